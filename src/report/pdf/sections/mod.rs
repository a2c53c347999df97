//! The sections of the briefing, in reading order. Each takes the model,
//! the labels and the wording and lays itself out on the composer.

pub mod appendix;
pub mod assumptions;
pub mod briefing;
pub mod charts;
pub mod closing;
pub mod performance;
pub mod risk;
pub mod site;

use super::document::{Composer, BODY_PT};
use super::fonts::Face;
use super::labels::Labels;
use crate::report::model::Model;
use crate::report::wording::{blocks, Block, Wording};
use minijinja::Value;

/// What every section reads.
pub struct Ctx<'a> {
    /// The report model.
    pub model: &'a Model,
    /// Short texts from `headings.j2`.
    pub labels: &'a Labels,
    /// The templates.
    pub wording: &'a Wording,
    /// Template values shared by all templates.
    pub base: Value,
}

/// Lay out rendered prose: paragraphs, bullets and sub-headings.
pub fn prose(composer: &mut Composer, text: &str) {
    for block in blocks(text) {
        match block {
            Block::Paragraph(p) => composer.paragraph(&p, BODY_PT, Face::Regular, 0.0),
            Block::Bullet(b) => composer.bullet(&b, BODY_PT),
            Block::Heading(h) => composer.heading(&h, 2, 12.0),
        }
    }
}

/// A display unit as the PDF prints it: the built-in fonts carry the degree
/// sign, so "degF" reads "°F".
pub fn pdf_units(text: String) -> String {
    text.replace(" degF", " °F")
}
