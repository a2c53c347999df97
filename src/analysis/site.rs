//! What each candidate makes at the site over its year: its fixed machine
//! ([`super::machine::machine_of`]) solved at the site's reference ambient
//! (base load: the site figures), at the capacity temperature, and at
//! every operating condition of the year ([`super::operation::conditions`]).
//! This is what `compare`, `report`, `sweep` and `risk` price.
//!
//! - One function gives a candidate's performance at any ambient and load:
//!   [`SiteModel::performance_at`] (base-load output available there and
//!   the heat rate at that load), vendor curves included.
//! - A candidate's vendor curves (`ambient_correction`, `part_load`) price
//!   base load and part load where it states them; the rule is
//!   [`super::vendor`]'s. Without them, the machine's own physics.
//! - The year: when the conditions hold at most [`EXACT_CONDITIONS`]
//!   distinct (temperature, humidity, load) triples (dispatch blocks,
//!   monthly bins) each is solved exactly. Otherwise (an hourly year) the
//!   machine is solved on a grid and interpolated ([`YearGrid`]):
//!   base load on temperatures every [`GRID_STEP_K`] K (or less) over the
//!   year's range × humidity at the year's lowest and highest, bilinear;
//!   the part-load heat-rate ratio on temperatures every
//!   [`GRID_RATIO_STEP_K`] K × loads, at the part-load hours' mean
//!   humidity, bilinear in (temperature, load). The error against exact
//!   solves is measured in `tests/site_year.rs`.
//! - Intercooled and reheat candidates, which the fixed-machine model does
//!   not cover, keep their rated output and the design-point heat rate at
//!   the site at every ambient (the "rubber engine"), with an information
//!   note.

use super::machine::{humidity_for, machine_of, site_ambient};
use super::operation::{conditions, Condition, ConditionPerformance};
use super::vendor::{self, Figures};
use crate::cycle::CycleResult;
use crate::fuel::Fuel;
use crate::offdesign::{Ambient, Load, Machine, OffDesignError, OffDesignPoint};
use crate::scenario::{Candidate, Scenario};
use std::sync::Arc;

/// At most this many distinct conditions are each solved exactly; more
/// (an hourly year) go through [`YearGrid`].
pub const EXACT_CONDITIONS: usize = 64;

/// Temperature spacing of the year grid, K (at most; the range is split
/// evenly).
pub const GRID_STEP_K: f64 = 5.0;

/// Temperature spacing of the part-load ratio grid, K (at most): the
/// ratio changes more slowly with ambient than the base load does.
pub const GRID_RATIO_STEP_K: f64 = 10.0;

/// Load spacing of the year grid when the year has more than
/// [`GRID_EXACT_LOADS`] distinct part loads (fraction).
pub const GRID_LOAD_STEP: f64 = 0.05;

/// Up to this many distinct part loads are grid nodes themselves.
pub const GRID_EXACT_LOADS: usize = 12;

/// How a candidate's site performance was found.
#[derive(Debug, Clone, PartialEq)]
pub enum Basis {
    /// Its fixed machine at the site's ambient.
    Machine(Box<OffDesignPoint>),
    /// Its rated output and the design-point heat rate at the site, because
    /// the fixed-machine model refuses it (the reason).
    Rated(String),
}

/// A candidate's performance at the site, as priced.
#[derive(Debug, Clone, PartialEq)]
pub struct SitePerformance {
    /// Base-load net output at the site, kW.
    pub net_output_kw: f64,
    /// Base-load net heat rate at the site, kJ (LHV) per kWh.
    pub heat_rate_kj_per_kwh: f64,
    /// Net heat rate at the rating condition, kJ (LHV) per kWh: what a
    /// guarantee defaults to (the acceptance test corrects to the rating).
    pub rated_heat_rate_kj_per_kwh: f64,
    /// Base-load net output at the capacity temperature
    /// (`economics.capacity_temperature`; without it, `net_output_kw`), kW:
    /// the capacity credited.
    pub capacity_output_kw: f64,
    /// Performance in each operating condition of the year, in the order
    /// of [`super::operation::conditions`] of the scenario it was solved
    /// for.
    pub points: Arc<Vec<ConditionPerformance>>,
    /// Where the figures come from.
    pub basis: Basis,
}

/// The key a site refusal is reported at, relative to the candidate, and
/// the message.
#[derive(Debug, Clone, PartialEq)]
pub struct SiteError {
    /// Candidate id.
    pub candidate: String,
    /// The off-design refusal.
    pub error: Box<OffDesignError>,
    /// The dispatch load (fraction) being solved, if a part-load point.
    pub load: Option<f64>,
}

impl std::fmt::Display for SiteError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self.load {
            Some(load) => write!(
                f,
                "candidate `{}` at the site, dispatch load {:.1} %: {}",
                self.candidate,
                load * 100.0,
                self.error
            ),
            None => write!(
                f,
                "candidate `{}` at the site: {}",
                self.candidate, self.error
            ),
        }
    }
}

/// Whether the fixed-machine model refuses a candidate for its
/// arrangement (intercooler or reheat), not for its values.
fn arrangement_refused(e: &OffDesignError) -> bool {
    matches!(
        e,
        OffDesignError::Invalid { field, .. } if *field == "intercooler" || *field == "reheat"
    )
}

/// A candidate's performance at any ambient and load: the one function
/// the year is built from.
#[derive(Debug)]
pub enum SiteModel<'a> {
    /// Its fixed machine, priced by its vendor curves where it states them
    /// ([`super::vendor`]), by the machine's physics otherwise.
    Machine {
        /// The calibrated machine.
        machine: Box<Machine>,
        /// The candidate (its vendor curves).
        candidate: &'a Candidate,
        /// The machine's base load at the rating, once solved: a vendor's
        /// ambient correction multiplies it at every ambient.
        rated: std::cell::OnceCell<Figures>,
    },
    /// Its rated output and design-point heat rate at every ambient, part
    /// load from its vendor's part-load curve (none: base-load heat rate).
    Rated {
        /// Rated net output, kW.
        net_output_kw: f64,
        /// Design-point heat rate at the site, kJ/kWh.
        heat_rate_kj_per_kwh: f64,
        /// The candidate (its part-load curve).
        candidate: &'a Candidate,
    },
}

/// The machine's own figures at an ambient and a load (fraction of base
/// load there).
fn physics(machine: &Machine, at: Ambient, load: f64) -> Result<Figures, OffDesignError> {
    machine.solve(at, Load(load.min(1.0))).map(|p| Figures {
        net_output_kw: p.net_output_kw,
        heat_rate_kj_per_kwh: p.heat_rate_kj_per_kwh,
    })
}

impl<'a> SiteModel<'a> {
    /// `candidate`'s fixed `machine`, priced with its vendor curves.
    pub fn machine(machine: Machine, candidate: &'a Candidate) -> SiteModel<'a> {
        SiteModel::Machine {
            machine: Box::new(machine),
            candidate,
            rated: std::cell::OnceCell::new(),
        }
    }

    /// Base-load net output (kW) and heat rate (kJ/kWh) at `ambient`.
    pub fn base_at(&self, ambient: Ambient) -> Result<(f64, f64), OffDesignError> {
        match self {
            SiteModel::Machine {
                machine,
                candidate,
                rated,
            } => {
                let rating = super::machine::rating_of(candidate);
                let f = vendor::base_at(candidate, ambient, &|at, load| {
                    if at != rating || load < 1.0 {
                        return physics(machine, at, load);
                    }
                    if let Some(f) = rated.get() {
                        return Ok(*f);
                    }
                    let f = physics(machine, at, load)?;
                    Ok(*rated.get_or_init(|| f))
                })?;
                Ok((f.net_output_kw, f.heat_rate_kj_per_kwh))
            }
            SiteModel::Rated {
                net_output_kw,
                heat_rate_kj_per_kwh,
                ..
            } => Ok((*net_output_kw, *heat_rate_kj_per_kwh)),
        }
    }

    /// Heat rate at `load` over the base-load heat rate at `ambient`;
    /// `base_heat_rate` is that base-load heat rate as priced (used as the
    /// machine's own when no vendor curve is involved, to save a solve).
    pub fn heat_rate_ratio_at(
        &self,
        ambient: Ambient,
        load: f64,
        base_heat_rate: f64,
    ) -> Result<f64, OffDesignError> {
        if load >= 1.0 {
            return Ok(1.0);
        }
        match self {
            SiteModel::Machine {
                machine, candidate, ..
            } if candidate.part_load.is_empty() && candidate.ambient_correction.is_empty() => {
                machine
                    .solve(ambient, Load(load))
                    .map(|p| p.heat_rate_kj_per_kwh / base_heat_rate)
            }
            SiteModel::Machine {
                machine, candidate, ..
            } => {
                vendor::part_load_ratio(candidate, ambient, load, &|at, l| physics(machine, at, l))
            }
            SiteModel::Rated { candidate, .. } => {
                let lowest = candidate
                    .part_load
                    .first()
                    .map_or(1.0, |p| p.heat_rate_ratio);
                Ok(vendor::curve_part_load_ratio(&candidate.part_load, load).unwrap_or(lowest))
            }
        }
    }

    /// Performance at `ambient` and `load` (fraction of the base load
    /// there): the base-load output available and the heat rate at that
    /// load.
    pub fn performance_at(
        &self,
        ambient: Ambient,
        load: f64,
    ) -> Result<ConditionPerformance, OffDesignError> {
        let (available_kw, base_hr) = self.base_at(ambient)?;
        let ratio = self.heat_rate_ratio_at(ambient, load, base_hr)?;
        Ok(ConditionPerformance {
            available_kw,
            heat_rate_kj_per_kwh: base_hr * ratio,
        })
    }

    /// Whether a point costs no solve (no grid needed).
    fn is_closed_form(&self) -> bool {
        match self {
            SiteModel::Rated { .. } => true,
            SiteModel::Machine { .. } => false,
        }
    }
}

/// A refusal in one condition: the off-design error and the load.
type PointError = (OffDesignError, Option<f64>);

/// The ambient of a condition for `candidate` (dry for a cold-air one).
fn ambient_of(candidate: &Candidate, pressure_kpa: f64, c: &Condition) -> Ambient {
    Ambient {
        temperature_k: c.temperature_k,
        pressure_kpa,
        relative_humidity: humidity_for(candidate, c.relative_humidity),
    }
}

/// Each condition solved exactly (equal conditions once).
pub fn exact_points(
    model: &SiteModel,
    candidate: &Candidate,
    pressure_kpa: f64,
    conditions: &[Condition],
) -> Result<Vec<ConditionPerformance>, PointError> {
    let mut done: Vec<((u64, u64, u64), ConditionPerformance)> = Vec::new();
    let mut out = Vec::with_capacity(conditions.len());
    for c in conditions {
        let key = (
            c.temperature_k.to_bits(),
            c.relative_humidity.to_bits(),
            c.load_fraction.to_bits(),
        );
        if let Some((_, p)) = done.iter().find(|(k, _)| *k == key) {
            out.push(*p);
            continue;
        }
        let load = (c.load_fraction < 1.0).then_some(c.load_fraction);
        let p = model
            .performance_at(ambient_of(candidate, pressure_kpa, c), c.load_fraction)
            .map_err(|e| (e, load))?;
        done.push((key, p));
        out.push(p);
    }
    Ok(out)
}

/// Evenly spaced nodes from `low` to `high`, at most `step` apart (one
/// node when the range is empty).
fn nodes(low: f64, high: f64, step: f64) -> Vec<f64> {
    if high - low <= 1e-9 {
        return vec![low];
    }
    let n = ((high - low) / step).ceil().max(1.0) as usize;
    (0..=n)
        .map(|i| low + (high - low) * i as f64 / n as f64)
        .collect()
}

/// Index of the cell holding `x` in sorted `nodes` and the fraction across
/// it (clamped to the ends).
fn cell(nodes: &[f64], x: f64) -> (usize, f64) {
    if nodes.len() < 2 {
        return (0, 0.0);
    }
    let i = nodes
        .partition_point(|&n| n <= x)
        .saturating_sub(1)
        .min(nodes.len() - 2);
    let t = ((x - nodes[i]) / (nodes[i + 1] - nodes[i])).clamp(0.0, 1.0);
    (i, t)
}

/// Bilinear interpolation in a row-major table `values[i * cols + j]`.
fn bilinear(values: &[f64], cols: usize, (i, ti): (usize, f64), (j, tj): (usize, f64)) -> f64 {
    let at = |a: usize, b: usize| {
        let a = a.min(values.len() / cols.max(1) - 1);
        let b = b.min(cols - 1);
        values[a * cols + b]
    };
    let (i1, j1) = (
        if ti > 0.0 { i + 1 } else { i },
        if tj > 0.0 { j + 1 } else { j },
    );
    let top = at(i, j) * (1.0 - tj) + at(i, j1) * tj;
    let bottom = at(i1, j) * (1.0 - tj) + at(i1, j1) * tj;
    top * (1.0 - ti) + bottom * ti
}

/// A candidate solved on a grid over the year's conditions: base-load
/// output and heat rate on temperature × humidity, the part-load
/// heat-rate ratio on temperature × load.
#[derive(Debug, Clone, PartialEq)]
pub struct YearGrid {
    /// Temperature nodes of the base-load table, K.
    pub temperatures_k: Vec<f64>,
    /// Temperature nodes of the part-load ratio table, K.
    pub ratio_temperatures_k: Vec<f64>,
    /// Humidity nodes (fraction).
    pub humidities: Vec<f64>,
    /// Load nodes (fraction, ascending, ending at 1).
    pub loads: Vec<f64>,
    base_kw: Vec<f64>,
    base_hr: Vec<f64>,
    ratio: Vec<f64>,
    /// Machine solves the grid took.
    pub solves: usize,
}

impl YearGrid {
    /// Solve `model` on the grid spanning `conditions`.
    pub fn build(
        model: &SiteModel,
        candidate: &Candidate,
        pressure_kpa: f64,
        conditions: &[Condition],
    ) -> Result<YearGrid, PointError> {
        let fold = |f: fn(f64, f64) -> f64, init: f64, g: fn(&Condition) -> f64| {
            conditions.iter().map(g).fold(init, f)
        };
        let t_low = fold(f64::min, f64::INFINITY, |c| c.temperature_k);
        let t_high = fold(f64::max, f64::NEG_INFINITY, |c| c.temperature_k);
        let t_nodes = nodes(t_low, t_high, GRID_STEP_K);
        let r_nodes = nodes(t_low, t_high, GRID_RATIO_STEP_K);
        let rh_low = fold(f64::min, f64::INFINITY, |c| c.relative_humidity);
        let rh_high = fold(f64::max, f64::NEG_INFINITY, |c| c.relative_humidity);
        let rh_nodes = nodes(rh_low, rh_high, f64::INFINITY);
        let mut part: Vec<f64> = conditions
            .iter()
            .map(|c| c.load_fraction)
            .filter(|&l| l < 1.0)
            .collect();
        part.sort_by(f64::total_cmp);
        part.dedup();
        let mut loads = if part.len() <= GRID_EXACT_LOADS {
            part.clone()
        } else {
            nodes(part[0], 1.0, GRID_LOAD_STEP)
        };
        if loads.last().is_none_or(|&l| l < 1.0) {
            loads.push(1.0);
        }
        let (hours, rh_sum) = conditions
            .iter()
            .filter(|c| c.load_fraction < 1.0)
            .fold((0.0, 0.0), |(h, s), c| {
                (h + c.hours, s + c.hours * c.relative_humidity)
            });
        let rh_part = if hours > 0.0 { rh_sum / hours } else { rh_low };
        let mut solves = 0;
        let mut base_kw = Vec::with_capacity(t_nodes.len() * rh_nodes.len());
        let mut base_hr = Vec::with_capacity(base_kw.capacity());
        let ambient = |t: f64, rh: f64| Ambient {
            temperature_k: t,
            pressure_kpa,
            relative_humidity: humidity_for(candidate, rh),
        };
        for &t in &t_nodes {
            for &rh in &rh_nodes {
                let (kw, hr) = model.base_at(ambient(t, rh)).map_err(|e| (e, None))?;
                solves += 1;
                base_kw.push(kw);
                base_hr.push(hr);
            }
        }
        let mut ratio = Vec::with_capacity(r_nodes.len() * loads.len());
        for &t in &r_nodes {
            let a = ambient(t, rh_part);
            let needs_base = loads.iter().any(|&l| l < 1.0);
            let base = if needs_base {
                solves += 1;
                model.base_at(a).map_err(|e| (e, None))?.1
            } else {
                f64::NAN
            };
            for &l in &loads {
                if l < 1.0 {
                    solves += 1;
                }
                ratio.push(
                    model
                        .heat_rate_ratio_at(a, l, base)
                        .map_err(|e| (e, Some(l)))?,
                );
            }
        }
        Ok(YearGrid {
            temperatures_k: t_nodes,
            ratio_temperatures_k: r_nodes,
            humidities: rh_nodes,
            loads,
            base_kw,
            base_hr,
            ratio,
            solves,
        })
    }

    /// The interpolated performance in condition `c`.
    pub fn at(&self, c: &Condition) -> ConditionPerformance {
        let ct = cell(&self.temperatures_k, c.temperature_k);
        let ch = cell(&self.humidities, c.relative_humidity);
        let cl = cell(&self.loads, c.load_fraction);
        let cols = self.humidities.len();
        let kw = bilinear(&self.base_kw, cols, ct, ch);
        let hr = bilinear(&self.base_hr, cols, ct, ch);
        let ratio = if c.load_fraction >= 1.0 {
            1.0
        } else {
            let cr = cell(&self.ratio_temperatures_k, c.temperature_k);
            bilinear(&self.ratio, self.loads.len(), cr, cl)
        };
        ConditionPerformance {
            available_kw: kw,
            heat_rate_kj_per_kwh: hr * ratio,
        }
    }
}

/// How many distinct (temperature, humidity, load) conditions there are.
fn distinct(conditions: &[Condition]) -> usize {
    let mut keys: Vec<(u64, u64, u64)> = conditions
        .iter()
        .map(|c| {
            (
                c.temperature_k.to_bits(),
                c.relative_humidity.to_bits(),
                c.load_fraction.to_bits(),
            )
        })
        .collect();
    keys.sort_unstable();
    keys.dedup();
    keys.len()
}

/// The performance of `model` in every condition: exact solves for few
/// distinct conditions (or a model without solves), the grid otherwise.
pub fn year_points(
    model: &SiteModel,
    candidate: &Candidate,
    pressure_kpa: f64,
    conditions: &[Condition],
) -> Result<Vec<ConditionPerformance>, PointError> {
    if model.is_closed_form() || distinct(conditions) <= EXACT_CONDITIONS {
        return exact_points(model, candidate, pressure_kpa, conditions);
    }
    let grid = YearGrid::build(model, candidate, pressure_kpa, conditions)?;
    Ok(conditions.iter().map(|c| grid.at(c)).collect())
}

/// A candidate's performance at the scenario's site. `rated` is its design
/// solve at the site (sized to the rated output), used for the candidates
/// the fixed-machine model refuses.
pub fn site_performance(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
    rated: &CycleResult,
) -> Result<SitePerformance, SiteError> {
    Ok(match fixed_machine_site(scenario, candidate, fuel)? {
        Ok(site) => site,
        Err(reason) => rated_site(scenario, candidate, rated.heat_rate_kj_per_kwh, reason),
    })
}

/// The site figures, capacity and year of `model`.
fn perform(
    scenario: &Scenario,
    candidate: &Candidate,
    model: &SiteModel,
    rated_heat_rate_kj_per_kwh: f64,
    base_point: OffDesignPoint,
) -> Result<SitePerformance, PointError> {
    let site = &scenario.site;
    let ambient = site_ambient(candidate, site);
    // The site figures as priced: the vendor's curves where the bid
    // states them (the machine's own point is kept in the basis).
    let base = model.base_at(ambient).map_err(|e| (e, None))?;
    let capacity_output_kw = match scenario.economics.capacity_temperature_k {
        Some(t) => {
            model
                .base_at(Ambient {
                    temperature_k: t,
                    ..ambient
                })
                .map_err(|e| (e, None))?
                .0
        }
        None => base.0,
    };
    let points = year_points(
        model,
        candidate,
        site.ambient_pressure_kpa,
        &conditions(scenario),
    )?;
    Ok(SitePerformance {
        net_output_kw: base.0,
        heat_rate_kj_per_kwh: base.1,
        rated_heat_rate_kj_per_kwh,
        capacity_output_kw,
        points: Arc::new(points),
        basis: Basis::Machine(Box::new(base_point)),
    })
}

/// The performance of a candidate the fixed-machine model refuses for its
/// arrangement (`reason`): its rated output, the design-point heat rate at
/// the site `rated_heat_rate_kj_per_kwh`, part load from its vendor's
/// curve (none: its base-load heat rate), at every ambient of the year.
pub fn rated_site(
    scenario: &Scenario,
    candidate: &Candidate,
    rated_heat_rate_kj_per_kwh: f64,
    reason: String,
) -> SitePerformance {
    let model = SiteModel::Rated {
        net_output_kw: candidate.net_output_kw,
        heat_rate_kj_per_kwh: rated_heat_rate_kj_per_kwh,
        candidate,
    };
    let points: Vec<ConditionPerformance> = conditions(scenario)
        .iter()
        .map(|c| ConditionPerformance {
            available_kw: candidate.net_output_kw,
            heat_rate_kj_per_kwh: rated_heat_rate_kj_per_kwh
                * model
                    .heat_rate_ratio_at(
                        site_ambient(candidate, &scenario.site),
                        c.load_fraction,
                        1.0,
                    )
                    .unwrap_or(1.0),
        })
        .collect();
    SitePerformance {
        net_output_kw: candidate.net_output_kw,
        heat_rate_kj_per_kwh: rated_heat_rate_kj_per_kwh,
        rated_heat_rate_kj_per_kwh,
        capacity_output_kw: candidate.net_output_kw,
        points: Arc::new(points),
        basis: Basis::Rated(reason),
    }
}

/// A candidate's fixed machine at the site and over its year:
/// `Ok(Ok(site))`; `Ok(Err(reason))` when the model refuses the
/// candidate's arrangement (intercooler, reheat: price it with
/// [`rated_site`]); `Err` when the machine cannot be built or cannot run
/// at the site, the capacity temperature or a condition of the year.
/// Needs no design solve at the site: the calibration at the rating is the
/// machine's own.
pub fn fixed_machine_site(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
) -> Result<Result<SitePerformance, String>, SiteError> {
    let located = |(error, load): PointError| SiteError {
        candidate: candidate.id.clone(),
        error: Box::new(error),
        load,
    };
    let machine = match machine_of(candidate, &scenario.site, fuel) {
        Ok(m) => m,
        Err(e) if arrangement_refused(&e) => return Ok(Err(e.to_string())),
        Err(e) => return Err(located((e, None))),
    };
    let rated = machine.rating_point().heat_rate_kj_per_kwh;
    let base = machine
        .solve(site_ambient(candidate, &scenario.site), Load::BASE)
        .map_err(|e| located((e, None)))?;
    let model = SiteModel::machine(machine, candidate);
    perform(scenario, candidate, &model, rated, base)
        .map(Ok)
        .map_err(located)
}

/// Information lines for `check` and the report: how the site performance
/// is priced (vendor curves or machine physics,
/// [`super::vendor::pricing_notes`]; candidates kept at their rating) and
/// each candidate's year.
pub fn pricing_notes(scenario: &Scenario, sites: &[SitePerformance]) -> Vec<String> {
    let mut notes = Vec::new();
    let conditions = conditions(scenario);
    let has_part_load = conditions.iter().any(|c| c.load_fraction < 1.0);
    notes.extend(year_notes(scenario, &conditions));
    let fixed: Vec<bool> = sites
        .iter()
        .map(|s| matches!(s.basis, Basis::Machine(_)))
        .collect();
    notes.extend(vendor::pricing_notes(scenario, &fixed, has_part_load));
    for (candidate, site) in scenario.candidates.iter().zip(sites) {
        let year = super::operation::year_from(&conditions, &site.points);
        let mean_heat_rate = if year.energy_mwh > 0.0 {
            year.fuel_energy_gj_lhv * 1000.0 / year.energy_mwh
        } else {
            0.0
        };
        let capacity_at = match scenario.economics.capacity_temperature_k {
            Some(t) => ambient_text(t),
            None => "the site's ambient".to_string(),
        };
        notes.push(format!(
            "candidate[{}]: its year at the site, new and clean: {:.1} run hours, {:.0} MWh, \
             {:.0} GJ ({:.0} MMBtu) fuel (LHV), mean heat rate {:.0} kJ/kWh ({:.0} Btu/kWh); \
             capacity credited {:.0} kW (base load at {capacity_at})",
            candidate.id,
            year.operating_hours,
            year.energy_mwh,
            year.fuel_energy_gj_lhv,
            year.fuel_energy_gj_lhv * MMBTU_PER_GJ,
            mean_heat_rate,
            mean_heat_rate * MMBTU_PER_GJ,
            site.capacity_output_kw,
        ));
        if let Basis::Rated(reason) = &site.basis {
            notes.push(format!(
                "candidate[{}]: priced at its rated output ({:.0} kW) and its design-point heat \
                 rate at the site, not as a fixed machine ({reason})",
                candidate.id, candidate.net_output_kw
            ));
        }
    }
    notes
}

/// How the year is built, for `check`: the weather and profile records and
/// how they scale to a year, how dispatch blocks spread over the weather,
/// whether the year is solved exactly or on the grid, and where capacity
/// is credited.
pub fn year_notes(scenario: &Scenario, conditions: &[Condition]) -> Vec<String> {
    let mut notes = Vec::new();
    let op = &scenario.operation;
    let weather = scenario.site.weather.as_deref();
    if let Some(w) = weather {
        let hours: f64 = w.records.iter().map(|r| r.hours).sum();
        let what = match &w.source {
            crate::scenario::WeatherSource::Hourly(file) => format!(
                "site.weather: {} hourly rows from {file}, each counted as 8760 / {} = {:.4} h",
                w.records.len(),
                w.records.len(),
                crate::scenario::HOURS_PER_YEAR / w.records.len().max(1) as f64
            ),
            crate::scenario::WeatherSource::Bins => {
                format!("site.weather: {} bins, {hours} h in all", w.records.len())
            }
        };
        notes.push(format!(
            "{what}; hour-weighted mean dry bulb {}",
            ambient_text(w.mean_temperature_k())
        ));
    }
    if let Some(p) = &op.profile {
        notes.push(format!(
            "operation.profile: {} rows from {}, {} with load above 0; each row counts 8760 / {} h, \
             so {:.1} run hours a year (energy and fuel scale alike){}",
            p.hours.len(),
            p.file,
            p.hours.iter().filter(|h| h.load_fraction > 0.0).count(),
            p.hours.len(),
            op.hours_per_year,
            if weather.is_some() {
                "; each hour at the weather of the same timestamp"
            } else {
                "; every hour at the site's ambient (no site.weather)"
            }
        ));
    } else if weather.is_some() {
        let spread = op
            .dispatch
            .iter()
            .any(|b| b.ambient_temperature_k.is_none());
        if op.dispatch.is_empty() || spread {
            notes.push(
                "dispatch hours without their own ambient_temperature (or hours_per_year at full \
                 load) are spread over the weather's records in proportion to each record's hours"
                    .to_string(),
            );
        }
    }
    let distinct = distinct(conditions);
    if distinct > EXACT_CONDITIONS {
        notes.push(format!(
            "the year has {distinct} distinct operating conditions: each fixed machine is solved \
             on a grid (base load: temperature every {GRID_STEP_K} K or less × humidity at the \
             year's lowest and highest; part-load heat-rate ratio: temperature every \
             {GRID_RATIO_STEP_K} K or less × the part loads as listed, or every {GRID_LOAD_STEP}) \
             and interpolated"
        ));
    }
    if let Some(t) = scenario.economics.capacity_temperature_k {
        notes.push(format!(
            "economics.capacity_temperature: capacity credited at each candidate's base-load \
             output at {}",
            ambient_text(t)
        ));
    }
    notes
}

/// MMBtu in one GJ (1 Btu = 1.055 056 kJ, the International Table Btu;
/// NIST SP 811, from memory); the same factor takes kJ/kWh to Btu/kWh.
const MMBTU_PER_GJ: f64 = 1.0 / 1.055_056;

/// An ambient temperature as the trade reads it in either unit system:
/// `35.0 degC / 95.0 degF`.
fn ambient_text(kelvin: f64) -> String {
    let c = kelvin - 273.15;
    format!("{c:.1} degC / {:.1} degF", c * 1.8 + 32.0)
}
