//! Vendor curves against the calibrated machine.

mod datasheet_support;

use brayfin::datasheet::{
    calibrate, check_ambient_correction, check_part_load, AmbientCorrectionPoint,
    CalibrationOptions, DatasheetError, PartLoadPoint, CURVE_THRESHOLD,
};
use brayfin::fuel::Fuel;
use brayfin::offdesign::{Ambient, Control, Load, Machine};
use datasheet_support::{datasheet_of, f_class};

fn machine() -> Machine {
    let sheet = datasheet_of(&f_class(), &Fuel::methane(), true, false);
    calibrate(&sheet, &CalibrationOptions::default())
        .unwrap()
        .machine(Control::default())
        .unwrap()
}

/// A curve equal to the machine's own ratios except one point moved by
/// 0.05 (above the 0.02 threshold): exactly that point is returned, with
/// both values.
#[test]
fn part_load_point_off_the_physics_is_named() {
    let m = machine();
    let rating = m.rating();
    let base = m.solve(rating, Load::BASE).unwrap().heat_rate_kj_per_kwh;
    let mut curve: Vec<PartLoadPoint> = [1.0, 0.9, 0.8, 0.7, 0.6, 0.5]
        .iter()
        .map(|&load| PartLoadPoint {
            load,
            heat_rate_ratio: m.solve(rating, Load(load)).unwrap().heat_rate_kj_per_kwh / base,
        })
        .collect();
    assert!(check_part_load(&m, &curve, CURVE_THRESHOLD)
        .unwrap()
        .is_empty());
    let physics = curve[3].heat_rate_ratio;
    curve[3].heat_rate_ratio += 0.05;
    // Within the threshold: not returned.
    curve[1].heat_rate_ratio += 0.015;
    let off = check_part_load(&m, &curve, CURVE_THRESHOLD).unwrap();
    assert_eq!(off.len(), 1, "{off:?}");
    assert_eq!(off[0].index, 3);
    assert_eq!(off[0].at, 0.7);
    assert!((off[0].physics - physics).abs() < 1e-12);
    let text = off[0].describe();
    assert!(
        text.contains("part_load[3]") && text.contains("load 70.0 %"),
        "{text}"
    );
}

/// A vendor curve that keeps full output on a 35 °C day contradicts the
/// hot-day derate of a single-shaft machine (about 0.5–0.9 % output per K,
/// common practice; REFERENCES.md): that point's output ratio is named.
/// A curve built on the middle of that rule (0.7 %/K) at 5 °C and 25 °C
/// stays within the threshold of the physics.
#[test]
fn ambient_curve_without_a_hot_day_derate_is_named() {
    let m = machine();
    let rating = m.rating();
    let base = m.solve(rating, Load::BASE).unwrap();
    let physics = |t: f64| {
        let p = m
            .solve(
                Ambient {
                    temperature_k: t,
                    ..rating
                },
                Load::BASE,
            )
            .unwrap();
        p.heat_rate_kj_per_kwh / base.heat_rate_kj_per_kwh
    };
    let curve = [
        AmbientCorrectionPoint {
            temperature_k: 278.15,
            output_ratio: 1.0 + 0.007 * 10.0,
            heat_rate_ratio: physics(278.15),
        },
        AmbientCorrectionPoint {
            temperature_k: 298.15,
            output_ratio: 1.0 - 0.007 * 10.0,
            heat_rate_ratio: physics(298.15),
        },
        AmbientCorrectionPoint {
            temperature_k: 308.15,
            output_ratio: 1.0,
            heat_rate_ratio: physics(308.15),
        },
    ];
    let off = check_ambient_correction(&m, &curve, CURVE_THRESHOLD).unwrap();
    assert_eq!(off.len(), 1, "{off:?}");
    assert_eq!((off[0].index, off[0].quantity), (2, "output_ratio"));
    assert!(
        off[0].physics < 0.92 && off[0].physics > 0.80,
        "{:?}",
        off[0]
    );
}

#[test]
fn curve_points_the_machine_cannot_run_are_refused_naming_the_point() {
    let m = machine();
    let below_minimum = [
        PartLoadPoint {
            load: 1.0,
            heat_rate_ratio: 1.0,
        },
        PartLoadPoint {
            load: 0.1,
            heat_rate_ratio: 2.0,
        },
    ];
    match check_part_load(&m, &below_minimum, CURVE_THRESHOLD) {
        Err(DatasheetError::Curve { curve, index, .. }) => {
            assert_eq!((curve, index), ("part_load", 1))
        }
        other => panic!("{other:?}"),
    }
    let bad_ratio = [AmbientCorrectionPoint {
        temperature_k: 288.15,
        output_ratio: -1.0,
        heat_rate_ratio: 1.0,
    }];
    let e = check_ambient_correction(&m, &bad_ratio, CURVE_THRESHOLD).unwrap_err();
    assert_eq!(e.field(), Some("ambient_correction"), "{e}");
    assert!(check_part_load(&m, &[], 0.0).is_err());
}
