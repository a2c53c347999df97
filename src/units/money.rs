//! Money and prices with a currency code, read straight into `Decimal`.
//!
//! The number text goes directly into [`Decimal`] (never through `f64`), so
//! `"4.20 USD/MMBtu"` is exactly 4.20 before conversion. Per-unit conversions
//! are Decimal divisions by exact decimal sizes (1 MMBtu = 1.055056 GJ, see
//! [`super::KJ_PER_BTU`]).

use super::parse::{split_quantity, Split};
use super::{Kind, Problem, UnitError};
use rust_decimal::Decimal;
use std::str::FromStr;

/// An amount of money (or money per unit) with the currency code it was
/// written with, if any. The amount is already in the internal per-unit
/// basis of the function that returned it.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct MoneyValue {
    /// The amount, exact, in the returning function's internal unit.
    pub amount: Decimal,
    /// ISO 4217-style code as written (`"USD"`), or `None` for a bare number
    /// (the scenario's currency is then meant).
    pub currency: Option<String>,
}

/// A denominator unit and its size in the internal denominator unit, as an
/// exact decimal `mantissa × 10^-scale`.
struct Per {
    symbol: &'static str,
    mantissa: i64,
    scale: u32,
}

const fn per(symbol: &'static str, mantissa: i64, scale: u32) -> Per {
    Per {
        symbol,
        mantissa,
        scale,
    }
}

/// Fuel energy per unit, in GJ. 1 MMBtu = 10^6 Btu_IT = 1.055056 GJ and
/// 1 therm = 10^5 Btu_IT = 0.1055056 GJ (NIST SP 811, Appendix B.8, rounded
/// as the trade quotes it); 1 MWh = 3.6 GJ exactly.
const FUEL_ENERGY_GJ: &[Per] = &[
    per("GJ", 1, 0),
    per("MJ", 1, 3),
    per("MMBtu", 1_055_056, 6),
    per("therm", 1_055_056, 7),
    per("MWh", 36, 1),
    per("kWh", 36, 4),
];

/// The size in GJ of a fuel-energy unit a price may be written per
/// (`"MMBtu"` → 1.055056, `"MWh"` → 3.6), exact; `None` for any other
/// symbol. The same table the reader divides by.
pub fn fuel_energy_unit_gj(symbol: &str) -> Option<Decimal> {
    FUEL_ENERGY_GJ
        .iter()
        .find(|p| p.symbol == symbol)
        .map(|p| Decimal::new(p.mantissa, p.scale))
}

/// Mass per unit, in tonnes (1 t = 1000 kg).
const MASS_T: &[Per] = &[per("t", 1, 0), per("tCO2", 1, 0), per("kg", 1, 3)];

/// Electrical energy per unit, in MWh.
const ELECTRICAL_ENERGY_MWH: &[Per] = &[per("MWh", 1, 0), per("kWh", 1, 3)];

/// Capacity-years per unit, in kW-yr.
const CAPACITY_KW_YEAR: &[Per] = &[
    per("kW-yr", 1, 0),
    per("kW-year", 1, 0),
    per("MW-yr", 1000, 0),
    per("MW-year", 1000, 0),
];

/// The denominators a kind of price accepts, in lookup order.
fn denominators(kind: Kind) -> &'static [Per] {
    match kind {
        Kind::FuelPrice => FUEL_ENERGY_GJ,
        Kind::PricePerTonne => MASS_T,
        Kind::PricePerEnergy => ELECTRICAL_ENERGY_MWH,
        Kind::PricePerCapacity => CAPACITY_KW_YEAR,
        _ => &[],
    }
}

/// Price kinds in the order used to name a unit's kind in messages.
const PRICE_KINDS: [Kind; 4] = [
    Kind::FuelPrice,
    Kind::PricePerEnergy,
    Kind::PricePerTonne,
    Kind::PricePerCapacity,
];

/// A currency code: three upper-case ASCII letters (ISO 4217 form).
fn is_currency(code: &str) -> bool {
    code.len() == 3 && code.bytes().all(|b| b.is_ascii_uppercase())
}

/// The money kind a unit such as `USD` or `EUR/GJ` states, if any.
pub(crate) fn money_unit_kind(symbol: &str) -> Option<Kind> {
    let (currency, denominator) = match symbol.split_once('/') {
        Some((c, d)) => (c.trim(), Some(d.trim())),
        None => (symbol, None),
    };
    if !is_currency(currency) {
        return None;
    }
    match denominator {
        None => Some(Kind::Money),
        Some(d) => PRICE_KINDS
            .into_iter()
            .find(|kind| denominators(*kind).iter().any(|p| p.symbol == d)),
    }
}

/// Parse `text` as `expected` (money or a price kind): the number goes
/// straight into Decimal and is divided by the denominator's exact size.
fn read(text: &str, expected: Kind) -> Result<MoneyValue, UnitError> {
    let error = |problem| UnitError {
        expected,
        input: text.to_string(),
        problem,
    };
    let (number, symbol) = match split_quantity(text) {
        Split::Quantity { number, unit } => (number, unit),
        Split::NotANumber => return Err(error(Problem::NotANumber)),
    };
    let amount = if number.contains(['e', 'E']) {
        Decimal::from_scientific(&number)
    } else {
        Decimal::from_str(&number)
    }
    .map_err(|_| {
        error(Problem::OutOfRange(
            "cannot be held exactly as a decimal amount (too large or too many digits)".into(),
        ))
    })?;
    if symbol.is_empty() {
        return Ok(MoneyValue {
            amount,
            currency: None,
        });
    }
    let (currency, denominator) = match symbol.split_once('/') {
        Some((c, d)) => (c.trim(), Some(d.trim())),
        None => (symbol, None),
    };
    let wrong_kind = || match super::unit_kind(symbol) {
        Some(kind) => error(Problem::WrongKind(kind)),
        None => error(Problem::UnknownUnit(symbol.to_string())),
    };
    if !is_currency(currency) {
        return Err(wrong_kind());
    }
    let amount = match (expected, denominator) {
        (Kind::Money, None) => amount,
        (Kind::Money, Some(_)) | (_, None) => return Err(wrong_kind()),
        (_, Some(d)) => {
            let size = denominators(expected)
                .iter()
                .find(|p| p.symbol == d)
                .ok_or_else(wrong_kind)?;
            amount
                .checked_div(Decimal::new(size.mantissa, size.scale))
                .ok_or_else(|| error(Problem::OutOfRange("is too large to convert".into())))?
        }
    };
    Ok(MoneyValue {
        amount,
        currency: Some(currency.to_string()),
    })
}

/// An amount of money: `"48500000 USD"` (digit separators `_` allowed) or a
/// bare number in the scenario's currency.
pub fn money(text: &str) -> Result<MoneyValue, UnitError> {
    read(text, Kind::Money)
}

/// A fuel price per GJ: `"4.20 USD/MMBtu"`, `"3.98 USD/GJ"`, `"0.004 USD/MJ"`,
/// `"0.42 USD/therm"`, `"28 EUR/MWh"` (bare number: per GJ). The heating-value
/// basis (HHV or LHV) is stated separately and is not converted here.
pub fn price_per_gj(text: &str) -> Result<MoneyValue, UnitError> {
    read(text, Kind::FuelPrice)
}

/// A price per tonne, e.g. a carbon price: `"45 USD/t"`, `"45 USD/tCO2"`,
/// `"0.045 USD/kg"` (bare number: per t).
pub fn price_per_tonne(text: &str) -> Result<MoneyValue, UnitError> {
    read(text, Kind::PricePerTonne)
}

/// A price per MWh of electricity: `"4.5 USD/MWh"`, `"0.0045 USD/kWh"`
/// (bare number: per MWh).
pub fn price_per_mwh(text: &str) -> Result<MoneyValue, UnitError> {
    read(text, Kind::PricePerEnergy)
}

/// A price per kW of capacity per year: `"12 USD/kW-yr"`, `"12000 USD/MW-yr"`
/// (bare number: per kW-yr).
pub fn price_per_kw_year(text: &str) -> Result<MoneyValue, UnitError> {
    read(text, Kind::PricePerCapacity)
}
