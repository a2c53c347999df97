//! Evaluation factors (what one unit of a guaranteed figure is worth over
//! the life) on the briefing and in `compare`'s table, and the conversion
//! of the heat-rate factor from the dispatch-weighted heat rate to the
//! full-load heat rate a bid guarantees.
//!
//! The mean part-load ratio is computed here by hand from the demo file's
//! `[operation]` tables (tests/fixtures/corvel-bay-blocks.toml, the demo before its hourly year): energy weights
//! load × hours, ratios from the part-load table at those loads.

use assert_cmd::Command;
use brayfin::report::pdf::context::short_money;
use rust_decimal::Decimal;
use serde_json::Value;
use std::str::FromStr;

const CORVEL: &str = "tests/fixtures/corvel-bay-blocks.toml";
const KESTREL: &str = "scenarios/kestrel-point-retrofit.toml";

fn stdout(args: &[&str]) -> String {
    let out = Command::cargo_bin("brayfin")
        .unwrap()
        .args(args)
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).unwrap()
}

fn json(scenario: &str) -> Value {
    serde_json::from_str(&stdout(&["compare", scenario, "--format", "json"])).unwrap()
}

fn dec(v: &Value) -> Decimal {
    Decimal::from_str(v.as_str().unwrap()).unwrap()
}

#[test]
fn full_load_heat_rate_factor_is_the_weighted_one_times_the_mean_part_load_ratio() {
    // Dispatch: 1800 h at 100 %, 1100 h at 80 %, 600 h at 60 %
    // (energy 1800, 880 and 360 load-hours). The vendor curves state
    // 1.045 and 1.12 at 80 % and 60 % (Bid A), 1.044 and 1.116 (Bid B),
    // 1.015 and 1.05 (Bid C). Energy-weighted mean ratio, by hand: A (1800
    // + 880·1.045 + 360·1.12) / 3040 = 3122.8 / 3040; B (1800 + 880·1.044 +
    // 360·1.116) / 3040 = 3120.48 / 3040; C (1800 + 880·1.015 + 360·1.05) /
    // 3040 = 3071.2 / 3040.
    let doc = json(CORVEL);
    for c in doc["candidates"].as_array().unwrap() {
        let e = &c["economics"];
        let ratio = e["dispatch_heat_rate_ratio"].as_f64().unwrap();
        let expected_ratio = match c["id"].as_str() {
            Some("standard") => 3122.8 / 3040.0,
            Some("premium") => 3120.48 / 3040.0,
            _ => 3071.2 / 3040.0,
        };
        assert!(
            (ratio - expected_ratio).abs() < 1e-9,
            "{}: ratio {ratio}",
            c["id"]
        );
        let weighted = dec(&e["value_per_kj_per_kwh"]);
        let full_load = dec(&e["value_per_kj_per_kwh_full_load"]);
        let by_hand = weighted * Decimal::from_f64_retain(expected_ratio).unwrap();
        // Both figures are rounded to the cent; the weighted one's rounding
        // (≤ 0.005) is scaled by the ratio.
        assert!(
            (full_load - by_hand).abs() <= Decimal::new(2, 2),
            "{}: {full_load} against {by_hand}",
            c["id"]
        );
        assert!(full_load > weighted, "part-load hours raise the factor");
    }
    // Every hour at full load (no dispatch table) but over monthly weather
    // bins: the ratio is the year's mean heat rate over the heat rate at
    // the site's reference ambient (the weather's effect alone, under 1 %
    // for these mild months), and the two factors differ by it.
    let doc = json(KESTREL);
    for c in doc["candidates"].as_array().unwrap() {
        let e = &c["economics"];
        let ratio = e["dispatch_heat_rate_ratio"].as_f64().unwrap();
        let p = &c["performance"];
        let mean = p["site_year"]["mean_heat_rate_kj_per_kwh"]
            .as_f64()
            .unwrap();
        let site = p["heat_rate_kj_per_kwh"].as_f64().unwrap();
        assert!((ratio - mean / site).abs() < 1e-9, "{}: {ratio}", c["id"]);
        assert!((ratio - 1.0).abs() < 0.01, "{}: {ratio}", c["id"]);
        let weighted = dec(&e["value_per_kj_per_kwh"]);
        let full_load = dec(&e["value_per_kj_per_kwh_full_load"]);
        let by_hand = weighted * Decimal::from_f64_retain(ratio).unwrap();
        assert!(
            (full_load - by_hand).abs() <= Decimal::new(2, 2),
            "{}: {full_load} against {by_hand}",
            c["id"]
        );
    }
}

#[test]
fn compare_table_prints_the_factors() {
    let doc = json(CORVEL);
    let table = stdout(&["compare", CORVEL]);
    assert!(table.contains("Evaluation factors"), "{table}");
    let mmbtu = Decimal::new(1_055_056, 6);
    for c in doc["candidates"].as_array().unwrap() {
        let id = c["id"].as_str().unwrap();
        let e = &c["economics"];
        let row = table
            .lines()
            .skip_while(|l| !l.starts_with("Evaluation factors"))
            .find(|l| l.trim_start().starts_with(&format!("{id} ")))
            .unwrap_or_else(|| panic!("{id}: no factors row"));
        let full_load =
            brayfin::report::format::money(dec(&e["value_per_kj_per_kwh_full_load"]), "USD");
        assert!(row.contains(&full_load), "{row}: {full_load}");
        let per_kw = brayfin::report::format::money(dec(&e["value_per_kw"]), "USD");
        assert!(row.contains(&per_kw), "{row}: {per_kw}");
        let turbine =
            brayfin::report::format::money(dec(&e["value_per_point"]["turbine_efficiency"]), "USD");
        assert!(row.contains(&turbine), "{row}: {turbine}");
        if let Some(per_gj) = e["break_even_fuel_price_per_gj"].as_str() {
            // In the file's unit: per GJ × 1.055056 GJ/MMBtu (NIST SP 811,
            // Appendix B.8).
            let per_mmbtu = (Decimal::from_str(per_gj).unwrap() * mmbtu)
                .round_dp_with_strategy(2, rust_decimal::RoundingStrategy::MidpointAwayFromZero);
            let printed = format!("{per_mmbtu:.2} USD/MMBtu HHV");
            assert!(row.contains(&printed), "{row}: {printed}");
        }
    }
    // US units: per Btu/kWh = per kJ/kWh × 1.055056 (1 Btu = 1.055056 kJ).
    let us = stdout(&["compare", CORVEL, "--units", "us"]);
    assert!(us.contains("1 Btu/kWh lower heat rate"), "{us}");
    let premium = &doc["candidates"][1]["economics"];
    let per_btu = dec(&premium["value_per_kj_per_kwh_full_load"]) * mmbtu;
    let printed = brayfin::report::format::money(per_btu, "USD");
    assert!(us.contains(&printed), "{us}: {printed}");
}

#[test]
fn briefing_has_the_factors_table_after_the_key_figures() {
    let doc = json(CORVEL);
    let dir = tempfile::tempdir().unwrap();
    let pdf = dir.path().join("b.pdf");
    stdout(&[
        "report",
        CORVEL,
        "-o",
        pdf.to_str().unwrap(),
        "--samples",
        "0",
    ]);
    let pdf = lopdf::Document::load(&pdf).unwrap();
    // Page 1 or 2 (the table flows on from the briefing page).
    let text: String = (1..=2)
        .map(|p| pdf.extract_text(&[p]).unwrap())
        .collect::<Vec<_>>()
        .join(" ")
        .replace('\u{a0}', " ")
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ");
    assert!(text.contains("Evaluation factors"), "{text}");
    assert!(
        text.contains("1 kJ/kWh lower full-load heat rate"),
        "{text}"
    );
    for c in doc["candidates"].as_array().unwrap() {
        let ratio = c["economics"]["dispatch_heat_rate_ratio"].as_f64().unwrap();
        let printed = format!("{ratio:.3}");
        assert!(
            text.contains(&printed),
            "the mean part-load ratio {printed}: {text}"
        );
    }
    for c in doc["candidates"].as_array().unwrap() {
        let e = &c["economics"];
        for figure in [
            dec(&e["value_per_kj_per_kwh_full_load"]),
            dec(&e["value_per_kw"]),
            dec(&e["value_per_point"]["compressor_efficiency"]),
        ] {
            let printed = short_money(figure, "USD").replace('\u{a0}', " ");
            assert!(text.contains(&printed), "{}: {printed}", c["id"]);
        }
    }
}
