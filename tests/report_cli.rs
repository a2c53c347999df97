//! `brayfin report` end to end on a demo scenario: the file is written
//! where asked, the printed page count is the PDF's, the last page carries
//! the SHA-256 of the scenario bytes (computed here independently), and the
//! scenario itself can never be the output.

use assert_cmd::Command;
use sha2::{Digest, Sha256};
use std::path::Path;

const SCENARIO: &str = "tests/fixtures/corvel-bay-blocks.toml";

#[test]
fn report_writes_the_pdf_and_prints_its_path_and_page_count() {
    let dir = tempfile::tempdir().expect("temp dir");
    let output = dir.path().join("briefing.pdf");
    let assert = Command::cargo_bin("brayfin")
        .expect("binary")
        .args(["report", SCENARIO, "-o"])
        .arg(&output)
        .assert()
        .success();
    let stdout = String::from_utf8_lossy(&assert.get_output().stdout).into_owned();
    let doc = lopdf::Document::load(&output).expect("a readable PDF");
    let pages = doc.get_pages().len();
    assert_eq!(
        stdout.trim(),
        format!("wrote {} ({pages} pages)", output.display())
    );
    let bytes = std::fs::read(Path::new(SCENARIO)).expect("scenario readable");
    let sha: String = Sha256::digest(&bytes)
        .iter()
        .map(|b| format!("{b:02x}"))
        .collect();
    let last = doc.extract_text(&[pages as u32]).expect("text");
    assert!(
        last.contains(&sha),
        "the scenario's SHA-256 is on the last page"
    );
}

#[test]
fn report_refuses_to_write_over_the_scenario() {
    Command::cargo_bin("brayfin")
        .expect("binary")
        .args(["report", SCENARIO, "-o", SCENARIO])
        .assert()
        .code(1);
}
