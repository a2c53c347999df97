//! The report's "Site performance" section on the demo scenario: the
//! figures behind it (each bid's fixed machine against ambient temperature
//! and load, and its year as priced) and the section as printed, read back
//! from the PDF.

use brayfin::analysis::compare::run_study;
use brayfin::analysis::model::{build_model, ModelOptions};
use brayfin::report::format;
use brayfin::report::model::{Model, Units};
use brayfin::report::pdf::{Paper, PdfRenderer};
use brayfin::report::wording::Wording;
use brayfin::report::Renderer;
use brayfin::scenario::{parse_in, LoadedScenario};
use lopdf::Document;
use std::path::Path;

const DEMO: &str = include_str!("../scenarios/corvel-bay-peaker.toml");

fn demo() -> LoadedScenario {
    match parse_in(
        DEMO,
        "scenarios/corvel-bay-peaker.toml",
        Some(Path::new("scenarios")),
    ) {
        Ok(loaded) => loaded,
        Err(e) => panic!("the demo must load: {e}"),
    }
}

fn model(loaded: &LoadedScenario) -> Model {
    let options = ModelOptions {
        units: Units::Si,
        sensitivity: false,
    };
    match build_model(loaded, &options) {
        Ok(model) => model,
        Err(e) => panic!("the demo model must build: {e}"),
    }
}

/// Hot-day lapse (common practice; Saravanamuttoo et al., *Gas Turbine
/// Theory*, off-design at constant speed): a fixed single-shaft machine
/// makes less output at a higher heat rate as the ambient warms; and each
/// machine's heat rate rises as its load falls.
#[test]
fn output_falls_and_heat_rate_rises_with_ambient_temperature_and_falling_load() {
    let model = model(&demo());
    let view = &model.site_performance;
    assert_eq!(view.candidates.len(), 3);
    for c in &view.candidates {
        assert!(c.fixed_machine, "{} is a fixed machine", c.candidate_id);
        let output: Vec<f64> = c.output_kw.iter().flatten().copied().collect();
        let heat_rate: Vec<f64> = c.heat_rate_kj_per_kwh.iter().flatten().copied().collect();
        assert_eq!(
            output.len(),
            view.temperatures_k.len(),
            "{}",
            c.candidate_id
        );
        assert!(output.windows(2).all(|w| w[1] < w[0]), "{output:?}");
        assert!(heat_rate.windows(2).all(|w| w[1] > w[0]), "{heat_rate:?}");
        let part: Vec<f64> = c
            .part_load_heat_rate_kj_per_kwh
            .iter()
            .flatten()
            .copied()
            .collect();
        assert!(part.len() >= 4, "{}: {part:?}", c.candidate_id);
        assert!(part.windows(2).all(|w| w[1] > w[0]), "{part:?}");
    }
}

/// Altitude similarity (Walsh and Fletcher, *Gas Turbine Performance*,
/// non-dimensional groups, from memory): at the rating temperature and
/// humidity but the site's lower pressure, a machine's output scales with
/// the inlet pressure and its heat rate is unchanged. The curve point at
/// 288.15 K against each bid's rating (288.15 K, 101.325 kPa).
#[test]
fn the_curve_at_the_rating_temperature_follows_altitude_similarity() {
    let loaded = demo();
    let model = model(&loaded);
    let study = match run_study(&loaded) {
        Ok(s) => s,
        Err(e) => panic!("the demo must solve: {e}"),
    };
    let view = &model.site_performance;
    let Some(at) = view
        .temperatures_k
        .iter()
        .position(|t| (t - 288.15).abs() < 1e-9)
    else {
        panic!("the curves include 288.15 K: {:?}", view.temperatures_k);
    };
    let scenario = &loaded.scenario;
    let pressure_ratio = scenario.site.ambient_pressure_kpa / 101.325;
    for ((c, candidate), outcome) in view
        .candidates
        .iter()
        .zip(&scenario.candidates)
        .zip(&study.outcomes)
    {
        let (Some(output), Some(heat_rate)) = (c.output_kw[at], c.heat_rate_kj_per_kwh[at]) else {
            panic!("{} runs at 288.15 K", c.candidate_id);
        };
        let expected = candidate.net_output_kw * pressure_ratio;
        assert!(
            (output / expected - 1.0).abs() < 2e-3,
            "{}: {output} kW against {expected} kW",
            c.candidate_id
        );
        let rated = outcome.solved.site.rated_heat_rate_kj_per_kwh;
        assert!(
            (heat_rate / rated - 1.0).abs() < 2e-3,
            "{}: {heat_rate} kJ/kWh against {rated} kJ/kWh",
            c.candidate_id
        );
    }
}

/// The year table is the priced year, and today's single temperature bin
/// holds every run hour around the site's annual mean.
#[test]
fn the_year_and_the_temperature_bins_are_the_priced_year() {
    let loaded = demo();
    let model = model(&loaded);
    let study = match run_study(&loaded) {
        Ok(s) => s,
        Err(e) => panic!("the demo must solve: {e}"),
    };
    let conditions = brayfin::analysis::operation::conditions(&loaded.scenario);
    let run: f64 = conditions.iter().map(|c| c.hours).sum();
    let mean = conditions
        .iter()
        .map(|c| c.temperature_k * c.hours)
        .sum::<f64>()
        / run;
    for (c, outcome) in model
        .site_performance
        .candidates
        .iter()
        .zip(&study.outcomes)
    {
        let year = &outcome.solved.year;
        assert_eq!(c.energy_mwh, year.energy_mwh);
        assert_eq!(c.fuel_gj_lhv, year.fuel_energy_gj_lhv);
        assert_eq!(c.run_hours, year.operating_hours);
        // Starts are the scenario's `operation.starts_per_year`.
        assert_eq!(
            c.starts_per_year,
            Some(loaded.scenario.operation.starts_per_year)
        );
        let hours: f64 = c.hours_by_temperature.iter().map(|b| b.hours).sum();
        assert!((hours / year.operating_hours - 1.0).abs() < 1e-9);
        // 5 K bins whose hour-weighted mean centre is within half a bin of
        // the hour-weighted mean temperature of the year's conditions.
        assert!(c
            .hours_by_temperature
            .iter()
            .all(|b| (b.high_k - b.low_k - 5.0).abs() < 1e-9));
        let centre = c
            .hours_by_temperature
            .iter()
            .map(|b| (b.low_k + b.high_k) / 2.0 * b.hours)
            .sum::<f64>()
            / hours;
        assert!((centre - mean).abs() <= 2.5, "{centre} vs {mean}");
    }
}

/// The section as printed: heading, chart titles, each bid's year as the
/// model gives it, and the caution that these are screening estimates.
#[test]
fn the_pdf_prints_the_section_with_the_model_figures() {
    let model = model(&demo());
    let renderer = PdfRenderer {
        paper: Paper::A4,
        wording: match Wording::builtin() {
            Ok(w) => w,
            Err(e) => panic!("built-in templates load: {e}"),
        },
    };
    let bytes = match renderer.render(&model) {
        Ok(b) => b,
        Err(e) => panic!("the demo renders: {e}"),
    };
    let doc = match Document::load_mem(&bytes) {
        Ok(d) => d,
        Err(e) => panic!("lopdf reads the PDF: {e}"),
    };
    let pages: Vec<u32> = doc.get_pages().keys().copied().collect();
    let text = match doc.extract_text(&pages) {
        // Whitespace collapsed: a phrase may wrap across lines.
        Ok(t) => t
            .replace('\u{a0}', " ")
            .split_whitespace()
            .collect::<Vec<_>>()
            .join(" "),
        Err(e) => panic!("text extracts: {e}"),
    };
    for expected in [
        "Site performance",
        "Net output at base load against ambient temperature",
        "Net heat rate (LHV) at base load against ambient temperature",
        "Net heat rate (LHV) at the site against load",
        "A year at the site, as priced",
        "Run hours by ambient temperature",
        "not the vendor's guaranteed performance",
        "confirm them against the vendor's correction curves",
    ] {
        assert!(text.contains(expected), "missing {expected:?}");
    }
    for c in &model.site_performance.candidates {
        for figure in [
            format::number(c.energy_mwh, 0),
            format::number(c.fuel_gj_lhv, 0),
            format::number(c.run_hours, 0),
        ] {
            assert!(
                text.contains(&figure),
                "{}: {figure} not printed",
                c.candidate_id
            );
        }
    }
}
