//! The year-by-year ledger of each candidate, on landscape pages in a small
//! font so every column fits.

use super::Ctx;
use crate::report::format;
use crate::report::model::{LedgerRowView, LedgerTotalView};
use crate::report::pdf::document::{Composer, Orientation};
use crate::report::pdf::fonts::Face;
use crate::report::pdf::table::{draw_table_continued, Column, TableStyle};

/// A row's cells; the bought_in column only when `levelled`, the
/// guarantee-settlement column only when `settled`.
fn row(r: &LedgerRowView, levelled: bool, settled: bool) -> Vec<String> {
    let m = |v| format::grouped(v, 0);
    let mut cells = vec![
        r.label.clone(),
        format::number(r.operating_hours, 0),
        format::number(r.energy_mwh, 0),
        format::number(r.fuel_energy_gj, 0),
        m(r.fuel_cost),
        m(r.carbon_cost),
        m(r.fixed_om),
        m(r.variable_om),
        m(r.overhaul),
        m(r.bought_in),
        m(r.capital),
        m(r.residual),
        m(r.guarantee_settlement),
        m(r.total),
        format!("{:.4}", r.discount_factor),
        m(r.present_value),
    ];
    drop_hidden(&mut cells, levelled, settled);
    cells
}

/// The totals row's cells (no discount factor: its present value is the
/// sum of the rows', the lifecycle cost).
fn total_row(t: &LedgerTotalView, label: &str, levelled: bool, settled: bool) -> Vec<String> {
    let m = |v| format::grouped(v, 0);
    let mut cells = vec![
        label.to_string(),
        format::number(t.operating_hours, 0),
        format::number(t.energy_mwh, 0),
        format::number(t.fuel_energy_gj, 0),
        m(t.fuel_cost),
        m(t.carbon_cost),
        m(t.fixed_om),
        m(t.variable_om),
        m(t.overhaul),
        m(t.bought_in),
        m(t.capital),
        m(t.residual),
        m(t.guarantee_settlement),
        m(t.total),
        String::new(),
        m(t.present_value),
    ];
    drop_hidden(&mut cells, levelled, settled);
    cells
}

/// Remove the optional columns not shown (the later one first, so the
/// earlier one's position still holds).
fn drop_hidden<T>(cells: &mut Vec<T>, levelled: bool, settled: bool) {
    if !settled {
        cells.remove(SETTLEMENT_COLUMN);
    }
    if !levelled {
        cells.remove(BOUGHT_IN_COLUMN);
    }
}

/// Position of the bought_in column, shown only when some candidate is
/// charged for an output shortfall.
const BOUGHT_IN_COLUMN: usize = 9;

/// Position of the guarantee-settlement column (after the residual, before
/// the total), shown only when some candidate settles a guarantee.
const SETTLEMENT_COLUMN: usize = 12;

/// Lay out the ledger appendix.
pub fn ledger(ctx: &Ctx, composer: &mut Composer) {
    let l = ctx.labels;
    let levelled = ctx.model.method.levelled;
    let settled = ctx.model.settled();
    let mut columns = vec![
        Column::left(l.ledger_year.clone()),
        Column::right(l.ledger_hours.clone()),
        Column::right(l.ledger_energy.clone()),
        Column::right(l.ledger_fuel_energy.clone()),
        Column::right(l.ledger_fuel_cost.clone()),
        Column::right(l.ledger_carbon.clone()),
        Column::right(l.ledger_fixed_om.clone()),
        Column::right(l.ledger_variable_om.clone()),
        Column::right(l.ledger_overhaul.clone()),
        Column::right(l.ledger_bought_in.clone()),
        Column::right(l.ledger_capital.clone()),
        Column::right(l.ledger_residual.clone()),
        Column::right(l.ledger_settlement.clone()),
        Column::right(l.ledger_total.clone()),
        Column::right(l.ledger_discount_factor.clone()),
        Column::right(l.ledger_present_value.clone()),
    ];
    drop_hidden(&mut columns, levelled, settled);
    let style = TableStyle {
        size_pt: 7.0,
        max_lines: 2,
        bold_first_column: false,
        header: true,
    };
    for (i, c) in ctx.model.candidates.iter().enumerate() {
        composer.new_page(Orientation::Landscape);
        if i == 0 {
            composer.heading(&l.ledger, 1, 40.0);
            composer.paragraph(&l.ledger_note, 8.5, Face::Regular, 0.0);
            if settled {
                composer.paragraph(&l.ledger_settlement_note, 8.5, Face::Regular, 0.0);
            }
        }
        composer.heading(&c.label, 2, 30.0);
        let mut rows: Vec<Vec<String>> =
            c.ledger.iter().map(|r| row(r, levelled, settled)).collect();
        rows.push(total_row(
            &c.ledger_total,
            &l.ledger_total,
            levelled,
            settled,
        ));
        let caption = format!("{} ({})", c.label, l.continued);
        draw_table_continued(composer, &columns, &rows, &style, Some(&caption));
    }
}
