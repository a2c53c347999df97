//! Off-design points of a fixed machine: the demo's regenerated bid
//! (pressure ratio 10, 1 450 K, regenerator 84 %) with products gas.

use brayfin::cycle::{EfficiencyBasis, EngineConfig, GasModel, Regenerator, Sizing};
use brayfin::fuel::Fuel;
use brayfin::offdesign::{Ambient, Control, Load, Machine};
use criterion::{black_box, criterion_group, criterion_main, Criterion};

fn regenerated() -> EngineConfig {
    EngineConfig {
        compressor_efficiency: 0.865,
        turbine_efficiency: 0.895,
        efficiency_basis: EfficiencyBasis::Isentropic,
        inlet_pressure_loss: 0.01,
        exhaust_pressure_loss: 0.015,
        combustor_pressure_loss: 0.04,
        combustion_efficiency: 0.995,
        mechanical_efficiency: 0.99,
        generator_efficiency: 0.982,
        auxiliary_load_fraction: 0.015,
        regenerator: Some(Regenerator {
            effectiveness: 0.84,
            air_side_pressure_loss: 0.025,
            gas_side_pressure_loss: 0.035,
        }),
        sizing: Some(Sizing::NetOutputKw(50_000.0)),
        ..EngineConfig::ideal(10.0, 1450.0)
    }
}

fn bench(c: &mut Criterion) {
    let fuel = Fuel::parse("methane").expect("methane is a known fuel");
    let machine = Machine::calibrate(
        &regenerated(),
        0.0,
        Ambient::dry(288.15, 101.325),
        Control::default(),
        GasModel::Products,
        &fuel,
    )
    .expect("the bench machine calibrates");
    let hot = Ambient::dry(303.15, 101.325);
    let cold = Ambient::dry(278.15, 101.325);
    let mut group = c.benchmark_group("offdesign");
    group.bench_function("products_regenerated_base_load_30C", |b| {
        b.iter(|| machine.solve(black_box(hot), black_box(Load::BASE)))
    });
    group.bench_function("products_regenerated_base_load_5C", |b| {
        b.iter(|| machine.solve(black_box(cold), black_box(Load::BASE)))
    });
    group.bench_function("products_regenerated_guide_vanes_70pct_30C", |b| {
        b.iter(|| machine.solve(black_box(hot), black_box(Load(0.7))))
    });
    group.bench_function("products_regenerated_minimum_airflow_40pct_30C", |b| {
        b.iter(|| machine.solve(black_box(hot), black_box(Load(0.4))))
    });
    group.finish();
}

/// What `brayfin offdesign scenarios/corvel-bay-peaker.toml --format json`
/// computes after reading its file: three machines calibrated, the default
/// grid (12 temperatures × 8 loads each) solved, the JSON rendered. The
/// whole-process figure (with start-up and the file read) is measured from
/// outside on the release binary; this is the library's share of it.
fn demo_grid(c: &mut Criterion) {
    use brayfin::analysis::engine::fuel_of;
    use brayfin::analysis::offdesign_grid::{solve_grid, GridRequest};
    use brayfin::report::model::Units;
    use brayfin::report::views::{offdesign::OffDesignView, View};
    let loaded = brayfin::scenario::load(std::path::Path::new("scenarios/corvel-bay-peaker.toml"))
        .expect("the demo loads");
    let scenario = &loaded.scenario;
    let fuel = fuel_of(&scenario.fuel).expect("the demo fuel");
    let request = GridRequest {
        candidate: None,
        temperatures_k: None,
        loads: None,
        pressure_kpa: scenario.site.ambient_pressure_kpa,
        relative_humidity: scenario.site.relative_humidity,
    };
    c.bench_function("offdesign_demo_default_grid_json", |b| {
        b.iter(|| {
            let grids = solve_grid(black_box(scenario), &fuel, &request).expect("the grid solves");
            OffDesignView::new(&grids, Units::Si)
                .json()
                .expect("JSON renders")
                .len()
        })
    });
}

criterion_group!(benches, bench, demo_grid);
criterion_main!(benches);
