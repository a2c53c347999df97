//! Command runners: the edge where files are read, results printed and
//! written. Each file runs one subcommand; none of them computes physics or
//! money itself.

pub mod arguments;
pub mod check;
pub mod compare;
pub mod cycle;
pub mod new;
pub mod offdesign;
pub mod output;
pub mod progress;
pub mod report;
pub mod risk;
pub mod sweep;
pub mod workbook;
