//! The sweep in the library: range arithmetic in exact decimals, the same
//! figures on 1 and 2 threads across block edges, and each point equal to
//! a separate evaluation of the scenario set to that value (`--exact`;
//! the default route is held to 0.1 % of it in `tests/risk_route.rs`).

use brayfin::analysis::compare::run_study;
use brayfin::analysis::point::{Figures, Route};
use brayfin::analysis::sweep::{parse_axis, plan, run_sweep_by};
use brayfin::scenario::{parse, LoadedScenario};
use rust_decimal::prelude::ToPrimitive;

const DEMO: &str = include_str!("fixtures/corvel-bay-blocks.toml");

fn demo() -> LoadedScenario {
    match parse(DEMO, "tests/fixtures/corvel-bay-blocks.toml") {
        Ok(l) => l,
        Err(e) => panic!("the demo must load: {e}"),
    }
}

/// Every row of a sweep: (point, candidate, figures or error text).
fn rows(
    loaded: &LoadedScenario,
    vary: &[&str],
    route: Route,
) -> Vec<(usize, usize, Result<Figures, String>)> {
    let vary: Vec<String> = vary.iter().map(|s| s.to_string()).collect();
    let plan = match plan(loaded, &vary, None) {
        Ok(p) => p,
        Err(e) => panic!("{vary:?} must be a valid sweep: {e}"),
    };
    let mut out = Vec::new();
    let outcome = run_sweep_by(loaded, &plan, route, &mut |block| {
        for j in 0..block.len() {
            for &i in &plan.reported {
                let figures = block.point(j).map(|f| f[i]).map_err(|e| e.to_string());
                out.push((block.first_point + j, i, figures));
            }
        }
        Ok(())
    });
    if let Err(e) = outcome {
        panic!("the sweep must run: {e}");
    }
    out
}

#[test]
fn ranges_are_exact_decimals_and_include_their_end() {
    let axis = match parse_axis("candidate.turbine_efficiency=0.85:0.95:0.01") {
        Ok(a) => a,
        Err(e) => panic!("{e}"),
    };
    assert_eq!(axis.count, 11);
    assert_eq!(axis.value(3), 0.88);
    assert_eq!(axis.value(10), 0.95);
    let down = match parse_axis("fuel.price=6:3:-1.5") {
        Ok(a) => a,
        Err(e) => panic!("{e}"),
    };
    assert_eq!(down.count, 3);
    assert_eq!(down.value(2), 3.0);
    // A step that does not land on TO stops before it.
    let short = match parse_axis("fuel.price=1:2:0.3") {
        Ok(a) => a,
        Err(e) => panic!("{e}"),
    };
    assert_eq!(short.count, 4);
    assert_eq!(short.value(3), 1.9);
}

#[test]
fn one_and_two_threads_give_identical_sweeps() {
    // 101 × 100 = 10 100 points: more than one block of 8192.
    let loaded = demo();
    let vary = [
        "fuel.price=2:7:0.05",
        "candidate[premium].turbine_efficiency=0.880:0.9295:0.0005",
    ];
    let on = |threads: usize| {
        let pool = match rayon::ThreadPoolBuilder::new().num_threads(threads).build() {
            Ok(p) => p,
            Err(e) => panic!("thread pool: {e}"),
        };
        pool.install(|| rows(&loaded, &vary, Route::Scaled))
    };
    let one = on(1);
    let two = on(2);
    assert_eq!(one.len(), 10_100 * 3);
    assert_eq!(one, two);
}

#[test]
fn each_point_equals_a_study_of_the_scenario_set_to_its_value() {
    // The library route of "a sweep point equals compare": the decimal
    // study of the scenario with the key set, against the sweep's f64
    // figures at that point (heat rate equal, money within a cent), on the
    // exact route.
    let loaded = demo();
    let key = "candidate.compressor_efficiency";
    let swept = rows(
        &loaded,
        &["candidate.compressor_efficiency=0.84:0.90:0.02"],
        Route::Exact,
    );
    for (point, value) in [0.84, 0.86, 0.88, 0.90].into_iter().enumerate() {
        let mut edited = loaded.clone();
        if let Err(e) = edited.scenario.set_numeric(key, value) {
            panic!("{key} = {value}: {e}");
        }
        let study = match run_study(&edited) {
            Ok(s) => s,
            Err(e) => panic!("study at {value}: {e}"),
        };
        for (i, outcome) in study.outcomes.iter().enumerate() {
            let Some((_, _, Ok(f))) = swept.iter().find(|(p, c, _)| *p == point && *c == i) else {
                panic!("point {point} candidate {i} must be solved");
            };
            assert_eq!(
                f.heat_rate_kj_per_kwh,
                outcome.solved.site.heat_rate_kj_per_kwh
            );
            let lcc = outcome
                .ledger
                .summary
                .lifecycle_cost
                .to_f64()
                .unwrap_or(f64::NAN);
            assert!((f.lifecycle_cost - lcc).abs() <= 0.01, "{value}: {lcc}");
            if let (Some(v), Some(c)) = (f.versus_baseline, &outcome.versus_baseline) {
                let ns = c.savings.net_savings.to_f64().unwrap_or(f64::NAN);
                assert!((v.net_savings - ns).abs() <= 0.01, "{value}: {ns}");
            } else {
                assert_eq!(i, study.baseline_index);
            }
        }
    }
}
