//! `brayfin compare`.

use crate::cli::CompareArgs;
use crate::{Error, Result};

/// Run `brayfin compare`.
pub fn run(_args: &CompareArgs) -> Result<()> {
    Err(Error::Internal("`compare` is not built yet".into()))
}
