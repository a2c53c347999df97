//! `check`'s starts-and-maintenance section and present-value line: the
//! figures of [`crate::analysis::maintenance`] as the ledger prices them,
//! fuel in GJ (SI) or MMBtu (US), money in the scenario currency.

use crate::analysis::maintenance::{OverhaulLimit, OverhaulTiming, StartsMaintenance};
use crate::report::format::{self, Quantity as Q};
use crate::report::model::Units;
use crate::scenario::{PresentValueDate, RateBasis, Scenario};
use rust_decimal::Decimal;
use std::fmt::Write;

/// The section: one block per candidate; empty when there are no
/// candidates' figures.
pub(super) fn section(figures: &[StartsMaintenance], currency: &str, units: Units) -> String {
    if figures.is_empty() {
        return String::new();
    }
    let mut out = String::from("Starts and maintenance (as priced)\n");
    for f in figures {
        out.push_str(&candidate(f, currency, units));
    }
    out
}

/// The economics line that states the present-value date and its basis.
pub(super) fn present_value_line(scenario: &Scenario, date: chrono::NaiveDate) -> String {
    let e = &scenario.economics;
    let base = match e.present_value_date {
        PresentValueDate::CommercialOperation => "commercial-operation",
        PresentValueDate::Study => "study",
    };
    let money = match e.rate_basis {
        RateBasis::Real => format!("real money of {}", scenario.meta.date),
        RateBasis::Nominal => "nominal (then-current) money".to_string(),
    };
    format!(
        "          present values at {date} (present_value_date = \"{base}\"): construction \
         payments before it compounded to it, later cash discounted to it; amounts in {money}\n"
    )
}

fn candidate(f: &StartsMaintenance, currency: &str, units: Units) -> String {
    let mut out = String::new();
    let starts = if f.starts_per_year > 0.0 {
        format!(
            "{} starts a year; each start {} (LHV) of fuel and {}",
            format::number(f.starts_per_year, decimals(f.starts_per_year)),
            format::with_unit(
                Q::FuelEnergy,
                f.start_fuel_gj_lhv,
                units,
                decimals(format::in_units(Q::FuelEnergy, f.start_fuel_gj_lhv, units)) as usize
            ),
            amount(f.start_cost, currency)
        )
    } else {
        "no starts".to_string()
    };
    let _ = writeln!(
        out,
        "  {}: {} fired h a year, {starts}",
        f.candidate_id,
        format::number(f.fired_hours_per_year, decimals(f.fired_hours_per_year))
    );
    match &f.overhaul {
        Some(o) => out.push_str(&overhaul(o, f.starts_per_year, currency)),
        None => out.push_str("    no overhaul priced\n"),
    }
    let service = if f.service_per_fired_hour.is_zero() && f.service_per_start.is_zero() {
        "none".to_string()
    } else {
        format!(
            "{} per fired hour, {} per start",
            amount(f.service_per_fired_hour, currency),
            amount(f.service_per_start, currency)
        )
    };
    let _ = writeln!(out, "    service fees {service}");
    let _ = writeln!(
        out,
        "    degradation per year of operation: heat rate {}, output {}; {} recovered at each overhaul",
        percent(f.heat_rate_degradation_per_year),
        percent(f.output_degradation_per_year),
        percent(f.recoverable_fraction)
    );
    out
}

fn overhaul(o: &OverhaulTiming, starts_per_year: f64, currency: &str) -> String {
    let mut out = String::new();
    let equivalent = if o.hours_per_start > 0.0 && starts_per_year > 0.0 {
        format!(
            " (fired h + starts × {} h = {} a year)",
            format::number(o.hours_per_start, decimals(o.hours_per_start)),
            format::number(o.equivalent_hours_per_year, 0)
        )
    } else {
        format!(
            " ({} a year)",
            format::number(o.equivalent_hours_per_year, 0)
        )
    };
    let starts_limit = o.interval_starts.map_or(String::new(), |s| {
        format!(
            " or {} starts, whichever first",
            format::number(s, decimals(s))
        )
    });
    let decided = match o.decided_by {
        OverhaulLimit::EquivalentHours => "equivalent hours decide",
        OverhaulLimit::Starts => "the starts limit decides",
    };
    let _ = writeln!(
        out,
        "    overhaul every {} equivalent h{equivalent}{starts_limit}; {decided}: every {} years ({} fired h)",
        format::number(o.interval_equivalent_hours, 0),
        format::number(o.years_between, decimals(o.years_between)),
        format::number(o.fired_hours_between, 0)
    );
    let count: u32 = o.years.iter().map(|(_, n)| n).sum();
    let years = if o.years.is_empty() {
        "none within the service life".to_string()
    } else {
        let list = o
            .years
            .iter()
            .map(|(year, n)| {
                if *n > 1 {
                    format!("{year} (×{n})")
                } else {
                    year.to_string()
                }
            })
            .collect::<Vec<_>>()
            .join(", ");
        format!("{list} ({count} in the service life)")
    };
    let _ = writeln!(
        out,
        "    overhauls in {years}; {} days out of service and {} each",
        format::number(o.outage_days, decimals(o.outage_days)),
        amount(o.cost, currency)
    );
    out
}

/// An amount as written (no rounding, thousands grouped) with its
/// currency: `"3,900,000 USD"`.
fn amount(value: Decimal, currency: &str) -> String {
    let value = value.normalize();
    format!("{} {currency}", format::grouped(value, value.scale()))
}

/// Decimals that show `value` without rounding away a fraction (up to 3).
fn decimals(value: f64) -> u32 {
    (0..3)
        .find(|&d| {
            let scale = 10f64.powi(d as i32);
            ((value * scale).round() - value * scale).abs() < 1e-9 * scale.max(1.0)
        })
        .unwrap_or(3)
}

/// A fraction as a percentage with up to three decimals, e.g. `0.35 %`.
fn percent(fraction: f64) -> String {
    let p = (fraction * 100.0 * 1000.0).round() / 1000.0;
    format!("{p} %")
}
