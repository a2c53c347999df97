//! brayfin: from candidate gas-turbine configurations to lifecycle money.
//!
//! The library follows one direction of flow (see `DEVELOPERS.md`):
//! scenario → cycle solver → operation (fuel burn) → finance ledger →
//! analysis (comparison, sensitivity, risk) → report model → renderers.
//! Physics is `f64`; money is `rust_decimal::Decimal`.

pub mod analysis;
pub mod app;
pub mod cli;
pub mod cycle;
pub mod datasheet;
pub mod error;
pub mod finance;
pub mod fuel;
pub mod offdesign;
pub mod report;
pub mod scenario;
pub mod thermo;
pub mod units;
pub mod workbook;

pub use error::{Error, Result};
