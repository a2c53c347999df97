//! What each bid's vendor figures imply: for every candidate whose
//! `[candidate.rating]` states a datasheet (heat rate, exhaust flow and
//! temperature), [`crate::datasheet::assess`] with the candidate's stated
//! components ([`ComponentData::from_engine`]) as the data to check against
//! the fit. A candidate without a datasheet is judged on its components as
//! before and has no entry.
//!
//! Figures that cannot all be true are not an error: they are an
//! [`Verdict::Impossible`](crate::datasheet::Verdict) with reasons. Only
//! figures that cannot be read (a fuel without composition, a machine the
//! calibration does not model) are refused, at the candidate's key.

use super::engine::{engine_config_of, gas_model_of};
use super::machine::rating_of;
use crate::cycle::Regenerator;
use crate::datasheet::{
    assess, check_ambient_correction, check_part_load, AmbientCorrectionPoint, Assessment,
    CalibrationOptions, ComponentData, CurveDeviation, Datasheet, DatasheetError, HeatRateBasis,
    PartLoadPoint, Verdict, CURVE_THRESHOLD,
};
use crate::fuel::Fuel;
use crate::scenario::{Candidate, HeatRateBasisSpec, LoadedScenario, RatingFigures};
use crate::Error;

/// What one bid's datasheet implies.
#[derive(Debug, Clone, PartialEq)]
pub struct ImpliedBid {
    /// The candidate's id.
    pub candidate_id: String,
    /// Index of the candidate in the scenario.
    pub index: usize,
    /// The datasheet as assessed (figures in SI, LHV or HHV as stated).
    pub datasheet: Datasheet,
    /// Balance, calibration, implied values, verdict and disagreements.
    pub assessment: Assessment,
}

/// The datasheet a candidate states, if any: its rated `net_output`, the
/// rating figures, its regenerator as stated, the rating condition and the
/// scenario's fuel.
pub fn datasheet_of(candidate: &Candidate, fuel: &Fuel) -> Option<Datasheet> {
    let figures: RatingFigures = candidate.rating.datasheet?;
    Some(Datasheet {
        net_output_kw: candidate.net_output_kw,
        heat_rate_kj_per_kwh: figures.heat_rate_kj_per_kwh,
        heat_rate_basis: match figures.heat_rate_basis {
            HeatRateBasisSpec::Lhv => HeatRateBasis::Lhv,
            HeatRateBasisSpec::Hhv => HeatRateBasis::Hhv,
        },
        exhaust_flow_kg_per_s: figures.exhaust_flow_kg_per_s,
        exhaust_temperature_k: figures.exhaust_temperature_k,
        pressure_ratio: figures.pressure_ratio,
        firing_temperature_k: figures.firing_temperature_k,
        regenerator: candidate.regenerator.as_ref().map(|r| Regenerator {
            effectiveness: r.effectiveness,
            air_side_pressure_loss: r.air_side_pressure_loss,
            gas_side_pressure_loss: r.gas_side_pressure_loss,
        }),
        rating: rating_of(candidate),
        fuel: fuel.clone(),
    })
}

/// The component values a candidate states, on the polytropic basis, at its
/// rating condition; its turbine cooling only when the file states it.
pub fn stated_components(
    loaded: &LoadedScenario,
    candidate: &Candidate,
    fuel: &Fuel,
) -> Result<ComponentData, DatasheetError> {
    let rating = rating_of(candidate);
    let mut config = engine_config_of(candidate, &loaded.scenario.site);
    config.ambient_temperature_k = rating.temperature_k;
    config.ambient_pressure_kpa = rating.pressure_kpa;
    let mut data = ComponentData::from_engine(
        &config,
        candidate.turbine_cooling,
        rating.relative_humidity,
        gas_model_of(&candidate.gas_model),
        fuel,
    )?;
    // A cooling the file does not state (the default, none) is not the
    // vendor's claim: it is left out of the comparison with the fit.
    let cooling_key = format!("candidate[{}].turbine_cooling", candidate.id);
    if loaded.applied_defaults.iter().any(|d| d.key == cooling_key) {
        data.turbine_cooling = None;
    }
    Ok(data)
}

/// The calibration's assumptions for a candidate that also states its
/// components: the fit shares what the scenario prices the candidate with
/// where the datasheet cannot determine it — pressure losses, combustion
/// efficiency, the split between compressor and turbine efficiency, and
/// no cooling air for a candidate that states none — so that a datasheet
/// worked from the candidate's own cycle is borne out by it. What the fit
/// does determine (efficiency level, firing temperature or cooling, air
/// flow) is still checked against the stated values.
fn options_of(
    candidate: &crate::scenario::Candidate,
    stated: &ComponentData,
) -> CalibrationOptions {
    let defaults = CalibrationOptions::default();
    let gap = match (
        stated.compressor_polytropic_efficiency,
        stated.turbine_polytropic_efficiency,
    ) {
        (Some(c), Some(t)) => c - t,
        _ => defaults.efficiency_gap,
    };
    let uncooled = stated.turbine_cooling == Some(0.0) || candidate.turbine_cooling == 0.0;
    CalibrationOptions {
        inlet_pressure_loss: candidate.inlet_pressure_loss,
        exhaust_pressure_loss: candidate.exhaust_pressure_loss,
        combustor_pressure_loss: candidate.combustor_pressure_loss,
        combustion_efficiency: candidate.combustion_efficiency,
        efficiency_gap: gap,
        cooling_per_kelvin: if uncooled {
            0.0
        } else {
            defaults.cooling_per_kelvin
        },
        ..defaults
    }
}

/// Assess every candidate that states a datasheet, in scenario order,
/// under the candidate's own assumptions ([`options_of`]).
///
/// An intercooled or reheat machine's datasheet is passed over (the
/// calibration models single-shaft simple or regenerated machines);
/// [`unassessed_notes`] says so.
///
/// Errors: a datasheet the library cannot read (input error at the
/// figure's key, exit 1), or a model failure (internal, exit 2).
pub fn implied_bids(loaded: &LoadedScenario, fuel: &Fuel) -> crate::Result<Vec<ImpliedBid>> {
    let mut bids = Vec::new();
    for (index, candidate) in loaded.scenario.candidates.iter().enumerate() {
        let Some(datasheet) = datasheet_of(candidate, fuel) else {
            continue;
        };
        if candidate.intercooler.is_some() || candidate.reheat.is_some() {
            // Not modelled by the calibration yet: said in `check`
            // ([`unassessed_notes`]), not refused.
            continue;
        }
        let located = |e: DatasheetError| datasheet_error(loaded, candidate, &e);
        // A candidate fitted to its datasheet states no components: its
        // fit is not checked against itself.
        let components = match candidate.fitted {
            Some(_) => ComponentData::default(),
            None => stated_components(loaded, candidate, fuel).map_err(located)?,
        };
        let assessment = assess(&datasheet, &components, &options_of(candidate, &components))
            .map_err(located)?;
        bids.push(ImpliedBid {
            candidate_id: candidate.id.clone(),
            index,
            datasheet,
            assessment,
        });
    }
    Ok(bids)
}

/// The warning for a bid whose datasheet is optimistic or impossible
/// (`None` for a plausible one): its verdict and first reason, naming the
/// candidate.
pub fn verdict_warning(bid: &ImpliedBid) -> Option<String> {
    let implied = &bid.assessment.implied;
    let word = match implied.verdict {
        Verdict::Plausible => return None,
        Verdict::Optimistic => "optimistic",
        Verdict::Impossible => "impossible",
    };
    let why = implied
        .reasons
        .first()
        .map_or(String::new(), |r| format!(": {r}"));
    Some(format!(
        "candidate[{}]: the vendor's figures at the rating are {word}{why}",
        bid.candidate_id
    ))
}

/// A datasheet refusal as an error at the key it names.
fn datasheet_error(loaded: &LoadedScenario, candidate: &Candidate, e: &DatasheetError) -> Error {
    if !e.is_input_error() {
        return Error::Internal(format!("candidate {}: {e}", candidate.id));
    }
    let key = match e.field() {
        Some("fuel") => "fuel.composition".to_string(),
        Some(field) => format!("candidate[{}].{field}", candidate.id),
        None => format!("candidate[{}].rating", candidate.id),
    };
    loaded.error_at(
        &key,
        &format!(
            "the datasheet of `{}` cannot be assessed: {e}",
            candidate.id
        ),
    )
}

/// Information lines for candidates whose datasheet is not assessed
/// (intercooled or reheat machines, which the calibration does not model
/// yet).
pub fn unassessed_notes(scenario: &crate::scenario::Scenario) -> Vec<String> {
    scenario
        .candidates
        .iter()
        .filter(|c| c.rating.datasheet.is_some() && (c.intercooler.is_some() || c.reheat.is_some()))
        .map(|c| {
            format!(
                "candidate[{}]: its vendor figures at the rating are not assessed: the \
                 calibration models single-shaft simple or regenerated machines, not \
                 intercooled or reheat ones (yet)",
                c.id
            )
        })
        .collect()
}

/// Warnings for each candidate's vendor curves that its calibrated machine
/// (the one that prices it, [`super::machine::machine_of`]) does not bear
/// out: a point whose vendor ratio differs from the machine's by more than
/// [`CURVE_THRESHOLD`] (0.02, see there why), naming the candidate, the
/// curve, the point and both values. A point the machine cannot run at
/// (a load below its control's minimum, an ambient it refuses) is a
/// warning too, and the rest of that curve goes unchecked. Intercooled and
/// reheat candidates are not modelled as fixed machines and are passed
/// over (their pricing note says so).
pub fn curve_warnings(scenario: &crate::scenario::Scenario, fuel: &Fuel) -> Vec<String> {
    let mut warnings = Vec::new();
    for candidate in &scenario.candidates {
        if candidate.part_load.is_empty() && candidate.ambient_correction.is_empty() {
            continue;
        }
        let Ok(machine) = super::machine::machine_of(candidate, &scenario.site, fuel) else {
            // A machine that cannot be built is refused by the comparison
            // itself, or kept at its rating (intercooler, reheat).
            continue;
        };
        let part_load: Vec<PartLoadPoint> = candidate
            .part_load
            .iter()
            .filter(|p| p.load_fraction < 1.0)
            .map(|p| PartLoadPoint {
                load: p.load_fraction,
                heat_rate_ratio: p.heat_rate_ratio,
            })
            .collect();
        let rating_t = candidate.rating.temperature_k;
        let ambient: Vec<AmbientCorrectionPoint> = candidate
            .ambient_correction
            .iter()
            .filter(|p| (p.temperature_k - rating_t).abs() > 1e-9)
            .map(|p| AmbientCorrectionPoint {
                temperature_k: p.temperature_k,
                output_ratio: p.output_ratio,
                heat_rate_ratio: p.heat_rate_ratio,
            })
            .collect();
        let checks = [
            check_part_load(&machine, &part_load, CURVE_THRESHOLD),
            check_ambient_correction(&machine, &ambient, CURVE_THRESHOLD),
        ];
        for outcome in checks {
            match outcome {
                Ok(deviations) => {
                    warnings.extend(deviations.iter().map(|d| curve_warning(&candidate.id, d)))
                }
                Err(e) => warnings.push(format!(
                    "candidate[{}]: a vendor curve point cannot be checked against its \
                     calibrated machine: {e}",
                    candidate.id
                )),
            }
        }
    }
    warnings
}

/// One curve point the machine does not bear out, in words.
fn curve_warning(candidate_id: &str, d: &CurveDeviation) -> String {
    let at = if d.curve == "part_load" {
        format!("load {:.1} %", d.at * 100.0)
    } else {
        format!("{:.2} K ({:.1} °C)", d.at, d.at - 273.15)
    };
    format!(
        "candidate[{candidate_id}].{} at {at}: the vendor's {} is {:.4}, its calibrated machine \
         gives {:.4} (a difference of {:.4}, above the {CURVE_THRESHOLD} cross-check threshold); \
         the vendor's curve prices it: ask the vendor to confirm the point",
        d.curve,
        d.quantity,
        d.vendor,
        d.physics,
        (d.vendor - d.physics).abs(),
    )
}

/// Information lines for each candidate that states no components: its
/// machine (what prices it) is the one fitted to its datasheet when the
/// file was read; the fitted values and every assumption of the fit.
pub fn fitted_notes(scenario: &crate::scenario::Scenario) -> Vec<String> {
    scenario
        .candidates
        .iter()
        .filter_map(|c| {
            let fit = c.fitted.as_ref()?;
            Some(format!(
                "candidate[{}]: states no components; its machine is fitted to its datasheet \
                 (fitted: {}): pressure ratio {:.2}, firing temperature {:.1} K, polytropic \
                 efficiencies {:.4} (compressor) and {:.4} (turbine), turbine cooling {:.1} % of \
                 compressor air, mechanical and generator efficiency {:.4} each, no auxiliary \
                 load, air flow {:.2} kg/s, pressure losses {:.1} % inlet, {:.1} % exhaust, {:.1} % \
                 combustor, combustion efficiency {:.3}; assumptions: {}",
                c.id,
                fit.fitted.join(", "),
                c.pressure_ratio,
                c.turbine_inlet_temperature_k,
                c.compressor_efficiency,
                c.turbine_efficiency,
                c.turbine_cooling * 100.0,
                c.mechanical_efficiency,
                fit.air_flow_kg_per_s,
                c.inlet_pressure_loss * 100.0,
                c.exhaust_pressure_loss * 100.0,
                c.combustor_pressure_loss * 100.0,
                c.combustion_efficiency,
                fit.assumptions.join("; ")
            ))
        })
        .collect()
}
