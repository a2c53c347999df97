//! Dispatch profile × performance → one full year of operation: hours,
//! net energy and fuel energy (LHV), new and clean.
//!
//! Part-load heat rate is the full-load heat rate times the ratio read from
//! the scenario's part-load table by linear interpolation in load fraction
//! (the table ends at load 1.0 with ratio 1.0; loads between table points
//! interpolate; a load below the table's lowest point is refused when the
//! scenario is loaded). Degradation over the years is the ledger's business,
//! not this module's.

use crate::scenario::{Operation, PartLoadPoint};

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

/// Heat-rate ratio at `load_fraction`, interpolated linearly in the sorted
/// part-load table; 1.0 when the table is empty (all hours at full load).
/// Loads outside the table clamp to its nearest end (the loader refuses
/// dispatch loads below the table, so clamping only guards rounding).
pub fn heat_rate_ratio(part_load: &[PartLoadPoint], load_fraction: f64) -> f64 {
    let (first, last) = match (part_load.first(), part_load.last()) {
        (Some(f), Some(l)) => (f, l),
        _ => return 1.0,
    };
    if load_fraction <= first.load_fraction {
        return first.heat_rate_ratio;
    }
    if load_fraction >= last.load_fraction {
        return last.heat_rate_ratio;
    }
    for pair in part_load.windows(2) {
        let (a, b) = (pair[0], pair[1]);
        if load_fraction <= b.load_fraction {
            let span = b.load_fraction - a.load_fraction;
            if span <= 0.0 {
                return b.heat_rate_ratio;
            }
            let t = (load_fraction - a.load_fraction) / span;
            return a.heat_rate_ratio + t * (b.heat_rate_ratio - a.heat_rate_ratio);
        }
    }
    last.heat_rate_ratio
}

/// A year of operation for a unit of `net_output_kw` at full-load heat rate
/// `heat_rate_kj_per_kwh` (LHV), part load from the scenario's table.
///
/// energy = Σ load·P·h / 1000 (MWh); fuel = Σ load·P·h · HR · ratio(load)
/// / 1e6 (GJ). With no dispatch profile every hour runs at full load.
pub fn annual_operation(
    operation: &Operation,
    net_output_kw: f64,
    heat_rate_kj_per_kwh: f64,
) -> AnnualOperation {
    year_with(operation, net_output_kw, heat_rate_kj_per_kwh, |_, load| {
        heat_rate_ratio(&operation.part_load, load)
    })
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

    fn table() -> Vec<PartLoadPoint> {
        vec![
            PartLoadPoint {
                load_fraction: 0.5,
                heat_rate_ratio: 1.2,
            },
            PartLoadPoint {
                load_fraction: 1.0,
                heat_rate_ratio: 1.0,
            },
        ]
    }

    #[test]
    fn interpolates_the_part_load_table_linearly() {
        // Hand-checked: halfway between (0.5, 1.2) and (1.0, 1.0) is 1.1.
        assert!((heat_rate_ratio(&table(), 0.75) - 1.1).abs() < 1e-15);
        assert_eq!(heat_rate_ratio(&table(), 1.0), 1.0);
        assert_eq!(heat_rate_ratio(&[], 0.3), 1.0);
    }

    #[test]
    fn full_load_year_is_output_times_hours_times_heat_rate() {
        let op = Operation {
            hours_per_year: 4000.0,
            starts_per_year: 0.0,
            dispatch: vec![],
            part_load: vec![],
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
                },
                DispatchBlock {
                    load_fraction: 0.5,
                    hours: 1000.0,
                },
            ],
            part_load: table(),
        };
        let year = annual_operation(&op, 10_000.0, 9_000.0);
        // 10 MW×2000 h + 5 MW×1000 h = 25 000 MWh.
        assert!((year.energy_mwh - 25_000.0).abs() < 1e-9);
        // 20e6 kWh×9000 + 5e6 kWh×9000×1.2 = 234e9 kJ = 234 000 GJ.
        assert!((year.fuel_energy_gj_lhv - 234_000.0).abs() < 1e-6);
        assert_eq!(year.operating_hours, 3000.0);
    }
}
