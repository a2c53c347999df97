//! One way out for every command, from the outside: argument errors are
//! bad input (exit 1, one line and a hint), `--units us` works on every
//! command that prints quantities and converts by the published
//! definitions, and `report` refuses an output that is not a PDF.
//!
//! Conversion factors used as references (NIST SP 811, 2008, Appendix B.8):
//! 1 Btu/lb = 2.326 kJ/kg, 1 Btu/(lb·°R) = 4.1868 kJ/(kg·K),
//! 1 lb = 0.453 592 37 kg, 1 psi = 6.894 757 kPa, T(°F) = 1.8 T(K) − 459.67,
//! 1 MMBtu = 1.055056 GJ (the trade's rounding of 1.055 055 852 62).

use assert_cmd::Command;
use serde_json::Value;
use std::collections::HashMap;

const DEMO: &str = "scenarios/corvel-bay-peaker.toml";

fn brayfin(args: &[&str]) -> std::process::Output {
    match Command::cargo_bin("brayfin") {
        Ok(mut c) => match c.args(args).output() {
            Ok(o) => o,
            Err(e) => panic!("brayfin must run: {e}"),
        },
        Err(e) => panic!("brayfin must build: {e}"),
    }
}

fn stdout(args: &[&str]) -> String {
    let output = brayfin(args);
    assert_eq!(
        output.status.code(),
        Some(0),
        "{args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    String::from_utf8_lossy(&output.stdout).into_owned()
}

/// Exit 1, nothing on stdout, and exactly two lines on stderr: the problem
/// (containing `expected`) and a hint to `--help`.
fn argument_refused(args: &[&str], expected: &str) {
    let output = brayfin(args);
    assert_eq!(output.status.code(), Some(1), "{args:?}");
    assert!(output.stdout.is_empty(), "{args:?}");
    let message = String::from_utf8_lossy(&output.stderr);
    let lines: Vec<&str> = message.lines().collect();
    assert_eq!(lines.len(), 2, "{args:?}: {message}");
    assert!(lines[0].starts_with("error: "), "{message}");
    assert!(lines[0].contains(expected), "{args:?}: {message}");
    assert!(lines[1].contains("--help"), "{message}");
    assert!(!message.contains("Usage:"), "no usage block: {message}");
}

#[test]
fn argument_errors_are_bad_input_with_one_line() {
    argument_refused(
        &["cycle", "--pressure-ratio", "10", "--bogus"],
        "unexpected argument '--bogus'",
    );
    argument_refused(
        &["compare", DEMO, "--format", "xml"],
        "possible values: table, json, csv",
    );
    argument_refused(&["risk", DEMO, "--units", "imperial"], "'imperial'");
    argument_refused(
        &[
            "sweep",
            DEMO,
            "--vary",
            "fuel.price=3:4:1",
            "--candidate",
            "-x",
        ],
        "--candidate=-x",
    );
    argument_refused(&["frobnicate"], "unrecognized subcommand");
    argument_refused(&[], "no command given");
    argument_refused(&["check"], "SCENARIO");
}

#[test]
fn help_and_version_still_exit_0() {
    let help = stdout(&["cycle", "--help"]);
    // `cycle --format` offers csv, and says so.
    assert!(help.contains("table, json or csv"), "{help}");
    assert!(stdout(&["--version"]).starts_with("brayfin "));
    assert!(stdout(&["--help"]).contains("sweep"));
}

/// `cycle --format csv` as (item, quantity) → (value, unit).
fn cycle_csv(units: &str) -> HashMap<(String, String), (f64, String)> {
    let text = stdout(&[
        "cycle",
        "--pressure-ratio",
        "12",
        "--turbine-inlet-temperature",
        "1500 K",
        "--compressor-efficiency",
        "0.86",
        "--turbine-efficiency",
        "0.9",
        "--gas",
        "products",
        "--net-output",
        "40 MW",
        "--format",
        "csv",
        "--units",
        units,
    ]);
    let mut reader = csv::Reader::from_reader(text.as_bytes());
    let mut rows = HashMap::new();
    for record in reader.records() {
        let r = match record {
            Ok(r) => r,
            Err(e) => panic!("CSV: {e}"),
        };
        let value = r[2].parse::<f64>().unwrap_or(f64::NAN);
        rows.insert(
            (r[0].to_string(), r[1].to_string()),
            (value, r[3].to_string()),
        );
    }
    rows
}

#[test]
fn cycle_prints_us_customary_units_by_their_definitions() {
    let si = cycle_csv("si");
    let us = cycle_csv("us");
    let get = |m: &HashMap<(String, String), (f64, String)>, item: &str, q: &str| {
        m.get(&(item.to_string(), q.to_string()))
            .cloned()
            .unwrap_or_else(|| panic!("no row {item} / {q}"))
    };
    let close = |a: f64, b: f64, what: &str| {
        assert!(
            (a - b).abs() <= 1e-9 * b.abs().max(1.0),
            "{what}: {a} vs {b}"
        );
    };
    for state in ["state 1", "state 3", "state 4"] {
        let (t_k, unit) = get(&si, state, "temperature");
        assert_eq!(unit, "K");
        let (t_f, unit) = get(&us, state, "temperature");
        assert_eq!(unit, "°F");
        close(t_f, t_k * 1.8 - 459.67, "temperature");
        let (p_kpa, _) = get(&si, state, "pressure");
        let (p_psia, unit) = get(&us, state, "pressure");
        assert_eq!(unit, "psia");
        // NIST quotes 1 psi = 6.894 757 kPa (7 significant figures).
        assert!(
            (p_psia * 6.894_757 - p_kpa).abs() <= 1e-6 * p_kpa,
            "pressure: {p_psia} psia vs {p_kpa} kPa"
        );
        let (h_si, _) = get(&si, state, "enthalpy");
        let (h_us, unit) = get(&us, state, "enthalpy");
        assert_eq!(unit, "Btu/lb");
        close(h_us * 2.326, h_si, "enthalpy");
        let (s_si, unit) = get(&si, state, "entropy");
        assert_eq!(unit, "kJ/(kg·K)");
        let (s_us, unit) = get(&us, state, "entropy");
        assert_eq!(unit, "Btu/(lb·°R)");
        close(s_us * 4.1868, s_si, "entropy");
    }
    // 59 °F at the compressor inlet: 288.15 K by the scale's definition.
    assert!((get(&us, "state 1", "temperature").0 - 59.0).abs() < 1e-9);
    // Fuel flow by the hour in lb, and as fuel energy in MMBtu/h.
    let (fuel_kg_s, unit) = get(&si, "cycle", "Fuel flow");
    assert_eq!(unit, "kg/s");
    let (fuel_lb_h, unit) = get(&us, "cycle", "Fuel flow");
    assert_eq!(unit, "lb/h");
    // Printed to 4 decimals (SI) and 1 decimal (US): compare to 0.1 %.
    let expected = fuel_kg_s * 3600.0 / 0.453_592_37;
    assert!(
        (fuel_lb_h - expected).abs() < 1e-3 * expected,
        "{fuel_lb_h}"
    );
    let (mw, unit) = get(&si, "cycle", "Fuel energy flow (LHV)");
    assert_eq!(unit, "MW");
    let (mmbtu_h, unit) = get(&us, "cycle", "Fuel energy flow (LHV)");
    assert_eq!(unit, "MMBtu/h");
    // 1 MW = 3600 MJ/h = 3.6 GJ/h = 3.412 MMBtu/h; both printed to 0.01.
    assert!((mmbtu_h - mw * 3.6 / 1.055056).abs() < 0.05, "{mmbtu_h}");
    let (work_us, unit) = get(&us, "cycle", "Net work (shaft)");
    assert_eq!(unit, "Btu/lb air");
    let (work_si, _) = get(&si, "cycle", "Net work (shaft)");
    assert!((work_us * 2.326 - work_si).abs() < 0.02, "{work_us}");
    // The back-work ratio prints as a percentage in both systems.
    assert_eq!(get(&si, "cycle", "Back-work ratio").1, "%");
    assert_eq!(
        get(&si, "cycle", "Back-work ratio").0,
        get(&us, "cycle", "Back-work ratio").0
    );
}

#[test]
fn cycle_table_in_us_units_names_every_unit() {
    let text = stdout(&[
        "cycle",
        "--pressure-ratio",
        "10",
        "--turbine-inlet-temperature",
        "1400",
        "--net-output",
        "40 MW",
        "--units",
        "us",
    ]);
    for unit in [
        "T (°F)",
        "p (psia)",
        "h (Btu/lb)",
        "s (Btu/(lb·°R))",
        "Btu/lb air",
        "lb/h",
        "MMBtu/h",
        "Btu/kWh",
    ] {
        assert!(text.contains(unit), "missing {unit}:\n{text}");
    }
    assert!(!text.contains("kJ/kg"), "an SI unit left in:\n{text}");
    // The back-work ratio is a percentage with one decimal, as in the PDF.
    let line = text
        .lines()
        .find(|l| l.contains("Back-work ratio"))
        .unwrap_or_default();
    let cells: Vec<&str> = line.split('|').map(str::trim).collect();
    assert_eq!(cells.get(2), Some(&"%"), "{line}");
    let value = cells.get(1).unwrap_or(&"");
    assert!(
        value.split_once('.').is_some_and(|(_, d)| d.len() == 1),
        "{line}"
    );
}

#[test]
fn compare_csv_in_us_units_gives_fuel_energy_in_mmbtu() {
    let read = |units: &str| -> Vec<HashMap<String, String>> {
        let text = stdout(&["compare", DEMO, "--format", "csv", "--units", units]);
        let mut reader = csv::Reader::from_reader(text.as_bytes());
        let headers = match reader.headers() {
            Ok(h) => h.clone(),
            Err(e) => panic!("CSV header: {e}"),
        };
        reader
            .records()
            .map(|r| match r {
                Ok(r) => headers
                    .iter()
                    .zip(r.iter())
                    .map(|(h, v)| (h.to_string(), v.to_string()))
                    .collect(),
                Err(e) => panic!("CSV: {e}"),
            })
            .collect()
    };
    let si = read("si");
    let us = read("us");
    assert_eq!(si.len(), us.len());
    assert!(us[0].contains_key("fuel_energy_mmbtu"));
    assert!(!us[0].contains_key("fuel_energy_gj"));
    let mut checked = 0;
    for (a, b) in si.iter().zip(&us) {
        let gj: f64 = a["fuel_energy_gj"].parse().unwrap_or(f64::NAN);
        let mmbtu: f64 = b["fuel_energy_mmbtu"].parse().unwrap_or(f64::NAN);
        assert!(
            (mmbtu * 1.055056 - gj).abs() <= 1e-9 * gj.max(1.0),
            "{gj} GJ vs {mmbtu} MMBtu"
        );
        // Money is the same in both systems.
        assert_eq!(a["fuel_cost"], b["fuel_cost"]);
        checked += usize::from(gj > 0.0);
    }
    assert!(checked > 0, "some year burns fuel");
}

#[test]
fn check_echoes_us_units() {
    let text = stdout(&["check", DEMO, "--units", "us"]);
    // The file says 3.85 USD/MMBtu HHV, 15 °C: printed back as written.
    assert!(text.contains("3.85 USD/MMBtu HHV"), "{text}");
    assert!(text.contains("59.00 °F"), "{text}");
    assert!(text.contains("psia"), "{text}");
    assert!(text.contains("TIT °F"), "{text}");
    let si = stdout(&["check", DEMO]);
    // SI readers get the per-GJ value beside it: 3.85 / 1.055056.
    assert!(si.contains("3.85 USD/MMBtu HHV (3.6491 USD/GJ)"), "{si}");
    // The HHV/LHV conversion is information, not a warning.
    let (info, warnings) = si.split_once("Warnings").expect("a warnings line");
    assert!(info.contains("Information:"), "{si}");
    assert!(info.contains("HHV/LHV ratio"), "{si}");
    assert!(!warnings.contains("HHV/LHV"), "{si}");
    assert!(si.contains("288.15 K"), "{si}");
}

#[test]
fn risk_takes_units_and_says_so() {
    let text = stdout(&["risk", DEMO, "--samples", "50", "--units", "us"]);
    assert!(text.contains("US customary units asked"), "{text}");
    let json: Value = match serde_json::from_str(&stdout(&[
        "risk",
        DEMO,
        "--samples",
        "50",
        "--units",
        "us",
        "--format",
        "json",
    ])) {
        Ok(v) => v,
        Err(e) => panic!("risk JSON: {e}"),
    };
    assert_eq!(json["samples"], 50);
}

#[test]
fn report_refuses_an_output_that_is_not_a_pdf() {
    let dir = match tempfile::tempdir() {
        Ok(d) => d,
        Err(e) => panic!("temporary folder: {e}"),
    };
    for name in ["briefing.txt", "briefing"] {
        let path = dir.path().join(name);
        let path_text = path.to_string_lossy().to_string();
        let output = brayfin(&["report", DEMO, "--samples", "0", "-o", &path_text]);
        assert_eq!(output.status.code(), Some(1), "{name}");
        let message = String::from_utf8_lossy(&output.stderr);
        assert!(message.contains("ending in .pdf"), "{message}");
        assert!(!path.exists(), "{name} must not be written");
    }
    let listed: Vec<_> = match std::fs::read_dir(dir.path()) {
        Ok(entries) => entries.collect(),
        Err(e) => panic!("listing: {e}"),
    };
    assert!(listed.is_empty(), "nothing partial left behind");
}
