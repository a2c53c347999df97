//! Reading the `[scenario]`, `[site]` and `[economics]` sections.

use super::context::Context;
use super::error::ScenarioError;
use super::ranges::Range;
use super::reader::TableReader;
use super::tree::Node;
use super::types::{Economics, Meta, RateBasis, Site, Timing};
use super::values::{checked, money_or_zero, required_date};
use crate::units;

type Read<T> = Result<T, ScenarioError>;

/// ISO 2533 standard atmosphere, troposphere: p = 101.325 kPa ·
/// (1 − 2.25577e-5 · z/m)^5.25588 (ISO 2533:1975; from memory).
pub fn iso_2533_pressure_kpa(elevation_m: f64) -> f64 {
    101.325 * (1.0 - 2.25577e-5 * elevation_m).powf(5.25588)
}

/// Elevations where the troposphere formula holds, m (ISO 2533 tabulates
/// from −2 km; the troposphere ends at 11 km).
const ELEVATION_RANGE_M: (f64, f64) = (-500.0, 11_000.0);

/// Read `[scenario]`; sets the context currency.
pub(crate) fn read_meta(ctx: &mut Context, node: &Node) -> Read<Meta> {
    let r = TableReader::new(
        ctx,
        "scenario",
        node,
        &[
            "title",
            "prepared_for",
            "prepared_by",
            "date",
            "currency",
            "baseline",
        ],
    )?;
    let title = r.required_string(
        ctx,
        "title",
        "expected a title, e.g. title = \"Unit 3 bid evaluation\"",
    )?;
    let text_or_default = |ctx: &mut Context, key: &str| -> Read<String> {
        Ok(r.string(ctx, key)?.unwrap_or_else(|| {
            r.default(ctx, key, "not stated");
            "not stated".to_string()
        }))
    };
    let prepared_for = text_or_default(ctx, "prepared_for")?;
    let prepared_by = text_or_default(ctx, "prepared_by")?;
    let date = required_date(ctx, &r, "date")?;
    let currency = r.required_string(
        ctx,
        "currency",
        "expected an ISO 4217 code, e.g. currency = \"USD\"",
    )?;
    if currency.len() != 3 || !currency.bytes().all(|b| b.is_ascii_uppercase()) {
        return Err(r.error(
            ctx,
            "currency",
            format!("{currency:?} is not a three-letter currency code"),
            "expected an ISO 4217 code in capitals, e.g. \"USD\" or \"EUR\"",
        ));
    }
    ctx.currency = Some(currency.clone());
    let baseline =
        r.required_string(ctx, "baseline", "expected the id of the baseline candidate")?;
    Ok(Meta {
        title,
        prepared_for,
        prepared_by,
        date,
        currency,
        baseline,
    })
}

/// Read `[site]` (all keys optional; ISO reference ambient by default).
pub(crate) fn read_site(ctx: &mut Context, node: &Node) -> Read<Site> {
    let r = TableReader::new(
        ctx,
        "site",
        node,
        &[
            "name",
            "ambient_temperature",
            "ambient_pressure",
            "elevation",
        ],
    )?;
    let name = r.string(ctx, "name")?;
    // 15 degC, 101.325 kPa: ISO 2314 / ISO 3977-2 reference ambient (from memory).
    let ambient_temperature_k = r.quantity_or(
        ctx,
        "ambient_temperature",
        units::temperature_k,
        288.15,
        "288.15 K",
    )?;
    let pressure = r.quantity(ctx, "ambient_pressure", units::pressure_kpa)?;
    let elevation_m = r.quantity(ctx, "elevation", units::length_m)?;
    let ambient_pressure_kpa = match (pressure, elevation_m) {
        (Some(_), Some(_)) => return Err(r.error(
            ctx,
            "elevation",
            "is given together with ambient_pressure",
            "expected either ambient_pressure or elevation (pressure then by ISO 2533), not both",
        )),
        (Some(p), None) => p,
        (None, Some(z)) => {
            let (low, high) = ELEVATION_RANGE_M;
            if !(low..=high).contains(&z) {
                return Err(r.error(
                    ctx,
                    "elevation",
                    format!("{z} m is outside the troposphere formula's range"),
                    format!("expected an elevation from {low} m to {high} m"),
                ));
            }
            let p = iso_2533_pressure_kpa(z);
            r.default(
                ctx,
                "ambient_pressure",
                &format!("{p:.3} kPa (ISO 2533 at {z} m)"),
            );
            p
        }
        (None, None) => {
            r.default(ctx, "ambient_pressure", "101.325 kPa");
            101.325
        }
    };
    Ok(Site {
        name,
        ambient_temperature_k,
        ambient_pressure_kpa,
        elevation_m,
    })
}

/// Read `[economics]`.
pub(crate) fn read_economics(ctx: &mut Context, node: &Node) -> Read<Economics> {
    let r = TableReader::new(
        ctx,
        "economics",
        node,
        &[
            "commercial_operation",
            "service_life_years",
            "discount_rate",
            "rate_basis",
            "inflation",
            "timing",
            "carbon_price",
            "carbon_escalation",
            "capacity_value",
            "energy_value",
        ],
    )?;
    let commercial_operation = required_date(ctx, &r, "commercial_operation")?;
    let life = checked(
        ctx,
        &r,
        "service_life_years",
        units::number,
        Range::Whole(1, 60),
    )?
    .ok_or_else(|| {
        r.missing(
            ctx,
            "service_life_years",
            "expected a whole number of years from 1 to 60",
        )
    })?;
    let discount_rate = r.required_quantity(
        ctx,
        "discount_rate",
        units::fraction,
        "expected a yearly rate such as \"7 %\" or 0.07",
    )?;
    let rate_basis = match r.choice(ctx, "rate_basis", &["real", "nominal"], "real")? {
        "nominal" => RateBasis::Nominal,
        _ => RateBasis::Real,
    };
    let inflation = r.quantity_or(ctx, "inflation", units::fraction, 0.0, "0 %")?;
    let timing = match r.choice(ctx, "timing", &["end-of-year", "mid-year"], "end-of-year")? {
        "mid-year" => Timing::MidYear,
        _ => Timing::EndOfYear,
    };
    let carbon_price_per_tonne =
        money_or_zero(ctx, &r, "carbon_price", units::price_per_tonne, "/t")?;
    let carbon_escalation = r.quantity_or(ctx, "carbon_escalation", units::fraction, 0.0, "0 %")?;
    let capacity_value_per_kw_year = money_or_zero(
        ctx,
        &r,
        "capacity_value",
        units::price_per_kw_year,
        "/kW-yr",
    )?;
    let energy_value_per_mwh =
        money_or_zero(ctx, &r, "energy_value", units::price_per_mwh, "/MWh")?;
    Ok(Economics {
        commercial_operation,
        // Checked above as a whole number from 1 to 60.
        service_life_years: life as u32,
        discount_rate,
        rate_basis,
        inflation,
        timing,
        carbon_price_per_tonne,
        carbon_escalation,
        capacity_value_per_kw_year,
        energy_value_per_mwh,
    })
}
