//! Break-even premium of each candidate against the first-year fuel price,
//! with the scenario's price marked and each bid's premium asked shown
//! where it meets that price.

use super::frame::{draw_frame, Axis, LegendEntry, Swatch, SMALL_PT};
use super::geometry::{Anchor, Colour, LineStyle, Mark, MarkerShape, Pt, Rect};
use super::scale::{money_f64, tight_ticks, MoneyScale};
use super::style::{series_marks, series_style};
use super::Chart;
use crate::report::format;
use crate::report::model::Model;
use crate::report::pdf::labels::Labels;

/// The chart inside `area`, or `None` when the model has no curve.
pub fn fuel_price_chart(model: &Model, labels: &Labels, area: Rect) -> Option<Chart> {
    let curves = &model.fuel_price_curves;
    let series: Vec<_> = curves
        .series
        .iter()
        .filter(|s| !s.points.is_empty())
        .collect();
    if series.is_empty() {
        return None;
    }
    // Prices are drawn in the unit the scenario file wrote its price in.
    let unit = &model.method.fuel_price_unit;
    let in_unit = |per_gj| money_f64(format::fuel_price_in(per_gj, unit));
    // The file's own price, unrounded (34 EUR/MWh, not 9.44 EUR/GJ × 3.6).
    let scenario_price = in_unit(model.method.fuel_price_per_gj);
    let asked: Vec<(usize, f64)> = series
        .iter()
        .enumerate()
        .filter_map(|(i, s)| {
            model
                .candidates
                .iter()
                .find(|c| c.id == s.candidate_id)
                .and_then(|c| c.economics.premium_asked)
                .map(|p| (i, money_f64(p)))
        })
        .collect();
    let prices = series
        .iter()
        .flat_map(|s| s.points.iter().map(|(p, _)| in_unit(*p)))
        .chain([scenario_price]);
    let (x_min, x_max) = prices.fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
        (lo.min(v), hi.max(v))
    });
    let premiums: Vec<f64> = series
        .iter()
        .flat_map(|s| s.points.iter().map(|(_, v)| money_f64(*v)))
        .chain(asked.iter().map(|(_, v)| *v))
        .chain([0.0])
        .collect();
    let y_min = premiums.iter().copied().fold(f64::INFINITY, f64::min);
    let y_max = premiums.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    let money = MoneyScale::for_magnitude(y_min.abs().max(y_max.abs()));
    let currency = &model.meta.currency;
    let x_ticks = tight_ticks(x_min, x_max, 7, 0.0);
    let y_ticks = tight_ticks(y_min, y_max, 6, 0.06);
    let x_axis = Axis::numeric(
        format!(
            "{}, {currency}/{} ({})",
            labels.fuel_price_axis, unit.symbol, model.method.fuel_price_basis
        ),
        &x_ticks,
        1.0,
    );
    let y_axis = Axis::numeric(
        format!("{}, {}", labels.premium_axis, money.unit(currency)),
        &y_ticks,
        money.divisor,
    );
    let label_of = |id: &str| {
        model
            .candidates
            .iter()
            .find(|c| c.id == id)
            .map_or_else(|| id.to_string(), |c| c.label.clone())
    };
    let mut legend: Vec<LegendEntry> = series
        .iter()
        .enumerate()
        .map(|(i, s)| {
            let style = series_style(i);
            LegendEntry {
                label: label_of(&s.candidate_id),
                swatch: Swatch::Line {
                    style: style.line,
                    colour: style.colour,
                    marker: Some(style.marker),
                },
            }
        })
        .collect();
    if !asked.is_empty() {
        legend.push(LegendEntry {
            label: labels.asked_marker.clone(),
            swatch: Swatch::Marker {
                shape: MarkerShape::Square,
                filled: false,
                colour: Colour::BLACK,
            },
        });
    }
    let mut marks = Vec::new();
    let frame = draw_frame(
        area,
        &labels.fuel_price_chart,
        &x_axis,
        &y_axis,
        &legend,
        &mut marks,
    );
    let price_x = frame.x.map(scenario_price);
    marks.push(Mark::Polyline {
        points: vec![
            Pt::new(price_x, frame.plot.y_mm),
            Pt::new(price_x, frame.plot.top_mm()),
        ],
        style: LineStyle::Dashed,
        width_pt: 0.8,
        colour: Colour::grey(0.35),
    });
    marks.push(Mark::text(
        Pt::new(price_x + 1.0, frame.plot.top_mm() - SMALL_PT * 0.35 - 1.0),
        format!(
            "{} {}",
            labels.scenario_price,
            format::fuel_price_as(model.method.fuel_price_per_gj, currency, "", unit)
        ),
        SMALL_PT,
        Anchor::Left,
    ));
    for (i, s) in series.iter().enumerate() {
        let style = series_style(i);
        let points: Vec<Pt> = s
            .points
            .iter()
            .map(|(p, v)| Pt::new(frame.x.map(in_unit(*p)), frame.y.map(money_f64(*v))))
            .collect();
        marks.extend(series_marks(&points, &style, 8));
    }
    for (i, value) in asked {
        marks.push(Mark::Marker {
            at: Pt::new(price_x, frame.y.map(value)),
            shape: MarkerShape::Square,
            size_mm: 2.8,
            colour: series_style(i).colour,
            filled: false,
        });
    }
    Some(Chart { marks, frame })
}
