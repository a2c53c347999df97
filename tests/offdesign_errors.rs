//! Bad off-design requests get one typed error each, naming the field.

mod offdesign_support;

use brayfin::offdesign::{Ambient, Control, Load, Machine, OffDesignError, Strategy};
use offdesign_support::{demo_candidates, demo_machine, dry_iso};

const DEMO: &str = "corvel-bay-peaker.toml";

#[test]
fn load_above_full_or_below_minimum_is_refused() {
    let machine = demo_machine(DEMO, "standard", Control::default());
    for (load, problem) in [(1.01, "above 100 %"), (0.2, "below the minimum load")] {
        let err = machine.solve(dry_iso(), Load(load)).unwrap_err();
        assert_eq!(err.field(), Some("load"));
        assert!(err.is_input_error());
        assert!(err.to_string().contains(problem), "{err}");
    }
    let err = machine.solve(dry_iso(), Load(f64::NAN)).unwrap_err();
    assert_eq!(err.field(), Some("load"));
}

#[test]
fn temperature_outside_property_data_or_characteristic_is_refused() {
    let machine = demo_machine(DEMO, "standard", Control::default());
    // 150 K is below the NASA-polynomial data (200 K); 400 K is inside it
    // but beyond the stated compressor characteristic.
    for t in [150.0, 400.0, f64::NAN] {
        let err = machine
            .solve(Ambient::dry(t, 101.325), Load::BASE)
            .unwrap_err();
        assert_eq!(err.field(), Some("ambient.temperature_k"), "{err}");
        assert!(err.is_input_error());
    }
}

#[test]
fn humidity_above_saturation_is_refused() {
    let machine = demo_machine(DEMO, "standard", Control::default());
    let wet = |t, p, rh| Ambient {
        temperature_k: t,
        pressure_kpa: p,
        relative_humidity: rh,
    };
    let err = machine
        .solve(wet(288.15, 101.325, 1.2), Load::BASE)
        .unwrap_err();
    assert_eq!(err.field(), Some("ambient.relative_humidity"));
    assert!(err.to_string().contains("saturation"), "{err}");
    // Saturated air at 45 °C holds 9.6 kPa of vapour (IAPWS-IF97), fine at
    // sea level; the same is accepted at 60 kPa, but not 100 % at 90 °C is
    // beyond the characteristic anyway, so check the cycle's own refusal.
    assert!(machine.solve(wet(318.15, 101.325, 1.0), Load::BASE).is_ok());
}

#[test]
fn control_limits_without_an_operating_point_are_refused() {
    let (_, config, gas, fuel) = demo_candidates(DEMO).remove(0);
    let build = |control: Control| Machine::calibrate(&config, 0.0, dry_iso(), control, gas, &fuel);
    // An exhaust limit below the rated exhaust: the rating itself breaks it.
    let err = build(Control {
        exhaust_temperature_limit_k: Some(700.0),
        ..Control::default()
    })
    .unwrap_err();
    assert_eq!(err.field(), Some("control.exhaust_temperature_limit_k"));
    for (control, field) in [
        (
            Control {
                minimum_airflow: 0.0,
                ..Control::default()
            },
            "control.minimum_airflow",
        ),
        (
            Control {
                minimum_load: 1.5,
                ..Control::default()
            },
            "control.minimum_load",
        ),
    ] {
        assert_eq!(build(control).unwrap_err().field(), Some(field));
    }
    // Firing-temperature control of a regenerated machine at 5 % load on a
    // cold day: the firing temperature needed leaves the turbine exit
    // colder than the compressor delivery, so no point exists.
    let (_, regen, gas, fuel) = demo_candidates(DEMO).remove(2);
    let machine = Machine::calibrate(
        &regen,
        0.0,
        dry_iso(),
        Control {
            strategy: Strategy::FiringTemperature,
            minimum_load: 0.05,
            ..Control::default()
        },
        gas,
        &fuel,
    )
    .unwrap();
    let err = machine
        .solve(Ambient::dry(263.15, 101.325), Load(0.05))
        .unwrap_err();
    assert!(matches!(err, OffDesignError::NoOperatingPoint(_)), "{err}");
    assert_eq!(err.field(), Some("control"));
}

#[test]
fn a_machine_without_size_is_refused() {
    let (_, mut config, gas, fuel) = demo_candidates(DEMO).remove(0);
    config.sizing = None;
    let err =
        Machine::calibrate(&config, 0.0, dry_iso(), Control::default(), gas, &fuel).unwrap_err();
    assert_eq!(err.field(), Some("net_output_kw"));
}
