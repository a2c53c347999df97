//! Vendor curves against the calibrated physics.
//!
//! A vendor's part-load curve (heat-rate ratio against load at the rating
//! ambient) and ambient-correction curve (output and heat-rate ratios
//! against ambient temperature at base load, rating pressure and humidity)
//! are compared point by point with the calibrated
//! [`crate::offdesign::Machine`]. Ratios are to the rating point. A point
//! whose vendor ratio differs from the machine's by more than the
//! threshold is returned; the default threshold is [`CURVE_THRESHOLD`].

use super::DatasheetError;
use crate::offdesign::{Ambient, Load, Machine, OffDesignError};
use serde::Serialize;

/// Default threshold, absolute difference of ratios: 0.02 (2 % of the
/// rated value). The machine's compressor characteristic is generic, not
/// the vendor's, so smaller differences are no evidence against a curve;
/// published ambient corrections of one class differ among themselves by
/// about that much (a judgement, stated; from memory).
pub const CURVE_THRESHOLD: f64 = 0.02;

/// One point of a vendor part-load curve at the rating ambient.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PartLoadPoint {
    /// Load, fraction of base-load output.
    pub load: f64,
    /// Heat rate over the rated heat rate.
    pub heat_rate_ratio: f64,
}

/// One point of a vendor ambient-correction curve at base load.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct AmbientCorrectionPoint {
    /// Ambient temperature, K.
    pub temperature_k: f64,
    /// Base-load output over the rated output.
    pub output_ratio: f64,
    /// Base-load heat rate over the rated heat rate.
    pub heat_rate_ratio: f64,
}

/// A vendor curve point that the calibrated machine does not bear out.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CurveDeviation {
    /// `part_load` or `ambient_correction`.
    pub curve: &'static str,
    /// Position of the point in its curve, from 0.
    pub index: usize,
    /// Where the point is: its load (fraction) or temperature (K).
    pub at: f64,
    /// `heat_rate_ratio` or `output_ratio`.
    pub quantity: &'static str,
    /// The vendor's ratio.
    pub vendor: f64,
    /// The calibrated machine's ratio.
    pub physics: f64,
}

impl CurveDeviation {
    /// The point and both values in words.
    pub fn describe(&self) -> String {
        let at = if self.curve == "part_load" {
            format!("load {:.1} %", self.at * 100.0)
        } else {
            format!("{:.1} K", self.at)
        };
        format!(
            "{}[{}] at {at}: the vendor's {} is {:.4}, the calibrated machine gives {:.4} ({:+.1} %)",
            self.curve,
            self.index,
            self.quantity,
            self.vendor,
            self.physics,
            (self.vendor - self.physics) * 100.0
        )
    }
}

fn curve_error(curve: &'static str, index: usize) -> impl Fn(OffDesignError) -> DatasheetError {
    move |e| DatasheetError::Curve {
        curve,
        index,
        problem: e.to_string(),
    }
}

fn check_threshold(threshold: f64) -> Result<(), DatasheetError> {
    if threshold.is_finite() && threshold > 0.0 {
        Ok(())
    } else {
        Err(DatasheetError::invalid(
            "curve_threshold",
            format!("{threshold} is not a positive number"),
            "expected a difference of ratios > 0, e.g. 0.02",
        ))
    }
}

fn ratio(curve: &'static str, index: usize, name: &str, v: f64) -> Result<(), DatasheetError> {
    if v.is_finite() && v > 0.0 {
        Ok(())
    } else {
        Err(DatasheetError::Curve {
            curve,
            index,
            problem: format!("{name} {v} is not a positive number; expected a ratio > 0"),
        })
    }
}

/// The points of a part-load curve whose heat-rate ratio differs from the
/// machine's at its rating ambient by more than `threshold`.
///
/// Errors: a threshold or ratio that is not positive; a load the machine's
/// control cannot run (naming the point).
pub fn check_part_load(
    machine: &Machine,
    points: &[PartLoadPoint],
    threshold: f64,
) -> Result<Vec<CurveDeviation>, DatasheetError> {
    const CURVE: &str = "part_load";
    check_threshold(threshold)?;
    let rating = machine.rating();
    let base = machine
        .solve(rating, Load::BASE)
        .map_err(curve_error(CURVE, 0))?;
    let mut out = Vec::new();
    for (index, p) in points.iter().enumerate() {
        ratio(CURVE, index, "heat_rate_ratio", p.heat_rate_ratio)?;
        let at = machine
            .solve(rating, Load(p.load))
            .map_err(curve_error(CURVE, index))?;
        let physics = at.heat_rate_kj_per_kwh / base.heat_rate_kj_per_kwh;
        let difference = (p.heat_rate_ratio - physics).abs();
        if difference.is_nan() || difference > threshold {
            out.push(CurveDeviation {
                curve: CURVE,
                index,
                at: p.load,
                quantity: "heat_rate_ratio",
                vendor: p.heat_rate_ratio,
                physics,
            });
        }
    }
    Ok(out)
}

/// The points of an ambient-correction curve whose output or heat-rate
/// ratio differs from the machine's at base load (rating pressure and
/// humidity) by more than `threshold`; a point off in both gives two.
///
/// Errors: a threshold or ratio that is not positive; an ambient the
/// machine cannot run at (naming the point).
pub fn check_ambient_correction(
    machine: &Machine,
    points: &[AmbientCorrectionPoint],
    threshold: f64,
) -> Result<Vec<CurveDeviation>, DatasheetError> {
    const CURVE: &str = "ambient_correction";
    check_threshold(threshold)?;
    let rating = machine.rating();
    let base = machine
        .solve(rating, Load::BASE)
        .map_err(curve_error(CURVE, 0))?;
    let mut out = Vec::new();
    for (index, p) in points.iter().enumerate() {
        ratio(CURVE, index, "output_ratio", p.output_ratio)?;
        ratio(CURVE, index, "heat_rate_ratio", p.heat_rate_ratio)?;
        let ambient = Ambient {
            temperature_k: p.temperature_k,
            ..rating
        };
        let at = machine
            .solve(ambient, Load::BASE)
            .map_err(curve_error(CURVE, index))?;
        let pairs = [
            (
                "output_ratio",
                p.output_ratio,
                at.net_output_kw / base.net_output_kw,
            ),
            (
                "heat_rate_ratio",
                p.heat_rate_ratio,
                at.heat_rate_kj_per_kwh / base.heat_rate_kj_per_kwh,
            ),
        ];
        for (quantity, vendor, physics) in pairs {
            let difference = (vendor - physics).abs();
            if difference.is_nan() || difference > threshold {
                out.push(CurveDeviation {
                    curve: CURVE,
                    index,
                    at: p.temperature_k,
                    quantity,
                    vendor,
                    physics,
                });
            }
        }
    }
    Ok(out)
}
