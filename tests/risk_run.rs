//! `risk` as a whole on the demo scenario: a collapsed run equals `compare`,
//! the same seed gives identical results on 1 and 2 threads, another seed
//! gives other results, and refused draws are redrawn and counted.

use brayfin::analysis::compare::run_study;
use brayfin::analysis::risk::{risk_view, run_risk, RiskRun};
use brayfin::scenario::{parse, LoadedScenario};
use rust_decimal::prelude::ToPrimitive;

const DEMO: &str = include_str!("fixtures/corvel-bay-blocks.toml");

/// The demo with its `[[uncertainty]]` entries replaced by `entries`.
fn demo_with(entries: &str) -> LoadedScenario {
    let cut = DEMO.find("[[uncertainty]]").unwrap_or(DEMO.len());
    let text = format!("{}{entries}", &DEMO[..cut]);
    match parse(&text, "demo-edited.toml") {
        Ok(loaded) => loaded,
        Err(e) => panic!("the edited demo must load: {e}"),
    }
}

fn demo() -> LoadedScenario {
    match parse(DEMO, "tests/fixtures/corvel-bay-blocks.toml") {
        Ok(loaded) => loaded,
        Err(e) => panic!("the demo must load: {e}"),
    }
}

fn run(loaded: &LoadedScenario, samples: usize, seed: u64) -> RiskRun {
    match run_risk(loaded, samples, seed, &mut |_, _| {}) {
        Ok(run) => run,
        Err(e) => panic!("risk must run: {e}"),
    }
}

/// Every distribution of the demo's kinds, each collapsed to the base value.
const COLLAPSED: &str = r#"
[[uncertainty]]
key = "fuel.price"
distribution = "lognormal"
median = "3.85 USD/MMBtu"
sigma = 0

[[uncertainty]]
key = "fuel.escalation"
distribution = "triangular"
low = "0.8 %"
mode = "0.8 %"
high = "0.8 %"

[[uncertainty]]
key = "operation.hours_per_year"
distribution = "uniform"
low = "3500 h"
high = "3500 h"

[[uncertainty]]
key = "candidate[premium].turbine_efficiency"
distribution = "normal"
mean = "91.5 %"
sigma = 0
"#;

#[test]
fn collapsed_distributions_reproduce_compare() {
    // "Equal" here: compare runs the decimal ledger, risk the f64 one (the
    // finance layer's two instantiations of the same code), so the figures
    // are equal to the cent and in fact within a millionth of a currency
    // unit (measured: at most 2.5e-8 on lifecycle costs of about 1.6e8).
    // The f64 ledger's relative error is about 1e-15, and the point values
    // pass through f64 (the price per GJ, the lognormal's exp(ln 3.85)).
    // Every sample is the same number, so mean, P10, P50 and P90 all carry
    // that one value.
    let loaded = demo_with(COLLAPSED);
    let study = match run_study(&loaded) {
        Ok(s) => s,
        Err(e) => panic!("compare must run: {e}"),
    };
    let risk = run(&loaded, 64, 5);
    assert_eq!(risk.redraws, 0);
    assert_eq!(risk.candidates.len(), 2);
    for c in &risk.candidates {
        let index = loaded
            .scenario
            .candidates
            .iter()
            .position(|x| x.id == c.candidate_id)
            .unwrap_or(usize::MAX);
        let Some(versus) = study.outcomes[index].versus_baseline.as_ref() else {
            panic!("{} must be compared with the baseline", c.candidate_id);
        };
        let savings = versus.savings.net_savings.to_f64().unwrap_or(f64::NAN);
        let premium = versus
            .savings
            .break_even_premium
            .and_then(|p| p.to_f64())
            .unwrap_or(f64::NAN);
        for (what, stats, expected) in [
            ("net savings", &c.net_savings, savings),
            ("break-even premium", &c.break_even_premium, premium),
        ] {
            for (name, value) in [
                ("mean", stats.mean),
                ("P10", stats.p10),
                ("P50", stats.p50),
                ("P90", stats.p90),
            ] {
                assert!(
                    (value - expected).abs() <= 1e-6,
                    "{} {what} {name}: risk {value}, compare {expected}",
                    c.candidate_id
                );
            }
        }
        let beats = if savings > 0.0 { 1.0 } else { 0.0 };
        assert_eq!(c.probability_beats_baseline, beats);
        assert_eq!(c.histogram.counts.iter().sum::<u64>(), 64);
    }
}

#[test]
fn same_seed_is_bit_identical_on_one_and_two_threads() {
    // 9000 samples: more than two blocks of 4096, so block edges are crossed.
    let loaded = demo();
    let on = |threads: usize| {
        let pool = match rayon::ThreadPoolBuilder::new().num_threads(threads).build() {
            Ok(p) => p,
            Err(e) => panic!("thread pool: {e}"),
        };
        pool.install(|| run(&loaded, 9000, 42))
    };
    let one = on(1);
    let two = on(2);
    // PartialEq on f64 fields: every statistic equal to the last bit (no NaN
    // occurs: each is a finite sum or sample value).
    assert_eq!(one, two);
    let view_one = risk_view(&loaded, 500, 42).map(|v| format!("{v:?}"));
    let view_two = risk_view(&loaded, 500, 42).map(|v| format!("{v:?}"));
    assert_eq!(view_one.ok(), view_two.ok());
}

#[test]
fn different_seeds_give_different_samples() {
    let loaded = demo();
    let a = run(&loaded, 2000, 1);
    let b = run(&loaded, 2000, 2);
    assert_ne!(a.candidates[0].net_savings, b.candidates[0].net_savings);
    assert_ne!(a.candidates[0].histogram, b.candidates[0].histogram);
}

#[test]
fn demo_run_is_plausible() {
    // The distributions spread the result: P10 < P50 < P90, the chance is
    // strictly between 0 and 1, and the break-even premium moves with the
    // savings (it is the premium asked plus savings over the capital factor).
    let r = run(&demo(), 3000, 7);
    assert_eq!(r.samples, 3000);
    for c in &r.candidates {
        let s = &c.net_savings;
        assert!(s.p10 < s.p50 && s.p50 < s.p90, "{}: {s:?}", c.candidate_id);
        assert!(c.probability_beats_baseline > 0.0 && c.probability_beats_baseline < 1.0);
        let b = &c.break_even_premium;
        assert!(b.p10 < b.p50 && b.p50 < b.p90);
        assert_eq!(c.histogram.counts.iter().sum::<u64>(), 3000);
    }
}

#[test]
fn refused_draws_are_redrawn_and_counted() {
    // A turbine efficiency normal about 99.9 % with σ 1 %: about 46 % of the
    // draws exceed 1, which the scenario refuses; each sample redraws until
    // valid, so all samples are counted and every refusal is reported.
    let loaded = demo_with(
        r#"
[[uncertainty]]
key = "candidate[premium].turbine_efficiency"
distribution = "normal"
mean = "99.9 %"
sigma = "1 %"
"#,
    );
    let r = run(&loaded, 2000, 3);
    assert_eq!(r.samples, 2000);
    // Expected redraws: 2000 · p/(1 − p) with p = Q(−0.1) ≈ 0.46: about
    // 1700; a generous band around it.
    assert!(r.redraws > 1000 && r.redraws < 2600, "{}", r.redraws);
    let reason = r.first_redraw_reason.unwrap_or_default();
    assert!(reason.contains("turbine_efficiency"), "{reason}");
}

#[test]
fn impossible_draws_and_empty_runs_are_input_errors() {
    let always_refused = demo_with(
        r#"
[[uncertainty]]
key = "candidate[premium].turbine_efficiency"
distribution = "normal"
mean = "150 %"
sigma = "0.1 %"
"#,
    );
    match run_risk(&always_refused, 10, 1, &mut |_, _| {}) {
        Err(brayfin::Error::Input(m)) => assert!(m.contains("no valid draw"), "{m}"),
        other => panic!("expected an input error, got {other:?}"),
    }
    let no_distribution = demo_with("");
    match run_risk(&no_distribution, 10, 1, &mut |_, _| {}) {
        Err(brayfin::Error::Input(m)) => assert!(m.contains("distribution"), "{m}"),
        other => panic!("expected an input error, got {other:?}"),
    }
    match run_risk(&demo(), 0, 1, &mut |_, _| {}) {
        Err(brayfin::Error::Input(m)) => assert!(m.contains("--samples 0"), "{m}"),
        other => panic!("expected an input error, got {other:?}"),
    }
}
