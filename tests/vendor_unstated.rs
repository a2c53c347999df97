//! A bid that states no components: its machine is fitted to the vendor's
//! figures at the rating when the file is read, priced like any other, and
//! reproduces the stated heat rate at the rating to the fit's tolerance
//! (0.05 %, issue 11's figure for the calibration).
//!
//! The bid is the Corvel Bay demo's Bid A with its component keys removed:
//! its vendor figures (9 713 kJ/kWh, 135.6 kg/s, 566.9 °C, pressure ratio
//! 19, ISO rating) were worked from its own stated cycle, so they are
//! figures one machine can reproduce.

use brayfin::analysis::compare::run_study;
use brayfin::scenario::{parse, EfficiencyBasis, GasModelSpec, LoadedScenario};

/// The Corvel Bay demo with dispatch blocks at its annual-mean ambient.
const DEMO: &str = "tests/fixtures/corvel-bay-blocks.toml";

/// The component keys (and the keys the fit sets) of Bid A.
const BID_A_COMPONENTS: [&str; 8] = [
    "pressure_ratio = 19\n",
    "turbine_inlet_temperature = \"1500 K\"\n",
    "compressor_efficiency = \"86 %\"\n",
    "turbine_efficiency = \"89 %\"\n",
    "efficiency_basis = \"isentropic\"\n",
    "mechanical_efficiency = \"99 %\"\n",
    "generator_efficiency = \"98.2 %\"\n",
    "auxiliary_load = \"1.2 %\"\n",
];

/// The demo with Bid A's keys in `remove` taken out of its table, and its
/// site at the ISO rating (15 °C, sea level: 101.325 kPa by ISO 2533, 60 %
/// by default) when `at_rating`.
fn demo_without(remove: &[&str], at_rating: bool) -> String {
    let mut text = std::fs::read_to_string(DEMO).expect("the demo is readable");
    let start = text.find("id = \"standard\"").expect("Bid A");
    for key in remove {
        let at = start + text[start..].find(key).expect("Bid A states the key");
        text.replace_range(at..at + key.len(), "");
    }
    if at_rating {
        text = text.replacen(
            "ambient_temperature = \"59 degF\"\nelevation = \"120 ft\"",
            "ambient_temperature = \"15 degC\"\nelevation = \"0 m\"",
            1,
        );
    }
    text
}

fn loaded(text: &str) -> LoadedScenario {
    parse(text, "fitted.toml").unwrap_or_else(|e| panic!("loads: {e}"))
}

/// Round trip: the fitted machine's heat rate at the rating — what the
/// comparison prices there, and what a guarantee defaults to — equals the
/// stated 9 713 kJ/kWh within 0.05 %, and its output is the rated 50 MW.
#[test]
fn a_bid_without_components_reproduces_its_stated_heat_rate() {
    let loaded = loaded(&demo_without(&BID_A_COMPONENTS, true));
    let a = &loaded.scenario.candidates[0];
    let fit = a.fitted.as_ref().expect("Bid A is fitted to its datasheet");
    assert!(!fit.assumptions.is_empty());
    assert_eq!(a.gas_model, GasModelSpec::Products);
    assert_eq!(a.efficiency_basis, EfficiencyBasis::Polytropic);
    // The stated pressure ratio is kept, not fitted.
    assert!(
        (a.pressure_ratio - 19.0).abs() < 1e-9,
        "{}",
        a.pressure_ratio
    );
    let study = run_study(&loaded).expect("the study runs");
    let site = &study.outcomes[0].solved.site;
    for (what, hr) in [
        ("at the rating", site.rated_heat_rate_kj_per_kwh),
        ("priced at a site at the rating", site.heat_rate_kj_per_kwh),
    ] {
        assert!(
            (hr / 9713.0 - 1.0).abs() < 5e-4,
            "{what}: {hr} kJ/kWh against the stated 9713"
        );
    }
    assert!((site.net_output_kw / 50_000.0 - 1.0).abs() < 1e-6);
    // Every fitted value is listed among the applied defaults.
    for key in [
        "turbine_inlet_temperature",
        "compressor_efficiency",
        "turbine_cooling",
    ] {
        let key = format!("candidate[standard].{key}");
        assert!(
            loaded
                .applied_defaults
                .iter()
                .any(|d| d.key == key && d.value.contains("fitted to the datasheet")),
            "{key}"
        );
    }
}

/// The four component keys go together: one left out names it.
#[test]
fn some_components_without_the_rest_are_refused() {
    let text = demo_without(&["compressor_efficiency = \"86 %\"\n"], false);
    let e = parse(&text, "partial.toml")
        .expect_err("refused")
        .to_string();
    assert!(
        e.contains("candidate[standard].compressor_efficiency")
            && e.contains("the four component keys go together"),
        "{e}"
    );
}

/// A key the fit sets is refused on a bid that states no components.
#[test]
fn a_key_the_fit_sets_is_refused() {
    let text = demo_without(&BID_A_COMPONENTS[..5], false);
    let e = parse(&text, "partial.toml")
        .expect_err("refused")
        .to_string();
    assert!(
        e.contains("candidate[standard].mechanical_efficiency")
            && e.contains("is fitted to the datasheet"),
        "{e}"
    );
}

/// `--vary` / `[[uncertainty]]` on a fitted efficiency is refused with a
/// message saying why; a key the fit takes as given may still vary.
#[test]
fn varying_a_fitted_efficiency_is_refused() {
    let mut scenario = loaded(&demo_without(&BID_A_COMPONENTS, false)).scenario;
    let e = scenario
        .set_numeric("candidate[standard].compressor_efficiency", 0.9)
        .expect_err("refused")
        .to_string();
    assert!(e.contains("fitted to its datasheet"), "{e}");
    let e = scenario
        .set_numeric("candidate[standard].rating.heat_rate", 9600.0)
        .expect_err("refused")
        .to_string();
    assert!(e.contains("fitted to its datasheet"), "{e}");
    scenario
        .set_numeric("candidate[standard].inlet_pressure_loss", 0.012)
        .expect("a loss the fit takes as given may vary");
}
