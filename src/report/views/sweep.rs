//! `brayfin sweep`: one row per point and reported candidate (long format),
//! written block by block as the sweep runs, so memory does not grow with
//! the number of points.
//!
//! Columns: `point`, one column per varied key, named `KEY (UNIT)` with
//! the unit its values are printed in (the unit the range was written in,
//! else the key's internal unit, with what it is counted per: `USD/start`,
//! `starts/yr`), or `KEY` alone for a dimensionless key (a fraction or a
//! ratio) swept in bare numbers, `candidate_id`, the heat rate
//! (`heat_rate_kj_per_kwh`, or `heat_rate_btu_per_kwh` with US units),
//! `lifecycle_cost`, `net_savings`, `break_even_premium` (money in the
//! scenario currency, rounded to the cent; the last two empty for the
//! baseline), and `error` (empty, or why the point could not be solved: its
//! figures are then empty). The table states the route points were solved
//! by (`--exact` or the default scaled route with its measured error) in a
//! note line under its title; the JSON in `exact` and `route_note`. JSON
//! has the same fields per row (always SI,
//! values of the keys under `values` as written, their units under
//! `units`, `null` when dimensionless), money as decimal strings and empty values as `null`; the table
//! prints whole currency units.

use super::{csv_line, TextFormat};
use crate::analysis::point::{Figures, PointError, Route};
use crate::analysis::sweep::{route_note, Axis, SweepBlock, SweepPlan};
use crate::report::format::{self, grouped, Quantity as Q};
use crate::report::model::Units;
use crate::scenario::{LoadedScenario, PriceBasis};
use crate::units::Kind;
use rayon::prelude::*;
use rust_decimal::prelude::FromPrimitive;
use rust_decimal::Decimal;
use serde_json::{json, Value};

/// What `sweep` prints, piece by piece: [`SweepView::head`], then
/// [`SweepView::block`] for each finished block, then [`SweepView::tail`].
pub struct SweepView<'a> {
    loaded: &'a LoadedScenario,
    plan: &'a SweepPlan,
    units: Units,
    format: TextFormat,
    route: Route,
    /// Per axis: the unit its values are printed in (`None`:
    /// dimensionless).
    units_of_keys: Vec<Option<String>>,
    id_width: usize,
    key_widths: Vec<usize>,
}

/// The internal unit of `kind`, as printed; `None` for a dimensionless
/// kind (a fraction of one or a plain number).
fn internal_unit(kind: Kind, currency: &str) -> Option<String> {
    let unit = match kind {
        Kind::Fraction | Kind::Number => return None,
        Kind::Temperature => "K".into(),
        Kind::Pressure => "kPa".into(),
        Kind::Power => "kW".into(),
        Kind::HeatRate => "kJ/kWh".into(),
        Kind::SpecificEnergy => "kJ/kg".into(),
        Kind::Length => "m".into(),
        Kind::Money => currency.to_string(),
        Kind::FuelPrice => format!("{currency}/GJ"),
        Kind::PricePerTonne => format!("{currency}/t"),
        Kind::PricePerEnergy => format!("{currency}/MWh"),
        Kind::PricePerCapacity => format!("{currency}/kW-yr"),
        Kind::Duration => "h".into(),
        Kind::EmissionFactor => "kg/GJ".into(),
        Kind::MassFlow => "kg/s".into(),
        Kind::FuelEnergy => "GJ LHV".into(),
    };
    Some(unit)
}

/// What a key's value is counted per, or the unit of a plain-number key
/// that is not dimensionless, by the key's field (its path after
/// `candidate.` or `candidate[<id>].`). Keys not listed carry their kind's
/// unit alone.
enum KeyUnit {
    /// The kind's unit (as written or internal) followed by this text.
    Per(&'static str),
    /// A plain number counted in this unit.
    Counted(&'static str),
}

fn key_unit(field: &str) -> Option<KeyUnit> {
    use KeyUnit::{Counted, Per};
    Some(match field {
        "operation.starts_per_year" => Counted("starts/yr"),
        "economics.service_life_years" => Counted("years"),
        "cp_kj_per_kg_k" => Counted("kJ/(kg·K)"),
        "costs.overhaul_starts" => Counted("starts"),
        "costs.overhaul_outage_days" => Counted("days"),
        "operation.hours_per_year" => Per("/yr"),
        "costs.hours_per_start"
        | "costs.start_fuel"
        | "costs.start_cost"
        | "costs.service_per_start" => Per("/start"),
        "costs.service_per_fired_hour" => Per("/fired h"),
        "costs.overhaul_interval" => Per(" (equivalent)"),
        "guarantee.damages_per_heat_rate_percent" | "guarantee.bonus_per_heat_rate_percent" => {
            Per(" per % of heat rate")
        }
        "guarantee.damages_per_heat_rate_kj_per_kwh" => Per(" per kJ/kWh of heat rate"),
        "guarantee.damages_per_kw" | "guarantee.bonus_per_kw" => Per("/kW"),
        _ => return None,
    })
}

/// The unit an axis's values are printed in: the unit the range was
/// written in, else the key's internal unit, with what the value is counted
/// per; a fuel price also names its heating-value basis. `None` for a
/// dimensionless key swept in bare numbers.
fn axis_unit(axis: &Axis, loaded: &LoadedScenario) -> Option<String> {
    let s = &loaded.scenario;
    let field = axis
        .key
        .strip_prefix("candidate.")
        .or_else(|| {
            axis.key
                .strip_prefix("candidate[")
                .and_then(|rest| rest.split_once("]."))
                .map(|(_, field)| field)
        })
        .unwrap_or(&axis.key);
    let base = axis.unit.clone().or_else(|| {
        axis.kind
            .and_then(|kind| internal_unit(kind, &s.meta.currency))
    });
    let mut unit = match (key_unit(field), base) {
        (Some(KeyUnit::Counted(unit)), None) => unit.to_string(),
        (Some(KeyUnit::Per(per)), Some(base)) => format!("{base}{per}"),
        (_, base) => base?,
    };
    if axis.key == "fuel.price" {
        unit.push_str(match s.fuel.price_basis {
            PriceBasis::Hhv => " HHV",
            PriceBasis::Lhv => " LHV",
        });
    }
    Some(unit)
}

/// One output row: a point and a reported candidate.
struct Row<'a> {
    point: usize,
    values: &'a [f64],
    candidate_id: &'a str,
    outcome: std::result::Result<&'a Figures, &'a PointError>,
}

/// A key's column header: `KEY (UNIT)`, or the key alone when it is
/// dimensionless.
pub fn header_of(key: &str, unit: Option<&str>) -> String {
    match unit {
        Some(unit) => format!("{key} ({unit})"),
        None => key.to_string(),
    }
}

/// The header of each axis of `plan` on `loaded` (as the CSV and the
/// table print it): `KEY (UNIT)`, or the key alone when dimensionless.
pub fn axis_headers(loaded: &LoadedScenario, plan: &SweepPlan) -> Vec<String> {
    plan.axes
        .iter()
        .map(|a| header_of(&a.key, axis_unit(a, loaded).as_deref()))
        .collect()
}

fn cents(value: f64) -> String {
    format!("{value:.2}")
}

fn whole(value: f64) -> String {
    Decimal::from_f64(value).map_or_else(|| format!("{value:.0}"), |d| grouped(d, 0))
}

impl<'a> SweepView<'a> {
    /// The view of `plan` on `loaded` in `format`, heat rate in `units`.
    pub fn new(
        loaded: &'a LoadedScenario,
        plan: &'a SweepPlan,
        units: Units,
        format: TextFormat,
    ) -> Self {
        let units_of_keys: Vec<Option<String>> =
            plan.axes.iter().map(|a| axis_unit(a, loaded)).collect();
        let id_width = loaded
            .scenario
            .candidates
            .iter()
            .map(|c| c.id.len())
            .max()
            .unwrap_or(0)
            .max("candidate".len());
        let key_widths = plan
            .axes
            .iter()
            .zip(&units_of_keys)
            .map(|(a, u)| {
                let unit = u.as_ref().map_or(0, |u| u.chars().count() + 2);
                a.key.chars().count().max(unit).max(12)
            })
            .collect();
        SweepView {
            loaded,
            plan,
            units,
            format,
            route: Route::default(),
            units_of_keys,
            id_width,
            key_widths,
        }
    }

    /// The same view stating that points were solved by `route` (the
    /// default is [`Route::Scaled`]): a note line in the table, `exact` and
    /// `route_note` in the JSON.
    pub fn with_route(mut self, route: Route) -> Self {
        self.route = route;
        self
    }

    fn keys(&self) -> Vec<&str> {
        self.plan.axes.iter().map(|a| a.key.as_str()).collect()
    }

    /// Everything before the first row.
    pub fn head(&self) -> String {
        let scenario = &self.loaded.scenario;
        let keys = self.keys();
        match self.format {
            TextFormat::Csv => {
                let mut header = vec!["point".to_string()];
                header.extend(
                    keys.iter()
                        .zip(&self.units_of_keys)
                        .map(|(k, u)| header_of(k, u.as_deref())),
                );
                let heat_rate = match self.units {
                    Units::Si => "heat_rate_kj_per_kwh",
                    Units::Us => "heat_rate_btu_per_kwh",
                };
                header.extend(
                    [
                        "candidate_id",
                        heat_rate,
                        "lifecycle_cost",
                        "net_savings",
                        "break_even_premium",
                        "error",
                    ]
                    .map(String::from),
                );
                csv_line(&header)
            }
            TextFormat::Json => {
                let head = json!({
                    "title": scenario.meta.title,
                    "baseline": scenario.meta.baseline,
                    "currency": scenario.meta.currency,
                    "file": self.loaded.file_label,
                    "sha256": self.loaded.sha256_hex,
                });
                let units: serde_json::Map<String, Value> = keys
                    .iter()
                    .zip(&self.units_of_keys)
                    .map(|(k, u)| ((*k).to_string(), json!(u)))
                    .collect();
                format!(
                    "{{\n  \"scenario\": {head},\n  \"keys\": {},\n  \"units\": {},\n  \"points\": {},\n  \"exact\": {},\n  \"route_note\": {},\n  \"rows\": [",
                    json!(keys),
                    Value::Object(units),
                    self.plan.points(),
                    json!(self.route == Route::Exact),
                    json!(route_note(self.route))
                )
            }
            TextFormat::Table => {
                let mut out = format!(
                    "{}\nSweep of {} ({} points); money in {}, lifecycle cost present value\n",
                    scenario.meta.title,
                    keys.join(" × "),
                    self.plan.points(),
                    scenario.meta.currency
                );
                out.push_str(route_note(self.route));
                out.push('\n');
                if keys.contains(&"fuel.price") {
                    let fuel = &scenario.fuel;
                    let currency = &scenario.meta.currency;
                    out.push_str(&format!(
                        "Fuel price in the file: {}\n",
                        format::fuel_price_echo(
                            fuel.price_per_gj,
                            format::scenario_price_written(fuel, currency).as_deref(),
                            currency,
                            match fuel.price_basis {
                                PriceBasis::Hhv => "HHV",
                                PriceBasis::Lhv => "LHV",
                            },
                            &format::scenario_price_unit(self.loaded),
                            self.units,
                        )
                    ));
                }
                let mut names = format!("{:>7}", "");
                let mut line = format!("{:>7}", "point");
                for ((k, u), w) in keys.iter().zip(&self.units_of_keys).zip(&self.key_widths) {
                    names.push_str(&format!("  {k:>w$}"));
                    let unit = u.as_ref().map_or(String::new(), |u| format!("({u})"));
                    line.push_str(&format!("  {unit:>w$}"));
                }
                line.push_str(&format!(
                    "  {:<iw$}  {:>11}  {:>15}  {:>13}  {:>13}",
                    "candidate",
                    format!("HR {}", format::unit(Q::HeatRate, self.units)),
                    "lifecycle cost",
                    "net savings",
                    "break-even",
                    iw = self.id_width
                ));
                out.push_str(names.trim_end());
                out.push('\n');
                out.push_str(&line);
                out.push('\n');
                out
            }
        }
    }

    /// The rows of a finished block, formatted in parallel, in point order.
    pub fn block(&self, block: &SweepBlock) -> String {
        let texts: Vec<String> = (0..block.len())
            .into_par_iter()
            .map(|j| self.point_text(block, j))
            .collect();
        texts.concat()
    }

    /// Everything after the last row.
    pub fn tail(&self) -> String {
        match self.format {
            TextFormat::Json => "\n  ]\n}\n".to_string(),
            TextFormat::Csv | TextFormat::Table => String::new(),
        }
    }

    fn point_text(&self, block: &SweepBlock, j: usize) -> String {
        let point = block.first_point + j;
        let mut values = [0.0; 2];
        let values = &mut values[..self.plan.axes.len()];
        let mut rest = point;
        for (axis, value) in self.plan.axes.iter().zip(values.iter_mut()).rev() {
            *value = axis.written_value(rest % axis.count);
            rest /= axis.count;
        }
        let keys = self.keys();
        let mut text = String::new();
        for (r, &i) in self.plan.reported.iter().enumerate() {
            let row = Row {
                point,
                values,
                candidate_id: &self.loaded.scenario.candidates[i].id,
                outcome: block.point(j).map(|f| &f[i]),
            };
            match self.format {
                TextFormat::Csv => text.push_str(&self.csv_row(&row)),
                TextFormat::Json => {
                    let comma = if point == 0 && r == 0 { "" } else { "," };
                    text.push_str(&format!("{comma}\n    {}", json_row(&row, &keys)));
                }
                TextFormat::Table => text.push_str(&self.table_row(&row)),
            }
        }
        text
    }

    fn heat_rate(&self, kj_per_kwh: f64) -> f64 {
        format::in_units(Q::HeatRate, kj_per_kwh, self.units)
    }

    fn csv_row(&self, row: &Row) -> String {
        let mut fields: Vec<String> = vec![row.point.to_string()];
        fields.extend(row.values.iter().map(|v| v.to_string()));
        fields.push(row.candidate_id.to_string());
        match row.outcome {
            Ok(f) => {
                let versus = f.versus_baseline;
                fields.push(self.heat_rate(f.heat_rate_kj_per_kwh).to_string());
                fields.push(cents(f.lifecycle_cost));
                fields.push(versus.map_or_else(String::new, |v| cents(v.net_savings)));
                fields.push(
                    versus
                        .and_then(|v| v.break_even_premium)
                        .map_or_else(String::new, cents),
                );
                fields.push(String::new());
            }
            Err(e) => {
                fields.extend([String::new(), String::new(), String::new(), String::new()]);
                fields.push(e.to_string());
            }
        }
        csv_line(&fields)
    }

    fn table_row(&self, row: &Row) -> String {
        let mut line = format!("{:>7}", row.point);
        for (v, w) in row.values.iter().zip(&self.key_widths) {
            line.push_str(&format!("  {:>w$}", v.to_string()));
        }
        line.push_str(&format!("  {:<w$}", row.candidate_id, w = self.id_width));
        match row.outcome {
            Ok(f) => {
                let versus = f.versus_baseline;
                let or_na = |v: Option<f64>| v.map_or_else(|| "n/a".to_string(), whole);
                line.push_str(&format!(
                    "  {:>11.0}  {:>15}  {:>13}  {:>13}",
                    self.heat_rate(f.heat_rate_kj_per_kwh),
                    whole(f.lifecycle_cost),
                    or_na(versus.map(|v| v.net_savings)),
                    or_na(versus.and_then(|v| v.break_even_premium)),
                ));
            }
            Err(e) => line.push_str(&format!("  not solved: {e}")),
        }
        line.push('\n');
        line
    }
}

fn json_row(row: &Row, keys: &[&str]) -> Value {
    let values: serde_json::Map<String, Value> = keys
        .iter()
        .zip(row.values)
        .map(|(k, v)| ((*k).to_string(), json!(v)))
        .collect();
    let mut object = json!({
        "point": row.point,
        "values": values,
        "candidate_id": row.candidate_id,
    });
    let (heat_rate, cost, savings, premium, error) = match row.outcome {
        Ok(f) => (
            json!(f.heat_rate_kj_per_kwh),
            json!(cents(f.lifecycle_cost)),
            json!(f.versus_baseline.map(|v| cents(v.net_savings))),
            json!(f
                .versus_baseline
                .and_then(|v| v.break_even_premium)
                .map(cents)),
            Value::Null,
        ),
        Err(e) => (
            Value::Null,
            Value::Null,
            Value::Null,
            Value::Null,
            json!(e.to_string()),
        ),
    };
    object["heat_rate_kj_per_kwh"] = heat_rate;
    object["lifecycle_cost"] = cost;
    object["net_savings"] = savings;
    object["break_even_premium"] = premium;
    object["error"] = error;
    object
}
