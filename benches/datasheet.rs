//! Datasheet work per bid: the energy balance, the calibration for each
//! set of stated figures, and the whole assessment. The datasheet is made
//! by the design solver from an F-class-like engine (pressure ratio 17,
//! firing 1 700 K, polytropic 0.90/0.89, 20 % cooling, ISO rating); every
//! fit starts away from it (efficiency 0.91; firing 1 500 K and ratio 15
//! where not stated).

use brayfin::cycle::{self, EfficiencyBasis, EngineConfig, GasModel, Sizing};
use brayfin::datasheet::{
    assess, calibrate, energy_balance, CalibrationOptions, ComponentData, Datasheet, HeatRateBasis,
};
use brayfin::fuel::Fuel;
use brayfin::offdesign::Ambient;
use criterion::{black_box, criterion_group, criterion_main, Criterion};

fn sheet(ratio: bool, firing: bool) -> Datasheet {
    let o = CalibrationOptions::default();
    let config = EngineConfig {
        compressor_efficiency: 0.90,
        turbine_efficiency: 0.89,
        efficiency_basis: EfficiencyBasis::Polytropic,
        inlet_pressure_loss: o.inlet_pressure_loss,
        exhaust_pressure_loss: o.exhaust_pressure_loss,
        combustor_pressure_loss: o.combustor_pressure_loss,
        mechanical_efficiency: 0.975f64.sqrt(),
        generator_efficiency: 0.975f64.sqrt(),
        sizing: Some(Sizing::NetOutputKw(250_000.0)),
        ..EngineConfig::ideal(17.0, 1700.0)
    };
    let detail = cycle::Detail {
        turbine_cooling: o.cooling_for(1700.0),
        relative_humidity: 0.6,
    };
    let fuel = Fuel::methane();
    let r = cycle::solve_detailed(&config, &detail, &GasModel::Products, &fuel)
        .expect("the bench engine solves");
    let flows = r.flows.expect("sized");
    Datasheet {
        net_output_kw: flows.net_output_kw,
        heat_rate_kj_per_kwh: r.heat_rate_kj_per_kwh,
        heat_rate_basis: HeatRateBasis::Lhv,
        exhaust_flow_kg_per_s: flows.exhaust_flow_kg_per_s,
        exhaust_temperature_k: r.exhaust_temperature_k,
        pressure_ratio: ratio.then_some(17.0),
        firing_temperature_k: firing.then_some(1700.0),
        regenerator: None,
        rating: Ambient::ISO,
        fuel,
    }
}

fn bench(c: &mut Criterion) {
    let options = CalibrationOptions::default();
    let both = sheet(true, true);
    c.bench_function("datasheet/energy_balance", |b| {
        b.iter(|| energy_balance(black_box(&both)))
    });
    for (name, s) in [
        ("datasheet/calibrate_ratio_and_firing", sheet(true, true)),
        ("datasheet/calibrate_ratio", sheet(true, false)),
        ("datasheet/calibrate_firing", sheet(false, true)),
        ("datasheet/calibrate_neither", sheet(false, false)),
    ] {
        c.bench_function(name, |b| b.iter(|| calibrate(black_box(&s), &options)));
    }
    let none = sheet(false, false);
    c.bench_function("datasheet/assess_neither", |b| {
        b.iter(|| assess(black_box(&none), &ComponentData::default(), &options))
    });
}

criterion_group!(benches, bench);
criterion_main!(benches);
