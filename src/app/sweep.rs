//! `brayfin sweep`.

use crate::cli::SweepArgs;
use crate::{Error, Result};

/// Run `brayfin sweep`.
pub fn run(_args: &SweepArgs) -> Result<()> {
    Err(Error::Internal("`sweep` is not built yet".into()))
}
