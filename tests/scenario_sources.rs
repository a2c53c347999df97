//! The sources a scenario file states for nested inputs (fuel composition,
//! dispatch, part-load table, price path) reach every input line below
//! them, so the assumptions pages print them.

use brayfin::scenario::{self, LoadedScenario};

fn load(path: &str) -> LoadedScenario {
    let text = std::fs::read_to_string(path).expect("demo file");
    scenario::parse(&text, path).expect("demo loads")
}

fn sources_of<'a>(loaded: &'a LoadedScenario, prefix: &str) -> Vec<Option<&'a str>> {
    loaded
        .inputs
        .iter()
        .filter(|i| i.key.starts_with(prefix))
        .map(|i| i.source.as_deref())
        .collect()
}

#[test]
fn composition_and_dispatch_sources_reach_every_nested_input() {
    let loaded = load("tests/fixtures/corvel-bay-blocks.toml");
    // The demo's [fuel] says: composition = "Pipeline tariff gas quality
    // sheet, 2024 average"; its [operation]: dispatch = "Production-cost
    // model run PC-2025-02, mid-merit case".
    let composition = sources_of(&loaded, "fuel.composition");
    assert!(composition.len() >= 2, "{composition:?}");
    assert!(composition
        .iter()
        .all(|s| *s == Some("Pipeline tariff gas quality sheet, 2024 average")));
    let dispatch = sources_of(&loaded, "operation.dispatch");
    assert_eq!(dispatch.len(), 6, "three blocks of load and hours");
    assert!(dispatch
        .iter()
        .all(|s| *s == Some("Production-cost model run PC-2025-02, mid-merit case")));
    // Bid A's vendor curve carries the source its table states; Bid B
    // states none, and none is invented.
    let part_load = sources_of(&loaded, "candidate[standard].part_load");
    assert_eq!(part_load.len(), 8, "four points of load and ratio");
    assert!(part_load
        .iter()
        .all(|s| *s == Some("Bid A performance curves, sheet 3")));
    let bid_b = sources_of(&loaded, "candidate[premium].compressor_efficiency");
    assert_eq!(bid_b, vec![Some("Bid B performance guarantee")]);
    let no_source = sources_of(&loaded, "candidate[premium].pressure_ratio");
    assert!(no_source.iter().all(Option::is_none), "{no_source:?}");
}

#[test]
fn a_named_fuel_and_a_price_path_keep_their_sources() {
    let text = std::fs::read_to_string("tests/fixtures/corvel-bay-blocks.toml").expect("demo");
    let fuel_start = text.find("[fuel]").expect("a [fuel] table");
    let fuel_end = fuel_start
        + text[fuel_start..]
            .find("\n[")
            .expect("a table after [fuel]");
    let fuel = r#"[fuel]
composition = "methane"
price_path = { 2027 = "3.85 USD/MMBtu", 2028 = "3.95 USD/MMBtu" }
price_basis = "hhv"
sources = { composition = "Lab sheet 12", price_path = "Fuel desk view" }
"#;
    let text = format!("{}{fuel}{}", &text[..fuel_start], &text[fuel_end + 1..]);
    let loaded = scenario::parse(&text, "inline.toml").expect("variant loads");
    assert_eq!(
        sources_of(&loaded, "fuel.composition"),
        vec![Some("Lab sheet 12")]
    );
    let path = sources_of(&loaded, "fuel.price_path");
    assert_eq!(path.len(), 2, "{path:?}");
    assert!(path.iter().all(|s| *s == Some("Fuel desk view")));
}

#[test]
fn the_assumptions_pages_print_them() {
    let dir = tempfile::tempdir().expect("temp dir");
    let pdf = dir.path().join("b.pdf");
    let out = assert_cmd::Command::cargo_bin("brayfin")
        .expect("binary")
        .args([
            "report",
            "tests/fixtures/corvel-bay-blocks.toml",
            "--samples",
            "0",
            "-o",
        ])
        .arg(&pdf)
        .output()
        .expect("runs");
    assert!(out.status.success());
    let doc = lopdf::Document::load(&pdf).expect("pdf");
    let pages = doc.get_pages().len() as u32;
    let text = (1..=pages)
        .map(|p| doc.extract_text(&[p]).unwrap_or_default())
        .collect::<Vec<_>>()
        .join(" ")
        .replace('\u{a0}', " ")
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ");
    for source in [
        "Production-cost model run PC-2025-02",
        "Pipeline tariff gas quality sheet",
    ] {
        assert!(text.contains(source), "{source} not in the briefing");
    }
}
