//! The Inputs sheet: every economic input as a named cell with its unit and
//! where it came from, and each candidate's figures from brayfin's cycle
//! model and operating year, marked as computed constants.

use super::style::{absolute, Styles};
use super::{xlsx_error, Names};
use crate::analysis::compare::Study;
use crate::finance::{Capital, FuelPrice, PriceBasis, RateBasis, ResidualValue, Timing};
use crate::scenario::LoadedScenario;
use crate::Result;
use rust_decimal::prelude::ToPrimitive;
use rust_decimal::Decimal;
use rust_xlsxwriter::{Format, Formula, Workbook, Worksheet};

/// Name of the Inputs sheet.
pub(crate) const SHEET: &str = "Inputs";

/// How a value cell is shown.
enum Shown {
    Money(Decimal),
    Percent(f64),
    Number(f64),
    Factor(f64),
    Word(String),
}

/// Whether a value is a scenario input or a constant brayfin computed.
#[derive(Clone, Copy)]
enum Origin {
    Input,
    Computed,
}

/// Writes rows of `label | name | value | unit | source` and defines names.
struct Writer<'a> {
    sheet: &'a mut Worksheet,
    styles: &'a Styles,
    row: u32,
    names: Vec<(String, String)>,
}

fn money_f64(value: Decimal) -> f64 {
    value.to_f64().unwrap_or(f64::NAN)
}

impl Writer<'_> {
    fn value(&mut self, row: u32, shown: &Shown, origin: Origin) -> Result<()> {
        let s = self.styles;
        let pick = |k: &super::style::Kinds| match origin {
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
    fn named(
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
    fn formula(
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
        let f = Formula::new(formula).set_result(super::style::cached(cached));
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

    fn heading(&mut self, text: &str) -> Result<()> {
        self.row += 1;
        self.sheet
            .write_string_with_format(self.row, 0, text, &self.styles.heading)
            .map_err(xlsx_error)?;
        self.row += 1;
        Ok(())
    }

    fn line(&mut self, text: &str, format: &Format) -> Result<()> {
        self.sheet
            .write_string_with_format(self.row, 0, text, format)
            .map_err(xlsx_error)?;
        self.row += 1;
        Ok(())
    }
}

/// The candidate's operating points of the year (dispatch blocks, or all
/// hours at full load): output and heat rate from brayfin's cycle model and
/// the scenario's part-load table, as computed constants.
fn bins(
    w: &mut Writer,
    scenario: &crate::scenario::Scenario,
    net_output_kw: f64,
    heat_rate: f64,
) -> Result<()> {
    let operation = &scenario.operation;
    let points: Vec<(f64, f64)> = if operation.dispatch.is_empty() {
        vec![(1.0, operation.hours_per_year)]
    } else {
        operation
            .dispatch
            .iter()
            .map(|b| (b.load_fraction, b.hours))
            .collect()
    };
    let s = w.styles;
    let header = [
        "Load",
        "Net output, kW",
        "Heat rate, kJ/kWh LHV",
        "Hours per year",
    ];
    w.sheet
        .write_string_with_format(w.row, 0, "Operating points of the year (computed)", &s.text)
        .map_err(xlsx_error)?;
    for (k, text) in header.iter().enumerate() {
        w.sheet
            .write_string_with_format(w.row, 1 + k as u16, *text, &s.header)
            .map_err(xlsx_error)?;
    }
    w.row += 1;
    for (load, hours) in points {
        let ratio = crate::analysis::operation::heat_rate_ratio(&operation.part_load, load);
        w.sheet
            .write_number_with_format(w.row, 1, load, &s.percent.computed)
            .and_then(|x| {
                x.write_number_with_format(w.row, 2, load * net_output_kw, &s.number.computed)
            })
            .and_then(|x| {
                x.write_number_with_format(w.row, 3, heat_rate * ratio, &s.number.computed)
            })
            .and_then(|x| x.write_number_with_format(w.row, 4, hours, &s.number.computed))
            .map_err(xlsx_error)?;
        w.row += 1;
    }
    Ok(())
}

/// Where a scenario key's value came from: as written and its stated
/// source, or the default brayfin applied.
fn source_of(loaded: &LoadedScenario, key: &str) -> String {
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

const COMPUTED_NOTE: &str = "computed by brayfin's cycle model and operating year (a constant: it does not follow edits of other cells)";

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
        Shown::Percent(first.rates.discount_rate),
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

    for (index, outcome) in study.outcomes.iter().enumerate() {
        let candidate = &scenario.candidates[index];
        let n = names.candidate(index);
        let key = |field: &str| format!("candidate[{}].{field}", candidate.id);
        let inputs = &outcome.inputs;
        let role = if index == study.baseline_index {
            " (baseline)"
        } else {
            ""
        };
        w.heading(&format!(
            "Candidate `{}`{role}: {}",
            candidate.id, candidate.label
        ))?;
        w.named(
            "Capital cost",
            &n.name("CapitalCost"),
            Shown::Money(candidate.capital_cost),
            currency,
            &source_of(loaded, &key("capital_cost")),
            Origin::Input,
        )?;
        match &inputs.capital {
            Capital::AtCommercialOperation(_) => {
                w.named(
                    "Share of capital paid at commercial operation",
                    &n.name("Share1"),
                    Shown::Percent(1.0),
                    "of capital cost",
                    "no construction schedule: all paid at commercial operation",
                    Origin::Input,
                )?;
            }
            Capital::Schedule(_) => {
                for (k, (date, fraction)) in
                    candidate.costs.construction_schedule.iter().enumerate()
                {
                    w.named(
                        &format!("Share of capital paid {date}"),
                        &n.name(&format!("Share{}", k + 1)),
                        Shown::Percent(*fraction),
                        "of capital cost",
                        &source_of(loaded, &key("costs.construction")),
                        Origin::Input,
                    )?;
                }
            }
        }
        w.named(
            "Fixed O&M",
            &n.name("FixedOm"),
            Shown::Money(inputs.fixed_om.price),
            &format!("{currency}/kW-yr"),
            &source_of(loaded, &key("costs.fixed_om")),
            Origin::Input,
        )?;
        w.named(
            "Variable O&M",
            &n.name("VariableOm"),
            Shown::Money(inputs.variable_om.price),
            &format!("{currency}/MWh"),
            &source_of(loaded, &key("costs.variable_om")),
            Origin::Input,
        )?;
        let (interval, cost) = inputs
            .overhaul
            .map_or((0.0, Decimal::ZERO), |o| (o.interval_hours, o.cost));
        w.named(
            "Overhaul cost (each)",
            &n.name("OverhaulCost"),
            Shown::Money(cost),
            currency,
            &source_of(loaded, &key("costs.overhaul_cost")),
            Origin::Input,
        )?;
        w.named(
            "Overhaul interval",
            &n.name("OverhaulInterval"),
            Shown::Number(interval),
            "operating hours",
            &format!(
                "{}; sets the overhaul counts in the ledger (computed constants)",
                source_of(loaded, &key("costs.overhaul_interval"))
            ),
            Origin::Input,
        )?;
        w.named(
            "Heat-rate degradation",
            &n.name("Degradation"),
            Shown::Percent(inputs.degradation.heat_rate_fraction_per_year),
            "per year of operation",
            &format!(
                "{}; enters the ledger through the heat-rate multipliers (computed constants)",
                source_of(loaded, &key("costs.degradation_per_year"))
            ),
            Origin::Input,
        )?;
        w.named(
            "Degradation recovered at overhaul",
            &n.name("Recoverable"),
            Shown::Percent(inputs.degradation.recoverable_fraction),
            "of degradation",
            &source_of(loaded, &key("costs.recoverable_fraction")),
            Origin::Input,
        )?;
        let (fraction, amount) = match inputs.residual.value {
            ResidualValue::FractionOfCapital(f) => (f, Decimal::ZERO),
            ResidualValue::Amount(a) => (0.0, a),
        };
        w.named(
            "Residual value, share of capital",
            &n.name("ResidualShare"),
            Shown::Percent(fraction),
            "of capital paid",
            &source_of(loaded, &key("costs.residual_value")),
            Origin::Input,
        )?;
        w.named(
            "Residual value, amount",
            &n.name("ResidualAmount"),
            Shown::Money(amount),
            currency,
            "used when the residual value is stated as an amount (else 0)",
            Origin::Input,
        )?;
        w.named(
            "Rated net output",
            &n.name("NetOutputKw"),
            Shown::Number(inputs.operation.net_output_kw),
            "kW",
            &source_of(loaded, &key("net_output")),
            Origin::Input,
        )?;
        let cycle = &outcome.solved.cycle;
        w.named(
            "Heat rate at site rating (LHV)",
            &n.name("HeatRate"),
            Shown::Number(cycle.heat_rate_kj_per_kwh),
            "kJ/kWh",
            COMPUTED_NOTE,
            Origin::Computed,
        )?;
        w.named(
            "Thermal efficiency at site rating (LHV)",
            &n.name("Efficiency"),
            Shown::Percent(cycle.thermal_efficiency),
            "",
            COMPUTED_NOTE,
            Origin::Computed,
        )?;
        let op = &inputs.operation;
        w.named(
            "Operating hours per full year",
            &n.name("AnnualHours"),
            Shown::Number(op.operating_hours),
            "h",
            COMPUTED_NOTE,
            Origin::Computed,
        )?;
        w.named(
            "Net energy per full year",
            &n.name("AnnualEnergy"),
            Shown::Number(op.energy_mwh),
            "MWh",
            COMPUTED_NOTE,
            Origin::Computed,
        )?;
        w.named(
            "Fuel energy per full year, new and clean",
            &n.name("AnnualFuelGj"),
            Shown::Number(op.fuel_energy_gj_lhv),
            "GJ LHV",
            &format!("{COMPUTED_NOTE}; dispatch × part-load heat rate"),
            Origin::Computed,
        )?;
        bins(
            &mut w,
            scenario,
            inputs.operation.net_output_kw,
            cycle.heat_rate_kj_per_kwh,
        )?;
        let energies = names.all("AnnualEnergy");
        let outputs = names.all("NetOutputKw");
        w.formula(
            "Energy shortfall bought elsewhere",
            &n.name("EnergyShortfall"),
            &format!("=MAX(0,MAX({energies})-{})", n.name("AnnualEnergy")),
            inputs.replacement.energy_mwh_per_year,
            "MWh per full year",
            "levelling: the most any candidate delivers, less this candidate's",
        )?;
        w.formula(
            "Capacity shortfall bought elsewhere",
            &n.name("CapacityShortfall"),
            &format!("=MAX(0,MAX({outputs})-{})", n.name("NetOutputKw")),
            inputs.replacement.capacity_kw,
            "kW",
            "levelling: the largest rated output, less this candidate's",
        )?;
    }
    let defined = std::mem::take(&mut w.names);
    for (name, target) in defined {
        workbook.define_name(&name, &target).map_err(xlsx_error)?;
    }
    Ok(())
}
