//! The PDF briefing: lays the [`Model`](crate::report::model::Model) out on
//! pages (briefing, charts, performance, assumptions, ledger, method,
//! cautions) and writes them with the PDF built-in fonts.

pub mod document;
pub mod emit;
mod font_widths;
pub mod fonts;
pub mod labels;
pub mod text;
