//! `brayfin report`.

use crate::cli::ReportArgs;
use crate::{Error, Result};

/// Run `brayfin report`.
pub fn run(_args: &ReportArgs) -> Result<()> {
    Err(Error::Internal("`report` is not built yet".into()))
}
