//! Every character the demo briefings print exists in the PDF built-in
//! fonts (WinAnsiEncoding, PDF 32000-1:2008 Annex D.2, the encoding the
//! report's Helvetica and Courier use). A character outside it would be
//! substituted by "?" on the page; this test lays out both demo briefings
//! and scans every text mark for such substitutions.

use brayfin::analysis::model::{build_model, ModelOptions};
use brayfin::report::charts::geometry::Mark;
use brayfin::report::model::Units;
use brayfin::report::pdf::fonts::{to_win_ansi, win_ansi_code};
use brayfin::report::pdf::{Paper, PdfRenderer};
use brayfin::report::wording::Wording;
use std::path::Path;

fn texts(scenario: &str, units: Units) -> Vec<String> {
    let loaded = brayfin::scenario::load(Path::new(scenario)).expect("demo scenario loads");
    let model = build_model(
        &loaded,
        &ModelOptions {
            units,
            sensitivity: true,
        },
    )
    .expect("demo evaluates");
    let renderer = PdfRenderer {
        paper: Paper::A4,
        wording: Wording::builtin().expect("templates load"),
    };
    let pages = renderer.layout(&model).expect("layout");
    pages
        .iter()
        .flat_map(|p| p.marks.iter())
        .filter_map(|m| match m {
            Mark::Label { text, .. } => Some(text.clone()),
            _ => None,
        })
        .collect()
}

#[test]
fn no_character_of_the_demo_briefings_is_substituted() {
    let mut scanned = 0;
    for scenario in [
        "tests/fixtures/corvel-bay-blocks.toml",
        "scenarios/kestrel-point-retrofit.toml",
    ] {
        for units in [Units::Si, Units::Us] {
            for text in texts(scenario, units) {
                let shown = to_win_ansi(&text);
                // The demos contain no question mark of their own, so any
                // on the page is a substitution.
                assert!(
                    !shown.contains('?'),
                    "{scenario}: {text:?} prints as {shown:?}"
                );
                assert!(
                    shown.chars().all(|c| win_ansi_code(c).is_some()),
                    "{scenario}: {shown:?} has a character outside WinAnsi"
                );
                scanned += shown.len();
            }
        }
    }
    assert!(scanned > 10_000, "only {scanned} characters scanned");
}
