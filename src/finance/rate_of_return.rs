//! Internal rate of return of the incremental cash flows of a candidate
//! over a baseline (ASTM E1057).
//!
//! A rate is not money: the incremental flows are taken as `f64` at their
//! cash times and the rate `x` solving `Σ flow·(1 + x)^−t = 0` is found by
//! Newton's method safeguarded by bisection within −99 % to 1 000 000 % per
//! year. For flows with one change of sign (an investment then savings) the
//! root is unique; otherwise the one found in the bracket is returned.

use super::ledger::Ledger;
use super::money::Money;

/// Lowest and highest rates searched, per year.
const RATE_BRACKET: (f64, f64) = (-0.99, 10_000.0);
/// Convergence tolerance on the rate.
const RATE_TOLERANCE: f64 = 1e-13;
const MAX_ITERATIONS: usize = 200;

/// Net present value of `flows` (time in years, amount) at `rate`, and its
/// derivative with respect to the rate.
fn npv_and_slope(flows: &[(f64, f64)], rate: f64) -> (f64, f64) {
    let log_growth = (1.0 + rate).ln();
    flows
        .iter()
        .fold((0.0, 0.0), |(value, slope), &(time, amount)| {
            let discounted = amount * (-time * log_growth).exp();
            (value + discounted, slope - time * discounted / (1.0 + rate))
        })
}

/// The rate at which `flows` (time in years, amount) have zero net present
/// value, if one lies in the searched bracket.
pub fn rate_of_return(flows: &[(f64, f64)]) -> Option<f64> {
    let (mut low, mut high) = RATE_BRACKET;
    let (at_low, _) = npv_and_slope(flows, low);
    let (at_high, _) = npv_and_slope(flows, high);
    if !(at_low.is_finite() && at_high.is_finite()) || at_low * at_high > 0.0 {
        return None;
    }
    let low_sign = at_low.signum();
    let mut rate = 0.1f64.clamp(low, high);
    for _ in 0..MAX_ITERATIONS {
        let (value, slope) = npv_and_slope(flows, rate);
        if value == 0.0 {
            return Some(rate);
        }
        if value.signum() == low_sign {
            low = rate;
        } else {
            high = rate;
        }
        let newton = rate - value / slope;
        let next = if newton.is_finite() && newton > low && newton < high {
            newton
        } else {
            0.5 * (low + high)
        };
        if (next - rate).abs() <= RATE_TOLERANCE * (1.0 + rate.abs()) {
            return Some(next);
        }
        rate = next;
    }
    Some(rate)
}

/// Internal rate of return of choosing `candidate` over `baseline`: the
/// discount rate at which the net savings of their cash flows (capital,
/// operating costs and residual value, at each row's cash time) vanish.
pub fn internal_rate_of_return<M: Money>(
    candidate: &Ledger<M>,
    baseline: &Ledger<M>,
) -> Option<f64> {
    let flows: Vec<(f64, f64)> = baseline
        .rows
        .iter()
        .map(|row| (row.cash_time_years, row.total.to_f64()))
        .chain(
            candidate
                .rows
                .iter()
                .map(|row| (row.cash_time_years, -row.total.to_f64())),
        )
        .collect();
    rate_of_return(&flows)
}
