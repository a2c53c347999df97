//! Heat-rate degradation and overhaul counting, in operating hours (physics,
//! `f64`).
//!
//! Model (documented choice):
//! - Degradation accrues in proportion to operating hours: `g` per year of
//!   operation at the stated annual hours `H`, i.e. `g / H` per hour. Heat
//!   rate at accumulated hours `h` is the new-and-clean heat rate times
//!   `1 + D(h)`; output is held (degradation raises fuel burn only).
//! - A share `ρ` (the recoverable fraction) of the degradation is recovered
//!   at each overhaul; the rest accumulates over the whole life:
//!   `D(h) = (g/H) · ((1 − ρ)·h + ρ·(h − h_last))`, where `h_last` is the
//!   hours at the most recent overhaul (a multiple of the interval). Without
//!   overhauls nothing is recovered.
//! - A row's fuel energy is the new-and-clean fuel energy times the mean of
//!   `1 + D(h)` over the row's operating hours (an exact integral of the
//!   piecewise-linear sawtooth).
//! - Overhauls fall at whole multiples of the interval of accumulated hours.
//! - Output degradation follows the same shape at its own rate `g_out`: the
//!   output lost at accumulated hours `h` is
//!   `L(h) = (g_out/H) · ((1 − ρ)·h + ρ·(h − h_last))` of the new-and-clean
//!   output (the same recoverable share `ρ` restored at each overhaul), at
//!   most all of it; a row's energy is the new-and-clean energy times
//!   `1 − mean L` over the row's hours.

/// Relative tolerance for deciding that accumulated hours sit exactly on an
/// overhaul multiple (absorbs rounding of sums of fractional years).
const ON_MULTIPLE_TOLERANCE: f64 = 1e-9;

/// Degradation and overhaul schedule of one candidate over accumulated
/// operating hours, walked row by row.
#[derive(Debug, Clone, Copy)]
pub(crate) struct WearModel {
    /// Degradation per operating hour (fraction of heat rate).
    rate_per_hour: f64,
    /// Output degradation per operating hour (fraction of output).
    output_rate_per_hour: f64,
    /// Recoverable share of degradation.
    recoverable: f64,
    /// Operating hours between overhauls, if overhauls are scheduled.
    interval_hours: Option<f64>,
    /// The hours at the end of the previous row and the whole intervals
    /// they reach: the next row starts there, so its start needs no second
    /// computation.
    reached: Option<(f64, f64)>,
}

/// Wear of one row: the mean heat-rate multiplier and the overhauls done.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct RowWear {
    /// Mean of `1 + D(h)` over the row's accumulated hours.
    pub(crate) heat_rate_multiplier: f64,
    /// Mean of the output lost `L(h)` over the row's accumulated hours, a
    /// fraction of the new-and-clean output (0 to 1).
    pub(crate) output_loss: f64,
    /// Overhauls triggered in the row.
    pub(crate) overhaul_count: u32,
}

/// Whole intervals reached at the start and end of a row.
#[derive(Debug, Clone, Copy)]
struct Intervals {
    interval: f64,
    before: f64,
    upto: f64,
}

impl WearModel {
    /// Model for `fraction_per_year` degradation at `annual_hours`, with
    /// `recoverable` recovered at overhauls every `interval_hours`.
    pub(crate) fn new(
        annual_hours: f64,
        (fraction_per_year, output_fraction_per_year): (f64, f64),
        recoverable: f64,
        interval_hours: Option<f64>,
    ) -> WearModel {
        let per_hour = |fraction: f64| {
            if annual_hours > 0.0 {
                fraction / annual_hours
            } else {
                0.0
            }
        };
        WearModel {
            rate_per_hour: per_hour(fraction_per_year),
            output_rate_per_hour: per_hour(output_fraction_per_year),
            recoverable,
            interval_hours,
            reached: None,
        }
    }

    /// Wear over accumulated hours `from_hours..to_hours`. Overhauls count
    /// in `(from_hours, to_hours]`, or `(from_hours, to_hours)` when
    /// `ends_service` (an overhaul exactly at the end of life is not done).
    /// Rows are expected in order, each starting where the previous ended.
    #[inline]
    pub(crate) fn row(&mut self, from_hours: f64, to_hours: f64, ends_service: bool) -> RowWear {
        let intervals = self.interval_hours.map(|interval| {
            let before = match self.reached {
                Some((hours, multiples)) if hours == from_hours => multiples,
                _ => multiples_reached(from_hours, interval),
            };
            let upto = multiples_reached(to_hours, interval);
            self.reached = Some((to_hours, upto));
            Intervals {
                interval,
                before,
                upto,
            }
        });
        let (heat_rate_multiplier, output_loss) =
            if self.rate_per_hour == 0.0 && self.output_rate_per_hour == 0.0 {
                (1.0, 0.0)
            } else {
                let worn = self.mean_worn_hours(from_hours, to_hours, intervals);
                (
                    1.0 + self.rate_per_hour * worn,
                    (self.output_rate_per_hour * worn).min(1.0),
                )
            };
        RowWear {
            heat_rate_multiplier,
            output_loss,
            overhaul_count: intervals.map_or(0, |i| overhauls_between(to_hours, i, ends_service)),
        }
    }

    /// Mean over accumulated hours `from_hours..to_hours` of the hours that
    /// count toward degradation, `(1 − ρ)·h + ρ·(h − h_last)`; the value at
    /// `from_hours` when the span is empty.
    fn mean_worn_hours(&self, from_hours: f64, to_hours: f64, intervals: Option<Intervals>) -> f64 {
        let span = to_hours - from_hours;
        let permanent = (1.0 - self.recoverable) * 0.5 * (from_hours + to_hours);
        let since_overhaul = match intervals {
            Some(i) if span > 0.0 => {
                (sawtooth_integral(to_hours, i.upto, i.interval)
                    - sawtooth_integral(from_hours, i.before, i.interval))
                    / span
            }
            Some(i) => from_hours - i.before * i.interval,
            None => 0.5 * (from_hours + to_hours),
        };
        permanent + self.recoverable * since_overhaul
    }
}

/// Overhauls in a row ending at `to_hours` (see [`WearModel::row`]).
fn overhauls_between(to_hours: f64, intervals: Intervals, ends_service: bool) -> u32 {
    let Intervals {
        interval,
        before,
        mut upto,
    } = intervals;
    if ends_service && upto > before && on_multiple(to_hours, interval) {
        upto -= 1.0;
    }
    (upto - before).max(0.0) as u32
}

/// Whole multiples of `interval` reached by `hours`, snapping values within
/// tolerance of a multiple onto it.
fn multiples_reached(hours: f64, interval: f64) -> f64 {
    floor(hours / interval + ON_MULTIPLE_TOLERANCE)
}

/// `x.floor()`, exactly, without a library call for the common case: a
/// positive `x` below 2^52 truncates to its floor through a 64-bit integer
/// (both conversions exact there). Zero, negative, large and non-finite
/// values take `f64::floor`, which the baseline x86-64 target does not
/// inline.
fn floor(x: f64) -> f64 {
    // 2^52: from here on every f64 is a whole number.
    const WHOLE_FROM: f64 = 4_503_599_627_370_496.0;
    if x > 0.0 && x < WHOLE_FROM {
        (x as u64) as f64
    } else {
        x.floor()
    }
}

fn on_multiple(hours: f64, interval: f64) -> bool {
    let ratio = hours / interval;
    (ratio - ratio.round()).abs() <= ON_MULTIPLE_TOLERANCE
}

/// ∫₀ʰ (x mod interval) dx: `k·I²/2 + r²/2` with `k` whole intervals (the
/// [`multiples_reached`] by `hours`) and remainder `r`.
fn sawtooth_integral(hours: f64, whole: f64, interval: f64) -> f64 {
    let remainder = (hours - whole * interval).max(0.0);
    0.5 * (whole * interval * interval + remainder * remainder)
}

#[cfg(test)]
mod tests {
    use super::floor;

    /// The integer-conversion floor equals `f64::floor` bit for bit, on both
    /// sides of every branch: signed zeros, fractions, whole numbers, the
    /// 2^52 boundary, huge, infinite and NaN values.
    #[test]
    fn floor_matches_the_library_floor() {
        let two_52 = 4_503_599_627_370_496.0;
        let values = [
            0.0,
            -0.0,
            1e-300,
            1e-9,
            0.5,
            0.999_999_999_999_999_9,
            1.0,
            1.000_000_001,
            2.5,
            -0.5,
            -1.0,
            -2.5,
            12_345.678,
            two_52 - 0.5,
            two_52,
            two_52 + 1.0,
            1e300,
            f64::MAX,
            f64::INFINITY,
            f64::NEG_INFINITY,
            f64::NAN,
        ];
        for x in values {
            assert_eq!(floor(x).to_bits(), x.floor().to_bits(), "{x}");
        }
        let mut x = 1e-6;
        while x < 1e17 {
            assert_eq!(floor(x).to_bits(), x.floor().to_bits(), "{x}");
            x *= 1.000_37;
        }
    }
}
