//! Sweeps: one or two scenario keys stepped over a range (two give a grid),
//! each point re-solving the cycle and `f64` ledger of the candidates and
//! setting each against the baseline.
//!
//! A range is `KEY=FROM:TO:STEP`. Bare numbers are in the key's internal
//! unit (see `docs/scenario.md`, "Key paths": fractions as 0.88,
//! temperatures in K, fuel prices per GJ); the three numbers may instead
//! carry one unit, the same on each (`2 USD/MMBtu:12 USD/MMBtu:1 USD/MMBtu`,
//! `86%:92%:1%`, `1400 degC:1500 degC:25 degC`), and the steps are then
//! taken in that unit. The numbers are read as exact decimals and each
//! point's value is FROM + i·STEP computed in decimal in the written unit,
//! so 0.85:0.95:0.01 gives 0.88, not 0.88000000000000012; TO is included
//! when the steps land on it. The written value is converted to the
//! internal unit by the unit's linear map (scale and offset, as
//! [`crate::units`] reads a single value). Points are numbered with the
//! first key varying slowest.
//!
//! Points run in parallel in blocks; each finished block is handed to the
//! caller in point order, so output can be written as it comes and memory
//! does not grow with the number of points.

use super::compare::study_fuel;
use super::point::{Figures, PointError, PointModel, Route};
use crate::scenario::LoadedScenario;
use crate::units::{self, split_quantity, Kind, Split};
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
    /// First value, in the written unit.
    pub from: Decimal,
    /// Step between values (non-zero, towards `to`), in the written unit.
    pub step: Decimal,
    /// Number of values, ≥ 1.
    pub count: usize,
    /// The unit the range was written in (`"USD/MMBtu"`, `"%"`), or `None`
    /// for bare numbers in the key's internal unit.
    pub unit: Option<String>,
    /// Internal value = written value × `scale` + `offset`.
    scale: f64,
    /// See `scale`.
    offset: f64,
    /// The kind of quantity the key holds: from the range's unit, else from
    /// the unit the scenario file wrote for the key, else as the key is
    /// declared (always known once [`plan`] has checked the axis).
    pub kind: Option<Kind>,
}

impl Axis {
    /// The `i`-th value (0-based) as written: in [`Axis::unit`], or in the
    /// internal unit when the range had none.
    pub fn written_value(&self, i: usize) -> f64 {
        (self.from + self.step * Decimal::from(i))
            .to_f64()
            .unwrap_or(f64::NAN)
    }

    /// The `i`-th value (0-based), internal unit.
    pub fn value(&self, i: usize) -> f64 {
        let written = self.written_value(i);
        if self.unit.is_none() {
            written
        } else {
            written * self.scale + self.offset
        }
    }
}

/// The linear map (scale, offset) of `unit` to its kind's internal unit:
/// for a physical unit the one [`crate::units`] reads values with; for a
/// money unit (which must name `currency`) the size of one of it in the
/// internal unit, read exactly as a decimal.
fn unit_map(text: &str, unit: &str, currency: &str) -> crate::Result<(f64, f64)> {
    if let Some((_, scale, offset)) = units::physical_unit_map(unit) {
        return Ok((scale, offset));
    }
    let one = format!("1 {unit}");
    let read: fn(&str) -> Result<units::MoneyValue, units::UnitError> = match units::kind_of(&one) {
        Some(Kind::Money) => units::money,
        Some(Kind::FuelPrice) => units::price_per_gj,
        Some(Kind::PricePerTonne) => units::price_per_tonne,
        Some(Kind::PricePerEnergy) => units::price_per_mwh,
        Some(Kind::PricePerCapacity) => units::price_per_kw_year,
        _ => {
            return Err(bad_vary(
                text,
                &format!("`{unit}` is not a unit brayfin knows"),
            ))
        }
    };
    let value = read(&one).map_err(|e| bad_vary(text, &e.to_string()))?;
    if let Some(named) = value.currency {
        if named != currency {
            return Err(bad_vary(
                text,
                &format!("the range is in {named} but the scenario's currency is {currency}"),
            ));
        }
    }
    let scale = value.amount.to_f64().unwrap_or(f64::NAN);
    Ok((scale, 0.0))
}

/// The unit the scenario file wrote for `key` (for `candidate.<field>`,
/// that of the first candidate giving the field with a unit), if any.
fn unit_in_file<'l>(loaded: &'l LoadedScenario, key: &str) -> Option<&'l str> {
    let field = key.strip_prefix("candidate.");
    loaded
        .inputs
        .iter()
        .filter(|i| !i.unit.is_empty())
        .find(|i| match field {
            Some(field) => i
                .key
                .strip_prefix("candidate[")
                .and_then(|rest| rest.split_once("]."))
                .is_some_and(|(_, f)| f == field),
            None => i.key == key,
        })
        .map(|i| i.unit.as_str())
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
    let text = crate::scenario::clip(text);
    let problem = crate::scenario::clip_long(problem);
    Error::Input(format!(
        "--vary {text}: {problem}; expected KEY=FROM:TO:STEP, bare numbers in the key's internal \
         unit or one unit on all three, e.g. --vary fuel.price=3:6:0.25, \
         --vary \"fuel.price=2 USD/MMBtu:12 USD/MMBtu:1 USD/MMBtu\" or \
         --vary candidate.turbine_efficiency=86%:92%:1%"
    ))
}

/// A range part: its exact number and the unit written after it (empty
/// when bare).
fn number<'t>(text: &str, part: &'t str, name: &str) -> crate::Result<(Decimal, &'t str)> {
    let trimmed = part.trim();
    let not_a_number = || {
        let shown = crate::scenario::clip(trimmed);
        bad_vary(text, &format!("{name} `{shown}` is not a finite number"))
    };
    let (digits, unit) = match split_quantity(trimmed) {
        Split::Quantity { number, unit } => (number, unit),
        Split::NotANumber => return Err(not_a_number()),
    };
    let value = Decimal::from_str(&digits)
        .or_else(|_| Decimal::from_scientific(&digits))
        .map_err(|_| not_a_number())?;
    Ok((value, unit))
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
    let ((from, from_unit), (to, to_unit), (step, step_unit)) = (
        number(text, from, "FROM")?,
        number(text, to, "TO")?,
        number(text, step, "STEP")?,
    );
    if from_unit != to_unit || from_unit != step_unit {
        return Err(bad_vary(
            text,
            &format!(
                "FROM, TO and STEP carry different units (`{from_unit}`, `{to_unit}`, \
                 `{step_unit}`); write the same unit on all three, or none"
            ),
        ));
    }
    let unit = (!from_unit.is_empty()).then(|| from_unit.to_string());
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
        unit,
        scale: 1.0,
        offset: 0.0,
        kind: None,
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
    let mut axes = vary
        .iter()
        .map(|text| parse_axis(text))
        .collect::<crate::Result<Vec<Axis>>>()?;
    for (axis, text) in axes.iter_mut().zip(vary) {
        let in_file =
            unit_in_file(loaded, &axis.key).and_then(|u| units::kind_of(&format!("1 {u}")));
        let declared = scenario
            .numeric_kind(&axis.key)
            .map_err(|e| Error::Input(format!("--vary {}: {e}", crate::scenario::clip(text))))?;
        axis.kind = Some(in_file.unwrap_or(declared));
        if let Some(unit) = &axis.unit {
            (axis.scale, axis.offset) = unit_map(text, unit, &scenario.meta.currency)?;
            let written = units::kind_of(&format!("1 {unit}"));
            if let (Some(file_kind), Some(range_kind)) = (in_file, written) {
                if file_kind != range_kind {
                    return Err(bad_vary(
                        text,
                        &format!(
                            "`{}` holds {file_kind} but `{unit}` is a unit of {range_kind}",
                            axis.key
                        ),
                    ));
                }
            }
            axis.kind = written;
        }
    }
    if axes.len() == 2 && axes[0].key == axes[1].key {
        return Err(Error::Input(format!(
            "--vary names `{}` twice; expected two different keys",
            axes[0].key
        )));
    }
    for (axis, text) in axes.iter().zip(vary) {
        for value in [axis.value(0), axis.value(axis.count - 1)] {
            let mut trial = scenario.clone();
            trial.set_numeric(&axis.key, value).map_err(|e| {
                Error::Input(format!("--vary {}: {e}", crate::scenario::clip(text)))
            })?;
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

/// One line for `sweep`'s output: how points that move a bid's engine were
/// solved by `route`, and the largest error of the default route measured
/// against `--exact` (`tests/sweep_route.rs` holds it).
///
/// Measured (10 001-point sweeps over the whole range shown, default route
/// against `--exact`): Corvel Bay, every bid's turbine efficiency 86-95 %:
/// heat rate 0.00004 %, lifecycle cost 0.00008 %; Kestrel Point, the
/// regenerator's effectiveness 70-90 %: 0.024 % and 0.020 %; Kestrel
/// Point, every bid's compressor efficiency 84-92 % (the file has 85 % and
/// 87 %): 0.087 % and 0.080 %, net savings and break-even premium within
/// 262 000 EUR (0.08 % of the lifecycle cost; 8 % of a net saving of about
/// 1 000 000 EUR). The error grows with the distance from the file's value.
pub fn route_note(route: Route) -> &'static str {
    match route {
        Route::Scaled => {
            "Route: a point that moves a bid's engine (efficiencies, regenerator) re-solves its \
             rating point and scales the site output and heat rate, solved once at the file's \
             values, by the rating ratios (largest error measured against --exact over \
             whole-range sweeps of the two demos: heat rate and lifecycle cost 0.09\u{a0}%, net \
             savings and break-even premium 0.08\u{a0}% of the lifecycle cost; it grows with the \
             distance from the file's value); --exact re-solves every point in full"
        }
        Route::Exact => {
            "Route: exact (every point that moves a bid's engine re-calibrates its machine and \
             solves it at the site and every dispatch load)"
        }
    }
}

/// Run the sweep by the default route ([`Route::Scaled`]), handing each
/// finished block to `on_block` in point order. Returns the number of
/// points that could not be evaluated.
pub fn run_sweep(
    loaded: &LoadedScenario,
    plan: &SweepPlan,
    on_block: &mut dyn FnMut(&SweepBlock) -> crate::Result<()>,
) -> crate::Result<usize> {
    run_sweep_by(loaded, plan, Route::default(), on_block)
}

/// [`run_sweep`] with points that move a candidate's engine solved by
/// `route` (`sweep --exact` is [`Route::Exact`]).
pub fn run_sweep_by(
    loaded: &LoadedScenario,
    plan: &SweepPlan,
    route: Route,
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
    )
    .with_route(route);
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
