//! A fixed machine: calibration at its rating condition and the matching of
//! compressor and turbine at any ambient, vane setting and firing
//! temperature.

use super::characteristic::{
    compressor_efficiency_factor, corrected_flow_fraction, turbine_efficiency_factor,
    CORRECTED_SPEED_RANGE,
};
use super::error::OffDesignError;
use super::{Ambient, Control};
use crate::cycle::{self, CycleResult, EngineConfig, GasModel, Sizing};
use crate::fuel::Fuel;
use crate::thermo::{MAX_TEMPERATURE_K, MIN_TEMPERATURE_K};

/// The matching stops when the nozzle equation holds and the turbine
/// efficiency agrees with its loading to this, relative (1e-9 of the
/// pressure ratio moves the output by about 1e-9 of itself: far below any
/// physical meaning, and three cycle solves from a cold start).
pub(super) const MATCH_TOLERANCE: f64 = 1e-9;

/// A gas turbine fixed at its rating: air flow, turbine flow capacity and
/// component design points set by the design solve at the rating condition.
#[derive(Debug, Clone)]
pub struct Machine {
    pub(crate) design: EngineConfig,
    pub(crate) turbine_cooling: f64,
    pub(crate) gas: GasModel,
    pub(crate) fuel: Fuel,
    pub(crate) control: Control,
    pub(crate) rating: Ambient,
    pub(crate) rating_point: CycleResult,
    pub(crate) air_flow_kg_per_s: f64,
    /// Turbine flow capacity m₃√T₃/p₃ at the first nozzle, kg·K^½/(s·kPa).
    pub(crate) flow_capacity: f64,
    pub(crate) turbine_isentropic_drop_kj_per_kg: f64,
    /// Mass through the first nozzle per kg of air at the rating.
    pub(crate) nozzle_mass: f64,
    pub(crate) exhaust_limit_k: f64,
}

/// What a matched point passes to the next one nearby, to start its
/// iteration close to the answer.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Hint {
    /// Mass through the first nozzle per kg of air, `1 − c + f`.
    pub nozzle_mass: f64,
    /// Turbine efficiency.
    pub turbine_efficiency: f64,
}

/// One matched operating state: the cycle at the matched pressure ratio.
#[derive(Debug, Clone)]
pub(crate) struct Matched {
    pub result: CycleResult,
    pub air_flow_kg_per_s: f64,
    pub pressure_ratio: f64,
    pub vanes: f64,
    pub firing_temperature_k: f64,
    pub compressor_efficiency: f64,
    pub turbine_efficiency: f64,
}

impl Matched {
    /// Net electrical output, kW.
    pub fn net_output_kw(&self) -> f64 {
        self.air_flow_kg_per_s * self.result.electrical_work_kj_per_kg
    }

    /// Turbine exit temperature (state 4), K: the controlled exhaust
    /// temperature.
    pub fn turbine_exit_k(&self) -> f64 {
        state(&self.result, "4").map_or(f64::NAN, |s| s.temperature_k)
    }

    /// This point as the start of a nearby one.
    pub fn hint(&self, cooling: f64) -> Hint {
        Hint {
            nozzle_mass: nozzle_mass_per_kg_air(&self.result, cooling),
            turbine_efficiency: self.turbine_efficiency,
        }
    }

    /// Compressor delivery temperature (state 2), K.
    pub fn delivery_k(&self) -> f64 {
        state(&self.result, "2").map_or(f64::NAN, |s| s.temperature_k)
    }
}

fn state<'a>(r: &'a CycleResult, id: &str) -> Option<&'a cycle::StatePoint> {
    r.states.iter().find(|s| s.id == id)
}

/// The turbine's isentropic enthalpy drop from its rotor inlet (state `3r`
/// with cooling, else `3`), kJ/kg, and the turbine inlet pressure, kPa.
pub(super) fn isentropic_drop(r: &CycleResult) -> Option<(f64, f64)> {
    let s3 = state(r, "3")?;
    let rotor = state(r, "3r").unwrap_or(s3);
    let s4s = state(r, "4s")?;
    Some((
        rotor.enthalpy_kj_per_kg - s4s.enthalpy_kj_per_kg,
        s3.pressure_kpa,
    ))
}

/// Mass through the first turbine nozzle per kg of compressor air: the
/// combustor's share of the air plus all the fuel, `1 − c + f`.
pub(super) fn nozzle_mass_per_kg_air(r: &CycleResult, cooling: f64) -> f64 {
    1.0 - cooling + r.fuel_air_ratio.unwrap_or(0.0)
}

impl Machine {
    /// Fix a machine at its rating: `design` describes the engine (its
    /// ambient fields are replaced by `rating`), sized by its rated net
    /// output or air flow; `turbine_cooling` is the fraction of combustor
    /// air that cools the turbine ([`cycle::Detail::turbine_cooling`]);
    /// `control` its part-load control.
    ///
    /// Errors: the design cycle does not solve; no sizing; an intercooler
    /// or reheat (not modelled off design); control values out of range;
    /// an exhaust temperature limit below the rated exhaust temperature.
    pub fn calibrate(
        design: &EngineConfig,
        turbine_cooling: f64,
        rating: Ambient,
        control: Control,
        gas: GasModel,
        fuel: &Fuel,
    ) -> Result<Machine, OffDesignError> {
        if design.intercooler.is_some() {
            return Err(OffDesignError::invalid(
                "intercooler",
                "an intercooled machine is not modelled off design",
                "expected a simple or regenerated single-shaft machine",
            ));
        }
        if design.reheat.is_some() {
            return Err(OffDesignError::invalid(
                "reheat",
                "a reheat machine is not modelled off design",
                "expected a simple or regenerated single-shaft machine",
            ));
        }
        if design.sizing.is_none() {
            return Err(OffDesignError::invalid(
                "net_output_kw",
                "a fixed machine needs its size, but neither rated output nor air flow is given",
                "expected a rated net output or an air flow",
            ));
        }
        control.validate()?;
        rating.validate("rating")?;
        let mut config = design.clone();
        config.ambient_temperature_k = rating.temperature_k;
        config.ambient_pressure_kpa = rating.pressure_kpa;
        let detail = cycle::Detail {
            turbine_cooling,
            relative_humidity: rating.relative_humidity,
        };
        let point = cycle::solve_detailed(&config, &detail, &gas, fuel).map_err(|source| {
            OffDesignError::Cycle {
                context: "rating point".into(),
                source,
            }
        })?;
        let flows = point.flows.ok_or(OffDesignError::NoConvergence {
            what: "sizing",
            last_change: f64::NAN,
        })?;
        let (drop, p3) = isentropic_drop(&point).ok_or(OffDesignError::NoConvergence {
            what: "state table",
            last_change: f64::NAN,
        })?;
        let t3 = config.turbine_inlet_temperature_k;
        let nozzle_mass = nozzle_mass_per_kg_air(&point, turbine_cooling);
        let flow_capacity = flows.air_flow_kg_per_s * nozzle_mass * t3.sqrt() / p3;
        let rated_exhaust = state(&point, "4").map_or(f64::NAN, |s| s.temperature_k);
        let exhaust_limit_k = control.exhaust_temperature_limit_k.unwrap_or(rated_exhaust);
        if exhaust_limit_k < rated_exhaust * (1.0 - 1e-12) {
            return Err(OffDesignError::invalid(
                "control.exhaust_temperature_limit_k",
                format!(
                    "{exhaust_limit_k} K is below the rated exhaust temperature {rated_exhaust:.2} K, so the machine could not make its rating"
                ),
                format!("expected a limit of at least {rated_exhaust:.2} K"),
            ));
        }
        // The limit is held on the turbine exit; a limit equal to the rated
        // exhaust within rounding is the rated exhaust.
        let exhaust_limit_k = exhaust_limit_k.max(rated_exhaust);
        Ok(Machine {
            air_flow_kg_per_s: flows.air_flow_kg_per_s,
            flow_capacity,
            turbine_isentropic_drop_kj_per_kg: drop,
            nozzle_mass,
            exhaust_limit_k,
            design: config,
            turbine_cooling,
            gas,
            fuel: fuel.clone(),
            control,
            rating,
            rating_point: point,
        })
    }

    /// The design solve at the rating condition.
    pub fn rating_point(&self) -> &CycleResult {
        &self.rating_point
    }

    /// The rating condition.
    pub fn rating(&self) -> Ambient {
        self.rating
    }

    /// Turbine cooling fraction.
    pub fn turbine_cooling(&self) -> f64 {
        self.turbine_cooling
    }

    /// The control the machine runs under.
    pub fn control(&self) -> &Control {
        &self.control
    }

    /// The exhaust (turbine exit) temperature limit in force, K.
    pub fn exhaust_temperature_limit_k(&self) -> f64 {
        self.exhaust_limit_k
    }

    /// Rated compressor inlet air flow, kg/s.
    pub fn rated_air_flow_kg_per_s(&self) -> f64 {
        self.air_flow_kg_per_s
    }

    /// Compressor corrected-speed ratio N_c/N_cd at `ambient` (constant
    /// mechanical speed: √(T_rating / T)).
    pub(crate) fn corrected_speed(&self, ambient: &Ambient) -> f64 {
        (self.rating.temperature_k / ambient.temperature_k).sqrt()
    }

    /// Check an ambient against the property data and the characteristic.
    pub(crate) fn check_ambient(&self, ambient: &Ambient) -> Result<(), OffDesignError> {
        ambient.validate("ambient")?;
        let speed = self.corrected_speed(ambient);
        let (low, high) = CORRECTED_SPEED_RANGE;
        if !(low..=high).contains(&speed) {
            let t_r = self.rating.temperature_k;
            return Err(OffDesignError::invalid(
                "ambient.temperature_k",
                format!(
                    "{} K puts the compressor at {:.3} of its rated corrected speed, outside the characteristic",
                    ambient.temperature_k, speed
                ),
                format!(
                    "expected an ambient from {:.1} K to {:.1} K for this rating",
                    t_r / (high * high),
                    t_r / (low * low)
                ),
            ));
        }
        Ok(())
    }

    /// Match compressor and turbine at `ambient` with the guide vanes at
    /// airflow fraction `vanes` and firing temperature `firing_k`. The
    /// pressure ratio starts from the nozzle equation with the rated
    /// fuel–air ratio.
    ///
    /// Air flow follows from the compressor characteristic; the pressure
    /// ratio from the choked first turbine nozzle,
    /// `m₁ (1 + f) √T₃ / p₃ = (m√T/p)_design`; the fuel–air ratio f and the
    /// turbine efficiency (from its loading) depend on the pressure ratio,
    /// so it is iterated (a contraction: f changes by about 1e-3 of itself
    /// per 1 % of pressure ratio) until both agree to 1e-9.
    pub(crate) fn matched(
        &self,
        ambient: &Ambient,
        vanes: f64,
        firing_k: f64,
        hint: Option<Hint>,
    ) -> Result<Matched, cycle::CycleError> {
        let d = &self.design;
        let speed = self.corrected_speed(ambient);
        let air_flow = self.air_flow_kg_per_s
            * corrected_flow_fraction(speed, vanes)
            * (ambient.pressure_kpa / self.rating.pressure_kpa)
            * speed;
        let eta_c = d.compressor_efficiency * compressor_efficiency_factor(speed, vanes);
        // A nearby matched point, if given, supplies the nozzle mass ratio
        // and turbine efficiency to start from; else the rated ones.
        let (nozzle_mass, mut eta_t) = match hint {
            Some(h) => (h.nozzle_mass, h.turbine_efficiency),
            None => (self.nozzle_mass, d.turbine_efficiency),
        };
        // p₃ = r · p_amb · (p₃/(r p_amb))_rated: the losses are fractions.
        let mut ratio = self.design.pressure_ratio
            * (air_flow / self.air_flow_kg_per_s)
            * (firing_k / d.turbine_inlet_temperature_k).sqrt()
            * (self.rating.pressure_kpa / ambient.pressure_kpa)
            * (nozzle_mass / self.nozzle_mass);
        // The last iterate and its nozzle residual, for a secant step.
        let mut previous: Option<(f64, f64)> = None;
        let mut config = EngineConfig {
            ambient_temperature_k: ambient.temperature_k,
            ambient_pressure_kpa: ambient.pressure_kpa,
            compressor_efficiency: eta_c,
            turbine_inlet_temperature_k: firing_k,
            sizing: Some(Sizing::AirFlowKgPerS(air_flow)),
            ..d.clone()
        };
        let detail = cycle::Detail {
            turbine_cooling: self.turbine_cooling,
            relative_humidity: ambient.relative_humidity,
        };
        let mut change = f64::INFINITY;
        for _ in 0..60 {
            config.pressure_ratio = ratio;
            config.turbine_efficiency = eta_t;
            let result = cycle::solve_detailed(&config, &detail, &self.gas, &self.fuel)?;

            let (drop, p3) = isentropic_drop(&result).ok_or(cycle::CycleError::NoConvergence {
                last_change: f64::NAN,
            })?;
            let capacity =
                air_flow * nozzle_mass_per_kg_air(&result, self.turbine_cooling) * firing_k.sqrt()
                    / p3;
            let mapped = ratio * capacity / self.flow_capacity;
            let residual = mapped - ratio;
            // Secant on the nozzle residual once two iterates exist (the
            // plain substitution converges linearly, at about 1/200 per
            // step); the substitution itself otherwise.
            let next_ratio = match previous {
                Some((r0, g0)) if residual != g0 && r0 != ratio => {
                    ratio - residual * (ratio - r0) / (residual - g0)
                }
                _ => mapped,
            };
            previous = Some((ratio, residual));
            let next_eta = d.turbine_efficiency
                * turbine_efficiency_factor(drop / self.turbine_isentropic_drop_kj_per_kg);
            change = (residual / ratio)
                .abs()
                .max(((next_eta - eta_t) / eta_t).abs());
            if change <= MATCH_TOLERANCE {
                return Ok(Matched {
                    result,
                    air_flow_kg_per_s: air_flow,
                    pressure_ratio: ratio,
                    vanes,
                    firing_temperature_k: firing_k,
                    compressor_efficiency: eta_c,
                    turbine_efficiency: eta_t,
                });
            }
            if !(next_ratio.is_finite() && next_ratio > 1.0 && next_eta > 0.0 && next_eta <= 1.0) {
                return Err(cycle::CycleError::invalid(
                    "pressure_ratio",
                    format!("the matched pressure ratio leaves the valid range ({next_ratio})"),
                    "expected conditions nearer the rating",
                ));
            }
            ratio = next_ratio;
            eta_t = next_eta;
        }
        Err(cycle::CycleError::NoConvergence {
            last_change: change,
        })
    }
}

impl Ambient {
    /// Range checks of an ambient: temperature within the property data,
    /// positive pressure, relative humidity from 0 to 1.
    pub(crate) fn validate(&self, prefix: &'static str) -> Result<(), OffDesignError> {
        let (t_field, p_field, rh_field) = match prefix {
            "rating" => (
                "rating.temperature_k",
                "rating.pressure_kpa",
                "rating.relative_humidity",
            ),
            _ => (
                "ambient.temperature_k",
                "ambient.pressure_kpa",
                "ambient.relative_humidity",
            ),
        };
        let t = self.temperature_k;
        if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&t) {
            return Err(OffDesignError::invalid(
                t_field,
                format!("{t} K is outside the property data"),
                format!(
                    "expected a temperature from {MIN_TEMPERATURE_K} K to {MAX_TEMPERATURE_K} K"
                ),
            ));
        }
        let p = self.pressure_kpa;
        if !(p.is_finite() && p > 0.0) {
            return Err(OffDesignError::invalid(
                p_field,
                format!("{p} kPa is not a positive pressure"),
                "expected a pressure > 0 kPa",
            ));
        }
        let rh = self.relative_humidity;
        if !(0.0..=1.0).contains(&rh) {
            return Err(OffDesignError::invalid(
                rh_field,
                format!("{rh} is outside 0 to 1 (above 1 is above saturation)"),
                "expected a relative humidity from 0 to 1",
            ));
        }
        Ok(())
    }
}
