//! Sweeps: one or two scenario keys stepped over a range (two give a grid),
//! each point re-solving the cycle and `f64` ledger of the candidates and
//! setting each against the baseline.
//!
//! A range is `KEY=FROM:TO:STEP` in the key's internal unit (see
//! `docs/scenario.md`, "Key paths": fractions as 0.88, temperatures in K,
//! fuel prices per GJ). The numbers are read as exact decimals and each
//! point's value is FROM + i·STEP computed in decimal, so 0.85:0.95:0.01
//! gives 0.88, not 0.88000000000000012; TO is included when the steps land
//! on it. Points are numbered with the first key varying slowest.
//!
//! Points run in parallel in blocks; each finished block is handed to the
//! caller in point order, so output can be written as it comes and memory
//! does not grow with the number of points.

use super::compare::study_fuel;
use super::point::{Figures, PointError, PointModel};
use crate::scenario::LoadedScenario;
use crate::Error;
use rayon::prelude::*;
use rust_decimal::prelude::ToPrimitive;
use rust_decimal::Decimal;
use std::str::FromStr;

/// Most points a sweep may have.
pub const MAX_POINTS: usize = 10_000_000;

/// Points computed between two hand-overs to the caller.
const BLOCK: usize = 8192;

/// One key stepped over a range.
#[derive(Debug, Clone, PartialEq)]
pub struct Axis {
    /// Dotted scenario key.
    pub key: String,
    /// First value, internal unit.
    pub from: Decimal,
    /// Step between values (non-zero, towards `to`).
    pub step: Decimal,
    /// Number of values, ≥ 1.
    pub count: usize,
}

impl Axis {
    /// The `i`-th value (0-based), internal unit.
    pub fn value(&self, i: usize) -> f64 {
        (self.from + self.step * Decimal::from(i))
            .to_f64()
            .unwrap_or(f64::NAN)
    }
}

/// A checked sweep: its axes and which candidates it reports.
#[derive(Debug, Clone, PartialEq)]
pub struct SweepPlan {
    /// One or two axes; with two, the first varies slowest.
    pub axes: Vec<Axis>,
    /// Index of the baseline candidate.
    pub baseline: usize,
    /// Indices of the candidates reported, in scenario order.
    pub reported: Vec<usize>,
}

impl SweepPlan {
    /// Total number of points.
    pub fn points(&self) -> usize {
        self.axes.iter().map(|a| a.count).product()
    }

    /// The key values of point `point`, one per axis, into `values`.
    pub fn fill_values(&self, point: usize, values: &mut [f64]) {
        let mut rest = point;
        for (axis, value) in self.axes.iter().zip(values.iter_mut()).rev() {
            *value = axis.value(rest % axis.count);
            rest /= axis.count;
        }
    }
}

fn bad_vary(text: &str, problem: &str) -> Error {
    Error::Input(format!(
        "--vary {text}: {problem}; expected KEY=FROM:TO:STEP with numbers in the key's internal \
         unit, e.g. --vary fuel.price=3:6:0.25 or --vary candidate.turbine_efficiency=0.86:0.92:0.01"
    ))
}

fn number(text: &str, part: &str, name: &str) -> crate::Result<Decimal> {
    let trimmed = part.trim();
    Decimal::from_str(trimmed)
        .or_else(|_| Decimal::from_scientific(trimmed))
        .map_err(|_| bad_vary(text, &format!("{name} `{trimmed}` is not a finite number")))
}

/// Read `KEY=FROM:TO:STEP` (without checking the key).
pub fn parse_axis(text: &str) -> crate::Result<Axis> {
    let (key, range) = text
        .split_once('=')
        .ok_or_else(|| bad_vary(text, "no `=` between the key and the range"))?;
    let key = key.trim();
    if key.is_empty() {
        return Err(bad_vary(text, "the key is empty"));
    }
    let parts: Vec<&str> = range.split(':').collect();
    let [from, to, step] = parts[..] else {
        return Err(bad_vary(
            text,
            &format!("the range has {} part(s), not 3", parts.len()),
        ));
    };
    let (from, to, step) = (
        number(text, from, "FROM")?,
        number(text, to, "TO")?,
        number(text, step, "STEP")?,
    );
    if step.is_zero() {
        return Err(bad_vary(text, "STEP is zero"));
    }
    if (to > from && step.is_sign_negative()) || (to < from && step.is_sign_positive()) {
        return Err(bad_vary(
            text,
            &format!("STEP {step} points away from TO {to} (from {from})"),
        ));
    }
    let too_many = || {
        bad_vary(
            text,
            &format!("more than {MAX_POINTS} points; widen STEP or narrow the range"),
        )
    };
    let intervals = (to - from)
        .checked_div(step)
        .ok_or_else(too_many)?
        .floor()
        .to_usize()
        .ok_or_else(too_many)?;
    if intervals >= MAX_POINTS {
        return Err(too_many());
    }
    Ok(Axis {
        key: key.to_string(),
        from,
        step,
        count: intervals + 1,
    })
}

/// Check `--vary` (once or twice) and `--candidate` against the scenario:
/// unknown keys (with a did-you-mean), values outside a key's range at
/// either end of its range, more than [`MAX_POINTS`] points, an unknown
/// candidate id.
pub fn plan(
    loaded: &LoadedScenario,
    vary: &[String],
    candidate: Option<&str>,
) -> crate::Result<SweepPlan> {
    let scenario = &loaded.scenario;
    if vary.is_empty() || vary.len() > 2 {
        return Err(Error::Input(format!(
            "--vary is given {} times; expected once (a line) or twice (a grid)",
            vary.len()
        )));
    }
    let axes = vary
        .iter()
        .map(|text| parse_axis(text))
        .collect::<crate::Result<Vec<Axis>>>()?;
    if axes.len() == 2 && axes[0].key == axes[1].key {
        return Err(Error::Input(format!(
            "--vary names `{}` twice; expected two different keys",
            axes[0].key
        )));
    }
    for (axis, text) in axes.iter().zip(vary) {
        for value in [axis.value(0), axis.value(axis.count - 1)] {
            let mut trial = scenario.clone();
            trial
                .set_numeric(&axis.key, value)
                .map_err(|e| Error::Input(format!("--vary {text}: {e}")))?;
        }
    }
    axes.iter()
        .try_fold(1usize, |n, a| n.checked_mul(a.count))
        .filter(|n| *n <= MAX_POINTS)
        .ok_or_else(|| {
            Error::Input(format!(
                "--vary: the grid has more than {MAX_POINTS} points; widen a step or narrow a range"
            ))
        })?;
    let baseline = scenario
        .candidates
        .iter()
        .position(|c| c.id == scenario.meta.baseline)
        .ok_or_else(|| loaded.error_at("scenario.baseline", "no candidate has this id"))?;
    let reported = match candidate {
        None => (0..scenario.candidates.len()).collect(),
        Some(id) => vec![scenario
            .candidates
            .iter()
            .position(|c| c.id == id)
            .ok_or_else(|| {
                let ids: Vec<&str> = scenario.candidates.iter().map(|c| c.id.as_str()).collect();
                Error::Input(format!(
                    "--candidate {id}: no such candidate; expected one of {}",
                    ids.join(", ")
                ))
            })?],
    };
    Ok(SweepPlan {
        axes,
        baseline,
        reported,
    })
}

/// A finished block of consecutive points.
#[derive(Debug)]
pub struct SweepBlock<'a> {
    /// Number of the block's first point.
    pub first_point: usize,
    candidates: usize,
    figures: &'a [Figures],
    failures: &'a [Option<PointError>],
}

impl SweepBlock<'_> {
    /// Number of points in the block.
    pub fn len(&self) -> usize {
        self.failures.len()
    }

    /// Whether the block has no points.
    pub fn is_empty(&self) -> bool {
        self.failures.is_empty()
    }

    /// The figures of every candidate (indexed as in the scenario; only the
    /// baseline and reported candidates are filled) at the block's `j`-th
    /// point, or why that point could not be evaluated.
    pub fn point(&self, j: usize) -> Result<&[Figures], &PointError> {
        match &self.failures[j] {
            Some(e) => Err(e),
            None => Ok(&self.figures[j * self.candidates..(j + 1) * self.candidates]),
        }
    }
}

/// Run the sweep, handing each finished block to `on_block` in point
/// order. Returns the number of points that could not be evaluated.
pub fn run_sweep(
    loaded: &LoadedScenario,
    plan: &SweepPlan,
    on_block: &mut dyn FnMut(&SweepBlock) -> crate::Result<()>,
) -> crate::Result<usize> {
    let scenario = &loaded.scenario;
    let n = scenario.candidates.len();
    let mut evaluated = vec![false; n];
    for &i in &plan.reported {
        evaluated[i] = true;
    }
    let keys = plan.axes.iter().map(|a| a.key.clone()).collect();
    let model = PointModel::new(
        scenario,
        study_fuel(loaded)?,
        plan.baseline,
        keys,
        evaluated,
    );
    let total = plan.points();
    let block_points = BLOCK.min(total);
    let mut figures = vec![Figures::default(); block_points * n];
    let mut failures: Vec<Option<PointError>> = vec![None; block_points];
    let mut unsolved = 0;
    let mut first = 0;
    while first < total {
        let len = block_points.min(total - first);
        let (figures, failures) = (&mut figures[..len * n], &mut failures[..len]);
        figures
            .par_chunks_mut(n)
            .zip(failures.par_iter_mut())
            .enumerate()
            .for_each_init(
                || (model.workspace(), vec![0.0; plan.axes.len()]),
                |(ws, values), (j, (out, failure))| {
                    plan.fill_values(first + j, values);
                    out.fill(Figures::default());
                    *failure = model.evaluate(ws, values, out).err();
                },
            );
        unsolved += failures.iter().filter(|f| f.is_some()).count();
        on_block(&SweepBlock {
            first_point: first,
            candidates: n,
            figures,
            failures,
        })?;
        first += len;
    }
    Ok(unsolved)
}
