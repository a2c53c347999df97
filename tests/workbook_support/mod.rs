//! Shared by the workbook tests: run brayfin, read a workbook back with
//! calamine, and hold it against `compare --format json`.
//!
//! "To the cent": `compare` prints money rounded half-to-even to cents; a
//! workbook figure agrees when it lies within half a cent of it (plus 1e-6
//! for the binary representation of the stored double), i.e. when rounding
//! it to cents gives the printed figure.

#![allow(dead_code)]

use assert_cmd::Command;
use brayfin::workbook::summary::{column, DOES_NOT_PAY, FIRST_ROW, NEVER, PAYS};
use calamine::{Data, Range, Reader, Xlsx};
use serde_json::Value;
use std::path::Path;

/// The two demo scenarios (invented places and organisations).
pub const DEMOS: [&str; 2] = [
    "tests/fixtures/corvel-bay-blocks.toml",
    "scenarios/kestrel-point-retrofit.toml",
];

/// Half a cent, plus room for the stored double.
pub const CENT: f64 = 0.005 + 1e-6;

/// `brayfin compare SCENARIO --format json`, parsed.
pub fn compare_json(scenario: &Path) -> Value {
    let out = Command::cargo_bin("brayfin")
        .expect("binary")
        .args(["compare", "--format", "json"])
        .arg(scenario)
        .output()
        .expect("compare runs");
    assert!(
        out.status.success(),
        "compare failed: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout).expect("compare prints JSON")
}

/// `brayfin workbook SCENARIO -o OUT`; panics unless it succeeds.
pub fn write_workbook(scenario: &Path, out: &Path) {
    let result = Command::cargo_bin("brayfin")
        .expect("binary")
        .arg("workbook")
        .arg(scenario)
        .arg("-o")
        .arg(out)
        .output()
        .expect("workbook runs");
    assert!(
        result.status.success(),
        "workbook failed: {}",
        String::from_utf8_lossy(&result.stderr)
    );
}

/// A sheet of a workbook file.
pub fn sheet(path: &Path, name: &str) -> Range<Data> {
    let mut book: Xlsx<_> = calamine::open_workbook(path).expect("the workbook opens");
    book.worksheet_range(name).expect("the sheet is there")
}

/// A cell as a number, with where it is in the message.
pub fn number(range: &Range<Data>, row: u32, col: u16, what: &str) -> f64 {
    match range.get_value((row, u32::from(col))) {
        Some(Data::Float(v)) => *v,
        Some(Data::Int(v)) => *v as f64,
        other => panic!("{what}: expected a number at row {row}, column {col}, found {other:?}"),
    }
}

/// A cell as text.
pub fn text(range: &Range<Data>, row: u32, col: u16) -> String {
    match range.get_value((row, u32::from(col))) {
        Some(Data::String(s)) => s.clone(),
        other => panic!("expected text at row {row}, column {col}, found {other:?}"),
    }
}

/// A money figure of the JSON (a decimal string), as `f64`.
pub fn json_money(value: &Value) -> f64 {
    value
        .as_str()
        .and_then(|s| s.parse().ok())
        .unwrap_or_else(|| panic!("expected a decimal string, found {value}"))
}

/// `actual` within half a cent of the printed `expected`.
pub fn assert_cent(actual: f64, expected: f64, what: &str) {
    assert!(
        (actual - expected).abs() <= CENT,
        "{what}: workbook {actual} against compare {expected} (difference {})",
        actual - expected
    );
}

/// `actual` within `tolerance` of `expected`.
pub fn assert_close(actual: f64, expected: f64, tolerance: f64, what: &str) {
    assert!(
        (actual - expected).abs() <= tolerance,
        "{what}: workbook {actual} against compare {expected}"
    );
}

/// The Summary sheet of `workbook` against `compare`'s JSON: lifecycle
/// costs, net savings, premiums and break-even premiums and fuel prices to
/// the cent, verdicts equal, ratios and paybacks to 1e-9 (relative; 1e-9
/// years): `compare` prints those unrounded and the workbook recomputes
/// them in doubles from the same ledger.
pub fn check_summary(workbook: &Path, json: &Value, label: &str) {
    let summary = sheet(workbook, "Summary");
    let candidates = json["candidates"].as_array().expect("candidates");
    for (i, c) in candidates.iter().enumerate() {
        let r = FIRST_ROW + i as u32;
        let id = c["id"].as_str().expect("id");
        let what = |field: &str| format!("{label}, `{id}`, {field}");
        assert_eq!(
            text(&summary, r, column::ID),
            id,
            "{label}: candidate order"
        );
        let e = &c["economics"];
        assert_cent(
            number(&summary, r, column::LIFECYCLE_COST, &what("lifecycle cost")),
            json_money(&e["lifecycle_cost"]),
            &what("lifecycle cost"),
        );
        assert_cent(
            number(&summary, r, column::CAPITAL, &what("capital")),
            json_money(&e["capital_cost"]),
            &what("capital cost"),
        );
        if c["is_baseline"].as_bool() == Some(true) {
            assert_eq!(text(&summary, r, column::NET_SAVINGS), "baseline");
            continue;
        }
        for (col, key) in [
            (column::NET_SAVINGS, "net_savings_vs_baseline"),
            (column::PREMIUM_ASKED, "premium_asked"),
            (column::BREAK_EVEN_PREMIUM, "break_even_premium"),
            (
                column::BREAK_EVEN_FUEL_PRICE,
                "break_even_fuel_price_per_gj",
            ),
        ] {
            assert_cent(
                number(&summary, r, col, &what(key)),
                json_money(&e[key]),
                &what(key),
            );
        }
        let verdict = match c["verdict"]["kind"].as_str() {
            Some("worth_premium") => PAYS,
            Some("not_worth_premium") => DOES_NOT_PAY,
            other => panic!("unexpected verdict {other:?}"),
        };
        assert_eq!(
            text(&summary, r, column::VERDICT),
            verdict,
            "{}",
            what("verdict")
        );
        for (col, key) in [
            (column::SIR, "savings_to_investment_ratio"),
            (column::AIRR, "adjusted_irr"),
        ] {
            match e[key].as_f64() {
                Some(expected) => assert_close(
                    number(&summary, r, col, &what(key)),
                    expected,
                    1e-9 * expected.abs().max(1.0),
                    &what(key),
                ),
                None => assert_eq!(text(&summary, r, col), "n/a", "{}", what(key)),
            }
        }
        for (col, key) in [
            (column::SIMPLE_PAYBACK, "simple_payback_years"),
            (column::DISCOUNTED_PAYBACK, "discounted_payback_years"),
        ] {
            match e[key].as_f64() {
                Some(expected) => assert_close(
                    number(&summary, r, col, &what(key)),
                    expected,
                    1e-9,
                    &what(key),
                ),
                None => assert_eq!(text(&summary, r, col), NEVER, "{}", what(key)),
            }
        }
    }
}

/// Every ledger row's total and present value against `compare`'s ledger,
/// to the cent, and the same number of rows.
pub fn check_ledgers(workbook: &Path, json: &Value, label: &str) {
    for c in json["candidates"].as_array().expect("candidates") {
        let id = c["id"].as_str().expect("id");
        let range = sheet(workbook, &format!("Ledger {id}"));
        let header = (0..40u32)
            .find(|r| matches!(range.get_value((*r, 0)), Some(Data::String(s)) if s == "Row"))
            .expect("the ledger's header row");
        let col_of = |name: &str| {
            (0..40u16)
                .find(|k| matches!(range.get_value((header, u32::from(*k))), Some(Data::String(s)) if s == name))
                .unwrap_or_else(|| panic!("column {name}"))
        };
        let (total, pv) = (col_of("Total"), col_of("Present value"));
        let kind = col_of("Kind");
        let rows = c["ledger"].as_array().expect("ledger rows");
        for (i, row) in rows.iter().enumerate() {
            let r = header + 1 + i as u32;
            let what = format!("{label}, `{id}`, ledger row {i} ({})", row["year"]);
            // The row's unique label, as compare's JSON ledger row has it,
            // and its kind beside it.
            assert_eq!(
                text(&range, r, 0),
                row["label"].as_str().expect("label"),
                "{what}, label"
            );
            let row_label = row["label"].as_str().unwrap_or_default();
            let expected_kind = if row_label.ends_with(" construction")
                || row_label == "capital at commercial operation"
            {
                "capital"
            } else if row_label.ends_with(" operation") {
                "operation"
            } else if row_label == "end of life" {
                "residual"
            } else {
                "guarantee settlement"
            };
            assert_eq!(text(&range, r, kind), expected_kind, "{what}, kind");
            assert_cent(
                number(&range, r, total, &what),
                json_money(&row["total"]),
                &format!("{what}, total"),
            );
            assert_cent(
                number(&range, r, pv, &what),
                json_money(&row["present_value"]),
                &format!("{what}, present value"),
            );
        }
        let after = header + 1 + rows.len() as u32;
        assert!(
            matches!(range.get_value((after, 0)), None | Some(Data::Empty)),
            "{label}, `{id}`: the workbook has more ledger rows than compare"
        );
    }
}

/// No cell of any sheet holds a spreadsheet error (`#NAME?`, `#DIV/0!`, …):
/// after recalculation every formula, checked figure or not, evaluated.
pub fn assert_no_error_cells(workbook: &Path, label: &str) {
    let mut book: Xlsx<_> = calamine::open_workbook(workbook).expect("the workbook opens");
    for name in book.sheet_names() {
        let range = book.worksheet_range(&name).expect("sheet");
        for (row, col, cell) in range.used_cells() {
            assert!(
                !matches!(cell, Data::Error(_)),
                "{label}: sheet {name}, row {row}, column {col} holds {cell:?}"
            );
        }
    }
}

/// The first demo with its fuel price given year by year instead of
/// escalating: an invented path (a ramp of 0.05 USD/MMBtu a year from the
/// demo's 3.85, every fourth year 0.30 lower), written into `dir`. It
/// exercises the workbook's price-path formulas.
pub fn price_path_variant(dir: &Path) -> std::path::PathBuf {
    let text = std::fs::read_to_string(DEMOS[0]).expect("demo");
    let entries: Vec<String> = (2027..=2057)
        .map(|year| {
            let ramp = 3.85 + 0.05 * f64::from(year - 2027);
            let price = if year % 4 == 0 { ramp - 0.30 } else { ramp };
            format!("{year} = \"{price:.2} USD/MMBtu\"")
        })
        .collect();
    let line = format!("price_path = {{ {} }}", entries.join(", "));
    let replaced: Vec<String> = text
        .lines()
        .map(|l| {
            if l.starts_with("price = ") {
                line.clone()
            } else {
                l.to_string()
            }
        })
        .collect();
    assert!(replaced.contains(&line), "the demo has a fuel price line");
    let path = dir.join("corvel-price-path.toml");
    std::fs::write(&path, replaced.join("\n") + "\n").expect("variant written");
    path
}

/// The second demo stated on a nominal basis (10.16 % ≈ 8 % real with 2 %
/// inflation by the Fisher relation, rounded; escalation rates left as
/// they are) and with no overhauls for the baseline, written into `dir`.
/// It exercises a ledger without overhauls, a payback never reached and a
/// negative savings-to-investment ratio.
pub fn nominal_variant(dir: &Path) -> std::path::PathBuf {
    let mut text = std::fs::read_to_string(DEMOS[1]).expect("demo");
    for (from, to) in [
        ("rate_basis = \"real\"", "rate_basis = \"nominal\""),
        ("discount_rate = \"8 %\"", "discount_rate = \"10.16 %\""),
        (
            "overhaul_interval = \"32000 h\"\noverhaul_cost = \"2600000 EUR\"\noverhaul_outage_days = 21\n",
            "",
        ),
    ] {
        assert!(text.contains(from), "the demo has {from}");
        text = text.replacen(from, to, 1);
    }
    let path = dir.join("kestrel-nominal.toml");
    std::fs::write(&path, text).expect("variant written");
    path
}

/// The second demo with every present value stated at the study date
/// (`economics.present_value_date = "study"`), written into `dir`. It
/// exercises the discount factor's shift to the present-value date.
pub fn study_date_variant(dir: &Path) -> std::path::PathBuf {
    let text = std::fs::read_to_string(DEMOS[1]).expect("demo");
    let from = "rate_basis = \"real\"";
    assert!(text.contains(from), "the demo has {from}");
    let text = text.replacen(
        from,
        "rate_basis = \"real\"\npresent_value_date = \"study\"",
        1,
    );
    let path = dir.join("kestrel-study-date.toml");
    std::fs::write(&path, text).expect("variant written");
    path
}

/// The Corvel Bay demo on its hourly year (weather and profile, capacity
/// credited at 95 degF), written into `dir` with its profile's hours priced
/// (an invented daily pattern: 30 USD/MWh plus 2 USD/MWh per hour of the
/// day), energy valued at 60 USD/MWh and ten outage days per overhaul on
/// Bid A. It exercises the hour-weighted price of energy bought in and the
/// capacity credited at the capacity temperature in the outage term.
pub fn hourly_priced_variant(dir: &Path) -> std::path::PathBuf {
    let data = dir.join("data");
    std::fs::create_dir_all(&data).expect("data dir");
    std::fs::copy(
        "scenarios/data/corvel-bay-weather.csv",
        data.join("corvel-bay-weather.csv"),
    )
    .expect("weather copied");
    let profile =
        std::fs::read_to_string("scenarios/data/corvel-bay-dispatch.csv").expect("profile");
    let mut lines = profile.lines();
    let header = lines.next().expect("profile header");
    let mut priced = format!("{header},energy_price_per_MWh\n");
    for line in lines {
        let hour: f64 = line
            .split(',')
            .next()
            .and_then(|t| t.get(11..13))
            .and_then(|h| h.parse().ok())
            .expect("an hourly timestamp");
        priced.push_str(&format!("{line},{}\n", 30.0 + 2.0 * hour));
    }
    std::fs::write(data.join("corvel-bay-dispatch.csv"), priced).expect("profile written");
    let text = std::fs::read_to_string("scenarios/corvel-bay-peaker.toml").expect("demo");
    let from = "capacity_value = \"95 USD/kW-yr\"";
    assert!(text.contains(from), "the demo has {from}");
    let text = text.replacen(
        from,
        "capacity_value = \"95 USD/kW-yr\"\nenergy_value = \"60 USD/MWh\"",
        1,
    );
    let from = "overhaul_cost = \"3900000 USD\"";
    assert!(text.contains(from), "the demo has {from}");
    let text = text.replacen(
        from,
        "overhaul_cost = \"3900000 USD\"\noverhaul_outage_days = 10",
        1,
    );
    let path = dir.join("corvel-hourly-priced.toml");
    std::fs::write(&path, text).expect("variant written");
    path
}
