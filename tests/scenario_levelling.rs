//! `[economics] energy_value` and `capacity_value`: the prices at which a
//! candidate's output shortfall is bought elsewhere. Read exactly (money
//! never through f64), defaulted to zero and said so, refused when negative
//! or of the wrong kind, reachable by key path, and warned about when the
//! candidates differ in output but a value is zero.

use brayfin::scenario::{self, engineering_warnings, LoadedScenario};
use rust_decimal::Decimal;
use std::str::FromStr;

const TWO_SIZES: &str = r#"
[scenario]
title = "Two sizes"
date = 2025-01-01
currency = "USD"
baseline = "small"

[fuel]
composition = "methane"
price = "4.00 USD/GJ"
price_basis = "lhv"

[economics]
commercial_operation = 2026-01-01
service_life_years = 20
discount_rate = "7 %"
#VALUES#

[operation]
hours_per_year = 4000

[[candidate]]
id = "small"
capital_cost = "40000000 USD"
net_output = "40 MW"
pressure_ratio = 16
turbine_inlet_temperature = "1450 K"
compressor_efficiency = 0.86
turbine_efficiency = 0.89

[[candidate]]
id = "large"
capital_cost = "46000000 USD"
net_output = "44 MW"
pressure_ratio = 16
turbine_inlet_temperature = "1450 K"
compressor_efficiency = 0.86
turbine_efficiency = 0.89
"#;

fn with_values(values: &str) -> String {
    TWO_SIZES.replace("#VALUES#", values)
}

fn load(text: &str) -> LoadedScenario {
    match scenario::parse(text, "inline.toml") {
        Ok(loaded) => loaded,
        Err(error) => panic!("does not load: {error}"),
    }
}

fn refusal(text: &str) -> String {
    match scenario::parse(text, "inline.toml") {
        Ok(_) => panic!("loads but should be refused"),
        Err(error) => error.to_string(),
    }
}

fn dec(text: &str) -> Decimal {
    Decimal::from_str(text).unwrap_or_default()
}

#[test]
fn energy_value_is_read_exactly_in_either_energy_unit() {
    let s = load(&with_values("energy_value = \"95 USD/MWh\"")).scenario;
    assert_eq!(s.economics.energy_value_per_mwh, dec("95"));
    // 1 MWh = 1000 kWh: 0.0955 USD/kWh is exactly 95.5 USD/MWh in Decimal.
    let s = load(&with_values("energy_value = \"0.0955 USD/kWh\"")).scenario;
    assert_eq!(s.economics.energy_value_per_mwh, dec("95.5"));
    let s = load(&with_values("capacity_value = \"40 USD/kW-yr\"")).scenario;
    assert_eq!(s.economics.capacity_value_per_kw_year, dec("40"));
}

#[test]
fn energy_value_defaults_to_zero_and_says_so() {
    let loaded = load(&with_values(""));
    assert_eq!(
        loaded.scenario.economics.energy_value_per_mwh,
        Decimal::ZERO
    );
    let default = loaded
        .applied_defaults
        .iter()
        .find(|d| d.key == "economics.energy_value");
    assert!(default.is_some(), "{:?}", loaded.applied_defaults);
}

#[test]
fn negative_or_wrong_kind_energy_value_is_refused_at_its_line() {
    let text = with_values("energy_value = \"-5 USD/MWh\"");
    let line = text
        .lines()
        .position(|l| l.starts_with("energy_value"))
        .map_or(0, |i| i + 1);
    let message = refusal(&text);
    assert!(
        message.starts_with(&format!("inline.toml:{line}:")),
        "{message}"
    );
    assert!(message.contains("economics.energy_value"), "{message}");
    assert!(message.contains("negative"), "{message}");

    let message = refusal(&with_values("energy_value = \"95 USD/kW-yr\""));
    assert!(message.contains("economics.energy_value"), "{message}");
    assert!(
        message.contains("MWh"),
        "{message} should name a valid unit"
    );

    let message = refusal(&with_values("energy_value = \"95 EUR/MWh\""));
    assert!(message.contains("economics.energy_value"), "{message}");
    assert!(
        message.contains("USD"),
        "{message} should name the currency"
    );
}

#[test]
fn energy_value_is_a_numeric_key() {
    let mut s = load(&with_values("energy_value = \"95 USD/MWh\"")).scenario;
    assert!(s
        .numeric_keys()
        .iter()
        .any(|k| k == "economics.energy_value"));
    assert_eq!(s.get_numeric("economics.energy_value"), Ok(95.0));
    assert!(s.set_numeric("economics.energy_value", 110.25).is_ok());
    assert_eq!(s.economics.energy_value_per_mwh, dec("110.25"));
    assert!(s.set_numeric("economics.energy_value", -1.0).is_err());
}

#[test]
fn warnings_say_which_shortfall_is_not_valued() {
    let warnings_of = |values: &str| engineering_warnings(&load(&with_values(values)).scenario);
    let mentions = |warnings: &[String], text: &str| warnings.iter().any(|w| w.contains(text));

    let both_zero = warnings_of("");
    assert!(
        mentions(&both_zero, "shortfall in output is not valued"),
        "{both_zero:?}"
    );
    let energy_only = warnings_of("energy_value = \"95 USD/MWh\"");
    assert!(
        mentions(&energy_only, "shortfall in capacity is not"),
        "{energy_only:?}"
    );
    let capacity_only = warnings_of("capacity_value = \"40 USD/kW-yr\"");
    assert!(
        mentions(&capacity_only, "shortfall in energy is not"),
        "{capacity_only:?}"
    );
    let both = warnings_of("energy_value = \"95 USD/MWh\"\ncapacity_value = \"40 USD/kW-yr\"");
    assert!(!mentions(&both, "differ in net output"), "{both:?}");

    // Equal outputs: nothing to level, no warning.
    let equal = TWO_SIZES
        .replace("#VALUES#", "")
        .replace("\"44 MW\"", "\"40 MW\"");
    let warnings = engineering_warnings(&load(&equal).scenario);
    assert!(!mentions(&warnings, "differ in net output"), "{warnings:?}");
}
