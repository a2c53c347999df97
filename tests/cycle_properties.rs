//! Property tests of the cycle solver: for random valid inputs the first law
//! closes (no internal failure), efficiency rises with turbine efficiency,
//! and no input of any kind makes it panic.

use brayfin::cycle::{
    solve, CycleError, EfficiencyBasis, EngineConfig, GasModel, Intercooler, IntercoolerExit,
    Regenerator, Reheat, Sizing,
};
use brayfin::fuel::Fuel;
use proptest::prelude::*;

fn gas_model() -> impl Strategy<Value = GasModel> {
    prop_oneof![
        Just(GasModel::cold_air_standard()),
        Just(GasModel::Air),
        Just(GasModel::Products),
    ]
}

prop_compose! {
    fn engine()(
        ambient in 230.0..320.0_f64,
        pressure in 60.0..110.0_f64,
        ratio in 2.0..45.0_f64,
        tit in 900.0..1900.0_f64,
        eta_c in 0.7..=1.0_f64,
        eta_t in 0.7..=1.0_f64,
        polytropic in any::<bool>(),
        losses in (0.0..0.03_f64, 0.0..0.03_f64, 0.0..0.06_f64),
        shaft in (0.95..=1.0_f64, 0.95..=1.0_f64, 0.0..0.03_f64, 0.97..=1.0_f64),
        regenerator in proptest::option::of((0.5..=1.0_f64, 0.0..0.04_f64, 0.0..0.04_f64)),
        intercool in proptest::option::of(0.3..=1.0_f64),
        reheat in proptest::option::of(0.9..=1.0_f64),
        sizing in proptest::option::of(1_000.0..300_000.0_f64),
    ) -> EngineConfig {
        EngineConfig {
            ambient_temperature_k: ambient,
            ambient_pressure_kpa: pressure,
            pressure_ratio: ratio,
            turbine_inlet_temperature_k: tit,
            compressor_efficiency: eta_c,
            turbine_efficiency: eta_t,
            efficiency_basis: if polytropic { EfficiencyBasis::Polytropic } else { EfficiencyBasis::Isentropic },
            inlet_pressure_loss: losses.0,
            exhaust_pressure_loss: losses.1,
            combustor_pressure_loss: losses.2,
            mechanical_efficiency: shaft.0,
            generator_efficiency: shaft.1,
            auxiliary_load_fraction: shaft.2,
            combustion_efficiency: shaft.3,
            regenerator: regenerator.map(|(e, a, g)| Regenerator {
                effectiveness: e,
                air_side_pressure_loss: a,
                gas_side_pressure_loss: g,
            }),
            intercooler: intercool.map(|e| Intercooler {
                pressure_split: None,
                exit: IntercoolerExit::Effectiveness(e),
            }),
            reheat: reheat.map(|f| Reheat { pressure_split: None, temperature_k: tit * f }),
            sizing: sizing.map(Sizing::NetOutputKw),
        }
    }
}

fn fuel() -> impl Strategy<Value = Fuel> {
    (0.5..1.0_f64, 0.0..0.2_f64, 0.0..0.1_f64, 0.0..0.05_f64).prop_map(|(ch4, c2, h2, n2)| {
        let total = ch4 + c2 + h2 + n2;
        Fuel::from_composition(&[
            ("CH4", ch4 / total),
            ("C2H6", c2 / total),
            ("H2", h2 / total),
            ("N2", n2 / total),
        ])
        .expect("normalised composition")
    })
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(400))]

    /// Every solve of valid inputs either closes the first law to 1e-9 of
    /// the heat input with finite, sensible outputs, or is refused as an
    /// input problem; it never fails internally.
    #[test]
    fn energy_balance_closes_or_input_is_refused(cfg in engine(), gas in gas_model(), fuel in fuel()) {
        match solve(&cfg, &gas, &fuel) {
            Ok(r) => {
                prop_assert!(r.energy_balance_residual_kj_per_kg.abs() <= 1e-9 * r.heat_input_kj_per_kg);
                prop_assert!(r.thermal_efficiency > 0.0 && r.thermal_efficiency < 1.0);
                prop_assert!(r.heat_rate_kj_per_kwh > 3600.0);
                for s in &r.states {
                    prop_assert!(s.temperature_k.is_finite() && s.pressure_kpa > 0.0);
                    prop_assert!(s.enthalpy_kj_per_kg.is_finite() && s.entropy_kj_per_kg_k.is_finite());
                }
                if let Some(f) = r.flows {
                    prop_assert!(f.air_flow_kg_per_s > 0.0 && f.fuel_flow_kg_per_s > 0.0);
                }
            }
            Err(e) => prop_assert!(e.is_input_error(), "internal failure: {e}"),
        }
    }

    /// Raising the turbine efficiency never lowers the thermal efficiency.
    #[test]
    fn efficiency_rises_with_turbine_efficiency(
        cfg in engine(), gas in gas_model(), fuel in fuel(), step in 0.005..0.1_f64,
    ) {
        let better = EngineConfig {
            turbine_efficiency: (cfg.turbine_efficiency + step).min(1.0),
            ..cfg.clone()
        };
        prop_assume!(better.turbine_efficiency > cfg.turbine_efficiency);
        if let (Ok(a), Ok(b)) = (solve(&cfg, &gas, &fuel), solve(&better, &gas, &fuel)) {
            prop_assert!(
                b.thermal_efficiency > a.thermal_efficiency,
                "η_t {} → {}: efficiency {} → {}",
                cfg.turbine_efficiency, better.turbine_efficiency,
                a.thermal_efficiency, b.thermal_efficiency
            );
        }
    }

    /// Any numbers at all, including NaN, infinities and negatives: an error
    /// or a result, never a panic.
    #[test]
    fn arbitrary_numbers_never_panic(
        values in proptest::collection::vec(
            prop_oneof![any::<f64>(), -10.0..4000.0_f64, Just(f64::NAN), Just(0.0), Just(1.0)],
            20,
        ),
        gas in gas_model(),
        flags in any::<(bool, bool, bool, bool)>(),
    ) {
        let v = |i: usize| values[i];
        let cfg = EngineConfig {
            ambient_temperature_k: v(0),
            ambient_pressure_kpa: v(1),
            pressure_ratio: v(2),
            turbine_inlet_temperature_k: v(3),
            compressor_efficiency: v(4),
            turbine_efficiency: v(5),
            efficiency_basis: if flags.0 { EfficiencyBasis::Polytropic } else { EfficiencyBasis::Isentropic },
            inlet_pressure_loss: v(6),
            exhaust_pressure_loss: v(7),
            combustor_pressure_loss: v(8),
            combustion_efficiency: v(9),
            mechanical_efficiency: v(10),
            generator_efficiency: v(11),
            auxiliary_load_fraction: v(12),
            regenerator: flags.1.then(|| Regenerator {
                effectiveness: v(13),
                air_side_pressure_loss: v(14),
                gas_side_pressure_loss: v(15),
            }),
            intercooler: flags.2.then(|| Intercooler {
                pressure_split: Some(v(16)),
                exit: IntercoolerExit::TemperatureK(v(17)),
            }),
            reheat: flags.3.then(|| Reheat { pressure_split: Some(v(18)), temperature_k: v(19) }),
            sizing: None,
        };
        let outcome: Result<_, CycleError> = solve(&cfg, &gas, &Fuel::methane());
        if let Err(e) = outcome {
            prop_assert!(!e.to_string().is_empty());
        }
        let cold = GasModel::ColdAir { cp_kj_per_kg_k: v(0), k: v(1) };
        let _ = solve(&EngineConfig::ideal(10.0, 1400.0), &cold, &Fuel::methane());
    }

    /// Fuel text of any shape: an error or a fuel, never a panic.
    #[test]
    fn arbitrary_fuel_text_never_panics(text in ".{0,60}", pairs in "[A-Za-z0-9]{1,6}=[-0-9.eE]{0,8}(,[A-Za-z0-9]{1,6}=[-0-9.eE]{0,8}){0,4}") {
        let _ = Fuel::parse(&text);
        let _ = Fuel::parse(&pairs);
    }
}
