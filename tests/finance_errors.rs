//! Bad input gives a typed error naming the input and what would be valid:
//! never a panic, never NaN money.

mod finance_support;

use brayfin::finance::{
    build_ledger, Capital, CapitalPayment, FinanceError, FuelPrice, LedgerInputs, Overhaul,
};
use finance_support::{busy_inputs, date, dec, empty_inputs};
use rust_decimal::Decimal;

fn error_of(inputs: &LedgerInputs) -> FinanceError {
    let decimal = build_ledger(inputs).expect_err("Decimal ledger refuses the input");
    let float = build_ledger(&inputs.to_f64()).expect_err("f64 ledger refuses the input");
    assert_eq!(
        decimal.to_string(),
        float.to_string(),
        "both number types give the same error"
    );
    decimal
}

fn assert_message(error: &FinanceError, parts: &[&str]) {
    let message = error.to_string();
    for part in parts {
        assert!(message.contains(part), "{message:?} lacks {part:?}");
    }
}

#[test]
fn service_life_out_of_range() {
    for years in [0, 61] {
        let error = error_of(&empty_inputs(years, 0.03));
        assert_eq!(error, FinanceError::ServiceLife { value: years });
        assert_message(&error, &["service_life_years", "1 to 60"]);
    }
}

#[test]
fn rates_at_or_below_minus_one_hundred_percent() {
    for rate in [-1.0, -1.5, f64::NAN, f64::INFINITY] {
        let error = error_of(&empty_inputs(10, rate));
        assert!(
            matches!(
                error,
                FinanceError::OutOfRange {
                    field: "rates.discount_rate",
                    ..
                }
            ),
            "{error}"
        );
        assert_message(&error, &["rates.discount_rate", "greater than -1"]);
    }
    let mut inputs = busy_inputs();
    inputs.fuel.price = FuelPrice::Escalating {
        price_per_gj: dec("4.00"),
        escalation: -1.2,
    };
    assert_message(&error_of(&inputs), &["fuel.escalation", "greater than -1"]);
    let mut inputs = busy_inputs();
    inputs.carbon.escalation = -1.0;
    assert_message(&error_of(&inputs), &["carbon.escalation"]);
}

#[test]
fn negative_prices_are_refused() {
    let mut inputs = busy_inputs();
    inputs.variable_om.price = dec("-0.01");
    let error = error_of(&inputs);
    assert_message(&error, &["variable_om.price", "-0.01", "zero or more"]);
}

#[test]
fn overhaul_interval_must_be_positive() {
    for interval in [0.0, -8000.0, f64::NAN] {
        let mut inputs = busy_inputs();
        inputs.overhaul = Some(Overhaul {
            interval_hours: interval,
            hours_per_start: 0.0,
            interval_starts: None,
            outage_days: 0.0,
            outage_capacity_kw: 0.0,
            cost: dec("1.00"),
            escalation: 0.0,
        });
        assert_message(
            &error_of(&inputs),
            &["overhaul.interval_hours", "greater than 0"],
        );
    }
}

#[test]
fn price_path_missing_or_duplicate_year() {
    let mut inputs = empty_inputs(3, 0.03);
    inputs.fuel.price = FuelPrice::Path(vec![(2026, dec("4.00")), (2028, dec("4.20"))]);
    let error = error_of(&inputs);
    assert_eq!(
        error,
        FinanceError::PricePathMissingYear {
            year: 2027,
            first: 2026,
            last: 2028
        }
    );
    assert_message(&error, &["2027", "2026 to 2028"]);

    inputs.fuel.price = FuelPrice::Path(vec![
        (2026, dec("4.00")),
        (2027, dec("4.10")),
        (2027, dec("4.15")),
        (2028, dec("4.20")),
    ]);
    assert_eq!(
        error_of(&inputs),
        FinanceError::PricePathDuplicateYear { year: 2027 }
    );
    inputs.fuel.price = FuelPrice::Path(vec![
        (2026, dec("4.00")),
        (2027, dec("4.10")),
        (2028, dec("4.20")),
        (2031, dec("1")),
        (2031, dec("1")),
    ]);
    assert_eq!(
        error_of(&inputs),
        FinanceError::PricePathDuplicateYear { year: 2031 }
    );
}

#[test]
fn capital_dates_out_of_order_or_after_operation() {
    let payment = |y, m, d| CapitalPayment {
        date: date(y, m, d),
        amount: dec("1000.00"),
    };
    let mut inputs = empty_inputs(10, 0.05);
    inputs.capital = Capital::Schedule(vec![payment(2025, 6, 1), payment(2025, 6, 1)]);
    let error = error_of(&inputs);
    assert!(matches!(
        error,
        FinanceError::CapitalDatesOutOfOrder { index: 1, .. }
    ));
    assert_message(&error, &["capital[1]", "strictly increasing"]);
    inputs.capital = Capital::Schedule(vec![payment(2025, 6, 1), payment(2026, 1, 2)]);
    assert_message(
        &error_of(&inputs),
        &[
            "capital[1]",
            "2026-01-02",
            "on or before commercial operation",
        ],
    );
    inputs.capital = Capital::Schedule(Vec::new());
    assert_eq!(error_of(&inputs), FinanceError::EmptyCapitalSchedule);
}

#[test]
fn physics_out_of_range() {
    let mut inputs = busy_inputs();
    inputs.operation.operating_hours = 9000.0;
    assert_message(
        &error_of(&inputs),
        &["operation.operating_hours", "0 to 8784"],
    );
    let mut inputs = busy_inputs();
    inputs.operation.fuel_energy_gj_lhv = f64::NAN;
    assert_message(&error_of(&inputs), &["operation.fuel_energy_gj_lhv"]);
    let mut inputs = busy_inputs();
    inputs.fuel.hhv_over_lhv = 0.9;
    assert_message(
        &error_of(&inputs),
        &["fuel.hhv_over_lhv", "HHV is never below LHV"],
    );
}

/// Amounts beyond the money range are an error, not a panic or infinity.
#[test]
fn overflow_is_an_error() {
    let mut inputs = busy_inputs();
    inputs.carbon.price_per_tonne = Decimal::MAX;
    assert!(matches!(
        build_ledger(&inputs),
        Err(FinanceError::Overflow { .. })
    ));
    let mut inputs = busy_inputs();
    inputs.fuel.price = FuelPrice::Escalating {
        price_per_gj: dec("4.00"),
        escalation: 1e12,
    };
    for error in [
        build_ledger(&inputs).unwrap_err(),
        build_ledger(&inputs.to_f64()).unwrap_err(),
    ] {
        assert!(
            matches!(
                error,
                FinanceError::Overflow {
                    stream: "fuel cost",
                    ..
                }
            ),
            "{error}"
        );
        assert_message(&error, &["fuel cost", "representable"]);
    }
}
