//! Fitting text into a width: word wrapping and truncation with an
//! ellipsis, both measured with the real font metrics of [`super::fonts`].

#[cfg(test)]
use super::fonts::text_width_mm;
use super::fonts::{glyph_width, to_win_ansi, Face, MM_PER_PT};

/// The ellipsis that marks truncated text (WinAnsi code 0x85).
pub const ELLIPSIS: char = '…';

/// Width in mm of `units` thousandths of an em at `size_pt` (the same
/// arithmetic as [`text_width_mm`], so a line measured piece by piece
/// measures as the whole).
fn mm(units: u32, size_pt: f32) -> f32 {
    units as f32 / 1000.0 * size_pt * MM_PER_PT
}

/// Advance width of `text` in thousandths of an em.
fn units(text: &str, face: Face) -> u32 {
    text.chars().map(|c| u32::from(glyph_width(face, c))).sum()
}

/// `text` wrapped into lines no wider than `width_mm` when set in `face` at
/// `size_pt`. Breaks at spaces (not at no-break spaces, U+00A0, which keep
/// e.g. a currency code with its amount); a word wider than the line is
/// broken between characters. Always returns at least one line. Each
/// character is measured once, so the time is linear in the text's length.
pub fn wrap(text: &str, face: Face, size_pt: f32, width_mm: f32) -> Vec<String> {
    let space = u32::from(glyph_width(face, ' '));
    let mut lines = Vec::new();
    let mut line = String::new();
    let mut line_units = 0u32;
    let words = text
        .split([' ', '\n'])
        .filter(|w| !w.is_empty())
        .map(to_win_ansi);
    for word in words {
        let word_units = units(&word, face);
        let joined = if line.is_empty() {
            word_units
        } else {
            line_units + space + word_units
        };
        if mm(joined, size_pt) <= width_mm {
            if !line.is_empty() {
                line.push(' ');
            }
            line.push_str(&word);
            line_units = joined;
            continue;
        }
        if !line.is_empty() {
            lines.push(std::mem::take(&mut line));
        }
        if mm(word_units, size_pt) <= width_mm {
            line = word;
            line_units = word_units;
        } else {
            let mut pieces = break_word(&word, face, size_pt, width_mm);
            line = pieces.pop().unwrap_or_default();
            line_units = units(&line, face);
            lines.extend(pieces);
        }
    }
    if !line.is_empty() || lines.is_empty() {
        lines.push(line);
    }
    lines
}

/// A word too wide for the line, cut into pieces that fit (at least one
/// character per piece, so an absurdly narrow width still terminates).
fn break_word(word: &str, face: Face, size_pt: f32, width_mm: f32) -> Vec<String> {
    let mut pieces = Vec::new();
    let mut piece = String::new();
    let mut piece_units = 0u32;
    for ch in word.chars() {
        let w = u32::from(glyph_width(face, ch));
        if !piece.is_empty() && mm(piece_units + w, size_pt) > width_mm {
            pieces.push(std::mem::take(&mut piece));
            piece_units = 0;
        }
        piece.push(ch);
        piece_units += w;
    }
    pieces.push(piece);
    pieces
}

/// `text` on one line no wider than `width_mm`: unchanged if it fits,
/// otherwise cut and ended with an ellipsis. Linear in the text's length:
/// the longest prefix that fits with the ellipsis is found in one pass.
pub fn fit(text: &str, face: Face, size_pt: f32, width_mm: f32) -> String {
    let text = to_win_ansi(text);
    let total = units(&text, face);
    if mm(total, size_pt) <= width_mm {
        return text;
    }
    let ellipsis = u32::from(glyph_width(face, ELLIPSIS));
    // Byte end of the longest prefix that fits with the ellipsis after it
    // (trailing spaces dropped, as they would not show before the mark).
    let mut best: Option<usize> = None;
    let mut prefix_units = 0u32;
    for (index, ch) in text.char_indices() {
        prefix_units += u32::from(glyph_width(face, ch));
        if mm(prefix_units + ellipsis, size_pt) > width_mm {
            break;
        }
        best = Some(index + ch.len_utf8());
    }
    // The prefix must be shorter than the whole text (something was cut).
    match best {
        Some(end) => {
            let mut cut = text[..end.min(text.len())].trim_end().to_string();
            cut.push(ELLIPSIS);
            cut
        }
        None if mm(ellipsis, size_pt) <= width_mm => ELLIPSIS.to_string(),
        None => String::new(),
    }
}

/// `text` wrapped into at most `max_lines` lines of `width_mm`; if it needs
/// more, the last kept line ends with an ellipsis.
pub fn wrap_at_most(
    text: &str,
    face: Face,
    size_pt: f32,
    width_mm: f32,
    max_lines: usize,
) -> Vec<String> {
    let mut lines = wrap(text, face, size_pt, width_mm);
    if lines.len() > max_lines.max(1) {
        lines.truncate(max_lines.max(1));
        if let Some(last) = lines.last_mut() {
            let marked = format!("{last}{ELLIPSIS}");
            *last = fit(&marked, face, size_pt, width_mm);
        }
    }
    lines
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn wrapped_lines_fit_and_keep_every_word() {
        let text = "Regenerative two-shaft machine with an unusually long label for a bid";
        let lines = wrap(text, Face::Regular, 9.0, 30.0);
        assert!(lines.len() > 1);
        for line in &lines {
            assert!(text_width_mm(line, Face::Regular, 9.0) <= 30.0, "{line}");
        }
        assert_eq!(lines.join(" "), text);
    }

    #[test]
    fn a_no_break_space_keeps_currency_and_amount_together() {
        let lines = wrap("USD\u{a0}12,500,000 USD 1", Face::Regular, 9.0, 30.0);
        assert_eq!(lines[0], "USD 12,500,000");
    }

    #[test]
    fn an_overlong_word_is_broken_into_fitting_pieces() {
        let word = "a".repeat(80);
        let lines = wrap(&word, Face::Mono, 10.0, 20.0);
        assert!(lines.len() > 1);
        assert!(lines
            .iter()
            .all(|l| text_width_mm(l, Face::Mono, 10.0) <= 20.0));
        assert_eq!(lines.concat(), word);
    }

    #[test]
    fn fit_truncates_with_an_ellipsis_only_when_needed() {
        assert_eq!(fit("short", Face::Regular, 9.0, 50.0), "short");
        let cut = fit("a label that cannot possibly fit", Face::Regular, 9.0, 20.0);
        assert!(cut.ends_with(ELLIPSIS), "{cut}");
        assert!(text_width_mm(&cut, Face::Regular, 9.0) <= 20.0);
    }

    #[test]
    fn wrap_at_most_marks_what_it_dropped() {
        let text = "one two three four five six seven eight nine ten eleven twelve";
        let lines = wrap_at_most(text, Face::Regular, 9.0, 15.0, 2);
        assert_eq!(lines.len(), 2);
        assert!(lines[1].ends_with(ELLIPSIS), "{lines:?}");
        assert_eq!(lines[1].matches(ELLIPSIS).count(), 1, "{lines:?}");
    }
}
