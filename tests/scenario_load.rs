//! Loading scenarios: values in SI, money exact, defaults and inputs
//! recorded, sources attached, errors placed by key path.

use brayfin::scenario::{
    self, iso_2533_pressure_kpa, FuelComposition, LoadedScenario, PriceBasis, ResidualValue,
};
use rust_decimal::Decimal;
use std::str::FromStr;

const MINIMAL: &str = r#"
[scenario]
title = "Minimal"
date = 2025-01-01
currency = "USD"
baseline = "a"

[fuel]
composition = "methane"
price = "4.20 USD/MMBtu"
price_basis = "hhv"

[economics]
commercial_operation = 2026-01-01
service_life_years = 20
discount_rate = "7 %"

[operation]
hours_per_year = 4000

[[candidate]]
id = "a"
capital_cost = 40_000_000.10
net_output = "40 MW"
pressure_ratio = 16
turbine_inlet_temperature = "1176.85 degC"
compressor_efficiency = 0.86
turbine_efficiency = "89 %"
"#;

fn load(text: &str) -> LoadedScenario {
    match scenario::parse(text, "inline.toml") {
        Ok(loaded) => loaded,
        Err(error) => panic!("does not load: {error}"),
    }
}

fn dec(text: &str) -> Decimal {
    Decimal::from_str(text).unwrap_or_default()
}

#[test]
fn minimal_scenario_fills_every_default_and_says_so() {
    let loaded = load(MINIMAL);
    let s = &loaded.scenario;
    // ISO 2314 reference ambient: 15 degC, 101.325 kPa (from memory).
    assert_eq!(s.site.ambient_temperature_k, 288.15);
    assert_eq!(s.site.ambient_pressure_kpa, 101.325);
    assert_eq!(s.meta.prepared_for, "not stated");
    let c = &s.candidates[0];
    assert_eq!(c.label, "a");
    assert!((c.turbine_inlet_temperature_k - 1450.0).abs() < 1e-9);
    assert_eq!(c.net_output_kw, 40_000.0);
    assert_eq!(c.generator_efficiency, 1.0);
    assert_eq!(
        c.costs.residual_value,
        ResidualValue::FractionOfCapital(0.0)
    );
    let defaulted: Vec<&str> = loaded
        .applied_defaults
        .iter()
        .map(|d| d.key.as_str())
        .collect();
    for key in [
        "scenario.prepared_for",
        "site.ambient_temperature",
        "site.ambient_pressure",
        "fuel.name",
        "fuel.escalation",
        "economics.rate_basis",
        "economics.timing",
        "economics.carbon_price",
        "candidate[a].label",
        "candidate[a].gas_model",
        "candidate[a].generator_efficiency",
        "candidate[a].costs.fixed_om",
        "candidate[a].costs.residual_value",
    ] {
        assert!(
            defaulted.contains(&key),
            "{key} not listed among {defaulted:?}"
        );
    }
    // Nothing given in the file is listed as a default.
    assert!(!defaulted.contains(&"candidate[a].turbine_efficiency"));
}

#[test]
fn money_never_passes_through_f64() {
    let s = load(MINIMAL).scenario;
    // A TOML float literal is read from its source text: 40000000.10 exactly.
    assert_eq!(s.candidates[0].capital_cost, dec("40000000.10"));
    // 4.20 USD/MMBtu = 4.20 / 1.055056 USD/GJ (1 MMBtu = 1.055056 GJ,
    // International Table Btu; NIST SP 811 Appendix B.8), in Decimal.
    assert_eq!(s.fuel.price_per_gj, dec("4.20") / dec("1.055056"));
    assert_eq!(s.fuel.price_basis, PriceBasis::Hhv);
}

#[test]
fn inputs_are_recorded_as_written_with_sources() {
    let text = MINIMAL.replace(
        "price_basis = \"hhv\"",
        "price_basis = \"hhv\"\nsources = { price = \"Tariff G-4, 2025\" }",
    );
    let loaded = load(&text);
    let price = loaded.inputs.iter().find(|i| i.key == "fuel.price");
    assert_eq!(
        price.map(|i| (i.value_text.as_str(), i.unit.as_str(), i.source.as_deref())),
        Some(("4.20", "USD/MMBtu", Some("Tariff G-4, 2025")))
    );
    let cost = loaded
        .inputs
        .iter()
        .find(|i| i.key == "candidate[a].capital_cost");
    assert_eq!(cost.map(|i| i.value_text.as_str()), Some("40000000.10"));
}

#[test]
fn file_hash_follows_the_text() {
    // The digest itself is checked against FIPS 180-2 in the loader's unit
    // tests; here: 64 hex digits, and one more byte changes it.
    let a = load(MINIMAL).sha256_hex;
    let b = load(&format!("{MINIMAL}\n")).sha256_hex;
    assert_eq!(a.len(), 64);
    assert!(a.chars().all(|c| c.is_ascii_hexdigit()));
    assert_ne!(a, b);
}

#[test]
fn elevation_gives_pressure_by_iso_2533() {
    // ISO 2533 standard atmosphere: 1000 m → 89.875 kPa (tabulated 89 874.6
    // Pa; from memory). Tolerance 0.01 kPa: the table rounds to 0.1 Pa and
    // the formula's exponent to six digits.
    assert!((iso_2533_pressure_kpa(1000.0) - 89.8746).abs() < 0.01);
    assert!((iso_2533_pressure_kpa(0.0) - 101.325).abs() < 1e-12);
    let text = MINIMAL.replace("[fuel]", "[site]\nelevation = \"3281 ft\"\n\n[fuel]");
    let s = load(&text).scenario;
    assert_eq!(s.site.elevation_m, Some(3281.0 * 0.3048));
    assert!((s.site.ambient_pressure_kpa - iso_2533_pressure_kpa(1000.0)).abs() < 0.002);
}

#[test]
fn composition_and_heating_values() {
    let mixed = MINIMAL.replace(
        "composition = \"methane\"",
        "composition = { CH4 = \"93 %\", C2H6 = 0.05, N2 = 0.02 }",
    );
    let s = load(&mixed).scenario;
    assert_eq!(
        s.fuel.composition.mole_fractions(),
        Some(vec![
            ("CH4".to_string(), 0.93),
            ("C2H6".to_string(), 0.05),
            ("N2".to_string(), 0.02)
        ])
    );
    assert_eq!(
        load(MINIMAL).scenario.fuel.composition.mole_fractions(),
        Some(vec![("CH4".to_string(), 1.0)])
    );
    let by_heating = MINIMAL.replace(
        "composition = \"methane\"",
        "lhv = \"21496 Btu/lb\"\nhhv = \"55.5 MJ/kg\"\nco2_factor = \"56100 kg/TJ\"",
    );
    let s = load(&by_heating).scenario;
    match s.fuel.composition {
        FuelComposition::HeatingValues {
            lhv_kj_per_kg,
            hhv_kj_per_kg,
            co2_kg_per_gj_lhv,
        } => {
            // 21 496 Btu/lb × 2.326 = 49 999.7 kJ/kg (NIST SP 811 B.8).
            assert!((lhv_kj_per_kg - 49_999.696).abs() < 1e-6);
            assert_eq!(hhv_kj_per_kg, 55_500.0);
            // IPCC 2006 Vol. 2 Table 2.2, natural gas: 56 100 kg/TJ.
            assert!((co2_kg_per_gj_lhv - 56.1).abs() < 1e-12);
        }
        other => panic!("expected heating values, got {other:?}"),
    }
}

#[test]
fn dispatch_fills_hours_and_a_bids_part_load_is_sorted_with_full_load_added() {
    let text = MINIMAL
        .replace(
            "hours_per_year = 4000",
            "dispatch = [{ load = \"100 %\", hours = 3000 }, { load = \"60 %\", hours = 1000 }]",
        )
        .replace(
            "turbine_efficiency = \"89 %\"",
            "turbine_efficiency = \"89 %\"\n\
             part_load = [{ load = \"75 %\", heat_rate_ratio = 1.08 }, { load = \"50 %\", heat_rate_ratio = 1.25 }]",
        );
    let loaded = load(&text);
    let op = &loaded.scenario.operation;
    assert_eq!(op.hours_per_year, 4000.0);
    let loads: Vec<f64> = loaded.scenario.candidates[0]
        .part_load
        .iter()
        .map(|p| p.load_fraction)
        .collect();
    assert_eq!(loads, vec![0.5, 0.75, 1.0]);
    assert!(loaded
        .applied_defaults
        .iter()
        .any(|d| d.key == "operation.hours_per_year"));
    assert!(loaded
        .applied_defaults
        .iter()
        .any(|d| d.key == "candidate[a].part_load"));
}

/// An ambient-correction curve is sorted by temperature and passes through
/// the rating temperature (15 °C by default, ISO 3977-2) at ratios 1.
#[test]
fn a_bids_ambient_correction_is_sorted_with_the_rating_point_added() {
    let text = MINIMAL.replace(
        "turbine_efficiency = \"89 %\"",
        "turbine_efficiency = \"89 %\"\n\
         ambient_correction = [{ temperature = \"35 degC\", output_ratio = 0.85, heat_rate_ratio = 1.05 }, \
         { temperature = \"-5 degC\", output_ratio = 1.12, heat_rate_ratio = 0.97 }]",
    );
    let loaded = load(&text);
    let curve = &loaded.scenario.candidates[0].ambient_correction;
    let t: Vec<f64> = curve.iter().map(|p| p.temperature_k).collect();
    assert_eq!(t.len(), 3);
    assert!(
        (t[0] - 268.15).abs() < 1e-9
            && (t[1] - 288.15).abs() < 1e-9
            && (t[2] - 308.15).abs() < 1e-9,
        "{t:?}"
    );
    assert_eq!(
        (curve[1].output_ratio, curve[1].heat_rate_ratio),
        (1.0, 1.0)
    );
}

#[test]
fn price_path_sets_the_first_year_price() {
    let text = MINIMAL.replace(
        "price = \"4.20 USD/MMBtu\"",
        "price_path = { 2025 = \"3.9 USD/GJ\", 2026 = \"4.0 USD/GJ\", 2027 = \"4.1 USD/GJ\" }",
    );
    let s = load(&text).scenario;
    assert_eq!(s.fuel.price_per_gj, dec("4.0"));
    assert_eq!(s.fuel.price_path.len(), 3);
    assert_eq!(s.fuel.price_path[2], (2027, dec("4.1")));
}

#[test]
fn error_at_points_at_the_key_in_the_file() {
    let loaded = load(MINIMAL);
    let line_of = |needle: &str| {
        MINIMAL
            .lines()
            .position(|l| l.starts_with(needle))
            .map_or(0, |i| i + 1)
    };
    let tit_line = line_of("turbine_inlet_temperature");
    let message = |key: &str| loaded.error_at(key, "refused").to_string();
    let expected =
        format!("inline.toml:{tit_line}:29: candidate[a].turbine_inlet_temperature: refused");
    assert_eq!(message("candidate[a].turbine_inlet_temperature"), expected);
    // Code-side names: a 0-based index and the unit suffix are mapped.
    assert_eq!(
        message("candidate[0].turbine_inlet_temperature_k"),
        expected
    );
    // A defaulted key points at its table.
    let id_line = line_of("[[candidate]]");
    assert!(message("candidate[a].regenerator_effectiveness")
        .starts_with(&format!("inline.toml:{id_line}:")));
    assert!(message("candidate[a].regenerator_effectiveness")
        .contains("candidate[a].regenerator.effectiveness: refused"));
}

#[test]
fn demo_scenarios_and_templates_load_with_their_uncertainty() {
    for path in [
        "scenarios/corvel-bay-peaker.toml",
        "scenarios/kestrel-point-retrofit.toml",
        "templates/bid-evaluation.toml",
        "templates/retrofit.toml",
    ] {
        let loaded = scenario::load(std::path::Path::new(path));
        assert!(
            loaded.is_ok(),
            "{path}: {:?}",
            loaded.err().map(|e| e.to_string())
        );
    }
    let corvel = scenario::load(std::path::Path::new("scenarios/corvel-bay-peaker.toml"));
    let s = corvel.map(|l| l.scenario);
    assert!(matches!(&s, Ok(s) if s.candidates.len() >= 3 && s.uncertainty.len() >= 4));
}
