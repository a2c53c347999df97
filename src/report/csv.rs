//! CSV renderer: the year-by-year ledger of every candidate, one row per
//! candidate-year (long format). Money as plain decimal numbers rounded to
//! the minor unit; no thousands separators.

use super::model::Model;
use super::Renderer;

/// Renders every candidate's ledger as CSV.
pub struct LedgerCsvRenderer;

/// Column names, in order.
pub const LEDGER_COLUMNS: [&str; 19] = [
    "candidate_id",
    "year",
    "period_start",
    "period_end",
    "operating_hours",
    "energy_mwh",
    "fuel_energy_gj",
    "fuel_cost",
    "carbon_cost",
    "fixed_om",
    "variable_om",
    "overhaul",
    "replacement",
    "capital",
    "residual",
    "total",
    "discount_factor",
    "present_value",
    "currency",
];

impl Renderer for LedgerCsvRenderer {
    fn render(&self, model: &Model) -> crate::Result<Vec<u8>> {
        let mut writer = csv::Writer::from_writer(Vec::new());
        let fail = |e: csv::Error| crate::Error::Internal(format!("CSV encoding failed: {e}"));
        writer.write_record(LEDGER_COLUMNS).map_err(fail)?;
        for c in &model.candidates {
            for r in &c.ledger {
                writer
                    .write_record([
                        c.id.clone(),
                        r.year.to_string(),
                        r.period_start.clone(),
                        r.period_end.clone(),
                        r.operating_hours.to_string(),
                        r.energy_mwh.to_string(),
                        r.fuel_energy_gj.to_string(),
                        r.fuel_cost.to_string(),
                        r.carbon_cost.to_string(),
                        r.fixed_om.to_string(),
                        r.variable_om.to_string(),
                        r.overhaul.to_string(),
                        r.replacement.to_string(),
                        r.capital.to_string(),
                        r.residual.to_string(),
                        r.total.to_string(),
                        r.discount_factor.to_string(),
                        r.present_value.to_string(),
                        model.meta.currency.clone(),
                    ])
                    .map_err(fail)?;
            }
        }
        writer
            .into_inner()
            .map_err(|e| crate::Error::Internal(format!("CSV encoding failed: {e}")))
    }
}
