//! Fuel properties against published values, and fuel input errors.

use brayfin::cycle::{solve, CycleError, EngineConfig, GasModel};
use brayfin::fuel::{Fuel, FuelError};

fn within(got: f64, expected: f64, relative: f64, what: &str) {
    assert!(
        ((got - expected) / expected).abs() <= relative,
        "{what}: got {got}, published {expected}, off by {:.4} %",
        (got - expected) / expected * 100.0
    );
}

/// Methane: HHV 55.5 MJ/kg and LHV 50.0 MJ/kg (NIST Chemistry WebBook,
/// standard enthalpy of combustion of methane gas ΔcH° ≈ −890 kJ/mol; LHV
/// after the latent heat of the two moles of water formed).
/// Tolerance 0.2 %: the published figures are rounded to three significant
/// figures (±0.1 %), and enthalpy-of-formation compilations for methane
/// differ by about 0.3 kJ/mol (0.03 %).
#[test]
fn methane_heating_values_match_nist() {
    let ch4 = Fuel::methane();
    within(ch4.hhv_kj_per_kg(), 55_500.0, 2e-3, "methane HHV");
    within(ch4.lhv_kj_per_kg(), 50_000.0, 2e-3, "methane LHV");
    // HHV/LHV ≈ 1.11 (common practice for methane-rich gas), ±0.5 %.
    within(ch4.hhv_over_lhv(), 1.11, 5e-3, "methane HHV/LHV");
}

/// Hydrogen: LHV 120.0 MJ/kg and HHV 141.8 MJ/kg (from memory; NIST
/// WebBook ΔfH° of water vapour −241.8 kJ/mol and of liquid water
/// −285.8 kJ/mol over 2.016 g/mol). Tolerance 0.1 %.
#[test]
fn hydrogen_heating_values() {
    let h2 = Fuel::parse("H2=1").unwrap();
    within(h2.lhv_kj_per_kg(), 120_000.0, 1e-3, "hydrogen LHV");
    within(h2.hhv_kj_per_kg(), 141_800.0, 1e-3, "hydrogen HHV");
}

/// Methane per standard cubic metre: HHV 37.71 MJ/m³ and LHV 33.95 MJ/m³
/// (ISO 6976, ideal-gas calorific values at 15 °C metering and 15 °C
/// combustion; from memory). Tolerance 0.3 %: brayfin's combustion reference
/// is 25 °C (≈ 0.1 % lower HHV) and it uses no compression factor.
#[test]
fn methane_per_standard_cubic_metre() {
    let ch4 = Fuel::methane();
    within(
        ch4.hhv_mj_per_sm3().unwrap(),
        37.71,
        3e-3,
        "methane HHV per m³",
    );
    within(
        ch4.lhv_mj_per_sm3().unwrap(),
        33.95,
        3e-3,
        "methane LHV per m³",
    );
}

/// Stoichiometric air–fuel ratio of methane 17.2 by mass (common practice).
/// Tolerance 0.5 %: the figure depends on the air composition assumed.
#[test]
fn methane_stoichiometric_air_fuel_ratio() {
    within(
        Fuel::methane().stoichiometric_air_fuel_ratio().unwrap(),
        17.2,
        5e-3,
        "methane AFR",
    );
}

/// Pure methane ≈ 54.8 kg CO2 per GJ (LHV) by stoichiometry (REFERENCES,
/// "Fuel"). Tolerance 0.2 % (rounding of the published figure).
#[test]
fn methane_co2_factor_by_stoichiometry() {
    let ch4 = Fuel::methane();
    within(ch4.co2_kg_per_gj_lhv(), 54.8, 2e-3, "methane CO2/GJ LHV");
    within(
        ch4.co2_kg_per_gj_hhv(),
        ch4.co2_kg_per_gj_lhv() / ch4.hhv_over_lhv(),
        1e-12,
        "HHV basis",
    );
}

/// Natural gas default CO2 emission factor 56 100 kg/TJ on a net calorific
/// value basis, 95 % interval 54 300–58 300 kg/TJ (IPCC 2006 Guidelines,
/// Vol. 2, Ch. 2, Table 2.2; interval from memory). A typical pipeline gas
/// must fall inside the interval and within 2.5 % of the default: the default
/// is an average over gases of varying composition, and the interval spans
/// −3.2 %/+3.9 %.
#[test]
fn pipeline_gas_co2_factor_against_ipcc_default() {
    let gas = Fuel::parse("CH4=0.93,C2H6=0.035,C3H8=0.01,C4H10=0.005,N2=0.01,CO2=0.01").unwrap();
    let factor = gas.co2_kg_per_gj_lhv();
    assert!(
        (54.3..=58.3).contains(&factor),
        "{factor} outside the IPCC interval"
    );
    within(factor, 56.1, 0.025, "pipeline gas CO2/GJ LHV");
}

#[test]
fn composition_errors_are_named() {
    let err = Fuel::parse("CH4=0.9,C2H6=0.05").unwrap_err();
    assert!(matches!(err, FuelError::FractionsDoNotSumToOne(_)));
    assert!(err.to_string().contains("sum to 1 within 1e-6"), "{err}");

    let err = Fuel::parse("CH4=0.9,XE=0.1").unwrap_err();
    assert_eq!(err, FuelError::UnknownSpecies("XE".into()));
    assert!(err.to_string().contains("CH4, C2H6"), "{err}");

    assert!(matches!(
        Fuel::parse("CH4=1.1,N2=-0.1").unwrap_err(),
        FuelError::InvalidFraction { .. }
    ));
    assert!(matches!(
        Fuel::parse("CH4=0.5,CH4=0.5").unwrap_err(),
        FuelError::DuplicateSpecies(_)
    ));
    assert!(matches!(
        Fuel::parse("C4H10=0.5,nC4H10=0.5").unwrap_err(),
        FuelError::DuplicateSpecies(_)
    ));
    assert_eq!(
        Fuel::parse("N2=0.5,CO2=0.5").unwrap_err(),
        FuelError::NotCombustible
    );
    assert!(matches!(
        Fuel::parse("propane").unwrap_err(),
        FuelError::Syntax { .. }
    ));
    assert!(matches!(
        Fuel::parse("CH4=abc").unwrap_err(),
        FuelError::Syntax { .. }
    ));
    assert!(Fuel::parse(" Methane ").is_ok());
    // Within 1e-6 of 1 is accepted and normalised.
    let fuel = Fuel::parse("CH4=0.9999995").unwrap();
    let sum: f64 = fuel
        .composition()
        .unwrap()
        .iter()
        .map(|c| c.mole_fraction)
        .sum();
    assert!((sum - 1.0).abs() < 1e-15);
}

#[test]
fn heating_value_fuel_is_not_modelled() {
    let fuel = Fuel::from_heating_values(42_700.0, 45_600.0, 74.1).unwrap();
    assert!(!fuel.is_modelled());
    assert!(fuel.stoichiometric_air_fuel_ratio().is_none());
    within(
        fuel.co2_kg_per_gj_hhv(),
        74.1 * 42_700.0 / 45_600.0,
        1e-12,
        "HHV basis",
    );
    let cfg = EngineConfig::ideal(10.0, 1400.0);
    assert!(solve(&cfg, &GasModel::Air, &fuel).is_ok());
    let err = solve(&cfg, &GasModel::Products, &fuel).unwrap_err();
    assert_eq!(err, CycleError::FuelNotModelled);
    assert_eq!(err.field(), Some("gas_model"));

    assert!(Fuel::from_heating_values(-1.0, 45_600.0, 74.1).is_err());
    assert!(Fuel::from_heating_values(42_700.0, 40_000.0, 74.1).is_err());
    assert!(Fuel::from_heating_values(42_700.0, 45_600.0, f64::NAN).is_err());
}
