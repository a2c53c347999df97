//! Series styles that stay distinguishable in greyscale print: each series
//! differs from the next in colour, dash pattern and marker shape at once.

use super::geometry::{Colour, LineStyle, MarkerShape};

/// How one data series is drawn.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SeriesStyle {
    /// Line and marker colour.
    pub colour: Colour,
    /// Dash pattern.
    pub line: LineStyle,
    /// Marker shape.
    pub marker: MarkerShape,
}

/// Colours of the Okabe–Ito colour-blind-safe palette (Okabe and Ito,
/// "Color Universal Design", 2008), ordered so neighbours also differ in
/// lightness: blue, vermillion, bluish green, reddish purple.
const PALETTE: [Colour; 4] = [
    Colour::rgb(0.0, 0.447, 0.698),
    Colour::rgb(0.835, 0.369, 0.0),
    Colour::rgb(0.0, 0.620, 0.451),
    Colour::rgb(0.800, 0.475, 0.655),
];

const LINES: [LineStyle; 4] = [
    LineStyle::Solid,
    LineStyle::Dashed,
    LineStyle::Dotted,
    LineStyle::DashDot,
];

const MARKERS: [MarkerShape; 4] = [
    MarkerShape::Circle,
    MarkerShape::Square,
    MarkerShape::Triangle,
    MarkerShape::Diamond,
];

/// The style of series number `index` (0-based). Styles repeat after four
/// series, shifted so the fifth differs from the first in dash pattern.
pub fn series_style(index: usize) -> SeriesStyle {
    SeriesStyle {
        colour: PALETTE[index % PALETTE.len()],
        line: LINES[(index + index / LINES.len()) % LINES.len()],
        marker: MARKERS[index % MARKERS.len()],
    }
}

/// Fill of stacked cost streams: greys of clearly different lightness, with
/// hatching on alternate streams, so streams separate in greyscale.
pub fn stream_fill(index: usize) -> (Colour, bool) {
    const FILLS: [(Colour, bool); 8] = [
        (Colour::rgb(0.16, 0.29, 0.48), false),
        (Colour::rgb(0.93, 0.55, 0.24), false),
        (Colour::rgb(0.55, 0.75, 0.88), true),
        (Colour::rgb(0.35, 0.35, 0.35), false),
        (Colour::rgb(0.80, 0.80, 0.80), true),
        (Colour::rgb(0.60, 0.80, 0.55), true),
        (Colour::rgb(0.62, 0.45, 0.70), false),
        (Colour::rgb(0.85, 0.40, 0.45), true),
    ];
    FILLS[index % FILLS.len()]
}

/// A data series as marks: its polyline, then a marker on about every
/// `len / max_markers`-th point (all points when there are few), so a series
/// reads by dash pattern and marker shape as well as colour.
pub fn series_marks(
    points: &[super::geometry::Pt],
    style: &SeriesStyle,
    max_markers: usize,
) -> Vec<super::geometry::Mark> {
    use super::geometry::Mark;
    let mut marks = vec![Mark::Polyline {
        points: points.to_vec(),
        style: style.line,
        width_pt: 1.3,
        colour: style.colour,
    }];
    let every = (points.len() / max_markers.max(1)).max(1);
    marks.extend(points.iter().step_by(every).map(|p| Mark::Marker {
        at: *p,
        shape: style.marker,
        size_mm: 1.6,
        colour: style.colour,
        filled: true,
    }));
    marks
}
