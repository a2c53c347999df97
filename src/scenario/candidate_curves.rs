//! A bid's vendor curves on its `[[candidate]]` table (keys declared in
//! `candidate.rs`):
//!
//! - `part_load = [{ load = "75 %", heat_rate_ratio = 1.07 }, …]`: heat rate
//!   at that load over the base-load heat rate;
//! - `ambient_correction = [{ temperature = "35 degC", output_ratio = 0.88,
//!   heat_rate_ratio = 1.04 }, …]`: base-load output and heat rate at that
//!   compressor inlet temperature over those at the rating temperature (at
//!   the rating pressure and humidity).
//!
//! Both are read in either order, checked point by point (each error at
//! the point's key) and returned sorted ascending, with the reference point
//! (load 100 %, or the rating temperature, at ratio 1) added as a recorded
//! default when the file leaves it out.

use super::context::Context;
use super::error::ScenarioError;
use super::ranges::{Range, AMBIENT_T_K, AMBIENT_T_REASON};
use super::reader::{type_error, TableReader};
use super::tree::NodeValue;
use super::types::PartLoadPoint;
use super::values::checked;
use crate::units;

type Read<T> = Result<T, ScenarioError>;

/// One point of a vendor's ambient-correction curve.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AmbientCorrectionSpec {
    /// Compressor inlet air temperature, K.
    pub temperature_k: f64,
    /// Base-load net output over the rated net output (> 0).
    pub output_ratio: f64,
    /// Base-load heat rate over the rated heat rate (> 0).
    pub heat_rate_ratio: f64,
}

/// Largest heat-rate ratio a part-load curve may state: a heat rate three
/// times the base-load one is a machine idling near its minimum load
/// (common practice), far below any load worth dispatching.
pub(crate) const PART_LOAD_RATIO_HIGH: f64 = 3.0;
/// Ambient-correction ratios, both kinds: from 0.5 to 1.5 of the rating.
/// Across −40 °C to +50 °C an industrial machine's output moves by about
/// ±30 % and its heat rate by about ±8 % (common practice); beyond half or
/// one and a half times the rating a ratio is a typing error.
pub(crate) const AMBIENT_RATIO: (f64, f64) = (0.5, 1.5);

/// The `part_load` array of candidate table `r`, if given: loads in
/// (0, 100 %], strictly ascending or strictly descending; heat-rate ratios
/// in [1, 3], exactly 1 at load 100 % (added when absent), and not rising
/// with load. Sorted ascending on return; empty when not given.
pub(crate) fn read_part_load(ctx: &mut Context, r: &TableReader) -> Read<Vec<PartLoadPoint>> {
    let rows = read_rows(ctx, r, "part_load", &["load", "heat_rate_ratio"])?;
    let mut points = Vec::with_capacity(rows.len());
    for (i, row) in rows.iter().enumerate() {
        let field = |key: &str| format!("{}[{}].{key}", r.field("part_load"), i + 1);
        let (load_fraction, ratio) = (row[0], row[1]);
        if !(1.0..=PART_LOAD_RATIO_HIGH).contains(&ratio) {
            return Err(ctx.error_for(
                &field("heat_rate_ratio"),
                format!(
                    "{ratio} is {}",
                    if ratio < 1.0 {
                        "below 1: a heat rate better than at base load"
                    } else {
                        "above 3"
                    }
                ),
                "expected a heat-rate ratio from 1 (at load 100 %) to 3",
            ));
        }
        if load_fraction == 1.0 && ratio != 1.0 {
            return Err(ctx.error_for(
                &field("heat_rate_ratio"),
                format!("{ratio} at load 100 %"),
                "expected exactly 1.0 at load 100 %: the ratio is relative to the base-load heat rate",
            ));
        }
        points.push(PartLoadPoint {
            load_fraction,
            heat_rate_ratio: ratio,
        });
    }
    let loads: Vec<f64> = points.iter().map(|p| p.load_fraction).collect();
    if sort_ascending(ctx, r, "part_load", "load", &loads)? {
        points.reverse();
    }
    if points.last().is_some_and(|p| p.load_fraction < 1.0) {
        r.default(ctx, "part_load", "includes load 100 %, heat_rate_ratio 1.0");
        points.push(PartLoadPoint {
            load_fraction: 1.0,
            heat_rate_ratio: 1.0,
        });
    }
    for pair in points.windows(2) {
        if pair[1].heat_rate_ratio > pair[0].heat_rate_ratio {
            return Err(r.error(
                ctx,
                "part_load",
                format!(
                    "the heat-rate ratio rises from {} at load {} to {} at load {}",
                    pair[0].heat_rate_ratio,
                    pair[0].load_fraction,
                    pair[1].heat_rate_ratio,
                    pair[1].load_fraction
                ),
                "expected the heat-rate ratio to fall (or stay) as load rises",
            ));
        }
    }
    Ok(points)
}

/// The `ambient_correction` array of candidate table `r`, if given:
/// temperatures within the ambient range, strictly ascending or strictly
/// descending; ratios in [0.5, 1.5]; exactly 1 and 1 at the rating
/// temperature `rating_temperature_k` (that point added when absent);
/// output ratio not rising with temperature (a hotter day never gives more
/// air to a fixed machine at constant speed). Sorted ascending on return;
/// empty when not given.
pub(crate) fn read_ambient_correction(
    ctx: &mut Context,
    r: &TableReader,
    rating_temperature_k: f64,
) -> Read<Vec<AmbientCorrectionSpec>> {
    let rows = read_rows(
        ctx,
        r,
        "ambient_correction",
        &["temperature", "output_ratio", "heat_rate_ratio"],
    )?;
    let mut points = Vec::with_capacity(rows.len());
    for (i, row) in rows.iter().enumerate() {
        let field = |key: &str| format!("{}[{}].{key}", r.field("ambient_correction"), i + 1);
        let (t, output_ratio, heat_rate_ratio) = (row[0], row[1], row[2]);
        if !(AMBIENT_T_K.0..=AMBIENT_T_K.1).contains(&t) {
            return Err(ctx.error_for(
                &field("temperature"),
                format!(
                    "{t} K is outside {} K to {} K",
                    AMBIENT_T_K.0, AMBIENT_T_K.1
                ),
                format!("expected an ambient temperature: {AMBIENT_T_REASON}"),
            ));
        }
        for (key, v) in [
            ("output_ratio", output_ratio),
            ("heat_rate_ratio", heat_rate_ratio),
        ] {
            if !(AMBIENT_RATIO.0..=AMBIENT_RATIO.1).contains(&v) {
                return Err(ctx.error_for(
                    &field(key),
                    format!("{v} is outside 0.5 to 1.5"),
                    "expected a ratio to the rating from 0.5 to 1.5 (ambient moves output by \
                     about ±30 % and heat rate by about ±8 %, common practice)",
                ));
            }
            if (t - rating_temperature_k).abs() < 1e-9 && v != 1.0 {
                return Err(ctx.error_for(
                    &field(key),
                    format!("{v} at the rating temperature ({rating_temperature_k} K)"),
                    "expected exactly 1.0 at the rating temperature: the ratios are relative to the rating",
                ));
            }
        }
        points.push(AmbientCorrectionSpec {
            temperature_k: t,
            output_ratio,
            heat_rate_ratio,
        });
    }
    let temperatures: Vec<f64> = points.iter().map(|p| p.temperature_k).collect();
    if sort_ascending(ctx, r, "ambient_correction", "temperature", &temperatures)? {
        points.reverse();
    }
    if !points.is_empty()
        && !points
            .iter()
            .any(|p| (p.temperature_k - rating_temperature_k).abs() < 1e-9)
    {
        r.default(
            ctx,
            "ambient_correction",
            "includes the rating temperature at output_ratio 1.0, heat_rate_ratio 1.0",
        );
        let at = points.partition_point(|p| p.temperature_k < rating_temperature_k);
        points.insert(
            at,
            AmbientCorrectionSpec {
                temperature_k: rating_temperature_k,
                output_ratio: 1.0,
                heat_rate_ratio: 1.0,
            },
        );
    }
    for pair in points.windows(2) {
        if pair[1].output_ratio > pair[0].output_ratio {
            return Err(r.error(
                ctx,
                "ambient_correction",
                format!(
                    "the output ratio rises from {} at {} K to {} at {} K",
                    pair[0].output_ratio,
                    pair[0].temperature_k,
                    pair[1].output_ratio,
                    pair[1].temperature_k
                ),
                "expected the output ratio to fall (or stay) as the ambient temperature rises \
                 (the rating temperature is at 1.0)",
            ));
        }
    }
    Ok(points)
}

/// Whether `values` (the `what` of each row of `key`) descend, after
/// checking that they are strictly monotone in one direction.
fn sort_ascending(
    ctx: &Context,
    r: &TableReader,
    key: &str,
    what: &str,
    values: &[f64],
) -> Read<bool> {
    let ascending = values.len() < 2 || values[1] > values[0];
    for i in 1..values.len() {
        let (a, b) = (values[i - 1], values[i]);
        if (ascending && b <= a) || (!ascending && b >= a) {
            return Err(ctx.error_for(
                &format!("{}[{}].{what}", r.field(key), i + 1),
                format!("{b} breaks the order of the {what}s before it"),
                format!("expected each {what} once, strictly ascending or strictly descending"),
            ));
        }
    }
    Ok(!ascending)
}

/// Read an array of small inline tables with the keys `keys`, all required,
/// as numbers in the internal unit (the first a load fraction or a
/// temperature, the rest positive ratios).
fn read_rows(ctx: &mut Context, r: &TableReader, key: &str, keys: &[&str]) -> Read<Vec<Vec<f64>>> {
    let Some(node) = r.node(ctx, key) else {
        return Ok(Vec::new());
    };
    let field = r.field(key);
    let NodeValue::Array(items) = &node.value else {
        return Err(type_error(
            ctx,
            &field,
            node,
            "an array of tables, e.g. [{ … }, { … }]",
        ));
    };
    if items.is_empty() {
        return Err(r.error(
            ctx,
            key,
            "is an empty array",
            "expected at least one point, or leave the key out",
        ));
    }
    let mut rows = Vec::with_capacity(items.len());
    for (i, item) in items.iter().enumerate() {
        let path = format!("{field}[{}]", i + 1);
        let b = TableReader::new(ctx, &path, item, keys)?;
        let mut row = Vec::with_capacity(keys.len());
        for name in keys {
            let value = match *name {
                "load" => checked(ctx, &b, name, units::fraction, Range::Efficiency)?,
                "temperature" => checked(ctx, &b, name, units::temperature_k, Range::Positive)?,
                _ => checked(ctx, &b, name, units::number, Range::Positive)?,
            }
            .ok_or_else(|| {
                b.missing(
                    ctx,
                    name,
                    &format!("expected {} in each point", keys.join(", ")),
                )
            })?;
            row.push(value);
        }
        rows.push(row);
    }
    r.source_below(ctx, key);
    Ok(rows)
}
