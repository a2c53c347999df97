//! The report: a [`model::Model`] of what is shown, and one renderer per
//! output format. Renderers never compute.

pub mod model;

/// One output format: turns a [`model::Model`] into bytes. Renderers format;
/// they never compute.
pub trait Renderer {
    /// Render the whole model.
    fn render(&self, model: &model::Model) -> crate::Result<Vec<u8>>;
}

pub mod charts;
pub mod csv;
pub mod format;
pub mod json;
pub mod pdf;
pub mod table;
pub mod views;
pub mod wording;
