//! Correlated sampling by the Iman–Conover method (Iman and Conover, "A
//! distribution-free approach to inducing rank correlation among input
//! variables", Communications in Statistics — Simulation and Computation 11,
//! 1982): samples of several inputs, drawn independently, are reordered
//! within each column so that their rank correlations approach a target.
//! Values are never changed, only paired differently, so every input keeps
//! exactly the marginal distribution it was drawn from.
//!
//! Steps, for `n` samples of `k` inputs:
//! 1. Scores: the van der Waerden scores `Φ⁻¹(i / (n + 1))`, `i = 1..n`, in
//!    an independent random order per column (seeded), an `n × k` matrix `R`.
//! 2. The scores' own sample correlation `T` is near but not exactly the
//!    identity; with `T = Q Qᵀ` and the target `C = P Pᵀ` (Cholesky), the
//!    rows of `R` are mapped by `P Q⁻¹`, which gives scores whose sample
//!    correlation is exactly `C`.
//! 3. Each input's column is reordered so that its ranks equal the ranks of
//!    its column of mapped scores.
//!
//! Target conversion (a documented choice): step 2 fixes the product-moment
//! correlation of normal scores, whose rank (Spearman) correlation is
//! `(6/π)·asin(ρ/2)` for a normal pair (Pearson 1907; Kruskal, JASA 53,
//! 1958 — from memory), up to 0.018 below ρ. The target is a rank
//! correlation, so each entry is converted to `2·sin(π·ρ_s/6)` before step
//! 2; the expected rank correlation of the result is then the target. The
//! converted matrix is checked again; a failure names the pair and its rank
//! correlation as given.
//!
//! Deterministic: the score orders come from the seed alone.

use rand::seq::SliceRandom;
use rand::SeedableRng;
use rand_chacha::ChaCha8Rng;

use super::normal;
use super::rank_correlation::{cholesky, CorrelationError, RankCorrelation};

/// Product-moment correlation of normal scores whose rank correlation is
/// `rank` (Pearson 1907, for a bivariate normal; from memory).
pub fn score_correlation_for_rank(rank: f64) -> f64 {
    2.0 * (std::f64::consts::PI * rank / 6.0).sin()
}

/// Rank correlation of a normal pair of product-moment correlation `score`
/// (the inverse of [`score_correlation_for_rank`]).
pub fn rank_correlation_for_score(score: f64) -> f64 {
    6.0 / std::f64::consts::PI * (score / 2.0).asin()
}

/// The order that imposes `target` on `columns`: for each column, the
/// indices of its values in their new order (`new[i] = old[order[i]]`).
/// The same reordering can then be applied to anything drawn alongside.
///
/// Errors: the target is inconsistent (names a pair to change), columns
/// and target differ in number, columns differ in length, or there are too
/// few samples (at least `k + 2` for `k` inputs, so that the scores' sample
/// correlation can be factored).
pub fn iman_conover_order(
    columns: &[Vec<f64>],
    target: &RankCorrelation,
    seed: u64,
) -> Result<Vec<Vec<usize>>, CorrelationError> {
    let k = target.size();
    if columns.len() != k {
        return Err(CorrelationError::SizeMismatch {
            size: k,
            columns: columns.len(),
        });
    }
    let n = columns.first().map_or(0, Vec::len);
    if let Some((column, c)) = columns.iter().enumerate().find(|(_, c)| c.len() != n) {
        return Err(CorrelationError::RaggedSamples {
            column,
            length: c.len(),
            expected: n,
        });
    }
    target.check_consistent()?;
    if k == 0 {
        return Ok(Vec::new());
    }
    if n < k + 2 {
        return Err(CorrelationError::TooFewSamples {
            samples: n,
            inputs: k,
        });
    }
    let scores_target = target.map(score_correlation_for_rank);
    let p = scores_target
        .cholesky()
        .map_err(|pivot| match scores_target.diagnose(pivot) {
            CorrelationError::NotPositiveSemiDefinite {
                first,
                second,
                nearest,
                ..
            } => CorrelationError::NotPositiveSemiDefinite {
                first,
                second,
                value: target.get(first, second),
                nearest: nearest.map(rank_correlation_for_score),
            },
            other => other,
        })?;

    // Step 1: van der Waerden scores, each column in its own random order.
    let scores: Vec<f64> = (1..=n)
        .map(|i| normal::inverse_cdf(i as f64 / (n as f64 + 1.0)))
        .collect();
    let mut rng = ChaCha8Rng::seed_from_u64(seed);
    let r: Vec<Vec<f64>> = (0..k)
        .map(|_| {
            let mut column = scores.clone();
            column.shuffle(&mut rng);
            column
        })
        .collect();

    // Step 2: map each row by P Q⁻¹, Q the Cholesky factor of the scores'
    // sample correlation.
    let t = sample_correlation(&r);
    let q = cholesky(&t, k, false).map_err(|_| CorrelationError::TooFewSamples {
        samples: n,
        inputs: k,
    })?;
    let mut mapped = vec![vec![0.0; n]; k];
    let mut y = vec![0.0; k];
    for row in 0..n {
        // Forward substitution: Q y = row of R.
        for a in 0..k {
            let sum: f64 = (0..a).map(|m| q[a * k + m] * y[m]).sum();
            y[a] = (r[a][row] - sum) / q[a * k + a];
        }
        for (a, out) in mapped.iter_mut().enumerate() {
            out[row] = (0..=a).map(|m| p[a * k + m] * y[m]).sum();
        }
    }

    // Step 3: each column takes the ranks of its mapped scores.
    Ok(columns
        .iter()
        .zip(&mapped)
        .map(|(values, mapped)| {
            let by_value = order_by(values);
            let by_score = order_by(mapped);
            let mut order = vec![0; n];
            for (rank, &row) in by_score.iter().enumerate() {
                order[row] = by_value[rank];
            }
            order
        })
        .collect())
}

/// `columns` reordered to carry the rank correlations of `target` (see
/// [`iman_conover_order`], which also gives the errors).
pub fn iman_conover(
    columns: &[Vec<f64>],
    target: &RankCorrelation,
    seed: u64,
) -> Result<Vec<Vec<f64>>, CorrelationError> {
    let orders = iman_conover_order(columns, target, seed)?;
    Ok(columns
        .iter()
        .zip(orders)
        .map(|(values, order)| order.into_iter().map(|i| values[i]).collect())
        .collect())
}

/// Indices of `values` in ascending order (ties and NaN in index order, by
/// `total_cmp`).
fn order_by(values: &[f64]) -> Vec<usize> {
    let mut order: Vec<usize> = (0..values.len()).collect();
    order.sort_by(|&a, &b| values[a].total_cmp(&values[b]));
    order
}

/// Sample product-moment correlation matrix (row-major) of the columns.
fn sample_correlation(columns: &[Vec<f64>]) -> Vec<f64> {
    let k = columns.len();
    let centred: Vec<Vec<f64>> = columns
        .iter()
        .map(|c| {
            let mean = c.iter().sum::<f64>() / c.len() as f64;
            c.iter().map(|x| x - mean).collect()
        })
        .collect();
    let dot = |a: &[f64], b: &[f64]| a.iter().zip(b).map(|(x, y)| x * y).sum::<f64>();
    let norms: Vec<f64> = centred.iter().map(|c| dot(c, c).sqrt()).collect();
    let mut t = vec![0.0; k * k];
    for a in 0..k {
        for b in 0..k {
            t[a * k + b] = if a == b {
                1.0
            } else {
                dot(&centred[a], &centred[b]) / (norms[a] * norms[b])
            };
        }
    }
    t
}

/// Spearman rank correlation of two equally long columns (Pearson
/// correlation of their ranks, ties given their mean rank); NaN when a
/// column is constant.
pub fn spearman(a: &[f64], b: &[f64]) -> f64 {
    let ranks = |values: &[f64]| {
        let order = order_by(values);
        let mut ranks = vec![0.0; values.len()];
        let mut start = 0;
        while start < order.len() {
            let mut end = start + 1;
            while end < order.len() && values[order[end]] == values[order[start]] {
                end += 1;
            }
            let mean_rank = (start + end - 1) as f64 / 2.0;
            for &i in &order[start..end] {
                ranks[i] = mean_rank;
            }
            start = end;
        }
        ranks
    };
    let t = sample_correlation(&[ranks(a), ranks(b)]);
    t[1]
}
