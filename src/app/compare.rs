//! `brayfin compare`: every candidate against the baseline, printed as
//! tables, one JSON object, or the CSV ledger.

use crate::analysis::{build_model, ModelOptions};
use crate::cli::{CompareArgs, Format, UnitSystem};
use crate::report::csv::LedgerCsvRenderer;
use crate::report::json::JsonRenderer;
use crate::report::model::Units;
use crate::report::table::TableRenderer;
use crate::report::Renderer;
use crate::{scenario, Error, Result};
use std::io::Write;

/// The display unit system of a CLI choice.
pub fn units_of(choice: UnitSystem) -> Units {
    match choice {
        UnitSystem::Si => Units::Si,
        UnitSystem::Us => Units::Us,
    }
}

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
    std::io::stdout()
        .write_all(&bytes)
        .map_err(|e| Error::io("writing to standard output", e))
}
