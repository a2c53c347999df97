//! `brayfin new`.

use crate::cli::NewArgs;
use crate::{Error, Result};

/// Run `brayfin new`.
pub fn run(_args: &NewArgs) -> Result<()> {
    Err(Error::Internal("`new` is not built yet".into()))
}
