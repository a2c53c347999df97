//! Where output goes: standard output for what a renderer returned, and
//! files written safely: atomically (temporary file in the same folder,
//! then rename) and never over an input file. Also maps the command-line
//! choices of format and units to the renderers' own types.

use crate::cli::{Format, UnitSystem};
use crate::report::model::Units;
use crate::report::views::TextFormat;
use crate::{Error, Result};
use std::io::Write;
use std::path::Path;

/// Write rendered bytes to standard output.
pub fn print(bytes: &[u8]) -> Result<()> {
    let mut out = std::io::stdout().lock();
    out.write_all(bytes)
        .and_then(|()| out.flush())
        .map_err(|e| Error::io("writing to standard output", e))
}

/// The display unit system of a `--units` choice.
pub fn units_of(choice: UnitSystem) -> Units {
    match choice {
        UnitSystem::Si => Units::Si,
        UnitSystem::Us => Units::Us,
    }
}

/// The text format of a `--format` choice.
pub fn text_format(choice: Format) -> TextFormat {
    match choice {
        Format::Table => TextFormat::Table,
        Format::Json => TextFormat::Json,
        Format::Csv => TextFormat::Csv,
    }
}

/// Write `bytes` to `path` atomically: a temporary file in the same folder
/// is written, flushed and renamed over `path`. A failure leaves no partial
/// file behind. Refuses to write over any path in `inputs`.
pub fn write_atomically(path: &Path, bytes: &[u8], inputs: &[&Path]) -> Result<()> {
    for input in inputs {
        if same_file(path, input) {
            return Err(Error::Input(format!(
                "output path {} is an input file; choose another output path",
                path.display()
            )));
        }
    }
    let folder = match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p.to_path_buf(),
        _ => std::path::PathBuf::from("."),
    };
    let file_name = path
        .file_name()
        .ok_or_else(|| Error::Input(format!("output path {} names no file", path.display())))?
        .to_string_lossy()
        .into_owned();
    let temp = folder.join(format!(".{file_name}.{}.tmp", std::process::id()));
    let result = (|| -> std::io::Result<()> {
        let mut file = std::fs::File::create(&temp)?;
        file.write_all(bytes)?;
        file.sync_all()?;
        std::fs::rename(&temp, path)
    })();
    if let Err(source) = result {
        let _ = std::fs::remove_file(&temp);
        return Err(Error::io(format!("writing {}", path.display()), source));
    }
    Ok(())
}

fn same_file(a: &Path, b: &Path) -> bool {
    match (std::fs::canonicalize(a), std::fs::canonicalize(b)) {
        (Ok(x), Ok(y)) => x == y,
        _ => a == b,
    }
}
