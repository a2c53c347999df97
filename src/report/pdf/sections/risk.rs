//! Sensitivity (a tornado per candidate) and risk (a histogram of sampled
//! net savings per candidate, with its summary statistics), each present
//! only when the model carries it.

use super::Ctx;
use crate::report::charts::geometry::Mark;
use crate::report::charts::histogram::histogram_chart;
use crate::report::charts::tornado::tornado_chart;
use crate::report::model::SensitivityBar;
use crate::report::pdf::context::money;
use crate::report::pdf::document::Composer;
use crate::report::pdf::fonts::Face;
use crate::report::pdf::table::{draw_table, Column, TableStyle};

/// Most bars in one tornado; the rest are left off (they move the answer
/// least, the model ranks them last).
const MAX_BARS: usize = 12;

fn label_of(ctx: &Ctx, id: &str) -> String {
    ctx.model
        .candidates
        .iter()
        .find(|c| c.id == id)
        .map_or_else(|| id.to_string(), |c| c.label.clone())
}

fn place(composer: &mut Composer, marks: Vec<Mark>) {
    for mark in marks {
        composer.push(mark);
    }
}

/// Lay out the sensitivity section (nothing when the model has none).
pub fn sensitivity(ctx: &Ctx, composer: &mut Composer) {
    let model = ctx.model;
    if model.sensitivity.is_empty() {
        return;
    }
    // Sections flow on from the one before; the heading moves to a new
    // page only when its first chart would not fit under it.
    composer.heading(&ctx.labels.sensitivity, 1, 80.0);
    let mut ids: Vec<&str> = Vec::new();
    for bar in &model.sensitivity {
        if !ids.contains(&bar.candidate_id.as_str()) {
            ids.push(&bar.candidate_id);
        }
    }
    for id in ids {
        let bars: Vec<&SensitivityBar> = model
            .sensitivity
            .iter()
            .filter(|b| b.candidate_id == id)
            .take(MAX_BARS)
            .collect();
        let height = (28.0 + 9.0 * bars.len() as f32).min(composer.content_box().height_mm);
        let area = composer.reserve(height);
        let title = label_of(ctx, id);
        if let Some(chart) = tornado_chart(&bars, &title, &model.meta.currency, ctx.labels, area) {
            place(composer, chart.marks);
        }
        composer.gap(5.0);
    }
    if model.sensitivity.iter().any(|b| b.default_range) {
        composer.paragraph(&ctx.labels.default_range_note, 8.0, Face::Regular, 0.0);
    }
}

/// Lay out the risk section (nothing when the model has none).
pub fn risk(ctx: &Ctx, composer: &mut Composer) {
    let Some(risk) = &ctx.model.risk else {
        return;
    };
    let l = ctx.labels;
    let currency = &ctx.model.meta.currency;
    composer.heading(&l.risk, 1, 60.0);
    composer.paragraph(
        &format!(
            "{}: {}. {}: {}.",
            l.risk_samples, risk.samples, l.risk_seed, risk.seed
        ),
        9.0,
        Face::Regular,
        0.0,
    );
    if risk.redraws > 0 {
        composer.paragraph(
            &format!(
                "{}: {}{}",
                l.risk_redraws,
                risk.redraws,
                risk.first_redraw_reason
                    .as_deref()
                    .map_or_else(String::new, |r| format!(" (first: {r})"))
            ),
            9.0,
            Face::Regular,
            0.0,
        );
    }
    composer.paragraph(&risk.route_note, 9.0, Face::Regular, 0.0);
    composer.paragraph(&l.risk_note, 9.0, Face::Regular, 0.0);
    let columns = vec![
        Column::left(l.candidate.clone()),
        Column::left(l.figure.clone()),
        Column::right(l.risk_table_mean.clone()),
        Column::right("P10"),
        Column::right("P50"),
        Column::right("P90"),
        Column::right(l.risk_probability.clone()),
    ];
    let mut rows = Vec::new();
    for c in &risk.candidates {
        let label = label_of(ctx, &c.candidate_id);
        for (what, p, probability) in [
            (
                &l.net_savings,
                &c.net_savings,
                format!("{:.1} %", c.probability_beats_baseline * 100.0),
            ),
            (&l.break_even_premium, &c.break_even_premium, String::new()),
        ] {
            // The candidate is named once, on its first row.
            let candidate = if probability.is_empty() {
                String::new()
            } else {
                label.clone()
            };
            rows.push(vec![
                candidate,
                what.clone(),
                money(p.mean, currency),
                money(p.p10, currency),
                money(p.p50, currency),
                money(p.p90, currency),
                probability,
            ]);
        }
    }
    draw_table(
        composer,
        &columns,
        &rows,
        &TableStyle {
            size_pt: 8.0,
            max_lines: 3,
            bold_first_column: false,
            header: true,
        },
    );
    for c in &risk.candidates {
        let Some(contract) = &c.contract else {
            continue;
        };
        let text = l
            .risk_contract
            .replace("{candidate}", &label_of(ctx, &c.candidate_id))
            .replace(
                "{shortfall}",
                &format!("{:.1} %", contract.probability_shortfall * 100.0),
            )
            .replace("{damages}", &money(contract.damages.mean, currency))
            .replace("{p90}", &money(contract.damages.p90, currency));
        composer.paragraph(&text, 9.0, Face::Regular, 0.0);
    }
    for c in &risk.candidates {
        let height = 80.0f32.min(composer.content_box().height_mm);
        let area = composer.reserve(height);
        let title = label_of(ctx, &c.candidate_id);
        if let Some(chart) = histogram_chart(c, &title, currency, l, area) {
            place(composer, chart.marks);
        }
        composer.gap(5.0);
    }
}
