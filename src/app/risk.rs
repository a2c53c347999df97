//! `brayfin risk`.

use crate::cli::RiskArgs;
use crate::{Error, Result};

/// Run `brayfin risk`.
pub fn run(_args: &RiskArgs) -> Result<()> {
    Err(Error::Internal("`risk` is not built yet".into()))
}
