//! The frame every chart shares: title, legend, plot area, grid, axes with
//! ticks and tick labels, and axis titles (with units), laid out inside a
//! given box so nothing spills out of it.

use super::geometry::{
    hatch_lines, rect_corners, Anchor, Colour, LineStyle, Mark, MarkerShape, Pt, Rect, Weight,
};
use super::scale::{tick_label, LinearScale, Ticks};
use crate::report::pdf::fonts::{text_width_mm, Face, MM_PER_PT};
use crate::report::pdf::text::{fit, wrap_at_most};

/// Font size of tick labels and legend entries, pt.
pub const SMALL_PT: f32 = 7.5;
/// Font size of axis titles, pt.
const AXIS_TITLE_PT: f32 = 8.0;
/// Font size of the chart title, pt.
const TITLE_PT: f32 = 10.0;

/// One axis: its title (with unit), its extent and its labelled ticks.
#[derive(Debug, Clone, PartialEq)]
pub struct Axis {
    /// Title with unit, e.g. "Fuel price, USD/GJ".
    pub title: String,
    /// Data value at the start of the axis.
    pub low: f64,
    /// Data value at the end of the axis.
    pub high: f64,
    /// Tick positions (data values) and their labels.
    pub ticks: Vec<(f64, String)>,
    /// Whether to draw grid lines across the plot at the ticks.
    pub grid: bool,
}

impl Axis {
    /// A numeric axis from nice ticks; tick values are divided by `divisor`
    /// for their labels (money in millions, say).
    pub fn numeric(title: impl Into<String>, ticks: &Ticks, divisor: f64) -> Self {
        Axis {
            title: title.into(),
            low: ticks.low,
            high: ticks.high,
            ticks: ticks
                .values
                .iter()
                .map(|v| (*v, tick_label(v / divisor, ticks.step / divisor)))
                .collect(),
            grid: true,
        }
    }
}

/// What a legend entry shows beside its text.
#[derive(Debug, Clone, PartialEq)]
pub enum Swatch {
    /// A line sample, with an optional marker in its middle.
    Line {
        /// Stroke style.
        style: LineStyle,
        /// Colour.
        colour: Colour,
        /// Marker drawn on the sample.
        marker: Option<MarkerShape>,
    },
    /// A filled box, optionally hatched.
    Fill {
        /// Fill colour.
        colour: Colour,
        /// Hatched.
        hatch: bool,
    },
    /// A lone marker.
    Marker {
        /// Shape.
        shape: MarkerShape,
        /// Filled or hollow.
        filled: bool,
        /// Colour.
        colour: Colour,
    },
}

/// One legend entry.
#[derive(Debug, Clone, PartialEq)]
pub struct LegendEntry {
    /// Text beside the swatch.
    pub label: String,
    /// The swatch.
    pub swatch: Swatch,
}

/// The laid-out frame: the plot area and the scales into it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Frame {
    /// The plot area inside the axes.
    pub plot: Rect,
    /// Horizontal scale, data to mm.
    pub x: LinearScale,
    /// Vertical scale, data to mm.
    pub y: LinearScale,
}

/// Width of a legend entry, mm.
fn entry_width(entry: &LegendEntry) -> f32 {
    11.0 + text_width_mm(&entry.label, Face::Regular, SMALL_PT) + 5.0
}

/// Lay out and draw the frame of a chart inside `area`, pushing its marks
/// onto `marks`, and return the plot area and scales.
pub fn draw_frame(
    area: Rect,
    title: &str,
    x: &Axis,
    y: &Axis,
    legend: &[LegendEntry],
    marks: &mut Vec<Mark>,
) -> Frame {
    let small_h = SMALL_PT * MM_PER_PT;
    let mut top = area.top_mm();

    // Title.
    top -= TITLE_PT * MM_PER_PT;
    marks.push(Mark::Label {
        at: Pt::new(area.x_mm, top),
        text: fit(title, Face::Bold, TITLE_PT, area.width_mm),
        size_pt: TITLE_PT,
        anchor: Anchor::Left,
        weight: Weight::Bold,
        colour: Colour::BLACK,
        vertical: false,
    });
    top -= 2.5;

    // Legend rows.
    let mut cursor_x = area.x_mm;
    let mut row_baseline = top - small_h;
    if !legend.is_empty() {
        for entry in legend {
            let label = fit(&entry.label, Face::Regular, SMALL_PT, area.width_mm - 16.0);
            let width = entry_width(&LegendEntry {
                label: label.clone(),
                swatch: entry.swatch.clone(),
            });
            if cursor_x > area.x_mm && cursor_x + width > area.right_mm() {
                cursor_x = area.x_mm;
                row_baseline -= small_h + 1.8;
            }
            draw_swatch(
                &entry.swatch,
                Pt::new(cursor_x, row_baseline + small_h * 0.35),
                marks,
            );
            marks.push(Mark::text(
                Pt::new(cursor_x + 11.0, row_baseline),
                label,
                SMALL_PT,
                Anchor::Left,
            ));
            cursor_x += width;
        }
        top = row_baseline - 3.0;
    }

    // Margins for the axes.
    let y_label_width = y
        .ticks
        .iter()
        .map(|(_, t)| text_width_mm(t, Face::Regular, SMALL_PT))
        .fold(0.0f32, f32::max);
    let left = AXIS_TITLE_PT * MM_PER_PT + 2.5 + y_label_width + 1.5;
    let x_label_lines = x
        .ticks
        .iter()
        .map(|(_, t)| t.lines().count().max(1))
        .max()
        .unwrap_or(1) as f32;
    let bottom = 1.5 + x_label_lines * (small_h + 0.8) + AXIS_TITLE_PT * MM_PER_PT + 2.5;
    let plot = Rect::new(
        area.x_mm + left,
        area.y_mm + bottom,
        (area.width_mm - left - 3.0).max(1.0),
        (top - area.y_mm - bottom).max(1.0),
    );
    let xs = LinearScale::new((x.low, x.high), (plot.x_mm, plot.right_mm()));
    let ys = LinearScale::new((y.low, y.high), (plot.y_mm, plot.top_mm()));

    // Grid, then ticks and labels.
    let grid = Colour::grey(0.85);
    for (value, text) in &y.ticks {
        let py = ys.map(*value);
        if y.grid {
            marks.push(Mark::Polyline {
                points: vec![Pt::new(plot.x_mm, py), Pt::new(plot.right_mm(), py)],
                style: LineStyle::Solid,
                width_pt: 0.3,
                colour: grid,
            });
        }
        marks.push(Mark::rule(
            Pt::new(plot.x_mm - 1.2, py),
            Pt::new(plot.x_mm, py),
            0.5,
        ));
        marks.push(Mark::text(
            Pt::new(plot.x_mm - 1.8, py - small_h * 0.35),
            text.clone(),
            SMALL_PT,
            Anchor::Right,
        ));
    }
    for (value, text) in &x.ticks {
        let px = xs.map(*value);
        if x.grid {
            marks.push(Mark::Polyline {
                points: vec![Pt::new(px, plot.y_mm), Pt::new(px, plot.top_mm())],
                style: LineStyle::Solid,
                width_pt: 0.3,
                colour: grid,
            });
        }
        marks.push(Mark::rule(
            Pt::new(px, plot.y_mm - 1.2),
            Pt::new(px, plot.y_mm),
            0.5,
        ));
        for (i, line) in text.lines().enumerate() {
            marks.push(Mark::text(
                Pt::new(px, plot.y_mm - 1.5 - small_h - i as f32 * (small_h + 0.8)),
                line,
                SMALL_PT,
                Anchor::Centre,
            ));
        }
    }
    let mut outline = rect_corners(plot);
    outline.push(outline[0]);
    marks.push(Mark::Polyline {
        points: outline,
        style: LineStyle::Solid,
        width_pt: 0.6,
        colour: Colour::BLACK,
    });

    // Axis titles.
    marks.push(Mark::text(
        Pt::new(plot.x_mm + plot.width_mm / 2.0, area.y_mm + 0.8),
        fit(&x.title, Face::Regular, AXIS_TITLE_PT, plot.width_mm),
        AXIS_TITLE_PT,
        Anchor::Centre,
    ));
    marks.push(Mark::Label {
        at: Pt::new(
            area.x_mm + AXIS_TITLE_PT * MM_PER_PT * 0.8,
            plot.y_mm + plot.height_mm / 2.0,
        ),
        text: fit(&y.title, Face::Regular, AXIS_TITLE_PT, plot.height_mm),
        size_pt: AXIS_TITLE_PT,
        anchor: Anchor::Centre,
        weight: Weight::Regular,
        colour: Colour::BLACK,
        vertical: true,
    });
    Frame { plot, x: xs, y: ys }
}

/// Draw a legend swatch whose left end sits at `at` (vertically centred).
fn draw_swatch(swatch: &Swatch, at: Pt, marks: &mut Vec<Mark>) {
    match swatch {
        Swatch::Line {
            style,
            colour,
            marker,
        } => {
            marks.push(Mark::Polyline {
                points: vec![at, Pt::new(at.x_mm + 9.0, at.y_mm)],
                style: *style,
                width_pt: 1.2,
                colour: *colour,
            });
            if let Some(shape) = marker {
                marks.push(Mark::Marker {
                    at: Pt::new(at.x_mm + 4.5, at.y_mm),
                    shape: *shape,
                    size_mm: 1.8,
                    colour: *colour,
                    filled: true,
                });
            }
        }
        Swatch::Fill { colour, hatch } => {
            let rect = Rect::new(at.x_mm + 1.0, at.y_mm - 1.5, 7.0, 3.0);
            marks.push(Mark::Area {
                points: rect_corners(rect),
                fill: *colour,
                outline: Some(Colour::grey(0.2)),
                hatch: if *hatch {
                    hatch_lines(rect, 1.2)
                } else {
                    Vec::new()
                },
            });
        }
        Swatch::Marker {
            shape,
            filled,
            colour,
        } => marks.push(Mark::Marker {
            at: Pt::new(at.x_mm + 4.5, at.y_mm),
            shape: *shape,
            size_mm: 2.2,
            colour: *colour,
            filled: *filled,
        }),
    }
}

/// Wrap a category label into at most two lines of `width_mm` for an x tick.
pub fn category_label(text: &str, width_mm: f32) -> String {
    wrap_at_most(text, Face::Regular, SMALL_PT, width_mm, 2).join("\n")
}
