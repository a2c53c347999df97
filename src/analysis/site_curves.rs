//! What the report's "Site performance" section shows: each candidate as
//! priced ([`super::site::SiteModel`]: its fixed machine, with its vendor
//! curves where it states them) at base load over a range of ambient
//! temperatures and at part load at the site, and its year as the
//! comparison priced it.
//!
//! Run hours by temperature bin come from [`hours_by_temperature`] (the
//! year's operating conditions: weather and dispatch), starts per year from
//! `operation.starts_per_year`.

use super::compare::Study;
use super::machine::{machine_of, site_ambient};
use super::site::{Basis, SiteModel};
use crate::offdesign::Ambient;
use crate::report::model::{SiteCandidateView, SitePerformanceView, TemperatureBinView};
use crate::scenario::Scenario;

/// Lowest ambient temperature of the curves, K (−10 °C).
const LOWEST_K: f64 = 263.15;
/// Step between ambient temperatures, K.
const STEP_K: f64 = 5.0;
/// Number of ambient temperatures (−10 °C to 45 °C).
const TEMPERATURES: usize = 12;
/// Loads of the part-load curves, fractions of the site base load.
const LOADS: [f64; 7] = [1.0, 0.9, 0.8, 0.7, 0.6, 0.5, 0.4];
/// Width of a run-hours temperature bin, K.
const BIN_K: f64 = 5.0;

/// Run hours of the site's year by ambient temperature: the year's
/// operating conditions ([`super::operation::conditions`], the weather and
/// dispatch as priced) in [`BIN_K`]-wide bins of dry-bulb temperature on
/// whole multiples of 5 °C, ascending; with one annual-mean temperature
/// every hour falls in one bin. Every candidate runs the same hours.
pub fn hours_by_temperature(scenario: &Scenario) -> Vec<TemperatureBinView> {
    let mut bins: std::collections::BTreeMap<i64, f64> = std::collections::BTreeMap::new();
    for c in super::operation::conditions(scenario) {
        let index = ((c.temperature_k - 273.15) / BIN_K).floor() as i64;
        *bins.entry(index).or_insert(0.0) += c.hours;
    }
    bins.into_iter()
        .map(|(index, hours)| {
            let low_k = 273.15 + BIN_K * index as f64;
            TemperatureBinView {
                low_k,
                high_k: low_k + BIN_K,
                hours,
            }
        })
        .collect()
}

/// The ambient temperatures of the curves, K.
pub fn curve_temperatures_k() -> Vec<f64> {
    (0..TEMPERATURES)
        .map(|i| LOWEST_K + STEP_K * i as f64)
        .collect()
}

/// The section's figures for every candidate of a solved study. A point the
/// machine cannot run at is left out of its curve (`None`); a candidate the
/// fixed-machine model does not cover has no curves.
pub fn site_performance_view(scenario: &Scenario, study: &Study) -> SitePerformanceView {
    let temperatures_k = curve_temperatures_k();
    let hours_by_temperature = hours_by_temperature(scenario);
    let candidates = scenario
        .candidates
        .iter()
        .zip(&study.outcomes)
        .map(|(candidate, outcome)| {
            let solved = &outcome.solved;
            let fixed = matches!(solved.site.basis, Basis::Machine(_));
            // Each bid as priced: its vendor curves where it states them,
            // its machine's physics otherwise (`SiteModel`).
            let model = if fixed {
                machine_of(candidate, &scenario.site, &study.fuel)
                    .ok()
                    .map(|machine| SiteModel::machine(machine, candidate))
            } else {
                None
            };
            let site = site_ambient(candidate, &scenario.site);
            let base: Vec<Option<(f64, f64)>> = temperatures_k
                .iter()
                .map(|&t| {
                    model.as_ref().and_then(|m| {
                        m.base_at(Ambient {
                            temperature_k: t,
                            ..site
                        })
                        .ok()
                    })
                })
                .collect();
            let part_load = LOADS
                .iter()
                .map(|&load| {
                    model.as_ref().and_then(|m| {
                        m.performance_at(site, load)
                            .ok()
                            .map(|p| p.heat_rate_kj_per_kwh)
                    })
                })
                .collect();
            SiteCandidateView {
                candidate_id: candidate.id.clone(),
                label: candidate.label.clone(),
                fixed_machine: fixed,
                output_kw: base.iter().map(|p| p.map(|p| p.0)).collect(),
                heat_rate_kj_per_kwh: base.iter().map(|p| p.map(|p| p.1)).collect(),
                part_load_heat_rate_kj_per_kwh: part_load,
                energy_mwh: solved.year.energy_mwh,
                fuel_gj_lhv: solved.year.fuel_energy_gj_lhv,
                run_hours: solved.year.operating_hours,
                starts_per_year: Some(scenario.operation.starts_per_year),
                hours_by_temperature: hours_by_temperature.clone(),
            }
        })
        .collect();
    SitePerformanceView {
        temperatures_k,
        site_temperature_k: scenario.site.ambient_temperature_k,
        loads: LOADS.to_vec(),
        part_load_from_table: scenario
            .candidates
            .iter()
            .any(|c| !c.part_load.is_empty() || !c.ambient_correction.is_empty()),
        candidates,
    }
}
