//! Speed of `compare` on the Corvel Bay demo, whose year is an 8760-hour
//! weather file and dispatch profile (1354 run hours): loading the scenario
//! (both CSV files), every candidate solved over its year (a grid of
//! off-design solves, interpolated per hour), the ledgers, the model and
//! the JSON. Target: the whole `compare` process ≤ 100 ms (release).
//! Also the year alone: one candidate's fixed machine over the year, on the
//! grid and exactly (every run hour solved), to show what the grid saves.

use brayfin::analysis::machine::machine_of;
use brayfin::analysis::operation::conditions;
use brayfin::analysis::site::{exact_points, year_points, SiteModel};
use brayfin::analysis::{build_model, ModelOptions};
use brayfin::report::json::JsonRenderer;
use brayfin::report::model::Units;
use brayfin::report::Renderer;
use criterion::{black_box, criterion_group, criterion_main, Criterion};
use std::path::Path;
use std::time::Duration;

const DEMO: &str = "scenarios/corvel-bay-peaker.toml";

fn bench(c: &mut Criterion) {
    let path = Path::new(env!("CARGO_MANIFEST_DIR")).join(DEMO);
    c.bench_function("year/compare_json_hourly_demo", |b| {
        b.iter(|| {
            let loaded = brayfin::scenario::load(black_box(&path)).expect("demo loads");
            let model = build_model(
                &loaded,
                &ModelOptions {
                    units: Units::Si,
                    sensitivity: false,
                },
            )
            .expect("model");
            JsonRenderer.render(&model).expect("json")
        })
    });
    let loaded = brayfin::scenario::load(&path).expect("demo loads");
    let scenario = &loaded.scenario;
    let fuel = brayfin::analysis::engine::fuel_of(&scenario.fuel).expect("fuel");
    let candidate = &scenario.candidates[0];
    let conds = conditions(scenario);
    let model = SiteModel::machine(
        machine_of(candidate, &scenario.site, &fuel).expect("machine"),
        candidate,
    );
    let p = scenario.site.ambient_pressure_kpa;
    c.bench_function("year/one_candidate_grid", |b| {
        b.iter(|| year_points(&model, candidate, p, black_box(&conds)).expect("grid"))
    });
    c.bench_function("year/one_candidate_exact", |b| {
        b.iter(|| exact_points(&model, candidate, p, black_box(&conds)).expect("exact"))
    });
}

criterion_group! {
    name = benches;
    config = Criterion::default()
        .sample_size(10)
        .measurement_time(Duration::from_secs(5))
        .warm_up_time(Duration::from_secs(1));
    targets = bench
}
criterion_main!(benches);
