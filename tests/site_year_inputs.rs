//! Bad weather and profile files are located errors (file, line, column,
//! what would be valid) with exit 1, and nothing panics; an hourly profile
//! with energy prices prices the energy shortfall hour by hour.
//!
//! Sources: the exit codes and error form are brayfin's own contract
//! (DEVELOPERS.md); the shortfall price rule is stated in
//! `analysis::evaluate::output_reference_of` and worked by hand below.

use assert_cmd::Command;
use brayfin::analysis::compare::run_study;
use brayfin::analysis::operation::{condition_energy_mwh, conditions};
use std::path::PathBuf;

fn root() -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
}

/// The Kestrel Point demo with `[site]` and `[operation]` replaced.
fn kestrel_with(site: &str, operation: &str) -> String {
    let text = std::fs::read_to_string(root().join("scenarios/kestrel-point-retrofit.toml"))
        .expect("demo readable");
    let site_at = text.find("[site]\n").expect("site section");
    let fuel_at = text.find("[fuel]\n").expect("fuel section");
    let op_at = text.find("[operation]\n").expect("operation section");
    let cand_at = text.find("[[candidate]]").expect("candidates");
    format!(
        "{}[site]\n{site}\n\n{}[operation]\n{operation}\n\n{}",
        &text[..site_at],
        &text[fuel_at..op_at],
        &text[cand_at..]
    )
}

/// `hours` hourly weather rows from 2025-06-01T00:00: 20 degC + 8 K daily
/// swing peaking at 15:00, 55 % humidity.
fn weather_rows(hours: usize) -> String {
    let mut out = String::from("timestamp,dry_bulb_degC,rh_pct\n");
    for i in 0..hours {
        let (day, hour) = (1 + i / 24, i % 24);
        let t = 20.0 + 8.0 * ((hour as f64 - 15.0) / 24.0 * std::f64::consts::TAU).cos();
        out.push_str(&format!("2025-06-{day:02}T{hour:02}:00,{t:.2},55\n"));
    }
    out
}

/// `hours` profile rows from 2025-06-01T00:00: 100 % from 12:00 to 20:00,
/// 60 % at 21:00, off otherwise; price 40 + 5 per hour after noon.
fn profile_rows(hours: usize, prices: bool) -> String {
    let mut out = String::from(if prices {
        "timestamp,load_pct,energy_price_per_MWh\n"
    } else {
        "timestamp,load_pct\n"
    });
    for i in 0..hours {
        let (day, hour) = (1 + i / 24, i % 24);
        let load = match hour {
            12..=20 => 100,
            21 => 60,
            _ => 0,
        };
        let price = 40.0 + 5.0 * (hour as f64 - 12.0).max(0.0);
        if prices {
            out.push_str(&format!("2025-06-{day:02}T{hour:02}:00,{load},{price}\n"));
        } else {
            out.push_str(&format!("2025-06-{day:02}T{hour:02}:00,{load}\n"));
        }
    }
    out
}

/// Write the scenario and files in a temp dir; run `check`.
fn check(files: &[(&str, &str)], scenario: &str) -> (i32, String, tempfile::TempDir) {
    let dir = tempfile::tempdir().expect("temp dir");
    for (name, text) in files {
        std::fs::write(dir.path().join(name), text).expect("file written");
    }
    let path = dir.path().join("year.toml");
    std::fs::write(&path, scenario).expect("scenario written");
    let out = Command::cargo_bin("brayfin")
        .expect("binary")
        .args(["check", path.to_str().expect("utf-8")])
        .output()
        .expect("runs");
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stderr).into_owned(),
        dir,
    )
}

const WEATHER_SITE: &str = "weather = \"w.csv\"";
const PROFILE_OP: &str = "profile = \"p.csv\"";

fn refused(files: &[(&str, &str)], site: &str, op: &str, located: &str, says: &str) {
    let (code, err, _dir) = check(files, &kestrel_with(site, op));
    assert_eq!(code, 1, "exit 1 expected; stderr: {err}");
    assert!(err.contains(located), "expected {located:?} in: {err}");
    assert!(err.contains(says), "expected {says:?} in: {err}");
    assert!(!err.contains("panicked"), "{err}");
}

#[test]
fn a_good_weather_and_profile_pass_check() {
    let (code, err, _dir) = check(
        &[
            ("w.csv", &weather_rows(48)),
            ("p.csv", &profile_rows(48, false)),
        ],
        &kestrel_with(WEATHER_SITE, PROFILE_OP),
    );
    assert_eq!(code, 0, "{err}");
}

#[test]
fn a_missing_column_is_located_at_the_header() {
    let text = weather_rows(24).replace(",rh_pct", ",humidity");
    refused(
        &[("w.csv", &text)],
        WEATHER_SITE,
        "hours_per_year = \"1000 h\"",
        "w.csv:1:",
        "no `rh_pct` column",
    );
}

#[test]
fn two_temperature_columns_are_refused() {
    let text = weather_rows(3)
        .replace("rh_pct\n", "rh_pct,dry_bulb_degF\n")
        .replace(",55\n", ",55,70\n");
    refused(
        &[("w.csv", &text)],
        WEATHER_SITE,
        "hours_per_year = \"1000 h\"",
        "w.csv:1:4",
        "more than one temperature column",
    );
}

#[test]
fn an_unparsable_value_is_located_at_its_line_and_column() {
    let mut lines: Vec<String> = weather_rows(24).lines().map(str::to_string).collect();
    lines[3] = "2025-06-01T02:00,warm,55".into();
    let text = lines.join("\n") + "\n";
    refused(
        &[("w.csv", &text)],
        WEATHER_SITE,
        "hours_per_year = \"1000 h\"",
        "w.csv:4:2",
        "\"warm\" is not a number",
    );
}

#[test]
fn a_bad_timestamp_and_a_gap_are_located() {
    let mut lines: Vec<String> = weather_rows(24).lines().map(str::to_string).collect();
    lines[5] = lines[5].replacen("2025-06-01T04:00", "June 1st", 1);
    refused(
        &[("w.csv", &(lines.join("\n") + "\n"))],
        WEATHER_SITE,
        "hours_per_year = \"1000 h\"",
        "w.csv:6:1",
        "not a timestamp",
    );
    let mut lines: Vec<String> = weather_rows(24).lines().map(str::to_string).collect();
    lines.remove(7);
    refused(
        &[("w.csv", &(lines.join("\n") + "\n"))],
        WEATHER_SITE,
        "hours_per_year = \"1000 h\"",
        "w.csv:8:1",
        "by one hour",
    );
}

#[test]
fn a_malformed_row_is_located() {
    let mut lines: Vec<String> = weather_rows(24).lines().map(str::to_string).collect();
    lines[4].push_str(",7");
    refused(
        &[("w.csv", &(lines.join("\n") + "\n"))],
        WEATHER_SITE,
        "hours_per_year = \"1000 h\"",
        "w.csv:5:",
        "the row has 4 fields, the header 3",
    );
}

#[test]
fn out_of_range_values_are_refused() {
    let text = weather_rows(24).replacen(",55\n", ",140\n", 1);
    refused(
        &[("w.csv", &text)],
        WEATHER_SITE,
        "hours_per_year = \"1000 h\"",
        "w.csv:2:3",
        "not a relative humidity",
    );
    let profile = profile_rows(24, false).replacen("T12:00,100", "T12:00,130", 1);
    refused(
        &[("w.csv", &weather_rows(24)), ("p.csv", &profile)],
        WEATHER_SITE,
        PROFILE_OP,
        "p.csv:14:2",
        "not a load",
    );
}

#[test]
fn a_profile_longer_than_the_weather_is_refused_at_its_first_hour_without_weather() {
    refused(
        &[
            ("w.csv", &weather_rows(48)),
            ("p.csv", &profile_rows(72, false)),
        ],
        WEATHER_SITE,
        PROFILE_OP,
        "p.csv:50:1",
        "this hour has no weather",
    );
}

#[test]
fn a_profile_cannot_go_with_bins_or_dispatch_and_a_missing_file_is_located() {
    refused(
        &[("p.csv", &profile_rows(24, false))],
        "weather = [{ temperature = \"10 degC\", hours = 8760 }]",
        PROFILE_OP,
        "year.toml:",
        "cannot be aligned with weather bins",
    );
    refused(
        &[("p.csv", &profile_rows(24, false))],
        "",
        "profile = \"p.csv\"\ndispatch = [{ load = \"100 %\", hours = 10 }]",
        "operation.dispatch",
        "together with profile",
    );
    refused(
        &[],
        WEATHER_SITE,
        "hours_per_year = \"1000 h\"",
        "site.weather",
        "cannot read w.csv",
    );
}

/// Two days: the profile's 20 run hours a day count 8760 / 48 h each; the
/// energy shortfall of each candidate against the one that makes the most
/// is priced at the hours' prices weighted by its shortfall in each hour.
#[test]
fn an_hourly_profile_scales_to_a_year_and_prices_the_shortfall_by_the_hour() {
    let dir = tempfile::tempdir().expect("temp dir");
    std::fs::write(dir.path().join("w.csv"), weather_rows(48)).expect("w");
    std::fs::write(dir.path().join("p.csv"), profile_rows(48, true)).expect("p");
    let text = kestrel_with(WEATHER_SITE, PROFILE_OP);
    let loaded = brayfin::scenario::parse_in(&text, "year.toml", Some(dir.path()))
        .unwrap_or_else(|e| panic!("{e}"));
    let scenario = &loaded.scenario;
    // 10 run hours a day (12:00–21:00) × 2 days = 20 rows of 8760 / 48 h.
    let run = 20.0 * 8760.0 / 48.0;
    assert!((scenario.operation.hours_per_year - run).abs() < 1e-9);
    let study = run_study(&loaded).expect("study");
    let conds = conditions(scenario);
    let energies: Vec<Vec<f64>> = study
        .outcomes
        .iter()
        .map(|o| condition_energy_mwh(&conds, &o.solved.site.points))
        .collect();
    let totals: Vec<f64> = energies.iter().map(|e| e.iter().sum()).collect();
    let top = (0..totals.len())
        .max_by(|&a, &b| totals[a].total_cmp(&totals[b]))
        .expect("candidates");
    for (i, o) in study.outcomes.iter().enumerate() {
        assert!((o.solved.year.operating_hours - run).abs() < 1e-9);
        let bought_in = &o.inputs.bought_in;
        if i == top {
            assert_eq!(bought_in.energy_mwh_per_year, 0.0);
            continue;
        }
        let (mut short, mut value) = (0.0, 0.0);
        for ((c, r), e) in conds.iter().zip(&energies[top]).zip(&energies[i]) {
            let gap = (r - e).max(0.0);
            short += gap;
            value += gap * c.energy_price_per_mwh.expect("priced");
        }
        let expected = value / short;
        let price: f64 = bought_in
            .energy_price
            .price
            .to_string()
            .parse()
            .expect("price");
        assert!((price - expected).abs() < 1e-5, "{price} vs {expected}");
        // Prices run from 40 to 85 per MWh over the run hours.
        assert!((40.0..=85.0).contains(&price));
        assert!((bought_in.energy_mwh_per_year - (totals[top] - totals[i])).abs() < 1e-6);
    }
}

/// A spreadsheet export's byte-order mark before the header is not part of
/// the first column's name.
#[test]
fn a_byte_order_mark_is_not_part_of_the_header() {
    let text = format!("\u{feff}{}", weather_rows(24));
    let (code, err, _dir) = check(
        &[("w.csv", &text)],
        &kestrel_with(WEATHER_SITE, "hours_per_year = \"1000 h\""),
    );
    assert_eq!(code, 0, "{err}");
}
