//! A target rank-correlation matrix among sampled inputs: built from pairs,
//! checked, and diagnosed when its entries cannot hold together.
//!
//! A correlation matrix must be positive semi-definite: no set of inputs can
//! have, say, A strongly like B, A strongly like C and B strongly unlike C.
//! The check is a Cholesky factorization that tolerates zero pivots (a
//! perfectly correlated pair is allowed). When it fails, the error names the
//! pair that needs the smallest change to make the whole matrix consistent,
//! with the nearest value that works: that is the edit most likely to keep
//! what the user meant (ties: the larger correlation, then the first pair).
//! Only pairs among the inputs up to the failing pivot (the first input
//! whose correlations with the inputs before it cannot hold together) can
//! fix it, so only those are searched. When no single pair can fix the
//! matrix, or the failing block has more than 24 inputs, it names the
//! largest correlation of the input at the failing pivot.

/// Pivots within this of zero count as zero (a singular but consistent
/// matrix); below minus this the matrix is not positive semi-definite.
const PIVOT_TOLERANCE: f64 = 1e-10;

/// Largest leading block (inputs) searched for the single pair to change;
/// beyond it the largest correlation at the failing pivot is named.
const SEARCHED_INPUTS: usize = 24;

/// Why a correlation target or a set of samples cannot be used.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum CorrelationError {
    /// An input index beyond the inputs being sampled.
    #[error("input {input} is not among the {size} sampled inputs (valid: 0 to {})", size.saturating_sub(1))]
    InputOutOfRange {
        /// The index given.
        input: usize,
        /// How many inputs are sampled.
        size: usize,
    },
    /// A pair of an input with itself.
    #[error("input {input} is paired with itself; a correlation needs two different inputs")]
    SelfPair {
        /// The input.
        input: usize,
    },
    /// A pair given twice (in either order).
    #[error("inputs {first} and {second} are paired more than once; give each pair once")]
    DuplicatePair {
        /// One input of the pair.
        first: usize,
        /// The other.
        second: usize,
    },
    /// A correlation that is not a number from −1 to 1.
    #[error("the correlation of inputs {first} and {second} is {value}; valid is -1 to 1")]
    OutOfRange {
        /// One input of the pair.
        first: usize,
        /// The other.
        second: usize,
        /// The value given.
        value: f64,
    },
    /// The correlations cannot hold together.
    #[error(
        "the rank correlations cannot hold together (the matrix is not positive \
         semi-definite): change the correlation of inputs {first} and {second} ({value}){}",
        match nearest {
            Some(v) => format!(", e.g. to about {v:.3}, the nearest value that works with the others"),
            None => ", and others: no change of that pair alone is enough".to_string(),
        }
    )]
    NotPositiveSemiDefinite {
        /// One input of the pair to change.
        first: usize,
        /// The other.
        second: usize,
        /// Its correlation now.
        value: f64,
        /// The nearest value of that pair that makes the matrix consistent,
        /// if there is one.
        nearest: Option<f64>,
    },
    /// The samples do not match the target.
    #[error(
        "{columns} sample columns for a {size}-input correlation target; give one column per input"
    )]
    SizeMismatch {
        /// Inputs of the target.
        size: usize,
        /// Sample columns given.
        columns: usize,
    },
    /// Sample columns of different lengths.
    #[error("sample column {column} has {length} values, column 0 has {expected}; all columns need the same number")]
    RaggedSamples {
        /// The column.
        column: usize,
        /// Its length.
        length: usize,
        /// The first column's length.
        expected: usize,
    },
    /// Too few samples to impose a correlation on this many inputs.
    #[error("{samples} samples cannot carry a correlation among {inputs} inputs; draw more samples than inputs (at least {})", inputs + 2)]
    TooFewSamples {
        /// Samples given.
        samples: usize,
        /// Inputs.
        inputs: usize,
    },
}

/// A symmetric matrix of rank correlations with a unit diagonal.
#[derive(Debug, Clone, PartialEq)]
pub struct RankCorrelation {
    size: usize,
    /// Row-major, full (both triangles).
    entries: Vec<f64>,
}

impl RankCorrelation {
    /// No correlation among `size` inputs.
    pub fn identity(size: usize) -> RankCorrelation {
        let mut entries = vec![0.0; size * size];
        for i in 0..size {
            entries[i * size + i] = 1.0;
        }
        RankCorrelation { size, entries }
    }

    /// Correlations among `size` inputs from `(first, second, value)` pairs;
    /// pairs not given are uncorrelated. Errors name the pair: an input out
    /// of range, a self-pair, a pair given twice, a value outside −1 to 1.
    /// Consistency (positive semi-definiteness) is checked by
    /// [`RankCorrelation::check_consistent`].
    pub fn from_pairs(
        size: usize,
        pairs: &[(usize, usize, f64)],
    ) -> Result<RankCorrelation, CorrelationError> {
        let mut matrix = RankCorrelation::identity(size);
        let mut given = vec![false; size * size];
        for &(first, second, value) in pairs {
            for input in [first, second] {
                if input >= size {
                    return Err(CorrelationError::InputOutOfRange { input, size });
                }
            }
            if first == second {
                return Err(CorrelationError::SelfPair { input: first });
            }
            if !(value.is_finite() && (-1.0..=1.0).contains(&value)) {
                return Err(CorrelationError::OutOfRange {
                    first,
                    second,
                    value,
                });
            }
            if given[first * size + second] {
                return Err(CorrelationError::DuplicatePair { first, second });
            }
            given[first * size + second] = true;
            given[second * size + first] = true;
            matrix.set(first, second, value);
        }
        Ok(matrix)
    }

    /// Number of inputs.
    pub fn size(&self) -> usize {
        self.size
    }

    /// The correlation of inputs `i` and `j` (1 on the diagonal).
    ///
    /// # Panics
    /// If `i` or `j` is not below [`RankCorrelation::size`] (a programming
    /// error, never input).
    pub fn get(&self, i: usize, j: usize) -> f64 {
        self.entries[i * self.size + j]
    }

    fn set(&mut self, i: usize, j: usize, value: f64) {
        self.entries[i * self.size + j] = value;
        self.entries[j * self.size + i] = value;
    }

    /// The same matrix with each off-diagonal entry mapped by `f`.
    pub(crate) fn map(&self, f: impl Fn(f64) -> f64) -> RankCorrelation {
        let mut mapped = self.clone();
        for i in 0..self.size {
            for j in 0..i {
                mapped.set(i, j, f(self.get(i, j)));
            }
        }
        mapped
    }

    /// The lower Cholesky factor (row-major), zero pivots allowed; `Err`
    /// with the failing pivot when the matrix is not positive semi-definite.
    pub(crate) fn cholesky(&self) -> Result<Vec<f64>, usize> {
        cholesky(&self.entries, self.size, true)
    }

    /// `Ok` when the matrix is positive semi-definite; otherwise the error
    /// names a pair to change (see the module documentation).
    pub fn check_consistent(&self) -> Result<(), CorrelationError> {
        match self.cholesky() {
            Ok(_) => Ok(()),
            Err(pivot) => Err(self.diagnose(pivot)),
        }
    }

    /// The pair to change in a matrix whose Cholesky factorization failed at
    /// `pivot`.
    pub(crate) fn diagnose(&self, pivot: usize) -> CorrelationError {
        let mut best: Option<(usize, usize, f64)> = None;
        // Only a pair within the leading block up to the pivot can fix it:
        // that block is not positive semi-definite whatever lies outside.
        // Searched up to a block of SEARCHED_INPUTS (the search costs about
        // 400 factorizations per pair).
        let searched = if pivot < SEARCHED_INPUTS {
            pivot + 1
        } else {
            0
        };
        for i in 0..searched {
            for j in 0..i {
                if let Some(nearest) = self.nearest_consistent(i, j) {
                    let change = (nearest - self.get(i, j)).abs();
                    let better = match best {
                        None => true,
                        Some((bi, bj, bn)) => {
                            let best_change = (bn - self.get(bi, bj)).abs();
                            change < best_change
                                || (change == best_change
                                    && self.get(i, j).abs() > self.get(bi, bj).abs())
                        }
                    };
                    if better {
                        best = Some((i, j, nearest));
                    }
                }
            }
        }
        if let Some((i, j, nearest)) = best {
            return CorrelationError::NotPositiveSemiDefinite {
                first: j,
                second: i,
                value: self.get(i, j),
                nearest: Some(nearest),
            };
        }
        // No single pair fixes it: the largest correlation at the pivot.
        let other = (0..pivot)
            .max_by(|&a, &b| {
                self.get(pivot, a)
                    .abs()
                    .total_cmp(&self.get(pivot, b).abs())
            })
            .unwrap_or(0);
        CorrelationError::NotPositiveSemiDefinite {
            first: other.min(pivot),
            second: other.max(pivot),
            value: self.get(pivot, other),
            nearest: None,
        }
    }

    /// The value of entry `(i, j)` nearest its current one that makes the
    /// matrix positive semi-definite, others held; `None` if none in −1 to 1.
    ///
    /// The consistent values of one entry form an interval (the positive
    /// semi-definite matrices are convex), found on a grid of 0.005 and
    /// refined by bisection to 1e-9 toward the current value.
    fn nearest_consistent(&self, i: usize, j: usize) -> Option<f64> {
        const STEPS: i32 = 400;
        let current = self.get(i, j);
        let mut trial = self.clone();
        let mut consistent = |value: f64| {
            trial.set(i, j, value);
            trial.cholesky().is_ok()
        };
        let nearest_grid = (0..=STEPS)
            .map(|k| -1.0 + 2.0 * f64::from(k) / f64::from(STEPS))
            .filter(|&v| consistent(v))
            .min_by(|a, b| (a - current).abs().total_cmp(&(b - current).abs()))?;
        let (mut inside, mut outside) = (nearest_grid, current);
        while (inside - outside).abs() > 1e-9 {
            let middle = 0.5 * (inside + outside);
            if consistent(middle) {
                inside = middle;
            } else {
                outside = middle;
            }
        }
        Some(inside)
    }
}

/// Lower Cholesky factor of the symmetric `size`×`size` row-major matrix
/// `a`. With `allow_singular`, a pivot within [`PIVOT_TOLERANCE`] of zero is
/// taken as zero if the rest of its column is zero too (positive
/// semi-definite); otherwise every pivot must be positive. `Err(pivot)` at
/// the first pivot that fails.
pub(crate) fn cholesky(a: &[f64], size: usize, allow_singular: bool) -> Result<Vec<f64>, usize> {
    let mut l = vec![0.0; size * size];
    for j in 0..size {
        let dot = |r: usize, l: &[f64]| -> f64 {
            (0..j).map(|m| l[r * size + m] * l[j * size + m]).sum()
        };
        let pivot = a[j * size + j] - dot(j, &l);
        if pivot.is_nan()
            || pivot < -PIVOT_TOLERANCE
            || (!allow_singular && pivot <= PIVOT_TOLERANCE)
        {
            return Err(j);
        }
        if pivot <= PIVOT_TOLERANCE {
            // A zero pivot: consistent only if the column below is zero too.
            for r in j + 1..size {
                if (a[r * size + j] - dot(r, &l)).abs() > 1e-8 {
                    return Err(j);
                }
            }
            continue;
        }
        let root = pivot.sqrt();
        l[j * size + j] = root;
        for r in j + 1..size {
            l[r * size + j] = (a[r * size + j] - dot(r, &l)) / root;
        }
    }
    Ok(l)
}
