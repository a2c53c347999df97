//! Turning laid-out pages of [`Mark`]s into PDF bytes with the PDF
//! built-in fonts (Helvetica, Helvetica-Bold, Courier in WinAnsiEncoding:
//! no font files, no system fonts), through `lopdf`.
//!
//! Memory stays proportional to the output: each page's drawing operators
//! are encoded and compressed into its content stream as soon as the page
//! is drawn, and the operators are dropped. (Building every page's
//! operators first, as a general PDF library does, held about 2 kB per
//! drawn mark, about 1 GB for a 500-candidate briefing.)

use super::document::Page;
use super::fonts::{text_width_mm, to_win_ansi, win_ansi_code, Face, MM_PER_PT};
use crate::report::charts::geometry::{Anchor, Colour, LineStyle, Mark, MarkerShape, Pt, Weight};
use crate::{Error, Result};
use printpdf::lopdf::content::{Content, Operation};
use printpdf::lopdf::{dictionary, Document, Object, ObjectId, Stream, StringFormat};

/// Resource names of the three faces.
const FONTS: [(Face, &str, &str); 3] = [
    (Face::Regular, "F1", "Helvetica"),
    (Face::Bold, "F2", "Helvetica-Bold"),
    (Face::Mono, "F3", "Courier"),
];

fn font_name(face: Face) -> &'static str {
    FONTS
        .iter()
        .find(|(f, _, _)| *f == face)
        .map_or("F1", |(_, name, _)| name)
}

/// Millimetres to PDF points.
fn pt(mm: f32) -> Object {
    Object::Real(mm / MM_PER_PT)
}

fn op(operator: &str, operands: Vec<Object>) -> Operation {
    Operation::new(operator, operands)
}

fn rgb(c: Colour) -> Vec<Object> {
    vec![Object::Real(c.r), Object::Real(c.g), Object::Real(c.b)]
}

/// Dash pattern in points (dash, gap, dash, gap).
fn dash(style: LineStyle) -> Operation {
    let pattern: Vec<i64> = match style {
        LineStyle::Solid => Vec::new(),
        LineStyle::Dashed => vec![5, 3],
        LineStyle::Dotted => vec![1, 2],
        LineStyle::DashDot => vec![6, 2, 1, 2],
    };
    op(
        "d",
        vec![
            Object::Array(pattern.into_iter().map(Object::Integer).collect()),
            Object::Integer(0),
        ],
    )
}

fn path(ops: &mut Vec<Operation>, points: &[Pt]) {
    for (i, p) in points.iter().enumerate() {
        let operator = if i == 0 { "m" } else { "l" };
        ops.push(op(operator, vec![pt(p.x_mm), pt(p.y_mm)]));
    }
}

fn stroke(ops: &mut Vec<Operation>, points: &[Pt], style: LineStyle, width_pt: f32, c: Colour) {
    if points.len() < 2 {
        return;
    }
    ops.push(op("RG", rgb(c)));
    ops.push(op("w", vec![Object::Real(width_pt)]));
    ops.push(dash(style));
    path(ops, points);
    ops.push(op("S", vec![]));
}

/// A closed polygon, filled (`f`) or filled and stroked (`b`).
fn polygon(ops: &mut Vec<Operation>, points: &[Pt], paint: &str) {
    if points.len() < 3 {
        return;
    }
    path(ops, points);
    ops.push(op(paint, vec![]));
}

/// Write `pages` as a PDF document titled `title`.
pub fn write_pdf(pages: &[Page], title: &str) -> Result<Vec<u8>> {
    if pages.is_empty() {
        return Err(Error::Internal("the report has no pages".into()));
    }
    let mut doc = Document::with_version("1.4");
    let pages_id = doc.new_object_id();
    let mut font_dict = printpdf::lopdf::Dictionary::new();
    for (_, name, base) in FONTS {
        let id = doc.add_object(dictionary! {
            "Type" => "Font",
            "Subtype" => "Type1",
            "BaseFont" => base,
            "Encoding" => "WinAnsiEncoding",
        });
        font_dict.set(name, Object::Reference(id));
    }
    let resources = doc.add_object(dictionary! { "Font" => font_dict });
    let mut kids: Vec<Object> = Vec::with_capacity(pages.len());
    for page in pages {
        let mut ops = Vec::new();
        for mark in &page.marks {
            draw(&mut ops, mark);
        }
        let bytes = Content { operations: ops }
            .encode()
            .map_err(|e| Error::Internal(format!("encoding a PDF page: {e}")))?;
        let mut stream = Stream::new(printpdf::lopdf::Dictionary::new(), bytes);
        // Compression is an optimisation: a stream that does not compress
        // is written as it is.
        let _ = stream.compress();
        let content: ObjectId = doc.add_object(stream);
        let id = doc.add_object(dictionary! {
            "Type" => "Page",
            "Parent" => pages_id,
            "MediaBox" => vec![0.into(), 0.into(), pt(page.width_mm), pt(page.height_mm)],
            "Contents" => content,
            "Resources" => resources,
        });
        kids.push(id.into());
    }
    let count = kids.len() as i64;
    doc.objects.insert(
        pages_id,
        Object::Dictionary(dictionary! {
            "Type" => "Pages",
            "Kids" => kids,
            "Count" => count,
        }),
    );
    let catalog = doc.add_object(dictionary! {
        "Type" => "Catalog",
        "Pages" => pages_id,
    });
    let info = doc.add_object(dictionary! {
        "Title" => Object::String(win_ansi_bytes(title), StringFormat::Literal),
        "Producer" => Object::string_literal("brayfin"),
        "Creator" => Object::string_literal("brayfin"),
    });
    doc.trailer.set("Root", catalog);
    doc.trailer.set("Info", info);
    let mut bytes = Vec::new();
    doc.save_to(&mut bytes)
        .map_err(|e| Error::Internal(format!("writing the PDF: {e}")))?;
    Ok(bytes)
}

/// `text` as WinAnsi bytes (transliterated first, so every character has a
/// code).
fn win_ansi_bytes(text: &str) -> Vec<u8> {
    to_win_ansi(text)
        .chars()
        .map(|c| win_ansi_code(c).unwrap_or(b'?'))
        .collect()
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

fn draw(ops: &mut Vec<Operation>, mark: &Mark) {
    match mark {
        Mark::Polyline {
            points,
            style,
            width_pt,
            colour: c,
        } => stroke(ops, points, *style, *width_pt, *c),
        Mark::Area {
            points,
            fill,
            outline,
            hatch,
        } => {
            ops.push(op("rg", rgb(*fill)));
            match outline {
                Some(o) => {
                    ops.push(op("RG", rgb(*o)));
                    ops.push(op("w", vec![Object::Real(0.5)]));
                    ops.push(dash(LineStyle::Solid));
                    polygon(ops, points, "b");
                }
                None => polygon(ops, points, "f"),
            }
            for (a, b) in hatch {
                stroke(ops, &[*a, *b], LineStyle::Solid, 0.4, Colour::grey(0.15));
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
            ops.push(dash(LineStyle::Solid));
            ops.push(op("RG", rgb(*c)));
            ops.push(op("w", vec![Object::Real(0.8)]));
            let fill = if *filled { *c } else { Colour::WHITE };
            ops.push(op("rg", rgb(fill)));
            polygon(ops, &outline, "b");
        }
        Mark::Label {
            at,
            text,
            size_pt,
            anchor,
            weight,
            colour: c,
            vertical,
        } => {
            let face = match weight {
                Weight::Regular => Face::Regular,
                Weight::Bold => Face::Bold,
                Weight::Mono => Face::Mono,
            };
            let text = to_win_ansi(text);
            let width = text_width_mm(&text, face, *size_pt);
            let shift = match anchor {
                Anchor::Left => 0.0,
                Anchor::Centre => width / 2.0,
                Anchor::Right => width,
            };
            ops.push(op("rg", rgb(*c)));
            ops.push(op("BT", vec![]));
            ops.push(op(
                "Tf",
                vec![Object::Name(font_name(face).into()), Object::Real(*size_pt)],
            ));
            let matrix = if *vertical {
                // Rotated a quarter turn anticlockwise, reading upward.
                [0.0, 1.0, -1.0, 0.0, at.x_mm, at.y_mm - shift]
            } else {
                [1.0, 0.0, 0.0, 1.0, at.x_mm - shift, at.y_mm]
            };
            ops.push(op(
                "Tm",
                vec![
                    Object::Real(matrix[0]),
                    Object::Real(matrix[1]),
                    Object::Real(matrix[2]),
                    Object::Real(matrix[3]),
                    pt(matrix[4]),
                    pt(matrix[5]),
                ],
            ));
            ops.push(op(
                "Tj",
                vec![Object::String(win_ansi_bytes(&text), StringFormat::Literal)],
            ));
            ops.push(op("ET", vec![]));
        }
    }
}
