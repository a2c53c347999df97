//! One candidate through the whole chain: cycle → a year of operation →
//! ledger inputs. The ledger itself is generic over its number type, so the
//! same inputs serve the printed (decimal) ledger and the sampled (`f64`)
//! one.

use super::engine::{detail_of, engine_config_of, gas_model_of, solve_error};
use super::operation::{annual_operation, AnnualOperation};
use crate::cycle::{self, CycleResult};
use crate::finance::{
    self, Capital, CapitalPayment, Carbon, Degradation, EscalatingPrice, FuelPrice, LedgerInputs,
    Overhaul, Rates, Replacement, Residual,
};
use crate::fuel::Fuel;
use crate::scenario::{
    Candidate, LoadedScenario, PriceBasis, RateBasis, ResidualValue, Scenario, Timing,
};
use rust_decimal::Decimal;

/// A candidate's solved cycle and its year of operation.
#[derive(Debug, Clone)]
pub struct Solved {
    /// The solved cycle at site conditions (the site's humidity, the
    /// candidate's turbine cooling), sized to the rated output.
    pub cycle: CycleResult,
    /// One full year at new-and-clean performance.
    pub year: AnnualOperation,
}

/// Solve a candidate's cycle and its year of operation. The error is the
/// solver's, for the caller to place.
pub fn solve(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
) -> Result<Solved, cycle::CycleError> {
    let config = engine_config_of(candidate, &scenario.site);
    let detail = detail_of(candidate, &scenario.site);
    let result =
        cycle::solve_detailed(&config, &detail, &gas_model_of(&candidate.gas_model), fuel)?;
    let year = annual_operation(
        &scenario.operation,
        candidate.net_output_kw,
        result.heat_rate_kj_per_kwh,
    );
    Ok(Solved {
        cycle: result,
        year,
    })
}

/// Like [`solve`], with a refusal placed at the candidate's key in the file.
pub fn solve_at(loaded: &LoadedScenario, index: usize, fuel: &Fuel) -> crate::Result<Solved> {
    let scenario = &loaded.scenario;
    solve(scenario, &scenario.candidates[index], fuel).map_err(|e| solve_error(loaded, index, &e))
}

/// The output every candidate of a scenario is levelled to: the most any
/// candidate delivers. A candidate that delivers less buys the difference
/// elsewhere (common practice in bid evaluation), so all are compared on
/// equal deliveries.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct OutputReference {
    /// Largest net energy of a full year among the candidates, MWh.
    pub energy_mwh: f64,
    /// Largest rated net output among the candidates, kW.
    pub net_output_kw: f64,
}

/// The scenario's output reference. A year's energy depends only on the
/// rated output and the scenario's operation (hours or dispatch profile),
/// not on the heat rate ([`annual_operation`]), so no cycle is solved:
/// the reference always follows the scenario as it stands, including any
/// rating changed by a sweep or a sample.
pub fn output_reference(scenario: &Scenario) -> OutputReference {
    scenario.candidates.iter().fold(
        OutputReference {
            energy_mwh: 0.0,
            net_output_kw: 0.0,
        },
        |most, c| OutputReference {
            energy_mwh: most
                .energy_mwh
                .max(annual_operation(&scenario.operation, c.net_output_kw, 0.0).energy_mwh),
            net_output_kw: most.net_output_kw.max(c.net_output_kw),
        },
    )
}

/// A candidate's shortfall against `reference`, priced at the scenario's
/// `energy_value` and `capacity_value` (constant in the analysis basis's
/// money, like the candidates' O&M prices). A candidate above the reference
/// (one set apart from the scenario's list) has no shortfall.
fn replacement(
    scenario: &Scenario,
    candidate: &Candidate,
    year: &AnnualOperation,
    reference: &OutputReference,
) -> Replacement<Decimal> {
    let e = &scenario.economics;
    Replacement {
        energy_mwh_per_year: (reference.energy_mwh - year.energy_mwh).max(0.0),
        energy_price: EscalatingPrice {
            price: e.energy_value_per_mwh,
            escalation: 0.0,
        },
        capacity_kw: (reference.net_output_kw - candidate.net_output_kw).max(0.0),
        capacity_price: EscalatingPrice {
            price: e.capacity_value_per_kw_year,
            escalation: 0.0,
        },
    }
}

/// The ledger inputs of a candidate whose year of operation is `year`,
/// levelled on output to the scenario's [`output_reference`] (an output
/// replacement stream for its shortfall in energy and capacity).
pub fn ledger_inputs(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
    year: &AnnualOperation,
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
        capital,
        operation: finance::Operation {
            operating_hours: year.operating_hours,
            energy_mwh: year.energy_mwh,
            fuel_energy_gj_lhv: year.fuel_energy_gj_lhv,
            net_output_kw: candidate.net_output_kw,
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
        overhaul: (costs.overhaul_interval_hours > 0.0).then_some(Overhaul {
            interval_hours: costs.overhaul_interval_hours,
            cost: costs.overhaul_cost,
            escalation: 0.0,
        }),
        degradation: Degradation {
            heat_rate_fraction_per_year: costs.degradation_per_year,
            recoverable_fraction: costs.recoverable_fraction,
        },
        residual: Residual {
            value: match costs.residual_value {
                ResidualValue::FractionOfCapital(f) => finance::ResidualValue::FractionOfCapital(f),
                ResidualValue::Amount(a) => finance::ResidualValue::Amount(a),
            },
            escalation: 0.0,
        },
        replacement: replacement(scenario, candidate, year, &output_reference(scenario)),
        acceptance_settlement: finance::AcceptanceSettlement::default(),
    })
}
