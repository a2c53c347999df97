//! A candidate's `costs` table (`[candidate.costs]`): its keys and reader.

use super::candidate::{Candidate, CandidateCosts, ResidualValue};
use super::context::Context;
use super::declare::{keys_in, money_from_f64, money_to_f64, Key, Presence, Shape};
use super::error::ScenarioError;
use super::ranges::{Range, AMOUNT_HIGH, AMOUNT_REASON, PRICE_HIGH, PRICE_REASON};
use super::reader::{type_error, TableReader};
use super::tree::NodeValue;
use super::values::{date_of_node, in_currency, money_or_zero};
use crate::units::{self, Kind};
use chrono::NaiveDate;

type Read<T> = Result<T, ScenarioError>;
/// Candidate declarations are keys into one [`Candidate`].
type K = Key<Candidate>;

/// Fractions of a construction schedule must sum to 1 within this.
const SCHEDULE_SUM_TOLERANCE: f64 = 1e-9;

/// The keys of a candidate's `costs` table (paths relative to the
/// candidate).
pub(crate) const KEYS: &[Key<Candidate>] = &[
    K::number(
        "costs.fixed_om",
        Kind::PricePerCapacity,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "fixed O&M per kW of rated output per year",
        |c| Some(money_to_f64(c.costs.fixed_om_per_kw_year)),
        |c, v| {
            c.costs.fixed_om_per_kw_year = money_from_f64(v)?;
            Ok(())
        },
    )
    .within(0.0, PRICE_HIGH, "", PRICE_REASON),
    K::number(
        "costs.variable_om",
        Kind::PricePerEnergy,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "variable O&M per MWh generated",
        |c| Some(money_to_f64(c.costs.variable_om_per_mwh)),
        |c, v| {
            c.costs.variable_om_per_mwh = money_from_f64(v)?;
            Ok(())
        },
    )
    .within(0.0, PRICE_HIGH, "", PRICE_REASON),
    K::number(
        "costs.overhaul_interval",
        Kind::Duration,
        Range::NonNegative,
        Presence::Default { text: "0 h (no overhauls)", value: 0.0 },
        "operating hours between major overhauls; `\"0 h\"` = none",
        |c| Some(c.costs.overhaul_interval_hours),
        |c, v| {
            c.costs.overhaul_interval_hours = v;
            Ok(())
        },
    )
    .within(0.0, 1e6, "h", "about 114 years of continuous running; any longer interval means no overhaul in a service life"),
    K::number(
        "costs.overhaul_cost",
        Kind::Money,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "cost of one overhaul; needs an interval above 0",
        |c| Some(money_to_f64(c.costs.overhaul_cost)),
        |c, v| {
            c.costs.overhaul_cost = money_from_f64(v)?;
            Ok(())
        },
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "costs.hours_per_start",
        Kind::Duration,
        Range::NonNegative,
        Presence::Default { text: "0 h", value: 0.0 },
        "equivalent operating hours counted per start toward `overhaul_interval` (which is then in equivalent hours)",
        |c| Some(c.costs.hours_per_start),
        |c, v| {
            c.costs.hours_per_start = v;
            Ok(())
        },
    )
    .within(0.0, 1000.0, "h", "a start is commonly counted as about 10 to 50 equivalent hours (common practice); above 1000 h a start would outweigh a month of running"),
    K::number(
        "costs.overhaul_starts",
        Kind::Number,
        Range::NonNegative,
        Presence::Default { text: "0 (starts do not limit)", value: 0.0 },
        "starts between major overhauls; an overhaul falls due on equivalent hours or on starts, whichever comes first; needs an `overhaul_interval` above 0",
        |c| Some(c.costs.overhaul_starts),
        |c, v| {
            c.costs.overhaul_starts = v;
            Ok(())
        },
    )
    .within(0.0, 1e6, "", "hundreds to a few thousand starts in practice (common practice); a million would never fall due"),
    K::number(
        "costs.overhaul_outage_days",
        Kind::Number,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "days out of service per major overhaul; the energy and capacity lost meanwhile are bought in at `economics.energy_value` and `capacity_value`",
        |c| Some(c.costs.overhaul_outage_days),
        |c, v| {
            c.costs.overhaul_outage_days = v;
            Ok(())
        },
    )
    .within(0.0, 365.0, "", "a major overhaul takes days to a few weeks (common practice); a year is the most a yearly ledger row can lose"),
    K::number(
        "costs.output_degradation_per_year",
        Kind::Fraction,
        Range::Loss,
        Presence::Default { text: "0 %", value: 0.0 },
        "net output lost per year of operation; `recoverable_fraction` of it is restored at each overhaul; the energy lost is bought in at `economics.energy_value`",
        |c| Some(c.costs.output_degradation_per_year),
        |c, v| {
            c.costs.output_degradation_per_year = v;
            Ok(())
        },
    )
    .within(0.0, 0.2, "", "a fraction of a per cent to a few per cent a year in practice (common practice)"),
    K::number(
        "costs.start_fuel",
        Kind::FuelEnergy,
        Range::NonNegative,
        Presence::Default { text: "0 GJ", value: 0.0 },
        "fuel burned per start (LHV), priced like the fuel and carrying its carbon",
        |c| Some(c.costs.start_fuel_gj),
        |c, v| {
            c.costs.start_fuel_gj = v;
            Ok(())
        },
    )
    .within(0.0, 1e5, "GJ", "a start burns roughly the fuel of a fraction of an hour to a few hours at full load (common practice); 100 000 GJ is days of a large machine"),
    K::number(
        "costs.start_cost",
        Kind::Money,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "O&M cost per start (counted in variable O&M)",
        |c| Some(money_to_f64(c.costs.start_cost)),
        |c, v| {
            c.costs.start_cost = money_from_f64(v)?;
            Ok(())
        },
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "costs.service_per_fired_hour",
        Kind::Money,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "service-agreement fee per fired hour (counted in variable O&M)",
        |c| Some(money_to_f64(c.costs.service_fee_per_fired_hour)),
        |c, v| {
            c.costs.service_fee_per_fired_hour = money_from_f64(v)?;
            Ok(())
        },
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "costs.service_per_start",
        Kind::Money,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "service-agreement fee per start (counted in variable O&M)",
        |c| Some(money_to_f64(c.costs.service_fee_per_start)),
        |c, v| {
            c.costs.service_fee_per_start = money_from_f64(v)?;
            Ok(())
        },
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "costs.degradation_per_year",
        Kind::Fraction,
        Range::Loss,
        Presence::Default { text: "0 %", value: 0.0 },
        "heat-rate rise per year of operation",
        |c| Some(c.costs.degradation_per_year),
        |c, v| {
            c.costs.degradation_per_year = v;
            Ok(())
        },
    )
    .within(0.0, 0.2, "", "a fraction of a per cent to a few per cent a year in practice (common practice); 20 % a year would double the heat rate in five"),
    K::number(
        "costs.recoverable_fraction",
        Kind::Fraction,
        Range::Fraction,
        Presence::Default { text: "0 %", value: 0.0 },
        "share of the degradation an overhaul recovers",
        |c| Some(c.costs.recoverable_fraction),
        |c, v| {
            c.costs.recoverable_fraction = v;
            Ok(())
        },
    ),
    K::plain("costs.residual_value", Shape::Quantity(Kind::Fraction), Presence::Default { text: "0 %", value: 0.0 }, "at end of life: a fraction of capital (`\"5 %\"`) or an amount (`\"600000 USD\"`)"),
    K::plain("costs.construction", Shape::Array, Presence::Optional { text: "all capital at commercial operation" }, "`[{ date = 2026-01-15, fraction = \"40 %\" }, …]`: capital spent before commercial operation; dates ascending, on or before it; fractions summing to 100 %"),
];

/// Read `costs` of the candidate being read by `r` (all keys optional,
/// defaults zero; a missing table is all defaults).
pub(crate) fn read_costs(
    ctx: &mut Context,
    r: &TableReader,
    cod: NaiveDate,
) -> Read<CandidateCosts> {
    let empty = super::tree::Node {
        span: r.span.clone(),
        value: NodeValue::Table(Vec::new()),
    };
    let node = r.node(ctx, "costs").unwrap_or(&empty);
    let t = TableReader::new(ctx, &r.field("costs"), node, &keys_in(KEYS, "costs"))?;
    let fixed_om_per_kw_year =
        money_or_zero(ctx, &t, "fixed_om", units::price_per_kw_year, "/kW-yr")?;
    let variable_om_per_mwh = money_or_zero(ctx, &t, "variable_om", units::price_per_mwh, "/MWh")?;
    let overhaul_interval_hours = t.declared_at(ctx, KEYS, "costs.overhaul_interval")?;
    let overhaul_cost = money_or_zero(ctx, &t, "overhaul_cost", units::money, "")?;
    if !overhaul_cost.is_zero() && overhaul_interval_hours <= 0.0 {
        return Err(t.error(
            ctx,
            "overhaul_cost",
            "is given but overhaul_interval is 0 h",
            "expected an overhaul_interval above 0 h, e.g. \"24000 h\"",
        ));
    }
    let hours_per_start = t.declared_at(ctx, KEYS, "costs.hours_per_start")?;
    let overhaul_starts = t.declared_at(ctx, KEYS, "costs.overhaul_starts")?;
    if overhaul_starts > 0.0 && overhaul_interval_hours <= 0.0 {
        return Err(t.error(
            ctx,
            "overhaul_starts",
            "is given but overhaul_interval is 0 h",
            "expected an overhaul_interval above 0 h (in equivalent hours), e.g. \"24000 h\"",
        ));
    }
    let overhaul_outage_days = t.declared_at(ctx, KEYS, "costs.overhaul_outage_days")?;
    if overhaul_outage_days > 0.0 && overhaul_interval_hours <= 0.0 {
        return Err(t.error(
            ctx,
            "overhaul_outage_days",
            "is given but overhaul_interval is 0 h",
            "expected an overhaul_interval above 0 h, e.g. \"24000 h\"",
        ));
    }
    let output_degradation_per_year =
        t.declared_at(ctx, KEYS, "costs.output_degradation_per_year")?;
    let start_fuel_gj = t.declared_at(ctx, KEYS, "costs.start_fuel")?;
    let start_cost = money_or_zero(ctx, &t, "start_cost", units::money, "")?;
    let service_fee_per_fired_hour =
        money_or_zero(ctx, &t, "service_per_fired_hour", units::money, "")?;
    let service_fee_per_start = money_or_zero(ctx, &t, "service_per_start", units::money, "")?;
    let degradation_per_year = t.declared_at(ctx, KEYS, "costs.degradation_per_year")?;
    let recoverable_fraction = t.declared_at(ctx, KEYS, "costs.recoverable_fraction")?;
    let residual_value = read_residual(ctx, &t)?;
    let construction_schedule = read_schedule(ctx, &t, cod)?;
    Ok(CandidateCosts {
        fixed_om_per_kw_year,
        variable_om_per_mwh,
        overhaul_interval_hours,
        overhaul_cost,
        hours_per_start,
        overhaul_starts,
        overhaul_outage_days,
        output_degradation_per_year,
        start_fuel_gj,
        start_cost,
        service_fee_per_fired_hour,
        service_fee_per_start,
        degradation_per_year,
        recoverable_fraction,
        residual_value,
        construction_schedule,
    })
}

/// Residual value: a fraction of capital (`"10 %"`, `0.1`) or an amount
/// with a currency (`"2500000 USD"`).
fn read_residual(ctx: &mut Context, t: &TableReader) -> Read<ResidualValue> {
    let Some(node) = t.entry("residual_value").map(|e| &e.node) else {
        t.default(ctx, "residual_value", "0 %");
        return Ok(ResidualValue::FractionOfCapital(0.0));
    };
    let text = super::reader::quantity_text(ctx, node);
    if units::kind_of(&text) == Some(Kind::Money) {
        let value = t
            .quantity(ctx, "residual_value", units::money)?
            .ok_or_else(|| t.missing(ctx, "residual_value", "expected an amount"))?;
        return Ok(ResidualValue::Amount(in_currency(
            ctx,
            t,
            "residual_value",
            value,
        )?));
    }
    let fraction = t
        .quantity(ctx, "residual_value", units::fraction)
        .map_err(|_| {
            t.error(
                ctx,
                "residual_value",
                format!("{text:?} is neither a fraction of capital nor an amount of money"),
                "expected a fraction such as \"10 %\" or an amount such as \"2500000 USD\"",
            )
        })?;
    Ok(ResidualValue::FractionOfCapital(fraction.unwrap_or(0.0)))
}

/// `construction = [{ date = 2026-01-15, fraction = "40 %" }, …]`: dates
/// ascending, on or before commercial operation, fractions summing to 1.
fn read_schedule(
    ctx: &mut Context,
    t: &TableReader,
    cod: NaiveDate,
) -> Read<Vec<(NaiveDate, f64)>> {
    let Some(node) = t.node(ctx, "construction") else {
        t.default(ctx, "construction", "all capital at commercial operation");
        return Ok(Vec::new());
    };
    let field = t.field("construction");
    let NodeValue::Array(items) = &node.value else {
        return Err(type_error(
            ctx,
            &field,
            node,
            "an array such as [{ date = 2026-01-15, fraction = \"40 %\" }]",
        ));
    };
    let mut schedule: Vec<(NaiveDate, f64)> = Vec::with_capacity(items.len());
    for (i, item) in items.iter().enumerate() {
        let b = TableReader::new(
            ctx,
            &format!("{field}[{}]", i + 1),
            item,
            &["date", "fraction"],
        )?;
        let date_node = b
            .node(ctx, "date")
            .ok_or_else(|| b.missing(ctx, "date", "expected a date written YYYY-MM-DD"))?;
        let date = date_of_node(ctx, &b.field("date"), date_node)?;
        if date > cod {
            return Err(b.error(
                ctx,
                "date",
                format!("{date} is after commercial operation on {cod}"),
                "expected construction payments on or before commercial operation",
            ));
        }
        if schedule
            .last()
            .is_some_and(|(previous, _)| date <= *previous)
        {
            return Err(b.error(
                ctx,
                "date",
                format!("{date} is not after the payment before it"),
                "expected dates in ascending order",
            ));
        }
        let fraction = b.required_quantity(
            ctx,
            "fraction",
            units::fraction,
            "expected a fraction of capital such as \"40 %\"",
        )?;
        if !(fraction > 0.0 && fraction <= 1.0) {
            return Err(b.error(
                ctx,
                "fraction",
                format!("{fraction} is not a fraction of capital in (0, 1]"),
                "expected e.g. \"40 %\"",
            ));
        }
        schedule.push((date, fraction));
    }
    let sum: f64 = schedule.iter().map(|(_, f)| f).sum();
    if (sum - 1.0).abs() > SCHEDULE_SUM_TOLERANCE {
        return Err(ctx.error_at_offset(
            node.span.start,
            &field,
            format!("the fractions sum to {}", (sum * 1e12).round() / 1e12),
            "expected fractions of capital summing to 1 (100 %)",
        ));
    }
    Ok(schedule)
}
