//! `brayfin check`.

use crate::cli::CheckArgs;
use crate::{Error, Result};

/// Run `brayfin check`.
pub fn run(_args: &CheckArgs) -> Result<()> {
    Err(Error::Internal("`check` is not built yet".into()))
}
