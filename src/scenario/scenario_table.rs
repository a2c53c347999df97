//! The `[scenario]` section: title, authors, date, currency and baseline.

use super::context::Context;
use super::declare::{keys_in, Key, Presence, Shape};
use super::error::ScenarioError;
use super::reader::TableReader;
use super::tree::Node;
use super::types::{Meta, Scenario};
use super::values::required_date;

type Read<T> = Result<T, ScenarioError>;
/// Declarations of this section are keys into the whole [`Scenario`].
type K = Key<Scenario>;

/// The keys of `[scenario]`.
pub(crate) const KEYS: &[Key<Scenario>] = &[
    K::plain("scenario.title", Shape::Text, Presence::Required { example: "\"Unit 3 bid evaluation\"" }, "title of the evaluation"),
    K::plain("scenario.prepared_for", Shape::Text, Presence::Default { text: "not stated", value: 0.0 }, "organisation or person the evaluation is for"),
    K::plain("scenario.prepared_by", Shape::Text, Presence::Default { text: "not stated", value: 0.0 }, "organisation or person who prepared it"),
    K::plain("scenario.date", Shape::Date, Presence::Required { example: "2025-03-14" }, "date of the evaluation (`2025-03-14` or `\"2025-03-14\"`); the money date of a real analysis"),
    K::plain("scenario.currency", Shape::Text, Presence::Required { example: "\"USD\"" }, "ISO 4217 code of every amount"),
    K::plain("scenario.baseline", Shape::Text, Presence::Required { example: "\"standard\"" }, "id of the candidate every other is compared with"),
];

/// Read `[scenario]`; sets the context currency.
pub(crate) fn read_meta(ctx: &mut Context, node: &Node) -> Read<Meta> {
    let r = TableReader::new(ctx, "scenario", node, &keys_in(KEYS, "scenario"))?;
    let title = r.required_string(
        ctx,
        "title",
        "expected a title, e.g. title = \"Unit 3 bid evaluation\"",
    )?;
    let text_or_default = |ctx: &mut Context, key: &str| -> Read<String> {
        Ok(r.string(ctx, key)?.unwrap_or_else(|| {
            r.default(ctx, key, "not stated");
            "not stated".to_string()
        }))
    };
    let prepared_for = text_or_default(ctx, "prepared_for")?;
    let prepared_by = text_or_default(ctx, "prepared_by")?;
    let date = required_date(ctx, &r, "date")?;
    let currency = r.required_string(
        ctx,
        "currency",
        "expected an ISO 4217 code, e.g. currency = \"USD\"",
    )?;
    if currency.len() != 3 || !currency.bytes().all(|b| b.is_ascii_uppercase()) {
        return Err(r.error(
            ctx,
            "currency",
            format!("{currency:?} is not a three-letter currency code"),
            "expected an ISO 4217 code in capitals, e.g. \"USD\" or \"EUR\"",
        ));
    }
    ctx.currency = Some(currency.clone());
    let baseline =
        r.required_string(ctx, "baseline", "expected the id of the baseline candidate")?;
    Ok(Meta {
        title,
        prepared_for,
        prepared_by,
        date,
        currency,
        baseline,
    })
}
