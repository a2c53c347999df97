//! Gas property models: ideal gases described by enthalpy, standard-state
//! entropy and heat capacity as functions of temperature, and the inverse
//! solves a cycle needs (temperature from enthalpy; temperature from
//! standard-state entropy, which gives isentropic and polytropic end states).
//!
//! Three pieces, smallest first: [`nasa7`] (one polynomial), [`species`]
//! (the data, each block with its source), [`mixture`] (an ideal-gas mixture,
//! itself one polynomial). [`cold_air`] is the constant-cp model.
//!
//! Conventions: specific values are per kilogram of the gas; enthalpies of
//! the polynomial models are absolute (they include enthalpies of formation,
//! so a combustor energy balance needs no separate heat of reaction);
//! entropies include the entropy of mixing and refer to 101.325 kPa.

pub mod cold_air;
pub mod humidity;
pub mod mixture;
pub mod nasa7;
pub mod species;

use thiserror::Error;

/// Universal gas constant, kJ/(kmol·K): CODATA 2018 exact value
/// (N_A × k_B), the value Cantera uses.
pub const UNIVERSAL_GAS_CONSTANT_KJ_PER_KMOL_K: f64 = 8.314_462_618_153_24;

/// Standard-state pressure of the NASA polynomial data (1 atm), kPa.
pub const STANDARD_PRESSURE_KPA: f64 = 101.325;

/// Thermochemical reference temperature (25 °C), K: heating values and
/// enthalpies of formation refer to it.
pub const REFERENCE_TEMPERATURE_K: f64 = 298.15;

/// Lowest temperature at which brayfin evaluates the polynomial models, K.
pub const MIN_TEMPERATURE_K: f64 = 200.0;

/// Highest temperature at which brayfin evaluates the polynomial models, K
/// (GRI-Mech 3.0 data reach 3500 K; brayfin keeps a margin).
pub const MAX_TEMPERATURE_K: f64 = 3000.0;

/// A property evaluation or inverse solve that has no valid answer.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum ThermoError {
    /// A temperature given to the model lies outside its data range.
    #[error("temperature {temperature_k} K is outside the property data range {low_k}–{high_k} K")]
    TemperatureOutOfRange {
        /// The offending temperature, K.
        temperature_k: f64,
        /// Lower end of the data range, K.
        low_k: f64,
        /// Upper end of the data range, K.
        high_k: f64,
    },
    /// An inverse solve's target lies beyond the values the data range
    /// reaches: the state would be colder or hotter than the data allow.
    #[error(
        "the state with {quantity} {value:.6} would be {} the property data range {low_k}–{high_k} K",
        if *above { "hotter than" } else { "colder than" }
    )]
    InverseOutOfRange {
        /// Which property was inverted ("enthalpy" or "standard entropy").
        quantity: &'static str,
        /// The target value, kJ/kg or kJ/(kg·K).
        value: f64,
        /// Lower end of the data range, K.
        low_k: f64,
        /// Upper end of the data range, K.
        high_k: f64,
        /// True when the state would be hotter than the range, false colder.
        above: bool,
    },
    /// A mixture composition that describes no gas.
    #[error("invalid mixture composition: {0}")]
    Composition(String),
}

/// An ideal gas whose properties depend on temperature only (enthalpy) or on
/// temperature and pressure (entropy), per kilogram of the gas.
pub trait GasProperties {
    /// Whether the inverse solves start from their `guess_k` (iterative
    /// models). A closed-form model sets this false so callers can skip
    /// computing a guess.
    const USES_GUESS: bool = true;

    /// Specific enthalpy, kJ/kg, at `temperature_k`.
    fn enthalpy_kj_per_kg(&self, temperature_k: f64) -> f64;
    /// Specific entropy at the standard pressure (101.325 kPa), kJ/(kg·K).
    fn standard_entropy_kj_per_kg_k(&self, temperature_k: f64) -> f64;
    /// Specific heat at constant pressure, kJ/(kg·K).
    fn cp_kj_per_kg_k(&self, temperature_k: f64) -> f64;
    /// Specific gas constant R = R_u / M, kJ/(kg·K).
    fn gas_constant_kj_per_kg_k(&self) -> f64;
    /// Temperatures at which the model may be evaluated, K (inclusive).
    fn temperature_range_k(&self) -> (f64, f64);
    /// Temperature whose specific enthalpy is `enthalpy_kj_per_kg`; `guess_k`
    /// starts the search. Errors when no temperature within the range has it.
    fn temperature_from_enthalpy(
        &self,
        enthalpy_kj_per_kg: f64,
        guess_k: f64,
    ) -> Result<f64, ThermoError>;
    /// Temperature whose standard-state entropy is `entropy_kj_per_kg_k`;
    /// `guess_k` starts the search. Errors when no temperature within the
    /// range has it.
    fn temperature_from_standard_entropy(
        &self,
        entropy_kj_per_kg_k: f64,
        guess_k: f64,
    ) -> Result<f64, ThermoError>;

    /// Specific entropy at `temperature_k` and `pressure_kpa`, kJ/(kg·K):
    /// `s°(T) − R ln(p / p°)`.
    fn entropy_kj_per_kg_k(&self, temperature_k: f64, pressure_kpa: f64) -> f64 {
        self.standard_entropy_kj_per_kg_k(temperature_k)
            - self.gas_constant_kj_per_kg_k() * (pressure_kpa / STANDARD_PRESSURE_KPA).ln()
    }

    /// Ok when `temperature_k` lies within the model's range (and is finite).
    fn check_temperature(&self, temperature_k: f64) -> Result<(), ThermoError> {
        let (low_k, high_k) = self.temperature_range_k();
        if temperature_k >= low_k && temperature_k <= high_k {
            Ok(())
        } else {
            Err(ThermoError::TemperatureOutOfRange {
                temperature_k,
                low_k,
                high_k,
            })
        }
    }
}

/// What an inverse solve inverts: a strictly increasing function of
/// temperature over a range, and its slope.
pub(crate) struct Monotone<F, D> {
    pub(crate) quantity: &'static str,
    pub(crate) value: F,
    pub(crate) slope: D,
    pub(crate) range_k: (f64, f64),
}

/// Solve `value(T) = target` for T within the range by Newton steps kept
/// inside a shrinking bracket (bisection when a step would leave it). The
/// function is evaluated at an end of the range only when a Newton step
/// points beyond it, to tell whether the answer lies outside the data.
///
/// Stops after a Newton step below 1e-9·T (leaving an error near 1e-15·T),
/// or at a bracket narrower than 1e-12·T at the
/// (tiny) step where a polynomial changes range. At that step the two ranges
/// of a fit disagree slightly (for air, by about 1e-4 K in temperature for
/// the same enthalpy), so an inverse there is unique only to that amount.
pub(crate) fn invert_monotone<F, D>(
    f: &Monotone<F, D>,
    target: f64,
    guess_k: f64,
) -> Result<f64, ThermoError>
where
    F: Fn(f64) -> f64,
    D: Fn(f64) -> f64,
{
    let (low_k, high_k) = f.range_k;
    let out_of_range = |above| ThermoError::InverseOutOfRange {
        quantity: f.quantity,
        value: target,
        low_k,
        high_k,
        above,
    };
    if !target.is_finite() {
        return Err(out_of_range(target > 0.0));
    }
    let (mut a, mut b) = (low_k, high_k);
    let (mut low_checked, mut high_checked) = (false, false);
    let mut t = if guess_k > a && guess_k < b {
        guess_k
    } else {
        0.5 * (a + b)
    };
    for _ in 0..200 {
        let residual = (f.value)(t) - target;
        if residual == 0.0 {
            return Ok(t);
        }
        if residual > 0.0 {
            b = t;
        } else {
            a = t;
        }
        let mut next = t - residual / (f.slope)(t);
        if next >= b && b == high_k && !high_checked {
            high_checked = true;
            let at_end = (f.value)(high_k) - target;
            if at_end < 0.0 {
                return Err(out_of_range(true));
            }
            if at_end == 0.0 {
                return Ok(high_k);
            }
        }
        if next <= a && a == low_k && !low_checked {
            low_checked = true;
            let at_end = (f.value)(low_k) - target;
            if at_end > 0.0 {
                return Err(out_of_range(false));
            }
            if at_end == 0.0 {
                return Ok(low_k);
            }
        }
        if !(next > a && next < b) {
            next = 0.5 * (a + b);
        }
        // Newton converges quadratically: once a step is below 1e-9·T the
        // error left after taking it is of order (1e-9·T)²·|h''/2h'|, below
        // 1e-15·T for these smooth polynomials.
        if (next - t).abs() <= 1e-9 * t || b - a <= 1e-12 * t {
            return Ok(next);
        }
        t = next;
    }
    Ok(t)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn cubic() -> Monotone<impl Fn(f64) -> f64, impl Fn(f64) -> f64> {
        Monotone {
            quantity: "enthalpy",
            value: |t: f64| t + 1e-4 * t * t,
            slope: |t: f64| 1.0 + 2e-4 * t,
            range_k: (200.0, 3000.0),
        }
    }

    #[test]
    fn newton_inverse_recovers_the_temperature() {
        let f = cubic();
        for t in [200.0, 250.0, 999.0, 2999.0, 3000.0] {
            let got = invert_monotone(&f, (f.value)(t), 1000.0).unwrap();
            assert!((got - t).abs() < 1e-9, "{t} -> {got}");
        }
    }

    #[test]
    fn inverse_outside_range_is_an_error_not_a_number() {
        let f = cubic();
        let err = invert_monotone(&f, 5000.0, 1000.0).unwrap_err();
        assert!(matches!(
            err,
            ThermoError::InverseOutOfRange { above: true, .. }
        ));
        assert!(err.to_string().contains("hotter than"));
        let err = invert_monotone(&f, 10.0, 1000.0).unwrap_err();
        assert!(matches!(
            err,
            ThermoError::InverseOutOfRange { above: false, .. }
        ));
        assert!(invert_monotone(&f, f64::NAN, 1000.0).is_err());
    }

    #[test]
    fn a_step_in_the_function_converges_to_the_step() {
        let f = Monotone {
            quantity: "enthalpy",
            value: |t: f64| if t <= 1000.0 { t } else { t + 0.5 },
            slope: |_t: f64| 1.0,
            range_k: (200.0, 3000.0),
        };
        let got = invert_monotone(&f, 1000.25, 400.0).unwrap();
        assert!((got - 1000.0).abs() < 1e-6);
    }
}
