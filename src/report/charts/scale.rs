//! Linear scales from data values to page millimetres, "nice" tick steps,
//! and the display scaling of money axes (thousands, millions).

use rust_decimal::prelude::ToPrimitive;
use rust_decimal::Decimal;

/// A linear map from a data interval onto a page interval (mm).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LinearScale {
    /// Data value at the start of the page interval.
    pub domain_low: f64,
    /// Data value at the end of the page interval.
    pub domain_high: f64,
    /// Page coordinate of `domain_low`, mm.
    pub range_low_mm: f32,
    /// Page coordinate of `domain_high`, mm.
    pub range_high_mm: f32,
}

impl LinearScale {
    /// A scale mapping `domain` onto `range_mm`. A zero-width domain is
    /// widened by one unit each way so every value still maps somewhere.
    pub fn new(domain: (f64, f64), range_mm: (f32, f32)) -> Self {
        let (mut low, mut high) = domain;
        if !(high - low).is_normal() || high < low {
            let centre = if low.is_finite() { low } else { 0.0 };
            low = centre - 1.0;
            high = centre + 1.0;
        }
        LinearScale {
            domain_low: low,
            domain_high: high,
            range_low_mm: range_mm.0,
            range_high_mm: range_mm.1,
        }
    }

    /// Page coordinate of data value `v`, mm.
    pub fn map(&self, v: f64) -> f32 {
        let t = (v - self.domain_low) / (self.domain_high - self.domain_low);
        self.range_low_mm + (t as f32) * (self.range_high_mm - self.range_low_mm)
    }

    /// Data value at page coordinate `mm` (the inverse of [`Self::map`]).
    pub fn invert(&self, mm: f32) -> f64 {
        let t = f64::from((mm - self.range_low_mm) / (self.range_high_mm - self.range_low_mm));
        self.domain_low + t * (self.domain_high - self.domain_low)
    }
}

/// Ticks of an axis: a widened domain whose ends fall on ticks, the step,
/// and the tick values.
#[derive(Debug, Clone, PartialEq)]
pub struct Ticks {
    /// Lowest tick (≤ the data minimum).
    pub low: f64,
    /// Highest tick (≥ the data maximum).
    pub high: f64,
    /// Distance between ticks.
    pub step: f64,
    /// Tick values from `low` to `high`.
    pub values: Vec<f64>,
}

/// The rounded "nice number" of Heckbert, "Nice numbers for graph
/// labels", Graphics Gems (1990): 1, 2, 5 or 10 times a power of ten
/// nearest `x`.
fn nice(x: f64) -> f64 {
    let exponent = x.log10().floor();
    let fraction = x / 10f64.powf(exponent);
    let nice_fraction = match fraction {
        f if f < 1.5 => 1.0,
        f if f < 3.0 => 2.0,
        f if f < 7.0 => 5.0,
        _ => 10.0,
    };
    nice_fraction * 10f64.powf(exponent)
}

/// `low..=high` ordered, finite and of non-zero width.
fn usable(low: f64, high: f64) -> (f64, f64) {
    let (mut low, mut high) = if low.is_finite() && high.is_finite() {
        (low.min(high), low.max(high))
    } else {
        (0.0, 1.0)
    };
    if high - low < 1e-12 * low.abs().max(1.0) {
        let pad = (low.abs() * 0.1).max(1.0);
        low -= pad;
        high += pad;
    }
    (low, high)
}

/// A nice step giving about `count` ticks over `range`: the rounded nice
/// number of range / (count − 1).
fn nice_step(range: f64, count: usize) -> f64 {
    nice(range / (count.max(2) - 1) as f64)
}

/// About `count` nice ticks covering `low..=high`, the axis ending on a
/// tick at each side (Heckbert's loose labelling). A degenerate or
/// non-finite interval is widened first.
pub fn nice_ticks(low: f64, high: f64, count: usize) -> Ticks {
    let (low, high) = usable(low, high);
    let step = nice_step(high - low, count);
    let first = (low / step).floor() * step;
    let last = (high / step).ceil() * step;
    let n = ((last - first) / step).round() as usize;
    let values = (0..=n).map(|i| first + i as f64 * step).collect();
    Ticks {
        low: first,
        high: last,
        step,
        values,
    }
}

/// Nice ticks for an axis that ends at the data, padded by `pad_fraction`
/// of the range on each side (not past zero when an end is zero), with the
/// ticks that fall inside.
pub fn tight_ticks(low: f64, high: f64, count: usize, pad_fraction: f64) -> Ticks {
    let (low, high) = usable(low, high);
    let pad = (high - low) * pad_fraction;
    let axis_low = if low == 0.0 { 0.0 } else { low - pad };
    let axis_high = if high == 0.0 { 0.0 } else { high + pad };
    let step = nice_step(high - low, count);
    let first = (axis_low / step - 1e-9).ceil() as i64;
    let last = (axis_high / step + 1e-9).floor() as i64;
    let values = (first..=last).map(|i| i as f64 * step).collect();
    Ticks {
        low: axis_low,
        high: axis_high,
        step,
        values,
    }
}

/// Text of a tick value with as many decimals as the step needs.
pub fn tick_label(value: f64, step: f64) -> String {
    let decimals = if step >= 1.0 {
        0
    } else {
        (-step.log10().floor()) as usize
    };
    let value = if value.abs() < step * 1e-9 {
        0.0
    } else {
        value
    };
    let text = format!("{value:.decimals$}");
    group_thousands(&text)
}

fn group_thousands(text: &str) -> String {
    let (sign, body) = match text.strip_prefix('-') {
        Some(rest) => ("-", rest),
        None => ("", text),
    };
    let (whole, fraction) = match body.split_once('.') {
        Some((w, f)) => (w, Some(f)),
        None => (body, None),
    };
    let mut out = String::from(sign);
    for (i, ch) in whole.chars().enumerate() {
        if i > 0 && (whole.len() - i) % 3 == 0 {
            out.push(',');
        }
        out.push(ch);
    }
    if let Some(f) = fraction {
        out.push('.');
        out.push_str(f);
    }
    out
}

/// How money on an axis is scaled for display: the divisor and the words
/// that go before the currency code in the axis title.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MoneyScale {
    /// Divide money by this for the tick values.
    pub divisor: f64,
    /// "million ", "thousand " or "".
    pub words: &'static str,
}

impl MoneyScale {
    /// The scale for money whose largest magnitude is `max_abs`.
    pub fn for_magnitude(max_abs: f64) -> Self {
        if max_abs >= 1.0e6 {
            MoneyScale {
                divisor: 1.0e6,
                words: "million ",
            }
        } else if max_abs >= 1.0e4 {
            MoneyScale {
                divisor: 1.0e3,
                words: "thousand ",
            }
        } else {
            MoneyScale {
                divisor: 1.0,
                words: "",
            }
        }
    }

    /// The unit part of the axis title, e.g. "million USD".
    pub fn unit(&self, currency: &str) -> String {
        format!("{}{currency}", self.words)
    }
}

/// A money value as a plotting coordinate. Drawing only: the figures
/// printed as text always come from the `Decimal` itself.
pub fn money_f64(value: Decimal) -> f64 {
    value.to_f64().unwrap_or(0.0)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn map_and_invert_are_inverse() {
        let s = LinearScale::new((0.0, 30.0), (20.0, 170.0));
        assert!((s.map(15.0) - 95.0).abs() < 1e-4);
        assert!((s.invert(s.map(7.3)) - 7.3).abs() < 1e-4);
    }

    #[test]
    fn nice_ticks_cover_the_data_on_round_steps() {
        // Heckbert's example style: 0.3..9.7 in about 5 ticks -> 0, 2, ..., 10.
        let t = nice_ticks(0.3, 9.7, 6);
        assert_eq!(t.step, 2.0);
        assert_eq!((t.low, t.high), (0.0, 10.0));
        let t = nice_ticks(-3.2e6, 11.9e6, 6);
        assert!(t.low <= -3.2e6 && t.high >= 11.9e6);
        assert!([1.0, 2.0, 5.0].contains(&(t.step / 10f64.powf(t.step.log10().floor()))));
    }

    #[test]
    fn tight_ticks_end_at_the_data_and_stay_inside() {
        let t = tight_ticks(0.0, 25.0, 7, 0.0);
        assert_eq!((t.low, t.high, t.step), (0.0, 25.0, 5.0));
        assert_eq!(t.values, vec![0.0, 5.0, 10.0, 15.0, 20.0, 25.0]);
        let t = tight_ticks(-1.5e6, 182.0e6, 6, 0.05);
        assert!(t.low < -1.5e6 && t.low > -12.0e6, "{t:?}");
        assert!(t.values.iter().all(|v| *v >= t.low && *v <= t.high));
    }

    #[test]
    fn degenerate_ranges_still_get_ticks() {
        let t = nice_ticks(5.0, 5.0, 5);
        assert!(t.values.len() >= 2 && t.low < 5.0 && t.high > 5.0);
    }

    #[test]
    fn tick_labels_group_thousands_and_show_needed_decimals() {
        assert_eq!(tick_label(12000.0, 2000.0), "12,000");
        assert_eq!(tick_label(-2.5, 0.5), "-2.5");
        assert_eq!(tick_label(1e-17, 0.2), "0.0");
    }
}
