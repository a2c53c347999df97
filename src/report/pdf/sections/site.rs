//! "Site performance": each bid's fixed machine against ambient
//! temperature (output, heat rate) and load (heat rate), every candidate on
//! one chart; a table of each bid's year as priced (energy, fuel, run
//! hours, starts); and run hours by ambient temperature bin. The figures
//! come from `report::model::SitePerformanceView`, filled in
//! `analysis::site_curves`.

use super::{pdf_units, Ctx};
use crate::report::charts::site::{site_chart, SiteCurve};
use crate::report::format::{self, Quantity};
use crate::report::model::Units;
use crate::report::pdf::document::{Composer, Orientation};
use crate::report::pdf::fonts::Face;
use crate::report::pdf::table::{draw_table, Column, TableStyle};

/// Height of each chart, mm.
const CHART_MM: f32 = 95.0;
/// Smallest chart worth drawing, mm.
const MIN_CHART_MM: f32 = 70.0;
/// Gap after each chart, mm.
const GAP_MM: f32 = 6.0;
/// Size of the notes, pt.
const NOTE_PT: f32 = 8.5;

/// Lay out the section.
pub fn site_performance(ctx: &Ctx, composer: &mut Composer) {
    let l = ctx.labels;
    let model = ctx.model;
    let view = &model.site_performance;
    if view.candidates.is_empty() {
        return;
    }
    composer.heading(&l.site_performance, 1, CHART_MM + 30.0);
    composer.paragraph(&l.site_note, NOTE_PT, Face::Regular, 0.0);
    for c in view.candidates.iter().filter(|c| !c.fixed_machine) {
        composer.paragraph(
            &format!("{}: {}.", c.label, l.site_not_fixed),
            NOTE_PT,
            Face::Regular,
            0.0,
        );
    }
    composer.gap(2.0);
    for curve in [SiteCurve::Output, SiteCurve::HeatRate, SiteCurve::PartLoad] {
        // A chart takes what is left of the page down to its smallest
        // readable height, else starts the next page.
        let mut height = CHART_MM.min(composer.remaining_mm() - GAP_MM - 0.5);
        if height < MIN_CHART_MM {
            composer.new_page(Orientation::Portrait);
            height = CHART_MM;
        }
        let area = composer.reserve(height);
        if let Some(chart) = site_chart(model, l, curve, area) {
            for mark in chart.marks {
                composer.push(mark);
            }
        }
        composer.gap(GAP_MM);
    }
    if view.part_load_from_table {
        composer.paragraph(&l.site_part_load_table_note, NOTE_PT, Face::Regular, 0.0);
        composer.gap(2.0);
    }
    year_table(ctx, composer);
    hours_by_temperature(ctx, composer);
}

/// Energy, fuel, run hours and starts per year by candidate.
fn year_table(ctx: &Ctx, composer: &mut Composer) {
    let l = ctx.labels;
    let units = ctx.model.meta.units;
    composer.heading(&l.site_year_table, 2, 30.0);
    let fuel_unit = format::unit(Quantity::FuelEnergy, units);
    let columns = vec![
        Column::left(l.candidate.clone()),
        Column::right(l.site_energy.clone()),
        Column::right(pdf_units(l.site_fuel.replace("GJ", fuel_unit))),
        Column::right(l.site_run_hours.clone()),
        Column::right(l.site_starts.clone()),
    ];
    let rows: Vec<Vec<String>> = ctx
        .model
        .site_performance
        .candidates
        .iter()
        .map(|c| {
            vec![
                c.label.clone(),
                format::number(c.energy_mwh, 0),
                format::number(
                    format::in_units(Quantity::FuelEnergy, c.fuel_gj_lhv, units),
                    0,
                ),
                format::number(c.run_hours, 0),
                c.starts_per_year.map_or_else(
                    || l.site_starts_not_modelled.clone(),
                    |s| format::number(s, 0),
                ),
            ]
        })
        .collect();
    draw_table(composer, &columns, &rows, &TableStyle::default());
    composer.gap(4.0);
}

/// Run hours by ambient temperature bin, one column per candidate.
fn hours_by_temperature(ctx: &Ctx, composer: &mut Composer) {
    let l = ctx.labels;
    let units = ctx.model.meta.units;
    let candidates = &ctx.model.site_performance.candidates;
    composer.heading(&l.site_hours_by_temperature, 2, 30.0);
    // Every candidate's bins, by lower edge, in ascending order.
    let mut edges: Vec<(f64, f64)> = candidates
        .iter()
        .flat_map(|c| c.hours_by_temperature.iter().map(|b| (b.low_k, b.high_k)))
        .collect();
    edges.sort_by(|a, b| a.0.total_cmp(&b.0));
    edges.dedup();
    // Ambient bins read best in degrees Celsius (they lie on whole
    // multiples of 5 °C) or Fahrenheit, not kelvin.
    let (bin_unit, temperature): (&str, fn(f64) -> String) = match units {
        Units::Si => ("°C", |k| format::number(k - 273.15, 0)),
        Units::Us => ("°F", |k| format::number(k * 1.8 - 459.67, 1)),
    };
    let mut columns = vec![Column::left(pdf_units(format!(
        "{}, {bin_unit}",
        l.site_temperature_bin
    )))];
    columns.extend(candidates.iter().map(|c| Column::right(c.label.clone())));
    let rows: Vec<Vec<String>> = edges
        .iter()
        .map(|&(low, high)| {
            let mut row = vec![format!("{} to {}", temperature(low), temperature(high))];
            row.extend(candidates.iter().map(|c| {
                let hours: f64 = c
                    .hours_by_temperature
                    .iter()
                    .filter(|b| b.low_k == low && b.high_k == high)
                    .map(|b| b.hours)
                    .sum();
                format::number(hours, 0)
            }));
            row
        })
        .collect();
    draw_table(composer, &columns, &rows, &TableStyle::default());
    composer.gap(2.0);
    composer.paragraph(&l.site_profile_note, NOTE_PT, Face::Regular, 0.0);
}
