//! Each candidate's starts and maintenance as its ledger prices them, for
//! `check`: starts, start fuel and cost, what decides the overhaul and the
//! years it falls in, outage days, service fees and degradation.

use super::compare::Study;
use crate::finance::{LedgerInputs, RowKind};
use rust_decimal::Decimal;

/// Which limit brings an overhaul due first.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum OverhaulLimit {
    /// Equivalent operating hours (fired hours + starts × hours per start)
    /// reach the interval first.
    EquivalentHours,
    /// The starts limit (`overhaul_starts`) is reached first.
    Starts,
}

/// When a candidate's overhauls fall and what each costs in time and money.
#[derive(Debug, Clone, PartialEq)]
pub struct OverhaulTiming {
    /// Equivalent operating hours between overhauls.
    pub interval_equivalent_hours: f64,
    /// Equivalent hours counted per start.
    pub hours_per_start: f64,
    /// Equivalent hours accrued per full year in service (fired hours +
    /// starts × `hours_per_start`).
    pub equivalent_hours_per_year: f64,
    /// Starts between overhauls, when a starts limit is given.
    pub interval_starts: Option<f64>,
    /// The limit that governs.
    pub decided_by: OverhaulLimit,
    /// Years of operation (at full-year hours and starts) between overhauls.
    pub years_between: f64,
    /// Fired hours between overhauls.
    pub fired_hours_between: f64,
    /// Calendar years of the ledger's operating rows with an overhaul, and
    /// how many fall in each (as the ledger charges them).
    pub years: Vec<(i32, u32)>,
    /// Days out of service per overhaul.
    pub outage_days: f64,
    /// Cost of one overhaul at the base date.
    pub cost: Decimal,
}

/// A candidate's starts and maintenance figures as priced.
#[derive(Debug, Clone, PartialEq)]
pub struct StartsMaintenance {
    /// The candidate's id.
    pub candidate_id: String,
    /// Fired hours per full year (new and clean, before outages).
    pub fired_hours_per_year: f64,
    /// Starts per full year.
    pub starts_per_year: f64,
    /// Fuel per start, GJ on the lower heating value.
    pub start_fuel_gj_lhv: f64,
    /// Cost per start at the base date.
    pub start_cost: Decimal,
    /// The overhaul schedule; `None` when the candidate has no overhauls
    /// or does not run.
    pub overhaul: Option<OverhaulTiming>,
    /// Service-agreement fee per fired hour at the base date.
    pub service_per_fired_hour: Decimal,
    /// Service-agreement fee per start at the base date.
    pub service_per_start: Decimal,
    /// Heat-rate degradation per year of operation (fraction).
    pub heat_rate_degradation_per_year: f64,
    /// Output degradation per year of operation (fraction).
    pub output_degradation_per_year: f64,
    /// Share of degradation each overhaul recovers (fraction).
    pub recoverable_fraction: f64,
}

/// Every candidate's starts and maintenance, in scenario order, read from
/// the ledger inputs and ledger of `study` (so exactly what is priced).
pub fn starts_and_maintenance(
    scenario: &crate::scenario::Scenario,
    study: &Study,
) -> Vec<StartsMaintenance> {
    scenario
        .candidates
        .iter()
        .zip(&study.outcomes)
        .map(|(candidate, outcome)| {
            let years = outcome
                .ledger
                .rows
                .iter()
                .filter(|r| r.kind == RowKind::Operation && r.overhaul_count > 0)
                .map(|r| (r.year, r.overhaul_count))
                .collect();
            of_inputs(&candidate.id, &outcome.inputs, years)
        })
        .collect()
}

/// The figures of one candidate's `inputs`, with the overhaul `years` its
/// ledger charged.
fn of_inputs(id: &str, inputs: &LedgerInputs, years: Vec<(i32, u32)>) -> StartsMaintenance {
    let operation = &inputs.operation;
    let overhaul = inputs.overhaul.and_then(|o| {
        let fired_hours_between = o.operating_hours_between(operation)?;
        let hours = operation.operating_hours;
        let starts = operation.starts_per_year;
        let equivalent_hours_per_year = hours + starts * o.hours_per_start;
        let by_starts = match o.interval_starts {
            Some(limit) if starts > 0.0 => limit / starts,
            _ => f64::INFINITY,
        };
        let by_hours = o.interval_hours / equivalent_hours_per_year;
        Some(OverhaulTiming {
            interval_equivalent_hours: o.interval_hours,
            hours_per_start: o.hours_per_start,
            equivalent_hours_per_year,
            interval_starts: o.interval_starts,
            decided_by: if by_starts < by_hours {
                OverhaulLimit::Starts
            } else {
                OverhaulLimit::EquivalentHours
            },
            years_between: fired_hours_between / hours,
            fired_hours_between,
            years,
            outage_days: o.outage_days,
            cost: o.cost,
        })
    });
    StartsMaintenance {
        candidate_id: id.to_string(),
        fired_hours_per_year: operation.operating_hours,
        starts_per_year: operation.starts_per_year,
        start_fuel_gj_lhv: inputs.starts.fuel_gj_lhv_per_start,
        start_cost: inputs.starts.cost_per_start.price,
        overhaul,
        service_per_fired_hour: inputs.service.per_fired_hour.price,
        service_per_start: inputs.service.per_start.price,
        heat_rate_degradation_per_year: inputs.degradation.heat_rate_fraction_per_year,
        output_degradation_per_year: inputs.degradation.output_fraction_per_year,
        recoverable_fraction: inputs.degradation.recoverable_fraction,
    }
}

/// The date every present value of `study` is stated at (its ledgers share
/// it); `None` for a study without candidates.
pub fn present_value_date(study: &Study) -> Option<chrono::NaiveDate> {
    study
        .outcomes
        .first()
        .map(|o| o.ledger.summary.analysis.present_value_date)
}
