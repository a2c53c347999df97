//! The parsed TOML document as a small tree that keeps the byte span of
//! every key and value, so later errors can point at a line and column.

use std::ops::Range;
use toml_edit::{ImDocument, InlineTable, Item, Table, Value};

/// A TOML value with the byte span where it was written.
#[derive(Debug, Clone)]
pub(crate) struct Node {
    /// Byte span of the value (for a table: its header, or its first key).
    pub span: Range<usize>,
    /// The value.
    pub value: NodeValue,
}

/// The kinds of TOML value.
#[derive(Debug, Clone)]
pub(crate) enum NodeValue {
    /// A string.
    Str(String),
    /// An integer (its text is read from the source span).
    Int,
    /// A float (its text is read from the source span).
    Float,
    /// A boolean.
    Bool,
    /// A date, time or date-time.
    Date(toml_edit::Datetime),
    /// An array (also an array of tables).
    Array(Vec<Node>),
    /// A table (standard or inline), keys in file order.
    Table(Vec<Entry>),
}

/// One key of a table and its value.
#[derive(Debug, Clone)]
pub(crate) struct Entry {
    /// The key text.
    pub key: String,
    /// Byte span of the key.
    pub key_span: Range<usize>,
    /// The value.
    pub node: Node,
}

impl NodeValue {
    /// The TOML type name, for messages ("a string", "a table").
    pub fn type_name(&self) -> &'static str {
        match self {
            NodeValue::Str(_) => "a string",
            NodeValue::Int => "an integer",
            NodeValue::Float => "a float",
            NodeValue::Bool => "a boolean",
            NodeValue::Date(_) => "a date",
            NodeValue::Array(_) => "an array",
            NodeValue::Table(_) => "a table",
        }
    }
}

/// A TOML syntax error: the message and the byte offset it points at.
pub(crate) struct SyntaxError {
    /// toml's own message, first line only.
    pub message: String,
    /// Byte offset of the error.
    pub offset: usize,
}

/// Parse `text` into the root table's entries.
pub(crate) fn parse_document(text: &str) -> Result<Vec<Entry>, SyntaxError> {
    let document = ImDocument::parse(text).map_err(|error| SyntaxError {
        message: error
            .message()
            .lines()
            .map(str::trim)
            .filter(|l| !l.is_empty())
            .collect::<Vec<_>>()
            .join(" "),
        offset: error.span().map_or(0, |s| s.start),
    })?;
    Ok(table_entries(document.as_table(), 0))
}

fn table_entries(table: &Table, fallback: usize) -> Vec<Entry> {
    table
        .iter()
        .map(|(key, item)| {
            let key_span = table
                .key(key)
                .and_then(|k| k.span())
                .unwrap_or(fallback..fallback);
            let node = item_node(item, key_span.clone());
            Entry {
                key: key.to_string(),
                key_span,
                node,
            }
        })
        .collect()
}

fn item_node(item: &Item, key_span: Range<usize>) -> Node {
    match item {
        Item::Value(value) => value_node(value, key_span),
        Item::Table(table) => {
            let span = table.span().unwrap_or_else(|| key_span.clone());
            Node {
                value: NodeValue::Table(table_entries(table, span.start)),
                span,
            }
        }
        Item::ArrayOfTables(array) => {
            let elements = array
                .iter()
                .map(|table| {
                    let span = table.span().unwrap_or_else(|| key_span.clone());
                    Node {
                        value: NodeValue::Table(table_entries(table, span.start)),
                        span,
                    }
                })
                .collect();
            Node {
                span: array.span().unwrap_or(key_span),
                value: NodeValue::Array(elements),
            }
        }
        Item::None => Node {
            span: key_span,
            value: NodeValue::Table(Vec::new()),
        },
    }
}

fn value_node(value: &Value, fallback: Range<usize>) -> Node {
    let span = value.span().unwrap_or(fallback);
    let node_value = match value {
        Value::String(s) => NodeValue::Str(s.value().clone()),
        Value::Integer(_) => NodeValue::Int,
        Value::Float(_) => NodeValue::Float,
        Value::Boolean(_) => NodeValue::Bool,
        Value::Datetime(d) => NodeValue::Date(*d.value()),
        Value::Array(array) => {
            NodeValue::Array(array.iter().map(|v| value_node(v, span.clone())).collect())
        }
        Value::InlineTable(table) => NodeValue::Table(inline_entries(table, span.start)),
    };
    Node {
        span,
        value: node_value,
    }
}

fn inline_entries(table: &InlineTable, fallback: usize) -> Vec<Entry> {
    table
        .iter()
        .map(|(key, value)| {
            let key_span = table
                .key(key)
                .and_then(|k| k.span())
                .unwrap_or(fallback..fallback);
            let node = value_node(value, key_span.clone());
            Entry {
                key: key.to_string(),
                key_span,
                node,
            }
        })
        .collect()
}

/// 1-based line and column (in characters) of byte `offset` in `text`.
/// Offsets past the end or inside a character clamp to a valid position.
pub(crate) fn line_column(text: &str, offset: usize) -> (usize, usize) {
    let mut end = offset.min(text.len());
    while !text.is_char_boundary(end) {
        end -= 1;
    }
    let before = &text[..end];
    let line = before.matches('\n').count() + 1;
    let line_start = before.rfind('\n').map_or(0, |i| i + 1);
    let column = before[line_start..].chars().count() + 1;
    (line, column)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn line_column_counts_characters_from_one() {
        let text = "a = 1\nb = \"é\"\nc = 2";
        assert_eq!(line_column(text, 0), (1, 1));
        assert_eq!(line_column(text, 6), (2, 1));
        // after "b = \"é" (é is 2 bytes): column of the closing quote is 7
        assert_eq!(line_column(text, 6 + 7), (2, 7));
        assert_eq!(line_column(text, 9999), (3, 6));
        // inside the two bytes of é: clamps back to the character start
        assert_eq!(line_column(text, 6 + 6), (2, 6));
    }

    #[test]
    fn spans_point_at_keys_and_values() {
        let text = "[site]\nambient_temperature = \"15 degC\"\n";
        let entries = parse_document(text).unwrap_or_default();
        let site = &entries[0];
        assert_eq!(site.key, "site");
        let NodeValue::Table(inner) = &site.node.value else {
            panic!("site is not a table");
        };
        assert_eq!(line_column(text, inner[0].key_span.start), (2, 1));
        assert_eq!(line_column(text, inner[0].node.span.start), (2, 23));
    }

    #[test]
    fn syntax_errors_carry_an_offset() {
        let text = "[site]\nambient_temperature = = 3\n";
        let error = parse_document(text).err();
        assert!(
            matches!(error, Some(SyntaxError { offset, .. }) if line_column(text, offset).0 == 2)
        );
    }
}
