//! Component values as a candidate states them, brought to the basis the
//! calibration fits: polytropic efficiencies.

use super::balance::root;
use super::implied::ComponentData;
use super::DatasheetError;
use crate::cycle::{self, CycleResult, EfficiencyBasis, EngineConfig, GasModel};
use crate::fuel::Fuel;

impl ComponentData {
    /// The component values of a stated engine `config` (cooling
    /// `turbine_cooling`, air of `relative_humidity`, gas model `gas`):
    /// pressure ratio, firing temperature, cooling and polytropic
    /// efficiencies.
    ///
    /// Isentropic efficiencies are converted at the engine's own pressure
    /// ratios: the polytropic compressor efficiency that gives the same
    /// delivery temperature (state `2`), then the polytropic turbine
    /// efficiency that gives the same turbine exit temperature (state `4`),
    /// so both works are unchanged. For a perfect gas this is the textbook
    /// relation `η_s = (r^((k−1)/k) − 1) / (r^((k−1)/(k η_p)) − 1)`
    /// (Saravanamuttoo et al., *Gas Turbine Theory*, polytropic efficiency).
    ///
    /// Errors: the stated engine does not solve (naming its field).
    pub fn from_engine(
        config: &EngineConfig,
        turbine_cooling: f64,
        relative_humidity: f64,
        gas: GasModel,
        fuel: &Fuel,
    ) -> Result<ComponentData, DatasheetError> {
        let detail = cycle::Detail {
            turbine_cooling,
            relative_humidity,
        };
        let solve = |c: &EngineConfig| -> Result<CycleResult, DatasheetError> {
            cycle::solve_detailed(c, &detail, &gas, fuel).map_err(|source| DatasheetError::Cycle {
                context: "stated components".into(),
                source,
            })
        };
        let stated = |eta_c: f64, eta_t: f64| ComponentData {
            pressure_ratio: Some(config.pressure_ratio),
            firing_temperature_k: Some(config.turbine_inlet_temperature_k),
            compressor_polytropic_efficiency: Some(eta_c),
            turbine_polytropic_efficiency: Some(eta_t),
            turbine_cooling: Some(turbine_cooling),
        };
        if config.efficiency_basis == EfficiencyBasis::Polytropic {
            solve(config)?;
            return Ok(stated(
                config.compressor_efficiency,
                config.turbine_efficiency,
            ));
        }
        let isentropic = solve(config)?;
        let t2 = temperature(&isentropic, "2");
        let t4 = temperature(&isentropic, "4");
        let mut poly = config.clone();
        poly.efficiency_basis = EfficiencyBasis::Polytropic;
        let at = |eta_c: f64, eta_t: f64| {
            let mut c = poly.clone();
            c.compressor_efficiency = eta_c;
            c.turbine_efficiency = eta_t;
            cycle::solve_detailed(&c, &detail, &gas, fuel).ok()
        };
        let not_converted = |what: &str| {
            DatasheetError::NoFit(format!(
            "the stated isentropic {what} efficiency has no polytropic equivalent at pressure ratio {}",
            config.pressure_ratio
        ))
        };
        // A compressor's polytropic efficiency is above its isentropic one,
        // a turbine's below; an efficiency of 1 is 1 on either basis.
        let eta_c = if config.compressor_efficiency >= 1.0 {
            1.0
        } else {
            root(
                |e| Some(temperature(&at(e.min(1.0), config.turbine_efficiency)?, "2") - t2),
                config.compressor_efficiency,
                (config.compressor_efficiency + 0.01).min(1.0),
            )
            .ok_or_else(|| not_converted("compressor"))?
        };
        let eta_t = if config.turbine_efficiency >= 1.0 {
            1.0
        } else {
            root(
                |e| Some(temperature(&at(eta_c, e.min(1.0))?, "4") - t4),
                config.turbine_efficiency,
                config.turbine_efficiency - 0.01,
            )
            .ok_or_else(|| not_converted("turbine"))?
        };
        Ok(stated(eta_c, eta_t))
    }
}

fn temperature(r: &CycleResult, id: &str) -> f64 {
    r.states
        .iter()
        .find(|s| s.id == id)
        .map_or(f64::NAN, |s| s.temperature_k)
}
