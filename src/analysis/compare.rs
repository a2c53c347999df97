//! Every candidate of a scenario through cycle, operation and ledger, and
//! each set against the baseline: the study behind `compare` and `report`.

use super::acceptance::contract_inputs;
use super::engine::fuel_of;
use super::evaluate::{
    ledger_inputs, output_reference_of, solve, solve_at, OutputReference, Solved,
};
use crate::finance::{
    self, bid_factors, build_ledger, compare_ledgers, summarize_ledger, BidFactors, CapacityValue,
    Comparison, Ledger, LedgerInputs,
};
use crate::fuel::Fuel;
use crate::scenario::{Candidate, LoadedScenario, Scenario};
use crate::Error;
use rust_decimal::Decimal;

/// Step of the central differences behind the value of one point: half a
/// percentage point either side of the candidate's figure.
const HALF_POINT: f64 = 0.005;

/// One candidate's full evaluation.
#[derive(Debug, Clone)]
pub struct CandidateOutcome {
    /// Solved cycle and year of operation.
    pub solved: Solved,
    /// The inputs its ledger was built from.
    pub inputs: LedgerInputs<Decimal>,
    /// Its decimal ledger.
    pub ledger: Ledger<Decimal>,
    /// Metrics against the baseline (`None` for the baseline itself).
    pub versus_baseline: Option<Comparison<Decimal>>,
    /// Present values per unit of heat rate and of net output.
    pub bid: BidFactors<Decimal>,
    /// Present value of one percentage point of compressor efficiency,
    /// turbine efficiency and regenerator effectiveness (if fitted).
    pub value_per_point: [Option<Decimal>; 3],
}

/// The whole comparison.
#[derive(Debug, Clone)]
pub struct Study {
    /// The fuel as the solver sees it.
    pub fuel: Fuel,
    /// Index of the baseline in the scenario's candidates.
    pub baseline_index: usize,
    /// One outcome per candidate, in scenario order.
    pub outcomes: Vec<CandidateOutcome>,
}

/// The scenario's fuel, or an input error at `[fuel]`.
pub fn study_fuel(loaded: &LoadedScenario) -> crate::Result<Fuel> {
    fuel_of(&loaded.scenario.fuel).map_err(|m| loaded.error_at("fuel.composition", &m))
}

fn finance_error(
    loaded: &LoadedScenario,
    candidate: &Candidate,
    e: finance::FinanceError,
) -> Error {
    loaded.error_at(
        &format!("candidate[{}]", candidate.id),
        &format!(
            "the lifecycle ledger of `{}` cannot be built: {e}",
            candidate.id
        ),
    )
}

/// Lifecycle cost of `candidate` with the scenario as given (decimal),
/// levelled to `reference` (the study's, so a changed figure moves only this
/// candidate's own costs and shortfall).
fn lifecycle_cost(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
    reference: &OutputReference,
) -> Option<Decimal> {
    let solved = solve(scenario, candidate, fuel).ok()?;
    let inputs = ledger_inputs(
        scenario,
        candidate,
        fuel,
        (&solved.year, solved.site.capacity_output_kw),
        reference,
    )
    .ok()?;
    Some(summarize_ledger(&inputs).ok()?.lifecycle_cost)
}

/// Present value of one percentage point of a component figure: the
/// lifecycle cost saved per point, by central differences of half a point
/// either side (one-sided where the figure sits at its limit of 1).
fn value_of_point(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
    reference: &OutputReference,
    set: impl Fn(&mut Candidate, f64),
    value: f64,
) -> Option<Decimal> {
    let up = (value + HALF_POINT).min(1.0);
    let down = value - HALF_POINT;
    let at = |x: f64| {
        let mut c = candidate.clone();
        set(&mut c, x);
        lifecycle_cost(scenario, &c, fuel, reference)
    };
    let (low_cost, high_cost) = (at(down)?, at(up)?);
    let points = Decimal::try_from((up - down) * 100.0).ok()?;
    if points.is_zero() {
        return None;
    }
    Some((low_cost - high_cost) / points)
}

fn values_per_point(
    scenario: &Scenario,
    c: &Candidate,
    fuel: &Fuel,
    reference: &OutputReference,
) -> [Option<Decimal>; 3] {
    [
        value_of_point(
            scenario,
            c,
            fuel,
            reference,
            |c, x| c.compressor_efficiency = x,
            c.compressor_efficiency,
        ),
        value_of_point(
            scenario,
            c,
            fuel,
            reference,
            |c, x| c.turbine_efficiency = x,
            c.turbine_efficiency,
        ),
        c.regenerator.as_ref().and_then(|r| {
            value_of_point(
                scenario,
                c,
                fuel,
                reference,
                |c, x| {
                    if let Some(r) = c.regenerator.as_mut() {
                        r.effectiveness = x;
                    }
                },
                r.effectiveness,
            )
        }),
    ]
}

/// Run the whole comparison of a loaded scenario.
pub fn run_study(loaded: &LoadedScenario) -> crate::Result<Study> {
    let scenario = &loaded.scenario;
    let fuel = study_fuel(loaded)?;
    let baseline_index = scenario
        .candidates
        .iter()
        .position(|c| c.id == scenario.meta.baseline)
        .ok_or_else(|| {
            loaded.error_at(
                "scenario.baseline",
                &format!(
                    "no candidate has id `{}`; the baseline must be one of the candidate ids",
                    scenario.meta.baseline
                ),
            )
        })?;
    let capacity = CapacityValue {
        per_kw_year: scenario.economics.capacity_value_per_kw_year,
        escalation: 0.0,
    };
    // Every candidate at the site first: the output reference is the most
    // any of them makes there.
    let solved_all = (0..scenario.candidates.len())
        .map(|index| solve_at(loaded, index, &fuel))
        .collect::<crate::Result<Vec<_>>>()?;
    let reference = output_reference_of(scenario, solved_all.iter().map(Some));
    let mut outcomes = Vec::with_capacity(scenario.candidates.len());
    for (candidate, solved) in scenario.candidates.iter().zip(solved_all) {
        // By the contract: the site year without a guarantee, else the
        // as-built machine and its settlement (see `analysis::acceptance`).
        let (inputs, _) = contract_inputs(
            scenario,
            candidate,
            &fuel,
            solved.site.rated_heat_rate_kj_per_kwh,
            (&solved.year, solved.site.capacity_output_kw),
            &reference,
        )
        .map_err(|e| finance_error(loaded, candidate, e))?;
        let ledger = build_ledger(&inputs).map_err(|e| finance_error(loaded, candidate, e))?;
        let bid =
            bid_factors(&inputs, &capacity).map_err(|e| finance_error(loaded, candidate, e))?;
        let value_per_point = values_per_point(scenario, candidate, &fuel, &reference);
        outcomes.push(CandidateOutcome {
            solved,
            inputs,
            ledger,
            versus_baseline: None,
            bid,
            value_per_point,
        });
    }
    // Every ledger is built; now set each against the baseline's.
    let comparisons = outcomes
        .iter()
        .zip(&scenario.candidates)
        .enumerate()
        .filter(|(index, _)| *index != baseline_index)
        .map(|(index, (outcome, candidate))| {
            compare_ledgers(&outcome.ledger, &outcomes[baseline_index].ledger)
                .map(|c| (index, c))
                .map_err(|e| finance_error(loaded, candidate, e))
        })
        .collect::<crate::Result<Vec<_>>>()?;
    for (index, comparison) in comparisons {
        outcomes[index].versus_baseline = Some(comparison);
    }
    Ok(Study {
        fuel,
        baseline_index,
        outcomes,
    })
}
