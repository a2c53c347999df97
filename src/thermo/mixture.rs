//! Ideal-gas mixtures of NASA-7 species at fixed composition.
//!
//! A mixture's molar properties are the mole-fraction-weighted sums of its
//! species' (plus the ideal entropy of mixing), so the mixture is itself one
//! NASA-7 polynomial: its coefficients are summed once, here, and every
//! later evaluation costs the same as one species. The stored polynomial is
//! scaled by the mixture's specific gas constant, so it yields kJ/kg and
//! kJ/(kg·K) directly.

use super::nasa7::Nasa7;
use super::species::{Species, AR, CO2, N2, O2};
use super::{
    invert_monotone, GasProperties, Monotone, ThermoError, MAX_TEMPERATURE_K, MIN_TEMPERATURE_K,
    UNIVERSAL_GAS_CONSTANT_KJ_PER_KMOL_K,
};

/// Dry air by mole fraction: N2 0.78084, O2 0.20946, Ar 0.00934, CO2 0.00036
/// (common practice; the standard-atmosphere composition). Sums to 1.
pub const DRY_AIR: [(&Species, f64); 4] = [
    (&N2, 0.78084),
    (&O2, 0.20946),
    (&AR, 0.00934),
    (&CO2, 0.00036),
];

/// An ideal-gas mixture of fixed composition, valid from
/// [`MIN_TEMPERATURE_K`] to [`MAX_TEMPERATURE_K`].
#[derive(Debug, Clone, PartialEq)]
pub struct Mixture {
    /// Mixture polynomial scaled by the specific gas constant (kJ/kg units),
    /// entropy of mixing included.
    poly: Nasa7,
    gas_constant_kj_per_kg_k: f64,
    molar_mass_kg_per_kmol: f64,
}

impl Mixture {
    /// Mixture of the given species in the given amounts (any consistent
    /// unit: moles or mole fractions; they are normalised). Amounts must be
    /// finite and non-negative with a positive total.
    pub fn from_moles(parts: &[(&Species, f64)]) -> Result<Mixture, ThermoError> {
        let mut total = 0.0;
        for (species, amount) in parts {
            if !(amount.is_finite() && *amount >= 0.0) {
                return Err(ThermoError::Composition(format!(
                    "amount of {} is {amount}; expected a finite number ≥ 0",
                    species.name
                )));
            }
            total += amount;
        }
        if total <= 0.0 {
            return Err(ThermoError::Composition(
                "the amounts sum to zero; expected at least one species present".into(),
            ));
        }
        let reference = Nasa7::zero(1000.0);
        if let Some((species, _)) = parts.iter().find(|(s, _)| !s.poly.same_break(&reference)) {
            return Err(ThermoError::Composition(format!(
                "{} breaks its polynomial at {} K, not at 1000 K",
                species.name, species.poly.t_mid_k
            )));
        }
        Ok(Mixture::build(parts, total))
    }

    /// Mixture from amounts already checked: finite, non-negative, positive
    /// `total`, every polynomial breaking at 1000 K.
    fn build(parts: &[(&Species, f64)], total: f64) -> Mixture {
        let mut molar = Nasa7::zero(1000.0);
        let mut molar_mass = 0.0;
        let mut mixing_entropy = 0.0;
        for (species, amount) in parts {
            let x = amount / total;
            if x > 0.0 {
                molar.add_scaled(&species.poly, x);
                molar_mass += x * species.molar_mass_kg_per_kmol();
                mixing_entropy -= x * x.ln();
            }
        }
        molar.add_entropy_constant(mixing_entropy);
        let gas_constant = UNIVERSAL_GAS_CONSTANT_KJ_PER_KMOL_K / molar_mass;
        let poly = molar.scaled(gas_constant);
        Mixture {
            poly,
            gas_constant_kj_per_kg_k: gas_constant,
            molar_mass_kg_per_kmol: molar_mass,
        }
    }

    /// Dry air of the [`DRY_AIR`] composition.
    pub fn dry_air() -> Mixture {
        // DRY_AIR's fractions are positive, sum to 1 and its species all
        // break at 1000 K (checked by a test below).
        Mixture::build(&DRY_AIR, 1.0)
    }

    /// Mean molar mass, kg/kmol.
    pub fn molar_mass_kg_per_kmol(&self) -> f64 {
        self.molar_mass_kg_per_kmol
    }
}

impl GasProperties for Mixture {
    #[inline]
    fn enthalpy_kj_per_kg(&self, temperature_k: f64) -> f64 {
        self.poly.enthalpy(temperature_k)
    }

    #[inline]
    fn standard_entropy_kj_per_kg_k(&self, temperature_k: f64) -> f64 {
        self.poly.standard_entropy(temperature_k)
    }

    #[inline]
    fn cp_kj_per_kg_k(&self, temperature_k: f64) -> f64 {
        self.poly.cp(temperature_k)
    }

    fn gas_constant_kj_per_kg_k(&self) -> f64 {
        self.gas_constant_kj_per_kg_k
    }

    fn temperature_range_k(&self) -> (f64, f64) {
        (MIN_TEMPERATURE_K, MAX_TEMPERATURE_K)
    }

    fn temperature_from_enthalpy(
        &self,
        enthalpy_kj_per_kg: f64,
        guess_k: f64,
    ) -> Result<f64, ThermoError> {
        let f = Monotone {
            quantity: "enthalpy (kJ/kg)",
            value: |t| self.poly.enthalpy(t),
            slope: |t| self.poly.cp(t),
            range_k: (MIN_TEMPERATURE_K, MAX_TEMPERATURE_K),
        };
        invert_monotone(&f, enthalpy_kj_per_kg, guess_k)
    }

    fn temperature_from_standard_entropy(
        &self,
        entropy_kj_per_kg_k: f64,
        guess_k: f64,
    ) -> Result<f64, ThermoError> {
        let f = Monotone {
            quantity: "standard entropy (kJ/(kg·K))",
            value: |t| self.poly.standard_entropy(t),
            slope: |t| self.poly.cp(t) / t,
            range_k: (MIN_TEMPERATURE_K, MAX_TEMPERATURE_K),
        };
        invert_monotone(&f, entropy_kj_per_kg_k, guess_k)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Molar mass of dry air 28.965 kg/kmol to within 0.005 (common
    /// practice; standard-atmosphere tables give 28.9644 with older atomic
    /// weights).
    #[test]
    fn dry_air_molar_mass_and_gas_constant() {
        let air = Mixture::dry_air();
        assert!((air.molar_mass_kg_per_kmol() - 28.965).abs() < 0.005);
        assert!((air.gas_constant_kj_per_kg_k() - 0.287).abs() < 0.0005);
    }

    /// cp of air at 300 K is 1.005 kJ/(kg·K) in air tables (e.g. the ideal
    /// gas table of air in standard engineering thermodynamics texts, from
    /// memory); polynomial and table agree to about 0.2 %.
    #[test]
    fn air_cp_at_300_k_matches_tables() {
        let air = Mixture::dry_air();
        assert!((air.cp_kj_per_kg_k(300.0) - 1.005).abs() < 0.003);
    }

    #[test]
    fn inverses_round_trip_over_the_whole_range() {
        let air = Mixture::dry_air();
        let mut temperatures: Vec<f64> = (0..56).map(|i| 225.0 + 50.0 * f64::from(i)).collect();
        temperatures.extend([200.0, 3000.0]);
        for t in temperatures {
            let h = air.enthalpy_kj_per_kg(t);
            let s = air.standard_entropy_kj_per_kg_k(t);
            let th = air.temperature_from_enthalpy(h, 700.0).unwrap();
            let ts = air.temperature_from_standard_entropy(s, 2500.0).unwrap();
            assert!((th - t).abs() < 1e-8, "{t} {th}");
            assert!((ts - t).abs() < 1e-8, "{t} {ts}");
        }
    }

    /// At the 1000 K range break the two fits of the data meet to within a
    /// small step; the inverse lands within 1e-3 K of the break.
    #[test]
    fn inverse_at_the_range_break_lands_on_it() {
        let air = Mixture::dry_air();
        let h = air.enthalpy_kj_per_kg(1000.0);
        let t = air.temperature_from_enthalpy(h, 600.0).unwrap();
        assert!((t - 1000.0).abs() < 1e-3, "{t}");
    }

    #[test]
    fn inverse_beyond_the_data_is_an_error() {
        let air = Mixture::dry_air();
        let too_hot = air.enthalpy_kj_per_kg(3000.0) + 1.0;
        assert!(air.temperature_from_enthalpy(too_hot, 1000.0).is_err());
        let too_cold = air.standard_entropy_kj_per_kg_k(200.0) - 1e-3;
        assert!(air
            .temperature_from_standard_entropy(too_cold, 300.0)
            .is_err());
    }

    #[test]
    fn dry_air_constant_is_a_valid_composition() {
        let sum: f64 = DRY_AIR.iter().map(|(_, x)| x).sum();
        assert!((sum - 1.0).abs() < 1e-12);
        assert_eq!(Mixture::from_moles(&DRY_AIR).unwrap(), Mixture::dry_air());
    }

    #[test]
    fn bad_compositions_are_refused() {
        assert!(Mixture::from_moles(&[(&N2, -1.0)]).is_err());
        assert!(Mixture::from_moles(&[(&N2, 0.0)]).is_err());
        assert!(Mixture::from_moles(&[(&N2, f64::NAN)]).is_err());
    }
}
