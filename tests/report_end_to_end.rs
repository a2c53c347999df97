//! The PDF briefing against `compare --format json` on the demo scenario:
//! every key figure on the briefing page, as printed, is the same figure the
//! JSON gives (rounded the way the page prints it), and the risk section is
//! present exactly when samples are asked for.

use assert_cmd::Command;
use brayfin::report::format;
use brayfin::report::model::Units;
use brayfin::report::pdf::context::short_money;
use rust_decimal::Decimal;
use serde_json::Value;
use std::str::FromStr;

const DEMO: &str = "tests/fixtures/corvel-bay-blocks.toml";

fn compare_json() -> Value {
    let out = Command::cargo_bin("brayfin")
        .unwrap()
        .args(["compare", DEMO, "--format", "json"])
        .output()
        .unwrap();
    assert!(out.status.success());
    serde_json::from_slice(&out.stdout).unwrap()
}

/// Text of every page, no-break spaces folded to spaces.
fn report_pages(extra: &[&str]) -> Vec<String> {
    let dir = tempfile::tempdir().unwrap();
    let pdf = dir.path().join("briefing.pdf");
    let mut args = vec!["report", DEMO, "-o", pdf.to_str().unwrap()];
    args.extend_from_slice(extra);
    let out = Command::cargo_bin("brayfin")
        .unwrap()
        .args(&args)
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let doc = lopdf::Document::load(&pdf).unwrap();
    (1..=doc.get_pages().len() as u32)
        .map(|p| {
            doc.extract_text(&[p])
                .unwrap()
                .replace('\u{a0}', " ")
                .split_whitespace()
                .collect::<Vec<_>>()
                .join(" ")
        })
        .collect()
}

#[test]
fn briefing_key_figures_equal_the_json() {
    let doc = compare_json();
    let pages = report_pages(&["--samples", "0"]);
    let briefing = &pages[0];
    let currency = doc["scenario"]["currency"].as_str().unwrap();
    for c in doc["candidates"].as_array().unwrap() {
        let e = &c["economics"];
        let mut money_keys = vec!["capital_cost", "lifecycle_cost"];
        if c["is_baseline"] == false {
            money_keys.extend([
                "net_savings_vs_baseline",
                "break_even_premium",
                "premium_asked",
            ]);
        }
        for key in money_keys {
            let amount = Decimal::from_str(e[key].as_str().unwrap()).unwrap();
            let printed = short_money(amount, currency).replace('\u{a0}', " ");
            assert!(
                briefing.contains(&printed),
                "{} {key}: `{printed}` not on page 1",
                c["id"]
            );
        }
        let heat_rate = c["performance"]["heat_rate_kj_per_kwh"].as_f64().unwrap();
        let printed = format::heat_rate(heat_rate, 0.0, Units::Si);
        assert!(
            briefing.contains(&printed),
            "{}: `{printed}` missing",
            c["id"]
        );
        if let Some(years) = e["discounted_payback_years"].as_f64() {
            let printed = format!("{years:.1} yr");
            assert!(
                briefing.contains(&printed),
                "{}: `{printed}` missing",
                c["id"]
            );
        }
    }
    assert!(!pages.iter().any(|p| p.contains("Monte Carlo")));
}

#[test]
fn the_risk_section_appears_when_samples_are_asked_for() {
    let pages = report_pages(&["--samples", "500", "--seed", "7"]);
    let risk_page = pages
        .iter()
        .find(|p| p.contains("Monte Carlo"))
        .expect("a risk page");
    assert!(risk_page.contains("Samples: 500"), "{risk_page}");
}
