//! The operating rows of a ledger: one per calendar year of service.

use super::calendar::{Calendar, Span};
use super::chain::FactorChain;
use super::degradation::WearModel;
use super::engine::{add, factor, mul, RowSink};
use super::inputs::{FuelPrice, LedgerInputs, PriceBasis};
use super::ledger::{LedgerRow, RowKind, StreamTotals};
use super::money::{convert_physics_to_money, Money};
use super::price_path::resolve_price_path;
use super::rates::Timing;
use super::FinanceError;

const FUEL_COST: &str = "fuel cost";
const CARBON_COST: &str = "carbon cost";
const FIXED_OM: &str = "fixed O&M";
const VARIABLE_OM: &str = "variable O&M";
const OVERHAUL_COST: &str = "overhaul cost";
const START_COST: &str = "start cost";
const LOST_ENERGY: &str = "energy lost to outages and output degradation";
const LOST_CAPACITY: &str = "capacity lost to outages";

/// Days in the year an outage's share is counted against (365: the share of
/// a common year; common practice for availability figures).
const DAYS_PER_YEAR: f64 = 365.0;
const SERVICE_PER_HOUR: &str = "service fee per fired hour";
const SERVICE_PER_START: &str = "service fee per start";
const BOUGHT_IN_ENERGY: &str = "energy bought in";
const BOUGHT_IN_CAPACITY: &str = "capacity bought in";

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

    /// Move to the next cash time; return the base price and the escalation
    /// factor there.
    fn advance(&mut self, step_years: f64) -> (M, f64) {
        match &mut self.chain {
            None => (self.base, 1.0),
            Some(chain) => (self.base, chain.advance(step_years)),
        }
    }
}

/// The fuel stream: escalating from a base price, or a price per year.
enum FuelStream<M: Money> {
    Escalating(Stream<M>),
    Path {
        first_year: i32,
        prices: Vec<M>,
        present_value: M,
    },
}

impl<M: Money> FuelStream<M> {
    fn cost(
        &mut self,
        quantity: f64,
        step_years: f64,
        discount: (f64, M),
        year: i32,
    ) -> Result<M, FinanceError> {
        match self {
            FuelStream::Escalating(stream) => stream.cost(quantity, step_years, discount.0, year),
            FuelStream::Path {
                first_year,
                prices,
                present_value,
            } => {
                let price = usize::try_from(year - *first_year)
                    .ok()
                    .and_then(|index| prices.get(index).copied())
                    .ok_or_else(|| FinanceError::PricePathMissingYear {
                        year,
                        first: *first_year,
                        last: *first_year + prices.len() as i32 - 1,
                    })?;
                let cost = priced(price, quantity, FUEL_COST, year)?;
                let discounted = mul(cost, discount.1, FUEL_COST, year)?;
                *present_value = add(*present_value, discounted, FUEL_COST, year)?;
                Ok(cost)
            }
        }
    }

    fn present_value(&self, year: i32) -> Result<M, FinanceError> {
        match self {
            FuelStream::Escalating(stream) => stream.present_value(year),
            FuelStream::Path { present_value, .. } => Ok(*present_value),
        }
    }
}

/// One cost stream over the rows: its base-date price and the sum of its
/// quantity × escalation × discount factor (physics in `f64`).
///
/// A row's cost is `price × (quantity × escalation)`: the escalation factor
/// is dimensionless, so it joins the physical quantity in `f64` and the
/// product crosses into money once, at [`convert_physics_to_money`]; the
/// multiplication by the price is then exact. The stream's present value is
/// `price × Σ quantity × escalation × discount`, priced once at the end. The
/// streams' present values add up to the lifecycle cost (the sum of the
/// rows' `total × discount_factor`) within about 1e-14 relative.
struct Stream<M> {
    name: &'static str,
    price: Escalated<M>,
    discounted_quantity: f64,
}

impl<M: Money> Stream<M> {
    fn new(name: &'static str, price: M, escalation: f64) -> Self {
        Stream {
            name,
            price: Escalated::new(price, escalation),
            discounted_quantity: 0.0,
        }
    }

    /// Cost of `quantity` in the row of `year`, the price escalated by
    /// `step_years` since the previous row.
    fn cost(
        &mut self,
        quantity: f64,
        step_years: f64,
        discount: f64,
        year: i32,
    ) -> Result<M, FinanceError> {
        let (price, escalation) = self.price.advance(step_years);
        let weighted = quantity * escalation;
        self.discounted_quantity += weighted * discount;
        priced(price, weighted, self.name, year)
    }

    /// Present value of the stream over all rows.
    fn present_value(&self, year: i32) -> Result<M, FinanceError> {
        priced(self.price.base, self.discounted_quantity, self.name, year)
    }
}

/// A stream that may be off (no overhauls, no output shortfall): then it
/// costs nothing and leaves the rows exactly as they would be without it.
struct OptionalStream<M>(Option<Stream<M>>);

impl<M: Money> OptionalStream<M> {
    fn new(on: bool, name: &'static str, price: M, escalation: f64) -> Self {
        OptionalStream(on.then(|| Stream::new(name, price, escalation)))
    }

    /// [`Stream::cost`], or zero when the stream is off.
    fn cost(
        &mut self,
        quantity: f64,
        step_years: f64,
        discount: f64,
        year: i32,
    ) -> Result<M, FinanceError> {
        match &mut self.0 {
            Some(stream) => stream.cost(quantity, step_years, discount, year),
            None => Ok(M::ZERO),
        }
    }

    /// [`Stream::present_value`], or zero when the stream is off.
    fn present_value(&self, year: i32) -> Result<M, FinanceError> {
        match &self.0 {
            Some(stream) => stream.present_value(year),
            None => Ok(M::ZERO),
        }
    }

    /// `sum` plus [`Stream::cost`]; `sum` itself, untouched, when the stream
    /// is off (so a ledger without the stream is exactly what it was).
    fn add_cost(
        &mut self,
        sum: M,
        quantity: f64,
        step_years: f64,
        discount: f64,
        year: i32,
    ) -> Result<M, FinanceError> {
        match &mut self.0 {
            Some(stream) => {
                let cost = stream.cost(quantity, step_years, discount, year)?;
                add(sum, cost, stream.name, year)
            }
            None => Ok(sum),
        }
    }

    /// `sum` plus [`Stream::present_value`]; `sum` when the stream is off.
    fn add_present_value(&self, sum: M, year: i32) -> Result<M, FinanceError> {
        match &self.0 {
            Some(stream) => add(sum, stream.present_value(year)?, stream.name, year),
            None => Ok(sum),
        }
    }
}

/// A stream that is on when its price is not zero and its yearly quantity
/// is positive.
fn priced_stream<M: Money>(
    name: &'static str,
    price: &super::inputs::EscalatingPrice<M>,
    quantity_per_year: f64,
) -> OptionalStream<M> {
    OptionalStream::new(
        price.price != M::ZERO && quantity_per_year > 0.0,
        name,
        price.price,
        price.escalation,
    )
}

/// Positive quantities below this always convert to money (finite, and
/// within the `Decimal` range at 15 significant digits).
const ALWAYS_CONVERTIBLE: f64 = 1e28;

/// `price × quantity`, the quantity converted at the one crossing. Inputs
/// are validated finite before any row, so a failed conversion here means
/// the escalated quantity left the representable range.
///
/// A stream that is off in a row (a quantity of +0, or a zero price with a
/// quantity that converts) costs `price × 0` without the conversion: the
/// same value in both money types, since +0 converts to zero and a zero
/// price times any positive quantity is that zero times +0 (`Decimal`
/// returns plain zero, `f64` keeps the price's sign of zero).
fn priced<M: Money>(
    price: M,
    quantity: f64,
    stream: &'static str,
    year: i32,
) -> Result<M, FinanceError> {
    let zero_quantity = quantity.to_bits() == 0;
    if zero_quantity || (price == M::ZERO && quantity > 0.0 && quantity < ALWAYS_CONVERTIBLE) {
        return mul(price, M::ZERO, stream, year);
    }
    let quantity: M = convert_physics_to_money(quantity, stream)
        .map_err(|_| FinanceError::Overflow { stream, year })?;
    mul(price, quantity, stream, year)
}

/// Time at which a period's cash is counted, and the step to it from the
/// previous period's cash time (exactly 1 between full years).
#[inline]
fn cash_time(timing: Timing, period: &Span, previous_fraction: Option<f64>) -> (f64, f64) {
    match timing {
        Timing::EndOfYear => (period.time_end_years, period.fraction_of_year),
        Timing::MidYear => (
            period.time_start_years + 0.5 * period.fraction_of_year,
            previous_fraction.map_or(0.0, |f| 0.5 * f) + 0.5 * period.fraction_of_year,
        ),
    }
}

/// Emit one row per operating period into `sink` and return the totals.
pub(crate) fn operating_rows<M: Money, S: RowSink<M>>(
    inputs: &LedgerInputs<M>,
    calendar: &Calendar,
    base_years: f64,
    sink: &mut S,
) -> Result<OperatingPart<M>, FinanceError> {
    let operation = &inputs.operation;
    let overhaul = inputs.overhaul;
    let mut wear = WearModel::new(
        operation.operating_hours,
        (
            inputs.degradation.heat_rate_fraction_per_year,
            inputs.degradation.output_fraction_per_year,
        ),
        inputs.degradation.recoverable_fraction,
        overhaul.and_then(|o| o.operating_hours_between(operation)),
    );
    // Outages: the share of a year each overhaul takes out of service (a
    // year of 365 days), and the capacity lost meanwhile.
    let (outage_year_share, outage_capacity_kw) = overhaul.map_or((0.0, 0.0), |o| {
        (o.outage_days / DAYS_PER_YEAR, o.outage_capacity_kw)
    });
    let starts_per_year = operation.starts_per_year;
    let start_fuel_per_year = starts_per_year * inputs.starts.fuel_gj_lhv_per_start;
    let mut start_cost = priced_stream(START_COST, &inputs.starts.cost_per_start, starts_per_year);
    let mut service_per_hour = priced_stream(
        SERVICE_PER_HOUR,
        &inputs.service.per_fired_hour,
        operation.operating_hours,
    );
    let mut service_per_start = priced_stream(
        SERVICE_PER_START,
        &inputs.service.per_start,
        starts_per_year,
    );
    let (first_year, last_year) = calendar.operating_years();
    let mut fuel = match &inputs.fuel.price {
        FuelPrice::Escalating {
            price_per_gj,
            escalation,
        } => FuelStream::Escalating(Stream::new(FUEL_COST, *price_per_gj, *escalation)),
        FuelPrice::Path(path) => FuelStream::Path {
            first_year,
            prices: resolve_price_path(path, first_year, last_year)?,
            present_value: M::ZERO,
        },
    };
    let fuel_basis_factor = match inputs.fuel.basis {
        PriceBasis::Hhv => inputs.fuel.hhv_over_lhv,
        PriceBasis::Lhv => 1.0,
    };
    let carbon = &inputs.carbon;
    let mut carbon_cost = Stream::new(CARBON_COST, carbon.price_per_tonne, carbon.escalation);
    let mut fixed_om = Stream::new(FIXED_OM, inputs.fixed_om.price, inputs.fixed_om.escalation);
    let variable = &inputs.variable_om;
    let mut variable_om = Stream::new(VARIABLE_OM, variable.price, variable.escalation);
    let mut overhauls =
        OptionalStream(overhaul.map(|o| Stream::new(OVERHAUL_COST, o.cost, o.escalation)));
    let shortfall = &inputs.bought_in;
    let mut bought_in_energy = OptionalStream::new(
        shortfall.energy_mwh_per_year > 0.0,
        BOUGHT_IN_ENERGY,
        shortfall.energy_price.price,
        shortfall.energy_price.escalation,
    );
    let mut bought_in_capacity = OptionalStream::new(
        shortfall.capacity_kw > 0.0,
        BOUGHT_IN_CAPACITY,
        shortfall.capacity_price.price,
        shortfall.capacity_price.escalation,
    );
    let loses_energy = inputs.degradation.output_fraction_per_year > 0.0
        || (outage_year_share > 0.0 && operation.energy_mwh > 0.0);
    let mut lost_energy = OptionalStream::new(
        loses_energy && shortfall.energy_price.price != M::ZERO,
        LOST_ENERGY,
        shortfall.energy_price.price,
        shortfall.energy_price.escalation,
    );
    let mut lost_capacity = OptionalStream::new(
        outage_year_share > 0.0
            && outage_capacity_kw > 0.0
            && shortfall.capacity_price.price != M::ZERO,
        LOST_CAPACITY,
        shortfall.capacity_price.price,
        shortfall.capacity_price.escalation,
    );
    let mut discount = FactorChain::discount_to(inputs.rates.discount_rate, base_years);

    let mut rows_present_value = M::ZERO;
    let mut pv_energy_mwh = 0.0;
    let mut previous_fraction = None;
    let last_index = calendar.period_count().saturating_sub(1);
    for (index, period) in calendar.spans().enumerate() {
        let year = period.year;
        let (cash_time_years, step) = cash_time(inputs.timing, &period, previous_fraction);
        previous_fraction = Some(period.fraction_of_year);

        // Physics of the period (f64).
        let fraction = period.fraction_of_year;
        let from_hours = operation.operating_hours * period.time_start_years;
        let to_hours = operation.operating_hours * period.time_end_years;
        let mut operating_hours = operation.operating_hours * fraction;
        let new_and_clean_mwh = operation.energy_mwh * fraction;
        let mut energy_mwh = new_and_clean_mwh;
        let wear = wear.row(from_hours, to_hours, index == last_index);
        let mut fuel_energy_gj =
            operation.fuel_energy_gj_lhv * fraction * wear.heat_rate_multiplier;
        if wear.output_loss > 0.0 {
            // Output degradation: less delivered, at the degraded heat rate.
            energy_mwh *= 1.0 - wear.output_loss;
            fuel_energy_gj *= 1.0 - wear.output_loss;
        }
        if start_fuel_per_year > 0.0 {
            // Start fuel: burned per start, not degraded.
            fuel_energy_gj += start_fuel_per_year * fraction;
        }
        let mut starts = starts_per_year * fraction;
        let overhaul_count = wear.overhaul_count;
        // Outage: the row's operation falls by the share out of service.
        let outage_share = if outage_year_share > 0.0 && overhaul_count > 0 && fraction > 0.0 {
            (f64::from(overhaul_count) * outage_year_share / fraction).min(1.0)
        } else {
            0.0
        };
        let in_service = 1.0 - outage_share;
        if outage_share > 0.0 {
            operating_hours *= in_service;
            energy_mwh *= in_service;
            fuel_energy_gj *= in_service;
            starts *= in_service;
        }

        // Quantities meet prices.
        let discount_value = discount.advance(step);
        let discount_factor: M = factor(discount_value, "discount factor", year)?;
        let fuel_cost = fuel.cost(
            fuel_energy_gj * fuel_basis_factor,
            step,
            (discount_value, discount_factor),
            year,
        )?;
        let co2_tonnes = fuel_energy_gj * carbon.co2_kg_per_gj_lhv / 1000.0;
        let carbon_cost = carbon_cost.cost(co2_tonnes, step, discount_value, year)?;
        let fixed_om = fixed_om.cost(
            operation.net_output_kw * fraction,
            step,
            discount_value,
            year,
        )?;
        let variable_om = variable_om.cost(energy_mwh, step, discount_value, year)?;
        // Starts and service-agreement fees are variable O&M.
        let variable_om = start_cost.add_cost(variable_om, starts, step, discount_value, year)?;
        let variable_om =
            service_per_hour.add_cost(variable_om, operating_hours, step, discount_value, year)?;
        let variable_om =
            service_per_start.add_cost(variable_om, starts, step, discount_value, year)?;
        let overhaul = overhauls.cost(f64::from(overhaul_count), step, discount_value, year)?;
        // Energy and capacity bought in: energy pro rata like energy, capacity like
        // fixed O&M.
        let bought_in_energy = bought_in_energy.cost(
            shortfall.energy_mwh_per_year * fraction,
            step,
            discount_value,
            year,
        )?;
        let bought_in_capacity = bought_in_capacity.cost(
            shortfall.capacity_kw * fraction,
            step,
            discount_value,
            year,
        )?;
        let bought_in = add(
            bought_in_energy,
            bought_in_capacity,
            "energy and capacity bought in",
            year,
        )?;
        // Energy lost to outages and output degradation, and capacity lost
        // to outages, bought in at the same prices.
        let bought_in = lost_energy.add_cost(
            bought_in,
            new_and_clean_mwh - energy_mwh,
            step,
            discount_value,
            year,
        )?;
        let bought_in = lost_capacity.add_cost(
            bought_in,
            outage_capacity_kw * outage_share * fraction,
            step,
            discount_value,
            year,
        )?;
        let total = [carbon_cost, fixed_om, variable_om, overhaul, bought_in]
            .into_iter()
            .try_fold(fuel_cost, |sum, x| add(sum, x, "row total", year))?;
        let present_value = mul(total, discount_factor, "present value", year)?;
        rows_present_value = add(rows_present_value, present_value, "present value", year)?;
        pv_energy_mwh += energy_mwh * discount_value;

        if !S::KEEPS_ROWS {
            // A summary keeps no rows: their dates are never looked up.
            continue;
        }
        // Every span has representable dates (see `Calendar::spans`).
        let (period_start, period_end) =
            calendar
                .period_dates(year)
                .ok_or(FinanceError::CalendarOverflow {
                    commercial_operation: calendar.commercial_operation,
                    years: calendar.service_life_years,
                })?;
        sink.push(LedgerRow {
            kind: RowKind::Operation,
            year,
            period_start,
            period_end,
            time_start_years: period.time_start_years,
            time_end_years: period.time_end_years,
            cash_time_years,
            operating_hours,
            energy_mwh,
            starts,
            fuel_energy_gj,
            heat_rate_multiplier: wear.heat_rate_multiplier,
            output_loss: wear.output_loss,
            in_service,
            overhaul_count,
            fuel_cost,
            carbon_cost,
            fixed_om,
            variable_om,
            overhaul,
            bought_in,
            capital: M::ZERO,
            guarantee_settlement: M::ZERO,
            residual: M::ZERO,
            total,
            discount_factor,
            present_value,
        });
    }
    let present_value = StreamTotals {
        fuel_cost: fuel.present_value(last_year)?,
        carbon_cost: carbon_cost.present_value(last_year)?,
        fixed_om: fixed_om.present_value(last_year)?,
        variable_om: [&start_cost, &service_per_hour, &service_per_start]
            .into_iter()
            .try_fold(variable_om.present_value(last_year)?, |sum, stream| {
                stream.add_present_value(sum, last_year)
            })?,
        overhaul: overhauls.present_value(last_year)?,
        bought_in: [&lost_energy, &lost_capacity].into_iter().try_fold(
            add(
                bought_in_energy.present_value(last_year)?,
                bought_in_capacity.present_value(last_year)?,
                "energy and capacity bought in",
                last_year,
            )?,
            |sum, stream| stream.add_present_value(sum, last_year),
        )?,
        ..StreamTotals::ZERO
    };
    Ok(OperatingPart {
        present_value,
        rows_present_value,
        pv_energy_mwh,
    })
}
