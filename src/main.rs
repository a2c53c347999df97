//! brayfin entry point: parse the command line, run one command, map its
//! error to a message on stderr and an exit code (1 bad input, 2 internal).

use brayfin::app;
use brayfin::cli::{Cli, Command};
use clap::Parser;

fn main() {
    let args: Vec<std::ffi::OsString> = std::env::args_os().collect();
    let cli = match Cli::try_parse_from(&args) {
        Ok(cli) => cli,
        Err(error) => {
            let subcommand = app::arguments::subcommand_of(&args);
            let (message, code) = app::arguments::refusal(&error, subcommand.as_deref());
            match message {
                // `--help` and `--version`: clap prints them (exit 0).
                None => error.exit(),
                Some(line) => {
                    eprintln!("{line}");
                    std::process::exit(code);
                }
            }
        }
    };
    let outcome = match cli.command {
        Command::Cycle(args) => app::cycle::run(&args),
        Command::Compare(args) => app::compare::run(&args),
        Command::Offdesign(args) => app::offdesign::run(&args),
        Command::Report(args) => app::report::run(&args),
        Command::Sweep(args) => app::sweep::run(&args),
        Command::Risk(args) => app::risk::run(&args),
        Command::Check(args) => app::check::run(&args),
        Command::New(args) => app::new::run(&args),
        Command::Workbook(args) => app::workbook::run(&args),
    };
    if let Err(error) = outcome {
        eprintln!("error: {error}");
        std::process::exit(error.exit_code());
    }
}
