//! The `[operation]` section: hours per year, dispatch blocks (each
//! optionally at its own ambient) or an hourly profile
//! ([`super::weather`]), and the part-load heat-rate curve.

use super::context::Context;
use super::declare::{keys_in, Key, Presence, SetResult, Shape};
use super::error::ScenarioError;
use super::ranges::{Range, AMBIENT_T_K, HOURS_PER_LEAP_YEAR};
use super::reader::{type_error, TableReader};
use super::tree::{Node, NodeValue};
use super::types::{DispatchBlock, Operation, PartLoadPoint, Scenario};
use super::values::checked;
use super::weather::{read_profile, Weather};
use crate::units::{self, Kind};

type Read<T> = Result<T, ScenarioError>;
/// Declarations of this section are keys into the whole [`Scenario`].
type K = Key<Scenario>;

/// The keys of `[operation]`.
pub(crate) const KEYS: &[Key<Scenario>] = &[
    K::number(
        "operation.hours_per_year",
        Kind::Duration,
        Range::HoursPerYear,
        Presence::RequiredUnless { text: "`dispatch` (then the dispatch total) or `profile` (then its run hours × 8760 / rows)" },
        "operating hours per year; setting it through a key path scales every dispatch block (or the profile's hours) in proportion",
        |s| Some(s.operation.hours_per_year),
        set_hours_per_year,
    ),
    K::plain("operation.dispatch", Shape::Array, Presence::Optional { text: "every hour at full load" }, "`[{ load = \"100 %\", hours = 2000 }, { load = \"75 %\", hours = 1000, ambient_temperature = \"30 degC\", relative_humidity = \"40 %\" }]`; loads in (0, 100 %] of the output available at the block's ambient, hours ≥ 0, total ≤ 8784. With `hours_per_year` too, the total must equal it. A block without `ambient_temperature` spreads its hours over the site's weather in proportion to the weather's hours (or runs at the site's ambient); a block with it and without `relative_humidity` takes the site's"),
    K::plain("operation.profile", Shape::Text, Presence::Optional { text: "none" }, "instead of `dispatch`: an hourly CSV file relative to the scenario, columns `timestamp` (as the weather's, hour by hour), `load_pct` (% of the output available in that hour, 0 = off) and optionally `energy_price_per_MWh` (prices the energy shortfall hour by hour, see *Levelling on output*). Each row counts 8760 / rows hours; without `site.weather` every hour is at the site's ambient; with weather bins it is refused"),
    K::plain("operation.part_load", Shape::Array, Presence::Optional { text: "none" }, "`[{ load = \"75 %\", heat_rate_ratio = 1.07 }, …]`: heat rate at that load ÷ full-load heat rate. Loads strictly ascending or descending; ratios ≥ 1 and not rising with load; exactly 1.0 at 100 % (added if absent). Optional: without it each candidate's own fixed machine gives its part-load heat rate (see `brayfin offdesign`); with it, the table is a stated vendor curve applied to each candidate's base-load heat rate at the site, and must reach down to the lowest dispatch load (no extrapolation)"),
];

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

/// Read `[operation]`.
pub(crate) fn read_operation(
    ctx: &mut Context,
    node: &Node,
    weather: Option<&Weather>,
) -> Read<Operation> {
    let r = TableReader::new(ctx, "operation", node, &keys_in(KEYS, "operation"))?;
    let hours = checked(
        ctx,
        &r,
        "hours_per_year",
        units::duration_h,
        Range::HoursPerYear,
    )?;
    let dispatch = read_dispatch(ctx, &r)?;
    let profile = read_profile(ctx, &r, weather)?;
    if profile.is_some() {
        for other in ["dispatch", "hours_per_year"] {
            if r.has(other) {
                return Err(r.error(
                    ctx,
                    other,
                    "is given together with profile",
                    "expected either an hourly profile or dispatch blocks and hours_per_year, not both",
                ));
            }
        }
    }
    let mut part_load = read_blocks(ctx, &r, "part_load", &["load", "heat_rate_ratio"])?
        .into_iter()
        .map(|(load_fraction, heat_rate_ratio)| PartLoadPoint {
            load_fraction,
            heat_rate_ratio,
        })
        .collect::<Vec<_>>();
    r.source_below(ctx, "dispatch");
    r.source_below(ctx, "part_load");
    let total: f64 = dispatch.iter().map(|b| b.hours).sum();
    if total > HOURS_PER_LEAP_YEAR {
        return Err(r.error(
            ctx,
            "dispatch",
            format!("the blocks' hours sum to {total} h, more than the 8784 hours of a leap year"),
            "expected dispatch hours summing to at most 8784",
        ));
    }
    let hours_per_year = match (hours, &profile) {
        (_, Some(p)) => {
            let h = p.run_hours_per_year();
            r.default(
                ctx,
                "hours_per_year",
                &format!("{h:.1} h (profile run hours × 8760 / rows)"),
            );
            h
        }
        (Some(h), None) => h,
        (None, None) if !dispatch.is_empty() && total > 0.0 => {
            r.default(ctx, "hours_per_year", &format!("{total} h (sum of dispatch)"));
            total
        }
        (None, None) => {
            return Err(r.missing(
                ctx,
                "hours_per_year",
                "expected operating hours per year, e.g. hours_per_year = \"4000 h\", dispatch blocks or an hourly profile",
            ))
        }
    };
    check_part_load(ctx, &r, &mut part_load)?;
    for (i, block) in dispatch.iter().enumerate() {
        if block.load_fraction >= 1.0 {
            continue;
        }
        let field = format!("operation.dispatch[{}].load", i + 1);
        match part_load.first() {
            // No table: each candidate's fixed machine gives its own part
            // load (its control's minimum load is checked when solved).
            None => {}
            Some(lowest) if block.load_fraction < lowest.load_fraction => {
                return Err(ctx.error_for(
                    &field,
                    format!(
                        "{} is below the lowest part_load point ({}); brayfin does not extrapolate",
                        block.load_fraction, lowest.load_fraction
                    ),
                    "expected a part_load table that reaches down to every dispatch load",
                ))
            }
            _ => {}
        }
    }
    Ok(Operation {
        hours_per_year,
        dispatch,
        part_load,
        profile: profile.map(std::sync::Arc::new),
    })
}

/// Read the dispatch blocks: `load`, `hours`, and optionally the block's
/// own `ambient_temperature` and `relative_humidity`.
fn read_dispatch(ctx: &mut Context, r: &TableReader) -> Read<Vec<DispatchBlock>> {
    let Some(node) = r.node(ctx, "dispatch") else {
        return Ok(Vec::new());
    };
    let field = r.field("dispatch");
    let NodeValue::Array(items) = &node.value else {
        return Err(type_error(
            ctx,
            &field,
            node,
            "an array of tables, e.g. [{ load = \"100 %\", hours = 2000 }]",
        ));
    };
    let mut blocks = Vec::with_capacity(items.len());
    for (i, item) in items.iter().enumerate() {
        let path = format!("{field}[{}]", i + 1);
        let b = TableReader::new(
            ctx,
            &path,
            item,
            &["load", "hours", "ambient_temperature", "relative_humidity"],
        )?;
        let load_fraction = checked(ctx, &b, "load", units::fraction, Range::Efficiency)?
            .ok_or_else(|| b.missing(ctx, "load", "expected a load fraction such as \"75 %\""))?;
        let hours = checked(ctx, &b, "hours", units::duration_h, Range::NonNegative)?
            .ok_or_else(|| b.missing(ctx, "hours", "expected a value for each block"))?;
        let ambient_temperature_k = checked(
            ctx,
            &b,
            "ambient_temperature",
            units::temperature_k,
            Range::Positive,
        )?;
        if let Some(t) = ambient_temperature_k {
            if !(AMBIENT_T_K.0..=AMBIENT_T_K.1).contains(&t) {
                return Err(b.error(
                    ctx,
                    "ambient_temperature",
                    format!("{t:.2} K is outside the ambient range"),
                    format!("expected {} K to {} K", AMBIENT_T_K.0, AMBIENT_T_K.1),
                ));
            }
        }
        let relative_humidity = checked(
            ctx,
            &b,
            "relative_humidity",
            units::fraction,
            Range::Fraction,
        )?;
        blocks.push(DispatchBlock {
            load_fraction,
            hours,
            ambient_temperature_k,
            relative_humidity,
        });
    }
    Ok(blocks)
}

/// Read an array of small inline tables with a `load` and one other value
/// (`hours` or `heat_rate_ratio`).
fn read_blocks(
    ctx: &mut Context,
    r: &TableReader,
    key: &str,
    keys: &[&str; 2],
) -> Read<Vec<(f64, f64)>> {
    let Some(node) = r.node(ctx, key) else {
        return Ok(Vec::new());
    };
    let field = r.field(key);
    let NodeValue::Array(items) = &node.value else {
        return Err(type_error(
            ctx,
            &field,
            node,
            "an array of tables, e.g. [{ load = \"100 %\", … }]",
        ));
    };
    let mut blocks = Vec::with_capacity(items.len());
    for (i, item) in items.iter().enumerate() {
        let path = format!("{field}[{}]", i + 1);
        let b = TableReader::new(ctx, &path, item, keys)?;
        let load = checked(ctx, &b, "load", units::fraction, Range::Efficiency)?
            .ok_or_else(|| b.missing(ctx, "load", "expected a load fraction such as \"75 %\""))?;
        let second = if keys[1] == "hours" {
            checked(ctx, &b, "hours", units::duration_h, Range::NonNegative)?
        } else {
            checked(ctx, &b, keys[1], units::number, Range::Positive)?
        }
        .ok_or_else(|| b.missing(ctx, keys[1], "expected a value for each block"))?;
        blocks.push((load, second));
    }
    Ok(blocks)
}

/// The part-load curve: loads strictly monotone (either order), heat-rate
/// ratio ≥ 1 and not rising with load, (1.0, 1.0) at full load. Sorted
/// ascending on return; (1.0, 1.0) added (as a default) when absent.
fn check_part_load(
    ctx: &mut Context,
    r: &TableReader,
    points: &mut Vec<PartLoadPoint>,
) -> Read<()> {
    if points.is_empty() {
        return Ok(());
    }
    let field = |i: usize, key: &str| format!("operation.part_load[{}].{key}", i + 1);
    let ascending = points.len() < 2 || points[1].load_fraction > points[0].load_fraction;
    for i in 1..points.len() {
        let (a, b) = (points[i - 1].load_fraction, points[i].load_fraction);
        if (ascending && b <= a) || (!ascending && b >= a) {
            return Err(ctx.error_for(
                &field(i, "load"),
                format!("{b} breaks the order of the loads before it"),
                "expected loads strictly ascending or strictly descending, each load once",
            ));
        }
    }
    for (i, p) in points.iter().enumerate() {
        if p.heat_rate_ratio < 1.0 {
            return Err(ctx.error_for(
                &field(i, "heat_rate_ratio"),
                format!(
                    "{} is below 1: a heat rate better than at full load",
                    p.heat_rate_ratio
                ),
                "expected heat-rate ratios of 1 or more (1.0 at full load)",
            ));
        }
        if p.load_fraction == 1.0 && p.heat_rate_ratio != 1.0 {
            return Err(ctx.error_for(
                &field(i, "heat_rate_ratio"),
                format!("{} at full load", p.heat_rate_ratio),
                "expected exactly 1.0 at load 100 %: the ratio is relative to the full-load heat rate",
            ));
        }
    }
    if !ascending {
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
            return Err(ctx.error_for(
                "operation.part_load",
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
    Ok(())
}
