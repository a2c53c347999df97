//! Builds a ledger row by row, generic over the money type.
//!
//! One pass produces every row and the totals; [`build_ledger`] keeps the
//! rows, [`summarize_ledger`] keeps none, for sampling and sweeps: it looks
//! up no row dates and allocates nothing (but the resolved fuel price path,
//! when prices are given year by year). Both run the same code and give the
//! same totals.

use chrono::{Datelike, NaiveDate};

use super::calendar::Calendar;
use super::chain::FactorChain;
use super::inputs::{Capital, CapitalPayment, LedgerInputs, ResidualValue};
use super::ledger::{Analysis, Ledger, LedgerRow, LedgerSummary, RowKind, StreamTotals};
use super::money::Money;
use super::operating::operating_rows;
use super::FinanceError;

/// Build the full ledger of one candidate.
pub fn build_ledger<M: Money>(inputs: &LedgerInputs<M>) -> Result<Ledger<M>, FinanceError> {
    let mut rows = Vec::with_capacity(inputs.service_life_years as usize + 4);
    let summary = run(inputs, &mut rows)?;
    Ok(Ledger { summary, rows })
}

/// The totals of one candidate's ledger without keeping its rows: the fast
/// path for sampling and sweeps. Equal to `build_ledger(inputs)?.summary`.
pub fn summarize_ledger<M: Money>(
    inputs: &LedgerInputs<M>,
) -> Result<LedgerSummary<M>, FinanceError> {
    run(inputs, &mut DropRows)
}

/// Where a ledger's rows go: kept by [`build_ledger`], never built by
/// [`summarize_ledger`].
pub(crate) trait RowSink<M: Money> {
    /// Whether rows are kept. When false the engine skips what only a row
    /// shows (its dates), and the optimiser drops the rest of the row.
    const KEEPS_ROWS: bool;

    /// Take one row.
    fn push(&mut self, row: LedgerRow<M>);
}

impl<M: Money> RowSink<M> for Vec<LedgerRow<M>> {
    const KEEPS_ROWS: bool = true;

    fn push(&mut self, row: LedgerRow<M>) {
        Vec::push(self, row);
    }
}

/// The sink of [`summarize_ledger`]: rows are not kept.
pub(crate) struct DropRows;

impl<M: Money> RowSink<M> for DropRows {
    const KEEPS_ROWS: bool = false;

    fn push(&mut self, _row: LedgerRow<M>) {}
}

/// `a * b`, or the overflow error for `stream` in `year`.
pub(crate) fn mul<M: Money>(
    a: M,
    b: M,
    stream: &'static str,
    year: i32,
) -> Result<M, FinanceError> {
    a.mul_checked(b)
        .ok_or(FinanceError::Overflow { stream, year })
}

/// `a + b`, or the overflow error for `stream` in `year`.
pub(crate) fn add<M: Money>(
    a: M,
    b: M,
    stream: &'static str,
    year: i32,
) -> Result<M, FinanceError> {
    a.add_checked(b)
        .ok_or(FinanceError::Overflow { stream, year })
}

/// A factor as money-type, or the overflow error for `stream` in `year`.
pub(crate) fn factor<M: Money>(
    value: f64,
    stream: &'static str,
    year: i32,
) -> Result<M, FinanceError> {
    M::from_factor(value).ok_or(FinanceError::Overflow { stream, year })
}

/// A row on a single date (capital payment, residual credit) with no
/// operation and no money yet.
pub(crate) fn single_date_row<M: Money>(kind: RowKind, date: NaiveDate, time: f64) -> LedgerRow<M> {
    LedgerRow {
        kind,
        year: date.year(),
        period_start: date,
        period_end: date,
        time_start_years: time,
        time_end_years: time,
        cash_time_years: time,
        operating_hours: 0.0,
        energy_mwh: 0.0,
        starts: 0.0,
        fuel_energy_gj: 0.0,
        heat_rate_multiplier: 1.0,
        output_loss: 0.0,
        in_service: 1.0,
        overhaul_count: 0,
        fuel_cost: M::ZERO,
        carbon_cost: M::ZERO,
        fixed_om: M::ZERO,
        variable_om: M::ZERO,
        overhaul: M::ZERO,
        bought_in: M::ZERO,
        capital: M::ZERO,
        guarantee_settlement: M::ZERO,
        residual: M::ZERO,
        total: M::ZERO,
        discount_factor: M::ONE,
        present_value: M::ZERO,
    }
}

/// Capital totals: undiscounted sum, present value, and the discount factor
/// at which added capital would be paid (see [`LedgerSummary::pv_per_unit_capital`]).
struct CapitalPart<M> {
    total: M,
    present_value: M,
    per_unit: M,
}

fn capital_rows<M: Money>(
    inputs: &LedgerInputs<M>,
    calendar: &Calendar,
    discount: &FactorChain,
    sink: &mut impl RowSink<M>,
) -> Result<CapitalPart<M>, FinanceError> {
    let mut total = M::ZERO;
    let mut present_value = M::ZERO;
    let mut last_factor = M::ONE;
    let single;
    let payments = match &inputs.capital {
        Capital::AtCommercialOperation(amount) => {
            single = [CapitalPayment {
                date: inputs.commercial_operation,
                amount: *amount,
            }];
            &single[..]
        }
        Capital::Schedule(payments) => &payments[..],
    };
    for payment in payments {
        let time = calendar.time_of(payment.date);
        let mut row = single_date_row::<M>(RowKind::Capital, payment.date, time);
        let year = row.year;
        row.capital = payment.amount;
        row.total = payment.amount;
        row.discount_factor = factor(discount.at(time), "capital discount factor", year)?;
        row.present_value = mul(row.total, row.discount_factor, "capital", year)?;
        total = add(total, payment.amount, "capital", year)?;
        present_value = add(present_value, row.present_value, "capital", year)?;
        last_factor = row.discount_factor;
        sink.push(row);
    }
    let per_unit = if total == M::ZERO {
        last_factor
    } else {
        present_value
            .div_checked(total)
            .ok_or_else(|| FinanceError::Overflow {
                stream: "capital",
                year: inputs.commercial_operation.year(),
            })?
    };
    Ok(CapitalPart {
        total,
        present_value,
        per_unit,
    })
}

/// The acceptance-test settlement row on the commercial-operation date, if
/// anything is settled; its present value. Nothing settled adds no row.
fn settlement_row<M: Money>(
    inputs: &LedgerInputs<M>,
    calendar: &Calendar,
    discount: &FactorChain,
    sink: &mut impl RowSink<M>,
) -> Result<Option<M>, FinanceError> {
    let settled = &inputs.acceptance_settlement;
    if settled.is_zero() {
        return Ok(None);
    }
    let date = inputs.commercial_operation;
    let time = calendar.time_of(date);
    let mut row = single_date_row::<M>(RowKind::Settlement, date, time);
    let year = row.year;
    let stream = "guarantee settlement";
    row.guarantee_settlement = settled
        .net_cost()
        .ok_or(FinanceError::Overflow { stream, year })?;
    row.total = row.guarantee_settlement;
    row.discount_factor = factor(discount.at(time), stream, year)?;
    row.present_value = mul(row.total, row.discount_factor, stream, year)?;
    let present_value = row.present_value;
    sink.push(row);
    Ok(Some(present_value))
}

fn run<M: Money>(
    inputs: &LedgerInputs<M>,
    sink: &mut impl RowSink<M>,
) -> Result<LedgerSummary<M>, FinanceError> {
    inputs.validate()?;
    let calendar = Calendar::new(inputs.commercial_operation, inputs.service_life_years)?;
    let present_value_date = inputs
        .present_value_date
        .unwrap_or(inputs.commercial_operation);
    let base_years = calendar.time_of(present_value_date);
    let discount = FactorChain::discount_to(inputs.rates.discount_rate, base_years);

    let capital = capital_rows(inputs, &calendar, &discount, sink)?;
    let settlement = settlement_row(inputs, &calendar, &discount, sink)?;
    let operating = operating_rows(inputs, &calendar, base_years, sink)?;

    // Residual value, credited at the end of life.
    let end_time = calendar.end_of_life_years();
    let mut row = single_date_row::<M>(RowKind::Residual, calendar.end_of_life, end_time);
    let year = row.year;
    let stream = "residual value";
    row.discount_factor = factor(discount.at(end_time), stream, year)?;
    let escalation = FactorChain::escalation(inputs.residual.escalation).at(end_time);
    let escalation: M = factor(escalation, stream, year)?;
    // Present value of the residual credit per unit of capital (zero unless
    // the residual is a fraction of capital).
    let (value, credit_per_unit_capital) = match inputs.residual.value {
        ResidualValue::FractionOfCapital(fraction) => {
            let fraction: M = factor(fraction, stream, year)?;
            let per_unit = mul(
                mul(fraction, escalation, stream, year)?,
                row.discount_factor,
                stream,
                year,
            )?;
            (mul(capital.total, fraction, stream, year)?, per_unit)
        }
        ResidualValue::Amount(amount) => (amount, M::ZERO),
    };
    let value = mul(value, escalation, stream, year)?;
    row.residual = M::ZERO
        .sub_checked(value)
        .ok_or(FinanceError::Overflow { stream, year })?;
    row.total = row.residual;
    row.present_value = mul(row.total, row.discount_factor, stream, year)?;
    let residual_pv = row.present_value;
    sink.push(row);

    let present_value = StreamTotals {
        capital: capital.present_value,
        guarantee_settlement: settlement.unwrap_or(M::ZERO),
        residual: residual_pv,
        ..operating.present_value
    };
    let overflow = || FinanceError::Overflow {
        stream: "lifecycle cost",
        year,
    };
    // The sum of every row's present value, in row order.
    let lifecycle_cost = match settlement {
        Some(settlement) => capital.present_value.add_checked(settlement),
        None => Some(capital.present_value),
    }
    .and_then(|sum| sum.add_checked(operating.rows_present_value))
    .and_then(|sum| sum.add_checked(residual_pv))
    .ok_or_else(overflow)?;
    let pv_per_unit_capital = capital
        .per_unit
        .sub_checked(credit_per_unit_capital)
        .ok_or_else(overflow)?;
    Ok(LedgerSummary {
        analysis: Analysis {
            calendar,
            rates: inputs.rates,
            timing: inputs.timing,
            present_value_date,
        },
        present_value,
        lifecycle_cost,
        pv_energy_mwh: operating.pv_energy_mwh,
        capital_total: capital.total,
        pv_per_unit_capital,
    })
}
