//! A fixed machine away from its rating: each bid's output, heat rate and
//! flows at any ambient and any load.
//!
//! # Model
//! A single-shaft, constant-speed (generator drive) gas turbine, simple or
//! regenerated, is fixed by the design solve at its rating condition
//! ([`Machine::calibrate`]): rated air flow, turbine flow capacity and the
//! compressor and turbine design points. Away from it ([`Machine::solve`]):
//!
//! - **Compressor**: corrected speed `N/√T₁` moves with the inlet
//!   temperature; corrected flow `m√T₁/p₁` and efficiency follow the generic
//!   characteristic of [`characteristic`] against corrected speed and the
//!   guide-vane airflow fraction. Its speed lines are taken vertical (flow
//!   independent of pressure ratio; Saravanamuttoo et al., *Gas Turbine
//!   Theory*, off-design chapter, from memory).
//! - **Turbine**: first-stage nozzle choked, so `m₃√T₃/p₃` is fixed at its
//!   design value (Saravanamuttoo et al.; Walsh and Fletcher, *Gas Turbine
//!   Performance*). This fixes the pressure ratio for a given air flow,
//!   fuel flow and firing temperature. Turbine efficiency follows its
//!   loading (velocity ratio) through [`characteristic`].
//! - Losses, combustion, mechanical and generator efficiencies, auxiliary
//!   load and regenerator effectiveness keep their rated values. Reynolds
//!   number effects are not modelled, so the model is exactly similar in
//!   ambient pressure: output ∝ p, heat rate unchanged (Walsh and Fletcher,
//!   non-dimensional groups).
//! - Each point is one cycle solve ([`crate::cycle::solve`]) at the matched
//!   pressure ratio, firing temperature and efficiencies, so it closes the
//!   first law as a design point does. At the rating condition and base
//!   load the matched state is the design state (pressure ratio, air flow
//!   and efficiencies equal to it to rounding).
//!
//! # Control ([`Control`])
//! - Base load at any ambient: vanes open, firing temperature at its rated
//!   value unless the exhaust (turbine exit) temperature would exceed its
//!   limit, then lowered to hold the limit. Loads are fractions of that
//!   base-load output.
//! - `guide-vanes`: close the inlet guide vanes down to `minimum_airflow`
//!   holding the exhaust at its limit (firing temperature lowered as
//!   needed, never above rated), then lower the firing temperature at
//!   minimum airflow.
//! - `firing-temperature`: vanes fixed open; firing temperature falls with
//!   load.
//! - A load below `minimum_load` or above 1 is an error naming the load.

pub mod characteristic;
mod control;
mod error;
mod folded;
mod machine;
mod roots;

pub use error::OffDesignError;
pub use machine::Machine;

use crate::thermo::STANDARD_PRESSURE_KPA;
use serde::Serialize;

/// Ambient air at the compressor's intake.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Ambient {
    /// Dry-bulb temperature, K.
    pub temperature_k: f64,
    /// Pressure, kPa.
    pub pressure_kpa: f64,
    /// Relative humidity, a fraction from 0 to 1.
    pub relative_humidity: f64,
}

impl Ambient {
    /// The ISO 3977-2 / ISO 2314 reference conditions for gas-turbine
    /// ratings: 15 °C, 101.325 kPa, 60 % relative humidity (from memory).
    pub const ISO: Ambient = Ambient {
        temperature_k: 288.15,
        pressure_kpa: STANDARD_PRESSURE_KPA,
        relative_humidity: 0.6,
    };

    /// Dry air at `temperature_k` and `pressure_kpa`.
    pub fn dry(temperature_k: f64, pressure_kpa: f64) -> Ambient {
        Ambient {
            temperature_k,
            pressure_kpa,
            relative_humidity: 0.0,
        }
    }
}

/// Requested load: a fraction of the base-load output available at the
/// ambient in question (1 = base load).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Load(pub f64);

impl Load {
    /// Base load.
    pub const BASE: Load = Load(1.0);
}

/// Part-load control strategy.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Strategy {
    /// Close the inlet guide vanes (holding exhaust temperature at its
    /// limit) down to the minimum airflow, then lower the firing
    /// temperature.
    GuideVanes,
    /// Fixed air flow; the firing temperature falls with load.
    FiringTemperature,
}

/// How a machine is controlled away from base load.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Control {
    /// The strategy.
    pub strategy: Strategy,
    /// Fewest the guide vanes may pass: a fraction of rated corrected flow,
    /// (0, 1].
    pub minimum_airflow: f64,
    /// Exhaust (turbine exit) temperature limit, K; `None`: the rated
    /// exhaust temperature.
    pub exhaust_temperature_limit_k: Option<f64>,
    /// Lowest load the machine runs at, a fraction of base load, (0, 1].
    pub minimum_load: f64,
}

impl Default for Control {
    /// Guide-vane control to 70 % airflow, exhaust limit at the rated
    /// exhaust temperature, minimum load 30 % (common practice for
    /// heavy-duty machines with variable inlet guide vanes).
    fn default() -> Self {
        Control {
            strategy: Strategy::GuideVanes,
            minimum_airflow: 0.7,
            exhaust_temperature_limit_k: None,
            minimum_load: 0.3,
        }
    }
}

impl Control {
    /// Range checks, each naming its field.
    pub fn validate(&self) -> Result<(), OffDesignError> {
        let w = self.minimum_airflow;
        if !(w > 0.0 && w <= 1.0) {
            return Err(OffDesignError::invalid(
                "control.minimum_airflow",
                format!("{w} is outside (0, 1]"),
                "expected a fraction of rated corrected flow above 0 and at most 1",
            ));
        }
        let l = self.minimum_load;
        if !(l > 0.0 && l <= 1.0) {
            return Err(OffDesignError::invalid(
                "control.minimum_load",
                format!("{l} is outside (0, 1]"),
                "expected a fraction of base load above 0 and at most 1",
            ));
        }
        if let Some(t) = self.exhaust_temperature_limit_k {
            if !(t.is_finite() && t > 0.0) {
                return Err(OffDesignError::invalid(
                    "control.exhaust_temperature_limit_k",
                    format!("{t} K is not a positive temperature"),
                    "expected a temperature > 0 K",
                ));
            }
        }
        Ok(())
    }
}

/// What sets the operating point.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Limit {
    /// Firing temperature at its rated value.
    FiringTemperature,
    /// Exhaust temperature at its limit.
    ExhaustTemperature,
    /// Guide vanes at minimum airflow; firing temperature follows load.
    MinimumAirflow,
    /// Firing-temperature control: air flow fixed, firing temperature
    /// follows load.
    FixedAirflow,
}

impl Limit {
    /// The name as printed: `firing-temperature`, `exhaust-temperature`,
    /// `minimum-airflow`, `fixed-airflow`.
    pub fn name(&self) -> &'static str {
        match self {
            Limit::FiringTemperature => "firing-temperature",
            Limit::ExhaustTemperature => "exhaust-temperature",
            Limit::MinimumAirflow => "minimum-airflow",
            Limit::FixedAirflow => "fixed-airflow",
        }
    }
}

/// A fixed machine at one ambient and load.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct OffDesignPoint {
    /// Ambient temperature, K.
    pub ambient_temperature_k: f64,
    /// Ambient pressure, kPa.
    pub ambient_pressure_kpa: f64,
    /// Ambient relative humidity, fraction.
    pub relative_humidity: f64,
    /// Load, fraction of base-load output at this ambient.
    pub load: f64,
    /// Net electrical output, kW.
    pub net_output_kw: f64,
    /// Heat rate, kJ (LHV) per kWh.
    pub heat_rate_kj_per_kwh: f64,
    /// Net electrical output over fuel energy (LHV).
    pub thermal_efficiency: f64,
    /// Compressor inlet air flow, kg/s.
    pub air_flow_kg_per_s: f64,
    /// Fuel flow, kg/s.
    pub fuel_flow_kg_per_s: f64,
    /// Exhaust flow, kg/s.
    pub exhaust_flow_kg_per_s: f64,
    /// Exhaust temperature, K: the turbine exit, where the limit is held.
    pub exhaust_temperature_k: f64,
    /// Stack temperature, K: regenerator gas exit, or the turbine exit.
    pub stack_temperature_k: f64,
    /// Firing temperature (combustor exit), K.
    pub firing_temperature_k: f64,
    /// Compressor pressure ratio.
    pub pressure_ratio: f64,
    /// Guide-vane setting as the fraction of rated corrected flow it passes
    /// at rated corrected speed.
    pub airflow_fraction: f64,
    /// Compressor efficiency at this point (the design basis).
    pub compressor_efficiency: f64,
    /// Turbine efficiency at this point (the design basis).
    pub turbine_efficiency: f64,
    /// What sets the point.
    pub limit: Limit,
    /// First-law residual of the point's cycle, kJ per kg of air.
    pub energy_balance_residual_kj_per_kg: f64,
}

impl Machine {
    /// The machine at `ambient` and `load`.
    ///
    /// Errors (each naming its field): ambient outside the property data or
    /// the compressor characteristic, humidity above saturation, a load
    /// above 1 or below the control's minimum load, control limits that
    /// leave no operating point.
    pub fn solve(&self, ambient: Ambient, load: Load) -> Result<OffDesignPoint, OffDesignError> {
        self.check_ambient(&ambient)?;
        let fraction = load.0;
        let minimum = self.control.minimum_load;
        if !(minimum..=1.0).contains(&fraction) {
            return Err(OffDesignError::Load {
                load_percent: fraction * 100.0,
                minimum_percent: minimum * 100.0,
                problem: if fraction > 1.0 {
                    "above 100 %"
                } else {
                    "below the minimum load"
                },
            });
        }
        let (base, base_limit) = self.base(&ambient)?;
        let (m, limit) = if fraction == 1.0 {
            (base, base_limit)
        } else {
            let target = fraction * base.net_output_kw();
            self.part_load(&ambient, base, target)?
        };
        Ok(self.point(&ambient, fraction, m, limit))
    }

    fn point(
        &self,
        ambient: &Ambient,
        load: f64,
        m: machine::Matched,
        limit: Limit,
    ) -> OffDesignPoint {
        let r = &m.result;
        let fuel_flow = m.air_flow_kg_per_s * r.heat_input_kj_per_kg / self.fuel.lhv_kj_per_kg();
        OffDesignPoint {
            ambient_temperature_k: ambient.temperature_k,
            ambient_pressure_kpa: ambient.pressure_kpa,
            relative_humidity: ambient.relative_humidity,
            load,
            net_output_kw: m.net_output_kw(),
            heat_rate_kj_per_kwh: r.heat_rate_kj_per_kwh,
            thermal_efficiency: r.thermal_efficiency,
            air_flow_kg_per_s: m.air_flow_kg_per_s,
            fuel_flow_kg_per_s: fuel_flow,
            exhaust_flow_kg_per_s: m.air_flow_kg_per_s + fuel_flow,
            exhaust_temperature_k: m.turbine_exit_k(),
            stack_temperature_k: r.exhaust_temperature_k,
            firing_temperature_k: m.firing_temperature_k,
            pressure_ratio: m.pressure_ratio,
            airflow_fraction: m.vanes,
            compressor_efficiency: m.compressor_efficiency,
            turbine_efficiency: m.turbine_efficiency,
            limit,
            energy_balance_residual_kj_per_kg: r.energy_balance_residual_kj_per_kg,
        }
    }
}
