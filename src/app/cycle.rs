//! `brayfin cycle`.

use crate::cli::CycleArgs;
use crate::{Error, Result};

/// Run `brayfin cycle`.
pub fn run(_args: &CycleArgs) -> Result<()> {
    Err(Error::Internal("`cycle` is not built yet".into()))
}
