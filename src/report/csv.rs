//! CSV renderer: the year-by-year ledger of every candidate, one row per
//! candidate-year (long format). Money as plain decimal numbers rounded to
//! the minor unit; no thousands separators. With US units the fuel energy
//! column is `fuel_energy_mmbtu` (LHV, 1 MMBtu = 1.055056 GJ) in place of
//! `fuel_energy_gj`; every other column is the same in both systems. The
//! `guarantee_settlement` column (bonus paid less damages received at the
//! acceptance test) is always present, zero on rows without a settlement,
//! so the stream columns of every row add up to its `total`.
//!
//! Each row has a unique label (`row`: `"2026 construction"`, `"2027
//! operation"`, `"acceptance test"`, `"end of life"`); each candidate's rows
//! end with a `total` row (year and discount factor empty) whose money
//! columns are the undiscounted sums and whose `present_value` is the
//! lifecycle cost. `present_value_date` is the date every present value is
//! stated at.

use super::format::{self, Quantity};
use super::model::{Model, Units};
use super::Renderer;

/// Position of the fuel-energy column (renamed with US units).
const FUEL_ENERGY_COLUMN: usize = 8;

/// Renders every candidate's ledger as CSV.
pub struct LedgerCsvRenderer;

/// Column names, in order.
pub const LEDGER_COLUMNS: [&str; 23] = [
    "candidate_id",
    "row",
    "year",
    "period_start",
    "period_end",
    "operating_hours",
    "starts",
    "energy_mwh",
    "fuel_energy_gj",
    "fuel_cost",
    "carbon_cost",
    "fixed_om",
    "variable_om",
    "overhaul",
    "bought_in",
    "capital",
    "residual",
    "guarantee_settlement",
    "total",
    "discount_factor",
    "present_value",
    "currency",
    "present_value_date",
];

impl Renderer for LedgerCsvRenderer {
    fn render(&self, model: &Model) -> crate::Result<Vec<u8>> {
        let mut writer = csv::Writer::from_writer(Vec::new());
        let fail = |e: csv::Error| crate::Error::Internal(format!("CSV encoding failed: {e}"));
        let mut columns = LEDGER_COLUMNS;
        if model.meta.units == Units::Us {
            columns[FUEL_ENERGY_COLUMN] = "fuel_energy_mmbtu";
        }
        writer.write_record(columns).map_err(fail)?;
        let pv_date = &model.method.present_value_date;
        for c in &model.candidates {
            for r in &c.ledger {
                writer
                    .write_record([
                        c.id.clone(),
                        r.label.clone(),
                        r.year.to_string(),
                        r.period_start.clone(),
                        r.period_end.clone(),
                        r.operating_hours.to_string(),
                        r.starts.to_string(),
                        r.energy_mwh.to_string(),
                        fuel_energy(r.fuel_energy_gj, model.meta.units),
                        r.fuel_cost.to_string(),
                        r.carbon_cost.to_string(),
                        r.fixed_om.to_string(),
                        r.variable_om.to_string(),
                        r.overhaul.to_string(),
                        r.bought_in.to_string(),
                        r.capital.to_string(),
                        r.residual.to_string(),
                        r.guarantee_settlement.to_string(),
                        r.total.to_string(),
                        r.discount_factor.to_string(),
                        r.present_value.to_string(),
                        model.meta.currency.clone(),
                        pv_date.clone(),
                    ])
                    .map_err(fail)?;
            }
            let t = &c.ledger_total;
            writer
                .write_record([
                    c.id.clone(),
                    t.label.clone(),
                    String::new(),
                    t.period_start.clone(),
                    t.period_end.clone(),
                    t.operating_hours.to_string(),
                    t.starts.to_string(),
                    t.energy_mwh.to_string(),
                    fuel_energy(t.fuel_energy_gj, model.meta.units),
                    t.fuel_cost.to_string(),
                    t.carbon_cost.to_string(),
                    t.fixed_om.to_string(),
                    t.variable_om.to_string(),
                    t.overhaul.to_string(),
                    t.bought_in.to_string(),
                    t.capital.to_string(),
                    t.residual.to_string(),
                    t.guarantee_settlement.to_string(),
                    t.total.to_string(),
                    String::new(),
                    t.present_value.to_string(),
                    model.meta.currency.clone(),
                    pv_date.clone(),
                ])
                .map_err(fail)?;
        }
        writer
            .into_inner()
            .map_err(|e| crate::Error::Internal(format!("CSV encoding failed: {e}")))
    }
}

/// Fuel energy in the column's unit: GJ, or MMBtu (GJ / 1.055056).
fn fuel_energy(gj: f64, units: Units) -> String {
    match units {
        Units::Si => gj.to_string(),
        Units::Us => format::in_units(Quantity::FuelEnergy, gj, units).to_string(),
    }
}
