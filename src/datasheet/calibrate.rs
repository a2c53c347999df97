//! Fitting a datasheet: the engine whose design solve reproduces the
//! stated figures.
//!
//! # What the figures determine
//! With the output exact (the engine is sized by it), the heat rate, the
//! exhaust temperature and the exhaust flow are three conditions. Through
//! the first law they fix the electro-mechanical efficiency (the energy
//! balance's remainder, [`super::balance`]), and leave two conditions for
//! the gas path: its fuel–air ratio and its exhaust temperature. So two
//! gas-path unknowns can be fitted; the rest are stated assumptions:
//!
//! | stated by the vendor      | fitted                                   | from a stated relation |
//! |---------------------------|------------------------------------------|------------------------|
//! | pressure ratio and firing | efficiency level, cooling fraction        | —                      |
//! | pressure ratio            | efficiency level, firing temperature      | cooling from firing    |
//! | firing temperature        | efficiency level, pressure ratio          | cooling from firing    |
//! | neither                   | pressure ratio, firing temperature        | cooling from firing; efficiency level at its default |
//!
//! A stated regenerator is taken as stated (effectiveness, pressure
//! losses); the exhaust temperature is then its gas exit.
//!
//! The efficiency level is the compressor polytropic efficiency; the
//! turbine's is below it by a fixed gap ([`CalibrationOptions::efficiency_gap`]),
//! because the figures determine one efficiency, not two. The
//! electro-mechanical efficiency ε is fitted in every case and split as
//! `η_mech = η_gen = √ε` with no auxiliary load (the data determine only
//! the product). Pressure losses and combustion efficiency are defaults
//! (listed in [`Calibration::assumptions`]).
//!
//! # Method
//! Newton's method on the three conditions (relative heat-rate, exhaust
//! temperature and exhaust-flow errors) with a forward-difference Jacobian
//! and step halving, each unknown kept within bounds; it stops at 1e-9 of
//! each, far inside the tolerances [`HEAT_RATE_TOLERANCE`],
//! [`EXHAUST_TEMPERATURE_TOLERANCE_K`] and [`EXHAUST_FLOW_TOLERANCE`],
//! which the result is checked against.

use super::balance::{energy_balance, BalanceStatus};
use super::fit::{Engine, Fit, Problem};
use super::implied::{maximum_specific_work, minimum_exhaust_temperature_k};
use super::{Datasheet, DatasheetError};
use crate::cycle::{CycleResult, EfficiencyBasis, EngineConfig, GasModel, Sizing};
use crate::fuel::Fuel;
use crate::offdesign::{Ambient, Control, Machine, OffDesignError};
use serde::Serialize;

/// Heat rate reproduced to this, relative.
pub const HEAT_RATE_TOLERANCE: f64 = 5e-4;
/// Exhaust temperature reproduced to this, K.
pub const EXHAUST_TEMPERATURE_TOLERANCE_K: f64 = 0.5;
/// Exhaust flow reproduced to this, relative.
pub const EXHAUST_FLOW_TOLERANCE: f64 = 1e-3;

/// The assumptions of a calibration: what the figures do not determine.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CalibrationOptions {
    /// Inlet (filter, duct) pressure loss, fraction of ambient. Default
    /// 0.01 (about 10 mbar; common practice).
    pub inlet_pressure_loss: f64,
    /// Exhaust (diffuser, stack) pressure loss, fraction. Default 0.01
    /// (common practice for a simple-cycle stack).
    pub exhaust_pressure_loss: f64,
    /// Combustor pressure loss, fraction of its inlet pressure. Default
    /// 0.04 (common practice for lean premixed combustors, 3–5 %).
    pub combustor_pressure_loss: f64,
    /// Combustion efficiency. Default 1 (modern combustors burn out above
    /// 99.9 %; common practice).
    pub combustion_efficiency: f64,
    /// Compressor minus turbine polytropic efficiency. Default 0.01: the
    /// gap between the state-of-the-art limits of the two (0.93 and 0.92,
    /// from memory; [`super::implied::STATE_OF_THE_ART`]).
    pub efficiency_gap: f64,
    /// Compressor polytropic efficiency taken when the datasheet states
    /// neither pressure ratio nor firing temperature. Default 0.91 (a
    /// current heavy-duty compressor, from memory).
    pub compressor_polytropic_efficiency: f64,
    /// Firing temperature below which the turbine needs no cooling air, K.
    /// Default 1 200 K (uncooled first stages of older industrial turbines
    /// run to about this; from memory).
    pub cooling_onset_k: f64,
    /// Cooling air per kelvin of firing temperature above the onset,
    /// fraction of compressor air per K. Default 0.0004: 20 % at 1 700 K,
    /// within the 15–25 % usual for F-class machines (from memory).
    pub cooling_per_kelvin: f64,
}

impl Default for CalibrationOptions {
    fn default() -> Self {
        CalibrationOptions {
            inlet_pressure_loss: 0.01,
            exhaust_pressure_loss: 0.01,
            combustor_pressure_loss: 0.04,
            combustion_efficiency: 1.0,
            efficiency_gap: 0.01,
            compressor_polytropic_efficiency: 0.91,
            cooling_onset_k: 1200.0,
            cooling_per_kelvin: 0.0004,
        }
    }
}

impl CalibrationOptions {
    /// Cooling fraction from the stated correlation at `firing_temperature_k`:
    /// `cooling_per_kelvin · max(0, T_fire − cooling_onset_k)`.
    pub fn cooling_for(&self, firing_temperature_k: f64) -> f64 {
        self.cooling_per_kelvin * (firing_temperature_k - self.cooling_onset_k).max(0.0)
    }

    /// The engine configuration at `e`, sized by the datasheet's output.
    pub(super) fn config(&self, sheet: &Datasheet, e: &Engine) -> EngineConfig {
        let split = e.electro_mechanical.sqrt();
        EngineConfig {
            ambient_temperature_k: sheet.rating.temperature_k,
            ambient_pressure_kpa: sheet.rating.pressure_kpa,
            pressure_ratio: e.pressure_ratio,
            turbine_inlet_temperature_k: e.firing_k,
            compressor_efficiency: e.eta_c,
            turbine_efficiency: e.eta_c - self.efficiency_gap,
            efficiency_basis: EfficiencyBasis::Polytropic,
            inlet_pressure_loss: self.inlet_pressure_loss,
            exhaust_pressure_loss: self.exhaust_pressure_loss,
            combustor_pressure_loss: self.combustor_pressure_loss,
            combustion_efficiency: self.combustion_efficiency,
            mechanical_efficiency: split,
            generator_efficiency: split,
            auxiliary_load_fraction: 0.0,
            regenerator: sheet.regenerator,
            intercooler: None,
            reheat: None,
            sizing: Some(Sizing::NetOutputKw(sheet.net_output_kw)),
        }
    }

    /// Every assumption in words.
    fn describe(&self, sheet: &Datasheet, fit: Fit) -> Vec<String> {
        let mut out = vec![
            format!(
                "inlet pressure loss {:.1} %, exhaust pressure loss {:.1} %, combustor pressure loss {:.1} % (the candidate's where it states components, else defaults: common practice)",
                self.inlet_pressure_loss * 100.0,
                self.exhaust_pressure_loss * 100.0,
                self.combustor_pressure_loss * 100.0
            ),
            format!(
                "combustion efficiency {:.3} (the candidate's where it states components, else default: common practice)",
                self.combustion_efficiency
            ),
            format!(
                "turbine polytropic efficiency = compressor polytropic efficiency − {:.3}: the data determine one efficiency level, not two",
                self.efficiency_gap
            ),
            "mechanical and generator efficiency equal, their product fitted to the energy balance; no auxiliary load: the data determine only the product".into(),
            "single shaft; coolant mixed ahead of the rotor at the combustor inlet; complete combustion products of the stated fuel".into(),
        ];
        if let Some(g) = &sheet.regenerator {
            out.push(format!(
                "regenerator as stated: effectiveness {:.3}, air-side pressure loss {:.1} %, gas-side {:.1} %; the exhaust temperature is its gas exit",
                g.effectiveness,
                g.air_side_pressure_loss * 100.0,
                g.gas_side_pressure_loss * 100.0
            ));
        }
        if fit != Fit::EfficiencyAndCooling {
            out.push(format!(
                "turbine cooling {:.4} of compressor air per K of firing temperature above {:.0} K (correlation, from memory)",
                self.cooling_per_kelvin, self.cooling_onset_k
            ));
        }
        if fit == Fit::RatioAndFiring {
            out.push(format!(
                "compressor polytropic efficiency {:.3} (default): neither pressure ratio nor firing temperature is stated, so the efficiency is not determined by the data",
                self.compressor_polytropic_efficiency
            ));
        }
        out
    }

    fn validate(&self) -> Result<(), DatasheetError> {
        let losses = [
            ("calibration.inlet_pressure_loss", self.inlet_pressure_loss),
            (
                "calibration.exhaust_pressure_loss",
                self.exhaust_pressure_loss,
            ),
            (
                "calibration.combustor_pressure_loss",
                self.combustor_pressure_loss,
            ),
            ("calibration.efficiency_gap", self.efficiency_gap),
            ("calibration.cooling_per_kelvin", self.cooling_per_kelvin),
        ];
        for (field, v) in losses {
            if !(0.0..0.5).contains(&v) {
                return Err(DatasheetError::invalid(
                    field,
                    format!("{v} is outside [0, 0.5)"),
                    "expected a fraction ≥ 0 and < 0.5",
                ));
            }
        }
        for (field, v) in [
            (
                "calibration.combustion_efficiency",
                self.combustion_efficiency,
            ),
            (
                "calibration.compressor_polytropic_efficiency",
                self.compressor_polytropic_efficiency,
            ),
        ] {
            if !(v > 0.5 && v <= 1.0) {
                return Err(DatasheetError::invalid(
                    field,
                    format!("{v} is outside (0.5, 1]"),
                    "expected an efficiency above 0.5 and at most 1",
                ));
            }
        }
        if !(self.cooling_onset_k.is_finite() && self.cooling_onset_k > 0.0) {
            return Err(DatasheetError::invalid(
                "calibration.cooling_onset_k",
                format!("{} K is not a positive temperature", self.cooling_onset_k),
                "expected a temperature > 0 K",
            ));
        }
        Ok(())
    }
}

/// How far the fitted engine is from the stated figures.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Residuals {
    /// Model heat rate over stated (LHV) − 1.
    pub heat_rate_relative: f64,
    /// Model exhaust temperature − stated, K.
    pub exhaust_temperature_k: f64,
    /// Model exhaust flow over stated − 1.
    pub exhaust_flow_relative: f64,
    /// Model net output over stated − 1 (sized by it: rounding only).
    pub net_output_relative: f64,
}

/// A fitted engine: the design configuration that reproduces a datasheet.
#[derive(Debug, Clone, PartialEq)]
pub struct Calibration {
    /// The engine at the rating condition, polytropic efficiencies, sized
    /// by the rated net output: what [`Machine::calibrate`] takes.
    pub config: EngineConfig,
    /// Turbine cooling fraction ([`crate::cycle::Detail::turbine_cooling`]).
    pub turbine_cooling: f64,
    /// Compressor inlet air flow, kg/s.
    pub air_flow_kg_per_s: f64,
    /// The rating condition.
    pub rating: Ambient,
    /// The fuel.
    pub fuel: Fuel,
    /// Names of the fitted unknowns.
    pub fitted: Vec<&'static str>,
    /// Every assumption the fit rests on, in words.
    pub assumptions: Vec<String>,
    /// How closely the figures are reproduced.
    pub residuals: Residuals,
    /// The design solve of the fitted engine.
    pub result: CycleResult,
}

impl Calibration {
    /// Fitted compressor polytropic efficiency.
    pub fn compressor_polytropic_efficiency(&self) -> f64 {
        self.config.compressor_efficiency
    }

    /// Fitted turbine polytropic efficiency.
    pub fn turbine_polytropic_efficiency(&self) -> f64 {
        self.config.turbine_efficiency
    }

    /// Firing temperature, K.
    pub fn firing_temperature_k(&self) -> f64 {
        self.config.turbine_inlet_temperature_k
    }

    /// Compressor pressure ratio.
    pub fn pressure_ratio(&self) -> f64 {
        self.config.pressure_ratio
    }

    /// Fitted product of mechanical and generator efficiency.
    pub fn electro_mechanical_efficiency(&self) -> f64 {
        self.config.mechanical_efficiency * self.config.generator_efficiency
    }

    /// The fixed machine this calibration describes, under `control`.
    pub fn machine(&self, control: Control) -> Result<Machine, OffDesignError> {
        Machine::calibrate(
            &self.config,
            self.turbine_cooling,
            self.rating,
            control,
            GasModel::Products,
            &self.fuel,
        )
    }
}

/// Fit the engine to `sheet` under `options`.
///
/// Errors: an invalid datasheet (naming the figure); figures that cannot
/// all be true ([`DatasheetError::Impossible`]: a negative energy balance,
/// an exhaust colder than its pressure ratio allows, an air flow below what
/// the output needs), each message naming the figures; no engine within
/// bounds reproducing them ([`DatasheetError::NoFit`], naming the unknown
/// that ran out).
pub fn calibrate(
    sheet: &Datasheet,
    options: &CalibrationOptions,
) -> Result<Calibration, DatasheetError> {
    options.validate()?;
    let balance = energy_balance(sheet)?;
    if balance.status == BalanceStatus::Negative {
        return Err(DatasheetError::Impossible(balance.describe()));
    }
    let fuel_air = balance.fuel_flow_kg_per_s / balance.air_flow_kg_per_s;
    if let Some(message) = too_little_air(sheet, balance.air_flow_kg_per_s)? {
        return Err(DatasheetError::Impossible(message));
    }
    // A regenerator takes heat from the exhaust, so the ideal-cycle bound on
    // the exhaust temperature holds for simple cycles only.
    if let (Some(r), None) = (sheet.pressure_ratio, &sheet.regenerator) {
        if let Some(message) = too_cold_for_ratio(sheet, r, fuel_air)? {
            return Err(DatasheetError::Impossible(message));
        }
    }
    let fit = match (sheet.pressure_ratio, sheet.firing_temperature_k) {
        (Some(_), Some(_)) => Fit::EfficiencyAndCooling,
        (Some(_), None) => Fit::EfficiencyAndFiring,
        (None, Some(_)) => Fit::EfficiencyAndRatio,
        (None, None) => Fit::RatioAndFiring,
    };
    let firing = sheet.firing_temperature_k.unwrap_or(1500.0);
    let start = Engine {
        eta_c: options.compressor_polytropic_efficiency,
        pressure_ratio: sheet.pressure_ratio.unwrap_or(15.0),
        firing_k: firing,
        cooling: options.cooling_for(firing),
        electro_mechanical: (sheet.net_output_kw / (sheet.net_output_kw + balance.remainder_kw))
            .clamp(0.5, 1.0),
    };
    let problem = Problem {
        sheet,
        options,
        fit,
        start,
    };
    let x = problem.newton()?;
    let engine = problem.engine(&x);
    let (result, residuals) =
        problem
            .evaluate(&engine)
            .map_err(|source| DatasheetError::Cycle {
                context: "fitted engine".into(),
                source,
            })?;
    if !(residuals.heat_rate_relative.abs() <= HEAT_RATE_TOLERANCE
        && residuals.exhaust_temperature_k.abs() <= EXHAUST_TEMPERATURE_TOLERANCE_K
        && residuals.exhaust_flow_relative.abs() <= EXHAUST_FLOW_TOLERANCE)
    {
        return Err(DatasheetError::NoFit(format!(
            "the best engine found misses the figures (heat rate {:+.3} %, exhaust temperature {:+.2} K, exhaust flow {:+.3} %)",
            residuals.heat_rate_relative * 100.0,
            residuals.exhaust_temperature_k,
            residuals.exhaust_flow_relative * 100.0
        )));
    }
    let air_flow = result.flows.map_or(f64::NAN, |f| f.air_flow_kg_per_s);
    Ok(Calibration {
        config: options.config(sheet, &engine),
        turbine_cooling: engine.cooling,
        air_flow_kg_per_s: air_flow,
        rating: sheet.rating,
        fuel: sheet.fuel.clone(),
        fitted: fit.names().to_vec(),
        assumptions: options.describe(sheet, fit),
        residuals,
        result,
    })
}

/// The exhaust flow check: is the air flow enough for the output at the
/// state-of-the-art specific work? A message naming the exhaust flow when
/// not.
pub(crate) fn too_little_air(
    sheet: &Datasheet,
    air_flow_kg_per_s: f64,
) -> Result<Option<String>, DatasheetError> {
    let w_max = maximum_specific_work(sheet)?;
    let needed = sheet.net_output_kw / w_max;
    Ok((air_flow_kg_per_s < needed).then(|| {
        format!(
            "rating.exhaust_flow {:.2} kg/s is below the air flow its output needs: {:.0} kW at the state-of-the-art limit of {w_max:.0} kJ per kg of air (firing 1 900 K, polytropic efficiencies 0.93 and 0.92, no losses) needs at least {needed:.2} kg/s of air, {:.2} kg/s of exhaust, where the figures leave {air_flow_kg_per_s:.2} kg/s",
            sheet.exhaust_flow_kg_per_s,
            sheet.net_output_kw,
            needed + sheet.fuel_flow_kg_per_s()
        )
    }))
}

/// The exhaust temperature check against a stated pressure ratio: a
/// message naming both when the exhaust is colder than ideal components
/// would leave it at that ratio and fuel–air ratio.
pub(crate) fn too_cold_for_ratio(
    sheet: &Datasheet,
    pressure_ratio: f64,
    fuel_air_ratio: f64,
) -> Result<Option<String>, DatasheetError> {
    let Some(t_min) = minimum_exhaust_temperature_k(sheet, pressure_ratio, fuel_air_ratio) else {
        return Ok(None);
    };
    let t = sheet.exhaust_temperature_k;
    Ok((t < t_min - EXHAUST_TEMPERATURE_TOLERANCE_K).then(|| {
        format!(
            "rating.exhaust_temperature {t:.1} K is below what rating.pressure_ratio {pressure_ratio} allows: with the fuel the heat rate burns, even an ideal compressor and turbine (no losses) leave the exhaust at {t_min:.1} K; the exhaust temperature would have to rise by at least {:.1} K, or the pressure ratio be higher",
            t_min - t
        )
    }))
}
