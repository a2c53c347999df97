//! `brayfin risk`: the Monte Carlo run in three formats.
//!
//! - table: a summary table (mean, P10, P50, P90 of net savings and of the
//!   break-even premium, chance of beating the baseline) and a text
//!   histogram of each candidate's net savings;
//! - json: the run (samples, seed, keys drawn, redraws) and per candidate
//!   the statistics, chance and histogram; money as decimal strings rounded
//!   to the minor unit;
//! - csv: the summary only, one row per candidate and figure (long format):
//!   `candidate_id,figure,mean,p10,p50,p90,probability_beats_baseline,
//!   samples,seed,currency,probability_shortfall,route`; the histogram is
//!   in the JSON and the table; `route` is `scaled` (the default: a draw
//!   that moves a bid's engine scales its site figures by its re-solved
//!   rating point) or `exact` (`--exact`), as the table's note and the
//!   JSON's `route_note` state. A candidate with a guarantee has a third row,
//!   `guarantee_damages` (damages received; the mean is the expected
//!   damages), whose last column is the share of samples short of the
//!   guarantee beyond the tolerance (empty on every other row).
//!
//! Every figure is money, the same in both unit systems; the table names
//! the unit system it was asked for.

use super::{json_text, View};
use crate::analysis::point::Route;
use crate::analysis::risk::RiskRun;
use crate::report::format::{self, grouped, money};
use crate::report::model::{RiskCandidate, RiskView, Units};
use crate::scenario::LoadedScenario;
use crate::{Error, Result};
use serde_json::json;
use tabled::builder::Builder;
use tabled::settings::{object::Columns, Alignment, Style};

/// Width of the longest histogram bar, characters.
const BAR_WIDTH: u64 = 40;

/// What `risk` prints: the run, its statistics and the unit system.
pub struct RiskOutput<'a> {
    loaded: &'a LoadedScenario,
    run: &'a RiskRun,
    view: &'a RiskView,
    units: Units,
}

impl<'a> RiskOutput<'a> {
    /// The output of `run` on `loaded`, whose statistics are `view`.
    pub fn new(
        loaded: &'a LoadedScenario,
        run: &'a RiskRun,
        view: &'a RiskView,
        units: Units,
    ) -> Self {
        RiskOutput {
            loaded,
            run,
            view,
            units,
        }
    }
}

impl View for RiskOutput<'_> {
    fn table(&self) -> Result<String> {
        Ok(table(self.loaded, self.run, self.view, self.units))
    }

    fn json(&self) -> Result<String> {
        json_text(&document(self.loaded, self.run, self.view))
    }

    fn csv(&self) -> Result<String> {
        let bytes = csv(self.loaded, self.run, self.view)?;
        String::from_utf8(bytes).map_err(|e| Error::Internal(format!("CSV encoding failed: {e}")))
    }
}

fn document(loaded: &LoadedScenario, run: &RiskRun, view: &RiskView) -> serde_json::Value {
    let s = &loaded.scenario;
    json!({
        "scenario": {
            "title": s.meta.title,
            "baseline": s.meta.baseline,
            "currency": s.meta.currency,
            "file": loaded.file_label,
            "sha256": loaded.sha256_hex,
        },
        "samples": run.samples,
        "seed": run.seed,
        "keys": run.keys,
        "correlations": s.correlation.iter().map(|c| json!({
            "keys": [c.first, c.second],
            "rank_correlation": c.rank_correlation,
        })).collect::<Vec<_>>(),
        "redraws": run.redraws,
        "first_redraw_reason": run.first_redraw_reason,
        "exact": run.route == Route::Exact,
        "route_note": run.route.note(),
        "candidates": view.candidates,
    })
}

fn csv(loaded: &LoadedScenario, run: &RiskRun, view: &RiskView) -> Result<Vec<u8>> {
    let route = match run.route {
        Route::Scaled => "scaled",
        Route::Exact => "exact",
    };
    let fail = |e: csv::Error| Error::Internal(format!("CSV encoding failed: {e}"));
    let mut writer = csv::Writer::from_writer(Vec::new());
    writer
        .write_record([
            "candidate_id",
            "figure",
            "mean",
            "p10",
            "p50",
            "p90",
            "probability_beats_baseline",
            "samples",
            "seed",
            "currency",
            "probability_shortfall",
            "route",
        ])
        .map_err(fail)?;
    for c in &view.candidates {
        let mut rows = vec![
            (
                "net_savings",
                &c.net_savings,
                c.probability_beats_baseline.to_string(),
                String::new(),
            ),
            (
                "break_even_premium",
                &c.break_even_premium,
                String::new(),
                String::new(),
            ),
        ];
        if let Some(contract) = &c.contract {
            rows.push((
                "guarantee_damages",
                &contract.damages,
                String::new(),
                contract.probability_shortfall.to_string(),
            ));
        }
        for (figure, p, chance, shortfall) in rows {
            writer
                .write_record([
                    c.candidate_id.clone(),
                    figure.to_string(),
                    p.mean.to_string(),
                    p.p10.to_string(),
                    p.p50.to_string(),
                    p.p90.to_string(),
                    chance,
                    view.samples.to_string(),
                    view.seed.to_string(),
                    loaded.scenario.meta.currency.clone(),
                    shortfall,
                    route.to_string(),
                ])
                .map_err(fail)?;
        }
    }
    writer
        .into_inner()
        .map_err(|e| Error::Internal(format!("CSV encoding failed: {e}")))
}

fn table(loaded: &LoadedScenario, run: &RiskRun, view: &RiskView, units: Units) -> String {
    let s = &loaded.scenario;
    let cur = &s.meta.currency;
    let mut out = format!(
        "{}\nMonte Carlo: {} samples, seed {}; baseline {}; scenario {}; money in {cur} ({} units \
         asked; every figure here is money)\nDrawn: {}\n",
        s.meta.title,
        run.samples,
        run.seed,
        s.meta.baseline,
        loaded.file_label,
        format::units_name(units),
        run.keys.join(", ")
    );
    if !s.correlation.is_empty() {
        let pairs: Vec<String> = s
            .correlation
            .iter()
            .map(|c| format!("{} and {} {}", c.first, c.second, c.rank_correlation))
            .collect();
        out.push_str(&format!(
            "Rank-correlated (Iman–Conover): {}\n",
            pairs.join("; ")
        ));
    }
    match &run.first_redraw_reason {
        Some(reason) => out.push_str(&format!(
            "Redrawn: {} draws the scenario refused or could not solve (first: {reason})\n",
            run.redraws
        )),
        None => out.push_str("Redrawn: none (every draw was valid)\n"),
    }
    out.push_str(run.route.note());
    out.push('\n');
    let mut b = Builder::default();
    b.push_record([
        "candidate",
        "figure",
        "mean",
        "P10",
        "P50",
        "P90",
        "chance it beats the baseline",
    ]);
    for c in &view.candidates {
        for (figure, p, chance) in [
            (
                "net savings",
                &c.net_savings,
                format!("{:.1} %", c.probability_beats_baseline * 100.0),
            ),
            ("break-even premium", &c.break_even_premium, String::new()),
        ] {
            b.push_record([
                c.candidate_id.clone(),
                figure.to_string(),
                money(p.mean, cur),
                money(p.p10, cur),
                money(p.p50, cur),
                money(p.p90, cur),
                chance,
            ]);
        }
    }
    let mut t = b.build();
    t.with(Style::psql())
        .modify(Columns::new(2..), Alignment::right());
    out.push('\n');
    out.push_str(&t.to_string());
    out.push_str(
        "\n\nThe chance counts the samples in which the candidate, at the premium it asks, costs \
         less over the life than the baseline (net savings above zero).\n",
    );
    for c in &view.candidates {
        if let Some(contract) = &c.contract {
            out.push_str(&format!(
                "Guarantee of {}: short beyond the tolerance in {:.1} % of samples; damages \
                 received mean (expected) {}, P10 {}, P50 {}, P90 {}. Its net savings and \
                 chance already count these damages and the machine as built.\n",
                c.candidate_id,
                contract.probability_shortfall * 100.0,
                money(contract.damages.mean, cur),
                money(contract.damages.p10, cur),
                money(contract.damages.p50, cur),
                money(contract.damages.p90, cur),
            ));
        }
    }
    for c in &view.candidates {
        out.push_str(&histogram_text(c, cur));
    }
    out
}

/// A text histogram of one candidate's net savings: one line per bin.
fn histogram_text(c: &RiskCandidate, currency: &str) -> String {
    let h = &c.histogram;
    let most = h.counts.iter().copied().max().unwrap_or(0).max(1);
    let mut out = format!(
        "\nNet savings of {} against the baseline, {currency} (samples per bin)\n",
        c.candidate_id
    );
    let edges: Vec<(String, String)> = (0..h.counts.len())
        .map(|i| {
            let from = h.low + h.bin_width * rust_decimal::Decimal::from(i);
            (grouped(from, 0), grouped(from + h.bin_width, 0))
        })
        .collect();
    let width = edges
        .iter()
        .map(|(a, b)| a.len().max(b.len()))
        .max()
        .unwrap_or(0);
    for ((from, to), count) in edges.iter().zip(&h.counts) {
        let bar = "#".repeat((count * BAR_WIDTH).div_ceil(most) as usize);
        out.push_str(&format!(
            "  {from:>width$} to {to:>width$} | {bar:<bw$} {count}\n",
            bw = BAR_WIDTH as usize
        ));
    }
    out
}
