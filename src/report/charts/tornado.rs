//! Sensitivity (tornado) chart of one candidate: for each uncertain input,
//! horizontal bars from the base case to the change in net savings at the
//! input's low and high values, in the order the model ranks them.

use super::frame::{draw_frame, Axis, LegendEntry, Swatch, SMALL_PT};
use super::geometry::{hatch_lines, rect_corners, Anchor, Colour, Mark, Pt, Rect};
use super::scale::{money_f64, tight_ticks, MoneyScale};
use super::style::stream_fill;
use super::Chart;
use crate::report::model::SensitivityBar;
use crate::report::pdf::fonts::{text_width_mm, Face};
use crate::report::pdf::labels::Labels;
use crate::report::pdf::text::fit;

/// Widest row label, mm, before it is cut with an ellipsis.
const ROW_LABEL_MM: f32 = 48.0;

/// The tornado of `bars` (one candidate's, ranked) inside `area`, titled
/// `title`; `None` when there are no bars.
pub fn tornado_chart(
    bars: &[&SensitivityBar],
    title: &str,
    currency: &str,
    labels: &Labels,
    area: Rect,
) -> Option<Chart> {
    if bars.is_empty() {
        return None;
    }
    let deltas = bars
        .iter()
        .flat_map(|b| [money_f64(b.delta_at_low), money_f64(b.delta_at_high)])
        .chain([0.0]);
    let (low, high) = deltas.fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
        (lo.min(v), hi.max(v))
    });
    let money = MoneyScale::for_magnitude(low.abs().max(high.abs()));
    // Room beyond the longest bars for their value labels.
    let x_ticks = tight_ticks(low, high, 6, 0.35);
    let x_axis = Axis::numeric(
        format!("{}, {}", labels.sensitivity_axis, money.unit(currency)),
        &x_ticks,
        money.divisor,
    );
    let n = bars.len();
    let y_axis = Axis {
        title: String::new(),
        low: 0.0,
        high: n as f64,
        ticks: bars
            .iter()
            .enumerate()
            .map(|(i, b)| {
                let mark = if b.default_range { " *" } else { "" };
                let text = fit(
                    &format!("{}{mark}", b.label),
                    Face::Regular,
                    SMALL_PT,
                    ROW_LABEL_MM,
                );
                ((n - i) as f64 - 0.5, text)
            })
            .collect(),
        grid: false,
    };
    let (low_fill, low_hatch) = stream_fill(4);
    let (high_fill, _) = stream_fill(0);
    let legend = [
        LegendEntry {
            label: labels.low_value.clone(),
            swatch: Swatch::Fill {
                colour: low_fill,
                hatch: low_hatch,
            },
        },
        LegendEntry {
            label: labels.high_value.clone(),
            swatch: Swatch::Fill {
                colour: high_fill,
                hatch: false,
            },
        },
    ];
    let mut marks = Vec::new();
    let frame = draw_frame(area, title, &x_axis, &y_axis, &legend, &mut marks);
    let zero = frame.x.map(0.0);
    let row_h = frame.y.map(1.0) - frame.y.map(0.0);
    let bar_h = (row_h * 0.3).min(4.0);
    for (i, b) in bars.iter().enumerate() {
        let centre = frame.y.map((n - i) as f64 - 0.5);
        for (delta, value_text, fill, hatch, below) in [
            (b.delta_at_low, &b.low_value, low_fill, low_hatch, false),
            (b.delta_at_high, &b.high_value, high_fill, false, true),
        ] {
            let end = frame.x.map(money_f64(delta));
            let y0 = if below { centre - bar_h } else { centre };
            let rect = Rect::new(zero, y0, end - zero, bar_h);
            marks.push(Mark::Area {
                points: rect_corners(rect),
                fill,
                outline: Some(Colour::grey(0.15)),
                hatch: if hatch {
                    hatch_lines(rect, 1.4)
                } else {
                    Vec::new()
                },
            });
            // The value beside the bar's end, kept inside the plot: where
            // it would run past the frame it is set against the frame's
            // inner edge instead.
            let text = fit(value_text, Face::Regular, SMALL_PT - 1.0, 30.0);
            let width = text_width_mm(&text, Face::Regular, SMALL_PT - 1.0);
            let (x, anchor) = if end >= zero {
                let x = (end + 1.0).min(frame.plot.right_mm() - 0.5 - width);
                (x, Anchor::Left)
            } else {
                let x = (end - 1.0).max(frame.plot.x_mm + 0.5 + width);
                (x, Anchor::Right)
            };
            marks.push(Mark::text(
                Pt::new(x, y0 + bar_h / 2.0 - SMALL_PT * 0.12),
                text,
                SMALL_PT - 1.0,
                anchor,
            ));
        }
    }
    marks.push(Mark::rule(
        Pt::new(zero, frame.plot.y_mm),
        Pt::new(zero, frame.plot.top_mm()),
        0.9,
    ));
    Some(Chart { marks, frame })
}
