//! Dotted key paths: listing, reading and setting numeric scenario values
//! (the interface of `--vary` and `[uncertainty]`).

use brayfin::scenario::{self, KeyError, Scenario};
use rust_decimal::Decimal;
use std::str::FromStr;

fn corvel() -> Scenario {
    match scenario::load(std::path::Path::new(
        "tests/fixtures/corvel-bay-blocks.toml",
    )) {
        Ok(loaded) => loaded.scenario,
        Err(error) => panic!("demo does not load: {error}"),
    }
}

#[test]
fn numeric_keys_cover_shared_generic_and_per_candidate_fields() {
    let s = corvel();
    let keys = s.numeric_keys();
    for key in [
        "site.ambient_temperature",
        "fuel.price",
        "fuel.escalation",
        "economics.discount_rate",
        "operation.hours_per_year",
        "candidate.turbine_efficiency",
        "candidate[premium].turbine_efficiency",
        "candidate.regenerator.effectiveness",
        "candidate[regenerated].regenerator.effectiveness",
    ] {
        assert!(keys.iter().any(|k| k == key), "{key} missing");
    }
    // Only one candidate has a regenerator; no heating-value keys for a
    // fuel given by composition.
    assert!(!keys
        .iter()
        .any(|k| k == "candidate[standard].regenerator.effectiveness"));
    assert!(!keys.iter().any(|k| k == "fuel.lhv"));
    // Every listed key can be read.
    for key in &keys {
        let value = s.get_numeric(key);
        assert!(
            value.is_ok() || matches!(value, Err(KeyError::Ambiguous { .. })),
            "{key}: {value:?}"
        );
    }
}

#[test]
fn get_returns_internal_units() {
    let s = corvel();
    // 59 degF = 288.15 K.
    assert!((s.get_numeric("site.ambient_temperature").unwrap_or(0.0) - 288.15).abs() < 1e-9);
    // 3.85 USD/MMBtu = 3.85 / 1.055056 USD/GJ.
    let price = s.get_numeric("fuel.price").unwrap_or(0.0);
    assert!((price - 3.85 / 1.055056).abs() < 1e-12);
    assert_eq!(
        s.get_numeric("candidate[premium].turbine_efficiency"),
        Ok(0.915)
    );
    assert!(matches!(
        s.get_numeric("candidate.turbine_efficiency"),
        Err(KeyError::Ambiguous { .. })
    ));
    assert_eq!(s.get_numeric("candidate.net_output"), Ok(50_000.0));
}

#[test]
fn set_changes_one_or_every_candidate() {
    let mut s = corvel();
    assert_eq!(
        s.set_numeric("candidate[premium].turbine_efficiency", 0.9),
        Ok(())
    );
    assert_eq!(s.candidates[1].turbine_efficiency, 0.9);
    assert_eq!(s.candidates[0].turbine_efficiency, 0.89);
    assert_eq!(
        s.set_numeric("candidate.compressor_efficiency", 0.87),
        Ok(())
    );
    // Every candidate that states its components; Bid C's machine is
    // fitted to its datasheet, and a generic key passes over it.
    assert!(s.candidates[..2]
        .iter()
        .all(|c| c.compressor_efficiency == 0.87));
    assert!(s.candidates[2].fitted.is_some());
    assert_ne!(s.candidates[2].compressor_efficiency, 0.87);
    // Generic keys of optional parts reach only the candidates that have them.
    assert_eq!(
        s.set_numeric("candidate.regenerator.effectiveness", 0.8),
        Ok(())
    );
    assert_eq!(
        s.candidates[2].regenerator.map(|r| r.effectiveness),
        Some(0.8)
    );
}

#[test]
fn money_is_set_through_decimal() {
    let mut s = corvel();
    assert_eq!(s.set_numeric("fuel.price", 4.5), Ok(()));
    assert_eq!(
        s.fuel.price_per_gj,
        Decimal::from_str("4.5").unwrap_or_default()
    );
    assert_eq!(
        s.set_numeric("candidate[premium].capital_cost", 51_000_000.0),
        Ok(())
    );
    assert_eq!(s.candidates[1].capital_cost, Decimal::from(51_000_000));
}

#[test]
fn hours_per_year_scales_the_dispatch_profile() {
    let mut s = corvel();
    // 1800 + 1100 + 600 = 3500 h; doubling keeps the shares.
    assert_eq!(s.set_numeric("operation.hours_per_year", 7000.0), Ok(()));
    let hours: Vec<f64> = s.operation.dispatch.iter().map(|b| b.hours).collect();
    assert_eq!(hours, vec![3600.0, 2200.0, 1200.0]);
}

#[test]
fn out_of_range_and_cross_rule_violations_leave_the_scenario_unchanged() {
    let mut s = corvel();
    let before = s.clone();
    assert!(matches!(
        s.set_numeric("candidate[premium].turbine_efficiency", 1.2),
        Err(KeyError::OutOfRange { .. })
    ));
    assert!(matches!(
        s.set_numeric("economics.service_life_years", 30.5),
        Err(KeyError::OutOfRange { .. })
    ));
    assert!(matches!(
        s.set_numeric("operation.hours_per_year", 9000.0),
        Err(KeyError::OutOfRange { .. })
    ));
    // Turbine inlet below ambient breaks a cross rule.
    let error = s.set_numeric("candidate.turbine_inlet_temperature", 250.0);
    assert!(
        matches!(&error, Err(KeyError::OutOfRange { problem, .. }) if problem.contains("ambient")),
        "{error:?}"
    );
    assert_eq!(s, before);
}

#[test]
fn unknown_keys_suggest_the_nearest() {
    let mut s = corvel();
    assert_eq!(
        s.get_numeric("fuel.prise"),
        Err(KeyError::Unknown {
            key: "fuel.prise".into(),
            suggestion: Some("fuel.price".into())
        })
    );
    assert!(matches!(
        s.get_numeric("candidate.turbine_eficiency"),
        Err(KeyError::Unknown { suggestion: Some(k), .. }) if k == "candidate.turbine_efficiency"
    ));
    assert!(matches!(
        s.set_numeric("candidate[bid-z].turbine_efficiency", 0.9),
        Err(KeyError::UnknownCandidate { .. })
    ));
    assert!(matches!(
        s.set_numeric("candidate[standard].regenerator.effectiveness", 0.8),
        Err(KeyError::NotApplicable { .. })
    ));
    let text = s.get_numeric("fuel.prise").err().map(|e| e.to_string());
    assert!(text.is_some_and(|t| t.contains("did you mean fuel.price?")));
}

#[test]
fn uncertainty_values_are_in_internal_units() {
    let s = corvel();
    let price = s.uncertainty.iter().find(|u| u.key == "fuel.price");
    match price.and_then(|u| u.distribution) {
        Some(scenario::Distribution::LogNormal { mu, sigma }) => {
            // median 3.85 USD/MMBtu → ln(3.85 / 1.055056) of USD/GJ.
            assert!((mu - (3.85f64 / 1.055056).ln()).abs() < 1e-12);
            assert_eq!(sigma, 0.3);
        }
        other => panic!("fuel.price distribution: {other:?}"),
    }
    let turbine = s
        .uncertainty
        .iter()
        .find(|u| u.key == "candidate[premium].turbine_efficiency");
    assert_eq!(turbine.map(|u| u.truncate), Some(Some((0.89, 0.925))));
    assert_eq!(
        turbine.map(|u| (u.low, u.high)),
        Some((Some(0.905), Some(0.92)))
    );
}

/// A money value too large for a decimal amount is refused and leaves the
/// scenario exactly as it was, to the last decimal digit (found by the
/// fuzz test: restoring through `f64` used to round the price).
#[test]
fn an_unrepresentable_price_is_refused_without_touching_the_price() {
    let mut s = corvel();
    let before = s.clone();
    assert!(s.set_numeric("fuel.price", 5.750106367688286e72).is_err());
    assert_eq!(s, before);
    assert!(s
        .set_numeric("candidate[premium].capital_cost", 1e40)
        .is_err());
    assert_eq!(s, before);
}
