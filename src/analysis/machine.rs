//! A candidate as a fixed machine: its design solve at its rating condition
//! (`[candidate.rating]`) fixes air flow, turbine flow capacity and the
//! compressor's design point ([`Machine::calibrate`]); the machine is then
//! solved at the site's ambient or any other ([`Machine::solve`]).
//!
//! The rating pressure is the candidate's `rating.pressure` (default
//! 101.325 kPa), never the site's: a bid's datasheet states its own
//! reference condition, and the site is where the machine runs.

use super::engine::{engine_config_of, gas_model_of};
use crate::fuel::Fuel;
use crate::offdesign::{Ambient, Control, Machine, OffDesignError, Strategy};
use crate::scenario::{Candidate, ControlSpec, ControlStrategy, LoadedScenario, Site};
use crate::Error;

/// The off-design control of a candidate's `[candidate.control]`.
pub fn control_of(spec: &ControlSpec) -> Control {
    Control {
        strategy: match spec.strategy {
            ControlStrategy::GuideVanes => Strategy::GuideVanes,
            ControlStrategy::FiringTemperature => Strategy::FiringTemperature,
        },
        minimum_airflow: spec.minimum_airflow,
        exhaust_temperature_limit_k: spec.exhaust_temperature_limit_k,
        minimum_load: spec.minimum_load,
    }
}

/// The rating condition of a candidate as an [`Ambient`].
pub fn rating_of(candidate: &Candidate) -> Ambient {
    Ambient {
        temperature_k: candidate.rating.temperature_k,
        pressure_kpa: candidate.rating.pressure_kpa,
        relative_humidity: candidate.rating.relative_humidity,
    }
}

/// The site's ambient (temperature, pressure or the elevation's ISO 2533
/// pressure, relative humidity).
pub fn site_ambient(site: &Site) -> Ambient {
    Ambient {
        temperature_k: site.ambient_temperature_k,
        pressure_kpa: site.ambient_pressure_kpa,
        relative_humidity: site.relative_humidity,
    }
}

/// Calibrate a candidate's fixed machine at its rating condition: its
/// rated `net_output` at 100 % load there fixes the machine.
pub fn machine_of(
    candidate: &Candidate,
    site: &Site,
    fuel: &Fuel,
) -> Result<Machine, OffDesignError> {
    // The site's ambient in the config is replaced by the rating condition
    // inside `calibrate`.
    let config = engine_config_of(candidate, site);
    Machine::calibrate(
        &config,
        candidate.turbine_cooling,
        rating_of(candidate),
        control_of(&candidate.control),
        gas_model_of(&candidate.gas_model),
        fuel,
    )
}

/// The scenario key (relative to the candidate) an off-design field names.
fn candidate_key_of(field: &str) -> &str {
    match field {
        "control.exhaust_temperature_limit_k" => "control.exhaust_temperature_limit",
        "rating.temperature_k" => "rating.temperature",
        "rating.pressure_kpa" => "rating.pressure",
        "net_output_kw" => "net_output",
        "turbine_inlet_temperature_k" => "turbine_inlet_temperature",
        "auxiliary_load_fraction" => "auxiliary_load",
        other => other,
    }
}

/// Calibrate candidate `index` of a loaded scenario; a refusal becomes an
/// input error at the candidate's key in the file (exit 1), or an internal
/// error (exit 2) when the model, not the input, failed.
pub fn calibrate_candidate(
    loaded: &LoadedScenario,
    index: usize,
    fuel: &Fuel,
) -> crate::Result<Machine> {
    let scenario = &loaded.scenario;
    let candidate = &scenario.candidates[index];
    machine_of(candidate, &scenario.site, fuel).map_err(|e| calibration_error(loaded, index, &e))
}

/// Map a calibration refusal to an error at the candidate's key.
pub fn calibration_error(loaded: &LoadedScenario, index: usize, e: &OffDesignError) -> Error {
    let candidate = &loaded.scenario.candidates[index];
    if !e.is_input_error() {
        return Error::Internal(format!("candidate {}: {e}", candidate.id));
    }
    let key = match e.field() {
        Some(field) => format!("candidate[{}].{}", candidate.id, candidate_key_of(field)),
        None => format!("candidate[{}]", candidate.id),
    };
    loaded.error_at(
        &key,
        &format!(
            "candidate `{}` cannot be built as a fixed machine: {e}",
            candidate.id
        ),
    )
}
