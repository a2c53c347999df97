//! `brayfin offdesign`: each candidate's fixed machine over a grid of
//! ambient temperatures and loads.
//!
//! - table: one block per candidate, units in the headers;
//! - JSON: `{"candidates":[{"id", "points":[{…}]}]}`, SI, the unit in each
//!   key name (`net_output_kw`, `heat_rate_kj_per_kwh`, …);
//! - CSV: one row per candidate and point; columns named with their unit,
//!   which follows `--units` (`heat_rate_kj_per_kwh` → `heat_rate_btu_per_kwh`).

use super::{csv_line, json_text, View};
use crate::analysis::offdesign_grid::CandidateGrid;
use crate::offdesign::OffDesignPoint;
use crate::report::format::{self, Quantity as Q};
use crate::report::model::Units;
use crate::Result;
use serde::Serialize;
use std::fmt::Write as _;
use tabled::builder::Builder;
use tabled::settings::{object::Columns, Alignment, Style};

/// What `offdesign` prints: the solved grids and the unit system.
pub struct OffDesignView<'a> {
    grids: &'a [CandidateGrid],
    units: Units,
}

impl<'a> OffDesignView<'a> {
    /// The view of `grids`, printed in `units` (table and CSV).
    pub fn new(grids: &'a [CandidateGrid], units: Units) -> Self {
        OffDesignView { grids, units }
    }

    /// CSV column names (the unit in each name, as `--units` says).
    fn csv_header(&self) -> Vec<&'static str> {
        let si = self.units == Units::Si;
        let pick = |a: &'static str, b: &'static str| if si { a } else { b };
        vec![
            "candidate",
            pick("ambient_temperature_k", "ambient_temperature_f"),
            pick("ambient_pressure_kpa", "ambient_pressure_psia"),
            "relative_humidity",
            "load",
            "net_output_kw",
            pick("heat_rate_kj_per_kwh", "heat_rate_btu_per_kwh"),
            "thermal_efficiency",
            pick("air_flow_kg_per_s", "air_flow_lb_per_s"),
            pick("exhaust_flow_kg_per_s", "exhaust_flow_lb_per_s"),
            pick("exhaust_temperature_k", "exhaust_temperature_f"),
            pick("firing_temperature_k", "firing_temperature_f"),
            "pressure_ratio",
            "airflow_fraction",
            "limit",
            pick(
                "energy_balance_residual_kj_per_kg",
                "energy_balance_residual_btu_per_lb",
            ),
        ]
    }
}

/// One point as the JSON keys name it (SI).
#[derive(Serialize)]
struct JsonPoint {
    ambient_temperature_k: f64,
    ambient_pressure_kpa: f64,
    relative_humidity: f64,
    load: f64,
    net_output_kw: f64,
    heat_rate_kj_per_kwh: f64,
    thermal_efficiency: f64,
    air_flow_kg_per_s: f64,
    exhaust_flow_kg_per_s: f64,
    exhaust_temperature_k: f64,
    firing_temperature_k: f64,
    pressure_ratio: f64,
    airflow_fraction: f64,
    limit: &'static str,
    energy_balance_residual_kj_per_kg: f64,
}

impl From<&OffDesignPoint> for JsonPoint {
    fn from(p: &OffDesignPoint) -> Self {
        JsonPoint {
            ambient_temperature_k: p.ambient_temperature_k,
            ambient_pressure_kpa: p.ambient_pressure_kpa,
            relative_humidity: p.relative_humidity,
            load: p.load,
            net_output_kw: p.net_output_kw,
            heat_rate_kj_per_kwh: p.heat_rate_kj_per_kwh,
            thermal_efficiency: p.thermal_efficiency,
            air_flow_kg_per_s: p.air_flow_kg_per_s,
            exhaust_flow_kg_per_s: p.exhaust_flow_kg_per_s,
            exhaust_temperature_k: p.exhaust_temperature_k,
            firing_temperature_k: p.firing_temperature_k,
            pressure_ratio: p.pressure_ratio,
            airflow_fraction: p.airflow_fraction,
            limit: p.limit.name(),
            energy_balance_residual_kj_per_kg: p.energy_balance_residual_kj_per_kg,
        }
    }
}

#[derive(Serialize)]
struct JsonCandidate<'a> {
    id: &'a str,
    points: Vec<JsonPoint>,
}

#[derive(Serialize)]
struct JsonOutput<'a> {
    candidates: Vec<JsonCandidate<'a>>,
}

impl View for OffDesignView<'_> {
    fn table(&self) -> Result<String> {
        let u = self.units;
        let t_unit = format::unit(Q::Temperature, u);
        let flow_unit = format::unit(Q::MassFlow, u);
        let mut out = String::new();
        for grid in self.grids {
            let first = grid.points.first();
            let _ = writeln!(
                out,
                "Candidate {} ({}): fixed machine rated {} at its rating condition",
                grid.id,
                grid.label,
                format::with_unit(Q::Power, grid.rated_net_output_kw, u, 0),
            );
            if let Some(p) = first {
                let _ = writeln!(
                    out,
                    "Ambient pressure {}, relative humidity {}; loads are fractions of the base-load output at each temperature\n",
                    format::with_unit(Q::Pressure, p.ambient_pressure_kpa, u, 3),
                    format::percent(p.relative_humidity, 0),
                );
            }
            let mut b = Builder::default();
            b.push_record([
                format!("Ambient ({t_unit})"),
                "Load (%)".to_string(),
                format!("Net output ({})", format::unit(Q::Power, u)),
                format!("Heat rate ({})", format::unit(Q::HeatRate, u)),
                "Efficiency (%)".to_string(),
                format!("Air flow ({flow_unit})"),
                format!("Exhaust flow ({flow_unit})"),
                format!("Exhaust T ({t_unit})"),
                format!("Firing T ({t_unit})"),
                "Pressure ratio".to_string(),
                "Airflow (%)".to_string(),
                "Limit".to_string(),
            ]);
            for p in &grid.points {
                b.push_record([
                    format::value(Q::Temperature, p.ambient_temperature_k, u, 2),
                    format!("{:.1}", p.load * 100.0),
                    format::value(Q::Power, p.net_output_kw, u, 0),
                    format::value(Q::HeatRate, p.heat_rate_kj_per_kwh, u, 0),
                    format!("{:.2}", p.thermal_efficiency * 100.0),
                    format::value(Q::MassFlow, p.air_flow_kg_per_s, u, 2),
                    format::value(Q::MassFlow, p.exhaust_flow_kg_per_s, u, 2),
                    format::value(Q::Temperature, p.exhaust_temperature_k, u, 1),
                    format::value(Q::Temperature, p.firing_temperature_k, u, 1),
                    format!("{:.3}", p.pressure_ratio),
                    format!("{:.1}", p.airflow_fraction * 100.0),
                    p.limit.name().to_string(),
                ]);
            }
            let mut table = b.build();
            table
                .with(Style::psql())
                .modify(Columns::new(..11), Alignment::right());
            out.push_str(&table.to_string());
            out.push_str("\n\n");
        }
        out.push_str(
            "Heat rate and efficiency: net electrical output over fuel energy, lower heating value basis.\n\
             Screening-level estimates from a generic compressor characteristic and a choked turbine; \
             not a substitute for vendor guarantees, ambient correction curves or acceptance testing.\n",
        );
        Ok(out)
    }

    fn json(&self) -> Result<String> {
        json_text(&JsonOutput {
            candidates: self
                .grids
                .iter()
                .map(|g| JsonCandidate {
                    id: &g.id,
                    points: g.points.iter().map(JsonPoint::from).collect(),
                })
                .collect(),
        })
    }

    fn csv(&self) -> Result<String> {
        let u = self.units;
        let mut out = csv_line(&self.csv_header());
        for grid in self.grids {
            for p in &grid.points {
                let v = |q: Q, si: f64| format::in_units(q, si, u).to_string();
                out.push_str(&csv_line(&[
                    grid.id.clone(),
                    v(Q::Temperature, p.ambient_temperature_k),
                    v(Q::Pressure, p.ambient_pressure_kpa),
                    p.relative_humidity.to_string(),
                    p.load.to_string(),
                    p.net_output_kw.to_string(),
                    v(Q::HeatRate, p.heat_rate_kj_per_kwh),
                    p.thermal_efficiency.to_string(),
                    v(Q::MassFlow, p.air_flow_kg_per_s),
                    v(Q::MassFlow, p.exhaust_flow_kg_per_s),
                    v(Q::Temperature, p.exhaust_temperature_k),
                    v(Q::Temperature, p.firing_temperature_k),
                    p.pressure_ratio.to_string(),
                    p.airflow_fraction.to_string(),
                    p.limit.name().to_string(),
                    v(Q::SpecificEnergy, p.energy_balance_residual_kj_per_kg),
                ]));
            }
        }
        Ok(out)
    }
}
