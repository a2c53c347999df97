//! Regression tests for files `risk` used to mishandle (found by mutating
//! the demo): money near the decimal limit, an enormous spread of results,
//! an unsolvable draw reported without a location, and nonsense nominal
//! rates. Each is refused with exit code 1 before sampling, with the same
//! message as `compare`, or located at its `[[uncertainty]]` entry. Also:
//! one default sample count for `risk` and `report`.

use assert_cmd::Command;
use brayfin::analysis::risk::DEFAULT_SAMPLES;
use clap::Parser;

const DEMO: &str = include_str!("fixtures/corvel-bay-blocks.toml");

fn brayfin(args: &[&str]) -> std::process::Output {
    let mut command = match Command::cargo_bin("brayfin") {
        Ok(c) => c,
        Err(e) => panic!("brayfin must build: {e}"),
    };
    match command.args(args).output() {
        Ok(o) => o,
        Err(e) => panic!("brayfin must run: {e}"),
    }
}

/// The demo with `from` replaced by `to` (exactly once), written to a
/// temporary folder as `name`.
fn edited(dir: &tempfile::TempDir, name: &str, edits: &[(&str, &str)]) -> String {
    let mut text = DEMO.to_string();
    for (from, to) in edits {
        assert_eq!(text.matches(from).count(), 1, "`{from}` must occur once");
        text = text.replacen(from, to, 1);
    }
    let path = dir.path().join(name);
    if let Err(e) = std::fs::write(&path, text) {
        panic!("writing {name}: {e}");
    }
    path.to_string_lossy().to_string()
}

fn temp() -> tempfile::TempDir {
    match tempfile::tempdir() {
        Ok(d) => d,
        Err(e) => panic!("temporary folder: {e}"),
    }
}

/// `risk` and `compare` both refuse `path` with exit code 1, nothing on
/// stdout, the same message, which contains `expected`.
fn refused_like_compare(path: &str, expected: &str) {
    let compare = brayfin(&["compare", path]);
    for format in ["table", "json", "csv"] {
        let risk = brayfin(&["risk", path, "--samples", "200", "--format", format]);
        assert_eq!(risk.status.code(), Some(1), "risk --format {format}");
        assert!(risk.stdout.is_empty(), "risk --format {format} printed");
        assert_eq!(risk.stderr, compare.stderr, "risk --format {format}");
    }
    assert_eq!(compare.status.code(), Some(1));
    let message = String::from_utf8_lossy(&compare.stderr);
    assert!(message.contains(expected), "{message}");
}

#[test]
fn overhaul_cost_near_the_decimal_limit_is_refused_like_compare() {
    // Was: a panic "Addition overflowed" in table format, and in JSON
    // mean = p10 = p50 = 0 with p90 = −7.9e28.
    let dir = temp();
    let path = edited(
        &dir,
        "huge-overhaul.toml",
        &[(
            "overhaul_cost = \"4300000 USD\"",
            "overhaul_cost = \"79000000000000000000000000000 USD\"",
        )],
    );
    refused_like_compare(&path, "candidate[premium].costs.overhaul_cost");
}

#[test]
fn enormous_variable_om_is_refused_like_compare() {
    // Was: SIGABRT allocating 2e14 bytes for the histogram (the bin count
    // is now bounded too: see `analysis::risk::statistics`).
    let dir = temp();
    let path = edited(
        &dir,
        "huge-variable-om.toml",
        &[(
            "variable_om = \"4.2 USD/MWh\"",
            "variable_om = \"1e21 USD/MWh\"",
        )],
    );
    refused_like_compare(&path, "candidate[standard].costs.variable_om");
}

#[test]
fn nonsense_nominal_rates_are_refused_at_load() {
    // Was: every statistic 0.00 with a probability of 1.0. Discount 0 %,
    // inflation −99 %, escalation 1000 % on a nominal basis.
    let dir = temp();
    let path = edited(
        &dir,
        "nonsense-nominal.toml",
        &[
            ("discount_rate = \"6.5 %\"", "discount_rate = \"0 %\""),
            ("rate_basis = \"real\"", "rate_basis = \"nominal\""),
            ("inflation = \"2.5 %\"", "inflation = \"-99 %\""),
        ],
    );
    refused_like_compare(&path, "economics.inflation");
    let escalation = edited(
        &dir,
        "nonsense-escalation.toml",
        &[
            ("rate_basis = \"real\"", "rate_basis = \"nominal\""),
            ("escalation = \"0.8 %\"\n", "escalation = \"1000 %\"\n"),
        ],
    );
    refused_like_compare(&escalation, "fuel.escalation");
}

#[test]
fn an_unsolvable_draw_names_its_entry_by_line_column_and_key() {
    // Was: "sample 0: no valid draw in 100 tries" with no location. A
    // turbine inlet temperature of 300 K is in its key's range but below
    // the compressor exit, so no draw can be solved.
    let entry = "\n[[uncertainty]]\nkey = \"candidate[premium].turbine_inlet_temperature\"\n\
                 distribution = \"uniform\"\nlow = \"300 K\"\nhigh = \"301 K\"\n";
    let mut text = DEMO.to_string();
    text.push_str(entry);
    // Line of the entry's `key`: the lines before it, plus the blank line
    // and the table header.
    let key_line = DEMO.lines().count() + 3;
    let dir = temp();
    let path = dir.path().join("cold-turbine.toml");
    if let Err(e) = std::fs::write(&path, text) {
        panic!("writing: {e}");
    }
    let path = path.to_string_lossy().to_string();
    let output = brayfin(&["risk", &path, "--samples", "20", "--format", "json"]);
    assert_eq!(output.status.code(), Some(1));
    assert!(output.stdout.is_empty());
    let message = String::from_utf8_lossy(&output.stderr);
    let entries = DEMO.matches("[[uncertainty]]").count() + 1;
    let located = format!("cold-turbine.toml:{key_line}:7: uncertainty[{entries}].key:");
    assert!(message.contains(&located), "{located} in {message}");
    assert!(
        message.contains("`candidate[premium].turbine_inlet_temperature`"),
        "{message}"
    );
    assert!(message.contains("no valid draw"), "{message}");
}

#[test]
fn risk_and_report_draw_the_same_default_number_of_samples() {
    let risk = match brayfin::cli::Cli::try_parse_from(["brayfin", "risk", "s.toml"]) {
        Ok(cli) => cli,
        Err(e) => panic!("risk arguments: {e}"),
    };
    let report = match brayfin::cli::Cli::try_parse_from(["brayfin", "report", "s.toml"]) {
        Ok(cli) => cli,
        Err(e) => panic!("report arguments: {e}"),
    };
    let risk_samples = match risk.command {
        brayfin::cli::Command::Risk(a) => a.samples,
        other => panic!("expected risk, got {other:?}"),
    };
    let report_samples = match report.command {
        brayfin::cli::Command::Report(a) => a.samples,
        other => panic!("expected report, got {other:?}"),
    };
    assert_eq!(risk_samples, DEFAULT_SAMPLES);
    assert_eq!(report_samples, DEFAULT_SAMPLES);
}
