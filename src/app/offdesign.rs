//! `brayfin offdesign`: read the scenario and the grid flags (lists with
//! units), solve every candidate's fixed machine over the grid, print what
//! [`crate::report::views::offdesign::OffDesignView`] renders.
//!
//! Every bad flag is `Error::Input` (exit 1) naming the flag; every point
//! is solved before the first byte is printed.

use super::output::{print, text_format, units_of};
use crate::analysis::engine::fuel_of;
use crate::analysis::machine::calibration_error;
use crate::analysis::offdesign_grid::{solve_grid, GridError, GridRequest};
use crate::cli::OffdesignArgs;
use crate::offdesign::OffDesignError;
use crate::report::views::{offdesign::OffDesignView, render};
use crate::scenario::{self, LoadedScenario};
use crate::units::{self, UnitError};
use crate::{Error, Result};

/// Run `brayfin offdesign`.
pub fn run(args: &OffdesignArgs) -> Result<()> {
    let loaded = scenario::load(&args.scenario)?;
    let request = request(args, &loaded)?;
    let fuel =
        fuel_of(&loaded.scenario.fuel).map_err(|m| loaded.error_at("fuel.composition", &m))?;
    let grids =
        solve_grid(&loaded.scenario, &fuel, &request).map_err(|e| grid_error(&loaded, args, &e))?;
    let view = OffDesignView::new(&grids, units_of(args.units));
    print(&render(&view, text_format(args.format))?)
}

fn flag_error(flag: &str, e: UnitError) -> Error {
    Error::Input(format!("--{flag}: {e}"))
}

/// One value of a flag, in its internal unit, within the declared range of
/// the scenario key it stands for.
fn value(
    flag: &str,
    text: &str,
    parse: fn(&str) -> std::result::Result<f64, UnitError>,
    key: Option<&str>,
) -> Result<f64> {
    let v = parse(text.trim()).map_err(|e| flag_error(flag, e))?;
    if let Some(key) = key {
        scenario::check_scenario_value(key, v).map_err(|(what, valid)| {
            Error::Input(format!("--{flag}: {:?} {what}; {valid}", text.trim()))
        })?;
    }
    Ok(v)
}

/// A comma-separated list of values with units.
fn list(
    flag: &str,
    text: &str,
    parse: fn(&str) -> std::result::Result<f64, UnitError>,
    key: Option<&str>,
) -> Result<Vec<f64>> {
    let items: Vec<&str> = text.split(',').collect();
    if items.iter().any(|i| i.trim().is_empty()) {
        return Err(Error::Input(format!(
            "--{flag}: {text:?} has an empty item; expected comma-separated values such as \"0 degC,15 degC\" or \"100 %,75 %\""
        )));
    }
    items.iter().map(|i| value(flag, i, parse, key)).collect()
}

/// The grid the flags ask for; pressure and humidity default to the site's.
fn request(args: &OffdesignArgs, loaded: &LoadedScenario) -> Result<GridRequest> {
    let site = &loaded.scenario.site;
    let temperatures_k = match &args.temperature {
        None => None,
        Some(text) => Some(list(
            "temperature",
            text,
            units::temperature_k,
            Some("site.ambient_temperature"),
        )?),
    };
    let loads = match &args.load {
        None => None,
        Some(text) => {
            let loads = list("load", text, units::fraction, None)?;
            if let Some(bad) = loads.iter().find(|l| !(**l > 0.0 && **l <= 1.0)) {
                return Err(Error::Input(format!(
                    "--load: {} % is {}; expected loads above 0 % and at most 100 % of the base-load output",
                    bad * 100.0,
                    if *bad > 1.0 { "above 100 %" } else { "not above 0 %" }
                )));
            }
            Some(loads)
        }
    };
    let pressure_kpa = match (&args.pressure, &args.elevation) {
        (Some(text), _) => value(
            "pressure",
            text,
            units::pressure_kpa,
            Some("site.ambient_pressure"),
        )?,
        (None, Some(text)) => {
            let z = value("elevation", text, units::length_m, None)?;
            let (low, high) = scenario::ELEVATION_RANGE_M;
            if !(low..=high).contains(&z) {
                return Err(Error::Input(format!(
                    "--elevation: {z} m is outside the ISO 2533 troposphere formula's range; expected an elevation from {low} m to {high} m"
                )));
            }
            scenario::iso_2533_pressure_kpa(z)
        }
        (None, None) => site.ambient_pressure_kpa,
    };
    let relative_humidity = match &args.relative_humidity {
        Some(text) => value(
            "relative-humidity",
            text,
            units::fraction,
            Some("site.relative_humidity"),
        )?,
        None => site.relative_humidity,
    };
    Ok(GridRequest {
        candidate: args.candidate.clone(),
        temperatures_k,
        loads,
        pressure_kpa,
        relative_humidity,
    })
}

/// The flag an off-design field comes from.
fn flag_of(field: &str, args: &OffdesignArgs) -> Option<&'static str> {
    match field {
        "load" => Some("--load"),
        "ambient.temperature_k" => Some("--temperature"),
        "ambient.pressure_kpa" if args.elevation.is_some() => Some("--elevation"),
        "ambient.pressure_kpa" => Some("--pressure"),
        "ambient.relative_humidity" => Some("--relative-humidity"),
        _ => None,
    }
}

/// One line naming the flag (or the candidate's key) at fault.
fn grid_error(loaded: &LoadedScenario, args: &OffdesignArgs, e: &GridError) -> Error {
    match e {
        GridError::UnknownCandidate { id, valid } => Error::Input(format!(
            "--candidate: {id:?} is not a candidate of this scenario; expected one of {}",
            valid.join(", ")
        )),
        GridError::Calibration { index, error } => calibration_error(loaded, *index, error),
        GridError::Point {
            index,
            ambient,
            load,
            error,
        } => {
            let id = &loaded.scenario.candidates[*index].id;
            let at = format!(
                "candidate `{id}` at {:.2} K, {:.3} kPa, {:.0} % relative humidity, {:.1} % load",
                ambient.temperature_k,
                ambient.pressure_kpa,
                ambient.relative_humidity * 100.0,
                load * 100.0
            );
            if !error.is_input_error() {
                return Error::Internal(format!("{at}: {error}"));
            }
            match (error.field().and_then(|f| flag_of(f, args)), error.as_ref()) {
                (Some(flag), _) => Error::Input(format!("{flag}: {at}: {error}")),
                (None, OffDesignError::NoOperatingPoint(_)) => loaded.error_at(
                    &format!("candidate[{id}].control"),
                    &format!("{at}: {error}"),
                ),
                (None, _) => calibration_error(loaded, *index, error),
            }
        }
    }
}
