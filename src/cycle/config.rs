//! The engine a cycle solve describes: ambient, pressure ratio, turbine inlet
//! temperature, component efficiencies and losses, optional regenerator,
//! intercooler and reheat, and optional sizing. Plain data plus the range
//! checks that need no thermodynamics.

use super::error::CycleError;
use crate::thermo::STANDARD_PRESSURE_KPA;

/// Whether compressor and turbine efficiencies are isentropic (whole-machine)
/// or polytropic (small-stage) efficiencies.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum EfficiencyBasis {
    /// Isentropic efficiency: actual over ideal enthalpy change.
    Isentropic,
    /// Polytropic efficiency: the isentropic efficiency of an infinitesimal
    /// stage; for an ideal gas `ds = R (1/η_p − 1) dp/p` through a
    /// compressor and `ds = −R (1 − η_p) dp/p` through a turbine.
    Polytropic,
}

/// Regenerator (recuperator): compressor delivery air heated by turbine
/// exhaust before the combustor.
///
/// Effectiveness is the heat passed over the most the exchanger could pass:
/// `q = ε · min(h_air(T4) − h_air(T2), m_gas (h_gas(T4) − h_gas(T2)))`
/// per kg of compressor inlet air (with one gas and equal flows this is the
/// textbook `ε = (h5 − h2) / (h4 − h2)`).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Regenerator {
    /// Effectiveness, 0 < ε ≤ 1.
    pub effectiveness: f64,
    /// Pressure loss of the air side, fraction of its inlet pressure, [0, 1).
    pub air_side_pressure_loss: f64,
    /// Pressure loss of the gas side, fraction of its inlet pressure, [0, 1).
    pub gas_side_pressure_loss: f64,
}

/// How far the intercooler cools the air between the two compressors.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum IntercoolerExit {
    /// Air leaves at this temperature, K.
    TemperatureK(f64),
    /// Effectiveness ε against a coolant at ambient temperature:
    /// `T_out = T_in − ε (T_in − T_ambient)`, 0 < ε ≤ 1.
    Effectiveness(f64),
}

/// One intercooler between a low- and a high-pressure compressor. No
/// pressure loss is modelled across it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Intercooler {
    /// Pressure ratio of the low-pressure compressor, 1 < r < overall ratio;
    /// `None` splits at the geometric mean (√ overall).
    pub pressure_split: Option<f64>,
    /// Intercooler exit condition.
    pub exit: IntercoolerExit,
}

/// One reheat combustor between a high- and a low-pressure turbine. It has
/// the main combustor's fractional pressure loss and combustion efficiency.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Reheat {
    /// Expansion ratio of the high-pressure turbine; `None` splits at the
    /// geometric mean of the overall turbine expansion ratio.
    pub pressure_split: Option<f64>,
    /// Reheat combustor exit temperature, K.
    pub temperature_k: f64,
}

/// How the engine is sized: the flows follow from one of these.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Sizing {
    /// Rated net electrical output, kW.
    NetOutputKw(f64),
    /// Compressor inlet air flow, kg/s.
    AirFlowKgPerS(f64),
}

/// A gas-turbine configuration. Fractions are of the local pressure or of
/// gross electrical output, as named; temperatures K; pressures kPa.
#[derive(Debug, Clone, PartialEq)]
pub struct EngineConfig {
    /// Ambient (and coolant) temperature, K.
    pub ambient_temperature_k: f64,
    /// Ambient pressure, kPa.
    pub ambient_pressure_kpa: f64,
    /// Compressor pressure ratio (delivery over inlet), > 1.
    pub pressure_ratio: f64,
    /// Turbine inlet temperature (combustor exit), K.
    pub turbine_inlet_temperature_k: f64,
    /// Compressor efficiency (basis: `efficiency_basis`), (0, 1].
    pub compressor_efficiency: f64,
    /// Turbine efficiency (basis: `efficiency_basis`), (0, 1].
    pub turbine_efficiency: f64,
    /// Isentropic or polytropic efficiencies.
    pub efficiency_basis: EfficiencyBasis,
    /// Inlet (filter, duct) pressure loss, fraction of ambient, [0, 1).
    pub inlet_pressure_loss: f64,
    /// Exhaust (duct, stack) pressure loss, fraction of its inlet, [0, 1).
    pub exhaust_pressure_loss: f64,
    /// Combustor pressure loss, fraction of its inlet pressure, [0, 1).
    pub combustor_pressure_loss: f64,
    /// Fraction of the fuel's LHV released to the gas, (0, 1].
    pub combustion_efficiency: f64,
    /// Shaft power after bearings and gearbox over turbine-less-compressor
    /// power, (0, 1].
    pub mechanical_efficiency: f64,
    /// Generator electrical over shaft power, (0, 1].
    pub generator_efficiency: f64,
    /// Auxiliary load, fraction of gross electrical output, [0, 1).
    pub auxiliary_load_fraction: f64,
    /// Optional regenerator.
    pub regenerator: Option<Regenerator>,
    /// Optional intercooler.
    pub intercooler: Option<Intercooler>,
    /// Optional reheat combustor.
    pub reheat: Option<Reheat>,
    /// Optional sizing (gives the flows).
    pub sizing: Option<Sizing>,
}

impl EngineConfig {
    /// The ideal cycle: ISO ambient (288.15 K, 101.325 kPa), no pressure
    /// losses, every efficiency 1, no auxiliary load, no regenerator,
    /// intercooler, reheat or sizing.
    pub fn ideal(pressure_ratio: f64, turbine_inlet_temperature_k: f64) -> Self {
        EngineConfig {
            ambient_temperature_k: 288.15,
            ambient_pressure_kpa: STANDARD_PRESSURE_KPA,
            pressure_ratio,
            turbine_inlet_temperature_k,
            compressor_efficiency: 1.0,
            turbine_efficiency: 1.0,
            efficiency_basis: EfficiencyBasis::Isentropic,
            inlet_pressure_loss: 0.0,
            exhaust_pressure_loss: 0.0,
            combustor_pressure_loss: 0.0,
            combustion_efficiency: 1.0,
            mechanical_efficiency: 1.0,
            generator_efficiency: 1.0,
            auxiliary_load_fraction: 0.0,
            regenerator: None,
            intercooler: None,
            reheat: None,
            sizing: None,
        }
    }

    /// Check every range that needs no thermodynamics. Temperatures against
    /// the gas model's data range, and combinations (turbine inlet above
    /// compressor exit, …), are checked by the solve.
    #[inline]
    pub fn validate(&self) -> Result<(), CycleError> {
        positive("ambient_temperature_k", self.ambient_temperature_k, "K")?;
        positive("ambient_pressure_kpa", self.ambient_pressure_kpa, "kPa")?;
        if !(self.pressure_ratio.is_finite() && self.pressure_ratio > 1.0) {
            return Err(CycleError::invalid(
                "pressure_ratio",
                format!("{} is not above 1", self.pressure_ratio),
                "expected a compressor pressure ratio > 1",
            ));
        }
        positive(
            "turbine_inlet_temperature_k",
            self.turbine_inlet_temperature_k,
            "K",
        )?;
        efficiency("compressor_efficiency", self.compressor_efficiency)?;
        efficiency("turbine_efficiency", self.turbine_efficiency)?;
        loss("inlet_pressure_loss", self.inlet_pressure_loss)?;
        loss("exhaust_pressure_loss", self.exhaust_pressure_loss)?;
        loss("combustor_pressure_loss", self.combustor_pressure_loss)?;
        efficiency("combustion_efficiency", self.combustion_efficiency)?;
        efficiency("mechanical_efficiency", self.mechanical_efficiency)?;
        efficiency("generator_efficiency", self.generator_efficiency)?;
        loss("auxiliary_load_fraction", self.auxiliary_load_fraction)?;
        if let Some(r) = &self.regenerator {
            efficiency("regenerator.effectiveness", r.effectiveness)?;
            loss(
                "regenerator.air_side_pressure_loss",
                r.air_side_pressure_loss,
            )?;
            loss(
                "regenerator.gas_side_pressure_loss",
                r.gas_side_pressure_loss,
            )?;
        }
        if let Some(ic) = &self.intercooler {
            if let Some(split) = ic.pressure_split {
                if !(split > 1.0 && split < self.pressure_ratio) {
                    return Err(CycleError::invalid(
                        "intercooler.pressure_split",
                        format!("{split} is not between 1 and the pressure ratio"),
                        format!(
                            "expected a low-pressure compressor ratio in (1, {})",
                            self.pressure_ratio
                        ),
                    ));
                }
            }
            match ic.exit {
                IntercoolerExit::TemperatureK(t) => {
                    positive("intercooler.exit_temperature_k", t, "K")?
                }
                IntercoolerExit::Effectiveness(e) => efficiency("intercooler.effectiveness", e)?,
            }
        }
        if let Some(rh) = &self.reheat {
            if let Some(split) = rh.pressure_split {
                if !(split.is_finite() && split > 1.0) {
                    return Err(CycleError::invalid(
                        "reheat.pressure_split",
                        format!("{split} is not above 1"),
                        "expected a high-pressure turbine expansion ratio > 1",
                    ));
                }
            }
            positive("reheat.temperature_k", rh.temperature_k, "K")?;
        }
        match self.sizing {
            Some(Sizing::NetOutputKw(p)) => positive("net_output_kw", p, "kW"),
            Some(Sizing::AirFlowKgPerS(m)) => positive("air_flow_kg_per_s", m, "kg/s"),
            None => Ok(()),
        }
    }
}

#[inline]
fn positive(field: &'static str, value: f64, unit: &'static str) -> Result<(), CycleError> {
    if value.is_finite() && value > 0.0 {
        Ok(())
    } else {
        Err(not_positive(field, value, unit))
    }
}

#[cold]
fn not_positive(field: &'static str, value: f64, unit: &str) -> CycleError {
    CycleError::invalid(
        field,
        format!("{value} {unit} is not a positive number"),
        format!("expected a value > 0 {unit}"),
    )
}

#[inline]
fn efficiency(field: &'static str, value: f64) -> Result<(), CycleError> {
    if value > 0.0 && value <= 1.0 {
        Ok(())
    } else {
        Err(not_an_efficiency(field, value))
    }
}

#[cold]
fn not_an_efficiency(field: &'static str, value: f64) -> CycleError {
    let problem = if value > 1.0 {
        format!("{value} is above 1")
    } else {
        format!("{value} is not above 0")
    };
    CycleError::invalid(field, problem, "expected a fraction in (0, 1]")
}

#[inline]
fn loss(field: &'static str, value: f64) -> Result<(), CycleError> {
    if (0.0..1.0).contains(&value) {
        Ok(())
    } else {
        Err(not_a_loss(field, value))
    }
}

#[cold]
fn not_a_loss(field: &'static str, value: f64) -> CycleError {
    CycleError::invalid(
        field,
        format!("{value} is outside [0, 1)"),
        "expected a fraction ≥ 0 and < 1",
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ideal_config_is_valid() {
        assert!(EngineConfig::ideal(10.0, 1400.0).validate().is_ok());
    }

    #[test]
    fn each_range_check_names_its_field() {
        let base = EngineConfig::ideal(10.0, 1400.0);
        let cases: Vec<(EngineConfig, &str)> = vec![
            (
                EngineConfig {
                    pressure_ratio: 1.0,
                    ..base.clone()
                },
                "pressure_ratio",
            ),
            (
                EngineConfig {
                    compressor_efficiency: 0.0,
                    ..base.clone()
                },
                "compressor_efficiency",
            ),
            (
                EngineConfig {
                    turbine_efficiency: 1.01,
                    ..base.clone()
                },
                "turbine_efficiency",
            ),
            (
                EngineConfig {
                    combustor_pressure_loss: 1.0,
                    ..base.clone()
                },
                "combustor_pressure_loss",
            ),
            (
                EngineConfig {
                    ambient_pressure_kpa: f64::NAN,
                    ..base.clone()
                },
                "ambient_pressure_kpa",
            ),
            (
                EngineConfig {
                    regenerator: Some(Regenerator {
                        effectiveness: 1.2,
                        air_side_pressure_loss: 0.0,
                        gas_side_pressure_loss: 0.0,
                    }),
                    ..base.clone()
                },
                "regenerator.effectiveness",
            ),
            (
                EngineConfig {
                    intercooler: Some(Intercooler {
                        pressure_split: Some(12.0),
                        exit: IntercoolerExit::Effectiveness(0.8),
                    }),
                    ..base.clone()
                },
                "intercooler.pressure_split",
            ),
            (
                EngineConfig {
                    sizing: Some(Sizing::NetOutputKw(-5.0)),
                    ..base.clone()
                },
                "net_output_kw",
            ),
        ];
        for (config, field) in cases {
            let err = config.validate().unwrap_err();
            assert_eq!(err.field(), Some(field), "{err}");
        }
    }
}
