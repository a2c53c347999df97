//! Errors of the scenario layer: a located error in a scenario file, and a
//! key-path error from [`super::Scenario::get_numeric`] and friends.

use thiserror::Error;

/// A scenario file could not be read or is wrong. Display is one line:
/// `<file>:<line>:<column>: <field>: <what is wrong>; <what would be valid>`.
#[derive(Debug, Error)]
pub enum ScenarioError {
    /// Something in the file is wrong, at a known place.
    #[error("{file}:{line}:{column}: {field}: {problem}; {valid}")]
    At {
        /// File label as the user named it.
        file: String,
        /// 1-based line.
        line: usize,
        /// 1-based column, in characters.
        column: usize,
        /// Dotted path of the field, e.g. `candidate[premium].pressure_ratio`.
        field: String,
        /// What is wrong.
        problem: String,
        /// What would be valid.
        valid: String,
    },
    /// The file could not be read.
    #[error("cannot read scenario file {file}: {source}")]
    Read {
        /// File label as the user named it.
        file: String,
        /// The operating-system error.
        #[source]
        source: std::io::Error,
    },
}

impl From<ScenarioError> for crate::Error {
    fn from(error: ScenarioError) -> Self {
        match error {
            ScenarioError::At { .. } => crate::Error::Input(error.to_string()),
            ScenarioError::Read { file, source } => {
                crate::Error::io(format!("reading scenario file {file}"), source)
            }
        }
    }
}

/// A dotted key path (as used by `--vary` and `[uncertainty]`) is unknown,
/// does not apply, or a value set through it is out of range.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum KeyError {
    /// No such key.
    #[error("unknown scenario key {key:?}{}; keys look like fuel.price, operation.hours_per_year, candidate.turbine_efficiency or candidate[<id>].turbine_efficiency", suggestion_text(.suggestion))]
    Unknown {
        /// The key as given.
        key: String,
        /// The closest valid key, if one is close.
        suggestion: Option<String>,
    },
    /// A candidate id in `candidate[<id>]` names no candidate.
    #[error("{key}: no candidate has the id {id:?}; the ids are {valid}")]
    UnknownCandidate {
        /// The key as given.
        key: String,
        /// The id as given.
        id: String,
        /// The valid ids, comma-separated.
        valid: String,
    },
    /// The key exists but not in this scenario (e.g. a regenerator field of
    /// a candidate without a regenerator).
    #[error("{key}: {why}")]
    NotApplicable {
        /// The key as given.
        key: String,
        /// Why it does not apply.
        why: String,
    },
    /// The candidates differ in this field; name one candidate.
    #[error("{key}: the candidates differ in this value; read it per candidate as {example}")]
    Ambiguous {
        /// The key as given.
        key: String,
        /// A per-candidate key to use instead.
        example: String,
    },
    /// The value is outside the field's valid range.
    #[error("{key}: {problem}; {valid}")]
    OutOfRange {
        /// The key as given.
        key: String,
        /// What is wrong with the value.
        problem: String,
        /// What would be valid.
        valid: String,
    },
}

fn suggestion_text(suggestion: &Option<String>) -> String {
    match suggestion {
        Some(s) => format!(" (did you mean {s}?)"),
        None => String::new(),
    }
}

impl From<KeyError> for crate::Error {
    fn from(error: KeyError) -> Self {
        crate::Error::Input(error.to_string())
    }
}
