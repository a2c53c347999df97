//! Bid-evaluation factors: what one unit of a guaranteed performance figure
//! is worth over the life, from reruns of the same ledger.
//!
//! - Heat rate: the ledger is rerun with fuel energy scaled by
//!   `(hr + 1) / hr` (the heat rate one kJ/kWh worse, output held); the
//!   difference in lifecycle cost is the present value of 1 kJ/kWh.
//! - Net output (documented choice): one more kW of rated output is valued
//!   as capacity, with energy and fuel held. It costs the present value of
//!   the fixed O&M charged on that kW (ledger rerun with one kW more) and is
//!   worth the present value of a stated capacity value per kW-year
//!   (what a kW of shortfall would cost to replace; zero unless given),
//!   computed by the same ledger as the capacity part of the output
//!   bought_in stream ([`BoughtIn`]) for one kW, so it equals what one
//!   kW less shortfall saves in a comparison levelled on output. The factor
//!   is the worth less the cost.

use super::engine::summarize_ledger;
use super::inputs::{BoughtIn, EscalatingPrice, LedgerInputs};
use super::money::Money;
use super::FinanceError;

/// Value of capacity to the buyer, per kW of net output per year.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CapacityValue<M: Money> {
    /// Value per kW-year at the base date (zero if not stated).
    pub per_kw_year: M,
    /// Escalation per year on the analysis basis.
    pub escalation: f64,
}

impl<M: Money> Default for CapacityValue<M> {
    fn default() -> Self {
        CapacityValue {
            per_kw_year: M::ZERO,
            escalation: 0.0,
        }
    }
}

/// Present values per unit of guaranteed performance for one candidate.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct BidFactors<M: Money> {
    /// Added lifecycle cost per 1 kJ/kWh of heat rate above the candidate's;
    /// `None` when the candidate generates no energy or burns no fuel.
    pub pv_per_kj_per_kwh: Option<M>,
    /// Present value of the fixed O&M on one kW of net output.
    pub pv_fixed_om_per_kw: M,
    /// Present value of the capacity value of one kW.
    pub pv_capacity_value_per_kw: M,
    /// Net worth of one more kW: capacity value less its fixed O&M.
    pub pv_per_kw_net_output: M,
}

fn overflow(inputs: &LedgerInputs<impl Money>) -> FinanceError {
    FinanceError::Overflow {
        stream: "bid-evaluation factor",
        year: chrono::Datelike::year(&inputs.commercial_operation),
    }
}

/// The bid-evaluation factors of the candidate described by `inputs`.
pub fn bid_factors<M: Money>(
    inputs: &LedgerInputs<M>,
    capacity_value: &CapacityValue<M>,
) -> Result<BidFactors<M>, FinanceError> {
    let base = summarize_ledger(inputs)?;
    let operation = inputs.operation;

    let pv_per_kj_per_kwh = if operation.energy_mwh > 0.0 && operation.fuel_energy_gj_lhv > 0.0 {
        // kJ/kWh = GJ · 1e6 kJ/GJ / (MWh · 1e3 kWh/MWh).
        let heat_rate_kj_per_kwh = operation.fuel_energy_gj_lhv * 1000.0 / operation.energy_mwh;
        let mut worse = inputs.clone();
        worse.operation.fuel_energy_gj_lhv *= (heat_rate_kj_per_kwh + 1.0) / heat_rate_kj_per_kwh;
        let worse = summarize_ledger(&worse)?;
        Some(
            worse
                .lifecycle_cost
                .sub_checked(base.lifecycle_cost)
                .ok_or_else(|| overflow(inputs))?,
        )
    } else {
        None
    };

    let mut bigger = inputs.clone();
    bigger.operation.net_output_kw += 1.0;
    let pv_fixed_om_per_kw = summarize_ledger(&bigger)?
        .present_value
        .fixed_om
        .sub_checked(base.present_value.fixed_om)
        .ok_or_else(|| overflow(inputs))?;

    let mut capacity = inputs.clone();
    capacity.bought_in = BoughtIn {
        capacity_kw: 1.0,
        capacity_price: EscalatingPrice {
            price: capacity_value.per_kw_year,
            escalation: capacity_value.escalation,
        },
        ..BoughtIn::default()
    };
    let pv_capacity_value_per_kw = summarize_ledger(&capacity)
        .map_err(|error| match error {
            FinanceError::NegativeMoney { value, .. } => FinanceError::NegativeMoney {
                field: "capacity_value.per_kw_year".to_string(),
                value,
            },
            FinanceError::OutOfRange {
                value,
                valid,
                field: "bought_in.capacity_price.escalation",
            } => FinanceError::OutOfRange {
                field: "capacity_value.escalation",
                value,
                valid,
            },
            other => other,
        })?
        .present_value
        .bought_in;
    let pv_per_kw_net_output = pv_capacity_value_per_kw
        .sub_checked(pv_fixed_om_per_kw)
        .ok_or_else(|| overflow(inputs))?;
    Ok(BidFactors {
        pv_per_kj_per_kwh,
        pv_fixed_om_per_kw,
        pv_capacity_value_per_kw,
        pv_per_kw_net_output,
    })
}
