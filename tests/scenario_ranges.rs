//! The declared sensible ranges: the values the issue found reaching the
//! solver are refused, in a file and on `cycle`'s flags alike, with the
//! field or flag named (exit 1, one line).

use assert_cmd::Command;
use brayfin::scenario::{check_candidate_value, check_flag_value, check_scenario_value};
use predicates::prelude::*;

#[test]
fn nonsense_values_are_outside_the_declared_ranges() {
    // Each pair: a value that parses but makes no physical sense, and a
    // value from a real machine (common practice) that must pass.
    for (key, bad, good) in [
        ("combustion_efficiency", 1e-320, 0.995),
        ("cp_kj_per_kg_k", 1e-320, 1.005),
        ("specific_heat_ratio", 1.000_000_1, 1.4),
        ("net_output", 1e-323, 45_000.0),
        ("pressure_ratio", 1.000_000_000_000_000_2, 18.0),
        ("rating.relative_humidity", 1.5, 0.6),
    ] {
        assert!(check_candidate_value(key, bad).is_err(), "{key} = {bad}");
        assert!(check_candidate_value(key, good).is_ok(), "{key} = {good}");
    }
    for (key, bad, good) in [
        ("economics.inflation", 1e306, 0.025),
        ("site.ambient_pressure", 1e308, 101.325),
        ("site.ambient_temperature", f64::NAN, 288.15),
    ] {
        assert!(check_scenario_value(key, bad).is_err(), "{key} = {bad}");
        assert!(check_scenario_value(key, good).is_ok(), "{key} = {good}");
    }
    assert!(check_flag_value("net-output", 1e308).is_err());
    assert!(check_flag_value("pressure-ratio", 16.0).is_ok());
}

fn cycle(args: &[&str]) -> assert_cmd::assert::Assert {
    Command::cargo_bin("brayfin")
        .expect("the brayfin binary is built for integration tests")
        .arg("cycle")
        .args(args)
        .assert()
}

#[test]
fn cycle_flags_share_the_ranges() {
    cycle(&[
        "--pressure-ratio",
        "1.0000000000000002",
        "--gas",
        "cold-air",
        "--turbine-inlet-temperature",
        "1400 K",
    ])
    .code(1)
    .stderr(predicate::str::contains("--pressure-ratio"))
    .stderr(predicate::str::contains("expected 1.5 to 80"));
    cycle(&[
        "--pressure-ratio",
        "16",
        "--turbine-inlet-temperature",
        "1400 K",
        "--net-output",
        "1e308 kW",
    ])
    .code(1)
    .stderr(predicate::str::contains("--net-output: 1e308 kW is above"));
}

#[test]
fn a_file_that_is_not_utf8_is_refused_with_its_place() {
    let folder = tempfile::tempdir().expect("a temporary folder");
    let path = folder.path().join("latin1.toml");
    std::fs::write(&path, b"[scenario]\ntitle = \"caf\xE9\"\n").expect("written");
    Command::cargo_bin("brayfin")
        .expect("the brayfin binary is built for integration tests")
        .arg("check")
        .arg(&path)
        .assert()
        .code(1)
        .stderr(predicate::str::contains(
            "latin1.toml:2:13: file encoding: byte 23 (0xE9)",
        ));
}
