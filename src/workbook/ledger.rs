//! One Ledger sheet per candidate: a row per cash event whose streams are
//! formulas of the Inputs sheet's named cells, its discount factor from the
//! rate and the row's cash time, and its present value; totals on top.
//!
//! The formulas follow `finance::build_ledger` stream by stream:
//! - fuel = fuel energy (GJ LHV) × (HHV/LHV if the price is on HHV) × price
//!   × (1 + escalation)^cash time, or the year's price from the path;
//! - carbon = fuel energy × kg CO2/GJ ÷ 1000 × carbon price escalated;
//! - fixed O&M = rated kW × share of the year × price per kW-yr;
//! - fuel energy = year's fuel × share of the year × degradation multiplier,
//!   plus starts per year × share of the year × start fuel;
//! - variable O&M = MWh × price per MWh, plus fired hours × service fee per
//!   hour, plus starts × (start cost + service fee per start);
//! - overhauls = count × cost (the counts, due on equivalent hours or
//!   starts, are constants);
//! - energy and capacity bought in = shortfall × share of the year × value,
//!   plus the energy lost to output degradation and overhaul outages (the
//!   year's energy × share of the year − the row's energy) × energy value,
//!   plus the site output × the share out of service × share of the year ×
//!   capacity value (output lost and share in service are constants);
//! - discount factor = (1 + rate)^−(cash time − present-value date's time);
//!   present value = total × factor.
//!
//! The ledger never rounds money; its one rounding is where a quantity
//! (already times its escalation factor) becomes `Decimal`, at 15
//! significant digits, the precision of the spreadsheet's own doubles, so no
//! `ROUND` is needed for the formulas to reproduce it: they agree with the
//! decimal ledger to about 1e-14 relative (well under a cent on any total
//! below 1e11). Calendar times, overhaul counts and the degradation
//! multipliers are constants computed by brayfin.

use super::cells::{at, f, Cells};
use super::style::{literal, Styles};
use super::{xlsx_error, CandidateNames, Names};
use crate::analysis::compare::{CandidateOutcome, Study};
use crate::finance::{FuelPrice, LedgerRow, RowKind};
use crate::Result;
use rust_decimal::Decimal;
use rust_xlsxwriter::Workbook;

/// Columns of a ledger sheet (zero-based).
pub(crate) mod col {
    /// The row's unique label, as `compare`'s ledger rows have it.
    pub(crate) const LABEL: u16 = 0;
    /// The row's kind (`capital`, `operation`, …), which the totals sum by.
    pub(crate) const KIND: u16 = 1;
    pub(crate) const YEAR: u16 = 2;
    pub(crate) const START: u16 = 3;
    pub(crate) const END: u16 = 4;
    pub(crate) const TIME: u16 = 5;
    pub(crate) const FRACTION: u16 = 6;
    pub(crate) const CASH_TIME: u16 = 7;
    pub(crate) const HOURS: u16 = 8;
    pub(crate) const ENERGY: u16 = 9;
    pub(crate) const MULTIPLIER: u16 = 10;
    pub(crate) const OUTPUT_LOSS: u16 = 11;
    pub(crate) const IN_SERVICE: u16 = 12;
    pub(crate) const FUEL_GJ: u16 = 13;
    pub(crate) const OVERHAULS: u16 = 14;
    pub(crate) const FUEL: u16 = 15;
    pub(crate) const CAPITAL: u16 = 21;
    pub(crate) const RESIDUAL: u16 = 22;
    pub(crate) const TOTAL: u16 = 23;
    pub(crate) const FACTOR: u16 = 24;
    pub(crate) const PV: u16 = 25;
    pub(crate) const SAVING: u16 = 26;
    pub(crate) const SIMPLE_CROSSING: u16 = 27;
    pub(crate) const PV_SAVING: u16 = 28;
    pub(crate) const DISCOUNTED_CROSSING: u16 = 29;
}

/// Rows of the totals block (zero-based), value in column B.
pub(crate) mod total {
    pub(crate) const LIFECYCLE_COST: u32 = 3;
    pub(crate) const PV_FUEL: u32 = 4;
    pub(crate) const PV_OPERATING: u32 = 5;
    pub(crate) const PV_CAPITAL: u32 = 6;
    pub(crate) const PV_RESIDUAL: u32 = 7;
    pub(crate) const CAPITAL_PAID: u32 = 8;
    pub(crate) const PV_PER_UNIT_CAPITAL: u32 = 9;
    pub(crate) const INVESTMENT: u32 = 10;
}

/// Header row of the ledger table; rows follow it.
const HEADER_ROW: u32 = 12;

const HEADERS: [&str; 30] = [
    "Row",
    "Kind",
    "Year",
    "Period start",
    "Period end",
    "Time at start, years (calendar, computed)",
    "Share of a year (calendar, computed)",
    "Cash time, years",
    "Operating hours",
    "Net energy, MWh",
    "Heat-rate multiplier, degradation (computed)",
    "Output lost, degradation (computed)",
    "Share in service, overhaul outages (computed)",
    "Fuel energy, GJ LHV",
    "Overhauls (computed)",
    "Fuel",
    "Carbon",
    "Fixed O&M",
    "Variable O&M",
    "Overhauls",
    "Energy and capacity bought in",
    "Capital",
    "Residual value",
    "Total",
    "Discount factor",
    "Present value",
    "Saving vs baseline",
    "Simple payback reached at, years",
    "Present value of saving",
    "Discounted payback reached at, years",
];

/// Where a candidate's ledger sits, for the Summary and the payback columns.
#[derive(Debug, Clone)]
pub(crate) struct Layout {
    /// Sheet name.
    pub(crate) sheet: String,
    /// First and last sheet rows of the ledger (zero-based, inclusive).
    pub(crate) rows: (u32, u32),
    /// First and last operating rows (zero-based, inclusive).
    pub(crate) operating: (u32, u32),
}

/// Where each ledger goes: first row, operating rows, last row.
pub(crate) fn layout(sheet: String, outcome: &CandidateOutcome) -> Layout {
    let first = HEADER_ROW + 1;
    let rows = &outcome.ledger.rows;
    let count = rows.len() as u32;
    let position = |kind: RowKind| rows.iter().position(|r| r.kind == kind).unwrap_or(0) as u32;
    let operating_count = rows.iter().filter(|r| r.kind == RowKind::Operation).count() as u32;
    let op_first = first + position(RowKind::Operation);
    Layout {
        sheet,
        rows: (first, first + count.saturating_sub(1)),
        operating: (op_first, op_first + operating_count.saturating_sub(1)),
    }
}

/// Everything one ledger sheet needs.
pub(crate) struct LedgerSheet<'a> {
    /// The study.
    pub(crate) study: &'a Study,
    /// Index of the candidate.
    pub(crate) index: usize,
    /// Layout of every candidate's ledger.
    pub(crate) layouts: &'a [Layout],
    /// Defined names.
    pub(crate) names: &'a Names,
    /// Formats.
    pub(crate) styles: &'a Styles,
}

impl LedgerSheet<'_> {
    /// Write the sheet.
    pub(crate) fn write(&self, workbook: &mut Workbook, title: &str) -> Result<()> {
        let layout = &self.layouts[self.index];
        let sheet = workbook.add_worksheet();
        sheet.set_name(&layout.sheet).map_err(xlsx_error)?;
        // Printed landscape, one page wide.
        sheet.set_landscape().set_print_fit_to_pages(1, 0);
        sheet
            .set_column_range_width(1, 29, 16.0)
            .map_err(xlsx_error)?;
        // Column B also holds the totals above the table.
        sheet.set_column_width(1, 20.0).map_err(xlsx_error)?;
        sheet.set_column_width(0, 58.0).map_err(xlsx_error)?;
        sheet.set_row_height(HEADER_ROW, 58).map_err(xlsx_error)?;
        sheet
            .set_freeze_panes(HEADER_ROW + 1, 3)
            .map_err(xlsx_error)?;
        let mut cells = Cells { sheet };
        let s = self.styles;
        cells.text(0, 0, title, &s.heading)?;
        cells.text(1, 0, "Every money cell is a formula of the Inputs sheet; pale blue cells are constants computed by brayfin (calendar, degradation, overhaul counts).", &s.note)?;
        for (col, header) in HEADERS.iter().enumerate() {
            let col = col as u16;
            if col >= col::SAVING && self.index == self.study.baseline_index {
                break;
            }
            cells.text(HEADER_ROW, col, header, &s.header)?;
        }
        let outcome = &self.study.outcomes[self.index];
        let n = self.names.candidate(self.index);
        let calendar = &outcome.ledger.summary.analysis.calendar;
        let mut periods = calendar.periods();
        let mut share = 0usize;
        let mut last_capital_row = layout.rows.0;
        let labels = crate::analysis::model::ledger_row_labels(
            &outcome.ledger.rows,
            calendar.commercial_operation,
        );
        for ((offset, row), label) in outcome.ledger.rows.iter().enumerate().zip(&labels) {
            let r = layout.rows.0 + offset as u32;
            cells.text(r, col::LABEL, label, &s.text)?;
            match row.kind {
                RowKind::Capital => {
                    share += 1;
                    last_capital_row = r;
                    self.single_date_row(&mut cells, r, row, "capital")?;
                    let capital = format!(
                        "={}*{}",
                        n.name("CapitalCost"),
                        n.name(&format!("Share{share}"))
                    );
                    cells.formula(r, col::CAPITAL, &capital, f(row.capital), &s.money.formula)?;
                }
                RowKind::Residual => {
                    self.single_date_row(&mut cells, r, row, "residual")?;
                    let (first, _) = layout.rows;
                    let residual = format!(
                        "=-(SUM({}:{})*{}+{})",
                        at(first, col::CAPITAL),
                        at(last_capital_row, col::CAPITAL),
                        n.name("ResidualShare"),
                        n.name("ResidualAmount")
                    );
                    cells.formula(
                        r,
                        col::RESIDUAL,
                        &residual,
                        f(row.residual),
                        &s.money.formula,
                    )?;
                }
                RowKind::Settlement => {
                    // Guarantee damages (negative) or bonus at the acceptance
                    // test: a settled contract amount, entered as a constant
                    // in the capital column (it is capital, not a stream).
                    self.single_date_row(&mut cells, r, row, "guarantee settlement")?;
                    cells.number(
                        r,
                        col::CAPITAL,
                        f(row.guarantee_settlement),
                        &s.money.computed,
                    )?;
                }
                RowKind::Operation => {
                    let fraction = periods
                        .next()
                        .map_or(row.time_end_years - row.time_start_years, |p| {
                            p.fraction_of_year
                        });
                    self.operating_row(&mut cells, r, row, fraction, &n)?;
                }
            }
            self.row_totals(&mut cells, r, row)?;
        }
        self.totals(&mut cells, last_capital_row)?;
        if self.index != self.study.baseline_index {
            super::payback::payback_columns(self, &mut cells)?;
        }
        Ok(())
    }

    fn single_date_row(
        &self,
        cells: &mut Cells,
        r: u32,
        row: &LedgerRow,
        kind: &str,
    ) -> Result<()> {
        let s = self.styles;
        cells.text(r, col::KIND, kind, &s.text)?;
        cells.number(r, col::YEAR, f64::from(row.year), &s.text)?;
        cells.date(r, col::START, row.period_start, &s.date.computed)?;
        cells.date(r, col::END, row.period_end, &s.date.computed)?;
        cells.number(r, col::TIME, row.time_start_years, &s.factor.computed)?;
        cells.number(r, col::FRACTION, 0.0, &s.factor.computed)?;
        self.cash_time(cells, r, row)?;
        for c in col::FUEL..col::CAPITAL {
            cells.number(r, c, 0.0, &s.money.formula)?;
        }
        let other = if kind == "capital" {
            col::RESIDUAL
        } else {
            col::CAPITAL
        };
        cells.number(r, other, 0.0, &s.money.formula)
    }

    fn cash_time(&self, cells: &mut Cells, r: u32, row: &LedgerRow) -> Result<()> {
        let text = format!(
            "={}+IF(CashTiming={},0.5,1)*{}",
            at(r, col::TIME),
            literal("mid-year"),
            at(r, col::FRACTION)
        );
        cells.formula(
            r,
            col::CASH_TIME,
            &text,
            row.cash_time_years,
            &self.styles.factor.formula,
        )
    }

    fn operating_row(
        &self,
        cells: &mut Cells,
        r: u32,
        row: &LedgerRow,
        fraction: f64,
        n: &CandidateNames,
    ) -> Result<()> {
        let s = self.styles;
        let inputs = &self.study.outcomes[self.index].inputs;
        cells.text(r, col::KIND, "operation", &s.text)?;
        cells.number(r, col::YEAR, f64::from(row.year), &s.text)?;
        cells.date(r, col::START, row.period_start, &s.date.computed)?;
        cells.date(r, col::END, row.period_end, &s.date.computed)?;
        cells.number(r, col::TIME, row.time_start_years, &s.factor.computed)?;
        cells.number(r, col::FRACTION, fraction, &s.factor.computed)?;
        self.cash_time(cells, r, row)?;
        let frac = at(r, col::FRACTION);
        let g = at(r, col::CASH_TIME);
        let k = at(r, col::FUEL_GJ);
        cells.number(
            r,
            col::MULTIPLIER,
            row.heat_rate_multiplier,
            &s.factor.computed,
        )?;
        cells.number(r, col::OUTPUT_LOSS, row.output_loss, &s.factor.computed)?;
        cells.number(r, col::IN_SERVICE, row.in_service, &s.factor.computed)?;
        let kept = format!("(1-{})", at(r, col::OUTPUT_LOSS));
        let in_service = at(r, col::IN_SERVICE);
        cells.formula(
            r,
            col::HOURS,
            &format!("={}*{frac}*{in_service}", n.name("AnnualHours")),
            row.operating_hours,
            &s.number.formula,
        )?;
        cells.formula(
            r,
            col::ENERGY,
            &format!("={}*{frac}*{kept}*{in_service}", n.name("AnnualEnergy")),
            row.energy_mwh,
            &s.number.formula,
        )?;
        let starts = format!("{}*{frac}*{in_service}", n.name("StartsPerYear"));
        cells.formula(
            r,
            col::FUEL_GJ,
            &format!(
                "=({}*{frac}*{}*{kept}+{}*{frac}*{})*{in_service}",
                n.name("AnnualFuelGj"),
                at(r, col::MULTIPLIER),
                n.name("StartsPerYear"),
                n.name("StartFuelGj")
            ),
            row.fuel_energy_gj,
            &s.number.formula,
        )?;
        cells.number(
            r,
            col::OVERHAULS,
            f64::from(row.overhaul_count),
            &s.number.computed,
        )?;
        let basis = format!("IF(FuelPriceBasis={},HhvOverLhv,1)", literal("hhv"));
        let fuel = match inputs.fuel.price {
            FuelPrice::Escalating { .. } => {
                format!("={k}*{basis}*FuelPrice*(1+FuelEscalation)^{g}")
            }
            FuelPrice::Path(_) => format!(
                "={k}*{basis}*VLOOKUP({},FuelPricePath,2,0)",
                at(r, col::YEAR)
            ),
        };
        let m = &s.money.formula;
        cells.formula(r, col::FUEL, &fuel, f(row.fuel_cost), m)?;
        cells.formula(
            r,
            col::FUEL + 1,
            &format!("={k}*Co2KgPerGj/1000*CarbonPrice*(1+CarbonEscalation)^{g}"),
            f(row.carbon_cost),
            m,
        )?;
        cells.formula(
            r,
            col::FUEL + 2,
            &format!("={}*{frac}*{}", n.name("NetOutputKw"), n.name("FixedOm")),
            f(row.fixed_om),
            m,
        )?;
        cells.formula(
            r,
            col::FUEL + 3,
            &format!(
                "={}*{}+{}*{}+{starts}*({}+{})",
                at(r, col::ENERGY),
                n.name("VariableOm"),
                at(r, col::HOURS),
                n.name("ServicePerHour"),
                n.name("StartCost"),
                n.name("ServicePerStart")
            ),
            f(row.variable_om),
            m,
        )?;
        cells.formula(
            r,
            col::FUEL + 4,
            &format!("={}*{}", at(r, col::OVERHAULS), n.name("OverhaulCost")),
            f(row.overhaul),
            m,
        )?;
        let bought_in = format!(
            "={}*{frac}*{price}+{}*{frac}*CapacityValue+({}*{frac}-{})*{price}+{}*(1-{in_service})*{frac}*CapacityValue",
            n.name("EnergyShortfall"),
            n.name("CapacityShortfall"),
            n.name("AnnualEnergy"),
            at(r, col::ENERGY),
            n.name("CapacityKw"),
            price = n.name("BoughtInEnergyPrice"),
        );
        cells.formula(r, col::FUEL + 5, &bought_in, f(row.bought_in), m)?;
        cells.number(r, col::CAPITAL, 0.0, m)?;
        cells.number(r, col::RESIDUAL, 0.0, m)
    }

    fn row_totals(&self, cells: &mut Cells, r: u32, row: &LedgerRow) -> Result<()> {
        let s = self.styles;
        let total = format!("=SUM({}:{})", at(r, col::FUEL), at(r, col::RESIDUAL));
        cells.formula(r, col::TOTAL, &total, f(row.total), &s.money.formula)?;
        let factor = format!(
            "=(1+DiscountRate)^(-({}-PresentValueYears))",
            at(r, col::CASH_TIME)
        );
        cells.formula(
            r,
            col::FACTOR,
            &factor,
            f(row.discount_factor),
            &s.factor.formula,
        )?;
        let pv = format!("={}*{}", at(r, col::TOTAL), at(r, col::FACTOR));
        cells.formula(r, col::PV, &pv, f(row.present_value), &s.money.formula)
    }

    fn totals(&self, cells: &mut Cells, last_capital_row: u32) -> Result<()> {
        let s = self.styles;
        let layout = &self.layouts[self.index];
        let summary = &self.study.outcomes[self.index].ledger.summary;
        let pv = &summary.present_value;
        let (first, last) = layout.rows;
        let column = |c: u16| format!("{}:{}", at(first, c), at(last, c));
        let kinds = column(col::KIND);
        let pvs = column(col::PV);
        let n = self.names.candidate(self.index);
        let capital_pv = at(total::PV_CAPITAL, 1);
        let paid = at(total::CAPITAL_PAID, 1);
        let rows: [(u32, &str, String, Decimal); 8] = [
            (
                total::LIFECYCLE_COST,
                "Lifecycle cost (present value)",
                format!("=SUM({pvs})"),
                summary.lifecycle_cost,
            ),
            (
                total::PV_FUEL,
                "Present value of fuel",
                format!("=SUMPRODUCT({},{})", column(col::FUEL), column(col::FACTOR)),
                pv.fuel_cost,
            ),
            (
                total::PV_OPERATING,
                "Present value of operating costs",
                format!("=SUMIF({kinds},{},{pvs})", literal("operation")),
                pv.operating().unwrap_or_default(),
            ),
            (
                total::PV_CAPITAL,
                "Present value of capital",
                format!("=SUMIF({kinds},{},{pvs})", literal("capital")),
                pv.capital,
            ),
            (
                total::PV_RESIDUAL,
                "Present value of residual credit",
                format!("=SUMIF({kinds},{},{pvs})", literal("residual")),
                pv.residual,
            ),
            (
                total::CAPITAL_PAID,
                "Capital paid (undiscounted)",
                format!("=SUM({})", column(col::CAPITAL)),
                summary.capital_total,
            ),
            (
                total::PV_PER_UNIT_CAPITAL,
                "Present value per unit of added capital (net of residual share)",
                format!(
                    "=IF({paid}=0,{},{capital_pv}/{paid})-{}*{}",
                    at(last_capital_row, col::FACTOR),
                    n.name("ResidualShare"),
                    at(last, col::FACTOR)
                ),
                summary.pv_per_unit_capital,
            ),
            (
                total::INVESTMENT,
                "Investment (present value of capital and residual)",
                format!("={capital_pv}+{}", at(total::PV_RESIDUAL, 1)),
                pv.investment().unwrap_or_default(),
            ),
        ];
        for (row, label, formula, value) in rows {
            cells.text(row, 0, label, &s.text)?;
            let format = if row == total::PV_PER_UNIT_CAPITAL {
                &s.factor.formula
            } else {
                &s.money.formula
            };
            cells.formula(row, 1, &formula, f(value), format)?;
        }
        Ok(())
    }
}
