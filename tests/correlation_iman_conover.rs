//! Iman–Conover reordering (Iman and Conover, Communications in Statistics
//! — Simulation and Computation 11, 1982): the rank correlations it imposes,
//! the marginals it keeps, and the targets it refuses.
//!
//! Standard error of a sample Spearman correlation `r_s` of `n` pairs with
//! population value `ρ`: `SE = (1 − ρ²)·√((1 + ρ²/2) / (n − 3))` (Bonett and
//! Wright, Psychometrika 65, 2000, the variance of Fisher's z of `r_s` taken
//! back through `dr = (1 − ρ²)·dz`; from memory). At `ρ = 0` it is within
//! 0.02 % of the exact null value `1/√(n − 1)` (Kendall, from memory). This
//! is the spread of a random sample; the method fixes the correlation of
//! the scores exactly, so its spread is smaller and 4 standard errors is a
//! conservative bound.

use brayfin::analysis::sampling::iman_conover::{
    iman_conover, iman_conover_order, rank_correlation_for_score, score_correlation_for_rank,
    spearman,
};
use brayfin::analysis::sampling::normal;
use brayfin::analysis::sampling::rank_correlation::{CorrelationError, RankCorrelation};
use brayfin::analysis::sampling::Streams;

const SEED: u64 = 20_261_203;

/// `n` samples of four inputs drawn independently, each from its own
/// marginal by the inverse CDF of a uniform number: uniform(0, 1),
/// lognormal (σ = 0.5), exponential (mean 1), and a normal with mean 100 and
/// sd 15 (a model stated here; no data).
fn independent_columns(n: usize) -> Vec<Vec<f64>> {
    let streams = Streams::new(SEED);
    let mut columns: Vec<Vec<f64>> = (0..4).map(|_| Vec::with_capacity(n)).collect();
    for i in 0..n {
        let mut stream = streams.sample(i as u64);
        let u: Vec<f64> = (0..4).map(|_| stream.next_unit()).collect();
        columns[0].push(u[0]);
        columns[1].push((0.5 * normal::inverse_cdf(u[1])).exp());
        columns[2].push(-(1.0 - u[2]).ln());
        columns[3].push(100.0 + 15.0 * normal::inverse_cdf(u[3]));
    }
    columns
}

fn target() -> RankCorrelation {
    RankCorrelation::from_pairs(
        4,
        &[
            (0, 1, 0.7),
            (0, 2, -0.4),
            (0, 3, 0.3),
            (1, 2, -0.2),
            (1, 3, 0.5),
            (2, 3, 0.0),
        ],
    )
    .expect("a valid target")
}

fn standard_error(rho: f64, n: usize) -> f64 {
    (1.0 - rho * rho) * ((1.0 + rho * rho / 2.0) / (n as f64 - 3.0)).sqrt()
}

/// Every pair's sample rank correlation within 4 standard errors of its
/// target, n = 10 000.
#[test]
fn rank_correlations_match_the_target() {
    let n = 10_000;
    let target = target();
    target.check_consistent().expect("positive semi-definite");
    let correlated = iman_conover(&independent_columns(n), &target, SEED).unwrap();
    for i in 0..4 {
        for j in 0..i {
            let rho = target.get(i, j);
            let r = spearman(&correlated[i], &correlated[j]);
            let bound = 4.0 * standard_error(rho, n);
            assert!(
                (r - rho).abs() < bound,
                "pair ({j}, {i}): rank correlation {r:.4}, target {rho}, bound {bound:.4}"
            );
        }
    }
}

/// Only the order changes: each column holds exactly the values it was
/// given (same multiset, bit for bit), ties included.
#[test]
fn marginals_are_unchanged() {
    let mut columns = independent_columns(2_000);
    // A column with ties (a discrete input): values 0 to 9.
    columns[3] = columns[0].iter().map(|u| (u * 10.0).floor()).collect();
    let correlated = iman_conover(&columns, &target(), SEED).unwrap();
    for (before, after) in columns.iter().zip(&correlated) {
        let mut before = before.clone();
        let mut after = after.clone();
        before.sort_by(f64::total_cmp);
        after.sort_by(f64::total_cmp);
        assert_eq!(before, after);
    }
}

/// The identity target leaves every pair's rank correlation within 4
/// standard errors (1/√(n − 1) at ρ = 0) of zero.
#[test]
fn identity_target_leaves_pairs_uncorrelated() {
    let n = 5_000;
    let correlated =
        iman_conover(&independent_columns(n), &RankCorrelation::identity(4), SEED).unwrap();
    let bound = 4.0 / (n as f64 - 1.0).sqrt();
    for i in 0..4 {
        for j in 0..i {
            let r = spearman(&correlated[i], &correlated[j]);
            assert!(r.abs() < bound, "pair ({j}, {i}): {r:.4}, bound {bound:.4}");
        }
    }
}

/// A perfectly correlated pair is positive semi-definite and allowed: the
/// two columns come out in the same rank order.
#[test]
fn perfect_correlation_is_allowed() {
    let columns = independent_columns(1_000);
    let target = RankCorrelation::from_pairs(4, &[(0, 1, 1.0)]).unwrap();
    let correlated = iman_conover(&columns, &target, SEED).unwrap();
    let r = spearman(&correlated[0], &correlated[1]);
    assert!(r > 0.999, "{r}");
}

/// Same seed, same order; another seed, another order with the same
/// correlations.
#[test]
fn deterministic_with_a_seed() {
    let columns = independent_columns(500);
    let a = iman_conover_order(&columns, &target(), 1).unwrap();
    let b = iman_conover_order(&columns, &target(), 1).unwrap();
    let c = iman_conover_order(&columns, &target(), 2).unwrap();
    assert_eq!(a, b);
    assert_ne!(a, c);
}

/// A target that is not positive semi-definite is refused, naming the pair
/// that needs the smallest change and the nearest value that works.
///
/// Inputs 0–1 and 0–2 at 0.9 with 1–2 at 0: the determinant of a 3×3
/// correlation matrix is `1 + 2abc − a² − b² − c²` (closed form, common
/// practice). Moving 0–1 (a) with b = 0.9, c = 0 needs `a² ≤ 0.19`, a
/// change of 0.9 − √0.19 = 0.464; moving 1–2 (c) needs `c ≥ 0.62`, a change
/// of 0.62. So the pair 0–1 is named with about √0.19 = 0.43589 (0–2 ties
/// with it; the first found is named).
#[test]
fn inconsistent_target_names_a_pair() {
    let target = RankCorrelation::from_pairs(3, &[(0, 1, 0.9), (0, 2, 0.9), (1, 2, 0.0)]).unwrap();
    let error = target.check_consistent().expect_err("not PSD");
    let CorrelationError::NotPositiveSemiDefinite {
        first,
        second,
        value,
        nearest,
    } = error.clone()
    else {
        panic!("{error:?}")
    };
    assert_eq!((first, second, value), (0, 1, 0.9));
    let nearest = nearest.expect("one pair can fix it");
    assert!((nearest - 0.19f64.sqrt()).abs() < 1e-6, "{nearest}");
    let message = error.to_string();
    assert!(message.contains("inputs 0 and 1"), "{message}");
    assert!(message.contains("0.436"), "{message}");
    // The suggested value works.
    RankCorrelation::from_pairs(3, &[(0, 1, nearest), (0, 2, 0.9), (1, 2, 0.0)])
        .unwrap()
        .check_consistent()
        .expect("the nearest value is consistent");
    // The method refuses the target before touching the samples.
    let columns = vec![vec![1.0, 2.0, 3.0, 4.0, 5.0]; 3];
    assert_eq!(iman_conover(&columns, &target, SEED), Err(error));
}

/// A triangle 0.9, 0.9, −0.9: moving 0–1 (a) with b = 0.9, c = −0.9 needs
/// `1 − 1.62a − a² − 1.62 ≥ 0`, i.e. a from −1 to −0.62 (same determinant);
/// each pair needs the same change of 1.52, so the first, 0–1, is named
/// with about −0.62.
#[test]
fn sign_flip_is_suggested_when_it_is_the_nearest_fix() {
    let target = RankCorrelation::from_pairs(3, &[(0, 1, 0.9), (0, 2, 0.9), (1, 2, -0.9)]).unwrap();
    match target.check_consistent() {
        Err(CorrelationError::NotPositiveSemiDefinite {
            first: 0,
            second: 1,
            nearest: Some(nearest),
            ..
        }) => assert!((nearest + 0.62).abs() < 1e-6, "{nearest}"),
        other => panic!("{other:?}"),
    }
}

/// Four inputs all at −0.9 (an equicorrelation matrix is positive
/// semi-definite only down to −1/(k − 1) = −1/3; every triple fails and one
/// pair belongs to two of the four triples), so no single pair can fix it:
/// the largest correlation at the failing pivot (input 2, the first triple)
/// is named, with no suggested value.
#[test]
fn hopeless_target_still_names_a_pair() {
    let pairs: Vec<_> = (0..4)
        .flat_map(|i| (0..i).map(move |j| (j, i, -0.9)))
        .collect();
    let target = RankCorrelation::from_pairs(4, &pairs).unwrap();
    match target.check_consistent() {
        Err(CorrelationError::NotPositiveSemiDefinite {
            first,
            second,
            nearest,
            ..
        }) => {
            assert!(first < second && second == 2, "({first}, {second})");
            assert_eq!(nearest, None);
        }
        other => panic!("{other:?}"),
    }
}

/// Malformed targets and samples are errors naming what is wrong.
#[test]
fn malformed_input_is_refused() {
    use CorrelationError::*;
    assert_eq!(
        RankCorrelation::from_pairs(2, &[(0, 2, 0.1)]),
        Err(InputOutOfRange { input: 2, size: 2 })
    );
    assert_eq!(
        RankCorrelation::from_pairs(2, &[(1, 1, 0.1)]),
        Err(SelfPair { input: 1 })
    );
    assert_eq!(
        RankCorrelation::from_pairs(2, &[(0, 1, 0.1), (1, 0, 0.2)]),
        Err(DuplicatePair {
            first: 1,
            second: 0
        })
    );
    assert!(matches!(
        RankCorrelation::from_pairs(2, &[(0, 1, 1.5)]),
        Err(OutOfRange { .. })
    ));
    assert!(matches!(
        RankCorrelation::from_pairs(2, &[(0, 1, f64::NAN)]),
        Err(OutOfRange { .. })
    ));
    let identity = RankCorrelation::identity(2);
    assert_eq!(
        iman_conover(&[vec![1.0; 10]], &identity, SEED),
        Err(SizeMismatch {
            size: 2,
            columns: 1
        })
    );
    assert_eq!(
        iman_conover(&[vec![1.0; 10], vec![1.0; 9]], &identity, SEED),
        Err(RaggedSamples {
            column: 1,
            length: 9,
            expected: 10
        })
    );
    assert_eq!(
        iman_conover(&[vec![1.0; 3], vec![1.0; 3]], &identity, SEED),
        Err(TooFewSamples {
            samples: 3,
            inputs: 2
        })
    );
    // NaN and infinite sample values are reordered, not a panic.
    let odd = vec![
        vec![f64::NAN, 1.0, f64::INFINITY, -1.0, 0.0, 2.0],
        vec![3.0, 2.0, 1.0, 0.0, -1.0, -2.0],
    ];
    let target = RankCorrelation::from_pairs(2, &[(0, 1, 0.5)]).unwrap();
    assert_eq!(iman_conover(&odd, &target, SEED).unwrap().len(), 2);
}

/// Pearson's relation between the rank and product-moment correlations of
/// a normal pair, ρ_s = (6/π)·asin(ρ/2) (from memory): fixed points 0 and
/// ±1, and 0.5 ↔ 2·sin(π/12) = 0.517638.
#[test]
fn rank_to_score_conversion() {
    assert_eq!(score_correlation_for_rank(0.0), 0.0);
    assert!((score_correlation_for_rank(1.0) - 1.0).abs() < 1e-15);
    assert!((score_correlation_for_rank(-1.0) + 1.0).abs() < 1e-15);
    assert!((score_correlation_for_rank(0.5) - 0.517_638_090_205).abs() < 1e-12);
    for rank in [-0.9, -0.3, 0.2, 0.7] {
        let back = rank_correlation_for_score(score_correlation_for_rank(rank));
        assert!((back - rank).abs() < 1e-14);
    }
}
