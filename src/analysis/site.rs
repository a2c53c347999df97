//! What each candidate makes at the site: its fixed machine
//! ([`super::machine::machine_of`]) solved at the site's ambient, base load
//! and every dispatch load. This is what `compare`, `report`, `sweep` and
//! `risk` price.
//!
//! - Base load: `machine.solve(site_ambient, Load::BASE)` gives the net
//!   output and heat rate at the site.
//! - Dispatch blocks: each block's load is a fraction of that site output.
//! - A candidate's vendor curves (`ambient_correction`, `part_load`) price
//!   base load and part load where it states them; the rule is
//!   [`super::vendor`]'s.
//! - Intercooled and reheat candidates, which the fixed-machine model does
//!   not cover, keep their rated output and the design-point heat rate at
//!   the site (the "rubber engine"), with an information note.

use super::machine::{machine_of, site_ambient};
use crate::cycle::CycleResult;
use crate::fuel::Fuel;
use crate::offdesign::{OffDesignError, OffDesignPoint};
use crate::scenario::{Candidate, Scenario};

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
    /// Heat rate of each dispatch block over the base-load heat rate, in
    /// the order of `[operation] dispatch` (empty without a profile).
    pub block_ratios: Vec<f64>,
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

/// The performance of a candidate the fixed-machine model refuses for its
/// arrangement (`reason`): its rated output, the design-point heat rate at
/// the site `rated_heat_rate_kj_per_kwh`, part load from its vendor's
/// curve (none: its base-load heat rate).
pub fn rated_site(
    scenario: &Scenario,
    candidate: &Candidate,
    rated_heat_rate_kj_per_kwh: f64,
    reason: String,
) -> SitePerformance {
    SitePerformance {
        net_output_kw: candidate.net_output_kw,
        heat_rate_kj_per_kwh: rated_heat_rate_kj_per_kwh,
        rated_heat_rate_kj_per_kwh,
        block_ratios: super::vendor::curve_block_ratios(candidate, &scenario.operation.dispatch),
        basis: Basis::Rated(reason),
    }
}

/// A candidate's fixed machine at the site: `Ok(Ok(site))`; `Ok(Err(reason))`
/// when the model refuses the candidate's arrangement (intercooler, reheat:
/// price it with [`rated_site`]); `Err` when the machine cannot be built or
/// cannot run at the site or a dispatch load. Needs no design solve at the
/// site: the calibration at the rating is the machine's own.
pub fn fixed_machine_site(
    scenario: &Scenario,
    candidate: &Candidate,
    fuel: &Fuel,
) -> Result<Result<SitePerformance, String>, SiteError> {
    let located = |error: OffDesignError, load: Option<f64>| SiteError {
        candidate: candidate.id.clone(),
        error: Box::new(error),
        load,
    };
    let machine = match machine_of(candidate, &scenario.site, fuel) {
        Ok(m) => m,
        Err(e) if arrangement_refused(&e) => return Ok(Err(e.to_string())),
        Err(e) => return Err(located(e, None)),
    };
    let ambient = site_ambient(candidate, &scenario.site);
    let priced =
        super::vendor::site_pricing(candidate, &machine, ambient, &scenario.operation.dispatch)
            .map_err(|(e, load)| located(e, load))?;
    Ok(Ok(SitePerformance {
        net_output_kw: priced.base.net_output_kw,
        heat_rate_kj_per_kwh: priced.base.heat_rate_kj_per_kwh,
        rated_heat_rate_kj_per_kwh: machine.rating_point().heat_rate_kj_per_kwh,
        block_ratios: priced.block_ratios,
        basis: Basis::Machine(Box::new(priced.machine_base)),
    }))
}

/// Information lines for `check` and the report: how the site performance
/// is priced (vendor curves or machine physics, [`super::vendor::pricing_notes`];
/// candidates kept at their rating).
pub fn pricing_notes(scenario: &Scenario, sites: &[SitePerformance]) -> Vec<String> {
    let fixed: Vec<bool> = sites
        .iter()
        .map(|s| matches!(s.basis, Basis::Machine(_)))
        .collect();
    let mut notes = super::vendor::pricing_notes(scenario, &fixed);
    for (candidate, site) in scenario.candidates.iter().zip(sites) {
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
