//! Scenario files: TOML in, a validated, typed [`Scenario`] out.
//!
//! Every key is declared once, in the file named after its section
//! (`scenario_table.rs`, `site.rs`, `fuel.rs`, `economics.rs`,
//! `operation.rs`, `candidate.rs`, `candidate_control.rs`, `candidate_costs.rs`,
//! `candidate_guarantee.rs`; `[[correlation]]` in `correlation.rs`; `[[uncertainty]]`
//! in `uncertainty_section.rs`); `declare.rs` holds the mechanism.

mod candidate;
mod candidate_control;
mod candidate_costs;
mod candidate_curves;
mod candidate_fit;
mod candidate_guarantee;
mod candidate_reader;
mod context;
mod correlation;
mod declare;
mod economics;
mod error;
mod fuel;
mod keys;
mod load;
mod operation;
mod ranges;
mod reader;
mod scenario_table;
mod site;
mod suggest;
mod tree;
mod types;
mod uncertainty;
mod uncertainty_check;
mod uncertainty_section;
mod validate;
mod values;
mod warnings;
mod weather;

pub use candidate_control::{ControlSpec, ControlStrategy};
pub use candidate_fit::{solver_fuel, FittedMachine};
pub use context::{AppliedDefault, InputLine};
pub use correlation::{drawn_keys, target_of, RankPair};
pub use declare::{
    check_candidate_value, check_flag_value, check_scenario_value, declared_key_paths, docs_tables,
};
pub use error::{clip, clip_long, KeyError, ScenarioError};
pub use load::{load, parse, parse_in, LoadedScenario};
pub use ranges::HOURS_PER_LEAP_YEAR;
pub use site::{iso_2533_pressure_kpa, ELEVATION_RANGE_M};
pub use types::*;
pub use warnings::{engineering_warnings, information_notes};
pub use weather::{AmbientRecord, Profile, ProfileHour, Weather, WeatherSource, HOURS_PER_YEAR};
