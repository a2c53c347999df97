//! `brayfin sweep` end to end: a sweep point with `--exact` equals a
//! `compare` run of the scenario file edited to that value, and by the
//! default route (engine moves scaled from a re-solved rating point) is
//! within 0.1 % of it; grids in long format, first key
//! slowest; unsolvable points reported in their rows; bad ranges refused
//! with exit code 1.

use assert_cmd::Command;
use serde_json::Value;

const DEMO: &str = "tests/fixtures/corvel-bay-blocks.toml";
const DEMO_TEXT: &str = include_str!("fixtures/corvel-bay-blocks.toml");

fn brayfin(args: &[&str]) -> std::process::Output {
    match Command::cargo_bin("brayfin") {
        Ok(mut c) => match c.args(args).output() {
            Ok(o) => o,
            Err(e) => panic!("brayfin must run: {e}"),
        },
        Err(e) => panic!("brayfin must build: {e}"),
    }
}

fn json_of(args: &[&str]) -> Value {
    let output = brayfin(args);
    assert!(
        output.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    match serde_json::from_slice(&output.stdout) {
        Ok(v) => v,
        Err(e) => panic!("{args:?} must print JSON: {e}"),
    }
}

/// Money printed as a decimal string, or a number.
fn amount(v: &Value) -> f64 {
    match v {
        Value::String(s) => s.parse().unwrap_or(f64::NAN),
        other => other.as_f64().unwrap_or(f64::NAN),
    }
}

/// Sweep the demo at one value of `key` and compare every candidate with a
/// `compare --format json` run of the demo text edited by `edit`.
fn check_point_against_compare(key: &str, value: &str, from: &str, to: &str) {
    check_range_against_compare(key, &format!("{value}:{value}:1"), from, to);
}

/// As [`check_point_against_compare`], with the one-point range written
/// out (units allowed).
fn check_range_against_compare(key: &str, range: &str, from: &str, to: &str) {
    assert!(DEMO_TEXT.contains(from), "the demo must contain {from}");
    let edited = DEMO_TEXT.replacen(from, to, 1);
    let dir = match tempfile::tempdir() {
        Ok(d) => d,
        Err(e) => panic!("temporary folder: {e}"),
    };
    let path = dir.path().join("edited.toml");
    if let Err(e) = std::fs::write(&path, edited) {
        panic!("writing the edited scenario: {e}");
    }
    let path_text = path.to_string_lossy().to_string();
    let compared = json_of(&["compare", &path_text, "--format", "json"]);
    let vary = format!("{key}={range}");
    let candidates = compared["candidates"]
        .as_array()
        .cloned()
        .unwrap_or_default();
    let exact = json_of(&[
        "sweep", DEMO, "--vary", &vary, "--format", "json", "--exact",
    ]);
    let rows = exact["rows"].as_array().cloned().unwrap_or_default();
    assert_eq!(rows.len(), candidates.len());
    for (row, c) in rows.iter().zip(&candidates) {
        assert_eq!(row["candidate_id"], c["id"]);
        assert_eq!(row["error"], Value::Null);
        // The same cycle solve on the same inputs: the same f64.
        assert_eq!(
            row["heat_rate_kj_per_kwh"].as_f64(),
            c["performance"]["heat_rate_kj_per_kwh"].as_f64(),
            "{key}: heat rate of {}",
            c["id"]
        );
        // Money: compare's decimal ledger and sweep's f64 ledger, each
        // rounded to the cent; the ledgers agree to about 1e-8 of a unit,
        // so the printed cents agree, or differ by one cent when a value
        // sits on a half-cent boundary.
        for (name, s, k, _) in money(row, c) {
            assert!(
                (s - k).abs() <= 0.010_000_1,
                "{key}: {name} of {}: sweep {s}, compare {k}",
                c["id"]
            );
        }
    }
    // The default route: within 0.1 % (issue 12) of the exact figures;
    // money on the scale of the candidate's lifecycle cost, since net
    // savings and the break-even premium can sit near zero.
    let scaled = json_of(&["sweep", DEMO, "--vary", &vary, "--format", "json"]);
    let rows = scaled["rows"].as_array().cloned().unwrap_or_default();
    assert_eq!(rows.len(), candidates.len());
    for (row, c) in rows.iter().zip(&candidates) {
        assert_eq!(row["error"], Value::Null);
        let (s, k) = (
            row["heat_rate_kj_per_kwh"].as_f64().unwrap_or(f64::NAN),
            c["performance"]["heat_rate_kj_per_kwh"]
                .as_f64()
                .unwrap_or(f64::NAN),
        );
        assert!(
            (s / k - 1.0).abs() <= 1e-3,
            "{key}: heat rate {s} against {k}"
        );
        for (name, s, k, scale) in money(row, c) {
            assert!(
                (s - k).abs() <= 1e-3 * scale,
                "{key}: {name} of {}: sweep {s}, compare {k}",
                c["id"]
            );
        }
    }
}

/// (figure, swept, compared, the candidate's lifecycle cost) for each money
/// figure `compare` gives the candidate.
fn money(row: &Value, c: &Value) -> Vec<(&'static str, f64, f64, f64)> {
    let e = &c["economics"];
    let scale = amount(&e["lifecycle_cost"]).abs();
    [
        ("lifecycle cost", "lifecycle_cost", "lifecycle_cost"),
        ("net savings", "net_savings", "net_savings_vs_baseline"),
        (
            "break-even premium",
            "break_even_premium",
            "break_even_premium",
        ),
    ]
    .into_iter()
    .filter_map(|(name, swept, compared)| {
        if e[compared].is_null() {
            assert!(row[swept].is_null(), "{name} of {}", c["id"]);
            return None;
        }
        Some((name, amount(&row[swept]), amount(&e[compared]), scale))
    })
    .collect()
}

#[test]
fn a_fuel_price_point_equals_compare_of_the_edited_file() {
    // 5 per GJ, internal unit of fuel.price; the file then says "5 USD/GJ".
    check_point_against_compare(
        "fuel.price",
        "5",
        "price = \"3.85 USD/MMBtu\"",
        "price = \"5 USD/GJ\"",
    );
}

#[test]
fn a_fuel_price_range_in_usd_per_mmbtu_equals_compare_of_the_edited_file() {
    // The range carries the unit the file uses: 5 USD/MMBtu is converted
    // exactly as the file's own "5 USD/MMBtu" is (1 MMBtu = 1.055056 GJ).
    check_range_against_compare(
        "fuel.price",
        "5 USD/MMBtu:5 USD/MMBtu:1 USD/MMBtu",
        "price = \"3.85 USD/MMBtu\"",
        "price = \"5 USD/MMBtu\"",
    );
}

#[test]
fn a_turbine_efficiency_range_in_percent_equals_compare_of_the_edited_file() {
    check_range_against_compare(
        "candidate[premium].turbine_efficiency",
        "90%:90%:1%",
        "turbine_efficiency = \"91.5 %\"",
        "turbine_efficiency = \"90 %\"",
    );
}

#[test]
fn a_temperature_range_in_degc_steps_in_degc() {
    // 1226.85 degC = 1500 K (0 degC = 273.15 K, NIST SP 811): the file's
    // own value for the first bid, so the sweep equals compare of the
    // file edited to say it in degC.
    check_range_against_compare(
        "candidate[standard].turbine_inlet_temperature",
        "1226.85 degC:1226.85 degC:10 degC",
        "turbine_inlet_temperature = \"1500 K\"",
        "turbine_inlet_temperature = \"1226.85 degC\"",
    );
    // A step in degC is a difference: 1200, 1225, 1250 degC.
    let swept = json_of(&[
        "sweep",
        DEMO,
        "--vary",
        "candidate.turbine_inlet_temperature=1200 degC:1250 degC:25 degC",
        "--candidate",
        "standard",
        "--format",
        "json",
    ]);
    let values: Vec<f64> = swept["rows"]
        .as_array()
        .cloned()
        .unwrap_or_default()
        .iter()
        .filter_map(|r| r["values"]["candidate.turbine_inlet_temperature"].as_f64())
        .collect();
    assert_eq!(values, [1200.0, 1225.0, 1250.0]);
    assert_eq!(
        swept["units"]["candidate.turbine_inlet_temperature"],
        "degC"
    );
}

#[test]
fn the_varied_key_prints_with_its_unit() {
    // Bare numbers keep meaning the internal unit (per GJ here) and say so.
    let output = brayfin(&[
        "sweep",
        DEMO,
        "--vary",
        "fuel.price=3:4:1",
        "--format",
        "csv",
    ]);
    assert!(output.status.success());
    let text = String::from_utf8_lossy(&output.stdout);
    assert!(
        text.starts_with("point,fuel.price (USD/GJ HHV),candidate_id,"),
        "{text}"
    );
    // Written in USD/MMBtu: printed in USD/MMBtu, as written.
    let swept = json_of(&[
        "sweep",
        DEMO,
        "--vary",
        "fuel.price=3 USD/MMBtu:4 USD/MMBtu:0.5 USD/MMBtu",
        "--format",
        "json",
    ]);
    assert_eq!(swept["units"]["fuel.price"], "USD/MMBtu HHV");
    let last = swept["rows"]
        .as_array()
        .and_then(|r| r.last())
        .cloned()
        .unwrap_or_default();
    assert_eq!(last["values"]["fuel.price"].as_f64(), Some(4.0));
    // The table names the unit under the key and the heat rate's unit.
    let output = brayfin(&[
        "sweep",
        DEMO,
        "--vary",
        "candidate.turbine_efficiency=88%:89%:1%",
        "--units",
        "us",
    ]);
    assert!(output.status.success());
    let text = String::from_utf8_lossy(&output.stdout);
    assert!(text.contains("(%)"), "{text}");
    assert!(text.contains("HR Btu/kWh"), "{text}");
}

#[test]
fn a_scenario_check_refuses_prints_nothing_and_exits_1() {
    // The file loads, but its cycle cannot be solved: `check` refuses it,
    // so `sweep` must too, before printing any JSON.
    let bad = "tests/bad_inputs/solve-negative-net-work.toml";
    let check = brayfin(&["check", bad]);
    assert_eq!(check.status.code(), Some(1));
    for format in ["json", "csv", "table"] {
        let output = brayfin(&[
            "sweep",
            bad,
            "--vary",
            "economics.discount_rate=0.05:0.06:0.01",
            "--format",
            format,
        ]);
        assert_eq!(output.status.code(), Some(1), "{format}");
        assert!(output.stdout.is_empty(), "{format}: printed before failing");
        let message = String::from_utf8_lossy(&output.stderr);
        assert!(message.contains("net work"), "{format}: {message}");
    }
}

#[test]
fn a_turbine_efficiency_point_equals_compare_of_the_edited_file() {
    // Only the premium bid has 91.5 % as its turbine efficiency line.
    check_point_against_compare(
        "candidate[premium].turbine_efficiency",
        "0.9",
        "turbine_efficiency = \"91.5 %\"",
        "turbine_efficiency = 0.9",
    );
}

#[test]
fn an_hours_point_equals_compare_of_the_edited_file() {
    // Setting hours scales every dispatch block in proportion: 3500 h →
    // 4200 h is a factor 1.2 (1800, 1100, 600 h → 2160, 1320, 720 h).
    check_point_against_compare(
        "operation.hours_per_year",
        "4200",
        "{ load = \"100 %\", hours = 1800 },\n  { load = \"80 %\", hours = 1100 },\n  { load = \"60 %\", hours = 600 },",
        "{ load = \"100 %\", hours = 2160 },\n  { load = \"80 %\", hours = 1320 },\n  { load = \"60 %\", hours = 720 },",
    );
}

#[test]
fn a_grid_is_long_format_with_the_first_key_slowest() {
    let output = brayfin(&[
        "sweep",
        DEMO,
        "--vary",
        "fuel.price=3:4:0.5",
        "--vary",
        "candidate[premium].turbine_efficiency=0.90:0.91:0.01",
        "--candidate",
        "premium",
        "--format",
        "csv",
    ]);
    assert!(output.status.success());
    let text = String::from_utf8_lossy(&output.stdout);
    let lines: Vec<&str> = text.lines().collect();
    assert_eq!(
        lines[0],
        "point,fuel.price (USD/GJ HHV),candidate[premium].turbine_efficiency,\
         candidate_id,heat_rate_kj_per_kwh,lifecycle_cost,net_savings,break_even_premium,error"
    );
    // 3 prices × 2 efficiencies, one reported candidate.
    assert_eq!(lines.len(), 1 + 6);
    let pairs: Vec<(String, String)> = lines[1..]
        .iter()
        .map(|l| {
            let f: Vec<&str> = l.split(',').collect();
            assert_eq!(f[3], "premium");
            assert_eq!(f[8], "", "no error expected: {l}");
            (f[1].to_string(), f[2].to_string())
        })
        .collect();
    let expected = [
        ("3", "0.9"),
        ("3", "0.91"),
        ("3.5", "0.9"),
        ("3.5", "0.91"),
        ("4", "0.9"),
        ("4", "0.91"),
    ];
    for (got, want) in pairs.iter().zip(expected) {
        assert_eq!((got.0.as_str(), got.1.as_str()), want);
    }
}

#[test]
fn unsolvable_points_are_rows_with_the_reason_not_a_failure() {
    // 400 K is below the compressor exit temperature at pressure ratio 19.
    let output = brayfin(&[
        "sweep",
        DEMO,
        "--vary",
        "candidate.turbine_inlet_temperature=400:1500:1100",
        "--format",
        "csv",
    ]);
    assert!(output.status.success());
    let text = String::from_utf8_lossy(&output.stdout);
    let first = text.lines().nth(1).unwrap_or_default();
    assert!(first.contains("cannot be solved"), "{first}");
    let last = text.lines().last().unwrap_or_default();
    assert!(last.starts_with("1,1500,regenerated,"), "{last}");
    assert!(
        last.ends_with(','),
        "a solved row has an empty error: {last}"
    );
    let note = String::from_utf8_lossy(&output.stderr);
    assert!(note.contains("1 of 2 points could not be solved"), "{note}");
}

fn refused(args: &[&str], expected: &str) {
    let output = brayfin(args);
    assert_eq!(output.status.code(), Some(1), "{args:?}");
    assert!(output.stdout.is_empty(), "{args:?} printed results");
    let message = String::from_utf8_lossy(&output.stderr);
    assert!(message.contains(expected), "{args:?}: {message}");
}

#[test]
fn bad_ranges_are_input_errors() {
    let s = DEMO;
    refused(
        &["sweep", s, "--vary", "fuel.prise=3:4:0.5"],
        "did you mean fuel.price?",
    );
    refused(&["sweep", s, "--vary", "fuel.price=3:4:0"], "STEP is zero");
    refused(
        &["sweep", s, "--vary", "fuel.price=4:3:0.5"],
        "points away from TO",
    );
    refused(
        &["sweep", s, "--vary", "fuel.price=0:100:0.00001"],
        "more than 10000000 points",
    );
    refused(
        &[
            "sweep",
            s,
            "--vary",
            "fuel.price=0:10:0.001",
            "--vary",
            "fuel.escalation=0:0.1:0.0001",
        ],
        "the grid has more than 10000000 points",
    );
    refused(
        &[
            "sweep",
            s,
            "--vary",
            "candidate.turbine_efficiency=0.9:1.1:0.1",
        ],
        "above 1",
    );
    refused(&["sweep", s, "--vary", "fuel.price=3:4"], "not 3");
    refused(
        &["sweep", s, "--vary", "fuel.price=2 USD/MMBtu:4:1"],
        "different units",
    );
    refused(
        &["sweep", s, "--vary", "fuel.price=2 K:4 K:1 K"],
        "is a unit of a temperature",
    );
    refused(
        &[
            "sweep",
            s,
            "--vary",
            "fuel.price=2 EUR/GJ:4 EUR/GJ:1 EUR/GJ",
        ],
        "the scenario's currency is USD",
    );
    refused(
        &["sweep", s, "--vary", "fuel.price=x:4:1"],
        "not a finite number",
    );
    refused(
        &[
            "sweep",
            s,
            "--vary",
            "fuel.price=3:4:1",
            "--candidate",
            "premiun",
        ],
        "expected one of standard, premium, regenerated",
    );
    refused(
        &[
            "sweep",
            s,
            "--vary",
            "fuel.price=3:4:1",
            "--vary",
            "fuel.price=3:4:1",
        ],
        "twice",
    );
    refused(
        &[
            "sweep",
            s,
            "--vary",
            "fuel.price=3:4:1",
            "--vary",
            "fuel.escalation=0:0.01:0.01",
            "--vary",
            "economics.discount_rate=0.05:0.06:0.01",
        ],
        "expected once (a line) or twice (a grid)",
    );
}

#[test]
fn a_huge_vary_key_or_value_is_quoted_short() {
    // A key path or a range value of thousands of characters is quoted to
    // at most about 80 characters with an ellipsis, on one line, exit 1.
    let long = "q".repeat(5_000);
    for vary in [
        format!("fuel.{long}=1:2:1"),
        format!("fuel.price=1:{}x:1", "9".repeat(5_000)),
    ] {
        let out = assert_cmd::Command::cargo_bin("brayfin")
            .unwrap()
            .args([
                "sweep",
                "tests/fixtures/corvel-bay-blocks.toml",
                "--vary",
                &vary,
            ])
            .output()
            .unwrap();
        assert_eq!(out.status.code(), Some(1));
        let message = String::from_utf8_lossy(&out.stderr);
        assert_eq!(message.trim_end().lines().count(), 1, "{message}");
        assert!(
            message.chars().count() < 600,
            "{} chars",
            message.chars().count()
        );
        assert!(message.contains('…'), "{message}");
    }
}
