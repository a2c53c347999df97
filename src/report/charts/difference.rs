//! Each cost stream of each candidate against the baseline's (present
//! values): one row per stream, one horizontal bar per candidate from zero
//! to its difference. Positive: the candidate spends more on that stream
//! than the baseline; negative: less (for the residual-value credit, a
//! larger credit shows as negative; for a guarantee settlement, more damages
//! received show as negative). Differences of a few per cent that a
//! stacked bar hides are readable here.

use super::frame::{draw_frame, Axis, LegendEntry, Swatch, SMALL_PT};
use super::geometry::{rect_corners, Colour, Mark, Pt, Rect};
use super::scale::{money_f64, tight_ticks, MoneyScale};
use super::style::series_style;
use super::Chart;
use crate::report::model::{CostBreakdown, Model};
use crate::report::pdf::fonts::Face;
use crate::report::pdf::labels::Labels;
use crate::report::pdf::text::fit;

/// Widest row label, mm.
const ROW_LABEL_MM: f32 = 32.0;

/// One drawn bar, for checking.
#[derive(Debug, Clone, PartialEq)]
pub struct DifferenceBar {
    /// Candidate id.
    pub candidate_id: String,
    /// Stream index, as in [`stream_values`].
    pub stream: usize,
    /// The difference it draws.
    pub value: f64,
    /// The bar's box on the page.
    pub rect: Rect,
}

/// The chart and its bars.
#[derive(Debug, Clone, PartialEq)]
pub struct DifferenceChart {
    /// The drawn chart.
    pub chart: Chart,
    /// Every bar drawn.
    pub bars: Vec<DifferenceBar>,
}

/// Stream values by index: capital, fuel, O&M, overhauls, carbon, output
/// bought_in, residual value, guarantee settlement (a row of the chart
/// only when some candidate's settlement differs from the baseline's).
pub fn stream_values(b: &CostBreakdown) -> [f64; 8] {
    [
        money_f64(b.capital),
        money_f64(b.fuel),
        money_f64(b.operation_and_maintenance),
        money_f64(b.overhauls),
        money_f64(b.carbon),
        money_f64(b.bought_in),
        money_f64(b.residual),
        money_f64(b.guarantee_settlement),
    ]
}

/// The chart inside `area`; `None` without a candidate besides the
/// baseline.
pub fn difference_chart(model: &Model, labels: &Labels, area: Rect) -> Option<DifferenceChart> {
    let series: Vec<_> = model
        .candidates
        .iter()
        .filter_map(|c| Some((c, c.cost_difference.as_ref()?)))
        .collect();
    if series.is_empty() {
        return None;
    }
    let names = [
        &labels.capital,
        &labels.fuel,
        &labels.operation_and_maintenance,
        &labels.overhauls,
        &labels.carbon,
        &labels.bought_in,
        &labels.residual,
        &labels.guarantee_settlement,
    ];
    // Streams where some candidate differs from the baseline.
    let rows: Vec<usize> = (0..names.len())
        .filter(|&s| series.iter().any(|(_, d)| stream_values(d)[s] != 0.0))
        .collect();
    if rows.is_empty() {
        return None;
    }
    let values = series
        .iter()
        .flat_map(|(_, d)| stream_values(d))
        .chain([0.0]);
    let (low, high) = values.fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
        (lo.min(v), hi.max(v))
    });
    let money = MoneyScale::for_magnitude(low.abs().max(high.abs()));
    let x_ticks = tight_ticks(low, high, 6, 0.08);
    let x_axis = Axis::numeric(
        format!(
            "{}, {}",
            labels.difference_axis,
            money.unit(&model.meta.currency)
        ),
        &x_ticks,
        money.divisor,
    );
    let n = rows.len();
    let y_axis = Axis {
        title: String::new(),
        low: 0.0,
        high: n as f64,
        ticks: rows
            .iter()
            .enumerate()
            .map(|(i, &s)| {
                let text = fit(names[s], Face::Regular, SMALL_PT, ROW_LABEL_MM);
                ((n - i) as f64 - 0.5, text)
            })
            .collect(),
        grid: false,
    };
    let legend: Vec<LegendEntry> = series
        .iter()
        .enumerate()
        .map(|(i, (c, _))| LegendEntry {
            label: c.label.clone(),
            swatch: Swatch::Fill {
                colour: series_style(i).colour,
                hatch: false,
            },
        })
        .collect();
    let mut marks = Vec::new();
    let frame = draw_frame(
        area,
        &labels.difference_chart,
        &x_axis,
        &y_axis,
        &legend,
        &mut marks,
    );
    let zero = frame.x.map(0.0);
    let row_h = frame.y.map(1.0) - frame.y.map(0.0);
    let bar_h = (row_h * 0.7 / series.len() as f32).min(4.0);
    let mut bars = Vec::new();
    for (i, &stream) in rows.iter().enumerate() {
        let centre = frame.y.map((n - i) as f64 - 0.5);
        let top = centre + bar_h * series.len() as f32 / 2.0;
        for (k, (c, d)) in series.iter().enumerate() {
            let value = stream_values(d)[stream];
            let end = frame.x.map(value);
            let rect = Rect::new(
                zero.min(end),
                top - bar_h * (k as f32 + 1.0),
                (end - zero).abs(),
                bar_h,
            );
            marks.push(Mark::Area {
                points: rect_corners(rect),
                fill: series_style(k).colour,
                outline: Some(Colour::grey(0.15)),
                hatch: Vec::new(),
            });
            bars.push(DifferenceBar {
                candidate_id: c.id.clone(),
                stream,
                value,
                rect,
            });
        }
    }
    marks.push(Mark::rule(
        Pt::new(zero, frame.plot.y_mm),
        Pt::new(zero, frame.plot.top_mm()),
        0.9,
    ));
    Some(DifferenceChart {
        chart: Chart { marks, frame },
        bars,
    })
}
