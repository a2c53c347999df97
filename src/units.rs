//! Quantities with units in, SI (or the project's internal unit) out.
//!
//! Inputs carry their unit as text: `"288.15 K"`, `"15 degC"`, `"101.325 kPa"`,
//! `"42 MW"`, `"86 %"`, `"9500 Btu/kWh"`. A bare number means the internal
//! unit named by each function (K, kPa, kW, kJ/kWh, kJ/kg, m). A unit of the
//! wrong kind is an error that names both kinds and lists the valid units.
//!
//! Physics comes back as `f64`. Money comes back as [`rust_decimal::Decimal`]
//! parsed straight from the text, never through `f64` (see [`money`]).

mod money;
mod parse;

pub use money::{
    fuel_energy_unit_gj, money, price_per_gj, price_per_kw_year, price_per_mwh, price_per_tonne,
    MoneyValue,
};

pub(crate) use parse::{split_quantity, Split};
use std::fmt;

/// Kilojoules per International Table British thermal unit. The exact
/// definition is 1 Btu_IT = 1055.05585262 J (NIST SP 811, 2008, Appendix B.8);
/// 1.055056 is the value rounded to seven significant figures that the trade
/// quotes (1 MMBtu = 1.055056 GJ).
pub const KJ_PER_BTU: f64 = 1.055056;

/// kJ/kg per Btu/lb: exactly 2.326 by the definition of the International
/// Table Btu (NIST SP 811, 2008, Appendix B.8, "Btu_IT per pound").
pub const KJ_PER_KG_PER_BTU_PER_LB: f64 = 2.326;

/// Kilopascals per pound-force per square inch: 6.894 757 kPa
/// (NIST SP 811, 2008, Appendix B.8; 1 psi = 6894.757 Pa).
pub const KPA_PER_PSI: f64 = 6.894_757_293_168_361;

/// Kilograms per avoirdupois pound, exactly 0.45359237 (NIST SP 811,
/// Appendix B.8).
pub const KG_PER_LB: f64 = 0.453_592_37;

/// Metres per international foot, exactly 0.3048 (NIST SP 811, Appendix B.8).
pub const M_PER_FT: f64 = 0.3048;

/// The kind of quantity a text value carries; used to say what was expected
/// and what was found.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Kind {
    /// Absolute temperature (internal unit K).
    Temperature,
    /// Absolute pressure (internal unit kPa).
    Pressure,
    /// Power (internal unit kW).
    Power,
    /// A fraction of one (`0.86` or `86 %`).
    Fraction,
    /// A dimensionless number.
    Number,
    /// Heat rate (internal unit kJ/kWh).
    HeatRate,
    /// Specific energy, e.g. a heating value (internal unit kJ/kg).
    SpecificEnergy,
    /// Length, e.g. site elevation (internal unit m).
    Length,
    /// An amount of money (`12500000 USD`).
    Money,
    /// Money per unit of fuel energy (internal: currency per GJ).
    FuelPrice,
    /// Money per tonne, e.g. a carbon price (internal: currency per t).
    PricePerTonne,
    /// Money per unit of electrical energy (internal: currency per MWh).
    PricePerEnergy,
    /// Money per kW of capacity per year (internal: currency per kW-yr).
    PricePerCapacity,
    /// A duration in operating hours (internal unit h).
    Duration,
    /// CO2 mass per unit of fuel energy (internal unit kg/GJ).
    EmissionFactor,
    /// Mass flow, e.g. a turbine's exhaust flow (internal unit kg/s).
    MassFlow,
    /// Fuel energy, e.g. the fuel burned per start (internal unit GJ).
    FuelEnergy,
}

impl Kind {
    /// The kind's name with its article, as used in messages ("a temperature").
    pub fn name(self) -> &'static str {
        match self {
            Kind::Temperature => "a temperature",
            Kind::Pressure => "a pressure",
            Kind::Power => "a power",
            Kind::Fraction => "a fraction",
            Kind::Number => "a plain number",
            Kind::HeatRate => "a heat rate",
            Kind::SpecificEnergy => "a specific energy",
            Kind::Length => "a length",
            Kind::Money => "an amount of money",
            Kind::FuelPrice => "a fuel price",
            Kind::PricePerTonne => "a price per tonne",
            Kind::PricePerEnergy => "a price per unit of electrical energy",
            Kind::PricePerCapacity => "a price per kW-year",
            Kind::Duration => "a duration",
            Kind::EmissionFactor => "an emission factor",
            Kind::MassFlow => "a mass flow",
            Kind::FuelEnergy => "an amount of fuel energy",
        }
    }

    /// The units accepted for this kind, in the form they are written.
    pub fn valid_units(self) -> &'static str {
        match self {
            Kind::Temperature => "K, degC, degF, degR; bare number = K",
            Kind::Pressure => "kPa, Pa, MPa, bar, psia; bare number = kPa",
            Kind::Power => "W, kW, MW; bare number = kW",
            Kind::Fraction => "a number such as 0.86, or a percentage such as 86 %",
            Kind::Number => "a number without a unit",
            Kind::HeatRate => "kJ/kWh, Btu/kWh; bare number = kJ/kWh",
            Kind::SpecificEnergy => "kJ/kg, MJ/kg, Btu/lb; bare number = kJ/kg",
            Kind::Length => "m, ft; bare number = m",
            Kind::Money => "an amount with a currency code, e.g. 12500000 USD",
            Kind::FuelPrice => "CUR/GJ, CUR/MJ, CUR/MMBtu, CUR/therm, CUR/MWh, e.g. 4.20 USD/MMBtu",
            Kind::PricePerTonne => "CUR/t, CUR/tCO2, CUR/kg, e.g. 45 USD/t",
            Kind::PricePerEnergy => "CUR/MWh, CUR/kWh, e.g. 4.5 USD/MWh",
            Kind::PricePerCapacity => "CUR/kW-yr, CUR/MW-yr, e.g. 12 USD/kW-yr",
            Kind::Duration => "h; bare number = h",
            Kind::EmissionFactor => "kg/GJ, kg/TJ, kg/MMBtu, lb/MMBtu; bare number = kg/GJ",
            Kind::MassFlow => "kg/s, t/h, lb/s; bare number = kg/s",
            Kind::FuelEnergy => "GJ, MJ, MMBtu, therm, MWh; bare number = GJ",
        }
    }
}

impl fmt::Display for Kind {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.name())
    }
}

/// What was wrong with a quantity's text.
#[derive(Debug, Clone, PartialEq)]
pub enum Problem {
    /// The text does not start with a number.
    NotANumber,
    /// The unit belongs to another kind of quantity.
    WrongKind(Kind),
    /// The unit is not one brayfin knows.
    UnknownUnit(String),
    /// The value is outside what the quantity can physically be.
    OutOfRange(String),
}

/// A quantity's text could not be read as the expected kind.
///
/// Display reads like `expected a temperature (K, degC, degF, degR; bare
/// number = K) but "101 kPa" is a pressure`.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[error("expected {} ({}) but {}", .expected.name(), .expected.valid_units(), self.what_is_wrong())]
pub struct UnitError {
    /// The kind the caller asked for.
    pub expected: Kind,
    /// The text as given.
    pub input: String,
    /// What was wrong with it.
    pub problem: Problem,
}

impl UnitError {
    fn new(expected: Kind, input: &str, problem: Problem) -> Self {
        UnitError {
            expected,
            input: input.to_string(),
            problem,
        }
    }

    /// The first half of a message: what was wrong with the input, e.g.
    /// `"101 kPa" is a pressure`.
    pub fn what_is_wrong(&self) -> String {
        let input = &self.input;
        match &self.problem {
            Problem::NotANumber => format!("{input:?} does not start with a number"),
            Problem::WrongKind(found) => format!("{input:?} is {}", found.name()),
            Problem::UnknownUnit(unit) => format!("{input:?} has the unknown unit {unit:?}"),
            Problem::OutOfRange(why) => format!("{input:?} {why}"),
        }
    }

    /// The second half of a message: what would be valid, e.g.
    /// `expected a temperature (K, degC, degF, degR; bare number = K)`.
    pub fn what_would_be_valid(&self) -> String {
        format!(
            "expected {} ({})",
            self.expected.name(),
            self.expected.valid_units()
        )
    }
}

/// One known unit: its spelling, kind, and the linear map `si = value *
/// scale + offset` to the kind's internal unit.
struct Unit {
    symbol: &'static str,
    kind: Kind,
    scale: f64,
    offset: f64,
}

const fn unit(symbol: &'static str, kind: Kind, scale: f64, offset: f64) -> Unit {
    Unit {
        symbol,
        kind,
        scale,
        offset,
    }
}

/// Every physical unit brayfin reads. Temperature offsets: 0 degC =
/// 273.15 K, T[degR] = T[degF] + 459.67, 1 degR = 5/9 K (NIST SP 811, 4.2.1.1
/// and Appendix B.8).
const UNITS: &[Unit] = &[
    unit("K", Kind::Temperature, 1.0, 0.0),
    unit("degC", Kind::Temperature, 1.0, 273.15),
    unit("°C", Kind::Temperature, 1.0, 273.15),
    unit("degF", Kind::Temperature, 5.0 / 9.0, 459.67 * 5.0 / 9.0),
    unit("°F", Kind::Temperature, 5.0 / 9.0, 459.67 * 5.0 / 9.0),
    unit("degR", Kind::Temperature, 5.0 / 9.0, 0.0),
    unit("kPa", Kind::Pressure, 1.0, 0.0),
    unit("Pa", Kind::Pressure, 1.0e-3, 0.0),
    unit("MPa", Kind::Pressure, 1.0e3, 0.0),
    unit("bar", Kind::Pressure, 100.0, 0.0),
    unit("psia", Kind::Pressure, KPA_PER_PSI, 0.0),
    unit("W", Kind::Power, 1.0e-3, 0.0),
    unit("kW", Kind::Power, 1.0, 0.0),
    unit("MW", Kind::Power, 1.0e3, 0.0),
    unit("%", Kind::Fraction, 0.01, 0.0),
    unit("kJ/kWh", Kind::HeatRate, 1.0, 0.0),
    unit("Btu/kWh", Kind::HeatRate, KJ_PER_BTU, 0.0),
    unit("kJ/kg", Kind::SpecificEnergy, 1.0, 0.0),
    unit("MJ/kg", Kind::SpecificEnergy, 1.0e3, 0.0),
    unit(
        "Btu/lb",
        Kind::SpecificEnergy,
        KJ_PER_KG_PER_BTU_PER_LB,
        0.0,
    ),
    unit("h", Kind::Duration, 1.0, 0.0),
    unit("kg/GJ", Kind::EmissionFactor, 1.0, 0.0),
    unit("kg/TJ", Kind::EmissionFactor, 1.0e-3, 0.0),
    unit("kg/MMBtu", Kind::EmissionFactor, 1.0 / KJ_PER_BTU, 0.0),
    unit(
        "lb/MMBtu",
        Kind::EmissionFactor,
        KG_PER_LB / KJ_PER_BTU,
        0.0,
    ),
    unit("m", Kind::Length, 1.0, 0.0),
    unit("ft", Kind::Length, M_PER_FT, 0.0),
    unit("kg/s", Kind::MassFlow, 1.0, 0.0),
    // 1 t/h = 1000 kg / 3600 s (SI definitions).
    unit("t/h", Kind::MassFlow, 1000.0 / 3600.0, 0.0),
    unit("lb/s", Kind::MassFlow, KG_PER_LB, 0.0),
    unit("GJ", Kind::FuelEnergy, 1.0, 0.0),
    unit("MJ", Kind::FuelEnergy, 1.0e-3, 0.0),
    // 1 MMBtu = 10^6 Btu_IT = 1.055056 GJ (KJ_PER_BTU).
    unit("MMBtu", Kind::FuelEnergy, KJ_PER_BTU, 0.0),
    // 1 therm = 10^5 Btu_IT (NIST SP 811, Appendix B.8).
    unit("therm", Kind::FuelEnergy, 0.1 * KJ_PER_BTU, 0.0),
    // 1 MWh = 3600 MJ (SI definitions).
    unit("MWh", Kind::FuelEnergy, 3.6, 0.0),
];

/// The kind of quantity `text` states by its unit, or `None` when it has no
/// unit (a bare number) or a unit brayfin does not know. Money units
/// (`USD`, `USD/GJ`, …) are recognised too.
pub fn kind_of(text: &str) -> Option<Kind> {
    match split_quantity(text) {
        Split::Quantity { unit, .. } if !unit.is_empty() => unit_kind(unit),
        _ => None,
    }
}

/// The linear map of a physical unit to its kind's internal unit:
/// `(kind, scale, offset)` with `internal = value * scale + offset`, the
/// same arithmetic as reading `"value symbol"`. `None` for money units and
/// unknown symbols.
pub fn physical_unit_map(symbol: &str) -> Option<(Kind, f64, f64)> {
    UNITS
        .iter()
        .find(|u| u.symbol == symbol)
        .map(|u| (u.kind, u.scale, u.offset))
}

fn unit_kind(symbol: &str) -> Option<Kind> {
    UNITS
        .iter()
        .find(|u| u.symbol == symbol)
        .map(|u| u.kind)
        .or_else(|| money::money_unit_kind(symbol))
}

/// Read `text` as `expected`, converting to the internal unit. A bare number
/// is taken in the internal unit.
fn convert(text: &str, expected: Kind) -> Result<f64, UnitError> {
    let (number, symbol) = match split_quantity(text) {
        Split::Quantity { number, unit } => (number, unit),
        Split::NotANumber => return Err(UnitError::new(expected, text, Problem::NotANumber)),
    };
    let value: f64 = number
        .parse()
        .map_err(|_| UnitError::new(expected, text, Problem::NotANumber))?;
    if !value.is_finite() {
        return Err(UnitError::new(
            expected,
            text,
            Problem::OutOfRange("is too large to be a finite number".into()),
        ));
    }
    if symbol.is_empty() {
        return Ok(value);
    }
    match UNITS.iter().find(|u| u.symbol == symbol) {
        Some(u) if u.kind == expected => Ok(value * u.scale + u.offset),
        Some(u) => Err(UnitError::new(expected, text, Problem::WrongKind(u.kind))),
        None => Err(UnitError::new(
            expected,
            text,
            match money::money_unit_kind(symbol) {
                Some(kind) => Problem::WrongKind(kind),
                None => Problem::UnknownUnit(symbol.to_string()),
            },
        )),
    }
}

/// Absolute temperature in K from `"288.15 K"`, `"15 degC"`, `"59 degF"`,
/// `"518.67 degR"` (bare number: K). Below 0 K is an error.
pub fn temperature_k(text: &str) -> Result<f64, UnitError> {
    let t = convert(text, Kind::Temperature)?;
    if t < 0.0 {
        return Err(UnitError::new(
            Kind::Temperature,
            text,
            Problem::OutOfRange(format!("is {t:.2} K, below absolute zero")),
        ));
    }
    Ok(t)
}

/// Absolute pressure in kPa from kPa, Pa, MPa, bar or psia (bare number: kPa).
/// A negative absolute pressure is an error.
pub fn pressure_kpa(text: &str) -> Result<f64, UnitError> {
    let p = convert(text, Kind::Pressure)?;
    if p < 0.0 {
        return Err(UnitError::new(
            Kind::Pressure,
            text,
            Problem::OutOfRange("is negative; an absolute pressure is at least 0".into()),
        ));
    }
    Ok(p)
}

/// Power in kW from W, kW or MW (bare number: kW).
pub fn power_kw(text: &str) -> Result<f64, UnitError> {
    convert(text, Kind::Power)
}

/// A fraction from `"0.86"` or `"86 %"` (returns 0.86). Range is the
/// caller's to check.
pub fn fraction(text: &str) -> Result<f64, UnitError> {
    convert(text, Kind::Fraction)
}

/// A dimensionless number; any unit is an error.
pub fn number(text: &str) -> Result<f64, UnitError> {
    convert(text, Kind::Number)
}

/// Heat rate in kJ/kWh from kJ/kWh or Btu/kWh (bare number: kJ/kWh).
pub fn heat_rate_kj_per_kwh(text: &str) -> Result<f64, UnitError> {
    convert(text, Kind::HeatRate)
}

/// Specific energy in kJ/kg from kJ/kg, MJ/kg or Btu/lb (bare number: kJ/kg).
pub fn specific_energy_kj_per_kg(text: &str) -> Result<f64, UnitError> {
    convert(text, Kind::SpecificEnergy)
}

/// A duration in hours from h (bare number: h), e.g. an overhaul interval.
pub fn duration_h(text: &str) -> Result<f64, UnitError> {
    convert(text, Kind::Duration)
}

/// CO2 emission factor in kg per GJ of fuel energy from kg/GJ, kg/TJ,
/// kg/MMBtu or lb/MMBtu (bare number: kg/GJ).
pub fn emission_factor_kg_per_gj(text: &str) -> Result<f64, UnitError> {
    convert(text, Kind::EmissionFactor)
}

/// Mass flow in kg/s from kg/s, t/h or lb/s (bare number: kg/s), e.g. a
/// turbine's exhaust flow.
pub fn mass_flow_kg_per_s(text: &str) -> Result<f64, UnitError> {
    convert(text, Kind::MassFlow)
}

/// Fuel energy in GJ from GJ, MJ, MMBtu, therm or MWh (bare number: GJ),
/// e.g. the fuel a start burns. A negative amount is an error.
pub fn fuel_energy_gj(text: &str) -> Result<f64, UnitError> {
    let energy = convert(text, Kind::FuelEnergy)?;
    if energy < 0.0 {
        return Err(UnitError::new(
            Kind::FuelEnergy,
            text,
            Problem::OutOfRange("is negative; an amount of fuel energy is at least 0".into()),
        ));
    }
    Ok(energy)
}

/// Length in m from m or ft (bare number: m), e.g. a site elevation.
pub fn length_m(text: &str) -> Result<f64, UnitError> {
    convert(text, Kind::Length)
}

#[cfg(test)]
mod tests;
