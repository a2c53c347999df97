//! Water vapour in air: saturation pressure over water and over ice, and
//! the composition of humid air.
//!
//! - Over liquid water (273.15 K to 647.096 K): the saturation-pressure
//!   equation of IAPWS-IF97, region 4 (IAPWS, *Revised Release on the IAPWS
//!   Industrial Formulation 1997 for the Thermodynamic Properties of Water
//!   and Steam*, eq. 30).
//! - Over ice (below 273.16 K): the sublimation-pressure equation of IAPWS
//!   (*Revised Release on the Pressure along the Melting and Sublimation
//!   Curves of Ordinary Water Substance*, 2011, eq. 6).
//!
//! Relative humidity is taken against the saturation pressure over water
//! at and above 273.15 K and over ice below it (a stated choice; weather
//! records below freezing usually quote it over water, which gives up to
//! about 10 % more vapour at −10 °C, a negligible amount of water there).

use super::mixture::{Mixture, DRY_AIR};
use super::species::{AR, CO2, H2O, N2, O2};
use super::ThermoError;

/// IAPWS-IF97 region-4 coefficients n1 … n10 (IF97 Table 34).
const IF97_N: [f64; 10] = [
    0.116_705_214_527_67e4,
    -0.724_213_167_032_06e6,
    -0.170_738_469_400_92e2,
    0.120_208_247_024_70e5,
    -0.323_255_503_223_33e7,
    0.149_151_086_135_30e2,
    -0.482_326_573_615_91e4,
    0.405_113_405_420_57e6,
    -0.238_555_575_678_49,
    0.650_175_348_447_98e3,
];

/// Triple-point temperature, K, and pressure, kPa (IAPWS 2011).
const TRIPLE_POINT_K: f64 = 273.16;
const TRIPLE_POINT_KPA: f64 = 0.611_657;

/// IAPWS 2011 sublimation coefficients a1 … a3 and exponents b1 … b3.
const SUBLIMATION_A: [f64; 3] = [-0.212_144_006e2, 0.273_203_819e2, -0.610_598_130e1];
const SUBLIMATION_B: [f64; 3] = [0.333_333_333e-2, 0.120_666_667e1, 0.170_333_333e1];

/// Lowest temperature the sublimation equation is used at, K (its stated
/// range starts at 50 K; the property data start at 200 K).
const LOWEST_K: f64 = 200.0;
/// Critical temperature, K: the end of the saturation line (IF97).
const CRITICAL_K: f64 = 647.096;

/// Saturation pressure of water vapour over water (at or above 273.15 K)
/// or over ice (below), kPa. Errors outside 200 K to 647.096 K.
pub fn saturation_pressure_kpa(temperature_k: f64) -> Result<f64, ThermoError> {
    let t = temperature_k;
    if !(LOWEST_K..=CRITICAL_K).contains(&t) {
        return Err(ThermoError::TemperatureOutOfRange {
            temperature_k: t,
            low_k: LOWEST_K,
            high_k: CRITICAL_K,
        });
    }
    if t >= 273.15 {
        let n = &IF97_N;
        let theta = t + n[8] / (t - n[9]);
        let a = theta * theta + n[0] * theta + n[1];
        let b = n[2] * theta * theta + n[3] * theta + n[4];
        let c = n[5] * theta * theta + n[6] * theta + n[7];
        let ratio = 2.0 * c / (-b + (b * b - 4.0 * a * c).sqrt());
        // IF97 gives MPa.
        Ok(ratio.powi(4) * 1e3)
    } else {
        let theta = t / TRIPLE_POINT_K;
        let sum: f64 = SUBLIMATION_A
            .iter()
            .zip(SUBLIMATION_B)
            .map(|(a, b)| a * theta.powf(b))
            .sum();
        Ok(TRIPLE_POINT_KPA * (sum / theta).exp())
    }
}

/// Humid air at `temperature_k`, `pressure_kpa` and relative humidity
/// `relative_humidity` (0 to 1): the mixture and its mole fractions of
/// N2, O2, Ar, CO2, H2O. The vapour mole fraction is
/// `x_w = φ p_sat(T) / p` (ideal gas; the enhancement factor, about 1.004
/// near ambient, is left out), and the dry part has the [`DRY_AIR`]
/// composition.
pub fn humid_air(
    temperature_k: f64,
    pressure_kpa: f64,
    relative_humidity: f64,
) -> Result<(Mixture, [f64; 5]), ThermoError> {
    if !(0.0..=1.0).contains(&relative_humidity) {
        return Err(ThermoError::Composition(format!(
            "relative humidity {relative_humidity} is above saturation or below 0; expected 0 to 1"
        )));
    }
    let vapour = relative_humidity * saturation_pressure_kpa(temperature_k)? / pressure_kpa;
    if !(0.0..1.0).contains(&vapour) {
        return Err(ThermoError::Composition(format!(
            "water vapour would be {:.1} % of the air at {pressure_kpa} kPa; expected a lower humidity or a higher pressure",
            vapour * 100.0
        )));
    }
    let dry = 1.0 - vapour;
    let fraction = |name: &str| {
        DRY_AIR
            .iter()
            .find(|(s, _)| s.name == name)
            .map_or(0.0, |(_, x)| dry * x)
    };
    let fractions = [
        fraction(N2.name),
        fraction(O2.name),
        fraction(AR.name),
        fraction(CO2.name),
        vapour,
    ];
    let mixture = Mixture::from_moles(&[
        (&N2, fractions[0]),
        (&O2, fractions[1]),
        (&AR, fractions[2]),
        (&CO2, fractions[3]),
        (&H2O, fractions[4]),
    ])?;
    Ok((mixture, fractions))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// IAPWS-IF97 computer-program verification values for the saturation
    /// pressure equation (IF97 Table 35): 300 K → 3.536 589 41e-3 MPa,
    /// 500 K → 2.638 897 76 MPa, 600 K → 12.344 314 6 MPa (from memory of
    /// the table; 9 significant figures are given there, we check 1e-8).
    #[test]
    fn if97_region4_verification_values() {
        for (t, p_mpa) in [
            (300.0, 0.353_658_941e-2),
            (500.0, 0.263_889_776e1),
            (600.0, 0.123_443_146e2),
        ] {
            let p = saturation_pressure_kpa(t).unwrap() / 1e3;
            assert!((p / p_mpa - 1.0).abs() < 1e-8, "{t} K: {p} MPa vs {p_mpa}");
        }
    }

    /// IAPWS 2011 sublimation-pressure check value: 230 K → 8.947 352 74e-6
    /// MPa (from memory of the release's table of check values).
    #[test]
    fn sublimation_check_value() {
        let p = saturation_pressure_kpa(230.0).unwrap() / 1e3;
        assert!((p / 8.947_352_74e-6 - 1.0).abs() < 1e-7, "{p} MPa");
    }

    /// Steam-table values near ambient (IAPWS-95 saturation table, e.g. as
    /// printed in engineering thermodynamics texts): 0.01 °C → 0.611 66 kPa,
    /// 15 °C → 1.7058 kPa, 25 °C → 3.1699 kPa, 40 °C → 7.3849 kPa, to 0.05 %.
    #[test]
    fn ambient_steam_table_values() {
        for (t_c, p_kpa) in [
            (0.01, 0.61166),
            (15.0, 1.7058),
            (25.0, 3.1699),
            (40.0, 7.3849),
        ] {
            let p = saturation_pressure_kpa(273.15 + t_c).unwrap();
            assert!(
                (p / p_kpa - 1.0).abs() < 5e-4,
                "{t_c} °C: {p} kPa vs {p_kpa}"
            );
        }
    }

    #[test]
    fn over_ice_and_over_water_meet_at_the_triple_point() {
        let ice = saturation_pressure_kpa(273.149_999).unwrap();
        let water = saturation_pressure_kpa(273.15).unwrap();
        assert!((ice / water - 1.0).abs() < 1e-3, "{ice} vs {water}");
    }

    #[test]
    fn humid_air_adds_vapour_and_refuses_supersaturation() {
        let (mix, x) = humid_air(288.15, 101.325, 0.6).unwrap();
        let expected = 0.6 * saturation_pressure_kpa(288.15).unwrap() / 101.325;
        assert!((x[4] - expected).abs() < 1e-15);
        assert!(mix.molar_mass_kg_per_kmol() < Mixture::dry_air().molar_mass_kg_per_kmol());
        assert!(humid_air(288.15, 101.325, 1.01).is_err());
        assert!(humid_air(363.15, 50.0, 1.0).is_err());
    }
}
