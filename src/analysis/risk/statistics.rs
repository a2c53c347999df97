//! Summary statistics of sampled values: mean, percentiles and an
//! equal-width histogram with round bin edges. Every sum runs in sample
//! order, so the figures do not depend on how the samples were computed.

/// Mean and percentiles of a sampled figure.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Statistics {
    /// Arithmetic mean.
    pub mean: f64,
    /// 10th percentile.
    pub p10: f64,
    /// 50th percentile (median).
    pub p50: f64,
    /// 90th percentile.
    pub p90: f64,
}

/// Equal-width histogram: bin `i` holds values in
/// `[low + i·bin_width, low + (i+1)·bin_width)`, the last bin closed.
#[derive(Debug, Clone, PartialEq)]
pub struct Bins {
    /// Lower edge of the first bin (a whole multiple of `bin_width`).
    pub low: f64,
    /// Bin width: 1, 2 or 5 times a power of ten, at least 0.01.
    pub bin_width: f64,
    /// Count per bin; they sum to the number of values.
    pub counts: Vec<u64>,
}

/// About this many bins; round widths make it between about 8 and 21.
pub const TARGET_BINS: f64 = 20.0;

/// Most bins a histogram may have, whatever the values: the bin count is
/// never sized from the data alone (a spread near the limits of `f64`
/// would otherwise ask for billions of bins).
pub const MAX_BINS: usize = 64;

/// Smallest bin width: one minor currency unit (cent).
const MIN_BIN_WIDTH: f64 = 0.01;

/// The `p`-quantile (0 ≤ p ≤ 1) of sorted values by linear interpolation
/// between closest ranks: h = (n − 1)·p, x⌊h⌋ + (h − ⌊h⌋)(x⌊h⌋₊₁ − x⌊h⌋).
/// This is definition 7 of Hyndman & Fan, "Sample quantiles in statistical
/// packages", The American Statistician 50(4), 1996 (the default of R and
/// numpy). `None` for no values.
pub fn quantile_of_sorted(sorted: &[f64], p: f64) -> Option<f64> {
    let last = sorted.len().checked_sub(1)?;
    let h = last as f64 * p.clamp(0.0, 1.0);
    let below = h.floor() as usize;
    let above = (below + 1).min(last);
    let (a, b) = (sorted[below], sorted[above]);
    Some(a + (h - below as f64) * (b - a))
}

/// Mean and P10/P50/P90 of `values` (in sample order); sorts `values`.
/// `None` for no values.
pub fn statistics(values: &mut [f64]) -> Option<Statistics> {
    if values.is_empty() {
        return None;
    }
    let mean = values.iter().sum::<f64>() / values.len() as f64;
    values.sort_unstable_by(f64::total_cmp);
    Some(Statistics {
        mean,
        p10: quantile_of_sorted(values, 0.1)?,
        p50: quantile_of_sorted(values, 0.5)?,
        p90: quantile_of_sorted(values, 0.9)?,
    })
}

/// The smallest width of 1, 2 or 5 × 10ᵏ (k ≥ −2) at least `raw`.
fn round_width(raw: f64) -> f64 {
    if raw.is_nan() || raw <= MIN_BIN_WIDTH {
        return MIN_BIN_WIDTH;
    }
    let magnitude = 10f64.powf(raw.log10().floor());
    [1.0, 2.0, 5.0, 10.0]
        .iter()
        .map(|m| m * magnitude)
        .find(|w| *w >= raw)
        .unwrap_or(10.0 * magnitude)
}

/// Histogram of sorted `values` with about [`TARGET_BINS`] bins of a round
/// width, the first edge a whole multiple of the width at or below the
/// smallest value. Equal values give one bin of the smallest width. At most
/// [`MAX_BINS`] bins: where rounding of very large values would ask for
/// more, the width grows tenfold until they fit. Empty for no values or any
/// value that is not finite.
pub fn histogram(sorted: &[f64]) -> Bins {
    let empty = Bins {
        low: 0.0,
        bin_width: MIN_BIN_WIDTH,
        counts: Vec::new(),
    };
    let (Some(&min), Some(&max)) = (sorted.first(), sorted.last()) else {
        return empty;
    };
    if !min.is_finite() || !max.is_finite() || sorted.iter().any(|x| !x.is_finite()) {
        return empty;
    }
    let mut width = round_width((max - min) / TARGET_BINS);
    // Edges are whole multiples of the width: exact in cents once rounded.
    let edge = |width: f64| ((min / width).floor() * width * 100.0).round() / 100.0;
    let mut low = edge(width);
    let mut span = ((max - low) / width).floor();
    // Each pass multiplies the width by ten; 400 passes cover every finite
    // ratio of f64 values, so the loop always ends.
    for _ in 0..400 {
        if span.is_finite() && span >= 0.0 && span < MAX_BINS as f64 {
            break;
        }
        width *= 10.0;
        low = edge(width);
        span = ((max - low) / width).floor();
    }
    let bins = if span.is_finite() && span >= 0.0 {
        (span as usize + 1).min(MAX_BINS)
    } else {
        1
    };
    let mut counts = vec![0u64; bins];
    for &x in sorted {
        let index = (((x - low) / width).floor().max(0.0) as usize).min(bins - 1);
        counts[index] += 1;
    }
    Bins {
        low,
        bin_width: width,
        counts,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn quantiles_follow_hyndman_fan_definition_7() {
        // numpy.percentile([1, 2, 3, 4], [10, 50, 90]) = 1.3, 2.5, 3.7
        // (linear method; worked by hand from the definition).
        let sorted = [1.0, 2.0, 3.0, 4.0];
        let q = |p| quantile_of_sorted(&sorted, p).unwrap_or(f64::NAN);
        assert!((q(0.1) - 1.3).abs() < 1e-12);
        assert!((q(0.5) - 2.5).abs() < 1e-12);
        assert!((q(0.9) - 3.7).abs() < 1e-12);
        assert_eq!(quantile_of_sorted(&[], 0.5), None);
    }

    #[test]
    fn histogram_counts_every_value_with_round_edges() {
        let mut values: Vec<f64> = (0..1000).map(|i| 1234.0 + 7.3 * f64::from(i)).collect();
        values.sort_unstable_by(f64::total_cmp);
        let bins = histogram(&values);
        assert_eq!(bins.counts.iter().sum::<u64>(), 1000);
        // Range 7292.7 / 20 = 364.6 → width 500; first edge 1000.
        assert_eq!(bins.bin_width, 500.0);
        assert_eq!(bins.low, 1000.0);
        let top = bins.low + bins.bin_width * bins.counts.len() as f64;
        assert!(top > values[999] && top - bins.bin_width <= values[999]);
    }

    #[test]
    fn equal_values_make_one_bin() {
        let bins = histogram(&[42.0; 5]);
        assert_eq!(bins.counts, vec![5]);
        assert!(bins.low <= 42.0 && 42.0 < bins.low + bins.bin_width);
    }

    #[test]
    fn huge_values_close_together_stay_within_the_bin_bound() {
        // Regression: results near 1e27 one unit in the last place apart
        // used to ask for about 2.5e13 bins of one cent (a 2e14-byte
        // allocation that aborted the process).
        let a = 1.0e27_f64;
        let b = f64::from_bits(a.to_bits() + 3);
        let bins = histogram(&[a, b]);
        assert!(!bins.counts.is_empty() && bins.counts.len() <= MAX_BINS);
        assert_eq!(bins.counts.iter().sum::<u64>(), 2);
        let wide = histogram(&[-7.9e28, 0.0, 1.0e21]);
        assert!(wide.counts.len() <= MAX_BINS);
        assert_eq!(wide.counts.iter().sum::<u64>(), 3);
    }

    #[test]
    fn values_that_are_not_finite_give_no_bins() {
        assert!(histogram(&[1.0, f64::INFINITY]).counts.is_empty());
        assert!(histogram(&[f64::NAN]).counts.is_empty());
    }
}
