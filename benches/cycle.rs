//! Speed of one cycle solve: a simple cycle with a regenerator, each gas
//! model, plus the heaviest configuration (intercooler, reheat,
//! regenerator). Targets (median, this 2-core machine): cold-air ≤ 100 ns,
//! air ≤ 1 µs, products ≤ 2 µs.

use brayfin::cycle::{
    solve, EngineConfig, GasModel, Intercooler, IntercoolerExit, Regenerator, Reheat,
};
use brayfin::fuel::Fuel;
use criterion::{black_box, criterion_group, criterion_main, Criterion};

fn regenerated() -> EngineConfig {
    EngineConfig {
        compressor_efficiency: 0.86,
        turbine_efficiency: 0.89,
        combustor_pressure_loss: 0.03,
        regenerator: Some(Regenerator {
            effectiveness: 0.85,
            air_side_pressure_loss: 0.02,
            gas_side_pressure_loss: 0.03,
        }),
        ..EngineConfig::ideal(8.0, 1350.0)
    }
}

fn everything() -> EngineConfig {
    EngineConfig {
        intercooler: Some(Intercooler {
            pressure_split: None,
            exit: IntercoolerExit::Effectiveness(0.85),
        }),
        reheat: Some(Reheat {
            pressure_split: None,
            temperature_k: 1350.0,
        }),
        ..regenerated()
    }
}

fn bench(c: &mut Criterion) {
    let fuel = Fuel::methane();
    let simple = regenerated();
    let full = everything();
    for (name, gas) in [
        ("cold-air", GasModel::cold_air_standard()),
        ("air", GasModel::Air),
        ("products", GasModel::Products),
    ] {
        c.bench_function(&format!("regenerated simple cycle, {name}"), |b| {
            b.iter(|| solve(black_box(&simple), black_box(&gas), black_box(&fuel)))
        });
        c.bench_function(
            &format!("intercooled reheat regenerated cycle, {name}"),
            |b| b.iter(|| solve(black_box(&full), black_box(&gas), black_box(&fuel))),
        );
    }
}

criterion_group!(benches, bench);
criterion_main!(benches);
