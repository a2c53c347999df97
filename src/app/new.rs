//! `brayfin new`: write a starter scenario from a built-in template.

use crate::app::output::write_atomically;
use crate::cli::NewArgs;
use crate::{Error, Result};

/// The starter templates, embedded so the binary works from any folder:
/// (name, file text). The first is the default of `--template`.
pub const TEMPLATES: &[(&str, &str)] = &[
    (
        "bid-evaluation",
        include_str!("../../templates/bid-evaluation.toml"),
    ),
    ("retrofit", include_str!("../../templates/retrofit.toml")),
];

/// The text of the template called `name`, or an error listing the names.
pub fn template(name: &str) -> Result<&'static str> {
    TEMPLATES
        .iter()
        .find(|(n, _)| *n == name)
        .map(|(_, text)| *text)
        .ok_or_else(|| {
            let names: Vec<&str> = TEMPLATES.iter().map(|(n, _)| *n).collect();
            Error::Input(format!(
                "--template: {name:?} is not a starter template; expected one of {}",
                names.join(", ")
            ))
        })
}

/// Run `brayfin new PATH [--template NAME]`: refuses to write over an
/// existing file; writes atomically.
pub fn run(args: &NewArgs) -> Result<()> {
    let text = template(&args.template)?;
    if args.path.exists() {
        return Err(Error::Input(format!(
            "{}: already exists; brayfin new never overwrites a file; choose a new path",
            args.path.display()
        )));
    }
    write_atomically(&args.path, text.as_bytes(), &[])?;
    println!(
        "wrote {} from the {:?} template; check it with `brayfin check {}`",
        args.path.display(),
        args.template,
        args.path.display()
    );
    Ok(())
}
