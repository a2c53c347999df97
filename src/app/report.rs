//! `brayfin report`: load the scenario, build the report model, render the
//! PDF briefing and write it atomically next to the scenario (or where
//! `-o` says), never over the scenario itself.

use crate::cli::{Paper as PaperArg, ReportArgs};
use crate::report::model::Model;
use crate::report::pdf::{Paper, PdfRenderer};
use crate::report::wording::Wording;
use crate::{Error, Result};
use std::path::{Path, PathBuf};

/// What `report` wrote.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Written {
    /// The PDF file.
    pub path: PathBuf,
    /// Its number of pages.
    pub pages: usize,
}

/// The paper size of the renderer for the `--paper` flag.
pub fn paper(arg: PaperArg) -> Paper {
    match arg {
        PaperArg::A4 => Paper::A4,
        PaperArg::Letter => Paper::Letter,
    }
}

/// Where the PDF goes: `output` if given, else the scenario path with the
/// extension `.pdf`. An output path equal to the scenario, or one whose
/// extension is not `.pdf` (any letter case), is refused.
pub fn output_path(scenario: &Path, output: Option<&Path>) -> Result<PathBuf> {
    let path = match output {
        Some(p) => p.to_path_buf(),
        None => scenario.with_extension("pdf"),
    };
    if path == scenario {
        return Err(Error::Input(format!(
            "output path {} is the scenario file itself; give -o with another path",
            path.display()
        )));
    }
    let is_pdf = path
        .extension()
        .is_some_and(|e| e.to_string_lossy().eq_ignore_ascii_case("pdf"));
    if !is_pdf {
        return Err(Error::Input(format!(
            "-o {}: the briefing is a PDF; expected an output path ending in .pdf",
            path.display()
        )));
    }
    Ok(path)
}

/// The wording: built in, or with the `.j2` files of `templates` in place.
pub fn wording(templates: Option<&Path>) -> Result<Wording> {
    match templates {
        Some(dir) => Wording::with_overrides(dir),
        None => Wording::builtin(),
    }
}

/// Render `model` on `paper` with `wording` and write it atomically to
/// `output`, refusing to overwrite `scenario`.
pub fn write_report(
    model: &Model,
    paper: Paper,
    wording: Wording,
    output: &Path,
    scenario: &Path,
) -> Result<Written> {
    let renderer = PdfRenderer { paper, wording };
    let pages = renderer.layout(model)?;
    let bytes = crate::report::pdf::emit::write_pdf(&pages, &model.meta.title)?;
    crate::app::output::write_atomically(output, &bytes, &[scenario])?;
    Ok(Written {
        path: output.to_path_buf(),
        pages: pages.len(),
    })
}

/// The line `report` prints once the file is written.
pub fn summary(written: &Written) -> String {
    let plural = if written.pages == 1 { "" } else { "s" };
    format!(
        "wrote {} ({} page{plural})",
        written.path.display(),
        written.pages
    )
}

/// Run `brayfin report`: check the flags and templates first (cheap), then
/// load the scenario, build the model with the sensitivity ranking, render,
/// write, and print where and how many pages.
pub fn run(args: &ReportArgs) -> Result<()> {
    let output = output_path(&args.scenario, args.output.as_deref())?;
    let wording = wording(args.templates.as_deref())?;
    let loaded = crate::scenario::load(&args.scenario)?;
    let options = crate::analysis::ModelOptions {
        units: crate::app::output::units_of(args.units),
        sensitivity: true,
    };
    let mut model = crate::analysis::build_model(&loaded, &options)?;
    // The risk section needs distributions; a scenario without any simply
    // has no such section (the sensitivity ranking is always there).
    let has_distributions = loaded
        .scenario
        .uncertainty
        .iter()
        .any(|u| u.distribution.is_some());
    if args.samples > 0 && has_distributions {
        model.risk = Some(crate::analysis::risk::risk_view(
            &loaded,
            args.samples,
            args.seed,
        )?);
    }
    let written = write_report(&model, paper(args.paper), wording, &output, &args.scenario)?;
    println!("{}", summary(&written));
    Ok(())
}
