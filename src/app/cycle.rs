//! `brayfin cycle`: read the flags (with units), solve one cycle, print the
//! state table and performance as a table, JSON or CSV.
//!
//! Every bad flag becomes `Error::Input` with one line naming the flag and
//! what would be valid (exit code 1).

use crate::cli::{CycleArgs, Format, GasModelArg};
use crate::cycle::{
    solve, CycleError, CycleResult, EfficiencyBasis, EngineConfig, GasModel, Intercooler,
    IntercoolerExit, Regenerator, Reheat, Sizing,
};
use crate::fuel::Fuel;
use crate::units::{self, UnitError};
use crate::{Error, Result};
use serde::Serialize;
use std::fmt::Write as _;
use tabled::builder::Builder;
use tabled::settings::{object::Columns, Alignment, Style};

/// Run `brayfin cycle`.
pub fn run(args: &CycleArgs) -> Result<()> {
    let (config, gas, fuel) = inputs(args)?;
    let result = match solve(&config, &gas, &fuel).map_err(|e| cycle_error(&e)) {
        Err(Error::Input(message)) => return Err(Error::Input(message)),
        other => {
            sensible_ranges(&config)?;
            other?
        }
    };
    let text = match args.format {
        Format::Table => table(&result, &fuel),
        Format::Json => json(&result, &fuel)?,
        Format::Csv => csv(&result),
    };
    print!("{text}");
    Ok(())
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
        compressor_efficiency: fraction("compressor-efficiency", &args.compressor_efficiency)?,
        turbine_efficiency: fraction("turbine-efficiency", &args.turbine_efficiency)?,
        efficiency_basis: if args.polytropic {
            EfficiencyBasis::Polytropic
        } else {
            EfficiencyBasis::Isentropic
        },
        combustor_pressure_loss: fraction(
            "combustor-pressure-loss",
            &args.combustor_pressure_loss,
        )?,
        regenerator,
        intercooler,
        reheat,
        sizing,
        ..EngineConfig::ideal(2.0, 1000.0)
    };
    let gas = match args.gas {
        GasModelArg::ColdAir => GasModel::cold_air_standard(),
        GasModelArg::Air => GasModel::Air,
        GasModelArg::Products => GasModel::Products,
    };
    let fuel = Fuel::parse(&args.fuel).map_err(|e| Error::Input(format!("--fuel: {e}")))?;
    Ok((config, gas, fuel))
}

/// The scenario's declared sensible ranges hold for the flags too (checked
/// after the solver's own checks, whose messages come first).
fn sensible_ranges(c: &EngineConfig) -> Result<()> {
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

#[derive(Serialize)]
struct JsonOutput<'a> {
    #[serde(flatten)]
    result: &'a CycleResult,
    fuel: &'a Fuel,
}

fn json(result: &CycleResult, fuel: &Fuel) -> Result<String> {
    let mut text = serde_json::to_string_pretty(&JsonOutput { result, fuel })
        .map_err(|e| Error::Internal(format!("writing JSON: {e}")))?;
    text.push('\n');
    Ok(text)
}

fn finish(mut table: tabled::Table, right_from: usize) -> String {
    table
        .with(Style::psql())
        .modify(Columns::new(right_from..), Alignment::right());
    table.to_string()
}

/// Rows of (quantity, value, unit) summarising the cycle.
fn summary(result: &CycleResult) -> Vec<(&'static str, String, &'static str)> {
    let r = result;
    let mut rows = vec![
        (
            "Compressor work",
            format!("{:.2}", r.compressor_work_kj_per_kg),
            "kJ/kg air",
        ),
        (
            "Turbine work",
            format!("{:.2}", r.turbine_work_kj_per_kg),
            "kJ/kg air",
        ),
        (
            "Net work (shaft)",
            format!("{:.2}", r.net_work_kj_per_kg),
            "kJ/kg air",
        ),
        (
            "Net electrical work",
            format!("{:.2}", r.electrical_work_kj_per_kg),
            "kJ/kg air",
        ),
        (
            "Heat input (fuel, LHV)",
            format!("{:.2}", r.heat_input_kj_per_kg),
            "kJ/kg air",
        ),
        (
            "Heat rejected",
            format!("{:.2}", r.heat_rejected_kj_per_kg),
            "kJ/kg air",
        ),
        ("Back-work ratio", format!("{:.4}", r.back_work_ratio), "-"),
        (
            "Thermal efficiency (LHV)",
            format!("{:.2}", r.thermal_efficiency * 100.0),
            "%",
        ),
        (
            "Heat rate (LHV)",
            format!("{:.0}", r.heat_rate_kj_per_kwh),
            "kJ/kWh",
        ),
        (
            "Heat rate (LHV)",
            format!("{:.0}", r.heat_rate_btu_per_kwh),
            "Btu/kWh",
        ),
        (
            "Exhaust temperature",
            format!("{:.2}", r.exhaust_temperature_k),
            "K",
        ),
    ];
    if let Some(far) = r.fuel_air_ratio {
        rows.push(("Fuel-air ratio", format!("{far:.5}"), "kg/kg air"));
    }
    if let Some(co2) = r.co2_kg_per_mwh {
        rows.push(("CO2 emitted", format!("{co2:.1}"), "kg/MWh"));
    }
    if let Some(flows) = &r.flows {
        rows.push((
            "Net electrical output",
            format!("{:.1}", flows.net_output_kw),
            "kW",
        ));
        rows.push((
            "Air flow",
            format!("{:.3}", flows.air_flow_kg_per_s),
            "kg/s",
        ));
        rows.push((
            "Fuel flow",
            format!("{:.4}", flows.fuel_flow_kg_per_s),
            "kg/s",
        ));
        rows.push((
            "Exhaust flow",
            format!("{:.3}", flows.exhaust_flow_kg_per_s),
            "kg/s",
        ));
    }
    rows
}

fn table(result: &CycleResult, fuel: &Fuel) -> String {
    let mut out = String::new();
    let _ = writeln!(
        out,
        "Gas-turbine cycle: gas model {}, fuel {} (LHV {:.0} kJ/kg)\n",
        result.gas_model,
        fuel.name(),
        fuel.lhv_kj_per_kg()
    );
    let mut states = Builder::default();
    states.push_record([
        "State",
        "Point",
        "T (K)",
        "p (kPa)",
        "h (kJ/kg)",
        "s (kJ/(kg·K))",
    ]);
    for s in &result.states {
        states.push_record([
            s.id.to_string(),
            s.name.to_string(),
            format!("{:.2}", s.temperature_k),
            format!("{:.3}", s.pressure_kpa),
            format!("{:.2}", s.enthalpy_kj_per_kg),
            format!("{:.4}", s.entropy_kj_per_kg_k),
        ]);
    }
    out.push_str(&finish(states.build(), 2));
    out.push_str("\n\n");
    let mut perf = Builder::default();
    perf.push_record(["Quantity", "Value", "Unit"]);
    for (quantity, value, unit) in summary(result) {
        perf.push_record([quantity.to_string(), value, unit.to_string()]);
    }
    let mut perf = perf.build();
    perf.with(Style::psql())
        .modify(Columns::single(1), Alignment::right());
    out.push_str(&perf.to_string());
    let _ = writeln!(
        out,
        "\n\nEnergy balance (per kg air): net work {:.6} = heat added {:.6} - heat rejected {:.6} kJ/kg; residual {:.1e} kJ/kg",
        result.net_work_kj_per_kg,
        result.heat_input_kj_per_kg,
        result.heat_rejected_kj_per_kg,
        result.energy_balance_residual_kj_per_kg
    );
    out.push_str(
        "Efficiency and heat rate: net electrical output over fuel energy, lower heating value basis.\n",
    );
    out
}

fn csv_field(text: &str) -> String {
    if text.contains([',', '"', '\n']) {
        format!("\"{}\"", text.replace('"', "\"\""))
    } else {
        text.to_string()
    }
}

/// Long format: `item,quantity,value,unit`, one row per number.
fn csv(result: &CycleResult) -> String {
    let mut out = String::from("item,quantity,value,unit\n");
    for s in &result.states {
        let item = format!("state {}", s.id);
        for (quantity, value, unit) in [
            ("temperature", s.temperature_k, "K"),
            ("pressure", s.pressure_kpa, "kPa"),
            ("enthalpy", s.enthalpy_kj_per_kg, "kJ/kg"),
            ("entropy", s.entropy_kj_per_kg_k, "kJ/(kg·K)"),
        ] {
            let _ = writeln!(
                out,
                "{},{quantity},{value},{}",
                csv_field(&item),
                csv_field(unit)
            );
        }
    }
    for (quantity, value, unit) in summary(result) {
        let _ = writeln!(
            out,
            "cycle,{},{value},{}",
            csv_field(quantity),
            csv_field(unit)
        );
    }
    let _ = writeln!(
        out,
        "cycle,Energy balance residual,{},kJ/kg air",
        result.energy_balance_residual_kj_per_kg
    );
    out
}
