//! `air` and `products` cycles against an independent implementation on
//! Cantera.
//!
//! Source: `tests/reference/cantera_air_cycles.json` (23 configurations:
//! pressure ratios 4–40, turbine inlet 1000–1800 K, efficiencies 0.75–1.0,
//! isentropic and polytropic, with and without losses, regenerator,
//! intercooling and reheat) and `cantera_products_cycles.json` (10
//! configurations, three fuels), written by
//! `tests/reference/cantera_cycles.py`, which solves the same cycle
//! definitions with Cantera's properties and inverse solvers (GRI-Mech 3.0).
//!
//! Tolerances (the issue's): thermal efficiency 1e-5 absolute, every state
//! temperature 0.01 K, fuel–air ratio 1e-4 relative.

use brayfin::cycle::{
    solve, CycleResult, EfficiencyBasis, EngineConfig, GasModel, Intercooler, IntercoolerExit,
    Regenerator, Reheat,
};
use brayfin::fuel::Fuel;
use serde_json::Value;

fn f(v: &Value, key: &str) -> f64 {
    v[key]
        .as_f64()
        .unwrap_or_else(|| panic!("fixture lacks number {key}"))
}

fn config(c: &Value) -> EngineConfig {
    let regenerator = (!c["regenerator"].is_null()).then(|| Regenerator {
        effectiveness: f(&c["regenerator"], "effectiveness"),
        air_side_pressure_loss: f(&c["regenerator"], "air_side_pressure_loss"),
        gas_side_pressure_loss: f(&c["regenerator"], "gas_side_pressure_loss"),
    });
    let intercooler = (!c["intercooler"].is_null()).then(|| {
        let ic = &c["intercooler"];
        Intercooler {
            pressure_split: ic["pressure_split"].as_f64(),
            exit: match ic["exit_temperature_k"].as_f64() {
                Some(t) => IntercoolerExit::TemperatureK(t),
                None => IntercoolerExit::Effectiveness(f(ic, "effectiveness")),
            },
        }
    });
    let reheat = (!c["reheat"].is_null()).then(|| Reheat {
        pressure_split: c["reheat"]["pressure_split"].as_f64(),
        temperature_k: f(&c["reheat"], "temperature_k"),
    });
    EngineConfig {
        ambient_temperature_k: f(c, "ambient_temperature_k"),
        ambient_pressure_kpa: f(c, "ambient_pressure_kpa"),
        pressure_ratio: f(c, "pressure_ratio"),
        turbine_inlet_temperature_k: f(c, "turbine_inlet_temperature_k"),
        compressor_efficiency: f(c, "compressor_efficiency"),
        turbine_efficiency: f(c, "turbine_efficiency"),
        efficiency_basis: if c["polytropic"].as_bool() == Some(true) {
            EfficiencyBasis::Polytropic
        } else {
            EfficiencyBasis::Isentropic
        },
        inlet_pressure_loss: f(c, "inlet_pressure_loss"),
        exhaust_pressure_loss: f(c, "exhaust_pressure_loss"),
        combustor_pressure_loss: f(c, "combustor_pressure_loss"),
        combustion_efficiency: f(c, "combustion_efficiency"),
        mechanical_efficiency: f(c, "mechanical_efficiency"),
        generator_efficiency: f(c, "generator_efficiency"),
        auxiliary_load_fraction: f(c, "auxiliary_load_fraction"),
        regenerator,
        intercooler,
        reheat,
        sizing: None,
    }
}

fn compare(result: &CycleResult, expected: &Value, case: usize) {
    let eta = f(expected, "thermal_efficiency");
    assert!(
        (result.thermal_efficiency - eta).abs() <= 1e-5,
        "case {case}: efficiency {} vs Cantera {eta}",
        result.thermal_efficiency
    );
    let temperatures = expected["temperatures_k"]
        .as_object()
        .expect("temperature map");
    assert_eq!(
        temperatures.len(),
        result.states.len(),
        "case {case}: state count"
    );
    for (id, t) in temperatures {
        let t = t.as_f64().expect("temperature");
        let state = result
            .states
            .iter()
            .find(|s| s.id == id)
            .unwrap_or_else(|| panic!("case {case}: brayfin has no state {id}"));
        assert!(
            (state.temperature_k - t).abs() <= 0.01,
            "case {case}: T{id} {} vs Cantera {t}",
            state.temperature_k
        );
    }
    let t_exh = f(expected, "exhaust_temperature_k");
    assert!((result.exhaust_temperature_k - t_exh).abs() <= 0.01);
}

fn cases(text: &str) -> Vec<Value> {
    let data: Value = serde_json::from_str(text).expect("fixture is valid JSON");
    data["cases"].as_array().expect("cases").clone()
}

#[test]
fn air_cycles_match_cantera() {
    let cases = cases(include_str!("reference/cantera_air_cycles.json"));
    assert!(cases.len() >= 20);
    for (i, case) in cases.iter().enumerate() {
        let cfg = config(&case["config"]);
        let result = solve(&cfg, &GasModel::Air, &Fuel::methane())
            .unwrap_or_else(|e| panic!("case {i}: {e}"));
        compare(&result, &case["expected"], i);
    }
}

#[test]
fn products_cycles_and_combustor_fuel_air_ratio_match_cantera() {
    let cases = cases(include_str!("reference/cantera_products_cycles.json"));
    for (i, case) in cases.iter().enumerate() {
        let cfg = config(&case["config"]);
        let fuel_text = case["config"]["fuel"].as_str().expect("fuel");
        let fuel = Fuel::parse(fuel_text).expect("fixture fuel parses");
        let expected = &case["expected"];
        // The heating value the fixture derived from Cantera's enthalpies at
        // 298.15 K: same data, so 1e-7 relative.
        let lhv = f(expected, "fuel_lhv_kj_per_kg");
        assert!(
            (fuel.lhv_kj_per_kg() - lhv).abs() <= 1e-7 * lhv,
            "case {i}: LHV"
        );
        let result =
            solve(&cfg, &GasModel::Products, &fuel).unwrap_or_else(|e| panic!("case {i}: {e}"));
        let far = f(expected, "fuel_air_ratio");
        let got = result
            .fuel_air_ratio
            .expect("products report a fuel–air ratio");
        assert!(
            ((got - far) / far).abs() <= 1e-4,
            "case {i}: fuel–air ratio {got} vs Cantera {far}"
        );
        compare(&result, expected, i);
    }
}
