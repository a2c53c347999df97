//! Impossible or out-of-range engines are refused with the field the
//! scenario file would name, never solved into a number.

use brayfin::cycle::{
    solve, CycleError, EngineConfig, GasModel, Intercooler, IntercoolerExit, Regenerator, Reheat,
};
use brayfin::fuel::Fuel;

fn field_of(cfg: &EngineConfig, gas: &GasModel) -> Option<&'static str> {
    let err = solve(cfg, gas, &Fuel::methane()).expect_err("must be refused");
    assert!(err.is_input_error(), "{err}");
    err.field()
}

#[test]
fn each_refusal_names_its_field() {
    let base = EngineConfig::ideal(10.0, 1400.0);
    let air = GasModel::Air;
    let cases: Vec<(EngineConfig, GasModel, Option<&str>)> = vec![
        (
            EngineConfig {
                turbine_inlet_temperature_k: 500.0,
                ..base.clone()
            },
            air,
            Some("turbine_inlet_temperature_k"),
        ),
        (
            EngineConfig {
                ambient_temperature_k: 150.0,
                ..base.clone()
            },
            air,
            Some("ambient_temperature_k"),
        ),
        (
            EngineConfig {
                pressure_ratio: 40.0,
                turbine_inlet_temperature_k: 1000.0,
                regenerator: Some(Regenerator {
                    effectiveness: 0.8,
                    air_side_pressure_loss: 0.0,
                    gas_side_pressure_loss: 0.0,
                }),
                ..base.clone()
            },
            air,
            Some("regenerator.effectiveness"),
        ),
        (
            EngineConfig {
                intercooler: Some(Intercooler {
                    pressure_split: None,
                    exit: IntercoolerExit::TemperatureK(150.0),
                }),
                ..base.clone()
            },
            air,
            Some("intercooler.exit_temperature_k"),
        ),
        (
            EngineConfig {
                reheat: Some(Reheat {
                    pressure_split: Some(50.0),
                    temperature_k: 1400.0,
                }),
                ..base.clone()
            },
            air,
            Some("reheat.pressure_split"),
        ),
        (
            EngineConfig {
                turbine_inlet_temperature_k: 2900.0,
                ..base.clone()
            },
            GasModel::Products,
            Some("turbine_inlet_temperature_k"),
        ),
        (
            EngineConfig {
                pressure_ratio: 1.02,
                combustor_pressure_loss: 0.05,
                ..base.clone()
            },
            air,
            Some("pressure_ratio"),
        ),
        (
            base.clone(),
            GasModel::ColdAir {
                cp_kj_per_kg_k: 1.005,
                k: 0.9,
            },
            Some("gas_model"),
        ),
        (
            EngineConfig {
                turbine_inlet_temperature_k: 700.0,
                compressor_efficiency: 0.7,
                turbine_efficiency: 0.7,
                ..base.clone()
            },
            air,
            None,
        ),
    ];
    for (cfg, gas, field) in cases {
        assert_eq!(field_of(&cfg, &gas), field, "{cfg:?}");
    }
}

#[test]
fn no_net_work_reports_both_works() {
    let cfg = EngineConfig {
        turbine_inlet_temperature_k: 700.0,
        compressor_efficiency: 0.7,
        turbine_efficiency: 0.7,
        ..EngineConfig::ideal(10.0, 1400.0)
    };
    match solve(&cfg, &GasModel::Air, &Fuel::methane()) {
        Err(CycleError::NoNetWork {
            turbine_work_kj_per_kg,
            compressor_work_kj_per_kg,
        }) => assert!(turbine_work_kj_per_kg < compressor_work_kj_per_kg),
        other => panic!("expected no net work, got {other:?}"),
    }
}
