//! The `[[candidate]]` tables (one bid each): the typed candidate and the
//! declaration of every candidate key except those of `costs` (see
//! `candidate_costs.rs`). The reader is `candidate_reader.rs`.

use super::candidate_fit::refuse_fitted;
use super::declare::{money_from_f64, money_to_f64, Key, Presence, SetResult, Shape};
use super::ranges::{
    Range, AMBIENT_P_KPA, AMBIENT_P_REASON, AMBIENT_T_K, AMBIENT_T_REASON, AMOUNT_HIGH,
    AMOUNT_REASON,
};
use crate::units::Kind;
use rust_decimal::Decimal;

/// Candidate declarations are keys into one [`Candidate`].
type K = Key<Candidate>;

/// Gas property model a candidate's cycle is solved with.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum GasModelSpec {
    /// Constant specific heat (cold-air standard).
    ColdAir {
        /// Constant-pressure specific heat, kJ/(kg·K).
        cp_kj_per_kg_k: f64,
        /// Ratio of specific heats cp/cv (> 1).
        k: f64,
    },
    /// Variable-property dry air throughout.
    Air,
    /// Air through the compressor, complete-combustion products of the
    /// scenario fuel through the turbine.
    Products,
}

/// What the compressor and turbine efficiencies mean.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum EfficiencyBasis {
    /// Isentropic (total) efficiencies.
    Isentropic,
    /// Polytropic (small-stage) efficiencies.
    Polytropic,
}

/// A recuperator/regenerator heating compressor delivery air with exhaust.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RegeneratorSpec {
    /// Thermal effectiveness, in (0, 1).
    pub effectiveness: f64,
    /// Air-side pressure loss, fraction of air-side inlet pressure, [0, 1).
    pub air_side_pressure_loss: f64,
    /// Gas-side pressure loss, fraction of gas-side inlet pressure, [0, 1).
    pub gas_side_pressure_loss: f64,
}

/// One intercooler between a low- and a high-pressure compressor. Exactly
/// one of `exit_temperature_k` and `effectiveness` is set.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct IntercoolerSpec {
    /// Low-pressure compressor pressure ratio, in (1, pressure_ratio);
    /// `None` means the geometric mean, √pressure_ratio.
    pub pressure_split: Option<f64>,
    /// Temperature the air is cooled to, K.
    pub exit_temperature_k: Option<f64>,
    /// Effectiveness towards ambient temperature, in (0, 1].
    pub effectiveness: Option<f64>,
}

/// One reheat combustor between a high- and a low-pressure turbine.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ReheatSpec {
    /// High-pressure turbine expansion ratio, in (1, overall expansion);
    /// `None` means the geometric mean.
    pub pressure_split: Option<f64>,
    /// Reheat combustor exit temperature, K.
    pub temperature_k: f64,
}

/// The ambient condition a candidate's rating is stated at (`[candidate.rating]`),
/// ISO 3977-2 / ISO 2314 reference conditions by default (from memory).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RatingCondition {
    /// Compressor inlet air temperature of the rating, K.
    pub temperature_k: f64,
    /// Ambient pressure of the rating, kPa.
    pub pressure_kpa: f64,
    /// Relative humidity of the rating, fraction of one.
    pub relative_humidity: f64,
    /// The vendor's stated figures at the rating (heat rate, exhaust flow
    /// and temperature, …), when the bid gives them; `None` judges the bid
    /// on its components alone.
    pub datasheet: Option<RatingFigures>,
}

/// The heating-value basis of a stated heat rate (`rating.heat_rate_basis`).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum HeatRateBasisSpec {
    /// Lower heating value (the usual basis of gas-turbine ratings).
    Lhv,
    /// Higher heating value.
    Hhv,
}

/// A vendor's figures at the rating condition (`[candidate.rating]`
/// `heat_rate`, `exhaust_flow`, `exhaust_temperature` and the optional
/// `pressure_ratio`, `firing_temperature`). The three first are given
/// together or not at all (checked by the reader); the reader starts the
/// required ones at NaN and fills them.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RatingFigures {
    /// Stated net heat rate, kJ/kWh on `heat_rate_basis`.
    pub heat_rate_kj_per_kwh: f64,
    /// Basis of `heat_rate_kj_per_kwh`.
    pub heat_rate_basis: HeatRateBasisSpec,
    /// Stated exhaust mass flow (air plus fuel), kg/s.
    pub exhaust_flow_kg_per_s: f64,
    /// Stated exhaust temperature, K.
    pub exhaust_temperature_k: f64,
    /// Stated compressor pressure ratio, if given.
    pub pressure_ratio: Option<f64>,
    /// Stated firing temperature, K, if given.
    pub firing_temperature_k: Option<f64>,
}

impl RatingFigures {
    /// Figures not read yet: NaN for the required three, LHV basis.
    pub fn unread() -> RatingFigures {
        RatingFigures {
            heat_rate_kj_per_kwh: f64::NAN,
            heat_rate_basis: HeatRateBasisSpec::Lhv,
            exhaust_flow_kg_per_s: f64::NAN,
            exhaust_temperature_k: f64::NAN,
            pressure_ratio: None,
            firing_temperature_k: None,
        }
    }
}

/// Set one rating figure, refusing it on a candidate whose rating states
/// no datasheet (a `--vary` or `[[uncertainty]]` of a figure the file does
/// not give).
fn set_figure(c: &mut Candidate, v: f64, set: impl FnOnce(&mut RatingFigures, f64)) -> SetResult {
    refuse_fitted(c, "machine (fitted to these figures)")?;
    match c.rating.datasheet.as_mut() {
        Some(d) => {
            set(d, v);
            Ok(())
        }
        None => Err(
            "this candidate's rating states no heat rate, exhaust flow and exhaust temperature"
                .into(),
        ),
    }
}

/// Value left at the end of the service life (a credit).
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum ResidualValue {
    /// A fraction of the capital cost, in [0, 1].
    FractionOfCapital(f64),
    /// An amount in the scenario currency, ≥ 0.
    Amount(Decimal),
}

/// Costs of a candidate other than fuel and carbon.
#[derive(Debug, Clone, PartialEq)]
pub struct CandidateCosts {
    /// Fixed O&M, currency per kW of rated net output per year.
    pub fixed_om_per_kw_year: Decimal,
    /// Variable O&M, currency per MWh generated.
    pub variable_om_per_mwh: Decimal,
    /// Operating hours between major overhauls; 0 means no overhauls.
    pub overhaul_interval_hours: f64,
    /// Cost of one major overhaul.
    pub overhaul_cost: Decimal,
    /// Equivalent operating hours counted per start (0: starts add none).
    pub hours_per_start: f64,
    /// Starts between major overhauls; 0 means starts do not limit them.
    pub overhaul_starts: f64,
    /// Days out of service per major overhaul.
    pub overhaul_outage_days: f64,
    /// Output loss per year of operation (fraction per year).
    pub output_degradation_per_year: f64,
    /// Fuel burned per start, GJ (LHV).
    pub start_fuel_gj: f64,
    /// Cost per start (O&M), currency.
    pub start_cost: Decimal,
    /// Service-agreement fee per fired hour, currency.
    pub service_fee_per_fired_hour: Decimal,
    /// Service-agreement fee per start, currency.
    pub service_fee_per_start: Decimal,
    /// Heat-rate increase per year of operation (fraction per year).
    pub degradation_per_year: f64,
    /// Fraction of the degradation an overhaul recovers, in [0, 1].
    pub recoverable_fraction: f64,
    /// Value left at the end of the service life.
    pub residual_value: ResidualValue,
    /// Capital spending before commercial operation: (date, fraction of
    /// capital), fractions summing to 1; empty means all of it at
    /// commercial operation.
    pub construction_schedule: Vec<(chrono::NaiveDate, f64)>,
}

/// One candidate configuration as bid.
#[derive(Debug, Clone, PartialEq)]
pub struct Candidate {
    /// Short unique id (a letter, then letters, digits, `-` or `_`).
    pub id: String,
    /// Human label shown in reports.
    pub label: String,
    /// Installed capital cost.
    pub capital_cost: Decimal,
    /// Rated net electrical output, kW (> 0).
    pub net_output_kw: f64,
    /// Gas property model.
    pub gas_model: GasModelSpec,
    /// Overall compressor pressure ratio (> 1).
    pub pressure_ratio: f64,
    /// Turbine inlet (combustor exit) temperature, K.
    pub turbine_inlet_temperature_k: f64,
    /// Compressor efficiency on `efficiency_basis`, in (0, 1].
    pub compressor_efficiency: f64,
    /// Turbine efficiency on `efficiency_basis`, in (0, 1].
    pub turbine_efficiency: f64,
    /// Isentropic or polytropic component efficiencies.
    pub efficiency_basis: EfficiencyBasis,
    /// Inlet duct/filter pressure loss, fraction of ambient pressure, [0, 1).
    pub inlet_pressure_loss: f64,
    /// Exhaust pressure loss, fraction of ambient pressure, [0, 1).
    pub exhaust_pressure_loss: f64,
    /// Combustor pressure loss, fraction of combustor inlet pressure, [0, 1).
    pub combustor_pressure_loss: f64,
    /// Combustion efficiency, in (0, 1].
    pub combustion_efficiency: f64,
    /// Mechanical efficiency of the shaft train, in (0, 1].
    pub mechanical_efficiency: f64,
    /// Generator efficiency, in (0, 1].
    pub generator_efficiency: f64,
    /// Auxiliary load as a fraction of gross electrical output, [0, 1).
    pub auxiliary_load_fraction: f64,
    /// Regenerator, if fitted.
    pub regenerator: Option<RegeneratorSpec>,
    /// Intercooler, if fitted.
    pub intercooler: Option<IntercoolerSpec>,
    /// Reheat combustor, if fitted.
    pub reheat: Option<ReheatSpec>,
    /// Fraction of compressor delivery air that bypasses the combustor to
    /// cool the turbine and mixes in ahead of the rotor, [0, 1).
    pub turbine_cooling: f64,
    /// The ambient condition the bid's rating (net output, heat rate) is
    /// stated at: the machine is fixed (calibrated) there.
    pub rating: RatingCondition,
    /// Part-load control of the fixed machine (`[candidate.control]`).
    pub control: super::candidate_control::ControlSpec,
    /// The vendor's part-load curve (`part_load`): heat rate over the
    /// base-load heat rate against load, sorted by ascending load and ending
    /// at load 1, ratio 1; empty when the bid states none (the machine's
    /// physics price part load).
    pub part_load: Vec<super::types::PartLoadPoint>,
    /// The vendor's ambient-correction curve (`ambient_correction`), sorted
    /// by ascending temperature and passing through the rating temperature
    /// at ratios 1; empty when the bid states none (the machine's physics
    /// price the site's ambient).
    pub ambient_correction: Vec<super::candidate_curves::AmbientCorrectionSpec>,
    /// Set when the bid states no components: its machine is fitted to its
    /// datasheet when the file is read (`candidate_fit.rs`), and this holds
    /// what was fitted and the fit's assumptions.
    pub fitted: Option<super::candidate_fit::FittedMachine>,
    /// O&M, overhaul, degradation, residual value, construction schedule.
    pub costs: CandidateCosts,
    /// Performance guarantee with damages (`[candidate.guarantee]`, keys
    /// in `candidate_guarantee.rs`); `None`: no guarantee clause.
    pub guarantee: Option<super::candidate_guarantee::CandidateGuarantee>,
}
/// Set `*slot` to `value`, or say which optional part is missing.
fn set_in<T>(slot: Option<&mut T>, value: T, part: &str) -> SetResult {
    match slot {
        Some(s) => {
            *s = value;
            Ok(())
        }
        None => Err(format!("this candidate has no {part}")),
    }
}

fn cold_air(c: &mut Candidate) -> Result<(&mut f64, &mut f64), String> {
    match &mut c.gas_model {
        GasModelSpec::ColdAir { cp_kj_per_kg_k, k } => Ok((cp_kj_per_kg_k, k)),
        _ => Err("this candidate's gas model is not cold-air".into()),
    }
}

/// A component value as a key path sees it: `None` on a candidate fitted
/// to its datasheet (the fit set it; `candidate.<key>` for every candidate
/// then passes over that one, as it does a candidate without the part).
fn stated(c: &Candidate, value: f64) -> Option<f64> {
    c.fitted.is_none().then_some(value)
}

/// Efficiencies of turbomachines: below this no gas turbine makes net work.
const MACHINE_EFFICIENCY_LOW: f64 = 0.3;
const MACHINE_EFFICIENCY_REASON: &str =
    "turbomachinery efficiencies run from about 0.8 to 0.93; below 0.3 no cycle makes net work (common practice)";
/// Pressure losses as fractions.
const LOSS_HIGH: f64 = 0.5;
const LOSS_REASON: &str =
    "a few per cent in practice; half the pressure lost leaves no cycle (common practice)";
/// Temperatures a flame or a hot section can reach.
const HOT_LOW: f64 = 180.0;
const HOT_HIGH: f64 = 2300.0;
const HOT_REASON: &str = "about 2230 K is the adiabatic flame temperature of stoichiometric methane in air (common practice); the low end is the coldest air, and the value must also be above ambient";
/// Pressure ratios (overall, or of a split).
const RATIO_LOW: f64 = 1.5;
const RATIO_HIGH: f64 = 80.0;
const RATIO_REASON: &str = "industrial and aero-derivative gas turbines run at about 4 to 45; below 1.5 a cycle makes almost no work (common practice)";

/// The keys of a `[[candidate]]` table (paths relative to the candidate),
/// in the order the docs list them. `control` keys are in `candidate_control.rs`, `costs` keys in
/// `candidate_costs.rs`.
pub(crate) const KEYS: &[Key<Candidate>] = &[
    K::plain("id", Shape::Text, Presence::Required { example: "\"premium\"" }, "unique; a letter, then letters, digits, `-`, `_`; at most 64 characters"),
    K::plain("label", Shape::Text, Presence::Optional { text: "the id" }, "name shown in reports"),
    K::number(
        "capital_cost",
        Kind::Money,
        Range::NonNegative,
        Presence::Required { example: "\"48500000 USD\"" },
        "installed capital cost",
        |c| Some(money_to_f64(c.capital_cost)),
        |c, v| {
            c.capital_cost = money_from_f64(v)?;
            Ok(())
        },
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "net_output",
        Kind::Power,
        Range::Positive,
        Presence::Required { example: "\"45 MW\"" },
        "rated net electrical output",
        |c| Some(c.net_output_kw),
        |c, v| {
            c.net_output_kw = v;
            Ok(())
        },
    )
    .within(1.0, 2e6, "kW", "from a 1 kW micro-turbine to twice the largest single gas turbines (about 0.6 GW, from memory)"),
    K::plain("gas_model", Shape::Choice(&["air", "products", "cold-air"]), Presence::Default { text: "air", value: 0.0 }, "variable-property air, combustion products through the turbine (needs a fuel composition), or the cold-air standard"),
    K::number(
        "cp_kj_per_kg_k",
        Kind::Number,
        Range::Positive,
        Presence::Default { text: "1.005", value: 1.005 },
        "cold-air only: constant cp, kJ/(kg·K) (cold-air standard of the engineering thermodynamics texts, common practice)",
        |c| match c.gas_model {
            GasModelSpec::ColdAir { cp_kj_per_kg_k, .. } => Some(cp_kj_per_kg_k),
            _ => None,
        },
        |c, v| {
            *cold_air(c)?.0 = v;
            Ok(())
        },
    )
    .within(0.5, 5.0, "kJ/(kg·K)", "air is about 1.0 and combustion products about 1.15; 0.5 to 5 covers any gas a turbine breathes"),
    K::number(
        "specific_heat_ratio",
        Kind::Number,
        Range::AboveOne,
        Presence::Default { text: "1.4", value: 1.4 },
        "cold-air only: k = cp/cv",
        |c| match c.gas_model {
            GasModelSpec::ColdAir { k, .. } => Some(k),
            _ => None,
        },
        |c, v| {
            *cold_air(c)?.1 = v;
            Ok(())
        },
    )
    .within(1.01, 1.67, "", "from heavy polyatomic gases (about 1.05) to the monatomic limit 5/3 of kinetic theory"),
    K::number(
        "pressure_ratio",
        Kind::Number,
        Range::AboveOne,
        Presence::Required { example: "18" },
        "overall compressor pressure ratio",
        |c| stated(c, c.pressure_ratio),
        |c, v| {
            refuse_fitted(c, "pressure ratio")?;
            c.pressure_ratio = v;
            Ok(())
        },
    )
    .within(RATIO_LOW, RATIO_HIGH, "", RATIO_REASON),
    K::number(
        "turbine_inlet_temperature",
        Kind::Temperature,
        Range::Positive,
        Presence::Required { example: "\"1450 K\"" },
        "combustor exit temperature; above ambient",
        |c| stated(c, c.turbine_inlet_temperature_k),
        |c, v| {
            refuse_fitted(c, "firing temperature")?;
            c.turbine_inlet_temperature_k = v;
            Ok(())
        },
    )
    .within(HOT_LOW, HOT_HIGH, "K", HOT_REASON),
    K::number(
        "compressor_efficiency",
        Kind::Fraction,
        Range::Efficiency,
        Presence::Required { example: "\"88 %\"" },
        "compressor efficiency on `efficiency_basis`",
        |c| stated(c, c.compressor_efficiency),
        |c, v| {
            refuse_fitted(c, "compressor efficiency")?;
            c.compressor_efficiency = v;
            Ok(())
        },
    )
    .within(MACHINE_EFFICIENCY_LOW, 1.0, "", MACHINE_EFFICIENCY_REASON),
    K::number(
        "turbine_efficiency",
        Kind::Fraction,
        Range::Efficiency,
        Presence::Required { example: "\"90 %\"" },
        "turbine efficiency on `efficiency_basis`",
        |c| stated(c, c.turbine_efficiency),
        |c, v| {
            refuse_fitted(c, "turbine efficiency")?;
            c.turbine_efficiency = v;
            Ok(())
        },
    )
    .within(MACHINE_EFFICIENCY_LOW, 1.0, "", MACHINE_EFFICIENCY_REASON),
    K::plain("efficiency_basis", Shape::Choice(&["isentropic", "polytropic"]), Presence::Default { text: "isentropic", value: 0.0 }, "what the compressor and turbine efficiencies mean"),
    K::number(
        "inlet_pressure_loss",
        Kind::Fraction,
        Range::Loss,
        Presence::Default { text: "0 %", value: 0.0 },
        "inlet duct and filter loss, fraction of ambient pressure",
        |c| Some(c.inlet_pressure_loss),
        |c, v| {
            c.inlet_pressure_loss = v;
            Ok(())
        },
    )
    .within(0.0, LOSS_HIGH, "", LOSS_REASON),
    K::number(
        "exhaust_pressure_loss",
        Kind::Fraction,
        Range::Loss,
        Presence::Default { text: "0 %", value: 0.0 },
        "exhaust loss, fraction of ambient pressure",
        |c| Some(c.exhaust_pressure_loss),
        |c, v| {
            c.exhaust_pressure_loss = v;
            Ok(())
        },
    )
    .within(0.0, LOSS_HIGH, "", LOSS_REASON),
    K::number(
        "combustor_pressure_loss",
        Kind::Fraction,
        Range::Loss,
        Presence::Default { text: "0 %", value: 0.0 },
        "combustor loss, fraction of combustor inlet pressure",
        |c| Some(c.combustor_pressure_loss),
        |c, v| {
            c.combustor_pressure_loss = v;
            Ok(())
        },
    )
    .within(0.0, LOSS_HIGH, "", LOSS_REASON),
    K::number(
        "combustion_efficiency",
        Kind::Fraction,
        Range::Efficiency,
        Presence::Default { text: "100 %", value: 1.0 },
        "fraction of the fuel's heating value released",
        |c| Some(c.combustion_efficiency),
        |c, v| {
            c.combustion_efficiency = v;
            Ok(())
        },
    )
    .within(0.5, 1.0, "", "gas-turbine combustors burn above 0.99 of their fuel; below 0.5 it is not a combustor (common practice)"),
    K::number(
        "mechanical_efficiency",
        Kind::Fraction,
        Range::Efficiency,
        Presence::Default { text: "100 %", value: 1.0 },
        "efficiency of the shaft train (bearings, gearbox)",
        |c| stated(c, c.mechanical_efficiency),
        |c, v| {
            refuse_fitted(c, "mechanical efficiency")?;
            c.mechanical_efficiency = v;
            Ok(())
        },
    )
    .within(0.5, 1.0, "", "shaft trains lose a few per cent at most (common practice)"),
    K::number(
        "generator_efficiency",
        Kind::Fraction,
        Range::Efficiency,
        Presence::Default { text: "100 %", value: 1.0 },
        "generator efficiency",
        |c| stated(c, c.generator_efficiency),
        |c, v| {
            refuse_fitted(c, "generator efficiency")?;
            c.generator_efficiency = v;
            Ok(())
        },
    )
    .within(0.5, 1.0, "", "utility generators run at about 0.97 to 0.99 (common practice)"),
    K::number(
        "auxiliary_load",
        Kind::Fraction,
        Range::Loss,
        Presence::Default { text: "0 %", value: 0.0 },
        "auxiliary load, fraction of gross electrical output",
        |c| stated(c, c.auxiliary_load_fraction),
        |c, v| {
            refuse_fitted(c, "auxiliary load")?;
            c.auxiliary_load_fraction = v;
            Ok(())
        },
    )
    .within(0.0, LOSS_HIGH, "", "a few per cent in practice; a plant using half its output is not a generating plant (common practice)"),
    K::number(
        "turbine_cooling",
        Kind::Fraction,
        Range::Loss,
        Presence::Default { text: "0 %", value: 0.0 },
        "fraction of compressor delivery air that bypasses the combustor and mixes in ahead of the turbine rotor (firing temperature = combustor exit)",
        |c| stated(c, c.turbine_cooling),
        |c, v| {
            refuse_fitted(c, "turbine cooling")?;
            c.turbine_cooling = v;
            Ok(())
        },
    )
    .within(0.0, 0.35, "", "cooling air of current heavy-duty machines is about 10 to 25 % of compressor delivery (from memory); beyond about a third too little air is left to burn the fuel"),
    K::plain("regenerator", Shape::Table, Presence::Optional { text: "none" }, "a regenerator (recuperator) heating compressor air with exhaust"),
    K::number(
        "regenerator.effectiveness",
        Kind::Fraction,
        Range::OpenFraction,
        Presence::Required { example: "\"85 %\"" },
        "thermal effectiveness",
        |c| c.regenerator.map(|r| r.effectiveness),
        |c, v| {
            set_in(
                c.regenerator.as_mut().map(|r| &mut r.effectiveness),
                v,
                "regenerator",
            )
        },
    ),
    K::number(
        "regenerator.air_side_pressure_loss",
        Kind::Fraction,
        Range::Loss,
        Presence::Default { text: "0 %", value: 0.0 },
        "air-side loss, fraction of air-side inlet pressure",
        |c| c.regenerator.map(|r| r.air_side_pressure_loss),
        |c, v| {
            set_in(
                c.regenerator
                    .as_mut()
                    .map(|r| &mut r.air_side_pressure_loss),
                v,
                "regenerator",
            )
        },
    )
    .within(0.0, LOSS_HIGH, "", LOSS_REASON),
    K::number(
        "regenerator.gas_side_pressure_loss",
        Kind::Fraction,
        Range::Loss,
        Presence::Default { text: "0 %", value: 0.0 },
        "gas-side loss, fraction of gas-side inlet pressure",
        |c| c.regenerator.map(|r| r.gas_side_pressure_loss),
        |c, v| {
            set_in(
                c.regenerator
                    .as_mut()
                    .map(|r| &mut r.gas_side_pressure_loss),
                v,
                "regenerator",
            )
        },
    )
    .within(0.0, LOSS_HIGH, "", LOSS_REASON),
    K::plain("intercooler", Shape::Table, Presence::Optional { text: "none" }, "an intercooler between a low- and a high-pressure compressor"),
    K::number(
        "intercooler.pressure_split",
        Kind::Number,
        Range::AboveOne,
        Presence::Optional { text: "geometric mean (√pressure_ratio)" },
        "low-pressure compressor ratio, below `pressure_ratio`",
        |c| c.intercooler.and_then(|i| i.pressure_split),
        |c, v| {
            set_in(
                c.intercooler.as_mut().map(|i| &mut i.pressure_split),
                Some(v),
                "intercooler",
            )
        },
    )
    .within(1.0, RATIO_HIGH, "", RATIO_REASON),
    K::number(
        "intercooler.exit_temperature",
        Kind::Temperature,
        Range::Positive,
        Presence::Optional { text: "exactly one of this and `effectiveness`" },
        "temperature the air is cooled to",
        |c| c.intercooler.and_then(|i| i.exit_temperature_k),
        |c, v| {
            set_in(
                c.intercooler
                    .as_mut()
                    .and_then(|i| i.exit_temperature_k.as_mut()),
                v,
                "intercooler exit temperature",
            )
        },
    )
    .within(180.0, 600.0, "K", "a cooler cools towards ambient (at least 180 K) and never above a compressor delivery temperature"),
    K::number(
        "intercooler.effectiveness",
        Kind::Fraction,
        Range::Efficiency,
        Presence::Optional { text: "exactly one of this and `exit_temperature`" },
        "effectiveness towards ambient temperature",
        |c| c.intercooler.and_then(|i| i.effectiveness),
        |c, v| {
            set_in(
                c.intercooler
                    .as_mut()
                    .and_then(|i| i.effectiveness.as_mut()),
                v,
                "intercooler effectiveness",
            )
        },
    ),
    K::plain("reheat", Shape::Table, Presence::Optional { text: "none" }, "a reheat combustor between a high- and a low-pressure turbine"),
    K::number(
        "reheat.pressure_split",
        Kind::Number,
        Range::AboveOne,
        Presence::Optional { text: "geometric mean of the expansion" },
        "high-pressure turbine expansion ratio, below `pressure_ratio`",
        |c| c.reheat.and_then(|r| r.pressure_split),
        |c, v| {
            set_in(
                c.reheat.as_mut().map(|r| &mut r.pressure_split),
                Some(v),
                "reheat combustor",
            )
        },
    )
    .within(1.0, RATIO_HIGH, "", RATIO_REASON),
    K::number(
        "reheat.temperature",
        Kind::Temperature,
        Range::Positive,
        Presence::Required { example: "\"1400 K\"" },
        "reheat combustor exit temperature; above ambient",
        |c| c.reheat.map(|r| r.temperature_k),
        |c, v| {
            set_in(
                c.reheat.as_mut().map(|r| &mut r.temperature_k),
                v,
                "reheat combustor",
            )
        },
    )
    .within(HOT_LOW, HOT_HIGH, "K", HOT_REASON),
    K::plain("rating", Shape::Table, Presence::Optional { text: "ISO 3977-2 reference conditions" }, "the ambient condition the bid's rating is stated at: the machine is fixed there and solved away from it at the site (`brayfin offdesign`)"),
    // 15 degC, 101.325 kPa, 60 %: ISO 3977-2 / ISO 2314 reference
    // conditions (from memory).
    K::number(
        "rating.temperature",
        Kind::Temperature,
        Range::Positive,
        Presence::Default { text: "288.15 K", value: 288.15 },
        "compressor inlet air temperature of the rating",
        |c| Some(c.rating.temperature_k),
        |c, v| {
            if !c.ambient_correction.is_empty() {
                return Err(
                    "this candidate's ambient_correction is stated relative to its rating \
                     temperature (ratio 1 there); vary the site's temperature instead"
                        .into(),
                );
            }
            c.rating.temperature_k = v;
            Ok(())
        },
    )
    .within(AMBIENT_T_K.0, AMBIENT_T_K.1, "K", AMBIENT_T_REASON),
    K::number(
        "rating.pressure",
        Kind::Pressure,
        Range::Positive,
        Presence::Default { text: "101.325 kPa", value: 101.325 },
        "ambient pressure of the rating",
        |c| Some(c.rating.pressure_kpa),
        |c, v| {
            c.rating.pressure_kpa = v;
            Ok(())
        },
    )
    .within(AMBIENT_P_KPA.0, AMBIENT_P_KPA.1, "kPa", AMBIENT_P_REASON),
    K::number(
        "rating.relative_humidity",
        Kind::Fraction,
        Range::Fraction,
        Presence::Default { text: "60 %", value: 0.6 },
        "relative humidity of the rating",
        |c| Some(c.rating.relative_humidity),
        |c, v| {
            c.rating.relative_humidity = v;
            Ok(())
        },
    ),
    K::number(
        "rating.heat_rate",
        Kind::HeatRate,
        Range::Positive,
        Presence::Optional { text: "none: the bid is judged on its components; with `exhaust_flow` and `exhaust_temperature`" },
        "the vendor's net heat rate at the rating, on `heat_rate_basis`",
        |c| c.rating.datasheet.map(|d| d.heat_rate_kj_per_kwh),
        |c, v| set_figure(c, v, |d, v| d.heat_rate_kj_per_kwh = v),
    )
    .within(3600.0, 36000.0, "kJ/kWh", "from 100 % efficiency (3600 kJ/kWh, the first law) to 10 %"),
    K::plain("rating.heat_rate_basis", Shape::Choice(&["lhv", "hhv"]), Presence::Default { text: "lhv", value: 0.0 }, "heating value the stated heat rate is on: `lhv` (the usual basis of ratings) or `hhv`"),
    K::number(
        "rating.exhaust_flow",
        Kind::MassFlow,
        Range::Positive,
        Presence::Optional { text: "with `heat_rate` and `exhaust_temperature`" },
        "the vendor's exhaust mass flow (air plus fuel) at the rating",
        |c| c.rating.datasheet.map(|d| d.exhaust_flow_kg_per_s),
        |c, v| set_figure(c, v, |d, v| d.exhaust_flow_kg_per_s = v),
    )
    .within(0.05, 2000.0, "kg/s", "from a micro-turbine (about 0.3 kg/s at 30 kW) to beyond the largest heavy-duty machines (about 1 100 kg/s), common practice"),
    K::number(
        "rating.exhaust_temperature",
        Kind::Temperature,
        Range::Positive,
        Presence::Optional { text: "with `heat_rate` and `exhaust_flow`" },
        "the vendor's exhaust temperature at the rating (turbine exit, or regenerator gas exit)",
        |c| c.rating.datasheet.map(|d| d.exhaust_temperature_k),
        |c, v| set_figure(c, v, |d, v| d.exhaust_temperature_k = v),
    )
    .within(400.0, 1200.0, "K", "recuperated machines leave about 500–600 K, simple cycles 700–900 K; outside 400–1 200 K no gas turbine exhausts (common practice)"),
    K::number(
        "rating.pressure_ratio",
        Kind::Number,
        Range::AboveOne,
        Presence::Optional { text: "fitted from the other figures" },
        "the vendor's compressor pressure ratio at the rating",
        |c| c.rating.datasheet.and_then(|d| d.pressure_ratio),
        |c, v| set_figure(c, v, |d, v| d.pressure_ratio = Some(v)),
    )
    .within(RATIO_LOW, RATIO_HIGH, "", RATIO_REASON),
    K::number(
        "rating.firing_temperature",
        Kind::Temperature,
        Range::Positive,
        Presence::Optional { text: "fitted from the other figures" },
        "the vendor's firing temperature (combustor exit) at the rating",
        |c| c.rating.datasheet.and_then(|d| d.firing_temperature_k),
        |c, v| set_figure(c, v, |d, v| d.firing_temperature_k = Some(v)),
    )
    .within(HOT_LOW, HOT_HIGH, "K", HOT_REASON),
    K::plain("part_load", Shape::Array, Presence::Optional { text: "none: the fixed machine's own part-load physics" }, "the vendor's part-load curve, `[{ load = \"75 %\", heat_rate_ratio = 1.07 }, …]`: heat rate at that load ÷ base-load heat rate. Loads strictly ascending or descending; ratios from 1 to 3, not rising with load, exactly 1.0 at 100 % (added if absent). Prices this bid's part load (applied to its base-load heat rate at the site) and must reach down to the lowest dispatch load; `check` compares it with the calibrated machine"),
    K::plain("ambient_correction", Shape::Array, Presence::Optional { text: "none: the fixed machine's own physics at the site" }, "the vendor's ambient correction at base load, `[{ temperature = \"35 degC\", output_ratio = 0.88, heat_rate_ratio = 1.04 }, …]`: output and heat rate at that compressor inlet temperature ÷ those at the rating (rating pressure and humidity). Temperatures strictly ascending or descending; ratios from 0.5 to 1.5, exactly 1.0 at the rating temperature (added if absent); output ratio not rising with temperature. Prices this bid's base load at the site temperature (linear between points; the site's pressure and humidity from physics); `check` compares it with the calibrated machine"),
    K::plain("control", Shape::Table, Presence::Optional { text: "guide vanes to 70 % airflow, 30 % minimum load" }, "how the fixed machine is held away from base load (`brayfin offdesign`)"),
    K::plain("costs", Shape::Table, Presence::Optional { text: "all zero" }, "O&M, overhauls, degradation, residual value, construction schedule (below)"),
];
