//! Discount rate, its basis (real or nominal), general inflation, and the
//! timing convention of cash flows within a year.

use super::FinanceError;

/// Whether money is stated in constant base-date money (real) or in
/// then-current money (nominal). The discount rate and every escalation rate
/// of a ledger are on this one basis.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum RateBasis {
    /// Constant money of the base date; rates exclude general inflation.
    Real,
    /// Then-current money; rates include general inflation.
    Nominal,
}

/// When within a period its cash flows are counted for discounting and
/// escalation.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Timing {
    /// At the end of each period (NIST Handbook 135 default).
    #[default]
    EndOfYear,
    /// At the middle of each period (cash spread evenly through the year).
    MidYear,
}

/// The rates of an analysis. All rates are fractions per year (0.07 = 7 %).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Rates {
    /// Discount rate on `basis`, per year; must exceed -1.
    pub discount_rate: f64,
    /// Basis of the discount rate and of every escalation rate.
    pub basis: RateBasis,
    /// General inflation per year; must exceed -1. Links the bases by the
    /// Fisher relation (1 + nominal) = (1 + real)(1 + inflation).
    pub inflation: f64,
}

/// Valid range of every rate in words.
pub(crate) const RATE_RANGE: &str = "a finite rate greater than -1 (-100 %)";

/// Check that `value` is a finite rate above -100 % per year.
pub(crate) fn check_rate(field: &'static str, value: f64) -> Result<(), FinanceError> {
    if value.is_finite() && value > -1.0 {
        Ok(())
    } else {
        Err(FinanceError::OutOfRange {
            field,
            value,
            valid: RATE_RANGE,
        })
    }
}

/// Nominal rate from a real rate and inflation, by the Fisher relation
/// (1 + n) = (1 + r)(1 + i) (exact form, not the approximation n ≈ r + i).
pub fn nominal_from_real(real_rate: f64, inflation: f64) -> f64 {
    (1.0 + real_rate) * (1.0 + inflation) - 1.0
}

/// Real rate from a nominal rate and inflation, by the Fisher relation
/// (1 + n) = (1 + r)(1 + i).
pub fn real_from_nominal(nominal_rate: f64, inflation: f64) -> f64 {
    (1.0 + nominal_rate) / (1.0 + inflation) - 1.0
}

impl Rates {
    /// Check the discount rate and inflation.
    pub fn validate(&self) -> Result<(), FinanceError> {
        check_rate("rates.discount_rate", self.discount_rate)?;
        check_rate("rates.inflation", self.inflation)
    }

    /// The discount rate on the real basis.
    pub fn real_discount_rate(&self) -> f64 {
        self.to_basis(self.discount_rate, RateBasis::Real)
    }

    /// The discount rate on the nominal basis.
    pub fn nominal_discount_rate(&self) -> f64 {
        self.to_basis(self.discount_rate, RateBasis::Nominal)
    }

    /// Restate `rate`, given on this analysis's basis, on `basis` using the
    /// Fisher relation with this analysis's inflation.
    pub fn to_basis(&self, rate: f64, basis: RateBasis) -> f64 {
        match (self.basis, basis) {
            (RateBasis::Real, RateBasis::Nominal) => nominal_from_real(rate, self.inflation),
            (RateBasis::Nominal, RateBasis::Real) => real_from_nominal(rate, self.inflation),
            _ => rate,
        }
    }

    /// The same analysis stated on `basis`: the discount rate restated by the
    /// Fisher relation. Escalation rates of the inputs must be restated with
    /// [`Rates::to_basis`] likewise.
    pub fn restated(&self, basis: RateBasis) -> Rates {
        Rates {
            discount_rate: self.to_basis(self.discount_rate, basis),
            basis,
            inflation: self.inflation,
        }
    }
}
