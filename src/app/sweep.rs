//! `brayfin sweep`: one or two scenario keys over a range, every point
//! re-solved, written as it is computed (long format: one row per point and
//! reported candidate).
//!
//! Columns: `point`, one column per varied key (named by the key, values in
//! its internal unit), `candidate_id`, `heat_rate_kj_per_kwh`,
//! `lifecycle_cost`, `net_savings`, `break_even_premium` (money in the
//! scenario currency, rounded to the cent; the last two empty for the
//! baseline), and `error` (empty, or why the point could not be solved: its
//! figures are then empty). JSON has the same fields per row, money as
//! decimal strings and empty values as `null`; the table prints whole
//! currency units.

use super::progress::Progress;
use crate::analysis::point::{Figures, PointError};
use crate::analysis::sweep::{plan, run_sweep, SweepBlock, SweepPlan};
use crate::cli::{Format, SweepArgs};
use crate::report::format::grouped;
use crate::scenario::{self, LoadedScenario};
use crate::{Error, Result};
use rayon::prelude::*;
use rust_decimal::prelude::FromPrimitive;
use rust_decimal::Decimal;
use serde_json::{json, Value};
use std::io::{BufWriter, Write};

/// Run `brayfin sweep`.
pub fn run(args: &SweepArgs) -> Result<()> {
    let loaded = scenario::load(&args.scenario)?;
    let plan = plan(&loaded, &args.vary, args.candidate.as_deref())?;
    let stdout = std::io::stdout();
    let mut out = BufWriter::new(stdout.lock());
    let mut progress = Progress::new(plan.points(), "points");
    let total = plan.points();
    let outcome = write_sweep(&loaded, &plan, args.format, &mut out, &mut |done| {
        progress.update(done, total)
    });
    progress.finish();
    let unsolved = outcome?;
    out.flush()
        .map_err(|e| Error::io("writing to standard output", e))?;
    if unsolved > 0 {
        eprintln!(
            "note: {unsolved} of {total} points could not be solved; their rows say why in `error`"
        );
    }
    Ok(())
}

/// One output row: a point and a reported candidate.
struct Row<'a> {
    point: usize,
    values: &'a [f64],
    candidate_id: &'a str,
    outcome: std::result::Result<&'a Figures, &'a PointError>,
}

fn cents(value: f64) -> String {
    format!("{value:.2}")
}

fn whole(value: f64) -> String {
    Decimal::from_f64(value).map_or_else(|| format!("{value:.0}"), |d| grouped(d, 0))
}

/// Write the whole sweep of `plan` to `out` in `format`, calling `progress`
/// with the number of points done after each block. Returns the number of
/// points that could not be solved.
pub fn write_sweep(
    loaded: &LoadedScenario,
    plan: &SweepPlan,
    format: Format,
    out: &mut dyn Write,
    progress: &mut dyn FnMut(usize),
) -> Result<usize> {
    let io = |e: std::io::Error| Error::io("writing to standard output", e);
    let scenario = &loaded.scenario;
    let keys: Vec<&str> = plan.axes.iter().map(|a| a.key.as_str()).collect();
    let id_width = scenario
        .candidates
        .iter()
        .map(|c| c.id.len())
        .max()
        .unwrap_or(0)
        .max("candidate".len());
    let key_widths: Vec<usize> = keys.iter().map(|k| k.len().max(12)).collect();
    match format {
        Format::Csv => {
            let mut header = vec!["point"];
            header.extend(&keys);
            header.extend([
                "candidate_id",
                "heat_rate_kj_per_kwh",
                "lifecycle_cost",
                "net_savings",
                "break_even_premium",
                "error",
            ]);
            writeln!(out, "{}", csv_line(&header)).map_err(io)?;
        }
        Format::Json => {
            let head = json!({
                "title": scenario.meta.title,
                "baseline": scenario.meta.baseline,
                "currency": scenario.meta.currency,
                "file": loaded.file_label,
                "sha256": loaded.sha256_hex,
            });
            write!(
                out,
                "{{\n  \"scenario\": {head},\n  \"keys\": {},\n  \"points\": {},\n  \"rows\": [",
                json!(keys),
                plan.points()
            )
            .map_err(io)?;
        }
        Format::Table => {
            writeln!(
                out,
                "{}\nSweep of {} ({} points); money in {}, lifecycle cost present value",
                scenario.meta.title,
                keys.join(" × "),
                plan.points(),
                scenario.meta.currency
            )
            .map_err(io)?;
            let mut line = format!("{:>7}", "point");
            for (k, w) in keys.iter().zip(&key_widths) {
                line.push_str(&format!("  {k:>w$}"));
            }
            line.push_str(&format!(
                "  {:<id_width$}  {:>9}  {:>15}  {:>13}  {:>13}",
                "candidate", "HR kJ/kWh", "lifecycle cost", "net savings", "break-even"
            ));
            writeln!(out, "{line}").map_err(io)?;
        }
    }
    // Rows are formatted in parallel, one string per point, and written
    // in point order.
    let point_text = |block: &SweepBlock, j: usize| -> String {
        let point = block.first_point + j;
        let mut values = [0.0; 2];
        let values = &mut values[..plan.axes.len()];
        plan.fill_values(point, values);
        let mut text = String::new();
        for (r, &i) in plan.reported.iter().enumerate() {
            let row = Row {
                point,
                values,
                candidate_id: &scenario.candidates[i].id,
                outcome: block.point(j).map(|f| &f[i]),
            };
            match format {
                Format::Csv => text.push_str(&csv_row(&row)),
                Format::Json => {
                    let comma = if point == 0 && r == 0 { "" } else { "," };
                    text.push_str(&format!("{comma}\n    {}", json_row(&row, &keys)));
                }
                Format::Table => text.push_str(&table_row(&row, &key_widths, id_width)),
            }
        }
        text
    };
    let mut write_block = |block: &SweepBlock| -> Result<()> {
        let texts: Vec<String> = (0..block.len())
            .into_par_iter()
            .map(|j| point_text(block, j))
            .collect();
        for text in texts {
            out.write_all(text.as_bytes()).map_err(io)?;
        }
        progress(block.first_point + block.len());
        Ok(())
    };
    let unsolved = run_sweep(loaded, plan, &mut write_block)?;
    if format == Format::Json {
        writeln!(out, "\n  ]\n}}").map_err(io)?;
    }
    Ok(unsolved)
}

fn csv_line(fields: &[&str]) -> String {
    fields
        .iter()
        .map(|f| {
            if f.contains([',', '"', '\n']) {
                format!("\"{}\"", f.replace('"', "\"\""))
            } else {
                (*f).to_string()
            }
        })
        .collect::<Vec<_>>()
        .join(",")
}

fn csv_row(row: &Row) -> String {
    let mut fields: Vec<String> = vec![row.point.to_string()];
    fields.extend(row.values.iter().map(|v| v.to_string()));
    fields.push(row.candidate_id.to_string());
    match row.outcome {
        Ok(f) => {
            let versus = f.versus_baseline;
            fields.push(f.heat_rate_kj_per_kwh.to_string());
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
    let borrowed: Vec<&str> = fields.iter().map(String::as_str).collect();
    format!("{}\n", csv_line(&borrowed))
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

fn table_row(row: &Row, key_widths: &[usize], id_width: usize) -> String {
    let mut line = format!("{:>7}", row.point);
    for (v, w) in row.values.iter().zip(key_widths) {
        line.push_str(&format!("  {:>w$}", v.to_string()));
    }
    line.push_str(&format!("  {:<id_width$}", row.candidate_id));
    match row.outcome {
        Ok(f) => {
            let versus = f.versus_baseline;
            let or_na = |v: Option<f64>| v.map_or_else(|| "n/a".to_string(), whole);
            line.push_str(&format!(
                "  {:>9.0}  {:>15}  {:>13}  {:>13}",
                f.heat_rate_kj_per_kwh,
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
