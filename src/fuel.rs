//! Fuels: from a composition by mole fraction to heating values,
//! stoichiometry and CO2 factors; or a fuel known only by its heating values.
//!
//! Decisions:
//! - Heating values are computed from the species' NASA-7 absolute enthalpies
//!   (see [`crate::thermo::species`]) at 298.15 K with complete combustion to
//!   CO2, H2O and N2, so the cycle's combustor balance and the heating value
//!   use one and the same data. The higher heating value adds the latent
//!   heat of the water formed, condensed to liquid at 298.15 K, using
//!   ΔfH°(H2O, liquid) = −285.830 kJ/mol (CODATA Key Values for
//!   Thermodynamics, Cox, Wagman & Medvedev 1989).
//! - Per standard cubic metre: ideal gas at 15 °C and 101.325 kPa
//!   (23.6444 m³/kmol); no real-gas compression factor. The combustion
//!   reference temperature stays 25 °C.
//! - Mole fractions must sum to 1 within 1e-6; they are then normalised to
//!   sum exactly to 1.
//! - A fuel given by heating values alone has no composition: the
//!   `products` gas model cannot use it.

use crate::thermo::mixture::{Mixture, DRY_AIR};
use crate::thermo::species::{self, Species};
use crate::thermo::{
    REFERENCE_TEMPERATURE_K, STANDARD_PRESSURE_KPA, UNIVERSAL_GAS_CONSTANT_KJ_PER_KMOL_K,
};
use serde::Serialize;
use thiserror::Error;

/// Standard enthalpy of formation of liquid water at 298.15 K, kJ/kmol
/// (CODATA Key Values for Thermodynamics, Cox, Wagman & Medvedev 1989:
/// −285.830 kJ/mol).
const LIQUID_WATER_FORMATION_ENTHALPY_KJ_PER_KMOL: f64 = -285_830.0;

/// Metering temperature of a standard cubic metre, K (15 °C; ISO 13443).
const STANDARD_VOLUME_TEMPERATURE_K: f64 = 288.15;

/// The fuel species a composition may name.
pub const FUEL_SPECIES: [&Species; 8] = [
    &species::CH4,
    &species::C2H6,
    &species::C3H8,
    &species::N_C4H10,
    &species::H2,
    &species::CO,
    &species::N2,
    &species::CO2,
];

const VALID_SPECIES_TEXT: &str = "CH4, C2H6, C3H8, C4H10 (or nC4H10), H2, CO, N2, CO2";

/// A fuel that cannot be built from what was given.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum FuelError {
    /// A species name brayfin does not model.
    #[error("unknown fuel species \"{0}\"; valid species: {VALID_SPECIES_TEXT}")]
    UnknownSpecies(String),
    /// The same species named twice.
    #[error("fuel species {0} is given more than once")]
    DuplicateSpecies(String),
    /// A mole fraction that is negative, above 1 or not a number.
    #[error("mole fraction of {species} is {value}; expected a number from 0 to 1")]
    InvalidFraction {
        /// The species.
        species: String,
        /// The fraction given.
        value: f64,
    },
    /// Mole fractions that do not sum to 1.
    #[error("fuel mole fractions sum to {0}; they must sum to 1 within 1e-6")]
    FractionsDoNotSumToOne(f64),
    /// A composition without anything that burns.
    #[error(
        "the fuel has no combustible species; give at least one of CH4, C2H6, C3H8, C4H10, H2, CO"
    )]
    NotCombustible,
    /// Fuel text that is neither a known name nor a composition.
    #[error("cannot read fuel \"{text}\": {reason}; expected `methane` or a composition such as `CH4=0.95,C2H6=0.03,N2=0.02`")]
    Syntax {
        /// The text given.
        text: String,
        /// What was wrong.
        reason: String,
    },
    /// Heating values or CO2 factor out of range.
    #[error("{field} = {value} is not valid; expected {valid}")]
    HeatingValues {
        /// Which input (`lhv_kj_per_kg`, `hhv_kj_per_kg`, `co2_kg_per_gj_lhv`).
        field: &'static str,
        /// The value given.
        value: f64,
        /// What would be valid.
        valid: &'static str,
    },
}

/// One species of a fuel composition.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct FuelComponent {
    /// Species formula (`"CH4"`, `"nC4H10"`, …).
    pub species: &'static str,
    /// Mole fraction (the fractions of a fuel sum to 1).
    pub mole_fraction: f64,
}

/// What complete combustion of one kilogram of a modelled fuel does to the
/// gas it burns in: kmol of each product species added (O2 negative:
/// consumed), and the fuel's own absolute enthalpy at 298.15 K.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Stoichiometry {
    /// Change in kmol per kg of fuel, in the order N2, O2, Ar, CO2, H2O.
    pub products_kmol_per_kg: [f64; 5],
    /// Absolute enthalpy of the fuel at 298.15 K, kJ/kg (NASA-7 data).
    pub enthalpy_at_reference_kj_per_kg: f64,
}

/// A fuel: its heating values and CO2 factor, with its composition when
/// brayfin models it.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Fuel {
    name: String,
    composition: Option<Vec<FuelComponent>>,
    lhv_kj_per_kg: f64,
    hhv_kj_per_kg: f64,
    co2_kg_per_gj_lhv: f64,
    molar_mass_kg_per_kmol: Option<f64>,
    stoichiometric_air_fuel_ratio: Option<f64>,
    lhv_mj_per_sm3: Option<f64>,
    hhv_mj_per_sm3: Option<f64>,
    #[serde(skip)]
    stoichiometry: Option<Stoichiometry>,
}

impl Fuel {
    /// Pure methane.
    pub fn methane() -> Fuel {
        Fuel::from_parts("methane".into(), &[(&species::CH4, 1.0)])
    }

    /// Fuel from mole fractions by species name (CH4 C2H6 C3H8 C4H10 or
    /// nC4H10, H2, CO, N2, CO2). The fractions must sum to 1 within 1e-6.
    pub fn from_composition(mole_fractions: &[(&str, f64)]) -> Result<Fuel, FuelError> {
        let mut parts: Vec<(&'static Species, f64)> = Vec::with_capacity(mole_fractions.len());
        for (name, fraction) in mole_fractions {
            let found = FUEL_SPECIES
                .iter()
                .copied()
                .find(|s| s.name == *name || (*name == "C4H10" && s.name == "nC4H10"))
                .ok_or_else(|| FuelError::UnknownSpecies((*name).to_string()))?;
            if parts.iter().any(|(s, _)| s.name == found.name) {
                return Err(FuelError::DuplicateSpecies(found.name.to_string()));
            }
            if !(fraction.is_finite() && (0.0..=1.0).contains(fraction)) {
                return Err(FuelError::InvalidFraction {
                    species: (*name).to_string(),
                    value: *fraction,
                });
            }
            parts.push((found, *fraction));
        }
        let sum: f64 = parts.iter().map(|(_, x)| x).sum();
        if (sum - 1.0).abs() > 1e-6 || sum.is_nan() {
            // Rounded to 9 significant figures so the message shows the sum as
            // typed, not its binary rounding.
            let shown = format!("{sum:.9e}").parse::<f64>().unwrap_or(sum);
            return Err(FuelError::FractionsDoNotSumToOne(shown));
        }
        for part in &mut parts {
            part.1 /= sum;
        }
        let name = parts
            .iter()
            .map(|(s, x)| format!("{}={x}", s.name))
            .collect::<Vec<_>>()
            .join(",");
        let fuel = Fuel::from_parts(name, &parts);
        if fuel.lhv_kj_per_kg > 0.0 {
            Ok(fuel)
        } else {
            Err(FuelError::NotCombustible)
        }
    }

    /// Read `methane` (any case) or a composition such as
    /// `CH4=0.95,C2H6=0.03,N2=0.02` (spaces allowed).
    pub fn parse(text: &str) -> Result<Fuel, FuelError> {
        let trimmed = text.trim();
        if trimmed.eq_ignore_ascii_case("methane") {
            return Ok(Fuel::methane());
        }
        let syntax = |reason: String| FuelError::Syntax {
            text: text.to_string(),
            reason,
        };
        if !trimmed.contains('=') {
            return Err(syntax("it is not a known fuel name".into()));
        }
        let mut pairs = Vec::new();
        for item in trimmed.split(',') {
            let (name, value) = item
                .split_once('=')
                .ok_or_else(|| syntax(format!("\"{}\" has no `=`", item.trim())))?;
            let value = value
                .trim()
                .parse::<f64>()
                .map_err(|_| syntax(format!("\"{}\" is not a number", value.trim())))?;
            pairs.push((name.trim(), value));
        }
        Fuel::from_composition(&pairs)
    }

    /// A fuel known only by its lower and higher heating values (kJ/kg) and
    /// CO2 factor (kg per GJ of LHV). Not modelled: only the `air` and
    /// `cold-air` gas models can use it.
    pub fn from_heating_values(
        lhv_kj_per_kg: f64,
        hhv_kj_per_kg: f64,
        co2_kg_per_gj_lhv: f64,
    ) -> Result<Fuel, FuelError> {
        if !(lhv_kj_per_kg.is_finite() && lhv_kj_per_kg > 0.0) {
            return Err(FuelError::HeatingValues {
                field: "lhv_kj_per_kg",
                value: lhv_kj_per_kg,
                valid: "a positive heating value in kJ/kg",
            });
        }
        if !(hhv_kj_per_kg.is_finite() && hhv_kj_per_kg >= lhv_kj_per_kg) {
            return Err(FuelError::HeatingValues {
                field: "hhv_kj_per_kg",
                value: hhv_kj_per_kg,
                valid: "a heating value in kJ/kg at least as large as the LHV",
            });
        }
        if !(co2_kg_per_gj_lhv.is_finite() && co2_kg_per_gj_lhv >= 0.0) {
            return Err(FuelError::HeatingValues {
                field: "co2_kg_per_gj_lhv",
                value: co2_kg_per_gj_lhv,
                valid: "a CO2 factor ≥ 0 in kg per GJ (LHV)",
            });
        }
        Ok(Fuel {
            name: "given heating values".into(),
            composition: None,
            lhv_kj_per_kg,
            hhv_kj_per_kg,
            co2_kg_per_gj_lhv,
            molar_mass_kg_per_kmol: None,
            stoichiometric_air_fuel_ratio: None,
            lhv_mj_per_sm3: None,
            hhv_mj_per_sm3: None,
            stoichiometry: None,
        })
    }

    /// Fuel from normalised mole fractions of known species (validated by the
    /// caller).
    fn from_parts(name: String, parts: &[(&'static Species, f64)]) -> Fuel {
        let r = UNIVERSAL_GAS_CONSTANT_KJ_PER_KMOL_K;
        let t = REFERENCE_TEMPERATURE_K;
        let h = |s: &Species| r * s.poly.enthalpy(t);
        let (mut molar_mass, mut h_fuel) = (0.0, 0.0);
        let (mut n2, mut o2_demand, mut co2, mut h2o) = (0.0, 0.0, 0.0, 0.0);
        for (s, x) in parts {
            molar_mass += x * s.molar_mass_kg_per_kmol();
            h_fuel += x * h(s);
            let a = s.atoms;
            o2_demand += x * (a.c + a.h / 4.0 - a.o / 2.0);
            co2 += x * a.c;
            h2o += x * a.h / 2.0;
            n2 += x * a.n / 2.0;
        }
        let h_products = co2 * h(&species::CO2) + h2o * h(&species::H2O) + n2 * h(&species::N2);
        let lhv_molar = h_fuel + o2_demand * h(&species::O2) - h_products;
        let latent = h(&species::H2O) - LIQUID_WATER_FORMATION_ENTHALPY_KJ_PER_KMOL;
        let hhv_molar = lhv_molar + h2o * latent;
        let air = Mixture::dry_air();
        let o2_in_air = DRY_AIR
            .iter()
            .find(|(s, _)| s.name == "O2")
            .map_or(f64::NAN, |(_, x)| *x);
        let molar_volume_m3 = r * STANDARD_VOLUME_TEMPERATURE_K / STANDARD_PRESSURE_KPA;
        let composition = parts
            .iter()
            .map(|(s, x)| FuelComponent {
                species: s.name,
                mole_fraction: *x,
            })
            .collect();
        Fuel {
            name,
            composition: Some(composition),
            lhv_kj_per_kg: lhv_molar / molar_mass,
            hhv_kj_per_kg: hhv_molar / molar_mass,
            co2_kg_per_gj_lhv: co2 * species::CO2.molar_mass_kg_per_kmol() / lhv_molar * 1e6,
            molar_mass_kg_per_kmol: Some(molar_mass),
            stoichiometric_air_fuel_ratio: Some(
                o2_demand / o2_in_air * air.molar_mass_kg_per_kmol() / molar_mass,
            ),
            lhv_mj_per_sm3: Some(lhv_molar / molar_volume_m3 / 1000.0),
            hhv_mj_per_sm3: Some(hhv_molar / molar_volume_m3 / 1000.0),
            stoichiometry: Some(Stoichiometry {
                products_kmol_per_kg: [
                    n2 / molar_mass,
                    -o2_demand / molar_mass,
                    0.0,
                    co2 / molar_mass,
                    h2o / molar_mass,
                ],
                enthalpy_at_reference_kj_per_kg: h_fuel / molar_mass,
            }),
        }
    }

    /// Display name: `methane`, the composition text, or `given heating
    /// values`.
    pub fn name(&self) -> &str {
        &self.name
    }

    /// Composition by mole fraction, when the fuel is modelled.
    pub fn composition(&self) -> Option<&[FuelComponent]> {
        self.composition.as_deref()
    }

    /// Lower heating value, kJ/kg (water formed stays vapour; 25 °C).
    pub fn lhv_kj_per_kg(&self) -> f64 {
        self.lhv_kj_per_kg
    }

    /// Higher heating value, kJ/kg (water formed condensed; 25 °C).
    pub fn hhv_kj_per_kg(&self) -> f64 {
        self.hhv_kj_per_kg
    }

    /// Ratio HHV / LHV (≥ 1): converts an LHV-basis fuel energy to the HHV
    /// basis a gas price is usually quoted on.
    pub fn hhv_over_lhv(&self) -> f64 {
        self.hhv_kj_per_kg / self.lhv_kj_per_kg
    }

    /// Lower heating value per standard cubic metre (ideal gas, 15 °C,
    /// 101.325 kPa), MJ/m³; `None` when the fuel is given by heating values.
    pub fn lhv_mj_per_sm3(&self) -> Option<f64> {
        self.lhv_mj_per_sm3
    }

    /// Higher heating value per standard cubic metre (ideal gas, 15 °C,
    /// 101.325 kPa), MJ/m³; `None` when the fuel is given by heating values.
    pub fn hhv_mj_per_sm3(&self) -> Option<f64> {
        self.hhv_mj_per_sm3
    }

    /// Mass of dry air per mass of fuel for complete combustion with no
    /// excess oxygen; `None` when the fuel is given by heating values.
    pub fn stoichiometric_air_fuel_ratio(&self) -> Option<f64> {
        self.stoichiometric_air_fuel_ratio
    }

    /// Molar mass, kg/kmol; `None` when the fuel is given by heating values.
    pub fn molar_mass_kg_per_kmol(&self) -> Option<f64> {
        self.molar_mass_kg_per_kmol
    }

    /// CO2 emitted by complete combustion, kg per GJ of fuel energy on the
    /// lower-heating-value basis.
    pub fn co2_kg_per_gj_lhv(&self) -> f64 {
        self.co2_kg_per_gj_lhv
    }

    /// CO2 emitted by complete combustion, kg per GJ of fuel energy on the
    /// higher-heating-value basis.
    pub fn co2_kg_per_gj_hhv(&self) -> f64 {
        self.co2_kg_per_gj_lhv / self.hhv_over_lhv()
    }

    /// Whether the fuel has a composition (so the `products` gas model can
    /// burn it).
    pub fn is_modelled(&self) -> bool {
        self.stoichiometry.is_some()
    }

    /// Complete-combustion stoichiometry per kg of fuel, when modelled.
    pub fn stoichiometry(&self) -> Option<&Stoichiometry> {
        self.stoichiometry.as_ref()
    }
}
