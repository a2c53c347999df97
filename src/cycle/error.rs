//! Why a cycle cannot be solved: an input out of range, a physically
//! impossible combination, or (never expected) a solve that fails its own
//! first-law check.

use crate::thermo::cold_air::ColdAirError;
use thiserror::Error;

/// A cycle that cannot be solved. Every input variant names the
/// [`EngineConfig`](super::EngineConfig) field at fault in the snake_case
/// spelling the scenario file uses (nested fields dotted, e.g.
/// `regenerator.effectiveness`); see [`CycleError::field`].
#[derive(Debug, Clone, PartialEq, Error)]
pub enum CycleError {
    /// An input value outside its valid range, or a combination of inputs
    /// the physics does not allow.
    #[error("{field}: {problem}; {valid}")]
    Invalid {
        /// The field at fault.
        field: &'static str,
        /// What is wrong, with the value.
        problem: String,
        /// What would be valid.
        valid: String,
    },
    /// The cold-air constants are not valid.
    #[error("gas_model: {0}")]
    ColdAir(#[from] ColdAirError),
    /// The `products` gas model needs a fuel with a composition.
    #[error("gas_model: the products gas model needs a fuel composition, but the fuel is given by heating values only; use the air or cold-air gas model, or give the composition")]
    FuelNotModelled,
    /// The turbine does not deliver more work than the compressor absorbs.
    #[error("the cycle delivers no net work: the turbine gives {turbine_work_kj_per_kg:.3} kJ/kg but the compressor absorbs {compressor_work_kj_per_kg:.3} kJ/kg; raise the turbine inlet temperature or the component efficiencies, or lower the pressure ratio")]
    NoNetWork {
        /// Turbine work per kg of compressor inlet air, kJ/kg.
        turbine_work_kj_per_kg: f64,
        /// Compressor work per kg of compressor inlet air, kJ/kg.
        compressor_work_kj_per_kg: f64,
    },
    /// Internal: the solved cycle does not satisfy the first law to 1e-9
    /// relative. Never expected; reported rather than printing a number.
    #[error("the first law does not close: net work minus (heat added − heat rejected) is {residual_kj_per_kg:e} kJ/kg against a heat input of {heat_input_kj_per_kg} kJ/kg")]
    EnergyBalance {
        /// The residual, kJ/kg.
        residual_kj_per_kg: f64,
        /// The heat input it is compared with, kJ/kg.
        heat_input_kj_per_kg: f64,
    },
    /// Internal: the products fuel–air ratio iteration did not converge.
    #[error("the fuel–air ratio iteration did not converge (last change {last_change:e})")]
    NoConvergence {
        /// Last change of the fuel–air ratio.
        last_change: f64,
    },
}

impl CycleError {
    /// The input field at fault (snake_case, nested fields dotted), if the
    /// error is about one field.
    pub fn field(&self) -> Option<&'static str> {
        match self {
            CycleError::Invalid { field, .. } => Some(field),
            CycleError::ColdAir(_) | CycleError::FuelNotModelled => Some("gas_model"),
            CycleError::NoNetWork { .. }
            | CycleError::EnergyBalance { .. }
            | CycleError::NoConvergence { .. } => None,
        }
    }

    /// True when the user's input is at fault (exit code 1), false for an
    /// internal failure.
    pub fn is_input_error(&self) -> bool {
        !matches!(
            self,
            CycleError::EnergyBalance { .. } | CycleError::NoConvergence { .. }
        )
    }

    /// The message without the leading `field: `, for callers that name the
    /// field their own way (a command-line flag, a file position).
    pub fn detail(&self) -> String {
        let text = self.to_string();
        match self.field() {
            Some(field) => text
                .strip_prefix(field)
                .and_then(|rest| rest.strip_prefix(": "))
                .map_or_else(|| text.clone(), str::to_string),
            None => text,
        }
    }

    pub(crate) fn invalid(
        field: &'static str,
        problem: impl Into<String>,
        valid: impl Into<String>,
    ) -> CycleError {
        CycleError::Invalid {
            field,
            problem: problem.into(),
            valid: valid.into(),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn detail_drops_the_field_prefix() {
        let e = CycleError::invalid(
            "compressor_efficiency",
            "1.3 is above 1",
            "expected an efficiency in (0, 1]",
        );
        assert_eq!(e.field(), Some("compressor_efficiency"));
        assert_eq!(
            e.detail(),
            "1.3 is above 1; expected an efficiency in (0, 1]"
        );
        assert!(e.is_input_error());
        assert!(!CycleError::NoConvergence { last_change: 1.0 }.is_input_error());
    }
}
