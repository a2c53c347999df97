//! Datasheet checks: the energy balance worked by hand, datasheets that
//! cannot be true, optimistic ones, component data that disagree with a
//! rating, and input errors. Each check names its source.

mod datasheet_support;

use brayfin::datasheet::{
    assess, calibrate, energy_balance, BalanceStatus, CalibrationOptions, ComponentData, Datasheet,
    DatasheetError, Figure, HeatRateBasis, Verdict,
};
use brayfin::fuel::Fuel;
use brayfin::offdesign::Ambient;
use datasheet_support::{datasheet_of, f_class, Known};

fn plausible_sheet() -> Datasheet {
    datasheet_of(&f_class(), &Fuel::methane(), true, true)
}

/// The energy balance of one datasheet, step by step, with published
/// property values instead of the library's polynomials.
///
/// Datasheet: 100 MW net, heat rate 10 000 kJ/kWh (LHV), exhaust 315 kg/s
/// at 800 K, rated at 25 °C (298.15 K, so the inlet air carries no energy
/// above the LHV reference), 101.325 kPa, dry air, methane.
#[test]
fn energy_balance_worked_by_hand() {
    let sheet = Datasheet {
        net_output_kw: 100_000.0,
        heat_rate_kj_per_kwh: 10_000.0,
        heat_rate_basis: HeatRateBasis::Lhv,
        exhaust_flow_kg_per_s: 315.0,
        exhaust_temperature_k: 800.0,
        pressure_ratio: None,
        firing_temperature_k: None,
        regenerator: None,
        rating: Ambient::dry(298.15, 101.325),
        fuel: Fuel::methane(),
    };
    // Step 1: fuel energy Q = HR · P / 3600 = 277 777.8 kW.
    let q = 10_000.0 * 100_000.0 / 3600.0;
    // Step 2: fuel flow. Methane LHV: ΔcH° = −890.63 kJ/mol (HHV, NIST
    // Chemistry WebBook) less 2 × 44.00 kJ/mol of water vaporised at 25 °C
    // (NIST), over M = 16.043 g/mol: 50.03 MJ/kg.
    let lhv_kj_per_kmol = (890.63 - 2.0 * 44.00) * 1000.0;
    let n_fuel = q / lhv_kj_per_kmol; // kmol/s
    let m_fuel = n_fuel * 16.043;
    // Step 3: air flow = exhaust − fuel; air kmol of each species from the
    // dry-air composition (N2 0.78084, O2 0.20946, Ar 0.00934, CO2 0.00036,
    // common practice) and atomic masses (IUPAC, from memory).
    let m_air = 315.0 - m_fuel;
    let x = [0.78084, 0.20946, 0.00934, 0.00036];
    let molar = [28.014, 31.998, 39.948, 44.009];
    let m_mix: f64 = x.iter().zip(molar).map(|(x, m)| x * m).sum();
    let n_air = m_air / m_mix;
    // Step 4: CH4 + 2 O2 → CO2 + 2 H2O.
    let n_n2 = n_air * x[0];
    let n_o2 = n_air * x[1] - 2.0 * n_fuel;
    let n_ar = n_air * x[2];
    let n_co2 = n_air * x[3] + n_fuel;
    let n_h2o = 2.0 * n_fuel;
    // Step 5: H(800 K) − H(298.15 K), kJ/mol, NIST-JANAF tables (from
    // memory): N2 15.046, O2 15.835, CO2 22.806, H2O(g) 18.002; Ar,
    // monatomic, cp = 5/2 R = 20.786 J/(mol·K) × 501.85 K.
    let exhaust_kw = 1000.0
        * (n_n2 * 15.046
            + n_o2 * 15.835
            + n_ar * 20.786e-3 * 501.85
            + n_co2 * 22.806
            + n_h2o * 18.002);
    // Step 6: remainder.
    let remainder = q - 100_000.0 - exhaust_kw;
    let fraction = remainder / q;

    let b = energy_balance(&sheet).unwrap();
    assert!((b.fuel_energy_kw - q).abs() < 1e-6);
    // Fuel flow: the library's LHV from GRI-Mech 3.0 data agrees with NIST
    // to about 0.02 %.
    assert!(
        (b.fuel_flow_kg_per_s / m_fuel - 1.0).abs() < 5e-4,
        "{} vs {m_fuel}",
        b.fuel_flow_kg_per_s
    );
    // Exhaust energy: NASA polynomials agree with JANAF to about 0.1 % in
    // enthalpy differences (REFERENCES.md); allow 0.2 %.
    assert!(
        (b.exhaust_energy_kw / exhaust_kw - 1.0).abs() < 2e-3,
        "{} vs {exhaust_kw}",
        b.exhaust_energy_kw
    );
    // So the remainder agrees to 0.2 % of 62 % of Q: about 0.12 points.
    assert!(
        (b.remainder_fraction - fraction).abs() < 1.5e-3,
        "{} vs {fraction}",
        b.remainder_fraction
    );
    assert!((b.remainder_kw - (b.fuel_energy_kw - 100_000.0 - b.exhaust_energy_kw)).abs() < 1e-6);
    // By hand: about 2.2 % of fuel energy, inside 0.5–4 %.
    assert!(fraction > 0.015 && fraction < 0.03, "{fraction}");
    assert_eq!(b.status, BalanceStatus::Plausible);
    assert!(b.closures.is_empty());
}

/// A solved cycle closes the datasheet balance with its electro-mechanical
/// losses alone (the cycle's first law, DESIGN.md): the remainder equals
/// shaft power less net output.
#[test]
fn remainder_of_a_solved_engine_is_its_electro_mechanical_loss() {
    let known = f_class();
    let sheet = plausible_sheet();
    let b = energy_balance(&sheet).unwrap();
    let loss = sheet.net_output_kw * (1.0 / known.electro_mechanical - 1.0);
    assert!(
        (b.remainder_kw / loss - 1.0).abs() < 1e-6,
        "{} vs {loss}",
        b.remainder_kw
    );
}

#[test]
fn hhv_heat_rate_gives_the_same_balance() {
    let lhv = plausible_sheet();
    let hhv = Datasheet {
        heat_rate_kj_per_kwh: lhv.heat_rate_kj_per_kwh * lhv.fuel.hhv_over_lhv(),
        heat_rate_basis: HeatRateBasis::Hhv,
        ..lhv.clone()
    };
    let a = energy_balance(&lhv).unwrap();
    let b = energy_balance(&hhv).unwrap();
    assert!((a.remainder_fraction - b.remainder_fraction).abs() < 1e-12);
}

#[test]
fn a_class_engine_within_the_state_of_the_art_is_plausible() {
    let a = assess(
        &plausible_sheet(),
        &ComponentData::default(),
        &CalibrationOptions::default(),
    )
    .unwrap();
    assert_eq!(
        a.implied.verdict,
        Verdict::Plausible,
        "{:?}",
        a.implied.reasons
    );
    let f = f_class();
    assert!((a.implied.firing_temperature_k.unwrap() - f.firing_k).abs() < 0.5);
    assert!(
        (a.implied.compressor_polytropic_efficiency.unwrap() - f.compressor_polytropic).abs()
            < 2e-4
    );
    assert!(a.disagreements.is_empty());
}

/// A heat rate 15 % too low for the exhaust energy: output plus exhaust
/// exceed the fuel energy (first law). Refused by the calibration, judged
/// impossible, and each closure, applied alone, closes the balance.
#[test]
fn heat_rate_fifteen_percent_too_low_is_impossible() {
    let good = plausible_sheet();
    let bad = Datasheet {
        heat_rate_kj_per_kwh: good.heat_rate_kj_per_kwh * 0.85,
        ..good.clone()
    };
    let b = energy_balance(&bad).unwrap();
    assert_eq!(b.status, BalanceStatus::Negative);
    let text = b.describe();
    for key in [
        "rating.heat_rate",
        "heat rate (rating.heat_rate) up by",
        "exhaust temperature (rating.exhaust_temperature) down by",
        "exhaust flow (rating.exhaust_flow) down by",
    ] {
        assert!(text.contains(key), "{text}");
    }
    assert_eq!(b.closures.len(), 3, "{text}");
    for c in &b.closures {
        let moved = match c.figure {
            Figure::HeatRate => Datasheet {
                heat_rate_kj_per_kwh: c.needed,
                ..bad.clone()
            },
            Figure::ExhaustTemperature => Datasheet {
                exhaust_temperature_k: c.needed,
                ..bad.clone()
            },
            Figure::ExhaustFlow => Datasheet {
                exhaust_flow_kg_per_s: c.needed,
                ..bad.clone()
            },
        };
        let closed = energy_balance(&moved).unwrap();
        assert!(
            closed.remainder_fraction.abs() < 1e-8,
            "{:?}: {}",
            c.figure,
            closed.remainder_fraction
        );
    }
    // The heat rate must rise by about what was taken off less the
    // original remainder: 1/0.85 − 1 = 17.6 %, less about 1 %.
    let hr = b
        .closures
        .iter()
        .find(|c| c.figure == Figure::HeatRate)
        .unwrap();
    let up = hr.needed / hr.stated - 1.0;
    assert!(up > 0.15 && up < 0.176, "{up}");

    match calibrate(&bad, &CalibrationOptions::default()) {
        Err(DatasheetError::Impossible(m)) => {
            assert!(m.contains("heat rate (rating.heat_rate) up by"), "{m}")
        }
        other => panic!("expected a refusal, got {other:?}"),
    }
    let a = assess(
        &bad,
        &ComponentData::default(),
        &CalibrationOptions::default(),
    )
    .unwrap();
    assert_eq!(a.implied.verdict, Verdict::Impossible);
    assert!(a.calibration.is_none());
    assert!(a.implied.loss_remainder_fraction < 0.0);
    assert!(
        a.implied
            .reasons
            .iter()
            .any(|r| r.contains("rating.heat_rate")),
        "{:?}",
        a.implied.reasons
    );
}

/// An exhaust flow below the air flow its output needs: 250 MW cannot come
/// from less air than the state-of-the-art specific work allows.
#[test]
fn exhaust_flow_below_the_air_its_output_needs_is_impossible() {
    let good = plausible_sheet();
    let bad = Datasheet {
        exhaust_flow_kg_per_s: good.exhaust_flow_kg_per_s * 0.5,
        ..good
    };
    match calibrate(&bad, &CalibrationOptions::default()) {
        Err(DatasheetError::Impossible(m)) => {
            assert!(
                m.contains("rating.exhaust_flow")
                    && m.contains("below the air flow its output needs"),
                "{m}"
            )
        }
        other => panic!("expected a refusal, got {other:?}"),
    }
    let a = assess(
        &bad,
        &ComponentData::default(),
        &CalibrationOptions::default(),
    )
    .unwrap();
    assert_eq!(a.implied.verdict, Verdict::Impossible);
    assert!(
        a.implied
            .reasons
            .iter()
            .any(|r| r.contains("below the air flow its output needs")),
        "{:?}",
        a.implied.reasons
    );
}

/// An exhaust colder than the stated pressure ratio allows: an F-class
/// datasheet restated with a pressure ratio of 6. At that ratio even ideal
/// turbomachinery burning the same fuel per kg of air leaves a hotter
/// exhaust (Brayton: T4/T3 = T1/T2 for the ideal cycle). The energy
/// balance alone does not see it.
#[test]
fn exhaust_below_what_its_pressure_ratio_allows_is_impossible() {
    let bad = Datasheet {
        pressure_ratio: Some(6.0),
        firing_temperature_k: None,
        regenerator: None,
        ..plausible_sheet()
    };
    assert_eq!(
        energy_balance(&bad).unwrap().status,
        BalanceStatus::Plausible
    );
    match calibrate(&bad, &CalibrationOptions::default()) {
        Err(DatasheetError::Impossible(m)) => assert!(
            m.contains("rating.exhaust_temperature") && m.contains("rating.pressure_ratio 6"),
            "{m}"
        ),
        other => panic!("expected a refusal, got {other:?}"),
    }
    let a = assess(
        &bad,
        &ComponentData::default(),
        &CalibrationOptions::default(),
    )
    .unwrap();
    assert_eq!(a.implied.verdict, Verdict::Impossible);
}

/// An engine beyond the state of the art (compressor polytropic 0.95,
/// firing 1 950 K) is possible physics but optimistic, and the reasons name
/// the values and the limits.
#[test]
fn beyond_the_state_of_the_art_is_optimistic() {
    let known = Known {
        compressor_polytropic: 0.95,
        firing_k: 1950.0,
        cooling: CalibrationOptions::default().cooling_for(1950.0),
        ..f_class()
    };
    let sheet = datasheet_of(&known, &Fuel::methane(), true, false);
    let a = assess(
        &sheet,
        &ComponentData::default(),
        &CalibrationOptions::default(),
    )
    .unwrap();
    assert_eq!(
        a.implied.verdict,
        Verdict::Optimistic,
        "{:?}",
        a.implied.reasons
    );
    let reasons = a.implied.reasons.join("\n");
    for key in [
        "compressor polytropic efficiency of 0.95",
        "above the state of the art 0.93",
        "firing temperature of 1950 K",
    ] {
        assert!(reasons.contains(key), "{reasons}");
    }
}

/// Too little left for losses (an electro-mechanical efficiency of 0.998,
/// a remainder near 0.1 % of fuel energy): optimistic, naming the moves to
/// 0.5 %.
#[test]
fn too_little_loss_is_optimistic() {
    let known = Known {
        electro_mechanical: 0.998,
        ..f_class()
    };
    let sheet = datasheet_of(&known, &Fuel::methane(), true, true);
    let a = assess(
        &sheet,
        &ComponentData::default(),
        &CalibrationOptions::default(),
    )
    .unwrap();
    assert_eq!(a.balance.status, BalanceStatus::TooLittleLoss);
    assert_eq!(a.implied.verdict, Verdict::Optimistic);
    assert!(
        a.implied.reasons[0].contains("to reach 0.5 %"),
        "{:?}",
        a.implied.reasons
    );
}

/// A candidate that states a firing temperature of 1 500 K beside a rating
/// made by a 1 700 K engine: the disagreement is reported with both
/// values; a stated efficiency that agrees is not.
#[test]
fn component_data_that_disagree_are_reported_with_both_values() {
    let sheet = datasheet_of(&f_class(), &Fuel::methane(), true, false);
    let stated = ComponentData {
        firing_temperature_k: Some(1500.0),
        compressor_polytropic_efficiency: Some(0.912),
        ..ComponentData::default()
    };
    let a = assess(&sheet, &stated, &CalibrationOptions::default()).unwrap();
    assert_eq!(a.disagreements.len(), 1, "{:?}", a.disagreements);
    let d = &a.disagreements[0];
    assert_eq!(d.field, "firing_temperature_k");
    assert_eq!(d.stated, 1500.0);
    assert!((d.implied - 1700.0).abs() < 0.5);
    let text = d.describe();
    assert!(
        text.contains("1500.0000") && text.contains("1700.0"),
        "{text}"
    );
}

#[test]
fn bad_figures_are_refused_naming_the_figure() {
    let good = plausible_sheet();
    let cases: Vec<(Datasheet, &str)> = vec![
        (
            Datasheet {
                heat_rate_kj_per_kwh: 3000.0,
                ..good.clone()
            },
            "rating.heat_rate",
        ),
        (
            Datasheet {
                heat_rate_kj_per_kwh: f64::NAN,
                ..good.clone()
            },
            "rating.heat_rate",
        ),
        (
            Datasheet {
                net_output_kw: -1.0,
                ..good.clone()
            },
            "net_output",
        ),
        (
            Datasheet {
                exhaust_flow_kg_per_s: 0.0,
                ..good.clone()
            },
            "rating.exhaust_flow",
        ),
        (
            Datasheet {
                exhaust_flow_kg_per_s: 5.0,
                ..good.clone()
            },
            "rating.exhaust_flow",
        ),
        (
            Datasheet {
                regenerator: Some(brayfin::cycle::Regenerator {
                    effectiveness: 1.2,
                    air_side_pressure_loss: 0.02,
                    gas_side_pressure_loss: 0.03,
                }),
                ..good.clone()
            },
            "regenerator.effectiveness",
        ),
        // Richer than stoichiometric: 20 kg/s of exhaust for about 12 kg/s
        // of fuel.
        (
            Datasheet {
                exhaust_flow_kg_per_s: 20.0,
                ..good.clone()
            },
            "rating.exhaust_flow",
        ),
        (
            Datasheet {
                exhaust_temperature_k: 280.0,
                ..good.clone()
            },
            "rating.exhaust_temperature",
        ),
        (
            Datasheet {
                pressure_ratio: Some(0.9),
                ..good.clone()
            },
            "rating.pressure_ratio",
        ),
        (
            Datasheet {
                firing_temperature_k: Some(700.0),
                ..good.clone()
            },
            "rating.firing_temperature",
        ),
        (
            Datasheet {
                rating: Ambient {
                    relative_humidity: 1.5,
                    ..good.rating
                },
                ..good.clone()
            },
            "rating.relative_humidity",
        ),
        (
            Datasheet {
                fuel: Fuel::from_heating_values(47_000.0, 52_000.0, 56.1).unwrap(),
                ..good.clone()
            },
            "fuel",
        ),
    ];
    for (sheet, field) in cases {
        let e = assess(
            &sheet,
            &ComponentData::default(),
            &CalibrationOptions::default(),
        )
        .unwrap_err();
        assert_eq!(e.field(), Some(field), "{e}");
        assert!(e.is_input_error());
        let e = calibrate(&sheet, &CalibrationOptions::default()).unwrap_err();
        assert_eq!(e.field(), Some(field), "{e}");
    }
}

/// More left over than machines lose: at an electro-mechanical efficiency
/// of 0.88 (remainder about 5.5 % of fuel energy) the datasheet is
/// doubtful (optimistic verdict, the moves named); at 0.78 (about 11 %)
/// no machine loses that much outside its gas path: impossible.
#[test]
fn too_much_loss_is_doubtful_then_impossible() {
    for (eps, verdict) in [(0.88, Verdict::Optimistic), (0.78, Verdict::Impossible)] {
        let known = Known {
            electro_mechanical: eps,
            ..f_class()
        };
        let sheet = datasheet_of(&known, &Fuel::methane(), true, true);
        let a = assess(
            &sheet,
            &ComponentData::default(),
            &CalibrationOptions::default(),
        )
        .unwrap();
        assert_eq!(a.balance.status, BalanceStatus::TooMuchLoss, "{eps}");
        assert_eq!(a.implied.verdict, verdict, "{eps}: {:?}", a.implied.reasons);
        assert!(
            a.implied.reasons[0].contains("exhaust flow (rating.exhaust_flow) up by"),
            "{:?}",
            a.implied.reasons
        );
    }
}
