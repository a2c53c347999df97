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
//!
//! Conventions, each documented where it is applied:
//! - Base date (time zero) is the commercial-operation date; construction
//!   capital before it is carried forward (discount factor above one).
//! - Service life is `N` anniversary years; rows are calendar years, the
//!   first from commercial operation to 31 December, the last to the day
//!   before the `N`-th anniversary; time runs on the actual/actual (ISDA)
//!   day count and partial years are prorated by days ([`Calendar`]).
//! - Prices are stated at the base date on the analysis basis (real or
//!   nominal, [`RateBasis`]) and escalate to each row's cash time, which is
//!   the period end or middle ([`Timing`]).
//! - Overhauls fall at multiples of the interval of accumulated operating
//!   hours; one falling exactly at the end of life is not charged.
//! - Residual value is credited on its own row at the end of life.
//! - Energy and capacity bought in ([`BoughtIn`]), the energy and capacity a
//!   candidate falls short of and buys elsewhere, is an operating cost
//!   charged pro rata in each operating row; the levelized cost leaves it
//!   out.
//! - A guarantee's settlement at the acceptance test ([`settle`],
//!   [`AcceptanceSettlement`]) is one row on the commercial-operation date
//!   with its own column: damages received are negative capital, a bonus
//!   paid is capital; both count as investment.
//! - `f64` becomes `Decimal` at 15 significant digits, at
//!   [`convert_physics_to_money`] (quantities) and [`Money::from_factor`]
//!   (discount factors); money is never rounded inside the ledger and is
//!   rounded once for display by [`round_for_presentation`] (half-to-even).

mod bid;
mod calendar;
mod chain;
mod compare;
mod degradation;
mod engine;
mod error;
pub mod factors;
mod guarantee;
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
pub use guarantee::{
    settle, AcceptanceSettlement, Guarantee, HeatRateRate, MeasuredPerformance, Settlement,
    SettlementRates, TestTolerance, ToleranceRule,
};
pub use inputs::{
    BoughtIn, Capital, CapitalPayment, Carbon, Degradation, EscalatingPrice, Fuel, FuelPrice,
    LedgerInputs, Operation, Overhaul, PriceBasis, Residual, ResidualValue, ServiceFees, Starts,
};
pub use ledger::{Analysis, Ledger, LedgerRow, LedgerSummary, RowKind, StreamTotals};
pub use money::{
    convert_physics_to_money, round_for_presentation, Money, DEFAULT_MINOR_UNIT_DECIMALS,
    MIDPOINT_RULE, SIGNIFICANT_DIGITS,
};
pub use payback::{payback, Payback, PaybackKind};
pub use rate_of_return::{internal_rate_of_return, rate_of_return};
pub use rates::{nominal_from_real, real_from_nominal, RateBasis, Rates, Timing};
