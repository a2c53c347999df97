//! The error every command returns at the edge, and its exit code.
//!
//! Each layer has its own typed error; they all become one of two kinds here:
//! bad input (exit code 1) or an internal / I/O failure (exit code 2).

use thiserror::Error;

/// Top-level error of a brayfin command.
#[derive(Debug, Error)]
pub enum Error {
    /// The user's input is wrong: a flag, a scenario file, a template.
    /// The message names where (file, line, column, field) and what is valid.
    #[error("{0}")]
    Input(String),
    /// Reading or writing a file failed.
    #[error("{context}: {source}")]
    Io {
        /// What brayfin was doing, with the path.
        context: String,
        /// The operating-system error.
        #[source]
        source: std::io::Error,
    },
    /// Something brayfin should have prevented; a bug or an unsolvable case.
    #[error("internal error: {0}")]
    Internal(String),
}

impl Error {
    /// Process exit code: 1 for bad input, 2 for internal or I/O failure.
    pub fn exit_code(&self) -> i32 {
        match self {
            Error::Input(_) => 1,
            Error::Io { .. } | Error::Internal(_) => 2,
        }
    }

    /// Build an I/O error with context.
    pub fn io(context: impl Into<String>, source: std::io::Error) -> Self {
        Error::Io {
            context: context.into(),
            source,
        }
    }
}

/// Result with the top-level [`Error`].
pub type Result<T> = std::result::Result<T, Error>;
