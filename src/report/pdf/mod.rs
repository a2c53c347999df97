//! The PDF briefing: lays the [`Model`] out on pages (briefing, charts,
//! sensitivity and risk, performance, assumptions, ledger, method and
//! cautions) and writes them with the PDF built-in fonts. It formats the
//! model and computes nothing.

pub mod context;
pub mod document;
pub mod emit;
mod font_widths;
pub mod fonts;
pub mod labels;
pub mod sections;
pub mod table;
pub mod text;

use crate::report::model::Model;
use crate::report::wording::Wording;
use crate::report::Renderer;
use crate::Result;
pub use document::Paper;
use document::{Composer, Page};
use labels::Labels;
use sections::Ctx;

/// Renders the briefing as PDF on `paper` with `wording`.
#[derive(Debug)]
pub struct PdfRenderer {
    /// Paper size.
    pub paper: Paper,
    /// The templates of the prose.
    pub wording: Wording,
}

impl PdfRenderer {
    /// Lay the model out into pages without writing PDF bytes (the pages
    /// are plain data, for checking layout).
    pub fn layout(&self, model: &Model) -> Result<Vec<Page>> {
        let base = context::base(model);
        let headings = self.wording.render("headings.j2", &base)?;
        let labels = Labels::parse(&self.wording.origin("headings.j2"), &headings)?;
        let ctx = Ctx {
            model,
            labels: &labels,
            wording: &self.wording,
            base,
        };
        let mut composer = Composer::new(self.paper);
        sections::briefing::briefing(&ctx, &mut composer)?;
        sections::charts::charts(&ctx, &mut composer);
        sections::risk::sensitivity(&ctx, &mut composer);
        sections::risk::risk(&ctx, &mut composer);
        sections::closing::cautions(&ctx, &mut composer)?;
        // The appendix: performance, assumptions, ledgers, method.
        sections::performance::performance(&ctx, &mut composer);
        sections::site::site_performance(&ctx, &mut composer);
        sections::assumptions::assumptions(&ctx, &mut composer);
        sections::appendix::ledger(&ctx, &mut composer);
        sections::closing::closing(&ctx, &mut composer)?;
        let pages = composer.page_count();
        let footers = (1..=pages)
            .map(|n| {
                self.wording
                    .render("footer.j2", &context::footer(model, n, pages))
                    .map(|t| t.trim().to_string())
            })
            .collect::<Result<Vec<String>>>()?;
        Ok(composer.finish(&model.meta.title, |n, _| {
            footers.get(n - 1).cloned().unwrap_or_default()
        }))
    }
}

impl Renderer for PdfRenderer {
    fn render(&self, model: &Model) -> Result<Vec<u8>> {
        let pages = self.layout(model)?;
        emit::write_pdf(&pages, &model.meta.title)
    }
}
