//! The finance layer: a lifecycle ledger of every cash flow of one candidate,
//! and the metrics a buyer decides by.
//!
//! Plain typed inputs ([`LedgerInputs`]), plain typed outputs ([`Ledger`],
//! [`LedgerSummary`], [`Comparison`]), typed errors ([`FinanceError`]). The
//! layer knows nothing of files, the scenario format, the cycle or the CLI.
//!
//! The ledger is generic over its number type ([`Money`]): `Decimal` for the
//! printed ledger, `f64` for sampling and sweeps; both run the same code.
//! Methods follow NIST Handbook 135 and ASTM E917 (life-cycle cost), E964
//! (savings-to-investment ratio), E1057 (adjusted internal rate of return),
//! E1074 (net savings) and E1121 (payback).

mod bid;
mod calendar;
mod chain;
mod compare;
mod degradation;
mod engine;
mod error;
pub mod factors;
mod inputs;
mod ledger;
mod money;
mod operating;
mod payback;
mod price_path;
mod rate_of_return;
mod rates;
mod validate;

pub use bid::{bid_factors, BidFactors, CapacityValue};
pub use calendar::{years_between, Calendar, Period, MAX_SERVICE_LIFE_YEARS};
pub use compare::{compare_ledgers, compare_summaries, BreakEvenFuelPrice, Comparison, Savings};
pub use engine::{build_ledger, summarize_ledger};
pub use error::FinanceError;
pub use inputs::{
    Capital, CapitalPayment, Carbon, Degradation, EscalatingPrice, Fuel, FuelPrice, LedgerInputs,
    Operation, Overhaul, PriceBasis, Residual, ResidualValue,
};
pub use ledger::{Analysis, Ledger, LedgerRow, LedgerSummary, RowKind, StreamTotals};
pub use money::{
    convert_physics_to_money, round_for_presentation, Money, DEFAULT_MINOR_UNIT_DECIMALS,
    MIDPOINT_RULE, SIGNIFICANT_DIGITS,
};
pub use payback::{payback, Payback, PaybackKind};
pub use rate_of_return::{internal_rate_of_return, rate_of_return};
pub use rates::{nominal_from_real, real_from_nominal, RateBasis, Rates, Timing};
