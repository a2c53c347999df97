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
// Until the off-design branch's own clippy fixes to these two modules land
// (they are being finished elsewhere and are not edited here); remove on
// merge.
#[allow(
    clippy::neg_cmp_op_on_partial_ord,
    clippy::unnecessary_lazy_evaluations
)]
pub mod offdesign;
pub mod report;
pub mod scenario;
#[allow(clippy::neg_cmp_op_on_partial_ord)]
pub mod thermo;
pub mod units;

pub use error::{Error, Result};
