//! The key tables of `docs/scenario.md` are the key declarations of
//! `src/scenario/` as Markdown: a declared key missing from the docs, or a
//! documented key that is not declared, fails here. Each table sits between
//! `<!-- keys: NAME -->` and `<!-- end keys -->`.
//!
//! `BRAYFIN_WRITE_DOCS=1 cargo test --test scenario_docs` rewrites the
//! tables from the declarations (the generator); review the diff.

use brayfin::scenario::docs_tables;

const DOCS: &str = "docs/scenario.md";
const END: &str = "<!-- end keys -->";

/// The docs with every key table replaced by the generated one; `Err`
/// names a table whose markers are missing.
fn regenerated(docs: &str) -> Result<String, String> {
    let mut text = docs.to_string();
    for (name, table) in docs_tables() {
        let start_marker = format!("<!-- keys: {name} -->");
        let start = text
            .find(&start_marker)
            .ok_or_else(|| format!("{DOCS} has no {start_marker}"))?
            + start_marker.len();
        let end = text[start..]
            .find(END)
            .ok_or_else(|| format!("{DOCS}: {start_marker} has no {END}"))?
            + start;
        text.replace_range(start..end, &format!("\n{table}\n"));
    }
    Ok(text)
}

#[test]
fn docs_key_tables_are_the_declarations() {
    let docs = std::fs::read_to_string(DOCS).unwrap_or_default();
    let fresh = match regenerated(&docs) {
        Ok(fresh) => fresh,
        Err(why) => panic!("{why}"),
    };
    if std::env::var_os("BRAYFIN_WRITE_DOCS").is_some() {
        std::fs::write(DOCS, &fresh).unwrap_or_else(|e| panic!("writing {DOCS}: {e}"));
        return;
    }
    let differing: Vec<(&str, &str)> = docs
        .lines()
        .zip(fresh.lines())
        .filter(|(a, b)| a != b)
        .take(3)
        .collect();
    assert!(
        docs == fresh,
        "{DOCS} key tables disagree with the declarations (first differing lines: {differing:?}); run BRAYFIN_WRITE_DOCS=1 cargo test --test scenario_docs"
    );
}

#[test]
fn every_key_table_in_the_docs_is_generated() {
    let docs = std::fs::read_to_string(DOCS).unwrap_or_default();
    let names: Vec<String> = docs_tables().into_iter().map(|(n, _)| n).collect();
    for marker in docs.split("<!-- keys: ").skip(1) {
        let name = marker.split(" -->").next().unwrap_or_default();
        if name == "TITLE" {
            continue;
        }
        assert!(
            names.iter().any(|n| n == name),
            "{DOCS} has a key table {name:?} that no declaration generates"
        );
    }
}

#[test]
fn every_table_names_keys_and_the_rating_condition_is_documented() {
    let tables = docs_tables();
    let candidate = tables
        .iter()
        .find(|(name, _)| name == "candidate")
        .map(|(_, t)| t.as_str())
        .unwrap_or_default();
    // ISO 3977-2 / ISO 2314 reference conditions (from memory).
    assert!(candidate.contains("| `rating.temperature` | temperature |"));
    assert!(candidate.contains("`288.15 K`"));
    assert!(candidate.contains("`101.325 kPa`"));
    assert!(candidate.contains("`60 %`"));
    for (name, table) in &tables {
        assert!(table.lines().count() > 3, "{name} table is nearly empty");
    }
    assert!(tables.iter().any(|(name, t)| name == "key paths"
        && t.contains("| `candidate.rating.relative_humidity` | fraction |")));
}
