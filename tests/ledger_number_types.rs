//! The one ledger in its two number types (issue: decimal for the printed
//! ledger, `f64` for sampling and sweeps) agrees to 1e-9 relative on every
//! demo scenario: every row's total and present value, each candidate's
//! lifecycle cost, and each candidate's net savings against the baseline.

use brayfin::analysis::compare::run_study;
use brayfin::finance::{build_ledger, compare_summaries, Money};
use brayfin::scenario;
use std::path::Path;

/// Relative difference, against a floor of one currency unit so that rows
/// worth nothing compare absolutely.
fn close(decimal: f64, float: f64) -> bool {
    (decimal - float).abs() <= 1e-9 * decimal.abs().max(1.0)
}

#[test]
fn decimal_and_f64_ledgers_agree_on_every_demo_scenario() {
    let mut checked = 0;
    for entry in std::fs::read_dir("scenarios").unwrap() {
        let path = entry.unwrap().path();
        if path.extension().and_then(|e| e.to_str()) != Some("toml") {
            continue;
        }
        let loaded = scenario::load(Path::new(&path)).unwrap();
        let study = run_study(&loaded).unwrap();
        let mut float_summaries = Vec::new();
        for outcome in &study.outcomes {
            let float = build_ledger(&outcome.inputs.to_f64()).unwrap();
            assert_eq!(float.rows.len(), outcome.ledger.rows.len());
            for (d, f) in outcome.ledger.rows.iter().zip(&float.rows) {
                assert!(
                    close(d.total.to_f64(), f.total),
                    "{}: row {}",
                    path.display(),
                    d.year
                );
                assert!(
                    close(d.present_value.to_f64(), f.present_value),
                    "{}: row {} present value",
                    path.display(),
                    d.year
                );
            }
            let lcc = outcome.ledger.summary.lifecycle_cost.to_f64();
            assert!(
                close(lcc, float.summary.lifecycle_cost),
                "{}",
                path.display()
            );
            float_summaries.push(float.summary);
            checked += 1;
        }
        let base = float_summaries[study.baseline_index];
        for (outcome, float) in study.outcomes.iter().zip(&float_summaries) {
            if let Some(versus) = &outcome.versus_baseline {
                let float_savings = compare_summaries(float, &base).unwrap().net_savings;
                // Net savings are a difference of two lifecycle costs: judge
                // them against the size of those costs.
                let scale = outcome.ledger.summary.lifecycle_cost.to_f64().abs();
                let decimal = versus.savings.net_savings.to_f64();
                assert!(
                    (decimal - float_savings).abs() <= 1e-9 * scale,
                    "{}: {decimal} vs {float_savings}",
                    path.display()
                );
            }
        }
    }
    assert!(checked >= 5, "only {checked} candidates checked");
}
