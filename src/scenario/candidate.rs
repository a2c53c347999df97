//! A candidate (one bid): its engine configuration and its costs.

use rust_decimal::Decimal;

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
    /// O&M, overhaul, degradation, residual value, construction schedule.
    pub costs: CandidateCosts,
}
