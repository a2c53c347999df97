//! The performance appendix of a `--units us` briefing: fuel flow in lb/h
//! (1 kg/s = 3600 / 0.45359237 lb/h, the international pound's definition)
//! and the back-work ratio in its one printed form, a percentage with one
//! decimal, both against `compare --format json`.

use assert_cmd::Command;
use serde_json::Value;

const DEMO: &str = "tests/fixtures/corvel-bay-blocks.toml";

fn pdf_text(units: &str) -> String {
    let dir = tempfile::tempdir().unwrap();
    let pdf = dir.path().join("b.pdf");
    let out = Command::cargo_bin("brayfin")
        .unwrap()
        .args(["report", DEMO, "--samples", "0", "--units", units, "-o"])
        .arg(&pdf)
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let doc = lopdf::Document::load(&pdf).unwrap();
    (1..=doc.get_pages().len() as u32)
        .map(|p| doc.extract_text(&[p]).unwrap_or_default())
        .collect::<Vec<_>>()
        .join(" ")
        .replace('\u{a0}', " ")
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ")
}

#[test]
fn fuel_flow_in_pounds_per_hour_and_back_work_ratio_as_a_percentage() {
    let out = Command::cargo_bin("brayfin")
        .unwrap()
        .args(["compare", DEMO, "--format", "json"])
        .output()
        .unwrap();
    let json: Value = serde_json::from_slice(&out.stdout).unwrap();
    let us = pdf_text("us");
    let si = pdf_text("si");
    for c in json["candidates"].as_array().unwrap() {
        let kg_per_s = c["performance"]["fuel_flow_kg_per_s"].as_f64().unwrap();
        let lb_per_h = kg_per_s * 3600.0 / 0.453_592_37;
        let printed = format!("Fuel flow {lb_per_h:.0} lb/h");
        assert!(us.contains(&printed), "{}: `{printed}` missing", c["id"]);
        let printed = format!("Fuel flow {kg_per_s:.3} kg/s");
        assert!(si.contains(&printed), "{}: `{printed}` missing", c["id"]);
        let bwr = c["cycle"]["back_work_ratio"].as_f64().unwrap();
        let printed = format!("{:.1} %", bwr * 100.0);
        assert!(us.contains(&printed), "{}: `{printed}` missing", c["id"]);
    }
}
