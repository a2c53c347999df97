//! Candidates of different output levelled on output: a candidate that
//! delivers less buys its shortfall at `[economics] energy_value` (per MWh)
//! and `capacity_value` (per kW-year). Checked by hand arithmetic on the
//! ledger rows, against the NIST Handbook 135 uniform present value
//! UPV(d, n) = ((1+d)^n − 1)/(d(1+d)^n) for the stream's present value, and
//! for agreement between the study (`compare`) and the point evaluation
//! behind `sweep` and `risk`.
//!
//! The site is the rating condition (ISO 3977-2 defaults on both), so each
//! fixed machine makes its rated output there to the 1e-9 of its
//! calibration, and the hand figures hold to that tolerance.

use brayfin::analysis::compare::{run_study, Study};
use brayfin::analysis::evaluate::{output_reference, OutputReference};
use brayfin::analysis::point::{Figures, PointModel};
use brayfin::finance::factors::uniform_present_value;
use brayfin::finance::{Money, RowKind};
use brayfin::scenario::{parse, LoadedScenario};
use rust_decimal::Decimal;

/// Two bids of 40 and 44 MW, 4000 h a year at full load, 1 January start,
/// end-of-year, 7 % real over 20 years (invented figures).
const TWO_SIZES: &str = r#"
[scenario]
title = "Two sizes"
date = 2025-01-01
currency = "USD"
baseline = "small"

[fuel]
composition = "methane"
price = "4.00 USD/GJ"
price_basis = "lhv"

[economics]
commercial_operation = 2026-01-01
service_life_years = 20
discount_rate = "7 %"
#VALUES#

[operation]
#OPERATION#

[[candidate]]
id = "small"
capital_cost = "40000000 USD"
net_output = "40 MW"
gas_model = "air"
pressure_ratio = 16
turbine_inlet_temperature = "1450 K"
compressor_efficiency = 0.86
turbine_efficiency = 0.89

[candidate.costs]
fixed_om = "15 USD/kW-yr"
variable_om = "4 USD/MWh"

[[candidate]]
id = "large"
capital_cost = "46000000 USD"
net_output = "44 MW"
gas_model = "air"
pressure_ratio = 16
turbine_inlet_temperature = "1450 K"
compressor_efficiency = 0.86
turbine_efficiency = 0.89

[candidate.costs]
fixed_om = "15 USD/kW-yr"
variable_om = "4 USD/MWh"
"#;

const VALUED: &str = "energy_value = \"95 USD/MWh\"\ncapacity_value = \"40 USD/kW-yr\"";
const FULL_LOAD: &str = "hours_per_year = \"4000 h\"";

fn scenario(values: &str, operation: &str) -> LoadedScenario {
    let text = TWO_SIZES
        .replace("#VALUES#", values)
        .replace("#OPERATION#", operation);
    match parse(&text, "two-sizes.toml") {
        Ok(loaded) => loaded,
        Err(error) => panic!("does not load: {error}"),
    }
}

fn study(loaded: &LoadedScenario) -> Study {
    match run_study(loaded) {
        Ok(study) => study,
        Err(error) => panic!("study fails: {error}"),
    }
}

fn dec(text: &str) -> Decimal {
    text.parse().unwrap_or_default()
}

/// `got` within 1e-9 relative of `want` (the fixed machine reproduces its
/// rating to 1e-9).
fn near(got: f64, want: f64) -> bool {
    ((got - want) / want).abs() < 1e-9
}

fn reference_of(loaded: &LoadedScenario) -> OutputReference {
    let fuel = study(loaded).fuel;
    match output_reference(&loaded.scenario, &fuel) {
        Ok(reference) => reference,
        Err(error) => panic!("the machines must solve: {error}"),
    }
}

/// The smaller bid pays, in every operating year, 4 MW × 4000 h = 16 000
/// MWh at 95 = 1 520 000 plus 4000 kW at 40 = 160 000: 1 680 000 exactly.
/// The larger pays nothing. The stream's present value is 1 680 000 ×
/// UPV(7 %, 20) (to 1e-9 relative, the machine's reproduction of its rating).
#[test]
fn the_smaller_bid_buys_its_shortfall_every_year() {
    let loaded = scenario(VALUED, FULL_LOAD);
    let reference = reference_of(&loaded);
    assert!(near(reference.energy_mwh, 176_000.0), "{reference:?}");
    assert!(near(reference.net_output_kw, 44_000.0), "{reference:?}");
    let study = study(&loaded);
    let (small, large) = (&study.outcomes[0], &study.outcomes[1]);
    let operating = small
        .ledger
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Operation);
    for row in operating {
        let got = row.bought_in.to_f64();
        assert!(near(got, 1_680_000.0), "{}: {got}", row.year);
    }
    assert!(large.ledger.rows.iter().all(|r| r.bought_in.is_zero()));
    let pv = small.ledger.summary.present_value.bought_in.to_f64();
    let expected = 1_680_000.0 * uniform_present_value(0.07, 20);
    assert!(near(pv, expected), "{pv} vs {expected}");
}

/// With a dispatch profile the shortfall in energy follows the profile:
/// 4 MW × (3000 h at 100 % + 1000 h at 60 %) = 14 400 MWh, at 95 =
/// 1 368 000, plus the 160 000 of capacity.
#[test]
fn the_energy_shortfall_follows_the_dispatch_profile() {
    let operation =
        "dispatch = [{ load = \"100 %\", hours = 3000 }, { load = \"60 %\", hours = 1000 }]";
    let loaded = scenario(VALUED, operation);
    let reference = reference_of(&loaded);
    assert!(near(reference.energy_mwh, 158_400.0), "{reference:?}");
    let study = study(&loaded);
    let row = study.outcomes[0]
        .ledger
        .rows
        .iter()
        .find(|r| r.kind == RowKind::Operation)
        .expect("an operating year");
    let got = row.bought_in.to_f64();
    assert!(near(got, 1_528_000.0), "{got}");
}

/// Valuing the shortfall moves the larger bid's net savings against the
/// smaller by exactly the present value of the smaller's bought_in, and
/// leaves both levelized costs as they were (they are each candidate's own
/// cost per MWh).
#[test]
fn levelling_moves_net_savings_but_not_levelized_cost() {
    let plain = study(&scenario("", FULL_LOAD));
    let valued = study(&scenario(VALUED, FULL_LOAD));
    let savings = |s: &Study| {
        s.outcomes[1]
            .versus_baseline
            .expect("the large bid is compared")
            .savings
            .net_savings
    };
    let stream = valued.outcomes[0].ledger.summary.present_value.bought_in;
    assert!(stream > Decimal::ZERO);
    // The stream's total is priced once over its discounted quantities, the
    // lifecycle cost sums the rows: equal within about 1e-14 relative (see
    // the finance layer), far below a millionth of a unit here.
    let moved = savings(&valued) - savings(&plain);
    assert!(
        (moved - stream).abs() < dec("0.000001"),
        "{moved} vs {stream}"
    );
    for (a, b) in plain.outcomes.iter().zip(&valued.outcomes) {
        let (a, b) = (
            a.ledger.summary.levelized_cost_per_mwh().expect("energy"),
            b.ledger.summary.levelized_cost_per_mwh().expect("energy"),
        );
        assert!((a - b).abs() < dec("1e-12"), "{a} vs {b}");
    }
}

/// The point evaluation behind `sweep` and `risk` levels the same way as
/// `compare`, including when a point changes which bid is the largest
/// (the small one rated at 48 MW): every lifecycle cost within a cent of
/// the decimal study of the edited scenario.
#[test]
fn points_level_like_the_study() {
    let loaded = scenario(VALUED, FULL_LOAD);
    let base = study(&loaded);
    let keys = vec![
        "candidate[small].net_output".to_string(),
        "economics.energy_value".to_string(),
    ];
    let model = PointModel::new(
        &loaded.scenario,
        base.fuel.clone(),
        base.baseline_index,
        keys.clone(),
        vec![true, true],
    );
    let mut workspace = model.workspace();
    for values in [[40_000.0, 95.0], [48_000.0, 95.0], [40_000.0, 120.0]] {
        let mut figures = vec![Figures::default(); 2];
        if let Err(error) = model.evaluate(&mut workspace, &values, &mut figures) {
            panic!("{values:?}: {error}");
        }
        let mut edited = loaded.clone();
        for (key, value) in keys.iter().zip(values) {
            if let Err(error) = edited.scenario.set_numeric(key, value) {
                panic!("{key} = {value}: {error}");
            }
        }
        let expected = study(&edited);
        for (f, outcome) in figures.iter().zip(&expected.outcomes) {
            let lcc = outcome.ledger.summary.lifecycle_cost.to_f64();
            assert!(
                (f.lifecycle_cost - lcc).abs() <= 0.01,
                "{values:?}: {} vs {lcc}",
                f.lifecycle_cost
            );
        }
        let charged: Vec<bool> = expected
            .outcomes
            .iter()
            .map(|o| !o.ledger.summary.present_value.bought_in.is_zero())
            .collect();
        let small_is_largest = values[0] > 44_000.0;
        assert_eq!(charged, vec![!small_is_largest, small_is_largest]);
    }
}
