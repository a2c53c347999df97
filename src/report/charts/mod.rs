//! Chart geometry as plain data: scales, axes, ticks, series, markers, bars
//! and labels in page coordinates, computed apart from any drawing so tests
//! can check where things land. The PDF renderer draws the resulting
//! [`geometry::Mark`]s.

pub mod breakdown;
pub mod difference;
pub mod frame;
pub mod fuel_price;
pub mod geometry;
pub mod histogram;
pub mod savings;
pub mod scale;
pub mod site;
pub mod style;
pub mod tornado;
pub mod ts;

/// A laid-out chart: its marks and the frame (plot area and scales) they
/// were placed with.
#[derive(Debug, Clone, PartialEq)]
pub struct Chart {
    /// Everything to draw, in order.
    pub marks: Vec<Mark>,
    /// Plot area and scales.
    pub frame: frame::Frame,
}

use geometry::Mark;
