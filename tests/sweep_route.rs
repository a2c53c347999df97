//! `sweep` states the route its points were solved by, as `risk` does, and
//! the default (scaled) route keeps the error its note states against
//! `--exact`: heat rate and lifecycle cost within 0.09 % (held here to
//! 0.1 %), net savings and break-even premium within 0.08 % of the
//! lifecycle cost (held to 0.1 %), over whole-range sweeps of both demos.
//! The exact route is the reference (every point re-solved in full;
//! `tests/sweep_cli.rs` checks it against `compare` on the edited file).

use assert_cmd::Command;
use brayfin::analysis::point::{Figures, Route};
use brayfin::analysis::sweep::{plan, route_note, run_sweep_by};
use brayfin::scenario::{load, LoadedScenario};
use std::path::Path;

const CORVEL: &str = "scenarios/corvel-bay-peaker.toml";
const KESTREL: &str = "scenarios/kestrel-point-retrofit.toml";

/// The held bound: the 0.1 % the note rounds its measured figures under.
const HELD: f64 = 0.001;

fn loaded(path: &str) -> LoadedScenario {
    match load(Path::new(path)) {
        Ok(l) => l,
        Err(e) => panic!("{path}: {e}"),
    }
}

/// Every point's figures (every candidate) by `route`.
fn sweep(loaded: &LoadedScenario, vary: &str, route: Route) -> Vec<Vec<Figures>> {
    let plan = match plan(loaded, &[vary.to_string()], None) {
        Ok(p) => p,
        Err(e) => panic!("{vary}: {e}"),
    };
    let mut points = Vec::new();
    let mut on_block = |block: &brayfin::analysis::sweep::SweepBlock| -> brayfin::Result<()> {
        for j in 0..block.len() {
            match block.point(j) {
                Ok(f) => points.push(f.to_vec()),
                Err(e) => panic!("{vary}: point {} not solved: {e}", block.first_point + j),
            }
        }
        Ok(())
    };
    match run_sweep_by(loaded, &plan, route, &mut on_block) {
        Ok(0) => points,
        Ok(n) => panic!("{vary}: {n} points not solved"),
        Err(e) => panic!("{vary}: {e}"),
    }
}

fn route_error_within_the_note(path: &str, vary: &str) {
    let loaded = loaded(path);
    let scaled = sweep(&loaded, vary, Route::Scaled);
    let exact = sweep(&loaded, vary, Route::Exact);
    assert_eq!(scaled.len(), exact.len());
    let mut moved = false;
    for (p, (s, e)) in scaled.iter().zip(&exact).enumerate() {
        for (i, (s, e)) in s.iter().zip(e).enumerate() {
            let what = format!("{path} {vary}: point {p}, candidate {i}");
            let relative = |a: f64, b: f64| (a - b).abs() / b.abs();
            assert!(
                relative(s.heat_rate_kj_per_kwh, e.heat_rate_kj_per_kwh) <= HELD,
                "{what}: heat rate {} vs {}",
                s.heat_rate_kj_per_kwh,
                e.heat_rate_kj_per_kwh
            );
            assert!(
                relative(s.lifecycle_cost, e.lifecycle_cost) <= HELD,
                "{what}: lifecycle cost {} vs {}",
                s.lifecycle_cost,
                e.lifecycle_cost
            );
            moved |= s.lifecycle_cost != e.lifecycle_cost;
            if let (Some(sv), Some(ev)) = (s.versus_baseline, e.versus_baseline) {
                let scale = e.lifecycle_cost.abs();
                assert!(
                    (sv.net_savings - ev.net_savings).abs() <= HELD * scale,
                    "{what}: net savings {} vs {}",
                    sv.net_savings,
                    ev.net_savings
                );
                if let (Some(a), Some(b)) = (sv.break_even_premium, ev.break_even_premium) {
                    assert!(
                        (a - b).abs() <= HELD * scale,
                        "{what}: break-even premium {a} vs {b}"
                    );
                }
            }
        }
    }
    // The two routes are different computations: identical results would
    // mean the default route was not taken.
    assert!(
        moved,
        "{path} {vary}: the scaled route equals the exact one"
    );
}

#[test]
fn corvel_bay_turbine_efficiency_over_its_range() {
    route_error_within_the_note(CORVEL, "candidate.turbine_efficiency=0.86:0.95:0.005");
}

#[test]
fn kestrel_point_regenerator_effectiveness_over_its_range() {
    route_error_within_the_note(
        KESTREL,
        "candidate.regenerator.effectiveness=0.70:0.90:0.01",
    );
}

/// The largest error measured: compressor efficiency far from the file's.
#[test]
fn kestrel_point_compressor_efficiency_over_its_range() {
    route_error_within_the_note(KESTREL, "candidate.compressor_efficiency=0.84:0.92:0.005");
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

fn json(text: &str) -> serde_json::Value {
    match serde_json::from_str(text) {
        Ok(v) => v,
        Err(e) => panic!("{e}: {text}"),
    }
}

#[test]
fn sweep_states_its_route_in_the_table_and_the_json() {
    let vary = ["--vary", "candidate.turbine_efficiency=0.88:0.89:0.01"];
    let table = brayfin(&[&["sweep", CORVEL][..], &vary].concat());
    assert!(
        table.lines().any(|l| l == route_note(Route::Scaled)),
        "{table}"
    );
    assert!(route_note(Route::Scaled).contains("--exact"));
    let exact_table = brayfin(&[&["sweep", CORVEL][..], &vary, &["--exact"]].concat());
    assert!(
        exact_table.lines().any(|l| l == route_note(Route::Exact)),
        "{exact_table}"
    );
    let default = json(&brayfin(
        &[&["sweep", CORVEL][..], &vary, &["--format", "json"]].concat(),
    ));
    assert_eq!(default["exact"], false);
    assert_eq!(default["route_note"], route_note(Route::Scaled));
    let exact = json(&brayfin(
        &[
            &["sweep", CORVEL][..],
            &vary,
            &["--format", "json", "--exact"],
        ]
        .concat(),
    ));
    assert_eq!(exact["exact"], true);
    assert_eq!(exact["route_note"], route_note(Route::Exact));
}

#[test]
fn risk_csv_names_its_route() {
    for (extra, route) in [(&[][..], "scaled"), (&["--exact"][..], "exact")] {
        let csv = brayfin(
            &[
                &["risk", CORVEL, "--samples", "200", "--format", "csv"][..],
                extra,
            ]
            .concat(),
        );
        let mut lines = csv.lines();
        let header: Vec<&str> = lines.next().unwrap_or_default().split(',').collect();
        let at = header.iter().position(|h| *h == "route");
        let Some(at) = at else {
            panic!("no route column: {csv}")
        };
        let mut rows = 0;
        for line in lines {
            assert_eq!(line.split(',').nth(at), Some(route), "{line}");
            rows += 1;
        }
        assert!(rows > 0, "{csv}");
    }
}
