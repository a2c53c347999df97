//! The Inputs sheet: every economic input as a named cell with its unit and
//! where it came from, and each candidate's figures from brayfin's cycle
//! model and operating year, marked as computed constants.

mod candidate;
mod writer;

use super::style::{absolute, Styles};
use super::{xlsx_error, Names};
use crate::analysis::compare::Study;
use crate::finance::{FuelPrice, PriceBasis, RateBasis, Timing};
use crate::scenario::LoadedScenario;
use crate::Result;
use rust_xlsxwriter::Workbook;
use writer::{money_f64, source_of, Origin, Shown, Writer};

/// Name of the Inputs sheet.
pub(crate) const SHEET: &str = "Inputs";

/// Write the Inputs sheet and return the names it defined.
pub(crate) fn write(
    workbook: &mut Workbook,
    loaded: &LoadedScenario,
    study: &Study,
    names: &Names,
    styles: &Styles,
) -> Result<()> {
    let scenario = &loaded.scenario;
    let currency = &scenario.meta.currency;
    let sheet = workbook.add_worksheet();
    sheet.set_name(SHEET).map_err(xlsx_error)?;
    // Printed landscape, one page wide.
    sheet.set_landscape().set_print_fit_to_pages(1, 0);
    for (col, width) in [(0u16, 44.0), (1, 30.0), (2, 20.0), (3, 18.0), (4, 90.0)] {
        sheet.set_column_width(col, width).map_err(xlsx_error)?;
    }
    let mut w = Writer {
        sheet,
        styles,
        row: 0,
        names: Vec::new(),
    };
    w.line(
        &format!("brayfin audit workbook: {}", scenario.meta.title),
        &styles.heading,
    )?;
    w.line(
        &format!("Scenario file: {}", loaded.file_label),
        &styles.text,
    )?;
    w.line(
        &format!("Scenario SHA-256: {}", loaded.sha256_hex),
        &styles.text,
    )?;
    w.line(
        &format!("brayfin version: {}", env!("CARGO_PKG_VERSION")),
        &styles.text,
    )?;
    for caution in super::CAUTIONS {
        w.line(caution, &styles.note)?;
    }
    w.line("Pale yellow: a scenario input (edit it and the ledgers and the summary follow). Pale blue, italic: a constant brayfin computed (cycle model, operating year, calendar); it does not follow edits. No fill: a formula.", &styles.note)?;
    w.row += 1;
    for (col, text) in ["Input", "Name", "Value", "Unit", "Source"]
        .iter()
        .enumerate()
    {
        w.sheet
            .write_string_with_format(w.row, col as u16, *text, &styles.header)
            .map_err(xlsx_error)?;
    }
    w.row += 1;

    let first = &study.outcomes[study.baseline_index].inputs;
    let e = &scenario.economics;
    w.heading("Economics")?;
    w.named(
        "Commercial operation (base date)",
        "CommercialOperation",
        Shown::Word(e.commercial_operation.to_string()),
        "date",
        &source_of(loaded, "economics.commercial_operation"),
        Origin::Input,
    )?;
    let analysis = &study.outcomes[study.baseline_index].ledger.summary.analysis;
    let pv_date = analysis.present_value_date;
    w.named(
        "Present-value date",
        "PresentValueDate",
        Shown::Word(pv_date.to_string()),
        "date",
        &format!(
            "{}; every present value is stated at this date (construction payments before it compounded to it)",
            source_of(loaded, "economics.present_value_date")
        ),
        Origin::Input,
    )?;
    w.named(
        "Present-value date, years from commercial operation",
        "PresentValueYears",
        Shown::Number(analysis.calendar.time_of(pv_date)),
        "years",
        "computed by brayfin's calendar (a constant); the discount factor is (1 + DiscountRate)^-(cash time - this)",
        Origin::Computed,
    )?;
    w.named(
        "Service life",
        "ServiceLifeYears",
        Shown::Number(f64::from(e.service_life_years)),
        "years",
        &source_of(loaded, "economics.service_life_years"),
        Origin::Input,
    )?;
    w.named(
        "Discount rate",
        "DiscountRate",
        Shown::Percent(e.discount_rate),
        "per year",
        &source_of(loaded, "economics.discount_rate"),
        Origin::Input,
    )?;
    let basis = match first.rates.basis {
        RateBasis::Real => "real",
        RateBasis::Nominal => "nominal",
    };
    w.named(
        "Rate basis (every rate and price)",
        "RateBasis",
        Shown::Word(basis.into()),
        "real or nominal",
        &source_of(loaded, "economics.rate_basis"),
        Origin::Input,
    )?;
    w.named("General inflation", "Inflation", Shown::Percent(first.rates.inflation), "per year", &format!("{}; links real and nominal rates (Fisher); every rate here is already on the analysis basis, so no formula uses it", source_of(loaded, "economics.inflation")), Origin::Input)?;
    let timing = match first.timing {
        Timing::EndOfYear => "end-of-year",
        Timing::MidYear => "mid-year",
    };
    w.named(
        "Cash timing within a year",
        "CashTiming",
        Shown::Word(timing.into()),
        "end-of-year or mid-year",
        &source_of(loaded, "economics.timing"),
        Origin::Input,
    )?;
    w.named(
        "Carbon price",
        "CarbonPrice",
        Shown::Money(first.carbon.price_per_tonne),
        &format!("{currency}/t CO2"),
        &source_of(loaded, "economics.carbon_price"),
        Origin::Input,
    )?;
    w.named(
        "Carbon price escalation",
        "CarbonEscalation",
        Shown::Percent(first.carbon.escalation),
        "per year",
        &source_of(loaded, "economics.carbon_escalation"),
        Origin::Input,
    )?;
    w.named(
        "Value of energy bought elsewhere",
        "EnergyValue",
        Shown::Money(e.energy_value_per_mwh),
        &format!("{currency}/MWh"),
        &source_of(loaded, "economics.energy_value"),
        Origin::Input,
    )?;
    w.named(
        "Value of capacity bought elsewhere",
        "CapacityValue",
        Shown::Money(e.capacity_value_per_kw_year),
        &format!("{currency}/kW-yr"),
        &source_of(loaded, "economics.capacity_value"),
        Origin::Input,
    )?;

    w.heading("Fuel")?;
    let price_basis = match first.fuel.basis {
        PriceBasis::Hhv => "hhv",
        PriceBasis::Lhv => "lhv",
    };
    let price_unit = format!("{currency}/GJ ({})", price_basis.to_uppercase());
    w.named(
        "Fuel price at the base date",
        "FuelPrice",
        Shown::Money(scenario.fuel.price_per_gj),
        &price_unit,
        &format!("{}; restated per GJ", source_of(loaded, "fuel.price")),
        Origin::Input,
    )?;
    w.named(
        "Heating-value basis of the price",
        "FuelPriceBasis",
        Shown::Word(price_basis.into()),
        "hhv or lhv",
        &source_of(loaded, "fuel.price_basis"),
        Origin::Input,
    )?;
    let escalation = match &first.fuel.price {
        FuelPrice::Escalating { escalation, .. } => *escalation,
        FuelPrice::Path(_) => 0.0,
    };
    w.named(
        "Fuel price escalation",
        "FuelEscalation",
        Shown::Percent(escalation),
        "per year",
        &source_of(loaded, "fuel.escalation"),
        Origin::Input,
    )?;
    w.named(
        "Higher over lower heating value",
        "HhvOverLhv",
        Shown::Factor(first.fuel.hhv_over_lhv),
        "ratio",
        "computed by brayfin from the fuel composition (a constant)",
        Origin::Computed,
    )?;
    w.named(
        "CO2 per GJ of fuel (LHV)",
        "Co2KgPerGj",
        Shown::Number(first.carbon.co2_kg_per_gj_lhv),
        "kg/GJ LHV",
        "computed by brayfin from the fuel composition, complete combustion (a constant)",
        Origin::Computed,
    )?;
    if let FuelPrice::Path(path) = &first.fuel.price {
        w.line(
            "Fuel price path: price per GJ for each calendar year (replaces the escalation).",
            &styles.note,
        )?;
        let top = w.row;
        for (year, price) in path {
            w.sheet
                .write_number_with_format(w.row, 1, f64::from(*year), &styles.number.input)
                .and_then(|s| {
                    s.write_number_with_format(w.row, 2, money_f64(*price), &styles.money.input)
                })
                .and_then(|s| s.write_string_with_format(w.row, 3, &price_unit, &styles.text))
                .map_err(xlsx_error)?;
            w.row += 1;
        }
        let range = format!(
            "={}:{}",
            absolute(SHEET, top, 1),
            rust_xlsxwriter::utility::row_col_to_cell_absolute(w.row.saturating_sub(1), 2)
        );
        w.names.push(("FuelPricePath".into(), range));
    }

    for index in 0..study.outcomes.len() {
        candidate::write(&mut w, loaded, study, names, index)?;
    }
    let defined = std::mem::take(&mut w.names);
    for (name, target) in defined {
        workbook.define_name(&name, &target).map_err(xlsx_error)?;
    }
    Ok(())
}
