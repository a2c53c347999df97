//! Fitting text into a width: word wrapping and truncation with an
//! ellipsis, both measured with the real font metrics of [`super::fonts`].

use super::fonts::{text_width_mm, to_win_ansi, Face};

/// The ellipsis that marks truncated text (WinAnsi code 0x85).
pub const ELLIPSIS: char = '…';

/// `text` wrapped into lines no wider than `width_mm` when set in `face` at
/// `size_pt`. Breaks at spaces (not at no-break spaces, U+00A0, which keep
/// e.g. a currency code with its amount); a word wider than the line is
/// broken between characters. Always returns at least one line.
pub fn wrap(text: &str, face: Face, size_pt: f32, width_mm: f32) -> Vec<String> {
    let mut lines = Vec::new();
    let mut line = String::new();
    let words = text
        .split([' ', '\n'])
        .filter(|w| !w.is_empty())
        .map(to_win_ansi);
    for word in words {
        let word = word.as_str();
        let candidate = if line.is_empty() {
            word.to_string()
        } else {
            format!("{line} {word}")
        };
        if text_width_mm(&candidate, face, size_pt) <= width_mm {
            line = candidate;
            continue;
        }
        if !line.is_empty() {
            lines.push(std::mem::take(&mut line));
        }
        if text_width_mm(word, face, size_pt) <= width_mm {
            line = word.to_string();
        } else {
            let mut pieces = break_word(word, face, size_pt, width_mm);
            line = pieces.pop().unwrap_or_default();
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
    for ch in word.chars() {
        piece.push(ch);
        if piece.chars().count() > 1 && text_width_mm(&piece, face, size_pt) > width_mm {
            piece.pop();
            pieces.push(std::mem::take(&mut piece));
            piece.push(ch);
        }
    }
    pieces.push(piece);
    pieces
}

/// `text` on one line no wider than `width_mm`: unchanged if it fits,
/// otherwise cut and ended with an ellipsis.
pub fn fit(text: &str, face: Face, size_pt: f32, width_mm: f32) -> String {
    let text = to_win_ansi(text);
    if text_width_mm(&text, face, size_pt) <= width_mm {
        return text;
    }
    let mut kept: Vec<char> = text.chars().collect();
    while !kept.is_empty() {
        kept.pop();
        let mut candidate: String = kept.iter().collect::<String>().trim_end().to_string();
        candidate.push(ELLIPSIS);
        if text_width_mm(&candidate, face, size_pt) <= width_mm {
            return candidate;
        }
    }
    String::new()
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
