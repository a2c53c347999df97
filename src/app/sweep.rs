//! `brayfin sweep`: check the scenario and the ranges, then run the sweep
//! and write each finished block as [`crate::report::views::sweep::SweepView`]
//! renders it, so output appears as it is computed.
//!
//! Nothing is printed before the scenario has been validated as fully as
//! `check` does (every candidate solved at the file's values): a scenario
//! `check` refuses exits 1 with an empty standard output.

use super::output::{text_format, units_of};
use super::progress::Progress;
use crate::analysis::point::Route;
use crate::analysis::sweep::{plan, run_sweep_by, SweepBlock};
use crate::cli::SweepArgs;
use crate::report::views::sweep::SweepView;
use crate::{scenario, Error, Result};
use std::io::{BufWriter, Write};

/// Run `brayfin sweep`.
pub fn run(args: &SweepArgs) -> Result<()> {
    let loaded = scenario::load(&args.scenario)?;
    let plan = plan(&loaded, &args.vary, args.candidate.as_deref())?;
    // The same validation as `check`: the file's own point must solve.
    crate::analysis::compare::run_study(&loaded)?;
    let route = if args.exact {
        Route::Exact
    } else {
        Route::Scaled
    };
    let view = SweepView::new(
        &loaded,
        &plan,
        units_of(args.units),
        text_format(args.format),
    )
    .with_route(route);
    let io = |e: std::io::Error| Error::io("writing to standard output", e);
    let stdout = std::io::stdout();
    let mut out = BufWriter::new(stdout.lock());
    let total = plan.points();
    let mut progress = Progress::new(total, "points");
    out.write_all(view.head().as_bytes()).map_err(io)?;
    let mut write_block = |block: &SweepBlock| -> Result<()> {
        out.write_all(view.block(block).as_bytes()).map_err(io)?;
        progress.update(block.first_point + block.len(), total);
        Ok(())
    };
    let outcome = run_sweep_by(&loaded, &plan, route, &mut write_block);
    progress.finish();
    let unsolved = outcome?;
    out.write_all(view.tail().as_bytes()).map_err(io)?;
    out.flush().map_err(io)?;
    if unsolved > 0 {
        eprintln!(
            "note: {unsolved} of {total} points could not be solved; their rows say why in `error`"
        );
    }
    Ok(())
}
