//! Shared helpers of the datasheet tests: a datasheet made by the design
//! solver from a known engine.

#![allow(dead_code)]

use brayfin::cycle::{self, EfficiencyBasis, EngineConfig, GasModel, Regenerator, Sizing};
use brayfin::datasheet::{CalibrationOptions, Datasheet, HeatRateBasis};
use brayfin::fuel::Fuel;
use brayfin::offdesign::Ambient;

/// A known engine: what the calibration should recover.
#[derive(Debug, Clone, Copy)]
pub struct Known {
    pub pressure_ratio: f64,
    pub firing_k: f64,
    pub compressor_polytropic: f64,
    pub cooling: f64,
    pub electro_mechanical: f64,
    pub net_output_kw: f64,
    pub rating: Ambient,
}

/// The engine's configuration under the calibration's default
/// assumptions (losses, efficiency gap, η_mech = η_gen = √ε).
pub fn config(k: &Known) -> EngineConfig {
    let o = CalibrationOptions::default();
    let split = k.electro_mechanical.sqrt();
    EngineConfig {
        ambient_temperature_k: k.rating.temperature_k,
        ambient_pressure_kpa: k.rating.pressure_kpa,
        pressure_ratio: k.pressure_ratio,
        turbine_inlet_temperature_k: k.firing_k,
        compressor_efficiency: k.compressor_polytropic,
        turbine_efficiency: k.compressor_polytropic - o.efficiency_gap,
        efficiency_basis: EfficiencyBasis::Polytropic,
        inlet_pressure_loss: o.inlet_pressure_loss,
        exhaust_pressure_loss: o.exhaust_pressure_loss,
        combustor_pressure_loss: o.combustor_pressure_loss,
        combustion_efficiency: o.combustion_efficiency,
        mechanical_efficiency: split,
        generator_efficiency: split,
        auxiliary_load_fraction: 0.0,
        regenerator: None,
        intercooler: None,
        reheat: None,
        sizing: Some(Sizing::NetOutputKw(k.net_output_kw)),
    }
}

/// The datasheet the design solver gives for `k` burning `fuel`, stating
/// the pressure ratio and firing temperature as asked.
pub fn datasheet_of(k: &Known, fuel: &Fuel, state_ratio: bool, state_firing: bool) -> Datasheet {
    datasheet_with(k, None, fuel, state_ratio, state_firing)
}

/// As [`datasheet_of`], for the engine with `regenerator`.
pub fn datasheet_with(
    k: &Known,
    regenerator: Option<Regenerator>,
    fuel: &Fuel,
    state_ratio: bool,
    state_firing: bool,
) -> Datasheet {
    let mut engine = config(k);
    engine.regenerator = regenerator;
    let detail = cycle::Detail {
        turbine_cooling: k.cooling,
        relative_humidity: k.rating.relative_humidity,
    };
    let r = cycle::solve_detailed(&engine, &detail, &GasModel::Products, fuel).unwrap();
    let flows = r.flows.unwrap();
    Datasheet {
        net_output_kw: flows.net_output_kw,
        heat_rate_kj_per_kwh: r.heat_rate_kj_per_kwh,
        heat_rate_basis: HeatRateBasis::Lhv,
        exhaust_flow_kg_per_s: flows.exhaust_flow_kg_per_s,
        exhaust_temperature_k: r.exhaust_temperature_k,
        pressure_ratio: state_ratio.then_some(k.pressure_ratio),
        firing_temperature_k: state_firing.then_some(k.firing_k),
        regenerator,
        rating: k.rating,
        fuel: fuel.clone(),
    }
}

/// An F-class-like engine at ISO conditions (figures of the class, from
/// memory: pressure ratio about 17, firing about 1 700 K).
pub fn f_class() -> Known {
    Known {
        pressure_ratio: 17.0,
        firing_k: 1700.0,
        compressor_polytropic: 0.91,
        cooling: CalibrationOptions::default().cooling_for(1700.0),
        electro_mechanical: 0.975,
        net_output_kw: 250_000.0,
        rating: Ambient::ISO,
    }
}
