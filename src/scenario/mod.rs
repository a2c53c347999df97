//! Scenario files: TOML in, a validated, typed [`Scenario`] out.

mod candidate;
mod error;
mod tree;
mod types;
mod uncertainty;

pub use error::{KeyError, ScenarioError};
pub use types::*;
mod context;
mod reader;
mod suggest;

pub use context::{AppliedDefault, InputLine};
mod ranges;
pub use ranges::HOURS_PER_LEAP_YEAR;
mod candidate_fields;
mod candidate_section;
mod costs_section;
mod fields;
mod fuel_section;
mod keys;
mod load;
mod operation_section;
mod sections;
mod uncertainty_check;
mod uncertainty_section;
mod validate;
mod values;

pub use load::{load, parse, LoadedScenario};
pub use sections::iso_2533_pressure_kpa;
mod warnings;

pub use warnings::engineering_warnings;
