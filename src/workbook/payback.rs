//! The payback columns of a candidate's ledger sheet (ASTM E1121): its
//! saving against the baseline in each operating row, undiscounted and
//! discounted, and where the cumulative saving first covers the added
//! capital.

use super::cells::{at, f, Cells};
use super::ledger::{col, total, LedgerSheet};
use super::style::{cached, quoted_sheet};
use super::xlsx_error;
use crate::analysis::compare::CandidateOutcome;
use crate::finance::{LedgerRow, Money, RowKind};
use crate::Result;
use rust_decimal::Decimal;
use rust_xlsxwriter::Formula;

/// Saving against the baseline in each operating row, and where the
/// cumulative saving first covers the added capital (ASTM E1121, as
/// `finance::payback`: linear within the row).
pub(crate) fn payback_columns(sheet: &LedgerSheet, cells: &mut Cells) -> Result<()> {
    let s = sheet.styles;
    let this = &sheet.layouts[sheet.index];
    let base = &sheet.layouts[sheet.study.baseline_index];
    let base_sheet = quoted_sheet(&base.sheet);
    let outcome = &sheet.study.outcomes[sheet.index];
    let base_outcome = &sheet.study.outcomes[sheet.study.baseline_index];
    let ops = |o: &CandidateOutcome| -> Vec<LedgerRow> {
        o.ledger
            .rows
            .iter()
            .filter(|r| r.kind == RowKind::Operation)
            .copied()
            .collect()
    };
    let (mine, theirs) = (ops(outcome), ops(base_outcome));
    let columns = [
        (
            col::SAVING,
            col::SIMPLE_CROSSING,
            col::TOTAL,
            total::CAPITAL_PAID,
        ),
        (
            col::PV_SAVING,
            col::DISCOUNTED_CROSSING,
            col::PV,
            total::PV_CAPITAL,
        ),
    ];
    let (mut outstanding_simple, mut outstanding_pv) = (
        outcome.ledger.summary.capital_total - base_outcome.ledger.summary.capital_total,
        outcome.ledger.summary.present_value.capital
            - base_outcome.ledger.summary.present_value.capital,
    );
    for (i, (c, b)) in mine.iter().zip(&theirs).enumerate() {
        let r = this.operating.0 + i as u32;
        let rb = base.operating.0 + i as u32;
        for (saving_col, crossing_col, amount_col, added_row) in columns {
            let simple = saving_col == col::SAVING;
            let saving = if simple {
                b.total - c.total
            } else {
                b.present_value - c.present_value
            };
            let saving_text = format!("={base_sheet}!{}-{}", at(rb, amount_col), at(r, amount_col));
            cells.formula(r, saving_col, &saving_text, f(saving), &s.money.formula)?;
            let added = format!("({}-{base_sheet}!{})", at(added_row, 1), at(added_row, 1));
            let before = if r == this.operating.0 {
                added
            } else {
                format!(
                    "({added}-SUM({}:{}))",
                    at(this.operating.0, saving_col),
                    at(r - 1, saving_col)
                )
            };
            let here = at(r, saving_col);
            let text = format!(
                "=IF(AND({before}>0,{here}>0,{here}>={before}),{}+{before}/{here}*{},\"\")",
                at(r, col::TIME),
                at(r, col::FRACTION)
            );
            let outstanding = if simple {
                &mut outstanding_simple
            } else {
                &mut outstanding_pv
            };
            // Only the first crossing: afterwards nothing is outstanding.
            let crossing =
                *outstanding > Decimal::ZERO && saving > Decimal::ZERO && saving >= *outstanding;
            let value = crossing.then(|| {
                let share = (*outstanding / saving).to_f64();
                c.time_start_years + share * (c.time_end_years - c.time_start_years)
            });
            let cached_text = value.map_or(String::new(), cached);
            let formula = Formula::new(text).set_result(cached_text);
            cells
                .sheet
                .write_formula_with_format(r, crossing_col, formula, &s.factor.formula)
                .map_err(xlsx_error)?;
            *outstanding -= saving;
        }
    }
    Ok(())
}
