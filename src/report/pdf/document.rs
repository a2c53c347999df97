//! Pages and the flow of content down them: paper sizes, margins, the
//! running header and footer, and a composer that places headings,
//! paragraphs and boxes, starting a new page when one is full.

use super::fonts::{Face, MM_PER_PT};
use super::text::{fit, wrap};
use crate::report::charts::geometry::{Anchor, Colour, Mark, Pt, Rect, Weight};

/// Paper size of the briefing.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Paper {
    /// ISO 216 A4, 210 mm × 297 mm.
    A4,
    /// US Letter (ANSI A), 8.5 in × 11 in = 215.9 mm × 279.4 mm.
    Letter,
}

impl Paper {
    /// Portrait width and height, mm (ISO 216; ANSI/ASME Y14.1 for Letter).
    pub fn portrait_mm(self) -> (f32, f32) {
        match self {
            Paper::A4 => (210.0, 297.0),
            Paper::Letter => (215.9, 279.4),
        }
    }
}

/// Page orientation.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Orientation {
    /// Taller than wide.
    Portrait,
    /// Wider than tall (the ledger appendix).
    Landscape,
}

/// Margin on every side of the page, mm.
pub const MARGIN_MM: f32 = 16.0;
/// Height kept clear at the top for the running header, mm.
const HEADER_MM: f32 = 8.0;
/// Height kept clear at the bottom for the footer, mm.
const FOOTER_MM: f32 = 8.0;
/// Body text size, pt.
pub const BODY_PT: f32 = 9.5;
/// Line height as a multiple of the font size (common practice: 1.2–1.35).
pub const LEADING: f32 = 1.3;

/// Height of one line of text at `size_pt`, mm.
pub fn line_height_mm(size_pt: f32) -> f32 {
    size_pt * LEADING * MM_PER_PT
}

/// One laid-out page.
#[derive(Debug, Clone, PartialEq)]
pub struct Page {
    /// Page width, mm.
    pub width_mm: f32,
    /// Page height, mm.
    pub height_mm: f32,
    /// Everything drawn on it, in drawing order.
    pub marks: Vec<Mark>,
}

impl Page {
    /// The box content may use: inside the margins, below the header and
    /// above the footer.
    pub fn content_box(&self) -> Rect {
        Rect::new(
            MARGIN_MM,
            MARGIN_MM + FOOTER_MM,
            self.width_mm - 2.0 * MARGIN_MM,
            self.height_mm - 2.0 * MARGIN_MM - HEADER_MM - FOOTER_MM,
        )
    }
}

/// Places content down the pages of one document.
#[derive(Debug)]
pub struct Composer {
    paper: Paper,
    orientation: Orientation,
    pages: Vec<Page>,
    /// y of the top of the next content on the current page, mm.
    cursor_mm: f32,
}

impl Composer {
    /// An empty document on `paper`.
    pub fn new(paper: Paper) -> Self {
        Composer {
            paper,
            orientation: Orientation::Portrait,
            pages: Vec::new(),
            cursor_mm: 0.0,
        }
    }

    /// Start a new page in `orientation`.
    pub fn new_page(&mut self, orientation: Orientation) {
        let (w, h) = self.paper.portrait_mm();
        let (width_mm, height_mm) = match orientation {
            Orientation::Portrait => (w, h),
            Orientation::Landscape => (h, w),
        };
        let page = Page {
            width_mm,
            height_mm,
            marks: Vec::new(),
        };
        self.cursor_mm = page.content_box().top_mm();
        self.orientation = orientation;
        self.pages.push(page);
    }

    /// Pages so far.
    pub fn page_count(&self) -> usize {
        self.pages.len()
    }

    /// Orientation of the current page.
    pub fn orientation(&self) -> Orientation {
        self.orientation
    }

    fn ensure_page(&mut self) {
        if self.pages.is_empty() {
            self.new_page(Orientation::Portrait);
        }
    }

    /// The content box of the current page.
    pub fn content_box(&mut self) -> Rect {
        self.ensure_page();
        self.pages
            .last()
            .map(Page::content_box)
            .unwrap_or_else(|| Rect::new(0.0, 0.0, 0.0, 0.0))
    }

    /// Height left on the current page below the cursor, mm.
    pub fn remaining_mm(&mut self) -> f32 {
        let bottom = self.content_box().y_mm;
        self.cursor_mm - bottom
    }

    /// Reserve a full-width box `height_mm` tall below the cursor, on a new
    /// page (same orientation) if it does not fit on this one. A box taller
    /// than a whole page is clipped to the page's content height.
    pub fn reserve(&mut self, height_mm: f32) -> Rect {
        if self.remaining_mm() < height_mm {
            self.new_page(self.orientation);
        }
        let content = self.content_box();
        let height = height_mm.min(content.height_mm);
        let rect = Rect::new(
            content.x_mm,
            self.cursor_mm - height,
            content.width_mm,
            height,
        );
        self.cursor_mm -= height;
        rect
    }

    /// Add vertical space (never past the bottom of the page).
    pub fn gap(&mut self, height_mm: f32) {
        let bottom = self.content_box().y_mm;
        self.cursor_mm = (self.cursor_mm - height_mm).max(bottom);
    }

    /// Draw `mark` on the current page.
    pub fn push(&mut self, mark: Mark) {
        self.ensure_page();
        if let Some(page) = self.pages.last_mut() {
            page.marks.push(mark);
        }
    }

    /// A heading: level 1 is a section title, level 2 a sub-heading. It is
    /// kept with at least `keep_with_mm` of what follows.
    pub fn heading(&mut self, text: &str, level: u8, keep_with_mm: f32) {
        let size = if level <= 1 { 15.0 } else { 11.5 };
        let at_top = self.pages.is_empty() || self.cursor_mm >= self.content_box().top_mm() - 0.01;
        let above = match (level <= 1, at_top) {
            (_, true) => 0.0,
            (true, false) => 5.0,
            (false, false) => 2.5,
        };
        let height = above + line_height_mm(size) + 1.5;
        if self.remaining_mm() < height + keep_with_mm {
            self.new_page(self.orientation);
        }
        let rect = self.reserve(height);
        let baseline = rect.top_mm() - above - size * MM_PER_PT;
        let line = fit(text, Face::Bold, size, rect.width_mm);
        self.push(Mark::Label {
            at: Pt::new(rect.x_mm, baseline),
            text: line,
            size_pt: size,
            anchor: Anchor::Left,
            weight: Weight::Bold,
            colour: Colour::BLACK,
            vertical: false,
        });
        if level <= 1 {
            let y = rect.y_mm + 0.5;
            self.push(Mark::rule(
                Pt::new(rect.x_mm, y),
                Pt::new(rect.right_mm(), y),
                0.8,
            ));
        }
    }

    /// A paragraph of wrapped text at `size_pt`, flowing onto new pages as
    /// needed, indented by `indent_mm`, followed by a small gap.
    pub fn paragraph(&mut self, text: &str, size_pt: f32, face: Face, indent_mm: f32) {
        let width = self.content_box().width_mm - indent_mm;
        let lines = wrap(text, face, size_pt, width);
        let weight = match face {
            Face::Regular => Weight::Regular,
            Face::Bold => Weight::Bold,
            Face::Mono => Weight::Mono,
        };
        for line in lines {
            let rect = self.reserve(line_height_mm(size_pt));
            let baseline = rect.top_mm() - size_pt * MM_PER_PT;
            self.push(Mark::Label {
                at: Pt::new(rect.x_mm + indent_mm, baseline),
                text: line,
                size_pt,
                anchor: Anchor::Left,
                weight,
                colour: Colour::BLACK,
                vertical: false,
            });
        }
        self.gap(size_pt * 0.5 * MM_PER_PT);
    }

    /// A bulleted item: a dash hanging in the margin, wrapped text beside it.
    pub fn bullet(&mut self, text: &str, size_pt: f32) {
        let indent = 5.0;
        if self.remaining_mm() < line_height_mm(size_pt) {
            self.new_page(self.orientation);
        }
        let top = self.cursor_mm;
        let x = self.content_box().x_mm;
        self.push(Mark::text(
            Pt::new(x + 1.0, top - size_pt * MM_PER_PT),
            "–",
            size_pt,
            Anchor::Left,
        ));
        self.paragraph(text, size_pt, Face::Regular, indent);
    }

    /// Finish: add the running header (`title`) and the footer (from
    /// `footer(page number, page count)`) to every page, and return the
    /// pages.
    pub fn finish(mut self, title: &str, footer: impl Fn(usize, usize) -> String) -> Vec<Page> {
        self.ensure_page();
        let count = self.pages.len();
        for (index, page) in self.pages.iter_mut().enumerate() {
            let content = page.content_box();
            let size = 8.0;
            let header_y = page.height_mm - MARGIN_MM - size * MM_PER_PT;
            let footer_y = MARGIN_MM;
            let grey = Colour::grey(0.3);
            let footer_text = footer(index + 1, count);
            let footer_width = super::fonts::text_width_mm(&footer_text, Face::Regular, size);
            let title_width = content.width_mm - footer_width - 6.0;
            for (at, text, anchor) in [
                (
                    Pt::new(content.x_mm, header_y),
                    fit(title, Face::Regular, size, content.width_mm),
                    Anchor::Left,
                ),
                (
                    Pt::new(content.x_mm, footer_y),
                    fit(title, Face::Regular, size, title_width.max(0.0)),
                    Anchor::Left,
                ),
                (
                    Pt::new(content.right_mm(), footer_y),
                    footer_text,
                    Anchor::Right,
                ),
            ] {
                page.marks.push(Mark::Label {
                    at,
                    text,
                    size_pt: size,
                    anchor,
                    weight: Weight::Regular,
                    colour: grey,
                    vertical: false,
                });
            }
            for y in [header_y - 1.8, footer_y + size * MM_PER_PT + 1.2] {
                page.marks.push(Mark::Polyline {
                    points: vec![Pt::new(content.x_mm, y), Pt::new(content.right_mm(), y)],
                    style: crate::report::charts::geometry::LineStyle::Solid,
                    width_pt: 0.3,
                    colour: Colour::grey(0.6),
                });
            }
        }
        self.pages
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn paper_sizes_are_the_standard_ones() {
        // ISO 216: A4 is 210 mm × 297 mm. ANSI Letter: 8.5 in × 11 in.
        assert_eq!(Paper::A4.portrait_mm(), (210.0, 297.0));
        let (w, h) = Paper::Letter.portrait_mm();
        assert!((w - 8.5 * 25.4).abs() < 1e-3 && (h - 11.0 * 25.4).abs() < 1e-3);
    }

    #[test]
    fn a_long_paragraph_flows_onto_new_pages_and_stays_inside_the_content_box() {
        let mut composer = Composer::new(Paper::Letter);
        let text = "word ".repeat(3000);
        composer.paragraph(&text, BODY_PT, Face::Regular, 0.0);
        let pages = composer.finish("Title", |n, m| format!("page {n} of {m}"));
        assert!(pages.len() > 1);
        for page in &pages {
            let content = page.content_box();
            let bodies = page.marks.iter().filter_map(|m| match m {
                Mark::Label { at, text, .. } if text.starts_with("word") => Some(at),
                _ => None,
            });
            for at in bodies {
                assert!(content.contains(*at, 0.01), "{at:?} outside {content:?}");
            }
        }
    }

    #[test]
    fn landscape_pages_swap_width_and_height() {
        let mut composer = Composer::new(Paper::A4);
        composer.new_page(Orientation::Landscape);
        let pages = composer.finish("T", |n, m| format!("{n}/{m}"));
        assert_eq!((pages[0].width_mm, pages[0].height_mm), (297.0, 210.0));
    }
}
