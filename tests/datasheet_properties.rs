//! Property tests: no datasheet makes the assessment panic, and a refused
//! datasheet is refused with a figure named or a reason given.

use brayfin::datasheet::{
    assess, CalibrationOptions, ComponentData, Datasheet, HeatRateBasis, Verdict,
};
use brayfin::fuel::Fuel;
use brayfin::offdesign::Ambient;
use proptest::prelude::*;

fn any_number() -> impl Strategy<Value = f64> {
    prop_oneof![
        4 => -1e6f64..1e6,
        1 => Just(f64::NAN),
        1 => Just(f64::INFINITY),
        1 => Just(0.0),
    ]
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 96, ..ProptestConfig::default() })]

    /// Anything at all: an answer or a typed error, never a panic.
    #[test]
    fn any_figures_give_an_answer_or_an_error(
        p in any_number(), hr in any_number(), m in any_number(), t in any_number(),
        r in proptest::option::of(any_number()), t3 in proptest::option::of(any_number()),
        ta in any_number(), pa in any_number(), rh in any_number(), hhv in any::<bool>(),
    ) {
        let sheet = Datasheet {
            net_output_kw: p,
            heat_rate_kj_per_kwh: hr,
            heat_rate_basis: if hhv { HeatRateBasis::Hhv } else { HeatRateBasis::Lhv },
            exhaust_flow_kg_per_s: m,
            exhaust_temperature_k: t,
            pressure_ratio: r,
            firing_temperature_k: t3,
            regenerator: None,
            rating: Ambient { temperature_k: ta, pressure_kpa: pa, relative_humidity: rh },
            fuel: Fuel::methane(),
        };
        match assess(&sheet, &ComponentData::default(), &CalibrationOptions::default()) {
            Ok(a) => prop_assert!(!a.implied.reasons.is_empty()),
            Err(e) => prop_assert!(e.field().is_some(), "{e}"),
        }
    }

    /// Figures near a real machine's (50–300 MW, heat rate 8 500–12 000
    /// kJ/kWh, 2.0–3.2 kg/s of exhaust per MW, 700–920 K): an answer always,
    /// and an impossible verdict always comes with a reason that names a
    /// figure.
    #[test]
    fn figures_near_a_machine_are_judged_with_reasons(
        p in 50_000.0f64..300_000.0, hr in 8_500.0f64..12_000.0, per_mw in 2.0f64..3.2,
        t in 700.0f64..920.0, r in proptest::option::of(8.0f64..35.0),
    ) {
        let sheet = Datasheet {
            net_output_kw: p,
            heat_rate_kj_per_kwh: hr,
            heat_rate_basis: HeatRateBasis::Lhv,
            exhaust_flow_kg_per_s: per_mw * p / 1000.0,
            exhaust_temperature_k: t,
            pressure_ratio: r,
            firing_temperature_k: None,
            regenerator: None,
            rating: Ambient::ISO,
            fuel: Fuel::methane(),
        };
        let a = assess(&sheet, &ComponentData::default(), &CalibrationOptions::default()).unwrap();
        if a.implied.verdict == Verdict::Impossible {
            prop_assert!(a.implied.reasons.iter().any(|r| r.contains("rating.") || r.contains("calibration")), "{:?}", a.implied.reasons);
        } else {
            prop_assert!(a.calibration.is_some());
        }
    }
}
