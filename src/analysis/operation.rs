//! Dispatch profile × performance → one full year of operation: hours,
//! net energy and fuel energy (LHV), new and clean.
//!
//! Each dispatch block's heat rate is the base-load heat rate times that
//! block's heat-rate ratio, given by the caller (a vendor's part-load curve
//! or the machine's own physics, see `analysis::vendor` and
//! `analysis::site`). Degradation over the years is the ledger's business,
//! not this module's.

use crate::scenario::Operation;

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

/// A year of operation for a unit of `net_output_kw` with every block at
/// the base-load heat rate `heat_rate_kj_per_kwh` (LHV): no part-load
/// penalty (used where only the energy matters).
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
