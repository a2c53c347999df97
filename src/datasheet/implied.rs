//! What a datasheet implies, judged against the state of the art.
//!
//! [`assess`] runs the energy balance ([`super::balance`]) and the
//! calibration ([`mod@super::calibrate`]), then compares the implied values with
//! [`STATE_OF_THE_ART`]:
//!
//! - [`Verdict::Impossible`]: a negative energy-balance remainder or one
//!   above [`REMAINDER_IMPOSSIBLE`], an exhaust colder than its pressure ratio allows, an air
//!   flow below what the output needs at the state-of-the-art specific
//!   work, or no engine that reproduces the figures;
//! - [`Verdict::Optimistic`] (possible, but beyond current practice or
//!   doubtful): a remainder outside the plausible range, or an implied
//!   efficiency, firing temperature or cooling beyond the state of
//!   the art;
//! - [`Verdict::Plausible`] otherwise.
//!
//! Component values also given ([`ComponentData`]) are compared with the
//! fit and every disagreement is reported with both values
//! ([`Disagreement`]); they never replace the fit.

use super::balance::{
    energy_balance, BalanceStatus, EnergyBalance, REMAINDER_HIGH, REMAINDER_IMPOSSIBLE,
    REMAINDER_LOW,
};
use super::calibrate::{calibrate, Calibration, CalibrationOptions};
use super::{Datasheet, DatasheetError};
use crate::cycle::{self, EfficiencyBasis, EngineConfig, GasModel};
use serde::Serialize;

/// One state-of-the-art limit and where it comes from.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Limit {
    /// What is limited (as in [`Implied`]'s field names).
    pub quantity: &'static str,
    /// The limit.
    pub value: f64,
    /// Where the limit comes from.
    pub source: &'static str,
}

/// Highest compressor polytropic efficiency of current industrial axial
/// compressors.
pub const COMPRESSOR_POLYTROPIC_MAX: f64 = 0.93;
/// Highest turbine polytropic efficiency, uncooled-equivalent (the coolant
/// mixed ahead of the rotor carries the cooling losses).
pub const TURBINE_POLYTROPIC_MAX: f64 = 0.92;
/// Highest firing temperature of current heavy-duty classes, K.
pub const FIRING_TEMPERATURE_MAX_K: f64 = 1900.0;

/// The state-of-the-art table the verdict uses.
pub const STATE_OF_THE_ART: [Limit; 6] = [
    Limit {
        quantity: "compressor_polytropic_efficiency",
        value: COMPRESSOR_POLYTROPIC_MAX,
        source: "best current axial compressors reach about 0.92–0.93 polytropic (from memory; Walsh and Fletcher, Gas Turbine Performance, component chapters)",
    },
    Limit {
        quantity: "turbine_polytropic_efficiency",
        value: TURBINE_POLYTROPIC_MAX,
        source: "best current turbines about 0.90–0.92 polytropic, uncooled-equivalent (from memory; Walsh and Fletcher)",
    },
    Limit {
        quantity: "firing_temperature_k",
        value: FIRING_TEMPERATURE_MAX_K,
        source: "current H/J-class heavy-duty machines fire at about 1 600–1 650 °C, about 1 900 K (from memory; vendors' published class ratings)",
    },
    Limit {
        quantity: "loss_remainder_fraction (low)",
        value: REMAINDER_LOW,
        source: "generator, bearing, auxiliary and casing losses together are at least about 0.5 % of fuel energy (common practice; src/datasheet/balance.rs)",
    },
    Limit {
        quantity: "loss_remainder_fraction (high)",
        value: REMAINDER_HIGH,
        source: "and at most about 4 % (common practice; src/datasheet/balance.rs)",
    },
    Limit {
        quantity: "loss_remainder_fraction (impossible)",
        value: REMAINDER_IMPOSSIBLE,
        source: "above 8 % of fuel energy, over 20 % of the output, no machine loses outside its gas path (common practice; src/datasheet/balance.rs)",
    },
];

/// How credible a datasheet is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Verdict {
    /// Every implied value within the state of the art.
    Plausible,
    /// Possible, but beyond the state of the art or doubtful.
    Optimistic,
    /// The figures cannot all be true.
    Impossible,
}

/// What a datasheet implies about the engine inside.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Implied {
    /// Compressor polytropic efficiency (`None` when no engine fits).
    pub compressor_polytropic_efficiency: Option<f64>,
    /// Turbine polytropic efficiency, uncooled-equivalent.
    pub turbine_polytropic_efficiency: Option<f64>,
    /// Firing temperature, K.
    pub firing_temperature_k: Option<f64>,
    /// Turbine cooling, fraction of compressor air.
    pub turbine_cooling: Option<f64>,
    /// Compressor pressure ratio.
    pub pressure_ratio: Option<f64>,
    /// Compressor inlet air flow, kg/s (the fit's, else exhaust less fuel).
    pub air_flow_kg_per_s: f64,
    /// Energy-balance remainder, fraction of fuel energy.
    pub loss_remainder_fraction: f64,
    /// The verdict.
    pub verdict: Verdict,
    /// Why, one sentence each, naming figures and limits.
    pub reasons: Vec<String>,
}

/// Component values a candidate also states (any subset), to be checked
/// against the fit.
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize)]
pub struct ComponentData {
    /// Compressor pressure ratio.
    pub pressure_ratio: Option<f64>,
    /// Firing (turbine inlet) temperature, K.
    pub firing_temperature_k: Option<f64>,
    /// Compressor polytropic efficiency.
    pub compressor_polytropic_efficiency: Option<f64>,
    /// Turbine polytropic efficiency.
    pub turbine_polytropic_efficiency: Option<f64>,
    /// Turbine cooling fraction.
    pub turbine_cooling: Option<f64>,
}

/// A stated component value the fit does not bear out.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Disagreement {
    /// The component value (as in [`ComponentData`]).
    pub field: &'static str,
    /// What the candidate states.
    pub stated: f64,
    /// What the datasheet implies.
    pub implied: f64,
    /// The agreement allowed (absolute; relative for the pressure ratio).
    pub tolerance: f64,
}

impl Disagreement {
    /// In words, both values.
    pub fn describe(&self) -> String {
        format!(
            "{}: the candidate states {:.4}, its rating implies {:.4}",
            self.field, self.stated, self.implied
        )
    }
}

/// Agreement allowed between a stated component value and the fit, before
/// it is reported: about what the fit's default assumptions (losses,
/// efficiency gap, cooling correlation) can move it (a judgement, stated).
pub const AGREEMENT: ComponentData = ComponentData {
    pressure_ratio: Some(0.03),
    firing_temperature_k: Some(20.0),
    compressor_polytropic_efficiency: Some(0.01),
    turbine_polytropic_efficiency: Some(0.01),
    turbine_cooling: Some(0.03),
};

/// Everything a datasheet yields.
#[derive(Debug, Clone, PartialEq)]
pub struct Assessment {
    /// The datasheet's energy balance.
    pub balance: EnergyBalance,
    /// The fitted engine, when one reproduces the figures.
    pub calibration: Option<Calibration>,
    /// What the figures imply and the verdict.
    pub implied: Implied,
    /// Stated component values that the fit does not bear out.
    pub disagreements: Vec<Disagreement>,
}

/// Assess `sheet`: energy balance, calibration under `options`, implied
/// values and verdict, and `components` checked against the fit.
///
/// Errors only for a datasheet that cannot be read (a figure out of range,
/// a fuel without composition); figures that cannot be true give
/// [`Verdict::Impossible`] with reasons.
pub fn assess(
    sheet: &Datasheet,
    components: &ComponentData,
    options: &CalibrationOptions,
) -> Result<Assessment, DatasheetError> {
    let balance = energy_balance(sheet)?;
    let mut reasons = Vec::new();
    let mut verdict = Verdict::Plausible;
    let mut flag = |v: Verdict, why: String, reasons: &mut Vec<String>| {
        verdict = verdict.max(v);
        reasons.push(why);
    };
    match balance.status {
        BalanceStatus::Plausible => {}
        BalanceStatus::TooLittleLoss => flag(Verdict::Optimistic, balance.describe(), &mut reasons),
        BalanceStatus::TooMuchLoss if balance.remainder_fraction <= REMAINDER_IMPOSSIBLE => {
            flag(Verdict::Optimistic, balance.describe(), &mut reasons)
        }
        BalanceStatus::Negative | BalanceStatus::TooMuchLoss => {
            flag(Verdict::Impossible, balance.describe(), &mut reasons)
        }
    }
    let calibration = match calibrate(sheet, options) {
        Ok(c) => Some(c),
        Err(e @ (DatasheetError::Invalid { .. } | DatasheetError::FuelNotModelled)) => {
            return Err(e)
        }
        Err(DatasheetError::Impossible(why)) => {
            if balance.status != BalanceStatus::Negative {
                flag(Verdict::Impossible, why, &mut reasons);
            }
            None
        }
        Err(e) => {
            flag(Verdict::Impossible, e.to_string(), &mut reasons);
            None
        }
    };
    let mut disagreements = Vec::new();
    if let Some(c) = &calibration {
        let eta_c = c.compressor_polytropic_efficiency();
        let eta_t = c.turbine_polytropic_efficiency();
        let t3 = c.firing_temperature_k();
        if eta_c > COMPRESSOR_POLYTROPIC_MAX {
            flag(
                Verdict::Optimistic,
                format!("the figures imply a compressor polytropic efficiency of {eta_c:.4}, above the state of the art {COMPRESSOR_POLYTROPIC_MAX}"),
                &mut reasons,
            );
        }
        if eta_t > TURBINE_POLYTROPIC_MAX {
            flag(
                Verdict::Optimistic,
                format!("the figures imply a turbine polytropic efficiency of {eta_t:.4}, above the state of the art {TURBINE_POLYTROPIC_MAX}"),
                &mut reasons,
            );
        }
        if t3 > FIRING_TEMPERATURE_MAX_K {
            flag(
                Verdict::Optimistic,
                format!("the figures imply a firing temperature of {t3:.0} K, above the state of the art {FIRING_TEMPERATURE_MAX_K:.0} K"),
                &mut reasons,
            );
        }
        let usual = options.cooling_for(t3);
        if c.turbine_cooling < 0.5 * usual {
            flag(
                Verdict::Optimistic,
                format!(
                    "the figures imply {:.1} % turbine cooling air at a firing temperature of {t3:.0} K, less than half the {:.1} % usual there (correlation of the calibration assumptions)",
                    c.turbine_cooling * 100.0,
                    usual * 100.0
                ),
                &mut reasons,
            );
        }
        if !c.fitted.contains(&"compressor_polytropic_efficiency") {
            reasons.push(format!(
                "the efficiencies are the calibration's default ({eta_c:.3} compressor), not implied: the datasheet states neither pressure ratio nor firing temperature"
            ));
        }
        disagreements = compare(components, c);
    }
    if verdict == Verdict::Plausible {
        reasons.insert(
            0,
            "every implied value lies within the state-of-the-art ranges".into(),
        );
    }
    let implied = Implied {
        compressor_polytropic_efficiency: calibration
            .as_ref()
            .map(Calibration::compressor_polytropic_efficiency),
        turbine_polytropic_efficiency: calibration
            .as_ref()
            .map(Calibration::turbine_polytropic_efficiency),
        firing_temperature_k: calibration.as_ref().map(Calibration::firing_temperature_k),
        turbine_cooling: calibration.as_ref().map(|c| c.turbine_cooling),
        pressure_ratio: calibration.as_ref().map(Calibration::pressure_ratio),
        air_flow_kg_per_s: calibration
            .as_ref()
            .map_or(balance.air_flow_kg_per_s, |c| c.air_flow_kg_per_s),
        loss_remainder_fraction: balance.remainder_fraction,
        verdict,
        reasons,
    };
    Ok(Assessment {
        balance,
        calibration,
        implied,
        disagreements,
    })
}

/// Stated component values against the fit.
fn compare(stated: &ComponentData, c: &Calibration) -> Vec<Disagreement> {
    let mut out = Vec::new();
    let mut check = |field, stated: Option<f64>, implied: f64, tolerance: Option<f64>, relative| {
        let (Some(s), Some(tol)) = (stated, tolerance) else {
            return;
        };
        let off = if relative {
            (s / implied - 1.0).abs()
        } else {
            (s - implied).abs()
        };
        if off.is_nan() || off > tol {
            out.push(Disagreement {
                field,
                stated: s,
                implied,
                tolerance: tol,
            });
        }
    };
    check(
        "pressure_ratio",
        stated.pressure_ratio,
        c.pressure_ratio(),
        AGREEMENT.pressure_ratio,
        true,
    );
    check(
        "firing_temperature_k",
        stated.firing_temperature_k,
        c.firing_temperature_k(),
        AGREEMENT.firing_temperature_k,
        false,
    );
    check(
        "compressor_polytropic_efficiency",
        stated.compressor_polytropic_efficiency,
        c.compressor_polytropic_efficiency(),
        AGREEMENT.compressor_polytropic_efficiency,
        false,
    );
    check(
        "turbine_polytropic_efficiency",
        stated.turbine_polytropic_efficiency,
        c.turbine_polytropic_efficiency(),
        AGREEMENT.turbine_polytropic_efficiency,
        false,
    );
    check(
        "turbine_cooling",
        stated.turbine_cooling,
        c.turbine_cooling,
        AGREEMENT.turbine_cooling,
        false,
    );
    out
}

/// An engine at the rating ambient with the given gas path and no losses
/// outside it.
fn lossless(sheet: &Datasheet, pressure_ratio: f64, firing_k: f64) -> EngineConfig {
    let mut config = EngineConfig::ideal(pressure_ratio, firing_k);
    config.ambient_temperature_k = sheet.rating.temperature_k;
    config.ambient_pressure_kpa = sheet.rating.pressure_kpa;
    config
}

/// The largest net work per kg of air at the state-of-the-art limits
/// (firing [`FIRING_TEMPERATURE_MAX_K`], polytropic efficiencies
/// [`COMPRESSOR_POLYTROPIC_MAX`] and [`TURBINE_POLYTROPIC_MAX`], no cooling,
/// no pressure or electro-mechanical losses) over pressure ratios 2 to 80,
/// kJ/kg: golden-section search on the logarithm of the ratio.
pub(crate) fn maximum_specific_work(sheet: &Datasheet) -> Result<f64, DatasheetError> {
    let detail = cycle::Detail {
        turbine_cooling: 0.0,
        relative_humidity: sheet.rating.relative_humidity,
    };
    let work = |ln_r: f64| -> Result<f64, DatasheetError> {
        let mut config = lossless(sheet, ln_r.exp(), FIRING_TEMPERATURE_MAX_K);
        config.efficiency_basis = EfficiencyBasis::Polytropic;
        config.compressor_efficiency = COMPRESSOR_POLYTROPIC_MAX;
        config.turbine_efficiency = TURBINE_POLYTROPIC_MAX;
        cycle::solve_detailed(&config, &detail, &GasModel::Products, &sheet.fuel)
            .map(|r| r.electrical_work_kj_per_kg)
            .map_err(|source| DatasheetError::Cycle {
                context: "state-of-the-art specific work".into(),
                source,
            })
    };
    let golden = (5f64.sqrt() - 1.0) / 2.0;
    let (mut a, mut b) = (2f64.ln(), 80f64.ln());
    let mut c = b - golden * (b - a);
    let mut d = a + golden * (b - a);
    let (mut wc, mut wd) = (work(c)?, work(d)?);
    for _ in 0..40 {
        if wc > wd {
            b = d;
            d = c;
            wd = wc;
            c = b - golden * (b - a);
            wc = work(c)?;
        } else {
            a = c;
            c = d;
            wc = wd;
            d = a + golden * (b - a);
            wd = work(d)?;
        }
    }
    Ok(wc.max(wd))
}

/// The coldest exhaust an engine of `pressure_ratio` can have while
/// burning `fuel_air_ratio`: ideal compressor and turbine, no cooling, no
/// pressure losses, firing temperature found so the fuel–air ratio is met.
/// `None` when no firing temperature within the data gives that ratio.
pub(crate) fn minimum_exhaust_temperature_k(
    sheet: &Datasheet,
    pressure_ratio: f64,
    fuel_air_ratio: f64,
) -> Option<f64> {
    let detail = cycle::Detail {
        turbine_cooling: 0.0,
        relative_humidity: sheet.rating.relative_humidity,
    };
    let solve = |t3: f64| {
        cycle::solve_detailed(
            &lossless(sheet, pressure_ratio, t3),
            &detail,
            &GasModel::Products,
            &sheet.fuel,
        )
        .ok()
    };
    let t3 = super::balance::root(
        |t3| solve(t3)?.fuel_air_ratio.map(|f| f - fuel_air_ratio),
        1400.0,
        1500.0,
    )?;
    solve(t3).map(|r| r.exhaust_temperature_k)
}
