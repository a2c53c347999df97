//! The three PDF built-in fonts the briefing uses, their advance widths for
//! measuring text, and the mapping of text onto WinAnsiEncoding (the
//! encoding the built-in fonts are written with).
//!
//! Characters outside WinAnsiEncoding would silently vanish from the page,
//! so [`to_win_ansi`] transliterates them first (`−` → `-`, `₂` → `2`,
//! `≤` → `<=`, …) and measurement is done on the transliterated text.

use super::font_widths::{HELVETICA, HELVETICA_BOLD, WIN_ANSI_HIGH};

/// Millimetres per PostScript point (1 pt = 1/72 in, 1 in = 25.4 mm exactly).
pub const MM_PER_PT: f32 = 25.4 / 72.0;

/// Courier advance width of every glyph, 1/1000 em (Adobe Core 14 AFM,
/// Courier.afm: fixed pitch, WX 600).
const COURIER_WIDTH: u16 = 600;

/// A built-in font face.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Face {
    /// Helvetica: body text and tables.
    Regular,
    /// Helvetica-Bold: headings and emphasis.
    Bold,
    /// Courier: hashes and file names, where every character matters.
    Mono,
}

impl Face {
    /// All faces, in the order the document registers them.
    pub const ALL: [Face; 3] = [Face::Regular, Face::Bold, Face::Mono];
}

/// WinAnsiEncoding code of `ch`, or `None` if the encoding lacks it.
pub fn win_ansi_code(ch: char) -> Option<u8> {
    let code = ch as u32;
    match code {
        0x20..=0x7e | 0xa1..=0xac | 0xae..=0xff => u8::try_from(code).ok(),
        // The bullet (0x95) is left out: the PDF writer encodes it as 0x7F,
        // which WinAnsiEncoding leaves undefined.
        0x2022 => None,
        _ => WIN_ANSI_HIGH
            .iter()
            .find(|(c, _)| *c == ch)
            .map(|(_, code)| *code),
    }
}

/// Replacement text for a character WinAnsiEncoding lacks.
fn transliterate(ch: char) -> &'static str {
    match ch {
        '\u{2212}' | '\u{2010}' | '\u{2011}' => "-",
        '\u{a0}' | '\u{2009}' | '\u{202f}' | '\u{2002}' | '\u{2003}' | '\t' => " ",
        '\u{2080}' => "0",
        '\u{2081}' => "1",
        '\u{2082}' => "2",
        '\u{2083}' => "3",
        '\u{2084}' => "4",
        '\u{2264}' => "<=",
        '\u{2265}' => ">=",
        '\u{2260}' => "!=",
        '\u{2248}' => "~",
        '\u{2192}' => "->",
        '\u{2190}' => "<-",
        '\u{0394}' => "Delta ",
        '\u{03b7}' => "eta",
        '\u{03b5}' => "epsilon",
        '\u{03c3}' => "sigma",
        '\u{ad}' => "",
        '\u{2022}' => "\u{b7}",
        '\u{2032}' => "'",
        '\u{2033}' => "\"",
        '\u{221a}' => "sqrt ",
        _ => "?",
    }
}

/// `text` with every character WinAnsiEncoding lacks transliterated, so
/// nothing silently disappears from the page. Line breaks become spaces.
pub fn to_win_ansi(text: &str) -> String {
    let mut out = String::with_capacity(text.len());
    for ch in text.chars() {
        if ch == '\n' || ch == '\r' {
            out.push(' ');
        } else if win_ansi_code(ch).is_some() {
            out.push(ch);
        } else {
            out.push_str(transliterate(ch));
        }
    }
    out
}

/// Advance width of one character in 1/1000 em; characters outside the
/// encoding measure as `?` (which is what [`to_win_ansi`] makes of them).
pub fn glyph_width(face: Face, ch: char) -> u16 {
    let table = match face {
        Face::Regular => &HELVETICA,
        Face::Bold => &HELVETICA_BOLD,
        Face::Mono => return COURIER_WIDTH,
    };
    let code = win_ansi_code(ch).unwrap_or(b'?');
    table[usize::from(code.saturating_sub(32))]
}

/// Width of `text` set in `face` at `size_pt`, in mm. The text should
/// already be WinAnsi-safe (see [`to_win_ansi`]).
pub fn text_width_mm(text: &str, face: Face, size_pt: f32) -> f32 {
    let units: u32 = text.chars().map(|c| u32::from(glyph_width(face, c))).sum();
    units as f32 / 1000.0 * size_pt * MM_PER_PT
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn widths_match_the_adobe_afm_values() {
        // Helvetica.afm: C 97 ; WX 556 ; N a ; C 105 ; WX 222 ; N i
        // (Adobe Core 14 AFM, from memory, confirmed against the generator).
        assert_eq!(glyph_width(Face::Regular, 'a'), 556);
        assert_eq!(glyph_width(Face::Regular, 'i'), 222);
        // Helvetica-Bold.afm: N A WX 722; Courier is 600 throughout.
        assert_eq!(glyph_width(Face::Bold, 'A'), 722);
        assert_eq!(glyph_width(Face::Mono, 'i'), 600);
        // Degree sign 0xB0 and en dash 0x96 are in WinAnsi: 400 and 556.
        assert_eq!(glyph_width(Face::Regular, '°'), 400);
        assert_eq!(glyph_width(Face::Regular, '–'), 556);
    }

    #[test]
    fn ten_point_courier_is_six_points_per_character() {
        let width = text_width_mm("abcdefghij", Face::Mono, 10.0);
        assert!((width - 60.0 * MM_PER_PT).abs() < 1e-4, "{width}");
    }

    #[test]
    fn win_ansi_keeps_degree_dash_dot_cube_and_transliterates_the_rest() {
        assert_eq!(to_win_ansi("15 °C – a·b m³"), "15 °C – a·b m³");
        assert_eq!(to_win_ansi("CO₂ ≤ −3"), "CO2 <= -3");
        assert_eq!(win_ansi_code('€'), Some(0x80));
        assert_eq!(win_ansi_code('\u{a0}'), None);
    }

    #[test]
    fn every_code_we_claim_is_what_the_pdf_writer_encodes() {
        // The PDF writer encodes built-in-font text itself; a character we
        // measure but it drops (or codes differently) would misplace text.
        let claimed = (0x20u32..=0xff)
            .filter_map(char::from_u32)
            .chain(WIN_ANSI_HIGH.iter().map(|(c, _)| *c));
        for ch in claimed {
            if let Some(code) = win_ansi_code(ch) {
                let bytes = printpdf::lopdf::Document::encode_text(
                    Some("WinAnsiEncoding"),
                    &ch.to_string(),
                );
                assert_eq!(bytes, vec![code], "character {ch:?}");
            }
        }
    }
}
