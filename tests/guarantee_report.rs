//! The contract in the outputs of `risk` and `report`: a bid with a
//! guarantee and an as-built heat rate drawn in `[[uncertainty]]`. The PDF's
//! risk section prints the chance of a shortfall and the expected damages
//! that `risk --format json` gives for the same samples and seed (one
//! default sample count, so the same seed gives the same figures), and the
//! CSV has the damages row.

use assert_cmd::Command;
use brayfin::report::format;
use rust_decimal::Decimal;
use serde_json::Value;
use std::str::FromStr;

const DEMO: &str = include_str!("fixtures/corvel-bay-blocks.toml");

/// The demo with a guarantee on the premium bid (1 % tolerance, 250 000
/// per counted % of heat rate) and its as-built heat rate uniform on
/// [99 %, 104 %], written to `dir`.
fn scenario(dir: &tempfile::TempDir) -> String {
    let at = DEMO
        .find("[[candidate]]\nid = \"regenerated\"")
        .unwrap_or(DEMO.len());
    let text = format!(
        "{}[candidate.guarantee]\ntolerance = \"1 %\"\n\
         damages_per_heat_rate_percent = \"250000 USD\"\n\n{}\n[[uncertainty]]\n\
         key = \"candidate[premium].guarantee.as_built_heat_rate\"\n\
         distribution = \"uniform\"\nlow = \"99 %\"\nhigh = \"104 %\"\n",
        &DEMO[..at],
        &DEMO[at..]
    );
    let path = dir.path().join("guaranteed.toml");
    if let Err(e) = std::fs::write(&path, text) {
        panic!("writing: {e}");
    }
    path.to_string_lossy().to_string()
}

fn brayfin(args: &[&str]) -> std::process::Output {
    let mut command = match Command::cargo_bin("brayfin") {
        Ok(c) => c,
        Err(e) => panic!("brayfin must build: {e}"),
    };
    match command.args(args).output() {
        Ok(o) if o.status.success() => o,
        Ok(o) => panic!("{args:?}: {}", String::from_utf8_lossy(&o.stderr)),
        Err(e) => panic!("brayfin must run: {e}"),
    }
}

#[test]
fn report_and_risk_print_the_same_contract_figures() {
    let dir = match tempfile::tempdir() {
        Ok(d) => d,
        Err(e) => panic!("temporary folder: {e}"),
    };
    let path = scenario(&dir);
    let json: Value = match serde_json::from_slice(
        &brayfin(&[
            "risk",
            &path,
            "--samples",
            "600",
            "--seed",
            "5",
            "--format",
            "json",
        ])
        .stdout,
    ) {
        Ok(v) => v,
        Err(e) => panic!("JSON: {e}"),
    };
    let premium = &json["candidates"][0];
    assert_eq!(premium["candidate_id"], "premium");
    assert!(json["candidates"][1].get("contract").is_none());
    let contract = &premium["contract"];
    let shortfall = contract["probability_shortfall"].as_f64().unwrap_or(-1.0);
    // Hand value 0.6 (3 of the 5 points of the range lie past 101 %); 600
    // samples: standard error 0.02, so 4 of them.
    assert!((shortfall - 0.6).abs() <= 0.08, "{shortfall}");
    let mean = contract["damages"]["mean"].as_str().unwrap_or("");
    let mean = match Decimal::from_str(mean) {
        Ok(d) => d,
        Err(e) => panic!("damages mean {mean:?}: {e}"),
    };
    let pdf = dir.path().join("briefing.pdf");
    let pdf_text = pdf.to_string_lossy().to_string();
    brayfin(&[
        "report",
        &path,
        "--samples",
        "600",
        "--seed",
        "5",
        "-o",
        &pdf_text,
    ]);
    let doc = match lopdf::Document::load(&pdf) {
        Ok(d) => d,
        Err(e) => panic!("PDF: {e}"),
    };
    let pages: Vec<u32> = (1..=doc.get_pages().len() as u32).collect();
    let text = doc
        .extract_text(&pages)
        .unwrap_or_default()
        .replace('\u{a0}', " ")
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ");
    assert!(
        text.contains("Guarantee at the acceptance test"),
        "no contract line"
    );
    let printed = format!(
        "short of the guarantee beyond the tolerance in {:.1} % of the samples; expected damages {}",
        shortfall * 100.0,
        format::money(mean, "USD")
    );
    assert!(text.contains(&printed), "{printed}");
    let csv = brayfin(&[
        "risk",
        &path,
        "--samples",
        "600",
        "--seed",
        "5",
        "--format",
        "csv",
    ]);
    let csv = String::from_utf8_lossy(&csv.stdout);
    let row = csv
        .lines()
        .find(|l| l.starts_with("premium,guarantee_damages,"))
        .unwrap_or("");
    assert!(
        row.starts_with(&format!("premium,guarantee_damages,{mean},")),
        "{row}"
    );
    // The last column is the route (`scaled` by default).
    assert!(
        row.ends_with(&format!(",600,5,USD,{shortfall},scaled")),
        "{row}"
    );
}
