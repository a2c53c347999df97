//! The bad-input corpus: every file in `tests/bad_inputs/` is a broken
//! scenario. Its first comment lines say what the loader must report:
//! `# expect: <substring>`, `# field: <dotted key>`, optionally
//! `# line: <n>` (the line the error must point at). Files marked
//! `# stage: solve` break the physics, not the file: the loader must accept
//! them (the cycle solver refuses them later).

use brayfin::scenario;
use std::path::{Path, PathBuf};

struct Case {
    path: PathBuf,
    label: String,
    text: String,
    expect: String,
    field: Option<String>,
    line: Option<usize>,
    solve_stage: bool,
}

fn header(text: &str, name: &str) -> Option<String> {
    text.lines()
        .take_while(|l| l.starts_with('#'))
        .find_map(|l| l.strip_prefix(&format!("# {name}: ")))
        .map(str::to_string)
}

fn cases() -> Vec<Case> {
    let folder = Path::new("tests/bad_inputs");
    let mut paths: Vec<PathBuf> = std::fs::read_dir(folder)
        .map(|entries| {
            entries
                .filter_map(|e| e.ok().map(|e| e.path()))
                .filter(|p| p.extension().is_some_and(|x| x == "toml"))
                .collect()
        })
        .unwrap_or_default();
    paths.sort();
    paths
        .into_iter()
        .map(|path| {
            let text = std::fs::read_to_string(&path).unwrap_or_default();
            let label = path.display().to_string().replace('\\', "/");
            Case {
                expect: header(&text, "expect").unwrap_or_default(),
                field: header(&text, "field"),
                line: header(&text, "line").and_then(|l| l.parse().ok()),
                solve_stage: header(&text, "stage").as_deref() == Some("solve"),
                path,
                label,
                text,
            }
        })
        .collect()
}

#[test]
fn corpus_has_at_least_25_loader_cases_and_some_solve_cases() {
    let all = cases();
    let loader = all.iter().filter(|c| !c.solve_stage).count();
    let solve = all.len() - loader;
    assert!(loader >= 25, "only {loader} loader cases");
    assert!((2..=5).contains(&solve), "{solve} solve-stage cases");
    for case in &all {
        assert!(!case.expect.is_empty(), "{}: no # expect line", case.label);
        assert!(
            case.solve_stage || case.field.is_some(),
            "{}: no # field line",
            case.label
        );
    }
}

#[test]
fn every_loader_case_fails_with_place_field_and_reason() {
    let mut failures = Vec::new();
    for case in cases().iter().filter(|c| !c.solve_stage) {
        let outcome = std::panic::catch_unwind(|| scenario::parse(&case.text, &case.label));
        let message = match outcome {
            Err(_) => {
                failures.push(format!("{}: the loader panicked", case.label));
                continue;
            }
            Ok(Ok(_)) => {
                failures.push(format!("{}: loaded without error", case.label));
                continue;
            }
            Ok(Err(error)) => error.to_string(),
        };
        let field = case.field.clone().unwrap_or_default();
        // <file>:<line>:<column>: <field>: <what is wrong>; <what is valid>
        let prefix = format!("{}:", case.label);
        let rest = message.strip_prefix(&prefix).unwrap_or("");
        let mut parts = rest.splitn(3, ':');
        let line: Option<usize> = parts.next().and_then(|l| l.parse().ok());
        let column: Option<usize> = parts.next().and_then(|c| c.parse().ok());
        let tail = parts.next().unwrap_or("");
        let ok_place = line.is_some_and(|l| l >= 1) && column.is_some_and(|c| c >= 1);
        let ok_line = case.line.is_none() || case.line == line;
        let ok_field = tail.starts_with(&format!(" {field}: "));
        let ok_expect = message.contains(&case.expect);
        let ok_valid = tail.contains("; ");
        let one_line = !message.contains('\n');
        if !(ok_place && ok_line && ok_field && ok_expect && ok_valid && one_line) {
            failures.push(format!(
                "{}: got {message:?}; want line {:?}, field {field:?}, text {:?}",
                case.label, case.line, case.expect
            ));
        }
    }
    assert!(failures.is_empty(), "\n{}", failures.join("\n"));
}

#[test]
fn solve_stage_cases_pass_the_loader() {
    for case in cases().iter().filter(|c| c.solve_stage) {
        let loaded = scenario::load(&case.path);
        assert!(
            loaded.is_ok(),
            "{} must load (its fault is physical): {:?}",
            case.label,
            loaded.err().map(|e| e.to_string())
        );
    }
}
