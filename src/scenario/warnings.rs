//! Engineering warnings available without solving the cycle: values that
//! are valid but unusual, and conversions an analyst should know about.
//! Thresholds are common practice for heavy-duty and aeroderivative gas
//! turbines, not limits from a standard.

use super::candidate::{Candidate, EfficiencyBasis};
use super::types::{FuelComposition, PriceBasis, Scenario};
use super::uncertainty::Distribution;

/// Highest usual isentropic efficiencies: compressor 0.92, turbine 0.94
/// (common practice).
const USUAL_MAX_ISENTROPIC: (f64, f64) = (0.92, 0.94);
/// Highest usual polytropic efficiencies: compressor 0.93, turbine 0.94
/// (common practice).
const USUAL_MAX_POLYTROPIC: (f64, f64) = (0.93, 0.94);
/// Efficiencies below this are unusually poor for either component.
const USUAL_MIN_EFFICIENCY: f64 = 0.75;
/// Turbine inlet temperatures above this exceed current firing temperatures
/// of industrial machines (common practice).
const USUAL_MAX_TIT_K: f64 = 1_900.0;
/// Pressure ratios above this exceed current industrial machines (common
/// practice; the largest aeroderivatives are near 40–45).
const USUAL_MAX_PRESSURE_RATIO: f64 = 45.0;
/// Hours in a common (non-leap) year.
const HOURS_PER_COMMON_YEAR: f64 = 8760.0;

/// Warnings for `scenario`, in reading order: site and fuel, economics,
/// operation, each candidate, uncertainty.
pub fn engineering_warnings(scenario: &Scenario) -> Vec<String> {
    let mut w = Vec::new();
    fuel_warnings(scenario, &mut w);
    let economics = &scenario.economics;
    if economics.commercial_operation < scenario.meta.date {
        w.push(format!(
            "economics.commercial_operation ({}) is before the scenario date ({}): operation already under way is valued as if it were ahead",
            economics.commercial_operation, scenario.meta.date
        ));
    }
    if economics.discount_rate > 0.15 {
        w.push(format!(
            "economics.discount_rate is {:.1} %, above the usual range for utility investments (common practice: 3–12 % real)",
            economics.discount_rate * 100.0
        ));
    }
    if scenario.operation.hours_per_year > HOURS_PER_COMMON_YEAR {
        w.push(format!(
            "operation.hours_per_year is {} h: more than the 8760 h of a common year, possible only in a leap year",
            scenario.operation.hours_per_year
        ));
    }
    let outputs_differ = scenario
        .candidates
        .windows(2)
        .any(|p| (p[0].net_output_kw - p[1].net_output_kw).abs() > 1e-9);
    if outputs_differ {
        match (
            economics.energy_value_per_mwh.is_zero(),
            economics.capacity_value_per_kw_year.is_zero(),
        ) {
            (true, true) => w.push("the candidates differ in net output but economics.energy_value and economics.capacity_value are both 0: a candidate's shortfall in output is not valued, so a smaller unit looks cheaper only because it makes less electricity; state what a MWh and a kW-year bought elsewhere would cost".into()),
            (true, false) => w.push("the candidates differ in net output but economics.energy_value is 0: their shortfall in capacity is valued, their shortfall in energy is not".into()),
            (false, true) => w.push("the candidates differ in net output but economics.capacity_value is 0: their shortfall in energy is valued, their shortfall in capacity is not".into()),
            (false, false) => {}
        }
    }
    for c in &scenario.candidates {
        candidate_warnings(scenario, c, &mut w);
    }
    uncertainty_warnings(scenario, &mut w);
    w
}

/// Information an analyst should know that is not a warning: routine
/// conversions brayfin makes (today the HHV/LHV conversion of a fuel price
/// on the HHV basis).
pub fn information_notes(scenario: &Scenario) -> Vec<String> {
    let mut notes = Vec::new();
    let fuel = &scenario.fuel;
    if fuel.price_basis == PriceBasis::Hhv {
        let ratio = match fuel.composition {
            FuelComposition::HeatingValues {
                lhv_kj_per_kg,
                hhv_kj_per_kg,
                ..
            } => format!(
                "{:.4}, from the given heating values",
                hhv_kj_per_kg / lhv_kj_per_kg
            ),
            _ => "from the fuel composition; about 1.11 for pipeline natural gas, common practice"
                .into(),
        };
        notes.push(format!(
            "fuel.price is per unit of higher heating value (HHV) and heat rates are on the lower (LHV): each year's fuel energy (LHV) is multiplied by the fuel's HHV/LHV ratio ({ratio}) before it is priced"
        ));
    }
    notes
}

fn fuel_warnings(scenario: &Scenario, w: &mut Vec<String>) {
    let fuel = &scenario.fuel;
    if let FuelComposition::MoleFractions(fractions) = &fuel.composition {
        let inert: f64 = fractions
            .iter()
            .filter(|(s, _)| s == "N2" || s == "CO2")
            .map(|(_, x)| x)
            .sum();
        if inert > 0.3 {
            w.push(format!(
                "fuel.composition is {:.0} % N2 and CO2: a low-heating-value gas; check the combustor is rated for it",
                inert * 100.0
            ));
        }
    }
}

fn candidate_warnings(scenario: &Scenario, c: &Candidate, w: &mut Vec<String>) {
    let at = |key: &str| format!("candidate[{}].{key}", c.id);
    let (basis, (max_c, max_t)) = match c.efficiency_basis {
        EfficiencyBasis::Isentropic => ("isentropic", USUAL_MAX_ISENTROPIC),
        EfficiencyBasis::Polytropic => ("polytropic", USUAL_MAX_POLYTROPIC),
    };
    for (key, value, max) in [
        ("compressor_efficiency", c.compressor_efficiency, max_c),
        ("turbine_efficiency", c.turbine_efficiency, max_t),
    ] {
        if value > max {
            w.push(format!(
                "{}: {basis} {:.1} % is above the usual range for its class (common practice: at most about {:.0} %)",
                at(key),
                value * 100.0,
                max * 100.0
            ));
        } else if value < USUAL_MIN_EFFICIENCY {
            w.push(format!(
                "{}: {basis} {:.1} % is unusually low (common practice: 80–92 %)",
                at(key),
                value * 100.0
            ));
        }
    }
    if c.turbine_inlet_temperature_k > USUAL_MAX_TIT_K {
        w.push(format!(
            "{}: {} K is above the firing temperatures of current industrial machines (common practice: at most about {USUAL_MAX_TIT_K} K)",
            at("turbine_inlet_temperature"),
            c.turbine_inlet_temperature_k
        ));
    }
    if c.pressure_ratio > USUAL_MAX_PRESSURE_RATIO {
        w.push(format!(
            "{}: {} is above current industrial machines (common practice: at most about {USUAL_MAX_PRESSURE_RATIO})",
            at("pressure_ratio"),
            c.pressure_ratio
        ));
    }
    let ideal: Vec<&str> = [
        ("combustion_efficiency", c.combustion_efficiency == 1.0),
        ("mechanical_efficiency", c.mechanical_efficiency == 1.0),
        ("generator_efficiency", c.generator_efficiency == 1.0),
        ("inlet_pressure_loss", c.inlet_pressure_loss == 0.0),
        ("exhaust_pressure_loss", c.exhaust_pressure_loss == 0.0),
        ("combustor_pressure_loss", c.combustor_pressure_loss == 0.0),
    ]
    .into_iter()
    .filter_map(|(k, is_ideal)| is_ideal.then_some(k))
    .collect();
    // A machine fitted to its datasheet reproduces the vendor's heat rate
    // whatever losses it assumes (its assumptions are stated with the fit).
    if !ideal.is_empty() && c.fitted.is_none() {
        w.push(format!(
            "candidate[{}]: ideal (lossless) values for {}: the heat rate will be optimistic",
            c.id,
            ideal.join(", ")
        ));
    }
    if let Some(t) = c.intercooler.and_then(|i| i.exit_temperature_k) {
        if t < scenario.site.ambient_temperature_k {
            w.push(format!(
                "{}: {t} K is below ambient ({} K): an intercooler needs a chiller to do that",
                at("intercooler.exit_temperature"),
                scenario.site.ambient_temperature_k
            ));
        }
    }
}

fn uncertainty_warnings(scenario: &Scenario, w: &mut Vec<String>) {
    for u in &scenario.uncertainty {
        if let (Some(Distribution::Normal { .. }), None) = (u.distribution, u.truncate) {
            if u.key.contains("efficiency") || u.key.contains("loss") || u.key.contains("fraction")
            {
                w.push(format!(
                    "uncertainty {}: a normal distribution without truncate can draw values outside the key's range; add truncate = [low, high]",
                    u.key
                ));
            }
        }
        if let Some(field) = u.key.strip_prefix("candidate.") {
            if scenario.get_numeric(&u.key).is_err()
                && scenario.numeric_keys().iter().any(|k| k == &u.key)
            {
                w.push(format!(
                    "uncertainty {}: the candidates differ in {field}, but every sample gives them all the same value; use candidate[<id>].{field} to vary one",
                    u.key
                ));
            }
        }
    }
}
