//! The ledger's row-by-row discounting against the closed-form present-value
//! factors of NIST Handbook 135 (Fuller & Petersen, 1995):
//! SPV = 1/(1+d)^t, UPV = ((1+d)^n − 1)/(d(1+d)^n),
//! UPV* = ((1+e)/(d−e))(1 − ((1+e)/(1+d))^n).
//!
//! The ledger never calls the closed forms: it multiplies a discount factor
//! and an escalation factor forward year by year and prices quantities row
//! by row. Agreement to 1e-12 relative checks the ledger's discounting,
//! escalation, calendar and summing against the published formulas.
//! Tolerance: the ledger's factors carry f64 and 16-decimal rounding, about
//! 1e-15 relative per row over at most 60 rows.

mod finance_support;

use brayfin::finance::factors::{
    modified_uniform_present_value, single_present_value, uniform_present_value,
};
use brayfin::finance::{summarize_ledger, FuelPrice, LedgerInputs, Money, Timing};
use finance_support::{dec, empty_inputs};
use rust_decimal::Decimal;

const DISCOUNT_RATES: [f64; 6] = [0.0, 0.03, 0.07, 0.10, 0.15, -0.01];
const YEARS: [u32; 4] = [1, 10, 25, 60];

fn assert_close(actual: f64, expected: f64, what: &str) {
    let error = (actual - expected).abs() / expected.abs();
    assert!(
        error < 1e-12,
        "{what}: ledger {actual} vs closed form {expected} (rel {error:e})"
    );
}

/// Present value of each stream in both number types, as f64 for comparison.
fn fixed_and_fuel_pv(inputs: &LedgerInputs) -> [(f64, f64); 2] {
    let decimal = summarize_ledger(inputs).expect("decimal ledger");
    let float = summarize_ledger(&inputs.to_f64()).expect("f64 ledger");
    [
        (
            decimal.present_value.fixed_om.to_f64(),
            float.present_value.fixed_om,
        ),
        (
            decimal.present_value.fuel_cost.to_f64(),
            float.present_value.fuel_cost,
        ),
    ]
}

/// UPV: a constant fixed O&M bill (1 000 kW × 12.50 per kW-year) over n
/// years, 1 January start, end-of-year, equals 12 500 × UPV(d, n).
#[test]
fn uniform_stream_matches_upv() {
    for d in DISCOUNT_RATES {
        for n in YEARS {
            let mut inputs = empty_inputs(n, d);
            inputs.operation.net_output_kw = 1000.0;
            inputs.fixed_om.price = dec("12.50");
            let expected = 12_500.0 * uniform_present_value(d, n);
            let [(decimal, float), _] = fixed_and_fuel_pv(&inputs);
            assert_close(decimal, expected, &format!("Decimal UPV d={d} n={n}"));
            assert_close(float, expected, &format!("f64 UPV d={d} n={n}"));
        }
    }
}

/// UPV*: a fuel bill of 2 500 000 GJ at 4.35 per GJ escalating at e per
/// year equals 10 875 000 × UPV*(d, e, n), including e = d (UPV* = n) and
/// negative escalation. 6 × 4 × 4 = 96 combinations.
#[test]
fn escalating_stream_matches_modified_upv() {
    for d in DISCOUNT_RATES {
        for e in [-0.03, 0.0, 0.02, d] {
            for n in YEARS {
                let mut inputs = empty_inputs(n, d);
                inputs.operation.fuel_energy_gj_lhv = 2_500_000.0;
                inputs.fuel.price = FuelPrice::Escalating {
                    price_per_gj: dec("4.35"),
                    escalation: e,
                };
                let expected = 10_875_000.0 * modified_uniform_present_value(d, e, n);
                let [_, (decimal, float)] = fixed_and_fuel_pv(&inputs);
                let what = format!("UPV* d={d} e={e} n={n}");
                assert_close(decimal, expected, &format!("Decimal {what}"));
                assert_close(float, expected, &format!("f64 {what}"));
                // The lifecycle cost is the sum of the rows, not the stream
                // total: check it too.
                let lcc = summarize_ledger(&inputs).expect("ledger").lifecycle_cost;
                assert_close(lcc.to_f64(), expected, &format!("lifecycle cost {what}"));
            }
        }
    }
}

/// SPV: a single amount in year t of a price path (zero in every other
/// year) has present value amount × SPV(d, t); checked at every t of a
/// 60-year life for each discount rate (6 × 60 = 360 combinations).
#[test]
fn single_amount_matches_spv() {
    for d in DISCOUNT_RATES {
        for t in 1..=60u32 {
            let mut inputs = empty_inputs(60, d);
            inputs.operation.fuel_energy_gj_lhv = 1.0;
            inputs.fuel.price = FuelPrice::Path(
                (2026..2086)
                    .map(|year| {
                        let amount = if year == 2025 + t as i32 {
                            dec("987654.32")
                        } else {
                            Decimal::ZERO
                        };
                        (year, amount)
                    })
                    .collect(),
            );
            let expected = 987_654.32 * single_present_value(d, f64::from(t));
            let [_, (decimal, float)] = fixed_and_fuel_pv(&inputs);
            assert_close(decimal, expected, &format!("Decimal SPV d={d} t={t}"));
            assert_close(float, expected, &format!("f64 SPV d={d} t={t}"));
        }
    }
}

/// Mid-year timing moves every cash flow half a year earlier, so a uniform
/// stream is worth UPV(d, n) × (1+d)^½ (common practice).
#[test]
fn mid_year_timing_shifts_by_half_a_year() {
    for d in [0.03, 0.07, 0.12] {
        for n in [5, 30] {
            let mut inputs = empty_inputs(n, d);
            inputs.timing = Timing::MidYear;
            inputs.operation.net_output_kw = 1000.0;
            inputs.fixed_om.price = dec("10.00");
            let expected = 10_000.0 * uniform_present_value(d, n) * (1.0 + d).sqrt();
            let [(decimal, float), _] = fixed_and_fuel_pv(&inputs);
            assert_close(decimal, expected, &format!("Decimal mid-year d={d} n={n}"));
            assert_close(float, expected, &format!("f64 mid-year d={d} n={n}"));
        }
    }
}

/// Values of the closed forms themselves, as tabulated in NIST Handbook 135
/// and its annual discount-factor supplements at 3 % (from memory, to the
/// 3–4 significant figures the tables print): SPV(10) = 0.744,
/// UPV(20) = 14.88, UPV(25) = 17.41; UPV* with e = 0 equals UPV.
#[test]
fn closed_forms_match_tabulated_values() {
    assert!((single_present_value(0.03, 10.0) - 0.744).abs() < 5e-4);
    assert!((uniform_present_value(0.03, 20) - 14.88).abs() < 5e-3);
    assert!((uniform_present_value(0.03, 25) - 17.41).abs() < 5e-3);
    for n in YEARS {
        let upv = uniform_present_value(0.05, n);
        assert!((modified_uniform_present_value(0.05, 0.0, n) - upv).abs() < 1e-12 * upv);
    }
}
