//! The typed scenario: every value in SI (or the named internal unit) and
//! money in [`Decimal`]. This is the contract the analysis layers read.
//!
//! Internal units: temperatures K, pressures kPa, power kW, durations h,
//! specific energies kJ/kg, lengths m, fractions as fractions of one (0.86,
//! not 86), money in the scenario currency (fuel prices per GJ of the stated
//! heating-value basis, carbon per tonne CO2, capacity per kW-yr, energy per
//! MWh).

pub use super::candidate::{
    Candidate, CandidateCosts, EfficiencyBasis, GasModelSpec, HeatRateBasisSpec, IntercoolerSpec,
    RatingCondition, RatingFigures, RegeneratorSpec, ReheatSpec, ResidualValue,
};
pub use super::candidate_curves::AmbientCorrectionSpec;
pub use super::candidate_guarantee::{CandidateGuarantee, HeatRateDamages, ToleranceReading};
pub use super::uncertainty::{Distribution, UncertainInput};
use rust_decimal::Decimal;

/// A whole scenario: the site, fuel, economics and operation shared by every
/// candidate, the candidates (bids), and the uncertain inputs.
#[derive(Debug, Clone, PartialEq)]
pub struct Scenario {
    /// Title, authors, date, currency, baseline.
    pub meta: Meta,
    /// Ambient conditions of the site.
    pub site: Site,
    /// The fuel and its price.
    pub fuel: FuelSpec,
    /// Discounting, service life, carbon price.
    pub economics: Economics,
    /// Hours of operation and the dispatch profile.
    pub operation: Operation,
    /// The candidates (at least one; ids unique; one is the baseline).
    pub candidates: Vec<Candidate>,
    /// Inputs with ranges or distributions for sensitivity and risk.
    pub uncertainty: Vec<UncertainInput>,
    /// Rank correlations between drawn `[[uncertainty]]` keys
    /// (`[[correlation]]`); unlisted pairs are uncorrelated.
    pub correlation: Vec<super::correlation::RankPair>,
}

/// The `[scenario]` section: who it is for and what it is compared against.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Meta {
    /// Title of the evaluation.
    pub title: String,
    /// The organisation or person the evaluation is for.
    pub prepared_for: String,
    /// The organisation or person who prepared it.
    pub prepared_by: String,
    /// Date of the evaluation (also the money date of a real analysis).
    pub date: chrono::NaiveDate,
    /// ISO 4217 currency code of every amount, e.g. `"USD"`.
    pub currency: String,
    /// Id of the baseline candidate every other candidate is set against.
    pub baseline: String,
}

/// The `[site]` section.
#[derive(Debug, Clone, PartialEq)]
pub struct Site {
    /// Site name, if given.
    pub name: Option<String>,
    /// Ambient (compressor inlet, before inlet loss) temperature, K.
    pub ambient_temperature_k: f64,
    /// Ambient pressure, kPa; from `elevation_m` by ISO 2533 when only the
    /// elevation was given.
    pub ambient_pressure_kpa: f64,
    /// Site elevation above sea level, m, when given.
    pub elevation_m: Option<f64>,
    /// Ambient relative humidity, a fraction from 0 to 1.
    pub relative_humidity: f64,
    /// The year's weather (`[site] weather`: hourly file or bins); `None`:
    /// every hour at `ambient_temperature` and `relative_humidity`. Shared,
    /// so copies of a scenario (sweep and risk points) do not copy it.
    pub weather: Option<std::sync::Arc<super::weather::Weather>>,
}

/// How the fuel is described.
#[derive(Debug, Clone, PartialEq)]
pub enum FuelComposition {
    /// A named pure fuel: one of [`FuelComposition::NAMED`].
    Named(String),
    /// Mole fractions by species formula (CH4, C2H6, C3H8, C4H10, H2, CO,
    /// N2, CO2), summing to 1 within 1e-6.
    MoleFractions(Vec<(String, f64)>),
    /// A fuel given by its heating values and CO2 factor only (only the
    /// `air` and `cold-air` gas models can use it).
    HeatingValues {
        /// Lower heating value, kJ/kg.
        lhv_kj_per_kg: f64,
        /// Higher heating value, kJ/kg (≥ LHV).
        hhv_kj_per_kg: f64,
        /// CO2 emitted per GJ of fuel energy on the LHV basis, kg/GJ.
        co2_kg_per_gj_lhv: f64,
    },
}

impl FuelComposition {
    /// Named fuels and the species formula each stands for.
    pub const NAMED: [(&'static str, &'static str); 6] = [
        ("methane", "CH4"),
        ("ethane", "C2H6"),
        ("propane", "C3H8"),
        ("butane", "C4H10"),
        ("hydrogen", "H2"),
        ("carbon-monoxide", "CO"),
    ];

    /// Species formulas a composition may name.
    pub const SPECIES: [&'static str; 8] =
        ["CH4", "C2H6", "C3H8", "C4H10", "H2", "CO", "N2", "CO2"];

    /// The composition as mole fractions: a named fuel is its one species at
    /// 1.0; `None` for a fuel given by heating values.
    pub fn mole_fractions(&self) -> Option<Vec<(String, f64)>> {
        match self {
            FuelComposition::Named(name) => FuelComposition::NAMED
                .iter()
                .find(|(n, _)| n == name)
                .map(|(_, formula)| vec![(formula.to_string(), 1.0)]),
            FuelComposition::MoleFractions(fractions) => Some(fractions.clone()),
            FuelComposition::HeatingValues { .. } => None,
        }
    }
}

/// Heating-value basis a fuel price is quoted on.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PriceBasis {
    /// Higher (gross) heating value, as gas is commonly sold.
    Hhv,
    /// Lower (net) heating value, the basis of gas-turbine heat rates.
    Lhv,
}

/// The `[fuel]` section.
#[derive(Debug, Clone, PartialEq)]
pub struct FuelSpec {
    /// Name shown in reports.
    pub name: String,
    /// What the fuel is.
    pub composition: FuelComposition,
    /// Price in the first year of operation, currency per GJ on
    /// `price_basis`. With a price path: the path's value for the commercial
    /// operation year.
    pub price_per_gj: Decimal,
    /// Heating-value basis of every price of this fuel.
    pub price_basis: PriceBasis,
    /// Yearly price escalation (fraction; real or nominal as
    /// `economics.rate_basis`); applies after the price path ends.
    pub escalation: f64,
    /// Explicit prices by calendar year (contiguous, ascending), currency per
    /// GJ on `price_basis`; empty when none was given.
    pub price_path: Vec<(i32, Decimal)>,
    /// `price` exactly as the file wrote it (number and unit, e.g. `3.85`
    /// and `USD/MMBtu`), so a report can echo it beside the per-GJ value;
    /// `None` when the price came from `price_path`.
    pub price_written: Option<WrittenQuantity>,
}

/// A quantity as the file wrote it.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct WrittenQuantity {
    /// The number as written, e.g. `"3.85"`.
    pub number: String,
    /// The unit as written, e.g. `"USD/MMBtu"`; empty for a bare number
    /// (then the internal unit).
    pub unit: String,
}

/// Whether rates and escalations are real (constant money) or nominal.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum RateBasis {
    /// Constant money of the scenario date; rates exclude inflation.
    Real,
    /// Money of the day; rates include inflation.
    Nominal,
}

/// When in a year the year's cash flows are discounted.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Timing {
    /// At the end of each year.
    EndOfYear,
    /// At the middle of each year.
    MidYear,
}

/// The date present values are stated at (`economics.present_value_date`).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum PresentValueDate {
    /// The commercial-operation date (the default).
    #[default]
    CommercialOperation,
    /// The scenario's study date (`scenario.date`).
    Study,
}

/// The `[economics]` section.
#[derive(Debug, Clone, PartialEq)]
pub struct Economics {
    /// First day of commercial operation (start of operating year 1).
    pub commercial_operation: chrono::NaiveDate,
    /// Years of operation analysed, 1–60.
    pub service_life_years: u32,
    /// Discount rate per year (fraction, > −1), on `rate_basis`.
    pub discount_rate: f64,
    /// Real or nominal rates.
    pub rate_basis: RateBasis,
    /// General inflation per year (fraction, > −1), linking real and nominal
    /// by the Fisher relation.
    pub inflation: f64,
    /// Discounting convention.
    pub timing: Timing,
    /// The date present values are stated at.
    pub present_value_date: PresentValueDate,
    /// Carbon price in the first year of operation, currency per tonne CO2.
    pub carbon_price_per_tonne: Decimal,
    /// Yearly carbon price escalation (fraction, > −1).
    pub carbon_escalation: f64,
    /// Value of one kW of net output for one year (currency per kW-yr):
    /// the price at which a candidate's shortfall in base-load output at
    /// the site against the largest candidate is bought elsewhere; 0 when
    /// capacity differences are not valued.
    pub capacity_value_per_kw_year: Decimal,
    /// Value of one MWh of net energy (currency per MWh): the price at which
    /// a candidate's shortfall in annual energy against the candidate that
    /// generates most is bought elsewhere; 0 when energy differences are
    /// not valued.
    pub energy_value_per_mwh: Decimal,
    /// Ambient temperature at which capacity is credited, K
    /// (`economics.capacity_temperature`): each candidate's base-load
    /// output there. `None`: its base-load output at the site's
    /// `ambient_temperature`.
    pub capacity_temperature_k: Option<f64>,
}

/// Part of a year's operating hours at one load.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DispatchBlock {
    /// Load as a fraction of rated net output, in (0, 1].
    pub load_fraction: f64,
    /// Hours per year at this load, ≥ 0.
    pub hours: f64,
    /// The block's own ambient temperature, K; `None`: its hours spread
    /// over the site's weather (or the site's ambient).
    pub ambient_temperature_k: Option<f64>,
    /// The block's own relative humidity (fraction); `None`: the site's
    /// (with `ambient_temperature_k`) or the weather's.
    pub relative_humidity: Option<f64>,
}

/// One point of a vendor's part-load heat-rate curve (`part_load` on a
/// `[[candidate]]`).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PartLoadPoint {
    /// Load as a fraction of base-load net output, in (0, 1].
    pub load_fraction: f64,
    /// Heat rate at this load divided by the base-load heat rate (≥ 1).
    pub heat_rate_ratio: f64,
}

/// The `[operation]` section.
#[derive(Debug, Clone, PartialEq)]
pub struct Operation {
    /// Operating hours per year, in (0, 8784]. With a dispatch profile it
    /// equals the sum of the profile's hours.
    pub hours_per_year: f64,
    /// Starts per year, 0 or more.
    pub starts_per_year: f64,
    /// Dispatch profile; empty means every hour at full load.
    pub dispatch: Vec<DispatchBlock>,
    /// An hourly dispatch profile (`[operation] profile`), instead of
    /// dispatch blocks; shared like the weather.
    pub profile: Option<std::sync::Arc<super::weather::Profile>>,
}
