//! Splitting a quantity's text into its number and its unit.

/// A quantity's text split into the number (digit separators `_` removed)
/// and the unit text after it (trimmed; empty for a bare number).
#[derive(Debug, PartialEq)]
pub(crate) enum Split<'a> {
    /// A number, optionally followed by a unit.
    Quantity {
        /// The number text, ready for `f64` or `Decimal` parsing.
        number: String,
        /// The unit text, possibly empty.
        unit: &'a str,
    },
    /// The text does not start with a number.
    NotANumber,
}

/// Split `text` into a leading decimal number (sign, digits with optional `_`
/// separators, fraction, exponent) and the unit after it. Words such as
/// `inf` or `NaN` are not numbers here.
pub(crate) fn split_quantity(text: &str) -> Split<'_> {
    let trimmed = text.trim();
    let bytes = trimmed.as_bytes();
    let mut i = 0;
    if matches!(bytes.first(), Some(b'+' | b'-')) {
        i += 1;
    }
    let digits_start = i;
    let mut digit_count = 0;
    while i < bytes.len() && (bytes[i].is_ascii_digit() || (bytes[i] == b'_' && i > digits_start)) {
        digit_count += usize::from(bytes[i].is_ascii_digit());
        i += 1;
    }
    if i < bytes.len() && bytes[i] == b'.' {
        i += 1;
        while i < bytes.len() && bytes[i].is_ascii_digit() {
            digit_count += 1;
            i += 1;
        }
    }
    if digit_count == 0 {
        return Split::NotANumber;
    }
    if i < bytes.len() && matches!(bytes[i], b'e' | b'E') {
        let mut j = i + 1;
        if j < bytes.len() && matches!(bytes[j], b'+' | b'-') {
            j += 1;
        }
        let exponent_digits_start = j;
        while j < bytes.len() && bytes[j].is_ascii_digit() {
            j += 1;
        }
        if j > exponent_digits_start {
            i = j;
        }
    }
    let number = trimmed[..i].replace('_', "");
    let unit = trimmed[i..].trim();
    Split::Quantity { number, unit }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn parts(text: &str) -> Option<(String, String)> {
        match split_quantity(text) {
            Split::Quantity { number, unit } => Some((number, unit.to_string())),
            Split::NotANumber => None,
        }
    }

    #[test]
    fn splits_number_and_unit() {
        assert_eq!(parts(" 15 degC "), Some(("15".into(), "degC".into())));
        assert_eq!(parts("86%"), Some(("86".into(), "%".into())));
        assert_eq!(parts("-1.5e3 Pa"), Some(("-1.5e3".into(), "Pa".into())));
        assert_eq!(
            parts("48_500_000 USD"),
            Some(("48500000".into(), "USD".into()))
        );
        assert_eq!(parts(".5"), Some((".5".into(), "".into())));
        assert_eq!(parts("5e"), Some(("5".into(), "e".into())));
    }

    #[test]
    fn rejects_words_and_empty_text() {
        assert_eq!(parts(""), None);
        assert_eq!(parts("inf"), None);
        assert_eq!(parts("NaN K"), None);
        assert_eq!(parts("-"), None);
        assert_eq!(parts("_5"), None);
        assert_eq!(parts("K 15"), None);
    }
}
