//! `[[correlation]]`: pairs of `[[uncertainty]]` keys with a rank
//! (Spearman) correlation, which `risk` imposes on its draws by the
//! Iman–Conover method (`analysis::sampling::iman_conover`).
//!
//! ```toml
//! [[correlation]]
//! keys = ["fuel.price", "fuel.escalation"]
//! rank_correlation = 0.6
//! ```
//!
//! Both keys must have an `[[uncertainty]]` entry with a distribution;
//! pairs not listed are uncorrelated. The whole set must be able to hold
//! together (a positive semi-definite matrix); when it cannot, the error
//! sits at the entry of the pair to change and gives the nearest value that
//! works with the others. The check uses the pure linear algebra of
//! `analysis::sampling::rank_correlation` (no analysis state).

use super::context::Context;
use super::error::ScenarioError;
use super::reader::{type_error, TableReader};
use super::tree::{Node, NodeValue};
use super::uncertainty::UncertainInput;
use crate::analysis::sampling::rank_correlation::{CorrelationError, RankCorrelation};
use crate::units;

type Read<T> = Result<T, ScenarioError>;

const KEYS: &[&str] = &["keys", "rank_correlation"];

/// One `[[correlation]]` entry.
#[derive(Debug, Clone, PartialEq)]
pub struct RankPair {
    /// The first key (as in its `[[uncertainty]]` entry).
    pub first: String,
    /// The second key.
    pub second: String,
    /// Target rank (Spearman) correlation, −1 to 1.
    pub rank_correlation: f64,
}

/// The keys that are drawn, in `[[uncertainty]]` order: those with a
/// distribution (the order `risk` draws them in).
pub fn drawn_keys(uncertainty: &[UncertainInput]) -> Vec<&str> {
    uncertainty
        .iter()
        .filter(|u| u.distribution.is_some())
        .map(|u| u.key.as_str())
        .collect()
}

/// The target matrix over [`drawn_keys`] of `pairs` (unlisted pairs 0).
/// Errors as [`RankCorrelation::from_pairs`]; a loaded scenario's pairs
/// always pass.
pub fn target_of(
    uncertainty: &[UncertainInput],
    pairs: &[RankPair],
) -> Result<RankCorrelation, CorrelationError> {
    let drawn = drawn_keys(uncertainty);
    let index = |key: &str| drawn.iter().position(|k| *k == key).unwrap_or(usize::MAX);
    let triples: Vec<(usize, usize, f64)> = pairs
        .iter()
        .map(|p| (index(&p.first), index(&p.second), p.rank_correlation))
        .collect();
    RankCorrelation::from_pairs(drawn.len(), &triples)
}

/// Read every `[[correlation]]` entry against the scenario's
/// `[[uncertainty]]` entries.
pub(crate) fn read_correlations(
    ctx: &mut Context,
    node: Option<&Node>,
    uncertainty: &[UncertainInput],
) -> Read<Vec<RankPair>> {
    let Some(node) = node else {
        return Ok(Vec::new());
    };
    let NodeValue::Array(items) = &node.value else {
        return Err(type_error(
            ctx,
            "correlation",
            node,
            "an array of tables written [[correlation]]",
        ));
    };
    let drawn = drawn_keys(uncertainty);
    let mut pairs: Vec<RankPair> = Vec::with_capacity(items.len());
    // Offsets of each entry's `rank_correlation`, for later errors.
    let mut places: Vec<(usize, String)> = Vec::with_capacity(items.len());
    for (i, item) in items.iter().enumerate() {
        let path = format!("correlation[{}]", i + 1);
        let r = TableReader::new(ctx, &path, item, KEYS)?;
        let (first, second) = read_keys(ctx, &r, &drawn)?;
        let value = r.required_quantity(
            ctx,
            "rank_correlation",
            units::number,
            "expected a rank correlation from -1 to 1, e.g. 0.5",
        )?;
        if !(value.is_finite() && (-1.0..=1.0).contains(&value)) {
            return Err(r.error(
                ctx,
                "rank_correlation",
                format!("{value} is not a correlation"),
                "expected a rank correlation from -1 to 1",
            ));
        }
        let same = |p: &RankPair| {
            (p.first == first && p.second == second) || (p.first == second && p.second == first)
        };
        if pairs.iter().any(same) {
            return Err(r.error(
                ctx,
                "keys",
                format!("the pair {first:?}, {second:?} has an earlier [[correlation]] entry"),
                "expected each pair once",
            ));
        }
        let offset = r
            .entry("rank_correlation")
            .map_or(r.span.start, |e| e.node.span.start);
        places.push((offset, format!("{path}.rank_correlation")));
        pairs.push(RankPair {
            first,
            second,
            rank_correlation: value,
        });
    }
    check_consistent(ctx, uncertainty, &pairs, &places)?;
    Ok(pairs)
}

/// The two keys of an entry: strings naming different drawn keys.
fn read_keys(ctx: &mut Context, r: &TableReader, drawn: &[&str]) -> Read<(String, String)> {
    let valid = "expected keys = [\"<key>\", \"<other key>\"], two different keys of \
                 [[uncertainty]] entries with a distribution";
    let Some(node) = r.node(ctx, "keys") else {
        return Err(r.missing(ctx, "keys", valid));
    };
    let NodeValue::Array(items) = &node.value else {
        return Err(type_error(
            ctx,
            &r.field("keys"),
            node,
            "an array of two keys",
        ));
    };
    let texts: Vec<&str> = items
        .iter()
        .filter_map(|n| match &n.value {
            NodeValue::Str(s) => Some(s.as_str()),
            _ => None,
        })
        .collect();
    if items.len() != 2 || texts.len() != 2 {
        return Err(r.error(
            ctx,
            "keys",
            format!(
                "has {} entries, {} of them strings",
                items.len(),
                texts.len()
            ),
            valid,
        ));
    }
    for (text, item) in texts.iter().zip(items) {
        if !drawn.contains(text) {
            return Err(ctx.error_at_offset(
                item.span.start,
                &r.field("keys"),
                format!("{text:?} is not the key of an [[uncertainty]] entry with a distribution"),
                format!(
                    "expected one of: {}",
                    if drawn.is_empty() {
                        "(none: no [[uncertainty]] entry has a distribution)".to_string()
                    } else {
                        drawn.join(", ")
                    }
                ),
            ));
        }
    }
    if texts[0] == texts[1] {
        return Err(r.error(
            ctx,
            "keys",
            format!("pairs {:?} with itself", texts[0]),
            valid,
        ));
    }
    Ok((texts[0].to_string(), texts[1].to_string()))
}

/// Refuse a set of pairs that cannot hold together, at the entry of the
/// pair to change (or the first entry, when that pair was not listed).
fn check_consistent(
    ctx: &Context,
    uncertainty: &[UncertainInput],
    pairs: &[RankPair],
    places: &[(usize, String)],
) -> Read<()> {
    let drawn = drawn_keys(uncertainty);
    let fail = |offset: usize, field: &str, e: &CorrelationError| {
        ctx.error_at_offset(
            offset,
            field,
            e.to_string(),
            "expected correlations that can hold together",
        )
    };
    let first_place = places.first().cloned().unwrap_or((0, "correlation".into()));
    let target =
        target_of(uncertainty, pairs).map_err(|e| fail(first_place.0, &first_place.1, &e))?;
    let Err(e) = target.check_consistent() else {
        return Ok(());
    };
    let CorrelationError::NotPositiveSemiDefinite {
        first,
        second,
        value,
        nearest,
    } = e
    else {
        return Err(fail(first_place.0, &first_place.1, &e));
    };
    let name = |i: usize| drawn.get(i).copied().unwrap_or("?").to_string();
    let (a, b) = (name(first), name(second));
    let entry = pairs
        .iter()
        .position(|p| (p.first == a && p.second == b) || (p.first == b && p.second == a));
    let (offset, field) = match entry {
        Some(k) => places[k].clone(),
        None => first_place,
    };
    let change = match nearest {
        Some(v) => format!("e.g. to about {v:.3}, the nearest value that works with the others"),
        None => "no change of that pair alone is enough; change others too".to_string(),
    };
    Err(ctx.error_at_offset(
        offset,
        &field,
        format!(
            "the rank correlations cannot hold together (the matrix is not positive \
             semi-definite): change the correlation of {a:?} and {b:?} ({value}){}",
            if entry.is_some() {
                String::new()
            } else {
                " (not listed: add a [[correlation]] entry for it)".to_string()
            }
        ),
        format!("expected correlations that can hold together; {change}"),
    ))
}
