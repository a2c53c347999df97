//! The `report` command's file handling: default output next to the
//! scenario, refusing to write over the scenario, the atomic write, and the
//! line it prints. The model is the invented rendering fixture.

mod report_support;

use brayfin::app::report::{output_path, summary, wording, write_report};
use brayfin::report::pdf::Paper;
use brayfin::Error;
use std::path::Path;

#[test]
fn the_default_output_is_the_scenario_path_with_pdf() {
    let out = output_path(Path::new("scenarios/corvel.toml"), None).expect("a path");
    assert_eq!(out, Path::new("scenarios/corvel.pdf"));
    let out = output_path(Path::new("s.toml"), Some(Path::new("out/b.pdf"))).expect("a path");
    assert_eq!(out, Path::new("out/b.pdf"));
}

#[test]
fn an_output_equal_to_the_scenario_is_refused() {
    let scenario = Path::new("scenarios/corvel.toml");
    match output_path(scenario, Some(scenario)) {
        Err(Error::Input(m)) => assert!(m.contains("scenario file itself"), "{m}"),
        other => panic!("expected a bad-input error, got {other:?}"),
    }
}

#[test]
fn the_report_is_written_and_never_over_the_scenario() {
    let dir = tempfile::tempdir().expect("temp dir");
    let scenario = dir.path().join("plant.toml");
    std::fs::write(&scenario, "title = \"x\"\n").expect("scenario written");
    let model = report_support::model(false, false);

    let output = dir.path().join("plant.pdf");
    let written = write_report(
        &model,
        Paper::A4,
        wording(None).expect("templates"),
        &output,
        &scenario,
    )
    .expect("written");
    let bytes = std::fs::read(&output).expect("the PDF exists");
    assert!(bytes.starts_with(b"%PDF-"));
    let doc = lopdf::Document::load_mem(&bytes).expect("a readable PDF");
    assert_eq!(doc.get_pages().len(), written.pages);
    assert_eq!(
        summary(&written),
        format!("wrote {} ({} pages)", output.display(), written.pages)
    );
    let leftovers = std::fs::read_dir(dir.path())
        .expect("dir")
        .filter(|e| {
            e.as_ref()
                .map(|e| e.file_name().to_string_lossy().ends_with(".tmp"))
                .unwrap_or(false)
        })
        .count();
    assert_eq!(leftovers, 0, "no temporary file left behind");

    // A different spelling of the same file is still the scenario.
    let same = dir.path().join(".").join("plant.toml");
    let refused = write_report(
        &model,
        Paper::A4,
        wording(None).expect("templates"),
        &same,
        &scenario,
    );
    assert!(matches!(refused, Err(Error::Input(_))));
    assert_eq!(
        std::fs::read_to_string(&scenario).expect("scenario intact"),
        "title = \"x\"\n"
    );
}
