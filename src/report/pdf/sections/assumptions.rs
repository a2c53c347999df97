//! Assumptions: every input with its unit and stated source, every default
//! the loader applied, and the warnings.

use super::Ctx;
use crate::report::pdf::document::{Composer, Orientation, BODY_PT};
use crate::report::pdf::fonts::Face;
use crate::report::pdf::table::{draw_table, Column, TableStyle};

/// Lay out the assumptions section.
pub fn assumptions(ctx: &Ctx, composer: &mut Composer) {
    let model = ctx.model;
    let l = ctx.labels;
    composer.new_page(Orientation::Portrait);
    composer.heading(&l.assumptions, 1, 40.0);

    composer.heading(&l.inputs, 2, 20.0);
    let columns = vec![
        Column::left(l.input_key.clone()),
        Column::right(l.input_value.clone()),
        Column::left(l.input_unit.clone()),
        Column::left(l.input_source.clone()),
    ];
    let rows: Vec<Vec<String>> = model
        .inputs
        .iter()
        .map(|i| {
            vec![
                i.key.clone(),
                i.value.clone(),
                i.unit.clone(),
                i.source.clone().unwrap_or_else(|| l.not_stated.clone()),
            ]
        })
        .collect();
    let style = TableStyle {
        size_pt: 8.0,
        max_lines: 4,
        bold_first_column: false,
        header: true,
    };
    draw_table(composer, &columns, &rows, &style);

    composer.heading(&l.defaults, 2, 15.0);
    if model.applied_defaults.is_empty() {
        composer.paragraph(&l.no_defaults, BODY_PT, Face::Regular, 0.0);
    } else {
        let columns = vec![
            Column::left(l.input_key.clone()),
            Column::left(l.input_value.clone()),
        ];
        let rows: Vec<Vec<String>> = model
            .applied_defaults
            .iter()
            .map(|d| vec![d.key.clone(), d.value.clone()])
            .collect();
        draw_table(composer, &columns, &rows, &style);
    }

    composer.heading(&l.warnings, 2, 10.0);
    if model.warnings.is_empty() {
        composer.paragraph(&l.no_warnings, BODY_PT, Face::Regular, 0.0);
    }
    for warning in &model.warnings {
        composer.bullet(warning, BODY_PT);
    }
}
