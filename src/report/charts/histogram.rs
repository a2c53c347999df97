//! Histogram of one candidate's sampled net savings, with the P10, P50 and
//! P90 and the break-even line (zero savings) marked.

use super::frame::{draw_frame, Axis, LegendEntry, Swatch, SMALL_PT};
use super::geometry::{rect_corners, Anchor, Colour, LineStyle, Mark, Pt, Rect};
use super::scale::{money_f64, nice_ticks, tight_ticks, MoneyScale};
use super::Chart;
use crate::report::model::RiskCandidate;
use crate::report::pdf::labels::Labels;

/// The histogram of `risk` inside `area` titled `title`; `None` when it has
/// no bins.
pub fn histogram_chart(
    risk: &RiskCandidate,
    title: &str,
    currency: &str,
    labels: &Labels,
    area: Rect,
) -> Option<Chart> {
    let counts = &risk.histogram.counts;
    if counts.is_empty() {
        return None;
    }
    let low = money_f64(risk.histogram.low);
    let width = money_f64(risk.histogram.bin_width);
    let high = low + width * counts.len() as f64;
    let stats = &risk.net_savings;
    let lines = [
        ("P10", money_f64(stats.p10), LineStyle::Dashed),
        ("P50", money_f64(stats.p50), LineStyle::Solid),
        ("P90", money_f64(stats.p90), LineStyle::Dotted),
    ];
    let x_low = lines.iter().map(|l| l.1).fold(low.min(0.0), f64::min);
    let x_high = lines.iter().map(|l| l.1).fold(high.max(0.0), f64::max);
    let money = MoneyScale::for_magnitude(x_low.abs().max(x_high.abs()));
    let max_count = counts.iter().copied().max().unwrap_or(1).max(1) as f64;
    let x_ticks = tight_ticks(x_low, x_high, 7, 0.04);
    let y_ticks = nice_ticks(0.0, max_count, 5);
    let x_axis = Axis::numeric(
        format!("{}, {}", labels.risk_axis, money.unit(currency)),
        &x_ticks,
        money.divisor,
    );
    let y_axis = Axis::numeric(labels.samples_axis.clone(), &y_ticks, 1.0);
    let accent = Colour::rgb(0.835, 0.369, 0.0);
    let legend: Vec<LegendEntry> = lines
        .iter()
        .map(|(name, _, style)| LegendEntry {
            label: (*name).to_string(),
            swatch: Swatch::Line {
                style: *style,
                colour: accent,
                marker: None,
            },
        })
        .collect();
    let mut marks = Vec::new();
    let frame = draw_frame(area, title, &x_axis, &y_axis, &legend, &mut marks);
    let fill = Colour::rgb(0.55, 0.70, 0.85);
    for (i, count) in counts.iter().enumerate() {
        if *count == 0 {
            continue;
        }
        let left = low + width * i as f64;
        let rect = Rect::new(
            frame.x.map(left),
            frame.y.map(0.0),
            frame.x.map(left + width) - frame.x.map(left),
            frame.y.map(*count as f64) - frame.y.map(0.0),
        );
        marks.push(Mark::Area {
            points: rect_corners(rect),
            fill,
            outline: Some(Colour::grey(0.25)),
            hatch: Vec::new(),
        });
    }
    let zero = frame.x.map(0.0);
    marks.push(Mark::rule(
        Pt::new(zero, frame.plot.y_mm),
        Pt::new(zero, frame.plot.top_mm()),
        1.0,
    ));
    for (k, (name, value, style)) in lines.iter().enumerate() {
        let x = frame.x.map(*value);
        marks.push(Mark::Polyline {
            points: vec![Pt::new(x, frame.plot.y_mm), Pt::new(x, frame.plot.top_mm())],
            style: *style,
            width_pt: 1.2,
            colour: accent,
        });
        // Staggered down from the top so close percentiles do not overlap;
        // set on the side of the line with more room.
        let (dx, anchor) = if x > frame.plot.x_mm + frame.plot.width_mm * 0.8 {
            (-0.8, Anchor::Right)
        } else {
            (0.8, Anchor::Left)
        };
        marks.push(Mark::text(
            Pt::new(x + dx, frame.plot.top_mm() - 3.0 - k as f32 * 3.2),
            *name,
            SMALL_PT - 0.5,
            anchor,
        ));
    }
    Some(Chart { marks, frame })
}
