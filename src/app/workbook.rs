//! `brayfin workbook`: load the scenario, run the study, build the audit
//! workbook and write it atomically next to the scenario (or where `-o`
//! says), never over the scenario, only to a `.xlsx` path.

use crate::cli::WorkbookArgs;
use crate::{Error, Result};
use std::path::{Path, PathBuf};

/// Where the workbook goes: `output` if given, else the scenario path with
/// the extension `.xlsx`. Refuses another extension and the scenario itself.
pub fn output_path(scenario: &Path, output: Option<&Path>) -> Result<PathBuf> {
    let path = match output {
        Some(p) => p.to_path_buf(),
        None => scenario.with_extension("xlsx"),
    };
    let is_xlsx = path
        .extension()
        .and_then(|e| e.to_str())
        .is_some_and(|e| e.eq_ignore_ascii_case("xlsx"));
    if !is_xlsx {
        return Err(Error::Input(format!(
            "output path {} does not end in .xlsx; the workbook is an Office Open XML spreadsheet, give -o with a .xlsx path",
            path.display()
        )));
    }
    if path == scenario {
        return Err(Error::Input(format!(
            "output path {} is the scenario file itself; give -o with another path",
            path.display()
        )));
    }
    Ok(path)
}

/// Run `brayfin workbook`: check the output path, load, study, build,
/// write, and print where it went.
pub fn run(args: &WorkbookArgs) -> Result<()> {
    let output = output_path(&args.scenario, args.output.as_deref())?;
    let loaded = crate::scenario::load(&args.scenario)?;
    let study = crate::analysis::compare::run_study(&loaded)?;
    let bytes = crate::workbook::build_workbook(&loaded, &study)?;
    crate::app::output::write_atomically(&output, &bytes, &[&args.scenario])?;
    println!(
        "wrote {} ({} candidate ledgers)",
        output.display(),
        study.outcomes.len()
    );
    Ok(())
}
