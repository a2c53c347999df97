//! The money follows each bid's fixed machine at the site's ambient
//! (`compare --format json` and the library study): hot days and altitude
//! cut output, the rating condition reproduces rated pricing, and without a
//! vendor part-load curve each machine's own part-load physics price the
//! dispatch.
//!
//! Sources, beside each check: the ISO 2533 standard atmosphere for the
//! ambient pressure at elevation (from memory); Walsh and Fletcher, *Gas
//! Turbine Performance*, for the non-dimensional similarity that makes
//! output scale with ambient pressure at unchanged heat rate; common
//! practice for the hot-day loss of output and efficiency.

use assert_cmd::Command;
use brayfin::analysis::compare::run_study;
use brayfin::analysis::operation::annual_operation_with_ratios;
use brayfin::analysis::site::Basis;
use brayfin::scenario::parse;
use serde_json::Value;

const DEMO: &str = "tests/fixtures/corvel-bay-blocks.toml";

fn demo_text() -> String {
    std::fs::read_to_string(DEMO).expect("the demo scenario is readable")
}

/// The demo with its site lines replaced by `site` (temperature and
/// elevation lines).
fn demo_at(site: &str) -> String {
    let text = demo_text();
    let from = "ambient_temperature = \"59 degF\"\nelevation = \"120 ft\"";
    assert!(text.contains(from), "the demo's site lines moved");
    text.replacen(from, site, 1)
}

/// `compare --format json` of `text`: (net output kW, heat rate kJ/kWh,
/// dispatch heat-rate ratio) per candidate, in scenario order.
fn compared(text: &str) -> Vec<(f64, f64, f64)> {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = dir.path().join("site.toml");
    std::fs::write(&path, text).expect("scenario written");
    let output = Command::cargo_bin("brayfin")
        .expect("binary builds")
        .args([
            "compare",
            path.to_str().expect("utf-8 path"),
            "--format",
            "json",
        ])
        .output()
        .expect("brayfin runs");
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    let v: Value = serde_json::from_slice(&output.stdout).expect("json");
    let num = |x: &Value| x.as_f64().expect("a number");
    v["candidates"]
        .as_array()
        .expect("candidates")
        .iter()
        .map(|c| {
            (
                num(&c["performance"]["net_output_kw"]),
                num(&c["performance"]["heat_rate_kj_per_kwh"]),
                num(&c["economics"]["dispatch_heat_rate_ratio"]),
            )
        })
        .collect()
}

/// A 35 °C site against a 15 °C site, both at sea level: every candidate
/// makes less and burns more per kWh. Common practice puts a heavy-duty
/// single-shaft machine at about −0.5 to −0.9 % output and +0.1 to +0.25 %
/// heat rate per K above 15 °C; the check takes a generous band around it
/// (−0.3 to −1.2 %/K output, heat rate rising), since a regenerated cycle
/// and the generic characteristic need not sit inside the narrow range.
#[test]
fn a_hot_site_gives_less_output_and_a_higher_heat_rate() {
    let mild = compared(&demo_at(
        "ambient_temperature = \"15 degC\"\nelevation = \"0 m\"",
    ));
    let hot = compared(&demo_at(
        "ambient_temperature = \"35 degC\"\nelevation = \"0 m\"",
    ));
    assert_eq!(mild.len(), 3);
    for (i, (m, h)) in mild.iter().zip(&hot).enumerate() {
        assert!(
            h.0 < m.0,
            "candidate {i}: output {} at 35 °C vs {} at 15 °C",
            h.0,
            m.0
        );
        assert!(h.1 > m.1, "candidate {i}: heat rate {} vs {}", h.1, m.1);
        let per_k = (h.0 / m.0 - 1.0) / 20.0 * 100.0;
        assert!(
            (-1.2..=-0.3).contains(&per_k),
            "candidate {i}: {per_k:.3} %/K output"
        );
    }
}

/// ISO 2533 standard atmosphere (from memory): p = 101.325 kPa ·
/// (1 − 2.25577e-5 · z/m)^5.25588 in the troposphere.
fn iso_2533_kpa(z_m: f64) -> f64 {
    101.325 * (1.0 - 2.25577e-5 * z_m).powf(5.25588)
}

/// 1 500 m against sea level at the same temperature: output scales with
/// ambient pressure and heat rate is unchanged, to 0.1 % (non-dimensional
/// similarity, Walsh and Fletcher; the tolerance).
#[test]
fn elevation_cuts_output_in_proportion_to_pressure() {
    let sea = compared(&demo_at(
        "ambient_temperature = \"15 degC\"\nelevation = \"0 m\"",
    ));
    let high = compared(&demo_at(
        "ambient_temperature = \"15 degC\"\nelevation = \"1500 m\"",
    ));
    let pressure_ratio = iso_2533_kpa(1500.0) / iso_2533_kpa(0.0);
    assert!((0.83..0.84).contains(&pressure_ratio), "{pressure_ratio}");
    for (i, (s, h)) in sea.iter().zip(&high).enumerate() {
        let output_ratio = h.0 / s.0;
        assert!(
            (output_ratio / pressure_ratio - 1.0).abs() < 1e-3,
            "candidate {i}: output ratio {output_ratio} vs pressure ratio {pressure_ratio}"
        );
        assert!(
            (h.1 / s.1 - 1.0).abs() < 1e-3,
            "candidate {i}: heat rate {} at 1500 m vs {} at sea level",
            h.1,
            s.1
        );
    }
}

/// The site at the rating condition (ISO 3977-2: 15 °C, 101.325 kPa, 60 %,
/// from memory; the demo's bids take the default rating) reproduces the
/// rated pricing: output = rated net output and heat rate = the design
/// solve's, each to 1e-6, and the year's fuel the same as pricing the
/// rated figures with each bid's part-load ratios (its vendor's curve where
/// it states one).
#[test]
fn the_rating_condition_reproduces_rated_pricing() {
    let text = demo_at("ambient_temperature = \"15 degC\"\nelevation = \"0 m\"");
    let loaded = parse(&text, "rating.toml").expect("the demo at the rating loads");
    let study = run_study(&loaded).expect("the study runs");
    let scenario = &loaded.scenario;
    for (candidate, outcome) in scenario.candidates.iter().zip(&study.outcomes) {
        let site = &outcome.solved.site;
        assert!(matches!(site.basis, Basis::Machine(_)), "{}", candidate.id);
        let rated_hr = outcome.solved.cycle.heat_rate_kj_per_kwh;
        assert!(
            (site.net_output_kw / candidate.net_output_kw - 1.0).abs() < 1e-6,
            "{}: {} vs {}",
            candidate.id,
            site.net_output_kw,
            candidate.net_output_kw
        );
        assert!(
            (site.heat_rate_kj_per_kwh / rated_hr - 1.0).abs() < 1e-6,
            "{}: {} vs {rated_hr}",
            candidate.id,
            site.heat_rate_kj_per_kwh
        );
        // The demo's dispatch is 100 %, 80 %, 60 %: Bid A's and Bid C's
        // vendor curves state those loads (1.045, 1.12; 1.015, 1.05 in the
        // file), Bid B's machine gives its own.
        // One condition per dispatch block at the rating ambient: each
        // block's heat rate over the site's base-load heat rate.
        let got: Vec<f64> = site
            .points
            .iter()
            .map(|p| p.heat_rate_kj_per_kwh / site.heat_rate_kj_per_kwh)
            .collect();
        assert_eq!(got.len(), 3, "{}", candidate.id);
        let ratios = match candidate.id.as_str() {
            "standard" => vec![1.0, 1.045, 1.12],
            "regenerated" => vec![1.0, 1.015, 1.05],
            _ => got.clone(),
        };
        for (got, want) in got.iter().zip(&ratios) {
            assert!(
                (got - want).abs() < 1e-12,
                "{}: {got} vs {want}",
                candidate.id
            );
        }
        let rated_year = annual_operation_with_ratios(
            &scenario.operation,
            candidate.net_output_kw,
            rated_hr,
            &ratios,
        );
        let year = &outcome.solved.year;
        assert!((year.energy_mwh / rated_year.energy_mwh - 1.0).abs() < 1e-6);
        assert!((year.fuel_energy_gj_lhv / rated_year.fuel_energy_gj_lhv - 1.0).abs() < 1e-6);
    }
}

/// The demo without its bids' vendor curves (`part_load` and
/// `ambient_correction` arrays on the candidates).
fn without_vendor_curves(text: &str) -> String {
    let mut out = String::new();
    let mut skipping = false;
    for line in text.lines() {
        let t = line.trim_start();
        if t.starts_with("part_load = [") || t.starts_with("ambient_correction = [") {
            skipping = true;
            continue;
        }
        if skipping {
            skipping = !t.starts_with(']');
            continue;
        }
        if t.starts_with("sources = {") {
            // Drop the curves' own sources with them: `, key = "…"`.
            let mut kept = line.to_string();
            for key in [", part_load = \"", ", ambient_correction = \""] {
                if let Some(start) = kept.find(key) {
                    let value = start + key.len();
                    let end = value + kept[value..].find('"').expect("a closing quote") + 1;
                    kept.replace_range(start..end, "");
                }
            }
            out.push_str(&kept);
            out.push('\n');
            continue;
        }
        out.push_str(line);
        out.push('\n');
    }
    out
}

/// Without vendor part-load curves each machine prices its own part load:
/// every dispatch-weighted heat-rate ratio is above 1, and the regenerated
/// bid's is below the simple cycles' (a regenerator recovers more heat as
/// the exhaust cools less at part load; Saravanamuttoo et al., *Gas
/// Turbine Theory*, off-design chapters, from memory).
#[test]
fn without_vendor_curves_each_machine_prices_its_own_part_load() {
    let without = without_vendor_curves(&demo_text());
    assert!(!without.contains("part_load"), "every curve removed");
    let ratios: Vec<f64> = compared(&without).iter().map(|c| c.2).collect();
    for r in &ratios {
        assert!(*r > 1.0 && *r < 1.5, "{ratios:?}");
    }
    assert!(ratios[2] < ratios[0] && ratios[2] < ratios[1], "{ratios:?}");
}

/// `check` says which source priced each bid: Bids A and B state a
/// part-load curve, Bid C both curves.
#[test]
fn check_says_what_priced_each_bid() {
    let assert = Command::cargo_bin("brayfin")
        .expect("binary builds")
        .args(["check", DEMO])
        .assert()
        .success();
    let out = String::from_utf8_lossy(&assert.get_output().stdout).to_string();
    for line in [
        "candidate[standard]: priced with base load at the site from its calibrated machine; \
         part load from the vendor's part_load curve",
        "candidate[premium]: priced with base load at the site from its calibrated machine; \
         part load from the vendor's part_load curve",
        "candidate[regenerated]: priced with base load at the site from the vendor's \
         ambient_correction (the site's pressure and humidity from its calibrated machine); \
         part load from the vendor's part_load curve",
    ] {
        assert!(out.contains(line), "{line}\n{out}");
    }
}

/// An intercooled bid, which the fixed-machine model does not cover, keeps
/// its rated output and its design-point heat rate at the site (exactly,
/// the same numbers as before the machine was priced), and `check` says so
/// in an information line; the other bids are still fixed machines.
#[test]
fn an_intercooled_bid_keeps_rated_pricing_with_a_note() {
    let text = demo_text();
    let from = "[candidate.costs]\nfixed_om = \"14.5 USD/kW-yr\"";
    assert!(text.contains(from), "the standard bid's costs moved");
    let with = text.replacen(
        from,
        &format!("[candidate.intercooler]\neffectiveness = \"85 %\"\n\n{from}"),
        1,
    );
    let loaded = parse(&with, "intercooled.toml").expect("the intercooled demo loads");
    let study = run_study(&loaded).expect("the study runs");
    let standard = &study.outcomes[0].solved;
    assert!(matches!(standard.site.basis, Basis::Rated(_)));
    assert_eq!(standard.site.net_output_kw, 50_000.0);
    assert_eq!(
        standard.site.heat_rate_kj_per_kwh,
        standard.cycle.heat_rate_kj_per_kwh
    );
    assert!(matches!(
        study.outcomes[1].solved.site.basis,
        Basis::Machine(_)
    ));
    let dir = tempfile::tempdir().expect("temp dir");
    let path = dir.path().join("intercooled.toml");
    std::fs::write(&path, with).expect("scenario written");
    Command::cargo_bin("brayfin")
        .expect("binary builds")
        .args(["check", path.to_str().expect("utf-8 path")])
        .assert()
        .success()
        .stdout(predicates::str::contains(
            "candidate[standard]: priced at its rated output (50000 kW)",
        ));
}

/// `sweep` and `risk` points follow the machine like `compare`: with the
/// site temperature and the fuel price varied together (a cache hit on
/// every price-only change, a full re-solve on every temperature change),
/// each point's heat rate equals the decimal study of the edited scenario
/// and its lifecycle cost is within a cent.
#[test]
fn points_follow_the_machine_like_the_study() {
    use brayfin::analysis::point::{Figures, PointModel};
    use brayfin::finance::Money;
    let loaded = parse(&demo_text(), "demo.toml").expect("the demo loads");
    let base = run_study(&loaded).expect("the study runs");
    let keys = vec![
        "site.ambient_temperature".to_string(),
        "fuel.price".to_string(),
    ];
    let model = PointModel::new(
        &loaded.scenario,
        base.fuel.clone(),
        base.baseline_index,
        keys.clone(),
        vec![true; 3],
    );
    let mut workspace = model.workspace();
    for values in [
        [288.15, 3.0],
        [288.15, 5.0],
        [308.15, 5.0],
        [308.15, 3.0],
        [288.15, 3.0],
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
            assert_eq!(
                f.heat_rate_kj_per_kwh, outcome.solved.site.heat_rate_kj_per_kwh,
                "{values:?}"
            );
            let lcc = outcome.ledger.summary.lifecycle_cost.to_f64();
            assert!(
                (f.lifecycle_cost - lcc).abs() <= 0.01,
                "{values:?}: {} vs {lcc}",
                f.lifecycle_cost
            );
        }
    }
}
