//! The number type of the ledger, and the two places where `f64` becomes money.
//!
//! The ledger is written once, generic over [`Money`]: `rust_decimal::Decimal`
//! for the printed ledger (exact decimal sums, no binary fractions of a cent)
//! and `f64` for sampling and sweeps, where speed matters and a relative error
//! of 1e-15 is immaterial.
//!
//! Two kinds of `f64` enter money arithmetic, each at one named function:
//! - physical quantities (GJ, MWh, tonnes, kW-years, overhaul counts), each
//!   already multiplied by its dimensionless escalation factor, at
//!   [`convert_physics_to_money`];
//! - dimensionless discount factors and fractions at [`Money::from_factor`].
//!
//! Both round to [`SIGNIFICANT_DIGITS`] significant digits for `Decimal`.
//!
//! Money itself is never rounded inside the ledger; [`round_for_presentation`]
//! rounds once, for display.

use std::fmt::{Debug, Display};

use rust_decimal::prelude::ToPrimitive;
use rust_decimal::{Decimal, RoundingStrategy};

use super::FinanceError;

/// Significant decimal digits kept when an `f64` (a physical quantity or a
/// dimensionless factor) becomes a `Decimal`: 15, the digits an `f64` is
/// guaranteed to carry (the C standard's `DBL_DIG`), so the conversion adds
/// no error beyond what the `f64` already had (at most 5e-15 relative). A
/// 15-digit quantity times a price of up to 13 digits fits the 96-bit
/// `Decimal` mantissa, so quantity × price is exact.
pub const SIGNIFICANT_DIGITS: i32 = 15;

/// A number type the ledger can keep money in.
///
/// Arithmetic is checked: an operation that leaves the representable range
/// (or, for `f64`, is not finite) yields `None`, which the ledger turns into
/// [`FinanceError::Overflow`]. Implemented for `Decimal` and `f64`.
pub trait Money: Copy + PartialEq + PartialOrd + Debug + Display + Send + Sync + 'static {
    /// Zero money.
    const ZERO: Self;
    /// One unit of money (or the factor one).
    const ONE: Self;
    /// `self + rhs`, `None` if out of range.
    fn add_checked(self, rhs: Self) -> Option<Self>;
    /// `self - rhs`, `None` if out of range.
    fn sub_checked(self, rhs: Self) -> Option<Self>;
    /// `self * rhs`, `None` if out of range.
    fn mul_checked(self, rhs: Self) -> Option<Self>;
    /// `self / rhs`, `None` if out of range or `rhs` is zero.
    fn div_checked(self, rhs: Self) -> Option<Self>;
    /// A `Decimal` input (a price, an amount) in this type.
    fn from_decimal(value: Decimal) -> Self;
    /// A physical quantity; see [`convert_physics_to_money`]. `None` if not
    /// finite or out of range.
    fn from_physics(value: f64) -> Option<Self>;
    /// A dimensionless factor or ratio (discount factor, escalation factor,
    /// fraction), rounded half-to-even to [`SIGNIFICANT_DIGITS`] significant
    /// digits for `Decimal`. `None` if not finite or out of range.
    fn from_factor(value: f64) -> Option<Self>;
    /// This value as `f64`, for rates and root finding, never for money sums.
    fn to_f64(self) -> f64;
}

impl Money for Decimal {
    const ZERO: Self = Decimal::ZERO;
    const ONE: Self = Decimal::ONE;

    fn add_checked(self, rhs: Self) -> Option<Self> {
        self.checked_add(rhs)
    }

    fn sub_checked(self, rhs: Self) -> Option<Self> {
        self.checked_sub(rhs)
    }

    fn mul_checked(self, rhs: Self) -> Option<Self> {
        self.checked_mul(rhs)
    }

    fn div_checked(self, rhs: Self) -> Option<Self> {
        self.checked_div(rhs)
    }

    fn from_decimal(value: Decimal) -> Self {
        value
    }

    fn from_physics(value: f64) -> Option<Self> {
        significant_decimal(value)
    }

    fn from_factor(value: f64) -> Option<Self> {
        significant_decimal(value)
    }

    fn to_f64(self) -> f64 {
        // Mantissa over a power of ten: within two ulps, and much faster
        // than the exact conversion.
        self.mantissa() as f64 / 10f64.powi(self.scale() as i32)
    }
}

impl Money for f64 {
    const ZERO: Self = 0.0;
    const ONE: Self = 1.0;

    fn add_checked(self, rhs: Self) -> Option<Self> {
        finite(self + rhs)
    }

    fn sub_checked(self, rhs: Self) -> Option<Self> {
        finite(self - rhs)
    }

    fn mul_checked(self, rhs: Self) -> Option<Self> {
        finite(self * rhs)
    }

    fn div_checked(self, rhs: Self) -> Option<Self> {
        if rhs == 0.0 {
            None
        } else {
            finite(self / rhs)
        }
    }

    fn from_decimal(value: Decimal) -> Self {
        decimal_to_f64(value)
    }

    fn from_physics(value: f64) -> Option<Self> {
        finite(value)
    }

    fn from_factor(value: f64) -> Option<Self> {
        finite(value)
    }

    fn to_f64(self) -> f64 {
        self
    }
}

fn finite(value: f64) -> Option<f64> {
    value.is_finite().then_some(value)
}

/// `value` as `f64`: the same number as `rust_decimal`'s `to_f64`, by its
/// steps (whole part plus fraction, then rounded at the decimal's scale),
/// taken in 64-bit integers when the mantissa and the power of ten fit them
/// (every price and amount below 1.8e19 units of its last digit) instead of
/// 128-bit ones; other values go to `to_f64` itself.
fn decimal_to_f64(value: Decimal) -> f64 {
    let scale = value.scale();
    let Ok(mantissa) = u64::try_from(value.mantissa().unsigned_abs()) else {
        return ToPrimitive::to_f64(&value).unwrap_or(f64::NAN);
    };
    // 10^19 is the largest power of ten below 2^64.
    if scale > 19 {
        return ToPrimitive::to_f64(&value).unwrap_or(f64::NAN);
    }
    let negative = value.is_sign_negative();
    let signed = |magnitude: f64| if negative { -magnitude } else { magnitude };
    if scale == 0 {
        // A whole number; a negative zero becomes plain zero.
        return if mantissa == 0 {
            0.0
        } else {
            signed(mantissa as f64)
        };
    }
    let precision = 10u64.pow(scale);
    let fraction = (mantissa % precision) as f64 / precision as f64;
    let whole = (mantissa / precision) as f64;
    if fraction == 0.0 {
        return signed(whole);
    }
    let round_to = 10f64.powi(scale as i32);
    signed(((whole + fraction) * round_to).round() / round_to)
}

/// `value` rounded half-to-even to [`SIGNIFICANT_DIGITS`] significant digits
/// (at most 28 decimal places), if finite and within the `Decimal` range.
fn significant_decimal(value: f64) -> Option<Decimal> {
    if value == 0.0 {
        return Some(Decimal::ZERO);
    }
    if !value.is_finite() {
        return None;
    }
    let decimals = (SIGNIFICANT_DIGITS - 1 - decimal_exponent(value.abs())).clamp(0, 28);
    let scaled = (value * power_of_ten(decimals)).round_ties_even();
    // 2^96: the largest mantissa a Decimal holds.
    if !scaled.is_finite() || scaled.abs() >= 79_228_162_514_264_337_593_543_950_336.0 {
        return None;
    }
    Decimal::try_from_i128_with_scale(scaled as i128, decimals as u32).ok()
}

/// Powers of ten from 1e-30 to 1e30 (exact in `f64` from 1e0 to 1e22).
const POWERS_OF_TEN: [f64; 61] = [
    1e-30, 1e-29, 1e-28, 1e-27, 1e-26, 1e-25, 1e-24, 1e-23, 1e-22, 1e-21, 1e-20, 1e-19, 1e-18,
    1e-17, 1e-16, 1e-15, 1e-14, 1e-13, 1e-12, 1e-11, 1e-10, 1e-9, 1e-8, 1e-7, 1e-6, 1e-5, 1e-4,
    1e-3, 1e-2, 1e-1, 1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13,
    1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22, 1e23, 1e24, 1e25, 1e26, 1e27, 1e28, 1e29,
    1e30,
];

/// `10^exponent` for `exponent` in -30..=30.
fn power_of_ten(exponent: i32) -> f64 {
    POWERS_OF_TEN[(exponent.clamp(-30, 30) + 30) as usize]
}

/// `floor(log10(x))` for finite `x > 0`, clamped to -30..=30: estimated from
/// the binary exponent (`1233 / 4096` ≈ log10 2, exact over the f64 range)
/// and corrected by one comparison; much cheaper than `log10`.
fn decimal_exponent(x: f64) -> i32 {
    let binary_exponent = ((x.to_bits() >> 52) & 0x7ff) as i32 - 1023;
    let estimate = ((binary_exponent * 1233) >> 12).clamp(-30, 29);
    if x >= power_of_ten(estimate + 1) {
        estimate + 1
    } else {
        estimate
    }
}

/// The one crossing point where a physical quantity (`f64`: GJ of fuel, MWh,
/// tonnes of CO2, kW-years) becomes a money-type number to meet a price.
///
/// For `Decimal` the value is rounded half-to-even to [`SIGNIFICANT_DIGITS`]
/// (15) significant digits, at most 28 decimal places; for `f64` it passes
/// unchanged. `field` names the quantity for the error. Errors if the value
/// is not finite or beyond the `Decimal` range (about 7.9e28).
pub fn convert_physics_to_money<M: Money>(
    value: f64,
    field: &'static str,
) -> Result<M, FinanceError> {
    M::from_physics(value).ok_or(FinanceError::OutOfRange {
        field,
        value,
        valid: "a finite quantity below 7.9e28",
    })
}

/// How presentation rounds a midpoint (a value exactly half a minor unit).
///
/// brayfin uses [`MIDPOINT_RULE`]: half-to-even ("banker's rounding"), so
/// that rounding many rows carries no upward bias (common practice in
/// accounting systems).
pub const MIDPOINT_RULE: RoundingStrategy = RoundingStrategy::MidpointNearestEven;

/// Default number of decimals of a currency's minor unit (cents).
pub const DEFAULT_MINOR_UNIT_DECIMALS: u32 = 2;

/// Round money once, for presentation, to `minor_unit_decimals` places
/// (2 for most currencies, 0 for some) using [`MIDPOINT_RULE`].
///
/// The ledger never calls this: sums are taken over unrounded values, so a
/// presented total may differ from the sum of presented rows by a minor unit.
pub fn round_for_presentation(value: Decimal, minor_unit_decimals: u32) -> Decimal {
    value.round_dp_with_strategy(minor_unit_decimals, MIDPOINT_RULE)
}

#[cfg(test)]
mod tests {
    use super::*;
    use rand::{Rng, SeedableRng};
    use rand_chacha::ChaCha8Rng;

    /// The 64-bit conversion gives `rust_decimal`'s `to_f64` bit for bit:
    /// every scale, both signs, zero, and mantissas from one digit to the
    /// full 96 bits (those above 64 bits take `to_f64` itself).
    #[test]
    fn decimal_to_f64_matches_rust_decimal_bit_for_bit() {
        let mut rng = ChaCha8Rng::seed_from_u64(7);
        for _ in 0..200_000 {
            let bits: u32 = rng.gen_range(0..=96);
            let mask = if bits == 0 {
                0
            } else {
                u128::MAX >> (128 - bits)
            };
            let mantissa = rng.gen::<u128>() & mask;
            let scale = rng.gen_range(0..=28);
            let value = Decimal::from_parts(
                mantissa as u32,
                (mantissa >> 32) as u32,
                (mantissa >> 64) as u32,
                rng.gen(),
                scale,
            );
            let expected = ToPrimitive::to_f64(&value).unwrap_or(f64::NAN);
            assert_eq!(
                decimal_to_f64(value).to_bits(),
                expected.to_bits(),
                "{value:?} (scale {scale})"
            );
        }
    }
}
