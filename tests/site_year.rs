//! The site's year: weather (hourly file or bins), dispatch at its own
//! ambient, an hourly profile, each candidate's own performance in every
//! condition, capacity credited at the capacity temperature.
//!
//! Sources, beside each check: the three-bin year is worked by hand from
//! the definitions (energy = Σ load × output × hours, fuel = energy × heat
//! rate); the temperature-bin method (hours grouped by 1 K dry-bulb
//! classes, each at its class's mean) is the bin method of the ASHRAE
//! Handbook, Fundamentals, energy estimating chapter (from memory); the
//! rating-point identity (a fixed machine at its rating condition makes its
//! rated output) is the calibration's definition (`Machine::calibrate`).

use brayfin::analysis::compare::run_study;
use brayfin::analysis::machine::{machine_of, site_ambient};
use brayfin::analysis::operation::{conditions, year_from};
use brayfin::analysis::site::{exact_points, year_points, SiteModel};
use brayfin::offdesign::{Ambient, Load};
use brayfin::scenario::{parse_in, LoadedScenario};
use std::path::{Path, PathBuf};

const KESTREL: &str = "scenarios/kestrel-point-retrofit.toml";
const CORVEL: &str = "scenarios/corvel-bay-peaker.toml";

fn root() -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
}

/// The Kestrel Point demo with its `[site]` and `[operation]` sections
/// replaced.
fn kestrel_with(site: &str, operation: &str) -> String {
    let text = std::fs::read_to_string(root().join(KESTREL)).expect("demo readable");
    let site_at = text.find("[site]\n").expect("site section");
    let fuel_at = text.find("[fuel]\n").expect("fuel section");
    let op_at = text.find("[operation]\n").expect("operation section");
    let cand_at = text.find("[[candidate]]").expect("candidates");
    format!(
        "{}[site]\n{site}\n\n{}[operation]\n{operation}\n\n{}",
        &text[..site_at],
        &text[fuel_at..op_at],
        &text[cand_at..]
    )
}

fn load_in(text: &str, dir: &Path) -> LoadedScenario {
    match parse_in(text, "year.toml", Some(dir)) {
        Ok(l) => l,
        Err(e) => panic!("scenario loads: {e}"),
    }
}

fn fuel_of(loaded: &LoadedScenario) -> brayfin::fuel::Fuel {
    brayfin::analysis::engine::fuel_of(&loaded.scenario.fuel).expect("fuel")
}

/// Three bins, dispatch spread over them in proportion, worked by hand
/// from each candidate's own machine at each bin's temperature.
#[test]
fn a_three_bin_year_is_the_hand_sum_of_its_bins() {
    // Weights 2190 : 4380 : 2190 h = 1/4 : 1/2 : 1/4 of the year.
    let site = r#"ambient_pressure = "101.1 kPa"
relative_humidity = "60 %"
weather = [
  { temperature = "0 degC", hours = 2190 },
  { temperature = "15 degC", hours = 4380 },
  { temperature = "30 degC", relative_humidity = "40 %", hours = 2190 },
]"#;
    let operation = r#"dispatch = [
  { load = "100 %", hours = 4000 },
  { load = "70 %", hours = 2000 },
]"#;
    let loaded = load_in(&kestrel_with(site, operation), &root());
    let scenario = &loaded.scenario;
    // Hand: the 4000 h block gives 1000, 2000, 1000 h; the 2000 h block
    // 500, 1000, 500 h.
    let hours: Vec<f64> = conditions(scenario).iter().map(|c| c.hours).collect();
    assert_eq!(hours, vec![1000.0, 2000.0, 1000.0, 500.0, 1000.0, 500.0]);
    let fuel = fuel_of(&loaded);
    let study = run_study(&loaded).expect("study runs");
    let bins = [(273.15, 0.6), (288.15, 0.6), (303.15, 0.4)];
    for (candidate, outcome) in scenario.candidates.iter().zip(&study.outcomes) {
        let machine = machine_of(candidate, &scenario.site, &fuel).expect("machine");
        let (mut energy_kwh, mut fuel_kj) = (0.0, 0.0);
        for (load, block_hours) in [(1.0, 4000.0), (0.7, 2000.0)] {
            for ((t, rh), share) in bins.iter().zip([0.25, 0.5, 0.25]) {
                let ambient = Ambient {
                    temperature_k: *t,
                    pressure_kpa: 101.1,
                    relative_humidity: *rh,
                };
                let base = machine.solve(ambient, Load::BASE).expect("base");
                let hr = machine
                    .solve(ambient, Load(load))
                    .expect("part")
                    .heat_rate_kj_per_kwh;
                let kwh = load * base.net_output_kw * block_hours * share;
                energy_kwh += kwh;
                fuel_kj += kwh * hr;
            }
        }
        let year = &outcome.solved.year;
        assert_eq!(year.operating_hours, 6000.0, "{}", candidate.id);
        assert!(
            (year.energy_mwh / (energy_kwh / 1e3) - 1.0).abs() < 1e-12,
            "{}: energy {} vs hand {}",
            candidate.id,
            year.energy_mwh,
            energy_kwh / 1e3
        );
        assert!(
            // The part-load solve converges to its load tolerance (1e-8,
            // `offdesign::control`), so the hand sum of separate solves
            // agrees to that order, not to rounding.
            (year.fuel_energy_gj_lhv / (fuel_kj / 1e6) - 1.0).abs() < 1e-8,
            "{}: fuel {} vs hand {}",
            candidate.id,
            year.fuel_energy_gj_lhv,
            fuel_kj / 1e6
        );
    }
}

/// Hourly weather against the same hours grouped into 1 K dry-bulb bins
/// (bin method): energy and fuel of a full-load year agree within 0.1 %.
#[test]
fn binned_and_hourly_weather_agree() {
    let data = root().join("scenarios");
    let hourly_site = "weather = \"data/corvel-bay-weather.csv\"";
    let operation = "hours_per_year = \"8760 h\"";
    let hourly = load_in(&kestrel_with(hourly_site, operation), &data);
    let records = &hourly
        .scenario
        .site
        .weather
        .as_ref()
        .expect("weather")
        .records;
    // Group by 1 K classes: hour-weighted mean temperature and humidity.
    let mut classes: std::collections::BTreeMap<i64, (f64, f64, f64)> = Default::default();
    for r in records {
        let e = classes
            .entry(r.temperature_k.floor() as i64)
            .or_insert((0.0, 0.0, 0.0));
        e.0 += r.hours;
        e.1 += r.hours * r.temperature_k;
        e.2 += r.hours * r.relative_humidity;
    }
    let bins: Vec<String> = classes
        .values()
        .map(|(h, t, rh)| {
            format!(
                "{{ temperature = \"{} K\", relative_humidity = \"{}\", hours = {h} }}",
                t / h,
                rh / h
            )
        })
        .collect();
    let binned_site = format!("weather = [\n{}\n]", bins.join(",\n"));
    let binned = load_in(&kestrel_with(&binned_site, operation), &data);
    let a = run_study(&hourly).expect("hourly study");
    let b = run_study(&binned).expect("binned study");
    for (x, y) in a.outcomes.iter().zip(&b.outcomes) {
        let de = x.solved.year.energy_mwh / y.solved.year.energy_mwh - 1.0;
        let df = x.solved.year.fuel_energy_gj_lhv / y.solved.year.fuel_energy_gj_lhv - 1.0;
        println!(
            "hourly vs {} bins: energy {de:+.2e}, fuel {df:+.2e}",
            bins.len()
        );
        assert!(de.abs() < 1e-3 && df.abs() < 1e-3, "energy {de}, fuel {df}");
        assert!((x.solved.year.operating_hours - 8760.0).abs() < 1e-6);
    }
}

/// The grid the hourly year is solved on, against an exact solve of every
/// hour of the Corvel Bay demo: energy and fuel within 0.05 %.
#[test]
fn the_year_grid_matches_exact_solves() {
    let loaded = brayfin::scenario::load(&root().join(CORVEL)).expect("demo loads");
    let scenario = &loaded.scenario;
    let fuel = fuel_of(&loaded);
    let conds = conditions(scenario);
    assert!(conds.len() > 1000, "an hourly year: {}", conds.len());
    for candidate in &scenario.candidates {
        let machine = machine_of(candidate, &scenario.site, &fuel).expect("machine");
        let model = SiteModel::machine(machine, candidate);
        let p = scenario.site.ambient_pressure_kpa;
        let grid = year_points(&model, candidate, p, &conds).expect("grid");
        let exact = exact_points(&model, candidate, p, &conds).expect("exact");
        let (g, x) = (year_from(&conds, &grid), year_from(&conds, &exact));
        let de = g.energy_mwh / x.energy_mwh - 1.0;
        let df = g.fuel_energy_gj_lhv / x.fuel_energy_gj_lhv - 1.0;
        let worst_hr = grid
            .iter()
            .zip(&exact)
            .map(|(a, b)| (a.heat_rate_kj_per_kwh / b.heat_rate_kj_per_kwh - 1.0).abs())
            .fold(0.0, f64::max);
        println!(
            "{}: grid vs exact energy {de:+.2e}, fuel {df:+.2e}, worst hour heat rate {worst_hr:.2e}",
            candidate.id
        );
        assert!(
            de.abs() < 5e-4 && df.abs() < 5e-4,
            "{}: {de} {df}",
            candidate.id
        );
        assert!(worst_hr < 5e-3, "{}: {worst_hr}", candidate.id);
    }
}

/// Capacity at the rating temperature is the rated output (the machine is
/// calibrated there); at a hot capacity temperature it is less, and the
/// capacity shortfall is the largest capacity less each one's.
#[test]
fn capacity_is_credited_at_the_capacity_temperature() {
    let site = "ambient_temperature = \"12 degC\"\nambient_pressure = \"101.325 kPa\"\nrelative_humidity = \"60 %\"";
    let operation = "hours_per_year = \"8000 h\"";
    let base = kestrel_with(site, operation);
    let at = |t: &str| {
        let text = base.replacen(
            "[economics]\n",
            &format!("[economics]\ncapacity_temperature = \"{t}\"\n"),
            1,
        );
        let loaded = load_in(&text, &root());
        let study = run_study(&loaded).expect("study");
        (loaded, study)
    };
    let (loaded, study) = at("15 degC");
    for (c, o) in loaded.scenario.candidates.iter().zip(&study.outcomes) {
        if (c.rating.temperature_k - 288.15).abs() > 1e-9
            || (c.rating.pressure_kpa - 101.325).abs() > 1e-9
            || (c.rating.relative_humidity - 0.6).abs() > 1e-9
        {
            continue;
        }
        let cap = o.solved.site.capacity_output_kw;
        assert!(
            (cap / c.net_output_kw - 1.0).abs() < 1e-6,
            "{}: capacity {cap} vs rated {}",
            c.id,
            c.net_output_kw
        );
    }
    let (loaded_hot, hot) = at("35 degC");
    let most = hot
        .outcomes
        .iter()
        .map(|o| o.solved.site.capacity_output_kw)
        .fold(0.0, f64::max);
    for ((c, o), cool) in loaded_hot
        .scenario
        .candidates
        .iter()
        .zip(&hot.outcomes)
        .zip(&study.outcomes)
    {
        let cap = o.solved.site.capacity_output_kw;
        assert!(cap < cool.solved.site.capacity_output_kw, "{}", c.id);
        let machine =
            machine_of(c, &loaded_hot.scenario.site, &fuel_of(&loaded_hot)).expect("machine");
        let own = machine
            .solve(
                Ambient {
                    temperature_k: 308.15,
                    ..site_ambient(c, &loaded_hot.scenario.site)
                },
                Load::BASE,
            )
            .expect("hot solve")
            .net_output_kw;
        assert!((cap - own).abs() < 1e-9, "{}", c.id);
        let shortfall = o.inputs.bought_in.capacity_kw;
        assert!((shortfall - (most - cap)).abs() < 1e-6, "{}", c.id);
    }
}

/// Sweep and risk points on the hourly demo (cached site years, the year's
/// conditions built once per point) give the study's figures at the same
/// inputs: the point cache must notice a changed capacity temperature,
/// efficiency or hours, and reuse nothing stale.
#[test]
fn points_on_the_hourly_year_follow_the_study() {
    use brayfin::analysis::point::{Figures, PointModel};
    use brayfin::finance::Money;
    let loaded = brayfin::scenario::load(&root().join(CORVEL)).expect("demo loads");
    let base = run_study(&loaded).expect("study runs");
    let keys = vec![
        "economics.capacity_temperature".to_string(),
        "candidate[premium].turbine_efficiency".to_string(),
        "operation.hours_per_year".to_string(),
        "fuel.price".to_string(),
    ];
    // The exact route: every machine re-solved in full (the default route
    // is held to 0.1 % in tests/risk_route.rs).
    let model = PointModel::new(
        &loaded.scenario,
        base.fuel.clone(),
        base.baseline_index,
        keys.clone(),
        vec![true; 3],
    )
    .with_route(brayfin::analysis::point::Route::Exact);
    let mut workspace = model.workspace();
    for values in [
        [308.15, 0.90, 1354.0, 3.0],
        [298.15, 0.90, 1354.0, 3.0],
        [298.15, 0.91, 1354.0, 3.0],
        [298.15, 0.91, 2000.0, 4.0],
        [308.15, 0.90, 1354.0, 3.0],
    ] {
        let mut figures = vec![Figures::default(); 3];
        if let Err(error) = model.evaluate(&mut workspace, &values, &mut figures) {
            panic!("{values:?}: {error}");
        }
        let mut edited = loaded.clone();
        for (key, value) in keys.iter().zip(values) {
            if let Err(error) = edited.scenario.set_numeric(key, value) {
                panic!("{key} = {value}: {error}");
            }
        }
        let expected = run_study(&edited).expect("the edited study runs");
        for (f, outcome) in figures.iter().zip(&expected.outcomes) {
            let lcc = outcome.ledger.summary.lifecycle_cost.to_f64();
            assert!(
                (f.lifecycle_cost - lcc).abs() <= 0.01,
                "{values:?}: {} vs {lcc}",
                f.lifecycle_cost
            );
        }
    }
}
