//! The firing-temperature search with the matching folded in: one cycle
//! solve per step moves the pressure ratio, the turbine efficiency and the
//! firing temperature together.

use super::characteristic::turbine_efficiency_factor;
use super::machine::{isentropic_drop, nozzle_mass_per_kg_air, Machine, Matched, MATCH_TOLERANCE};
use super::Ambient;
use crate::cycle::{self, CycleResult, EngineConfig, Sizing};

impl Machine {
    /// Match at `vanes` while moving the firing temperature until
    /// `goal(result, air_flow) = 0` (|goal| ≤ `tolerance`), the matching
    /// iteration folded into the search: each step is one cycle solve that
    /// updates the pressure ratio (nozzle equation, scaled by √T3 for the
    /// firing step), the turbine efficiency, and the firing temperature (a
    /// secant on `goal` anchored at the matched `start`). `None` when it
    /// does not settle within its budget or steps outside
    /// (`floor_k`, 2 × rated firing): the nested search then answers.
    pub(crate) fn matched_to_goal(
        &self,
        ambient: &Ambient,
        start: &Matched,
        x0: f64,
        floor_k: f64,
        tolerance: f64,
        goal: impl Fn(&CycleResult, f64) -> f64,
    ) -> Option<Matched> {
        let d = &self.design;
        let air_flow = start.air_flow_kg_per_s;
        let ceiling = 2.0 * d.turbine_inlet_temperature_k;
        let mut t3 = x0;
        let mut ratio = start.pressure_ratio * (x0 / start.firing_temperature_k).sqrt();
        let mut eta_t = start.turbine_efficiency;
        let mut anchor = (start.firing_temperature_k, goal(&start.result, air_flow));
        let mut slope = f64::NAN;
        let mut config = EngineConfig {
            ambient_temperature_k: ambient.temperature_k,
            ambient_pressure_kpa: ambient.pressure_kpa,
            compressor_efficiency: start.compressor_efficiency,
            sizing: Some(Sizing::AirFlowKgPerS(air_flow)),
            ..d.clone()
        };
        let detail = cycle::Detail {
            turbine_cooling: self.turbine_cooling,
            relative_humidity: ambient.relative_humidity,
        };
        for _ in 0..30 {
            if !(t3 > floor_k && t3 < ceiling && ratio.is_finite() && ratio > 1.0) {
                return None;
            }
            config.pressure_ratio = ratio;
            config.turbine_efficiency = eta_t;
            config.turbine_inlet_temperature_k = t3;
            let result = cycle::solve_detailed(&config, &detail, &self.gas, &self.fuel).ok()?;
            let (drop, p3) = isentropic_drop(&result)?;
            let capacity =
                air_flow * nozzle_mass_per_kg_air(&result, self.turbine_cooling) * t3.sqrt() / p3;
            let mapped = ratio * capacity / self.flow_capacity;
            let next_eta = d.turbine_efficiency
                * turbine_efficiency_factor(drop / self.turbine_isentropic_drop_kj_per_kg);
            let change = ((mapped - ratio) / ratio)
                .abs()
                .max(((next_eta - eta_t) / eta_t).abs());
            let g = goal(&result, air_flow);
            if change <= MATCH_TOLERANCE && g.abs() <= tolerance {
                return Some(Matched {
                    result,
                    air_flow_kg_per_s: air_flow,
                    pressure_ratio: ratio,
                    vanes: start.vanes,
                    firing_temperature_k: t3,
                    compressor_efficiency: start.compressor_efficiency,
                    turbine_efficiency: eta_t,
                });
            }
            // The slope of the goal in firing temperature, refreshed only
            // over steps long enough that the pressure ratio's own
            // convergence does not swamp it.
            let (t0, g0) = anchor;
            if (t3 - t0).abs() > 1e-3 && g != g0 {
                slope = (g - g0) / (t3 - t0);
                anchor = (t3, g);
            }
            let next_t3 = if g.abs() > tolerance && slope.is_finite() && slope != 0.0 {
                t3 - g / slope
            } else {
                t3
            };
            ratio = mapped * (next_t3 / t3).sqrt();
            eta_t = next_eta;
            t3 = next_t3;
        }
        None
    }
}
