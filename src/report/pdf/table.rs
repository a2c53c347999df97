//! Tables that never overflow: column widths from the measured text, cells
//! wrapped (at most a few lines, then an ellipsis), rows that do not fit
//! moved to a new page under a repeated header.

use super::document::{line_height_mm, Composer};
use super::fonts::{text_width_mm, to_win_ansi, Face, MM_PER_PT};
use super::text::wrap_at_most;
use crate::report::charts::geometry::{Anchor, Colour, Mark, Pt, Rect, Weight};

/// Horizontal alignment of a column.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Align {
    /// Text starts at the left of the cell.
    Left,
    /// Text ends at the right of the cell (numbers).
    Right,
}

/// One column: its header and alignment.
#[derive(Debug, Clone, PartialEq)]
pub struct Column {
    /// Header text (may wrap).
    pub header: String,
    /// Alignment of the body cells.
    pub align: Align,
}

impl Column {
    /// A left-aligned column.
    pub fn left(header: impl Into<String>) -> Self {
        Column {
            header: header.into(),
            align: Align::Left,
        }
    }

    /// A right-aligned (numeric) column.
    pub fn right(header: impl Into<String>) -> Self {
        Column {
            header: header.into(),
            align: Align::Right,
        }
    }
}

/// How a table is set.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TableStyle {
    /// Font size of body and header, pt.
    pub size_pt: f32,
    /// Most lines a body cell may take before it is cut with an ellipsis.
    pub max_lines: usize,
    /// Set the first column in bold (row labels).
    pub bold_first_column: bool,
    /// Draw the header row (off for label–value tables).
    pub header: bool,
}

impl Default for TableStyle {
    fn default() -> Self {
        TableStyle {
            size_pt: 8.5,
            max_lines: 3,
            bold_first_column: false,
            header: true,
        }
    }
}

/// Horizontal padding inside a cell, mm.
const PAD_X_MM: f32 = 1.4;
/// Vertical padding inside a cell, mm.
const PAD_Y_MM: f32 = 0.9;

/// Longest single word of `text`, mm; a no-break space joins words, as in
/// [`super::text::wrap`].
fn longest_word_mm(text: &str, face: Face, size_pt: f32) -> f32 {
    text.split([' ', '\n'])
        .map(|w| text_width_mm(&to_win_ansi(w), face, size_pt))
        .fold(0.0, f32::max)
}

/// Widest a single word may make a column; longer words (a long code or
/// identifier) are broken instead of starving the other columns.
const MAX_WORD_MM: f32 = 48.0;

/// Column widths (mm) summing to `available_mm`. Right-aligned (numeric)
/// columns get their full body width if at all possible, so numbers are
/// never broken; the other columns get at least their longest word (up to
/// [`MAX_WORD_MM`]), and the rest is shared by how much more each column's
/// text would like.
pub fn column_widths(
    columns: &[Column],
    rows: &[Vec<String>],
    style: &TableStyle,
    available_mm: f32,
) -> Vec<f32> {
    let n = columns.len();
    let mut word = vec![0.0f32; n];
    let mut body = vec![0.0f32; n];
    let mut natural = vec![0.0f32; n];
    let face_of = |i: usize| {
        if i == 0 && style.bold_first_column {
            Face::Bold
        } else {
            Face::Regular
        }
    };
    for (i, column) in columns.iter().enumerate() {
        word[i] = longest_word_mm(&column.header, Face::Bold, style.size_pt).min(MAX_WORD_MM);
        // A header may take two lines before it asks for more width.
        let header = text_width_mm(&to_win_ansi(&column.header), Face::Bold, style.size_pt);
        natural[i] = word[i].max(header / 2.0);
    }
    for row in rows {
        for (i, cell) in row.iter().enumerate().take(n) {
            let face = face_of(i);
            let width = text_width_mm(&to_win_ansi(cell), face, style.size_pt);
            word[i] = word[i].max(longest_word_mm(cell, face, style.size_pt).min(MAX_WORD_MM));
            body[i] = body[i].max(width);
            natural[i] = natural[i].max(width);
        }
    }
    let pad = 2.0 * PAD_X_MM;
    let numeric = |i: usize| columns[i].align == Align::Right;
    let min: Vec<f32> = (0..n)
        .map(|i| {
            pad + if numeric(i) {
                body[i].max(word[i])
            } else {
                word[i]
            }
        })
        .collect();
    let natural: Vec<f32> = natural.iter().map(|w| w + pad).collect();
    let sum_natural: f32 = natural.iter().sum();
    let sum_min: f32 = min.iter().sum();
    if sum_natural <= available_mm {
        let extra = (available_mm - sum_natural) / n.max(1) as f32;
        return natural.iter().map(|w| w + extra).collect();
    }
    if sum_min <= available_mm {
        let want: f32 = natural.iter().zip(&min).map(|(a, b)| a - b).sum();
        let spare = available_mm - sum_min;
        return min
            .iter()
            .zip(&natural)
            .map(|(lo, hi)| {
                lo + if want > 0.0 {
                    spare * (hi - lo) / want
                } else {
                    0.0
                }
            })
            .collect();
    }
    // Too narrow for every minimum: numbers keep theirs if they can, the
    // text columns share what is left.
    let numbers: f32 = (0..n).filter(|i| numeric(*i)).map(|i| min[i]).sum();
    let text: f32 = (0..n).filter(|i| !numeric(*i)).map(|i| min[i]).sum();
    if numbers < available_mm && text > 0.0 {
        let scale = (available_mm - numbers) / text;
        (0..n)
            .map(|i| if numeric(i) { min[i] } else { min[i] * scale })
            .collect()
    } else {
        min.iter().map(|w| w * available_mm / sum_min).collect()
    }
}

struct Layout<'a> {
    columns: &'a [Column],
    widths: Vec<f32>,
    style: TableStyle,
}

impl Layout<'_> {
    fn cell_lines(&self, i: usize, text: &str, face: Face, max_lines: usize) -> Vec<String> {
        wrap_at_most(
            text,
            face,
            self.style.size_pt,
            (self.widths[i] - 2.0 * PAD_X_MM).max(1.0),
            max_lines,
        )
    }

    fn row_height(&self, lines: usize) -> f32 {
        lines as f32 * line_height_mm(self.style.size_pt) + 2.0 * PAD_Y_MM
    }

    /// Draw one row of already-wrapped cells in `rect`.
    fn draw_row(
        &self,
        composer: &mut Composer,
        rect: Rect,
        cells: &[(Vec<String>, Face)],
        aligns: &[Align],
    ) {
        let size = self.style.size_pt;
        let mut x = rect.x_mm;
        for (i, (lines, face)) in cells.iter().enumerate() {
            let width = self.widths[i];
            for (k, line) in lines.iter().enumerate() {
                let baseline =
                    rect.top_mm() - PAD_Y_MM - size * MM_PER_PT - k as f32 * line_height_mm(size)
                        + 0.3;
                let (at_x, anchor) = match aligns[i] {
                    Align::Left => (x + PAD_X_MM, Anchor::Left),
                    Align::Right => (x + width - PAD_X_MM, Anchor::Right),
                };
                composer.push(Mark::Label {
                    at: Pt::new(at_x, baseline),
                    text: line.clone(),
                    size_pt: size,
                    anchor,
                    weight: match face {
                        Face::Regular => Weight::Regular,
                        Face::Bold => Weight::Bold,
                        Face::Mono => Weight::Mono,
                    },
                    colour: Colour::BLACK,
                    vertical: false,
                });
            }
            x += width;
        }
    }

    fn draw_header(&self, composer: &mut Composer) {
        if !self.style.header {
            return;
        }
        let cells: Vec<(Vec<String>, Face)> = self
            .columns
            .iter()
            .enumerate()
            .map(|(i, c)| (self.cell_lines(i, &c.header, Face::Bold, 4), Face::Bold))
            .collect();
        let lines = cells.iter().map(|c| c.0.len()).max().unwrap_or(1);
        let rect = composer.reserve(self.row_height(lines));
        composer.push(Mark::fill(rect, Colour::grey(0.88)));
        let aligns: Vec<Align> = self.columns.iter().map(|c| c.align).collect();
        self.draw_row(composer, rect, &cells, &aligns);
        composer.push(Mark::rule(
            Pt::new(rect.x_mm, rect.y_mm),
            Pt::new(rect.right_mm(), rect.y_mm),
            0.6,
        ));
    }
}

/// Draw a table of `rows` under `columns` at the composer's cursor, across
/// pages as needed, full content width.
pub fn draw_table(
    composer: &mut Composer,
    columns: &[Column],
    rows: &[Vec<String>],
    style: &TableStyle,
) {
    draw_table_continued(composer, columns, rows, style, None);
}

/// As [`draw_table`]; on every page the table continues onto, `caption`
/// (if any) is set above the repeated header, so a reader of that page
/// knows whose table it is.
pub fn draw_table_continued(
    composer: &mut Composer,
    columns: &[Column],
    rows: &[Vec<String>],
    style: &TableStyle,
    caption: Option<&str>,
) {
    let available = composer.content_box().width_mm;
    let layout = Layout {
        columns,
        widths: column_widths(columns, rows, style, available),
        style: *style,
    };
    let header_height = layout.row_height(2);
    if composer.remaining_mm() < header_height + layout.row_height(1) {
        composer.new_page(composer.orientation());
    }
    layout.draw_header(composer);
    let aligns: Vec<Align> = columns.iter().map(|c| c.align).collect();
    for (r, row) in rows.iter().enumerate() {
        let cells: Vec<(Vec<String>, Face)> = (0..columns.len())
            .map(|i| {
                let face = if i == 0 && style.bold_first_column {
                    Face::Bold
                } else {
                    Face::Regular
                };
                let text = row.get(i).map_or("", String::as_str);
                (layout.cell_lines(i, text, face, style.max_lines), face)
            })
            .collect();
        let lines = cells.iter().map(|c| c.0.len()).max().unwrap_or(1);
        let height = layout.row_height(lines);
        if composer.remaining_mm() < height {
            composer.new_page(composer.orientation());
            if let Some(caption) = caption {
                composer.paragraph(caption, style.size_pt + 1.0, Face::Bold, 0.0);
            }
            layout.draw_header(composer);
        }
        let rect = composer.reserve(height);
        if r % 2 == 1 {
            composer.push(Mark::fill(rect, Colour::grey(0.96)));
        }
        layout.draw_row(composer, rect, &cells, &aligns);
        composer.push(Mark::Polyline {
            points: vec![
                Pt::new(rect.x_mm, rect.y_mm),
                Pt::new(rect.right_mm(), rect.y_mm),
            ],
            style: crate::report::charts::geometry::LineStyle::Solid,
            width_pt: 0.25,
            colour: Colour::grey(0.75),
        });
    }
    composer.gap(3.0);
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::report::pdf::document::Paper;

    #[test]
    fn widths_fill_the_page_and_every_cell_line_fits_its_column() {
        let columns = vec![
            Column::left("Candidate"),
            Column::right("Capital cost"),
            Column::right("Lifecycle cost"),
        ];
        let rows = vec![vec![
            "An exceptionally long candidate label that must wrap inside its own cell. ".repeat(3),
            "USD 12,500,000".into(),
            "USD 96,413,227".into(),
        ]];
        let style = TableStyle::default();
        let widths = column_widths(&columns, &rows, &style, 60.0);
        assert!(
            (widths.iter().sum::<f32>() - 60.0).abs() < 1e-3,
            "{widths:?}"
        );
        let mut composer = Composer::new(Paper::A4);
        draw_table(&mut composer, &columns, &rows, &style);
        let pages = composer.finish("t", |n, m| format!("{n}/{m}"));
        let content = pages[0].content_box();
        let mut edges = vec![content.x_mm];
        for w in column_widths(&columns, &rows, &style, content.width_mm) {
            edges.push(edges[edges.len() - 1] + w);
        }
        let mut checked = 0;
        for mark in &pages[0].marks {
            if let Mark::Label {
                at,
                text,
                size_pt,
                anchor,
                weight,
                ..
            } = mark
            {
                if *size_pt != style.size_pt {
                    continue; // running header and footer
                }
                let face = match weight {
                    Weight::Bold => Face::Bold,
                    Weight::Mono => Face::Mono,
                    Weight::Regular => Face::Regular,
                };
                let width = text_width_mm(text, face, *size_pt);
                let left = match anchor {
                    Anchor::Left => at.x_mm,
                    Anchor::Centre => at.x_mm - width / 2.0,
                    Anchor::Right => at.x_mm - width,
                };
                let inside_a_column = edges
                    .windows(2)
                    .any(|e| left >= e[0] - 1e-3 && left + width <= e[1] + 1e-3);
                assert!(inside_a_column, "{text:?} crosses a column edge {edges:?}");
                checked += 1;
            }
        }
        assert!(checked > 5, "the long label wrapped onto several lines");
    }

    #[test]
    fn a_long_table_repeats_its_header_on_each_page() {
        let columns = vec![Column::left("Key"), Column::right("Value")];
        let rows: Vec<Vec<String>> = (0..200)
            .map(|i| vec![format!("row {i}"), format!("{i}")])
            .collect();
        let mut composer = Composer::new(Paper::A4);
        draw_table(&mut composer, &columns, &rows, &TableStyle::default());
        let pages = composer.finish("t", |n, m| format!("{n}/{m}"));
        assert!(pages.len() > 1);
        for page in &pages {
            let headers = page
                .marks
                .iter()
                .filter(|m| matches!(m, Mark::Label { text, .. } if text == "Key"))
                .count();
            assert_eq!(headers, 1);
        }
    }
}
