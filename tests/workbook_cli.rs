//! `brayfin workbook` at the command line: where it writes, what it
//! refuses (exit 1, nothing written), and the sheets it writes.

mod workbook_support;

use assert_cmd::Command;
use calamine::{Reader, Xlsx};
use std::path::Path;

fn brayfin() -> Command {
    Command::cargo_bin("brayfin").expect("binary")
}

/// The demo copied into `dir` under `name`.
fn demo_in(dir: &Path, name: &str) -> std::path::PathBuf {
    let path = dir.join(name);
    std::fs::copy(workbook_support::DEMOS[0], &path).expect("demo copied");
    path
}

fn files_in(dir: &Path) -> Vec<String> {
    let mut names: Vec<String> = std::fs::read_dir(dir)
        .expect("folder")
        .map(|e| e.expect("entry").file_name().to_string_lossy().into_owned())
        .collect();
    names.sort();
    names
}

#[test]
fn the_default_output_is_next_to_the_scenario_with_every_sheet() {
    let dir = tempfile::tempdir().expect("temp dir");
    let scenario = demo_in(dir.path(), "plant.toml");
    brayfin()
        .arg("workbook")
        .arg(&scenario)
        .assert()
        .success()
        .stdout(predicates::str::contains("plant.xlsx"));
    assert_eq!(files_in(dir.path()), ["plant.toml", "plant.xlsx"]);
    let book: Xlsx<_> = calamine::open_workbook(dir.path().join("plant.xlsx")).expect("opens");
    assert_eq!(
        book.sheet_names(),
        [
            "Inputs",
            "Ledger standard",
            "Ledger premium",
            "Ledger regenerated",
            "Summary"
        ]
    );
}

#[test]
fn an_output_that_is_not_xlsx_is_refused() {
    let dir = tempfile::tempdir().expect("temp dir");
    let scenario = demo_in(dir.path(), "plant.toml");
    brayfin()
        .arg("workbook")
        .arg(&scenario)
        .arg("-o")
        .arg(dir.path().join("plant.csv"))
        .assert()
        .code(1)
        .stderr(predicates::str::contains(".xlsx"));
    assert_eq!(files_in(dir.path()), ["plant.toml"]);
}

#[test]
fn the_scenario_is_never_written_over() {
    let dir = tempfile::tempdir().expect("temp dir");
    let scenario = demo_in(dir.path(), "plant.xlsx");
    let before = std::fs::read(&scenario).expect("read");
    brayfin()
        .arg("workbook")
        .arg(&scenario)
        .assert()
        .code(1)
        .stderr(predicates::str::contains("scenario file itself"));
    assert_eq!(std::fs::read(&scenario).expect("read"), before);
    assert_eq!(files_in(dir.path()), ["plant.xlsx"]);
}

#[test]
fn a_bad_scenario_is_refused_with_its_place_and_nothing_is_written() {
    let dir = tempfile::tempdir().expect("temp dir");
    let scenario = dir.path().join("broken.toml");
    let text = std::fs::read_to_string(workbook_support::DEMOS[0]).expect("demo");
    std::fs::write(
        &scenario,
        text.replace("discount_rate = \"6.5 %\"", "discount_rate = \"six\""),
    )
    .expect("written");
    brayfin()
        .arg("workbook")
        .arg(&scenario)
        .assert()
        .code(1)
        .stderr(predicates::str::contains("broken.toml:"))
        .stderr(predicates::str::contains("discount_rate"));
    assert_eq!(files_in(dir.path()), ["broken.toml"]);
}

#[test]
fn an_unwritable_output_is_an_io_error() {
    let dir = tempfile::tempdir().expect("temp dir");
    let scenario = demo_in(dir.path(), "plant.toml");
    brayfin()
        .arg("workbook")
        .arg(&scenario)
        .arg("-o")
        .arg(dir.path().join("no-such-folder").join("plant.xlsx"))
        .assert()
        .code(2);
    assert_eq!(files_in(dir.path()), ["plant.toml"]);
}
