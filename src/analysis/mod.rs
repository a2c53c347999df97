//! Analysis: each candidate through cycle, operation and ledger, set against
//! the baseline; sensitivity and risk. Plain typed values in and out.

pub mod acceptance;
pub mod compare;
pub mod engine;
pub mod evaluate;
pub mod implied;
pub mod machine;
pub mod maintenance;
pub mod model;
pub mod offdesign_grid;
pub mod operation;
pub mod sensitivity;
pub mod site;
pub mod site_curves;
pub mod vendor;
pub mod warnings;

pub use model::{build_model, ModelOptions};
pub mod point;
pub mod risk;
pub mod sampling;
pub mod sweep;
