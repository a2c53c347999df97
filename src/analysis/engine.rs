//! Scenario values → the cycle solver's inputs, and one candidate's solve.
//!
//! The scenario's candidate keys carry the same snake_case names as the
//! solver's [`EngineConfig`] fields, so a solver error naming a field is
//! reported at that key of that candidate in the scenario file.

use crate::cycle::{
    self, CycleResult, EfficiencyBasis, EngineConfig, GasModel, Intercooler, IntercoolerExit,
    Regenerator, Reheat, Sizing,
};
use crate::fuel::Fuel;
use crate::scenario::{
    Candidate, EfficiencyBasis as SpecBasis, FuelSpec, GasModelSpec, LoadedScenario, Site,
};
use crate::Error;

/// The fuel of a scenario as the solver's [`Fuel`]
/// ([`crate::scenario::solver_fuel`], which the loader also uses to fit a
/// candidate that states no components).
pub fn fuel_of(spec: &FuelSpec) -> Result<Fuel, String> {
    crate::scenario::solver_fuel(spec)
}

/// The solver's gas model for a candidate.
pub fn gas_model_of(spec: &GasModelSpec) -> GasModel {
    match *spec {
        GasModelSpec::ColdAir { cp_kj_per_kg_k, k } => GasModel::ColdAir { cp_kj_per_kg_k, k },
        GasModelSpec::Air => GasModel::Air,
        GasModelSpec::Products => GasModel::Products,
    }
}

/// The solver's engine description for a candidate at a site, sized to the
/// candidate's rated net output.
pub fn engine_config_of(candidate: &Candidate, site: &Site) -> EngineConfig {
    EngineConfig {
        ambient_temperature_k: site.ambient_temperature_k,
        ambient_pressure_kpa: site.ambient_pressure_kpa,
        pressure_ratio: candidate.pressure_ratio,
        turbine_inlet_temperature_k: candidate.turbine_inlet_temperature_k,
        compressor_efficiency: candidate.compressor_efficiency,
        turbine_efficiency: candidate.turbine_efficiency,
        efficiency_basis: match candidate.efficiency_basis {
            SpecBasis::Isentropic => EfficiencyBasis::Isentropic,
            SpecBasis::Polytropic => EfficiencyBasis::Polytropic,
        },
        inlet_pressure_loss: candidate.inlet_pressure_loss,
        exhaust_pressure_loss: candidate.exhaust_pressure_loss,
        combustor_pressure_loss: candidate.combustor_pressure_loss,
        combustion_efficiency: candidate.combustion_efficiency,
        mechanical_efficiency: candidate.mechanical_efficiency,
        generator_efficiency: candidate.generator_efficiency,
        auxiliary_load_fraction: candidate.auxiliary_load_fraction,
        regenerator: candidate.regenerator.as_ref().map(|r| Regenerator {
            effectiveness: r.effectiveness,
            air_side_pressure_loss: r.air_side_pressure_loss,
            gas_side_pressure_loss: r.gas_side_pressure_loss,
        }),
        intercooler: candidate.intercooler.as_ref().map(|i| Intercooler {
            pressure_split: i.pressure_split,
            exit: match (i.exit_temperature_k, i.effectiveness) {
                (Some(t), _) => IntercoolerExit::TemperatureK(t),
                (None, Some(e)) => IntercoolerExit::Effectiveness(e),
                // The loader requires exactly one of the two; a perfect
                // intercooler (back to the inlet temperature) is the only
                // neutral reading if it ever let neither through.
                (None, None) => IntercoolerExit::Effectiveness(1.0),
            },
        }),
        reheat: candidate.reheat.as_ref().map(|r| Reheat {
            pressure_split: r.pressure_split,
            temperature_k: r.temperature_k,
        }),
        sizing: Some(Sizing::NetOutputKw(candidate.net_output_kw)),
    }
}

/// The cycle's turbine cooling and humidity for a candidate at a site: its
/// `turbine_cooling`, and the site's relative humidity (none for a cold-air
/// candidate, see [`super::machine::humidity_for`]).
pub fn detail_of(candidate: &Candidate, site: &Site) -> cycle::Detail {
    cycle::Detail {
        turbine_cooling: candidate.turbine_cooling,
        relative_humidity: super::machine::humidity_for(candidate, site.relative_humidity),
    }
}

/// Solve one candidate's cycle; a refusal becomes an input error at the
/// candidate's offending key in the scenario file.
pub fn solve_candidate(
    loaded: &LoadedScenario,
    index: usize,
    fuel: &Fuel,
) -> crate::Result<CycleResult> {
    let scenario = &loaded.scenario;
    let candidate = &scenario.candidates[index];
    let config = engine_config_of(candidate, &scenario.site);
    let detail = detail_of(candidate, &scenario.site);
    cycle::solve_detailed(&config, &detail, &gas_model_of(&candidate.gas_model), fuel)
        .map_err(|e| solve_error(loaded, index, &e))
}

/// Map a solver refusal to an input error at the right place.
pub fn solve_error(loaded: &LoadedScenario, index: usize, e: &cycle::CycleError) -> Error {
    let candidate = &loaded.scenario.candidates[index];
    if !e.is_input_error() {
        return Error::Internal(format!("candidate {}: {e}", candidate.id));
    }
    let key = match e.field() {
        Some(field) => format!("candidate[{}].{field}", candidate.id),
        None => format!("candidate[{}]", candidate.id),
    };
    loaded.error_at(
        &key,
        &format!(
            "the cycle of candidate `{}` cannot be solved: {e}",
            candidate.id
        ),
    )
}
