//! Turning laid-out pages of [`Mark`]s into PDF bytes with `printpdf`,
//! using the PDF built-in fonts (no font files, no system fonts).

use super::document::Page;
use super::fonts::{text_width_mm, to_win_ansi, Face, MM_PER_PT};
use crate::report::charts::geometry::{Anchor, Colour, LineStyle, Mark, MarkerShape, Pt, Weight};
use crate::{Error, Result};
use printpdf::path::{PaintMode, WindingOrder};
use printpdf::{
    BuiltinFont, Color, IndirectFontRef, Line, LineDashPattern, Mm, PdfDocument,
    PdfDocumentReference, PdfLayerReference, Point, Polygon, Rgb, TextMatrix,
};

/// The registered built-in fonts, by face.
struct Fonts {
    regular: IndirectFontRef,
    bold: IndirectFontRef,
    mono: IndirectFontRef,
}

impl Fonts {
    fn add(doc: &PdfDocumentReference) -> Result<Self> {
        let add = |font| {
            doc.add_builtin_font(font)
                .map_err(|e| Error::Internal(format!("registering a PDF built-in font: {e}")))
        };
        Ok(Fonts {
            regular: add(BuiltinFont::Helvetica)?,
            bold: add(BuiltinFont::HelveticaBold)?,
            mono: add(BuiltinFont::Courier)?,
        })
    }

    fn get(&self, face: Face) -> &IndirectFontRef {
        match face {
            Face::Regular => &self.regular,
            Face::Bold => &self.bold,
            Face::Mono => &self.mono,
        }
    }
}

/// Write `pages` as a PDF document titled `title`.
pub fn write_pdf(pages: &[Page], title: &str) -> Result<Vec<u8>> {
    let first = pages
        .first()
        .ok_or_else(|| Error::Internal("the report has no pages".into()))?;
    let (doc, page_index, layer_index) = PdfDocument::new(
        to_win_ansi(title),
        Mm(first.width_mm),
        Mm(first.height_mm),
        "content",
    );
    let doc = doc.with_producer("brayfin").with_creator("brayfin");
    let fonts = Fonts::add(&doc)?;
    let mut layers = vec![doc.get_page(page_index).get_layer(layer_index)];
    for page in &pages[1..] {
        let (p, l) = doc.add_page(Mm(page.width_mm), Mm(page.height_mm), "content");
        layers.push(doc.get_page(p).get_layer(l));
    }
    for (page, layer) in pages.iter().zip(&layers) {
        for mark in &page.marks {
            draw(layer, &fonts, mark);
        }
    }
    doc.save_to_bytes()
        .map_err(|e| Error::Internal(format!("writing the PDF: {e}")))
}

fn colour(c: Colour) -> Color {
    Color::Rgb(Rgb::new(c.r, c.g, c.b, None))
}

fn point(p: Pt) -> (Point, bool) {
    (Point::new(Mm(p.x_mm), Mm(p.y_mm)), false)
}

/// Dash pattern in points: (dash, gap, dash, gap).
fn dash(style: LineStyle) -> LineDashPattern {
    let pattern = |d1, g1, d2, g2| LineDashPattern {
        dash_1: Some(d1),
        gap_1: Some(g1),
        dash_2: d2,
        gap_2: g2,
        ..LineDashPattern::default()
    };
    match style {
        LineStyle::Solid => LineDashPattern::default(),
        LineStyle::Dashed => pattern(5, 3, None, None),
        LineStyle::Dotted => pattern(1, 2, None, None),
        LineStyle::DashDot => pattern(6, 2, Some(1), Some(2)),
    }
}

fn stroke(layer: &PdfLayerReference, points: &[Pt], style: LineStyle, width_pt: f32, c: Colour) {
    layer.set_outline_color(colour(c));
    layer.set_outline_thickness(width_pt);
    layer.set_line_dash_pattern(dash(style));
    layer.add_line(Line {
        points: points.iter().copied().map(point).collect(),
        is_closed: false,
    });
}

fn polygon(layer: &PdfLayerReference, points: &[Pt], mode: PaintMode) {
    layer.add_polygon(Polygon {
        rings: vec![points.iter().copied().map(point).collect()],
        mode,
        winding_order: WindingOrder::NonZero,
    });
}

/// Vertices of a marker shape of overall width `size` centred on `at`.
fn marker_outline(at: Pt, shape: MarkerShape, size: f32) -> Vec<Pt> {
    let r = size / 2.0;
    let around = |n: usize, phase: f32| -> Vec<Pt> {
        (0..n)
            .map(|i| {
                let a = phase + i as f32 * std::f32::consts::TAU / n as f32;
                Pt::new(at.x_mm + r * a.cos(), at.y_mm + r * a.sin())
            })
            .collect()
    };
    match shape {
        MarkerShape::Circle => around(16, 0.0),
        MarkerShape::Square => {
            let h = 0.8 * r;
            vec![
                Pt::new(at.x_mm - h, at.y_mm - h),
                Pt::new(at.x_mm + h, at.y_mm - h),
                Pt::new(at.x_mm + h, at.y_mm + h),
                Pt::new(at.x_mm - h, at.y_mm + h),
            ]
        }
        MarkerShape::Triangle => around(3, std::f32::consts::FRAC_PI_2),
        MarkerShape::Diamond => around(4, 0.0),
    }
}

fn draw(layer: &PdfLayerReference, fonts: &Fonts, mark: &Mark) {
    match mark {
        Mark::Polyline {
            points,
            style,
            width_pt,
            colour: c,
        } => stroke(layer, points, *style, *width_pt, *c),
        Mark::Area {
            points,
            fill,
            outline,
            hatch,
        } => {
            layer.set_fill_color(colour(*fill));
            match outline {
                Some(o) => {
                    layer.set_outline_color(colour(*o));
                    layer.set_outline_thickness(0.5);
                    layer.set_line_dash_pattern(dash(LineStyle::Solid));
                    polygon(layer, points, PaintMode::FillStroke);
                }
                None => polygon(layer, points, PaintMode::Fill),
            }
            for (a, b) in hatch {
                stroke(layer, &[*a, *b], LineStyle::Solid, 0.4, Colour::grey(0.15));
            }
        }
        Mark::Marker {
            at,
            shape,
            size_mm,
            colour: c,
            filled,
        } => {
            let outline = marker_outline(*at, *shape, *size_mm);
            layer.set_line_dash_pattern(dash(LineStyle::Solid));
            layer.set_outline_color(colour(*c));
            layer.set_outline_thickness(0.8);
            let fill = if *filled { *c } else { Colour::WHITE };
            layer.set_fill_color(colour(fill));
            polygon(layer, &outline, PaintMode::FillStroke);
        }
        Mark::Label {
            at,
            text,
            size_pt,
            anchor,
            weight,
            colour: c,
            vertical,
        } => label(
            layer, fonts, *at, text, *size_pt, *anchor, *weight, *c, *vertical,
        ),
    }
}

#[allow(clippy::too_many_arguments)]
fn label(
    layer: &PdfLayerReference,
    fonts: &Fonts,
    at: Pt,
    text: &str,
    size_pt: f32,
    anchor: Anchor,
    weight: Weight,
    c: Colour,
    vertical: bool,
) {
    let face = match weight {
        Weight::Regular => Face::Regular,
        Weight::Bold => Face::Bold,
        Weight::Mono => Face::Mono,
    };
    let text = to_win_ansi(text);
    let width = text_width_mm(&text, face, size_pt);
    let shift = match anchor {
        Anchor::Left => 0.0,
        Anchor::Centre => width / 2.0,
        Anchor::Right => width,
    };
    let font = fonts.get(face);
    layer.set_fill_color(colour(c));
    layer.begin_text_section();
    layer.set_font(font, size_pt);
    if vertical {
        let pt = |mm: f32| printpdf::Pt(mm / MM_PER_PT);
        layer.set_text_matrix(TextMatrix::TranslateRotate(
            pt(at.x_mm),
            pt(at.y_mm - shift),
            90.0,
        ));
    } else {
        layer.set_text_cursor(Mm(at.x_mm - shift), Mm(at.y_mm));
    }
    layer.write_text(text, font);
    layer.end_text_section();
}
