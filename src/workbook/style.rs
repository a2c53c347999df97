//! Cell formats of the audit workbook and small helpers for cell addresses.
//!
//! Three kinds of cell are told apart by their fill, explained on the
//! Inputs sheet: scenario inputs (pale yellow, edit these), constants
//! computed by brayfin's cycle model or calendar (pale blue, italic; they
//! do not follow an edit), and formulas (no fill).

use rust_xlsxwriter::{utility::row_col_to_cell_absolute, Color, Format};

/// Fill of a scenario input cell.
const INPUT_FILL: u32 = 0xFFF5CC;
/// Fill of a constant computed by brayfin.
const COMPUTED_FILL: u32 = 0xDDEBF7;

/// Number formats, each in three kinds (input, computed, formula).
pub(crate) struct Styles {
    /// Bold text for headings.
    pub(crate) heading: Format,
    /// Bold text with wrapping for table headers.
    pub(crate) header: Format,
    /// Plain text.
    pub(crate) text: Format,
    /// Italic grey note text.
    pub(crate) note: Format,
    /// Money in the scenario's currency, per kind.
    pub(crate) money: Kinds,
    /// A rate or fraction shown as a percentage, per kind.
    pub(crate) percent: Kinds,
    /// A plain number with three decimals, per kind.
    pub(crate) number: Kinds,
    /// A dimensionless factor with ten decimals, per kind.
    pub(crate) factor: Kinds,
    /// A calendar date, per kind.
    pub(crate) date: Kinds,
    /// Text, per kind.
    pub(crate) word: Kinds,
}

/// One number format as an input, a computed constant and a formula.
pub(crate) struct Kinds {
    /// A scenario input.
    pub(crate) input: Format,
    /// A constant computed by brayfin.
    pub(crate) computed: Format,
    /// A live formula.
    pub(crate) formula: Format,
}

impl Kinds {
    fn of(num_format: &str) -> Kinds {
        let base = Format::new().set_num_format(num_format);
        Kinds {
            input: base.clone().set_background_color(Color::RGB(INPUT_FILL)),
            computed: base
                .clone()
                .set_italic()
                .set_background_color(Color::RGB(COMPUTED_FILL)),
            formula: base,
        }
    }
}

impl Styles {
    /// The formats for a workbook whose money is in `currency` (an ISO 4217
    /// code such as `USD`), shown with two decimals (cents).
    pub(crate) fn new(currency: &str) -> Styles {
        let code: String = currency
            .chars()
            .filter(|c| c.is_ascii_alphanumeric())
            .collect();
        let money = format!("#,##0.00 \"{code}\";-#,##0.00 \"{code}\"");
        Styles {
            heading: Format::new().set_bold().set_font_size(13),
            header: Format::new().set_bold().set_text_wrap(),
            text: Format::new(),
            note: Format::new()
                .set_italic()
                .set_font_color(Color::RGB(0x595959)),
            money: Kinds::of(&money),
            percent: Kinds::of("0.000%"),
            number: Kinds::of("#,##0.000"),
            factor: Kinds::of("0.0000000000"),
            date: Kinds::of("yyyy-mm-dd"),
            word: Kinds::of("@"),
        }
    }
}

/// `'Sheet name'!$C$5`: an absolute reference to a cell of `sheet`.
pub(crate) fn absolute(sheet: &str, row: u32, col: u16) -> String {
    format!(
        "{}!{}",
        quoted_sheet(sheet),
        row_col_to_cell_absolute(row, col)
    )
}

/// A sheet name as a formula refers to it: in single quotes, with any
/// single quote doubled.
pub(crate) fn quoted_sheet(sheet: &str) -> String {
    format!("'{}'", sheet.replace('\'', "''"))
}

/// A formula's cached value as the text the file stores: a number written
/// so that it reads back as the same `f64`.
pub(crate) fn cached(value: f64) -> String {
    if value.is_finite() {
        format!("{value}")
    } else {
        "0".to_string()
    }
}

/// A string literal in a formula: in double quotes, any double quote
/// doubled.
pub(crate) fn literal(text: &str) -> String {
    format!("\"{}\"", text.replace('"', "\"\""))
}
