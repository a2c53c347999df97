//! Display formatting shared by every renderer: money with thousands
//! separators, unit conversions for display only ([`Quantity`] with
//! [`in_units`] and [`unit`]), percentages, payback in words.
//!
//! This is the one place where a quantity meets a unit system: a renderer
//! asks for a [`Quantity`] in [`Units`] and prints the number with the unit
//! this module names. Values arrive in SI (the library's units) and are
//! converted here, for display only.

use super::model::{FuelPriceUnit, PaybackView, Units};
use crate::units::{KJ_PER_BTU, KJ_PER_KG_PER_BTU_PER_LB};
use rust_decimal::Decimal;

/// Kilograms per pound (exact by definition of the international pound,
/// 1 lb = 0.453 592 37 kg).
const KG_PER_LB: f64 = 0.453_592_37;
/// Kilopascals per psi (NIST SP 811, 1 psi = 6.894 757 kPa).
const KPA_PER_PSI: f64 = 6.894_757;

/// `1234567.891` → `"1,234,568"` with `decimals` places (half away from zero).
pub fn grouped(value: Decimal, decimals: u32) -> String {
    let rounded = value.round_dp_with_strategy(
        decimals,
        rust_decimal::RoundingStrategy::MidpointAwayFromZero,
    );
    let negative = rounded.is_sign_negative() && !rounded.is_zero();
    let text = format!("{:.*}", decimals as usize, rounded.abs());
    let (whole, fraction) = match text.split_once('.') {
        Some((w, f)) => (w.to_string(), Some(f.to_string())),
        None => (text, None),
    };
    let mut out = String::new();
    for (i, ch) in whole.chars().enumerate() {
        if i > 0 && (whole.len() - i) % 3 == 0 {
            out.push(',');
        }
        out.push(ch);
    }
    if let Some(f) = fraction {
        out.push('.');
        out.push_str(&f);
    }
    if negative {
        format!("-{out}")
    } else {
        out
    }
}

/// Money in whole currency units with the code: `"USD 1,234,568"`.
pub fn money(value: Decimal, currency: &str) -> String {
    format!("{currency} {}", grouped(value, 0))
}

/// Optional money; an em-dash-free "n/a" when absent.
pub fn money_opt(value: Option<Decimal>, currency: &str) -> String {
    value.map_or_else(|| "n/a".to_string(), |v| money(v, currency))
}

/// A float with `decimals` places and thousands separators.
pub fn number(value: f64, decimals: u32) -> String {
    match Decimal::from_f64_retain(value) {
        Some(d) => grouped(d, decimals),
        None => format!("{value}"),
    }
}

/// Payback in words or fractional years.
pub fn payback(p: PaybackView) -> String {
    match p {
        PaybackView::Years(y) => format!("{y:.1} yr"),
        PaybackView::NeverWithinLife => "never within life".to_string(),
        PaybackView::NotApplicable => "n/a".to_string(),
    }
}

/// Heat rate in the display unit system, with its unit.
pub fn heat_rate(kj_per_kwh: f64, btu_per_kwh: f64, units: Units) -> String {
    match units {
        Units::Si => format!("{} kJ/kWh", number(kj_per_kwh, 0)),
        Units::Us => format!("{} Btu/kWh", number(btu_per_kwh, 0)),
    }
}

/// Temperature in the display unit system, with its unit.
pub fn temperature(kelvin: f64, units: Units) -> String {
    match units {
        Units::Si => format!("{kelvin:.1} K"),
        Units::Us => format!("{:.1} degF", kelvin * 1.8 - 459.67),
    }
}

/// Pressure in the display unit system, with its unit.
pub fn pressure(kpa: f64, units: Units) -> String {
    match units {
        Units::Si => format!("{kpa:.2} kPa"),
        Units::Us => format!("{:.2} psia", kpa / KPA_PER_PSI),
    }
}

/// Mass flow in the display unit system, with its unit.
pub fn mass_flow(kg_per_s: f64, units: Units) -> String {
    match units {
        Units::Si => format!("{kg_per_s:.2} kg/s"),
        Units::Us => format!("{:.2} lb/s", kg_per_s / KG_PER_LB),
    }
}

/// A fraction as a percentage: `0.3812` → `"38.12 %"`.
pub fn percent(fraction: f64, decimals: usize) -> String {
    format!("{:.*} %", decimals, fraction * 100.0)
}

/// The back-work ratio (compressor work over turbine work) in its one
/// printed form, a percentage with one decimal: `0.5310` → `"53.1 %"`.
pub fn back_work_ratio(ratio: f64) -> String {
    percent(ratio, 1)
}

/// kJ/(kg·K) per Btu/(lb·°R): 2.326 × 1.8 = 4.1868 exactly (the
/// International Table calorie definition; NIST SP 811, 2008, Appendix B.8,
/// "Btu_IT per pound degree Fahrenheit").
const KJ_PER_KG_K_PER_BTU_PER_LB_R: f64 = KJ_PER_KG_PER_BTU_PER_LB * 1.8;

/// Seconds per hour.
const S_PER_H: f64 = 3600.0;

/// kJ per MMBtu: 10^6 Btu_IT at [`KJ_PER_BTU`] kJ each (1.055056 GJ, the
/// trade's rounding; NIST SP 811, Appendix B.8).
const KJ_PER_MMBTU: f64 = KJ_PER_BTU * 1.0e6;

/// A physical quantity as printed. Each takes its SI value (the library's
/// unit, named in the variant) and has one SI and one US display unit.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Quantity {
    /// Temperature, K → °F.
    Temperature,
    /// Absolute pressure, kPa → psia.
    Pressure,
    /// Specific energy or work per kg of air, kJ/kg → Btu/lb.
    SpecificEnergy,
    /// Specific entropy, kJ/(kg·K) → Btu/(lb·°R).
    SpecificEntropy,
    /// Air or exhaust mass flow, kg/s → lb/s.
    MassFlow,
    /// Fuel mass flow, kg/s → lb/h (the trade quotes fuel by the hour).
    FuelMassFlow,
    /// Fuel energy flow (LHV heat input), kW → MW (SI) or MMBtu/h (US).
    FuelEnergyFlow,
    /// Heat rate, kJ/kWh → Btu/kWh.
    HeatRate,
    /// Electrical power, kW (the same in both systems).
    Power,
    /// Specific energy of a gas or a fuel (enthalpy, heating value),
    /// kJ/kg → Btu/lb.
    HeatingValue,
    /// Fuel energy over a period, GJ → MMBtu.
    FuelEnergy,
    /// Length, e.g. site elevation, m → ft.
    Length,
}

/// `si` (in the SI unit of `quantity`) in the display unit of `units`.
pub fn in_units(quantity: Quantity, si: f64, units: Units) -> f64 {
    match (quantity, units) {
        (Quantity::FuelEnergyFlow, Units::Si) => si / 1000.0,
        (_, Units::Si) | (Quantity::Power, _) => si,
        (Quantity::Temperature, Units::Us) => si * 1.8 - 459.67,
        (Quantity::Pressure, Units::Us) => si / crate::units::KPA_PER_PSI,
        (Quantity::SpecificEnergy | Quantity::HeatingValue, Units::Us) => {
            si / KJ_PER_KG_PER_BTU_PER_LB
        }
        (Quantity::SpecificEntropy, Units::Us) => si / KJ_PER_KG_K_PER_BTU_PER_LB_R,
        (Quantity::MassFlow, Units::Us) => si / KG_PER_LB,
        (Quantity::FuelMassFlow, Units::Us) => si / KG_PER_LB * S_PER_H,
        (Quantity::FuelEnergyFlow, Units::Us) => si * S_PER_H / KJ_PER_MMBTU,
        (Quantity::HeatRate, Units::Us) => si / KJ_PER_BTU,
        // GJ per MMBtu equals kJ per Btu.
        (Quantity::FuelEnergy, Units::Us) => si / KJ_PER_BTU,
        (Quantity::Length, Units::Us) => si / crate::units::M_PER_FT,
    }
}

/// The display unit of `quantity` in `units`.
pub fn unit(quantity: Quantity, units: Units) -> &'static str {
    match (quantity, units) {
        (Quantity::Temperature, Units::Si) => "K",
        (Quantity::Temperature, Units::Us) => "°F",
        (Quantity::Pressure, Units::Si) => "kPa",
        (Quantity::Pressure, Units::Us) => "psia",
        (Quantity::SpecificEnergy, Units::Si) => "kJ/kg air",
        (Quantity::SpecificEnergy, Units::Us) => "Btu/lb air",
        (Quantity::HeatingValue, Units::Si) => "kJ/kg",
        (Quantity::HeatingValue, Units::Us) => "Btu/lb",
        (Quantity::SpecificEntropy, Units::Si) => "kJ/(kg·K)",
        (Quantity::SpecificEntropy, Units::Us) => "Btu/(lb·°R)",
        (Quantity::MassFlow, Units::Si) | (Quantity::FuelMassFlow, Units::Si) => "kg/s",
        (Quantity::MassFlow, Units::Us) => "lb/s",
        (Quantity::FuelMassFlow, Units::Us) => "lb/h",
        (Quantity::FuelEnergyFlow, Units::Si) => "MW",
        (Quantity::FuelEnergyFlow, Units::Us) => "MMBtu/h",
        (Quantity::HeatRate, Units::Si) => "kJ/kWh",
        (Quantity::HeatRate, Units::Us) => "Btu/kWh",
        (Quantity::Power, _) => "kW",
        (Quantity::FuelEnergy, Units::Si) => "GJ",
        (Quantity::FuelEnergy, Units::Us) => "MMBtu",
        (Quantity::Length, Units::Si) => "m",
        (Quantity::Length, Units::Us) => "ft",
    }
}

/// `si` in `units` with `decimals` places and no unit (for a table cell
/// under a header that names the unit, or a CSV field).
pub fn value(quantity: Quantity, si: f64, units: Units, decimals: usize) -> String {
    format!("{:.*}", decimals, in_units(quantity, si, units))
}

/// `si` in `units` with `decimals` places and the unit: `"59.0 °F"`.
pub fn with_unit(quantity: Quantity, si: f64, units: Units, decimals: usize) -> String {
    format!(
        "{} {}",
        value(quantity, si, units, decimals),
        unit(quantity, units)
    )
}

/// A fuel price given per GJ, shown per GJ (SI) or per MMBtu (US), exact
/// decimal arithmetic (1 MMBtu = 1.055056 GJ), with the currency and the
/// heating-value basis: `"USD 3.85/MMBtu HHV"`.
pub fn fuel_price(per_gj: Decimal, currency: &str, basis: &str, units: Units) -> String {
    match units {
        Units::Si => format!("{currency} {}/GJ {basis}", per_gj.round_dp(4).normalize()),
        Units::Us => {
            let per_mmbtu = per_gj * Decimal::new(1_055_056, 6);
            format!(
                "{currency} {}/MMBtu {basis}",
                per_mmbtu.round_dp(4).normalize()
            )
        }
    }
}

/// A fuel price per GJ in `unit` (exact decimal: per GJ × GJ per unit);
/// unchanged if the product would overflow.
pub fn fuel_price_in(per_gj: Decimal, unit: &FuelPriceUnit) -> Decimal {
    per_gj.checked_mul(unit.gj_per_unit).unwrap_or(per_gj)
}

/// A fuel price given per GJ, shown in `unit` the way a scenario file
/// writes one, with the heating-value basis: `"4.62 USD/MMBtu HHV"`. Two
/// decimals, four below one currency unit (a price per therm or kWh);
/// an empty `basis` is left out.
pub fn fuel_price_as(per_gj: Decimal, currency: &str, basis: &str, unit: &FuelPriceUnit) -> String {
    let value = fuel_price_in(per_gj, unit);
    let decimals = if value.abs() < Decimal::ONE { 4 } else { 2 };
    let text = format!("{} {currency}/{}", grouped(value, decimals), unit.symbol);
    if basis.is_empty() {
        text
    } else {
        format!("{text} {basis}")
    }
}

/// The fuel price of a scenario as its file wrote it, with the basis, and
/// beside it in parentheses the same price in the unit `units` reads in
/// (per GJ for SI, per MMBtu for US) when that differs:
/// `"3.85 USD/MMBtu HHV (3.649 USD/GJ)"`. `written` is the file's text
/// (`None` for a price path: the per-GJ value is shown in `unit`).
pub fn fuel_price_echo(
    per_gj: Decimal,
    written: Option<&str>,
    currency: &str,
    basis: &str,
    unit: &FuelPriceUnit,
    units: Units,
) -> String {
    let first = match written {
        Some(text) => format!("{text} {basis}"),
        None => fuel_price_as(per_gj, currency, basis, unit),
    };
    let reader = match units {
        Units::Si => FuelPriceUnit::gj(),
        Units::Us => FuelPriceUnit::from_written("/MMBtu"),
    };
    if reader.symbol == unit.symbol {
        return first;
    }
    let value = fuel_price_in(per_gj, &reader).round_dp(4).normalize();
    format!("{first} ({value} {currency}/{})", reader.symbol)
}

/// The unit a scenario file wrote its fuel price in: that of `price`, else
/// that of the first year of `price_path` (per GJ for bare numbers).
pub fn scenario_price_unit(loaded: &crate::scenario::LoadedScenario) -> FuelPriceUnit {
    let written = loaded.scenario.fuel.price_written.as_ref().map_or_else(
        || {
            loaded
                .inputs
                .iter()
                .find(|line| line.key.starts_with("fuel.price_path"))
                .map_or("", |line| line.unit.as_str())
        },
        |w| w.unit.as_str(),
    );
    FuelPriceUnit::from_written(written)
}

/// A scenario's fuel price as its file wrote it (`"3.85 USD/MMBtu"`; a
/// bare number gets `currency` and `/GJ`); `None` for a price path.
pub fn scenario_price_written(fuel: &crate::scenario::FuelSpec, currency: &str) -> Option<String> {
    fuel.price_written.as_ref().map(|w| {
        if w.unit.is_empty() {
            format!("{} {currency}/GJ", w.number)
        } else {
            format!("{} {}", w.number, w.unit)
        }
    })
}

/// A value per kJ/kWh of heat rate as a value per unit of heat rate in
/// `units`: per kJ/kWh (SI) or per Btu/kWh (US; 1 Btu/kWh = 1.055056
/// kJ/kWh, NIST SP 811, Appendix B.8), exact decimal arithmetic.
pub fn per_heat_rate_unit(per_kj_per_kwh: Decimal, units: Units) -> Decimal {
    match units {
        Units::Si => per_kj_per_kwh,
        Units::Us => per_kj_per_kwh
            .checked_mul(Decimal::new(1_055_056, 6))
            .unwrap_or(per_kj_per_kwh),
    }
}

/// The name a unit system is echoed with in outputs (`"SI"`, `"US"`).
pub fn units_name(units: Units) -> &'static str {
    match units {
        Units::Si => "SI",
        Units::Us => "US customary",
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::str::FromStr;

    #[test]
    fn groups_thousands_and_keeps_sign() {
        let d = |s: &str| Decimal::from_str(s).unwrap_or_default();
        assert_eq!(grouped(d("1234567.891"), 0), "1,234,568");
        assert_eq!(grouped(d("-1234.5"), 0), "-1,235");
        assert_eq!(grouped(d("999.994"), 2), "999.99");
        assert_eq!(grouped(d("0.004"), 2), "0.00");
        assert_eq!(grouped(d("100"), 0), "100");
    }

    #[test]
    fn converts_display_units() {
        // 288.15 K = 59 degF exactly (definition of the Fahrenheit scale).
        assert_eq!(temperature(288.15, Units::Us), "59.0 degF");
        // 101.325 kPa = 14.696 psia (standard atmosphere, common practice).
        assert_eq!(pressure(101.325, Units::Us), "14.70 psia");
        assert_eq!(mass_flow(0.45359237, Units::Us), "1.00 lb/s");
    }

    #[test]
    fn converts_quantities_by_their_definitions() {
        let us = |q, si| in_units(q, si, Units::Us);
        // 2.326 kJ/kg = 1 Btu/lb and 4.1868 kJ/(kg·K) = 1 Btu/(lb·°R)
        // (NIST SP 811, 2008, Appendix B.8).
        assert!((us(Quantity::SpecificEnergy, 2.326) - 1.0).abs() < 1e-12);
        assert!((us(Quantity::SpecificEntropy, 4.1868) - 1.0).abs() < 1e-12);
        // 373.15 K = 212 °F (boiling point of water at 1 atm, definition
        // of the scale).
        assert!((us(Quantity::Temperature, 373.15) - 212.0).abs() < 1e-9);
        // 1 kg/s = 7936.64 lb/h (3600 / 0.45359237).
        assert!((us(Quantity::FuelMassFlow, 1.0) - 7936.641438).abs() < 1e-5);
        // 293.071 kW = 1 MMBtu/h (1.055056e6 kJ per 3600 s, common practice).
        assert!((us(Quantity::FuelEnergyFlow, 293.071_111) - 1.0).abs() < 1e-6);
        // 3412.14 Btu/kWh is 100 % efficiency: 3600 kJ/kWh / 1.055056.
        assert!((us(Quantity::HeatRate, 3600.0) - 3412.14).abs() < 0.01);
        assert_eq!(unit(Quantity::SpecificEntropy, Units::Us), "Btu/(lb·°R)");
        assert_eq!(
            with_unit(Quantity::FuelEnergyFlow, 1500.0, Units::Si, 2),
            "1.50 MW"
        );
    }

    #[test]
    fn fuel_price_per_mmbtu_is_exact() {
        // 3.649 USD/GJ × 1.055056 GJ/MMBtu = 3.8499 USD/MMBtu.
        let per_gj = Decimal::from_str("3.649").unwrap_or_default();
        assert_eq!(
            fuel_price(per_gj, "USD", "HHV", Units::Us),
            "USD 3.8499/MMBtu HHV"
        );
        assert_eq!(
            fuel_price(per_gj, "USD", "HHV", Units::Si),
            "USD 3.649/GJ HHV"
        );
    }

    #[test]
    fn fuel_price_is_echoed_in_the_written_unit() {
        // 3.85 USD/MMBtu ÷ 1.055056 GJ/MMBtu = 3.6491 USD/GJ (NIST SP 811,
        // Appendix B.8: 1 Btu_IT = 1.055056 kJ); back again it is 3.85.
        let mmbtu = FuelPriceUnit::from_written("USD/MMBtu");
        assert_eq!(mmbtu.gj_per_unit, Decimal::new(1_055_056, 6));
        let per_gj = Decimal::new(385, 2) / Decimal::new(1_055_056, 6);
        assert_eq!(
            fuel_price_as(per_gj, "USD", "HHV", &mmbtu),
            "3.85 USD/MMBtu HHV"
        );
        assert_eq!(
            fuel_price_echo(
                per_gj,
                Some("3.85 USD/MMBtu"),
                "USD",
                "HHV",
                &mmbtu,
                Units::Si
            ),
            "3.85 USD/MMBtu HHV (3.6491 USD/GJ)"
        );
        // The reader's own unit adds nothing beside it.
        assert_eq!(
            fuel_price_echo(
                per_gj,
                Some("3.85 USD/MMBtu"),
                "USD",
                "HHV",
                &mmbtu,
                Units::Us
            ),
            "3.85 USD/MMBtu HHV"
        );
        // 34 EUR/MWh = 9.4444 EUR/GJ (1 MWh = 3.6 GJ exactly).
        let mwh = FuelPriceUnit::from_written("EUR/MWh");
        let per_gj = Decimal::new(34, 0) / Decimal::new(36, 1);
        assert_eq!(
            fuel_price_as(per_gj, "EUR", "LHV", &mwh),
            "34.00 EUR/MWh LHV"
        );
        assert_eq!(
            fuel_price_echo(per_gj, Some("34 EUR/MWh"), "EUR", "LHV", &mwh, Units::Si),
            "34 EUR/MWh LHV (9.4444 EUR/GJ)"
        );
        // A bare number or an unknown unit reads per GJ.
        assert_eq!(FuelPriceUnit::from_written(""), FuelPriceUnit::gj());
        assert_eq!(FuelPriceUnit::from_written("USD/bbl"), FuelPriceUnit::gj());
    }

    #[test]
    fn back_work_ratio_is_a_percentage_with_one_decimal() {
        assert_eq!(back_work_ratio(0.5310), "53.1 %");
    }
}
