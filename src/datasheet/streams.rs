//! The gas streams of a datasheet's energy balance: humid inlet air at the
//! rating condition and the complete-combustion products of the datasheet's
//! fuel burned in it, from the mixture thermodynamics.

use super::{Datasheet, DatasheetError};
use crate::thermo::humidity::humid_air;
use crate::thermo::mixture::Mixture;
use crate::thermo::species::{AR, CO2, H2O, N2, O2};
use crate::thermo::{GasProperties, REFERENCE_TEMPERATURE_K};

/// Inlet air and the combustion change of one datasheet.
pub(crate) struct Streams {
    air: Mixture,
    /// kmol of N2, O2, Ar, CO2, H2O per kg of inlet air.
    air_kmol_per_kg: [f64; 5],
    /// kmol change of the same species per kg of fuel burned.
    delta_kmol_per_kg_fuel: [f64; 5],
    ambient_k: f64,
}

impl Streams {
    /// The streams of `sheet` (validated: modelled fuel, humidity the
    /// ambient can hold).
    pub fn new(sheet: &Datasheet) -> Result<Streams, DatasheetError> {
        let r = &sheet.rating;
        let (air, fractions) = humid_air(r.temperature_k, r.pressure_kpa, r.relative_humidity)
            .map_err(|e| DatasheetError::Property {
                field: "rating.relative_humidity",
                problem: e.to_string(),
            })?;
        let stoichiometry = sheet
            .fuel
            .stoichiometry()
            .ok_or(DatasheetError::FuelNotModelled)?;
        let molar_mass = air.molar_mass_kg_per_kmol();
        let mut air_kmol_per_kg = [0.0; 5];
        for (slot, x) in air_kmol_per_kg.iter_mut().zip(fractions) {
            *slot = x / molar_mass;
        }
        Ok(Streams {
            air,
            air_kmol_per_kg,
            delta_kmol_per_kg_fuel: stoichiometry.products_kmol_per_kg,
            ambient_k: r.temperature_k,
        })
    }

    /// Fuel per kg of air at which the products hold no oxygen.
    pub fn stoichiometric_fuel_air_ratio(&self) -> f64 {
        -self.air_kmol_per_kg[1] / self.delta_kmol_per_kg_fuel[1]
    }

    /// Products of `fuel_air_ratio` kg of fuel per kg of air.
    fn products(&self, fuel_air_ratio: f64) -> Result<Mixture, DatasheetError> {
        let n =
            |i: usize| self.air_kmol_per_kg[i] + fuel_air_ratio * self.delta_kmol_per_kg_fuel[i];
        if n(1) < 0.0 {
            return Err(DatasheetError::Impossible(format!(
                "the fuel–air ratio {fuel_air_ratio:.4} that the heat rate, output and exhaust flow imply burns more than all the air's oxygen (rating.heat_rate too high or rating.exhaust_flow too low)"
            )));
        }
        Mixture::from_moles(&[
            (&N2, n(0)),
            (&O2, n(1)),
            (&AR, n(2)),
            (&CO2, n(3)),
            (&H2O, n(4)),
        ])
        .map_err(|e| DatasheetError::Property {
            field: "fuel",
            problem: e.to_string(),
        })
    }

    /// Exhaust energy above the inlet state, kW: the exhaust's enthalpy
    /// less the inlet air's, both counted from 298.15 K where the fuel's
    /// LHV is defined (the fuel enters at 298.15 K),
    /// `ṁ_ex (h_p(T_ex) − h_p(298.15)) − ṁ_a (h_a(T_amb) − h_a(298.15))`.
    /// This is the heat the cycle solver rejects, so a solved cycle closes
    /// this balance with its electro-mechanical losses alone.
    pub fn exhaust_energy_kw(
        &self,
        air_flow_kg_per_s: f64,
        fuel_flow_kg_per_s: f64,
        exhaust_temperature_k: f64,
    ) -> Result<f64, DatasheetError> {
        let products = self.products(fuel_flow_kg_per_s / air_flow_kg_per_s)?;
        products
            .check_temperature(exhaust_temperature_k)
            .map_err(|e| DatasheetError::Property {
                field: "rating.exhaust_temperature",
                problem: e.to_string(),
            })?;
        let exhaust = (air_flow_kg_per_s + fuel_flow_kg_per_s)
            * (products.enthalpy_kj_per_kg(exhaust_temperature_k)
                - products.enthalpy_kj_per_kg(REFERENCE_TEMPERATURE_K));
        let inlet = air_flow_kg_per_s
            * (self.air.enthalpy_kj_per_kg(self.ambient_k)
                - self.air.enthalpy_kj_per_kg(REFERENCE_TEMPERATURE_K));
        Ok(exhaust - inlet)
    }
}
