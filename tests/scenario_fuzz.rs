//! Fuzzing the loader with mutated scenario text: whatever the bytes, it
//! returns a scenario or one located error, never a panic.

use brayfin::scenario;
use proptest::prelude::*;

const SEEDS: [&str; 2] = [
    include_str!("fixtures/corvel-bay-blocks.toml"),
    include_str!("../scenarios/kestrel-point-retrofit.toml"),
];

/// Fragments that stress the parser and the validators.
const FRAGMENTS: &[&str] = &[
    "=",
    "\"",
    "[",
    "]",
    "[[candidate]]",
    "{",
    "}",
    ",",
    "\n",
    "#",
    "-",
    ".",
    "%",
    " K",
    " kPa",
    " USD",
    "/MMBtu",
    "1e999",
    "-0",
    "nan",
    "inf",
    "0",
    "1.5",
    "é",
    "\u{0}",
    "2025-02-30",
    "'''",
    "\"\"\"",
    "[candidate.regenerator]",
    "id = \"x\"",
];

/// One edit: delete a byte range, insert a fragment, or duplicate a line.
#[derive(Debug, Clone)]
enum Edit {
    Delete { at: usize, len: usize },
    Insert { at: usize, fragment: usize },
    DuplicateLine { line: usize },
    Replace { at: usize, fragment: usize },
}

fn edit_strategy() -> impl Strategy<Value = Edit> {
    prop_oneof![
        (any::<usize>(), 1usize..40).prop_map(|(at, len)| Edit::Delete { at, len }),
        (any::<usize>(), 0..FRAGMENTS.len())
            .prop_map(|(at, fragment)| Edit::Insert { at, fragment }),
        any::<usize>().prop_map(|line| Edit::DuplicateLine { line }),
        (any::<usize>(), 0..FRAGMENTS.len())
            .prop_map(|(at, fragment)| Edit::Replace { at, fragment }),
    ]
}

/// Snap `at` to a char boundary of `text` (mutations stay valid UTF-8, as
/// a `&str` must be; raw bytes are fuzzed through `load` below).
fn boundary(text: &str, at: usize) -> usize {
    let mut i = at % (text.len() + 1);
    while !text.is_char_boundary(i) {
        i -= 1;
    }
    i
}

fn apply(text: &mut String, edit: &Edit) {
    match *edit {
        Edit::Delete { at, len } => {
            let start = boundary(text, at);
            let end = boundary(text, start.saturating_add(len).min(text.len()));
            text.replace_range(start..end.max(start), "");
        }
        Edit::Insert { at, fragment } => {
            let i = boundary(text, at);
            text.insert_str(i, FRAGMENTS[fragment]);
        }
        Edit::DuplicateLine { line } => {
            let lines: Vec<&str> = text.lines().collect();
            if !lines.is_empty() {
                let chosen = lines[line % lines.len()].to_string();
                let i = boundary(text, text.find(&chosen).unwrap_or(0));
                text.insert_str(i, &format!("{chosen}\n"));
            }
        }
        Edit::Replace { at, fragment } => {
            let start = boundary(text, at);
            let end = boundary(
                text,
                start
                    .saturating_add(FRAGMENTS[fragment].len())
                    .min(text.len()),
            );
            text.replace_range(start..end.max(start), FRAGMENTS[fragment]);
        }
    }
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 400, ..ProptestConfig::default() })]

    #[test]
    fn mutated_scenarios_never_panic(seed in 0usize..2, edits in prop::collection::vec(edit_strategy(), 1..6)) {
        let mut text = SEEDS[seed].to_string();
        for edit in &edits {
            apply(&mut text, edit);
        }
        match scenario::parse(&text, "fuzz.toml") {
            Ok(loaded) => {
                // A scenario that loads can be listed and read by key.
                for key in loaded.scenario.numeric_keys() {
                    let _ = loaded.scenario.get_numeric(&key);
                }
            }
            Err(error) => {
                let message = error.to_string();
                prop_assert!(message.starts_with("fuzz.toml:"), "{}", message);
                prop_assert!(!message.contains('\n'), "{}", message);
            }
        }
    }

    #[test]
    fn arbitrary_bytes_through_a_file_never_panic(bytes in prop::collection::vec(any::<u8>(), 0..400)) {
        let folder = tempfile::tempdir();
        prop_assume!(folder.is_ok());
        let folder = folder.map_err(|e| TestCaseError::fail(e.to_string()))?;
        let path = folder.path().join("bytes.toml");
        prop_assume!(std::fs::write(&path, &bytes).is_ok());
        let _ = scenario::load(&path);
    }

    #[test]
    fn set_numeric_never_panics(key_index in any::<usize>(), value in prop_oneof![any::<f64>(), -1.0e6..1.0e6f64]) {
        let loaded = scenario::parse(SEEDS[0], "seed.toml");
        prop_assume!(loaded.is_ok());
        let mut s = loaded.map_err(|e| TestCaseError::fail(e.to_string()))?.scenario;
        let keys = s.numeric_keys();
        let key = keys[key_index % keys.len()].clone();
        let before = s.clone();
        if s.set_numeric(&key, value).is_err() {
            prop_assert_eq!(s, before);
        }
    }
}
