//! The numeric fields of a candidate, each with its key, unit kind, valid
//! range and accessors (see [`super::fields`]).

use super::candidate::{Candidate, GasModelSpec};
use super::fields::{money_from_f64, money_to_f64, CandidateField, SetResult};
use super::ranges::Range;
use crate::units::Kind;

const fn field(
    key: &'static str,
    kind: Kind,
    range: Range,
    get: fn(&Candidate) -> Option<f64>,
    set: fn(&mut Candidate, f64) -> SetResult,
) -> CandidateField {
    CandidateField {
        key,
        kind,
        range,
        get,
        set,
    }
}

/// Set `*slot` to `value`, or say which optional part is missing.
fn set_in<T>(slot: Option<&mut T>, value: T, part: &str) -> SetResult {
    match slot {
        Some(s) => {
            *s = value;
            Ok(())
        }
        None => Err(format!("this candidate has no {part}")),
    }
}

fn cold_air(c: &mut Candidate) -> Result<(&mut f64, &mut f64), String> {
    match &mut c.gas_model {
        GasModelSpec::ColdAir { cp_kj_per_kg_k, k } => Ok((cp_kj_per_kg_k, k)),
        _ => Err("this candidate's gas model is not cold-air".into()),
    }
}

/// Every numeric field of a candidate, keyed as in the file (within
/// `[[candidate]]`). Internal units: kW, K, fractions, kJ/(kg·K), h, and
/// money in the scenario currency (capital and overhaul as amounts, fixed
/// O&M per kW-yr, variable O&M per MWh).
pub(crate) const CANDIDATE_FIELDS: &[CandidateField] = &[
    field(
        "capital_cost",
        Kind::Money,
        Range::NonNegative,
        |c| Some(money_to_f64(c.capital_cost)),
        |c, v| {
            c.capital_cost = money_from_f64(v)?;
            Ok(())
        },
    ),
    field(
        "net_output",
        Kind::Power,
        Range::Positive,
        |c| Some(c.net_output_kw),
        |c, v| {
            c.net_output_kw = v;
            Ok(())
        },
    ),
    field(
        "cp_kj_per_kg_k",
        Kind::Number,
        Range::Positive,
        |c| match c.gas_model {
            GasModelSpec::ColdAir { cp_kj_per_kg_k, .. } => Some(cp_kj_per_kg_k),
            _ => None,
        },
        |c, v| {
            *cold_air(c)?.0 = v;
            Ok(())
        },
    ),
    field(
        "specific_heat_ratio",
        Kind::Number,
        Range::AboveOne,
        |c| match c.gas_model {
            GasModelSpec::ColdAir { k, .. } => Some(k),
            _ => None,
        },
        |c, v| {
            *cold_air(c)?.1 = v;
            Ok(())
        },
    ),
    field(
        "pressure_ratio",
        Kind::Number,
        Range::AboveOne,
        |c| Some(c.pressure_ratio),
        |c, v| {
            c.pressure_ratio = v;
            Ok(())
        },
    ),
    field(
        "turbine_inlet_temperature",
        Kind::Temperature,
        Range::Positive,
        |c| Some(c.turbine_inlet_temperature_k),
        |c, v| {
            c.turbine_inlet_temperature_k = v;
            Ok(())
        },
    ),
    field(
        "compressor_efficiency",
        Kind::Fraction,
        Range::Efficiency,
        |c| Some(c.compressor_efficiency),
        |c, v| {
            c.compressor_efficiency = v;
            Ok(())
        },
    ),
    field(
        "turbine_efficiency",
        Kind::Fraction,
        Range::Efficiency,
        |c| Some(c.turbine_efficiency),
        |c, v| {
            c.turbine_efficiency = v;
            Ok(())
        },
    ),
    field(
        "inlet_pressure_loss",
        Kind::Fraction,
        Range::Loss,
        |c| Some(c.inlet_pressure_loss),
        |c, v| {
            c.inlet_pressure_loss = v;
            Ok(())
        },
    ),
    field(
        "exhaust_pressure_loss",
        Kind::Fraction,
        Range::Loss,
        |c| Some(c.exhaust_pressure_loss),
        |c, v| {
            c.exhaust_pressure_loss = v;
            Ok(())
        },
    ),
    field(
        "combustor_pressure_loss",
        Kind::Fraction,
        Range::Loss,
        |c| Some(c.combustor_pressure_loss),
        |c, v| {
            c.combustor_pressure_loss = v;
            Ok(())
        },
    ),
    field(
        "combustion_efficiency",
        Kind::Fraction,
        Range::Efficiency,
        |c| Some(c.combustion_efficiency),
        |c, v| {
            c.combustion_efficiency = v;
            Ok(())
        },
    ),
    field(
        "mechanical_efficiency",
        Kind::Fraction,
        Range::Efficiency,
        |c| Some(c.mechanical_efficiency),
        |c, v| {
            c.mechanical_efficiency = v;
            Ok(())
        },
    ),
    field(
        "generator_efficiency",
        Kind::Fraction,
        Range::Efficiency,
        |c| Some(c.generator_efficiency),
        |c, v| {
            c.generator_efficiency = v;
            Ok(())
        },
    ),
    field(
        "auxiliary_load",
        Kind::Fraction,
        Range::Loss,
        |c| Some(c.auxiliary_load_fraction),
        |c, v| {
            c.auxiliary_load_fraction = v;
            Ok(())
        },
    ),
    field(
        "regenerator.effectiveness",
        Kind::Fraction,
        Range::OpenFraction,
        |c| c.regenerator.map(|r| r.effectiveness),
        |c, v| {
            set_in(
                c.regenerator.as_mut().map(|r| &mut r.effectiveness),
                v,
                "regenerator",
            )
        },
    ),
    field(
        "regenerator.air_side_pressure_loss",
        Kind::Fraction,
        Range::Loss,
        |c| c.regenerator.map(|r| r.air_side_pressure_loss),
        |c, v| {
            set_in(
                c.regenerator
                    .as_mut()
                    .map(|r| &mut r.air_side_pressure_loss),
                v,
                "regenerator",
            )
        },
    ),
    field(
        "regenerator.gas_side_pressure_loss",
        Kind::Fraction,
        Range::Loss,
        |c| c.regenerator.map(|r| r.gas_side_pressure_loss),
        |c, v| {
            set_in(
                c.regenerator
                    .as_mut()
                    .map(|r| &mut r.gas_side_pressure_loss),
                v,
                "regenerator",
            )
        },
    ),
    field(
        "intercooler.pressure_split",
        Kind::Number,
        Range::AboveOne,
        |c| c.intercooler.and_then(|i| i.pressure_split),
        |c, v| {
            set_in(
                c.intercooler.as_mut().map(|i| &mut i.pressure_split),
                Some(v),
                "intercooler",
            )
        },
    ),
    field(
        "intercooler.exit_temperature",
        Kind::Temperature,
        Range::Positive,
        |c| c.intercooler.and_then(|i| i.exit_temperature_k),
        |c, v| {
            set_in(
                c.intercooler
                    .as_mut()
                    .and_then(|i| i.exit_temperature_k.as_mut()),
                v,
                "intercooler exit temperature",
            )
        },
    ),
    field(
        "intercooler.effectiveness",
        Kind::Fraction,
        Range::Efficiency,
        |c| c.intercooler.and_then(|i| i.effectiveness),
        |c, v| {
            set_in(
                c.intercooler
                    .as_mut()
                    .and_then(|i| i.effectiveness.as_mut()),
                v,
                "intercooler effectiveness",
            )
        },
    ),
    field(
        "reheat.pressure_split",
        Kind::Number,
        Range::AboveOne,
        |c| c.reheat.and_then(|r| r.pressure_split),
        |c, v| {
            set_in(
                c.reheat.as_mut().map(|r| &mut r.pressure_split),
                Some(v),
                "reheat combustor",
            )
        },
    ),
    field(
        "reheat.temperature",
        Kind::Temperature,
        Range::Positive,
        |c| c.reheat.map(|r| r.temperature_k),
        |c, v| {
            set_in(
                c.reheat.as_mut().map(|r| &mut r.temperature_k),
                v,
                "reheat combustor",
            )
        },
    ),
    field(
        "costs.fixed_om",
        Kind::PricePerCapacity,
        Range::NonNegative,
        |c| Some(money_to_f64(c.costs.fixed_om_per_kw_year)),
        |c, v| {
            c.costs.fixed_om_per_kw_year = money_from_f64(v)?;
            Ok(())
        },
    ),
    field(
        "costs.variable_om",
        Kind::PricePerEnergy,
        Range::NonNegative,
        |c| Some(money_to_f64(c.costs.variable_om_per_mwh)),
        |c, v| {
            c.costs.variable_om_per_mwh = money_from_f64(v)?;
            Ok(())
        },
    ),
    field(
        "costs.overhaul_interval",
        Kind::Duration,
        Range::NonNegative,
        |c| Some(c.costs.overhaul_interval_hours),
        |c, v| {
            c.costs.overhaul_interval_hours = v;
            Ok(())
        },
    ),
    field(
        "costs.overhaul_cost",
        Kind::Money,
        Range::NonNegative,
        |c| Some(money_to_f64(c.costs.overhaul_cost)),
        |c, v| {
            c.costs.overhaul_cost = money_from_f64(v)?;
            Ok(())
        },
    ),
    field(
        "costs.degradation_per_year",
        Kind::Fraction,
        Range::Loss,
        |c| Some(c.costs.degradation_per_year),
        |c, v| {
            c.costs.degradation_per_year = v;
            Ok(())
        },
    ),
    field(
        "costs.recoverable_fraction",
        Kind::Fraction,
        Range::Fraction,
        |c| Some(c.costs.recoverable_fraction),
        |c, v| {
            c.costs.recoverable_fraction = v;
            Ok(())
        },
    ),
];
