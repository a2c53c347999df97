//! Sampled statistics of each distribution against its closed-form mean and
//! quantiles.
//!
//! Confidence: 200 000 draws; a sample mean must lie within 4 standard
//! errors (σ/√n, σ from the closed form) of the closed-form mean, and the
//! share of draws at or below a closed-form quantile q_p within 4 binomial
//! standard errors (√(p(1−p)/n)) of p. Four standard errors leave a chance
//! of about 6e-5 per check of failing by bad luck; the draws are seeded, so
//! the outcome is fixed once it passes.
//!
//! Each closed form is written out here, independently of the sampler's own
//! code, with its source.

use brayfin::analysis::sampling::{Sampler, Streams};
use brayfin::scenario::Distribution;

const N: usize = 200_000;

/// z such that Φ(z) = 0.90, and Φ(z) = 0.75 (standard normal table, any
/// statistics text; from memory).
const Z_90: f64 = 1.281_551_565_545;
const Z_75: f64 = 0.674_489_750_196;

fn sampler(distribution: Distribution, truncate: Option<(f64, f64)>) -> Sampler {
    match Sampler::new(distribution, truncate) {
        Ok(s) => s,
        Err(e) => panic!("{distribution:?} must be valid: {e}"),
    }
}

fn draws(s: &Sampler, seed: u64) -> Vec<f64> {
    let streams = Streams::new(seed);
    (0..N as u64)
        .map(|i| s.quantile(streams.sample(i).next_unit()))
        .collect()
}

fn check_mean(values: &[f64], mean: f64, variance: f64, what: &str) {
    let sample_mean = values.iter().sum::<f64>() / values.len() as f64;
    let standard_error = (variance / values.len() as f64).sqrt();
    assert!(
        (sample_mean - mean).abs() <= 4.0 * standard_error,
        "{what}: sample mean {sample_mean}, closed form {mean}, 4 SE = {}",
        4.0 * standard_error
    );
}

fn check_quantile(values: &[f64], p: f64, quantile: f64, what: &str) {
    let below = values.iter().filter(|v| **v <= quantile).count() as f64 / values.len() as f64;
    let standard_error = (p * (1.0 - p) / values.len() as f64).sqrt();
    assert!(
        (below - p).abs() <= 4.0 * standard_error,
        "{what}: {below} of draws at or below the closed-form q{p} = {quantile}"
    );
}

fn close(a: f64, b: f64, what: &str) {
    assert!(
        (a - b).abs() <= 1e-12 * (1.0 + b.abs()),
        "{what}: {a} vs {b}"
    );
}

#[test]
fn uniform_matches_its_closed_forms() {
    // Uniform on [a, b]: mean (a+b)/2, variance (b−a)²/12, q_p = a + p(b−a)
    // (any probability text).
    let s = sampler(
        Distribution::Uniform {
            low: 2.0,
            high: 5.0,
        },
        None,
    );
    let v = draws(&s, 11);
    check_mean(&v, 3.5, 0.75, "uniform mean");
    for p in [0.1, 0.5, 0.9] {
        check_quantile(&v, p, 2.0 + 3.0 * p, "uniform");
    }
    close(s.mean(), 3.5, "uniform closed-form mean");
    close(s.variance(), 0.75, "uniform closed-form variance");
}

#[test]
fn triangular_matches_its_closed_forms() {
    // Triangular (a, c, b) = (1, 2, 5): mean (a+b+c)/3, variance
    // (a²+b²+c²−ab−ac−bc)/18; inverse CDF a + √(p(b−a)(c−a)) for
    // p < (c−a)/(b−a), else b − √((1−p)(b−a)(b−c)) (Evans, Hastings &
    // Peacock, Statistical Distributions, "Triangular"; from memory).
    let (a, c, b) = (1.0f64, 2.0f64, 5.0f64);
    let s = sampler(
        Distribution::Triangular {
            low: a,
            mode: c,
            high: b,
        },
        None,
    );
    let v = draws(&s, 12);
    let mean = (a + b + c) / 3.0;
    let variance = (a * a + b * b + c * c - a * b - a * c - b * c) / 18.0;
    check_mean(&v, mean, variance, "triangular mean");
    let inverse = |p: f64| {
        if p < (c - a) / (b - a) {
            a + (p * (b - a) * (c - a)).sqrt()
        } else {
            b - ((1.0 - p) * (b - a) * (b - c)).sqrt()
        }
    };
    for p in [0.1, 0.5, 0.9] {
        check_quantile(&v, p, inverse(p), "triangular");
    }
    close(s.mean(), mean, "triangular closed-form mean");
    close(s.variance(), variance, "triangular closed-form variance");
}

#[test]
fn normal_matches_its_closed_forms() {
    // Normal (μ, σ): mean μ, variance σ², q_p = μ + z_p σ (z from tables).
    let s = sampler(
        Distribution::Normal {
            mean: 10.0,
            sigma: 2.0,
        },
        None,
    );
    let v = draws(&s, 13);
    check_mean(&v, 10.0, 4.0, "normal mean");
    check_quantile(&v, 0.1, 10.0 - Z_90 * 2.0, "normal");
    check_quantile(&v, 0.5, 10.0, "normal");
    check_quantile(&v, 0.9, 10.0 + Z_90 * 2.0, "normal");
    close(s.mean(), 10.0, "normal closed-form mean");
    close(s.variance(), 4.0, "normal closed-form variance");
}

#[test]
fn lognormal_matches_its_closed_forms() {
    // ln x ~ N(μ, σ): mean exp(μ + σ²/2), variance (exp(σ²) − 1)·exp(2μ +
    // σ²), q_p = exp(μ + z_p σ) (Aitchison & Brown, The Lognormal
    // Distribution, 1957; from memory).
    let (mu, sigma) = (3.85f64.ln(), 0.3f64);
    let s = sampler(Distribution::LogNormal { mu, sigma }, None);
    let v = draws(&s, 14);
    let mean = (mu + sigma * sigma / 2.0).exp();
    let variance = ((sigma * sigma).exp() - 1.0) * (2.0 * mu + sigma * sigma).exp();
    check_mean(&v, mean, variance, "lognormal mean");
    check_quantile(&v, 0.1, (mu - Z_90 * sigma).exp(), "lognormal");
    check_quantile(&v, 0.5, mu.exp(), "lognormal");
    check_quantile(&v, 0.9, (mu + Z_90 * sigma).exp(), "lognormal");
    close(s.mean(), mean, "lognormal closed-form mean");
    close(s.variance(), variance, "lognormal closed-form variance");
}

#[test]
fn normal_truncated_at_its_mean_is_half_normal() {
    // N(0, 1) kept on [0, ∞) is the half-normal: mean √(2/π), variance
    // 1 − 2/π, median z(0.75) (Johnson, Kotz & Balakrishnan, Continuous
    // Univariate Distributions, vol. 1, "folded normal"; from memory).
    let s = sampler(
        Distribution::Normal {
            mean: 0.0,
            sigma: 1.0,
        },
        Some((0.0, f64::INFINITY)),
    );
    let v = draws(&s, 15);
    let mean = (2.0 / std::f64::consts::PI).sqrt();
    let variance = 1.0 - 2.0 / std::f64::consts::PI;
    check_mean(&v, mean, variance, "half-normal mean");
    check_quantile(&v, 0.5, Z_75, "half-normal");
    assert!(v.iter().all(|x| *x >= 0.0));
    close(s.mean(), mean, "half-normal closed-form mean");
    close(s.variance(), variance, "half-normal closed-form variance");
}

#[test]
fn normal_truncated_below_has_the_inverse_mills_mean() {
    // N(0, 1) kept on [1, ∞): mean φ(1)/Q(1) = 0.241 970 725 / 0.158 655 254
    // = 1.525 135 276 (the inverse Mills ratio; φ and Q from standard normal
    // tables, from memory). Its variance 1 + 1·λ − λ², λ = 1.525 135 276
    // (Johnson, Kotz & Balakrishnan, vol. 1, truncated normal; from memory).
    let s = sampler(
        Distribution::Normal {
            mean: 0.0,
            sigma: 1.0,
        },
        Some((1.0, f64::INFINITY)),
    );
    let v = draws(&s, 16);
    let lambda = 1.525_135_276;
    let variance = 1.0 + lambda - lambda * lambda;
    check_mean(&v, lambda, variance, "truncated normal mean");
    assert!((s.mean() - lambda).abs() < 1e-8);
    assert!((s.variance() - variance).abs() < 1e-8);
    assert!(v.iter().all(|x| *x >= 1.0));
}

#[test]
fn truncated_uniform_and_triangular_stay_inside_and_match_their_moments() {
    // Uniform on [0, 10] kept on [2, 4] is uniform on [2, 4] (mean 3,
    // variance 4/12). A symmetric triangle (0, 1, 2) kept on [0, 1] is the
    // rising side alone, density 2x: mean 2/3, variance 1/18, q_p = √p
    // (integrals of 2x on [0, 1]).
    let u = sampler(
        Distribution::Uniform {
            low: 0.0,
            high: 10.0,
        },
        Some((2.0, 4.0)),
    );
    let v = draws(&u, 17);
    check_mean(&v, 3.0, 4.0 / 12.0, "truncated uniform mean");
    assert!(v.iter().all(|x| (2.0..=4.0).contains(x)));
    let t = sampler(
        Distribution::Triangular {
            low: 0.0,
            mode: 1.0,
            high: 2.0,
        },
        Some((-5.0, 1.0)),
    );
    let v = draws(&t, 18);
    check_mean(&v, 2.0 / 3.0, 1.0 / 18.0, "truncated triangular mean");
    for p in [0.1, 0.5, 0.9] {
        check_quantile(&v, p, p.sqrt(), "truncated triangular");
    }
    close(t.mean(), 2.0 / 3.0, "truncated triangular closed-form mean");
    close(
        t.variance(),
        1.0 / 18.0,
        "truncated triangular closed-form variance",
    );
}

#[test]
fn truncated_lognormal_sample_mean_matches_its_partial_moment_formula() {
    // Checks the sampler's truncated-lognormal mean (partial moments of the
    // lognormal) against draws: the demo fuel price, median 3.85, σ 0.3,
    // kept on [1.5, 12].
    let s = sampler(
        Distribution::LogNormal {
            mu: 3.85f64.ln(),
            sigma: 0.3,
        },
        Some((1.5, 12.0)),
    );
    let v = draws(&s, 19);
    check_mean(&v, s.mean(), s.variance(), "truncated lognormal mean");
    assert!(v.iter().all(|x| (1.5..=12.0).contains(x)));
}

#[test]
fn point_distributions_always_give_their_point() {
    for d in [
        Distribution::Uniform {
            low: 0.9,
            high: 0.9,
        },
        Distribution::Triangular {
            low: 0.9,
            mode: 0.9,
            high: 0.9,
        },
        Distribution::Normal {
            mean: 0.9,
            sigma: 0.0,
        },
    ] {
        let s = sampler(d, None);
        assert_eq!(s.quantile(0.123), 0.9);
        assert_eq!(s.mean(), 0.9);
        assert_eq!(s.variance(), 0.0);
    }
}

#[test]
fn same_seed_same_numbers_other_seed_other_numbers() {
    let take = |seed: u64, index: u64| {
        let mut stream = Streams::new(seed).sample(index);
        [stream.next_unit(), stream.next_unit(), stream.next_unit()]
    };
    assert_eq!(take(7, 3), take(7, 3));
    assert_ne!(take(7, 3), take(8, 3));
    assert_ne!(take(7, 3), take(7, 4));
    let u = take(7, 3);
    assert!(u.iter().all(|x| *x > 0.0 && *x < 1.0));
}

#[test]
fn invalid_distributions_are_refused_not_sampled() {
    let refused = |d: Distribution, t: Option<(f64, f64)>| Sampler::new(d, t).is_err();
    assert!(refused(
        Distribution::Uniform {
            low: 2.0,
            high: 1.0
        },
        None
    ));
    assert!(refused(
        Distribution::Normal {
            mean: 1.0,
            sigma: -0.1
        },
        None
    ));
    assert!(refused(
        Distribution::Normal {
            mean: f64::NAN,
            sigma: 0.1
        },
        None
    ));
    // 350 standard deviations out: no probability left in double precision.
    assert!(refused(
        Distribution::Normal {
            mean: 0.915,
            sigma: 0.0001
        },
        Some((0.95, 0.96))
    ));
    assert!(refused(
        Distribution::Uniform {
            low: 0.0,
            high: 1.0
        },
        Some((2.0, 3.0))
    ));
    assert!(refused(
        Distribution::Uniform {
            low: 0.0,
            high: 1.0
        },
        Some((0.6, 0.4))
    ));
}
