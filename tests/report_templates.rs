//! Report wording from templates: overrides file by file, and clear errors
//! for an unknown value, an unknown template, a missing heading key and a
//! syntax error. The model is the invented rendering fixture.

mod report_support;

use brayfin::report::pdf::{Paper, PdfRenderer};
use brayfin::report::wording::Wording;
use brayfin::report::Renderer;
use brayfin::Error;
use std::path::Path;

fn render_with(dir: &Path) -> brayfin::Result<Vec<u8>> {
    let renderer = PdfRenderer {
        paper: Paper::A4,
        wording: Wording::with_overrides(dir)?,
    };
    renderer.render(&report_support::model(false, false))
}

fn input_message(result: brayfin::Result<Vec<u8>>) -> String {
    match result {
        Err(Error::Input(message)) => message,
        Err(other) => panic!("expected a bad-input error, got {other}"),
        Ok(_) => panic!("expected an error, the report rendered"),
    }
}

#[test]
fn an_unknown_value_names_the_template_the_line_and_the_name() {
    let dir = tempfile::tempdir().expect("temp dir");
    std::fs::write(
        dir.path().join("decision.j2"),
        "Choose {{ decision.preferred_label }}.\n{{ decision.no_such_value }}\n",
    )
    .expect("template written");
    let message = input_message(render_with(dir.path()));
    assert!(message.contains("decision.j2"), "{message}");
    assert!(message.contains("line 2"), "{message}");
    assert!(message.contains("decision.no_such_value"), "{message}");
}

#[test]
fn an_unknown_top_level_name_is_named_too() {
    let dir = tempfile::tempdir().expect("temp dir");
    std::fs::write(
        dir.path().join("footer.j2"),
        "page {{ page }} of {{ total_pages }}\n",
    )
    .expect("template written");
    let message = input_message(render_with(dir.path()));
    assert!(
        message.contains("footer.j2") && message.contains("line 1"),
        "{message}"
    );
    assert!(message.contains("total_pages"), "{message}");
}

#[test]
fn a_template_file_the_report_does_not_use_is_refused_with_the_valid_names() {
    let dir = tempfile::tempdir().expect("temp dir");
    std::fs::write(dir.path().join("caution.j2"), "- typo in the file name\n")
        .expect("template written");
    let message = match Wording::with_overrides(dir.path()) {
        Err(Error::Input(m)) => m,
        other => panic!("expected a bad-input error, got {other:?}"),
    };
    assert!(
        message.contains("caution.j2") && message.contains("cautions.j2"),
        "{message}"
    );
}

#[test]
fn a_missing_heading_key_is_named() {
    let dir = tempfile::tempdir().expect("temp dir");
    let builtin = include_str!("../templates/report/headings.j2");
    let without: String = builtin
        .lines()
        .filter(|l| !l.starts_with("cautions:"))
        .map(|l| format!("{l}\n"))
        .collect();
    std::fs::write(dir.path().join("headings.j2"), without).expect("template written");
    let message = input_message(render_with(dir.path()));
    assert!(
        message.contains("headings.j2") && message.contains("`cautions`"),
        "{message}"
    );
}

#[test]
fn a_syntax_error_names_the_template_and_line() {
    let dir = tempfile::tempdir().expect("temp dir");
    std::fs::write(
        dir.path().join("method.j2"),
        "Fine.\n\n{% if method.timing %}\nno end\n",
    )
    .expect("template written");
    let message = match Wording::with_overrides(dir.path()) {
        Err(Error::Input(m)) => m,
        other => panic!("expected a bad-input error, got {other:?}"),
    };
    assert!(
        message.contains("method.j2") && message.contains("line"),
        "{message}"
    );
}

#[test]
fn an_override_replaces_only_its_own_template() {
    let dir = tempfile::tempdir().expect("temp dir");
    std::fs::write(
        dir.path().join("cautions.j2"),
        "- House rule: every figure here is checked by the plant owner's engineer.\n",
    )
    .expect("template written");
    let bytes = render_with(dir.path()).expect("renders");
    let doc = lopdf::Document::load_mem(&bytes).expect("PDF");
    let pages: Vec<u32> = doc.get_pages().keys().copied().collect();
    let text = doc.extract_text(&pages).expect("text");
    assert!(text.contains("House rule"), "the override is used");
    assert!(
        !text.contains("screening-level estimate"),
        "the built-in cautions are replaced"
    );
    assert!(
        text.contains("NIST Handbook 135"),
        "other templates stay built in"
    );
}
