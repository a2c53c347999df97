//! Typed value readers built on [`TableReader`]: dates, money in the
//! scenario currency, and numbers with a range checked where they are read.

use super::context::Context;
use super::error::ScenarioError;
use super::ranges::Range;
use super::reader::{type_error, TableReader};
use super::tree::{Node, NodeValue};
use crate::units::{MoneyValue, UnitError};
use chrono::NaiveDate;
use rust_decimal::Decimal;

type Read<T> = Result<T, ScenarioError>;

/// A date from a TOML date (`2027-06-01`) or a string `"2027-06-01"`.
pub(crate) fn date_of_node(ctx: &Context, field: &str, node: &Node) -> Read<NaiveDate> {
    let valid = "expected a date written YYYY-MM-DD, e.g. 2027-06-01";
    let parsed = match &node.value {
        NodeValue::Date(d) => match (d.date, d.time, d.offset) {
            (Some(date), None, None) => NaiveDate::from_ymd_opt(
                i32::from(date.year),
                u32::from(date.month),
                u32::from(date.day),
            ),
            _ => {
                return Err(ctx.error_at_offset(
                    node.span.start,
                    field,
                    format!("{d} has a time of day"),
                    valid,
                ))
            }
        },
        NodeValue::Str(text) => NaiveDate::parse_from_str(text.trim(), "%Y-%m-%d").ok(),
        _ => return Err(type_error(ctx, field, node, "a date")),
    };
    parsed.ok_or_else(|| {
        let text = match &node.value {
            NodeValue::Str(text) => text.clone(),
            _ => ctx
                .text
                .get(node.span.clone())
                .unwrap_or_default()
                .to_string(),
        };
        ctx.error_at_offset(
            node.span.start,
            field,
            format!("{text:?} is not a calendar date"),
            valid,
        )
    })
}

/// A required date.
pub(crate) fn required_date(ctx: &mut Context, reader: &TableReader, key: &str) -> Read<NaiveDate> {
    let node = reader
        .node(ctx, key)
        .ok_or_else(|| reader.missing(ctx, key, "expected a date written YYYY-MM-DD"))?;
    let date = date_of_node(ctx, &reader.field(key), node)?;
    ctx.inputs.push(super::context::InputLine {
        key: reader.field(key),
        value_text: date.to_string(),
        unit: String::new(),
        source: None,
    });
    Ok(date)
}

/// Check that a money value is in the scenario currency; return its amount.
pub(crate) fn in_currency(
    ctx: &Context,
    reader: &TableReader,
    key: &str,
    value: MoneyValue,
) -> Read<Decimal> {
    match (&value.currency, &ctx.currency) {
        (Some(given), Some(scenario)) if given != scenario => Err(reader.error(
            ctx,
            key,
            format!("is in {given} but the scenario currency is {scenario}"),
            format!("expected an amount in {scenario} (or a bare number)"),
        )),
        _ => Ok(value.amount),
    }
}

/// An optional money value in the scenario currency; negative is an error.
pub(crate) fn money(
    ctx: &mut Context,
    reader: &TableReader,
    key: &str,
    parse: fn(&str) -> Result<MoneyValue, UnitError>,
) -> Read<Option<Decimal>> {
    let Some(value) = reader.quantity(ctx, key, parse)? else {
        return Ok(None);
    };
    let amount = in_currency(ctx, reader, key, value)?;
    if amount.is_sign_negative() && !amount.is_zero() {
        return Err(reader.error(
            ctx,
            key,
            format!("{amount} is negative"),
            Range::NonNegative.valid(),
        ));
    }
    Ok(Some(amount))
}

/// A money value with a default of zero (recorded as `"0 <CUR>…"`).
pub(crate) fn money_or_zero(
    ctx: &mut Context,
    reader: &TableReader,
    key: &str,
    parse: fn(&str) -> Result<MoneyValue, UnitError>,
    per: &str,
) -> Read<Decimal> {
    if let Some(amount) = money(ctx, reader, key, parse)? {
        return Ok(amount);
    }
    let currency = ctx.currency.clone().unwrap_or_default();
    reader.default(ctx, key, &format!("0 {currency}{per}"));
    Ok(Decimal::ZERO)
}

/// A number read with `parse` and checked against `range` at its place.
pub(crate) fn checked(
    ctx: &mut Context,
    reader: &TableReader,
    key: &str,
    parse: fn(&str) -> Result<f64, UnitError>,
    range: Range,
) -> Read<Option<f64>> {
    let Some(value) = reader.quantity(ctx, key, parse)? else {
        return Ok(None);
    };
    range
        .check(value)
        .map_err(|(problem, valid)| reader.error(ctx, key, problem, valid))?;
    Ok(Some(value))
}
