//! A progress bar on standard error for long runs (`sweep`, `risk`): it
//! appears only once a run has taken about a second, and never when
//! standard error is not a terminal (pipes, files, tests).

use indicatif::{ProgressBar, ProgressDrawTarget, ProgressStyle};
use std::io::IsTerminal;
use std::time::{Duration, Instant};

/// How long a run goes before its bar is shown.
const SHOW_AFTER: Duration = Duration::from_secs(1);

/// A progress bar that stays hidden for short runs.
pub struct Progress {
    bar: ProgressBar,
    started: Instant,
    shown: bool,
    message: &'static str,
}

impl Progress {
    /// A hidden bar for a run of `total` steps described by `message`
    /// (e.g. "samples").
    pub fn new(total: usize, message: &'static str) -> Progress {
        let bar = ProgressBar::with_draw_target(Some(total as u64), ProgressDrawTarget::hidden());
        Progress {
            bar,
            started: Instant::now(),
            shown: false,
            message,
        }
    }

    /// `done` of `total` steps are finished.
    pub fn update(&mut self, done: usize, total: usize) {
        if !self.shown && self.started.elapsed() >= SHOW_AFTER && std::io::stderr().is_terminal() {
            self.shown = true;
            let template = format!("{{bar:40}} {{pos}}/{{len}} {} ({{eta}} left)", self.message);
            if let Ok(style) = ProgressStyle::with_template(&template) {
                self.bar.set_style(style);
            }
            self.bar.set_draw_target(ProgressDrawTarget::stderr());
        }
        self.bar.set_length(total as u64);
        self.bar.set_position(done as u64);
    }

    /// Remove the bar (if shown) before results are printed.
    pub fn finish(self) {
        self.bar.finish_and_clear();
    }
}
