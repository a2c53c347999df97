//! Checks of ledger inputs: each failure names the input and what is valid.

use super::inputs::{Capital, FuelPrice, LedgerInputs, ResidualValue};
use super::money::Money;
use super::rates::check_rate;
use super::FinanceError;

fn check_range(
    field: &'static str,
    value: f64,
    low: f64,
    high: f64,
    valid: &'static str,
) -> Result<(), FinanceError> {
    if value.is_finite() && value >= low && value <= high {
        Ok(())
    } else {
        Err(FinanceError::OutOfRange {
            field,
            value,
            valid,
        })
    }
}

/// Error unless `value` is zero or more.
fn check_money<M: Money>(field: &'static str, value: M) -> Result<(), FinanceError> {
    check_money_named(value, || field.to_string())
}

/// Error unless `value` is zero or more; the field's name is built only
/// for the error.
pub(crate) fn check_money_named<M: Money>(
    value: M,
    field: impl FnOnce() -> String,
) -> Result<(), FinanceError> {
    if value >= M::ZERO {
        Ok(())
    } else {
        Err(FinanceError::NegativeMoney {
            field: field(),
            value: value.to_string(),
        })
    }
}

const NON_NEGATIVE: &str = "a finite number, zero or more";

impl<M: Money> LedgerInputs<M> {
    /// Check every input that does not depend on the calendar (capital
    /// dates and the price path are checked when the ledger is built).
    pub fn validate(&self) -> Result<(), FinanceError> {
        self.rates.validate()?;
        let op = &self.operation;
        check_range(
            "operation.operating_hours",
            op.operating_hours,
            0.0,
            8784.0,
            "0 to 8784 hours per year",
        )?;
        check_range(
            "operation.energy_mwh",
            op.energy_mwh,
            0.0,
            f64::MAX,
            NON_NEGATIVE,
        )?;
        check_range(
            "operation.fuel_energy_gj_lhv",
            op.fuel_energy_gj_lhv,
            0.0,
            f64::MAX,
            NON_NEGATIVE,
        )?;
        check_range(
            "operation.net_output_kw",
            op.net_output_kw,
            0.0,
            f64::MAX,
            NON_NEGATIVE,
        )?;
        check_range(
            "fuel.hhv_over_lhv",
            self.fuel.hhv_over_lhv,
            1.0,
            2.0,
            "1 to 2 (HHV is never below LHV)",
        )?;
        if let FuelPrice::Escalating {
            price_per_gj,
            escalation,
        } = &self.fuel.price
        {
            check_money("fuel.price_per_gj", *price_per_gj)?;
            check_rate("fuel.escalation", *escalation)?;
        }
        check_range(
            "carbon.co2_kg_per_gj_lhv",
            self.carbon.co2_kg_per_gj_lhv,
            0.0,
            f64::MAX,
            NON_NEGATIVE,
        )?;
        check_money("carbon.price_per_tonne", self.carbon.price_per_tonne)?;
        check_rate("carbon.escalation", self.carbon.escalation)?;
        check_range(
            "operation.starts_per_year",
            op.starts_per_year,
            0.0,
            f64::MAX,
            NON_NEGATIVE,
        )?;
        check_range(
            "starts.fuel_gj_lhv_per_start",
            self.starts.fuel_gj_lhv_per_start,
            0.0,
            f64::MAX,
            NON_NEGATIVE,
        )?;
        check_money("starts.cost_per_start", self.starts.cost_per_start.price)?;
        check_rate(
            "starts.cost_per_start.escalation",
            self.starts.cost_per_start.escalation,
        )?;
        check_money("service.per_fired_hour", self.service.per_fired_hour.price)?;
        check_rate(
            "service.per_fired_hour.escalation",
            self.service.per_fired_hour.escalation,
        )?;
        check_money("service.per_start", self.service.per_start.price)?;
        check_rate(
            "service.per_start.escalation",
            self.service.per_start.escalation,
        )?;
        check_money("fixed_om.price", self.fixed_om.price)?;
        check_rate("fixed_om.escalation", self.fixed_om.escalation)?;
        check_money("variable_om.price", self.variable_om.price)?;
        check_rate("variable_om.escalation", self.variable_om.escalation)?;
        if let Some(overhaul) = &self.overhaul {
            if !(overhaul.interval_hours.is_finite() && overhaul.interval_hours > 0.0) {
                return Err(FinanceError::OutOfRange {
                    field: "overhaul.interval_hours",
                    value: overhaul.interval_hours,
                    valid: "a finite number of operating hours greater than 0",
                });
            }
            check_range(
                "overhaul.hours_per_start",
                overhaul.hours_per_start,
                0.0,
                f64::MAX,
                NON_NEGATIVE,
            )?;
            check_range(
                "overhaul.outage_days",
                overhaul.outage_days,
                0.0,
                365.0,
                "0 to 365 days per overhaul",
            )?;
            check_range(
                "overhaul.outage_capacity_kw",
                overhaul.outage_capacity_kw,
                0.0,
                f64::MAX,
                NON_NEGATIVE,
            )?;
            if let Some(starts) = overhaul.interval_starts {
                if !(starts.is_finite() && starts > 0.0) {
                    return Err(FinanceError::OutOfRange {
                        field: "overhaul.interval_starts",
                        value: starts,
                        valid: "a finite number of starts greater than 0",
                    });
                }
            }
            check_money("overhaul.cost", overhaul.cost)?;
            check_rate("overhaul.escalation", overhaul.escalation)?;
        }
        let degradation = &self.degradation;
        check_range(
            "degradation.heat_rate_fraction_per_year",
            degradation.heat_rate_fraction_per_year,
            0.0,
            0.999_999,
            "0 to below 1 per year",
        )?;
        check_range(
            "degradation.output_fraction_per_year",
            degradation.output_fraction_per_year,
            0.0,
            0.999_999,
            "0 to below 1 per year",
        )?;
        check_range(
            "degradation.recoverable_fraction",
            degradation.recoverable_fraction,
            0.0,
            1.0,
            "0 to 1",
        )?;
        match self.residual.value {
            ResidualValue::FractionOfCapital(fraction) => {
                check_range("residual.fraction_of_capital", fraction, 0.0, 1.0, "0 to 1")?
            }
            ResidualValue::Amount(amount) => check_money("residual.amount", amount)?,
        }
        check_rate("residual.escalation", self.residual.escalation)?;
        self.validate_bought_in()?;
        check_money(
            "acceptance_settlement.damages",
            self.acceptance_settlement.damages,
        )?;
        check_money(
            "acceptance_settlement.bonus",
            self.acceptance_settlement.bonus,
        )?;
        self.validate_capital()
    }

    fn validate_bought_in(&self) -> Result<(), FinanceError> {
        let bought_in = &self.bought_in;
        check_range(
            "bought_in.energy_mwh_per_year",
            bought_in.energy_mwh_per_year,
            0.0,
            f64::MAX,
            NON_NEGATIVE,
        )?;
        check_money("bought_in.energy_price.price", bought_in.energy_price.price)?;
        check_rate(
            "bought_in.energy_price.escalation",
            bought_in.energy_price.escalation,
        )?;
        check_range(
            "bought_in.capacity_kw",
            bought_in.capacity_kw,
            0.0,
            f64::MAX,
            NON_NEGATIVE,
        )?;
        check_money(
            "bought_in.capacity_price.price",
            bought_in.capacity_price.price,
        )?;
        check_rate(
            "bought_in.capacity_price.escalation",
            bought_in.capacity_price.escalation,
        )
    }

    fn validate_capital(&self) -> Result<(), FinanceError> {
        let payments = match &self.capital {
            Capital::AtCommercialOperation(amount) => return check_money("capital", *amount),
            Capital::Schedule(payments) => payments,
        };
        if payments.is_empty() {
            return Err(FinanceError::EmptyCapitalSchedule);
        }
        for (index, payment) in payments.iter().enumerate() {
            check_money_named(payment.amount, || format!("capital[{index}].amount"))?;
            if payment.date > self.commercial_operation {
                return Err(FinanceError::CapitalAfterCommercialOperation {
                    index,
                    date: payment.date,
                    commercial_operation: self.commercial_operation,
                });
            }
            if index > 0 && payment.date <= payments[index - 1].date {
                return Err(FinanceError::CapitalDatesOutOfOrder {
                    index,
                    date: payment.date,
                    previous: payments[index - 1].date,
                });
            }
        }
        Ok(())
    }
}
