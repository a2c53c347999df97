//! The datasheet's own first law.
//!
//! Around the whole machine (inlet flange to exhaust flange, generator
//! terminals), in steady state:
//!
//! ```text
//! fuel energy (LHV) = net output + exhaust energy above the inlet state + remainder
//! ```
//!
//! - fuel energy `Q = HR_LHV · P / 3600` kW; fuel flow `Q / LHV`;
//! - air flow = exhaust flow − fuel flow; the exhaust is the complete
//!   combustion products of that fuel in the rating's humid air;
//! - exhaust energy as in the cycle solver's heat rejected: the exhaust's
//!   enthalpy less the inlet air's, both from 298.15 K, where the LHV is
//!   defined (the fuel enters at 298.15 K);
//! - the remainder is everything else that leaves: bearing and gearbox
//!   losses, generator losses, auxiliaries, heat from the casing and the
//!   lube oil, unburned fuel.
//!
//! # Plausible range of the remainder: 0.5 % to 4 % of the fuel energy
//! Common practice, reasoned: generator losses are about 1.5–2.5 % of
//! output (air-cooled generators are 97.5–98.8 % efficient), bearings and
//! gearbox 0.5–1.5 %, auxiliaries 0.3–1 %, casing radiation and lube-oil
//! heat a few tenths of a percent; at 30–42 % efficiency that is about
//! 1–2.5 % of fuel energy; small gearbox-driven machines lose more. Below
//! 0.5 % the figures leave too little for the generator alone; above 4 %
//! they leave more than usual, most likely energy that the machine sends up
//! the stack (an exhaust flow or temperature stated too low); above
//! [`REMAINDER_IMPOSSIBLE`] (8 %) no machine loses that much outside its
//! gas path (over 20 % of the output at 25–40 % efficiency). A negative
//! remainder breaks the first law: the figures cannot all be true.

use super::streams::Streams;
use super::{Datasheet, DatasheetError};
use serde::Serialize;

/// Lower end of the plausible remainder, fraction of fuel energy (common
/// practice; see the module documentation).
pub const REMAINDER_LOW: f64 = 0.005;
/// Upper end of the plausible remainder, fraction of fuel energy (common
/// practice; see the module documentation).
pub const REMAINDER_HIGH: f64 = 0.04;
/// Remainder above which the figures cannot all be true, fraction of fuel
/// energy: twice the plausible upper end (common practice, reasoned in the
/// module documentation).
pub const REMAINDER_IMPOSSIBLE: f64 = 0.08;

/// Where the remainder falls.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum BalanceStatus {
    /// Within [`REMAINDER_LOW`]..=[`REMAINDER_HIGH`].
    Plausible,
    /// Between 0 and [`REMAINDER_LOW`]: fewer losses than a machine has.
    TooLittleLoss,
    /// Above [`REMAINDER_HIGH`]: energy unaccounted for (beyond
    /// [`REMAINDER_IMPOSSIBLE`] the figures cannot all be true).
    TooMuchLoss,
    /// Below 0: the figures break the first law.
    Negative,
}

/// A datasheet figure that a closure moves.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Figure {
    /// `rating.heat_rate`.
    HeatRate,
    /// `rating.exhaust_temperature`.
    ExhaustTemperature,
    /// `rating.exhaust_flow`.
    ExhaustFlow,
}

impl Figure {
    /// The scenario key the figure is stated under.
    pub fn key(&self) -> &'static str {
        match self {
            Figure::HeatRate => "rating.heat_rate",
            Figure::ExhaustTemperature => "rating.exhaust_temperature",
            Figure::ExhaustFlow => "rating.exhaust_flow",
        }
    }
}

/// One figure moved, alone, so that the remainder reaches `target_fraction`.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Closure {
    /// The figure moved.
    pub figure: Figure,
    /// Its stated value (heat rate kJ/kWh on the stated basis, exhaust
    /// temperature K, exhaust flow kg/s).
    pub stated: f64,
    /// The value that would give the target remainder, same unit.
    pub needed: f64,
    /// The remainder it would give, fraction of fuel energy.
    pub target_fraction: f64,
}

impl Closure {
    /// The move in words, naming the key: "heat rate (rating.heat_rate) up
    /// by 17.6 % (to 8741 kJ/kWh)", "exhaust temperature
    /// (rating.exhaust_temperature) down by 45.2 K (to 799.1 K)", …
    pub fn describe(&self) -> String {
        let direction = if self.needed > self.stated {
            "up"
        } else {
            "down"
        };
        match self.figure {
            Figure::ExhaustTemperature => format!(
                "exhaust temperature (rating.exhaust_temperature) {direction} by {:.1} K (to {:.1} K)",
                (self.needed - self.stated).abs(),
                self.needed
            ),
            Figure::HeatRate => format!(
                "heat rate (rating.heat_rate) {direction} by {:.1} % (to {:.0} kJ/kWh)",
                ((self.needed / self.stated) - 1.0).abs() * 100.0,
                self.needed
            ),
            Figure::ExhaustFlow => format!(
                "exhaust flow (rating.exhaust_flow) {direction} by {:.1} % (to {:.2} kg/s)",
                ((self.needed / self.stated) - 1.0).abs() * 100.0,
                self.needed
            ),
        }
    }
}

/// The first law of one datasheet.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EnergyBalance {
    /// Fuel energy in, kW (LHV).
    pub fuel_energy_kw: f64,
    /// Net electrical output, kW.
    pub net_output_kw: f64,
    /// Exhaust energy above the inlet state, kW.
    pub exhaust_energy_kw: f64,
    /// Fuel energy − output − exhaust energy, kW.
    pub remainder_kw: f64,
    /// The remainder as a fraction of fuel energy.
    pub remainder_fraction: f64,
    /// Fuel flow, kg/s.
    pub fuel_flow_kg_per_s: f64,
    /// Air flow (exhaust flow − fuel flow), kg/s.
    pub air_flow_kg_per_s: f64,
    /// Where the remainder falls.
    pub status: BalanceStatus,
    /// Outside the plausible range: each figure moved alone to the nearest
    /// end of it (to 0 when negative, to close the balance). A figure that
    /// no value within the property data moves far enough is left out.
    pub closures: Vec<Closure>,
}

impl EnergyBalance {
    /// One sentence on the balance: its remainder and, outside the
    /// plausible range, what would have to move.
    pub fn describe(&self) -> String {
        let pct = self.remainder_fraction * 100.0;
        let moves = self
            .closures
            .iter()
            .map(Closure::describe)
            .collect::<Vec<_>>()
            .join(", or ");
        let range = format!(
            "{:.1}–{:.0} %",
            REMAINDER_LOW * 100.0,
            REMAINDER_HIGH * 100.0
        );
        match self.status {
            BalanceStatus::Plausible => format!(
                "energy balance: {pct:.2} % of the fuel energy is left for mechanical, generator, auxiliary and casing losses (plausible: {range})"
            ),
            BalanceStatus::Negative => format!(
                "energy balance: output plus exhaust energy exceed the fuel energy by {:.2} % of it, so rating.heat_rate, rating.exhaust_temperature and rating.exhaust_flow cannot all be true; to close it: {moves}",
                -pct
            ),
            BalanceStatus::TooLittleLoss => format!(
                "energy balance: only {pct:.2} % of the fuel energy is left for mechanical, generator, auxiliary and casing losses (plausible: {range}); to reach {:.1} %: {moves}",
                REMAINDER_LOW * 100.0
            ),
            BalanceStatus::TooMuchLoss => format!(
                "energy balance: {pct:.2} % of the fuel energy is unaccounted for (plausible losses: {range}; above {:.0} % no machine loses that much outside its gas path), so the exhaust flow or temperature is likely understated; to reach {:.0} %: {moves}",
                REMAINDER_IMPOSSIBLE * 100.0,
                REMAINDER_HIGH * 100.0
            ),
        }
    }
}

/// The energy balance of `sheet`.
///
/// Errors: an invalid datasheet (naming the figure); products that would
/// need more oxygen than the air holds.
pub fn energy_balance(sheet: &Datasheet) -> Result<EnergyBalance, DatasheetError> {
    sheet.validate()?;
    let streams = Streams::new(sheet)?;
    let lhv = sheet.fuel.lhv_kj_per_kg();
    let p = sheet.net_output_kw;
    let q = sheet.fuel_energy_kw();
    let fuel = q / lhv;
    let air = sheet.exhaust_flow_kg_per_s - fuel;
    let stoichiometric = streams.stoichiometric_fuel_air_ratio();
    if fuel / air > stoichiometric {
        let needed = fuel / stoichiometric + fuel;
        return Err(DatasheetError::invalid(
            "rating.exhaust_flow",
            format!(
                "{:.3} kg/s leaves {air:.3} kg/s of air for {fuel:.3} kg/s of fuel, more fuel than the air's oxygen can burn (fuel–air ratio {:.4}, stoichiometric {stoichiometric:.4})",
                sheet.exhaust_flow_kg_per_s,
                fuel / air
            ),
            format!("expected an exhaust flow of at least {needed:.3} kg/s for this heat rate and output"),
        ));
    }
    let exhaust = streams.exhaust_energy_kw(air, fuel, sheet.exhaust_temperature_k)?;
    let remainder = q - p - exhaust;
    let fraction = remainder / q;
    let (status, target) = if fraction < 0.0 {
        (BalanceStatus::Negative, Some(0.0))
    } else if fraction < REMAINDER_LOW {
        (BalanceStatus::TooLittleLoss, Some(REMAINDER_LOW))
    } else if fraction > REMAINDER_HIGH {
        (BalanceStatus::TooMuchLoss, Some(REMAINDER_HIGH))
    } else {
        (BalanceStatus::Plausible, None)
    };
    let closures = match target {
        None => Vec::new(),
        Some(t) => closures(sheet, &streams, t),
    };
    Ok(EnergyBalance {
        fuel_energy_kw: q,
        net_output_kw: p,
        exhaust_energy_kw: exhaust,
        remainder_kw: remainder,
        remainder_fraction: fraction,
        fuel_flow_kg_per_s: fuel,
        air_flow_kg_per_s: air,
        status,
        closures,
    })
}

/// Each figure moved alone until the remainder is `target` of the fuel
/// energy.
fn closures(sheet: &Datasheet, streams: &Streams, target: f64) -> Vec<Closure> {
    let lhv = sheet.fuel.lhv_kj_per_kg();
    let p = sheet.net_output_kw;
    let m_ex = sheet.exhaust_flow_kg_per_s;
    let t_ex = sheet.exhaust_temperature_k;
    let q0 = sheet.fuel_energy_kw();
    // Remainder minus its target, kW, as a function of the fuel energy,
    // exhaust temperature and exhaust flow.
    let gap = |q: f64, t: f64, m: f64| -> Option<f64> {
        let fuel = q / lhv;
        if m.is_nan() || m <= fuel {
            return None;
        }
        let e = streams.exhaust_energy_kw(m - fuel, fuel, t).ok()?;
        Some(q - p - e - target * q)
    };
    let mut out = Vec::new();
    // Heat rate: the stated basis moves with the LHV one in proportion.
    if let Some(q) = root(|q| gap(q, t_ex, m_ex), q0, q0 * 1.01) {
        out.push(Closure {
            figure: Figure::HeatRate,
            stated: sheet.heat_rate_kj_per_kwh,
            needed: sheet.heat_rate_kj_per_kwh * q / q0,
            target_fraction: target,
        });
    }
    if let Some(t) = root(|t| gap(q0, t, m_ex), t_ex, t_ex - 5.0) {
        if t > sheet.rating.temperature_k {
            out.push(Closure {
                figure: Figure::ExhaustTemperature,
                stated: t_ex,
                needed: t,
                target_fraction: target,
            });
        }
    }
    if let Some(m) = root(|m| gap(q0, t_ex, m), m_ex, m_ex * 0.99) {
        out.push(Closure {
            figure: Figure::ExhaustFlow,
            stated: m_ex,
            needed: m,
            target_fraction: target,
        });
    }
    out
}

/// A root of `g` by the secant method from `x0`, `x1`, to 1e-10 relative;
/// `None` when `g` has no value on the way or the steps do not settle.
pub(crate) fn root(g: impl Fn(f64) -> Option<f64>, x0: f64, x1: f64) -> Option<f64> {
    let (mut a, mut b) = (x0, x1);
    let (mut ga, mut gb) = (g(a)?, g(b)?);
    for _ in 0..60 {
        if gb == ga {
            return None;
        }
        let c = b - gb * (b - a) / (gb - ga);
        if !c.is_finite() {
            return None;
        }
        if (c - b).abs() <= 1e-10 * c.abs().max(1.0) {
            return Some(c);
        }
        let gc = g(c)?;
        (a, ga, b, gb) = (b, gb, c, gc);
    }
    None
}
