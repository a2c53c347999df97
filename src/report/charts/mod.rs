//! Chart geometry as plain data: scales, axes, ticks, series, markers, bars
//! and labels in page coordinates, computed apart from any drawing so tests
//! can check where things land. The PDF renderer draws the resulting
//! [`geometry::Mark`]s.

pub mod geometry;
