//! One candidate through the whole chain: cycle → a year of operation →
//! ledger inputs. The ledger itself is generic over its number type, so the
//! same inputs serve the printed (decimal) ledger and the sampled (`f64`)
//! one.

use super::engine::{detail_of, engine_config_of, gas_model_of, solve_error};
use super::operation::{condition_energy_mwh, conditions, year_from, AnnualOperation};
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
/// ([`super::operation::conditions`] of the scenario, each at the
/// candidate's performance there).
pub fn year_of(scenario: &Scenario, site: &SitePerformance) -> AnnualOperation {
    year_from(&conditions(scenario), &site.points)
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
    let scenario = &loaded.scenario;
    if e.load.is_some() && e.error.is_input_error() {
        let key = if scenario.operation.profile.is_some() {
            "operation.profile"
        } else {
            "operation.dispatch"
        };
        return loaded.error_at(key, &e.to_string());
    }
    if e.error.field().is_some_and(|f| f.starts_with("ambient")) && e.error.is_input_error() {
        let key = if scenario.site.weather.is_some() {
            "site.weather"
        } else {
            "site"
        };
        return loaded.error_at(key, &e.to_string());
    }
    super::machine::calibration_error(loaded, index, &e.error)
}

/// The output every candidate of a scenario is levelled to: the most any
/// candidate delivers. A candidate that delivers less buys the difference
/// elsewhere (common practice in bid evaluation), so all are compared on
/// equal deliveries.
#[derive(Debug, Clone, PartialEq)]
pub struct OutputReference {
    /// Largest net energy of a full year among the candidates, MWh.
    pub energy_mwh: f64,
    /// Largest capacity credited among the candidates (base-load output at
    /// the capacity temperature, or at the site), kW.
    pub net_output_kw: f64,
    /// With an hourly profile that prices every run hour: each candidate's
    /// energy shortfall price, currency per MWh, by candidate id (see
    /// [`output_reference_of`]). Empty otherwise: the shortfall is priced
    /// at `economics.energy_value`.
    pub shortfall_prices: Vec<(String, f64)>,
}

/// The output reference of a scenario's solved candidates (in candidate
/// order; `None` for one not solved, which counts as delivering nothing).
/// Each candidate's year comes from its own performance in every condition
/// of the year, so energy differs by candidate.
///
/// Hourly prices (an `[operation] profile` with `energy_price_per_MWh` in
/// every run hour): the shortfall of candidate c is priced at the hours'
/// prices weighted by its hourly shortfall against the candidate r with
/// the most annual energy, price_c = Σ_h p_h · max(0, E_r,h − E_c,h) /
/// Σ_h max(0, E_r,h − E_c,h); hours where c makes more than r are not
/// netted. Without such a shortfall (c is r) `economics.energy_value`.
pub fn output_reference_of<'a>(
    scenario: &Scenario,
    solved: impl IntoIterator<Item = Option<&'a Solved>>,
) -> OutputReference {
    // The conditions are read only for hourly prices.
    let priced = scenario
        .operation
        .profile
        .as_ref()
        .is_some_and(|p| p.has_prices());
    let conditions = if priced {
        conditions(scenario)
    } else {
        Vec::new()
    };
    let sites = solved
        .into_iter()
        .map(|s| s.map(|s| (&s.site, s.year.energy_mwh)));
    output_reference_from(scenario, &conditions, sites)
}

/// [`output_reference_of`] with the scenario's year conditions already
/// built ([`super::operation::conditions`]) and each site's annual energy
/// (MWh) already summed. The conditions are read only for hourly prices.
pub fn output_reference_from<'a>(
    scenario: &Scenario,
    conditions: &[super::operation::Condition],
    sites: impl IntoIterator<Item = Option<(&'a SitePerformance, f64)>>,
) -> OutputReference {
    let sites: Vec<_> = sites.into_iter().collect();
    let mut reference = OutputReference {
        energy_mwh: 0.0,
        net_output_kw: 0.0,
        shortfall_prices: Vec::new(),
    };
    let mut most: Option<(usize, f64)> = None;
    for (i, site) in sites.iter().enumerate() {
        let Some((site, energy)) = *site else {
            continue;
        };
        if most.is_none_or(|(_, e)| energy > e) {
            most = Some((i, energy));
        }
        reference.energy_mwh = reference.energy_mwh.max(energy);
        reference.net_output_kw = reference.net_output_kw.max(site.capacity_output_kw);
    }
    let priced = scenario
        .operation
        .profile
        .as_ref()
        .is_some_and(|p| p.has_prices());
    let top = most.and_then(|(i, _)| sites[i]).map(|(s, _)| s);
    if let (true, Some(top)) = (priced, top) {
        let top_energy = condition_energy_mwh(conditions, &top.points);
        for (candidate, site) in scenario.candidates.iter().zip(&sites) {
            let Some((site, _)) = site else { continue };
            let own = condition_energy_mwh(conditions, &site.points);
            let (mut short, mut value) = (0.0, 0.0);
            for ((c, r), e) in conditions.iter().zip(&top_energy).zip(&own) {
                let gap = (r - e).max(0.0);
                short += gap;
                value += gap * c.energy_price_per_mwh.unwrap_or(0.0);
            }
            if short > 0.0 {
                reference
                    .shortfall_prices
                    .push((candidate.id.clone(), value / short));
            }
        }
    }
    reference
}

/// The scenario's output reference from each candidate's fixed machine at
/// the site: every candidate is solved. The error is the first candidate's
/// that cannot be.
pub fn output_reference(scenario: &Scenario, fuel: &Fuel) -> Result<OutputReference, SolveError> {
    let solved = scenario
        .candidates
        .iter()
        .map(|c| solve(scenario, c, fuel))
        .collect::<Result<Vec<_>, _>>()?;
    Ok(output_reference_of(scenario, solved.iter().map(Some)))
}

/// A candidate's shortfall against `reference`: energy priced at its
/// hourly shortfall price when the reference has one, else at the
/// scenario's `energy_value`; capacity at `capacity_value` (constant in the
/// analysis basis's money, like the candidates' O&M prices). A candidate
/// above the reference (one set apart from the scenario's list) has no
/// shortfall.
fn bought_in(
    scenario: &Scenario,
    candidate: &Candidate,
    capacity_kw: f64,
    year: &AnnualOperation,
    reference: &OutputReference,
) -> Result<BoughtIn<Decimal>, finance::FinanceError> {
    let e = &scenario.economics;
    let energy_price = match reference
        .shortfall_prices
        .iter()
        .find(|(id, _)| *id == candidate.id)
    {
        Some((_, price)) => finance::convert_physics_to_money(*price, "hourly energy price")?,
        None => e.energy_value_per_mwh,
    };
    Ok(BoughtIn {
        energy_mwh_per_year: (reference.energy_mwh - year.energy_mwh).max(0.0),
        energy_price: EscalatingPrice {
            price: energy_price,
            escalation: 0.0,
        },
        capacity_kw: (reference.net_output_kw - capacity_kw).max(0.0),
        capacity_price: EscalatingPrice {
            price: e.capacity_value_per_kw_year,
            escalation: 0.0,
        },
    })
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
/// capacity credited `site_output_kw` (base-load output at the capacity
/// temperature, [`SitePerformance::capacity_output_kw`]), levelled on output to
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
        bought_in: bought_in(scenario, candidate, site_output_kw, year, reference)?,
        acceptance_settlement: finance::AcceptanceSettlement::default(),
    })
}
