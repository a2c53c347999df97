//! What the loader collects while it reads: the span of every field (for
//! errors later), the defaults it applied and every input as given.

use super::error::ScenarioError;
use super::tree::line_column;
use std::collections::BTreeMap;
use std::ops::Range;

/// A default value the loader filled in because the file did not give it.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct AppliedDefault {
    /// Dotted key, e.g. `candidate[standard].generator_efficiency`.
    pub key: String,
    /// The default as text with its unit, e.g. `"1.0"` or `"288.15 K"`.
    pub value: String,
}

/// One input exactly as the file gave it, for the assumptions page.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct InputLine {
    /// Dotted key, e.g. `fuel.price`.
    pub key: String,
    /// The number (or text) as written, e.g. `"4.20"` or `"air"`.
    pub value_text: String,
    /// The unit as written (empty for a bare number or a word).
    pub unit: String,
    /// Where the value came from, from the table's `sources` entry.
    pub source: Option<String>,
}

/// Loader state: file text and label, spans by dotted key, defaults,
/// inputs, and the scenario currency once known.
pub(crate) struct Context<'t> {
    /// File label used in messages.
    pub file: String,
    /// The whole file text.
    pub text: &'t str,
    /// Byte span of each field's value (or table header) by dotted key.
    pub spans: BTreeMap<String, Range<usize>>,
    /// Defaults applied, in reading order.
    pub defaults: Vec<AppliedDefault>,
    /// Inputs as given, in reading order.
    pub inputs: Vec<InputLine>,
    /// Scenario currency code (from `[scenario]`), once read.
    pub currency: Option<String>,
}

impl<'t> Context<'t> {
    /// A fresh context for `text` labelled `file`.
    pub fn new(file: &str, text: &'t str) -> Self {
        Context {
            file: file.to_string(),
            text,
            spans: BTreeMap::new(),
            defaults: Vec::new(),
            inputs: Vec::new(),
            currency: None,
        }
    }

    /// An error at byte `offset` about `field`.
    pub fn error_at_offset(
        &self,
        offset: usize,
        field: &str,
        problem: impl Into<String>,
        valid: impl Into<String>,
    ) -> ScenarioError {
        let (line, column) = line_column(self.text, offset);
        ScenarioError::At {
            file: self.file.clone(),
            line,
            column,
            field: field.to_string(),
            problem: problem.into(),
            valid: valid.into(),
        }
    }

    /// An error at the recorded place of `field` (or of its nearest
    /// recorded parent; the file start if none).
    pub fn error_for(
        &self,
        field: &str,
        problem: impl Into<String>,
        valid: impl Into<String>,
    ) -> ScenarioError {
        let offset = locate(&self.spans, field).unwrap_or(0);
        self.error_at_offset(offset, field, problem, valid)
    }
}

/// Byte offset of `field`, or of its nearest recorded parent path
/// (`a.b[c].d` → `a.b[c]` → `a.b` → `a`).
pub(crate) fn locate(spans: &BTreeMap<String, Range<usize>>, field: &str) -> Option<usize> {
    let mut path = field;
    loop {
        if let Some(span) = spans.get(path) {
            return Some(span.start);
        }
        let cut = path.rfind(['.', '['])?;
        path = &path[..cut];
    }
}
