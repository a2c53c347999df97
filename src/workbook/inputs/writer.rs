//! Rows of the Inputs sheet: `label | name | value | unit | source`, each
//! value a defined name of the workbook.

use super::super::style::{absolute, Kinds, Styles};
use super::super::xlsx_error;
use super::SHEET;
use crate::scenario::LoadedScenario;
use crate::Result;
use rust_decimal::prelude::ToPrimitive;
use rust_decimal::Decimal;
use rust_xlsxwriter::{Format, Formula, Worksheet};

/// How a value cell is shown.
pub(super) enum Shown {
    Money(Decimal),
    Percent(f64),
    Number(f64),
    Factor(f64),
    Word(String),
}

/// Whether a value is a scenario input or a constant brayfin computed.
#[derive(Clone, Copy)]
pub(super) enum Origin {
    Input,
    Computed,
}

/// Writes rows of `label | name | value | unit | source` and defines names.
pub(super) struct Writer<'a> {
    pub(super) sheet: &'a mut Worksheet,
    pub(super) styles: &'a Styles,
    pub(super) row: u32,
    pub(super) names: Vec<(String, String)>,
}

pub(super) fn money_f64(value: Decimal) -> f64 {
    value.to_f64().unwrap_or(f64::NAN)
}

impl Writer<'_> {
    fn value(&mut self, row: u32, shown: &Shown, origin: Origin) -> Result<()> {
        let s = self.styles;
        let pick = |k: &Kinds| match origin {
            Origin::Input => k.input.clone(),
            Origin::Computed => k.computed.clone(),
        };
        let sheet = &mut *self.sheet;
        match shown {
            Shown::Money(v) => {
                sheet.write_number_with_format(row, 2, money_f64(*v), &pick(&s.money))
            }
            Shown::Percent(v) => sheet.write_number_with_format(row, 2, *v, &pick(&s.percent)),
            Shown::Number(v) => sheet.write_number_with_format(row, 2, *v, &pick(&s.number)),
            Shown::Factor(v) => sheet.write_number_with_format(row, 2, *v, &pick(&s.factor)),
            Shown::Word(v) => sheet.write_string_with_format(row, 2, v, &pick(&s.word)),
        }
        .map_err(xlsx_error)?;
        Ok(())
    }

    /// One named value row.
    pub(super) fn named(
        &mut self,
        label: &str,
        name: &str,
        shown: Shown,
        unit: &str,
        source: &str,
        origin: Origin,
    ) -> Result<()> {
        let row = self.row;
        self.labels(row, label, name, unit, source)?;
        self.value(row, &shown, origin)?;
        self.names
            .push((name.to_string(), format!("={}", absolute(SHEET, row, 2))));
        self.row += 1;
        Ok(())
    }

    /// One named formula row with its cached value.
    pub(super) fn formula(
        &mut self,
        label: &str,
        name: &str,
        formula: &str,
        cached: f64,
        unit: &str,
        source: &str,
    ) -> Result<()> {
        let row = self.row;
        self.labels(row, label, name, unit, source)?;
        let f = Formula::new(formula).set_result(super::super::style::cached(cached));
        self.sheet
            .write_formula_with_format(row, 2, f, &self.styles.number.formula)
            .map_err(xlsx_error)?;
        self.names
            .push((name.to_string(), format!("={}", absolute(SHEET, row, 2))));
        self.row += 1;
        Ok(())
    }

    fn labels(
        &mut self,
        row: u32,
        label: &str,
        name: &str,
        unit: &str,
        source: &str,
    ) -> Result<()> {
        let text = &self.styles.text;
        self.sheet
            .write_string_with_format(row, 0, label, text)
            .and_then(|s| s.write_string_with_format(row, 1, name, text))
            .and_then(|s| s.write_string_with_format(row, 3, unit, text))
            .and_then(|s| s.write_string_with_format(row, 4, source, &self.styles.note))
            .map_err(xlsx_error)?;
        Ok(())
    }

    pub(super) fn heading(&mut self, text: &str) -> Result<()> {
        self.row += 1;
        self.sheet
            .write_string_with_format(self.row, 0, text, &self.styles.heading)
            .map_err(xlsx_error)?;
        self.row += 1;
        Ok(())
    }

    pub(super) fn line(&mut self, text: &str, format: &Format) -> Result<()> {
        self.sheet
            .write_string_with_format(self.row, 0, text, format)
            .map_err(xlsx_error)?;
        self.row += 1;
        Ok(())
    }
}

/// Where a scenario key's value came from: as written and its stated
/// source, or the default brayfin applied.
pub(super) fn source_of(loaded: &LoadedScenario, key: &str) -> String {
    if let Some(line) = loaded.inputs.iter().find(|i| i.key == key) {
        let written = format!("{} {}", line.value_text, line.unit);
        return match &line.source {
            Some(s) => format!("scenario `{key}` = {}; source: {s}", written.trim()),
            None => format!("scenario `{key}` = {}; no source stated", written.trim()),
        };
    }
    if let Some(default) = loaded.applied_defaults.iter().find(|d| d.key == key) {
        return format!("brayfin default for `{key}`: {}", default.value);
    }
    format!("scenario `{key}`")
}
