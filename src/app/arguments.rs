//! Command-line parse failures as brayfin reports them: one line naming
//! the problem and a hint to `--help`, exit code 1 (bad input), instead of
//! the parser's whole usage text.

use clap::error::{ContextKind, ContextValue, ErrorKind};

/// What to print for a parse failure and the exit code, or `None` when the
/// parser's own output is wanted (`--help`, `--version`: exit 0).
/// `subcommand` is the command named on the line, if any, for the hint.
pub fn refusal(error: &clap::Error, subcommand: Option<&str>) -> (Option<String>, i32) {
    match error.kind() {
        ErrorKind::DisplayHelp | ErrorKind::DisplayVersion => (None, 0),
        _ => (Some(message(error, subcommand)), 1),
    }
}

/// The subcommand named in `args` (the first word that is one), if any.
pub fn subcommand_of(args: &[std::ffi::OsString]) -> Option<String> {
    use clap::CommandFactory;
    let cli = crate::cli::Cli::command();
    let names: Vec<&str> = cli.get_subcommands().map(|c| c.get_name()).collect();
    args.iter()
        .skip(1)
        .map(|a| a.to_string_lossy())
        .find(|a| names.contains(&a.as_ref()))
        .map(|a| a.into_owned())
}

/// `error: <problem>[; <tip>]` then `hint: ...--help`, from the parser's
/// rendered text: its first line and continuation lines, any `tip:` lines
/// and the list of possible values, without the usage block.
fn message(error: &clap::Error, subcommand: Option<&str>) -> String {
    let rendered = error.render().to_string();
    let mut lines = rendered.lines().map(str::trim).filter(|l| !l.is_empty());
    let first = lines
        .next()
        .unwrap_or("the command line could not be read")
        .trim_start_matches("error:")
        .trim()
        .to_string();
    let mut parts = vec![first];
    let invalid = match error.get(ContextKind::InvalidArg) {
        Some(ContextValue::String(arg)) => arg.clone(),
        _ => String::new(),
    };
    let lines = lines
        .take_while(|l| !l.starts_with("Usage:"))
        .filter(|l| !l.starts_with("For more information"));
    for line in lines {
        if let Some(tip) = line.strip_prefix("tip:") {
            // clap suggests `-- -x`, which only suits a positional value; a
            // value starting with "-" given to an option is joined with `=`.
            if tip.contains("to pass") && invalid.starts_with('-') {
                parts.push(format!(
                    "if `{invalid}` is the value of an option, join them with `=` \
                     (e.g. --candidate={invalid})"
                ));
            } else {
                parts.push(tip.trim().to_string());
            }
        } else if line.starts_with("[possible values") {
            parts.push(
                line.trim_start_matches('[')
                    .trim_end_matches(']')
                    .to_string(),
            );
        } else if let Some(first) = parts.first_mut() {
            // A continuation, e.g. the missing `<SCENARIO>`.
            first.push(' ');
            first.push_str(line);
        }
    }
    if error.kind() == ErrorKind::DisplayHelpOnMissingArgumentOrSubcommand {
        parts = vec!["no command given".to_string()];
    }
    let hint = match subcommand {
        Some(name) => format!("`brayfin {name} --help` lists its options"),
        None => "`brayfin --help` lists the commands".to_string(),
    };
    format!("error: {}\nhint: {hint}", parts.join("; "))
}
