//! `[[correlation]]` through the scenario into `risk`: the drawn columns
//! carry the target rank correlation within sampling error, keep their
//! marginals, change the results, and a set of correlations that cannot
//! hold together is refused at load at the pair to change.

use brayfin::analysis::risk::{correlated_draws, draws_of, run_risk};
use brayfin::analysis::sampling::iman_conover::spearman;
use brayfin::scenario::{parse, LoadedScenario};

const DEMO: &str = include_str!("fixtures/corvel-bay-blocks.toml");

fn demo_with(correlations: &str) -> LoadedScenario {
    match parse(&format!("{DEMO}\n{correlations}"), "correlated.toml") {
        Ok(loaded) => loaded,
        Err(e) => panic!("the edited demo must load: {e}"),
    }
}

/// Columns (one per drawn key) of the first draws of `samples` samples.
fn columns(loaded: &LoadedScenario, samples: usize) -> Vec<Vec<f64>> {
    let draws = match draws_of(loaded) {
        Ok(d) => d,
        Err(e) => panic!("draws: {e}"),
    };
    let k = draws.keys.len();
    let rows = match correlated_draws(loaded, &draws, samples, 3) {
        Ok(Some(rows)) => rows,
        Ok(None) => panic!("the scenario has correlations"),
        Err(e) => panic!("correlated draws: {e}"),
    };
    (0..k)
        .map(|j| (0..samples).map(|i| rows[i * k + j]).collect())
        .collect()
}

#[test]
fn the_sample_rank_correlation_matches_the_target_within_4_standard_errors() {
    // Demo keys in order: 0 fuel.price, 1 fuel.escalation, 2 hours, 3
    // discount rate. Targets 0.6 and −0.3 and the unlisted pair 0.
    // Sampling error: the Fisher transform z = atanh(r_s) of a Spearman
    // correlation has a variance of about 1.06/(n − 3) (Fieller, Hartley and
    // Pearson, Biometrika 44, 1957; from memory); the check allows 4
    // standard errors on that scale. (Iman–Conover fixes the scores'
    // correlation exactly, so the error is usually far smaller.)
    let loaded = demo_with(
        "[[correlation]]\nkeys = [\"fuel.price\", \"fuel.escalation\"]\nrank_correlation = 0.6\n\n\
         [[correlation]]\nkeys = [\"operation.hours_per_year\", \"fuel.price\"]\n\
         rank_correlation = -0.3\n",
    );
    let n = 2000;
    let c = columns(&loaded, n);
    let se = (1.06 / (n as f64 - 3.0)).sqrt();
    for (a, b, target) in [(0, 1, 0.6), (2, 0, -0.3), (1, 3, 0.0), (2, 3, 0.0)] {
        let r = spearman(&c[a], &c[b]);
        let gap = (r.atanh() - f64::atanh(target)).abs();
        assert!(
            gap <= 4.0 * se,
            "keys {a}, {b}: {r} vs {target} (z gap {gap}, 4 SE {})",
            4.0 * se
        );
    }
}

#[test]
fn correlation_only_reorders_the_independent_draws() {
    // Iman–Conover pairs values differently and changes none: each column
    // holds exactly the values an uncorrelated run draws first.
    let loaded = demo_with(
        "[[correlation]]\nkeys = [\"fuel.price\", \"economics.discount_rate\"]\n\
         rank_correlation = 0.8\n",
    );
    let n = 500;
    let correlated = columns(&loaded, n);
    let draws = match draws_of(&loaded) {
        Ok(d) => d,
        Err(e) => panic!("draws: {e}"),
    };
    let streams = brayfin::analysis::sampling::Streams::new(3);
    for (j, sampler) in draws.samplers.iter().enumerate() {
        let mut independent: Vec<f64> = (0..n)
            .map(|i| {
                let mut s = streams.sample(i as u64);
                let mut v = 0.0;
                for _ in 0..=j {
                    v = s.next_unit();
                }
                sampler.quantile(v)
            })
            .collect();
        let mut mine = correlated[j].clone();
        independent.sort_by(f64::total_cmp);
        mine.sort_by(f64::total_cmp);
        assert_eq!(independent, mine, "column {j}");
    }
}

#[test]
fn risk_results_follow_the_correlation() {
    // Fuel price and hours both raise the premium bid's fuel savings; tied
    // together (0.9) the spread of its net savings widens against the
    // independent run (same seed, same marginals).
    let independent = demo_with("");
    let tied = demo_with(
        "[[correlation]]\nkeys = [\"fuel.price\", \"operation.hours_per_year\"]\n\
         rank_correlation = 0.9\n",
    );
    let spread = |loaded: &LoadedScenario| match run_risk(loaded, 2000, 3, &mut |_, _| {}) {
        Ok(r) => r.candidates[0].net_savings.p90 - r.candidates[0].net_savings.p10,
        Err(e) => panic!("risk: {e}"),
    };
    let (a, b) = (spread(&independent), spread(&tied));
    assert!(b > a, "P10–P90 spread: independent {a}, correlated {b}");
}

#[test]
fn correlations_that_cannot_hold_together_are_refused_at_the_pair() {
    // 0.9, 0.9 and −0.9 among three keys: no such matrix exists.
    let text = format!(
        "{DEMO}\n[[correlation]]\nkeys = [\"fuel.price\", \"fuel.escalation\"]\n\
         rank_correlation = 0.9\n\n[[correlation]]\n\
         keys = [\"fuel.price\", \"operation.hours_per_year\"]\nrank_correlation = 0.9\n\n\
         [[correlation]]\nkeys = [\"fuel.escalation\", \"operation.hours_per_year\"]\n\
         rank_correlation = -0.9\n"
    );
    let first_line = DEMO.lines().count() + 4;
    match parse(&text, "bad.toml") {
        Ok(_) => panic!("must be refused"),
        Err(e) => {
            let m = e.to_string();
            let place = format!("bad.toml:{first_line}:20: correlation[1].rank_correlation:");
            assert!(m.starts_with(&place), "{place} in {m}");
            assert!(m.contains("not positive semi-definite"), "{m}");
            assert!(m.contains("\"fuel.price\" and \"fuel.escalation\""), "{m}");
            assert!(m.contains("nearest value"), "{m}");
        }
    }
}
