//! Stated component values brought to the polytropic basis the calibration
//! fits, so they can be compared with it.

mod datasheet_support;

use brayfin::cycle::{self, EfficiencyBasis, EngineConfig, GasModel};
use brayfin::datasheet::{assess, CalibrationOptions, ComponentData};
use brayfin::fuel::Fuel;
use datasheet_support::{config, datasheet_of, f_class};

/// Perfect gas (k = 1.4): the textbook relations between isentropic and
/// polytropic efficiency (Saravanamuttoo, Rogers, Cohen and Straznicky,
/// *Gas Turbine Theory*, polytropic efficiency), exact for a perfect gas:
/// compressor `η_s = (r^a − 1)/(r^(a/η_p) − 1)`, turbine
/// `η_s = (1 − r^(−a η_p))/(1 − r^(−a))`, a = (k − 1)/k. Tolerance 1e-9:
/// the conversion's root is found to 1e-10.
#[test]
fn isentropic_to_polytropic_matches_the_perfect_gas_relations() {
    for (r, eta_c, eta_t) in [(16.0, 0.86, 0.89), (8.0, 0.84, 0.90), (30.0, 0.88, 0.92)] {
        let mut engine = EngineConfig::ideal(r, 1500.0);
        engine.compressor_efficiency = eta_c;
        engine.turbine_efficiency = eta_t;
        let stated = ComponentData::from_engine(
            &engine,
            0.0,
            0.0,
            GasModel::cold_air_standard(),
            &Fuel::methane(),
        )
        .unwrap();
        let a: f64 = 0.4 / 1.4;
        let ln_r = f64::ln(r);
        let poly_c = a * ln_r / (1.0 + (r.powf(a) - 1.0) / eta_c).ln();
        let poly_t = -(1.0 - eta_t * (1.0 - r.powf(-a))).ln() / (a * ln_r);
        let got_c = stated.compressor_polytropic_efficiency.unwrap();
        let got_t = stated.turbine_polytropic_efficiency.unwrap();
        assert!((got_c - poly_c).abs() < 1e-9, "r {r}: {got_c} vs {poly_c}");
        assert!((got_t - poly_t).abs() < 1e-9, "r {r}: {got_t} vs {poly_t}");
        // Compressor polytropic above isentropic, turbine below (same
        // source).
        assert!(got_c > eta_c && got_t < eta_t);
    }
}

/// A candidate that states the very engine its rating came from, on the
/// isentropic basis: converted, its values agree with the fit, so nothing
/// is reported. The same engine with its compressor stated 3 points better
/// is reported, with both values.
#[test]
fn stated_isentropic_components_are_compared_on_the_fitted_basis() {
    let known = f_class();
    let sheet = datasheet_of(&known, &Fuel::methane(), true, false);
    let poly = config(&known);
    let detail = cycle::Detail {
        turbine_cooling: known.cooling,
        relative_humidity: known.rating.relative_humidity,
    };
    let target =
        cycle::solve_detailed(&poly, &detail, &GasModel::Products, &Fuel::methane()).unwrap();
    // The isentropic efficiencies of the same engine: compressor and
    // turbine works equal to the polytropic engine's.
    let work_at = |basis_c: f64, basis_t: f64| {
        let mut c = poly.clone();
        c.efficiency_basis = EfficiencyBasis::Isentropic;
        c.compressor_efficiency = basis_c;
        c.turbine_efficiency = basis_t;
        cycle::solve_detailed(&c, &detail, &GasModel::Products, &Fuel::methane()).unwrap()
    };
    let mut eta_c = 0.88;
    for _ in 0..60 {
        let w = work_at(eta_c, 0.9).compressor_work_kj_per_kg;
        eta_c *= w / target.compressor_work_kj_per_kg;
    }
    let mut eta_t = 0.9;
    for _ in 0..60 {
        let w = work_at(eta_c, eta_t).turbine_work_kj_per_kg;
        eta_t *= target.turbine_work_kj_per_kg / w;
    }
    let mut isentropic = poly.clone();
    isentropic.efficiency_basis = EfficiencyBasis::Isentropic;
    isentropic.compressor_efficiency = eta_c;
    isentropic.turbine_efficiency = eta_t;
    let options = CalibrationOptions::default();
    let stated = ComponentData::from_engine(
        &isentropic,
        known.cooling,
        known.rating.relative_humidity,
        GasModel::Products,
        &Fuel::methane(),
    )
    .unwrap();
    assert!(
        (stated.compressor_polytropic_efficiency.unwrap() - known.compressor_polytropic).abs()
            < 1e-6,
        "{stated:?}"
    );
    let a = assess(&sheet, &stated, &options).unwrap();
    assert!(a.disagreements.is_empty(), "{:?}", a.disagreements);

    isentropic.compressor_efficiency += 0.03;
    let better = ComponentData::from_engine(
        &isentropic,
        known.cooling,
        known.rating.relative_humidity,
        GasModel::Products,
        &Fuel::methane(),
    )
    .unwrap();
    let a = assess(&sheet, &better, &options).unwrap();
    let fields: Vec<&str> = a.disagreements.iter().map(|d| d.field).collect();
    assert!(
        fields.contains(&"compressor_polytropic_efficiency"),
        "{:?}",
        a.disagreements
    );
    let d = a
        .disagreements
        .iter()
        .find(|d| d.field == "compressor_polytropic_efficiency")
        .unwrap();
    assert!((d.implied - known.compressor_polytropic).abs() < 1e-4);
    assert!(d.stated > d.implied + 0.02);
}
