//! `brayfin cycle`: read the flags (with units), solve one cycle, print
//! what [`crate::report::views::cycle::CycleView`] renders.
//!
//! Every bad flag becomes `Error::Input` with one line naming the flag and
//! what would be valid (exit code 1).

use super::output::{print, text_format, units_of};
use crate::cli::{CycleArgs, GasModelArg};
use crate::cycle::{
    solve_detailed, CycleError, Detail, EfficiencyBasis, EngineConfig, GasModel, Intercooler,
    IntercoolerExit, Regenerator, Reheat, Sizing,
};
use crate::fuel::Fuel;
use crate::report::views::{cycle::CycleView, render};
use crate::units::{self, UnitError};
use crate::{Error, Result};

/// Run `brayfin cycle`.
pub fn run(args: &CycleArgs) -> Result<()> {
    let (config, gas, fuel) = inputs(args)?;
    let detail = Detail {
        turbine_cooling: read("turbine-cooling", &args.turbine_cooling, units::fraction)?,
        relative_humidity: read(
            "relative-humidity",
            &args.relative_humidity,
            units::fraction,
        )?,
    };
    let solved = solve_detailed(&config, &detail, &gas, &fuel).map_err(|e| cycle_error(&e));
    let result = match solved {
        Err(Error::Input(message)) => return Err(Error::Input(message)),
        other => {
            sensible_ranges(&config, &detail)?;
            other?
        }
    };
    let ideal = ideal_defaults(args);
    let view = CycleView::new(&result, &fuel, units_of(args.units)).with_ideal_defaults(&ideal);
    print(&render(&view, text_format(args.format))?)
}

fn flag_error(flag: &str, e: UnitError) -> Error {
    Error::Input(format!("--{flag}: {e}"))
}

fn read(
    flag: &str,
    text: &str,
    parse: fn(&str) -> std::result::Result<f64, UnitError>,
) -> Result<f64> {
    parse(text).map_err(|e| flag_error(flag, e))
}

/// The engine, gas model and fuel the flags describe.
fn inputs(args: &CycleArgs) -> Result<(EngineConfig, GasModel, Fuel)> {
    let temperature = |flag: &str, text: &str| read(flag, text, units::temperature_k);
    let fraction = |flag: &str, text: &str| read(flag, text, units::fraction);
    // An efficiency flag not given is ideal (1); the output says so.
    let efficiency = |flag: &str, text: &Option<String>| match text {
        Some(text) => read(flag, text, units::fraction),
        None => Ok(1.0),
    };
    let regenerator = match &args.regenerator_effectiveness {
        None => None,
        Some(text) => {
            let loss = fraction("regenerator-pressure-loss", &args.regenerator_pressure_loss)?;
            Some(Regenerator {
                effectiveness: fraction("regenerator-effectiveness", text)?,
                air_side_pressure_loss: loss,
                gas_side_pressure_loss: loss,
            })
        }
    };
    let intercooler = match &args.intercool_temperature {
        None => None,
        Some(text) => Some(Intercooler {
            pressure_split: None,
            exit: IntercoolerExit::TemperatureK(temperature("intercool-temperature", text)?),
        }),
    };
    let reheat = match &args.reheat_temperature {
        None => None,
        Some(text) => Some(Reheat {
            pressure_split: None,
            temperature_k: temperature("reheat-temperature", text)?,
        }),
    };
    let sizing = match &args.net_output {
        None => None,
        Some(text) => Some(Sizing::NetOutputKw(read(
            "net-output",
            text,
            units::power_kw,
        )?)),
    };
    let config = EngineConfig {
        ambient_temperature_k: temperature("ambient-temperature", &args.ambient_temperature)?,
        ambient_pressure_kpa: read(
            "ambient-pressure",
            &args.ambient_pressure,
            units::pressure_kpa,
        )?,
        pressure_ratio: read("pressure-ratio", &args.pressure_ratio, units::number)?,
        turbine_inlet_temperature_k: temperature(
            "turbine-inlet-temperature",
            &args.turbine_inlet_temperature,
        )?,
        compressor_efficiency: efficiency("compressor-efficiency", &args.compressor_efficiency)?,
        turbine_efficiency: efficiency("turbine-efficiency", &args.turbine_efficiency)?,
        efficiency_basis: if args.polytropic {
            EfficiencyBasis::Polytropic
        } else {
            EfficiencyBasis::Isentropic
        },
        combustor_pressure_loss: fraction(
            "combustor-pressure-loss",
            &args.combustor_pressure_loss,
        )?,
        combustion_efficiency: fraction("combustion-efficiency", &args.combustion_efficiency)?,
        inlet_pressure_loss: fraction("inlet-pressure-loss", &args.inlet_pressure_loss)?,
        exhaust_pressure_loss: fraction("exhaust-pressure-loss", &args.exhaust_pressure_loss)?,
        mechanical_efficiency: efficiency("mechanical-efficiency", &args.mechanical_efficiency)?,
        generator_efficiency: efficiency("generator-efficiency", &args.generator_efficiency)?,
        auxiliary_load_fraction: fraction("auxiliary-load", &args.auxiliary_load)?,
        regenerator,
        intercooler,
        reheat,
        sizing,
    };
    let gas = match args.gas {
        GasModelArg::ColdAir => GasModel::cold_air_standard(),
        GasModelArg::Air => GasModel::Air,
        GasModelArg::Products => GasModel::Products,
    };
    let fuel = Fuel::parse(&args.fuel).map_err(|e| Error::Input(format!("--fuel: {e}")))?;
    Ok((config, gas, fuel))
}

/// The component-efficiency flags left at their ideal default of 1 (not
/// given on the command line).
fn ideal_defaults(args: &CycleArgs) -> Vec<&'static str> {
    [
        ("--compressor-efficiency", &args.compressor_efficiency),
        ("--turbine-efficiency", &args.turbine_efficiency),
        ("--mechanical-efficiency", &args.mechanical_efficiency),
        ("--generator-efficiency", &args.generator_efficiency),
    ]
    .into_iter()
    .filter(|(_, given)| given.is_none())
    .map(|(flag, _)| flag)
    .collect()
}

/// The scenario's declared sensible ranges hold for the flags too (checked
/// after the solver's own checks, whose messages come first).
fn sensible_ranges(c: &EngineConfig, detail: &Detail) -> Result<()> {
    let net_output = match c.sizing {
        Some(Sizing::NetOutputKw(kw)) => Some(kw),
        _ => None,
    };
    let intercool = c.intercooler.and_then(|i| match i.exit {
        IntercoolerExit::TemperatureK(t) => Some(t),
        IntercoolerExit::Effectiveness(_) => None,
    });
    let values = [
        ("ambient-temperature", Some(c.ambient_temperature_k)),
        ("ambient-pressure", Some(c.ambient_pressure_kpa)),
        ("pressure-ratio", Some(c.pressure_ratio)),
        (
            "turbine-inlet-temperature",
            Some(c.turbine_inlet_temperature_k),
        ),
        ("compressor-efficiency", Some(c.compressor_efficiency)),
        ("turbine-efficiency", Some(c.turbine_efficiency)),
        ("combustor-pressure-loss", Some(c.combustor_pressure_loss)),
        (
            "regenerator-effectiveness",
            c.regenerator.map(|r| r.effectiveness),
        ),
        (
            "regenerator-pressure-loss",
            c.regenerator.map(|r| r.air_side_pressure_loss),
        ),
        ("intercool-temperature", intercool),
        ("reheat-temperature", c.reheat.map(|r| r.temperature_k)),
        ("net-output", net_output),
        ("combustion-efficiency", Some(c.combustion_efficiency)),
        ("inlet-pressure-loss", Some(c.inlet_pressure_loss)),
        ("exhaust-pressure-loss", Some(c.exhaust_pressure_loss)),
        ("mechanical-efficiency", Some(c.mechanical_efficiency)),
        ("generator-efficiency", Some(c.generator_efficiency)),
        ("auxiliary-load", Some(c.auxiliary_load_fraction)),
        ("turbine-cooling", Some(detail.turbine_cooling)),
        ("relative-humidity", Some(detail.relative_humidity)),
    ];
    for (flag, value) in values {
        if let Some(value) = value {
            crate::scenario::check_flag_value(flag, value)
                .map_err(|why| Error::Input(format!("--{flag}: {why}")))?;
        }
    }
    Ok(())
}

/// The command-line flag that sets an [`EngineConfig`] field.
fn flag_for(field: &str) -> &str {
    match field {
        "ambient_temperature_k" => "--ambient-temperature",
        "ambient_pressure_kpa" => "--ambient-pressure",
        "pressure_ratio" => "--pressure-ratio",
        "turbine_inlet_temperature_k" => "--turbine-inlet-temperature",
        "compressor_efficiency" => "--compressor-efficiency",
        "turbine_efficiency" => "--turbine-efficiency",
        "combustor_pressure_loss" | "reheat.pressure_split" => "--combustor-pressure-loss",
        "regenerator.effectiveness" => "--regenerator-effectiveness",
        "regenerator.air_side_pressure_loss" | "regenerator.gas_side_pressure_loss" => {
            "--regenerator-pressure-loss"
        }
        "intercooler.exit_temperature_k" => "--intercool-temperature",
        "reheat.temperature_k" => "--reheat-temperature",
        "net_output_kw" => "--net-output",
        "combustion_efficiency" => "--combustion-efficiency",
        "inlet_pressure_loss" => "--inlet-pressure-loss",
        "exhaust_pressure_loss" => "--exhaust-pressure-loss",
        "mechanical_efficiency" => "--mechanical-efficiency",
        "generator_efficiency" => "--generator-efficiency",
        "auxiliary_load_fraction" => "--auxiliary-load",
        "turbine_cooling" => "--turbine-cooling",
        "relative_humidity" => "--relative-humidity",
        "gas_model" => "--gas",
        other => other,
    }
}

/// One line naming the flag at fault and what would be valid.
fn cycle_error(e: &CycleError) -> Error {
    let message = match e.field() {
        Some(field) => format!("{}: {}", flag_for(field), e.detail()),
        None if matches!(e, CycleError::NoNetWork { .. }) => {
            format!("--turbine-inlet-temperature, --pressure-ratio: {e}")
        }
        None => e.to_string(),
    };
    if e.is_input_error() {
        Error::Input(message)
    } else {
        Error::Internal(message)
    }
}
