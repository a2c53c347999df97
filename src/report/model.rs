//! The report model: everything a renderer shows, already computed,
//! rounded where it is money, and labelled. Renderers (terminal tables,
//! JSON, CSV, PDF) format this and compute nothing.
//!
//! Money is `Decimal` rounded once to the currency's minor unit (half to
//! even, `finance::round_for_presentation`); physics is `f64` in SI units. The unit system the
//! user asked for is carried in [`Meta::units`]; renderers convert for
//! display only.

use rust_decimal::Decimal;
use serde::Serialize;

/// Unit system for display.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Units {
    /// kJ/kWh, K, kPa, kg/s.
    Si,
    /// Btu/kWh, degF, psia, lb/s.
    Us,
}

/// The whole report.
#[derive(Debug, Clone, Serialize)]
pub struct Model {
    /// Title block and traceability.
    pub meta: Meta,
    /// The decision in data (the sentence itself comes from a template).
    pub decision: Decision,
    /// Every candidate, baseline first.
    pub candidates: Vec<CandidateView>,
    /// The inputs that move the recommended candidate's net savings most
    /// (from the sensitivity ranking), largest first; the briefing page
    /// shows the first three.
    pub key_assumptions: Vec<KeyAssumption>,
    /// Every input with its unit and stated source.
    pub inputs: Vec<InputView>,
    /// Every default the loader applied.
    pub applied_defaults: Vec<DefaultView>,
    /// Warnings an engineer would want to see (from `check`).
    pub warnings: Vec<String>,
    /// Information that is not a warning: routine conversions brayfin
    /// made (e.g. pricing LHV fuel energy per unit of HHV), and the
    /// [`Model::pricing`] lines.
    pub information: Vec<String>,
    /// How each bid is priced: from its vendor's curves or its machine's
    /// physics, and for a bid that states no components the machine fitted
    /// to its datasheet with the fit's values and assumptions (one line
    /// each; also in `information`).
    pub pricing: Vec<String>,
    /// How the numbers were made.
    pub method: MethodView,
    /// Break-even premium of each non-baseline candidate against fuel price.
    pub fuel_price_curves: FuelPriceCurves,
    /// Sensitivity ranking (tornado); empty when not asked for.
    pub sensitivity: Vec<SensitivityBar>,
    /// Monte Carlo summary; `None` when not run.
    pub risk: Option<RiskView>,
    /// Each candidate's machine over temperature and load, and its year
    /// (the "Site performance" section).
    pub site_performance: SitePerformanceView,
}

impl Model {
    /// Whether some candidate settles a guarantee at the acceptance test
    /// (a non-zero `guarantee_settlement` stream): renderers show the
    /// settlement column, category or bar only then, as they do output
    /// bought_in only when it is charged.
    pub fn settled(&self) -> bool {
        self.candidates.iter().any(|c| {
            !c.cost_breakdown.guarantee_settlement.is_zero()
                || c.ledger.iter().any(|r| !r.guarantee_settlement.is_zero())
        })
    }
}

/// Title block and traceability of the report.
#[derive(Debug, Clone, Serialize)]
pub struct Meta {
    /// Scenario title.
    pub title: String,
    /// Organisation the study is for.
    pub prepared_for: String,
    /// Author.
    pub prepared_by: String,
    /// Study date as written in the scenario (ISO 8601).
    pub date: String,
    /// ISO 4217 currency code.
    pub currency: String,
    /// Id of the baseline candidate.
    pub baseline_id: String,
    /// The scenario file as the user named it.
    pub scenario_file: String,
    /// SHA-256 of the scenario file bytes, lower-case hex.
    pub scenario_sha256: String,
    /// brayfin version that made the report.
    pub brayfin_version: String,
    /// When the report was generated (RFC 3339, UTC).
    pub generated_at: String,
    /// Display unit system.
    pub units: Units,
    /// Site name, if given.
    pub site_name: Option<String>,
}

/// The decision, in data.
#[derive(Debug, Clone, Serialize)]
pub struct Decision {
    /// The candidate with the lowest lifecycle cost.
    pub preferred_id: String,
    /// Its label.
    pub preferred_label: String,
    /// Whether the preferred candidate is the baseline itself.
    pub preferred_is_baseline: bool,
    /// Break-even premium of the preferred candidate (zero for the baseline).
    pub break_even_premium: Decimal,
    /// Premium its bid asks over the baseline (zero for the baseline).
    pub premium_asked: Decimal,
    /// Net savings of the preferred candidate against the baseline.
    pub net_savings: Decimal,
    /// Discounted payback of the preferred candidate (not applicable for
    /// the baseline).
    pub discounted_payback: PaybackView,
    /// The next cheapest candidate to own, other than the baseline, that
    /// also covers the premium its bid asks: what the recommendation is
    /// weighed against. `None` when no other bid covers its premium.
    pub runner_up: Option<RunnerUp>,
}

/// Another bid that covers its premium, as the recommendation weighs it.
#[derive(Debug, Clone, Serialize)]
pub struct RunnerUp {
    /// Candidate id.
    pub id: String,
    /// Its label.
    pub label: String,
    /// Its net savings against the baseline.
    pub net_savings: Decimal,
    /// Break-even premium minus premium asked (its headroom).
    pub headroom: Decimal,
    /// Its discounted payback.
    pub discounted_payback: PaybackView,
}

/// One candidate: performance, economics, verdict, ledger.
#[derive(Debug, Clone, Serialize)]
pub struct CandidateView {
    /// Short id from the scenario.
    pub id: String,
    /// Human label.
    pub label: String,
    /// True for the baseline candidate.
    pub is_baseline: bool,
    /// Gas model name used for this candidate ("cold-air", "air", "products").
    pub gas_model: String,
    /// Headline performance.
    pub performance: PerformanceView,
    /// The solved cycle: state table, works, energy balance.
    pub cycle: CycleView,
    /// Economics against the baseline.
    pub economics: EconomicsView,
    /// Plain-words verdict data.
    pub verdict: Verdict,
    /// Present value of the lifecycle cost by stream.
    pub cost_breakdown: CostBreakdown,
    /// Each stream's present value less the baseline's (positive: this
    /// candidate spends more on it); `None` for the baseline.
    pub cost_difference: Option<CostBreakdown>,
    /// Cumulative discounted savings against the baseline, the two ledgers
    /// paired by date (empty for the baseline).
    pub cumulative_savings: Vec<CumulativePoint>,
    /// The year-by-year ledger.
    pub ledger: Vec<LedgerRowView>,
    /// The ledger's totals row: each column summed over the rows (money
    /// undiscounted, except `present_value`, which is the lifecycle cost).
    pub ledger_total: LedgerTotalView,
}

/// The totals row of a candidate's ledger: the unrounded rows summed, then
/// rounded once. Its present value is the lifecycle cost.
#[derive(Debug, Clone, Serialize)]
pub struct LedgerTotalView {
    /// `"total"`.
    pub label: String,
    /// First day of the first row (ISO 8601).
    pub period_start: String,
    /// Last day of the last row (ISO 8601).
    pub period_end: String,
    /// Operating hours over the life.
    pub operating_hours: f64,
    /// Starts over the life.
    pub starts: f64,
    /// Net energy over the life, MWh.
    pub energy_mwh: f64,
    /// Fuel energy over the life, GJ (LHV).
    pub fuel_energy_gj: f64,
    /// Fuel cost, undiscounted.
    pub fuel_cost: Decimal,
    /// Carbon cost, undiscounted.
    pub carbon_cost: Decimal,
    /// Fixed O&M, undiscounted.
    pub fixed_om: Decimal,
    /// Variable O&M, undiscounted.
    pub variable_om: Decimal,
    /// Overhauls, undiscounted.
    pub overhaul: Decimal,
    /// Energy and capacity bought in, undiscounted.
    pub bought_in: Decimal,
    /// Capital, undiscounted.
    pub capital: Decimal,
    /// Residual value credited, undiscounted (negative).
    pub residual: Decimal,
    /// Guarantee settlement; left out of the JSON when zero.
    #[serde(skip_serializing_if = "Decimal::is_zero")]
    pub guarantee_settlement: Decimal,
    /// Sum of the rows' totals, undiscounted.
    pub total: Decimal,
    /// Sum of the rows' present values: the lifecycle cost.
    pub present_value: Decimal,
}

/// Headline performance at site conditions, new and clean, full load.
#[derive(Debug, Clone, Serialize)]
pub struct PerformanceView {
    /// Base-load net electrical output at the site (the fixed machine's;
    /// the rated output for a candidate kept at its rating), kW.
    pub net_output_kw: f64,
    /// Base-load net heat rate at the site, LHV basis, kJ/kWh.
    pub heat_rate_kj_per_kwh: f64,
    /// Net heat rate, LHV basis, Btu/kWh.
    pub heat_rate_btu_per_kwh: f64,
    /// Net electrical efficiency, LHV basis, fraction.
    pub thermal_efficiency: f64,
    /// Exhaust (stack) temperature, K.
    pub exhaust_temperature_k: f64,
    /// Compressor inlet air flow at base load at the site, kg/s.
    pub air_flow_kg_per_s: f64,
    /// Fuel flow at base load at the site, kg/s.
    pub fuel_flow_kg_per_s: f64,
    /// CO2 emitted per MWh of net output, kg/MWh.
    pub co2_kg_per_mwh: f64,
    /// What the bid's datasheet (`[candidate.rating]` figures) implies;
    /// absent for a bid without one.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub implied: Option<ImpliedView>,
    /// The candidate's own year at the site, new and clean.
    pub site_year: SiteYearView,
}

/// A candidate's year at the site from its own performance in every
/// operating condition (weather, dispatch or hourly profile), new and
/// clean, before output levelling.
#[derive(Debug, Clone, Serialize)]
pub struct SiteYearView {
    /// Run hours per year, h.
    pub run_hours: f64,
    /// Net energy per year, MWh.
    pub energy_mwh: f64,
    /// Fuel energy per year, GJ (LHV).
    pub fuel_energy_gj_lhv: f64,
    /// Mean net heat rate over the year (fuel ÷ energy), kJ/kWh (LHV).
    pub mean_heat_rate_kj_per_kwh: f64,
    /// Capacity credited: base-load net output at the capacity
    /// temperature (or at the site), kW.
    pub capacity_output_kw: f64,
    /// The capacity temperature, K (`null`: the site's ambient).
    pub capacity_temperature_k: Option<f64>,
}

/// What a bid's vendor figures imply about the engine inside, and whether
/// they are credible (`crate::datasheet::assess`). Values that no fitted
/// engine gives are `None` (JSON `null`).
#[derive(Debug, Clone, Serialize)]
pub struct ImpliedView {
    /// Implied compressor polytropic efficiency, fraction.
    pub compressor_polytropic_efficiency: Option<f64>,
    /// Implied turbine polytropic efficiency, fraction.
    pub turbine_polytropic_efficiency: Option<f64>,
    /// Implied firing temperature, K.
    pub firing_temperature_k: Option<f64>,
    /// Implied turbine cooling air, fraction of compressor air.
    pub turbine_cooling: Option<f64>,
    /// Implied compressor inlet air flow, kg/s.
    pub air_flow_kg_per_s: f64,
    /// The datasheet's energy-balance remainder (mechanical, generator,
    /// auxiliary and casing losses), fraction of fuel energy.
    pub loss_remainder_fraction: f64,
    /// `"plausible"`, `"optimistic"` or `"impossible"`.
    pub verdict: String,
    /// Why, one sentence each (including every stated component value the
    /// fit does not bear out, both values).
    pub reasons: Vec<String>,
    /// The assumptions the fit rests on, in words (empty when no engine
    /// fits the figures).
    pub assumptions: Vec<String>,
}

/// One row of the cycle state table.
#[derive(Debug, Clone, Serialize)]
pub struct StateRow {
    /// State id ("1", "2s", "2", …).
    pub id: String,
    /// State name.
    pub name: String,
    /// Temperature, K.
    pub temperature_k: f64,
    /// Pressure, kPa.
    pub pressure_kpa: f64,
    /// Specific enthalpy, kJ/kg.
    pub enthalpy_kj_per_kg: f64,
    /// Specific entropy, kJ/(kg·K).
    pub entropy_kj_per_kg_k: f64,
}

/// The solved cycle of one candidate, per kg of compressor inlet air.
#[derive(Debug, Clone, Serialize)]
pub struct CycleView {
    /// State table in flow order.
    pub states: Vec<StateRow>,
    /// Compressor work, kJ/kg.
    pub compressor_work_kj_per_kg: f64,
    /// Turbine work, kJ/kg.
    pub turbine_work_kj_per_kg: f64,
    /// Net work, kJ/kg.
    pub net_work_kj_per_kg: f64,
    /// Heat input, kJ/kg.
    pub heat_input_kj_per_kg: f64,
    /// Heat rejected, kJ/kg.
    pub heat_rejected_kj_per_kg: f64,
    /// Back-work ratio, fraction.
    pub back_work_ratio: f64,
    /// First-law residual, kJ/kg.
    pub energy_balance_residual_kj_per_kg: f64,
    /// Fuel–air ratio (products model only).
    pub fuel_air_ratio: Option<f64>,
}

/// Discounted payback.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(tag = "kind", content = "years", rename_all = "snake_case")]
pub enum PaybackView {
    /// Paid back after this many (fractional) years.
    Years(f64),
    /// Never paid back within the service life.
    NeverWithinLife,
    /// Not applicable (the baseline, or no added investment).
    NotApplicable,
}

/// Present value of one percentage point of each component figure.
#[derive(Debug, Clone, Serialize)]
pub struct ValuePerPoint {
    /// Per point of compressor efficiency.
    pub compressor_efficiency: Decimal,
    /// Per point of turbine efficiency.
    pub turbine_efficiency: Decimal,
    /// Per point of regenerator effectiveness, if one is fitted.
    pub regenerator_effectiveness: Option<Decimal>,
}

/// Economics of one candidate, against the baseline where relevant.
#[derive(Debug, Clone, Serialize)]
pub struct EconomicsView {
    /// Capital cost (undiscounted).
    pub capital_cost: Decimal,
    /// Lifecycle cost: sum of the ledger's present values.
    pub lifecycle_cost: Decimal,
    /// Levelized cost of electricity per MWh.
    pub levelized_cost_per_mwh: Decimal,
    /// Net savings against the baseline (None for the baseline).
    pub net_savings_vs_baseline: Option<Decimal>,
    /// Extra capital over the baseline at which net savings are zero.
    pub break_even_premium: Option<Decimal>,
    /// Extra capital over the baseline that the bid asks.
    pub premium_asked: Option<Decimal>,
    /// Savings-to-investment ratio (None where undefined).
    pub savings_to_investment_ratio: Option<f64>,
    /// Adjusted internal rate of return, fraction (None where undefined).
    pub adjusted_irr: Option<f64>,
    /// Simple payback.
    pub simple_payback: PaybackView,
    /// Discounted payback.
    pub discounted_payback: PaybackView,
    /// Fuel price (per GJ, scenario basis) at which this candidate and the
    /// baseline cost the same over the life.
    pub break_even_fuel_price: Option<Decimal>,
    /// Present value of one point of each component figure.
    pub value_per_point: ValuePerPoint,
    /// Present value of one kJ/kWh of heat rate over the life, per kJ/kWh
    /// of the dispatch-weighted heat rate (the year's fuel energy over its
    /// energy).
    pub value_per_kj_per_kwh: Decimal,
    /// Present value of one kJ/kWh of the full-load heat rate (the figure
    /// a bid guarantees) over the life: `value_per_kj_per_kwh` ×
    /// `dispatch_heat_rate_ratio`. Part-load heat rates are the full-load
    /// heat rate times a ratio from the part-load table, so 1 kJ/kWh more
    /// at full load is that ratio's energy-weighted mean more over the
    /// year; fuel and carbon cost are linear in fuel energy.
    pub value_per_kj_per_kwh_full_load: Decimal,
    /// Dispatch-weighted heat rate over full-load heat rate (the
    /// energy-weighted mean of the part-load ratios; 1 with every hour at
    /// full load).
    pub dispatch_heat_rate_ratio: f64,
    /// Present value of one kW more net output over the life, per kW of
    /// the output as rated in the bid (the rating the capacity value is
    /// paid on): the capacity value less the fixed O&M on that kW.
    pub value_per_kw: Decimal,
}

/// The verdict on one candidate.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum VerdictKind {
    /// This candidate is the baseline.
    Baseline,
    /// Its break-even premium covers the premium asked.
    WorthPremium,
    /// Its break-even premium falls short of the premium asked.
    NotWorthPremium,
}

/// Verdict data; the words come from the renderer or a template.
#[derive(Debug, Clone, Serialize)]
pub struct Verdict {
    /// Kind of verdict.
    pub kind: VerdictKind,
    /// Break-even premium minus premium asked (positive: headroom).
    pub margin: Decimal,
}

/// Lifecycle cost by stream, present values (residual negative).
#[derive(Debug, Clone, Serialize)]
pub struct CostBreakdown {
    /// Capital.
    pub capital: Decimal,
    /// Fuel.
    pub fuel: Decimal,
    /// Fixed plus variable O&M.
    pub operation_and_maintenance: Decimal,
    /// Major overhauls.
    pub overhauls: Decimal,
    /// Carbon.
    pub carbon: Decimal,
    /// Energy and capacity bought in: the candidate's shortfall in energy and capacity
    /// against the largest candidate, bought elsewhere (zero for the
    /// largest, or when the scenario values neither).
    pub bought_in: Decimal,
    /// Residual value (a credit, negative).
    pub residual: Decimal,
    /// Guarantee settlement at the acceptance test: bonus paid less damages
    /// received (negative when the vendor pays). Left out of the JSON when
    /// zero (no guarantee, or a machine within its tolerance).
    #[serde(skip_serializing_if = "Decimal::is_zero")]
    pub guarantee_settlement: Decimal,
}

/// One point of cumulative discounted savings.
#[derive(Debug, Clone, Serialize)]
pub struct CumulativePoint {
    /// Years since commercial operation: the cash time of a capital
    /// payment (zero or negative), else the end of the period.
    pub years_from_start: f64,
    /// Calendar year label of the row.
    pub year: i32,
    /// Date the cumulative stands at (ISO 8601): a capital payment date,
    /// the commercial operation date, the last day of an operating period
    /// or the residual-value date. It counts every ledger row of both
    /// candidates whose period ends on or before it.
    pub date: String,
    /// Cumulative discounted savings against the baseline.
    pub savings: Decimal,
}

/// One ledger row as shown.
#[derive(Debug, Clone, Serialize)]
pub struct LedgerRowView {
    /// Unique label of the row: `"2026-03-01 construction"`,
    /// `"acceptance test"`, `"2027 operation"`, `"2057-05-01 residual value"`.
    pub label: String,
    /// Calendar year label.
    pub year: i32,
    /// First day of the period (ISO 8601).
    pub period_start: String,
    /// Last day of the period (ISO 8601).
    pub period_end: String,
    /// Operating hours.
    pub operating_hours: f64,
    /// Starts.
    pub starts: f64,
    /// Net energy, MWh.
    pub energy_mwh: f64,
    /// Fuel energy, GJ (LHV).
    pub fuel_energy_gj: f64,
    /// Fuel cost.
    pub fuel_cost: Decimal,
    /// Carbon cost.
    pub carbon_cost: Decimal,
    /// Fixed O&M.
    pub fixed_om: Decimal,
    /// Variable O&M.
    pub variable_om: Decimal,
    /// Overhaul.
    pub overhaul: Decimal,
    /// Energy and capacity bought in (energy and capacity shortfall bought elsewhere).
    pub bought_in: Decimal,
    /// Capital.
    pub capital: Decimal,
    /// Residual value (a credit, negative).
    pub residual: Decimal,
    /// Guarantee settlement (bonus paid less damages received); left out
    /// of the JSON when zero.
    #[serde(skip_serializing_if = "Decimal::is_zero")]
    pub guarantee_settlement: Decimal,
    /// Sum of the row's money.
    pub total: Decimal,
    /// Discount factor applied to the row.
    pub discount_factor: f64,
    /// Total × discount factor.
    pub present_value: Decimal,
}

/// An input that moves the answer, for the briefing page.
#[derive(Debug, Clone, Serialize)]
pub struct KeyAssumption {
    /// Dotted scenario key.
    pub key: String,
    /// Plain-words name.
    pub label: String,
    /// Base value as shown, with unit.
    pub base_value: String,
    /// Largest one-sided change in net savings (at the low or the high end
    /// of the input's range, whichever moves more) of the candidate
    /// `candidate_id`; of any candidate when that is `None`.
    pub swing: Decimal,
    /// The candidate whose net savings `swing` is: the recommended one, or
    /// `None` when the baseline itself is recommended.
    pub candidate_id: Option<String>,
}

/// One input line of the assumptions section.
#[derive(Debug, Clone, Serialize)]
pub struct InputView {
    /// Dotted scenario key.
    pub key: String,
    /// Value as given.
    pub value: String,
    /// Unit (empty for dimensionless).
    pub unit: String,
    /// Source as the scenario states it.
    pub source: Option<String>,
}

/// One default the loader applied.
#[derive(Debug, Clone, Serialize)]
pub struct DefaultView {
    /// Dotted scenario key.
    pub key: String,
    /// Value applied.
    pub value: String,
}

/// How the numbers were made (data; method prose is in the templates).
#[derive(Debug, Clone, Serialize)]
pub struct MethodView {
    /// Gas models used, distinct.
    pub gas_models: Vec<String>,
    /// "real" or "nominal".
    pub rate_basis: String,
    /// Discount rate, fraction, on `rate_basis`.
    pub discount_rate: f64,
    /// General inflation, fraction.
    pub inflation: f64,
    /// "end-of-year" or "mid-year".
    pub timing: String,
    /// Service life, years.
    pub service_life_years: u32,
    /// Fuel price basis ("HHV" or "LHV").
    pub fuel_price_basis: String,
    /// The unit fuel prices are shown in on pages and tables: the one the
    /// scenario file wrote its price in. Not in JSON, whose prices stay
    /// per GJ (the key names say so).
    #[serde(skip)]
    pub fuel_price_unit: FuelPriceUnit,
    /// The fuel price exactly as the file wrote it (`"3.85 USD/MMBtu"`;
    /// a bare number gets the currency and `/GJ`); `None` when the file
    /// gave a price path. Not in JSON.
    #[serde(skip)]
    pub fuel_price_written: Option<String>,
    /// The scenario's fuel price per GJ on `fuel_price_basis`, unrounded
    /// (the price at commercial operation for a price path). Not in JSON.
    #[serde(skip)]
    pub fuel_price_per_gj: Decimal,
    /// HHV/LHV ratio of the fuel.
    pub hhv_over_lhv: f64,
    /// Rounding rule for money.
    pub rounding: String,
    /// Whether any candidate is charged for an output shortfall (the
    /// candidates differ in output and the scenario values energy or
    /// capacity).
    pub levelled: bool,
    /// Value of one MWh bought elsewhere, per MWh (`economics.energy_value`).
    pub energy_value_per_mwh: Decimal,
    /// Value of one kW of capacity bought elsewhere, per kW-year
    /// (`economics.capacity_value`).
    pub capacity_value_per_kw_year: Decimal,
    /// The date every present value is stated at (ISO 8601): the
    /// commercial operation date or the study date
    /// (`economics.present_value_date`).
    pub present_value_date: String,
    /// Which date that is: `"commercial-operation"` or `"study"`.
    pub present_value_base: String,
    /// One sentence stating the present-value date, that construction
    /// payments before it are compounded to it and later cash discounted,
    /// and the money basis (real or nominal).
    pub present_value_note: String,
}

/// The energy unit fuel prices are shown per (the one the scenario file
/// wrote its price in).
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct FuelPriceUnit {
    /// Symbol, e.g. `"MMBtu"`, `"GJ"`, `"MWh"`.
    pub symbol: String,
    /// Its size in GJ, exact (1 MMBtu = 1.055056 GJ; 1 MWh = 3.6 GJ).
    pub gj_per_unit: Decimal,
}

impl FuelPriceUnit {
    /// Per GJ, the internal unit.
    pub fn gj() -> Self {
        FuelPriceUnit {
            symbol: "GJ".to_string(),
            gj_per_unit: Decimal::ONE,
        }
    }

    /// The unit of a written price unit such as `"USD/MMBtu"` (its part
    /// after the slash); per GJ for a bare number or an unknown symbol.
    pub fn from_written(unit: &str) -> Self {
        unit.split_once('/')
            .map(|(_, per)| per.trim())
            .and_then(|per| {
                crate::units::fuel_energy_unit_gj(per).map(|size| FuelPriceUnit {
                    symbol: per.to_string(),
                    gj_per_unit: size,
                })
            })
            .unwrap_or_else(Self::gj)
    }
}

/// Break-even premium against fuel price.
#[derive(Debug, Clone, Serialize)]
pub struct FuelPriceCurves {
    /// The scenario's first-year fuel price, per GJ on the stated basis.
    pub scenario_price_per_gj: Decimal,
    /// One series per non-baseline candidate.
    pub series: Vec<FuelPriceSeries>,
}

/// One candidate's break-even premium curve.
#[derive(Debug, Clone, Serialize)]
pub struct FuelPriceSeries {
    /// Candidate id.
    pub candidate_id: String,
    /// (fuel price per GJ, break-even premium) points, price ascending.
    pub points: Vec<(Decimal, Decimal)>,
}

/// One bar of the sensitivity (tornado) chart.
#[derive(Debug, Clone, Serialize)]
pub struct SensitivityBar {
    /// Candidate id.
    pub candidate_id: String,
    /// Dotted scenario key.
    pub key: String,
    /// Plain-words name of the input (as on the briefing page).
    pub label: String,
    /// Low value of the input, as shown with unit.
    pub low_value: String,
    /// High value of the input, as shown with unit.
    pub high_value: String,
    /// Whether the range is the default ±20 % (neither a swing nor a
    /// distribution stated in the scenario; an input with a distribution
    /// and no swing is swung over its 10th to 90th percentiles).
    pub default_range: bool,
    /// Change in net savings at the low value, against the base case.
    pub delta_at_low: Decimal,
    /// Change in net savings at the high value, against the base case.
    pub delta_at_high: Decimal,
}

/// Monte Carlo summary.
#[derive(Debug, Clone, Serialize)]
pub struct RiskView {
    /// Number of samples.
    pub samples: usize,
    /// Seed.
    pub seed: u64,
    /// Draws refused (a value out of its valid range, or a cycle that
    /// cannot be solved) and redrawn from the same sample's stream.
    pub redraws: u64,
    /// Why the first redrawn draw was refused, when any was.
    pub first_redraw_reason: Option<String>,
    /// How draws that move a bid's engine were solved, and the route's
    /// measured error (one line).
    pub route_note: String,
    /// One entry per non-baseline candidate.
    pub candidates: Vec<RiskCandidate>,
}

/// Monte Carlo results for one candidate.
#[derive(Debug, Clone, Serialize)]
pub struct RiskCandidate {
    /// Candidate id.
    pub candidate_id: String,
    /// Net savings statistics.
    pub net_savings: Percentiles,
    /// Break-even premium statistics.
    pub break_even_premium: Percentiles,
    /// Probability that it beats the baseline at the premium asked.
    pub probability_beats_baseline: f64,
    /// Histogram of net savings.
    pub histogram: Histogram,
    /// The acceptance test by the contract, for a candidate with a
    /// guarantee (left out of the JSON otherwise). Net savings and the
    /// chance of beating the baseline above are net of these damages.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub contract: Option<RiskContract>,
}

/// The acceptance test of a candidate with a guarantee over a risk run.
#[derive(Debug, Clone, Serialize)]
pub struct RiskContract {
    /// Share of samples (0 to 1) short of the guarantee beyond the
    /// tolerance (heat rate or output).
    pub probability_shortfall: f64,
    /// Damages received from the vendor (after the cap), statistics over
    /// the samples; the mean is the expected damages.
    pub damages: Percentiles,
}

/// Mean and percentiles of a sampled money figure.
#[derive(Debug, Clone, Serialize)]
pub struct Percentiles {
    /// Mean.
    pub mean: Decimal,
    /// 10th percentile.
    pub p10: Decimal,
    /// Median.
    pub p50: Decimal,
    /// 90th percentile.
    pub p90: Decimal,
}

/// Equal-width histogram.
#[derive(Debug, Clone, Serialize)]
pub struct Histogram {
    /// Lower edge of the first bin.
    pub low: Decimal,
    /// Bin width.
    pub bin_width: Decimal,
    /// Count per bin.
    pub counts: Vec<u64>,
}

/// The "Site performance" section: each candidate's fixed machine over
/// ambient temperature and load at the site's pressure and humidity, and
/// its year as priced.
#[derive(Debug, Clone, Default, Serialize)]
pub struct SitePerformanceView {
    /// Compressor inlet temperatures of the curves, K, ascending.
    pub temperatures_k: Vec<f64>,
    /// The site's annual mean temperature, K (marked on the charts).
    pub site_temperature_k: f64,
    /// Loads of the part-load curves, fractions of the site base load,
    /// descending.
    pub loads: Vec<f64>,
    /// Whether any candidate states vendor curves (`part_load`,
    /// `ambient_correction`), which price it and are drawn here.
    pub part_load_from_table: bool,
    /// Every candidate, in scenario order.
    pub candidates: Vec<SiteCandidateView>,
}

/// One candidate in the "Site performance" section.
#[derive(Debug, Clone, Default, Serialize)]
pub struct SiteCandidateView {
    /// Candidate id.
    pub candidate_id: String,
    /// Candidate label.
    pub label: String,
    /// Whether it is priced as a fixed machine (else at its rating, and it
    /// has no curves).
    pub fixed_machine: bool,
    /// Base-load net output at each of `temperatures_k`, kW; `None` where
    /// the machine cannot run.
    pub output_kw: Vec<Option<f64>>,
    /// Base-load net heat rate (LHV) at each of `temperatures_k`, kJ/kWh.
    pub heat_rate_kj_per_kwh: Vec<Option<f64>>,
    /// Net heat rate (LHV) at the site at each of `loads`, kJ/kWh.
    pub part_load_heat_rate_kj_per_kwh: Vec<Option<f64>>,
    /// Net energy in a year as priced, MWh.
    pub energy_mwh: f64,
    /// Fuel energy in a year as priced, GJ (LHV).
    pub fuel_gj_lhv: f64,
    /// Run hours in a year, h.
    pub run_hours: f64,
    /// Starts per year; `None` while starts are not modelled.
    pub starts_per_year: Option<f64>,
    /// Run hours by ambient temperature bin.
    pub hours_by_temperature: Vec<TemperatureBinView>,
}

/// Run hours in one ambient temperature bin.
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize)]
pub struct TemperatureBinView {
    /// Lower edge, K.
    pub low_k: f64,
    /// Upper edge, K.
    pub high_k: f64,
    /// Run hours in the bin per year, h.
    pub hours: f64,
}
