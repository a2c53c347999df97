//! Why an off-design point cannot be given.

use crate::cycle::CycleError;
use thiserror::Error;

/// An off-design request the machine cannot meet, or a machine that cannot
/// be built. Input variants name the field at fault (`load`,
/// `ambient.temperature_k`, `control.minimum_airflow`, …) so the caller can
/// point at its own flag or scenario key.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum OffDesignError {
    /// An input outside its valid range.
    #[error("{field}: {problem}; {valid}")]
    Invalid {
        /// The field at fault.
        field: &'static str,
        /// What is wrong, with the value.
        problem: String,
        /// What would be valid.
        valid: String,
    },
    /// The requested load is outside what the control allows.
    #[error("load: {load_percent:.3} % is {problem}; expected a load from {minimum_percent:.3} % to 100 % of the base-load output at this ambient")]
    Load {
        /// The requested load, % of base-load output at that ambient.
        load_percent: f64,
        /// The minimum load, %.
        minimum_percent: f64,
        /// "above 100 %" or "below the minimum load".
        problem: &'static str,
    },
    /// The control limits leave no point where the machine can run.
    #[error("control: {0}")]
    NoOperatingPoint(String),
    /// The design (rating) cycle or an off-design cycle would not solve.
    #[error("{context}: {source}")]
    Cycle {
        /// Where: `rating point` or the off-design condition.
        context: String,
        /// The cycle solver's refusal.
        source: CycleError,
    },
    /// Internal: an iteration that did not converge. Never expected.
    #[error(
        "internal: the {what} iteration did not converge (last relative change {last_change:e})"
    )]
    NoConvergence {
        /// Which iteration.
        what: &'static str,
        /// Its last relative change.
        last_change: f64,
    },
}

impl OffDesignError {
    /// The field at fault, if one.
    pub fn field(&self) -> Option<&'static str> {
        match self {
            OffDesignError::Invalid { field, .. } => Some(field),
            OffDesignError::Load { .. } => Some("load"),
            OffDesignError::NoOperatingPoint(_) => Some("control"),
            OffDesignError::Cycle { source, .. } => source.field(),
            OffDesignError::NoConvergence { .. } => None,
        }
    }

    /// True when the input is at fault (exit 1), false when internal (exit 2).
    pub fn is_input_error(&self) -> bool {
        match self {
            OffDesignError::Cycle { source, .. } => source.is_input_error(),
            OffDesignError::NoConvergence { .. } => false,
            _ => true,
        }
    }

    pub(crate) fn invalid(
        field: &'static str,
        problem: impl Into<String>,
        valid: impl Into<String>,
    ) -> OffDesignError {
        OffDesignError::Invalid {
            field,
            problem: problem.into(),
            valid: valid.into(),
        }
    }
}
