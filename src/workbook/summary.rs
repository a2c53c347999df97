//! The Summary sheet: each candidate's lifecycle cost and its metrics
//! against the baseline, every one a formula of the ledger sheets, with the
//! verdict as a formula too.
//!
//! Definitions as in `finance::compare_summaries` (ASTM E1074 net savings,
//! E964 savings-to-investment ratio, E1057 adjusted internal rate of
//! return, E1121 payback): break-even premium = premium asked + net savings
//! ÷ present value per unit of added capital; break-even fuel price = fuel
//! price × (1 + net savings ÷ (PV fuel of the candidate − PV fuel of the
//! baseline)). The verdict compares the break-even premium with the premium
//! asked, both rounded to the cent, as the report does.

use super::ledger::{col, total, Layout};
use super::style::{cached, literal, quoted_sheet, Styles};
use super::xlsx_error;
use crate::analysis::compare::Study;
use crate::finance::{Money, Payback};
use crate::scenario::LoadedScenario;
use crate::Result;
use rust_decimal::Decimal;
use rust_xlsxwriter::{Format, Formula, Workbook, Worksheet};

/// Name of the Summary sheet.
pub(crate) const SHEET: &str = "Summary";

/// Verdict words: the break-even premium covers the premium asked.
pub const PAYS: &str = "pays for its premium";
/// Verdict words: it does not.
pub const DOES_NOT_PAY: &str = "does not pay for its premium";
/// What a payback cell says when savings never recover the added capital.
pub const NEVER: &str = "never within life";
/// What a metric cell says when the metric is undefined.
pub const UNDEFINED: &str = "n/a";

/// Columns of the Summary table (zero-based).
pub mod column {
    /// Candidate id.
    pub const ID: u16 = 0;
    /// Candidate label.
    pub const LABEL: u16 = 1;
    /// Capital cost.
    pub const CAPITAL: u16 = 2;
    /// Lifecycle cost.
    pub const LIFECYCLE_COST: u16 = 3;
    /// Net savings against the baseline.
    pub const NET_SAVINGS: u16 = 4;
    /// Premium asked.
    pub const PREMIUM_ASKED: u16 = 5;
    /// Break-even premium.
    pub const BREAK_EVEN_PREMIUM: u16 = 6;
    /// Verdict.
    pub const VERDICT: u16 = 7;
    /// Savings-to-investment ratio.
    pub const SIR: u16 = 8;
    /// Adjusted internal rate of return.
    pub const AIRR: u16 = 9;
    /// Simple payback, years.
    pub const SIMPLE_PAYBACK: u16 = 10;
    /// Discounted payback, years.
    pub const DISCOUNTED_PAYBACK: u16 = 11;
    /// Break-even fuel price per GJ.
    pub const BREAK_EVEN_FUEL_PRICE: u16 = 12;
    /// Operating savings (present value).
    pub const OPERATING_SAVINGS: u16 = 13;
    /// Added investment (present value).
    pub const ADDED_INVESTMENT: u16 = 14;
}

/// Row of the first candidate in the Summary table (zero-based); the
/// candidates follow in scenario order.
pub const FIRST_ROW: u32 = 3;

const HEADERS: [&str; 15] = [
    "Candidate",
    "Label",
    "Capital cost",
    "Lifecycle cost",
    "Net savings vs baseline",
    "Premium asked",
    "Break-even premium",
    "Verdict",
    "Savings-to-investment ratio",
    "Adjusted internal rate of return",
    "Simple payback, years",
    "Discounted payback, years",
    "Break-even fuel price, per GJ",
    "Operating savings (present value)",
    "Added investment (present value)",
];

fn at(row: u32, col: u16) -> String {
    rust_xlsxwriter::utility::row_col_to_cell(row, col)
}

fn write(
    sheet: &mut Worksheet,
    row: u32,
    col: u16,
    text: String,
    value: Option<f64>,
    words: &str,
    format: &Format,
) -> Result<()> {
    let result = value.map_or(words.to_string(), cached);
    sheet
        .write_formula_with_format(row, col, Formula::new(text).set_result(result), format)
        .map_err(xlsx_error)?;
    Ok(())
}

fn payback_value(p: Payback) -> Option<f64> {
    match p {
        Payback::Years(y) => Some(y),
        Payback::NeverWithinLife => None,
    }
}

/// Write the Summary sheet.
pub(crate) fn write_sheet(
    workbook: &mut Workbook,
    loaded: &LoadedScenario,
    study: &Study,
    layouts: &[Layout],
    capital_names: &[String],
    styles: &Styles,
) -> Result<()> {
    let sheet = workbook.add_worksheet();
    sheet.set_name(SHEET).map_err(xlsx_error)?;
    // Printed landscape, one page wide.
    sheet.set_landscape().set_print_fit_to_pages(1, 0);
    sheet.set_column_width(0, 16.0).map_err(xlsx_error)?;
    sheet.set_column_width(1, 40.0).map_err(xlsx_error)?;
    sheet
        .set_column_range_width(2, 14, 18.0)
        .map_err(xlsx_error)?;
    sheet
        .write_string_with_format(0, 0, format!("Summary: {}", loaded.scenario.meta.title), &styles.heading)
        .and_then(|s| s.write_string_with_format(1, 0, "Every figure is a formula of the ledger sheets; change an input on the Inputs sheet and they follow. Screening-level estimates; see the cautions on the Inputs sheet.", &styles.note))
        .map_err(xlsx_error)?;
    sheet
        .set_row_height(FIRST_ROW - 1, 32)
        .map_err(xlsx_error)?;
    for (c, h) in HEADERS.iter().enumerate() {
        sheet
            .write_string_with_format(FIRST_ROW - 1, c as u16, *h, &styles.header)
            .map_err(xlsx_error)?;
    }
    let base = &layouts[study.baseline_index];
    let base_sheet = quoted_sheet(&base.sheet);
    let bref = |row: u32| format!("{base_sheet}!{}", at(row, 1));
    let m = &styles.money.formula;
    for (index, outcome) in study.outcomes.iter().enumerate() {
        let r = FIRST_ROW + index as u32;
        let candidate = &loaded.scenario.candidates[index];
        let me = quoted_sheet(&layouts[index].sheet);
        let mref = |row: u32| format!("{me}!{}", at(row, 1));
        sheet
            .write_string_with_format(r, column::ID, &candidate.id, &styles.text)
            .and_then(|s| {
                s.write_string_with_format(r, column::LABEL, &candidate.label, &styles.text)
            })
            .map_err(xlsx_error)?;
        write(
            sheet,
            r,
            column::CAPITAL,
            format!("={}", capital_names[index]),
            Some(candidate.capital_cost.to_f64()),
            "",
            m,
        )?;
        write(
            sheet,
            r,
            column::LIFECYCLE_COST,
            format!("={}", mref(total::LIFECYCLE_COST)),
            Some(outcome.ledger.summary.lifecycle_cost.to_f64()),
            "",
            m,
        )?;
        let Some(versus) = &outcome.versus_baseline else {
            sheet
                .write_string_with_format(r, column::NET_SAVINGS, "baseline", &styles.text)
                .map_err(xlsx_error)?;
            continue;
        };
        let s = &versus.savings;
        let cell = |c: u16| at(r, c);
        write(
            sheet,
            r,
            column::NET_SAVINGS,
            format!(
                "={}-{}",
                bref(total::LIFECYCLE_COST),
                mref(total::LIFECYCLE_COST)
            ),
            Some(s.net_savings.to_f64()),
            "",
            m,
        )?;
        write(
            sheet,
            r,
            column::PREMIUM_ASKED,
            format!(
                "={}-{}",
                mref(total::CAPITAL_PAID),
                bref(total::CAPITAL_PAID)
            ),
            Some(s.premium_asked.to_f64()),
            "",
            m,
        )?;
        let (ns, asked) = (cell(column::NET_SAVINGS), cell(column::PREMIUM_ASKED));
        write(
            sheet,
            r,
            column::BREAK_EVEN_PREMIUM,
            format!(
                "=IFERROR({asked}+{ns}/{},{})",
                mref(total::PV_PER_UNIT_CAPITAL),
                literal(UNDEFINED)
            ),
            s.break_even_premium.map(Money::to_f64),
            UNDEFINED,
            m,
        )?;
        let be = cell(column::BREAK_EVEN_PREMIUM);
        let verdict_value = s.break_even_premium.map(|b| {
            let round = |x: Decimal| crate::finance::round_for_presentation(x, 2);
            if round(b) >= round(s.premium_asked) {
                PAYS
            } else {
                DOES_NOT_PAY
            }
        });
        write(
            sheet,
            r,
            column::VERDICT,
            format!(
                "=IF(ISNUMBER({be}),IF(ROUND({be},2)>=ROUND({asked},2),{},{}),{})",
                literal(PAYS),
                literal(DOES_NOT_PAY),
                literal(UNDEFINED)
            ),
            None,
            verdict_value.unwrap_or(UNDEFINED),
            &styles.text,
        )?;
        write(
            sheet,
            r,
            column::OPERATING_SAVINGS,
            format!(
                "={}-{}",
                bref(total::PV_OPERATING),
                mref(total::PV_OPERATING)
            ),
            Some(s.operating_savings.to_f64()),
            "",
            m,
        )?;
        write(
            sheet,
            r,
            column::ADDED_INVESTMENT,
            format!("={}-{}", mref(total::INVESTMENT), bref(total::INVESTMENT)),
            Some(s.added_investment.to_f64()),
            "",
            m,
        )?;
        let (ops, added) = (
            cell(column::OPERATING_SAVINGS),
            cell(column::ADDED_INVESTMENT),
        );
        write(
            sheet,
            r,
            column::SIR,
            format!("=IF({added}>0,{ops}/{added},{})", literal(UNDEFINED)),
            s.savings_to_investment.map(Money::to_f64),
            UNDEFINED,
            &styles.number.formula,
        )?;
        let sir = cell(column::SIR);
        write(sheet, r, column::AIRR, format!("=IF(ISNUMBER({sir}),IF({sir}>0,(1+DiscountRate)*{sir}^(1/ServiceLifeYears)-1,{u}),{u})", u = literal(UNDEFINED)), s.adjusted_irr, UNDEFINED, &styles.percent.formula)?;
        let ledger = &layouts[index];
        for (c, crossing, added_row, payback) in [
            (
                column::SIMPLE_PAYBACK,
                col::SIMPLE_CROSSING,
                total::CAPITAL_PAID,
                versus.simple_payback,
            ),
            (
                column::DISCOUNTED_PAYBACK,
                col::DISCOUNTED_CROSSING,
                total::PV_CAPITAL,
                versus.discounted_payback,
            ),
        ] {
            let range = format!(
                "{me}!{}:{}",
                at(ledger.operating.0, crossing),
                at(ledger.operating.1, crossing)
            );
            let text = format!(
                "=IF({}-{}<=0,0,IF(COUNT({range})=0,{},MIN({range})))",
                mref(added_row),
                bref(added_row),
                literal(NEVER)
            );
            write(
                sheet,
                r,
                c,
                text,
                payback_value(payback),
                NEVER,
                &styles.number.formula,
            )?;
        }
        let fuel_price = s
            .break_even_fuel_price
            .map(|b| (loaded.scenario.fuel.price_per_gj * b.multiplier).to_f64());
        write(
            sheet,
            r,
            column::BREAK_EVEN_FUEL_PRICE,
            format!(
                "=IFERROR(FuelPrice*(1+{ns}/({}-{})),{})",
                mref(total::PV_FUEL),
                bref(total::PV_FUEL),
                literal(UNDEFINED)
            ),
            fuel_price,
            UNDEFINED,
            m,
        )?;
    }
    let notes = [
        "Net savings (ASTM E1074): baseline lifecycle cost minus the candidate's. Positive: the candidate costs less over its life.",
        "Premium asked: the candidate's capital minus the baseline's. Break-even premium: the premium at which net savings would be zero (the candidate's capital schedule scaled, a residual stated as a share of capital following it).",
        "Savings-to-investment ratio (ASTM E964): present value of operating costs saved over the added investment (capital and residual credit, present value); undefined without added investment.",
        "Adjusted internal rate of return (ASTM E1057): (1 + discount rate) × SIR^(1/service life) − 1.",
        "Payback (ASTM E1121): years from commercial operation until cumulative savings recover the added capital, linear within a year; residual value not counted.",
        "Break-even fuel price: the price (on the scenario's price basis, per GJ; every price of a price path scaled alike) at which the two lifecycle costs are equal.",
    ];
    let first_note = FIRST_ROW + study.outcomes.len() as u32 + 1;
    for (row, note) in (first_note..).zip(notes.iter().chain(super::CAUTIONS)) {
        sheet
            .write_string_with_format(row, 0, *note, &styles.note)
            .map_err(xlsx_error)?;
    }
    Ok(())
}
