//! Drawing uncertain inputs: each distribution (optionally truncated) as a
//! [`Sampler`] that turns a uniform number into a value by its inverse
//! cumulative distribution, with its closed-form mean, variance and
//! quantiles; and the seeded random streams, one per sample.
//!
//! Truncation keeps the distribution's shape on the kept interval and
//! rescales it to probability one: the distribution of a draw conditional on
//! landing inside, which is exactly what rejecting and redrawing outside
//! draws gives. Drawing by the inverse CDF restricted to the interval gets
//! it with one uniform number and no loop, however little mass is kept.
//!
//! Streams: sample `i` of seed `s` reads ChaCha8 stream `i` of the key
//! derived from `s`, so every sample's numbers depend on `(s, i)` alone and
//! results are bit-identical whatever the number of threads.
//!
//! Correlated inputs: [`rank_correlation::RankCorrelation`] holds a target
//! rank-correlation matrix and [`iman_conover`] reorders independently drawn
//! columns to carry it.

pub mod iman_conover;
pub mod normal;
pub mod rank_correlation;

use crate::scenario::Distribution;
use rand::{RngCore, SeedableRng};
use rand_chacha::ChaCha8Rng;

/// Why a distribution cannot be sampled.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum SamplingError {
    /// A parameter or bound is NaN or infinite where a finite number is needed.
    #[error("{parameter} is {value}; expected a finite number")]
    NotFinite {
        /// Which parameter.
        parameter: &'static str,
        /// Its value.
        value: f64,
    },
    /// Parameters out of order or negative where they may not be.
    #[error("{problem}; expected {valid}")]
    Invalid {
        /// What is wrong.
        problem: String,
        /// What would be valid.
        valid: &'static str,
    },
    /// The truncation keeps no probability (numerically) of the distribution.
    #[error(
        "truncation to [{low}, {high}] keeps no probability of the distribution; expected a \
         range where it has values"
    )]
    EmptyTruncation {
        /// Lower truncation bound.
        low: f64,
        /// Upper truncation bound.
        high: f64,
    },
}

/// A distribution ready to draw from: parameters checked, truncation applied.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Sampler {
    /// Always this value.
    Point(f64),
    /// Uniform on [low, high] (already cut to the truncation), low < high.
    Uniform {
        /// Lower bound.
        low: f64,
        /// Upper bound.
        high: f64,
    },
    /// Triangular (low, mode, high) restricted to [from, to].
    Triangular {
        /// Lower bound of the triangle.
        low: f64,
        /// Mode.
        mode: f64,
        /// Upper bound of the triangle.
        high: f64,
        /// Kept interval, lower end (≥ low).
        from: f64,
        /// Kept interval, upper end (≤ high).
        to: f64,
    },
    /// Normal (mean, sigma > 0) restricted to standardized [alpha, beta].
    Normal {
        /// Mean.
        mean: f64,
        /// Standard deviation, > 0.
        sigma: f64,
        /// Lower bound in standard units (may be −∞).
        alpha: f64,
        /// Upper bound in standard units (may be +∞).
        beta: f64,
    },
    /// Lognormal (ln x normal with mu, sigma > 0) restricted to
    /// standardized [alpha, beta] of ln x.
    LogNormal {
        /// Mean of ln x.
        mu: f64,
        /// Standard deviation of ln x, > 0.
        sigma: f64,
        /// Lower bound of (ln x − mu)/sigma (may be −∞).
        alpha: f64,
        /// Upper bound of (ln x − mu)/sigma (may be +∞).
        beta: f64,
    },
}

fn finite(parameter: &'static str, value: f64) -> Result<f64, SamplingError> {
    if value.is_finite() {
        Ok(value)
    } else {
        Err(SamplingError::NotFinite { parameter, value })
    }
}

fn invalid(problem: String, valid: &'static str) -> SamplingError {
    SamplingError::Invalid { problem, valid }
}

/// CDF of the triangular distribution (closed form).
fn triangular_cdf(low: f64, mode: f64, high: f64, x: f64) -> f64 {
    let width = high - low;
    if x <= low {
        0.0
    } else if x >= high {
        1.0
    } else if x <= mode {
        (x - low) * (x - low) / (width * (mode - low))
    } else {
        1.0 - (high - x) * (high - x) / (width * (high - mode))
    }
}

/// Inverse CDF of the triangular distribution (closed form).
fn triangular_quantile(low: f64, mode: f64, high: f64, p: f64) -> f64 {
    let width = high - low;
    if p * width < mode - low {
        low + (p * width * (mode - low)).sqrt()
    } else {
        high - ((1.0 - p) * width * (high - mode)).sqrt()
    }
}

/// ∫ y^k f(y) dy over [y0, y1] for the triangle on y ∈ [0, w] with mode
/// at c (y = x − low), for k = 0, 1, 2.
fn triangular_moments(c: f64, w: f64, y0: f64, y1: f64) -> [f64; 3] {
    let mut m = [0.0; 3];
    // Rising side: f = 2y/(w c) on [0, c].
    let (a, b) = (y0.max(0.0), y1.min(c));
    if b > a && c > 0.0 {
        for (k, m) in m.iter_mut().enumerate() {
            let n = k as i32 + 2;
            *m += 2.0 / (w * c) * (b.powi(n) - a.powi(n)) / f64::from(n);
        }
    }
    // Falling side: f = 2(w − y)/(w (w − c)) on [c, w].
    let (a, b) = (y0.max(c), y1.min(w));
    if b > a && w > c {
        for (k, m) in m.iter_mut().enumerate() {
            let n = k as i32 + 1;
            let upper = w * b.powi(n) / f64::from(n) - b.powi(n + 1) / f64::from(n + 1);
            let lower = w * a.powi(n) / f64::from(n) - a.powi(n + 1) / f64::from(n + 1);
            *m += 2.0 / (w * (w - c)) * (upper - lower);
        }
    }
    m
}

impl Sampler {
    /// Check `distribution` and apply `truncate` (low ≤ high; infinite ends
    /// allowed). Errors on non-finite parameters, parameters out of order,
    /// a negative sigma, or a truncation that keeps no probability.
    pub fn new(
        distribution: Distribution,
        truncate: Option<(f64, f64)>,
    ) -> Result<Sampler, SamplingError> {
        let (t_low, t_high) = truncate.unwrap_or((f64::NEG_INFINITY, f64::INFINITY));
        if t_low.is_nan() || t_high.is_nan() || t_low > t_high {
            return Err(invalid(
                format!("truncation [{t_low}, {t_high}] is not an interval"),
                "truncate = [low, high] with low ≤ high",
            ));
        }
        let empty = || SamplingError::EmptyTruncation {
            low: t_low,
            high: t_high,
        };
        let point = |x: f64| {
            if (t_low..=t_high).contains(&x) {
                Ok(Sampler::Point(x))
            } else {
                Err(empty())
            }
        };
        match distribution {
            Distribution::Uniform { low, high } => {
                let (low, high) = (finite("low", low)?, finite("high", high)?);
                if low > high {
                    return Err(invalid(
                        format!("low {low} is above high {high}"),
                        "low ≤ high",
                    ));
                }
                if low == high {
                    return point(low);
                }
                let (from, to) = (low.max(t_low), high.min(t_high));
                if from < to {
                    Ok(Sampler::Uniform {
                        low: from,
                        high: to,
                    })
                } else {
                    Err(empty())
                }
            }
            Distribution::Triangular { low, mode, high } => {
                let low = finite("low", low)?;
                let (mode, high) = (finite("mode", mode)?, finite("high", high)?);
                if !(low <= mode && mode <= high) {
                    return Err(invalid(
                        format!("low {low}, mode {mode}, high {high} are not in order"),
                        "low ≤ mode ≤ high",
                    ));
                }
                if low == high {
                    return point(low);
                }
                let (from, to) = (low.max(t_low), high.min(t_high));
                if from < to {
                    Ok(Sampler::Triangular {
                        low,
                        mode,
                        high,
                        from,
                        to,
                    })
                } else {
                    Err(empty())
                }
            }
            Distribution::Normal { mean, sigma } | Distribution::LogNormal { mu: mean, sigma } => {
                let lognormal = matches!(distribution, Distribution::LogNormal { .. });
                let mean = finite(if lognormal { "mu" } else { "mean" }, mean)?;
                let sigma = finite("sigma", sigma)?;
                if sigma < 0.0 {
                    return Err(invalid(format!("sigma {sigma} is negative"), "sigma ≥ 0"));
                }
                if sigma == 0.0 {
                    return point(if lognormal { mean.exp() } else { mean });
                }
                let standard = |x: f64| {
                    let x = if lognormal {
                        if x <= 0.0 {
                            f64::NEG_INFINITY
                        } else {
                            x.ln()
                        }
                    } else {
                        x
                    };
                    (x - mean) / sigma
                };
                let (alpha, beta) = (standard(t_low), standard(t_high));
                let mass = normal::mass_between(alpha, beta);
                if mass.is_nan() || mass <= 0.0 {
                    return Err(empty());
                }
                Ok(if lognormal {
                    Sampler::LogNormal {
                        mu: mean,
                        sigma,
                        alpha,
                        beta,
                    }
                } else {
                    Sampler::Normal {
                        mean,
                        sigma,
                        alpha,
                        beta,
                    }
                })
            }
        }
    }

    /// The value below which the fraction `p` (0 to 1) of the (truncated)
    /// distribution lies. Drawing is `quantile(u)` with `u` uniform.
    pub fn quantile(&self, p: f64) -> f64 {
        match *self {
            Sampler::Point(x) => x,
            Sampler::Uniform { low, high } => low + p * (high - low),
            Sampler::Triangular {
                low,
                mode,
                high,
                from,
                to,
            } => {
                let (f0, f1) = (
                    triangular_cdf(low, mode, high, from),
                    triangular_cdf(low, mode, high, to),
                );
                triangular_quantile(low, mode, high, f0 + p * (f1 - f0)).clamp(from, to)
            }
            Sampler::Normal {
                mean,
                sigma,
                alpha,
                beta,
            } => mean + sigma * normal::quantile_between(alpha, beta, p),
            Sampler::LogNormal {
                mu,
                sigma,
                alpha,
                beta,
            } => (mu + sigma * normal::quantile_between(alpha, beta, p)).exp(),
        }
    }

    /// Mean of the (truncated) distribution, closed form.
    pub fn mean(&self) -> f64 {
        self.moments().0
    }

    /// Variance of the (truncated) distribution, closed form.
    pub fn variance(&self) -> f64 {
        self.moments().1
    }

    /// (mean, variance). Uniform: (a+b)/2, (b−a)²/12. Triangular: partial
    /// moments of its piecewise-linear density. Normal truncated to
    /// [α, β]: μ + σ(φ(α) − φ(β))/Z and σ²[1 + (αφ(α) − βφ(β))/Z −
    /// ((φ(α) − φ(β))/Z)²], Z = Φ(β) − Φ(α) (Johnson, Kotz & Balakrishnan,
    /// Continuous Univariate Distributions, vol. 1, ch. 13; from memory).
    /// Lognormal: E[xᵏ] = exp(kμ + k²σ²/2)·[Φ(β − kσ) − Φ(α − kσ)]/Z (the
    /// partial moments of the lognormal, same work, ch. 14; from memory).
    fn moments(&self) -> (f64, f64) {
        match *self {
            Sampler::Point(x) => (x, 0.0),
            Sampler::Uniform { low, high } => {
                ((low + high) / 2.0, (high - low) * (high - low) / 12.0)
            }
            Sampler::Triangular {
                low,
                mode,
                high,
                from,
                to,
            } => {
                let m = triangular_moments(mode - low, high - low, from - low, to - low);
                let mean = m[1] / m[0];
                (low + mean, m[2] / m[0] - mean * mean)
            }
            Sampler::Normal {
                mean,
                sigma,
                alpha,
                beta,
            } => {
                let z = normal::mass_between(alpha, beta);
                let phi = |x: f64| {
                    if x.is_finite() {
                        normal::density(x)
                    } else {
                        0.0
                    }
                };
                let x_phi = |x: f64| {
                    if x.is_finite() {
                        x * normal::density(x)
                    } else {
                        0.0
                    }
                };
                let shift = (phi(alpha) - phi(beta)) / z;
                let spread = 1.0 + (x_phi(alpha) - x_phi(beta)) / z - shift * shift;
                (mean + sigma * shift, sigma * sigma * spread)
            }
            Sampler::LogNormal {
                mu,
                sigma,
                alpha,
                beta,
            } => {
                let z = normal::mass_between(alpha, beta);
                let raw = |k: f64| {
                    (k * mu + 0.5 * k * k * sigma * sigma).exp()
                        * normal::mass_between(alpha - k * sigma, beta - k * sigma)
                        / z
                };
                let (first, second) = (raw(1.0), raw(2.0));
                (first, second - first * first)
            }
        }
    }
}

/// The seeded source of every sample's random numbers.
#[derive(Debug, Clone)]
pub struct Streams {
    keyed: ChaCha8Rng,
}

/// The random numbers of one sample.
#[derive(Debug, Clone)]
pub struct SampleStream {
    rng: ChaCha8Rng,
}

impl Streams {
    /// The streams of `seed`.
    pub fn new(seed: u64) -> Streams {
        Streams {
            keyed: ChaCha8Rng::seed_from_u64(seed),
        }
    }

    /// The stream of sample `index`: its numbers depend on the seed and
    /// `index` only.
    pub fn sample(&self, index: u64) -> SampleStream {
        let mut rng = self.keyed.clone();
        rng.set_stream(index);
        rng.set_word_pos(0);
        SampleStream { rng }
    }
}

impl SampleStream {
    /// A uniform number in the open interval (0, 1): 53 random bits, centred
    /// in their cell so that 0 and 1 never occur.
    pub fn next_unit(&mut self) -> f64 {
        // 2^-53: the spacing of 53-bit fractions.
        const SCALE: f64 = 1.0 / 9_007_199_254_740_992.0;
        ((self.rng.next_u64() >> 11) as f64 + 0.5) * SCALE
    }
}
