//! A scenario's candidate as a fixed machine (`analysis::machine`): the
//! rating table, control table and turbine cooling reach the off-design
//! model, and a refusal points at the candidate's key.

use brayfin::analysis::engine::fuel_of;
use brayfin::analysis::machine::{calibrate_candidate, machine_of, rating_of, site_ambient};
use brayfin::offdesign::{Ambient, Load};
use brayfin::scenario::{self, LoadedScenario};

fn demo_text() -> String {
    std::fs::read_to_string("tests/fixtures/corvel-bay-blocks.toml").expect("demo scenario")
}

fn parse(text: &str) -> LoadedScenario {
    scenario::parse(text, "test.toml").expect("scenario parses")
}

/// Add `lines` to the first candidate (`standard`) of the demo, just
/// before its rating table (which states its vendor figures).
fn with_standard(lines: &str) -> String {
    with_standard_rating(lines, "")
}

/// Add `before` to the first candidate (`standard`) of the demo just before
/// its rating table, and `keys` at the top of that table.
fn with_standard_rating(before: &str, keys: &str) -> String {
    demo_text().replacen(
        "[candidate.rating]\n",
        &format!("{before}\n[candidate.rating]\n{keys}"),
        1,
    )
}

/// At its own rating condition and base load a candidate's machine makes
/// its rated `net_output`: the definition of the rating (issue 10), to
/// 1e-9 relative (the matching closes to 1e-13).
#[test]
fn each_demo_machine_makes_its_rated_output_at_its_rating() {
    for text in [
        demo_text(),
        with_standard_rating(
            "turbine_cooling = \"12 %\"",
            "temperature = \"30 degC\"\npressure = \"95 kPa\"\nrelative_humidity = \"20 %\"\n",
        ),
    ] {
        let loaded = parse(&text);
        let s = &loaded.scenario;
        let fuel = fuel_of(&s.fuel).expect("fuel");
        for (i, c) in s.candidates.iter().enumerate() {
            let machine = calibrate_candidate(&loaded, i, &fuel).expect("machine");
            let p = machine
                .solve(rating_of(c), Load::BASE)
                .expect("rating point");
            let rel = (p.net_output_kw - c.net_output_kw).abs() / c.net_output_kw;
            assert!(
                rel <= 1e-9,
                "{}: {} kW vs rated {} kW",
                c.id,
                p.net_output_kw,
                c.net_output_kw
            );
        }
    }
}

/// A machine rated at 30 °C makes more than its rating on a 15 °C day:
/// output falls as ambient temperature rises (Walsh and Fletcher, *Gas
/// Turbine Performance*, ambient effects; common practice).
#[test]
fn a_hot_rated_machine_makes_more_on_a_cooler_day() {
    let loaded = parse(&with_standard_rating("", "temperature = \"30 degC\"\n"));
    let s = &loaded.scenario;
    let fuel = fuel_of(&s.fuel).expect("fuel");
    let c = &s.candidates[0];
    let machine = machine_of(c, &s.site, &fuel).expect("machine");
    let cool = Ambient {
        temperature_k: 288.15,
        ..rating_of(c)
    };
    let p = machine.solve(cool, Load::BASE).expect("15 degC point");
    assert!(
        p.net_output_kw > c.net_output_kw * 1.03,
        "{} kW at 15 degC vs {} kW rated at 30 degC",
        p.net_output_kw,
        c.net_output_kw
    );
}

/// `[candidate.control]` reaches the machine: under `firing-temperature`
/// the air flow stays at its full setting at part load; under the default
/// guide vanes it closes (issue 10, control strategies).
#[test]
fn control_table_sets_the_strategy() {
    let vanes = parse(&demo_text());
    let fixed = parse(&with_standard(
        "[candidate.control]\nstrategy = \"firing-temperature\"\nminimum_load = \"40 %\"\n",
    ));
    let fuel = fuel_of(&vanes.scenario.fuel).expect("fuel");
    let at = |loaded: &LoadedScenario| {
        let s = &loaded.scenario;
        let m = machine_of(&s.candidates[0], &s.site, &fuel).expect("machine");
        m.solve(site_ambient(&s.candidates[0], &s.site), Load(0.6))
            .expect("60 % load")
    };
    assert_eq!(at(&fixed).airflow_fraction, 1.0);
    assert!(at(&vanes).airflow_fraction < 0.99);
    let s = &fixed.scenario;
    let m = machine_of(&s.candidates[0], &s.site, &fuel).expect("machine");
    let e = m
        .solve(site_ambient(&s.candidates[0], &s.site), Load(0.35))
        .expect_err("below the minimum load");
    assert_eq!(e.field(), Some("load"));
}

/// An exhaust limit below the rated exhaust temperature leaves the machine
/// no way to make its rating: an input error at that key of that
/// candidate, with line and column.
#[test]
fn an_exhaust_limit_below_the_rating_is_refused_at_its_key() {
    let loaded = parse(&with_standard(
        "[candidate.control]\nexhaust_temperature_limit = \"500 K\"\n",
    ));
    let fuel = fuel_of(&loaded.scenario.fuel).expect("fuel");
    let e = calibrate_candidate(&loaded, 0, &fuel).expect_err("limit below rated exhaust");
    let text = e.to_string();
    assert!(matches!(e, brayfin::Error::Input(_)), "{text}");
    assert!(
        text.contains("candidate[standard].control.exhaust_temperature_limit")
            && text.contains("below the rated exhaust temperature"),
        "{text}"
    );
    assert!(text.starts_with("test.toml:"), "{text}");
}
