//! Mutating the demo and starter scenarios a few thousand times (fixed
//! seed, so every run checks the same cases) and running each mutant
//! in-process through the loader and, when it loads, through `compare`'s
//! model and its JSON and table renderers.
//!
//! Mutations: a line deleted, duplicated or two lines swapped; a value
//! replaced by an extreme number (0, -1, 1e308, 1e-320, nan, inf), the same
//! extreme with the value's own unit, a wrong-kind or unknown unit, a wrong
//! TOML type, or a huge string.
//!
//! What must hold (what `brayfin compare` promises): no panic; success, or
//! a bad-input error (exit 1, never an internal error, exit 2) that is one
//! line starting `file:line:column: `; and on success no non-finite number
//! in the output.

use brayfin::analysis::{build_model, ModelOptions};
use brayfin::report::json::JsonRenderer;
use brayfin::report::model::Units;
use brayfin::report::table::TableRenderer;
use brayfin::report::Renderer;
use brayfin::{scenario, Error};
use rand::{Rng, SeedableRng};
use rand_chacha::ChaCha8Rng;
use std::panic::{catch_unwind, AssertUnwindSafe};

const SEEDS: [(&str, &str); 4] = [
    (
        "corvel-bay-peaker.toml",
        include_str!("../scenarios/corvel-bay-peaker.toml"),
    ),
    (
        "kestrel-point-retrofit.toml",
        include_str!("../scenarios/kestrel-point-retrofit.toml"),
    ),
    (
        "bid-evaluation.toml",
        include_str!("../templates/bid-evaluation.toml"),
    ),
    ("retrofit.toml", include_str!("../templates/retrofit.toml")),
];

/// Mutants per run (all loaded; see [`MAX_ANALYSED`]).
const CASES: usize = 2000;
/// Mutants that load are analysed up to this many (a `compare` each).
const MAX_ANALYSED: usize = 24;
/// Fixed seed: the same cases every run.
const SEED: u64 = 0x0b7a_2f1e_5ced_0009;

/// Bare replacement values.
const EXTREMES: &[&str] = &[
    "0",
    "-1",
    "1e308",
    "-1e308",
    "1e-320",
    "nan",
    "inf",
    "-inf",
    "1.0000000000000002",
    "true",
    "[]",
    "{}",
    "2025-02-30",
    "\"\"",
];

/// Numbers put in front of the value's own unit.
const NUMBERS: &[&str] = &["0", "-1", "1e308", "1e-320", "1e-9", "1e9", "nan", "-0"];

/// Units of the wrong kind or unknown to brayfin.
const UNITS: &[&str] = &[
    "kPa",
    "degC",
    "MW",
    "USD/MMBtu",
    "%",
    "h",
    "furlongs",
    "MWe",
];

fn mutate(text: &str, rng: &mut ChaCha8Rng) -> String {
    let mut lines: Vec<String> = text.lines().map(str::to_string).collect();
    if lines.is_empty() {
        return String::new();
    }
    let i = rng.gen_range(0..lines.len());
    match rng.gen_range(0..8) {
        0 => {
            lines.remove(i);
        }
        1 => {
            let line = lines[i].clone();
            lines.insert(i, line);
        }
        2 => {
            let j = rng.gen_range(0..lines.len());
            lines.swap(i, j);
        }
        kind => {
            // A value line: find one at or after i.
            let Some(at) = (0..lines.len())
                .map(|k| (i + k) % lines.len())
                .find(|&k| lines[k].contains(" = ") && !lines[k].trim_start().starts_with('#'))
            else {
                return lines.join("\n");
            };
            let (key, value) = lines[at].split_once(" = ").unwrap_or(("x", "0"));
            let value = value.trim();
            let new_value = match kind {
                3 | 4 => EXTREMES[rng.gen_range(0..EXTREMES.len())].to_string(),
                5 => {
                    // The value's own unit with an extreme number.
                    let unit = value
                        .trim_matches('"')
                        .split_once(' ')
                        .map_or("", |(_, u)| u)
                        .to_string();
                    format!("\"{} {unit}\"", NUMBERS[rng.gen_range(0..NUMBERS.len())])
                }
                6 => format!(
                    "\"{} {}\"",
                    rng.gen_range(1..500),
                    UNITS[rng.gen_range(0..UNITS.len())]
                ),
                _ => format!("\"{}\"", "x".repeat(rng.gen_range(100..20_000))),
            };
            lines[at] = format!("{key} = {new_value}");
        }
    }
    lines.join("\n")
}

/// `file:line:column: ` at the start, one line, a bounded length.
fn check_located(message: &str, file: &str) -> Result<(), String> {
    let rest = message
        .strip_prefix(file)
        .and_then(|r| r.strip_prefix(':'))
        .ok_or_else(|| format!("not placed in {file}: {message:.200}"))?;
    let mut parts = rest.splitn(3, ':');
    let line = parts.next().and_then(|l| l.parse::<usize>().ok());
    let column = parts.next().and_then(|c| c.parse::<usize>().ok());
    if line.is_none() || column.is_none() {
        return Err(format!("no line:column: {message:.200}"));
    }
    if message.contains('\n') {
        return Err(format!("more than one line: {message:.200}"));
    }
    if message.chars().count() > 1500 {
        return Err(format!(
            "{} characters long: {message:.200}",
            message.chars().count()
        ));
    }
    Ok(())
}

fn has_non_finite(text: &str) -> bool {
    text.split(|c: char| !c.is_ascii_alphanumeric())
        .any(|word| matches!(word, "NaN" | "nan" | "inf" | "Infinity"))
}

/// Every string value of the mutant (titles, labels, sources), so that a
/// mutation that writes "nan" into a title is not read as a non-finite
/// number when the title is echoed.
fn string_values(text: &str) -> Vec<String> {
    fn walk(value: &toml::Value, out: &mut Vec<String>) {
        match value {
            toml::Value::String(s) => out.push(s.clone()),
            toml::Value::Array(items) => items.iter().for_each(|v| walk(v, out)),
            toml::Value::Table(table) => table.values().for_each(|v| walk(v, out)),
            _ => {}
        }
    }
    let mut out = Vec::new();
    if let Ok(value) = text.parse::<toml::Value>() {
        walk(&value, &mut out);
    }
    // Longest first, so a string containing another is removed whole.
    out.sort_by_key(|s| std::cmp::Reverse(s.len()));
    out
}

/// The rendered output without the mutant's own strings.
fn without_strings(rendered: &str, strings: &[String]) -> String {
    let mut text = rendered.to_string();
    for s in strings.iter().filter(|s| !s.is_empty()) {
        text = text.replace(s.as_str(), " ");
    }
    text
}

#[test]
fn mutated_scenarios_load_or_fail_located_and_never_panic() {
    let mut rng = ChaCha8Rng::seed_from_u64(SEED);
    let mut failures: Vec<String> = Vec::new();
    let (mut loaded_count, mut analysed, mut refused) = (0usize, 0usize, 0usize);
    let file = "mutant.toml";
    for case in 0..CASES {
        let (name, seed) = SEEDS[case % SEEDS.len()];
        let text = mutate(seed, &mut rng);
        let strings = string_values(&text);
        let outcome = catch_unwind(|| scenario::parse(&text, file));
        let loaded = match outcome {
            Err(_) => {
                failures.push(format!("case {case} ({name}): the loader panicked"));
                continue;
            }
            Ok(Err(e)) => {
                refused += 1;
                if let Err(why) = check_located(&e.to_string(), file) {
                    failures.push(format!("case {case} ({name}): {why}"));
                }
                continue;
            }
            Ok(Ok(loaded)) => loaded,
        };
        loaded_count += 1;
        if analysed >= MAX_ANALYSED {
            continue;
        }
        analysed += 1;
        let options = ModelOptions {
            units: Units::Si,
            sensitivity: false,
        };
        let built = catch_unwind(AssertUnwindSafe(|| build_model(&loaded, &options)));
        let model = match built {
            Err(_) => {
                failures.push(format!("case {case} ({name}): compare panicked"));
                continue;
            }
            Ok(Err(Error::Input(message))) => {
                if let Err(why) = check_located(&message, file) {
                    failures.push(format!("case {case} ({name}): {why}"));
                }
                continue;
            }
            Ok(Err(other)) => {
                failures.push(format!(
                    "case {case} ({name}): not a bad-input error (exit 2): {other}"
                ));
                continue;
            }
            Ok(Ok(model)) => model,
        };
        for (format, rendered) in [
            ("json", JsonRenderer.render(&model)),
            ("table", TableRenderer.render(&model)),
        ] {
            match rendered {
                Ok(bytes) => {
                    let text = without_strings(&String::from_utf8_lossy(&bytes), &strings);
                    if has_non_finite(&text) {
                        failures.push(format!(
                            "case {case} ({name}): a non-finite number in the {format} output"
                        ));
                    }
                }
                Err(e) => failures.push(format!("case {case} ({name}): {format} failed: {e}")),
            }
        }
    }
    assert!(
        failures.is_empty(),
        "{} of {CASES} mutants broke a rule; first: {:#?}",
        failures.len(),
        failures.iter().take(8).collect::<Vec<_>>()
    );
    // The mutations must exercise both paths.
    assert!(refused > CASES / 4, "only {refused} mutants were refused");
    assert!(
        loaded_count > CASES / 10,
        "only {loaded_count} mutants loaded"
    );
}
