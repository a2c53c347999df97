//! Reading `[[uncertainty]]`: a key, an optional distribution, optional
//! truncation and sensitivity swing, each value written with the key's unit.

use super::context::Context;
use super::declare::value_of_kind;
use super::error::ScenarioError;
use super::keys::kind_of_key;
use super::reader::{quantity_of_node, type_error, TableReader};
use super::tree::{Node, NodeValue};
use super::types::Scenario;
use super::uncertainty::{Distribution, UncertainInput};
use crate::units::{self, Kind, UnitError};

type Read<T> = Result<T, ScenarioError>;

const KEYS: &[&str] = &[
    "key",
    "distribution",
    "low",
    "mode",
    "high",
    "mean",
    "sigma",
    "median",
    "mu",
    "truncate",
    "swing",
];

/// Parameters each distribution takes (besides key, truncate, swing).
const PARAMETERS: &[(&str, &[&str])] = &[
    ("uniform", &["low", "high"]),
    ("triangular", &["low", "mode", "high"]),
    ("normal", &["mean", "sigma"]),
    ("lognormal", &["median", "mu", "sigma"]),
];

/// A difference of `kind` (a standard deviation): for temperatures the
/// scale's offset is removed, so `"5 degC"` is 5 K, not 278.15 K.
fn difference_of_kind(kind: Kind, text: &str) -> Result<f64, UnitError> {
    let value = value_of_kind(kind, text)?;
    if kind != Kind::Temperature {
        return Ok(value);
    }
    let zero = match units::split_quantity(text) {
        units::Split::Quantity { unit, .. } => format!("0 {unit}"),
        units::Split::NotANumber => "0".to_string(),
    };
    Ok(value - value_of_kind(kind, &zero).unwrap_or(0.0))
}

/// Read every `[[uncertainty]]` entry against the loaded `scenario`.
pub(crate) fn read_uncertainty(
    ctx: &mut Context,
    node: Option<&Node>,
    scenario: &Scenario,
) -> Read<Vec<UncertainInput>> {
    let Some(node) = node else {
        return Ok(Vec::new());
    };
    let NodeValue::Array(items) = &node.value else {
        return Err(type_error(
            ctx,
            "uncertainty",
            node,
            "an array of tables written [[uncertainty]]",
        ));
    };
    let mut inputs: Vec<UncertainInput> = Vec::with_capacity(items.len());
    for (i, item) in items.iter().enumerate() {
        let r = TableReader::new(ctx, &format!("uncertainty[{}]", i + 1), item, KEYS)?;
        let input = read_entry(ctx, &r, scenario)?;
        if inputs.iter().any(|u| u.key == input.key) {
            return Err(r.error(
                ctx,
                "key",
                format!("{:?} has an earlier [[uncertainty]] entry", input.key),
                "expected each key once",
            ));
        }
        inputs.push(input);
    }
    Ok(inputs)
}

fn read_entry(ctx: &mut Context, r: &TableReader, scenario: &Scenario) -> Read<UncertainInput> {
    let key = r.required_string(
        ctx,
        "key",
        "expected a scenario key such as key = \"fuel.price\"",
    )?;
    let kind = kind_of_key(scenario, &key).map_err(|e| {
        r.error(
            ctx,
            "key",
            e.to_string(),
            "expected a numeric scenario key; see docs/scenario.md, \"Key paths\"",
        )
    })?;
    scenario
        .get_numeric(&key)
        .or_else(|e| match e {
            super::error::KeyError::Ambiguous { .. } => Ok(0.0),
            other => Err(other),
        })
        .map_err(|e| {
            r.error(
                ctx,
                "key",
                e.to_string(),
                "expected a key that applies to this scenario",
            )
        })?;
    let distribution = match r.string(ctx, "distribution")? {
        None => {
            if let Some(extra) = PARAMETERS
                .iter()
                .flat_map(|(_, p)| p.iter())
                .find(|p| r.has(p))
            {
                return Err(r.error(ctx, extra, "is given without a distribution", "expected distribution = \"uniform\", \"triangular\", \"normal\" or \"lognormal\""));
            }
            None
        }
        Some(name) => {
            let Some((_, allowed)) = PARAMETERS.iter().find(|(n, _)| *n == name) else {
                return Err(r.error(
                    ctx,
                    "distribution",
                    format!(
                        "{name:?} is not a distribution brayfin samples{}",
                        super::suggest::did_you_mean(&name, PARAMETERS.iter().map(|(n, _)| *n))
                    ),
                    "expected \"uniform\", \"triangular\", \"normal\" or \"lognormal\"",
                ));
            };
            if let Some(extra) = PARAMETERS
                .iter()
                .flat_map(|(_, p)| p.iter())
                .find(|p| r.has(p) && !allowed.contains(p))
            {
                return Err(r.error(
                    ctx,
                    extra,
                    format!("is not a parameter of a {name} distribution"),
                    format!("expected {}", allowed.join(", ")),
                ));
            }
            let d = read_distribution(ctx, r, kind, &name, allowed)?;
            Some(d)
        }
    };
    let truncate = pair(ctx, r, "truncate", kind)?;
    let swing = pair(ctx, r, "swing", kind)?;
    let input = UncertainInput {
        key,
        distribution,
        truncate,
        low: swing.map(|s| s.0),
        high: swing.map(|s| s.1),
    };
    super::uncertainty_check::check_entry(ctx, r, scenario, &input)?;
    Ok(input)
}

/// The parameters of distribution `name` (one of [`PARAMETERS`]).
fn read_distribution(
    ctx: &mut Context,
    r: &TableReader,
    kind: Kind,
    name: &str,
    allowed: &[&str],
) -> Read<Distribution> {
    let valid = format!("a {name} distribution needs {}", allowed.join(", "));
    let need = |ctx: &mut Context, p: &str| -> Read<f64> {
        r.quantity(ctx, p, |t| value_of_kind(kind, t))?
            .ok_or_else(|| r.missing(ctx, p, &valid))
    };
    Ok(match name {
        "uniform" => Distribution::Uniform {
            low: need(ctx, "low")?,
            high: need(ctx, "high")?,
        },
        "triangular" => Distribution::Triangular {
            low: need(ctx, "low")?,
            mode: need(ctx, "mode")?,
            high: need(ctx, "high")?,
        },
        "normal" => Distribution::Normal {
            mean: need(ctx, "mean")?,
            sigma: r
                .quantity(ctx, "sigma", |t| difference_of_kind(kind, t))?
                .ok_or_else(|| r.missing(ctx, "sigma", &valid))?,
        },
        _ => {
            let median = r.quantity(ctx, "median", |t| value_of_kind(kind, t))?;
            let mu =
                match (median, r.quantity(ctx, "mu", units::number)?) {
                    (Some(_), Some(_)) => return Err(r.error(
                        ctx,
                        "mu",
                        "is given together with median",
                        "expected either median (with the key's unit) or mu (of ln x), not both",
                    )),
                    (Some(median), None) if median > 0.0 => median.ln(),
                    (Some(median), None) => {
                        return Err(r.error(
                            ctx,
                            "median",
                            format!("{median} is not above 0"),
                            "expected a positive median for a lognormal",
                        ))
                    }
                    (None, Some(mu)) => mu,
                    (None, None) => return Err(r.missing(ctx, "median", &valid)),
                };
            Distribution::LogNormal {
                mu,
                sigma: r
                    .quantity(ctx, "sigma", units::number)?
                    .ok_or_else(|| r.missing(ctx, "sigma", &valid))?,
            }
        }
    })
}

/// `truncate` or `swing`: a two-element array [low, high] with the key's unit.
fn pair(ctx: &mut Context, r: &TableReader, name: &str, kind: Kind) -> Read<Option<(f64, f64)>> {
    let Some(node) = r.node(ctx, name) else {
        return Ok(None);
    };
    let field = r.field(name);
    match &node.value {
        NodeValue::Array(items) if items.len() == 2 => {
            let parse = |t: &str| value_of_kind(kind, t);
            let low = quantity_of_node(ctx, &format!("{field}[1]"), &items[0], &parse)?;
            let high = quantity_of_node(ctx, &format!("{field}[2]"), &items[1], &parse)?;
            if low > high {
                return Err(r.error(
                    ctx,
                    name,
                    format!("low {low} is above high {high}"),
                    "expected [low, high] with low ≤ high",
                ));
            }
            super::reader::record_node(ctx, &format!("{field}[1]"), &items[0]);
            super::reader::record_node(ctx, &format!("{field}[2]"), &items[1]);
            Ok(Some((low, high)))
        }
        _ => Err(type_error(
            ctx,
            &field,
            node,
            "an array of two values [low, high]",
        )),
    }
}
