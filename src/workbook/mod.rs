//! The audit workbook (`.xlsx`): the ledger of every candidate as live
//! spreadsheet formulas, so that a reviewer can follow, and change, every
//! money figure in a spreadsheet application.
//!
//! Sheets, in order: **Inputs** (every economic input as a named cell with
//! unit and source; each candidate's figures from brayfin's cycle model as
//! marked constants; the scenario's SHA-256), one **Ledger** sheet per
//! candidate (row streams as formulas of the named inputs, discount factor,
//! present value; totals on top) and **Summary** (lifecycle cost, net
//! savings, SIR, AIRR, paybacks, break-even premium and fuel price, verdict,
//! all formulas of the ledger sheets).
//!
//! Every formula carries its cached value, taken from the decimal ledger
//! (`finance::build_ledger`) and its comparison, so that a reader that does
//! not recalculate shows the same figures as `compare`. A spreadsheet
//! application recalculating the formulas in double precision reproduces
//! them to well under a cent (see the notes of `src/workbook/ledger.rs`).
//!
//! The workbook is built from the analysis layer's [`Study`] rather than the
//! rounded report model: formulas need the unrounded quantities.

mod cells;
mod inputs;
mod ledger;
mod payback;
mod style;
pub mod summary;

use crate::analysis::compare::Study;
use crate::scenario::LoadedScenario;
use crate::{Error, Result};
use rust_xlsxwriter::{DocProperties, Workbook, XlsxError};

/// Cautions printed on the Inputs and Summary sheets.
pub(crate) const CAUTIONS: &[&str] = &[
    "Screening-level estimates from a thermodynamic cycle model and a lifecycle-cost ledger.",
    "Not a substitute for vendor guarantees, acceptance testing, or licensed engineering and financial advice; defer to local codes.",
];

/// An xlsx writer failure: a bug in the workbook's layout, not bad input.
pub(crate) fn xlsx_error(error: XlsxError) -> Error {
    Error::Internal(format!("building the workbook failed: {error}"))
}

/// Defined names of each candidate: `bid_<id>_<Field>`, the id reduced to
/// letters, digits and underscores (made unique by the candidate's number
/// when two ids reduce alike).
pub(crate) struct Names {
    prefixes: Vec<String>,
}

/// The defined names of one candidate.
pub(crate) struct CandidateNames<'a> {
    prefix: &'a str,
}

impl CandidateNames<'_> {
    /// The name of `field` of this candidate, e.g. `bid_premium_CapitalCost`.
    pub(crate) fn name(&self, field: &str) -> String {
        format!("{}_{field}", self.prefix)
    }
}

impl Names {
    fn new(ids: &[&str]) -> Names {
        let mut prefixes: Vec<String> = Vec::with_capacity(ids.len());
        for (index, id) in ids.iter().enumerate() {
            let reduced: String = id
                .chars()
                .map(|c| if c.is_ascii_alphanumeric() { c } else { '_' })
                .collect();
            let mut prefix = format!("bid_{reduced}");
            if prefixes.contains(&prefix) {
                prefix = format!("{prefix}_{}", index + 1);
            }
            prefixes.push(prefix);
        }
        Names { prefixes }
    }

    /// The names of candidate `index`.
    pub(crate) fn candidate(&self, index: usize) -> CandidateNames<'_> {
        CandidateNames {
            prefix: &self.prefixes[index],
        }
    }

    /// `field` of every candidate, comma-separated (for `MAX(…)`).
    pub(crate) fn all(&self, field: &str) -> String {
        self.prefixes
            .iter()
            .map(|p| format!("{p}_{field}"))
            .collect::<Vec<_>>()
            .join(",")
    }
}

/// Sheet name of a candidate's ledger: `Ledger <id>`, without the
/// characters a sheet name cannot hold, at most 31 characters, unique.
fn ledger_sheet_names(ids: &[&str]) -> Vec<String> {
    let mut names: Vec<String> = Vec::with_capacity(ids.len());
    for (index, id) in ids.iter().enumerate() {
        let clean: String = id
            .chars()
            .map(|c| if "[]:*?/\\'".contains(c) { '_' } else { c })
            .collect();
        let mut name: String = format!("Ledger {clean}").chars().take(31).collect();
        if names.iter().any(|n| n.eq_ignore_ascii_case(&name)) {
            let suffix = format!(" {}", index + 1);
            name = name.chars().take(31 - suffix.len()).collect::<String>() + &suffix;
        }
        names.push(name);
    }
    names
}

/// Build the audit workbook of a scenario's study as `.xlsx` bytes.
pub fn build_workbook(loaded: &LoadedScenario, study: &Study) -> Result<Vec<u8>> {
    let scenario = &loaded.scenario;
    let ids: Vec<&str> = scenario.candidates.iter().map(|c| c.id.as_str()).collect();
    let names = Names::new(&ids);
    let styles = style::Styles::new(&scenario.meta.currency);
    let layouts: Vec<ledger::Layout> = ledger_sheet_names(&ids)
        .into_iter()
        .zip(&study.outcomes)
        .map(|(sheet, outcome)| ledger::layout(sheet, outcome))
        .collect();
    let mut workbook = Workbook::new();
    workbook.set_properties(
        &DocProperties::new()
            .set_title(&scenario.meta.title)
            .set_subject("Lifecycle-cost audit workbook")
            .set_comment(format!("scenario SHA-256 {}", loaded.sha256_hex)),
    );
    inputs::write(&mut workbook, loaded, study, &names, &styles)?;
    for (index, candidate) in scenario.candidates.iter().enumerate() {
        let sheet = ledger::LedgerSheet {
            study,
            index,
            layouts: &layouts,
            names: &names,
            styles: &styles,
        };
        let title = format!("Ledger of `{}`: {}", candidate.id, candidate.label);
        sheet.write(&mut workbook, &title)?;
    }
    let capital_names: Vec<String> = (0..ids.len())
        .map(|i| names.candidate(i).name("CapitalCost"))
        .collect();
    summary::write_sheet(
        &mut workbook,
        loaded,
        study,
        &layouts,
        &capital_names,
        &styles,
    )?;
    workbook.save_to_buffer().map_err(xlsx_error)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Ids that reduce alike (`as-is`, `as_is`) get distinct names; every
    /// name is letters, digits and underscores, starting with a letter.
    #[test]
    fn candidate_names_are_valid_and_distinct() {
        let names = Names::new(&["as-is", "as_is", "2030-upgrade"]);
        let all: Vec<String> = (0..3)
            .map(|i| names.candidate(i).name("CapitalCost"))
            .collect();
        assert_eq!(
            all,
            [
                "bid_as_is_CapitalCost",
                "bid_as_is_2_CapitalCost",
                "bid_2030_upgrade_CapitalCost"
            ]
        );
        for name in &all {
            assert!(name.chars().all(|c| c.is_ascii_alphanumeric() || c == '_'));
        }
    }

    /// Sheet names stay within 31 characters and distinct, ignoring case.
    #[test]
    fn ledger_sheet_names_fit_and_differ() {
        let long = "a-very-long-candidate-identifier-indeed";
        let names = ledger_sheet_names(&[long, &long.to_uppercase(), "b"]);
        assert_eq!(names[2], "Ledger b");
        assert!(names.iter().all(|n| n.chars().count() <= 31), "{names:?}");
        assert!(!names[0].eq_ignore_ascii_case(&names[1]), "{names:?}");
    }
}
