//! Speed of `risk` and `sweep` on the three-candidate, 30-year demo
//! scenario `scenarios/corvel-bay-peaker.toml`, all cores.
//!
//! Targets (this 2-core machine; issue 12): risk with 100 000 samples
//! ≤ 3 s by the default route (a draw that moves a bid's engine re-solves
//! its rating point and scales the site figures); the same route checked
//! by a smaller `--exact` run; a sweep of 100 000 points ≤ 0.5 s. The one-point figures give the cost per point to set against a
//! general-purpose Python script (about 35 µs per point here).

use brayfin::analysis::engine::{engine_config_of, gas_model_of};
use brayfin::analysis::evaluate::{ledger_inputs, output_reference, solve};
use brayfin::analysis::point::{Figures, PointModel, Route};
use brayfin::analysis::risk::{run_risk, run_risk_by};
use brayfin::analysis::sweep::{plan, run_sweep};
use brayfin::scenario::{load, LoadedScenario};
use criterion::{black_box, criterion_group, criterion_main, Criterion};
use std::path::Path;
use std::time::Duration;

fn demo() -> LoadedScenario {
    let path = Path::new(env!("CARGO_MANIFEST_DIR")).join("scenarios/corvel-bay-peaker.toml");
    match load(&path) {
        Ok(loaded) => loaded,
        Err(e) => panic!("the demo scenario must load: {e}"),
    }
}

fn sweep_points(loaded: &LoadedScenario, vary: &str, candidate: Option<&str>) -> usize {
    let Ok(plan) = plan(loaded, &[vary.to_string()], candidate) else {
        panic!("the bench sweep must be valid: {vary}");
    };
    let mut rows = 0;
    match run_sweep(loaded, &plan, &mut |block| {
        rows += block.len();
        Ok(())
    }) {
        Ok(_) => rows,
        Err(e) => panic!("the bench sweep must run: {e}"),
    }
}

fn bench(c: &mut Criterion) {
    let loaded = demo();
    let mut group = c.benchmark_group("monte carlo and sweep");
    group.sample_size(10);
    group.measurement_time(Duration::from_secs(12));
    group.bench_function(
        "risk, 100 000 samples, 3 candidates, 30 years, default route",
        |b| b.iter(|| run_risk(black_box(&loaded), 100_000, 1, &mut |_, _| {})),
    );
    // Every draw moves two bids' engines: each re-calibrated and solved at
    // the site in full.
    group.bench_function("risk, 10 000 samples, --exact", |b| {
        b.iter(|| run_risk_by(black_box(&loaded), 10_000, 1, Route::Exact, &mut |_, _| {}))
    });
    // Every point changes every candidate's turbine: three cycle solves and
    // three ledgers per point.
    group.bench_function(
        "sweep, 100 000 points of candidate.turbine_efficiency",
        |b| {
            b.iter(|| {
                sweep_points(
                    black_box(&loaded),
                    "candidate.turbine_efficiency=0.85:0.949999:0.000001",
                    None,
                )
            })
        },
    );
    // Economics only: the cycles are reused, three ledgers per point.
    group.bench_function("sweep, 100 000 points of fuel.price", |b| {
        b.iter(|| sweep_points(black_box(&loaded), "fuel.price=2:6.99995:0.00005", None))
    });
    // One bid's figure, that bid reported: its cycle and ledger at each
    // point; the baseline's inputs are unchanged, so its ledger is reused.
    group.bench_function(
        "sweep, 100 000 points of candidate[premium].turbine_efficiency, --candidate premium",
        |b| {
            b.iter(|| {
                sweep_points(
                    black_box(&loaded),
                    "candidate[premium].turbine_efficiency=0.85:0.949999:0.000001",
                    Some("premium"),
                )
            })
        },
    );
    group.finish();

    // One point on one thread: what a single evaluation costs.
    let scenario = &loaded.scenario;
    let fuel = match brayfin::analysis::compare::study_fuel(&loaded) {
        Ok(f) => f,
        Err(e) => panic!("the demo fuel must solve: {e}"),
    };
    let n = scenario.candidates.len();
    let model = PointModel::new(
        scenario,
        fuel,
        0,
        vec!["candidate.turbine_efficiency".to_string()],
        vec![true; n],
    );
    let mut ws = model.workspace();
    let mut out = vec![Figures::default(); n];
    let mut efficiency = 0.85;
    c.bench_function("one point, 3 candidates, cycles and ledgers", |b| {
        b.iter(|| {
            // A new value each time, so no cycle is reused.
            efficiency = if efficiency > 0.95 {
                0.85
            } else {
                efficiency + 1e-6
            };
            model.evaluate(&mut ws, black_box(&[efficiency]), &mut out)
        })
    });
}

/// The two halves of a point on their own: the three cycle solves, and the
/// three `f64` ledgers from ready inputs.
fn parts(c: &mut Criterion) {
    let loaded = demo();
    let scenario = &loaded.scenario;
    let fuel = match brayfin::analysis::compare::study_fuel(&loaded) {
        Ok(f) => f,
        Err(e) => panic!("the demo fuel must solve: {e}"),
    };
    let engines: Vec<_> = scenario
        .candidates
        .iter()
        .map(|k| {
            (
                engine_config_of(k, &scenario.site),
                gas_model_of(&k.gas_model),
            )
        })
        .collect();
    c.bench_function("3 cycle solves (products gas)", |b| {
        b.iter(|| {
            for (config, gas) in &engines {
                let _ = black_box(brayfin::cycle::solve(black_box(config), gas, &fuel));
            }
        })
    });
    let Ok(reference) = output_reference(scenario, &fuel) else {
        panic!("the demo machines must solve");
    };
    let inputs: Vec<_> = scenario
        .candidates
        .iter()
        .map(|k| {
            let Ok(solved) = solve(scenario, k, &fuel) else {
                panic!("the demo cycles must solve");
            };
            match ledger_inputs(
                scenario,
                k,
                &fuel,
                (&solved.year, solved.site.net_output_kw),
                &reference,
            ) {
                Ok(i) => i.to_f64(),
                Err(e) => panic!("the demo ledger inputs must build: {e}"),
            }
        })
        .collect();
    // What a point spends building its `f64` ledger inputs through
    // `Decimal` (the ceiling of building them in `f64` directly).
    let solved: Vec<_> = scenario
        .candidates
        .iter()
        .map(|k| match solve(scenario, k, &fuel) {
            Ok(s) => s,
            Err(e) => panic!("the demo cycles must solve: {e}"),
        })
        .collect();
    c.bench_function("3 ledger inputs through Decimal, to f64", |b| {
        b.iter(|| {
            for (k, s) in scenario.candidates.iter().zip(&solved) {
                let built = brayfin::analysis::acceptance::contract_inputs(
                    scenario,
                    k,
                    &fuel,
                    s.site.rated_heat_rate_kj_per_kwh,
                    (black_box(&s.year), s.site.net_output_kw),
                    &reference,
                );
                let _ = black_box(built.map(|(i, _)| i.to_f64()));
            }
        })
    });
    c.bench_function("3 f64 ledgers, 30 years", |b| {
        b.iter(|| {
            for i in &inputs {
                let _ = black_box(brayfin::finance::summarize_ledger(black_box(i)));
            }
        })
    });
}

criterion_group!(benches, bench, parts);
criterion_main!(benches);
