//! `brayfin compare` end to end on the demo scenarios, checked against an
//! independent recomputation from the printed JSON (not against stored
//! numbers): the ledger's arithmetic, the fuel energy of a full-load year,
//! and the break-even premium from the present value of the operating
//! savings in the printed ledger. Plus the bad-input corpus through the
//! binary: exit code 1, a located message, nothing written.

use assert_cmd::Command;
use rust_decimal::Decimal;
use serde_json::Value;
use std::str::FromStr;

const DEMOS: [&str; 2] = [
    "tests/fixtures/corvel-bay-blocks.toml",
    "scenarios/kestrel-point-retrofit.toml",
];

fn compare_json(path: &str) -> Value {
    let output = Command::cargo_bin("brayfin")
        .unwrap()
        .args(["compare", path, "--format", "json"])
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    serde_json::from_slice(&output.stdout).unwrap()
}

fn money(v: &Value) -> Decimal {
    Decimal::from_str(
        v.as_str()
            .unwrap_or_else(|| panic!("money as a string: {v}")),
    )
    .unwrap()
}

fn num(v: &Value) -> f64 {
    v.as_f64().unwrap_or_else(|| panic!("a number: {v}"))
}

const STREAMS: [&str; 8] = [
    "fuel_cost",
    "carbon_cost",
    "fixed_om",
    "variable_om",
    "overhaul",
    "bought_in",
    "capital",
    "residual",
];

/// Each printed ledger adds up: total = sum of the row's money (each figure
/// rounded to the cent on its own, so within half a cent per column and
/// half a cent for the total), present
/// value = total × discount factor (within a cent), and lifecycle cost =
/// sum of present values (within half a cent per row).
#[test]
fn printed_ledgers_add_up() {
    let half_cent = Decimal::new(5, 3);
    for path in DEMOS {
        let doc = compare_json(path);
        for c in doc["candidates"].as_array().unwrap() {
            let rows = c["ledger"].as_array().unwrap();
            let mut sum_pv = Decimal::ZERO;
            for r in rows {
                let total: Decimal = STREAMS.iter().map(|k| money(&r[k])).sum();
                let columns = Decimal::from(STREAMS.len() as i64 + 1);
                assert!((total - money(&r["total"])).abs() <= half_cent * columns);
                let df = Decimal::try_from(num(&r["discount_factor"])).unwrap();
                let pv = money(&r["total"]) * df;
                assert!((pv - money(&r["present_value"])).abs() <= Decimal::new(1, 2));
                sum_pv += money(&r["present_value"]);
            }
            let lcc = money(&c["economics"]["lifecycle_cost"]);
            let slack = half_cent * Decimal::from(rows.len() as i64 + 1);
            assert!(
                (sum_pv - lcc).abs() <= slack,
                "{path} {}: {sum_pv} vs {lcc}",
                c["id"]
            );
        }
    }
}

/// Break-even premium recomputed from the printed ledgers. Net savings are
/// the PV of operating savings less the added PV of investment; the
/// candidate's investment moves with its capital C as m·C, where m is the
/// PV of one unit of capital (its printed capital rows over C) less, when
/// the residual value is a fraction of capital (as the scenario states it),
/// the PV of that fraction. Net savings vanish at C = (savings + I_b −
/// R_fixed)/m; the premium is that less the baseline's capital. With capital
/// at commercial operation and no residual, m = 1 and the premium is the PV
/// of the operating savings itself.
#[test]
fn break_even_premium_is_the_pv_of_operating_savings() {
    let operating = [
        "fuel_cost",
        "carbon_cost",
        "fixed_om",
        "variable_om",
        "overhaul",
        "bought_in",
    ];
    for path in DEMOS {
        let doc = compare_json(path);
        let file: toml::Value = toml::from_str(&std::fs::read_to_string(path).unwrap()).unwrap();
        let candidates = doc["candidates"].as_array().unwrap();
        let baseline_id = doc["scenario"]["baseline"].as_str().unwrap();
        let baseline = candidates.iter().find(|c| c["id"] == baseline_id).unwrap();
        let pv_of = |c: &Value, keys: &[&str]| -> f64 {
            c["ledger"]
                .as_array()
                .unwrap()
                .iter()
                .map(|r| {
                    let cost: Decimal = keys.iter().map(|k| money(&r[*k])).sum();
                    f64::try_from(cost).unwrap() * num(&r["discount_factor"])
                })
                .sum()
        };
        let residual_is_fraction = |id: &str| {
            file["candidate"]
                .as_array()
                .unwrap()
                .iter()
                .find(|c| c["id"].as_str() == Some(id))
                .and_then(|c| {
                    c["costs"]["residual_value"]
                        .as_str()
                        .map(|v| v.ends_with('%'))
                })
                .unwrap_or(true)
        };
        for c in candidates.iter().filter(|c| c["id"] != baseline_id) {
            let capital = f64::try_from(money(&c["economics"]["capital_cost"])).unwrap();
            let pv_capital = pv_of(c, &["capital"]);
            let pv_residual = pv_of(c, &["residual"]);
            let (m, fixed) = if residual_is_fraction(c["id"].as_str().unwrap()) {
                ((pv_capital + pv_residual) / capital, 0.0)
            } else {
                (pv_capital / capital, pv_residual)
            };
            let savings = pv_of(baseline, &operating) - pv_of(c, &operating);
            let base_investment = pv_of(baseline, &["capital", "residual"]);
            let base_capital =
                f64::try_from(money(&baseline["economics"]["capital_cost"])).unwrap();
            let expected = (savings + base_investment - fixed) / m - base_capital;
            let printed = f64::try_from(money(&c["economics"]["break_even_premium"])).unwrap();
            // Each printed row is rounded to the cent: well under one unit.
            assert!(
                (printed - expected).abs() < 1.0,
                "{path} {}: printed {printed}, recomputed {expected}",
                c["id"]
            );
        }
    }
}

/// With every hour at full load and no degradation, a year's fuel energy is
/// output × hours × heat rate (DESIGN.md's definition of fuel burn).
#[test]
fn full_load_fuel_energy_is_output_times_hours_times_heat_rate() {
    let text = std::fs::read_to_string(DEMOS[0]).unwrap();
    let mut edited = String::new();
    let mut skipping = false;
    for line in text.lines() {
        let t = line.trim_start();
        if t.starts_with("dispatch = [") {
            skipping = true;
            continue;
        }
        if skipping {
            if t.starts_with(']') {
                skipping = false;
            }
            continue;
        }
        if t.starts_with("sources = { dispatch") || t.starts_with("starts_per_year") {
            // No starts: start fuel would add to the fired hours' fuel.
            continue;
        }
        if t.starts_with("degradation_per_year") {
            edited.push_str("degradation_per_year = \"0 %\"\n");
            continue;
        }
        edited.push_str(line);
        edited.push('\n');
        if t == "[operation]" {
            edited.push_str("hours_per_year = \"3000 h\"\n");
        }
    }
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("full-load.toml");
    std::fs::write(&path, edited).unwrap();
    let doc = compare_json(path.to_str().unwrap());
    for c in doc["candidates"].as_array().unwrap() {
        let p = &c["performance"];
        let row = c["ledger"]
            .as_array()
            .unwrap()
            .iter()
            .find(|r| num(&r["operating_hours"]) == 3000.0)
            .expect("a full operating year");
        let expected_gj =
            num(&p["net_output_kw"]) * 3000.0 * num(&p["heat_rate_kj_per_kwh"]) / 1.0e6;
        let got = num(&row["fuel_energy_gj"]);
        assert!(
            ((got - expected_gj) / expected_gj).abs() < 1e-9,
            "{got} vs {expected_gj}"
        );
        let expected_mwh = num(&p["net_output_kw"]) * 3000.0 / 1000.0;
        assert!((num(&row["energy_mwh"]) - expected_mwh).abs() < 1e-6);
    }
}

/// The table names every candidate and gives a verdict line for each.
#[test]
fn table_has_a_verdict_per_candidate() {
    let output = Command::cargo_bin("brayfin")
        .unwrap()
        .args(["compare", DEMOS[0]])
        .output()
        .unwrap();
    assert!(output.status.success());
    let text = String::from_utf8(output.stdout).unwrap();
    let doc = compare_json(DEMOS[0]);
    for c in doc["candidates"].as_array().unwrap() {
        let id = c["id"].as_str().unwrap();
        assert!(text
            .lines()
            .any(|l| l.trim_start().starts_with(&format!("{id} ("))));
    }
    assert!(text.contains("Screening-level estimate"));
}

/// CSV: one header, one row per ledger row (same count as the JSON) and a
/// totals row per candidate.
#[test]
fn csv_has_one_row_per_candidate_year() {
    let output = Command::cargo_bin("brayfin")
        .unwrap()
        .args(["compare", DEMOS[1], "--format", "csv"])
        .output()
        .unwrap();
    assert!(output.status.success());
    let doc = compare_json(DEMOS[1]);
    let rows: usize = doc["candidates"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| c["ledger"].as_array().unwrap().len())
        .sum();
    let candidates = doc["candidates"].as_array().unwrap().len();
    let mut reader = csv::Reader::from_reader(output.stdout.as_slice());
    assert_eq!(reader.records().count(), rows + candidates);
}

/// Every broken scenario: exit code 1, `file:line:column:` in the message,
/// the expected words, nothing on stdout, and no output file from `report`.
#[test]
fn bad_inputs_exit_1_with_a_located_message_and_write_nothing() {
    let mut seen = 0;
    for entry in std::fs::read_dir("tests/bad_inputs").unwrap() {
        let path = entry.unwrap().path();
        if path.extension().and_then(|e| e.to_str()) != Some("toml") {
            continue;
        }
        seen += 1;
        let text = std::fs::read_to_string(&path).unwrap();
        let expect = text
            .lines()
            .find_map(|l| l.strip_prefix("# expect: "))
            .unwrap_or_else(|| panic!("{} has no `# expect:` line", path.display()));
        let output = Command::cargo_bin("brayfin")
            .unwrap()
            .args(["compare", path.to_str().unwrap()])
            .output()
            .unwrap();
        let stderr = String::from_utf8_lossy(&output.stderr);
        assert_eq!(
            output.status.code(),
            Some(1),
            "{}: {stderr}",
            path.display()
        );
        assert!(
            output.stdout.is_empty(),
            "{} printed results",
            path.display()
        );
        let label = path.to_str().unwrap();
        let located = stderr
            .strip_prefix("error: ")
            .and_then(|s| s.strip_prefix(label))
            .and_then(|s| s.strip_prefix(':'))
            .map(|s| {
                let mut parts = s.splitn(3, ':');
                let line = parts.next().unwrap_or("").parse::<usize>().is_ok();
                let column = parts.next().unwrap_or("").parse::<usize>().is_ok();
                line && column
            })
            .unwrap_or(false);
        assert!(located, "{}: not located: {stderr}", path.display());
        assert!(
            stderr.contains(expect),
            "{}: `{expect}` missing: {stderr}",
            path.display()
        );
        assert!(!stderr.contains("panicked"), "{}", path.display());

        let dir = tempfile::tempdir().unwrap();
        let pdf = dir.path().join("out.pdf");
        let output = Command::cargo_bin("brayfin")
            .unwrap()
            .args([
                "report",
                path.to_str().unwrap(),
                "-o",
                pdf.to_str().unwrap(),
            ])
            .output()
            .unwrap();
        assert_eq!(output.status.code(), Some(1), "report {}", path.display());
        assert!(
            !pdf.exists(),
            "report wrote {} for a bad input",
            pdf.display()
        );
        assert_eq!(std::fs::read_dir(dir.path()).unwrap().count(), 0);
    }
    assert!(
        seen >= 25,
        "the corpus has {seen} files; the issue asks for at least 25"
    );
}
