//! `brayfin check` and `brayfin new` as a user runs them.

use assert_cmd::Command;
use predicates::prelude::*;

fn brayfin() -> Command {
    match Command::cargo_bin("brayfin") {
        Ok(command) => command,
        Err(error) => panic!("binary not built: {error}"),
    }
}

#[test]
fn check_prints_a_summary_and_exits_zero_on_the_demos() {
    for path in [
        "scenarios/corvel-bay-peaker.toml",
        "scenarios/kestrel-point-retrofit.toml",
    ] {
        brayfin()
            .args(["check", path])
            .assert()
            .success()
            .stdout(predicate::str::contains("Candidates"))
            .stdout(predicate::str::contains(": valid;"));
    }
}

#[test]
fn check_informs_about_hhv_pricing_and_warns_about_unusual_efficiencies() {
    // HHV pricing is a routine conversion: an information line.
    brayfin()
        .args(["check", "scenarios/corvel-bay-peaker.toml"])
        .assert()
        .success()
        .stdout(predicate::str::contains("Information:"))
        .stdout(predicate::str::contains(
            "per unit of higher heating value (HHV) and heat rates are on the lower (LHV)",
        ));
    let folder = tempfile::tempdir().map_err(|e| e.to_string());
    let folder = folder
        .as_ref()
        .map(|f| f.path().to_path_buf())
        .unwrap_or_default();
    let path = folder.join("hot.toml");
    let text = include_str!("../templates/retrofit.toml").replace(
        "compressor_efficiency = \"85 %\"          # required",
        "compressor_efficiency = \"95 %\"",
    );
    assert!(std::fs::write(&path, text).is_ok());
    brayfin()
        .arg("check")
        .arg(&path)
        .assert()
        .success()
        .stdout(predicate::str::contains(
            "candidate[as-is].compressor_efficiency: isentropic 95.0 % is above the usual range",
        ));
}

#[test]
fn check_exits_one_with_a_located_message_on_bad_input() {
    brayfin()
        .args(["check", "tests/bad_inputs/efficiency-above-one.toml"])
        .assert()
        .code(1)
        .stdout(predicate::str::is_empty())
        .stderr(predicate::str::contains(
            "tests/bad_inputs/efficiency-above-one.toml:33:25: candidate[standard].compressor_efficiency: 1.3 is above 1",
        ));
}

#[test]
fn new_writes_every_template_and_the_result_checks_clean() {
    let folder = tempfile::tempdir().map_err(|e| e.to_string());
    let folder = folder
        .as_ref()
        .map(|f| f.path().to_path_buf())
        .unwrap_or_default();
    for (name, _) in brayfin::app::new::TEMPLATES {
        let path = folder.join(format!("{name}.toml"));
        brayfin()
            .arg("new")
            .arg(&path)
            .args(["--template", name])
            .assert()
            .success();
        brayfin().arg("check").arg(&path).assert().success();
    }
    // Default template.
    let path = folder.join("default.toml");
    brayfin().arg("new").arg(&path).assert().success();
    let written = std::fs::read_to_string(&path).unwrap_or_default();
    assert_eq!(written, include_str!("../templates/bid-evaluation.toml"));
}

#[test]
fn new_refuses_to_overwrite_and_rejects_unknown_templates() {
    let folder = tempfile::tempdir().map_err(|e| e.to_string());
    let folder = folder
        .as_ref()
        .map(|f| f.path().to_path_buf())
        .unwrap_or_default();
    let path = folder.join("mine.toml");
    assert!(std::fs::write(&path, "my work").is_ok());
    brayfin()
        .arg("new")
        .arg(&path)
        .assert()
        .code(1)
        .stderr(predicate::str::contains("already exists"));
    assert_eq!(
        std::fs::read_to_string(&path).unwrap_or_default(),
        "my work"
    );
    brayfin()
        .arg("new")
        .arg(folder.join("other.toml"))
        .args(["--template", "retrofitt"])
        .assert()
        .code(1)
        .stderr(predicate::str::contains(
            "expected one of bid-evaluation, retrofit",
        ));
    assert!(!folder.join("other.toml").exists());
}
