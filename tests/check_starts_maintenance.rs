//! `check` lists each candidate's starts and maintenance as the ledger
//! prices them, and the present-value date with its basis.
//!
//! The overhaul timing is worked by hand from the rule "an overhaul falls
//! due on equivalent operating hours (fired hours + starts × hours per
//! start) or on starts, whichever comes first" (common practice in
//! gas-turbine maintenance contracts); the figures are invented.

use brayfin::analysis::compare::run_study;
use brayfin::analysis::maintenance::{
    present_value_date, starts_and_maintenance, OverhaulLimit, StartsMaintenance,
};
use brayfin::report::model::Units;
use brayfin::report::views::check::CheckView;
use brayfin::scenario::{parse, LoadedScenario};
use rust_decimal::Decimal;

/// Invented figures: 4 000 fired h and 150 starts a year, 20 equivalent h
/// per start, so 4 000 + 150 × 20 = 7 000 equivalent h a year.
/// - `small`: a 28 000 equivalent-h interval, no starts limit: every
///   28 000 / 7 000 = 4 years (16 000 fired h); 14 outage days.
/// - `better`: the same interval or 450 starts: 450 / 150 = 3 years comes
///   first, so the starts limit decides (12 000 fired h); no outage.
const SCENARIO: &str = r#"
[scenario]
title = "Starts and maintenance"
date = 2024-01-01
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
#ECONOMICS#

[operation]
hours_per_year = "4000 h"
starts_per_year = 150

[[candidate]]
id = "small"
capital_cost = "40000000 USD"
net_output = "40 MW"
gas_model = "air"
pressure_ratio = 16
turbine_inlet_temperature = "1450 K"
compressor_efficiency = 0.86
turbine_efficiency = 0.89

[candidate.costs]
overhaul_interval = "28000 h"
overhaul_cost = "3200000 USD"
hours_per_start = "20 h"
overhaul_outage_days = 14
start_fuel = "80 GJ"
start_cost = "700 USD"
service_per_fired_hour = "6 USD"
service_per_start = "350 USD"
degradation_per_year = "0.4 %"
output_degradation_per_year = "0.2 %"
recoverable_fraction = "60 %"

[[candidate]]
id = "better"
capital_cost = "42000000 USD"
net_output = "40 MW"
gas_model = "air"
pressure_ratio = 16
turbine_inlet_temperature = "1450 K"
compressor_efficiency = 0.88
turbine_efficiency = 0.90

[candidate.costs]
overhaul_interval = "28000 h"
overhaul_cost = "3500000 USD"
hours_per_start = "20 h"
overhaul_starts = 450
start_fuel = "90.5 GJ"
"#;

fn scenario(economics: &str) -> LoadedScenario {
    match parse(&SCENARIO.replace("#ECONOMICS#", economics), "starts.toml") {
        Ok(loaded) => loaded,
        Err(e) => panic!("scenario: {e}"),
    }
}

fn figures(loaded: &LoadedScenario) -> Vec<StartsMaintenance> {
    let study = run_study(loaded).expect("study");
    starts_and_maintenance(&loaded.scenario, &study)
}

fn check_text(loaded: &LoadedScenario, units: Units) -> String {
    let study = run_study(loaded).expect("study");
    let figures = starts_and_maintenance(&loaded.scenario, &study);
    CheckView::new(loaded, Vec::new(), units)
        .with_maintenance(&figures, present_value_date(&study))
        .table()
}

fn close(a: f64, b: f64, what: &str) {
    assert!(
        (a - b).abs() <= 1e-9 * b.abs().max(1.0),
        "{what}: {a} vs {b}"
    );
}

#[test]
fn overhaul_timing_is_decided_as_worked_by_hand() {
    let f = figures(&scenario(""));
    let small = &f[0];
    assert_eq!(small.candidate_id, "small");
    close(small.fired_hours_per_year, 4000.0, "fired hours");
    close(small.starts_per_year, 150.0, "starts");
    close(small.start_fuel_gj_lhv, 80.0, "start fuel");
    assert_eq!(small.start_cost, Decimal::new(700, 0));
    assert_eq!(small.service_per_fired_hour, Decimal::new(6, 0));
    assert_eq!(small.service_per_start, Decimal::new(350, 0));
    close(
        small.output_degradation_per_year,
        0.002,
        "output degradation",
    );
    close(
        small.heat_rate_degradation_per_year,
        0.004,
        "heat-rate degradation",
    );
    close(small.recoverable_fraction, 0.6, "recoverable");
    let o = small.overhaul.as_ref().expect("small has overhauls");
    close(o.equivalent_hours_per_year, 7000.0, "EOH a year");
    assert_eq!(o.decided_by, OverhaulLimit::EquivalentHours);
    close(o.years_between, 4.0, "years between");
    close(o.fired_hours_between, 16_000.0, "fired hours between");
    close(o.outage_days, 14.0, "outage days");
    assert_eq!(o.cost, Decimal::new(3_200_000, 0));

    let better = &f[1];
    let o = better.overhaul.as_ref().expect("better has overhauls");
    assert_eq!(o.decided_by, OverhaulLimit::Starts);
    close(o.years_between, 3.0, "years between");
    close(o.fired_hours_between, 12_000.0, "fired hours between");
    // Every 3 years from 2026-01-01 with calendar-year rows: the ends of
    // 2028, 2031, …, 2043; 21 years would pass the 20-year life.
    assert_eq!(
        o.years,
        vec![
            (2028, 1),
            (2031, 1),
            (2034, 1),
            (2037, 1),
            (2040, 1),
            (2043, 1)
        ]
    );
    assert_eq!(better.start_cost, Decimal::ZERO);
}

#[test]
fn check_prints_the_figures_in_si() {
    let text = check_text(&scenario(""), Units::Si);
    for expected in [
        "Starts and maintenance (as priced)",
        "  small: 4,000 fired h a year, 150 starts a year; each start 80 GJ (LHV) of fuel and 700 USD",
        "overhaul every 28,000 equivalent h (fired h + starts × 20 h = 7,000 a year); equivalent hours decide: every 4 years (16,000 fired h)",
        "14 days out of service and 3,200,000 USD each",
        "service fees 6 USD per fired hour, 350 USD per start",
        "heat rate 0.4 %, output 0.2 %; 60 % recovered at each overhaul",
        "  better: 4,000 fired h a year, 150 starts a year; each start 90.5 GJ (LHV) of fuel and 0 USD",
        "or 450 starts, whichever first; the starts limit decides: every 3 years (12,000 fired h)",
        "overhauls in 2028, 2031, 2034, 2037, 2040, 2043 (6 in the service life); 0 days out of service and 3,500,000 USD each",
        "present values at 2026-01-01 (present_value_date = \"commercial-operation\")",
        "amounts in real money of 2024-01-01",
    ] {
        assert!(text.contains(expected), "missing {expected:?} in\n{text}");
    }
}

/// 80 GJ = 75.8254 MMBtu, shown 75.825 (1 Btu = 1.055056 kJ, the International Table Btu;
/// GJ per MMBtu equals kJ per Btu).
#[test]
fn check_echoes_start_fuel_in_us_units() {
    let text = check_text(&scenario(""), Units::Us);
    assert!(
        text.contains("each start 75.825 MMBtu (LHV) of fuel and 700 USD"),
        "{text}"
    );
    assert!(!text.contains("80 GJ"), "{text}");
}

#[test]
fn check_states_a_study_present_value_date_and_nominal_money() {
    let text = check_text(
        &scenario("present_value_date = \"study\"\nrate_basis = \"nominal\"\ninflation = \"2 %\""),
        Units::Si,
    );
    assert!(
        text.contains("present values at 2024-01-01 (present_value_date = \"study\")"),
        "{text}"
    );
    assert!(
        text.contains("amounts in nominal (then-current) money"),
        "{text}"
    );
}

#[test]
fn a_candidate_without_starts_or_overhauls_says_so() {
    let text = check_text(
        &parse(
            &SCENARIO
                .replace("#ECONOMICS#", "")
                .replace("starts_per_year = 150\n", ""),
            "no-starts.toml",
        )
        .map(|mut l| {
            for c in &mut l.scenario.candidates {
                c.costs.overhaul_interval_hours = 0.0;
                c.costs.overhaul_starts = 0.0;
                c.costs.overhaul_cost = Decimal::ZERO;
            }
            l
        })
        .expect("scenario"),
        Units::Si,
    );
    assert!(
        text.contains("  small: 4,000 fired h a year, no starts"),
        "{text}"
    );
    assert!(text.contains("    no overhaul priced"), "{text}");
}
