//! A bid that states no components: a `[[candidate]]` without
//! `pressure_ratio`, `turbine_inlet_temperature`, `compressor_efficiency`
//! and `turbine_efficiency`, whose `[candidate.rating]` states the vendor's
//! heat rate, exhaust flow and exhaust temperature. Its machine is the one
//! [`crate::datasheet::calibrate`] fits to those figures, done once when the
//! file is read, so every later layer (cycle, fixed machine, pricing,
//! sweep, risk, workbook) sees an ordinary candidate.
//!
//! The four component keys are given all together or not at all. On a
//! candidate fitted to its datasheet:
//!
//! - the fit determines the pressure ratio (unless `rating.pressure_ratio`
//!   states it), firing temperature (unless `rating.firing_temperature`
//!   does), the polytropic efficiencies (turbine 0.01 below compressor),
//!   turbine cooling (the fit's correlation), air flow and the product of
//!   mechanical and generator efficiency (split equally, no auxiliary
//!   load); `efficiency_basis`, `mechanical_efficiency`,
//!   `generator_efficiency`, `auxiliary_load` and `turbine_cooling` are
//!   refused as keys (the fit sets them);
//! - the pressure losses and combustion efficiency are the candidate's
//!   where it states them, else the fit's defaults (1 %, 1 %, 4 %, 1:
//!   common practice), and a regenerator is taken as stated;
//! - the gas model is `products` (the fit's; another is refused);
//! - intercooled and reheat machines are refused (the fit does not model
//!   them).
//!
//! Each fitted value is recorded as an applied default ("fitted to the
//! datasheet"), so `check` lists it; the fit's assumptions are kept on the
//! candidate ([`FittedMachine`]) and printed by `check`, the JSON and the
//! report with what the bid implies.
//!
//! Key paths (`--vary`, `[[uncertainty]]`): the keys the fit determines
//! and the datasheet figures are refused on such a candidate (a varied
//! figure would need a new fit); the keys the fit takes as given (pressure
//! losses, combustion efficiency, regenerator, rating condition) may vary,
//! the fitted components held — the machine then departs from the
//! datasheet, which is the question such a variation asks.

use super::candidate::{Candidate, EfficiencyBasis, GasModelSpec, HeatRateBasisSpec};
use super::context::Context;
use super::error::ScenarioError;
use super::reader::TableReader;
use super::types::FuelSpec;
use crate::cycle::Regenerator;
use crate::datasheet::{calibrate, CalibrationOptions, Datasheet, HeatRateBasis};
use crate::offdesign::Ambient;

type Read<T> = Result<T, ScenarioError>;

/// What the fit gave a candidate that states no components.
#[derive(Debug, Clone, PartialEq)]
pub struct FittedMachine {
    /// Names of the fitted unknowns (as [`crate::datasheet::Calibration::fitted`]).
    pub fitted: Vec<&'static str>,
    /// Every assumption the fit rests on, in words.
    pub assumptions: Vec<String>,
    /// Compressor inlet air flow of the fit at the rating, kg/s.
    pub air_flow_kg_per_s: f64,
}

/// The component keys given all together or not at all.
pub(crate) const COMPONENT_KEYS: [&str; 4] = [
    "pressure_ratio",
    "turbine_inlet_temperature",
    "compressor_efficiency",
    "turbine_efficiency",
];

/// Keys the fit sets, refused in the file of a candidate fitted to its
/// datasheet.
const FIT_SETS: [&str; 5] = [
    "efficiency_basis",
    "mechanical_efficiency",
    "generator_efficiency",
    "auxiliary_load",
    "turbine_cooling",
];

/// Refuse a key path set on a candidate fitted to its datasheet (`what`
/// names the key for the message).
pub(crate) fn refuse_fitted(c: &Candidate, what: &str) -> Result<(), String> {
    match c.fitted {
        Some(_) => Err(format!(
            "candidate `{}` states no components: its {what} is fitted to its datasheet; vary \
             what the fit takes as given (losses, regenerator) or state the four component \
             keys to vary them",
            c.id
        )),
        None => Ok(()),
    }
}

/// The solver's fuel of a scenario's `[fuel]`.
pub fn solver_fuel(spec: &FuelSpec) -> Result<crate::fuel::Fuel, String> {
    use super::types::FuelComposition;
    let fuel = match &spec.composition {
        FuelComposition::HeatingValues {
            lhv_kj_per_kg,
            hhv_kj_per_kg,
            co2_kg_per_gj_lhv,
        } => crate::fuel::Fuel::from_heating_values(
            *lhv_kj_per_kg,
            *hhv_kj_per_kg,
            *co2_kg_per_gj_lhv,
        ),
        other => {
            let fractions = other.mole_fractions().unwrap_or_default();
            let borrowed: Vec<(&str, f64)> =
                fractions.iter().map(|(s, x)| (s.as_str(), *x)).collect();
            crate::fuel::Fuel::from_composition(&borrowed)
        }
    };
    fuel.map_err(|e| e.to_string())
}

/// Fit the machine of `candidate` (read from table `r`, which gives none
/// of [`COMPONENT_KEYS`]) to its datasheet, and fill its component fields.
pub(crate) fn fit_unstated(
    ctx: &mut Context,
    r: &TableReader,
    candidate: &mut Candidate,
    fuel: &FuelSpec,
) -> Read<()> {
    let Some(figures) = candidate.rating.datasheet else {
        return Err(r.missing(
            ctx,
            COMPONENT_KEYS[0],
            "expected the four component keys (pressure_ratio, turbine_inlet_temperature, \
             compressor_efficiency, turbine_efficiency), or none of them with the vendor's \
             heat_rate, exhaust_flow and exhaust_temperature in [candidate.rating] to fit them",
        ));
    };
    let valid_alone = "expected it left out: on a candidate that states no components the fit \
                       sets it (state pressure_ratio, turbine_inlet_temperature, \
                       compressor_efficiency and turbine_efficiency to give it yourself)";
    for key in FIT_SETS {
        if r.has(key) {
            return Err(r.error(
                ctx,
                key,
                "is fitted to the datasheet on a candidate that states no components",
                valid_alone,
            ));
        }
    }
    for key in ["intercooler", "reheat"] {
        if r.has(key) {
            return Err(r.error(
                ctx,
                key,
                "cannot be fitted to a datasheet: the fit models single-shaft simple or \
                 regenerated machines",
                "expected the four component keys on an intercooled or reheat candidate",
            ));
        }
    }
    if r.has("gas_model") && candidate.gas_model != GasModelSpec::Products {
        return Err(r.error(
            ctx,
            "gas_model",
            "is not \"products\" on a candidate fitted to its datasheet",
            "expected gas_model = \"products\" (or left out): the fit works with the \
             combustion products of the scenario's fuel",
        ));
    }
    candidate.gas_model = GasModelSpec::Products;
    let fuel = solver_fuel(fuel).map_err(|m| {
        ctx.error_for(
            "fuel.composition",
            format!(
                "cannot fit candidate `{}` to its datasheet: {m}",
                candidate.id
            ),
            "expected a fuel composition",
        )
    })?;
    let defaults = CalibrationOptions::default();
    let stated_or = |key: &str, value: f64, default: f64| {
        if r.has(key) {
            value
        } else {
            default
        }
    };
    let options = CalibrationOptions {
        inlet_pressure_loss: stated_or(
            "inlet_pressure_loss",
            candidate.inlet_pressure_loss,
            defaults.inlet_pressure_loss,
        ),
        exhaust_pressure_loss: stated_or(
            "exhaust_pressure_loss",
            candidate.exhaust_pressure_loss,
            defaults.exhaust_pressure_loss,
        ),
        combustor_pressure_loss: stated_or(
            "combustor_pressure_loss",
            candidate.combustor_pressure_loss,
            defaults.combustor_pressure_loss,
        ),
        combustion_efficiency: stated_or(
            "combustion_efficiency",
            candidate.combustion_efficiency,
            defaults.combustion_efficiency,
        ),
        ..defaults
    };
    let sheet = Datasheet {
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
        regenerator: candidate.regenerator.map(|g| Regenerator {
            effectiveness: g.effectiveness,
            air_side_pressure_loss: g.air_side_pressure_loss,
            gas_side_pressure_loss: g.gas_side_pressure_loss,
        }),
        rating: Ambient {
            temperature_k: candidate.rating.temperature_k,
            pressure_kpa: candidate.rating.pressure_kpa,
            relative_humidity: candidate.rating.relative_humidity,
        },
        fuel,
    };
    let fit = calibrate(&sheet, &options).map_err(|e| {
        let key = match e.field() {
            Some(field) if field.starts_with("rating.") => r.field(field),
            _ => r.field("rating"),
        };
        ctx.error_for(
            &key,
            format!(
                "candidate `{}` states no components, and its datasheet cannot be fitted: {e}",
                candidate.id
            ),
            "expected vendor figures one machine can reproduce together, or the four component \
             keys (then `brayfin check` says what the figures imply)",
        )
    })?;
    let config = &fit.config;
    candidate.pressure_ratio = config.pressure_ratio;
    candidate.turbine_inlet_temperature_k = config.turbine_inlet_temperature_k;
    candidate.compressor_efficiency = config.compressor_efficiency;
    candidate.turbine_efficiency = config.turbine_efficiency;
    candidate.efficiency_basis = EfficiencyBasis::Polytropic;
    candidate.inlet_pressure_loss = config.inlet_pressure_loss;
    candidate.exhaust_pressure_loss = config.exhaust_pressure_loss;
    candidate.combustor_pressure_loss = config.combustor_pressure_loss;
    candidate.combustion_efficiency = config.combustion_efficiency;
    candidate.mechanical_efficiency = config.mechanical_efficiency;
    candidate.generator_efficiency = config.generator_efficiency;
    candidate.auxiliary_load_fraction = config.auxiliary_load_fraction;
    candidate.turbine_cooling = fit.turbine_cooling;
    // What the file's defaults said for these keys no longer holds: each
    // is now the fit's value, recorded as such.
    let fitted = [
        ("gas_model", "products".to_string()),
        ("pressure_ratio", format!("{:.4}", config.pressure_ratio)),
        (
            "turbine_inlet_temperature",
            format!("{:.2} K", config.turbine_inlet_temperature_k),
        ),
        (
            "compressor_efficiency",
            format!("{:.4}", config.compressor_efficiency),
        ),
        (
            "turbine_efficiency",
            format!("{:.4}", config.turbine_efficiency),
        ),
        ("efficiency_basis", "polytropic".to_string()),
        (
            "mechanical_efficiency",
            format!("{:.4}", config.mechanical_efficiency),
        ),
        (
            "generator_efficiency",
            format!("{:.4}", config.generator_efficiency),
        ),
        ("auxiliary_load", "0".to_string()),
        ("turbine_cooling", format!("{:.4}", fit.turbine_cooling)),
    ];
    let taken = [
        ("inlet_pressure_loss", config.inlet_pressure_loss),
        ("exhaust_pressure_loss", config.exhaust_pressure_loss),
        ("combustor_pressure_loss", config.combustor_pressure_loss),
        ("combustion_efficiency", config.combustion_efficiency),
    ]
    .map(|(key, v)| (key, format!("{v} (the fit's default, common practice)")));
    let fitted = fitted.map(|(key, v)| (key, format!("{v} (fitted to the datasheet)")));
    for (key, value) in fitted.into_iter().chain(taken) {
        if r.has(key) {
            continue;
        }
        let field = r.field(key);
        ctx.defaults.retain(|d| d.key != field);
        r.default(ctx, key, &value);
    }
    candidate.fitted = Some(FittedMachine {
        fitted: fit.fitted.clone(),
        assumptions: fit.assumptions.clone(),
        air_flow_kg_per_s: fit.air_flow_kg_per_s,
    });
    Ok(())
}
