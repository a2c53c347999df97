//! One point of a sweep or one sample of a risk run: a few scenario keys set
//! to given values, every selected candidate's cycle and `f64` ledger
//! re-solved, each set against the baseline.
//!
//! A [`Workspace`] is one worker's copy of the scenario. Before each point
//! the sections the keys write to are copied back from the base scenario, so
//! a point depends on its values alone (never on the points a worker did
//! before), which keeps parallel results identical to serial ones. A
//! candidate's cycle and fixed machine at the site are solved again only
//! when their physics inputs (engine, cooling, gas model, fuel, site
//! ambient, rating, control, dispatch loads, part-load table) differ from
//! the last solve in this workspace: a sample that moves only economics
//! reuses the site output and heat rates, which are the same numbers a new
//! solve would give; a sample that moves a component efficiency, the
//! cooling, the site's ambient or humidity re-solves the machine in full.
//! Likewise a candidate's ledger is summed again only when its ledger
//! inputs differ from the last ones (a sweep of one bid's figure leaves the
//! baseline's ledger as it was).

mod restore;

use super::acceptance::contract_inputs;
use super::engine::{detail_of, engine_config_of, fuel_of, gas_model_of};
use super::evaluate::output_reference_from;
use super::site::{fixed_machine_site, rated_site, SitePerformance};
use crate::cycle::{self, EngineConfig, GasModel};
use crate::finance::{compare_summaries, summarize_ledger, LedgerInputs, LedgerSummary};
use crate::fuel::Fuel;
use crate::scenario::{Candidate, ControlSpec, PartLoadPoint, RatingCondition, Scenario};
use rust_decimal::prelude::ToPrimitive;

/// What one candidate's figures are at one point.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Figures {
    /// Base-load net heat rate at the site, LHV, kJ/kWh.
    pub heat_rate_kj_per_kwh: f64,
    /// Lifecycle cost (present value), scenario currency, `f64` ledger.
    pub lifecycle_cost: f64,
    /// Against the baseline; `None` for the baseline itself.
    pub versus_baseline: Option<Versus>,
    /// Damages the contract settles at the acceptance test (scenario
    /// currency, after the cap); 0 without a guarantee.
    pub damages: f64,
    /// Whether the as-built heat rate or output fell short of the
    /// guarantee beyond the tolerance; `false` without a guarantee.
    pub shortfall_beyond_tolerance: bool,
}

/// A candidate against the baseline at one point (scenario currency).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Versus {
    /// Baseline lifecycle cost minus this candidate's.
    pub net_savings: f64,
    /// Capital premium over the baseline at which net savings are zero;
    /// `None` when the lifecycle cost does not depend on capital.
    pub break_even_premium: Option<f64>,
    /// Capital of this candidate minus the baseline's.
    pub premium_asked: f64,
}

/// Why a point could not be evaluated.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum PointError {
    /// The scenario refused the value of a key (range or cross-field rule).
    #[error("{message}")]
    Refused {
        /// The key.
        key: String,
        /// The value refused, internal unit.
        value: f64,
        /// The scenario's reason, naming the key and what is valid.
        message: String,
    },
    /// The fuel, as changed, cannot be modelled.
    #[error("the fuel cannot be modelled: {0}")]
    Fuel(String),
    /// A candidate's cycle cannot be solved.
    #[error("the cycle of `{candidate}` cannot be solved: {message}")]
    Cycle {
        /// Candidate id.
        candidate: String,
        /// The solver's reason.
        message: String,
    },
    /// A candidate's ledger cannot be built.
    #[error("the ledger of `{candidate}` cannot be built: {message}")]
    Ledger {
        /// Candidate id.
        candidate: String,
        /// The finance layer's reason.
        message: String,
    },
}

/// The part of a scenario a key writes to.
#[derive(Debug, Clone, Copy, PartialEq)]
enum Section {
    Site,
    Fuel,
    Economics,
    Operation,
    Candidate(usize),
    Candidates,
}

fn section_of(scenario: &Scenario, key: &str) -> Section {
    let candidate = key
        .strip_prefix("candidate[")
        .and_then(|rest| rest.split_once("]."))
        .and_then(|(id, _)| scenario.candidates.iter().position(|c| c.id == id));
    match (key.split('.').next(), candidate) {
        (_, Some(index)) => Section::Candidate(index),
        (Some("site"), _) => Section::Site,
        (Some("fuel"), _) => Section::Fuel,
        (Some("economics"), _) => Section::Economics,
        (Some("operation"), _) => Section::Operation,
        _ => Section::Candidates,
    }
}

/// The fixed part of a run of points: the base scenario, the keys that
/// vary, which candidates are evaluated.
#[derive(Debug, Clone)]
pub struct PointModel<'s> {
    base: &'s Scenario,
    base_fuel: Fuel,
    baseline: usize,
    keys: Vec<String>,
    sections: Vec<Section>,
    evaluated: Vec<bool>,
}

/// A candidate's site performance and the physics inputs it was solved
/// from.
#[derive(Debug, Clone)]
struct CachedCycle {
    config: EngineConfig,
    detail: cycle::Detail,
    gas: GasModel,
    fuel_is_base: bool,
    rating: RatingCondition,
    control: ControlSpec,
    /// The year's conditions (temperature, humidity, load) and the
    /// capacity temperature the site performance was solved for.
    year_key: YearKey,
    part_load: Vec<PartLoadPoint>,
    site: SitePerformance,
}

impl CachedCycle {
    /// Whether this solve holds for `candidate` in `scenario` (engine
    /// `config`, `detail`, `gas`, and the scenario's own fuel).
    fn holds(
        &self,
        scenario: &Scenario,
        candidate: &Candidate,
        (config, detail, gas): (&EngineConfig, &cycle::Detail, &GasModel),
        fuel_is_base: bool,
        year: &YearKey,
    ) -> bool {
        // Only solves with the scenario's own fuel are reused.
        fuel_is_base
            && self.fuel_is_base
            && self.config == *config
            && self.detail == *detail
            && self.gas == *gas
            && self.rating == candidate.rating
            && self.control == candidate.control
            && self.part_load == scenario.operation.part_load
            && self.year_key == *year
    }
}

/// What a site performance depends on beyond the candidate's physics: the
/// year's conditions and the capacity temperature.
type YearKey = (
    Vec<(f64, Option<f64>, Option<f64>, bool)>,
    [usize; 2],
    [f64; 3],
    Option<f64>,
);

/// The [`YearKey`] of `scenario`, without building its conditions: the
/// weather and profile (shared, so compared by address), the dispatch
/// blocks (load, own ambient and humidity, whether they run), the site's
/// ambient and humidity, and the capacity temperature. The hours do not
/// move a condition's ambient or load.
fn year_key(scenario: &Scenario) -> YearKey {
    let site = &scenario.site;
    let operation = &scenario.operation;
    (
        operation
            .dispatch
            .iter()
            .map(|b| {
                (
                    b.load_fraction,
                    b.ambient_temperature_k,
                    b.relative_humidity,
                    b.hours > 0.0,
                )
            })
            .collect(),
        [
            site.weather
                .as_ref()
                .map_or(0, |w| std::sync::Arc::as_ptr(w) as usize),
            operation
                .profile
                .as_ref()
                .map_or(0, |p| std::sync::Arc::as_ptr(p) as usize),
        ],
        [
            site.ambient_temperature_k,
            site.relative_humidity,
            if operation.dispatch.is_empty() && operation.hours_per_year > 0.0 {
                1.0
            } else {
                0.0
            },
        ],
        scenario.economics.capacity_temperature_k,
    )
}

/// One worker's scratch copy of the scenario and its cycle cache.
#[derive(Debug, Clone)]
pub struct Workspace {
    scenario: Scenario,
    cycles: Vec<Option<CachedCycle>>,
    summaries: Vec<Option<LedgerSummary<f64>>>,
    ledgers: Vec<Option<(LedgerInputs<f64>, LedgerSummary<f64>)>>,
    /// The year's conditions of the last point, with the key and the hours
    /// per year they were built for.
    conditions: Option<(YearKey, f64, Vec<super::operation::Condition>)>,
}

impl<'s> PointModel<'s> {
    /// Points of `base` that set `keys` (already checked to exist), with
    /// `base_fuel` its solved fuel and `baseline` the index of its baseline.
    /// `evaluated[i]` says whether candidate `i` is solved at each point (the
    /// baseline always is).
    pub fn new(
        base: &'s Scenario,
        base_fuel: Fuel,
        baseline: usize,
        keys: Vec<String>,
        mut evaluated: Vec<bool>,
    ) -> PointModel<'s> {
        evaluated.resize(base.candidates.len(), false);
        if let Some(b) = evaluated.get_mut(baseline) {
            *b = true;
        }
        let mut sections: Vec<Section> = Vec::new();
        for key in &keys {
            let section = section_of(base, key);
            if !sections.contains(&section) {
                sections.push(section);
            }
        }
        PointModel {
            base,
            base_fuel,
            baseline,
            keys,
            sections,
            evaluated,
        }
    }

    /// A fresh workspace for one worker.
    pub fn workspace(&self) -> Workspace {
        let n = self.base.candidates.len();
        Workspace {
            scenario: self.base.clone(),
            cycles: vec![None; n],
            summaries: vec![None; n],
            ledgers: vec![None; n],
            conditions: None,
        }
    }

    fn restore(&self, scenario: &mut Scenario) {
        let base = self.base;
        for section in &self.sections {
            match *section {
                Section::Site => restore::site(&mut scenario.site, &base.site),
                Section::Fuel => restore::fuel(&mut scenario.fuel, &base.fuel),
                // Plain values only: a copy allocates nothing.
                Section::Economics => scenario.economics.clone_from(&base.economics),
                Section::Operation => restore::operation(&mut scenario.operation, &base.operation),
                Section::Candidate(i) => {
                    restore::candidate(&mut scenario.candidates[i], &base.candidates[i])
                }
                Section::Candidates => {
                    for (dst, src) in scenario.candidates.iter_mut().zip(&base.candidates) {
                        restore::candidate(dst, src);
                    }
                }
            }
        }
    }

    /// Evaluate the point where the keys take `values` (internal units, one
    /// per key). `out[i]` receives candidate `i`'s figures for every
    /// evaluated candidate; the others are left as they were.
    pub fn evaluate(
        &self,
        ws: &mut Workspace,
        values: &[f64],
        out: &mut [Figures],
    ) -> Result<(), PointError> {
        self.restore(&mut ws.scenario);
        for (key, &value) in self.keys.iter().zip(values) {
            ws.scenario
                .set_numeric(key, value)
                .map_err(|e| PointError::Refused {
                    key: key.clone(),
                    value,
                    message: e.to_string(),
                })?;
        }
        let scenario = &ws.scenario;
        let own_fuel;
        let fuel_is_base = scenario.fuel.composition == self.base.fuel.composition;
        let fuel = if fuel_is_base {
            &self.base_fuel
        } else {
            own_fuel = fuel_of(&scenario.fuel).map_err(PointError::Fuel)?;
            &own_fuel
        };
        // Every candidate's site output sets the output reference, so each
        // is solved (or found in the cache), evaluated or not.
        let year = year_key(scenario);
        for (i, candidate) in scenario.candidates.iter().enumerate() {
            let config = engine_config_of(candidate, &scenario.site);
            let detail = detail_of(candidate, &scenario.site);
            let gas = gas_model_of(&candidate.gas_model);
            let hit = ws.cycles[i].as_ref().is_some_and(|c| {
                c.holds(
                    scenario,
                    candidate,
                    (&config, &detail, &gas),
                    fuel_is_base,
                    &year,
                )
            });
            if hit {
                continue;
            }
            let cycle_error = |message: String| PointError::Cycle {
                candidate: candidate.id.clone(),
                message,
            };
            // The machine's calibration is its own design solve: the design
            // cycle at the site is solved only for a candidate kept at its
            // rating.
            let site = match fixed_machine_site(scenario, candidate, fuel)
                .map_err(|e| cycle_error(e.to_string()))?
            {
                Ok(site) => site,
                Err(reason) => {
                    let solved = cycle::solve_detailed(&config, &detail, &gas, fuel)
                        .map_err(|e| cycle_error(e.to_string()))?;
                    rated_site(scenario, candidate, solved.heat_rate_kj_per_kwh, reason)
                }
            };
            ws.cycles[i] = Some(CachedCycle {
                config,
                detail,
                gas,
                fuel_is_base,
                rating: candidate.rating,
                control: candidate.control,
                year_key: year.clone(),
                part_load: scenario.operation.part_load.clone(),
                site,
            });
        }
        // The year's conditions (an hourly year has thousands), rebuilt only
        // when the year or its hours change.
        let hours = scenario.operation.hours_per_year;
        let stale = !matches!(&ws.conditions, Some((k, h, _)) if *k == year && *h == hours);
        if stale {
            ws.conditions = Some((year, hours, super::operation::conditions(scenario)));
        }
        let conds: &[super::operation::Condition] =
            ws.conditions.as_ref().map_or(&[], |c| c.2.as_slice());
        let reference = output_reference_from(
            scenario,
            conds,
            ws.cycles.iter().map(|c| c.as_ref().map(|c| &c.site)),
        );
        for (i, candidate) in scenario.candidates.iter().enumerate() {
            if !self.evaluated[i] {
                continue;
            }
            let Some(cached) = ws.cycles[i].as_ref() else {
                continue;
            };
            let site = &cached.site;
            let heat_rate = site.heat_rate_kj_per_kwh;
            let year = super::operation::year_from(conds, &site.points);
            let ledger_error = |e: crate::finance::FinanceError| PointError::Ledger {
                candidate: candidate.id.clone(),
                message: e.to_string(),
            };
            let (inputs, settlement) = contract_inputs(
                scenario,
                candidate,
                fuel,
                site.rated_heat_rate_kj_per_kwh,
                (&year, site.capacity_output_kw),
                &reference,
            )
            .map_err(ledger_error)?;
            let inputs = inputs.to_f64();
            let summary = match &ws.ledgers[i] {
                Some((last, summary)) if *last == inputs => *summary,
                _ => {
                    let summary = summarize_ledger(&inputs).map_err(ledger_error)?;
                    ws.ledgers[i] = Some((inputs, summary));
                    summary
                }
            };
            ws.summaries[i] = Some(summary);
            out[i] = Figures {
                heat_rate_kj_per_kwh: heat_rate,
                lifecycle_cost: summary.lifecycle_cost,
                versus_baseline: None,
                damages: settlement.map_or(0.0, |s| s.damages.to_f64().unwrap_or(f64::INFINITY)),
                shortfall_beyond_tolerance: settlement.is_some_and(|s| {
                    s.beyond_tolerance
                        && (s.heat_rate_shortfall_percent > 0.0 || s.output_shortfall_percent > 0.0)
                }),
            };
        }
        let Some(base) = ws.summaries[self.baseline] else {
            return Ok(());
        };
        for (i, candidate) in scenario.candidates.iter().enumerate() {
            if i == self.baseline || !self.evaluated[i] {
                continue;
            }
            if let Some(summary) = &ws.summaries[i] {
                let savings =
                    compare_summaries(summary, &base).map_err(|e| PointError::Ledger {
                        candidate: candidate.id.clone(),
                        message: e.to_string(),
                    })?;
                out[i].versus_baseline = Some(Versus {
                    net_savings: savings.net_savings,
                    break_even_premium: savings.break_even_premium,
                    premium_asked: savings.premium_asked,
                });
            }
        }
        Ok(())
    }
}
