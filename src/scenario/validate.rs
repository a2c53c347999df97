//! Whole-scenario rules: every field's range, and the rules that tie fields
//! together. Run on load (each failure placed at its key's line and column)
//! and after every set through a key path.

use super::candidate::{GasModelSpec, ResidualValue};
use super::declare::{candidate_keys, scenario_keys};
use super::types::{FuelComposition, Scenario};

/// A rule a scenario breaks: the field, what is wrong, what would be valid.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Violation {
    /// Dotted key, e.g. `candidate[premium].turbine_inlet_temperature`.
    pub field: String,
    /// What is wrong.
    pub problem: String,
    /// What would be valid.
    pub valid: String,
}

/// Check every numeric field against its range.
pub(crate) fn check_ranges(scenario: &Scenario) -> Result<(), Violation> {
    for field in scenario_keys() {
        if let Some(value) = field.access.and_then(|a| (a.get)(scenario)) {
            field.check(value).map_err(|(problem, valid)| Violation {
                field: field.path.to_string(),
                problem,
                valid,
            })?;
        }
    }
    for candidate in &scenario.candidates {
        for field in candidate_keys() {
            if let Some(value) = field.access.and_then(|a| (a.get)(candidate)) {
                field.check(value).map_err(|(problem, valid)| Violation {
                    field: format!("candidate[{}].{}", candidate.id, field.path),
                    problem,
                    valid,
                })?;
            }
        }
    }
    Ok(())
}

fn violation(field: String, problem: String, valid: &str) -> Violation {
    Violation {
        field,
        problem,
        valid: valid.to_string(),
    }
}

/// Rules that tie fields together. Allocates only to report a failure.
pub(crate) fn cross_check(scenario: &Scenario) -> Result<(), Violation> {
    let meta = &scenario.meta;
    if !scenario.candidates.iter().any(|c| c.id == meta.baseline) {
        return Err(violation(
            "scenario.baseline".into(),
            format!("{:?} is not the id of any candidate", meta.baseline),
            "expected the id of one [[candidate]]",
        ));
    }
    if let FuelComposition::HeatingValues {
        lhv_kj_per_kg,
        hhv_kj_per_kg,
        ..
    } = scenario.fuel.composition
    {
        if hhv_kj_per_kg < lhv_kj_per_kg {
            return Err(violation(
                "fuel.hhv".into(),
                format!("{hhv_kj_per_kg} kJ/kg is below the LHV of {lhv_kj_per_kg} kJ/kg"),
                "expected an HHV at least as large as the LHV",
            ));
        }
    }
    let operation = &scenario.operation;
    if !operation.dispatch.is_empty() {
        let total: f64 = operation.dispatch.iter().map(|b| b.hours).sum();
        if (total - operation.hours_per_year).abs() > 1e-6 * operation.hours_per_year.max(1.0) {
            return Err(violation(
                "operation.dispatch".into(),
                format!(
                    "the blocks' hours sum to {total} h but hours_per_year is {} h",
                    operation.hours_per_year
                ),
                "expected the dispatch hours to sum to hours_per_year (or leave hours_per_year out)",
            ));
        }
    }
    let ambient_k = scenario.site.ambient_temperature_k;
    for c in &scenario.candidates {
        let at = |key: &str| format!("candidate[{}].{key}", c.id);
        if let Some(lowest) = c.part_load.first() {
            if let Some(block) = operation
                .dispatch
                .iter()
                .find(|b| b.load_fraction < lowest.load_fraction)
            {
                return Err(violation(
                    at("part_load"),
                    format!(
                        "reaches down to load {}, but operation.dispatch has a block at load {}; \
                         brayfin does not extrapolate a vendor's curve",
                        lowest.load_fraction, block.load_fraction
                    ),
                    "expected a part_load curve that reaches down to every dispatch load (or no \
                     part_load, to price part load from the machine's physics)",
                ));
            }
        }
        if c.turbine_inlet_temperature_k <= ambient_k {
            return Err(violation(
                at("turbine_inlet_temperature"),
                format!(
                    "{} K is not above the ambient temperature of {ambient_k} K",
                    c.turbine_inlet_temperature_k
                ),
                "expected a turbine inlet temperature well above ambient",
            ));
        }
        if matches!(c.gas_model, GasModelSpec::Products)
            && matches!(
                scenario.fuel.composition,
                FuelComposition::HeatingValues { .. }
            )
        {
            return Err(violation(
                at("gas_model"),
                "\"products\" needs the fuel's composition, but the fuel is given by heating values only".into(),
                "expected gas_model = \"air\" or \"cold-air\", or a fuel composition",
            ));
        }
        if let Some(split) = c.intercooler.and_then(|i| i.pressure_split) {
            if split >= c.pressure_ratio {
                return Err(violation(
                    at("intercooler.pressure_split"),
                    format!("{split} is not below the pressure ratio {}", c.pressure_ratio),
                    "expected a low-pressure compressor ratio between 1 and the overall pressure ratio",
                ));
            }
        }
        if let Some(reheat) = c.reheat {
            if let Some(split) = reheat.pressure_split {
                if split >= c.pressure_ratio {
                    return Err(violation(
                        at("reheat.pressure_split"),
                        format!("{split} is not below the pressure ratio {}", c.pressure_ratio),
                        "expected a high-pressure turbine expansion ratio between 1 and the overall pressure ratio",
                    ));
                }
            }
            if reheat.temperature_k <= ambient_k {
                return Err(violation(
                    at("reheat.temperature"),
                    format!(
                        "{} K is not above the ambient temperature of {ambient_k} K",
                        reheat.temperature_k
                    ),
                    "expected a reheat temperature well above ambient",
                ));
            }
        }
        match c.costs.residual_value {
            ResidualValue::FractionOfCapital(f) if !(0.0..=1.0).contains(&f) => {
                return Err(violation(
                    at("costs.residual_value"),
                    format!("{f} is not a fraction of capital in [0, 1]"),
                    "expected a fraction such as 10 %, or an amount such as 2500000 USD",
                ));
            }
            ResidualValue::Amount(a) if a.is_sign_negative() && !a.is_zero() => {
                return Err(violation(
                    at("costs.residual_value"),
                    format!("{a} is negative"),
                    "expected an amount of 0 or more",
                ));
            }
            _ => {}
        }
    }
    Ok(())
}
