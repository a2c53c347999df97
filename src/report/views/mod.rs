//! The outputs of the commands that do not print a whole comparison
//! (`cycle`, `check`, `offdesign`, `risk`, `sweep`): one view per command, each turning
//! what the library returned into table, JSON or CSV text. `compare` and
//! `report` render [`super::model::Model`] through [`super::Renderer`].
//!
//! A view formats; it never computes physics or money. Units and number
//! formats come from [`super::format`], so every command prints a quantity
//! the same way.

pub mod check;
mod check_maintenance;
pub mod cycle;
pub mod implied;
pub mod offdesign;
pub mod risk;
pub mod sweep;

use crate::{Error, Result};

/// The text formats a command's output can take.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum TextFormat {
    /// Aligned tables for people.
    Table,
    /// One JSON object for scripts.
    Json,
    /// Comma-separated values.
    Csv,
}

/// A command's output in each text format.
pub trait View {
    /// Aligned tables for a terminal.
    fn table(&self) -> Result<String>;
    /// One JSON document (SI values; the key names carry the units).
    fn json(&self) -> Result<String>;
    /// Comma-separated values with a header line.
    fn csv(&self) -> Result<String>;
}

/// The bytes of `view` in `format`.
pub fn render(view: &dyn View, format: TextFormat) -> Result<Vec<u8>> {
    let text = match format {
        TextFormat::Table => view.table()?,
        TextFormat::Json => view.json()?,
        TextFormat::Csv => view.csv()?,
    };
    Ok(text.into_bytes())
}

/// A JSON value as pretty text with a final newline.
pub fn json_text(value: &impl serde::Serialize) -> Result<String> {
    let mut text = serde_json::to_string_pretty(value)
        .map_err(|e| Error::Internal(format!("JSON encoding failed: {e}")))?;
    text.push('\n');
    Ok(text)
}

/// One CSV field, quoted when it holds a comma, quote or line break.
pub fn csv_field(text: &str) -> String {
    if text.contains([',', '"', '\n', '\r']) {
        format!("\"{}\"", text.replace('"', "\"\""))
    } else {
        text.to_string()
    }
}

/// One CSV line (with its newline) from fields.
pub fn csv_line<S: AsRef<str>>(fields: &[S]) -> String {
    let mut line = fields
        .iter()
        .map(|f| csv_field(f.as_ref()))
        .collect::<Vec<_>>()
        .join(",");
    line.push('\n');
    line
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn csv_fields_are_quoted_as_rfc_4180_says() {
        // RFC 4180, section 2, rules 6 and 7.
        assert_eq!(
            csv_line(&["a", "b,c", "say \"hi\""]),
            "a,\"b,c\",\"say \"\"hi\"\"\"\n"
        );
    }
}
