//! Species and dry-air properties against Cantera.
//!
//! Source: `tests/reference/cantera_species.json`, written by
//! `tests/reference/cantera_species.py` with Cantera (GRI-Mech 3.0 data of
//! `gri30.yaml`; n-butane from NASA TM-4513 via `nasa_gas.yaml`) at 13
//! temperatures from 250 K to 3000 K, both sides of the 1000 K range break.
//!
//! Tolerance 1e-7 relative (the figure). Enthalpies cross zero near
//! 298 K, so the comparison is relative to max(|value|, 1) in the
//! dimensionless forms (h/RT, s°/R, cp/R are of order 1–100).

use brayfin::thermo::mixture::Mixture;
use brayfin::thermo::species::by_name;
use brayfin::thermo::GasProperties;
use serde_json::Value;

const TOL: f64 = 1e-7;

fn fixture() -> Value {
    let text = include_str!("reference/cantera_species.json");
    serde_json::from_str(text).expect("fixture is valid JSON")
}

fn num(v: &Value, key: &str) -> f64 {
    v[key]
        .as_f64()
        .unwrap_or_else(|| panic!("fixture lacks {key}"))
}

fn check(got: f64, expected: f64, what: &str) {
    let scale = expected.abs().max(1.0);
    assert!(
        (got - expected).abs() <= TOL * scale,
        "{what}: brayfin {got}, Cantera {expected}, difference {:e}",
        got - expected
    );
}

#[test]
fn species_polynomials_match_cantera_at_thirteen_temperatures() {
    let data = fixture();
    let rows = data["species"].as_array().expect("species rows");
    assert!(
        rows.len() >= 11 * 12,
        "expected ≥ 12 temperatures per species"
    );
    for row in rows {
        let name = row["species"].as_str().expect("species name");
        let t = num(row, "temperature_k");
        let species = by_name(name).unwrap_or_else(|| panic!("brayfin lacks {name}"));
        let p = &species.poly;
        check(
            p.cp(t),
            num(row, "cp_over_r"),
            &format!("{name} cp/R at {t} K"),
        );
        check(
            p.enthalpy(t) / t,
            num(row, "h_over_rt"),
            &format!("{name} h/RT at {t} K"),
        );
        check(
            p.standard_entropy(t),
            num(row, "s0_over_r"),
            &format!("{name} s°/R at {t} K"),
        );
    }
}

/// Dry air as a mixture: mass-specific cp, h and s (with the entropy of
/// mixing) at 101.325 kPa, and its molar mass. Tolerance 1e-7 relative to
/// max(|value|, 1) in kJ/kg and kJ/(kg·K).
#[test]
fn dry_air_mixture_matches_cantera() {
    let data = fixture();
    let air = Mixture::dry_air();
    check(
        air.molar_mass_kg_per_kmol(),
        num(&data["air"], "molar_mass_kg_per_kmol"),
        "air molar mass",
    );
    for row in data["air"]["states"].as_array().expect("air states") {
        let t = num(row, "temperature_k");
        check(
            air.cp_kj_per_kg_k(t),
            num(row, "cp_kj_per_kg_k"),
            &format!("air cp at {t} K"),
        );
        check(
            air.enthalpy_kj_per_kg(t),
            num(row, "h_kj_per_kg"),
            &format!("air h at {t} K"),
        );
        check(
            air.entropy_kj_per_kg_k(t, 101.325),
            num(row, "s_kj_per_kg_k"),
            &format!("air s at {t} K"),
        );
    }
}
