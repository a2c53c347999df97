//! The cold-air standard: a perfect gas with constant cp and ratio of
//! specific heats k.
//!
//! Conventions: `h = cp·T` (zero at 0 K) and `s° = cp ln(T / 298.15 K)`
//! (zero at 298.15 K and 101.325 kPa). Only differences matter in a cycle;
//! the zeros are stated so the state table is reproducible. The gas constant
//! follows from `R = cp (k − 1) / k`. Every inverse is closed-form.

use super::{GasProperties, ThermoError, REFERENCE_TEMPERATURE_K};
use thiserror::Error;

/// Default cold-air cp, kJ/(kg·K): air at 300 K (common practice).
pub const DEFAULT_CP_KJ_PER_KG_K: f64 = 1.005;
/// Default cold-air ratio of specific heats (common practice).
pub const DEFAULT_K: f64 = 1.4;

/// Invalid constants for the cold-air model.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum ColdAirError {
    /// cp not a positive finite number.
    #[error("cp = {0} kJ/(kg·K) is not valid; expected a positive number such as 1.005")]
    Cp(f64),
    /// k not a finite number above 1.
    #[error("k = {0} is not valid; expected a ratio of specific heats above 1, such as 1.4")]
    K(f64),
}

/// A perfect gas with constant cp and k, valid at every positive
/// temperature.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ColdAir {
    cp_kj_per_kg_k: f64,
    gas_constant_kj_per_kg_k: f64,
    exponent: f64,
}

impl ColdAir {
    /// Model with `cp_kj_per_kg_k` > 0 and `k` > 1.
    pub fn new(cp_kj_per_kg_k: f64, k: f64) -> Result<ColdAir, ColdAirError> {
        if !(cp_kj_per_kg_k.is_finite() && cp_kj_per_kg_k > 0.0) {
            return Err(ColdAirError::Cp(cp_kj_per_kg_k));
        }
        if !(k.is_finite() && k > 1.0) {
            return Err(ColdAirError::K(k));
        }
        let exponent = (k - 1.0) / k;
        Ok(ColdAir {
            cp_kj_per_kg_k,
            gas_constant_kj_per_kg_k: cp_kj_per_kg_k * exponent,
            exponent,
        })
    }

    /// The constant specific heat cp, kJ/(kg·K).
    pub fn constant_cp_kj_per_kg_k(&self) -> f64 {
        self.cp_kj_per_kg_k
    }

    /// The isentropic exponent (k − 1)/k = R/cp: along an isentrope
    /// `T2/T1 = (p2/p1)^((k−1)/k)`.
    pub fn isentropic_exponent(&self) -> f64 {
        self.exponent
    }
}

impl GasProperties for ColdAir {
    const USES_GUESS: bool = false;

    #[inline]
    fn enthalpy_kj_per_kg(&self, temperature_k: f64) -> f64 {
        self.cp_kj_per_kg_k * temperature_k
    }

    #[inline]
    fn standard_entropy_kj_per_kg_k(&self, temperature_k: f64) -> f64 {
        self.cp_kj_per_kg_k * (temperature_k / REFERENCE_TEMPERATURE_K).ln()
    }

    #[inline]
    fn cp_kj_per_kg_k(&self, _temperature_k: f64) -> f64 {
        self.cp_kj_per_kg_k
    }

    fn gas_constant_kj_per_kg_k(&self) -> f64 {
        self.gas_constant_kj_per_kg_k
    }

    fn temperature_range_k(&self) -> (f64, f64) {
        (f64::MIN_POSITIVE, f64::MAX)
    }

    fn temperature_from_enthalpy(
        &self,
        enthalpy_kj_per_kg: f64,
        _guess_k: f64,
    ) -> Result<f64, ThermoError> {
        let t = enthalpy_kj_per_kg / self.cp_kj_per_kg_k;
        if t.is_finite() && t > 0.0 {
            Ok(t)
        } else {
            Err(ThermoError::InverseOutOfRange {
                quantity: "enthalpy (kJ/kg)",
                value: enthalpy_kj_per_kg,
                low_k: 0.0,
                high_k: f64::INFINITY,
                above: t > 0.0,
            })
        }
    }

    fn temperature_from_standard_entropy(
        &self,
        entropy_kj_per_kg_k: f64,
        _guess_k: f64,
    ) -> Result<f64, ThermoError> {
        let t = REFERENCE_TEMPERATURE_K * (entropy_kj_per_kg_k / self.cp_kj_per_kg_k).exp();
        if t.is_finite() && t > 0.0 {
            Ok(t)
        } else {
            Err(ThermoError::InverseOutOfRange {
                quantity: "standard entropy (kJ/(kg·K))",
                value: entropy_kj_per_kg_k,
                low_k: 0.0,
                high_k: f64::INFINITY,
                above: t > 0.0,
            })
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Isentropic relation of a perfect gas: T2/T1 = (p2/p1)^((k−1)/k)
    /// (any thermodynamics text). Exact to rounding.
    #[test]
    fn isentropic_inverse_obeys_the_power_law() {
        let gas = ColdAir::new(DEFAULT_CP_KJ_PER_KG_K, DEFAULT_K).unwrap();
        let (t1, r) = (300.0_f64, 10.0_f64);
        let s_target =
            gas.standard_entropy_kj_per_kg_k(t1) + gas.gas_constant_kj_per_kg_k() * r.ln();
        let t2 = gas
            .temperature_from_standard_entropy(s_target, 0.0)
            .unwrap();
        let exact = t1 * r.powf(0.4 / 1.4);
        assert!((t2 - exact).abs() <= 1e-12 * exact);
    }

    #[test]
    fn invalid_constants_are_refused() {
        assert!(ColdAir::new(0.0, 1.4).is_err());
        assert!(ColdAir::new(1.005, 1.0).is_err());
        assert!(ColdAir::new(f64::NAN, 1.4).is_err());
        assert!(ColdAir::new(1.005, f64::INFINITY).is_err());
    }

    #[test]
    fn negative_enthalpy_has_no_temperature() {
        let gas = ColdAir::new(1.005, 1.4).unwrap();
        assert!(gas.temperature_from_enthalpy(-1.0, 300.0).is_err());
    }
}
