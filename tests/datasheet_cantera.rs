//! Datasheets made by an independent implementation on Cantera's
//! properties (GRI-Mech 3.0) from known engines (six simple cycles, one
//! regenerated),
//! `tests/reference/cantera_datasheets.py`; the committed fixture
//! `cantera_datasheets.json` is read here, no Python needed. The
//! calibration must reproduce each datasheet's figures and recover the
//! engine that made it; the energy balance must agree with the one worked
//! on Cantera's enthalpies.

use brayfin::cycle::Regenerator;
use brayfin::datasheet::calibrate::{
    EXHAUST_FLOW_TOLERANCE, EXHAUST_TEMPERATURE_TOLERANCE_K, HEAT_RATE_TOLERANCE,
};
use brayfin::datasheet::{
    assess, calibrate, energy_balance, CalibrationOptions, ComponentData, Datasheet, HeatRateBasis,
    Verdict,
};
use brayfin::fuel::Fuel;
use brayfin::offdesign::Ambient;
use serde_json::Value;

/// Engine values recovered to: efficiencies 1e-5, firing temperature
/// 0.01 K, pressure ratio 1e-5 relative, cooling 1e-5 of air. Measured:
/// every value within 1e-8 (the two implementations evaluate the same
/// GRI-Mech 3.0 data; the fit converges to 1e-9 of each figure); the
/// allowance is for rounding elsewhere.
const ETA_TOL: f64 = 1e-5;
const FIRING_TOL_K: f64 = 0.01;
const RATIO_TOL: f64 = 1e-5;
const COOLING_TOL: f64 = 1e-5;

fn num(v: &Value, key: &str) -> f64 {
    v[key]
        .as_f64()
        .unwrap_or_else(|| panic!("fixture lacks {key}"))
}

fn fixture() -> Value {
    let text = std::fs::read_to_string(concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/reference/cantera_datasheets.json"
    ))
    .unwrap();
    serde_json::from_str(&text).unwrap()
}

fn case_sheet(case: &Value) -> Datasheet {
    let e = &case["engine"];
    let d = &case["datasheet"];
    let fuel: Vec<(&str, f64)> = e["fuel"]
        .as_object()
        .unwrap()
        .iter()
        .map(|(k, v)| (k.as_str(), v.as_f64().unwrap()))
        .collect();
    let r = &e["rating"];
    Datasheet {
        net_output_kw: num(d, "net_output_kw"),
        heat_rate_kj_per_kwh: num(d, "heat_rate_kj_per_kwh"),
        heat_rate_basis: HeatRateBasis::Lhv,
        exhaust_flow_kg_per_s: num(d, "exhaust_flow_kg_per_s"),
        exhaust_temperature_k: num(d, "exhaust_temperature_k"),
        pressure_ratio: case["states_pressure_ratio"]
            .as_bool()
            .unwrap()
            .then(|| num(e, "pressure_ratio")),
        firing_temperature_k: case["states_firing_temperature"]
            .as_bool()
            .unwrap()
            .then(|| num(e, "firing_temperature_k")),
        regenerator: e.get("regenerator").map(|g| Regenerator {
            effectiveness: num(g, "effectiveness"),
            air_side_pressure_loss: num(g, "air_side_pressure_loss"),
            gas_side_pressure_loss: num(g, "gas_side_pressure_loss"),
        }),
        rating: Ambient {
            temperature_k: num(r, "temperature_k"),
            pressure_kpa: num(r, "pressure_kpa"),
            relative_humidity: num(r, "relative_humidity"),
        },
        fuel: Fuel::from_composition(&fuel).unwrap(),
    }
}

#[test]
fn cantera_datasheets_are_reproduced_and_their_engines_recovered() {
    let f = fixture();
    let cases = f["cases"].as_array().unwrap();
    assert!(cases.len() >= 7);
    assert!(cases
        .iter()
        .any(|c| c["engine"].get("regenerator").is_some()));
    for case in cases {
        let name = case["name"].as_str().unwrap();
        let e = &case["engine"];
        let d = &case["datasheet"];
        let sheet = case_sheet(case);
        let lhv = sheet.fuel.lhv_kj_per_kg();
        assert!(
            (lhv / num(d, "lhv_kj_per_kg") - 1.0).abs() < 1e-4,
            "{name}: LHV {lhv}"
        );
        let c = calibrate(&sheet, &CalibrationOptions::default())
            .unwrap_or_else(|err| panic!("{name}: {err}"));
        let r = c.residuals;
        assert!(
            r.heat_rate_relative.abs() <= HEAT_RATE_TOLERANCE,
            "{name}: {r:?}"
        );
        assert!(
            r.exhaust_temperature_k.abs() <= EXHAUST_TEMPERATURE_TOLERANCE_K,
            "{name}: {r:?}"
        );
        assert!(
            r.exhaust_flow_relative.abs() <= EXHAUST_FLOW_TOLERANCE,
            "{name}: {r:?}"
        );
        assert!(r.net_output_relative.abs() <= 1e-12, "{name}: {r:?}");
        let report = format!(
            "{name}: η_c {:.8} T3 {:.5} r {:.7} c {:.8} ε {:.8} air {:.5}",
            c.compressor_polytropic_efficiency(),
            c.firing_temperature_k(),
            c.pressure_ratio(),
            c.turbine_cooling,
            c.electro_mechanical_efficiency(),
            c.air_flow_kg_per_s
        );
        assert!(
            (c.compressor_polytropic_efficiency() - num(e, "compressor_polytropic_efficiency"))
                .abs()
                <= ETA_TOL,
            "{report}"
        );
        assert!(
            (c.electro_mechanical_efficiency() - num(e, "electro_mechanical_efficiency")).abs()
                <= ETA_TOL,
            "{report}"
        );
        assert!(
            (c.firing_temperature_k() - num(e, "firing_temperature_k")).abs() <= FIRING_TOL_K,
            "{report}"
        );
        assert!(
            (c.pressure_ratio() / num(e, "pressure_ratio") - 1.0).abs() <= RATIO_TOL,
            "{report}"
        );
        assert!(
            (c.turbine_cooling - num(e, "turbine_cooling")).abs() <= COOLING_TOL,
            "{report}"
        );
        assert!(
            (c.air_flow_kg_per_s / num(d, "air_flow_kg_per_s") - 1.0).abs()
                <= EXHAUST_FLOW_TOLERANCE,
            "{report}"
        );
    }
}

/// The energy-balance remainder on brayfin's mixtures agrees with the one
/// worked on Cantera's enthalpies to 1e-6 of the fuel energy (same
/// GRI-Mech data; measured within 1e-8).
#[test]
fn energy_balance_agrees_with_cantera() {
    for case in fixture()["cases"].as_array().unwrap() {
        let name = case["name"].as_str().unwrap();
        let b = energy_balance(&case_sheet(case)).unwrap();
        let expected = num(&case["datasheet"], "remainder_fraction");
        assert!(
            (b.remainder_fraction - expected).abs() < 1e-6,
            "{name}: {} vs {expected}",
            b.remainder_fraction
        );
    }
}

/// Engines chosen within current practice are judged plausible.
#[test]
fn cantera_engines_within_practice_are_plausible() {
    for case in fixture()["cases"].as_array().unwrap() {
        let name = case["name"].as_str().unwrap();
        let a = assess(
            &case_sheet(case),
            &ComponentData::default(),
            &CalibrationOptions::default(),
        )
        .unwrap();
        assert_eq!(
            a.implied.verdict,
            Verdict::Plausible,
            "{name}: {:?}",
            a.implied.reasons
        );
    }
}
