//! The key declarations: every key of the scenario file is declared once, in
//! the file named after its section, as a [`Key`] — its dotted path, what
//! kind of value it takes, its valid range with the reason, its default (or
//! that it is required), one line of documentation, and for numeric keys
//! where its value lives in the typed [`Scenario`] (a getter and a setter in
//! the internal unit).
//!
//! From these tables come: the keys each table accepts (unknown keys with a
//! did-you-mean), the numeric readers with their defaults recorded, the
//! range checks on load and on every set through a key path, the `--vary` /
//! `[[uncertainty]]` key paths, and the key tables of `docs/scenario.md`
//! ([`docs_tables`], checked by `tests/scenario_docs.rs`).

use super::candidate::Candidate;
use super::ranges::{shown, Limits, Range};
use super::types::Scenario;
use crate::units::{self, Kind, UnitError};
use rust_decimal::prelude::{FromPrimitive, ToPrimitive};
use rust_decimal::Decimal;

/// Outcome of setting a field: `Err(why)` when the field does not apply.
pub(crate) type SetResult = Result<(), String>;

/// What kind of value a key takes.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) enum Shape {
    /// A number with a unit of this kind (or a bare number in the internal
    /// unit).
    Quantity(Kind),
    /// Free text.
    Text,
    /// One word of a fixed list.
    Choice(&'static [&'static str]),
    /// A calendar date.
    Date,
    /// A table of further keys (declared with this key as their prefix) or
    /// of free-form entries (described in the key's documentation).
    Table,
    /// An array of small tables, described in the key's documentation.
    Array,
}

/// Whether a key must be given, and what it is when it is not.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) enum Presence {
    /// The file must give it; `example` is a value as it would be written.
    Required {
        /// An example value as written, e.g. `"\"45 MW\""`.
        example: &'static str,
    },
    /// Required unless another key stands in for it (said in `text`).
    RequiredUnless {
        /// When it may be left out, for the docs.
        text: &'static str,
    },
    /// A default: `text` is recorded among the applied defaults and shown
    /// in the docs; `value` is the same value in the internal unit (unused
    /// for non-numeric keys).
    Default {
        /// The default as text with its unit.
        text: &'static str,
        /// The default in the internal unit.
        value: f64,
    },
    /// May be left out; `text` says what that means (for the docs).
    Optional {
        /// What leaving it out means.
        text: &'static str,
    },
}

/// Where a numeric key's value lives in the typed `T` (a [`Scenario`] or a
/// [`Candidate`]), in its internal unit.
pub(crate) struct Access<T: 'static> {
    /// Read the value; `None` if it does not apply (e.g. no regenerator).
    pub get: fn(&T) -> Option<f64>,
    /// Set the value; `Err(why)` if it does not apply. Changes nothing on
    /// refusal.
    pub set: fn(&mut T, f64) -> SetResult,
}

impl<T> Clone for Access<T> {
    fn clone(&self) -> Self {
        *self
    }
}

impl<T> Copy for Access<T> {}

/// One declared key.
pub(crate) struct Key<T: 'static> {
    /// Dotted path: from the file root for the shared sections
    /// (`fuel.price`), from the candidate table for candidate keys
    /// (`regenerator.effectiveness`).
    pub path: &'static str,
    /// What kind of value it takes.
    pub shape: Shape,
    /// Sign and openness rule (`None` for non-numeric keys).
    pub range: Option<Range>,
    /// Physically sensible bounds with their reason (`None` when the
    /// `range` says all there is, e.g. a fraction in [0, 1]).
    pub limits: Option<Limits>,
    /// Required, defaulted or optional.
    pub presence: Presence,
    /// One line of documentation (the docs table's "meaning").
    pub doc: &'static str,
    /// Where a numeric value lives; `None` for keys that are not key paths.
    pub access: Option<Access<T>>,
}

impl<T> Key<T> {
    /// A key without a range or a place in the typed scenario (text, a
    /// choice, a date, a table).
    pub const fn plain(
        path: &'static str,
        shape: Shape,
        presence: Presence,
        doc: &'static str,
    ) -> Self {
        Key {
            path,
            shape,
            range: None,
            limits: None,
            presence,
            doc,
            access: None,
        }
    }

    /// A numeric key of `kind` with its `range` and where it lives.
    pub const fn number(
        path: &'static str,
        kind: Kind,
        range: Range,
        presence: Presence,
        doc: &'static str,
        get: fn(&T) -> Option<f64>,
        set: fn(&mut T, f64) -> SetResult,
    ) -> Self {
        Key {
            path,
            shape: Shape::Quantity(kind),
            range: Some(range),
            limits: None,
            presence,
            doc,
            access: Some(Access { get, set }),
        }
    }

    /// The same key with physically sensible bounds (internal unit) and
    /// their reason.
    pub const fn within(
        mut self,
        low: f64,
        high: f64,
        unit: &'static str,
        reason: &'static str,
    ) -> Self {
        self.limits = Some(Limits {
            low,
            high,
            unit,
            reason,
        });
        self
    }

    /// The unit kind of a numeric key.
    pub fn kind(&self) -> Option<Kind> {
        match self.shape {
            Shape::Quantity(kind) => Some(kind),
            _ => None,
        }
    }

    /// Check `value` (internal unit) against the range, then the limits.
    pub fn check(&self, value: f64) -> Result<(), (String, String)> {
        if let Some(range) = self.range {
            range.check(value)?;
        }
        match &self.limits {
            Some(limits) => limits.check(value),
            None if value.is_finite() => Ok(()),
            None => Err((
                format!("{value} is not a finite number"),
                "expected a finite number".into(),
            )),
        }
    }

    /// The last part of the path (the key as written in its table).
    pub fn name(&self) -> &'static str {
        self.path.rsplit('.').next().unwrap_or(self.path)
    }

    /// The table path the key is written in (`""` for a top-level key).
    pub fn table(&self) -> &'static str {
        self.path.rsplit_once('.').map_or("", |(table, _)| table)
    }
}

/// A value of `kind` in its internal unit (money amounts as `f64`, currency
/// not checked).
pub(crate) fn value_of_kind(kind: Kind, text: &str) -> Result<f64, UnitError> {
    let money = |v: units::MoneyValue| v.amount.to_f64().unwrap_or(f64::NAN);
    match kind {
        Kind::Temperature => units::temperature_k(text),
        Kind::Pressure => units::pressure_kpa(text),
        Kind::Power => units::power_kw(text),
        Kind::Fraction => units::fraction(text),
        Kind::Number => units::number(text),
        Kind::HeatRate => units::heat_rate_kj_per_kwh(text),
        Kind::SpecificEnergy => units::specific_energy_kj_per_kg(text),
        Kind::Length => units::length_m(text),
        Kind::Duration => units::duration_h(text),
        Kind::EmissionFactor => units::emission_factor_kg_per_gj(text),
        Kind::MassFlow => units::mass_flow_kg_per_s(text),
        Kind::FuelEnergy => units::fuel_energy_gj(text),
        Kind::Money => units::money(text).map(money),
        Kind::FuelPrice => units::price_per_gj(text).map(money),
        Kind::PricePerTonne => units::price_per_tonne(text).map(money),
        Kind::PricePerEnergy => units::price_per_mwh(text).map(money),
        Kind::PricePerCapacity => units::price_per_kw_year(text).map(money),
    }
}

/// The keys written directly in `table` (its children), in declaration
/// order: the keys that table accepts.
pub(crate) fn keys_in<T>(keys: &'static [Key<T>], table: &str) -> Vec<&'static str> {
    keys.iter()
        .filter(|k| k.table() == table)
        .map(|k| k.name())
        .collect()
}

/// The declaration of `path` in `keys`.
pub(crate) fn find<T>(keys: &'static [Key<T>], path: &str) -> Option<&'static Key<T>> {
    keys.iter().find(|k| k.path == path)
}

/// The one place an `f64` becomes money: a value set through a key path
/// (sweeps, sampling) is converted to the nearest Decimal.
pub(crate) fn money_from_f64(value: f64) -> Result<Decimal, String> {
    Decimal::from_f64(value).ok_or_else(|| format!("{value} cannot be held as an amount of money"))
}

/// Money as `f64` for sweeps, sampling and range checks.
pub(crate) fn money_to_f64(value: Decimal) -> f64 {
    value.to_f64().unwrap_or(f64::NAN)
}

/// Every declared key of the shared sections, section by section in file
/// order.
pub(crate) fn scenario_keys() -> impl Iterator<Item = &'static Key<Scenario>> {
    super::scenario_table::KEYS
        .iter()
        .chain(super::site::KEYS)
        .chain(super::fuel::KEYS)
        .chain(super::economics::KEYS)
        .chain(super::operation::KEYS)
}

/// Every declared key of a candidate (relative to the candidate table).
pub(crate) fn candidate_keys() -> impl Iterator<Item = &'static Key<Candidate>> {
    super::candidate::KEYS
        .iter()
        .chain(super::candidate_control::KEYS)
        .chain(super::candidate_costs::KEYS)
        .chain(super::candidate_guarantee::KEYS)
}

/// Check one candidate value (internal unit) against the declared range of
/// `path` (relative to the candidate table, e.g. `pressure_ratio`).
/// `Err((what is wrong, what would be valid))`; an undeclared path is an
/// error too.
pub fn check_candidate_value(path: &str, value: f64) -> Result<(), (String, String)> {
    match candidate_keys().find(|k| k.path == path) {
        Some(key) => key.check(value),
        None => Err((
            format!("{path} is not a declared candidate key"),
            String::new(),
        )),
    }
}

/// Check one shared-section value (internal unit) against the declared
/// range of `path` (e.g. `site.ambient_pressure`).
pub fn check_scenario_value(path: &str, value: f64) -> Result<(), (String, String)> {
    match scenario_keys().find(|k| k.path == path) {
        Some(key) => key.check(value),
        None => Err((format!("{path} is not a declared key"), String::new())),
    }
}

fn kind_text(kind: Kind) -> &'static str {
    match kind {
        Kind::Temperature => "temperature",
        Kind::Pressure => "pressure",
        Kind::Power => "power",
        Kind::Fraction => "fraction",
        Kind::Number => "number",
        Kind::HeatRate => "heat rate",
        Kind::SpecificEnergy => "specific energy",
        Kind::Length => "length",
        Kind::Money => "money",
        Kind::FuelPrice => "fuel price",
        Kind::PricePerTonne => "price per tonne",
        Kind::PricePerEnergy => "price per MWh",
        Kind::PricePerCapacity => "price per kW-year",
        Kind::Duration => "duration",
        Kind::EmissionFactor => "emission factor",
        Kind::MassFlow => "mass flow",
        Kind::FuelEnergy => "fuel energy",
    }
}

fn row<T>(key: &Key<T>, shown_path: &str) -> String {
    let value = match key.shape {
        Shape::Quantity(kind) => kind_text(kind).to_string(),
        Shape::Text => "text".into(),
        Shape::Choice(words) => words
            .iter()
            .map(|w| format!("`\"{w}\"`"))
            .collect::<Vec<_>>()
            .join(", "),
        Shape::Date => "date".into(),
        Shape::Table => "table".into(),
        Shape::Array => "array".into(),
    };
    let range = match (key.range, key.limits) {
        (_, Some(limits)) => {
            let unit = if limits.unit.is_empty() {
                String::new()
            } else {
                format!(" {}", limits.unit)
            };
            format!(
                "{}{unit} to {}{unit}: {}",
                shown(limits.low),
                shown(limits.high),
                limits.reason
            )
        }
        (Some(range), None) => range.valid().trim_start_matches("expected ").to_string(),
        (None, None) => String::new(),
    };
    let presence = match key.presence {
        Presence::Required { .. } => "required".to_string(),
        Presence::RequiredUnless { text } => format!("required unless {text}"),
        Presence::Default { text, .. } => format!("`{text}`"),
        Presence::Optional { text } => text.to_string(),
    };
    format!(
        "| `{shown_path}` | {value} | {} | {range} | {presence} |",
        key.doc
    )
}

const HEADER: &str = "| key | value | meaning | valid range (internal unit) and why | default |\n| --- | --- | --- | --- | --- |";

/// The docs' key tables, one per section, as Markdown: `(section title,
/// table)`. `docs/scenario.md` carries each between
/// `<!-- keys: TITLE -->` and `<!-- end keys -->`.
pub fn docs_tables() -> Vec<(String, String)> {
    let mut tables = Vec::new();
    for section in ["scenario", "site", "fuel", "economics", "operation"] {
        let rows: Vec<String> = scenario_keys()
            .filter(|k| k.path.split('.').next() == Some(section))
            .map(|k| row(k, k.path.split_once('.').map_or(k.path, |(_, rest)| rest)))
            .collect();
        tables.push((
            section.to_string(),
            format!("{HEADER}\n{}", rows.join("\n")),
        ));
    }
    let rows: Vec<String> = candidate_keys().map(|k| row(k, k.path)).collect();
    tables.push((
        "candidate".to_string(),
        format!("{HEADER}\n{}", rows.join("\n")),
    ));
    let rows: Vec<String> = declared_key_paths()
        .into_iter()
        .map(|(path, kind)| format!("| `{path}` | {kind} |"))
        .collect();
    tables.push((
        "key paths".to_string(),
        format!(
            "| key path | unit kind (internal unit as in *Values and units*) |\n| --- | --- |\n{}",
            rows.join("\n")
        ),
    ));
    tables
}

/// Every numeric key path a scenario can have, for the docs' key-path list:
/// shared paths as written, candidate paths as `candidate.<path>`, each
/// with its unit kind.
pub fn declared_key_paths() -> Vec<(String, &'static str)> {
    let shared = scenario_keys()
        .filter(|k| k.access.is_some())
        .filter_map(|k| Some((k.path.to_string(), kind_text(k.kind()?))));
    let candidate = candidate_keys()
        .filter(|k| k.access.is_some())
        .filter_map(|k| Some((format!("candidate.{}", k.path), kind_text(k.kind()?))));
    shared.chain(candidate).collect()
}

/// The scenario key each numeric `cycle` flag stands for (the same ranges
/// hold on the command line as in a file).
const FLAG_KEYS: &[(&str, &str)] = &[
    ("ambient-temperature", "site.ambient_temperature"),
    ("ambient-pressure", "site.ambient_pressure"),
    ("pressure-ratio", "pressure_ratio"),
    ("turbine-inlet-temperature", "turbine_inlet_temperature"),
    ("compressor-efficiency", "compressor_efficiency"),
    ("turbine-efficiency", "turbine_efficiency"),
    ("combustor-pressure-loss", "combustor_pressure_loss"),
    ("regenerator-effectiveness", "regenerator.effectiveness"),
    (
        "regenerator-pressure-loss",
        "regenerator.air_side_pressure_loss",
    ),
    ("intercool-temperature", "intercooler.exit_temperature"),
    ("reheat-temperature", "reheat.temperature"),
    ("net-output", "net_output"),
    ("combustion-efficiency", "combustion_efficiency"),
    ("inlet-pressure-loss", "inlet_pressure_loss"),
    ("exhaust-pressure-loss", "exhaust_pressure_loss"),
    ("mechanical-efficiency", "mechanical_efficiency"),
    ("generator-efficiency", "generator_efficiency"),
    ("auxiliary-load", "auxiliary_load"),
    ("turbine-cooling", "turbine_cooling"),
    ("relative-humidity", "site.relative_humidity"),
];

/// Check the value of a `cycle` flag (named without its dashes, e.g.
/// `pressure-ratio`; value in the internal unit) against the declared range
/// of the scenario key it stands for. `Err` is one line: what is wrong and
/// what would be valid. A flag with no scenario key passes.
pub fn check_flag_value(flag: &str, value: f64) -> Result<(), String> {
    let Some((_, path)) = FLAG_KEYS.iter().find(|(f, _)| *f == flag) else {
        return Ok(());
    };
    let checked = if path.starts_with("site.") {
        check_scenario_value(path, value)
    } else {
        check_candidate_value(path, value)
    };
    checked.map_err(|(problem, valid)| format!("{problem}; {valid}"))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A scenario giving only what is required.
    const MINIMAL: &str = r#"
[scenario]
title = "Minimal"
date = 2025-01-01
currency = "USD"
baseline = "standard"

[fuel]
composition = "methane"
price = "4 USD/GJ"
price_basis = "lhv"

[economics]
commercial_operation = 2026-01-01
service_life_years = 20
discount_rate = "7 %"

[operation]
hours_per_year = "4000 h"

[[candidate]]
id = "standard"
capital_cost = "40000000 USD"
net_output = "40 MW"
pressure_ratio = 16
turbine_inlet_temperature = "1450 K"
compressor_efficiency = "86 %"
turbine_efficiency = "89 %"
"#;

    #[test]
    fn recorded_defaults_are_the_declared_defaults() {
        let loaded = match crate::scenario::parse(MINIMAL, "minimal.toml") {
            Ok(loaded) => loaded,
            Err(e) => panic!("{e}"),
        };
        let mut matched = 0;
        for applied in &loaded.applied_defaults {
            let path = applied
                .key
                .strip_prefix("candidate[standard].")
                .unwrap_or(&applied.key);
            let declared = scenario_keys()
                .find(|k| k.path == path)
                .map(|k| k.presence)
                .or_else(|| {
                    candidate_keys()
                        .find(|k| k.path == path)
                        .map(|k| k.presence)
                });
            let Some(Presence::Default { text, .. }) = declared else {
                continue;
            };
            // Money defaults are recorded with the currency and unit
            // ("0 USD/kW-yr"); the declaration states the number.
            assert!(
                applied.value.starts_with(text),
                "{}: recorded {:?}, declared {text:?}",
                applied.key,
                applied.value
            );
            matched += 1;
        }
        // Every declared default of a key outside optional parts
        // (regenerator, intercooler, reheat, guarantee, cold-air constants,
        // the basis of a datasheet's heat rate) applies.
        let expected = scenario_keys()
            .map(|k| (k.path, k.presence))
            .chain(candidate_keys().map(|k| (k.path, k.presence)))
            .filter(|(path, presence)| {
                matches!(presence, Presence::Default { .. })
                    && !["regenerator.", "intercooler.", "reheat.", "guarantee."]
                        .iter()
                        .any(|p| path.starts_with(p))
                    && ![
                        "cp_kj_per_kg_k",
                        "specific_heat_ratio",
                        "rating.heat_rate_basis",
                    ]
                    .contains(path)
            })
            .count();
        assert_eq!(matched, expected);
    }
}
