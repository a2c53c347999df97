//! A bid's vendor curves as priced (`analysis::vendor`), the retired
//! `[operation] part_load`, and the cross-check of curves against the
//! calibrated machine.
//!
//! The interpolation checks use a made-up "physics" (simple closed forms
//! chosen so every expected figure can be worked by hand; not a gas
//! turbine), so they test the rule, not the machine. The pricing check
//! works the fuel energy of the Corvel Bay demo's Bid A by hand from the
//! figures its file states.

use assert_cmd::Command;
use brayfin::analysis::compare::run_study;
use brayfin::analysis::vendor::{
    base_at, part_load_ratio, vendor_point, Figures, Source, VendorPoint,
};
use brayfin::offdesign::{Ambient, OffDesignError};
use brayfin::scenario::{parse, AmbientCorrectionSpec, Candidate, PartLoadPoint};

/// The Corvel Bay demo with dispatch blocks at its annual-mean ambient.
const DEMO: &str = "tests/fixtures/corvel-bay-blocks.toml";

fn demo_text() -> String {
    std::fs::read_to_string(DEMO).expect("the demo scenario is readable")
}

/// A bid of the demo with its curves replaced by the ones given.
fn bid(part_load: Vec<PartLoadPoint>, ambient: Vec<AmbientCorrectionSpec>) -> Candidate {
    let loaded = parse(&demo_text(), "demo.toml").expect("the demo loads");
    let mut c = loaded.scenario.candidates[1].clone();
    c.part_load = part_load;
    c.ambient_correction = ambient;
    c
}

fn pl(load_fraction: f64, heat_rate_ratio: f64) -> PartLoadPoint {
    PartLoadPoint {
        load_fraction,
        heat_rate_ratio,
    }
}

fn ac(temperature_k: f64, output_ratio: f64, heat_rate_ratio: f64) -> AmbientCorrectionSpec {
    AmbientCorrectionSpec {
        temperature_k,
        output_ratio,
        heat_rate_ratio,
    }
}

/// ISO 3977-2 rating ambient (15 °C, 101.325 kPa, 60 %; from memory), the
/// demo bids' default rating.
const RATING: Ambient = Ambient {
    temperature_k: 288.15,
    pressure_kpa: 101.325,
    relative_humidity: 0.6,
};

/// Made-up physics: output 50 000 kW × p/101.325 × (1 − 0.007 (T − 288.15)),
/// base heat rate 9 700 × (1 + 0.002 (T − 288.15)), part-load heat rate ×
/// (1 + 0.3 (1 − x)²).
fn physics(a: Ambient, load: f64) -> Result<Figures, OffDesignError> {
    let dt = a.temperature_k - 288.15;
    Ok(Figures {
        net_output_kw: 50_000.0 * a.pressure_kpa / 101.325 * (1.0 - 0.007 * dt) * load,
        heat_rate_kj_per_kwh: 9_700.0 * (1.0 + 0.002 * dt) * (1.0 + 0.3 * (1.0 - load).powi(2)),
    })
}

fn close(got: f64, want: f64, what: &str) {
    assert!(
        (got / want - 1.0).abs() < 1e-12,
        "{what}: {got} vs {want} by hand"
    );
}

fn curve() -> Vec<AmbientCorrectionSpec> {
    vec![
        ac(268.15, 1.15, 0.96),
        ac(288.15, 1.0, 1.0),
        ac(308.15, 0.84, 1.05),
    ]
}

/// Inside the curve at the rating's pressure and humidity: halfway from
/// 15 °C to 35 °C (298.15 K) the vendor's ratios are (1 + 0.84)/2 = 0.92
/// and (1 + 1.05)/2 = 1.025; on the rated 50 000 kW and 9 700 kJ/kWh that
/// is 46 000 kW and 9 942.5 kJ/kWh (by hand). The physics' own figures
/// there (46 500 kW) play no part.
#[test]
fn ambient_correction_interpolates_linearly_on_the_rated_figures() {
    let c = bid(vec![], curve());
    let at = Ambient {
        temperature_k: 298.15,
        ..RATING
    };
    let base = base_at(&c, at, &physics).expect("priced");
    close(base.net_output_kw, 46_000.0, "output");
    close(base.heat_rate_kj_per_kwh, 9_942.5, "heat rate");
}

/// The site's pressure is not on the curve (stated at the rating's): the
/// machine's step from 101.325 kPa to 90 kPa at the same temperature
/// scales output by 90/101.325 and leaves heat rate (by the made-up
/// physics, as by non-dimensional similarity): 46 000 × 90/101.325 kW.
#[test]
fn the_sites_pressure_comes_from_physics() {
    let c = bid(vec![], curve());
    let at = Ambient {
        temperature_k: 298.15,
        pressure_kpa: 90.0,
        ..RATING
    };
    let base = base_at(&c, at, &physics).expect("priced");
    close(base.net_output_kw, 46_000.0 * 90.0 / 101.325, "output");
    close(base.heat_rate_kj_per_kwh, 9_942.5, "heat rate");
}

/// Beyond the curve's hot end (45 °C against its 35 °C): the end ratios
/// carried on by the physics between 35 °C and 45 °C: output 50 000 ×
/// 0.84 × (1 − 0.21)/(1 − 0.14), heat rate 9 700 × 1.05 × 1.06/1.04.
#[test]
fn beyond_its_end_the_curve_is_carried_on_by_physics() {
    let c = bid(vec![], curve());
    let at = Ambient {
        temperature_k: 318.15,
        ..RATING
    };
    let base = base_at(&c, at, &physics).expect("priced");
    close(base.net_output_kw, 50_000.0 * 0.84 * 0.79 / 0.86, "output");
    close(
        base.heat_rate_kj_per_kwh,
        9_700.0 * 1.05 * 1.06 / 1.04,
        "heat rate",
    );
}

/// Part load: between (50 %, 1.2) and (80 %, 1.05) the ratio at 65 % is
/// 1.125; below the curve's lowest point (40 %) it is 1.2 × m(0.4)/m(0.5)
/// with m(x) = 1 + 0.3 (1 − x)² the physics' own ratio; without a curve
/// it is m(0.65) = 1.036 75 (all by hand).
#[test]
fn part_load_interpolates_in_load_and_falls_back_on_physics() {
    let c = bid(vec![pl(0.5, 1.2), pl(0.8, 1.05), pl(1.0, 1.0)], vec![]);
    close(
        part_load_ratio(&c, RATING, 0.65, &physics).expect("priced"),
        1.125,
        "inside",
    );
    close(
        part_load_ratio(&c, RATING, 0.4, &physics).expect("priced"),
        1.2 * 1.108 / 1.075,
        "below",
    );
    let none = bid(vec![], vec![]);
    close(
        part_load_ratio(&none, RATING, 0.65, &physics).expect("priced"),
        1.036_75,
        "physics",
    );
    assert_eq!(part_load_ratio(&c, RATING, 1.0, &physics).ok(), Some(1.0));
}

/// One curve given, the other factor from physics: a part-load curve alone
/// leaves base load to the physics at the ambient (at 298.15 K: 46 500 kW,
/// 9 894 kJ/kWh), and says which source priced what.
#[test]
fn with_one_curve_the_other_factor_is_the_machines() {
    let c = bid(vec![pl(0.5, 1.2), pl(1.0, 1.0)], vec![]);
    let at = Ambient {
        temperature_k: 298.15,
        ..RATING
    };
    let point: VendorPoint = vendor_point(&c, at, 0.75, &physics).expect("priced");
    close(point.base.net_output_kw, 46_500.0, "output");
    close(point.base.heat_rate_kj_per_kwh, 9_894.0, "heat rate");
    close(point.part_load_ratio, 1.1, "part load");
    assert_eq!(point.ambient_source, Source::Physics);
    assert_eq!(point.part_load_source, Source::Vendor);
}

/// The demo's Bid C at a 35 °C sea-level site (101.325 kPa by ISO 2533,
/// 60 % humidity: the rating's pressure and humidity) is priced by its
/// vendor's curves: base output 50 000 × 0.844 = 42 200 kW exactly, heat
/// rate HR_r × 1.065 with HR_r its machine's heat rate at the rating, and
/// each dispatch block on its part-load curve. Worked by hand for the
/// 80 % block (1 100 h): 0.8 × 42 200 kW × 1 100 h = 37 136 000 kWh, ×
/// HR_r × 1.065 × 1.015 kJ/kWh; the year adds 1 800 h at 100 % and 600 h
/// at 60 % (ratio 1.05) the same way.
#[test]
fn a_bid_with_curves_is_priced_by_them() {
    let text = demo_text().replacen(
        "ambient_temperature = \"59 degF\"\nelevation = \"120 ft\"",
        "ambient_temperature = \"35 degC\"\nelevation = \"0 m\"",
        1,
    );
    let loaded = parse(&text, "hot.toml").expect("the hot demo loads");
    let study = run_study(&loaded).expect("the study runs");
    let c = &study.outcomes[2].solved;
    let hr_r = c.site.rated_heat_rate_kj_per_kwh;
    close(c.site.net_output_kw, 42_200.0, "base output");
    close(c.site.heat_rate_kj_per_kwh, hr_r * 1.065, "base heat rate");
    let hr = hr_r * 1.065;
    let block_80_gj = 0.8 * 42_200.0 * 1_100.0 * hr * 1.015 / 1e6;
    close(
        block_80_gj,
        37_136_000.0 * hr * 1.015 / 1e6,
        "the 80 % block",
    );
    let year_gj =
        (42_200.0 * 1_800.0 * hr) / 1e6 + block_80_gj + (0.6 * 42_200.0 * 600.0 * hr * 1.05) / 1e6;
    assert!(
        (c.year.fuel_energy_gj_lhv / year_gj - 1.0).abs() < 1e-9,
        "{} GJ vs {year_gj} GJ by hand",
        c.year.fuel_energy_gj_lhv
    );
    // Bid B states no ambient correction: its machine prices its base
    // load (below the rated output on a hot day, by physics).
    let b = &study.outcomes[1].solved;
    assert!(b.site.net_output_kw < 50_000.0 * 0.9);
}

/// A file that still has `[operation] part_load` is refused (exit 1) at
/// the key, saying where the curve goes now.
#[test]
fn the_retired_operation_part_load_says_where_to_move_it() {
    let text = demo_text().replacen(
        "[operation]\n",
        "[operation]\npart_load = [{ load = \"80 %\", heat_rate_ratio = 1.05 }]\n",
        1,
    );
    let dir = tempfile::tempdir().expect("temp dir");
    let path = dir.path().join("old.toml");
    std::fs::write(&path, &text).expect("written");
    let line = text
        .lines()
        .position(|l| l.starts_with("part_load = [{ load = \"80 %\""))
        .expect("the line")
        + 1;
    Command::cargo_bin("brayfin")
        .expect("binary builds")
        .args(["check", path.to_str().expect("utf-8 path")])
        .assert()
        .code(1)
        .stderr(predicates::str::contains(format!(
            "old.toml:{line}:1: operation.part_load: is retired"
        )))
        .stderr(predicates::str::contains(
            "to `part_load = [...]` in the [[candidate]] table of each bid",
        ));
}

/// Bid A's vendor curve moved 0.08 off its machine at 60 % load (1.20
/// against about 1.119, above the 0.02 threshold) is a warning in `check`
/// and in `compare`'s JSON warnings naming the candidate, the curve and
/// the point; the demo as shipped has no curve warning.
#[test]
fn a_curve_point_off_the_machine_is_a_warning_naming_the_point() {
    let from = "{ load = \"60 %\", heat_rate_ratio = 1.12 }";
    let text = demo_text();
    assert!(text.contains(from), "Bid A's 60 % point moved");
    let edited = text.replacen(from, "{ load = \"60 %\", heat_rate_ratio = 1.20 }", 1);
    let dir = tempfile::tempdir().expect("temp dir");
    let path = dir.path().join("off.toml");
    std::fs::write(&path, &edited).expect("written");
    let path = path.to_str().expect("utf-8 path");
    let want =
        "candidate[standard].part_load at load 60.0 %: the vendor's heat_rate_ratio is 1.2000";
    Command::cargo_bin("brayfin")
        .expect("binary builds")
        .args(["check", path])
        .assert()
        .success()
        .stdout(predicates::str::contains(want));
    let out = Command::cargo_bin("brayfin")
        .expect("binary builds")
        .args(["compare", path, "--format", "json"])
        .output()
        .expect("brayfin runs");
    assert!(out.status.success());
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("json");
    let warnings: Vec<String> = v["warnings"]
        .as_array()
        .expect("warnings")
        .iter()
        .map(|w| w.as_str().map_or_else(|| w.to_string(), str::to_string))
        .collect();
    assert!(warnings.iter().any(|w| w.contains(want)), "{warnings:?}");
    let shipped = Command::cargo_bin("brayfin")
        .expect("binary builds")
        .args(["check", DEMO])
        .output()
        .expect("brayfin runs");
    let shipped = String::from_utf8_lossy(&shipped.stdout);
    assert!(!shipped.contains("cross-check threshold"), "{shipped}");
}

/// The report says how each bid is priced, in the appendix after "What
/// each bid implies": Bid C's curves and its machine fitted to its
/// datasheet, with the fit's values.
#[test]
fn the_report_says_how_each_bid_is_priced() {
    let dir = tempfile::tempdir().expect("temp dir");
    let pdf = dir.path().join("r.pdf");
    Command::cargo_bin("brayfin")
        .expect("binary builds")
        .args([
            "report",
            DEMO,
            "-o",
            pdf.to_str().expect("utf-8"),
            "--samples",
            "0",
        ])
        .assert()
        .success();
    let doc = lopdf::Document::load(&pdf).expect("a PDF");
    let pages: Vec<u32> = doc.get_pages().keys().copied().collect();
    let text = doc
        .extract_text(&pages)
        .expect("text")
        .replace('\u{a0}', " ")
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ");
    for want in [
        "How each bid is priced",
        "candidate[regenerated]: priced with base load at the site from the vendor's ambient_correction",
        "candidate[regenerated]: states no components; its machine is fitted to its datasheet",
    ] {
        assert!(text.contains(want), "{want}");
    }
}

/// A bid's ambient correction is relative to its rating temperature, so a
/// key path that moves that temperature is refused for a bid with one
/// (Bid C) and allowed for a bid without (Bid B).
#[test]
fn the_rating_temperature_of_a_bid_with_an_ambient_curve_is_not_varied() {
    let mut s = parse(&demo_text(), "demo.toml").expect("loads").scenario;
    let e = s
        .set_numeric("candidate[regenerated].rating.temperature", 298.15)
        .expect_err("refused")
        .to_string();
    assert!(e.contains("ambient_correction is stated relative"), "{e}");
    s.set_numeric("candidate[premium].rating.temperature", 298.15)
        .expect("allowed without a curve");
}
