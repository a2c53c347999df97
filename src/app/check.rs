//! `brayfin check`: load and validate a scenario, solve its candidates,
//! and print what [`crate::report::views::check::CheckView`] renders.

use super::output::{print, units_of};
use crate::cli::CheckArgs;
use crate::report::views::check::CheckView;
use crate::scenario;
use crate::Result;

/// Run `brayfin check SCENARIO`: exit 0 (with any warnings) when the
/// scenario is valid; a bad scenario is an input error (exit 1).
pub fn run(args: &CheckArgs) -> Result<()> {
    let loaded = scenario::load(&args.scenario)?;
    // Solving every candidate also validates what only physics and the
    // ledger can: an impossible cycle is an input error here too.
    let study = crate::analysis::compare::run_study(&loaded)?;
    let extra = crate::analysis::warnings::cycle_warnings(&loaded, &study);
    let mut information = crate::analysis::machine::site_notes(&loaded.scenario, &study);
    information.extend(crate::analysis::implied::unassessed_notes(&loaded.scenario));
    information.extend(crate::analysis::implied::fitted_notes(&loaded.scenario));
    let implied = crate::analysis::implied::implied_bids(&loaded, &study.fuel)?;
    let mut extra = extra;
    extra.extend(crate::analysis::implied::curve_warnings(
        &loaded.scenario,
        &study.fuel,
    ));
    for bid in &implied {
        extra.extend(crate::analysis::implied::verdict_warning(bid));
    }
    let maintenance =
        crate::analysis::maintenance::starts_and_maintenance(&loaded.scenario, &study);
    let present_value_date = crate::analysis::maintenance::present_value_date(&study);
    let view = CheckView::new(&loaded, extra, units_of(args.units))
        .with_information(information)
        .with_implied(&implied)
        .with_maintenance(&maintenance, present_value_date);
    print(view.table().as_bytes())
}
