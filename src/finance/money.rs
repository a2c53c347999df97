//! The number type of the ledger, and the two places where `f64` becomes money.
//!
//! The ledger is written once, generic over [`Money`]: `rust_decimal::Decimal`
//! for the printed ledger (exact decimal sums, no binary fractions of a cent)
//! and `f64` for sampling and sweeps, where speed matters and a relative error
//! of 1e-15 is immaterial.
//!
//! Two kinds of `f64` enter money arithmetic, each at one named function:
//! - physical quantities (GJ, MWh, tonnes, kW-years) at
//!   [`convert_physics_to_money`], rounded to [`PHYSICS_DECIMALS`] places;
//! - dimensionless discount and escalation factors at [`Money::from_factor`],
//!   rounded to [`FACTOR_DECIMALS`] places.
//!
//! Money itself is never rounded inside the ledger; [`round_for_presentation`]
//! rounds once, for display.

use std::fmt::{Debug, Display};

use rust_decimal::prelude::ToPrimitive;
use rust_decimal::{Decimal, RoundingStrategy};

use super::FinanceError;

/// Decimal places kept when a physical quantity becomes a `Decimal`
/// (a nano-unit: 1 J of a GJ, 1 mWh of a MWh, 1 µg of a tonne). Far below
/// any metering precision, yet few enough digits that a quantity times a
/// price stays within the 96-bit `Decimal` mantissa and is exact.
pub const PHYSICS_DECIMALS: u32 = 9;

/// Decimal places kept when a discount or escalation factor becomes a
/// `Decimal`. The money error this introduces is at most 5e-17 of the amount
/// the factor multiplies: the precision of the `f64` the factor is computed
/// in, and far below a minor currency unit for any plant-sized amount.
pub const FACTOR_DECIMALS: u32 = 16;

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
    /// fraction), rounded half-to-even to [`FACTOR_DECIMALS`] places for
    /// `Decimal` (fewer only for factors beyond 7.9e10).
    /// `None` if not finite or out of range.
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
        scaled_decimal(value, PHYSICS_DECIMALS)
    }

    fn from_factor(value: f64) -> Option<Self> {
        // Very large factors (beyond 7.9e10, only from extreme rates) keep as
        // many decimals as still fit.
        (0..=FACTOR_DECIMALS)
            .rev()
            .find_map(|decimals| scaled_decimal(value, decimals))
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
        ToPrimitive::to_f64(&value).unwrap_or(f64::NAN)
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

/// `value` rounded half-to-even to `decimals` places, if it fits a `Decimal`.
fn scaled_decimal(value: f64, decimals: u32) -> Option<Decimal> {
    let scaled = (value * 10f64.powi(decimals as i32)).round_ties_even();
    // 2^96: the largest mantissa a Decimal holds.
    if !scaled.is_finite() || scaled.abs() >= 79_228_162_514_264_337_593_543_950_336.0 {
        return None;
    }
    Decimal::try_from_i128_with_scale(scaled as i128, decimals).ok()
}

/// The one crossing point where a physical quantity (`f64`: GJ of fuel, MWh,
/// tonnes of CO2, kW-years) becomes a money-type number to meet a price.
///
/// For `Decimal` the value is rounded half-to-even to [`PHYSICS_DECIMALS`]
/// (9) decimal places of its unit; for `f64` it passes unchanged. `field`
/// names the quantity for the error. Errors if the value is not finite or
/// beyond the `Decimal` range (about 7.9e19 units at 9 places).
pub fn convert_physics_to_money<M: Money>(
    value: f64,
    field: &'static str,
) -> Result<M, FinanceError> {
    M::from_physics(value).ok_or(FinanceError::OutOfRange {
        field,
        value,
        valid: "a finite quantity below 7.9e19",
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
