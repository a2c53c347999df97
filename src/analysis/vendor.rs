//! A bid's vendor curves as priced: where a candidate states
//! `ambient_correction` or `part_load`, those curves give its base-load
//! output and heat rate at an ambient and its part-load heat rate (they are
//! what the vendor stands behind); where it does not, its calibrated
//! machine's physics does. Each factor is taken separately, so a bid with
//! one curve gets the other factor from physics.
//!
//! The rule, for a candidate at ambient `a` (temperature `T`, pressure
//! `p`, humidity `φ`) and load `x` (fraction of base load at `a`):
//!
//! - Base load with `ambient_correction`: output = `P_r · o(T) · k_P`,
//!   heat rate = `HR_r · h(T) · k_HR`, where `P_r`, `HR_r` are the
//!   machine's figures at the rating (its rated net output, and the heat
//!   rate it is calibrated to there), `o`, `h` the vendor's ratios
//!   interpolated linearly in temperature, and `k` the machine's own ratio
//!   between `a` and `a` at the rating's pressure and humidity (the curve is
//!   stated at those; `k = 1` when the site has them).
//! - Base load without it: the machine at `a`.
//! - Part-load heat-rate ratio with `part_load`: the vendor's ratio at `x`,
//!   linear in load, applied to the base-load heat rate at `a` (the curve
//!   is stated at the rating ambient; its shape is taken to hold at `a`).
//! - Part load without it: the machine's heat rate at `x` over its own
//!   base-load heat rate at `a`.
//!
//! Beyond a curve's ends brayfin neither refuses nor extrapolates the
//! vendor's line: the machine's physics carries the curve on from its end
//! point (end ratio × the machine's ratio between the point and the end).
//! This keeps sweeps and sampled site temperatures running and changes
//! nothing inside the span. A dispatch load below a candidate's
//! `part_load` is still refused when the scenario is loaded (the loads are
//! known then), so only other callers meet the continuation in part load.

use super::machine::{rating_of, site_ambient};
use crate::offdesign::{Ambient, OffDesignError};
use crate::scenario::{AmbientCorrectionSpec, Candidate, PartLoadPoint, Scenario};

/// Net output and heat rate of a machine at one ambient and load.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Figures {
    /// Net electrical output, kW.
    pub net_output_kw: f64,
    /// Net heat rate, kJ (LHV) per kWh.
    pub heat_rate_kj_per_kwh: f64,
}

/// The calibrated machine's physics: its figures at an ambient and a load
/// (fraction of the base-load output at that ambient; 1 is base load).
pub type Physics<'a> = dyn Fn(Ambient, f64) -> Result<Figures, OffDesignError> + 'a;

/// Where a priced figure comes from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Source {
    /// The vendor's curve.
    Vendor,
    /// The calibrated machine's physics.
    Physics,
}

/// A candidate at one ambient and load, as priced.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct VendorPoint {
    /// Base-load output and heat rate at the ambient.
    pub base: Figures,
    /// Heat rate at the load over the base-load heat rate at the ambient.
    pub part_load_ratio: f64,
    /// Source of the base-load figures.
    pub ambient_source: Source,
    /// Source of the part-load ratio.
    pub part_load_source: Source,
}

/// `candidate` at `ambient` and `load_fraction` as priced ([`base_at`] and
/// [`part_load_ratio`]; see the module notes for the rule).
///
/// Errors: the machine's refusal of an ambient or load it needs.
pub fn vendor_point(
    candidate: &Candidate,
    ambient: Ambient,
    load_fraction: f64,
    physics: &Physics,
) -> Result<VendorPoint, OffDesignError> {
    Ok(VendorPoint {
        base: base_at(candidate, ambient, physics)?,
        part_load_ratio: part_load_ratio(candidate, ambient, load_fraction, physics)?,
        ambient_source: ambient_source(candidate),
        part_load_source: part_load_source(candidate),
    })
}

/// Which source prices a candidate's base load away from its rating.
pub fn ambient_source(candidate: &Candidate) -> Source {
    if candidate.ambient_correction.is_empty() {
        Source::Physics
    } else {
        Source::Vendor
    }
}

/// Which source prices a candidate's part load.
pub fn part_load_source(candidate: &Candidate) -> Source {
    if candidate.part_load.is_empty() {
        Source::Physics
    } else {
        Source::Vendor
    }
}

/// A value of a sorted curve at `x`, linear between the two points around
/// it; `None` beyond the curve's ends (or for an empty curve).
pub fn interpolate<P>(
    points: &[P],
    x: f64,
    at: impl Fn(&P) -> f64,
    value: impl Fn(&P) -> f64,
) -> Option<f64> {
    let (first, last) = (points.first()?, points.last()?);
    if x < at(first) || x > at(last) {
        return None;
    }
    for pair in points.windows(2) {
        let (a, b) = (&pair[0], &pair[1]);
        if x <= at(b) {
            let span = at(b) - at(a);
            if span <= 0.0 {
                return Some(value(b));
            }
            let t = (x - at(a)) / span;
            return Some(value(a) + t * (value(b) - value(a)));
        }
    }
    Some(value(last))
}

/// The vendor's part-load ratio at `load_fraction` where the curve covers
/// it (1 at base load and above, or with no curve at all); `None` below
/// the curve's lowest load.
pub fn curve_part_load_ratio(part_load: &[PartLoadPoint], load_fraction: f64) -> Option<f64> {
    if load_fraction >= 1.0 || part_load.is_empty() {
        return Some(1.0);
    }
    interpolate(
        part_load,
        load_fraction,
        |p| p.load_fraction,
        |p| p.heat_rate_ratio,
    )
}

/// The vendor's (output, heat-rate) ratios at `temperature_k`; `None`
/// beyond the curve's ends.
pub fn curve_ambient_ratios(
    curve: &[AmbientCorrectionSpec],
    temperature_k: f64,
) -> Option<(f64, f64)> {
    let t = |p: &AmbientCorrectionSpec| p.temperature_k;
    Some((
        interpolate(curve, temperature_k, t, |p| p.output_ratio)?,
        interpolate(curve, temperature_k, t, |p| p.heat_rate_ratio)?,
    ))
}

/// Base-load output and heat rate of `candidate` at `ambient`: the
/// vendor's ambient correction on the machine's rated figures where the
/// bid gives one, the machine's physics otherwise (module notes).
///
/// Errors: the machine's refusal of an ambient it needs.
pub fn base_at(
    candidate: &Candidate,
    ambient: Ambient,
    physics: &Physics,
) -> Result<Figures, OffDesignError> {
    let curve = &candidate.ambient_correction;
    let (Some(first), Some(last)) = (curve.first(), curve.last()) else {
        return physics(ambient, 1.0);
    };
    let rating = rating_of(candidate);
    let rated = physics(rating, 1.0)?;
    let at_rating_air = Ambient {
        temperature_k: ambient.temperature_k,
        ..rating
    };
    // The curve at the ambient temperature, or carried on from its nearer
    // end by the machine (at the rating's pressure and humidity).
    let (output_ratio, heat_rate_ratio, reference) =
        match curve_ambient_ratios(curve, ambient.temperature_k) {
            Some((o, h)) => (o, h, at_rating_air),
            None => {
                let end = if ambient.temperature_k < first.temperature_k {
                    first
                } else {
                    last
                };
                (
                    end.output_ratio,
                    end.heat_rate_ratio,
                    Ambient {
                        temperature_k: end.temperature_k,
                        ..rating
                    },
                )
            }
        };
    // The machine's own step from the reference to the ambient itself.
    let (k_output, k_heat_rate) = if reference == ambient {
        (1.0, 1.0)
    } else {
        let to = physics(ambient, 1.0)?;
        let from = physics(reference, 1.0)?;
        (
            to.net_output_kw / from.net_output_kw,
            to.heat_rate_kj_per_kwh / from.heat_rate_kj_per_kwh,
        )
    };
    Ok(Figures {
        net_output_kw: rated.net_output_kw * output_ratio * k_output,
        heat_rate_kj_per_kwh: rated.heat_rate_kj_per_kwh * heat_rate_ratio * k_heat_rate,
    })
}

/// Heat rate of `candidate` at `load_fraction` over its base-load heat rate
/// at `ambient`: the vendor's part-load curve where the bid gives one, the
/// machine's physics otherwise; 1 at base load (module notes).
///
/// Errors: the machine's refusal of a load it needs.
pub fn part_load_ratio(
    candidate: &Candidate,
    ambient: Ambient,
    load_fraction: f64,
    physics: &Physics,
) -> Result<f64, OffDesignError> {
    if load_fraction >= 1.0 {
        return Ok(1.0);
    }
    let machine_ratio = |load: f64| -> Result<f64, OffDesignError> {
        Ok(physics(ambient, load)?.heat_rate_kj_per_kwh
            / physics(ambient, 1.0)?.heat_rate_kj_per_kwh)
    };
    let curve = &candidate.part_load;
    let Some(lowest) = curve.first() else {
        return machine_ratio(load_fraction);
    };
    match curve_part_load_ratio(curve, load_fraction) {
        Some(ratio) => Ok(ratio),
        None => Ok(lowest.heat_rate_ratio * machine_ratio(load_fraction)?
            / machine_ratio(lowest.load_fraction)?),
    }
}

/// Information lines for `check` and the report: which source priced each
/// candidate's base load at the site and its part load, and where the site
/// lies beyond a vendor curve (carried on by physics). `fixed_machine[i]`
/// says whether candidate `i` is priced as a fixed machine (a candidate
/// kept at its rating has its own note in `analysis::site`);
/// `has_part_load` whether the year runs any hour below base load.
pub fn pricing_notes(
    scenario: &Scenario,
    fixed_machine: &[bool],
    has_part_load: bool,
) -> Vec<String> {
    let mut notes = Vec::new();
    for (candidate, &machine) in scenario.candidates.iter().zip(fixed_machine) {
        let base = match (machine, ambient_source(candidate)) {
            (false, _) => None,
            (true, Source::Vendor) => {
                let t = site_ambient(candidate, &scenario.site).temperature_k;
                let beyond = curve_ambient_ratios(&candidate.ambient_correction, t).is_none();
                Some(format!(
                    "base load at the site from the vendor's ambient_correction{} (the site's \
                     pressure and humidity from its calibrated machine)",
                    if beyond {
                        format!(
                            " carried on by its calibrated machine beyond the curve's end \
                             ({t:.2} K lies outside the curve)"
                        )
                    } else {
                        String::new()
                    }
                ))
            }
            (true, Source::Physics) => {
                Some("base load at the site from its calibrated machine".to_string())
            }
        };
        let part = match (has_part_load, part_load_source(candidate), machine) {
            (false, _, _) => None,
            (true, Source::Vendor, _) => Some("part load from the vendor's part_load curve"),
            (true, Source::Physics, true) => Some("part load from its calibrated machine"),
            (true, Source::Physics, false) => {
                Some("part load at its base-load heat rate (no part_load curve)")
            }
        };
        let parts: Vec<String> = base.into_iter().chain(part.map(str::to_string)).collect();
        if !parts.is_empty() {
            notes.push(format!(
                "candidate[{}]: priced with {}",
                candidate.id,
                parts.join("; ")
            ));
        }
    }
    notes
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn interpolates_linearly_and_gives_none_beyond_the_ends() {
        let curve = [
            PartLoadPoint {
                load_fraction: 0.5,
                heat_rate_ratio: 1.2,
            },
            PartLoadPoint {
                load_fraction: 1.0,
                heat_rate_ratio: 1.0,
            },
        ];
        // By hand: halfway between (0.5, 1.2) and (1.0, 1.0) is 1.1.
        let r = curve_part_load_ratio(&curve, 0.75).unwrap_or(f64::NAN);
        assert!((r - 1.1).abs() < 1e-15, "{r}");
        assert_eq!(curve_part_load_ratio(&curve, 1.0), Some(1.0));
        assert_eq!(curve_part_load_ratio(&curve, 0.4), None);
        assert_eq!(curve_part_load_ratio(&[], 0.3), Some(1.0));
    }
}
