//! The operating rows of a ledger: one per calendar year of service.

use super::calendar::{Calendar, Period};
use super::chain::FactorChain;
use super::degradation::WearModel;
use super::engine::{add, factor, mul};
use super::inputs::{FuelPrice, LedgerInputs, PriceBasis};
use super::ledger::{LedgerRow, RowKind, StreamTotals};
use super::money::{convert_physics_to_money, Money};
use super::price_path::resolve_price_path;
use super::rates::Timing;
use super::FinanceError;

/// Present values accumulated over the operating rows.
pub(crate) struct OperatingPart<M: Money> {
    /// Present value of each operating stream (capital and residual zero).
    pub(crate) present_value: StreamTotals<M>,
    /// Sum of the rows' present values.
    pub(crate) rows_present_value: M,
    /// Present value of energy, MWh.
    pub(crate) pv_energy_mwh: f64,
}

/// A base-date price and its escalation chain.
struct Escalated<M> {
    base: M,
    chain: Option<FactorChain>,
}

impl<M: Money> Escalated<M> {
    fn new(base: M, escalation: f64) -> Self {
        let chain = (escalation != 0.0).then(|| FactorChain::escalation(escalation));
        Escalated { base, chain }
    }

    /// Move to the next cash time and return the price there.
    fn advance(
        &mut self,
        step_years: f64,
        stream: &'static str,
        year: i32,
    ) -> Result<M, FinanceError> {
        match &mut self.chain {
            None => Ok(self.base),
            Some(chain) => {
                let escalation: M = factor(chain.advance(step_years), stream, year)?;
                mul(self.base, escalation, stream, year)
            }
        }
    }
}

/// Where the fuel price of each row comes from.
enum FuelPrices<M> {
    Escalating(Escalated<M>),
    Path { first_year: i32, prices: Vec<M> },
}

impl<M: Money> FuelPrices<M> {
    fn advance(&mut self, step_years: f64, year: i32) -> Result<M, FinanceError> {
        match self {
            FuelPrices::Escalating(price) => price.advance(step_years, "fuel price", year),
            FuelPrices::Path { first_year, prices } => usize::try_from(year - *first_year)
                .ok()
                .and_then(|index| prices.get(index).copied())
                .ok_or(FinanceError::PricePathMissingYear {
                    year,
                    first: *first_year,
                    last: *first_year + prices.len() as i32 - 1,
                }),
        }
    }
}

/// Time at which a period's cash is counted, and the step to it from the
/// previous period's cash time (exactly 1 between full years).
fn cash_time(timing: Timing, period: &Period, previous_fraction: Option<f64>) -> (f64, f64) {
    match timing {
        Timing::EndOfYear => (period.time_end_years, period.fraction_of_year),
        Timing::MidYear => (
            period.time_start_years + 0.5 * period.fraction_of_year,
            previous_fraction.map_or(0.0, |f| 0.5 * f) + 0.5 * period.fraction_of_year,
        ),
    }
}

/// Emit one row per operating period into `sink` and return the totals.
pub(crate) fn operating_rows<M: Money>(
    inputs: &LedgerInputs<M>,
    calendar: &Calendar,
    sink: &mut impl FnMut(LedgerRow<M>),
) -> Result<OperatingPart<M>, FinanceError> {
    let operation = &inputs.operation;
    let overhaul = inputs.overhaul;
    let wear = WearModel::new(
        operation.operating_hours,
        inputs.degradation.heat_rate_fraction_per_year,
        inputs.degradation.recoverable_fraction,
        overhaul.map(|o| o.interval_hours),
    );
    let (first_year, last_year) = calendar.operating_years();
    let mut fuel_price = match &inputs.fuel.price {
        FuelPrice::Escalating {
            price_per_gj,
            escalation,
        } => FuelPrices::Escalating(Escalated::new(*price_per_gj, *escalation)),
        FuelPrice::Path(path) => FuelPrices::Path {
            first_year,
            prices: resolve_price_path(path, first_year, last_year)?,
        },
    };
    let fuel_basis_factor = match inputs.fuel.basis {
        PriceBasis::Hhv => inputs.fuel.hhv_over_lhv,
        PriceBasis::Lhv => 1.0,
    };
    let mut carbon_price = Escalated::new(inputs.carbon.price_per_tonne, inputs.carbon.escalation);
    let mut fixed_price = Escalated::new(inputs.fixed_om.price, inputs.fixed_om.escalation);
    let mut variable_price =
        Escalated::new(inputs.variable_om.price, inputs.variable_om.escalation);
    let mut overhaul_cost = overhaul.map(|o| Escalated::new(o.cost, o.escalation));
    let mut discount = FactorChain::discount(inputs.rates.discount_rate);

    let mut pv = StreamTotals::<M>::ZERO;
    let mut rows_present_value = M::ZERO;
    let mut pv_energy_mwh = 0.0;
    let mut previous_fraction = None;
    let last_index = calendar.period_count().saturating_sub(1);
    for (index, period) in calendar.periods().enumerate() {
        let year = period.year;
        let (cash_time_years, step) = cash_time(inputs.timing, &period, previous_fraction);
        previous_fraction = Some(period.fraction_of_year);

        // Physics of the period (f64).
        let fraction = period.fraction_of_year;
        let from_hours = operation.operating_hours * period.time_start_years;
        let to_hours = operation.operating_hours * period.time_end_years;
        let operating_hours = operation.operating_hours * fraction;
        let energy_mwh = operation.energy_mwh * fraction;
        let fuel_energy_gj = operation.fuel_energy_gj_lhv
            * fraction
            * wear.mean_heat_rate_multiplier(from_hours, to_hours);
        let overhaul_count = wear.overhauls_between(from_hours, to_hours, index == last_index);

        // Quantities meet prices.
        let fuel_gj: M = convert_physics_to_money(
            fuel_energy_gj * fuel_basis_factor,
            "fuel energy (GJ on the price basis)",
        )?;
        let co2_tonnes: M = convert_physics_to_money(
            fuel_energy_gj * inputs.carbon.co2_kg_per_gj_lhv / 1000.0,
            "CO2 emitted (t)",
        )?;
        let kw_years: M =
            convert_physics_to_money(operation.net_output_kw * fraction, "net output (kW-years)")?;
        let energy: M = convert_physics_to_money(energy_mwh, "energy (MWh)")?;

        let fuel_cost = mul(fuel_gj, fuel_price.advance(step, year)?, "fuel cost", year)?;
        let carbon_cost = mul(
            co2_tonnes,
            carbon_price.advance(step, "carbon cost", year)?,
            "carbon cost",
            year,
        )?;
        let fixed_om = mul(
            kw_years,
            fixed_price.advance(step, "fixed O&M", year)?,
            "fixed O&M",
            year,
        )?;
        let variable_om = mul(
            energy,
            variable_price.advance(step, "variable O&M", year)?,
            "variable O&M",
            year,
        )?;
        let overhaul = match &mut overhaul_cost {
            Some(cost) => {
                let unit = cost.advance(step, "overhaul", year)?;
                mul(
                    M::from_physics(f64::from(overhaul_count)).unwrap_or(M::ZERO),
                    unit,
                    "overhaul",
                    year,
                )?
            }
            None => M::ZERO,
        };
        let total = [carbon_cost, fixed_om, variable_om, overhaul]
            .into_iter()
            .try_fold(fuel_cost, |sum, x| add(sum, x, "row total", year))?;
        let discount_value = discount.advance(step);
        let discount_factor: M = factor(discount_value, "discount factor", year)?;
        let present_value = mul(total, discount_factor, "present value", year)?;

        pv.fuel_cost = add(
            pv.fuel_cost,
            mul(fuel_cost, discount_factor, "fuel cost", year)?,
            "fuel cost",
            year,
        )?;
        pv.carbon_cost = add(
            pv.carbon_cost,
            mul(carbon_cost, discount_factor, "carbon cost", year)?,
            "carbon cost",
            year,
        )?;
        pv.fixed_om = add(
            pv.fixed_om,
            mul(fixed_om, discount_factor, "fixed O&M", year)?,
            "fixed O&M",
            year,
        )?;
        pv.variable_om = add(
            pv.variable_om,
            mul(variable_om, discount_factor, "variable O&M", year)?,
            "variable O&M",
            year,
        )?;
        pv.overhaul = add(
            pv.overhaul,
            mul(overhaul, discount_factor, "overhaul", year)?,
            "overhaul",
            year,
        )?;
        rows_present_value = add(rows_present_value, present_value, "present value", year)?;
        pv_energy_mwh += energy_mwh * discount_value;

        sink(LedgerRow {
            kind: RowKind::Operation,
            year,
            period_start: period.start,
            period_end: period.end,
            time_start_years: period.time_start_years,
            time_end_years: period.time_end_years,
            cash_time_years,
            operating_hours,
            energy_mwh,
            fuel_energy_gj,
            overhaul_count,
            fuel_cost,
            carbon_cost,
            fixed_om,
            variable_om,
            overhaul,
            capital: M::ZERO,
            residual: M::ZERO,
            total,
            discount_factor,
            present_value,
        });
    }
    Ok(OperatingPart {
        present_value: pv,
        rows_present_value,
        pv_energy_mwh,
    })
}
