//! The ledger's row labels and totals row, and the present-value date.
//!
//! - Every row has a unique label; the totals row's present value is the
//!   lifecycle cost to the cent (the ledger's own definition: the lifecycle
//!   cost is the sum of the rows' present values), in the model, the JSON
//!   and the CSV.
//! - `economics.present_value_date = "study"` states every present value at
//!   the scenario's date: each equals the commercial-operation result times
//!   `(1 + d)^-(years from the study date to commercial operation)`, worked
//!   by hand below (whole years, so the factor is a plain power). Ratios
//!   (break-even premium, SIR) do not move.

use brayfin::analysis::compare::run_study;
use brayfin::analysis::{build_model, ModelOptions};
use brayfin::finance::{Money, RowKind};
use brayfin::report::csv::LedgerCsvRenderer;
use brayfin::report::json::JsonRenderer;
use brayfin::report::model::Units;
use brayfin::report::Renderer;
use brayfin::scenario::{load, parse, LoadedScenario};
use rust_decimal::Decimal;
use std::collections::HashSet;
use std::path::Path;

/// Invented figures: a study dated two whole years before commercial
/// operation, capital paid half one year before and half at commercial
/// operation, 7 % real, end-of-year cash, 15 years.
const SCENARIO: &str = r#"
[scenario]
title = "Present-value date"
date = 2024-01-01
currency = "USD"
baseline = "small"

[fuel]
composition = "methane"
price = "4.00 USD/GJ"
price_basis = "lhv"

[economics]
commercial_operation = 2026-01-01
service_life_years = 15
discount_rate = "7 %"
#BASE#

[operation]
hours_per_year = "4000 h"
starts_per_year = 50

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
fixed_om = "15 USD/kW-yr"
variable_om = "4 USD/MWh"
start_fuel = "80 GJ"
start_cost = "700 USD"
construction = [
  { date = 2025-01-01, fraction = "50 %" },
  { date = 2026-01-01, fraction = "50 %" },
]

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
fixed_om = "15 USD/kW-yr"
variable_om = "4 USD/MWh"
start_fuel = "80 GJ"
start_cost = "700 USD"
construction = [
  { date = 2025-01-01, fraction = "50 %" },
  { date = 2026-01-01, fraction = "50 %" },
]
"#;

fn scenario(base: &str) -> LoadedScenario {
    let text = SCENARIO.replace("#BASE#", base);
    match parse(&text, "pv-date.toml") {
        Ok(loaded) => loaded,
        Err(e) => panic!("scenario: {e}"),
    }
}

fn f(d: Decimal) -> f64 {
    d.to_f64()
}

/// Hand-worked: the study date is 2 whole years before commercial
/// operation, so every present value at the study date is the one at
/// commercial operation × 1.07^-2 = 1 / 1.1449. The 2025 construction
/// payment of 20 000 000 is compounded one year at commercial operation
/// (× 1.07 = 21 400 000.00) and discounted one year at the study date
/// (÷ 1.07 = 18 691 588.79).
#[test]
fn study_date_is_the_commercial_operation_result_times_the_factor() {
    let at_cod = run_study(&scenario("")).expect("study");
    let explicit =
        run_study(&scenario("present_value_date = \"commercial-operation\"")).expect("study");
    let at_study = run_study(&scenario("present_value_date = \"study\"")).expect("study");
    let factor = 1.0 / 1.07f64.powi(2);
    for ((cod, same), study) in at_cod
        .outcomes
        .iter()
        .zip(&explicit.outcomes)
        .zip(&at_study.outcomes)
    {
        assert_eq!(
            cod.ledger, same.ledger,
            "the default is commercial operation"
        );
        let lcc = f(cod.ledger.summary.lifecycle_cost);
        let lcc_study = f(study.ledger.summary.lifecycle_cost);
        assert!(
            (lcc_study - lcc * factor).abs() < 0.01,
            "{lcc_study} vs {lcc} × {factor}"
        );
        // Undiscounted money does not move.
        for (a, b) in cod.ledger.rows.iter().zip(&study.ledger.rows) {
            assert_eq!(a.total, b.total);
        }
        assert_eq!(
            study.ledger.summary.analysis.present_value_date,
            chrono::NaiveDate::from_ymd_opt(2024, 1, 1).expect("date")
        );
    }
    let first = |ledger: &brayfin::finance::Ledger| {
        ledger
            .rows
            .iter()
            .find(|r| r.kind == RowKind::Capital)
            .map(|r| f(r.present_value))
            .expect("a capital row")
    };
    assert!((first(&at_cod.outcomes[0].ledger) - 21_400_000.0).abs() < 0.005);
    assert!((first(&at_study.outcomes[0].ledger) - 18_691_588.785).abs() < 0.005);
    // Net savings scale by the factor; the break-even premium and SIR, ratios
    // of present values, stay.
    let cod = at_cod.outcomes[1].versus_baseline.as_ref().expect("versus");
    let study = at_study.outcomes[1]
        .versus_baseline
        .as_ref()
        .expect("versus");
    let savings = f(cod.savings.net_savings);
    assert!((f(study.savings.net_savings) - savings * factor).abs() < 0.01);
    let premium = f(cod.savings.break_even_premium.expect("premium"));
    let premium_study = f(study.savings.break_even_premium.expect("premium"));
    assert!((premium_study - premium).abs() < 0.01 + 1e-9 * premium.abs());
}

/// Every output states the date: the model's note, the JSON method block,
/// the CSV column.
#[test]
fn every_output_states_the_present_value_date() {
    let options = ModelOptions {
        units: Units::Si,
        sensitivity: false,
    };
    let model = build_model(&scenario("present_value_date = \"study\""), &options).expect("model");
    assert_eq!(model.method.present_value_date, "2024-01-01");
    assert_eq!(model.method.present_value_base, "study");
    let note = &model.method.present_value_note;
    assert!(note.contains("2024-01-01, the study date"), "{note}");
    assert!(note.contains("compounded"), "{note}");
    assert!(note.contains("real money"), "{note}");
    let csv = String::from_utf8(LedgerCsvRenderer.render(&model).expect("csv")).expect("utf-8");
    let header = csv.lines().next().expect("header");
    assert!(header.ends_with(",present_value_date"), "{header}");
    assert!(csv.lines().skip(1).all(|l| l.ends_with(",2024-01-01")));
    let model = build_model(&scenario(""), &options).expect("model");
    assert_eq!(model.method.present_value_date, "2026-01-01");
    assert!(model
        .method
        .present_value_note
        .contains("the commercial operation date"));
}

/// Labels are unique within each ledger, on both demos and the scenario
/// above, and name what the row is.
#[test]
fn ledger_row_labels_are_unique() {
    let options = ModelOptions {
        units: Units::Si,
        sensitivity: false,
    };
    let mut models = vec![build_model(&scenario(""), &options).expect("model")];
    for demo in ["corvel-bay-peaker", "kestrel-point-retrofit"] {
        let path = format!("scenarios/{demo}.toml");
        let loaded = load(Path::new(&path)).expect("demo loads");
        models.push(build_model(&loaded, &options).expect("model"));
    }
    for model in &models {
        for c in &model.candidates {
            let labels: HashSet<&str> = c.ledger.iter().map(|r| r.label.as_str()).collect();
            assert_eq!(
                labels.len(),
                c.ledger.len(),
                "{:?}",
                c.ledger.iter().map(|r| &r.label).collect::<Vec<_>>()
            );
            assert!(c.ledger.iter().any(|r| r.label.ends_with(" operation")));
            assert_eq!(
                c.ledger.last().map(|r| r.label.as_str()),
                Some("end of life")
            );
        }
    }
    // The scenario above: 2025 construction, then capital on the
    // commercial-operation date, then 15 operating years.
    let small = &models[0].candidates[0];
    assert_eq!(small.ledger[0].label, "2025 construction");
    assert_eq!(small.ledger[1].label, "capital at commercial operation");
    assert_eq!(small.ledger[2].label, "2026 operation");
}

/// The totals row ties the ledger to the lifecycle cost to the cent, and
/// each money column's total is the column summed (within half a cent per
/// row, the rows being rounded one by one), in the model, the JSON and the
/// CSV.
#[test]
fn totals_row_equals_the_lifecycle_cost() {
    let options = ModelOptions {
        units: Units::Si,
        sensitivity: false,
    };
    for demo in ["corvel-bay-peaker", "kestrel-point-retrofit"] {
        let path = format!("scenarios/{demo}.toml");
        let loaded = load(Path::new(&path)).expect("demo loads");
        let model = build_model(&loaded, &options).expect("model");
        let json: serde_json::Value =
            serde_json::from_slice(&JsonRenderer.render(&model).expect("json"))
                .expect("json parses");
        let csv = String::from_utf8(LedgerCsvRenderer.render(&model).expect("csv")).expect("utf-8");
        for (i, c) in model.candidates.iter().enumerate() {
            let t = &c.ledger_total;
            assert_eq!(
                t.present_value, c.economics.lifecycle_cost,
                "{demo} {}",
                c.id
            );
            let half_cent = Decimal::new(5, 3) * Decimal::from(c.ledger.len());
            let rows_pv: Decimal = c.ledger.iter().map(|r| r.present_value).sum();
            assert!((rows_pv - t.present_value).abs() <= half_cent);
            let rows_total: Decimal = c.ledger.iter().map(|r| r.total).sum();
            assert!((rows_total - t.total).abs() <= half_cent);
            let streams = t.fuel_cost
                + t.carbon_cost
                + t.fixed_om
                + t.variable_om
                + t.overhaul
                + t.bought_in
                + t.capital
                + t.residual
                + t.guarantee_settlement;
            assert!((streams - t.total).abs() <= Decimal::new(5, 2));
            let j = &json["candidates"][i];
            assert_eq!(
                j["ledger_total"]["present_value"], j["economics"]["lifecycle_cost"],
                "{demo} {}",
                c.id
            );
            let line = csv
                .lines()
                .find(|l| l.starts_with(&format!("{},total,", c.id)))
                .expect("a CSV totals row");
            assert!(
                line.contains(&format!(",{},", c.economics.lifecycle_cost)),
                "{line}"
            );
        }
    }
}
