//! Assumptions: every input with its unit and stated source (scenario-wide
//! inputs first, then one table per candidate with the candidate prefix
//! taken off the keys), each candidate's capital payment dates, the
//! defaults the loader applied (one line for a default every candidate
//! shares) and the warnings.

use super::Ctx;
use crate::report::model::{InputView, Model};
use crate::report::pdf::context::money;
use crate::report::pdf::document::{Composer, BODY_PT};
use crate::report::pdf::fonts::Face;
use crate::report::pdf::table::{draw_table, Column, TableStyle};

const STYLE: TableStyle = TableStyle {
    size_pt: 8.0,
    max_lines: 4,
    bold_first_column: false,
    header: true,
};

/// The candidate a key belongs to (`candidate[ID].rest` → `(ID, rest)`).
pub fn split_candidate_key(key: &str) -> Option<(&str, &str)> {
    let rest = key.strip_prefix("candidate[")?;
    let (id, field) = rest.split_once("].")?;
    Some((id, field))
}

/// The unit as printed: a bare number of dispatch hours is in hours, and
/// the font has the degree sign.
fn unit_of(input: &InputView) -> String {
    match input.unit.as_str() {
        "" if input.key.ends_with(".hours") => "h".to_string(),
        "degC" => "°C".to_string(),
        "degF" => "°F".to_string(),
        unit => unit.to_string(),
    }
}

fn input_rows<'a>(inputs: impl Iterator<Item = (&'a InputView, &'a str)>) -> Vec<Vec<String>> {
    inputs
        .map(|(i, key)| {
            vec![
                key.to_string(),
                i.value.clone(),
                unit_of(i),
                i.source.clone().unwrap_or_default(),
            ]
        })
        .collect()
}

fn input_table(ctx: &Ctx, composer: &mut Composer, rows: &[Vec<String>]) {
    let l = ctx.labels;
    // Values are text as often as numbers (titles, names), so they are set
    // left and wrap at spaces like any text.
    let columns = vec![
        Column::left(l.input_key.clone()),
        Column::left(l.input_value.clone()),
        Column::left(l.input_unit.clone()),
        Column::left(l.input_source.clone()),
    ];
    draw_table(composer, &columns, rows, &STYLE);
}

/// Capital payments of `id` as its ledger records them: date and amount.
fn capital_payments(model: &Model, id: &str) -> Option<String> {
    let c = model.candidates.iter().find(|c| c.id == id)?;
    let payments: Vec<String> = c
        .ledger
        .iter()
        .filter(|r| !r.capital.is_zero() && r.operating_hours == 0.0)
        .map(|r| {
            format!(
                "{} {}",
                r.period_start,
                money(r.capital, &model.meta.currency)
            )
        })
        .collect();
    (!payments.is_empty()).then(|| payments.join("; "))
}

/// Lay out the assumptions section.
pub fn assumptions(ctx: &Ctx, composer: &mut Composer) {
    let model = ctx.model;
    let l = ctx.labels;
    composer.heading(&l.assumptions, 1, 40.0);

    composer.heading(&l.inputs, 2, 20.0);
    composer.paragraph(&l.sources_note, BODY_PT, Face::Regular, 0.0);
    let general = input_rows(
        model
            .inputs
            .iter()
            .filter(|i| split_candidate_key(&i.key).is_none())
            .map(|i| (i, i.key.as_str())),
    );
    input_table(ctx, composer, &general);
    for c in &model.candidates {
        let rows = input_rows(model.inputs.iter().filter_map(|i| {
            let (id, field) = split_candidate_key(&i.key)?;
            (id == c.id).then_some((i, field))
        }));
        if rows.is_empty() {
            continue;
        }
        composer.heading(&format!("{} ({})", c.label, c.id), 3, 20.0);
        input_table(ctx, composer, &rows);
        if let Some(payments) = capital_payments(model, &c.id) {
            composer.paragraph(
                &format!("{}: {payments}", l.capital_payments),
                BODY_PT,
                Face::Regular,
                0.0,
            );
        }
    }

    composer.heading(&l.defaults, 2, 15.0);
    if model.applied_defaults.is_empty() {
        composer.paragraph(&l.no_defaults, BODY_PT, Face::Regular, 0.0);
    } else {
        let columns = vec![
            Column::left(l.input_key.clone()),
            Column::left(l.input_value.clone()),
        ];
        draw_table(composer, &columns, &default_rows(ctx), &STYLE);
    }

    composer.heading(&l.warnings, 2, 10.0);
    if model.warnings.is_empty() {
        composer.paragraph(&l.no_warnings, BODY_PT, Face::Regular, 0.0);
    }
    for warning in &model.warnings {
        composer.bullet(warning, BODY_PT);
    }
}

/// The defaults, a default that every candidate received with the same
/// value on one line (`every candidate: field`).
fn default_rows(ctx: &Ctx) -> Vec<Vec<String>> {
    let model = ctx.model;
    let candidates = model.candidates.len();
    let mut rows: Vec<Vec<String>> = Vec::new();
    let mut grouped: Vec<(String, String)> = Vec::new();
    for d in &model.applied_defaults {
        match split_candidate_key(&d.key) {
            Some((_, field)) => {
                let shared = model
                    .applied_defaults
                    .iter()
                    .filter(|o| {
                        split_candidate_key(&o.key).is_some_and(|(_, f)| f == field)
                            && o.value == d.value
                    })
                    .count();
                if candidates > 1 && shared == candidates {
                    let entry = (field.to_string(), d.value.clone());
                    if !grouped.contains(&entry) {
                        rows.push(vec![
                            format!("{}: {field}", ctx.labels.every_candidate),
                            d.value.clone(),
                        ]);
                        grouped.push(entry);
                    }
                } else {
                    rows.push(vec![d.key.clone(), d.value.clone()]);
                }
            }
            None => rows.push(vec![d.key.clone(), d.value.clone()]),
        }
    }
    rows
}
