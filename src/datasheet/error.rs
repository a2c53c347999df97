//! Why a datasheet cannot be assessed or calibrated.

use crate::cycle::CycleError;
use thiserror::Error;

/// A datasheet that cannot be read, cannot be true, or cannot be fitted.
/// Input variants name the figure at fault as the scenario spells it
/// (`rating.heat_rate`, `rating.exhaust_flow`, …) so the caller can point
/// at its own key.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum DatasheetError {
    /// A figure outside its valid range.
    #[error("{field}: {problem}; {valid}")]
    Invalid {
        /// The figure at fault.
        field: &'static str,
        /// What is wrong, with the value.
        problem: String,
        /// What would be valid.
        valid: String,
    },
    /// The energy balance needs the fuel's composition (its combustion
    /// products), which a fuel given only by heating values lacks.
    #[error("fuel: the datasheet's energy balance needs the fuel's composition (its combustion products); expected a fuel given by composition, e.g. `methane` or `CH4=0.95,C2H6=0.05`")]
    FuelNotModelled,
    /// The stated figures cannot all be true; the message names them and
    /// what would have to move.
    #[error("the stated figures cannot all be true: {0}")]
    Impossible(String),
    /// No engine within the model's bounds reproduces the figures under the
    /// stated assumptions; the message says which unknown ran out of range.
    #[error("calibration: {0}")]
    NoFit(String),
    /// A property evaluation outside the data (an exhaust temperature
    /// beyond the property range, …).
    #[error("{field}: {problem}")]
    Property {
        /// The figure whose value left the data.
        field: &'static str,
        /// The property model's refusal.
        problem: String,
    },
    /// A vendor curve point the machine cannot be run at, or whose values
    /// are out of range.
    #[error("{curve}[{index}]: {problem}")]
    Curve {
        /// `part_load` or `ambient_correction`.
        curve: &'static str,
        /// The point's position in the curve, from 0.
        index: usize,
        /// What is wrong.
        problem: String,
    },
    /// The cycle solver refused a solve the calibration needed.
    #[error("{context}: {source}")]
    Cycle {
        /// What was being solved.
        context: String,
        /// The solver's refusal.
        source: CycleError,
    },
}

impl DatasheetError {
    /// The figure at fault, if one.
    pub fn field(&self) -> Option<&'static str> {
        match self {
            DatasheetError::Invalid { field, .. } | DatasheetError::Property { field, .. } => {
                Some(field)
            }
            DatasheetError::FuelNotModelled => Some("fuel"),
            DatasheetError::Curve { curve, .. } => Some(curve),
            _ => None,
        }
    }

    /// Whether the fault is in the input (exit 1) rather than internal.
    pub fn is_input_error(&self) -> bool {
        match self {
            DatasheetError::Cycle { source, .. } => source.is_input_error(),
            _ => true,
        }
    }

    pub(crate) fn invalid(
        field: &'static str,
        problem: impl Into<String>,
        valid: impl Into<String>,
    ) -> DatasheetError {
        DatasheetError::Invalid {
            field,
            problem: problem.into(),
            valid: valid.into(),
        }
    }
}
