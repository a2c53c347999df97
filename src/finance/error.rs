//! The one error type of the finance layer.
//!
//! Every variant names the input (by its path in [`LedgerInputs`]) and says
//! what would be valid, so the scenario layer can point at the offending line.
//!
//! [`LedgerInputs`]: super::LedgerInputs

use chrono::NaiveDate;
use thiserror::Error;

/// What went wrong while building a ledger or comparing two of them.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum FinanceError {
    /// `service_life_years` is outside the supported span.
    #[error("service_life_years = {value} is out of range: valid is 1 to 60 years")]
    ServiceLife {
        /// The value given.
        value: u32,
    },
    /// A rate, fraction or physical quantity is outside its valid range or is
    /// not a finite number.
    #[error("{field} = {value} is out of range: valid is {valid}")]
    OutOfRange {
        /// Path of the input, e.g. `rates.discount_rate`.
        field: &'static str,
        /// The value given.
        value: f64,
        /// The valid range in words, e.g. `greater than -1 (-100 %)`.
        valid: &'static str,
    },
    /// A money input is negative where only zero or more makes sense.
    #[error("{field} = {value} is negative: valid is zero or more")]
    NegativeMoney {
        /// Path of the input, e.g. `fuel.price_path[2031]`.
        field: String,
        /// The value given, as text.
        value: String,
    },
    /// The fuel price path lacks a calendar year of the service life.
    #[error(
        "fuel.price_path has no price for {year}: every calendar year of the \
         service life ({first} to {last}) needs exactly one price"
    )]
    PricePathMissingYear {
        /// The missing year.
        year: i32,
        /// First calendar year of operation.
        first: i32,
        /// Last calendar year of operation.
        last: i32,
    },
    /// The fuel price path names a year twice.
    #[error("fuel.price_path gives {year} more than once: each year may appear only once")]
    PricePathDuplicateYear {
        /// The repeated year.
        year: i32,
    },
    /// A capital schedule with no payments.
    #[error("capital schedule is empty: give at least one (date, amount) payment")]
    EmptyCapitalSchedule,
    /// A capital payment dated after commercial operation.
    #[error(
        "capital[{index}] is dated {date}, after commercial operation on \
         {commercial_operation}: payments must fall on or before commercial operation"
    )]
    CapitalAfterCommercialOperation {
        /// Position of the payment in the schedule (0-based).
        index: usize,
        /// Its date.
        date: NaiveDate,
        /// The commercial-operation date.
        commercial_operation: NaiveDate,
    },
    /// Capital payment dates that do not strictly increase.
    #[error(
        "capital[{index}] is dated {date}, not after the previous payment on \
         {previous}: payment dates must be strictly increasing"
    )]
    CapitalDatesOutOfOrder {
        /// Position of the payment in the schedule (0-based).
        index: usize,
        /// Its date.
        date: NaiveDate,
        /// The date of the payment before it.
        previous: NaiveDate,
    },
    /// The end of the service life is past the last representable date.
    #[error(
        "commercial operation {commercial_operation} plus {years} years is past the \
         last representable date: use a date before the year 200000"
    )]
    CalendarOverflow {
        /// The commercial-operation date.
        commercial_operation: NaiveDate,
        /// The service life.
        years: u32,
    },
    /// A money amount left the representable range.
    #[error(
        "{stream} in {year} is beyond the representable money range \
         (about 7.9e28): check the magnitudes of prices, quantities and escalation"
    )]
    Overflow {
        /// The cost stream being computed, e.g. `fuel cost`.
        stream: &'static str,
        /// The calendar year of the row.
        year: i32,
    },
    /// A guarantee settlement amount left the representable range.
    #[error(
        "{stream} is beyond the representable money range (about 7.9e28): check \
         the guarantee's rates, the contract price and the measured values"
    )]
    SettlementOverflow {
        /// The amount being computed, e.g. `guarantee damages`.
        stream: &'static str,
    },
    /// Two ledgers that cannot be compared because their analyses differ.
    #[error(
        "candidate and baseline differ in {what}: both must share commercial \
         operation, service life, rates and timing to be compared"
    )]
    Incomparable {
        /// The setting that differs, e.g. `discount rate`.
        what: &'static str,
    },
}
