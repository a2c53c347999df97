//! One candidate through the whole chain: cycle → a year of operation →
//! ledger inputs. The ledger itself is generic over its number type, so the
//! same inputs serve the printed (decimal) ledger and the sampled (`f64`)
//! one.

use super::engine::{detail_of, engine_config_of, gas_model_of, solve_error};
use super::operation::{annual_operation, annual_operation_with_ratios, AnnualOperation};
use super::site::{site_performance, SiteError, SitePerformance};
use crate::cycle::{self, CycleResult};
use crate::finance::{
    self, BoughtIn, Capital, CapitalPayment, Carbon, Degradation, EscalatingPrice, FuelPrice,
    LedgerInputs, Overhaul, Rates, Residual, ServiceFees, Starts,
};
use crate::fuel::Fuel;
use crate::scenario::{
    Candidate, LoadedScenario, PresentValueDate, PriceBasis, RateBasis, ResidualValue, Scenario,
    Timing,
};
use rust_decimal::Decimal;

/// A candidate's solved cycle, its performance at the site and its year of
/// operation.
#[derive(Debug, Clone)]
pub struct Solved {
    /// The solved design cycle at site conditions (the site's humidity, the
    /// candidate's turbine cooling), sized to the rated output: the cycle
    /// shown in the report's state table.
    pub cycle: CycleResult,
    /// What is priced: the fixed machine at the site (or the rated
    /// figures, for a candidate the fixed-machine model refuses).
    pub site: SitePerformance,
    /// One full year at new-and-clean performance, from `site`.
    pub year: AnnualOperation,
}

/// Why a candidate cannot be solved.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum SolveError {
    /// The design cycle does not solve.
    #[error("{0}")]
    Cycle(crate::cycle::CycleError),
    /// The fixed machine cannot run at the site or a dispatch load.
    #[error("{0}")]
    Site(SiteError),
}

/// The year of a candidate whose site performance is `site`.
pub fn year_of(scenario: &Scenario, site: &SitePerformance) -> AnnualOperation {
    annual_operation_with_ratios(
        &scenario.operation,
        site.net_output_kw,
        site.heat_rate_kj_per_kwh,
        &site.block_ratios,
    )
}

/// Solve a candidate's cycle, its fixed machine at the site and its year of
/// operation. The error is the solver's, for the caller to place.
pub fn solve(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
) -> Result<Solved, SolveError> {
    let config = engine_config_of(candidate, &scenario.site);
    let detail = detail_of(candidate, &scenario.site);
    let result = cycle::solve_detailed(&config, &detail, &gas_model_of(&candidate.gas_model), fuel)
        .map_err(SolveError::Cycle)?;
    let site = site_performance(scenario, candidate, fuel, &result).map_err(SolveError::Site)?;
    let year = year_of(scenario, &site);
    Ok(Solved {
        cycle: result,
        site,
        year,
    })
}

/// Like [`solve`], with a refusal placed at the candidate's key in the file
/// (a dispatch load the machine cannot run at, at `operation.dispatch`).
pub fn solve_at(loaded: &LoadedScenario, index: usize, fuel: &Fuel) -> crate::Result<Solved> {
    let scenario = &loaded.scenario;
    solve(scenario, &scenario.candidates[index], fuel).map_err(|e| match e {
        SolveError::Cycle(e) => solve_error(loaded, index, &e),
        SolveError::Site(e) => site_error(loaded, index, &e),
    })
}

/// Map a site refusal to an error at the right key.
fn site_error(loaded: &LoadedScenario, index: usize, e: &SiteError) -> crate::Error {
    if e.load.is_some() && e.error.is_input_error() {
        return loaded.error_at("operation.dispatch", &e.to_string());
    }
    if e.error.field().is_some_and(|f| f.starts_with("ambient")) && e.error.is_input_error() {
        return loaded.error_at("site", &e.to_string());
    }
    super::machine::calibration_error(loaded, index, &e.error)
}

/// The output every candidate of a scenario is levelled to: the most any
/// candidate delivers. A candidate that delivers less buys the difference
/// elsewhere (common practice in bid evaluation), so all are compared on
/// equal deliveries.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct OutputReference {
    /// Largest net energy of a full year among the candidates, MWh.
    pub energy_mwh: f64,
    /// Largest base-load net output at the site among the candidates, kW.
    pub net_output_kw: f64,
}

/// The output reference of candidates whose base-load outputs at the site
/// are `outputs_kw`: a year's energy depends only on that output and the
/// scenario's operation (hours or dispatch profile), not on the heat rate
/// ([`annual_operation`]).
pub fn output_reference_of(
    scenario: &Scenario,
    outputs_kw: impl IntoIterator<Item = f64>,
) -> OutputReference {
    outputs_kw.into_iter().fold(
        OutputReference {
            energy_mwh: 0.0,
            net_output_kw: 0.0,
        },
        |most, kw| OutputReference {
            energy_mwh: most
                .energy_mwh
                .max(annual_operation(&scenario.operation, kw, 0.0).energy_mwh),
            net_output_kw: most.net_output_kw.max(kw),
        },
    )
}

/// The scenario's output reference from each candidate's fixed machine at
/// the site: every candidate is solved. The error is the first candidate's
/// that cannot be.
pub fn output_reference(scenario: &Scenario, fuel: &Fuel) -> Result<OutputReference, SolveError> {
    let outputs = scenario
        .candidates
        .iter()
        .map(|c| solve(scenario, c, fuel).map(|s| s.site.net_output_kw))
        .collect::<Result<Vec<_>, _>>()?;
    Ok(output_reference_of(scenario, outputs))
}

/// A candidate's shortfall against `reference`, priced at the scenario's
/// `energy_value` and `capacity_value` (constant in the analysis basis's
/// money, like the candidates' O&M prices). A candidate above the reference
/// (one set apart from the scenario's list) has no shortfall.
fn bought_in(
    scenario: &Scenario,
    site_output_kw: f64,
    year: &AnnualOperation,
    reference: &OutputReference,
) -> BoughtIn<Decimal> {
    let e = &scenario.economics;
    BoughtIn {
        energy_mwh_per_year: (reference.energy_mwh - year.energy_mwh).max(0.0),
        energy_price: EscalatingPrice {
            price: e.energy_value_per_mwh,
            escalation: 0.0,
        },
        capacity_kw: (reference.net_output_kw - site_output_kw).max(0.0),
        capacity_price: EscalatingPrice {
            price: e.capacity_value_per_kw_year,
            escalation: 0.0,
        },
    }
}

/// A price constant in the analysis basis's money (like the candidates' O&M
/// prices).
fn constant(price: Decimal) -> EscalatingPrice<Decimal> {
    EscalatingPrice {
        price,
        escalation: 0.0,
    }
}

/// The ledger inputs of a candidate whose year of operation is `year` and
/// base-load output at the site `site_output_kw`, levelled on output to
/// `reference` (an energy and capacity bought in stream for its shortfall in energy
/// and capacity). Fixed O&M stays on the rated net output: it is quoted per
/// kW of rating (common practice) and does not fall on a hot day.
pub fn ledger_inputs(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
    (year, site_output_kw): (&AnnualOperation, f64),
    reference: &OutputReference,
) -> Result<LedgerInputs<Decimal>, finance::FinanceError> {
    let e = &scenario.economics;
    let costs = &candidate.costs;
    let capital = if costs.construction_schedule.is_empty() {
        Capital::AtCommercialOperation(candidate.capital_cost)
    } else {
        Capital::Schedule(
            costs
                .construction_schedule
                .iter()
                .map(|(date, fraction)| {
                    let share: Decimal =
                        finance::convert_physics_to_money(*fraction, "construction fraction")?;
                    Ok(CapitalPayment {
                        date: *date,
                        amount: candidate.capital_cost * share,
                    })
                })
                .collect::<Result<Vec<_>, finance::FinanceError>>()?,
        )
    };
    let price = if scenario.fuel.price_path.is_empty() {
        FuelPrice::Escalating {
            price_per_gj: scenario.fuel.price_per_gj,
            escalation: scenario.fuel.escalation,
        }
    } else {
        FuelPrice::Path(scenario.fuel.price_path.clone())
    };
    Ok(LedgerInputs {
        commercial_operation: e.commercial_operation,
        service_life_years: e.service_life_years,
        rates: Rates {
            discount_rate: e.discount_rate,
            basis: match e.rate_basis {
                RateBasis::Real => finance::RateBasis::Real,
                RateBasis::Nominal => finance::RateBasis::Nominal,
            },
            inflation: e.inflation,
        },
        timing: match e.timing {
            Timing::EndOfYear => finance::Timing::EndOfYear,
            Timing::MidYear => finance::Timing::MidYear,
        },
        present_value_date: match e.present_value_date {
            PresentValueDate::CommercialOperation => None,
            PresentValueDate::Study => Some(scenario.meta.date),
        },
        capital,
        operation: finance::Operation {
            operating_hours: year.operating_hours,
            energy_mwh: year.energy_mwh,
            fuel_energy_gj_lhv: year.fuel_energy_gj_lhv,
            net_output_kw: candidate.net_output_kw,
            starts_per_year: scenario.operation.starts_per_year,
        },
        fuel: finance::Fuel {
            price,
            basis: match scenario.fuel.price_basis {
                PriceBasis::Hhv => finance::PriceBasis::Hhv,
                PriceBasis::Lhv => finance::PriceBasis::Lhv,
            },
            hhv_over_lhv: fuel.hhv_over_lhv(),
        },
        carbon: Carbon {
            co2_kg_per_gj_lhv: fuel.co2_kg_per_gj_lhv(),
            price_per_tonne: e.carbon_price_per_tonne,
            escalation: e.carbon_escalation,
        },
        fixed_om: EscalatingPrice {
            price: costs.fixed_om_per_kw_year,
            escalation: 0.0,
        },
        variable_om: EscalatingPrice {
            price: costs.variable_om_per_mwh,
            escalation: 0.0,
        },
        starts: Starts {
            fuel_gj_lhv_per_start: costs.start_fuel_gj,
            cost_per_start: constant(costs.start_cost),
        },
        service: ServiceFees {
            per_fired_hour: constant(costs.service_fee_per_fired_hour),
            per_start: constant(costs.service_fee_per_start),
        },
        overhaul: (costs.overhaul_interval_hours > 0.0).then_some(Overhaul {
            interval_hours: costs.overhaul_interval_hours,
            hours_per_start: costs.hours_per_start,
            interval_starts: (costs.overhaul_starts > 0.0).then_some(costs.overhaul_starts),
            outage_days: costs.overhaul_outage_days,
            outage_capacity_kw: site_output_kw,
            cost: costs.overhaul_cost,
            escalation: 0.0,
        }),
        degradation: Degradation {
            heat_rate_fraction_per_year: costs.degradation_per_year,
            output_fraction_per_year: costs.output_degradation_per_year,
            recoverable_fraction: costs.recoverable_fraction,
        },
        residual: Residual {
            value: match costs.residual_value {
                ResidualValue::FractionOfCapital(f) => finance::ResidualValue::FractionOfCapital(f),
                ResidualValue::Amount(a) => finance::ResidualValue::Amount(a),
            },
            escalation: 0.0,
        },
        bought_in: bought_in(scenario, site_output_kw, year, reference),
        acceptance_settlement: finance::AcceptanceSettlement::default(),
    })
}
