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
//! in the output, and the key numbers of the JSON within their physical
//! ranges (see [`check_physical`]).

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
        include_str!("fixtures/corvel-bay-blocks.toml"),
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

/// Bare bought_in values.
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

/// The key numbers of each candidate in `compare`'s JSON within their
/// physical ranges:
/// - thermal efficiency in (0, 1) and below the Carnot efficiency
///   1 − T_min/T_max of the cycle's own state temperatures (second law;
///   every heat added or rejected in a Brayton cycle crosses at a state
///   temperature between them);
/// - heat rate × efficiency = 3600 kJ/kWh (definition: 1 kWh = 3600 kJ),
///   so the heat rate is above 3600 kJ/kWh;
/// - net output within the declared key range, 1 kW to 2 GW;
/// - exhaust temperature between the lowest and highest state
///   temperatures, and every state temperature and pressure positive.
fn check_physical(json: &str) -> Result<(), String> {
    let doc: serde_json::Value =
        serde_json::from_str(json).map_err(|e| format!("JSON does not parse: {e}"))?;
    let candidates = doc["candidates"]
        .as_array()
        .ok_or("no candidates in the JSON")?;
    for c in candidates {
        let id = &c["id"];
        let number = |v: &serde_json::Value, what: &str| {
            v.as_f64()
                .filter(|x| x.is_finite())
                .ok_or_else(|| format!("{id}: {what} is not a finite number: {v}"))
        };
        let p = &c["performance"];
        let efficiency = number(&p["thermal_efficiency"], "thermal efficiency")?;
        let heat_rate = number(&p["heat_rate_kj_per_kwh"], "heat rate")?;
        let output = number(&p["net_output_kw"], "net output")?;
        let exhaust = number(&p["exhaust_temperature_k"], "exhaust temperature")?;
        let states = c["cycle"]["states"].as_array().ok_or("no state table")?;
        let mut temperatures = Vec::new();
        for state in states {
            let t = number(&state["temperature_k"], "a state temperature")?;
            let pressure = number(&state["pressure_kpa"], "a state pressure")?;
            if t <= 0.0 || pressure <= 0.0 {
                return Err(format!("{id}: state at {t} K, {pressure} kPa"));
            }
            temperatures.push(t);
        }
        let t_min = temperatures.iter().copied().fold(f64::INFINITY, f64::min);
        let t_max = temperatures.iter().copied().fold(0.0, f64::max);
        if !(efficiency > 0.0 && efficiency < 1.0) {
            return Err(format!("{id}: thermal efficiency {efficiency}"));
        }
        let carnot = 1.0 - t_min / t_max;
        if efficiency > carnot + 1e-9 {
            return Err(format!(
                "{id}: efficiency {efficiency} above Carnot {carnot} ({t_min} K to {t_max} K)"
            ));
        }
        if heat_rate <= 3600.0 || (heat_rate * efficiency - 3600.0).abs() > 1e-6 * 3600.0 {
            return Err(format!(
                "{id}: heat rate {heat_rate} kJ/kWh at efficiency {efficiency}"
            ));
        }
        if !(1.0..=2e6).contains(&output) {
            return Err(format!("{id}: net output {output} kW"));
        }
        if exhaust < t_min - 1e-9 || exhaust > t_max + 1e-9 {
            return Err(format!(
                "{id}: exhaust {exhaust} K outside the cycle's {t_min}–{t_max} K"
            ));
        }
    }
    Ok(())
}

/// `rendered` without the texts the scenario file itself wrote and the
/// output echoes (title, names, ids, labels, in plain and JSON-escaped
/// form): a mutant titled "nan retrofit decision" is not a non-finite
/// number.
fn without_echoed_text(rendered: &str, model: &brayfin::report::model::Model) -> String {
    let m = &model.meta;
    let mut echoed: Vec<&str> = vec![&m.title, &m.prepared_for, &m.prepared_by, &m.scenario_file];
    echoed.extend(m.site_name.as_deref());
    for c in &model.candidates {
        echoed.push(&c.id);
        echoed.push(&c.label);
    }
    let mut text = rendered.to_string();
    for e in echoed.into_iter().filter(|e| !e.is_empty()) {
        let escaped = serde_json::to_string(e).unwrap_or_default();
        let escaped = escaped.trim_matches('"');
        text = text.replace(escaped, " ").replace(e, " ");
    }
    text
}

fn has_non_finite(text: &str) -> bool {
    text.split(|c: char| !c.is_ascii_alphanumeric())
        .any(|word| matches!(word, "NaN" | "nan" | "inf" | "Infinity"))
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
                    let text = String::from_utf8_lossy(&bytes);
                    if has_non_finite(&without_echoed_text(&text, &model)) {
                        failures.push(format!(
                            "case {case} ({name}): a non-finite number in the {format} output"
                        ));
                    }
                    if format == "json" {
                        if let Err(why) = check_physical(&text) {
                            failures.push(format!("case {case} ({name}): {why}"));
                        }
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

#[test]
fn the_physical_check_refuses_impossible_numbers() {
    let doc = |efficiency: f64, heat_rate: f64, output: f64, exhaust: f64| {
        serde_json::json!({"candidates": [{
            "id": "a",
            "performance": {
                "thermal_efficiency": efficiency,
                "heat_rate_kj_per_kwh": heat_rate,
                "net_output_kw": output,
                "exhaust_temperature_k": exhaust,
            },
            "cycle": {"states": [
                {"temperature_k": 288.15, "pressure_kpa": 101.325},
                {"temperature_k": 1500.0, "pressure_kpa": 1500.0},
            ]},
        }]})
        .to_string()
    };
    // 3600 / 0.38 kJ/kWh at 38 %: fine (Carnot 1 − 288.15/1500 = 0.81).
    assert_eq!(
        check_physical(&doc(0.38, 3600.0 / 0.38, 50_000.0, 800.0)),
        Ok(())
    );
    for (bad, why) in [
        (doc(1.2, 3000.0, 50_000.0, 800.0), "efficiency above one"),
        (doc(0.9, 4000.0, 50_000.0, 800.0), "above Carnot"),
        (
            doc(0.38, 9000.0, 50_000.0, 800.0),
            "heat rate not 3600/efficiency",
        ),
        (doc(0.38, 3600.0 / 0.38, 0.5, 800.0), "output below 1 kW"),
        (
            doc(0.38, 3600.0 / 0.38, 50_000.0, 2000.0),
            "exhaust above the hottest state",
        ),
    ] {
        assert!(check_physical(&bad).is_err(), "{why} passed");
    }
}
