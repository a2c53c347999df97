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
    /// Folder of the scenario file: files it names (weather, profile) are
    /// relative to it; `None` reads them relative to the working folder.
    pub dir: Option<std::path::PathBuf>,
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
            dir: None,
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
            field: shorten(&one_line(field), QUOTE_LIMIT),
            problem: shorten_quoted(&one_line(&problem.into())),
            valid: one_line(&valid.into()),
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

/// The most characters of a value a message quotes before an ellipsis.
pub(crate) const QUOTE_LIMIT: usize = 80;

/// `text` on one line: line breaks and other control characters escaped.
pub(crate) fn one_line(text: &str) -> String {
    if !text.chars().any(char::is_control) {
        return text.to_string();
    }
    text.chars()
        .flat_map(|c| {
            let shown: Vec<char> = if c.is_control() {
                c.escape_default().collect()
            } else {
                vec![c]
            };
            shown
        })
        .collect()
}

/// `text` cut to at most `limit` characters, with an ellipsis when cut.
pub(crate) fn shorten(text: &str, limit: usize) -> String {
    if text.chars().count() <= limit {
        return text.to_string();
    }
    let mut cut: String = text.chars().take(limit.saturating_sub(1)).collect();
    cut.push('…');
    cut
}

/// Every double-quoted value in `text` cut to [`QUOTE_LIMIT`] characters
/// (a value of a megabyte is not echoed in full), and the whole message
/// to a few quoted values' worth.
pub(crate) fn shorten_quoted(text: &str) -> String {
    let mut out = String::with_capacity(text.len().min(4 * QUOTE_LIMIT));
    let mut inside = false;
    let mut run = 0usize;
    let mut prev = '\0';
    for c in text.chars() {
        if c == '"' && prev != '\\' {
            inside = !inside;
            run = 0;
            out.push(c);
        } else if inside {
            run += 1;
            if run < QUOTE_LIMIT {
                out.push(c);
            } else if run == QUOTE_LIMIT {
                out.push('…');
            }
        } else {
            out.push(c);
        }
        prev = c;
    }
    shorten(&out, 6 * QUOTE_LIMIT)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn long_values_are_cut_with_an_ellipsis() {
        let long = format!("\"{}\" is not a valid id", "a".repeat(10_000));
        let short = shorten_quoted(&long);
        assert!(short.chars().count() < 120, "{short}");
        assert!(short.contains('…'));
        assert!(short.ends_with("is not a valid id"));
        assert_eq!(shorten_quoted("\"air\" is fine"), "\"air\" is fine");
        assert_eq!(one_line("a\nb"), "a\\nb");
    }
}
