//! The `[fuel]` section: composition or heating values, price and its
//! basis (with the unit the file wrote it in), escalation or a year-by-year
//! price path.

use super::context::Context;
use super::declare::{keys_in, money_from_f64, money_to_f64, Key, Presence, SetResult, Shape};
use super::error::ScenarioError;
use super::ranges::{Range, RATE_HIGH, RATE_LOW, RATE_REASON};
use super::reader::{quantity_of_node, record_node, type_error, TableReader};
use super::suggest::did_you_mean;
use super::tree::{Node, NodeValue};
use super::types::{FuelComposition, FuelSpec, PriceBasis, Scenario, WrittenQuantity};
use super::values::{in_currency, money};
use crate::units::{self, Kind};
use rust_decimal::Decimal;

type Read<T> = Result<T, ScenarioError>;
/// Declarations of this section are keys into the whole [`Scenario`].
type K = Key<Scenario>;

/// Mole fractions must sum to 1 within this (the fuel model's own check).
const COMPOSITION_SUM_TOLERANCE: f64 = 1e-6;

/// Fuel prices per GJ: an upper bound that catches unit slips in any
/// currency (spot gas has not passed about 100 USD/GJ; from memory).
const PRICE_HIGH: f64 = 1e6;

/// The keys of `[fuel]`.
pub(crate) const KEYS: &[Key<Scenario>] = &[
    K::plain("fuel.name", Shape::Text, Presence::Optional { text: "the named fuel, else `\"fuel\"`" }, "name shown in reports"),
    K::plain("fuel.composition", Shape::Table, Presence::RequiredUnless { text: "`lhv`, `hhv` and `co2_factor`" }, "a named fuel (`\"methane\"`, `\"ethane\"`, `\"propane\"`, `\"butane\"`, `\"hydrogen\"`, `\"carbon-monoxide\"`) or a table of mole fractions of CH4, C2H6, C3H8, C4H10, H2, CO, N2, CO2 summing to 1"),
    K::number(
        "fuel.lhv",
        Kind::SpecificEnergy,
        Range::Positive,
        Presence::RequiredUnless { text: "`composition`" },
        "lower heating value (fuel by heating values, not with `composition`)",
        |s| heating_value(s, 0),
        |s, v| {
            *heating_values(s)?.0 = v;
            Ok(())
        },
    )
    .within(5_000.0, 150_000.0, "kJ/kg", "from low-calorific gases (about 5 MJ/kg) to hydrogen (HHV 141.8 MJ/kg, NIST WebBook)"),
    K::number(
        "fuel.hhv",
        Kind::SpecificEnergy,
        Range::Positive,
        Presence::RequiredUnless { text: "`composition`" },
        "higher heating value, at least the LHV",
        |s| heating_value(s, 1),
        |s, v| {
            *heating_values(s)?.1 = v;
            Ok(())
        },
    )
    .within(5_000.0, 150_000.0, "kJ/kg", "from low-calorific gases (about 5 MJ/kg) to hydrogen (HHV 141.8 MJ/kg, NIST WebBook)"),
    K::number(
        "fuel.co2_factor",
        Kind::EmissionFactor,
        Range::NonNegative,
        Presence::RequiredUnless { text: "`composition`" },
        "CO2 per GJ of fuel energy, LHV basis",
        |s| heating_value(s, 2),
        |s, v| {
            *heating_values(s)?.2 = v;
            Ok(())
        },
    )
    .within(0.0, 120.0, "kg/GJ", "from hydrogen (0) past coal (about 95-101 kg/GJ, IPCC 2006 Vol. 2 Table 2.2) with margin"),
    K::number(
        "fuel.price",
        Kind::FuelPrice,
        Range::NonNegative,
        Presence::RequiredUnless { text: "`price_path`" },
        "price in the first year of operation, per unit of fuel energy on `price_basis` (the unit as written is kept for reports)",
        |s| Some(money_to_f64(s.fuel.price_per_gj)),
        set_fuel_price,
    )
    .within(0.0, PRICE_HIGH, "per GJ", "a fuel price in any currency; larger is a unit slip"),
    K::plain("fuel.price_basis", Shape::Choice(&["hhv", "lhv"]), Presence::Required { example: "\"hhv\"" }, "the heating value the price is per. Never assumed: gas is usually sold on HHV while heat rates are LHV, and brayfin converts with the fuel's HHV/LHV ratio (`check` says so)"),
    K::number(
        "fuel.escalation",
        Kind::Fraction,
        Range::Rate,
        Presence::Default { text: "0 %", value: 0.0 },
        "yearly price escalation (real or nominal as `economics.rate_basis`)",
        |s| Some(s.fuel.escalation),
        |s, v| {
            s.fuel.escalation = v;
            Ok(())
        },
    )
    .within(RATE_LOW, RATE_HIGH, "", RATE_REASON),
    K::plain("fuel.price_path", Shape::Table, Presence::Optional { text: "none" }, "`{ 2027 = \"4.20 USD/MMBtu\", 2028 = \"4.35 USD/MMBtu\" }`: prices by calendar year, contiguous, covering the commercial-operation year; later years escalate from the last at `escalation`. Replaces `price` (not both); `price` is then the path's value in the commercial-operation year"),
];

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

/// Read `[fuel]`. `commercial_operation_year` is the first year a price path
/// must cover.
pub(crate) fn read_fuel(
    ctx: &mut Context,
    node: &Node,
    commercial_operation_year: i32,
) -> Read<FuelSpec> {
    let r = TableReader::new(ctx, "fuel", node, &keys_in(KEYS, "fuel"))?;
    let composition = read_composition(ctx, &r)?;
    r.source_below(ctx, "composition");
    let name = match r.string(ctx, "name")? {
        Some(name) => name,
        None => {
            let name = match &composition {
                FuelComposition::Named(n) => n.clone(),
                _ => "fuel".to_string(),
            };
            r.default(ctx, "name", &name);
            name
        }
    };
    let price_basis = match r.string(ctx, "price_basis")?.as_deref() {
        Some("hhv") => PriceBasis::Hhv,
        Some("lhv") => PriceBasis::Lhv,
        Some(other) => {
            return Err(r.error(
                ctx,
                "price_basis",
                format!(
                    "{other:?} is not a heating-value basis{}",
                    did_you_mean(other, ["hhv", "lhv"])
                ),
                "expected \"hhv\" (gas is usually sold so) or \"lhv\"",
            ))
        }
        None => {
            return Err(r.missing(
                ctx,
                "price_basis",
                "expected price_basis = \"hhv\" or \"lhv\"; brayfin never assumes which",
            ))
        }
    };
    let escalation = r.declared_at(ctx, KEYS, "fuel.escalation")?;
    let price = money(ctx, &r, "price", units::price_per_gj)?;
    let price_written = price.and_then(|_| {
        ctx.inputs
            .iter()
            .rev()
            .find(|line| line.key == "fuel.price")
            .map(|line| WrittenQuantity {
                number: line.value_text.clone(),
                unit: line.unit.clone(),
            })
    });
    let price_path = read_price_path(ctx, &r, commercial_operation_year)?;
    r.source_below(ctx, "price_path");
    let price_per_gj = match (price, price_path.first()) {
        (Some(_), Some(_)) => {
            return Err(r.error(
                ctx,
                "price_path",
                "is given together with price",
                "expected either price (with escalation) or price_path, not both",
            ))
        }
        (Some(p), None) => p,
        (None, Some(_)) => {
            let at_operation = price_path
                .iter()
                .find(|(year, _)| *year == commercial_operation_year)
                .map_or(Decimal::ZERO, |(_, p)| *p);
            r.default(
                ctx,
                "price",
                &format!("{at_operation} per GJ (price_path, {commercial_operation_year})"),
            );
            at_operation
        }
        (None, None) => {
            return Err(r.missing(
                ctx,
                "price",
                "expected a fuel price such as price = \"4.20 USD/MMBtu\", or a price_path",
            ))
        }
    };
    Ok(FuelSpec {
        name,
        composition,
        price_per_gj,
        price_basis,
        escalation,
        price_path,
        price_written,
    })
}

fn read_composition(ctx: &mut Context, r: &TableReader) -> Read<FuelComposition> {
    let heating_keys = ["lhv", "hhv", "co2_factor"];
    let given_heating = heating_keys.iter().filter(|k| r.has(k)).count();
    let Some(node) = r.node(ctx, "composition") else {
        if given_heating == 0 {
            return Err(r.missing(
                ctx,
                "composition",
                "expected composition = \"methane\", a table of mole fractions, or lhv, hhv and co2_factor",
            ));
        }
        let valid = "a fuel by heating values needs lhv, hhv and co2_factor";
        let lhv_kj_per_kg =
            r.required_quantity(ctx, "lhv", units::specific_energy_kj_per_kg, valid)?;
        let hhv_kj_per_kg =
            r.required_quantity(ctx, "hhv", units::specific_energy_kj_per_kg, valid)?;
        let co2_kg_per_gj_lhv =
            r.required_quantity(ctx, "co2_factor", units::emission_factor_kg_per_gj, valid)?;
        return Ok(FuelComposition::HeatingValues {
            lhv_kj_per_kg,
            hhv_kj_per_kg,
            co2_kg_per_gj_lhv,
        });
    };
    if let Some(key) = heating_keys.iter().find(|k| r.has(k)) {
        return Err(r.error(
            ctx,
            key,
            "is given together with composition",
            "expected either a composition or heating values (lhv, hhv, co2_factor), not both",
        ));
    }
    let field = r.field("composition");
    match &node.value {
        NodeValue::Str(name) => {
            if FuelComposition::NAMED.iter().any(|(n, _)| n == name) {
                record_node(ctx, &field, node);
                Ok(FuelComposition::Named(name.clone()))
            } else {
                let names: Vec<&str> = FuelComposition::NAMED.iter().map(|(n, _)| *n).collect();
                Err(ctx.error_at_offset(
                    node.span.start,
                    &field,
                    format!(
                        "{name:?} is not a named fuel{}",
                        did_you_mean(name, names.iter().copied())
                    ),
                    format!(
                        "expected one of {}, or a table of mole fractions",
                        names.join(", ")
                    ),
                ))
            }
        }
        NodeValue::Table(entries) => {
            let mut fractions = Vec::with_capacity(entries.len());
            for entry in entries {
                let species_field = format!("{field}.{}", entry.key);
                ctx.spans
                    .insert(species_field.clone(), entry.node.span.clone());
                if !FuelComposition::SPECIES.contains(&entry.key.as_str()) {
                    return Err(ctx.error_at_offset(
                        entry.key_span.start,
                        &species_field,
                        format!(
                            "{:?} is not a species brayfin models{}",
                            entry.key,
                            did_you_mean(&entry.key, FuelComposition::SPECIES)
                        ),
                        format!(
                            "expected species among {}",
                            FuelComposition::SPECIES.join(", ")
                        ),
                    ));
                }
                let x = quantity_of_node(ctx, &species_field, &entry.node, &units::fraction)?;
                record_node(ctx, &species_field, &entry.node);
                if !(0.0..=1.0).contains(&x) {
                    return Err(ctx.error_at_offset(
                        entry.node.span.start,
                        &species_field,
                        format!("{x} is not a mole fraction"),
                        "expected a mole fraction in [0, 1]",
                    ));
                }
                fractions.push((entry.key.clone(), x));
            }
            let sum: f64 = fractions.iter().map(|(_, x)| x).sum();
            if (sum - 1.0).abs() > COMPOSITION_SUM_TOLERANCE {
                return Err(ctx.error_at_offset(
                    node.span.start,
                    &field,
                    format!("the mole fractions sum to {}", (sum * 1e9).round() / 1e9),
                    "expected mole fractions summing to 1 within 1e-6",
                ));
            }
            Ok(FuelComposition::MoleFractions(fractions))
        }
        _ => Err(type_error(
            ctx,
            &field,
            node,
            "a fuel name or a table of mole fractions",
        )),
    }
}

fn read_price_path(
    ctx: &mut Context,
    r: &TableReader,
    first_year: i32,
) -> Read<Vec<(i32, Decimal)>> {
    let Some(node) = r.node(ctx, "price_path") else {
        return Ok(Vec::new());
    };
    let field = r.field("price_path");
    let NodeValue::Table(entries) = &node.value else {
        return Err(type_error(
            ctx,
            &field,
            node,
            "a table of year = price, e.g. { 2027 = \"4.30 USD/MMBtu\" }",
        ));
    };
    let mut path: Vec<(i32, Decimal)> = Vec::with_capacity(entries.len());
    for entry in entries {
        let year_field = format!("{field}.{}", entry.key);
        ctx.spans
            .insert(year_field.clone(), entry.node.span.clone());
        let year = entry
            .key
            .parse::<i32>()
            .ok()
            .filter(|y| (1900..=2200).contains(y))
            .ok_or_else(|| {
                ctx.error_at_offset(
                    entry.key_span.start,
                    &year_field,
                    format!("{:?} is not a calendar year", entry.key),
                    "expected a year such as 2027 as the key",
                )
            })?;
        if let Some((previous, _)) = path.last() {
            if year != previous + 1 {
                return Err(ctx.error_at_offset(
                    entry.key_span.start,
                    &year_field,
                    format!("follows {previous}; the years must be contiguous and ascending"),
                    format!("expected {} next", previous + 1),
                ));
            }
        }
        let value = quantity_of_node(ctx, &year_field, &entry.node, &units::price_per_gj)?;
        record_node(ctx, &year_field, &entry.node);
        let price = in_currency(ctx, r, "price_path", value)?;
        if price.is_sign_negative() && !price.is_zero() {
            return Err(ctx.error_at_offset(
                entry.node.span.start,
                &year_field,
                format!("{price} per GJ is negative"),
                "expected a price of 0 or more",
            ));
        }
        path.push((year, price));
    }
    match path.first() {
        None => Err(ctx.error_at_offset(
            node.span.start,
            &field,
            "is empty",
            "expected at least one year",
        )),
        Some((start, _)) if *start > first_year => Err(ctx.error_at_offset(
            node.span.start,
            &field,
            format!("starts in {start}, after commercial operation in {first_year}"),
            format!("expected the path to cover {first_year} onwards"),
        )),
        _ => Ok(path),
    }
}
