//! Monte Carlo over the scenario's `[[uncertainty]]` distributions: each
//! sample draws every uncertain input, re-solves every candidate whose
//! physics it moves (by [`Route::Scaled`] unless `--exact`, see
//! [`super::point`]) and its `f64` ledger, and records each candidate's net
//! savings and break-even premium against the baseline.
//!
//! - Draws: sample `i` takes its numbers from stream `i` of the seed (see
//!   [`super::sampling`]), so results are bit-identical for a seed whatever
//!   the number of threads; statistics are taken in sample order.
//! - A draw the scenario refuses (a value outside its key's range, e.g. a
//!   normal efficiency above 1, or a cross-field rule) or at which a cycle or
//!   ledger cannot be solved is redrawn from the same sample's stream, up to
//!   [`MAX_DRAWS_PER_SAMPLE`] times. Every sample counted is valid; the
//!   results are those of the distributions conditional on a valid
//!   scenario, and the number of redraws is reported.
//! - `[[correlation]]` pairs are imposed on each sample's first draw by the
//!   Iman–Conover method ([`correlated_draws`]); without them every sample
//!   draws independently.
//! - Before any draw, the file's own point goes through `compare`'s decimal
//!   study, so `risk` refuses every file `compare` refuses, the same way.
//! - A candidate with a guarantee settles each sample's as-built draw by
//!   its contract and runs as built (`analysis::acceptance`); the run
//!   keeps its damages and whether it fell short beyond the tolerance.
//! - Memory: four `f64` per sample and non-baseline candidate, nothing more
//!   per sample (no ledger is kept).

pub mod statistics;

use super::compare::{run_study, study_fuel};
use super::point::{Figures, PointModel, Route};
use super::sampling::iman_conover::iman_conover_order;
use super::sampling::rank_correlation::CorrelationError;
use super::sampling::{Sampler, Streams};
use crate::finance::{round_for_presentation, DEFAULT_MINOR_UNIT_DECIMALS};
use crate::report::model::{Histogram, Percentiles, RiskCandidate, RiskContract, RiskView};
use crate::scenario::LoadedScenario;
use crate::Error;
use rayon::prelude::*;
use rust_decimal::prelude::FromPrimitive;
use rust_decimal::Decimal;
use statistics::{histogram, statistics, Bins, Statistics};

/// Most samples a run may ask for. The figures kept take 32 bytes per
/// sample and non-baseline candidate, plus 16 bytes per sample while one
/// candidate's figures are sorted: about 8 MB for 100 000 samples of the
/// three-candidate demo, about 800 MB at this maximum.
pub const MAX_SAMPLES: usize = 10_000_000;

/// Samples drawn when none is asked for, by `risk` and by `report`'s risk
/// section alike, so the same scenario prints the same figures in both
/// (both also print the count behind them).
pub const DEFAULT_SAMPLES: usize = 10_000;

/// Draws tried for one sample before the run is refused.
pub const MAX_DRAWS_PER_SAMPLE: u32 = 100;

/// Figures kept per sample and non-baseline candidate.
const FIGURES: usize = 4;

/// Samples computed between two progress reports.
const BLOCK: usize = 4096;

/// The uncertain inputs that have a distribution, ready to draw.
#[derive(Debug, Clone)]
pub struct Draws {
    /// Dotted scenario keys, in `[[uncertainty]]` order.
    pub keys: Vec<String>,
    /// One sampler per key.
    pub samplers: Vec<Sampler>,
    /// Per key, the 0-based index of its entry in the scenario's
    /// `[[uncertainty]]` list (for locating an error at the entry).
    pub entries: Vec<usize>,
}

/// The distributions of `loaded`'s `[[uncertainty]]` entries; an input
/// error at the entry when one cannot be sampled, or when none has a
/// distribution.
pub fn draws_of(loaded: &LoadedScenario) -> crate::Result<Draws> {
    let mut draws = Draws {
        keys: Vec::new(),
        samplers: Vec::new(),
        entries: Vec::new(),
    };
    for (i, input) in loaded.scenario.uncertainty.iter().enumerate() {
        let Some(distribution) = input.distribution else {
            continue;
        };
        let sampler = Sampler::new(distribution, input.truncate).map_err(|e| {
            loaded.error_at(
                &format!("uncertainty[{}]", i + 1),
                &format!("the distribution of `{}` cannot be sampled: {e}", input.key),
            )
        })?;
        draws.keys.push(input.key.clone());
        draws.samplers.push(sampler);
        draws.entries.push(i);
    }
    if draws.keys.is_empty() {
        return Err(loaded.error_at(
            "uncertainty",
            "no [[uncertainty]] entry has a distribution; risk needs at least one, e.g. \
             key = \"fuel.price\", distribution = \"triangular\", low, mode, high",
        ));
    }
    Ok(draws)
}

/// Monte Carlo results of one non-baseline candidate.
#[derive(Debug, Clone, PartialEq)]
pub struct CandidateRisk {
    /// Candidate id.
    pub candidate_id: String,
    /// Net savings against the baseline (scenario currency).
    pub net_savings: Statistics,
    /// Break-even premium over the baseline's capital (scenario currency).
    pub break_even_premium: Statistics,
    /// Share of samples (0 to 1) with positive net savings: the candidate,
    /// at the premium it asks, costs less over the life than the baseline.
    pub probability_beats_baseline: f64,
    /// Histogram of net savings.
    pub histogram: Bins,
    /// What the contract settled, for a candidate with a guarantee.
    pub contract: Option<ContractRisk>,
}

/// The acceptance test over the samples of a candidate with a guarantee:
/// each sample settles its as-built draw by the contract (see
/// [`super::acceptance`]), and its net savings above already count the
/// damages received and the machine run as built.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ContractRisk {
    /// Share of samples (0 to 1) whose as-built heat rate or output falls
    /// short of the guarantee beyond the tolerance.
    pub probability_shortfall: f64,
    /// Damages received (after the cap), scenario currency.
    pub damages: Statistics,
}

/// A whole Monte Carlo run.
#[derive(Debug, Clone, PartialEq)]
pub struct RiskRun {
    /// Samples counted (as asked).
    pub samples: usize,
    /// Seed of the streams.
    pub seed: u64,
    /// The keys drawn, in order.
    pub keys: Vec<String>,
    /// Baseline candidate id.
    pub baseline_id: String,
    /// Draws refused and redrawn, over all samples.
    pub redraws: u64,
    /// Why the first redrawn draw (lowest sample) was refused.
    pub first_redraw_reason: Option<String>,
    /// One entry per non-baseline candidate, in scenario order.
    pub candidates: Vec<CandidateRisk>,
    /// How draws that move a candidate's engine were solved.
    pub route: Route,
}

/// What one sample's draws came to.
#[derive(Debug, Clone, Default)]
struct Tally {
    redraws: u64,
    /// (sample, reason) of the lowest sample with a redraw.
    first_reason: Option<(usize, String)>,
    /// (sample, reason) of the lowest sample with no valid draw.
    failed: Option<(usize, String)>,
    /// The first refused draw of that sample (one value per key).
    failed_draw: Option<(usize, Vec<f64>)>,
}

fn lowest<T>(a: Option<(usize, T)>, b: Option<(usize, T)>) -> Option<(usize, T)> {
    match (a, b) {
        (Some(x), Some(y)) => Some(if y.0 < x.0 { y } else { x }),
        (x, y) => x.or(y),
    }
}

impl Tally {
    fn merge(self, other: Tally) -> Tally {
        Tally {
            redraws: self.redraws + other.redraws,
            first_reason: lowest(self.first_reason, other.first_reason),
            failed: lowest(self.failed, other.failed),
            failed_draw: lowest(self.failed_draw, other.failed_draw),
        }
    }
}

/// Run `samples` Monte Carlo samples of `loaded` with `seed` by the
/// default route ([`Route::Scaled`]). `progress` is called from the calling
/// thread with (samples done, samples asked) after each block of samples.
pub fn run_risk(
    loaded: &LoadedScenario,
    samples: usize,
    seed: u64,
    progress: &mut dyn FnMut(usize, usize),
) -> crate::Result<RiskRun> {
    run_risk_by(loaded, samples, seed, Route::default(), progress)
}

/// [`run_risk`] with draws that move a candidate's engine solved by
/// `route` (`risk --exact` is [`Route::Exact`]).
pub fn run_risk_by(
    loaded: &LoadedScenario,
    samples: usize,
    seed: u64,
    route: Route,
    progress: &mut dyn FnMut(usize, usize),
) -> crate::Result<RiskRun> {
    if samples == 0 || samples > MAX_SAMPLES {
        return Err(Error::Input(format!(
            "--samples {samples}: expected 1 to {MAX_SAMPLES} samples"
        )));
    }
    let scenario = &loaded.scenario;
    // The file's own point first, through `compare`'s decimal study:
    // whatever `compare` refuses (e.g. money past the decimal limit), `risk`
    // refuses with the same message before drawing anything.
    run_study(loaded)?;
    let draws = draws_of(loaded)?;
    let fuel = study_fuel(loaded)?;
    let baseline = scenario
        .candidates
        .iter()
        .position(|c| c.id == scenario.meta.baseline)
        .ok_or_else(|| loaded.error_at("scenario.baseline", "no candidate has this id"))?;
    let others: Vec<usize> = (0..scenario.candidates.len())
        .filter(|&i| i != baseline)
        .collect();
    if others.is_empty() {
        return Err(loaded.error_at(
            "candidate",
            "risk sets candidates against the baseline; expected at least one candidate besides it",
        ));
    }
    let correlated = correlated_draws(loaded, &draws, samples, seed)?;
    let n = scenario.candidates.len();
    let model = PointModel::new(scenario, fuel, baseline, draws.keys.clone(), vec![true; n])
        .with_route(route);
    let streams = Streams::new(seed);
    // Per sample and other candidate: net savings, break-even premium,
    // damages settled, and 1 for a shortfall beyond the tolerance (else 0).
    let stride = FIGURES * others.len();
    let mut values = vec![0.0f64; samples * stride];
    let mut tally = Tally::default();
    let mut done = 0;
    for block in values.chunks_mut(BLOCK * stride) {
        let first = done;
        let block_tally = block
            .par_chunks_mut(stride)
            .enumerate()
            .map_init(
                || {
                    (
                        model.workspace(),
                        vec![Figures::default(); n],
                        vec![0.0; draws.samplers.len()],
                    )
                },
                |(ws, figures, drawn), (j, out)| {
                    let index = first + j;
                    let mut stream = streams.sample(index as u64);
                    let mut tally = Tally::default();
                    let mut first_draw: Option<Vec<f64>> = None;
                    for attempt in 0..MAX_DRAWS_PER_SAMPLE {
                        for (value, sampler) in drawn.iter_mut().zip(&draws.samplers) {
                            *value = sampler.quantile(stream.next_unit());
                        }
                        if attempt == 0 {
                            if let Some(rows) = &correlated {
                                let k = drawn.len();
                                drawn.copy_from_slice(&rows[index * k..(index + 1) * k]);
                            }
                        }
                        let outcome = model
                            .evaluate(ws, drawn, figures)
                            .map_err(|e| e.to_string())
                            .and_then(|()| record(figures, &others, scenario, out));
                        match outcome {
                            Ok(()) => return tally,
                            Err(reason) => {
                                tally.redraws += 1;
                                if tally.first_reason.is_none() {
                                    tally.first_reason = Some((index, reason));
                                    first_draw = Some(drawn.clone());
                                }
                            }
                        }
                    }
                    tally.failed = tally.first_reason.clone();
                    tally.failed_draw = first_draw.map(|d| (index, d));
                    tally
                },
            )
            .reduce(Tally::default, Tally::merge);
        tally = tally.merge(block_tally);
        done += block.len() / stride;
        progress(done.min(samples), samples);
    }
    if let Some((index, reason)) = tally.failed {
        let drawn = tally.failed_draw.map(|(_, d)| d).unwrap_or_default();
        let culprit = culprit_of(&model, &draws, scenario, &drawn);
        let message = format!(
            "sample {index}: no valid draw in {MAX_DRAWS_PER_SAMPLE} tries (first refusal: \
             {reason}); narrow or truncate {} so that the values it gives are valid",
            match culprit {
                Culprit::Alone(_) => "this entry's distribution",
                Culprit::Together =>
                    "the [[uncertainty]] distributions (no entry alone is refused; \
                     this is the first one drawn)",
            },
        );
        let k = match culprit {
            Culprit::Alone(k) => k,
            Culprit::Together => 0,
        };
        let entry = draws.entries.get(k).copied().unwrap_or(0);
        let key = draws.keys.get(k).map(String::as_str).unwrap_or("");
        return Err(loaded.error_at(
            &format!("uncertainty[{}].key", entry + 1),
            &format!("`{key}`: {message}"),
        ));
    }
    let candidates = others
        .iter()
        .enumerate()
        .map(|(k, &i)| {
            let candidate = &scenario.candidates[i];
            summarize(
                &values,
                stride,
                k,
                &candidate.id,
                candidate.guarantee.is_some(),
            )
        })
        .collect::<Option<Vec<_>>>()
        .ok_or_else(|| Error::Internal("risk statistics of an empty run".into()))?;
    Ok(RiskRun {
        samples,
        seed,
        keys: draws.keys,
        baseline_id: scenario.meta.baseline.clone(),
        redraws: tally.redraws,
        first_redraw_reason: tally.first_reason.map(|(_, reason)| reason),
        candidates,
        route,
    })
}

/// The first draw of every sample with the scenario's `[[correlation]]`
/// imposed, row-major (sample `i`'s values at `i·k .. (i+1)·k` for `k`
/// keys); `None` without correlations (each sample then draws
/// independently, as before).
///
/// Each key's column is drawn from the samples' own streams (the values an
/// uncorrelated run would draw first) and reordered by the Iman–Conover
/// method, so every input keeps its marginal distribution exactly. A
/// sample whose correlated draw is refused redraws independently from its
/// stream; the redraw count says how often. Memory: 24 bytes per sample and
/// key while the order is computed.
pub fn correlated_draws(
    loaded: &LoadedScenario,
    draws: &Draws,
    samples: usize,
    seed: u64,
) -> crate::Result<Option<Vec<f64>>> {
    let scenario = &loaded.scenario;
    if scenario.correlation.is_empty() {
        return Ok(None);
    }
    let target = crate::scenario::target_of(&scenario.uncertainty, &scenario.correlation)
        .map_err(|e| loaded.error_at("correlation", &e.to_string()))?;
    let k = draws.samplers.len();
    let streams = Streams::new(seed);
    let mut columns = vec![Vec::with_capacity(samples); k];
    for i in 0..samples {
        let mut stream = streams.sample(i as u64);
        for (column, sampler) in columns.iter_mut().zip(&draws.samplers) {
            column.push(sampler.quantile(stream.next_unit()));
        }
    }
    let orders = iman_conover_order(&columns, &target, seed).map_err(|e| match e {
        CorrelationError::TooFewSamples { .. } => Error::Input(format!("--samples {samples}: {e}")),
        other => loaded.error_at("correlation", &other.to_string()),
    })?;
    let mut rows = vec![0.0; samples * k];
    for (j, (column, order)) in columns.iter().zip(&orders).enumerate() {
        for (i, &from) in order.iter().enumerate() {
            rows[i * k + j] = column[from];
        }
    }
    Ok(Some(rows))
}

/// Which `[[uncertainty]]` draw made a sample unsolvable.
#[derive(Debug, Clone, Copy, PartialEq)]
enum Culprit {
    /// Draw `k` (index into the keys) alone, the others at their file values.
    Alone(usize),
    /// No draw alone: only their combination.
    Together,
}

/// The first key whose drawn value alone (every other key at the file's
/// value) the scenario or a solve refuses; `Together` when none does.
fn culprit_of(
    model: &PointModel,
    draws: &Draws,
    scenario: &crate::scenario::Scenario,
    drawn: &[f64],
) -> Culprit {
    let nominal: Option<Vec<f64>> = draws
        .keys
        .iter()
        .map(|key| scenario.get_numeric(key).ok())
        .collect();
    let Some(nominal) = nominal else {
        return Culprit::Together;
    };
    let mut ws = model.workspace();
    let mut figures = vec![Figures::default(); scenario.candidates.len()];
    for (k, &value) in drawn.iter().enumerate() {
        let mut point = nominal.clone();
        point[k] = value;
        if model.evaluate(&mut ws, &point, &mut figures).is_err() {
            return Culprit::Alone(k);
        }
    }
    Culprit::Together
}

/// Copy each other candidate's figures into `out`; a missing break-even
/// premium refuses the draw.
fn record(
    figures: &[Figures],
    others: &[usize],
    scenario: &crate::scenario::Scenario,
    out: &mut [f64],
) -> Result<(), String> {
    for (k, &i) in others.iter().enumerate() {
        let versus = figures[i].versus_baseline.ok_or_else(|| {
            format!(
                "`{}` was not set against the baseline",
                scenario.candidates[i].id
            )
        })?;
        let premium = versus.break_even_premium.ok_or_else(|| {
            format!(
                "the lifecycle cost of `{}` does not depend on its capital, so it has no \
                 break-even premium",
                scenario.candidates[i].id
            )
        })?;
        let at = FIGURES * k;
        out[at] = versus.net_savings;
        out[at + 1] = premium;
        out[at + 2] = figures[i].damages;
        out[at + 3] = if figures[i].shortfall_beyond_tolerance {
            1.0
        } else {
            0.0
        };
    }
    Ok(())
}

fn summarize(
    values: &[f64],
    stride: usize,
    k: usize,
    id: &str,
    has_guarantee: bool,
) -> Option<CandidateRisk> {
    let column = |offset: usize| -> Vec<f64> {
        values
            .chunks(stride)
            .map(|sample| sample[FIGURES * k + offset])
            .collect()
    };
    let contract = if has_guarantee {
        let mut damages = column(2);
        let short = column(3).iter().sum::<f64>();
        Some(ContractRisk {
            probability_shortfall: short / damages.len() as f64,
            damages: statistics(&mut damages)?,
        })
    } else {
        None
    };
    let mut savings = column(0);
    let mut premiums = column(1);
    let beats = savings.iter().filter(|s| **s > 0.0).count();
    let probability_beats_baseline = beats as f64 / savings.len() as f64;
    let net_savings = statistics(&mut savings)?;
    let break_even_premium = statistics(&mut premiums)?;
    Some(CandidateRisk {
        candidate_id: id.to_string(),
        net_savings,
        break_even_premium,
        probability_beats_baseline,
        histogram: histogram(&savings),
        contract,
    })
}

/// Money for the report model: rounded half-to-even to the minor unit,
/// always with its two decimals.
fn money(value: f64) -> Decimal {
    let mut rounded = round_for_presentation(
        Decimal::from_f64(value).unwrap_or_default(),
        DEFAULT_MINOR_UNIT_DECIMALS,
    );
    rounded.rescale(DEFAULT_MINOR_UNIT_DECIMALS);
    rounded
}

fn percentiles(s: &Statistics) -> Percentiles {
    Percentiles {
        mean: money(s.mean),
        p10: money(s.p10),
        p50: money(s.p50),
        p90: money(s.p90),
    }
}

/// The report model's view of a run: money rounded to the minor unit.
pub fn view_of(run: &RiskRun) -> RiskView {
    RiskView {
        samples: run.samples,
        seed: run.seed,
        redraws: run.redraws,
        first_redraw_reason: run.first_redraw_reason.clone(),
        route_note: run.route.note().to_string(),
        candidates: run
            .candidates
            .iter()
            .map(|c| RiskCandidate {
                candidate_id: c.candidate_id.clone(),
                net_savings: percentiles(&c.net_savings),
                break_even_premium: percentiles(&c.break_even_premium),
                probability_beats_baseline: c.probability_beats_baseline,
                histogram: Histogram {
                    low: money(c.histogram.low),
                    bin_width: money(c.histogram.bin_width),
                    counts: c.histogram.counts.clone(),
                },
                contract: c.contract.map(|k| RiskContract {
                    probability_shortfall: k.probability_shortfall,
                    damages: percentiles(&k.damages),
                }),
            })
            .collect(),
    }
}

/// The risk section of a report: `samples` samples with `seed`, no
/// progress shown.
pub fn risk_view(loaded: &LoadedScenario, samples: usize, seed: u64) -> crate::Result<RiskView> {
    run_risk(loaded, samples, seed, &mut |_, _| {}).map(|run| view_of(&run))
}
