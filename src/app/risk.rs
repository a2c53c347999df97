//! `brayfin risk`: Monte Carlo over the scenario's `[[uncertainty]]`
//! distributions, printed as [`crate::report::views::risk::RiskOutput`]
//! renders it.

use super::output::{print, text_format, units_of};
use super::progress::Progress;
use crate::analysis::point::Route;
use crate::analysis::risk::{run_risk_by, view_of};
use crate::cli::RiskArgs;
use crate::report::views::{render, risk::RiskOutput};
use crate::scenario;
use crate::Result;

/// Run `brayfin risk`.
pub fn run(args: &RiskArgs) -> Result<()> {
    let loaded = scenario::load(&args.scenario)?;
    let mut progress = Progress::new(args.samples, "samples");
    let route = if args.exact {
        Route::Exact
    } else {
        Route::Scaled
    };
    let outcome = run_risk_by(
        &loaded,
        args.samples,
        args.seed,
        route,
        &mut |done, total| progress.update(done, total),
    );
    progress.finish();
    let run = outcome?;
    let view = view_of(&run);
    let output = RiskOutput::new(&loaded, &run, &view, units_of(args.units));
    print(&render(&output, text_format(args.format))?)
}
