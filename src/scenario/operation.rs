//! The `[operation]` section: hours per year, starts, dispatch blocks
//! (each optionally at its own ambient) or an hourly profile
//! ([`super::weather`]). The part-load heat-rate curve is a bid's own
//! (`part_load` on each `[[candidate]]`); the retired `[operation]
//! part_load` is refused with a message saying where it moved.

use super::context::Context;
use super::declare::{keys_in, Key, Presence, SetResult, Shape};
use super::error::ScenarioError;
use super::ranges::{Range, HOURS_PER_LEAP_YEAR};
use super::reader::{type_error, TableReader};
use super::tree::{Node, NodeValue};
use super::types::{DispatchBlock, Operation, Scenario};
use super::values::checked;
use super::weather::{read_ambient, read_profile, Weather};
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
    K::number(
        "operation.starts_per_year",
        Kind::Number,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "starts per year, every candidate alike: start fuel, start cost, service fees per start and the overhaul count follow them",
        |s| Some(s.operation.starts_per_year),
        |s, v| {
            s.operation.starts_per_year = v;
            Ok(())
        },
    )
    .within(0.0, HOURS_PER_LEAP_YEAR, "", "at most one start per hour of the year; a peaker starts a few hundred times a year (common practice)"),
    K::plain("operation.dispatch", Shape::Array, Presence::Optional { text: "every hour at full load" }, "`[{ load = \"100 %\", hours = 2000 }, { load = \"75 %\", hours = 1000, ambient_temperature = \"30 degC\", relative_humidity = \"40 %\" }]`; loads in (0, 100 %] of the output available at the block's ambient, hours ≥ 0, total ≤ 8784. With `hours_per_year` too, the total must equal it. A block without `ambient_temperature` spreads its hours over the site's weather in proportion to the weather's hours (or runs at the site's ambient); a block with it and without `relative_humidity` takes the site's"),
    K::plain("operation.profile", Shape::Text, Presence::Optional { text: "none" }, "instead of `dispatch`: an hourly CSV file relative to the scenario, columns `timestamp` (as the weather's, hour by hour), `load_pct` (% of the output available in that hour, 0 = off) and optionally `energy_price_per_MWh` (prices the energy shortfall hour by hour, see *Levelling on output*). Each row counts 8760 / rows hours; without `site.weather` every hour is at the site's ambient; with weather bins it is refused"),
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
    refuse_retired_part_load(ctx, node)?;
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
    r.source_below(ctx, "dispatch");
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
    let starts_per_year = r.declared_at(ctx, KEYS, "operation.starts_per_year")?;
    Ok(Operation {
        hours_per_year,
        starts_per_year,
        dispatch,
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
        let (ambient_temperature_k, relative_humidity) =
            read_ambient(ctx, &b, "ambient_temperature")?;
        blocks.push(DispatchBlock {
            load_fraction,
            hours,
            ambient_temperature_k,
            relative_humidity,
        });
    }
    Ok(blocks)
}

/// `[operation] part_load` was the one part-load curve of every candidate;
/// it is now each bid's own (`part_load` on its `[[candidate]]`, the
/// vendor's curve). A file that still has it is refused at the key, saying
/// what to move where.
fn refuse_retired_part_load(ctx: &Context, node: &Node) -> Read<()> {
    let NodeValue::Table(entries) = &node.value else {
        return Ok(());
    };
    let Some(entry) = entries.iter().find(|e| e.key == "part_load") else {
        return Ok(());
    };
    Err(ctx.error_at_offset(
        entry.key_span.start,
        "operation.part_load",
        "is retired: a part-load curve is now each bid's own (the vendor's curve)",
        "move the array, unchanged, to `part_load = [...]` in the [[candidate]] table of each \
         bid whose vendor states it (as candidate.part_load) and delete it from [operation]; \
         a bid without one is priced from its own machine's part-load physics",
    ))
}
