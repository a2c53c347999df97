//! The briefing page: title block, the decision in one sentence, the key
//! figures of every candidate, a verdict per candidate, and the three
//! inputs that move the answer most.

use super::{pdf_units, Ctx};
use crate::report::charts::geometry::{Anchor, Colour, Mark, Pt, Weight};
use crate::report::format;
use crate::report::model::{CandidateView, Model};
use crate::report::pdf::context::{short_money, with_candidate};
use crate::report::pdf::document::{line_height_mm, Composer, BODY_PT};
use crate::report::pdf::fonts::{Face, MM_PER_PT};
use crate::report::pdf::table::{draw_table, Column, TableStyle};
use crate::report::pdf::text::{wrap, wrap_at_most};
use crate::Result;

/// Candidates per key-figures table; more are set in further tables so
/// columns stay readable.
const CANDIDATES_PER_TABLE: usize = 4;

/// Lines of the title on the briefing page; a longer title is cut with an
/// ellipsis.
pub const TITLE_LINES: usize = 3;

/// The key figures of `c`, in the order of [`figure_names`]. Money is
/// rounded to three significant figures (the ledger keeps the cents).
pub fn key_figures(c: &CandidateView, model: &Model) -> Vec<String> {
    let currency = &model.meta.currency;
    let units = model.meta.units;
    let e = &c.economics;
    let short = |v: Option<rust_decimal::Decimal>| {
        v.map_or_else(|| "n/a".to_string(), |v| short_money(v, currency))
    };
    let headroom = (!c.is_baseline).then_some(c.verdict.margin);
    // A break-even fuel price below zero means no real fuel price makes the
    // two cost the same.
    let fuel_price = e.break_even_fuel_price.map(|p| {
        if p.is_sign_negative() {
            return "none above zero".to_string();
        }
        pdf_units(format::fuel_price_as(
            p,
            currency,
            &model.method.fuel_price_basis,
            &model.method.fuel_price_unit,
        ))
    });
    vec![
        format!(
            "{}\u{a0}MW",
            format::number(c.performance.net_output_kw / 1000.0, 1)
        ),
        short(Some(e.capital_cost)),
        pdf_units(format::heat_rate(
            c.performance.heat_rate_kj_per_kwh,
            c.performance.heat_rate_btu_per_kwh,
            units,
        )),
        short(Some(e.lifecycle_cost)),
        short(e.net_savings_vs_baseline),
        short(e.break_even_premium),
        short(e.premium_asked),
        short(headroom),
        format::payback(e.discounted_payback),
        fuel_price.unwrap_or_else(|| "n/a".to_string()),
    ]
}

/// Row labels of the key-figures table.
pub fn figure_names(ctx: &Ctx) -> Vec<String> {
    let l = ctx.labels;
    vec![
        l.rated_output.clone(),
        l.capital_cost.clone(),
        l.heat_rate.clone(),
        l.lifecycle_cost.clone(),
        l.net_savings.clone(),
        l.break_even_premium.clone(),
        l.premium_asked.clone(),
        l.headroom.clone(),
        l.discounted_payback.clone(),
        l.break_even_fuel_price.clone(),
    ]
}

fn title_block(ctx: &Ctx, composer: &mut Composer) {
    let meta = &ctx.model.meta;
    let content = composer.content_box();
    let kicker = composer.reserve(line_height_mm(10.0));
    composer.push(Mark::Label {
        at: Pt::new(kicker.x_mm, kicker.top_mm() - 10.0 * MM_PER_PT),
        text: ctx.labels.report_title.clone(),
        size_pt: 10.0,
        anchor: Anchor::Left,
        weight: Weight::Regular,
        colour: Colour::grey(0.35),
        vertical: false,
    });
    // A title longer than three lines is cut with an ellipsis here (the
    // running header shows one line of it; the PDF metadata keeps it whole).
    for line in wrap_at_most(&meta.title, Face::Bold, 18.0, content.width_mm, TITLE_LINES) {
        let rect = composer.reserve(line_height_mm(18.0));
        composer.push(Mark::Label {
            at: Pt::new(rect.x_mm, rect.top_mm() - 18.0 * MM_PER_PT),
            text: line,
            size_pt: 18.0,
            anchor: Anchor::Left,
            weight: Weight::Bold,
            colour: Colour::BLACK,
            vertical: false,
        });
    }
    composer.gap(2.0);
    let l = ctx.labels;
    let mut facts = vec![
        (l.prepared_for.as_str(), meta.prepared_for.clone()),
        (l.prepared_by.as_str(), meta.prepared_by.clone()),
        (l.study_date.as_str(), meta.date.clone()),
    ];
    if let Some(site) = &meta.site_name {
        facts.push((l.site.as_str(), site.clone()));
    }
    facts.push((l.scenario_file.as_str(), meta.scenario_file.clone()));
    let m = &ctx.model.method;
    facts.push((
        l.fuel_price.as_str(),
        pdf_units(format::fuel_price_echo(
            m.fuel_price_per_gj,
            m.fuel_price_written.as_deref(),
            &meta.currency,
            &m.fuel_price_basis,
            &m.fuel_price_unit,
            meta.units,
        )),
    ));
    let label_width = 32.0;
    for (name, value) in facts {
        let lines = wrap(
            &value,
            Face::Regular,
            BODY_PT,
            content.width_mm - label_width,
        );
        for (i, line) in lines.iter().enumerate() {
            let rect = composer.reserve(line_height_mm(BODY_PT));
            let baseline = rect.top_mm() - BODY_PT * MM_PER_PT;
            if i == 0 {
                composer.push(Mark::Label {
                    at: Pt::new(rect.x_mm, baseline),
                    text: name.to_string(),
                    size_pt: BODY_PT,
                    anchor: Anchor::Left,
                    weight: Weight::Bold,
                    colour: Colour::BLACK,
                    vertical: false,
                });
            }
            composer.push(Mark::text(
                Pt::new(rect.x_mm + label_width, baseline),
                line.clone(),
                BODY_PT,
                Anchor::Left,
            ));
        }
    }
    composer.gap(3.0);
}

/// Lay out the briefing page.
pub fn briefing(ctx: &Ctx, composer: &mut Composer) -> Result<()> {
    let model = ctx.model;
    let l = ctx.labels;
    title_block(ctx, composer);

    composer.heading(&l.recommendation, 2, 12.0);
    let decision = ctx.wording.render("decision.j2", &ctx.base)?;
    // The recommendation itself is the first paragraph, in bold; what
    // follows explains the figures.
    for (i, block) in crate::report::wording::blocks(&decision)
        .into_iter()
        .enumerate()
    {
        match block {
            crate::report::wording::Block::Paragraph(p) if i == 0 => {
                composer.paragraph(&p, 11.0, Face::Bold, 0.0)
            }
            crate::report::wording::Block::Paragraph(p) => {
                composer.paragraph(&p, BODY_PT, Face::Regular, 0.0)
            }
            crate::report::wording::Block::Bullet(b) => composer.bullet(&b, BODY_PT),
            crate::report::wording::Block::Heading(h) => composer.heading(&h, 2, 12.0),
        }
    }

    composer.heading(&l.key_figures, 2, 30.0);
    figures_by_candidate(ctx, composer, &figure_names(ctx), key_figures);

    composer.heading(&l.verdicts, 2, 12.0);
    // The baseline needs no verdict: the key figures name it and every
    // other verdict is against it.
    for c in model.candidates.iter().filter(|c| !c.is_baseline) {
        let text = ctx
            .wording
            .render("verdict.j2", &with_candidate(model, c))?;
        let text = match contract_sentence(ctx, c) {
            Some(sentence) => format!("{} {sentence}", text.trim()),
            None => text.trim().to_string(),
        };
        composer.bullet(&text, BODY_PT);
    }
    // Every bid whose vendor figures the datasheet check flags, the
    // baseline included.
    for c in model.candidates.iter().filter(|c| {
        c.performance
            .implied
            .as_ref()
            .is_some_and(|i| i.verdict != "plausible")
    }) {
        let text = ctx
            .wording
            .render("datasheet.j2", &with_candidate(model, c))?;
        composer.bullet(text.trim(), BODY_PT);
    }

    composer.heading(&l.key_assumptions, 2, 15.0);
    if model.key_assumptions.is_empty() {
        composer.paragraph(&l.no_key_assumptions, BODY_PT, Face::Regular, 0.0);
    } else {
        let columns = vec![
            Column::left(l.assumption.clone()),
            Column::left(l.base_value.clone()),
            Column::right(l.swing.clone()),
        ];
        let rows: Vec<Vec<String>> = model
            .key_assumptions
            .iter()
            .take(3)
            .map(|k| {
                vec![
                    k.label.clone(),
                    k.base_value.clone(),
                    short_money(k.swing, &model.meta.currency),
                ]
            })
            .collect();
        draw_table(composer, &columns, &rows, &TableStyle::default());
    }
    evaluation_factors(ctx, composer);
    Ok(())
}

/// The sentence on `c`'s guarantee for its verdict, when the briefing has
/// no risk section to give the chance of a shortfall and the expected
/// damages (that section prints them for every candidate with a guarantee,
/// and one more line here would push the key assumptions off page 1): the
/// damages or bonus settled on the scenario's as-built figures, if any.
fn contract_sentence(ctx: &Ctx, c: &CandidateView) -> Option<String> {
    let l = ctx.labels;
    let currency = &ctx.model.meta.currency;
    let sampled = ctx
        .model
        .risk
        .as_ref()
        .and_then(|r| r.candidates.iter().find(|rc| rc.candidate_id == c.id))
        .is_some_and(|rc| rc.contract.is_some());
    if sampled {
        return None;
    }
    // The amount on the settlement row (paid once, on the commercial
    // operation date).
    let settled = c
        .ledger
        .iter()
        .map(|r| r.guarantee_settlement)
        .find(|v| !v.is_zero())?;
    if settled.is_sign_negative() {
        Some(
            l.briefing_damages
                .replace("{damages}", &short_money(-settled, currency)),
        )
    } else {
        Some(
            l.briefing_bonus
                .replace("{bonus}", &short_money(settled, currency)),
        )
    }
}

/// The evaluation factors of `c`, in the order of [`factor_names`]:
/// present values, three significant figures.
pub fn factor_figures(c: &CandidateView, model: &Model) -> Vec<String> {
    let currency = &model.meta.currency;
    let e = &c.economics;
    let short = |v: rust_decimal::Decimal| short_money(v, currency);
    vec![
        short(format::per_heat_rate_unit(
            e.value_per_kj_per_kwh_full_load,
            model.meta.units,
        )),
        short(e.value_per_kw),
        short(e.value_per_point.compressor_efficiency),
        short(e.value_per_point.turbine_efficiency),
        e.value_per_point
            .regenerator_effectiveness
            .map_or_else(|| "n/a".to_string(), short),
        format!("{:.3}", e.dispatch_heat_rate_ratio),
    ]
}

/// Row labels of the evaluation-factors table.
pub fn factor_names(ctx: &Ctx) -> Vec<String> {
    let l = ctx.labels;
    vec![
        match ctx.model.meta.units {
            crate::report::model::Units::Si => l.factor_heat_rate.clone(),
            crate::report::model::Units::Us => l.factor_heat_rate_us.clone(),
        },
        l.factor_output.clone(),
        l.factor_compressor.clone(),
        l.factor_turbine.clone(),
        l.factor_regenerator.clone(),
        l.factor_dispatch_ratio.clone(),
    ]
}

/// What one unit of each guaranteed figure is worth, per candidate.
fn evaluation_factors(ctx: &Ctx, composer: &mut Composer) {
    let l = ctx.labels;
    composer.heading(&l.evaluation_factors, 2, 30.0);
    figures_by_candidate(ctx, composer, &factor_names(ctx), factor_figures);
    composer.paragraph(&l.factors_note, 8.0, Face::Regular, 0.0);
}

/// A table of named figures (rows) by candidate (columns), in groups of
/// [`CANDIDATES_PER_TABLE`] candidates; `figures` gives one candidate's
/// column in the order of `names`.
fn figures_by_candidate(
    ctx: &Ctx,
    composer: &mut Composer,
    names: &[String],
    figures: fn(&CandidateView, &Model) -> Vec<String>,
) {
    let model = ctx.model;
    for group in model.candidates.chunks(CANDIDATES_PER_TABLE) {
        let mut columns = vec![Column::left(ctx.labels.figure.clone())];
        columns.extend(group.iter().map(|c| Column::right(c.label.clone())));
        let values: Vec<Vec<String>> = group.iter().map(|c| figures(c, model)).collect();
        let rows: Vec<Vec<String>> = names
            .iter()
            .enumerate()
            .map(|(i, name)| {
                std::iter::once(name.clone())
                    .chain(values.iter().map(|f| f[i].clone()))
                    .collect()
            })
            .collect();
        let style = TableStyle {
            size_pt: 8.0,
            max_lines: 2,
            bold_first_column: true,
            header: true,
        };
        draw_table(composer, &columns, &rows, &style);
    }
}
