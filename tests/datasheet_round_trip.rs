//! Round trip: engines within state-of-the-art ranges → datasheet by the
//! design solver → calibration → the figures and the engine recovered.
//!
//! The engines are drawn (fixed seed) within current practice (common
//! practice, from memory): pressure ratio 10–35, firing 1 400–1 850 K,
//! compressor polytropic efficiency 0.87–0.93, electro-mechanical
//! efficiency 0.96–0.99, ambient −10 to 40 °C, 85–103 kPa, 0–90 % RH,
//! 5–400 MW. They follow the calibration's stated relations (turbine
//! efficiency 0.01 below the compressor's; cooling from the firing
//! temperature unless both pressure ratio and firing temperature are
//! stated, when it is drawn 0–25 %; the default efficiency when neither
//! is stated), because those are exactly what the data cannot determine.

mod datasheet_support;

use brayfin::datasheet::calibrate::{
    EXHAUST_FLOW_TOLERANCE, EXHAUST_TEMPERATURE_TOLERANCE_K, HEAT_RATE_TOLERANCE,
};
use brayfin::datasheet::{calibrate, CalibrationOptions};
use brayfin::fuel::Fuel;
use brayfin::offdesign::{Ambient, Control, Load};
use datasheet_support::{datasheet_of, Known};
use rand::{Rng, SeedableRng};
use rand_chacha::ChaCha8Rng;

/// Components recovered to: efficiency 2e-4, firing temperature 0.5 K,
/// pressure ratio 0.05 %, cooling 5e-4 of air, electro-mechanical
/// efficiency 2e-4. The fit solves to 1e-9 of each figure; these allow for
/// the conditioning of the two-unknown gas-path fit (a 0.05 K change of
/// exhaust temperature moves the efficiency by about 1e-4).
const ETA_TOL: f64 = 2e-4;
const FIRING_TOL_K: f64 = 0.5;
const RATIO_TOL: f64 = 5e-4;
const COOLING_TOL: f64 = 5e-4;

fn draw(rng: &mut ChaCha8Rng, case: usize) -> (Known, bool, bool) {
    let options = CalibrationOptions::default();
    let (state_ratio, state_firing) =
        [(true, true), (true, false), (false, true), (false, false)][case % 4];
    let firing_k = rng.gen_range(1400.0..1850.0);
    let eta = if state_ratio || state_firing {
        rng.gen_range(0.87..0.93)
    } else {
        options.compressor_polytropic_efficiency
    };
    let cooling = if state_ratio && state_firing {
        rng.gen_range(0.0..0.25)
    } else {
        options.cooling_for(firing_k)
    };
    let known = Known {
        pressure_ratio: rng.gen_range(10.0..35.0),
        firing_k,
        compressor_polytropic: eta,
        cooling,
        electro_mechanical: rng.gen_range(0.96..0.99),
        net_output_kw: rng.gen_range(5_000.0..400_000.0),
        rating: Ambient {
            temperature_k: rng.gen_range(263.15..313.15),
            pressure_kpa: rng.gen_range(85.0..103.0),
            relative_humidity: rng.gen_range(0.0..0.9),
        },
    };
    (known, state_ratio, state_firing)
}

#[test]
fn forty_random_engines_are_recovered_from_their_datasheets() {
    let mut rng = ChaCha8Rng::seed_from_u64(11);
    let fuels = [
        Fuel::methane(),
        Fuel::from_composition(&[
            ("CH4", 0.93),
            ("C2H6", 0.04),
            ("C3H8", 0.01),
            ("N2", 0.01),
            ("CO2", 0.01),
        ])
        .unwrap(),
    ];
    let mut done = 0;
    for case in 0..40 {
        let (known, state_ratio, state_firing) = draw(&mut rng, case);
        let fuel = &fuels[case % 2];
        let sheet = datasheet_of(&known, fuel, state_ratio, state_firing);
        let c = calibrate(&sheet, &CalibrationOptions::default())
            .unwrap_or_else(|e| panic!("case {case} {known:?}: {e}"));
        let r = c.residuals;
        let what = format!("case {case} {known:?} → {r:?}");
        assert!(r.heat_rate_relative.abs() <= HEAT_RATE_TOLERANCE, "{what}");
        assert!(
            r.exhaust_temperature_k.abs() <= EXHAUST_TEMPERATURE_TOLERANCE_K,
            "{what}"
        );
        assert!(
            r.exhaust_flow_relative.abs() <= EXHAUST_FLOW_TOLERANCE,
            "{what}"
        );
        assert!(r.net_output_relative.abs() <= 1e-12, "{what}");
        assert!(
            (c.compressor_polytropic_efficiency() - known.compressor_polytropic).abs() <= ETA_TOL,
            "{what}: η_c {}",
            c.compressor_polytropic_efficiency()
        );
        assert!(
            (c.firing_temperature_k() - known.firing_k).abs() <= FIRING_TOL_K,
            "{what}: T3 {}",
            c.firing_temperature_k()
        );
        assert!(
            (c.pressure_ratio() / known.pressure_ratio - 1.0).abs() <= RATIO_TOL,
            "{what}: r {}",
            c.pressure_ratio()
        );
        assert!(
            (c.turbine_cooling - known.cooling).abs() <= COOLING_TOL,
            "{what}: c {}",
            c.turbine_cooling
        );
        assert!(
            (c.electro_mechanical_efficiency() - known.electro_mechanical).abs() <= ETA_TOL,
            "{what}"
        );
        assert!(!c.assumptions.is_empty());
        // The fitted engine is a fixed machine whose rating point states
        // the datasheet's figures.
        let machine = c.machine(Control::default()).unwrap();
        let p = machine.solve(sheet.rating, Load::BASE).unwrap();
        assert!(
            (p.heat_rate_kj_per_kwh / sheet.heat_rate_kj_per_kwh - 1.0).abs()
                <= HEAT_RATE_TOLERANCE,
            "{what}"
        );
        assert!(
            (p.exhaust_temperature_k - sheet.exhaust_temperature_k).abs()
                <= EXHAUST_TEMPERATURE_TOLERANCE_K,
            "{what}"
        );
        assert!(
            (p.exhaust_flow_kg_per_s / sheet.exhaust_flow_kg_per_s - 1.0).abs()
                <= EXHAUST_FLOW_TOLERANCE,
            "{what}"
        );
        assert!(
            (p.net_output_kw / sheet.net_output_kw - 1.0).abs() <= 1e-9,
            "{what}"
        );
        done += 1;
    }
    assert_eq!(done, 40);
}

/// An engine that breaks the calibration's assumptions (larger pressure
/// losses, a 0.02 efficiency gap, 1 % auxiliary load, unequal mechanical
/// and generator efficiencies): the figures are still reproduced to the
/// tolerances, and the implied values move only by what the assumptions
/// shift (measured: compressor efficiency 0.895 for 0.910, firing
/// temperature 1 713 K for 1 700 K; checked within 0.02 and 30 K).
#[test]
fn figures_are_reproduced_when_the_engine_breaks_the_assumptions() {
    let known = datasheet_support::f_class();
    let mut engine = datasheet_support::config(&known);
    engine.inlet_pressure_loss = 0.02;
    engine.exhaust_pressure_loss = 0.03;
    engine.combustor_pressure_loss = 0.05;
    engine.turbine_efficiency = known.compressor_polytropic - 0.02;
    engine.auxiliary_load_fraction = 0.01;
    engine.mechanical_efficiency = 0.995;
    engine.generator_efficiency = 0.985;
    let fuel = Fuel::methane();
    let detail = brayfin::cycle::Detail {
        turbine_cooling: known.cooling,
        relative_humidity: known.rating.relative_humidity,
    };
    let r = brayfin::cycle::solve_detailed(
        &engine,
        &detail,
        &brayfin::cycle::GasModel::Products,
        &fuel,
    )
    .unwrap();
    let flows = r.flows.unwrap();
    let sheet = brayfin::datasheet::Datasheet {
        net_output_kw: flows.net_output_kw,
        heat_rate_kj_per_kwh: r.heat_rate_kj_per_kwh,
        heat_rate_basis: brayfin::datasheet::HeatRateBasis::Lhv,
        exhaust_flow_kg_per_s: flows.exhaust_flow_kg_per_s,
        exhaust_temperature_k: r.exhaust_temperature_k,
        pressure_ratio: Some(known.pressure_ratio),
        firing_temperature_k: None,
        regenerator: None,
        rating: known.rating,
        fuel,
    };
    let c = calibrate(&sheet, &CalibrationOptions::default()).unwrap();
    let res = c.residuals;
    assert!(
        res.heat_rate_relative.abs() <= HEAT_RATE_TOLERANCE,
        "{res:?}"
    );
    assert!(
        res.exhaust_temperature_k.abs() <= EXHAUST_TEMPERATURE_TOLERANCE_K,
        "{res:?}"
    );
    assert!(
        res.exhaust_flow_relative.abs() <= EXHAUST_FLOW_TOLERANCE,
        "{res:?}"
    );
    assert!(
        (c.compressor_polytropic_efficiency() - known.compressor_polytropic).abs() < 0.02,
        "{}",
        c.compressor_polytropic_efficiency()
    );
    assert!(
        (c.firing_temperature_k() - known.firing_k).abs() < 30.0,
        "{}",
        c.firing_temperature_k()
    );
    // The electro-mechanical efficiency absorbs the auxiliary load: the
    // energy balance sees only their product.
    let product = 0.995 * 0.985 * 0.99;
    assert!(
        (c.electro_mechanical_efficiency() - product).abs() < 1e-6,
        "{}",
        c.electro_mechanical_efficiency()
    );
}

/// The same datasheet stated on the HHV basis calibrates to the same
/// engine (the fuel's own HHV/LHV converts it).
#[test]
fn hhv_datasheet_calibrates_to_the_same_engine() {
    let lhv = datasheet_of(&datasheet_support::f_class(), &Fuel::methane(), true, false);
    let hhv = brayfin::datasheet::Datasheet {
        heat_rate_kj_per_kwh: lhv.heat_rate_kj_per_kwh * lhv.fuel.hhv_over_lhv(),
        heat_rate_basis: brayfin::datasheet::HeatRateBasis::Hhv,
        ..lhv.clone()
    };
    let a = calibrate(&lhv, &CalibrationOptions::default()).unwrap();
    let b = calibrate(&hhv, &CalibrationOptions::default()).unwrap();
    assert!((a.firing_temperature_k() - b.firing_temperature_k()).abs() < 1e-6);
    assert!(
        (a.compressor_polytropic_efficiency() - b.compressor_polytropic_efficiency()).abs() < 1e-9
    );
}

/// Regenerated machines (drawn, fixed seed: pressure ratio 4–12, firing
/// 1 200–1 500 K, compressor polytropic 0.86–0.91, effectiveness 0.75–0.90,
/// air-side loss 2 %, gas-side 3 %; recuperated industrial machines run at
/// such values, from memory): the datasheet's exhaust is the regenerator
/// gas exit, the regenerator is stated, and the engine is recovered to the
/// same tolerances as a simple cycle's.
#[test]
fn regenerated_engines_are_recovered_from_their_datasheets() {
    let mut rng = ChaCha8Rng::seed_from_u64(12);
    let options = CalibrationOptions::default();
    for case in 0..12 {
        let (state_ratio, state_firing) =
            [(true, true), (true, false), (false, true), (false, false)][case % 4];
        let firing_k = rng.gen_range(1200.0..1500.0);
        let known = Known {
            pressure_ratio: rng.gen_range(4.0..12.0),
            firing_k,
            compressor_polytropic: if state_ratio || state_firing {
                rng.gen_range(0.86..0.91)
            } else {
                options.compressor_polytropic_efficiency
            },
            cooling: if state_ratio && state_firing {
                rng.gen_range(0.0..0.1)
            } else {
                options.cooling_for(firing_k)
            },
            electro_mechanical: rng.gen_range(0.95..0.98),
            net_output_kw: rng.gen_range(3_000.0..60_000.0),
            rating: Ambient::ISO,
        };
        let regenerator = brayfin::cycle::Regenerator {
            effectiveness: rng.gen_range(0.75..0.90),
            air_side_pressure_loss: 0.02,
            gas_side_pressure_loss: 0.03,
        };
        let sheet = datasheet_support::datasheet_with(
            &known,
            Some(regenerator),
            &Fuel::methane(),
            state_ratio,
            state_firing,
        );
        let c =
            calibrate(&sheet, &options).unwrap_or_else(|e| panic!("case {case} {known:?}: {e}"));
        let what = format!("case {case} {known:?} → {:?}", c.residuals);
        assert!(
            c.residuals.heat_rate_relative.abs() <= HEAT_RATE_TOLERANCE,
            "{what}"
        );
        assert!(
            c.residuals.exhaust_temperature_k.abs() <= EXHAUST_TEMPERATURE_TOLERANCE_K,
            "{what}"
        );
        assert!(
            c.residuals.exhaust_flow_relative.abs() <= EXHAUST_FLOW_TOLERANCE,
            "{what}"
        );
        assert!(
            (c.compressor_polytropic_efficiency() - known.compressor_polytropic).abs() <= ETA_TOL,
            "{what}"
        );
        assert!(
            (c.firing_temperature_k() - known.firing_k).abs() <= FIRING_TOL_K,
            "{what}"
        );
        assert!(
            (c.pressure_ratio() / known.pressure_ratio - 1.0).abs() <= RATIO_TOL,
            "{what}"
        );
        assert!(
            (c.turbine_cooling - known.cooling).abs() <= COOLING_TOL,
            "{what}"
        );
        assert_eq!(c.config.regenerator, Some(regenerator));
        assert!(c
            .assumptions
            .iter()
            .any(|a| a.contains("regenerator as stated")));
        let machine = c.machine(Control::default()).unwrap();
        let p = machine.solve(sheet.rating, Load::BASE).unwrap();
        assert!(
            (p.stack_temperature_k - sheet.exhaust_temperature_k).abs()
                <= EXHAUST_TEMPERATURE_TOLERANCE_K,
            "{what}"
        );
    }
}
