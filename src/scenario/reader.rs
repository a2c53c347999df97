//! Reading one TOML table: unknown keys with a did-you-mean, typed values
//! with units, defaults recorded, every error placed at its line and column.

use super::context::{AppliedDefault, Context, InputLine};
use super::declare::{value_of_kind, Key, Presence};
use super::error::ScenarioError;
use super::suggest::did_you_mean;
use super::tree::{Entry, Node, NodeValue};
use crate::units::{split_quantity, Split, UnitError};
use std::ops::Range;

/// The key every table may carry: `sources = { key = "where it came from" }`.
pub(crate) const SOURCES: &str = "sources";

/// A table being read, with its dotted path and the `sources` it gives.
pub(crate) struct TableReader<'a> {
    /// Dotted path of the table, e.g. `candidate[premium].regenerator`.
    pub path: String,
    /// Byte span of the table (header or first key) for "missing" errors.
    pub span: Range<usize>,
    entries: &'a [Entry],
    sources: Vec<(String, String)>,
}

type Read<T> = Result<T, ScenarioError>;

impl<'a> TableReader<'a> {
    /// Start reading `node` (which must be a table) at `path`. Keys outside
    /// `allowed` (and `sources`) are errors with a did-you-mean.
    pub fn new(ctx: &mut Context, path: &str, node: &'a Node, allowed: &[&str]) -> Read<Self> {
        let NodeValue::Table(entries) = &node.value else {
            return Err(ctx.error_at_offset(
                node.span.start,
                path,
                format!("is {}", node.value.type_name()),
                "expected a table",
            ));
        };
        let mut reader = TableReader {
            path: path.to_string(),
            span: node.span.clone(),
            entries,
            sources: Vec::new(),
        };
        ctx.spans
            .entry(path.to_string())
            .or_insert(node.span.clone());
        for entry in entries {
            if entry.key != SOURCES && !allowed.contains(&entry.key.as_str()) {
                return Err(ctx.error_at_offset(
                    entry.key_span.start,
                    &reader.field(&entry.key),
                    format!(
                        "unknown {} {:?}{}",
                        if path.is_empty() { "section" } else { "key" },
                        entry.key,
                        did_you_mean(&entry.key, allowed.iter().copied())
                    ),
                    format!("valid keys here are {}", allowed.join(", ")),
                ));
            }
        }
        reader.read_sources(ctx, allowed)?;
        Ok(reader)
    }

    fn read_sources(&mut self, ctx: &mut Context, allowed: &[&str]) -> Read<()> {
        let Some(entry) = self.entry(SOURCES) else {
            return Ok(());
        };
        let field = self.field(SOURCES);
        let NodeValue::Table(items) = &entry.node.value else {
            return Err(type_error(
                ctx,
                &field,
                &entry.node,
                "a table of key = \"source\"",
            ));
        };
        for item in items {
            let item_field = format!("{field}.{}", item.key);
            if !allowed.contains(&item.key.as_str()) {
                return Err(ctx.error_at_offset(
                    item.key_span.start,
                    &item_field,
                    format!(
                        "names no key of this table{}",
                        did_you_mean(&item.key, allowed.iter().copied())
                    ),
                    format!("a source may be given for {}", allowed.join(", ")),
                ));
            }
            let NodeValue::Str(text) = &item.node.value else {
                return Err(type_error(ctx, &item_field, &item.node, "a string"));
            };
            self.sources.push((item.key.clone(), text.clone()));
        }
        Ok(())
    }

    /// Dotted path of `key` in this table (the root table's path is empty).
    pub fn field(&self, key: &str) -> String {
        if self.path.is_empty() {
            key.to_string()
        } else {
            format!("{}.{key}", self.path)
        }
    }

    /// The entry for `key`, if given.
    pub fn entry(&self, key: &str) -> Option<&'a Entry> {
        self.entries.iter().find(|e| e.key == key)
    }

    /// Whether `key` was given.
    pub fn has(&self, key: &str) -> bool {
        self.entry(key).is_some()
    }

    /// The node for `key`, recording its span; `None` if not given.
    pub fn node(&self, ctx: &mut Context, key: &str) -> Option<&'a Node> {
        let entry = self.entry(key)?;
        ctx.spans.insert(self.field(key), entry.node.span.clone());
        Some(&entry.node)
    }

    /// Error: a required key is missing.
    pub fn missing(&self, ctx: &Context, key: &str, valid: &str) -> ScenarioError {
        ctx.error_at_offset(
            self.span.start,
            &self.field(key),
            format!("is missing from [{}]", self.path),
            valid,
        )
    }

    /// Error at the value of `key` (which must have been given).
    pub fn error(
        &self,
        ctx: &Context,
        key: &str,
        problem: impl Into<String>,
        valid: impl Into<String>,
    ) -> ScenarioError {
        let offset = self
            .entry(key)
            .map_or(self.span.start, |e| e.node.span.start);
        ctx.error_at_offset(offset, &self.field(key), problem, valid)
    }

    /// Give every input recorded below `key` (its nested values, such as
    /// a mole fraction or a dispatch block, read by other readers) the
    /// source this table's `sources` states for `key`, unless it has one.
    pub fn source_below(&self, ctx: &mut Context, key: &str) {
        let Some(source) = self.source_of(key) else {
            return;
        };
        let field = self.field(key);
        for line in ctx.inputs.iter_mut().filter(|line| line.source.is_none()) {
            let below = line.key.strip_prefix(field.as_str()).is_some_and(|rest| {
                rest.is_empty() || rest.starts_with('.') || rest.starts_with('[')
            });
            if below {
                line.source = Some(source.clone());
            }
        }
    }

    fn source_of(&self, key: &str) -> Option<String> {
        self.sources
            .iter()
            .find(|(k, _)| k == key)
            .map(|(_, s)| s.clone())
    }

    /// A string value, if given.
    pub fn string(&self, ctx: &mut Context, key: &str) -> Read<Option<String>> {
        let Some(node) = self.node(ctx, key) else {
            return Ok(None);
        };
        let NodeValue::Str(text) = &node.value else {
            return Err(type_error(ctx, &self.field(key), node, "a string"));
        };
        self.record(ctx, key, text.clone(), String::new());
        Ok(Some(text.clone()))
    }

    /// A required string value.
    pub fn required_string(&self, ctx: &mut Context, key: &str, valid: &str) -> Read<String> {
        self.string(ctx, key)?
            .ok_or_else(|| self.missing(ctx, key, valid))
    }

    /// One of `options` (a word), or `default` (recorded) when absent.
    pub fn choice(
        &self,
        ctx: &mut Context,
        key: &str,
        options: &[&'static str],
        default: &'static str,
    ) -> Read<&'static str> {
        let Some(word) = self.string(ctx, key)? else {
            self.default(ctx, key, default);
            return Ok(default);
        };
        options.iter().copied().find(|o| *o == word).ok_or_else(|| {
            self.error(
                ctx,
                key,
                format!(
                    "{word:?} is not a valid choice{}",
                    did_you_mean(&word, options.iter().copied())
                ),
                format!("expected one of {}", options.join(", ")),
            )
        })
    }

    /// A quantity read by `parse` from a string with a unit or a bare TOML
    /// number (its text exactly as written, so money never passes through
    /// `f64`); `None` if absent.
    pub fn quantity<T>(
        &self,
        ctx: &mut Context,
        key: &str,
        parse: impl Fn(&str) -> Result<T, UnitError>,
    ) -> Read<Option<T>> {
        let Some(node) = self.node(ctx, key) else {
            return Ok(None);
        };
        let field = self.field(key);
        let value = quantity_of_node(ctx, &field, node, &parse)?;
        let text = quantity_text(ctx, node);
        let (number, unit) = match split_quantity(&text) {
            Split::Quantity { number, unit } => (number, unit.to_string()),
            Split::NotANumber => (text.clone(), String::new()),
        };
        self.record(ctx, key, number, unit);
        Ok(Some(value))
    }

    /// A required quantity.
    pub fn required_quantity<T>(
        &self,
        ctx: &mut Context,
        key: &str,
        parse: impl Fn(&str) -> Result<T, UnitError>,
        valid: &str,
    ) -> Read<T> {
        self.quantity(ctx, key, parse)?
            .ok_or_else(|| self.missing(ctx, key, valid))
    }

    /// A numeric key read as its declaration says: parsed by its unit
    /// kind; when absent, its declared default (recorded) or a "missing"
    /// error if it is required; `None` for an optional key left out. The
    /// range is checked with the whole scenario (see `validate.rs`).
    pub fn declared<T>(&self, ctx: &mut Context, key: &Key<T>) -> Read<Option<f64>> {
        let name = key.name();
        let Some(kind) = key.kind() else {
            return Err(self.error(
                ctx,
                name,
                "is declared without a unit kind (a fault in brayfin)",
                "expected a numeric declaration",
            ));
        };
        if let Some(value) = self.quantity(ctx, name, |t| value_of_kind(kind, t))? {
            return Ok(Some(value));
        }
        match key.presence {
            Presence::Default { text, value } => {
                self.default(ctx, name, text);
                Ok(Some(value))
            }
            Presence::Required { example } => Err(self.missing(
                ctx,
                name,
                &format!("expected the {}, e.g. {example}", key.doc),
            )),
            Presence::RequiredUnless { .. } | Presence::Optional { .. } => Ok(None),
        }
    }

    /// [`TableReader::declared`] for the key declared at `path` in `keys`;
    /// a path with no declaration is an error (a fault in brayfin, caught
    /// by the tests).
    pub fn declared_at<T>(
        &self,
        ctx: &mut Context,
        keys: &'static [Key<T>],
        path: &str,
    ) -> Read<f64> {
        let Some(key) = keys.iter().find(|k| k.path == path) else {
            return Err(self.error(
                ctx,
                path.rsplit('.').next().unwrap_or(path),
                "is not declared (a fault in brayfin)",
                "expected a declared key",
            ));
        };
        Ok(self.declared(ctx, key)?.unwrap_or(f64::NAN))
    }

    /// Read every declared numeric key of this table (declarations in
    /// `keys` whose table is `table`) into `target` through its setter:
    /// the value given, or its declared default.
    pub fn declared_into<T>(
        &self,
        ctx: &mut Context,
        keys: &'static [Key<T>],
        table: &str,
        target: &mut T,
    ) -> Read<()> {
        for key in keys.iter().filter(|k| k.table() == table) {
            let Some(access) = key.access else {
                continue;
            };
            if let Some(value) = self.declared(ctx, key)? {
                (access.set)(target, value).map_err(|why| {
                    self.error(ctx, key.name(), why, "expected a key that applies here")
                })?;
            }
        }
        Ok(())
    }

    /// Record that `key` took `value` by default.
    pub fn default(&self, ctx: &mut Context, key: &str, value: &str) {
        ctx.defaults.push(AppliedDefault {
            key: self.field(key),
            value: value.to_string(),
        });
    }

    fn record(&self, ctx: &mut Context, key: &str, value_text: String, unit: String) {
        ctx.inputs.push(InputLine {
            key: self.field(key),
            value_text,
            unit,
            source: self.source_of(key),
        });
    }
}

/// The text of a quantity node: a string's content, or a number's source
/// text as written.
pub(crate) fn quantity_text(ctx: &Context, node: &Node) -> String {
    match &node.value {
        NodeValue::Str(text) => text.clone(),
        _ => ctx
            .text
            .get(node.span.clone())
            .unwrap_or_default()
            .trim()
            .to_string(),
    }
}

/// Record a quantity node nested below a table's keys (a mole fraction, a
/// price-path year) as an input line.
pub(crate) fn record_node(ctx: &mut Context, field: &str, node: &Node) {
    let text = quantity_text(ctx, node);
    let (value_text, unit) = match split_quantity(&text) {
        Split::Quantity { number, unit } => (number, unit.to_string()),
        Split::NotANumber => (text.clone(), String::new()),
    };
    ctx.inputs.push(InputLine {
        key: field.to_string(),
        value_text,
        unit,
        source: None,
    });
}

/// Parse a quantity node (string with unit or TOML number) with `parse`,
/// errors placed at the node.
pub(crate) fn quantity_of_node<T>(
    ctx: &Context,
    field: &str,
    node: &Node,
    parse: &impl Fn(&str) -> Result<T, UnitError>,
) -> Read<T> {
    match &node.value {
        NodeValue::Str(_) | NodeValue::Int | NodeValue::Float => {}
        _ => {
            return Err(type_error(
                ctx,
                field,
                node,
                "a number or a string with a unit",
            ))
        }
    }
    parse(&quantity_text(ctx, node)).map_err(|e| {
        ctx.error_at_offset(
            node.span.start,
            field,
            e.what_is_wrong(),
            e.what_would_be_valid(),
        )
    })
}

/// Error: `node` has the wrong TOML type.
pub(crate) fn type_error(ctx: &Context, field: &str, node: &Node, expected: &str) -> ScenarioError {
    ctx.error_at_offset(
        node.span.start,
        field,
        format!("is {}", node.value.type_name()),
        format!("expected {expected}"),
    )
}
