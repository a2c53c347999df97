//! The gas-turbine cycle solver: an [`EngineConfig`], a [`GasModel`] and a
//! [`Fuel`] in; a [`CycleResult`] (state table, works, heat rate) out.
//!
//! # State points
//! Ids follow the flow; the simple cycle has `1, 2s, 2, 3, 4s, 4`:
//!
//! | id    | state                                            | present when  |
//! |-------|--------------------------------------------------|---------------|
//! | `1`   | compressor inlet (after the inlet pressure loss) | always        |
//! | `2as` | low-pressure compressor exit, isentropic         | intercooler   |
//! | `2a`  | low-pressure compressor exit                     | intercooler   |
//! | `2b`  | intercooler exit                                 | intercooler   |
//! | `2s`  | compressor exit, isentropic                      | always        |
//! | `2`   | compressor exit                                  | always        |
//! | `5`   | regenerator air exit (combustor inlet)           | regenerator   |
//! | `3`   | turbine inlet (combustor exit)                   | always        |
//! | `3r`  | rotor inlet, after the coolant has mixed in      | turbine cooling |
//! | `3as` | high-pressure turbine exit, isentropic           | reheat        |
//! | `3a`  | high-pressure turbine exit                       | reheat        |
//! | `3b`  | reheat combustor exit                            | reheat        |
//! | `4s`  | turbine exit, isentropic                         | always        |
//! | `4`   | turbine exit                                     | always        |
//! | `6`   | regenerator gas exit                             | regenerator   |
//!
//! With intercooling, `2s`/`2` are the high-pressure compressor's exit; with
//! reheat, `4s`/`4` are the low-pressure turbine's. Each state's enthalpy
//! and entropy are per kg of the gas at that point (air before the
//! combustor; with `products`, combustion products after it).
//!
//! # Decisions
//! - Works, heats and flows are per kg of compressor inlet air. The turbine
//!   work with `products` counts the fuel's mass: `(1 + f)(h3 − h4)`.
//! - Pressure losses are fractions of the local pressure: inlet
//!   `p1 = p_amb (1 − loss)`; combustor `p3 = p_in (1 − loss)`; the
//!   regenerator air side between 2 and 5; the turbine exhausts at
//!   `p_amb / ((1 − exhaust loss)(1 − regenerator gas-side loss))`. The
//!   reheat combustor has the main combustor's fractional loss; the
//!   intercooler has none.
//! - Air-standard models (`cold-air`, `air`) heat air of unchanged mass; the
//!   fuel supplies that heat divided by the combustion efficiency.
//!   `products` burns the fuel (entering at 298.15 K) to complete-combustion
//!   products; the fuel per kg of air follows in closed form from each
//!   combustor's energy balance, and with a regenerator the combustor inlet
//!   enthalpy is iterated (secant) to |Δh5| ≤ 1e-13 relative, because the
//!   turbine gas, and so the exhaust, depends on the fuel burned.
//! - Thermal efficiency is **net electrical output over fuel energy on the
//!   lower-heating-value basis**: `(w_turbine − w_compressor) η_mech η_gen
//!   (1 − auxiliary load fraction) / q_fuel`. The heat rate is its inverse,
//!   3600 / η kJ/kWh (LHV).
//! - First law on every solve: `w_turbine − w_compressor` must equal heat
//!   added (fuel LHV energy) minus heat rejected (exhaust enthalpy above
//!   298.15 K less inlet air's, intercooler heat, and the fuel energy not
//!   released) within 1e-9 of the heat added, or the solve fails.
//! - `cold-air` takes a closed-form path (power laws, no inverse solves;
//!   `cold.rs`) with the same states, works and first-law check. Any cycle
//!   it does not solve (every input the generic solver refuses among them)
//!   goes to the generic solver, so errors are reported in one place.

mod cold;
#[cfg(test)]
mod cold_tests;
mod components;
mod compression;
mod config;
#[cfg(test)]
mod detail_tests;
mod error;
mod hot;
mod solver;
mod states;

pub use config::{
    EfficiencyBasis, EngineConfig, Intercooler, IntercoolerExit, Regenerator, Reheat, Sizing,
};
pub use error::CycleError;

use crate::fuel::Fuel;
use crate::thermo::cold_air::{ColdAir, DEFAULT_CP_KJ_PER_KG_K, DEFAULT_K};
use crate::thermo::humidity::humid_air;
use crate::thermo::mixture::Mixture;
use crate::units::KJ_PER_BTU;
use components::{greater, AirStandard, Combustion, Products};
use serde::Serialize;
use std::sync::OnceLock;

/// Which gas property model the solve uses.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum GasModel {
    /// Constant cp (kJ/(kg·K)) and ratio of specific heats k; the
    /// cold-air standard (defaults 1.005 and 1.4: [`GasModel::cold_air_standard`]).
    ColdAir {
        /// Specific heat at constant pressure, kJ/(kg·K), > 0.
        cp_kj_per_kg_k: f64,
        /// Ratio of specific heats, > 1.
        k: f64,
    },
    /// Variable-property dry air (NASA-7 polynomials) throughout.
    Air,
    /// Dry air through the compressor; complete-combustion products of the
    /// fuel through the turbine (needs a modelled fuel).
    Products,
}

impl GasModel {
    /// The cold-air standard with the usual constants: cp = 1.005 kJ/(kg·K),
    /// k = 1.4.
    pub fn cold_air_standard() -> GasModel {
        GasModel::ColdAir {
            cp_kj_per_kg_k: DEFAULT_CP_KJ_PER_KG_K,
            k: DEFAULT_K,
        }
    }

    /// The model's name as the command line spells it: `cold-air`, `air`,
    /// `products`.
    pub fn name(&self) -> &'static str {
        match self {
            GasModel::ColdAir { .. } => "cold-air",
            GasModel::Air => "air",
            GasModel::Products => "products",
        }
    }
}

/// One point of the cycle.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct StatePoint {
    /// Id (`1`, `2s`, `2`, …; see the module documentation).
    pub id: &'static str,
    /// What the point is, in words.
    pub name: &'static str,
    /// Temperature, K.
    pub temperature_k: f64,
    /// Pressure, kPa.
    pub pressure_kpa: f64,
    /// Specific enthalpy, kJ per kg of the gas at this point. Absolute
    /// (formation included) for `air` and `products`; `cp·T` for cold air.
    pub enthalpy_kj_per_kg: f64,
    /// Specific entropy, kJ/(kg·K) per kg of the gas at this point, relative
    /// to the model's zero (see [`crate::thermo`]).
    pub entropy_kj_per_kg_k: f64,
}

/// Mass flows and output of a sized engine.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Flows {
    /// Net electrical output, kW.
    pub net_output_kw: f64,
    /// Compressor inlet air flow, kg/s.
    pub air_flow_kg_per_s: f64,
    /// Fuel flow, kg/s.
    pub fuel_flow_kg_per_s: f64,
    /// Exhaust flow (air plus fuel, every gas model), kg/s.
    pub exhaust_flow_kg_per_s: f64,
}

/// The solved cycle. Specific quantities are per kg of compressor inlet
/// air.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CycleResult {
    /// Gas model name (`cold-air`, `air`, `products`).
    pub gas_model: &'static str,
    /// State table in flow order.
    pub states: Vec<StatePoint>,
    /// Compressor work (all stages), kJ/kg.
    pub compressor_work_kj_per_kg: f64,
    /// Turbine work (all stages), kJ/kg.
    pub turbine_work_kj_per_kg: f64,
    /// Shaft net work, turbine minus compressor, kJ/kg.
    pub net_work_kj_per_kg: f64,
    /// Net electrical output after mechanical, generator and auxiliary
    /// losses, kJ/kg.
    pub electrical_work_kj_per_kg: f64,
    /// Fuel energy supplied, LHV basis, kJ/kg.
    pub heat_input_kj_per_kg: f64,
    /// Heat rejected (exhaust, intercooler, unburned fuel energy), kJ/kg.
    pub heat_rejected_kj_per_kg: f64,
    /// Compressor work over turbine work.
    pub back_work_ratio: f64,
    /// Net electrical output over fuel energy (LHV), a fraction.
    pub thermal_efficiency: f64,
    /// Heat rate, kJ of fuel (LHV) per kWh of net electrical output.
    pub heat_rate_kj_per_kwh: f64,
    /// Heat rate, Btu (International Table) of fuel (LHV) per kWh.
    pub heat_rate_btu_per_kwh: f64,
    /// Heating-value basis of the heat rate and efficiency: always `LHV`.
    pub heat_rate_basis: &'static str,
    /// Exhaust (stack) temperature, K: regenerator gas exit or turbine exit.
    pub exhaust_temperature_k: f64,
    /// Fuel per kg of air, with the `products` model only (the air-standard
    /// models carry no fuel mass).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub fuel_air_ratio: Option<f64>,
    /// CO2 emitted per MWh of net electrical output, kg.
    pub co2_kg_per_mwh: Option<f64>,
    /// Net work minus (heat added − heat rejected), kJ/kg; |·| ≤ 1e-9 of the
    /// heat input on every successful solve.
    pub energy_balance_residual_kj_per_kg: f64,
    /// Flows and output when the config was sized.
    #[serde(flatten)]
    pub flows: Option<Flows>,
}

/// Btu (International Table) per kJ.
const BTU_PER_KJ: f64 = 1.0 / KJ_PER_BTU;

fn dry_air() -> &'static Mixture {
    static AIR: OnceLock<Mixture> = OnceLock::new();
    AIR.get_or_init(Mixture::dry_air)
}

/// Refinements of the gas path that [`solve_detailed`] takes beside an
/// [`EngineConfig`]: turbine cooling and ambient humidity. Both default to
/// 0, which gives exactly (bit for bit) the result of [`solve`].
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize)]
pub struct Detail {
    /// Fraction of the air entering the combustor that bypasses it and
    /// mixes with the combustor gas ahead of the turbine rotor, [0, 1).
    /// The coolant leaves at the combustor inlet state (compressor
    /// delivery, or the regenerator air exit where there is one); mixing is
    /// adiabatic at the combustor-exit pressure; the firing temperature
    /// (`turbine_inlet_temperature_k`) is the combustor exit and the rotor
    /// inlet temperature (state `3r`) follows from the mixed enthalpy.
    pub turbine_cooling: f64,
    /// Ambient relative humidity, 0 to 1: water vapour in the compressor
    /// air, and so in the products ([`crate::thermo::humidity`]). Needs the
    /// `air` or `products` gas model.
    pub relative_humidity: f64,
}

impl Detail {
    /// No cooling, dry air.
    pub const NONE: Detail = Detail {
        turbine_cooling: 0.0,
        relative_humidity: 0.0,
    };

    /// Range checks, each naming its field.
    pub fn validate(&self) -> Result<(), CycleError> {
        let c = self.turbine_cooling;
        if !(0.0..1.0).contains(&c) {
            return Err(CycleError::invalid(
                "turbine_cooling",
                format!("{c} is outside [0, 1)"),
                "expected a fraction of the combustor air ≥ 0 and < 1",
            ));
        }
        let rh = self.relative_humidity;
        if !(0.0..=1.0).contains(&rh) {
            return Err(CycleError::invalid(
                "relative_humidity",
                format!("{rh} is outside 0 to 1 (above 1 is above saturation)"),
                "expected a relative humidity from 0 to 1",
            ));
        }
        Ok(())
    }
}

/// Solve `config` with gas model `gas` burning `fuel`, dry air and no
/// turbine cooling.
///
/// Errors: an input out of range or an impossible combination (each naming
/// its field), a fuel without composition for `products`, no net work, or
/// (internal, never expected) a first-law residual above 1e-9 relative.
pub fn solve(
    config: &EngineConfig,
    gas: &GasModel,
    fuel: &Fuel,
) -> Result<CycleResult, CycleError> {
    solve_detailed(config, &Detail::NONE, gas, fuel)
}

/// Solve `config` with the refinements `detail` (turbine cooling, humid
/// air); as [`solve`] otherwise, and identical to it when `detail` is
/// [`Detail::NONE`].
///
/// Errors: those of [`solve`]; a detail out of range; humidity with the
/// cold-air model; humid air whose vapour would exceed the ambient pressure
/// or at a temperature outside the saturation data (field
/// `relative_humidity`).
pub fn solve_detailed(
    config: &EngineConfig,
    detail: &Detail,
    gas: &GasModel,
    fuel: &Fuel,
) -> Result<CycleResult, CycleError> {
    config.validate()?;
    detail.validate()?;
    let eta_b = config.combustion_efficiency;
    let cooling = detail.turbine_cooling;
    let humid = if detail.relative_humidity > 0.0 {
        if let GasModel::ColdAir { .. } = gas {
            return Err(CycleError::invalid(
                "relative_humidity",
                "the cold-air model has fixed properties and carries no water vapour",
                "use the air or products gas model, or a relative humidity of 0",
            ));
        }
        Some(
            humid_air(
                config.ambient_temperature_k,
                config.ambient_pressure_kpa,
                detail.relative_humidity,
            )
            .map_err(|e| {
                CycleError::invalid(
                    "relative_humidity",
                    e.to_string(),
                    "expected a humidity the ambient can hold",
                )
            })?,
        )
    } else {
        None
    };
    match *gas {
        GasModel::ColdAir { cp_kj_per_kg_k, k } => {
            let air = ColdAir::new(cp_kj_per_kg_k, k)?;
            let fast = if cooling == 0.0 {
                cold::run(config, &air, eta_b)
            } else {
                None
            };
            match fast {
                Some(solved) => finish(config, gas, fuel, solved, false),
                None => solve_with(config, gas, fuel, &AirStandard::new(air, eta_b), cooling),
            }
        }
        GasModel::Air => {
            let air = humid.map_or_else(|| dry_air().clone(), |(mix, _)| mix);
            solve_with(config, gas, fuel, &AirStandard::new(air, eta_b), cooling)
        }
        GasModel::Products => {
            let model = match humid {
                None => Products::new(dry_air().clone(), fuel, eta_b)?,
                Some((mix, fractions)) => Products::in_air(mix, fractions, fuel, eta_b)?,
            };
            solve_with(config, gas, fuel, &model, cooling)
        }
    }
}

/// Solve with the generic solver, combustor model `model` and turbine
/// cooling fraction `cooling`.
fn solve_with<C: Combustion>(
    config: &EngineConfig,
    gas: &GasModel,
    fuel: &Fuel,
    model: &C,
    cooling: f64,
) -> Result<CycleResult, CycleError> {
    let solved = solver::run(config, model, cooling)?;
    finish(config, gas, fuel, solved, C::COMPOSITION_FOLLOWS_FUEL)
}

/// The result of a solved cycle; `burns_fuel` when the model carries the
/// fuel's mass (then the result states the fuel–air ratio).
#[inline(always)]
fn finish(
    config: &EngineConfig,
    gas: &GasModel,
    fuel: &Fuel,
    solved: solver::Solved,
    burns_fuel: bool,
) -> Result<CycleResult, CycleError> {
    let net = solved.turbine_work - solved.compressor_work;
    if !greater(net, 0.0) {
        return Err(CycleError::NoNetWork {
            turbine_work_kj_per_kg: solved.turbine_work,
            compressor_work_kj_per_kg: solved.compressor_work,
        });
    }
    let electrical = net
        * config.mechanical_efficiency
        * config.generator_efficiency
        * (1.0 - config.auxiliary_load_fraction);
    let efficiency = electrical / solved.heat_input;
    // From the works, not from the efficiency: the two divisions run side
    // by side instead of one after the other.
    let heat_rate = 3600.0 * solved.heat_input / electrical;
    let flows = config.sizing.map(|sizing| {
        let air = match sizing {
            Sizing::NetOutputKw(p) => p / electrical,
            Sizing::AirFlowKgPerS(m) => m,
        };
        let fuel_flow = air * solved.heat_input / fuel.lhv_kj_per_kg();
        Flows {
            net_output_kw: air * electrical,
            air_flow_kg_per_s: air,
            fuel_flow_kg_per_s: fuel_flow,
            exhaust_flow_kg_per_s: air + fuel_flow,
        }
    });
    Ok(CycleResult {
        gas_model: gas.name(),
        states: solved.states,
        compressor_work_kj_per_kg: solved.compressor_work,
        turbine_work_kj_per_kg: solved.turbine_work,
        net_work_kj_per_kg: net,
        electrical_work_kj_per_kg: electrical,
        heat_input_kj_per_kg: solved.heat_input,
        heat_rejected_kj_per_kg: solved.heat_rejected,
        back_work_ratio: solved.compressor_work / solved.turbine_work,
        thermal_efficiency: efficiency,
        heat_rate_kj_per_kwh: heat_rate,
        heat_rate_btu_per_kwh: heat_rate * BTU_PER_KJ,
        heat_rate_basis: "LHV",
        exhaust_temperature_k: solved.exhaust_temperature_k,
        fuel_air_ratio: burns_fuel.then_some(solved.fuel_per_kg_air),
        co2_kg_per_mwh: Some(heat_rate * 1e-3 * fuel.co2_kg_per_gj_lhv()),
        energy_balance_residual_kj_per_kg: solved.residual,
        flows,
    })
}
