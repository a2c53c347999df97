//! `sweep`'s column headers state a unit for every declared numeric key
//! (none for a dimensionless one): no placeholder such as "internal unit",
//! "number" or "fraction". Checked over every key path the declarations
//! give (`brayfin::scenario::declared_key_paths`), and end to end through
//! `sweep --vary` for the starts and maintenance keys of the demo.

use assert_cmd::Command;
use brayfin::analysis::sweep::{parse_axis, plan, SweepPlan};
use brayfin::report::views::sweep::axis_headers;
use brayfin::scenario::{declared_key_paths, load, LoadedScenario};
use brayfin::units::{kind_of, Kind};
use std::path::Path;

const DEMO: &str = "scenarios/corvel-bay-peaker.toml";

/// Keys whose values are ratios of like quantities (pressure ratios, the
/// ratio of specific heats, pressure splits): dimensionless, so their
/// header is the key alone. Every fraction-kind key is dimensionless too.
const DIMENSIONLESS: &[&str] = &[
    "candidate.specific_heat_ratio",
    "candidate.pressure_ratio",
    "candidate.intercooler.pressure_split",
    "candidate.reheat.pressure_split",
    "candidate.rating.pressure_ratio",
];

/// Plain-number keys that count something, with the unit their header
/// must state.
const COUNTED: &[(&str, &str)] = &[
    ("economics.service_life_years", "years"),
    ("operation.starts_per_year", "starts/yr"),
    ("candidate.cp_kj_per_kg_k", "kJ/(kg·K)"),
    ("candidate.costs.overhaul_starts", "starts"),
    ("candidate.costs.overhaul_outage_days", "days"),
];

/// What a unit may be counted per after its kind's unit.
const PER: &[&str] = &[
    "/start",
    "/fired h",
    "/yr",
    "/kW",
    " per % of heat rate",
    " per kJ/kWh of heat rate",
    " (equivalent)",
    " HHV",
    " LHV",
];

fn demo() -> LoadedScenario {
    match load(Path::new(DEMO)) {
        Ok(l) => l,
        Err(e) => panic!("demo: {e}"),
    }
}

/// The header of `key` swept in bare numbers, with the kind `sweep`'s plan
/// gives a key the file writes no unit for: its declared kind.
fn bare_header(loaded: &LoadedScenario, key: &str) -> String {
    let mut axis = match parse_axis(&format!("{key}=1:1:1")) {
        Ok(a) => a,
        Err(e) => panic!("{key}: {e}"),
    };
    axis.kind = match loaded.scenario.numeric_kind(key) {
        Ok(kind) => Some(kind),
        Err(e) => panic!("{key}: {e}"),
    };
    let plan = SweepPlan {
        axes: vec![axis],
        baseline: 0,
        reported: vec![0],
    };
    axis_headers(loaded, &plan).remove(0)
}

/// The unit inside `KEY (UNIT)`, or `None` for the key alone.
fn unit_of<'h>(header: &'h str, key: &str) -> Option<&'h str> {
    let rest = header
        .strip_prefix(key)
        .unwrap_or_else(|| panic!("{header}"));
    if rest.is_empty() {
        return None;
    }
    rest.strip_prefix(" (")
        .and_then(|r| r.strip_suffix(')'))
        .or_else(|| panic!("{header}: expected `KEY (UNIT)`"))
}

#[test]
fn every_declared_numeric_key_has_a_real_unit_or_none() {
    let loaded = demo();
    let paths = declared_key_paths();
    assert!(
        paths.len() > 70,
        "the declarations give every key: {}",
        paths.len()
    );
    for (key, kind_text) in paths {
        let header = bare_header(&loaded, &key);
        let unit = unit_of(&header, &key);
        if kind_text == "fraction" || DIMENSIONLESS.contains(&key.as_str()) {
            assert_eq!(unit, None, "{key} is dimensionless: {header}");
            continue;
        }
        let Some(unit) = unit else {
            panic!("{key} ({kind_text}) has no unit: {header}")
        };
        for placeholder in ["internal unit", "number", "fraction"] {
            assert!(!unit.contains(placeholder), "{key}: {header}");
        }
        if let Some((_, counted)) = COUNTED.iter().find(|(k, _)| *k == key) {
            assert_eq!(unit, *counted, "{key}");
            continue;
        }
        // The unit, less what it is counted per, reads back as a unit of the
        // key's declared kind.
        let mut base = unit;
        while let Some(per) = PER.iter().find(|p| base.ends_with(*p)) {
            base = &base[..base.len() - per.len()];
        }
        let declared = loaded.scenario.numeric_kind(&key).ok();
        let read = kind_of(&format!("1 {base}"))
            .or_else(|| (base == "USD").then_some(Kind::Money))
            .or_else(|| (base == "GJ").then_some(Kind::FuelEnergy));
        // `USD/MWh` reads as a fuel price as well (fuel may be priced per
        // MWh of heat); for an electrical-energy price it is the right unit.
        let same = read == declared
            || (declared == Some(Kind::PricePerEnergy) && read == Some(Kind::FuelPrice));
        assert!(
            same,
            "{key}: `{base}` in {header} reads as {read:?}, declared {declared:?}"
        );
    }
}

fn brayfin(args: &[&str]) -> String {
    let output = match Command::cargo_bin("brayfin") {
        Ok(mut c) => match c.args(args).output() {
            Ok(o) => o,
            Err(e) => panic!("brayfin must run: {e}"),
        },
        Err(e) => panic!("brayfin must build: {e}"),
    };
    assert!(
        output.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    String::from_utf8_lossy(&output.stdout).into_owned()
}

/// The demo writes `starts_per_year = 120` bare and `start_fuel = "95 GJ"`:
/// both headers state their unit, in the CSV, the table and the JSON.
#[test]
fn starts_and_start_fuel_headers_through_sweep() {
    let vary = [
        "--vary",
        "operation.starts_per_year=100:120:20",
        "--vary",
        "candidate[premium].costs.start_fuel=90:95:5",
        "--candidate",
        "premium",
    ];
    let csv = brayfin(&[&["sweep", DEMO][..], &vary, &["--format", "csv"]].concat());
    assert!(
        csv.starts_with(
            "point,operation.starts_per_year (starts/yr),\
             candidate[premium].costs.start_fuel (GJ LHV/start),candidate_id,"
        ),
        "{csv}"
    );
    let table = brayfin(&[&["sweep", DEMO][..], &vary].concat());
    assert!(table.contains("(starts/yr)"), "{table}");
    assert!(table.contains("(GJ LHV/start)"), "{table}");
    let json = brayfin(&[&["sweep", DEMO][..], &vary, &["--format", "json"]].concat());
    let v: serde_json::Value = match serde_json::from_str(&json) {
        Ok(v) => v,
        Err(e) => panic!("{e}: {json}"),
    };
    assert_eq!(v["units"]["operation.starts_per_year"], "starts/yr");
    assert_eq!(
        v["units"]["candidate[premium].costs.start_fuel"],
        "GJ LHV/start"
    );
}

/// A range written with a unit keeps it, counted per start; a
/// dimensionless key has no unit (`null` in the JSON).
#[test]
fn written_units_and_dimensionless_keys() {
    let loaded = demo();
    let plan = match plan(
        &loaded,
        &[
            "candidate[premium].costs.start_cost=400USD:600USD:100USD".to_string(),
            "candidate[premium].pressure_ratio=18:19:1".to_string(),
        ],
        None,
    ) {
        Ok(p) => p,
        Err(e) => panic!("{e}"),
    };
    assert_eq!(
        axis_headers(&loaded, &plan),
        vec![
            "candidate[premium].costs.start_cost (USD/start)".to_string(),
            "candidate[premium].pressure_ratio".to_string(),
        ]
    );
    let json = brayfin(&[
        "sweep",
        DEMO,
        "--vary",
        "candidate[premium].compressor_efficiency=0.88:0.89:0.01",
        "--format",
        "json",
    ]);
    let v: serde_json::Value = match serde_json::from_str(&json) {
        Ok(v) => v,
        Err(e) => panic!("{e}: {json}"),
    };
    assert!(v["units"]["candidate[premium].compressor_efficiency"].is_null());
}
