//! The ledger of one candidate: a row per cash event, with its discount
//! factor and present value, and the totals the metrics are made of.
//!
//! Row order: capital payments (their own rows, dated, time ≤ 0), then the
//! acceptance-test settlement of a guarantee if there is one (on the
//! commercial-operation date), then one operating row per calendar year,
//! then the residual-value credit at the end of life. Every row satisfies `total` = sum of its money columns and
//! `present_value` = `total` × `discount_factor`; the lifecycle cost is the
//! sum of `present_value`.

use chrono::NaiveDate;
use rust_decimal::Decimal;

use super::calendar::Calendar;
use super::money::Money;
use super::rates::{RateBasis, Rates, Timing};
use super::FinanceError;

/// What a ledger row records.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum RowKind {
    /// A capital payment on a single date.
    Capital,
    /// Guarantee damages received (negative) or bonus paid (positive) at the
    /// acceptance test, on the commercial-operation date.
    Settlement,
    /// A period of operation within one calendar year.
    Operation,
    /// The residual-value credit at the end of life.
    Residual,
}

/// One row of the ledger. Physics columns are `f64`; money columns `M`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LedgerRow<M: Money = Decimal> {
    /// What the row records.
    pub kind: RowKind,
    /// Calendar year that labels the row.
    pub year: i32,
    /// First day of the period (the payment date for a single-date row).
    pub period_start: NaiveDate,
    /// Last day of the period, inclusive (the payment date for a single-date
    /// row).
    pub period_end: NaiveDate,
    /// Start of the period in years since commercial operation.
    pub time_start_years: f64,
    /// End of the period (start of the next) in years since commercial
    /// operation; equal to the start for single-date rows.
    pub time_end_years: f64,
    /// Time at which the row's cash is counted (escalated and discounted), in
    /// years since commercial operation.
    pub cash_time_years: f64,
    /// Operating hours in the period.
    pub operating_hours: f64,
    /// Net energy generated in the period, MWh.
    pub energy_mwh: f64,
    /// Starts in the period.
    pub starts: f64,
    /// Fuel energy burned in the period including degradation and start
    /// fuel, GJ (LHV).
    pub fuel_energy_gj: f64,
    /// Mean heat-rate multiplier of the period, `1 + degradation` (1 for a
    /// single-date row).
    pub heat_rate_multiplier: f64,
    /// Mean output lost to degradation in the period, a fraction of the
    /// new-and-clean output.
    pub output_loss: f64,
    /// Share of the period's operation in service (1 less the overhaul
    /// outages' share).
    pub in_service: f64,
    /// Overhauls done in the period.
    pub overhaul_count: u32,
    /// Fuel cost.
    pub fuel_cost: M,
    /// Carbon cost.
    pub carbon_cost: M,
    /// Fixed O&M cost.
    pub fixed_om: M,
    /// Variable O&M cost.
    pub variable_om: M,
    /// Overhaul cost.
    pub overhaul: M,
    /// Energy and capacity bought in: the energy and capacity shortfall bought
    /// elsewhere (see [`BoughtIn`](super::BoughtIn)).
    pub bought_in: M,
    /// Capital paid.
    pub capital: M,
    /// Guarantee settlement at the acceptance test: bonus paid less damages
    /// received (see [`AcceptanceSettlement`](super::AcceptanceSettlement)).
    pub guarantee_settlement: M,
    /// Residual value credited (zero or negative).
    pub residual: M,
    /// Sum of the row's money columns.
    pub total: M,
    /// Discount factor to the present-value date at `cash_time_years`.
    pub discount_factor: M,
    /// `total` × `discount_factor`.
    pub present_value: M,
}

/// Present values of each cost stream summed over the ledger.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct StreamTotals<M: Money = Decimal> {
    /// Present value of fuel cost.
    pub fuel_cost: M,
    /// Present value of carbon cost.
    pub carbon_cost: M,
    /// Present value of fixed O&M.
    pub fixed_om: M,
    /// Present value of variable O&M.
    pub variable_om: M,
    /// Present value of overhauls.
    pub overhaul: M,
    /// Present value of energy and capacity bought in (energy and capacity shortfall).
    pub bought_in: M,
    /// Present value of capital.
    pub capital: M,
    /// Present value of the guarantee settlement (bonus less damages).
    pub guarantee_settlement: M,
    /// Present value of the residual credit (zero or negative).
    pub residual: M,
}

impl<M: Money> StreamTotals<M> {
    /// All zero.
    pub const ZERO: StreamTotals<M> = StreamTotals {
        fuel_cost: M::ZERO,
        carbon_cost: M::ZERO,
        fixed_om: M::ZERO,
        variable_om: M::ZERO,
        overhaul: M::ZERO,
        bought_in: M::ZERO,
        capital: M::ZERO,
        guarantee_settlement: M::ZERO,
        residual: M::ZERO,
    };

    /// Operating, maintenance and repair costs: fuel, carbon, fixed and
    /// variable O&M, overhauls and energy and capacity bought in (everything but
    /// capital and residual).
    pub fn operating(&self) -> Option<M> {
        self.fuel_cost
            .add_checked(self.carbon_cost)?
            .add_checked(self.fixed_om)?
            .add_checked(self.variable_om)?
            .add_checked(self.overhaul)?
            .add_checked(self.bought_in)
    }

    /// Investment net of residual value: capital plus the guarantee
    /// settlement (damages received are negative) plus the (negative)
    /// residual credit.
    pub fn investment(&self) -> Option<M> {
        let investment = self.capital.add_checked(self.residual)?;
        if self.guarantee_settlement == M::ZERO {
            // No settlement: exactly the sum without one (an `f64` −0 stays −0).
            return Some(investment);
        }
        investment.add_checked(self.guarantee_settlement)
    }
}

/// The settings a ledger is stated on; two ledgers compare only if equal.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Analysis {
    /// Base date, service life and end of life.
    pub calendar: Calendar,
    /// Discount rate, basis (the money every amount is stated in) and
    /// inflation.
    pub rates: Rates,
    /// Cash timing convention.
    pub timing: Timing,
    /// The date every present value is stated at (discounted or, for
    /// construction payments before it, compounded to).
    pub present_value_date: NaiveDate,
}

impl Analysis {
    /// The basis every amount of the ledger is stated on.
    pub fn basis(&self) -> RateBasis {
        self.rates.basis
    }

    /// `Ok` if `other` shares this analysis, else which setting differs.
    pub fn check_comparable(&self, other: &Analysis) -> Result<(), FinanceError> {
        let differs = |what| Err(FinanceError::Incomparable { what });
        if self.calendar != other.calendar {
            return differs("commercial operation date or service life");
        }
        if self.rates != other.rates {
            return differs("discount rate, rate basis or inflation");
        }
        if self.timing != other.timing {
            return differs("cash timing");
        }
        if self.present_value_date != other.present_value_date {
            return differs("present-value date");
        }
        Ok(())
    }
}

/// Totals of a ledger: everything the metrics need, without the rows.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LedgerSummary<M: Money = Decimal> {
    /// What the ledger is stated on.
    pub analysis: Analysis,
    /// Present value of each stream.
    pub present_value: StreamTotals<M>,
    /// Lifecycle cost: the sum of every row's present value (capital and
    /// costs, less the residual credit).
    pub lifecycle_cost: M,
    /// Present value of energy, MWh discounted like money (the denominator
    /// of the levelized cost).
    pub pv_energy_mwh: f64,
    /// Capital paid, undiscounted.
    pub capital_total: M,
    /// Change in lifecycle cost per unit of added capital spread like the
    /// schedule (on the commercial-operation date if the schedule sums to
    /// zero), net of the residual credit when that is a fraction of capital.
    pub pv_per_unit_capital: M,
}

impl<M: Money> LedgerSummary<M> {
    /// Levelized cost of electricity per MWh: the candidate's own lifecycle
    /// cost over the present value of the energy it generates. Output
    /// bought_in is left out: it buys energy and capacity the candidate
    /// does not generate, so it is not a cost of the candidate's MWh (and
    /// levelized costs of candidates of different output stay comparable).
    /// `None` when no energy is generated.
    pub fn levelized_cost_per_mwh(&self) -> Option<M> {
        let energy = M::from_physics(self.pv_energy_mwh)?;
        self.lifecycle_cost
            .sub_checked(self.present_value.bought_in)?
            .div_checked(energy)
    }
}

/// A candidate's full ledger: its rows and its totals.
#[derive(Debug, Clone, PartialEq)]
pub struct Ledger<M: Money = Decimal> {
    /// Totals and the analysis settings.
    pub summary: LedgerSummary<M>,
    /// Rows in time order: capital, operating years, residual.
    pub rows: Vec<LedgerRow<M>>,
}
