//! The site's year of weather (`[site] weather`) and the hourly dispatch
//! profile (`[operation] profile`): their types, the CSV readers and the
//! inline bins.
//!
//! Weather CSV (one row per hour, a header row first; column order free):
//!
//! | column | what |
//! | --- | --- |
//! | `timestamp` | the hour's start, `YYYY-MM-DDTHH:MM` (or with a space instead of `T`; seconds allowed), consecutive hours |
//! | `dry_bulb_degC`, `dry_bulb_degF` or `dry_bulb_K` | dry-bulb temperature, the unit in the column name (exactly one of these) |
//! | `rh_pct` | relative humidity, % (0–100) |
//!
//! Profile CSV (one row per hour, aligned with the weather's hours):
//!
//! | column | what |
//! | --- | --- |
//! | `timestamp` | as in the weather; must equal the weather's timestamp of the same hour |
//! | `load_pct` | load as % of the output the machine can give in that hour (0 = off; otherwise 0 < load ≤ 100) |
//! | `energy_price_per_MWh` | optional: the hour's energy price, scenario currency per MWh |
//!
//! A record of any length stands for a year of 8760 hours: each of its
//! hours counts 8760 / (rows) hours (energy, fuel and run hours likewise).
//! Bins are weights: a dispatch block's hours (or `hours_per_year`) spread
//! over the bins in proportion to their hours.

use super::context::Context;
use super::error::ScenarioError;
use super::reader::{type_error, TableReader};
use super::tree::{Node, NodeValue};
use super::values::checked;
use crate::scenario::ranges::{Range, AMBIENT_T_K, HOURS_PER_LEAP_YEAR};
use crate::units;
use chrono::NaiveDateTime;
use std::path::{Path, PathBuf};

type Read<T> = Result<T, ScenarioError>;

/// Hours of the year a record of any length is scaled to.
pub const HOURS_PER_YEAR: f64 = 8760.0;

/// One ambient condition of the year: an hour of a weather file or a bin.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AmbientRecord {
    /// The hour's start (hourly weather only).
    pub timestamp: Option<NaiveDateTime>,
    /// Dry-bulb temperature, K.
    pub temperature_k: f64,
    /// Relative humidity, a fraction from 0 to 1.
    pub relative_humidity: f64,
    /// Hours of the year this record stands for (an hourly record:
    /// 8760 / rows; a bin: its hours as given).
    pub hours: f64,
}

/// Where the year's weather came from.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum WeatherSource {
    /// An hourly CSV file, as named in the scenario (relative to it).
    Hourly(String),
    /// Inline bins.
    Bins,
}

/// The year's weather: hourly records or bins.
#[derive(Debug, Clone, PartialEq)]
pub struct Weather {
    /// File or bins.
    pub source: WeatherSource,
    /// The records in order (hours, or bins as listed).
    pub records: Vec<AmbientRecord>,
}

impl Weather {
    /// Hour-weighted mean dry-bulb temperature, K.
    pub fn mean_temperature_k(&self) -> f64 {
        let hours: f64 = self.records.iter().map(|r| r.hours).sum();
        if hours <= 0.0 {
            return f64::NAN;
        }
        self.records
            .iter()
            .map(|r| r.temperature_k * r.hours)
            .sum::<f64>()
            / hours
    }
}

/// One hour of a dispatch profile.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ProfileHour {
    /// The hour's start.
    pub timestamp: NaiveDateTime,
    /// Load as a fraction of the output available in that hour; 0 = off.
    pub load_fraction: f64,
    /// The hour's energy price, scenario currency per MWh, if given.
    pub energy_price_per_mwh: Option<f64>,
}

/// An hourly dispatch profile (`[operation] profile`).
#[derive(Debug, Clone, PartialEq)]
pub struct Profile {
    /// The file as named in the scenario.
    pub file: String,
    /// Every hour of the record, off hours too.
    pub hours: Vec<ProfileHour>,
    /// Index of the profile's first hour in the hourly weather (0 without
    /// weather).
    pub weather_offset: usize,
}

impl Profile {
    /// Hours of a year each row stands for: 8760 / rows.
    pub fn year_scale(&self) -> f64 {
        HOURS_PER_YEAR / self.hours.len().max(1) as f64
    }

    /// Run hours (load > 0) scaled to a year, h.
    pub fn run_hours_per_year(&self) -> f64 {
        self.hours.iter().filter(|h| h.load_fraction > 0.0).count() as f64 * self.year_scale()
    }

    /// Whether every run hour carries an energy price.
    pub fn has_prices(&self) -> bool {
        self.hours
            .iter()
            .filter(|h| h.load_fraction > 0.0)
            .all(|h| h.energy_price_per_mwh.is_some())
            && self.hours.iter().any(|h| h.energy_price_per_mwh.is_some())
    }
}

/// Column names of the weather CSV's temperature, with their unit.
const TEMPERATURE_COLUMNS: &[(&str, &str)] = &[
    ("dry_bulb_degC", "degC"),
    ("dry_bulb_degF", "degF"),
    ("dry_bulb_K", "K"),
];
const TIMESTAMP: &str = "timestamp";
const HUMIDITY: &str = "rh_pct";
const LOAD: &str = "load_pct";
const PRICE: &str = "energy_price_per_MWh";

/// Read `[site] weather`: a CSV path (string) or an array of bins.
/// `default_rh` is the site's relative humidity (a bin without its own).
pub(crate) fn read_weather(
    ctx: &mut Context,
    r: &TableReader,
    default_rh: f64,
) -> Read<Option<Weather>> {
    let Some(node) = r.node(ctx, "weather") else {
        return Ok(None);
    };
    let field = r.field("weather");
    match &node.value {
        NodeValue::Str(path) => read_weather_csv(ctx, &field, node, path).map(Some),
        NodeValue::Array(items) => read_bins(ctx, &field, node, items, default_rh).map(Some),
        _ => Err(type_error(
            ctx,
            &field,
            node,
            "a CSV file path, e.g. \"data/site-weather.csv\", or an array of bins, e.g. [{ temperature = \"5 degC\", relative_humidity = \"70 %\", hours = 744 }]",
        )),
    }
}

fn read_bins(
    ctx: &mut Context,
    field: &str,
    node: &Node,
    items: &[Node],
    default_rh: f64,
) -> Read<Weather> {
    if items.is_empty() {
        return Err(ctx.error_at_offset(
            node.span.start,
            field,
            "is an empty array",
            "expected at least one bin, e.g. [{ temperature = \"5 degC\", hours = 744 }]",
        ));
    }
    let mut records = Vec::with_capacity(items.len());
    for (i, item) in items.iter().enumerate() {
        let path = format!("{field}[{}]", i + 1);
        let b = TableReader::new(
            ctx,
            &path,
            item,
            &["temperature", "relative_humidity", "hours"],
        )?;
        let (temperature_k, relative_humidity) = read_ambient(ctx, &b, "temperature")?;
        let temperature_k = temperature_k.ok_or_else(|| {
            b.missing(
                ctx,
                "temperature",
                "expected the bin's dry-bulb temperature, e.g. \"5 degC\"",
            )
        })?;
        let relative_humidity = relative_humidity.unwrap_or(default_rh);
        let hours =
            checked(ctx, &b, "hours", units::duration_h, Range::NonNegative)?.ok_or_else(|| {
                b.missing(ctx, "hours", "expected the bin's hours per year, e.g. 744")
            })?;
        records.push(AmbientRecord {
            timestamp: None,
            temperature_k,
            relative_humidity,
            hours,
        });
    }
    let total: f64 = records.iter().map(|r| r.hours).sum();
    if total > HOURS_PER_LEAP_YEAR || total <= 0.0 {
        return Err(ctx.error_at_offset(
            node.span.start,
            field,
            format!("the bins' hours sum to {total} h"),
            "expected bins whose hours sum to more than 0 and at most 8784",
        ));
    }
    Ok(Weather {
        source: WeatherSource::Bins,
        records,
    })
}

/// An inline table's own ambient, both optional: the dry-bulb temperature
/// at `temperature_key` (K, within the ambient range) and its
/// `relative_humidity` (fraction). Weather bins and dispatch blocks share
/// it.
pub(super) fn read_ambient(
    ctx: &mut Context,
    b: &TableReader,
    temperature_key: &str,
) -> Read<(Option<f64>, Option<f64>)> {
    let temperature_k = checked(
        ctx,
        b,
        temperature_key,
        units::temperature_k,
        Range::Positive,
    )?;
    if let Some(t) = temperature_k {
        if !(AMBIENT_T_K.0..=AMBIENT_T_K.1).contains(&t) {
            return Err(b.error(
                ctx,
                temperature_key,
                format!("{t:.2} K is outside the ambient range"),
                format!("expected {} K to {} K", AMBIENT_T_K.0, AMBIENT_T_K.1),
            ));
        }
    }
    let relative_humidity = checked(
        ctx,
        b,
        "relative_humidity",
        units::fraction,
        Range::Fraction,
    )?;
    Ok((temperature_k, relative_humidity))
}

/// The file named in the scenario, resolved against the scenario's folder.
fn resolve(ctx: &Context, name: &str) -> PathBuf {
    let path = Path::new(name);
    match &ctx.dir {
        Some(dir) if path.is_relative() => dir.join(path),
        _ => path.to_path_buf(),
    }
}

/// A CSV file's error: the file, line and column (1-based field number),
/// the column's name and the scenario key that named the file.
fn csv_error(
    file: &str,
    line: u64,
    column: usize,
    what: &str,
    problem: impl Into<String>,
    valid: impl Into<String>,
) -> ScenarioError {
    ScenarioError::At {
        file: file.to_string(),
        line: line as usize,
        column,
        field: what.to_string(),
        problem: problem.into(),
        valid: valid.into(),
    }
}

/// A parsed CSV: header names and rows with their line numbers.
struct Table {
    label: String,
    header: Vec<String>,
    rows: Vec<(u64, csv::StringRecord)>,
}

impl Table {
    fn column(&self, name: &str) -> Option<usize> {
        self.header.iter().position(|h| h == name)
    }
}

fn read_csv(ctx: &Context, key: &str, node: &Node, name: &str) -> Read<Table> {
    let path = resolve(ctx, name);
    let bytes = std::fs::read(&path).map_err(|e| {
        ctx.error_at_offset(
            node.span.start,
            key,
            format!("cannot read {name}: {e}"),
            "expected a readable CSV file, its path relative to the scenario file",
        )
    })?;
    let label = name.to_string();
    let mut reader = csv::ReaderBuilder::new()
        .has_headers(true)
        .trim(csv::Trim::All)
        .flexible(false)
        .from_reader(bytes.as_slice());
    let header: Vec<String> = reader
        .headers()
        .map_err(|e| record_error(&label, e))?
        .iter()
        // A byte-order mark (spreadsheet exports) is not part of the name.
        .map(|h| h.trim_start_matches('\u{feff}').to_string())
        .collect();
    let mut rows = Vec::new();
    for record in reader.records() {
        let record = record.map_err(|e| record_error(&label, e))?;
        let line = record.position().map_or(0, |p| p.line());
        // A blank trailing line is no row.
        if record.iter().all(str::is_empty) {
            continue;
        }
        rows.push((line, record));
    }
    if rows.is_empty() {
        return Err(csv_error(
            &label,
            1,
            1,
            key,
            "has a header but no rows",
            "expected one row per hour below the header",
        ));
    }
    Ok(Table {
        label,
        header,
        rows,
    })
}

/// A malformed row (wrong number of fields, bad UTF-8) as a located error.
fn record_error(label: &str, e: csv::Error) -> ScenarioError {
    let line = e.position().map_or(1, |p| p.line());
    let (problem, valid) = match e.kind() {
        csv::ErrorKind::UnequalLengths {
            expected_len, len, ..
        } => (
            format!("the row has {len} fields, the header {expected_len}"),
            "expected every row to have one field per header column".to_string(),
        ),
        csv::ErrorKind::Utf8 { err, .. } => (
            format!("field {} is not UTF-8 text", err.field() + 1),
            "expected a CSV file saved as UTF-8".to_string(),
        ),
        _ => (
            e.to_string(),
            "expected a comma-separated file with a header row".to_string(),
        ),
    };
    let column = match e.kind() {
        csv::ErrorKind::Utf8 { err, .. } => err.field() + 1,
        _ => 1,
    };
    csv_error(label, line, column, "CSV row", problem, valid)
}

fn parse_timestamp(text: &str) -> Option<NaiveDateTime> {
    [
        "%Y-%m-%dT%H:%M",
        "%Y-%m-%d %H:%M",
        "%Y-%m-%dT%H:%M:%S",
        "%Y-%m-%d %H:%M:%S",
    ]
    .iter()
    .find_map(|f| NaiveDateTime::parse_from_str(text, f).ok())
}

/// A column that must be present.
fn require(t: &Table, name: &str, expected: &str) -> Read<usize> {
    t.column(name).ok_or_else(|| {
        csv_error(
            &t.label,
            1,
            t.header.len() + 1,
            "CSV header",
            format!("has no `{name}` column (columns: {})", t.header.join(", ")),
            expected.to_string(),
        )
    })
}

/// A field parsed as a number; a located error otherwise.
fn number_at(t: &Table, line: u64, record: &csv::StringRecord, col: usize) -> Read<f64> {
    let text = record.get(col).unwrap_or_default();
    text.parse::<f64>()
        .ok()
        .filter(|v| v.is_finite())
        .ok_or_else(|| {
            csv_error(
                &t.label,
                line,
                col + 1,
                &t.header[col],
                format!("{text:?} is not a number"),
                "expected a plain number such as 12.5 (the unit is in the column name)",
            )
        })
}

/// Timestamps of consecutive rows must be one hour apart.
fn timestamps(t: &Table, col: usize) -> Read<Vec<NaiveDateTime>> {
    let mut out: Vec<NaiveDateTime> = Vec::with_capacity(t.rows.len());
    for (line, record) in &t.rows {
        let text = record.get(col).unwrap_or_default();
        let at = parse_timestamp(text).ok_or_else(|| {
            csv_error(
                &t.label,
                *line,
                col + 1,
                TIMESTAMP,
                format!("{text:?} is not a timestamp"),
                "expected the hour's start as YYYY-MM-DDTHH:MM, e.g. 2025-07-14T15:00",
            )
        })?;
        if let Some(last) = out.last() {
            if at - *last != chrono::Duration::hours(1) {
                return Err(csv_error(
                    &t.label,
                    *line,
                    col + 1,
                    TIMESTAMP,
                    format!("{text} does not follow the row before ({last}) by one hour"),
                    "expected consecutive hours, one row per hour, no gaps or repeats",
                ));
            }
        }
        out.push(at);
    }
    Ok(out)
}

fn read_weather_csv(ctx: &mut Context, field: &str, node: &Node, name: &str) -> Read<Weather> {
    let t = read_csv(ctx, field, node, name)?;
    let valid_header = "expected the columns timestamp, one of dry_bulb_degC / dry_bulb_degF / dry_bulb_K, and rh_pct";
    let ts = require(&t, TIMESTAMP, valid_header)?;
    let present: Vec<_> = TEMPERATURE_COLUMNS
        .iter()
        .filter_map(|(n, unit)| t.column(n).map(|c| (c, *unit)))
        .collect();
    let (tcol, unit) = match present.as_slice() {
        [one] => *one,
        [] => {
            return Err(csv_error(
                &t.label,
                1,
                t.header.len() + 1,
                "CSV header",
                format!(
                    "has no temperature column (columns: {})",
                    t.header.join(", ")
                ),
                valid_header,
            ))
        }
        _ => {
            return Err(csv_error(
                &t.label,
                1,
                present[1].0 + 1,
                "CSV header",
                "has more than one temperature column",
                "expected exactly one of dry_bulb_degC, dry_bulb_degF, dry_bulb_K",
            ))
        }
    };
    let hcol = require(&t, HUMIDITY, valid_header)?;
    let times = timestamps(&t, ts)?;
    let hours = HOURS_PER_YEAR / t.rows.len() as f64;
    let mut records = Vec::with_capacity(t.rows.len());
    for ((line, record), at) in t.rows.iter().zip(times) {
        let value = number_at(&t, *line, record, tcol)?;
        let temperature_k = units::temperature_k(&format!("{value} {unit}")).unwrap_or(f64::NAN);
        if !(AMBIENT_T_K.0..=AMBIENT_T_K.1).contains(&temperature_k) {
            return Err(csv_error(
                &t.label,
                *line,
                tcol + 1,
                &t.header[tcol],
                format!("{value} {unit} is outside the ambient range"),
                format!("expected {} K to {} K", AMBIENT_T_K.0, AMBIENT_T_K.1),
            ));
        }
        let rh = number_at(&t, *line, record, hcol)?;
        if !(0.0..=100.0).contains(&rh) {
            return Err(csv_error(
                &t.label,
                *line,
                hcol + 1,
                HUMIDITY,
                format!("{rh} % is not a relative humidity"),
                "expected 0 to 100 (%)",
            ));
        }
        records.push(AmbientRecord {
            timestamp: Some(at),
            temperature_k,
            relative_humidity: rh / 100.0,
            hours,
        });
    }
    Ok(Weather {
        source: WeatherSource::Hourly(name.to_string()),
        records,
    })
}

/// Read `[operation] profile` (a CSV path) and align it with the hourly
/// weather, if any: every profile hour must be an hour of the weather.
pub(crate) fn read_profile(
    ctx: &mut Context,
    r: &TableReader,
    weather: Option<&Weather>,
) -> Read<Option<Profile>> {
    let Some(node) = r.node(ctx, "profile") else {
        return Ok(None);
    };
    let field = r.field("profile");
    let NodeValue::Str(name) = &node.value else {
        return Err(type_error(
            ctx,
            &field,
            node,
            "a CSV file path, e.g. \"data/dispatch.csv\"",
        ));
    };
    if let Some(Weather {
        source: WeatherSource::Bins,
        ..
    }) = weather
    {
        return Err(ctx.error_at_offset(
            node.span.start,
            &field,
            "an hourly profile cannot be aligned with weather bins",
            "expected site.weather as an hourly CSV file (or no weather: every hour at the site's ambient), or dispatch blocks instead of a profile",
        ));
    }
    let t = read_csv(ctx, &field, node, name)?;
    let valid_header =
        "expected the columns timestamp and load_pct, and optionally energy_price_per_MWh";
    let ts = require(&t, TIMESTAMP, valid_header)?;
    let lcol = require(&t, LOAD, valid_header)?;
    let pcol = t.column(PRICE);
    let times = timestamps(&t, ts)?;
    let mut weather_offset = 0;
    if let Some(w) = weather {
        let first = w.records.first().and_then(|r| r.timestamp);
        let start = times.first().copied();
        let offset = match (first, start) {
            (Some(first), Some(start)) if start >= first => {
                ((start - first).num_hours()).max(0) as usize
            }
            _ => usize::MAX,
        };
        if offset >= w.records.len() {
            return Err(csv_error(
                &t.label,
                t.rows[0].0,
                ts + 1,
                TIMESTAMP,
                "the profile's first hour is not an hour of the weather file",
                "expected a profile that starts at or after the weather's first hour",
            ));
        }
        if offset + times.len() > w.records.len() {
            let row = w.records.len() - offset;
            return Err(csv_error(
                &t.label,
                t.rows[row].0,
                ts + 1,
                TIMESTAMP,
                format!(
                    "the profile has {} hours, the weather only {} from its first hour on: this hour has no weather",
                    times.len(),
                    w.records.len() - offset
                ),
                "expected a profile no longer than the weather file, aligned hour by hour",
            ));
        }
        weather_offset = offset;
    }
    let mut hours = Vec::with_capacity(t.rows.len());
    for ((line, record), at) in t.rows.iter().zip(times) {
        let load = number_at(&t, *line, record, lcol)?;
        if !(0.0..=100.0).contains(&load) {
            return Err(csv_error(
                &t.label,
                *line,
                lcol + 1,
                LOAD,
                format!("{load} % is not a load"),
                "expected 0 (off) to 100 (%)",
            ));
        }
        let price = match pcol {
            Some(c) if !record.get(c).unwrap_or_default().is_empty() => {
                Some(number_at(&t, *line, record, c)?)
            }
            _ => None,
        };
        hours.push(ProfileHour {
            timestamp: at,
            load_fraction: load / 100.0,
            energy_price_per_mwh: price,
        });
    }
    if !hours.iter().any(|h| h.load_fraction > 0.0) {
        return Err(ctx.error_at_offset(
            node.span.start,
            &field,
            format!("{name} has no hour with a load above 0"),
            "expected a profile that runs the machine in at least one hour",
        ));
    }
    Ok(Some(Profile {
        file: name.to_string(),
        hours,
        weather_offset,
    }))
}
