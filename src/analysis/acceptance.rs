//! The contract at the acceptance test: a candidate's guarantee
//! (`[candidate.guarantee]`) settled against its as-built figures, and the
//! machine run as built for its life.
//!
//! - As built: heat rate = guaranteed heat rate × `as_built_heat_rate`,
//!   net output = guaranteed output × `as_built_output`. The machine in
//!   operation is the fixed machine at the site scaled by the same ratios
//!   (its year's energy by the output ratio, its fuel by both), so a
//!   guarantee that defaults to the rating at 100 % runs exactly the site
//!   year. Output short of the scenario's output reference is bought
//!   elsewhere like any other shortfall (the reference stays the site
//!   outputs of the machines as modelled).
//! - Settlement: [`finance::settle`] by the contract (tolerance, rule,
//!   rates, caps on the contract price, which defaults to the capital
//!   cost), paid once at commercial operation as the ledger's settlement
//!   row.
//! - `compare` is the deterministic case: it settles the as-built figures
//!   the file states, 100 % by default, i.e. a machine exactly at its
//!   guarantee, so no damages and no settlement row. `risk` settles each
//!   sample's draw of the as-built keys.

use super::evaluate::{ledger_inputs, OutputReference};
use super::operation::AnnualOperation;
use crate::finance::{
    self, FinanceError, Guarantee, HeatRateRate, LedgerInputs, MeasuredPerformance, Settlement,
    SettlementRates, TestTolerance, ToleranceRule,
};
use crate::fuel::Fuel;
use crate::scenario::{Candidate, CandidateGuarantee, HeatRateDamages, Scenario, ToleranceReading};
use rust_decimal::Decimal;

/// The finance layer's guarantee for a candidate whose rated (modelled)
/// heat rate is `rated_heat_rate_kj_per_kwh`.
pub fn guarantee_of(
    candidate: &Candidate,
    g: &CandidateGuarantee,
    rated_heat_rate_kj_per_kwh: f64,
) -> Guarantee<Decimal> {
    let percent = g.tolerance * 100.0;
    Guarantee {
        net_output_kw: g.net_output_kw.unwrap_or(candidate.net_output_kw),
        heat_rate_kj_per_kwh: g.heat_rate_kj_per_kwh.unwrap_or(rated_heat_rate_kj_per_kwh),
        tolerance: TestTolerance::uniform(percent),
        rule: match g.reading {
            ToleranceReading::BeyondTolerance => ToleranceRule::BeyondBand,
            ToleranceReading::WholeShortfall => ToleranceRule::WholeOnceBeyond,
        },
        damages: SettlementRates {
            heat_rate: match g.damages_heat_rate {
                HeatRateDamages::PerPercent(m) => HeatRateRate::PerPercent(m),
                HeatRateDamages::PerKjPerKwh(m) => HeatRateRate::PerKjPerKwh(m),
            },
            output_per_kw: g.damages_per_kw,
            cap_fraction_of_price: g.damages_cap,
        },
        bonus: SettlementRates {
            heat_rate: HeatRateRate::PerPercent(g.bonus_per_heat_rate_percent),
            output_per_kw: g.bonus_per_kw,
            cap_fraction_of_price: g.bonus_cap,
        },
    }
}

/// A candidate's ledger inputs by its contract: without a guarantee,
/// exactly [`super::evaluate::ledger_inputs`] of its year at the site; with
/// one, the as-built machine's year (the site year's energy scaled by
/// `as_built_output`, its fuel by both ratios) and the settlement row
/// (returned too). `rated_heat_rate_kj_per_kwh` is the heat rate at the
/// rating condition, the guarantee's default.
pub fn contract_inputs(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
    rated_heat_rate_kj_per_kwh: f64,
    (year, site_output_kw): (&AnnualOperation, f64),
    reference: &OutputReference,
) -> Result<(LedgerInputs<Decimal>, Option<Settlement<Decimal>>), FinanceError> {
    let Some(g) = &candidate.guarantee else {
        let inputs = ledger_inputs(scenario, candidate, fuel, (year, site_output_kw), reference)?;
        return Ok((inputs, None));
    };
    let guarantee = guarantee_of(candidate, g, rated_heat_rate_kj_per_kwh);
    let measured = MeasuredPerformance {
        net_output_kw: guarantee.net_output_kw * g.as_built_output,
        heat_rate_kj_per_kwh: guarantee.heat_rate_kj_per_kwh * g.as_built_heat_rate,
    };
    let price = g.contract_price.unwrap_or(candidate.capital_cost);
    let settlement = finance::settle(&guarantee, price, &measured)?;
    let mut built = candidate.clone();
    built.net_output_kw = candidate.net_output_kw * g.as_built_output;
    let built_year = AnnualOperation {
        operating_hours: year.operating_hours,
        energy_mwh: year.energy_mwh * g.as_built_output,
        fuel_energy_gj_lhv: year.fuel_energy_gj_lhv * g.as_built_output * g.as_built_heat_rate,
    };
    let mut inputs = ledger_inputs(
        scenario,
        &built,
        fuel,
        (&built_year, site_output_kw * g.as_built_output),
        reference,
    )?;
    inputs.acceptance_settlement = settlement.to_ledger();
    Ok((inputs, Some(settlement)))
}
