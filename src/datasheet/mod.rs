//! A vendor's datasheet: what a bid states at its rating condition, what
//! those figures imply about the engine inside, and whether that is
//! physically possible.
//!
//! # Pieces
//! - [`Datasheet`]: net output, heat rate (LHV or HHV), exhaust flow and
//!   temperature, optional pressure ratio and firing temperature, the
//!   rating condition and the fuel.
//! - [`balance`]: the datasheet's own first law. Fuel energy in minus net
//!   output minus exhaust energy above the inlet state leaves the
//!   mechanical, generator, auxiliary and casing losses; outside its
//!   plausible range it says which figure would have to move, and by how
//!   much.
//! - [`mod@calibrate`]: fits the engine's unknowns (firing temperature,
//!   polytropic efficiencies, cooling fraction, air flow, electro-mechanical
//!   efficiency) so the design solve reproduces the figures, and returns
//!   the [`crate::cycle::EngineConfig`] an [`crate::offdesign::Machine`]
//!   takes, every assumption stated.
//! - [`implied`]: the implied components judged against state-of-the-art
//!   ranges ([`implied::STATE_OF_THE_ART`]), with a verdict and its reasons;
//!   component data also given are compared with the fit.
//! - [`curves`]: vendor part-load and ambient-correction curves against the
//!   calibrated machine.
//! - [`ComponentData::from_engine`]: a candidate's stated components
//!   (isentropic or polytropic) on the polytropic basis the fit uses.
//!
//! Single-shaft machines, simple or regenerated: the exhaust temperature is
//! the turbine exit, or the regenerator's gas exit when the datasheet
//! states a regenerator (its effectiveness and pressure losses are then
//! taken as stated, not fitted).

pub mod balance;
pub mod calibrate;
pub mod curves;
mod error;
mod fit;
pub mod implied;
mod stated;
mod streams;

pub use balance::{energy_balance, BalanceStatus, Closure, EnergyBalance, Figure};
pub use calibrate::{calibrate, Calibration, CalibrationOptions, Residuals};
pub use curves::{
    check_ambient_correction, check_part_load, AmbientCorrectionPoint, CurveDeviation,
    PartLoadPoint, CURVE_THRESHOLD,
};
pub use error::DatasheetError;
pub use implied::{assess, Assessment, ComponentData, Disagreement, Implied, Verdict};

use crate::cycle::Regenerator;
use crate::fuel::Fuel;
use crate::offdesign::Ambient;
use crate::thermo::{MAX_TEMPERATURE_K, MIN_TEMPERATURE_K};
use serde::Serialize;

/// The heating-value basis a heat rate is stated on.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum HeatRateBasis {
    /// Lower (net) heating value: water in the products stays vapour. The
    /// usual basis of gas-turbine ratings (common practice).
    Lhv,
    /// Higher (gross) heating value: the water's latent heat counted.
    Hhv,
}

/// A vendor's rating figures at one rating condition.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Datasheet {
    /// Net electrical output at the rating condition, kW.
    pub net_output_kw: f64,
    /// Heat rate, kJ of fuel per kWh of net output, on `heat_rate_basis`.
    pub heat_rate_kj_per_kwh: f64,
    /// Basis of `heat_rate_kj_per_kwh`.
    pub heat_rate_basis: HeatRateBasis,
    /// Exhaust mass flow (air plus fuel), kg/s.
    pub exhaust_flow_kg_per_s: f64,
    /// Exhaust temperature where the gas leaves the machine, K: the turbine
    /// exit, or the regenerator gas exit when there is one.
    pub exhaust_temperature_k: f64,
    /// Compressor pressure ratio, when the vendor states it.
    pub pressure_ratio: Option<f64>,
    /// Firing temperature (combustor exit, ahead of the first nozzle), K,
    /// when the vendor states it.
    pub firing_temperature_k: Option<f64>,
    /// The machine's regenerator (recuperator) as the vendor states it, if
    /// it has one.
    #[serde(skip)]
    pub regenerator: Option<Regenerator>,
    /// The rating condition: ambient temperature, pressure, humidity.
    pub rating: Ambient,
    /// The fuel the rating is for; needs its composition.
    pub fuel: Fuel,
}

impl Datasheet {
    /// The heat rate on the lower-heating-value basis, kJ/kWh: an HHV heat
    /// rate times LHV/HHV of the datasheet's fuel.
    pub fn heat_rate_lhv_kj_per_kwh(&self) -> f64 {
        match self.heat_rate_basis {
            HeatRateBasis::Lhv => self.heat_rate_kj_per_kwh,
            HeatRateBasis::Hhv => self.heat_rate_kj_per_kwh / self.fuel.hhv_over_lhv(),
        }
    }

    /// Fuel energy in at the rating, kW (LHV).
    pub fn fuel_energy_kw(&self) -> f64 {
        self.heat_rate_lhv_kj_per_kwh() * self.net_output_kw / 3600.0
    }

    /// Fuel flow at the rating, kg/s.
    pub fn fuel_flow_kg_per_s(&self) -> f64 {
        self.fuel_energy_kw() / self.fuel.lhv_kj_per_kg()
    }

    /// Compressor inlet air flow the figures imply, kg/s: exhaust flow less
    /// fuel flow (no air is bled overboard).
    pub fn air_flow_kg_per_s(&self) -> f64 {
        self.exhaust_flow_kg_per_s - self.fuel_flow_kg_per_s()
    }

    /// Range checks, each naming the figure as the scenario spells it.
    /// Needs a fuel with composition; the heat rate must be above 3600
    /// kJ/kWh (an efficiency below 1); the exhaust must be hotter than the
    /// rating ambient and within the property data; the exhaust flow must
    /// exceed the fuel flow.
    pub fn validate(&self) -> Result<(), DatasheetError> {
        if self.fuel.stoichiometry().is_none() {
            return Err(DatasheetError::FuelNotModelled);
        }
        positive("net_output", self.net_output_kw, "kW")?;
        positive("rating.exhaust_flow", self.exhaust_flow_kg_per_s, "kg/s")?;
        let hr = self.heat_rate_lhv_kj_per_kwh();
        if !(hr.is_finite() && hr > 3600.0) {
            return Err(DatasheetError::invalid(
                "rating.heat_rate",
                format!(
                    "{} kJ/kWh ({} kJ/kWh on LHV) is an efficiency of 1 or more",
                    self.heat_rate_kj_per_kwh, hr
                ),
                "expected a heat rate above 3600 kJ/kWh on the LHV basis (efficiency below 100 %)",
            ));
        }
        let r = &self.rating;
        if !(MIN_TEMPERATURE_K..=MAX_TEMPERATURE_K).contains(&r.temperature_k) {
            return Err(DatasheetError::invalid(
                "rating.temperature",
                format!("{} K is outside the property data", r.temperature_k),
                format!("expected {MIN_TEMPERATURE_K} K to {MAX_TEMPERATURE_K} K"),
            ));
        }
        positive("rating.pressure", r.pressure_kpa, "kPa")?;
        if !(0.0..=1.0).contains(&r.relative_humidity) {
            return Err(DatasheetError::invalid(
                "rating.relative_humidity",
                format!("{} is outside 0 to 1", r.relative_humidity),
                "expected a relative humidity from 0 to 1",
            ));
        }
        let t = self.exhaust_temperature_k;
        if !(t.is_finite() && t > r.temperature_k && t <= MAX_TEMPERATURE_K) {
            return Err(DatasheetError::invalid(
                "rating.exhaust_temperature",
                format!(
                    "{t} K is not above the rating ambient {} K or is beyond the property data",
                    r.temperature_k
                ),
                format!(
                    "expected an exhaust temperature above {} K and at most {MAX_TEMPERATURE_K} K",
                    r.temperature_k
                ),
            ));
        }
        if let Some(p) = self.pressure_ratio {
            if !(p.is_finite() && p > 1.0) {
                return Err(DatasheetError::invalid(
                    "rating.pressure_ratio",
                    format!("{p} is not above 1"),
                    "expected a compressor pressure ratio > 1",
                ));
            }
        }
        if let Some(t3) = self.firing_temperature_k {
            if !(t3.is_finite() && t3 > t && t3 <= MAX_TEMPERATURE_K) {
                return Err(DatasheetError::invalid(
                    "rating.firing_temperature",
                    format!("{t3} K is not above the exhaust temperature {t} K or is beyond the property data"),
                    format!("expected a firing temperature above {t} K and at most {MAX_TEMPERATURE_K} K"),
                ));
            }
        }
        if let Some(g) = &self.regenerator {
            if !(g.effectiveness > 0.0 && g.effectiveness <= 1.0) {
                return Err(DatasheetError::invalid(
                    "regenerator.effectiveness",
                    format!("{} is outside (0, 1]", g.effectiveness),
                    "expected an effectiveness above 0 and at most 1",
                ));
            }
            for (field, v) in [
                (
                    "regenerator.air_side_pressure_loss",
                    g.air_side_pressure_loss,
                ),
                (
                    "regenerator.gas_side_pressure_loss",
                    g.gas_side_pressure_loss,
                ),
            ] {
                if !(0.0..1.0).contains(&v) {
                    return Err(DatasheetError::invalid(
                        field,
                        format!("{v} is outside [0, 1)"),
                        "expected a fraction ≥ 0 and < 1",
                    ));
                }
            }
        }
        let fuel_flow = self.fuel_flow_kg_per_s();
        if self.exhaust_flow_kg_per_s <= fuel_flow {
            return Err(DatasheetError::invalid(
                "rating.exhaust_flow",
                format!(
                    "{} kg/s is not more than the fuel flow {fuel_flow:.3} kg/s that the heat rate and output burn",
                    self.exhaust_flow_kg_per_s
                ),
                "expected an exhaust flow (air plus fuel) above the fuel flow",
            ));
        }
        Ok(())
    }
}

fn positive(field: &'static str, value: f64, unit: &str) -> Result<(), DatasheetError> {
    if value.is_finite() && value > 0.0 {
        Ok(())
    } else {
        Err(DatasheetError::invalid(
            field,
            format!("{value} {unit} is not a positive number"),
            format!("expected a value > 0 {unit}"),
        ))
    }
}
