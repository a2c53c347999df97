//! The `[site]` section: ambient conditions (ISO reference ambient by
//! default), or the elevation instead of the pressure.

use super::context::Context;
use super::declare::{keys_in, Key, Presence, Shape};
use super::error::ScenarioError;
use super::ranges::{Range, AMBIENT_P_KPA, AMBIENT_P_REASON, AMBIENT_T_K, AMBIENT_T_REASON};
use super::reader::TableReader;
use super::tree::Node;
use super::types::{Scenario, Site};
use super::weather::read_weather;
use crate::units::{self, Kind};

type Read<T> = Result<T, ScenarioError>;
/// Declarations of this section are keys into the whole [`Scenario`].
type K = Key<Scenario>;

/// ISO 2533 standard atmosphere, troposphere: p = 101.325 kPa ·
/// (1 − 2.25577e-5 · z/m)^5.25588 (ISO 2533:1975; from memory).
pub fn iso_2533_pressure_kpa(elevation_m: f64) -> f64 {
    101.325 * (1.0 - 2.25577e-5 * elevation_m).powf(5.25588)
}

/// Elevations where the troposphere formula holds, m (ISO 2533 tabulates
/// from −2 km; the troposphere ends at 11 km).
pub const ELEVATION_RANGE_M: (f64, f64) = (-500.0, 11_000.0);

/// The keys of `[site]`.
pub(crate) const KEYS: &[Key<Scenario>] = &[
    K::plain("site.name", Shape::Text, Presence::Optional { text: "none" }, "site name"),
    // 15 degC: ISO 2314 / ISO 3977-2 reference ambient (from memory).
    K::number(
        "site.ambient_temperature",
        Kind::Temperature,
        Range::Positive,
        Presence::Default { text: "288.15 K", value: 288.15 },
        "compressor inlet air temperature before the inlet loss",
        |s| Some(s.site.ambient_temperature_k),
        |s, v| {
            s.site.ambient_temperature_k = v;
            Ok(())
        },
    )
    .within(AMBIENT_T_K.0, AMBIENT_T_K.1, "K", AMBIENT_T_REASON),
    // 101.325 kPa: ISO 2314 / ISO 3977-2 reference ambient (from memory).
    K::number(
        "site.ambient_pressure",
        Kind::Pressure,
        Range::Positive,
        Presence::Default { text: "101.325 kPa", value: 101.325 },
        "ambient pressure",
        |s| Some(s.site.ambient_pressure_kpa),
        |s, v| {
            s.site.ambient_pressure_kpa = v;
            Ok(())
        },
    )
    .within(AMBIENT_P_KPA.0, AMBIENT_P_KPA.1, "kPa", AMBIENT_P_REASON),
    // 60 %: the ISO 2314 / ISO 3977-2 reference humidity (from memory), so
    // a site left at its defaults is the rating condition of an ISO bid.
    K::number(
        "site.relative_humidity",
        Kind::Fraction,
        Range::Fraction,
        Presence::Default { text: "60 %", value: 0.6 },
        "ambient relative humidity (water vapour in the air and products); at most saturation",
        |s| Some(s.site.relative_humidity),
        |s, v| {
            s.site.relative_humidity = v;
            Ok(())
        },
    ),
    K::plain("site.weather", Shape::Array, Presence::Optional { text: "none: every hour at `ambient_temperature` and `relative_humidity`" }, "the year's weather: a CSV file relative to the scenario (hourly rows; columns `timestamp`, one of `dry_bulb_degC` / `dry_bulb_degF` / `dry_bulb_K`, `rh_pct`; each row counts 8760 / rows hours), or bins `[{ temperature = \"5 degC\", relative_humidity = \"70 %\", hours = 744 }, …]` (humidity defaults to `relative_humidity`; hours sum to at most 8784 and weigh the bins). Dispatch blocks without their own temperature, or `hours_per_year`, spread over the weather's hours in proportion; `ambient_temperature` stays the site's reference point (site figures, default capacity)"),
    K::plain("site.elevation", Shape::Quantity(Kind::Length), Presence::Optional { text: "none" }, "instead of `ambient_pressure` (not both): pressure by ISO 2533, p = 101.325 kPa · (1 − 2.25577e-5 · z/m)^5.25588, for −500 m to 11 000 m"),
];

/// Read `[site]` (all keys optional; ISO reference ambient by default).
pub(crate) fn read_site(ctx: &mut Context, node: &Node) -> Read<Site> {
    let r = TableReader::new(ctx, "site", node, &keys_in(KEYS, "site"))?;
    let name = r.string(ctx, "name")?;
    let ambient_temperature_k = r.declared_at(ctx, KEYS, "site.ambient_temperature")?;
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
    let relative_humidity = r.declared_at(ctx, KEYS, "site.relative_humidity")?;
    let weather = read_weather(ctx, &r, relative_humidity)?.map(std::sync::Arc::new);
    Ok(Site {
        name,
        ambient_temperature_k,
        ambient_pressure_kpa,
        elevation_m,
        relative_humidity,
        weather,
    })
}
