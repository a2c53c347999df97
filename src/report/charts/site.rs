//! The "Site performance" charts: each candidate's base-load output and
//! heat rate against ambient temperature, and its heat rate against load,
//! every candidate on one chart, with the site's annual mean temperature
//! marked.

use super::frame::{draw_frame, Axis, LegendEntry, Swatch, SMALL_PT};
use super::geometry::{Anchor, Colour, LineStyle, Mark, Pt, Rect};
use super::scale::tight_ticks;
use super::style::{series_marks, series_style};
use super::Chart;
use crate::report::format::{self, Quantity};
use crate::report::model::{Model, SiteCandidateView};
use crate::report::pdf::labels::Labels;

/// Which curve of each candidate a chart draws.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum SiteCurve {
    /// Base-load net output against ambient temperature.
    Output,
    /// Base-load net heat rate against ambient temperature.
    HeatRate,
    /// Net heat rate at the site against load.
    PartLoad,
}

/// A candidate's index (for its style), view and display points.
type Series<'m> = (usize, &'m SiteCandidateView, Vec<(f64, f64)>);

/// The points (display x, display y) of one candidate's `curve`; a point
/// the machine cannot run at is left out.
fn points(model: &Model, c: &SiteCandidateView, curve: SiteCurve) -> Vec<(f64, f64)> {
    let units = model.meta.units;
    let view = &model.site_performance;
    let temperature = |t: f64| format::in_units(Quantity::Temperature, t, units);
    let heat_rate = |h: f64| format::in_units(Quantity::HeatRate, h, units);
    match curve {
        SiteCurve::Output => view
            .temperatures_k
            .iter()
            .zip(&c.output_kw)
            .filter_map(|(t, v)| v.map(|v| (temperature(*t), v / 1000.0)))
            .collect(),
        SiteCurve::HeatRate => view
            .temperatures_k
            .iter()
            .zip(&c.heat_rate_kj_per_kwh)
            .filter_map(|(t, v)| v.map(|v| (temperature(*t), heat_rate(v))))
            .collect(),
        SiteCurve::PartLoad => view
            .loads
            .iter()
            .zip(&c.part_load_heat_rate_kj_per_kwh)
            .filter_map(|(l, v)| v.map(|v| (l * 100.0, heat_rate(v))))
            .collect(),
    }
}

/// The chart of `curve` inside `area`, or `None` when no candidate has a
/// point of it.
pub fn site_chart(model: &Model, labels: &Labels, curve: SiteCurve, area: Rect) -> Option<Chart> {
    let units = model.meta.units;
    let series: Vec<Series> = model
        .site_performance
        .candidates
        .iter()
        .enumerate()
        .map(|(i, c)| (i, c, points(model, c, curve)))
        .filter(|(_, _, p)| !p.is_empty())
        .collect();
    if series.is_empty() {
        return None;
    }
    let site_x = format::in_units(
        Quantity::Temperature,
        model.site_performance.site_temperature_k,
        units,
    );
    let xs = series.iter().flat_map(|s| s.2.iter().map(|p| p.0));
    let ys: Vec<f64> = series
        .iter()
        .flat_map(|s| s.2.iter().map(|p| p.1))
        .collect();
    let (x_min, x_max) = xs.fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
        (lo.min(v), hi.max(v))
    });
    let (y_min, y_max) = ys
        .iter()
        .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
            (lo.min(*v), hi.max(*v))
        });
    let heat_rate_unit = format::unit(Quantity::HeatRate, units);
    let temperature_title = format!(
        "{}, {}",
        labels.site_temperature_axis,
        format::unit(Quantity::Temperature, units)
    );
    let (title, x_title, y_title) = match curve {
        SiteCurve::Output => (
            &labels.site_output_chart,
            temperature_title,
            format!("{}, MW", labels.site_output_axis),
        ),
        SiteCurve::HeatRate => (
            &labels.site_heat_rate_chart,
            temperature_title,
            format!("{}, {heat_rate_unit}", labels.site_heat_rate_axis),
        ),
        SiteCurve::PartLoad => (
            &labels.site_part_load_chart,
            format!("{}, %", labels.site_load_axis),
            format!("{}, {heat_rate_unit}", labels.site_heat_rate_axis),
        ),
    };
    let x_ticks = tight_ticks(x_min, x_max, 7, 0.0);
    let y_ticks = tight_ticks(y_min, y_max, 6, 0.06);
    let x_axis = Axis::numeric(x_title, &x_ticks, 1.0);
    let y_axis = Axis::numeric(y_title, &y_ticks, 1.0);
    let legend: Vec<LegendEntry> = series
        .iter()
        .map(|(i, c, _)| {
            let style = series_style(*i);
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
    let mut marks = Vec::new();
    let frame = draw_frame(area, title, &x_axis, &y_axis, &legend, &mut marks);
    if curve != SiteCurve::PartLoad && site_x >= x_ticks.low && site_x <= x_ticks.high {
        let x = frame.x.map(site_x);
        marks.push(Mark::Polyline {
            points: vec![Pt::new(x, frame.plot.y_mm), Pt::new(x, frame.plot.top_mm())],
            style: LineStyle::Dashed,
            width_pt: 0.8,
            colour: Colour::grey(0.35),
        });
        marks.push(Mark::text(
            Pt::new(x + 1.0, frame.plot.top_mm() - SMALL_PT * 0.35 - 1.0),
            labels.site_mean_marker.clone(),
            SMALL_PT,
            Anchor::Left,
        ));
    }
    for (i, _, pts) in &series {
        let style = series_style(*i);
        let placed: Vec<Pt> = pts
            .iter()
            .map(|(x, y)| Pt::new(frame.x.map(*x), frame.y.map(*y)))
            .collect();
        marks.extend(series_marks(&placed, &style, 12));
    }
    Some(Chart { marks, frame })
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Every drawn point of a series lies inside the plot area (the chart
    /// geometry keeps each curve within its axes).
    #[test]
    fn temperature_curves_sit_inside_the_plot() {
        let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR"))
            .join("scenarios/corvel-bay-peaker.toml");
        let loaded = match crate::scenario::load(&path) {
            Ok(l) => l,
            Err(e) => panic!("demo loads: {e}"),
        };
        let options = crate::analysis::model::ModelOptions {
            units: crate::report::model::Units::Si,
            sensitivity: false,
        };
        let model = match crate::analysis::model::build_model(&loaded, &options) {
            Ok(m) => m,
            Err(e) => panic!("demo model builds: {e}"),
        };
        let labels = Labels::default();
        let area = Rect::new(20.0, 20.0, 170.0, 110.0);
        for curve in [SiteCurve::Output, SiteCurve::HeatRate, SiteCurve::PartLoad] {
            let Some(chart) = site_chart(&model, &labels, curve, area) else {
                panic!("the demo has {curve:?} curves");
            };
            let plot = chart.frame.plot;
            for c in &model.site_performance.candidates {
                for (x, y) in points(&model, c, curve) {
                    let (px, py) = (chart.frame.x.map(x), chart.frame.y.map(y));
                    assert!(px >= plot.x_mm - 0.01 && px <= plot.x_mm + plot.width_mm + 0.01);
                    assert!(py >= plot.y_mm - 0.01 && py <= plot.top_mm() + 0.01);
                }
            }
        }
    }
}
