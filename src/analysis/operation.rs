//! The site's year as operating conditions, and a year of operation from
//! each condition's performance: hours, net energy and fuel energy (LHV),
//! new and clean.
//!
//! [`conditions`] turns the scenario's weather and dispatch into a list of
//! conditions (ambient temperature, humidity, load, hours per year, the
//! hour's energy price). The rules, also stated by `check`:
//!
//! - An hourly profile: one condition per hour with load > 0, at that
//!   hour's weather (or the site's ambient without weather). Each row of a
//!   record of any length counts 8760 / rows hours, scaled further by
//!   `hours_per_year` ÷ the profile's own run hours (1 unless a key path
//!   set the hours).
//! - Dispatch blocks with their own `ambient_temperature`: one condition
//!   each, at the block's humidity (or the site's).
//! - Dispatch blocks without it, and `hours_per_year` at full load without
//!   dispatch: the hours spread over the weather's records (hours or bins)
//!   in proportion to each record's hours; without weather, at the site's
//!   ambient.
//!
//! Part-load heat rate comes from each candidate's model
//! ([`super::site`]): its vendor's part-load curve where it states one
//! ([`super::vendor`]), else its fixed machine's physics.
//! Degradation over the years is the ledger's business, not this module's.

use crate::scenario::{Operation, Scenario};

/// One full year of operation at new-and-clean performance.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AnnualOperation {
    /// Operating hours per year, h.
    pub operating_hours: f64,
    /// Net electrical energy per year, MWh.
    pub energy_mwh: f64,
    /// Fuel energy per year, GJ on the LHV basis.
    pub fuel_energy_gj_lhv: f64,
}

impl AnnualOperation {
    /// This year with its hours, energy and fuel multiplied by the given
    /// factors (a year is linear in its hours; a machine's output ratio
    /// moves its energy, output × heat-rate ratio its fuel).
    pub fn scaled(self, hours: f64, energy: f64, fuel: f64) -> AnnualOperation {
        AnnualOperation {
            operating_hours: self.operating_hours * hours,
            energy_mwh: self.energy_mwh * energy,
            fuel_energy_gj_lhv: self.fuel_energy_gj_lhv * fuel,
        }
    }
}

/// One operating condition of the year.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Condition {
    /// Ambient dry-bulb temperature, K.
    pub temperature_k: f64,
    /// Ambient relative humidity, fraction.
    pub relative_humidity: f64,
    /// Load as a fraction of the output available at this ambient, (0, 1].
    pub load_fraction: f64,
    /// Hours per year in this condition, h.
    pub hours: f64,
    /// The hour's energy price, currency per MWh (hourly profile only).
    pub energy_price_per_mwh: Option<f64>,
}

/// What one candidate does in one condition.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ConditionPerformance {
    /// Base-load net output available at the condition's ambient, kW.
    pub available_kw: f64,
    /// Net heat rate at the condition's ambient and load, kJ (LHV) per kWh.
    pub heat_rate_kj_per_kwh: f64,
}

/// The site's climate as (temperature K, relative humidity, weight in
/// hours): the weather's records, or the site's ambient alone.
fn climate(site: &crate::scenario::Site) -> Vec<(f64, f64, f64)> {
    match &site.weather {
        Some(w) if !w.records.is_empty() => w
            .records
            .iter()
            .map(|r| (r.temperature_k, r.relative_humidity, r.hours))
            .collect(),
        _ => vec![(site.ambient_temperature_k, site.relative_humidity, 1.0)],
    }
}

/// Spread `hours` at `load` over the climate in proportion to its weights.
fn spread(out: &mut Vec<Condition>, climate: &[(f64, f64, f64)], load: f64, hours: f64) {
    let total: f64 = climate.iter().map(|c| c.2).sum();
    if total <= 0.0 {
        return;
    }
    for &(t, rh, w) in climate {
        if w > 0.0 {
            out.push(Condition {
                temperature_k: t,
                relative_humidity: rh,
                load_fraction: load,
                hours: hours * w / total,
                energy_price_per_mwh: None,
            });
        }
    }
}

/// The scenario's year as operating conditions (see the module notes for
/// the rules). Conditions with zero hours are left out.
pub fn conditions(scenario: &Scenario) -> Vec<Condition> {
    conditions_of(&scenario.site, &scenario.operation)
}

/// [`conditions`] of a site and an operation given apart (a sweep or risk
/// point sums its year at the file's own operation and scales it by the
/// hours: a year is linear in `hours_per_year`).
pub fn conditions_of(site: &crate::scenario::Site, operation: &Operation) -> Vec<Condition> {
    let mut out = Vec::new();
    if let Some(profile) = &operation.profile {
        let run = profile
            .hours
            .iter()
            .filter(|h| h.load_fraction > 0.0)
            .count();
        if run == 0 {
            return out;
        }
        let each = operation.hours_per_year / run as f64;
        let weather = site.weather.as_ref().map(|w| &w.records);
        for (i, hour) in profile.hours.iter().enumerate() {
            if hour.load_fraction <= 0.0 {
                continue;
            }
            let (t, rh) = weather
                .and_then(|r| r.get(profile.weather_offset + i))
                .map_or((site.ambient_temperature_k, site.relative_humidity), |r| {
                    (r.temperature_k, r.relative_humidity)
                });
            out.push(Condition {
                temperature_k: t,
                relative_humidity: rh,
                load_fraction: hour.load_fraction,
                hours: each,
                energy_price_per_mwh: hour.energy_price_per_mwh,
            });
        }
        return out;
    }
    let climate = climate(site);
    if operation.dispatch.is_empty() {
        spread(&mut out, &climate, 1.0, operation.hours_per_year);
        return out;
    }
    for block in &operation.dispatch {
        if block.hours <= 0.0 {
            continue;
        }
        match block.ambient_temperature_k {
            Some(t) => out.push(Condition {
                temperature_k: t,
                relative_humidity: block.relative_humidity.unwrap_or(site.relative_humidity),
                load_fraction: block.load_fraction,
                hours: block.hours,
                energy_price_per_mwh: None,
            }),
            None => spread(&mut out, &climate, block.load_fraction, block.hours),
        }
    }
    out
}

/// The year of a candidate whose performance in each of `conditions` is
/// `points` (same order): hours = Σ h; energy = Σ load · P_avail · h /
/// 1000 (MWh); fuel = Σ load · P_avail · h · HR / 1e6 (GJ LHV).
pub fn year_from(conditions: &[Condition], points: &[ConditionPerformance]) -> AnnualOperation {
    let mut hours = 0.0;
    let mut energy_kwh = 0.0;
    let mut fuel_kj = 0.0;
    for (c, p) in conditions.iter().zip(points) {
        let kwh = c.load_fraction * p.available_kw * c.hours;
        hours += c.hours;
        energy_kwh += kwh;
        fuel_kj += kwh * p.heat_rate_kj_per_kwh;
    }
    AnnualOperation {
        operating_hours: hours,
        energy_mwh: energy_kwh / 1000.0,
        fuel_energy_gj_lhv: fuel_kj / 1.0e6,
    }
}

/// Net energy of each condition, MWh per year (load · P_avail · h / 1000).
pub fn condition_energy_mwh(conditions: &[Condition], points: &[ConditionPerformance]) -> Vec<f64> {
    conditions
        .iter()
        .zip(points)
        .map(|(c, p)| c.load_fraction * p.available_kw * c.hours / 1000.0)
        .collect()
}

/// A year of operation for a unit of `net_output_kw` with every block at
/// the base-load heat rate `heat_rate_kj_per_kwh` (LHV), at every hour of
/// the year (no weather): no part-load penalty (used where only the energy
/// matters).
///
/// energy = Σ load·P·h / 1000 (MWh); fuel = Σ load·P·h · HR / 1e6 (GJ).
/// With no dispatch profile every hour runs at full load.
pub fn annual_operation(
    operation: &Operation,
    net_output_kw: f64,
    heat_rate_kj_per_kwh: f64,
) -> AnnualOperation {
    year_with(operation, net_output_kw, heat_rate_kj_per_kwh, |_, _| 1.0)
}

/// Like [`annual_operation`], with each dispatch block's heat-rate ratio
/// given (`block_ratios[i]` for `operation.dispatch[i]`, as a fixed
/// machine's part-load physics give it); a missing ratio counts as 1.
pub fn annual_operation_with_ratios(
    operation: &Operation,
    net_output_kw: f64,
    heat_rate_kj_per_kwh: f64,
    block_ratios: &[f64],
) -> AnnualOperation {
    year_with(operation, net_output_kw, heat_rate_kj_per_kwh, |i, _| {
        block_ratios.get(i).copied().unwrap_or(1.0)
    })
}

fn year_with(
    operation: &Operation,
    net_output_kw: f64,
    heat_rate_kj_per_kwh: f64,
    ratio: impl Fn(usize, f64) -> f64,
) -> AnnualOperation {
    if operation.dispatch.is_empty() {
        let energy_kwh = net_output_kw * operation.hours_per_year;
        return AnnualOperation {
            operating_hours: operation.hours_per_year,
            energy_mwh: energy_kwh / 1000.0,
            fuel_energy_gj_lhv: energy_kwh * heat_rate_kj_per_kwh / 1.0e6,
        };
    }
    let mut hours = 0.0;
    let mut energy_kwh = 0.0;
    let mut fuel_kj = 0.0;
    for (i, block) in operation.dispatch.iter().enumerate() {
        let block_kwh = block.load_fraction * net_output_kw * block.hours;
        hours += block.hours;
        energy_kwh += block_kwh;
        fuel_kj += block_kwh * heat_rate_kj_per_kwh * ratio(i, block.load_fraction);
    }
    AnnualOperation {
        operating_hours: hours,
        energy_mwh: energy_kwh / 1000.0,
        fuel_energy_gj_lhv: fuel_kj / 1.0e6,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::scenario::DispatchBlock;

    #[test]
    fn full_load_year_is_output_times_hours_times_heat_rate() {
        let op = Operation {
            hours_per_year: 4000.0,
            starts_per_year: 0.0,
            dispatch: vec![],
            profile: None,
        };
        let year = annual_operation(&op, 50_000.0, 10_000.0);
        // 50 MW × 4000 h = 200 000 MWh; × 10 000 kJ/kWh = 2.0e6 GJ.
        assert!((year.energy_mwh - 200_000.0).abs() < 1e-9);
        assert!((year.fuel_energy_gj_lhv - 2.0e6).abs() < 1e-6);
    }

    #[test]
    fn dispatch_profile_sums_blocks_with_part_load_penalty() {
        let op = Operation {
            hours_per_year: 3000.0,
            starts_per_year: 0.0,
            dispatch: vec![
                DispatchBlock {
                    load_fraction: 1.0,
                    hours: 2000.0,
                    ambient_temperature_k: None,
                    relative_humidity: None,
                },
                DispatchBlock {
                    load_fraction: 0.5,
                    hours: 1000.0,
                    ambient_temperature_k: None,
                    relative_humidity: None,
                },
            ],
            profile: None,
        };
        // The 50 % block's ratio 1.2 as a part-load curve through
        // (0.5, 1.2) and (1.0, 1.0) would give it.
        let year = annual_operation_with_ratios(&op, 10_000.0, 9_000.0, &[1.0, 1.2]);
        // 10 MW×2000 h + 5 MW×1000 h = 25 000 MWh.
        assert!((year.energy_mwh - 25_000.0).abs() < 1e-9);
        // 20e6 kWh×9000 + 5e6 kWh×9000×1.2 = 234e9 kJ = 234 000 GJ.
        assert!((year.fuel_energy_gj_lhv - 234_000.0).abs() < 1e-6);
        assert_eq!(year.operating_hours, 3000.0);
    }
}
