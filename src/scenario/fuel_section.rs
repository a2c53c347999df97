//! Reading the `[fuel]` section: composition or heating values, price and
//! its basis, escalation or a year-by-year price path.

use super::context::Context;
use super::error::ScenarioError;
use super::reader::{quantity_of_node, record_node, type_error, TableReader};
use super::suggest::did_you_mean;
use super::tree::{Node, NodeValue};
use super::types::{FuelComposition, FuelSpec, PriceBasis};
use super::values::{in_currency, money};
use crate::units;
use rust_decimal::Decimal;

type Read<T> = Result<T, ScenarioError>;

/// Mole fractions must sum to 1 within this (the fuel model's own check).
const COMPOSITION_SUM_TOLERANCE: f64 = 1e-6;

/// Read `[fuel]`. `commercial_operation_year` is the first year a price path
/// must cover.
pub(crate) fn read_fuel(
    ctx: &mut Context,
    node: &Node,
    commercial_operation_year: i32,
) -> Read<FuelSpec> {
    let r = TableReader::new(
        ctx,
        "fuel",
        node,
        &[
            "name",
            "composition",
            "lhv",
            "hhv",
            "co2_factor",
            "price",
            "price_basis",
            "escalation",
            "price_path",
        ],
    )?;
    let composition = read_composition(ctx, &r)?;
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
    let escalation = r.quantity_or(ctx, "escalation", units::fraction, 0.0, "0 %")?;
    let price = money(ctx, &r, "price", units::price_per_gj)?;
    let price_path = read_price_path(ctx, &r, commercial_operation_year)?;
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
