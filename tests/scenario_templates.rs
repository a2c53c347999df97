//! The starter templates and demo scenarios load cleanly.

use brayfin::scenario;

fn load_ok(path: &str) -> scenario::LoadedScenario {
    match scenario::load(std::path::Path::new(path)) {
        Ok(loaded) => loaded,
        Err(error) => panic!("{path} does not load: {error}"),
    }
}

#[test]
fn bid_evaluation_template_loads() {
    let loaded = load_ok("templates/bid-evaluation.toml");
    let s = &loaded.scenario;
    assert_eq!(s.candidates.len(), 2);
    assert_eq!(s.meta.baseline, "standard");
    // 15 degC = 288.15 K (ISO 2314 reference ambient).
    assert!((s.site.ambient_temperature_k - 288.15).abs() < 1e-12);
    assert_eq!(s.operation.hours_per_year, 3000.0);
    assert_eq!(s.uncertainty.len(), 2);
}
