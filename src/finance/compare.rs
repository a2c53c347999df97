//! Metrics of a candidate against a baseline (ASTM E1074 net savings, E964
//! savings-to-investment ratio, E1057 adjusted internal rate of return), and
//! the break-even premium and fuel price, solved exactly by linearity.
//!
//! Cost classes (documented choice): "investment" is capital plus the
//! guarantee settlement at the acceptance test (damages received are
//! negative capital) plus the (negative) residual credit; "operating" is fuel, carbon, fixed and
//! variable O&M, overhauls and energy and capacity bought in (overhauls count as
//! repair, an OM&R cost in the terms of NIST Handbook 135, not as capital
//! bought_in; energy and capacity bought in is energy and capacity bought each year
//! to make up a shortfall, an operating cost).

use super::inputs::FuelPrice;
use super::ledger::{Ledger, LedgerSummary};
use super::money::Money;
use super::payback::{payback, Payback, PaybackKind};
use super::rate_of_return::internal_rate_of_return;
use super::FinanceError;

/// Fuel price at which candidate and baseline have equal lifecycle cost.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct BreakEvenFuelPrice<M: Money> {
    /// Factor applied to every fuel price of both analyses (the base price
    /// and escalation path, or each entry of a price path). May be negative:
    /// then no real price makes the two equal, and the candidate is better
    /// (or worse) at every price.
    pub multiplier: M,
}

impl<M: Money> BreakEvenFuelPrice<M> {
    /// `price` scaled to break even; `None` on overflow.
    pub fn apply(&self, price: &FuelPrice<M>) -> Option<FuelPrice<M>> {
        Some(match price {
            FuelPrice::Escalating {
                price_per_gj,
                escalation,
            } => FuelPrice::Escalating {
                price_per_gj: price_per_gj.mul_checked(self.multiplier)?,
                escalation: *escalation,
            },
            FuelPrice::Path(path) => FuelPrice::Path(
                path.iter()
                    .map(|(year, p)| Some((*year, p.mul_checked(self.multiplier)?)))
                    .collect::<Option<Vec<_>>>()?,
            ),
        })
    }
}

/// Savings metrics of a candidate against a baseline, from their totals.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Savings<M: Money> {
    /// Net savings (ASTM E1074): baseline lifecycle cost minus candidate
    /// lifecycle cost. Positive: the candidate is cheaper over its life.
    pub net_savings: M,
    /// Present value of operating costs saved (baseline minus candidate).
    pub operating_savings: M,
    /// Present value of added investment net of residual value (candidate
    /// minus baseline).
    pub added_investment: M,
    /// Savings-to-investment ratio (ASTM E964): `operating_savings /
    /// added_investment`. `None` when the added investment is zero or
    /// negative: the ratio is then undefined (no investment to recover).
    pub savings_to_investment: Option<M>,
    /// Adjusted internal rate of return (ASTM E1057), per year on the
    /// analysis basis: `(1 + d)·SIR^(1/n) − 1` with `n` the service life in
    /// years. `None` when the SIR is undefined or not positive.
    pub adjusted_irr: Option<f64>,
    /// Undiscounted capital of the candidate minus that of the baseline.
    pub premium_asked: M,
    /// The capital premium over the baseline's capital at which net savings
    /// would be exactly zero, with the candidate's schedule scaled to carry
    /// it and a fractional residual value following it. `None` when the
    /// candidate's lifecycle cost does not depend on its capital.
    pub break_even_premium: Option<M>,
    /// Fuel price at which the lifecycle costs are equal; `None` when both
    /// fuel bills have the same present value.
    pub break_even_fuel_price: Option<BreakEvenFuelPrice<M>>,
}

fn overflow(stream: &'static str, summary: &LedgerSummary<impl Money>) -> FinanceError {
    FinanceError::Overflow {
        stream,
        year: summary.analysis.calendar.operating_years().0,
    }
}

/// Savings metrics of `candidate` against `baseline`. Errors if the two were
/// built on different calendars, rates or timing.
pub fn compare_summaries<M: Money>(
    candidate: &LedgerSummary<M>,
    baseline: &LedgerSummary<M>,
) -> Result<Savings<M>, FinanceError> {
    candidate.analysis.check_comparable(&baseline.analysis)?;
    let err = |stream| overflow(stream, candidate);
    let net_savings = baseline
        .lifecycle_cost
        .sub_checked(candidate.lifecycle_cost)
        .ok_or_else(|| err("net savings"))?;
    let operating = |s: &LedgerSummary<M>| s.present_value.operating();
    let investment = |s: &LedgerSummary<M>| s.present_value.investment();
    let operating_savings = operating(baseline)
        .zip(operating(candidate))
        .and_then(|(b, c)| b.sub_checked(c))
        .ok_or_else(|| err("operating savings"))?;
    let added_investment = investment(candidate)
        .zip(investment(baseline))
        .and_then(|(c, b)| c.sub_checked(b))
        .ok_or_else(|| err("added investment"))?;
    let savings_to_investment = if added_investment > M::ZERO {
        operating_savings.div_checked(added_investment)
    } else {
        None
    };
    let years = f64::from(candidate.analysis.calendar.service_life_years);
    let adjusted_irr = savings_to_investment
        .map(Money::to_f64)
        .filter(|sir| *sir > 0.0 && sir.is_finite())
        .map(|sir| (1.0 + candidate.analysis.rates.discount_rate) * sir.powf(1.0 / years) - 1.0);
    let premium_asked = candidate
        .capital_total
        .sub_checked(baseline.capital_total)
        .ok_or_else(|| err("premium asked"))?;
    // LCC_c(C) = LCC_c + (C − C_c)·m_c, so net savings vanish at
    // C = C_c + NS/m_c; the premium is that minus the baseline's capital.
    let break_even_premium = net_savings
        .div_checked(candidate.pv_per_unit_capital)
        .and_then(|extra| premium_asked.add_checked(extra));
    // LCC_x(s) = LCC_x + (s − 1)·F_x with F_x the fuel bill's present value:
    // equal at s = 1 + NS/(F_c − F_b).
    let break_even_fuel_price = candidate
        .present_value
        .fuel_cost
        .sub_checked(baseline.present_value.fuel_cost)
        .and_then(|difference| net_savings.div_checked(difference))
        .and_then(|extra| M::ONE.add_checked(extra))
        .map(|multiplier| BreakEvenFuelPrice { multiplier });
    Ok(Savings {
        net_savings,
        operating_savings,
        added_investment,
        savings_to_investment,
        adjusted_irr,
        premium_asked,
        break_even_premium,
        break_even_fuel_price,
    })
}

/// Every metric of a candidate against a baseline.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Comparison<M: Money> {
    /// Metrics from the totals.
    pub savings: Savings<M>,
    /// Simple payback (ASTM E1121), undiscounted.
    pub simple_payback: Payback,
    /// Discounted payback (ASTM E1121).
    pub discounted_payback: Payback,
    /// Internal rate of return of the incremental cash flows (candidate
    /// instead of baseline), per year on the analysis basis; `None` when the
    /// flows have no root between −99 % and 1 000 000 % per year.
    pub internal_rate_of_return: Option<f64>,
}

/// Every metric of `candidate` against `baseline`, from their full ledgers.
pub fn compare_ledgers<M: Money>(
    candidate: &Ledger<M>,
    baseline: &Ledger<M>,
) -> Result<Comparison<M>, FinanceError> {
    let savings = compare_summaries(&candidate.summary, &baseline.summary)?;
    Ok(Comparison {
        savings,
        simple_payback: payback(candidate, baseline, PaybackKind::Simple)?,
        discounted_payback: payback(candidate, baseline, PaybackKind::Discounted)?,
        internal_rate_of_return: internal_rate_of_return(candidate, baseline),
    })
}
