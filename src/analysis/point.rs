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
//! solve would give; a sample that moves only a component efficiency is
//! solved by the route below; one that moves the cooling, the site's
//! ambient or humidity re-solves the machine in full.
//! Likewise a candidate's ledger is summed again only when its ledger
//! inputs differ from the last ones (a sweep of one bid's figure leaves the
//! baseline's ledger as it was).
//!
//! # Routes for a sample that moves a candidate's engine
//!
//! A full re-solve ([`Route::Exact`]) calibrates the machine again at its
//! rating and solves it at the site and at each dispatch load: tens of
//! microseconds per candidate, and with an hourly year many off-design
//! points. The default route ([`Route::Scaled`]) solves each candidate's
//! site year once, at the file's values ([`PointModel::new`]); a point
//! whose only physics change is the candidate's engine description
//! (component efficiencies, losses, regenerator, pressure ratio, firing
//! temperature, size) calibrates the machine again (one design solve) and
//! solves it at base load at two ambients only:
//!
//! - at the base year's energy-weighted mean ambient: the year's energy
//!   scales with the output ratio there and its fuel with output × heat
//!   rate ratio (the hours stay; each condition keeps the base machine's
//!   shape over temperature and load);
//! - at `economics.capacity_temperature`, when given: the capacity
//!   credited is that solve's own output (without it, the site output
//!   scaled by the ratio above);
//! - the site's base-load output and heat rate (at its annual mean) scale
//!   with the rating point's ratios; the rating-point heat rate (what a
//!   guarantee defaults to) is the new calibration's own, exact.
//!
//! What it leaves out is how the shape of the year over temperature and
//! load changes with the engine's components: second order for the small
//! moves of a risk run. Any other physics change (site ambient,
//! humidity, weather, fuel, rating, control, cooling, gas model, dispatch,
//! vendor curves) is solved in full on either route. The error
//! against `Route::Exact` is measured in `tests/risk_route.rs` and
//! recorded in DEVELOPERS.md.

mod restore;

use super::acceptance::contract_inputs;
use super::engine::{detail_of, engine_config_of, fuel_of, gas_model_of};
use super::evaluate::output_reference_from;
use super::machine::machine_of;
use super::operation::{year_from, AnnualOperation, Condition};
use super::site::{fixed_machine_site, rated_site, Basis, SiteModel, SitePerformance};
use crate::cycle::{self, EngineConfig, GasModel};
use crate::finance::{compare_summaries, summarize_ledger, LedgerInputs, LedgerSummary};
use crate::fuel::Fuel;
use crate::offdesign::Ambient;
use crate::scenario::{
    AmbientCorrectionSpec, Candidate, ControlSpec, PartLoadPoint, RatingCondition, Scenario,
};
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

/// How a point that moves a candidate's engine description is solved.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Route {
    /// The rating point alone is re-solved and the base site figures are
    /// scaled by its ratios (see the module documentation).
    #[default]
    Scaled,
    /// The machine is calibrated again and solved at the site and every
    /// dispatch load, for every point.
    Exact,
}

impl Route {
    /// One line for a command's notes: how component changes were solved.
    pub fn note(self) -> &'static str {
        match self {
            Route::Scaled => {
                "Route: a draw that moves a bid's engine (efficiencies, regenerator) recalibrates \
                 it and scales its year, solved once at the file's values, by its base-load \
                 ratios at the year's energy-weighted mean ambient, capacity solved at the \
                 capacity temperature (largest error measured against --exact on the two demos: \
                 0.012\u{a0}%, 2\u{a0}000 samples); --exact re-solves every machine in full"
            }
            Route::Exact => {
                "Route: exact (every draw that moves a bid's engine re-calibrates its machine \
                 and solves it at the site and every dispatch load)"
            }
        }
    }
}

/// A candidate's exact site performance at the file's values and the
/// physics it was solved from: what [`Route::Scaled`] scales.
#[derive(Debug, Clone)]
struct BaseSite {
    cached: CachedCycle,
    /// The base machine's rated output, kW, and heat rate, kJ/kWh.
    rated: (f64, f64),
    /// The year's energy-weighted mean ambient, where a point's machine is
    /// solved at base load to scale the base year.
    representative: Ambient,
    /// The base machine's (output kW, heat rate kJ/kWh) there, as priced.
    representative_figures: (f64, f64),
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
    route: Route,
    bases: Vec<Option<BaseSite>>,
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
    ambient_correction: Vec<AmbientCorrectionSpec>,
    site: SitePerformance,
    /// The site's year at the file's own hours per year (a point scales
    /// it by its hours).
    year: Option<AnnualOperation>,
    /// On the scaled route, the (output, heat-rate) ratios `site.points`
    /// still await (they are the base's, shared): applied to the year in
    /// O(1), and to the points only where hourly prices need them.
    pending_scale: Option<(f64, f64)>,
}

impl CachedCycle {
    /// Whether this solve holds for `candidate` in `scenario` (engine
    /// `config`, `detail`, `gas`, and the scenario's own fuel).
    fn holds(
        &self,
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
            && self.part_load == candidate.part_load
            && self.ambient_correction == candidate.ambient_correction
            && self.year_key == *year
    }
}

impl CachedCycle {
    /// Whether a point with these physics inputs differs from this base
    /// solve in the engine description alone, at the same ambient (so the
    /// scaled route applies).
    fn same_but_engine(
        &self,
        candidate: &Candidate,
        (config, detail, gas): (&EngineConfig, &cycle::Detail, &GasModel),
        fuel_is_base: bool,
        year: &YearKey,
    ) -> bool {
        fuel_is_base
            && self.fuel_is_base
            && self.config.ambient_temperature_k == config.ambient_temperature_k
            && self.config.ambient_pressure_kpa == config.ambient_pressure_kpa
            && self.detail == *detail
            && self.gas == *gas
            && self.rating == candidate.rating
            && self.control == candidate.control
            && self.part_load == candidate.part_load
            && self.ambient_correction == candidate.ambient_correction
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
    /// The year's conditions at the file's own operation, with the key of
    /// the year they were built for.
    conditions: Option<(YearKey, Vec<Condition>)>,
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
            route: Route::default(),
            bases: Vec::new(),
        }
        .with_route(Route::default())
    }

    /// The same model solving points by `route`. [`Route::Scaled`] solves
    /// every candidate's site once here, at the file's values (a candidate
    /// whose base solve fails, or that is kept at its rating, is then
    /// solved in full at every point).
    pub fn with_route(mut self, route: Route) -> PointModel<'s> {
        self.route = route;
        self.bases = match route {
            Route::Exact => Vec::new(),
            Route::Scaled => self
                .base
                .candidates
                .iter()
                .map(|candidate| base_site(self.base, candidate, &self.base_fuel))
                .collect(),
        };
        self
    }

    /// How points that move a candidate's engine are solved.
    pub fn route(&self) -> Route {
        self.route
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
            let hit = ws.cycles[i]
                .as_ref()
                .is_some_and(|c| c.holds(candidate, (&config, &detail, &gas), fuel_is_base, &year));
            if hit {
                continue;
            }
            let scaled = match (self.route, self.bases.get(i).and_then(Option::as_ref)) {
                (Route::Scaled, Some(base))
                    if base.cached.same_but_engine(
                        candidate,
                        (&config, &detail, &gas),
                        fuel_is_base,
                        &year,
                    ) =>
                {
                    Some(base)
                }
                _ => None,
            };
            ws.cycles[i] = Some(match scaled {
                Some(base) if base.cached.config == config => base.cached.clone(),
                Some(base) => scaled_cycle(base, candidate, scenario, fuel, config)?,
                None => exact_cycle(
                    scenario,
                    candidate,
                    fuel,
                    (config, detail, gas),
                    (fuel_is_base, year.clone()),
                )?,
            });
        }
        // A year is linear in its hours per year (every profile hour,
        // dispatch block or spread hour scales alike, and the hours key is
        // the only one that moves them): each candidate's year is summed
        // once over the conditions at the file's own operation and scaled
        // by the point's hours, so a point's year depends on its values
        // alone. The conditions (an hourly year has thousands) are built
        // only when a year must be summed or hourly prices need them.
        let scale = scenario.operation.hours_per_year / self.base.operation.hours_per_year;
        let priced = scenario
            .operation
            .profile
            .as_ref()
            .is_some_and(|p| p.has_prices());
        let needs_conditions = priced || ws.cycles.iter().flatten().any(|c| c.year.is_none());
        if needs_conditions && !ws.conditions.as_ref().is_some_and(|c| c.0 == year) {
            ws.conditions = Some((
                year.clone(),
                super::operation::conditions_of(&scenario.site, &self.base.operation),
            ));
        }
        let conds: &[Condition] = ws
            .conditions
            .as_ref()
            .filter(|c| c.0 == year)
            .map_or(&[], |c| c.1.as_slice());
        for cached in ws.cycles.iter_mut().flatten() {
            if cached.year.is_none() {
                let (o, r) = cached.pending_scale.unwrap_or((1.0, 1.0));
                cached.year = Some(year_from(conds, &cached.site.points).scaled(1.0, o, o * r));
            }
            if priced {
                if let Some((o, r)) = cached.pending_scale.take() {
                    cached.site.points = std::sync::Arc::new(
                        cached
                            .site
                            .points
                            .iter()
                            .map(|p| super::operation::ConditionPerformance {
                                available_kw: p.available_kw * o,
                                heat_rate_kj_per_kwh: p.heat_rate_kj_per_kwh * r,
                            })
                            .collect(),
                    );
                }
            }
        }
        let at_hours = |y: AnnualOperation| y.scaled(scale, scale, scale);
        // Hourly shortfall prices are ratios of energies over the same
        // conditions: the hours' scale cancels.
        let reference = output_reference_from(
            scenario,
            conds,
            ws.cycles.iter().map(|c| {
                c.as_ref()
                    .map(|c| (&c.site, c.year.map_or(0.0, |y| at_hours(y).energy_mwh)))
            }),
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
            let Some(year) = cached.year.map(at_hours) else {
                continue;
            };
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

fn cycle_error(candidate: &Candidate, message: String) -> PointError {
    PointError::Cycle {
        candidate: candidate.id.clone(),
        message,
    }
}

/// The full solve: the machine calibrated at its rating and solved at the
/// site and every dispatch load (or, for a candidate the fixed-machine
/// model refuses, its design solve at the site).
fn exact_cycle(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
    (config, detail, gas): (EngineConfig, cycle::Detail, GasModel),
    (fuel_is_base, year_key): (bool, YearKey),
) -> Result<CachedCycle, PointError> {
    // The machine's calibration is its own design solve: the design
    // cycle at the site is solved only for a candidate kept at its
    // rating.
    let site = match fixed_machine_site(scenario, candidate, fuel)
        .map_err(|e| cycle_error(candidate, e.to_string()))?
    {
        Ok(site) => site,
        Err(reason) => {
            let solved = cycle::solve_detailed(&config, &detail, &gas, fuel)
                .map_err(|e| cycle_error(candidate, e.to_string()))?;
            rated_site(scenario, candidate, solved.heat_rate_kj_per_kwh, reason)
        }
    };
    Ok(CachedCycle {
        config,
        detail,
        gas,
        fuel_is_base,
        rating: candidate.rating,
        control: candidate.control,
        year_key,
        part_load: candidate.part_load.clone(),
        ambient_correction: candidate.ambient_correction.clone(),
        site,
        year: None,
        pending_scale: None,
    })
}

/// A candidate's exact site at the file's values and its rating point, for
/// [`Route::Scaled`]; `None` when it cannot be solved or is not a fixed
/// machine (those are solved in full at every point).
fn base_site(scenario: &Scenario, candidate: &Candidate, fuel: &Fuel) -> Option<BaseSite> {
    let physics = (
        engine_config_of(candidate, &scenario.site),
        detail_of(candidate, &scenario.site),
        gas_model_of(&candidate.gas_model),
    );
    let mut cached = exact_cycle(
        scenario,
        candidate,
        fuel,
        physics,
        (true, year_key(scenario)),
    )
    .ok()?;
    if !matches!(cached.site.basis, Basis::Machine(_)) {
        return None;
    }
    let conditions = super::operation::conditions(scenario);
    cached.year = Some(year_from(&conditions, &cached.site.points));
    let machine = machine_of(candidate, &scenario.site, fuel).ok()?;
    let rating = machine.rating_point();
    let rated_output_kw = rating.flows.map(|f| f.net_output_kw)?;
    let rated_heat_rate_kj_per_kwh = rating.heat_rate_kj_per_kwh;
    let usable = |v: f64| v.is_finite() && v > 0.0;
    if !usable(rated_output_kw) || !usable(rated_heat_rate_kj_per_kwh) {
        return None;
    }
    // The energy-weighted mean ambient of the year (the site's own when the
    // year makes no energy).
    let (mut weight, mut t, mut rh) = (0.0, 0.0, 0.0);
    for (c, p) in conditions.iter().zip(cached.site.points.iter()) {
        let e = c.load_fraction * p.available_kw * c.hours;
        weight += e;
        t += e * c.temperature_k;
        rh += e * c.relative_humidity;
    }
    let site_ambient = super::machine::site_ambient(candidate, &scenario.site);
    let representative = if weight > 0.0 {
        Ambient {
            temperature_k: t / weight,
            pressure_kpa: site_ambient.pressure_kpa,
            relative_humidity: super::machine::humidity_for(candidate, rh / weight),
        }
    } else {
        site_ambient
    };
    let model = SiteModel::machine(machine, candidate);
    let representative_figures = model.base_at(representative).ok()?;
    if !usable(representative_figures.0) || !usable(representative_figures.1) {
        return None;
    }
    Some(BaseSite {
        rated: (rated_output_kw, rated_heat_rate_kj_per_kwh),
        representative,
        representative_figures,
        cached,
    })
}

/// [`Route::Scaled`]: the candidate's machine with engine `config`
/// calibrated at its rating (one design solve), its site figures the base
/// site's scaled by the rating ratios.
fn scaled_cycle(
    base: &BaseSite,
    candidate: &Candidate,
    scenario: &Scenario,
    fuel: &Fuel,
    config: EngineConfig,
) -> Result<CachedCycle, PointError> {
    let machine = machine_of(candidate, &scenario.site, fuel)
        .map_err(|e| cycle_error(candidate, e.to_string()))?;
    let rating = machine.rating_point();
    let rated_heat_rate_kj_per_kwh = rating.heat_rate_kj_per_kwh;
    let rated_output_kw = rating
        .flows
        .map(|f| f.net_output_kw)
        .ok_or_else(|| cycle_error(candidate, "the rating point was not sized".into()))?;
    let base_site = &base.cached.site;
    let rating_ratios = (
        rated_output_kw / base.rated.0,
        rated_heat_rate_kj_per_kwh / base.rated.1,
    );
    // A bid priced by its vendor's ambient correction: its output and heat
    // rate at any temperature are its rated figures times the vendor's
    // ratios (times the machine's small pressure and humidity step), so
    // the rating's ratios carry over with no solve.
    if !candidate.ambient_correction.is_empty() {
        let (o, r) = rating_ratios;
        return Ok(scaled_from(
            base,
            config,
            (rated_heat_rate_kj_per_kwh, rating_ratios),
            base_site.capacity_output_kw * o,
            (o, r),
        ));
    }
    let model = SiteModel::machine(machine, candidate);
    let (kw, hr) = model
        .base_at(base.representative)
        .map_err(|e| cycle_error(candidate, e.to_string()))?;
    let year_ratios = (
        kw / base.representative_figures.0,
        hr / base.representative_figures.1,
    );
    // The capacity credited is solved where it is credited.
    let capacity_output_kw = match scenario.economics.capacity_temperature_k {
        Some(t) => {
            model
                .base_at(Ambient {
                    temperature_k: t,
                    ..super::machine::site_ambient(candidate, &scenario.site)
                })
                .map_err(|e| cycle_error(candidate, e.to_string()))?
                .0
        }
        None => base_site.capacity_output_kw * year_ratios.0,
    };
    Ok(scaled_from(
        base,
        config,
        (rated_heat_rate_kj_per_kwh, rating_ratios),
        capacity_output_kw,
        year_ratios,
    ))
}

/// The base's site and year scaled: the site's base-load figures by the
/// rating's ratios, the year's energy by `output_ratio` and its fuel by
/// `output_ratio × heat_rate_ratio` (hours unchanged), with the new rated
/// heat rate and capacity.
fn scaled_from(
    base: &BaseSite,
    config: EngineConfig,
    (rated_heat_rate_kj_per_kwh, (rated_output_ratio, rated_heat_rate_ratio)): (f64, (f64, f64)),
    capacity_output_kw: f64,
    (output_ratio, heat_rate_ratio): (f64, f64),
) -> CachedCycle {
    let base_site = &base.cached.site;
    let site = SitePerformance {
        // The site's own figures (at its annual-mean ambient) follow the
        // rating's ratios; the year follows the representative point's.
        net_output_kw: base_site.net_output_kw * rated_output_ratio,
        heat_rate_kj_per_kwh: base_site.heat_rate_kj_per_kwh * rated_heat_rate_ratio,
        rated_heat_rate_kj_per_kwh,
        capacity_output_kw,
        // The base's points, shared; the ratios wait in `pending_scale`.
        points: base_site.points.clone(),
        basis: base_site.basis.clone(),
    };
    // energy = Σ l·P·h scales with the output; fuel = Σ l·P·h·HR with
    // output × heat rate; the hours stay.
    let year = base
        .cached
        .year
        .map(|y| y.scaled(1.0, output_ratio, output_ratio * heat_rate_ratio));
    CachedCycle {
        config,
        site,
        year,
        pending_scale: Some((output_ratio, heat_rate_ratio)),
        ..base.cached.clone()
    }
}
