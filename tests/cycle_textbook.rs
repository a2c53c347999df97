//! Textbook worked examples of air-standard gas-turbine cycles with
//! variable specific heats (ideal-gas air tables), against brayfin's `air`
//! model. All values below are from memory of the texts named.
//!
//! Tolerance: air tables and NASA-polynomial air differ by about 0.1–0.3 %
//! in enthalpy differences, and the texts interpolate their tables in the
//! relative pressure and round to three or four significant figures. So:
//! temperatures ±1.5 K, specific works ±0.5 %, thermal efficiency and
//! back-work ratio ±0.003 absolute.

use brayfin::cycle::{solve, CycleResult, EngineConfig, GasModel, Regenerator};
use brayfin::fuel::Fuel;

fn air(cfg: &EngineConfig) -> CycleResult {
    solve(cfg, &GasModel::Air, &Fuel::methane()).expect("solves")
}

fn temperature(r: &CycleResult, id: &str) -> f64 {
    r.states
        .iter()
        .find(|s| s.id == id)
        .map(|s| s.temperature_k)
        .expect("state present")
}

fn near(got: f64, book: f64, tolerance: f64, what: &str) {
    assert!(
        (got - book).abs() <= tolerance,
        "{what}: brayfin {got}, text {book}, tolerance {tolerance}"
    );
}

fn regenerator(effectiveness: f64) -> Option<Regenerator> {
    Some(Regenerator {
        effectiveness,
        air_side_pressure_loss: 0.0,
        gas_side_pressure_loss: 0.0,
    })
}

/// Çengel & Boles, "Thermodynamics: An Engineering Approach", simple ideal
/// Brayton cycle example (ch. 9, from memory): r = 8, T1 = 300 K,
/// T3 = 1300 K. T2 = 540 K, T4 = 770 K, w_c = 244.16 kJ/kg,
/// w_t = 606.60 kJ/kg, r_bw = 0.403, η = 0.426. The follow-on examples:
/// η_c = 0.80, η_t = 0.85 gives r_bw = 0.592, η = 0.266, T4 = 853 K; adding
/// a regenerator of effectiveness 0.80 gives η = 0.369.
#[test]
fn cengel_boles_brayton_examples() {
    let ideal = EngineConfig {
        ambient_temperature_k: 300.0,
        ambient_pressure_kpa: 100.0,
        ..EngineConfig::ideal(8.0, 1300.0)
    };
    let r = air(&ideal);
    near(temperature(&r, "2"), 540.0, 1.5, "T2");
    near(temperature(&r, "4"), 770.0, 1.5, "T4");
    near(r.compressor_work_kj_per_kg, 244.16, 0.005 * 244.16, "w_c");
    near(r.turbine_work_kj_per_kg, 606.60, 0.005 * 606.60, "w_t");
    near(r.back_work_ratio, 0.403, 0.003, "back-work ratio");
    near(r.thermal_efficiency, 0.426, 0.003, "efficiency");

    let actual = EngineConfig {
        compressor_efficiency: 0.80,
        turbine_efficiency: 0.85,
        ..ideal
    };
    let r = air(&actual);
    near(r.back_work_ratio, 0.592, 0.003, "actual back-work ratio");
    near(r.thermal_efficiency, 0.266, 0.003, "actual efficiency");
    near(temperature(&r, "4"), 853.0, 1.5, "actual T4");

    let regenerated = EngineConfig {
        regenerator: regenerator(0.80),
        ..actual
    };
    near(
        air(&regenerated).thermal_efficiency,
        0.369,
        0.003,
        "regenerated efficiency",
    );
}

/// Moran & Shapiro, "Fundamentals of Engineering Thermodynamics", ideal
/// Brayton cycle examples (ch. 9, from memory): p1 = 100 kPa, T1 = 300 K,
/// r = 10, T3 = 1400 K. T2 = 574.1 K, T4 = 787.7 K, η = 45.7 %,
/// r_bw = 39.6 %. With η_c = η_t = 0.80: η = 24.9 %, r_bw = 61.9 %. With a
/// regenerator of effectiveness 0.80 on the ideal cycle: η = 56.8 %.
#[test]
fn moran_shapiro_brayton_examples() {
    let ideal = EngineConfig {
        ambient_temperature_k: 300.0,
        ambient_pressure_kpa: 100.0,
        ..EngineConfig::ideal(10.0, 1400.0)
    };
    let r = air(&ideal);
    near(temperature(&r, "2"), 574.1, 1.5, "T2");
    near(temperature(&r, "4"), 787.7, 1.5, "T4");
    near(r.thermal_efficiency, 0.457, 0.003, "efficiency");
    near(r.back_work_ratio, 0.396, 0.003, "back-work ratio");

    let actual = EngineConfig {
        compressor_efficiency: 0.80,
        turbine_efficiency: 0.80,
        ..ideal.clone()
    };
    let r = air(&actual);
    near(r.thermal_efficiency, 0.249, 0.003, "actual efficiency");
    near(r.back_work_ratio, 0.619, 0.003, "actual back-work ratio");

    let regenerated = EngineConfig {
        regenerator: regenerator(0.80),
        ..ideal
    };
    near(
        air(&regenerated).thermal_efficiency,
        0.568,
        0.003,
        "regenerated efficiency",
    );
}
