//! Simple and discounted payback (ASTM E1121).
//!
//! Payback is the time from commercial operation until the cumulative
//! savings of the candidate over the baseline first recover the added
//! investment. Added investment is the difference in capital (all paid on or
//! before commercial operation) plus the difference in guarantee settlement
//! at the acceptance test (damages received reduce it); savings are the differences in operating
//! rows' totals, assumed to accrue evenly through each row, so the crossing
//! year is interpolated linearly (common practice). The residual value is
//! not counted (it is not a saving of any year of operation). Simple payback
//! uses undiscounted amounts (in the analysis basis's money, escalation
//! included); discounted payback uses present values. No added investment
//! means a payback of zero years.

use super::ledger::{Ledger, LedgerRow, RowKind};
use super::money::Money;
use super::FinanceError;

/// A payback period.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Payback {
    /// Years after commercial operation (fractional; 0 when nothing extra
    /// is invested).
    Years(f64),
    /// Cumulative savings never recover the added investment within the
    /// service life.
    NeverWithinLife,
}

/// Whether payback discounts.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PaybackKind {
    /// Undiscounted amounts.
    Simple,
    /// Present values.
    Discounted,
}

fn amount<M: Money>(row: &LedgerRow<M>, kind: PaybackKind) -> M {
    match kind {
        PaybackKind::Simple => row.total,
        PaybackKind::Discounted => row.present_value,
    }
}

fn rows_of<M: Money>(ledger: &Ledger<M>, kind: RowKind) -> impl Iterator<Item = &LedgerRow<M>> {
    ledger.rows.iter().filter(move |row| row.kind == kind)
}

/// Payback of `candidate` against `baseline`.
pub fn payback<M: Money>(
    candidate: &Ledger<M>,
    baseline: &Ledger<M>,
    kind: PaybackKind,
) -> Result<Payback, FinanceError> {
    candidate
        .summary
        .analysis
        .check_comparable(&baseline.summary.analysis)?;
    let year = candidate.summary.analysis.calendar.operating_years().0;
    let overflow = || FinanceError::Overflow {
        stream: "payback",
        year,
    };
    let capital = |ledger| {
        rows_of(ledger, RowKind::Capital)
            .chain(rows_of(ledger, RowKind::Settlement))
            .try_fold(M::ZERO, |sum, row| sum.add_checked(amount(row, kind)))
    };
    let added_investment = capital(candidate)
        .zip(capital(baseline))
        .and_then(|(c, b)| c.sub_checked(b))
        .ok_or_else(overflow)?;
    if added_investment <= M::ZERO {
        return Ok(Payback::Years(0.0));
    }
    // Still to recover before this row.
    let mut outstanding = added_investment;
    let rows = rows_of(candidate, RowKind::Operation).zip(rows_of(baseline, RowKind::Operation));
    for (cand, base) in rows {
        let saving = amount(base, kind)
            .sub_checked(amount(cand, kind))
            .ok_or_else(overflow)?;
        if saving > M::ZERO && saving >= outstanding {
            let share = outstanding
                .div_checked(saving)
                .ok_or_else(overflow)?
                .to_f64();
            let span = cand.time_end_years - cand.time_start_years;
            return Ok(Payback::Years(cand.time_start_years + share * span));
        }
        outstanding = outstanding.sub_checked(saving).ok_or_else(overflow)?;
    }
    Ok(Payback::NeverWithinLife)
}
