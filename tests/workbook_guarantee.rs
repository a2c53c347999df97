//! The audit workbook of a scenario whose bid states as-built figures short
//! of its guarantee: the settlement row and the as-built ledger cached in
//! the workbook equal `compare --format json` to the cent.

mod workbook_support;

use workbook_support::{check_ledgers, check_summary, compare_json, write_workbook};

const DEMO: &str = include_str!("fixtures/corvel-bay-blocks.toml");

#[test]
fn cached_values_equal_compare_with_a_settled_guarantee() {
    let dir = tempfile::tempdir().expect("temp dir");
    let at = DEMO
        .find("[[candidate]]\nid = \"regenerated\"")
        .expect("the demo has a regenerated bid");
    // Damages 500 000 + 600 000 (worked in tests/guarantee_scenario.rs).
    let text = format!(
        "{}[candidate.guarantee]\ntolerance = \"1 %\"\n\
         damages_per_heat_rate_percent = \"250000 USD\"\ndamages_per_kw = \"1200 USD\"\n\
         as_built_heat_rate = \"103 %\"\nas_built_output = \"98 %\"\n\n{}",
        &DEMO[..at],
        &DEMO[at..]
    );
    let scenario = dir.path().join("guaranteed.toml");
    std::fs::write(&scenario, text).expect("write scenario");
    let out = dir.path().join("book.xlsx");
    write_workbook(&scenario, &out);
    let json = compare_json(&scenario);
    let rows = json["candidates"][1]["ledger"]
        .as_array()
        .cloned()
        .unwrap_or_default();
    assert!(
        rows.iter()
            .any(|r| r["guarantee_settlement"] == "-1100000.00"),
        "the JSON ledger carries the settlement"
    );
    check_summary(&out, &json, "guarantee");
    check_ledgers(&out, &json, "guarantee");
}
