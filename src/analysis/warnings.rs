//! Warnings that need the solved cycle: what `check` and the report add to
//! the scenario layer's own warnings.

use super::compare::Study;
use super::evaluate::solve;
use crate::scenario::LoadedScenario;

/// Below this gain in net efficiency (percentage points) a regenerator is
/// flagged as gaining little (common practice: recuperators on simple-cycle
/// machines are expected to gain several points; under one point rarely
/// pays for its pressure losses and maintenance).
const SMALL_REGENERATOR_GAIN_POINTS: f64 = 1.0;

/// Warnings from the solved cycles of a study.
pub fn cycle_warnings(loaded: &LoadedScenario, study: &Study) -> Vec<String> {
    let scenario = &loaded.scenario;
    let mut warnings = Vec::new();
    for (candidate, outcome) in scenario.candidates.iter().zip(&study.outcomes) {
        let with = outcome.solved.cycle.thermal_efficiency;
        if candidate.regenerator.is_some() {
            let mut bare = candidate.clone();
            bare.regenerator = None;
            if let Ok(without) = solve(scenario, &bare, &study.fuel) {
                let gain = (with - without.cycle.thermal_efficiency) * 100.0;
                if gain < SMALL_REGENERATOR_GAIN_POINTS {
                    warnings.push(format!(
                        "candidate[{}]: the regenerator gains only {gain:.2} points of net \
                         efficiency ({:.2} % with, {:.2} % without); check its effectiveness, \
                         pressure losses and the pressure ratio",
                        candidate.id,
                        with * 100.0,
                        without.cycle.thermal_efficiency * 100.0
                    ));
                }
            }
        }
        let residual = outcome.solved.cycle.energy_balance_residual_kj_per_kg.abs();
        if residual > 1e-6 {
            warnings.push(format!(
                "candidate[{}]: first-law residual {residual:e} kJ/kg is larger than usual",
                candidate.id
            ));
        }
    }
    warnings
}
