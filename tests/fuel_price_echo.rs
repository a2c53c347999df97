//! The fuel price is echoed in the unit the scenario file wrote it in, on
//! every output that prints it: the briefing's page 1 (the price and the
//! break-even fuel price), the fuel-price chart's axis, the sensitivity
//! labels, `compare`'s table, `check` and `sweep`. The per-GJ value sits
//! beside the echo where a reader in SI needs it.
//!
//! Conversion factors: 1 MMBtu = 10^6 Btu_IT = 1.055056 GJ (NIST SP 811,
//! 2008, Appendix B.8, rounded as the trade quotes it); 1 MWh = 3.6 GJ
//! exactly.

use assert_cmd::Command;
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

/// Text of every page, no-break spaces folded, whitespace collapsed.
fn report_pages(scenario: &str) -> Vec<String> {
    let dir = tempfile::tempdir().unwrap();
    let pdf = dir.path().join("briefing.pdf");
    stdout(&[
        "report",
        scenario,
        "-o",
        pdf.to_str().unwrap(),
        "--samples",
        "0",
    ]);
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

/// `per_gj` × `gj_per_unit` to two decimals, as the outputs print it.
fn in_unit(per_gj: &str, gj_per_unit: Decimal) -> String {
    let value = Decimal::from_str(per_gj).unwrap() * gj_per_unit;
    format!(
        "{:.2}",
        value.round_dp_with_strategy(2, rust_decimal::RoundingStrategy::MidpointAwayFromZero)
    )
}

#[test]
fn compare_table_and_check_echo_the_written_price() {
    // 3.85 USD/MMBtu ÷ 1.055056 = 3.6491 USD/GJ.
    let table = stdout(&["compare", CORVEL]);
    assert!(
        table.contains("Fuel price: 3.85 USD/MMBtu HHV (3.6491 USD/GJ)"),
        "{table}"
    );
    let check = stdout(&["check", CORVEL]);
    assert!(
        check.contains("3.85 USD/MMBtu HHV (3.6491 USD/GJ)"),
        "{check}"
    );
    // 34 EUR/MWh ÷ 3.6 = 9.4444 EUR/GJ.
    let table = stdout(&["compare", KESTREL]);
    assert!(
        table.contains("Fuel price: 34 EUR/MWh LHV (9.4444 EUR/GJ)"),
        "{table}"
    );
    // A US reader already reads per MMBtu: nothing beside it.
    let us = stdout(&["compare", CORVEL, "--units", "us"]);
    assert!(us.contains("Fuel price: 3.85 USD/MMBtu HHV\n"), "{us}");
}

#[test]
fn sensitivity_labels_are_in_the_written_unit() {
    let table = stdout(&["compare", CORVEL, "--sensitivity"]);
    let row = table
        .lines()
        .find(|l| l.contains("fuel.price"))
        .expect("a fuel.price row");
    assert!(row.contains("USD/MMBtu HHV"), "{row}");
    assert!(!row.contains("/GJ"), "{row}");
    // The demo swings the price between 2.75 and 5.50 USD/MMBtu (its
    // [[uncertainty]] entry, written in USD/MMBtu): echoed as written.
    assert!(row.contains("2.75 USD/MMBtu HHV"), "{row}");
    assert!(row.contains("5.50 USD/MMBtu HHV"), "{row}");
}

#[test]
fn sweep_table_names_the_file_price() {
    let text = stdout(&[
        "sweep",
        CORVEL,
        "--vary",
        "fuel.price=3 USD/MMBtu:4 USD/MMBtu:1 USD/MMBtu",
    ]);
    assert!(
        text.contains("Fuel price in the file: 3.85 USD/MMBtu HHV (3.6491 USD/GJ)"),
        "{text}"
    );
}

#[test]
fn briefing_echoes_the_price_and_break_even_in_the_file_unit() {
    let json: Value =
        serde_json::from_str(&stdout(&["compare", CORVEL, "--format", "json"])).unwrap();
    let pages = report_pages(CORVEL);
    let page1 = &pages[0];
    assert!(
        page1.contains("Fuel price 3.85 USD/MMBtu HHV (3.6491 USD/GJ)"),
        "{page1}"
    );
    let mmbtu = Decimal::new(1_055_056, 6);
    let mut checked = 0;
    for c in json["candidates"].as_array().unwrap() {
        let Some(per_gj) = c["economics"]["break_even_fuel_price_per_gj"].as_str() else {
            continue;
        };
        if per_gj.starts_with('-') {
            continue;
        }
        let printed = format!("{} USD/MMBtu HHV", in_unit(per_gj, mmbtu));
        assert!(page1.contains(&printed), "{}: `{printed}` missing", c["id"]);
        checked += 1;
    }
    assert!(checked > 0, "some bid has a break-even fuel price");
    assert!(
        pages
            .iter()
            .any(|p| p.contains("Fuel price, USD/MMBtu (HHV)")),
        "the fuel-price chart's axis is per MMBtu"
    );
    assert!(!pages.iter().any(|p| p.contains("USD/GJ (HHV)")));
}

#[test]
fn briefing_echoes_a_price_per_mwh() {
    let pages = report_pages(KESTREL);
    assert!(
        pages[0].contains("Fuel price 34 EUR/MWh LHV (9.4444 EUR/GJ)"),
        "{}",
        pages[0]
    );
    assert!(
        pages
            .iter()
            .any(|p| p.contains("Fuel price, EUR/MWh (LHV)")),
        "the fuel-price chart's axis is per MWh"
    );
    // The marker names the file's price itself, not a per-GJ price rounded
    // to the cent and converted back (9.44 × 3.6 = 33.98).
    assert!(
        pages
            .iter()
            .any(|p| p.contains("scenario price 34.00 EUR/MWh")),
        "the scenario-price marker is the file's 34 EUR/MWh"
    );
}

#[test]
fn a_price_path_is_echoed_in_the_unit_of_its_years() {
    // The demo with its price replaced by a path in USD/MMBtu covering the
    // service life (2027 to 2057), 3.85 in the first year.
    let years: Vec<String> = (2027..=2057)
        .map(|y| {
            format!(
                "{y} = \"{:.2} USD/MMBtu\"",
                3.85 + 0.01 * f64::from(y - 2027)
            )
        })
        .collect();
    let text = std::fs::read_to_string(CORVEL)
        .unwrap()
        .replacen(
            "price = \"3.85 USD/MMBtu\"",
            &format!("price_path = {{ {} }}", years.join(", ")),
            1,
        )
        .replacen(
            "price = \"Utility fuel desk forward view, 2027 delivery\", ",
            "",
            1,
        );
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("path.toml");
    std::fs::write(&path, text).unwrap();
    let path = path.to_str().unwrap();
    let table = stdout(&["compare", path]);
    assert!(
        table.contains("Fuel price: 3.85 USD/MMBtu HHV (3.6491 USD/GJ)"),
        "{table}"
    );
    let row = stdout(&["compare", path, "--sensitivity"]);
    let row = row.lines().find(|l| l.contains("fuel.price")).unwrap();
    assert!(row.contains("USD/MMBtu HHV"), "{row}");
}
