//! `brayfin compare`: every candidate against the baseline, printed as
//! tables, one JSON object, or the CSV ledger.

use super::output::{print, units_of};
use crate::analysis::{build_model, ModelOptions};
use crate::cli::{CompareArgs, Format};
use crate::report::csv::LedgerCsvRenderer;
use crate::report::json::JsonRenderer;
use crate::report::table::TableRenderer;
use crate::report::Renderer;
use crate::{scenario, Result};

/// Run `brayfin compare`.
pub fn run(args: &CompareArgs) -> Result<()> {
    let loaded = scenario::load(&args.scenario)?;
    let model = build_model(
        &loaded,
        &ModelOptions {
            units: units_of(args.units),
            sensitivity: args.sensitivity,
        },
    )?;
    let bytes = match args.format {
        Format::Table => TableRenderer.render(&model)?,
        Format::Json => JsonRenderer.render(&model)?,
        Format::Csv => LedgerCsvRenderer.render(&model)?,
    };
    print(&bytes)
}
