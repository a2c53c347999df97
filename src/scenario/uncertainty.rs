//! Uncertain inputs: a scenario key with a sensitivity swing range and/or a
//! probability distribution. Values are in the key's internal unit (see
//! [`super::Scenario::get_numeric`]).

/// A probability distribution of one input, parameters in the key's
/// internal unit.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Distribution {
    /// Uniform on [low, high], low ≤ high.
    Uniform {
        /// Lower bound.
        low: f64,
        /// Upper bound.
        high: f64,
    },
    /// Triangular with low ≤ mode ≤ high.
    Triangular {
        /// Lower bound.
        low: f64,
        /// Most likely value.
        mode: f64,
        /// Upper bound.
        high: f64,
    },
    /// Normal with mean and standard deviation (sigma ≥ 0).
    Normal {
        /// Mean.
        mean: f64,
        /// Standard deviation, ≥ 0 (0 is a point).
        sigma: f64,
    },
    /// Lognormal: ln x is normal with mean `mu` and standard deviation
    /// `sigma` (≥ 0). A file may give `median` instead of `mu`
    /// (mu = ln median).
    LogNormal {
        /// Mean of ln x (x in the key's internal unit).
        mu: f64,
        /// Standard deviation of ln x, ≥ 0.
        sigma: f64,
    },
}

impl Distribution {
    /// Smallest and largest value the distribution can take (before any
    /// truncation); infinite where unbounded.
    pub fn support(&self) -> (f64, f64) {
        match *self {
            Distribution::Uniform { low, high } | Distribution::Triangular { low, high, .. } => {
                (low, high)
            }
            Distribution::Normal { mean, sigma: 0.0 } => (mean, mean),
            Distribution::Normal { .. } => (f64::NEG_INFINITY, f64::INFINITY),
            Distribution::LogNormal { mu, sigma: 0.0 } => (mu.exp(), mu.exp()),
            Distribution::LogNormal { .. } => (0.0, f64::INFINITY),
        }
    }
}

/// One `[[uncertainty]]` entry.
#[derive(Debug, Clone, PartialEq)]
pub struct UncertainInput {
    /// Dotted scenario key, e.g. `fuel.price`, `candidate.turbine_efficiency`
    /// or `candidate[premium].turbine_efficiency`.
    pub key: String,
    /// Distribution for `risk`, if given.
    pub distribution: Option<Distribution>,
    /// Truncation bounds (low ≤ high) applied to the distribution, if given.
    pub truncate: Option<(f64, f64)>,
    /// Low end of the sensitivity swing; `None` means 20 % below the base
    /// value (stated as a default in reports).
    pub low: Option<f64>,
    /// High end of the sensitivity swing; `None` means 20 % above the base.
    pub high: Option<f64>,
}
