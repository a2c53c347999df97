//! The analysis calendar, proration of partial years, construction capital
//! before the base date, and the degradation and overhaul model, each
//! against hand-computed values.

mod finance_support;

use brayfin::finance::{
    build_ledger, years_between, Calendar, Capital, CapitalPayment, Degradation, Overhaul, RowKind,
};
use finance_support::{busy_inputs, date, dec, empty_inputs};

/// Actual/actual (ISDA) day count (ISDA 2006 Definitions, 4.16(b), from
/// memory): days in a leap year count 1/366, others 1/365.
#[test]
fn actual_actual_year_fractions() {
    assert_eq!(years_between(date(2026, 1, 1), date(2036, 1, 1)), 10.0);
    let expected = 184.0 / 365.0 + 182.0 / 366.0; // 2027-07-01 → 2028-07-01
    assert!((years_between(date(2027, 7, 1), date(2028, 7, 1)) - expected).abs() < 1e-15);
    assert!((years_between(date(2028, 7, 1), date(2027, 7, 1)) + expected).abs() < 1e-15);
}

/// A 1 July start gives a first row to 31 December, full calendar years,
/// and a last row to the day before the 30th anniversary; hours prorate by
/// days over the days of the calendar year.
#[test]
fn mid_year_start_rows_and_proration() {
    let ledger = build_ledger(&busy_inputs()).expect("ledger");
    let operating: Vec<_> = ledger
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Operation)
        .collect();
    assert_eq!(operating.len(), 31);
    let first = operating[0];
    assert_eq!(
        (first.year, first.period_start, first.period_end),
        (2027, date(2027, 7, 1), date(2027, 12, 31))
    );
    assert!((first.operating_hours - 6000.0 * 184.0 / 365.0).abs() < 1e-9);
    let leap = operating[1];
    assert_eq!((leap.year, leap.operating_hours), (2028, 6000.0));
    let last = operating[30];
    assert_eq!(
        (last.year, last.period_start, last.period_end),
        (2057, date(2057, 1, 1), date(2057, 6, 30))
    );
    assert!((last.operating_hours - 6000.0 * 181.0 / 365.0).abs() < 1e-9);
    assert_eq!(
        ledger.summary.analysis.calendar.end_of_life,
        date(2057, 7, 1)
    );
    let residual = ledger.rows.last().unwrap();
    assert_eq!(
        (residual.kind, residual.period_start),
        (RowKind::Residual, date(2057, 7, 1))
    );
}

/// A 29 February start has its anniversaries on 28 February (chrono's
/// month arithmetic); a life outside 1–60 years is refused.
#[test]
fn leap_day_start_and_life_limits() {
    let calendar = Calendar::new(date(2028, 2, 29), 1).unwrap();
    assert_eq!(calendar.end_of_life, date(2029, 2, 28));
    let first = calendar.periods().next().unwrap();
    assert!((first.fraction_of_year - 307.0 / 366.0).abs() < 1e-15);
    assert!(Calendar::new(date(2028, 1, 1), 0).is_err());
    assert!(Calendar::new(date(2028, 1, 1), 61).is_err());
    assert_eq!(
        Calendar::new(date(2028, 1, 1), 60).unwrap().period_count(),
        60
    );
}

/// Capital paid two and one years before commercial operation is carried
/// forward: discount factors 1.07² = 1.1449 and 1.07 at 7 %.
#[test]
fn construction_capital_has_factors_above_one() {
    let mut inputs = empty_inputs(5, 0.07);
    inputs.capital = Capital::Schedule(vec![
        CapitalPayment {
            date: date(2024, 1, 1),
            amount: dec("100.00"),
        },
        CapitalPayment {
            date: date(2025, 1, 1),
            amount: dec("200.00"),
        },
    ]);
    let ledger = build_ledger(&inputs).unwrap();
    let capital: Vec<_> = ledger
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Capital)
        .collect();
    assert_eq!(capital[0].discount_factor, dec("1.1449"));
    assert_eq!(capital[1].discount_factor, dec("1.07"));
    assert_eq!(
        capital[0].present_value + capital[1].present_value,
        dec("328.49")
    );
}

/// Degradation and overhauls, hand-computed. 8 000 h a year, 1 % heat rate
/// a year, half recoverable, overhaul every 16 000 h, 4 years:
/// mean multipliers 1.005, 1.015, 1.015, 1.025
/// (e.g. year 3, hours 16 000–24 000: permanent 0.5 × 1.25e-6 × 20 000 =
/// 0.0125, recoverable 0.5 × 1.25e-6 × 4 000 = 0.0025). Overhauls at
/// 16 000 h (year 2) and at 32 000 h, which is the end of life and so not
/// done.
#[test]
fn degradation_and_overhauls_hand_computed() {
    let mut inputs = empty_inputs(4, 0.05);
    inputs.operation.operating_hours = 8000.0;
    inputs.operation.fuel_energy_gj_lhv = 1_000_000.0;
    inputs.degradation = Degradation {
        heat_rate_fraction_per_year: 0.01,
        output_fraction_per_year: 0.0,
        recoverable_fraction: 0.5,
    };
    inputs.overhaul = Some(Overhaul {
        interval_hours: 16_000.0,
        hours_per_start: 0.0,
        interval_starts: None,
        outage_days: 0.0,
        outage_capacity_kw: 0.0,
        cost: dec("500000.00"),
        escalation: 0.0,
    });
    let ledger = build_ledger(&inputs).unwrap();
    let operating: Vec<_> = ledger
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Operation)
        .collect();
    for (row, multiplier) in operating.iter().zip([1.005, 1.015, 1.015, 1.025]) {
        assert!(
            (row.fuel_energy_gj - 1e6 * multiplier).abs() < 1e-6,
            "{}: {}",
            row.year,
            row.fuel_energy_gj
        );
    }
    let counts: Vec<u32> = operating.iter().map(|r| r.overhaul_count).collect();
    assert_eq!(counts, [0, 1, 0, 0]);
    assert_eq!(operating[1].overhaul, dec("500000.00"));

    // Without overhauls nothing is recovered: 1 + 0.01 (k − ½).
    inputs.overhaul = None;
    let ledger = build_ledger(&inputs).unwrap();
    let fuel: Vec<f64> = ledger
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Operation)
        .map(|r| r.fuel_energy_gj)
        .collect();
    for (k, value) in fuel.iter().enumerate() {
        let expected = 1e6 * (1.0 + 0.01 * (k as f64 + 0.5));
        assert!(
            (value - expected).abs() < 1e-6,
            "year {k}: {value} vs {expected}"
        );
    }
}

/// Ledger identities on a busy ledger: each row's total is the sum of its
/// money columns and its present value is total × discount factor, exactly
/// in Decimal; the lifecycle cost is exactly the sum of the rows' present
/// values; the streams' present values add up to it within 1e-14 relative.
#[test]
fn ledger_identities_hold_exactly() {
    let ledger = build_ledger(&busy_inputs()).unwrap();
    let mut sum = rust_decimal::Decimal::ZERO;
    for row in &ledger.rows {
        let columns = row.fuel_cost
            + row.carbon_cost
            + row.fixed_om
            + row.variable_om
            + row.overhaul
            + row.bought_in
            + row.capital
            + row.residual;
        assert_eq!(row.total, columns, "{} {:?}", row.year, row.kind);
        assert_eq!(row.present_value, row.total * row.discount_factor);
        sum += row.present_value;
    }
    let summary = ledger.summary;
    assert_eq!(summary.lifecycle_cost, sum);
    let streams =
        summary.present_value.operating().unwrap() + summary.present_value.investment().unwrap();
    let gap = (streams - sum).abs() / sum;
    assert!(gap < dec("1e-14"), "streams {streams} vs rows {sum}");
}
