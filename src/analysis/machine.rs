//! A candidate as a fixed machine: its design solve at its rating condition
//! (`[candidate.rating]`) fixes air flow, turbine flow capacity and the
//! compressor's design point ([`Machine::calibrate`]); the machine is then
//! solved at the site's ambient or any other ([`Machine::solve`]).
//!
//! The rating pressure is the candidate's `rating.pressure` (default
//! 101.325 kPa), never the site's: a bid's datasheet states its own
//! reference condition, and the site is where the machine runs.

use super::compare::Study;
use super::engine::{engine_config_of, gas_model_of};
use super::site::Basis;
use crate::fuel::Fuel;
use crate::offdesign::{Ambient, Control, Machine, OffDesignError, Strategy};
use crate::scenario::{
    Candidate, ControlSpec, ControlStrategy, GasModelSpec, LoadedScenario, Scenario, Site,
};
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

/// The relative humidity a candidate's gas model can carry: the cold-air
/// standard has no water vapour (its constant cp stands for dry air), so
/// its machine runs dry whatever the air holds; `air` and `products` carry
/// `relative_humidity` as given.
pub fn humidity_for(candidate: &Candidate, relative_humidity: f64) -> f64 {
    match candidate.gas_model {
        GasModelSpec::ColdAir { .. } => 0.0,
        GasModelSpec::Air | GasModelSpec::Products => relative_humidity,
    }
}

/// The rating condition of a candidate as an [`Ambient`] (dry for a
/// cold-air candidate, see [`humidity_for`]).
pub fn rating_of(candidate: &Candidate) -> Ambient {
    Ambient {
        temperature_k: candidate.rating.temperature_k,
        pressure_kpa: candidate.rating.pressure_kpa,
        relative_humidity: humidity_for(candidate, candidate.rating.relative_humidity),
    }
}

/// The site's ambient (temperature, pressure or the elevation's ISO 2533
/// pressure, relative humidity); a cold-air candidate takes it dry
/// ([`humidity_for`]).
pub fn site_ambient(candidate: &Candidate, site: &Site) -> Ambient {
    Ambient {
        temperature_k: site.ambient_temperature_k,
        pressure_kpa: site.ambient_pressure_kpa,
        relative_humidity: humidity_for(candidate, site.relative_humidity),
    }
}

/// Above this relative difference between what a candidate's fixed machine
/// makes at the site and its rating (rated output; the design-point heat
/// rate at the site), `check` says so: 1 % is about the uncertainty of an
/// output acceptance test (ASME PTC 22 puts output at roughly 1 %, from
/// memory), so a smaller difference is within what a test could tell.
const SITE_NOTE_FRACTION: f64 = 0.01;

/// Information for `check`: each candidate whose fixed machine at the
/// site's ambient differs from its rating by more than 1 % in output or
/// heat rate (the comparison prices the site figures), how part load is
/// priced, and each candidate kept at its rating
/// ([`super::site::pricing_notes`]).
pub fn site_notes(scenario: &Scenario, study: &Study) -> Vec<String> {
    let mut notes = Vec::new();
    for (candidate, outcome) in scenario.candidates.iter().zip(&study.outcomes) {
        let site = &outcome.solved.site;
        let Basis::Machine(point) = &site.basis else {
            continue;
        };
        let rated_hr = outcome.solved.cycle.heat_rate_kj_per_kwh;
        let output = site.net_output_kw / candidate.net_output_kw - 1.0;
        let heat_rate = site.heat_rate_kj_per_kwh / rated_hr - 1.0;
        if output.abs() > SITE_NOTE_FRACTION || heat_rate.abs() > SITE_NOTE_FRACTION {
            let (source, priced) = match super::vendor::ambient_source(candidate) {
                super::vendor::Source::Vendor => (
                    "with its vendor's ambient correction",
                    "these figures (its vendor's curve)",
                ),
                super::vendor::Source::Physics => {
                    ("as a fixed machine", "the fixed machine's figures")
                }
            };
            notes.push(format!(
                "candidate[{}]: {source} at the site ({:.2} K, {:.3} kPa, {:.0} % \
                 relative humidity) it makes {:.0} kW ({:+.1} %) at {:.0} kJ/kWh ({:+.1} %) \
                 against its rated {:.0} kW and the {:.0} kJ/kWh of its design point at the \
                 site; compare, report, sweep and risk price {priced} \
                 (see `brayfin offdesign`)",
                candidate.id,
                point.ambient_temperature_k,
                point.ambient_pressure_kpa,
                point.relative_humidity * 100.0,
                site.net_output_kw,
                output * 100.0,
                site.heat_rate_kj_per_kwh,
                heat_rate * 100.0,
                candidate.net_output_kw,
                rated_hr,
            ));
        }
    }
    let sites: Vec<_> = study
        .outcomes
        .iter()
        .map(|o| o.solved.site.clone())
        .collect();
    notes.extend(super::site::pricing_notes(scenario, &sites));
    notes
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
