//! Unit conversions against their published definitions (NIST SP 811, 2008,
//! Appendix B.8, "Factors for units listed alphabetically"; from memory).

use super::*;
use rust_decimal::Decimal;
use std::str::FromStr;

fn close(a: f64, b: f64, tol: f64) -> bool {
    (a - b).abs() <= tol * b.abs().max(1.0)
}

fn dec(text: &str) -> Decimal {
    Decimal::from_str(text).unwrap_or_default()
}

#[test]
fn temperatures_in_every_unit_agree_on_iso_ambient() {
    // 15 degC = 59 degF = 518.67 degR = 288.15 K (ISO 2314 reference ambient;
    // scale definitions NIST SP 811 4.2.1.1). Tolerance: one ulp-ish of 288.
    for text in [
        "288.15 K",
        "288.15",
        "15 degC",
        "15°C",
        "59 degF",
        "518.67 degR",
    ] {
        let t = temperature_k(text);
        assert!(
            matches!(t, Ok(v) if close(v, 288.15, 1e-12)),
            "{text}: {t:?}"
        );
    }
    assert!(matches!(temperature_k("-40 degF"), Ok(v) if close(v, 233.15, 1e-12)));
}

#[test]
fn temperature_below_absolute_zero_is_refused() {
    let error = temperature_k("-300 degC").err();
    assert!(matches!(
        error,
        Some(UnitError {
            problem: Problem::OutOfRange(_),
            ..
        })
    ));
    assert!(temperature_k("0 K").is_ok());
}

#[test]
fn pressure_wrong_kind_names_both_kinds() {
    let error = temperature_k("101 kPa").err().map(|e| e.to_string());
    assert_eq!(
        error.as_deref(),
        Some(
            "expected a temperature (K, degC, degF, degR; bare number = K) \
             but \"101 kPa\" is a pressure"
        )
    );
}

#[test]
fn pressures() {
    // 1 bar = 100 kPa; 1 psi = 6.894757 kPa (NIST SP 811 B.8).
    assert!(matches!(pressure_kpa("101.325 kPa"), Ok(v) if close(v, 101.325, 1e-15)));
    assert!(matches!(pressure_kpa("101325 Pa"), Ok(v) if close(v, 101.325, 1e-15)));
    assert!(matches!(pressure_kpa("1.01325 bar"), Ok(v) if close(v, 101.325, 1e-15)));
    assert!(matches!(pressure_kpa("14.695949 psia"), Ok(v) if close(v, 101.325, 1e-7)));
    assert!(matches!(pressure_kpa("0.101325 MPa"), Ok(v) if close(v, 101.325, 1e-15)));
    assert!(matches!(pressure_kpa("101.325"), Ok(v) if v == 101.325));
    assert!(pressure_kpa("-5 kPa").is_err());
    assert!(matches!(
        pressure_kpa("15 psig").err().map(|e| e.problem),
        Some(Problem::UnknownUnit(u)) if u == "psig"
    ));
}

#[test]
fn powers_fractions_numbers() {
    assert!(matches!(power_kw("42.5 MW"), Ok(v) if close(v, 42_500.0, 1e-15)));
    assert!(matches!(power_kw("500 W"), Ok(v) if close(v, 0.5, 1e-15)));
    assert!(matches!(power_kw("1200"), Ok(v) if v == 1200.0));
    assert!(matches!(fraction("86 %"), Ok(v) if close(v, 0.86, 1e-15)));
    assert!(matches!(fraction("86%"), Ok(v) if close(v, 0.86, 1e-15)));
    assert!(matches!(fraction("0.86"), Ok(v) if v == 0.86));
    assert!(matches!(number("12.5"), Ok(v) if v == 12.5));
    assert!(matches!(
        number("12 %").err().map(|e| e.problem),
        Some(Problem::WrongKind(Kind::Fraction))
    ));
    assert!(matches!(
        fraction("12 MW").err().map(|e| e.problem),
        Some(Problem::WrongKind(Kind::Power))
    ));
}

#[test]
fn heat_rates_and_heating_values() {
    // 9500 Btu/kWh × 1.055056 kJ/Btu = 10 023.032 kJ/kWh.
    assert!(matches!(heat_rate_kj_per_kwh("9500 Btu/kWh"), Ok(v) if close(v, 10_023.032, 1e-12)));
    assert!(matches!(heat_rate_kj_per_kwh("10000"), Ok(v) if v == 10_000.0));
    // Methane LHV 50.0 MJ/kg = 21 496 Btu/lb at 2.326 kJ/kg per Btu/lb
    // (NIST SP 811 B.8 defines Btu_IT/lb = 2.326 kJ/kg exactly).
    assert!(matches!(specific_energy_kj_per_kg("50 MJ/kg"), Ok(v) if close(v, 50_000.0, 1e-15)));
    assert!(
        matches!(specific_energy_kj_per_kg("21496 Btu/lb"), Ok(v) if close(v, 49_999.696, 1e-12))
    );
    assert!(matches!(
        heat_rate_kj_per_kwh("50 MJ/kg").err().map(|e| e.problem),
        Some(Problem::WrongKind(Kind::SpecificEnergy))
    ));
}

#[test]
fn lengths() {
    assert!(matches!(length_m("1000 ft"), Ok(v) if close(v, 304.8, 1e-15)));
    assert!(matches!(length_m("250"), Ok(v) if v == 250.0));
}

#[test]
fn junk_is_not_a_number_and_never_panics() {
    for text in [
        "",
        "   ",
        "K",
        "inf",
        "NaN",
        "nan K",
        "--5",
        "1e999999 K",
        "½ K",
        "🔥",
    ] {
        let _ = temperature_k(text);
        let _ = money(text);
        let _ = price_per_gj(text);
        let _ = kind_of(text);
    }
    assert!(matches!(
        temperature_k("hot").err().map(|e| e.problem),
        Some(Problem::NotANumber)
    ));
    assert!(matches!(
        temperature_k("1e999999 K").err().map(|e| e.problem),
        Some(Problem::OutOfRange(_))
    ));
}

#[test]
fn kind_of_names_units_of_every_kind() {
    assert_eq!(kind_of("101 kPa"), Some(Kind::Pressure));
    assert_eq!(kind_of("15 degC"), Some(Kind::Temperature));
    assert_eq!(kind_of("86 %"), Some(Kind::Fraction));
    assert_eq!(kind_of("4.2 USD/MMBtu"), Some(Kind::FuelPrice));
    assert_eq!(kind_of("45 USD/t"), Some(Kind::PricePerTonne));
    assert_eq!(kind_of("12 USD/kW-yr"), Some(Kind::PricePerCapacity));
    assert_eq!(kind_of("100 USD"), Some(Kind::Money));
    assert_eq!(kind_of("100"), None);
    assert_eq!(kind_of("100 furlongs"), None);
}

#[test]
fn money_is_exact_decimal() {
    // 0.1 + 0.2 style amounts must stay exact: no f64 in the path.
    let v = money("48_500_000.10 USD");
    assert_eq!(
        v,
        Ok(MoneyValue {
            amount: dec("48500000.10"),
            currency: Some("USD".into())
        })
    );
    assert_eq!(money("17").map(|m| m.currency), Ok(None));
    assert_eq!(money("1.5e6 EUR").map(|m| m.amount), Ok(dec("1500000")));
    assert!(matches!(
        money("100 usd").err().map(|e| e.problem),
        Some(Problem::UnknownUnit(_))
    ));
}

#[test]
fn fuel_price_per_mmbtu_divides_by_1_055056_exactly() {
    // 1 MMBtu = 1.055056 GJ (KJ_PER_BTU; NIST SP 811 B.8, rounded as quoted).
    let per_gj = price_per_gj("4.20 USD/MMBtu").map(|m| m.amount);
    assert_eq!(per_gj, Ok(dec("4.20") / dec("1.055056")));
    // Round trip in Decimal: back to 4.20 to 26 decimal places.
    let back = per_gj.map(|p| (p * dec("1.055056")).round_dp(20));
    assert_eq!(back, Ok(dec("4.20")));
    assert_eq!(
        price_per_gj("3.98 USD/GJ").map(|m| m.amount),
        Ok(dec("3.98"))
    );
    assert_eq!(price_per_gj("36 EUR/MWh").map(|m| m.amount), Ok(dec("10")));
    assert_eq!(price_per_gj("0.004 USD/MJ").map(|m| m.amount), Ok(dec("4")));
    assert!(matches!(
        price_per_gj("45 USD/t").err().map(|e| e.problem),
        Some(Problem::WrongKind(Kind::PricePerTonne))
    ));
    assert!(matches!(
        price_per_gj("4.2 USD").err().map(|e| e.problem),
        Some(Problem::WrongKind(Kind::Money))
    ));
}

#[test]
fn other_prices() {
    assert_eq!(price_per_tonne("45 USD/t").map(|m| m.amount), Ok(dec("45")));
    assert_eq!(
        price_per_tonne("0.045 USD/kg").map(|m| m.amount),
        Ok(dec("45"))
    );
    assert_eq!(
        price_per_mwh("0.0045 USD/kWh").map(|m| m.amount),
        Ok(dec("4.5"))
    );
    assert_eq!(
        price_per_kw_year("12000 USD/MW-yr").map(|m| m.amount),
        Ok(dec("12"))
    );
    let error = price_per_tonne("12 K").err().map(|e| e.to_string());
    assert_eq!(
        error.as_deref(),
        Some("expected a price per tonne (CUR/t, CUR/tCO2, CUR/kg, e.g. 45 USD/t) but \"12 K\" is a temperature")
    );
}

#[test]
fn durations_and_emission_factors() {
    assert!(matches!(duration_h("24000 h"), Ok(v) if v == 24_000.0));
    // IPCC 2006 Vol. 2 Ch. 2 Table 2.2: natural gas 56 100 kg CO2/TJ (NCV)
    // is 56.1 kg/GJ.
    assert!(matches!(emission_factor_kg_per_gj("56100 kg/TJ"), Ok(v) if close(v, 56.1, 1e-14)));
    // 117.0 lb/MMBtu (a commonly quoted natural-gas factor, from memory)
    // = 117.0 × 0.45359237 / 1.055056 = 50.3011... kg/GJ.
    assert!(matches!(
        emission_factor_kg_per_gj("117 lb/MMBtu"),
        Ok(v) if close(v, 117.0 * 0.453_592_37 / 1.055_056, 1e-14)
    ));
    assert!(matches!(
        duration_h("3 MW").err().map(|e| e.problem),
        Some(Problem::WrongKind(Kind::Power))
    ));
}

#[test]
fn fuel_energy_in_gj_from_each_unit() {
    // 1 MMBtu = 1.055056 GJ (KJ_PER_BTU; NIST SP 811 B.8, rounded as
    // quoted); 1 therm = 10^5 Btu; 1 MWh = 3.6 GJ and 1 MJ = 0.001 GJ (SI).
    let close = |text: &str, gj: f64| {
        let value = fuel_energy_gj(text).expect(text);
        assert!((value - gj).abs() <= 1e-12 * gj.max(1.0), "{text}: {value}");
    };
    close("110 GJ", 110.0);
    close("110", 110.0);
    close("2500 MJ", 2.5);
    close("100 MMBtu", 105.5056);
    close("1000 therm", 105.5056);
    close("10 MWh", 36.0);
    assert!(matches!(
        fuel_energy_gj("-5 GJ").err().map(|e| e.problem),
        Some(Problem::OutOfRange(_))
    ));
    assert!(matches!(
        fuel_energy_gj("5 kg/s").err().map(|e| e.problem),
        Some(Problem::WrongKind(Kind::MassFlow))
    ));
}
