//! Cumulative discounted savings of each candidate against the baseline
//! over the life, with each discounted-payback crossing marked.

use super::frame::{draw_frame, Axis, LegendEntry, Swatch, SMALL_PT};
use super::geometry::{Anchor, Colour, LineStyle, Mark, MarkerShape, Pt, Rect};
use super::scale::{money_f64, tight_ticks, MoneyScale};
use super::style::{series_marks, series_style};
use super::Chart;
use crate::report::format;
use crate::report::model::{Model, PaybackView};
use crate::report::pdf::labels::Labels;

/// Where a payback crossing was marked.
#[derive(Debug, Clone, PartialEq)]
pub struct PaybackMarker {
    /// Candidate id.
    pub candidate_id: String,
    /// Centre of the marker on the page (on the zero line).
    pub at: Pt,
    /// The payback in years it marks, as given by the model.
    pub years: f64,
}

/// The savings chart and the payback markers placed on it.
#[derive(Debug, Clone, PartialEq)]
pub struct SavingsChart {
    /// The drawn chart.
    pub chart: Chart,
    /// One marker per candidate that pays back within the life.
    pub payback_markers: Vec<PaybackMarker>,
}

/// The chart inside `area`, or `None` when no candidate has savings points
/// (a scenario with a baseline only).
pub fn savings_chart(model: &Model, labels: &Labels, area: Rect) -> Option<SavingsChart> {
    let series: Vec<_> = model
        .candidates
        .iter()
        .filter(|c| !c.is_baseline && !c.cumulative_savings.is_empty())
        .collect();
    if series.is_empty() {
        return None;
    }
    let xs: Vec<f64> = series
        .iter()
        .flat_map(|c| c.cumulative_savings.iter().map(|p| p.years_from_start))
        .collect();
    let x_max = xs.iter().copied().fold(1.0f64, f64::max);
    // Capital paid during construction sits before commercial operation
    // (negative years); the axis starts there so no point falls outside it.
    let x_min = xs.iter().copied().fold(0.0f64, f64::min);
    let ys: Vec<f64> = series
        .iter()
        .flat_map(|c| c.cumulative_savings.iter().map(|p| money_f64(p.savings)))
        .chain([0.0])
        .collect();
    let y_min = ys.iter().copied().fold(f64::INFINITY, f64::min);
    let y_max = ys.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    let money = MoneyScale::for_magnitude(y_min.abs().max(y_max.abs()));
    let currency = &model.meta.currency;

    let x_ticks = tight_ticks(x_min, x_max, 7, 0.0);
    let y_ticks = tight_ticks(y_min, y_max, 6, 0.06);
    // The label already names the unit ("Years from commercial operation").
    let x_axis = Axis::numeric(labels.years_axis.clone(), &x_ticks, 1.0);
    let y_axis = Axis::numeric(
        format!("{}, {}", labels.savings_axis, money.unit(currency)),
        &y_ticks,
        money.divisor,
    );
    let mut legend: Vec<LegendEntry> = series
        .iter()
        .enumerate()
        .map(|(i, c)| {
            let style = series_style(i);
            LegendEntry {
                label: c.label.clone(),
                swatch: Swatch::Line {
                    style: style.line,
                    colour: style.colour,
                    marker: Some(style.marker),
                },
            }
        })
        .collect();
    // The payback marker is explained only where one is drawn.
    let any_payback = series
        .iter()
        .any(|c| matches!(c.economics.discounted_payback, PaybackView::Years(_)));
    legend.extend(any_payback.then(|| LegendEntry {
        label: labels.payback_marker.clone(),
        swatch: Swatch::Marker {
            shape: MarkerShape::Circle,
            filled: false,
            colour: Colour::BLACK,
        },
    }));

    let mut marks = Vec::new();
    let frame = draw_frame(
        area,
        &labels.savings_chart,
        &x_axis,
        &y_axis,
        &legend,
        &mut marks,
    );
    let zero_y = frame.y.map(0.0);
    marks.push(Mark::Polyline {
        points: vec![
            Pt::new(frame.plot.x_mm, zero_y),
            Pt::new(frame.plot.right_mm(), zero_y),
        ],
        style: LineStyle::Solid,
        width_pt: 0.9,
        colour: Colour::BLACK,
    });

    let mut payback_markers = Vec::new();
    for (i, candidate) in series.iter().enumerate() {
        let style = series_style(i);
        let points: Vec<Pt> = candidate
            .cumulative_savings
            .iter()
            .map(|p| {
                Pt::new(
                    frame.x.map(p.years_from_start),
                    frame.y.map(money_f64(p.savings)),
                )
            })
            .collect();
        marks.extend(series_marks(&points, &style, 10));
        if let PaybackView::Years(years) = candidate.economics.discounted_payback {
            let at = Pt::new(frame.x.map(years), zero_y);
            marks.push(Mark::Marker {
                at,
                shape: MarkerShape::Circle,
                size_mm: 3.2,
                colour: Colour::BLACK,
                filled: false,
            });
            let above = if i % 2 == 0 {
                3.0
            } else {
                -3.0 - SMALL_PT * 0.35
            };
            marks.push(Mark::Label {
                at: Pt::new(at.x_mm, at.y_mm + above),
                text: format::payback(candidate.economics.discounted_payback),
                size_pt: SMALL_PT,
                anchor: Anchor::Centre,
                weight: super::geometry::Weight::Regular,
                colour: style.colour,
                vertical: false,
            });
            payback_markers.push(PaybackMarker {
                candidate_id: candidate.id.clone(),
                at,
                years,
            });
        }
    }
    Some(SavingsChart {
        chart: Chart { marks, frame },
        payback_markers,
    })
}
