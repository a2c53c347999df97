//! `brayfin cycle`: the state table and the cycle's performance.
//!
//! - table: the state points (T, p, h, s) and a quantity/value/unit table
//!   in the chosen unit system, then the energy balance;
//! - JSON: the solver's result and the fuel, always SI (the key names carry
//!   the units: `temperature_k`, `heat_rate_kj_per_kwh`, …);
//! - CSV: long format `item,quantity,value,unit`, one row per number, in
//!   the chosen unit system (the `unit` column says which).

use super::{csv_line, json_text, View};
use crate::cycle::CycleResult;
use crate::fuel::Fuel;
use crate::report::format::{self, Quantity as Q};
use crate::report::model::Units;
use crate::Result;
use serde::Serialize;
use std::fmt::Write as _;
use tabled::builder::Builder;
use tabled::settings::{object::Columns, Alignment, Style};

/// What `cycle` prints: a solved cycle, its fuel and the unit system.
pub struct CycleView<'a> {
    result: &'a CycleResult,
    fuel: &'a Fuel,
    units: Units,
    /// LHV heat input of the sized machine, kW (fuel flow × LHV), when the
    /// cycle was sized to a net output.
    fuel_energy_flow_kw: Option<f64>,
    /// Component-efficiency flags left at their ideal default of 1.
    ideal_defaults: Vec<&'static str>,
}

impl<'a> CycleView<'a> {
    /// The view of `result` solved with `fuel`, printed in `units`.
    pub fn new(result: &'a CycleResult, fuel: &'a Fuel, units: Units) -> Self {
        let fuel_energy_flow_kw = result
            .flows
            .as_ref()
            .map(|f| f.fuel_flow_kg_per_s * fuel.lhv_kj_per_kg());
        CycleView {
            result,
            fuel,
            units,
            fuel_energy_flow_kw,
            ideal_defaults: Vec::new(),
        }
    }

    /// Name the component-efficiency flags that were left at their ideal
    /// default of 1, so the output can say so.
    pub fn with_ideal_defaults(mut self, flags: &[&'static str]) -> Self {
        self.ideal_defaults = flags.to_vec();
        self
    }

    /// The sentence saying which efficiencies were left ideal, if any.
    fn ideal_note(&self) -> Option<String> {
        (!self.ideal_defaults.is_empty()).then(|| {
            format!(
                "Left at the ideal default of 1 (no loss): {}. Give them to model a real machine.",
                self.ideal_defaults.join(", ")
            )
        })
    }

    /// Rows of (quantity, value, unit) summarising the cycle.
    fn summary(&self) -> Vec<(&'static str, String, &'static str)> {
        let (r, u) = (self.result, self.units);
        let work = |label, kj_per_kg| {
            (
                label,
                format::value(Q::SpecificEnergy, kj_per_kg, u, 2),
                format::unit(Q::SpecificEnergy, u),
            )
        };
        let mut rows = vec![
            work("Compressor work", r.compressor_work_kj_per_kg),
            work("Turbine work", r.turbine_work_kj_per_kg),
            work("Net work (shaft)", r.net_work_kj_per_kg),
            work("Net electrical work", r.electrical_work_kj_per_kg),
            work("Heat input (fuel, LHV)", r.heat_input_kj_per_kg),
            work("Heat rejected", r.heat_rejected_kj_per_kg),
            (
                "Back-work ratio",
                format::back_work_ratio(r.back_work_ratio)
                    .trim_end_matches(" %")
                    .to_string(),
                "%",
            ),
            (
                "Thermal efficiency (LHV)",
                format!("{:.2}", r.thermal_efficiency * 100.0),
                "%",
            ),
        ];
        let heat_rate = [
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
        ];
        // Both heat rates are printed; the chosen system's comes first.
        match u {
            Units::Si => rows.extend(heat_rate),
            Units::Us => rows.extend(heat_rate.into_iter().rev()),
        }
        rows.push((
            "Exhaust temperature",
            format::value(Q::Temperature, r.exhaust_temperature_k, u, 2),
            format::unit(Q::Temperature, u),
        ));
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
                format::value(Q::MassFlow, flows.air_flow_kg_per_s, u, 3),
                format::unit(Q::MassFlow, u),
            ));
            let fuel_decimals = match u {
                Units::Si => 4,
                Units::Us => 1,
            };
            rows.push((
                "Fuel flow",
                format::value(Q::FuelMassFlow, flows.fuel_flow_kg_per_s, u, fuel_decimals),
                format::unit(Q::FuelMassFlow, u),
            ));
            if let Some(kw) = self.fuel_energy_flow_kw {
                rows.push((
                    "Fuel energy flow (LHV)",
                    format::value(Q::FuelEnergyFlow, kw, u, 2),
                    format::unit(Q::FuelEnergyFlow, u),
                ));
            }
            rows.push((
                "Exhaust flow",
                format::value(Q::MassFlow, flows.exhaust_flow_kg_per_s, u, 3),
                format::unit(Q::MassFlow, u),
            ));
        }
        rows
    }

    /// One state's (quantity, value, unit) in the chosen system.
    fn state_values(&self, i: usize) -> [(&'static str, f64, &'static str); 4] {
        let (s, u) = (&self.result.states[i], self.units);
        [
            (
                "temperature",
                format::in_units(Q::Temperature, s.temperature_k, u),
                format::unit(Q::Temperature, u),
            ),
            (
                "pressure",
                format::in_units(Q::Pressure, s.pressure_kpa, u),
                format::unit(Q::Pressure, u),
            ),
            (
                "enthalpy",
                format::in_units(Q::HeatingValue, s.enthalpy_kj_per_kg, u),
                format::unit(Q::HeatingValue, u),
            ),
            (
                "entropy",
                format::in_units(Q::SpecificEntropy, s.entropy_kj_per_kg_k, u),
                format::unit(Q::SpecificEntropy, u),
            ),
        ]
    }
}

#[derive(Serialize)]
struct JsonOutput<'a> {
    #[serde(flatten)]
    result: &'a CycleResult,
    fuel: &'a Fuel,
    /// Flags of component efficiencies left at their ideal default of 1.
    efficiencies_left_ideal: &'a [&'static str],
}

impl View for CycleView<'_> {
    fn table(&self) -> Result<String> {
        let (result, u) = (self.result, self.units);
        let mut out = String::new();
        let _ = writeln!(
            out,
            "Gas-turbine cycle: gas model {}, fuel {} (LHV {}); units {}\n",
            result.gas_model,
            self.fuel.name(),
            format::with_unit(Q::HeatingValue, self.fuel.lhv_kj_per_kg(), u, 0),
            format::units_name(u)
        );
        let mut states = Builder::default();
        states.push_record([
            "State".to_string(),
            "Point".to_string(),
            format!("T ({})", format::unit(Q::Temperature, u)),
            format!("p ({})", format::unit(Q::Pressure, u)),
            format!("h ({})", format::unit(Q::HeatingValue, u)),
            format!("s ({})", format::unit(Q::SpecificEntropy, u)),
        ]);
        for (i, s) in result.states.iter().enumerate() {
            let [t, p, h, e] = self.state_values(i);
            states.push_record([
                s.id.to_string(),
                s.name.to_string(),
                format!("{:.2}", t.1),
                format!("{:.3}", p.1),
                format!("{:.2}", h.1),
                format!("{:.4}", e.1),
            ]);
        }
        let mut states = states.build();
        states
            .with(Style::psql())
            .modify(Columns::new(2..), Alignment::right());
        out.push_str(&states.to_string());
        out.push_str("\n\n");
        let mut perf = Builder::default();
        perf.push_record(["Quantity", "Value", "Unit"]);
        for (quantity, value, unit) in self.summary() {
            perf.push_record([quantity.to_string(), value, unit.to_string()]);
        }
        let mut perf = perf.build();
        perf.with(Style::psql())
            .modify(Columns::single(1), Alignment::right());
        out.push_str(&perf.to_string());
        let energy = |kj_per_kg| format::in_units(Q::SpecificEnergy, kj_per_kg, u);
        let unit = format::unit(Q::SpecificEnergy, u);
        let _ = writeln!(
            out,
            "\n\nEnergy balance (per unit mass of air): net work {:.6} = heat added {:.6} - heat \
             rejected {:.6} {unit}; residual {:.1e} {unit}",
            energy(result.net_work_kj_per_kg),
            energy(result.heat_input_kj_per_kg),
            energy(result.heat_rejected_kj_per_kg),
            energy(result.energy_balance_residual_kj_per_kg)
        );
        out.push_str(
            "Efficiency and heat rate: net electrical output over fuel energy, lower heating value basis.\n",
        );
        if let Some(note) = self.ideal_note() {
            let _ = writeln!(out, "{note}");
        }
        Ok(out)
    }

    fn json(&self) -> Result<String> {
        json_text(&JsonOutput {
            result: self.result,
            fuel: self.fuel,
            efficiencies_left_ideal: &self.ideal_defaults,
        })
    }

    fn csv(&self) -> Result<String> {
        let mut out = csv_line(&["item", "quantity", "value", "unit"]);
        for (i, s) in self.result.states.iter().enumerate() {
            let item = format!("state {}", s.id);
            for (quantity, value, unit) in self.state_values(i) {
                out.push_str(&csv_line(&[
                    item.as_str(),
                    quantity,
                    &value.to_string(),
                    unit,
                ]));
            }
        }
        for (quantity, value, unit) in self.summary() {
            out.push_str(&csv_line(&["cycle", quantity, &value, unit]));
        }
        out.push_str(&csv_line(&[
            "cycle",
            "Energy balance residual",
            &format::in_units(
                Q::SpecificEnergy,
                self.result.energy_balance_residual_kj_per_kg,
                self.units,
            )
            .to_string(),
            format::unit(Q::SpecificEnergy, self.units),
        ]));
        for flag in &self.ideal_defaults {
            out.push_str(&csv_line(&["note", "left at ideal default of 1", flag, ""]));
        }
        Ok(out)
    }
}
