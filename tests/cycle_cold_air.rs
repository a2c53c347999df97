//! Cold-air standard against the closed-form Brayton laws (any engineering
//! thermodynamics text; REFERENCES "Cycle laws"): exact to floating point,
//! checked to 1e-12 relative.
//!
//! Ideal: η = 1 − r^(−(k−1)/k). With component efficiencies:
//! T2 = T1 + (T2s − T1)/η_c, T4 = T3 − η_t (T3 − T4s), η = w_net / q_in.

use brayfin::cycle::{
    solve, EfficiencyBasis, EngineConfig, GasModel, Intercooler, IntercoolerExit, Regenerator,
    Reheat, Sizing,
};
use brayfin::fuel::Fuel;

const TOL: f64 = 1e-12;

fn close(a: f64, b: f64, what: &str) {
    assert!(
        (a - b).abs() <= TOL * b.abs().max(1e-300),
        "{what}: got {a}, closed form {b}, relative {:e}",
        ((a - b) / b).abs()
    );
}

fn state(r: &brayfin::cycle::CycleResult, id: &str) -> f64 {
    r.states
        .iter()
        .find(|s| s.id == id)
        .map(|s| s.temperature_k)
        .unwrap_or_else(|| panic!("no state {id}"))
}

#[test]
fn ideal_efficiency_is_one_minus_r_to_the_minus_k_minus_one_over_k() {
    for (k, cp) in [(1.4, 1.005), (1.3, 1.15), (1.67, 0.52)] {
        for r in [2.0_f64, 4.0, 8.0, 15.0, 30.0, 40.0] {
            let cfg = EngineConfig::ideal(r, 1600.0);
            let res = solve(
                &cfg,
                &GasModel::ColdAir {
                    cp_kj_per_kg_k: cp,
                    k,
                },
                &Fuel::methane(),
            )
            .unwrap();
            let exact = 1.0 - r.powf(-(k - 1.0) / k);
            close(res.thermal_efficiency, exact, "efficiency");
            close(state(&res, "2"), 288.15 * r.powf((k - 1.0) / k), "T2");
            close(state(&res, "4"), 1600.0 / r.powf((k - 1.0) / k), "T4");
        }
    }
}

#[test]
fn component_efficiencies_follow_the_closed_forms() {
    let (k, cp) = (1.4_f64, 1.005_f64);
    for (r, t3, eta_c, eta_t) in [
        (8.0_f64, 1300.0_f64, 0.80_f64, 0.85_f64),
        (12.0, 1400.0, 0.86, 0.89),
        (20.0, 1600.0, 0.90, 0.92),
        (30.0, 1750.0, 0.75, 0.95),
    ] {
        let cfg = EngineConfig {
            compressor_efficiency: eta_c,
            turbine_efficiency: eta_t,
            ..EngineConfig::ideal(r, t3)
        };
        let res = solve(&cfg, &GasModel::cold_air_standard(), &Fuel::methane()).unwrap();
        let t1 = 288.15;
        let e = (k - 1.0) / k;
        let t2 = t1 + (t1 * r.powf(e) - t1) / eta_c;
        let t4 = t3 - eta_t * (t3 - t3 / r.powf(e));
        let w_net = cp * ((t3 - t4) - (t2 - t1));
        close(state(&res, "2"), t2, "T2");
        close(state(&res, "4"), t4, "T4");
        close(res.net_work_kj_per_kg, w_net, "net work");
        close(
            res.thermal_efficiency,
            w_net / (cp * (t3 - t2)),
            "efficiency",
        );
        close(
            res.back_work_ratio,
            (t2 - t1) / (t3 - t4),
            "back-work ratio",
        );
        close(
            res.heat_rate_kj_per_kwh,
            3600.0 * cp * (t3 - t2) / w_net,
            "heat rate",
        );
    }
}

/// Ideal regeneration: η = 1 − (T1/T3) r^((k−1)/k) (cold-air standard with
/// an ideal regenerator, any thermodynamics text).
#[test]
fn ideal_regenerator_efficiency() {
    let (k, r, t3) = (1.4_f64, 6.0_f64, 1400.0_f64);
    let cfg = EngineConfig {
        regenerator: Some(Regenerator {
            effectiveness: 1.0,
            air_side_pressure_loss: 0.0,
            gas_side_pressure_loss: 0.0,
        }),
        ..EngineConfig::ideal(r, t3)
    };
    let res = solve(&cfg, &GasModel::cold_air_standard(), &Fuel::methane()).unwrap();
    close(
        res.thermal_efficiency,
        1.0 - 288.15 / t3 * r.powf((k - 1.0) / k),
        "efficiency",
    );
}

/// Regenerator of effectiveness ε: T5 = T2 + ε (T4 − T2), T6 = T4 − (T5 − T2).
#[test]
fn partial_regenerator_follows_effectiveness() {
    let (k, cp, r, t3, eps) = (1.4_f64, 1.005_f64, 5.0_f64, 1250.0_f64, 0.7_f64);
    let cfg = EngineConfig {
        compressor_efficiency: 0.85,
        turbine_efficiency: 0.88,
        regenerator: Some(Regenerator {
            effectiveness: eps,
            air_side_pressure_loss: 0.0,
            gas_side_pressure_loss: 0.0,
        }),
        ..EngineConfig::ideal(r, t3)
    };
    let res = solve(&cfg, &GasModel::cold_air_standard(), &Fuel::methane()).unwrap();
    let e = (k - 1.0) / k;
    let t1 = 288.15;
    let t2 = t1 + (t1 * r.powf(e) - t1) / 0.85;
    let t4 = t3 - 0.88 * (t3 - t3 / r.powf(e));
    let t5 = t2 + eps * (t4 - t2);
    close(state(&res, "5"), t5, "T5");
    close(state(&res, "6"), t4 - (t5 - t2), "T6");
    close(res.exhaust_temperature_k, t4 - (t5 - t2), "exhaust");
    close(res.heat_input_kj_per_kg, cp * (t3 - t5), "heat input");
}

/// Polytropic efficiency: T2/T1 = r^((k−1)/(k η_pc)), T4/T3 = r^(−η_pt (k−1)/k)
/// (standard gas-turbine theory texts, e.g. Saravanamuttoo et al., "Gas
/// Turbine Theory", from memory).
#[test]
fn polytropic_efficiencies_follow_the_closed_forms() {
    let (k, r, t3) = (1.4_f64, 16.0_f64, 1500.0_f64);
    let cfg = EngineConfig {
        compressor_efficiency: 0.90,
        turbine_efficiency: 0.88,
        efficiency_basis: EfficiencyBasis::Polytropic,
        ..EngineConfig::ideal(r, t3)
    };
    let res = solve(&cfg, &GasModel::cold_air_standard(), &Fuel::methane()).unwrap();
    let e = (k - 1.0) / k;
    close(state(&res, "2"), 288.15 * r.powf(e / 0.90), "T2");
    close(state(&res, "4"), t3 * r.powf(-0.88 * e), "T4");
    close(state(&res, "2s"), 288.15 * r.powf(e), "T2s");
}

/// Intercooling to the inlet temperature with an equal split, and reheat to
/// the turbine inlet temperature with an equal split: each half of the
/// compression and expansion is the same (cold-air closed forms).
#[test]
fn intercooling_and_reheat_closed_forms() {
    let (k, cp, r, t3) = (1.4_f64, 1.005_f64, 9.0_f64, 1400.0_f64);
    let cfg = EngineConfig {
        compressor_efficiency: 0.82,
        turbine_efficiency: 0.84,
        intercooler: Some(Intercooler {
            pressure_split: None,
            exit: IntercoolerExit::Effectiveness(1.0),
        }),
        reheat: Some(Reheat {
            pressure_split: None,
            temperature_k: t3,
        }),
        ..EngineConfig::ideal(r, t3)
    };
    let res = solve(&cfg, &GasModel::cold_air_standard(), &Fuel::methane()).unwrap();
    let e = (k - 1.0) / k;
    let t1 = 288.15;
    let t2 = t1 + (t1 * r.sqrt().powf(e) - t1) / 0.82;
    let t4 = t3 - 0.84 * (t3 - t3 / r.sqrt().powf(e));
    close(state(&res, "2a"), t2, "T2a");
    close(state(&res, "2b"), t1, "T2b");
    close(state(&res, "2"), t2, "T2");
    close(state(&res, "3a"), t4, "T3a");
    close(state(&res, "4"), t4, "T4");
    let w_net = 2.0 * cp * ((t3 - t4) - (t2 - t1));
    let q_in = cp * (t3 - t2) + cp * (t3 - t4);
    close(res.net_work_kj_per_kg, w_net, "net work");
    close(res.thermal_efficiency, w_net / q_in, "efficiency");
}

/// Losses after the shaft: η = w_net η_m η_g (1 − aux) / (q / η_b).
#[test]
fn shaft_and_combustion_losses_scale_the_efficiency() {
    let (k, r, t3) = (1.4_f64, 10.0_f64, 1500.0_f64);
    let cfg = EngineConfig {
        combustion_efficiency: 0.99,
        mechanical_efficiency: 0.985,
        generator_efficiency: 0.98,
        auxiliary_load_fraction: 0.01,
        ..EngineConfig::ideal(r, t3)
    };
    let res = solve(&cfg, &GasModel::cold_air_standard(), &Fuel::methane()).unwrap();
    let ideal = 1.0 - r.powf(-(k - 1.0) / k);
    close(
        res.thermal_efficiency,
        ideal * 0.985 * 0.98 * 0.99 * 0.99,
        "efficiency",
    );
}

/// Sizing: air flow = rated net output / net electrical work per kg, and
/// the fuel flow supplies q_in per kg of air at the fuel's LHV (cold-air
/// closed forms); sizing by that air flow gives back the rated output.
#[test]
fn sizing_by_output_and_by_air_flow_agree() {
    let (k, cp, r, t3) = (1.4_f64, 1.005_f64, 12.0_f64, 1450.0_f64);
    let fuel = Fuel::methane();
    let by_output = EngineConfig {
        compressor_efficiency: 0.87,
        turbine_efficiency: 0.9,
        sizing: Some(Sizing::NetOutputKw(50_000.0)),
        ..EngineConfig::ideal(r, t3)
    };
    let res = solve(&by_output, &GasModel::cold_air_standard(), &fuel).unwrap();
    let e = (k - 1.0) / k;
    let t1 = 288.15;
    let t2 = t1 + (t1 * r.powf(e) - t1) / 0.87;
    let t4 = t3 - 0.9 * (t3 - t3 / r.powf(e));
    let w_net = cp * ((t3 - t4) - (t2 - t1));
    let flows = res.flows.expect("sized");
    close(flows.air_flow_kg_per_s, 50_000.0 / w_net, "air flow");
    close(
        flows.fuel_flow_kg_per_s,
        flows.air_flow_kg_per_s * cp * (t3 - t2) / fuel.lhv_kj_per_kg(),
        "fuel flow",
    );
    close(
        flows.exhaust_flow_kg_per_s,
        flows.air_flow_kg_per_s + flows.fuel_flow_kg_per_s,
        "exhaust flow",
    );
    let by_air = EngineConfig {
        sizing: Some(Sizing::AirFlowKgPerS(flows.air_flow_kg_per_s)),
        ..by_output
    };
    let again = solve(&by_air, &GasModel::cold_air_standard(), &fuel).unwrap();
    close(
        again.flows.expect("sized").net_output_kw,
        50_000.0,
        "net output",
    );
}
