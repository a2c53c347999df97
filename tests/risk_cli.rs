//! `brayfin risk` end to end: identical output with RAYON_NUM_THREADS 1 and
//! 2, the three formats, nothing on stderr when it is not a terminal, and
//! bad input refused with exit code 1.

use assert_cmd::Command;
use serde_json::Value;

const DEMO: &str = "tests/fixtures/corvel-bay-blocks.toml";

fn brayfin(args: &[&str], threads: Option<&str>) -> std::process::Output {
    let mut command = match Command::cargo_bin("brayfin") {
        Ok(c) => c,
        Err(e) => panic!("brayfin must build: {e}"),
    };
    if let Some(n) = threads {
        command.env("RAYON_NUM_THREADS", n);
    }
    match command.args(args).output() {
        Ok(o) => o,
        Err(e) => panic!("brayfin must run: {e}"),
    }
}

#[test]
fn output_is_identical_on_one_and_two_threads() {
    let args = [
        "risk",
        DEMO,
        "--samples",
        "6000",
        "--seed",
        "9",
        "--format",
        "json",
    ];
    let one = brayfin(&args, Some("1"));
    let two = brayfin(&args, Some("2"));
    assert!(one.status.success() && two.status.success());
    assert_eq!(one.stdout, two.stdout);
    // Not a terminal: no progress bar, nothing else on stderr.
    assert!(
        one.stderr.is_empty(),
        "{}",
        String::from_utf8_lossy(&one.stderr)
    );
    let other_seed = brayfin(
        &[
            "risk",
            DEMO,
            "--samples",
            "6000",
            "--seed",
            "10",
            "--format",
            "json",
        ],
        None,
    );
    assert_ne!(one.stdout, other_seed.stdout);
}

#[test]
fn json_has_the_run_and_each_candidate() {
    let output = brayfin(
        &["risk", DEMO, "--samples", "1500", "--format", "json"],
        None,
    );
    assert!(output.status.success());
    let v: Value = match serde_json::from_slice(&output.stdout) {
        Ok(v) => v,
        Err(e) => panic!("JSON: {e}"),
    };
    assert_eq!(v["samples"], 1500);
    assert_eq!(v["seed"], 1);
    assert_eq!(v["scenario"]["baseline"], "standard");
    assert_eq!(v["keys"].as_array().map(Vec::len), Some(7));
    let candidates = v["candidates"].as_array().cloned().unwrap_or_default();
    let ids: Vec<&str> = candidates
        .iter()
        .filter_map(|c| c["candidate_id"].as_str())
        .collect();
    assert_eq!(ids, ["premium", "regenerated"]);
    for c in &candidates {
        let counts: u64 = c["histogram"]["counts"]
            .as_array()
            .map(|a| a.iter().filter_map(Value::as_u64).sum())
            .unwrap_or(0);
        assert_eq!(counts, 1500);
        let chance = c["probability_beats_baseline"].as_f64().unwrap_or(-1.0);
        assert!((0.0..=1.0).contains(&chance));
        // Money as decimal strings with two places.
        let p50 = c["net_savings"]["p50"].as_str().unwrap_or_default();
        assert!(p50.split('.').nth(1).map(str::len) == Some(2), "{p50}");
    }
}

#[test]
fn csv_is_one_row_per_candidate_and_figure() {
    let output = brayfin(&["risk", DEMO, "--samples", "500", "--format", "csv"], None);
    assert!(output.status.success());
    let text = String::from_utf8_lossy(&output.stdout);
    let lines: Vec<&str> = text.lines().collect();
    assert_eq!(
        lines[0],
        "candidate_id,figure,mean,p10,p50,p90,probability_beats_baseline,samples,seed,currency,\
         probability_shortfall,route"
    );
    assert_eq!(lines.len(), 5);
    assert!(lines[1].starts_with("premium,net_savings,"));
    assert!(lines[2].starts_with("premium,break_even_premium,"));
    assert!(lines[4].ends_with(",,500,1,USD,,scaled"));
}

#[test]
fn table_names_the_run_and_draws_histograms() {
    let output = brayfin(&["risk", DEMO, "--samples", "500"], None);
    assert!(output.status.success());
    let text = String::from_utf8_lossy(&output.stdout);
    assert!(text.contains("Monte Carlo: 500 samples, seed 1; baseline standard"));
    assert!(text.contains("Redrawn: none"));
    assert!(text.contains("Net savings of premium against the baseline"));
    assert!(text.contains("chance it beats the baseline"));
}

fn refused(args: &[&str], expected: &str) {
    let output = brayfin(args, None);
    assert_eq!(output.status.code(), Some(1), "{args:?}");
    assert!(output.stdout.is_empty());
    let message = String::from_utf8_lossy(&output.stderr);
    assert!(message.contains(expected), "{args:?}: {message}");
}

#[test]
fn bad_input_is_refused_with_exit_code_1() {
    refused(
        &["risk", DEMO, "--samples", "0"],
        "expected 1 to 10000000 samples",
    );
    refused(
        &["risk", DEMO, "--samples", "10000001"],
        "expected 1 to 10000000 samples",
    );
    // A truncation 350 standard deviations from the mean keeps nothing in
    // double precision: the loader lets it through (the ranges overlap),
    // the sampler refuses it at the entry.
    let text = include_str!("fixtures/corvel-bay-blocks.toml");
    let cut = text.find("[[uncertainty]]").unwrap_or(text.len());
    let edited = format!(
        "{}[[uncertainty]]\nkey = \"candidate[premium].turbine_efficiency\"\n\
         distribution = \"normal\"\nmean = \"91.5 %\"\nsigma = \"0.01 %\"\n\
         truncate = [\"95 %\", \"96 %\"]\n",
        &text[..cut]
    );
    let dir = match tempfile::tempdir() {
        Ok(d) => d,
        Err(e) => panic!("temporary folder: {e}"),
    };
    let path = dir.path().join("far-truncation.toml");
    if let Err(e) = std::fs::write(&path, edited) {
        panic!("writing: {e}");
    }
    let path = path.to_string_lossy().to_string();
    refused(&["risk", &path, "--samples", "10"], "keeps no probability");
    refused(&["risk", &path, "--samples", "10"], "uncertainty[1]");
}
