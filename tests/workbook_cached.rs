//! The workbook's cached formula values, read back with calamine (a reader
//! that does not recalculate), equal `compare --format json` to the cent on
//! both demo scenarios: the figures a viewer shows without recalculating
//! are brayfin's own.

mod workbook_support;

use std::path::Path;
use workbook_support::{
    check_ledgers, check_summary, compare_json, hourly_priced_variant, nominal_variant,
    price_path_variant, study_date_variant, write_workbook, DEMOS,
};

#[test]
fn cached_values_equal_compare_on_both_demos() {
    let dir = tempfile::tempdir().expect("temp dir");
    for demo in DEMOS {
        let scenario = Path::new(demo);
        let out = dir.path().join("book.xlsx");
        write_workbook(scenario, &out);
        let json = compare_json(scenario);
        check_summary(&out, &json, demo);
        check_ledgers(&out, &json, demo);
    }
}

/// The same with the fuel price given year by year (a price path), and on
/// a nominal basis without overhauls for the baseline.
#[test]
fn cached_values_equal_compare_on_the_variants() {
    let dir = tempfile::tempdir().expect("temp dir");
    for (scenario, label) in [
        (price_path_variant(dir.path()), "price path"),
        (nominal_variant(dir.path()), "nominal"),
        (
            study_date_variant(dir.path()),
            "present values at the study date",
        ),
        (
            hourly_priced_variant(dir.path()),
            "hourly year with priced hours",
        ),
    ] {
        let out = dir.path().join("book.xlsx");
        write_workbook(&scenario, &out);
        let json = compare_json(&scenario);
        check_summary(&out, &json, label);
        check_ledgers(&out, &json, label);
    }
}

/// The Inputs sheet names the scenario by its SHA-256, as `compare` does.
#[test]
fn the_inputs_sheet_carries_the_scenario_hash() {
    let dir = tempfile::tempdir().expect("temp dir");
    let scenario = Path::new(DEMOS[0]);
    let out = dir.path().join("book.xlsx");
    write_workbook(scenario, &out);
    let sha = compare_json(scenario)["scenario"]["sha256"]
        .as_str()
        .expect("sha256")
        .to_string();
    let inputs = workbook_support::sheet(&out, "Inputs");
    let found = inputs
        .rows()
        .flatten()
        .any(|cell| cell.to_string().contains(&sha));
    assert!(found, "the scenario's SHA-256 {sha} is on the Inputs sheet");
}
