//! The closed-form cold-air path against the generic solver (the same cycle
//! through inverse solves of the cold-air property model), and its state
//! table against the closed-form entropy of a perfect gas.
//!
//! For every validated configuration: where the closed form solves, the
//! generic solver solves too and agrees to 1e-12; where the generic solver
//! refuses (so the user gets its error), the closed form declines; and the
//! closed form declines no cycle the generic solver can solve.

use super::cold;
use super::components::AirStandard;
use super::config::{
    EfficiencyBasis, EngineConfig, Intercooler, IntercoolerExit, Regenerator, Reheat,
};
use super::solver::{self, Solved};
use crate::thermo::cold_air::ColdAir;
use crate::thermo::{GasProperties, REFERENCE_TEMPERATURE_K, STANDARD_PRESSURE_KPA};
use proptest::prelude::*;

const TOLERANCE: f64 = 1e-12;

fn close(a: f64, b: f64, scale: f64, what: &str) -> Result<(), TestCaseError> {
    prop_assert!(
        (a - b).abs() <= TOLERANCE * scale.max(a.abs()).max(b.abs()),
        "{what}: closed form {a}, generic {b}"
    );
    Ok(())
}

fn agree(fast: &Solved, slow: &Solved, cp: f64) -> Result<(), TestCaseError> {
    let ids = |s: &Solved| s.states.iter().map(|p| p.id).collect::<Vec<_>>();
    prop_assert_eq!(ids(fast), ids(slow));
    for (f, s) in fast.states.iter().zip(&slow.states) {
        prop_assert_eq!(f.name, s.name);
        close(f.temperature_k, s.temperature_k, 0.0, f.id)?;
        close(f.pressure_kpa, s.pressure_kpa, 0.0, f.id)?;
        close(f.enthalpy_kj_per_kg, s.enthalpy_kj_per_kg, 0.0, f.id)?;
        close(f.entropy_kj_per_kg_k, s.entropy_kj_per_kg_k, cp, f.id)?;
    }
    // Works and heats are differences of state enthalpies, so their rounding
    // is relative to the largest enthalpy in the cycle, not to the (possibly
    // tiny) heat input itself (a random engine with a heat input of
    // 0.026 kJ/kg differed by 5e-12 of it).
    let scale = slow
        .states
        .iter()
        .map(|p| p.enthalpy_kj_per_kg.abs())
        .fold(slow.heat_input.abs(), f64::max);
    close(
        fast.compressor_work,
        slow.compressor_work,
        scale,
        "compressor work",
    )?;
    close(fast.turbine_work, slow.turbine_work, scale, "turbine work")?;
    close(fast.heat_input, slow.heat_input, scale, "heat input")?;
    close(
        fast.heat_rejected,
        slow.heat_rejected,
        scale,
        "heat rejected",
    )?;
    close(fast.residual, slow.residual, scale, "residual")?;
    close(
        fast.exhaust_temperature_k,
        slow.exhaust_temperature_k,
        0.0,
        "exhaust",
    )?;
    prop_assert_eq!(fast.fuel_per_kg_air, 0.0);
    Ok(())
}

prop_compose! {
    fn gas()(cp in 0.5..1.5_f64, k in 1.1..1.7_f64) -> ColdAir {
        ColdAir::new(cp, k).expect("valid constants")
    }
}

prop_compose! {
    /// Engines over and beyond the useful range: some leave no net work,
    /// some put the turbine exit below the compressor exit (refused with a
    /// regenerator), some reheat below the high-pressure turbine exit.
    fn engine()(
        ambient in 200.0..330.0_f64,
        pressure in 50.0..120.0_f64,
        ratio in 1.2..60.0_f64,
        tit in 500.0..2200.0_f64,
        eta in (0.4..=1.0_f64, 0.4..=1.0_f64),
        polytropic in any::<bool>(),
        losses in (0.0..0.05_f64, 0.0..0.05_f64, 0.0..0.08_f64),
        eta_b in 0.9..=1.0_f64,
        regenerator in proptest::option::of((0.05..=1.0_f64, 0.0..0.05_f64, 0.0..0.05_f64)),
        intercooler in proptest::option::of((any::<bool>(), 0.1..0.9_f64, 0.2..=1.0_f64, any::<bool>())),
        reheat in proptest::option::of((any::<bool>(), 0.1..0.9_f64, 0.6..=1.1_f64)),
    ) -> EngineConfig {
        EngineConfig {
            ambient_temperature_k: ambient,
            ambient_pressure_kpa: pressure,
            pressure_ratio: ratio,
            turbine_inlet_temperature_k: tit,
            compressor_efficiency: eta.0,
            turbine_efficiency: eta.1,
            efficiency_basis: if polytropic {
                EfficiencyBasis::Polytropic
            } else {
                EfficiencyBasis::Isentropic
            },
            inlet_pressure_loss: losses.0,
            exhaust_pressure_loss: losses.1,
            combustor_pressure_loss: losses.2,
            combustion_efficiency: eta_b,
            regenerator: regenerator.map(|(e, a, g)| Regenerator {
                effectiveness: e,
                air_side_pressure_loss: a,
                gas_side_pressure_loss: g,
            }),
            intercooler: intercooler.map(|(split, at, value, by_temperature)| Intercooler {
                pressure_split: split.then(|| ratio.powf(at)),
                exit: if by_temperature {
                    IntercoolerExit::TemperatureK(ambient * (0.8 + value))
                } else {
                    IntercoolerExit::Effectiveness(value)
                },
            }),
            reheat: reheat.map(|(split, at, fraction)| Reheat {
                pressure_split: split.then(|| ratio.powf(at)),
                temperature_k: tit * fraction,
            }),
            ..EngineConfig::ideal(ratio, tit)
        }
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(2000))]

    #[test]
    fn closed_form_agrees_with_the_generic_solver(air in gas(), cfg in engine()) {
        prop_assume!(cfg.validate().is_ok());
        let eta_b = cfg.combustion_efficiency;
        let fast = cold::run(&cfg, &air, eta_b);
        let slow = solver::run(&cfg, &AirStandard::new(air, eta_b), 0.0);
        match (fast, slow) {
            (Some(fast), Ok(slow)) => agree(&fast, &slow, air.constant_cp_kj_per_kg_k())?,
            (None, Err(_)) => {}
            (Some(_), Err(e)) => prop_assert!(false, "closed form solved what the generic solver refuses: {e}"),
            (None, Ok(_)) => prop_assert!(false, "closed form declined a cycle the generic solver solves"),
        }
    }
}

/// Entropy of a perfect gas with the model's zeros (thermo::cold_air):
/// `s = cp ln(T / 298.15 K) − R ln(p / 101.325 kPa)`, per state, to 1e-12
/// (closed form, any thermodynamics text); isentropic ends share their
/// inlet's entropy.
#[test]
fn state_entropies_follow_the_perfect_gas_closed_form() {
    let air = ColdAir::new(1.005, 1.4).expect("valid constants");
    let (cp, r) = (1.005, air.gas_constant_kj_per_kg_k());
    let cfg = EngineConfig {
        ambient_pressure_kpa: 95.0,
        compressor_efficiency: 0.86,
        turbine_efficiency: 0.89,
        inlet_pressure_loss: 0.01,
        exhaust_pressure_loss: 0.02,
        combustor_pressure_loss: 0.03,
        regenerator: Some(Regenerator {
            effectiveness: 0.85,
            air_side_pressure_loss: 0.02,
            gas_side_pressure_loss: 0.03,
        }),
        intercooler: Some(Intercooler {
            pressure_split: None,
            exit: IntercoolerExit::Effectiveness(0.8),
        }),
        reheat: Some(Reheat {
            pressure_split: None,
            temperature_k: 1300.0,
        }),
        ..EngineConfig::ideal(12.0, 1350.0)
    };
    let solved = cold::run(&cfg, &air, 1.0).expect("a solvable cycle");
    assert_eq!(solved.states.len(), 14);
    for s in &solved.states {
        let exact = cp * (s.temperature_k / REFERENCE_TEMPERATURE_K).ln()
            - r * (s.pressure_kpa / STANDARD_PRESSURE_KPA).ln();
        assert!(
            (s.entropy_kj_per_kg_k - exact).abs() <= 1e-12 * cp,
            "{}: {} vs {exact}",
            s.id,
            s.entropy_kj_per_kg_k
        );
    }
    let entropy = |id: &str| {
        solved
            .states
            .iter()
            .find(|s| s.id == id)
            .map(|s| s.entropy_kj_per_kg_k)
            .expect("state present")
    };
    for (ideal, inlet) in [("2as", "1"), ("2s", "2b"), ("3as", "3"), ("4s", "3b")] {
        assert!((entropy(ideal) - entropy(inlet)).abs() <= 1e-12 * cp);
    }
}
