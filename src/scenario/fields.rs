//! The numeric fields of a scenario, each with its key, unit kind, valid
//! range and accessors. One table serves loading (range checks), `--vary`
//! and `[uncertainty]` (get/set by dotted key).

use super::candidate::Candidate;
use super::ranges::Range;
use super::types::{FuelComposition, Scenario};
use crate::units::Kind;
use rust_decimal::prelude::{FromPrimitive, ToPrimitive};
use rust_decimal::Decimal;

/// Outcome of setting a field: `Err(why)` when the field does not apply.
pub(crate) type SetResult = Result<(), String>;

/// A numeric field of the shared (non-candidate) sections.
pub(crate) struct ScenarioField {
    /// Dotted key, e.g. `fuel.price`.
    pub key: &'static str,
    /// Unit kind of the value as written.
    pub kind: Kind,
    /// Valid range.
    pub range: Range,
    /// Read the value in its internal unit; `None` if it does not apply.
    pub get: fn(&Scenario) -> Option<f64>,
    /// Set the value in its internal unit.
    pub set: fn(&mut Scenario, f64) -> SetResult,
}

/// A numeric field of a candidate.
pub(crate) struct CandidateField {
    /// Key within the candidate, e.g. `regenerator.effectiveness`.
    pub key: &'static str,
    /// Unit kind of the value as written.
    pub kind: Kind,
    /// Valid range.
    pub range: Range,
    /// Read the value in its internal unit; `None` if it does not apply.
    pub get: fn(&Candidate) -> Option<f64>,
    /// Set the value in its internal unit.
    pub set: fn(&mut Candidate, f64) -> SetResult,
}

/// The one place an `f64` becomes money: a value set through a key path
/// (sweeps, sampling) is converted to the nearest Decimal.
pub(crate) fn money_from_f64(value: f64) -> Result<Decimal, String> {
    Decimal::from_f64(value).ok_or_else(|| format!("{value} cannot be held as an amount of money"))
}

/// Money as `f64` for sweeps, sampling and range checks.
pub(crate) fn money_to_f64(value: Decimal) -> f64 {
    value.to_f64().unwrap_or(f64::NAN)
}

fn heating_values(s: &mut Scenario) -> Result<(&mut f64, &mut f64, &mut f64), String> {
    match &mut s.fuel.composition {
        FuelComposition::HeatingValues {
            lhv_kj_per_kg,
            hhv_kj_per_kg,
            co2_kg_per_gj_lhv,
        } => Ok((lhv_kj_per_kg, hhv_kj_per_kg, co2_kg_per_gj_lhv)),
        _ => Err("the fuel is given by composition, not by heating values".into()),
    }
}

fn heating_value(s: &Scenario, which: usize) -> Option<f64> {
    match s.fuel.composition {
        FuelComposition::HeatingValues {
            lhv_kj_per_kg,
            hhv_kj_per_kg,
            co2_kg_per_gj_lhv,
        } => Some([lhv_kj_per_kg, hhv_kj_per_kg, co2_kg_per_gj_lhv][which]),
        _ => None,
    }
}

/// Set the first-year fuel price; a price path is scaled by the same ratio
/// so that "fuel price +20 %" moves the whole path.
fn set_fuel_price(s: &mut Scenario, value: f64) -> SetResult {
    let new = money_from_f64(value)?;
    if !s.fuel.price_path.is_empty() {
        let old = s.fuel.price_per_gj;
        if old.is_zero() {
            return Err("the price path starts at 0, so it cannot be scaled".into());
        }
        let ratio = new
            .checked_div(old)
            .ok_or_else(|| format!("{value} is too large to scale the price path by"))?;
        // Scale into a new path first: a refusal leaves the old one intact.
        let scaled = s
            .fuel
            .price_path
            .iter()
            .map(|(year, price)| Some((*year, price.checked_mul(ratio)?)))
            .collect::<Option<Vec<_>>>()
            .ok_or_else(|| format!("{value} is too large to scale the price path by"))?;
        s.fuel.price_path = scaled;
    }
    s.fuel.price_per_gj = new;
    Ok(())
}

/// Scale every dispatch block so the hours sum to `hours`.
fn set_hours_per_year(s: &mut Scenario, hours: f64) -> SetResult {
    let old = s.operation.hours_per_year;
    if !s.operation.dispatch.is_empty() && old > 0.0 {
        for block in &mut s.operation.dispatch {
            block.hours *= hours / old;
        }
    }
    s.operation.hours_per_year = hours;
    Ok(())
}

const fn field(
    key: &'static str,
    kind: Kind,
    range: Range,
    get: fn(&Scenario) -> Option<f64>,
    set: fn(&mut Scenario, f64) -> SetResult,
) -> ScenarioField {
    ScenarioField {
        key,
        kind,
        range,
        get,
        set,
    }
}

/// Every numeric field of the shared sections. Internal units: K, kPa,
/// fractions, currency per GJ (fuel, on its price basis), kJ/kg, kg/GJ,
/// currency per t CO2, currency per kW-yr, years, h.
pub(crate) const SCENARIO_FIELDS: &[ScenarioField] = &[
    field(
        "site.ambient_temperature",
        Kind::Temperature,
        Range::Positive,
        |s| Some(s.site.ambient_temperature_k),
        |s, v| {
            s.site.ambient_temperature_k = v;
            Ok(())
        },
    ),
    field(
        "site.ambient_pressure",
        Kind::Pressure,
        Range::Positive,
        |s| Some(s.site.ambient_pressure_kpa),
        |s, v| {
            s.site.ambient_pressure_kpa = v;
            Ok(())
        },
    ),
    field(
        "fuel.price",
        Kind::FuelPrice,
        Range::NonNegative,
        |s| Some(money_to_f64(s.fuel.price_per_gj)),
        set_fuel_price,
    ),
    field(
        "fuel.escalation",
        Kind::Fraction,
        Range::Rate,
        |s| Some(s.fuel.escalation),
        |s, v| {
            s.fuel.escalation = v;
            Ok(())
        },
    ),
    field(
        "fuel.lhv",
        Kind::SpecificEnergy,
        Range::Positive,
        |s| heating_value(s, 0),
        |s, v| {
            *heating_values(s)?.0 = v;
            Ok(())
        },
    ),
    field(
        "fuel.hhv",
        Kind::SpecificEnergy,
        Range::Positive,
        |s| heating_value(s, 1),
        |s, v| {
            *heating_values(s)?.1 = v;
            Ok(())
        },
    ),
    field(
        "fuel.co2_factor",
        Kind::EmissionFactor,
        Range::NonNegative,
        |s| heating_value(s, 2),
        |s, v| {
            *heating_values(s)?.2 = v;
            Ok(())
        },
    ),
    field(
        "economics.service_life_years",
        Kind::Number,
        Range::Whole(1, 60),
        |s| Some(f64::from(s.economics.service_life_years)),
        |s, v| {
            s.economics.service_life_years = v as u32;
            Ok(())
        },
    ),
    field(
        "economics.discount_rate",
        Kind::Fraction,
        Range::Rate,
        |s| Some(s.economics.discount_rate),
        |s, v| {
            s.economics.discount_rate = v;
            Ok(())
        },
    ),
    field(
        "economics.inflation",
        Kind::Fraction,
        Range::Rate,
        |s| Some(s.economics.inflation),
        |s, v| {
            s.economics.inflation = v;
            Ok(())
        },
    ),
    field(
        "economics.carbon_price",
        Kind::PricePerTonne,
        Range::NonNegative,
        |s| Some(money_to_f64(s.economics.carbon_price_per_tonne)),
        |s, v| {
            s.economics.carbon_price_per_tonne = money_from_f64(v)?;
            Ok(())
        },
    ),
    field(
        "economics.carbon_escalation",
        Kind::Fraction,
        Range::Rate,
        |s| Some(s.economics.carbon_escalation),
        |s, v| {
            s.economics.carbon_escalation = v;
            Ok(())
        },
    ),
    field(
        "economics.capacity_value",
        Kind::PricePerCapacity,
        Range::NonNegative,
        |s| Some(money_to_f64(s.economics.capacity_value_per_kw_year)),
        |s, v| {
            s.economics.capacity_value_per_kw_year = money_from_f64(v)?;
            Ok(())
        },
    ),
    field(
        "economics.energy_value",
        Kind::PricePerEnergy,
        Range::NonNegative,
        |s| Some(money_to_f64(s.economics.energy_value_per_mwh)),
        |s, v| {
            s.economics.energy_value_per_mwh = money_from_f64(v)?;
            Ok(())
        },
    ),
    field(
        "operation.hours_per_year",
        Kind::Duration,
        Range::HoursPerYear,
        |s| Some(s.operation.hours_per_year),
        set_hours_per_year,
    ),
];
