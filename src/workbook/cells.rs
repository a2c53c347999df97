//! Writing one cell of a ledger sheet: a formula with its cached value, a
//! number, text or a date, each with its format.

use super::style::cached;
use super::xlsx_error;
use crate::finance::Money;
use crate::Result;
use chrono::Datelike;
use rust_decimal::Decimal;
use rust_xlsxwriter::{ExcelDateTime, Format, Formula, Worksheet};

pub(crate) fn f(value: Decimal) -> f64 {
    value.to_f64()
}

/// `A1`-style relative address.
pub(crate) fn at(row: u32, col: u16) -> String {
    rust_xlsxwriter::utility::row_col_to_cell(row, col)
}

pub(crate) struct Cells<'a> {
    /// The sheet written to.
    pub(crate) sheet: &'a mut Worksheet,
}

impl Cells<'_> {
    pub(crate) fn formula(
        &mut self,
        row: u32,
        col: u16,
        text: &str,
        value: f64,
        format: &Format,
    ) -> Result<()> {
        let formula = Formula::new(text).set_result(cached(value));
        self.sheet
            .write_formula_with_format(row, col, formula, format)
            .map_err(xlsx_error)?;
        Ok(())
    }

    pub(crate) fn number(&mut self, row: u32, col: u16, value: f64, format: &Format) -> Result<()> {
        self.sheet
            .write_number_with_format(row, col, value, format)
            .map_err(xlsx_error)?;
        Ok(())
    }

    pub(crate) fn text(&mut self, row: u32, col: u16, value: &str, format: &Format) -> Result<()> {
        self.sheet
            .write_string_with_format(row, col, value, format)
            .map_err(xlsx_error)?;
        Ok(())
    }

    pub(crate) fn date(
        &mut self,
        row: u32,
        col: u16,
        date: chrono::NaiveDate,
        format: &Format,
    ) -> Result<()> {
        let excel = u16::try_from(date.year())
            .ok()
            .and_then(|y| ExcelDateTime::from_ymd(y, date.month() as u8, date.day() as u8).ok());
        match excel {
            Some(d) => self
                .sheet
                .write_date_with_format(row, col, &d, format)
                .map(|_| ())
                .map_err(xlsx_error),
            None => self.text(row, col, &date.to_string(), format),
        }
    }
}
