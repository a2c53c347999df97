//! Lifecycle cost of each candidate broken down by stream (present values):
//! capital, fuel, O&M, overhauls, carbon and (when any candidate is charged
//! for an output shortfall) energy and capacity bought in stacked upward from zero, the
//! residual-value credit below zero, and the lifecycle cost marked. A
//! guarantee settlement (when any candidate has one) is its own category:
//! damages received stack below zero with the residual credit, a bonus paid
//! stacks upward, so each bar's segments still add up to the lifecycle cost.

use super::frame::{category_label, draw_frame, Axis, LegendEntry, Swatch};
use super::geometry::{hatch_lines, rect_corners, Colour, Mark, MarkerShape, Rect};
use super::scale::{money_f64, tight_ticks, MoneyScale};
use super::style::stream_fill;
use super::Chart;
use crate::report::model::{CostBreakdown, Model};
use crate::report::pdf::labels::Labels;

/// One drawn segment of a stacked bar, for checking.
#[derive(Debug, Clone, PartialEq)]
pub struct Segment {
    /// Candidate id.
    pub candidate_id: String,
    /// Stream index (0 capital, 1 fuel, 2 O&M, 3 overhauls, 4 carbon,
    /// 5 residual, 6 energy and capacity bought in, 7 guarantee settlement).
    pub stream: usize,
    /// The segment's box on the page.
    pub rect: Rect,
}

/// The breakdown chart and its segments.
#[derive(Debug, Clone, PartialEq)]
pub struct BreakdownChart {
    /// The drawn chart.
    pub chart: Chart,
    /// Every non-empty segment drawn.
    pub segments: Vec<Segment>,
}

/// Index of the energy and capacity bought in stream.
const BOUGHT_IN: usize = 6;

/// Index of the guarantee-settlement stream.
pub const SETTLEMENT: usize = 7;

/// Stream values by index; stacking runs in the order of [`STACK_ORDER`].
fn streams(b: &CostBreakdown) -> [f64; 8] {
    [
        money_f64(b.capital),
        money_f64(b.fuel),
        money_f64(b.operation_and_maintenance),
        money_f64(b.overhauls),
        money_f64(b.carbon),
        money_f64(b.residual),
        money_f64(b.bought_in),
        money_f64(b.guarantee_settlement),
    ]
}

/// Order of stacking and of the legend: the candidate's own costs, then
/// what it buys elsewhere, then the settlement, then the credit.
const STACK_ORDER: [usize; 8] = [0, 1, 2, 3, 4, BOUGHT_IN, SETTLEMENT, 5];

/// The chart inside `area`; `None` if the model has no candidates.
pub fn breakdown_chart(model: &Model, labels: &Labels, area: Rect) -> Option<BreakdownChart> {
    if model.candidates.is_empty() {
        return None;
    }
    let names = [
        &labels.capital,
        &labels.fuel,
        &labels.operation_and_maintenance,
        &labels.overhauls,
        &labels.carbon,
        &labels.residual,
        &labels.bought_in,
        &labels.guarantee_settlement,
    ];
    let settled = model.settled();
    let levelled = model
        .candidates
        .iter()
        .any(|c| !c.cost_breakdown.bought_in.is_zero());
    let (mut low, mut high) = (0.0f64, 0.0f64);
    for c in &model.candidates {
        let values = streams(&c.cost_breakdown);
        high = high.max(values.iter().filter(|v| **v > 0.0).sum());
        low = low.min(values.iter().filter(|v| **v < 0.0).sum());
        high = high.max(money_f64(c.economics.lifecycle_cost));
    }
    let money = MoneyScale::for_magnitude(low.abs().max(high.abs()));
    let y_ticks = tight_ticks(low, high, 6, 0.06);
    let y_axis = Axis::numeric(
        format!(
            "{}, {}",
            labels.present_value_axis,
            money.unit(&model.meta.currency)
        ),
        &y_ticks,
        money.divisor,
    );
    let n = model.candidates.len();
    let slot_mm = (area.width_mm - 30.0) / n as f32;
    let x_axis = Axis {
        title: String::new(),
        low: 0.0,
        high: n as f64,
        ticks: model
            .candidates
            .iter()
            .enumerate()
            .map(|(i, c)| (i as f64 + 0.5, category_label(&c.label, slot_mm * 0.95)))
            .collect(),
        grid: false,
    };
    let mut legend: Vec<LegendEntry> = STACK_ORDER
        .iter()
        .filter(|i| levelled || **i != BOUGHT_IN)
        .filter(|i| settled || **i != SETTLEMENT)
        .map(|&i| {
            let (colour, hatch) = stream_fill(i);
            LegendEntry {
                label: names[i].clone(),
                swatch: Swatch::Fill { colour, hatch },
            }
        })
        .collect();
    legend.push(LegendEntry {
        label: labels.lifecycle_cost.clone(),
        swatch: Swatch::Marker {
            shape: MarkerShape::Diamond,
            filled: true,
            colour: Colour::BLACK,
        },
    });
    let mut marks = Vec::new();
    let frame = draw_frame(
        area,
        &labels.breakdown_chart,
        &x_axis,
        &y_axis,
        &legend,
        &mut marks,
    );
    let mut segments = Vec::new();
    let bar_width = (frame.x.map(1.0) - frame.x.map(0.0)) * 0.5;
    for (i, c) in model.candidates.iter().enumerate() {
        let centre = frame.x.map(i as f64 + 0.5);
        let (mut up, mut down) = (0.0f64, 0.0f64);
        let values = streams(&c.cost_breakdown);
        for stream in STACK_ORDER {
            let value = values[stream];
            if value == 0.0 {
                continue;
            }
            let (from, to) = if value > 0.0 {
                up += value;
                (up - value, up)
            } else {
                down += value;
                (down - value, down)
            };
            let rect = Rect::new(
                centre - bar_width / 2.0,
                frame.y.map(from),
                bar_width,
                frame.y.map(to) - frame.y.map(from),
            );
            let (colour, hatch) = stream_fill(stream);
            marks.push(Mark::Area {
                points: rect_corners(rect),
                fill: colour,
                outline: Some(Colour::grey(0.15)),
                hatch: if hatch {
                    hatch_lines(rect, 1.6)
                } else {
                    Vec::new()
                },
            });
            segments.push(Segment {
                candidate_id: c.id.clone(),
                stream,
                rect,
            });
        }
        let total_y = frame.y.map(money_f64(c.economics.lifecycle_cost));
        marks.push(Mark::Marker {
            at: super::geometry::Pt::new(centre, total_y),
            shape: MarkerShape::Diamond,
            size_mm: 3.0,
            colour: Colour::BLACK,
            filled: true,
        });
    }
    let zero = frame.y.map(0.0);
    marks.push(Mark::rule(
        super::geometry::Pt::new(frame.plot.x_mm, zero),
        super::geometry::Pt::new(frame.plot.right_mm(), zero),
        0.8,
    ));
    Some(BreakdownChart {
        chart: Chart { marks, frame },
        segments,
    })
}
