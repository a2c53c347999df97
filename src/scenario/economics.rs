//! The `[economics]` section: dates, service life, discounting, carbon
//! price and the values of capacity and energy.

use super::context::Context;
use super::declare::{keys_in, money_from_f64, money_to_f64, Key, Presence, Shape};
use super::error::ScenarioError;
use super::ranges::{
    Range, AMBIENT_T_K, AMBIENT_T_REASON, PRICE_HIGH, PRICE_REASON, RATE_HIGH, RATE_LOW,
    RATE_REASON,
};
use super::reader::TableReader;
use super::tree::Node;
use super::types::{Economics, PresentValueDate, RateBasis, Scenario, Timing};
use super::values::{checked, money_or_zero, required_date};
use crate::units::{self, Kind};

type Read<T> = Result<T, ScenarioError>;
/// Declarations of this section are keys into the whole [`Scenario`].
type K = Key<Scenario>;

/// The keys of `[economics]`.
pub(crate) const KEYS: &[Key<Scenario>] = &[
    K::plain("economics.commercial_operation", Shape::Date, Presence::Required { example: "2027-06-01" }, "first day of operating year 1"),
    K::number(
        "economics.service_life_years",
        Kind::Number,
        Range::Whole(1, 60),
        Presence::Required { example: "25" },
        "whole years analysed",
        |s| Some(f64::from(s.economics.service_life_years)),
        |s, v| {
            s.economics.service_life_years = v as u32;
            Ok(())
        },
    ),
    K::number(
        "economics.discount_rate",
        Kind::Fraction,
        Range::Rate,
        Presence::Required { example: "\"7 %\"" },
        "yearly discount rate on `rate_basis`",
        |s| Some(s.economics.discount_rate),
        |s, v| {
            s.economics.discount_rate = v;
            Ok(())
        },
    )
    .within(RATE_LOW, RATE_HIGH, "", RATE_REASON),
    K::plain("economics.rate_basis", Shape::Choice(&["real", "nominal"]), Presence::Default { text: "real", value: 0.0 }, "real (constant money of the scenario date) or nominal rates"),
    K::number(
        "economics.inflation",
        Kind::Fraction,
        Range::Rate,
        Presence::Default { text: "0 %", value: 0.0 },
        "yearly general inflation; links real and nominal (Fisher relation)",
        |s| Some(s.economics.inflation),
        |s, v| {
            s.economics.inflation = v;
            Ok(())
        },
    )
    .within(RATE_LOW, RATE_HIGH, "", RATE_REASON),
    K::plain("economics.timing", Shape::Choice(&["end-of-year", "mid-year"]), Presence::Default { text: "end-of-year", value: 0.0 }, "when in each year its cash flows are discounted"),
    K::plain("economics.present_value_date", Shape::Choice(&["commercial-operation", "study"]), Presence::Default { text: "commercial-operation", value: 0.0 }, "the date every present value is stated at: the commercial operation date, or the scenario's `date` (the study date); construction payments before it are compounded to it, later cash discounted; prices still escalate from commercial operation"),
    K::number(
        "economics.carbon_price",
        Kind::PricePerTonne,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "per tonne CO2 in the first year of operation",
        |s| Some(money_to_f64(s.economics.carbon_price_per_tonne)),
        |s, v| {
            s.economics.carbon_price_per_tonne = money_from_f64(v)?;
            Ok(())
        },
    )
    .within(0.0, PRICE_HIGH, "", PRICE_REASON),
    K::number(
        "economics.carbon_escalation",
        Kind::Fraction,
        Range::Rate,
        Presence::Default { text: "0 %", value: 0.0 },
        "yearly carbon price escalation",
        |s| Some(s.economics.carbon_escalation),
        |s, v| {
            s.economics.carbon_escalation = v;
            Ok(())
        },
    )
    .within(RATE_LOW, RATE_HIGH, "", RATE_REASON),
    K::number(
        "economics.capacity_value",
        Kind::PricePerCapacity,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "value of one kW of net output for one year (e.g. `\"40 EUR/kW-yr\"`; also `/MW-yr`): prices each candidate's capacity shortfall (see *Levelling on output*) and the value of one kW in the bid factors",
        |s| Some(money_to_f64(s.economics.capacity_value_per_kw_year)),
        |s, v| {
            s.economics.capacity_value_per_kw_year = money_from_f64(v)?;
            Ok(())
        },
    )
    .within(0.0, PRICE_HIGH, "", PRICE_REASON),
    K::number(
        "economics.energy_value",
        Kind::PricePerEnergy,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "value of one MWh of net energy (e.g. `\"95 EUR/MWh\"`; also `/kWh`): prices each candidate's energy shortfall (see *Levelling on output*)",
        |s| Some(money_to_f64(s.economics.energy_value_per_mwh)),
        |s, v| {
            s.economics.energy_value_per_mwh = money_from_f64(v)?;
            Ok(())
        },
    )
    .within(0.0, PRICE_HIGH, "", PRICE_REASON),
    K::number(
        "economics.capacity_temperature",
        Kind::Temperature,
        Range::Positive,
        Presence::Optional { text: "the site's `ambient_temperature`" },
        "ambient temperature at which capacity is credited (e.g. the summer peak, `\"35 degC\"`): each candidate's base-load output there, at the site's pressure and relative humidity, sets its capacity shortfall (see *Levelling on output*)",
        |s| s.economics.capacity_temperature_k,
        |s, v| {
            s.economics.capacity_temperature_k = Some(v);
            Ok(())
        },
    )
    .within(AMBIENT_T_K.0, AMBIENT_T_K.1, "K", AMBIENT_T_REASON),
];

/// Read `[economics]`.
pub(crate) fn read_economics(ctx: &mut Context, node: &Node) -> Read<Economics> {
    let r = TableReader::new(ctx, "economics", node, &keys_in(KEYS, "economics"))?;
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
    let inflation = r.declared_at(ctx, KEYS, "economics.inflation")?;
    let timing = match r.choice(ctx, "timing", &["end-of-year", "mid-year"], "end-of-year")? {
        "mid-year" => Timing::MidYear,
        _ => Timing::EndOfYear,
    };
    let present_value_date = match r.choice(
        ctx,
        "present_value_date",
        &["commercial-operation", "study"],
        "commercial-operation",
    )? {
        "study" => PresentValueDate::Study,
        _ => PresentValueDate::CommercialOperation,
    };
    let carbon_price_per_tonne =
        money_or_zero(ctx, &r, "carbon_price", units::price_per_tonne, "/t")?;
    let carbon_escalation = r.declared_at(ctx, KEYS, "economics.carbon_escalation")?;
    let capacity_value_per_kw_year = money_or_zero(
        ctx,
        &r,
        "capacity_value",
        units::price_per_kw_year,
        "/kW-yr",
    )?;
    let energy_value_per_mwh =
        money_or_zero(ctx, &r, "energy_value", units::price_per_mwh, "/MWh")?;
    let capacity_temperature_k = match KEYS
        .iter()
        .find(|k| k.path == "economics.capacity_temperature")
    {
        Some(key) => r.declared(ctx, key)?,
        None => None,
    };
    Ok(Economics {
        commercial_operation,
        // Checked above as a whole number from 1 to 60.
        service_life_years: life as u32,
        discount_rate,
        rate_basis,
        inflation,
        timing,
        present_value_date,
        carbon_price_per_tonne,
        carbon_escalation,
        capacity_value_per_kw_year,
        energy_value_per_mwh,
        capacity_temperature_k,
    })
}
