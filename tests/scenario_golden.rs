//! `compare --format json` on both demo scenarios must stay byte-identical
//! to the output captured before the scenario layer was restructured into
//! declared keys (`tests/scenario_golden/*.json`, captured from the code
//! of the commit before the restructuring). A change here means the
//! scenario layer changed a value the analysis sees.
//!
//! To accept an intended change of the analysis (not of the scenario
//! layer), run with `BRAYFIN_WRITE_GOLDEN=1` and review the diff.

use assert_cmd::Command;
use std::path::Path;

fn check(demo: &str) {
    let output = Command::cargo_bin("brayfin")
        .expect("the brayfin binary is built for integration tests")
        .args([
            "compare",
            &format!("scenarios/{demo}.toml"),
            "--format",
            "json",
        ])
        .output()
        .expect("brayfin runs");
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    let golden = Path::new("tests/scenario_golden").join(format!("{demo}.json"));
    if std::env::var_os("BRAYFIN_WRITE_GOLDEN").is_some() {
        std::fs::write(&golden, &output.stdout).expect("golden file written");
        return;
    }
    let expected = std::fs::read(&golden).expect("golden file present");
    assert!(
        output.stdout == expected,
        "compare --format json on {demo} differs from {}",
        golden.display()
    );
}

#[test]
fn corvel_bay_json_is_byte_identical() {
    check("corvel-bay-peaker");
}

#[test]
fn kestrel_point_json_is_byte_identical() {
    check("kestrel-point-retrofit");
}
