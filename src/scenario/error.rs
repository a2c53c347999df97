//! Errors of the scenario layer: a located error in a scenario file, and a
//! key-path error from [`super::Scenario::get_numeric`] and friends.

use super::context::{one_line, shorten, shorten_quoted, QUOTE_LIMIT};
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
    #[error("unknown scenario key {}{}; keys look like fuel.price, operation.hours_per_year, candidate.turbine_efficiency or candidate[<id>].turbine_efficiency", quoted(.key), suggestion_text(.suggestion))]
    Unknown {
        /// The key as given.
        key: String,
        /// The closest valid key, if one is close.
        suggestion: Option<String>,
    },
    /// A candidate id in `candidate[<id>]` names no candidate.
    #[error("{}: no candidate has the id {}; the ids are {}", clip(.key), quoted(.id), clip_list(.valid))]
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
    #[error("{}: {}", clip(.key), shorten_quoted(.why))]
    NotApplicable {
        /// The key as given.
        key: String,
        /// Why it does not apply.
        why: String,
    },
    /// The candidates differ in this field; name one candidate.
    #[error("{}: the candidates differ in this value; read it per candidate as {}", clip(.key), clip(.example))]
    Ambiguous {
        /// The key as given.
        key: String,
        /// A per-candidate key to use instead.
        example: String,
    },
    /// The value is outside the field's valid range.
    #[error("{}: {}; {}", clip(.key), shorten_quoted(.problem), shorten_quoted(.valid))]
    OutOfRange {
        /// The key as given.
        key: String,
        /// What is wrong with the value.
        problem: String,
        /// What would be valid.
        valid: String,
    },
}

/// A key, id, example or command-line value as a message shows it: on one
/// line, at most 80 characters, an ellipsis where cut (a `--vary` key of a
/// megabyte is not echoed in full).
pub fn clip(text: &str) -> String {
    shorten(&one_line(text), QUOTE_LIMIT)
}

/// A message part that may carry a value (a problem, a list): on one line,
/// cut to a few quoted values' worth (320 characters) with an ellipsis.
pub fn clip_long(text: &str) -> String {
    shorten(&one_line(text), 4 * QUOTE_LIMIT)
}

/// [`clip`], double-quoted with escapes.
fn quoted(text: &str) -> String {
    format!("{:?}", clip(text))
}

/// A comma-separated list (the valid ids), each item clipped and the whole
/// cut to a few items' worth.
fn clip_list(text: &str) -> String {
    let items: Vec<String> = text.split(", ").map(clip).collect();
    clip_long(&items.join(", "))
}

fn suggestion_text(suggestion: &Option<String>) -> String {
    match suggestion {
        Some(s) => format!(" (did you mean {}?)", clip(s)),
        None => String::new(),
    }
}

impl From<KeyError> for crate::Error {
    fn from(error: KeyError) -> Self {
        crate::Error::Input(error.to_string())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn key_errors_quote_at_most_a_line_of_a_value() {
        let huge = format!("fuel.{}", "x".repeat(1_000_000));
        let unknown = KeyError::Unknown {
            key: huge.clone(),
            suggestion: None,
        }
        .to_string();
        assert!(unknown.chars().count() < 300, "{} chars", unknown.len());
        assert!(unknown.contains("fuel.xxx"), "{unknown}");
        assert!(unknown.contains('…'), "{unknown}");
        let id = "y".repeat(100_000);
        let candidate = KeyError::UnknownCandidate {
            key: format!("candidate[{id}].turbine_efficiency"),
            id,
            valid: "standard, premium".into(),
        }
        .to_string();
        assert!(candidate.chars().count() < 300, "{candidate}");
        assert!(
            candidate.ends_with("the ids are standard, premium"),
            "{candidate}"
        );
        let range = KeyError::OutOfRange {
            key: huge,
            problem: format!("\"{}\" is not a number", "9".repeat(50_000)),
            valid: "expected a fraction".into(),
        }
        .to_string();
        assert!(range.chars().count() < 300, "{range}");
        // A short key is shown whole, unchanged.
        let short = KeyError::NotApplicable {
            key: "candidate[standard].regenerator.effectiveness".into(),
            why: "this candidate has no regenerator".into(),
        }
        .to_string();
        assert_eq!(
            short,
            "candidate[standard].regenerator.effectiveness: this candidate has no regenerator"
        );
    }
}
