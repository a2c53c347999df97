//! Display formatting shared by the text renderers: money with thousands
//! separators, unit conversions for display only, payback in words.

use super::model::{PaybackView, Units};
use rust_decimal::Decimal;

/// Pounds per kilogram (exact by definition of the international pound,
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
}
