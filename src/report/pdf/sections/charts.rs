//! The chart pages: cumulative discounted savings with payback, break-even
//! premium against fuel price, lifecycle cost by stream, and a
//! temperature–entropy diagram of each candidate.

use super::Ctx;
use crate::report::charts::breakdown::breakdown_chart;
use crate::report::charts::difference::difference_chart;
use crate::report::charts::fuel_price::fuel_price_chart;
use crate::report::charts::geometry::Mark;
use crate::report::charts::savings::savings_chart;
use crate::report::charts::style::series_style;
use crate::report::charts::ts::ts_chart;
use crate::report::pdf::document::{line_height_mm, Composer, Orientation};
use crate::report::pdf::fonts::Face;

/// Gap between charts stacked on a page, mm.
const GAP_MM: f32 = 6.0;
/// Size of the note under the diagrams, pt.
const NOTE_PT: f32 = 8.0;

/// Smallest chart worth drawing, mm: with less room left on the page, the
/// charts start on the next one.
const MIN_CHART_MM: f32 = 80.0;

/// Height for each of `count` charts sharing what is left of the page
/// (each followed by a gap; half a millimetre kept back so rounding never
/// pushes the last one over), capped at `max_mm`. Starts a new page when
/// the share would be smaller than [`MIN_CHART_MM`].
fn share(composer: &mut Composer, count: usize, max_mm: f32) -> f32 {
    let height = |composer: &mut Composer| {
        let room = composer.remaining_mm() - GAP_MM * count as f32 - 0.5;
        (room / count as f32).min(max_mm)
    };
    if height(composer) < MIN_CHART_MM.min(max_mm) {
        composer.new_page(Orientation::Portrait);
    }
    height(composer)
}

fn place(composer: &mut Composer, marks: Vec<Mark>) {
    for mark in marks {
        composer.push(mark);
    }
}

/// Lay out the chart pages.
pub fn charts(ctx: &Ctx, composer: &mut Composer) {
    let model = ctx.model;
    let l = ctx.labels;
    // Flows on from the briefing page: on short paper whatever of page 1
    // runs over shares the next page with the charts.
    // The heading keeps with room for the first chart, so it is never left
    // alone at the foot of a page; each chart then takes the room left on
    // its page (at most 118 mm), or starts a new page when less than a
    // chart's minimum is left, so no page holds a lone chart with space
    // for another.
    composer.heading(&l.charts, 1, MIN_CHART_MM + GAP_MM + 0.5);
    let height = share(composer, 1, 118.0);
    let area = composer.reserve(height);
    if let Some(chart) = savings_chart(model, l, area) {
        place(composer, chart.chart.marks);
        composer.gap(GAP_MM);
    }
    let height = share(composer, 1, 118.0);
    let area = composer.reserve(height);
    if let Some(chart) = fuel_price_chart(model, l, area) {
        place(composer, chart.marks);
        composer.gap(GAP_MM);
    }
    let height = share(composer, 1, 118.0);
    let area = composer.reserve(height);
    if let Some(chart) = breakdown_chart(model, l, area) {
        place(composer, chart.chart.marks);
        composer.gap(GAP_MM);
    }
    let height = share(composer, 1, 118.0);
    let area = composer.reserve(height);
    if let Some(chart) = difference_chart(model, l, area) {
        place(composer, chart.chart.marks);
        composer.gap(GAP_MM);
    }
    let note_mm = 2.0 * line_height_mm(NOTE_PT) + 2.0;
    let drawable = model
        .candidates
        .iter()
        .filter(|c| c.cycle.states.len() >= 2);
    let last = drawable.clone().count();
    for (i, candidate) in drawable.enumerate() {
        // Two diagrams and the note fit one page.
        let height = 112.0f32.min((composer.content_box().height_mm - note_mm) / 2.0 - GAP_MM);
        // The note on reading the diagrams stays with the last one.
        let keep = if i + 1 == last { note_mm } else { 0.0 };
        if composer.remaining_mm() < height + keep {
            composer.new_page(Orientation::Portrait);
        }
        let area = composer.reserve(height);
        if let Some(chart) = ts_chart(candidate, model.meta.units, l, area, series_style(i).colour)
        {
            place(composer, chart.marks);
        }
        composer.gap(GAP_MM);
    }
    if last > 0 {
        composer.paragraph(&l.ts_note, NOTE_PT, Face::Regular, 0.0);
    }
}
