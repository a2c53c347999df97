//! Components of the gas path: compressor and turbine stages (isentropic or
//! polytropic efficiency), and the combustor in its two forms: the
//! air-standard heat addition and the burning of a real fuel into
//! complete-combustion products.
//!
//! All enthalpies here are per kilogram of the gas at that point; a stream
//! also carries how much fuel per kilogram of compressor inlet air it holds,
//! so works and heats can be stated per kilogram of inlet air.

use super::config::EfficiencyBasis;
use super::error::CycleError;
use crate::fuel::Fuel;
use crate::thermo::mixture::{Mixture, DRY_AIR};
use crate::thermo::nasa7::Nasa7;
use crate::thermo::species::{AR, CO2, H2O, N2, O2};
use crate::thermo::{
    GasProperties, ThermoError, REFERENCE_TEMPERATURE_K, UNIVERSAL_GAS_CONSTANT_KJ_PER_KMOL_K,
};

/// A gas state on the way through the engine: temperature, specific
/// enthalpy and standard-state entropy (pressure is tracked by the caller).
#[derive(Debug, Clone, Copy)]
pub(crate) struct Point {
    /// Temperature, K.
    pub t_k: f64,
    /// Specific enthalpy, kJ/kg.
    pub h: f64,
    /// Standard-state specific entropy, kJ/(kg·K).
    pub s0: f64,
}

impl Point {
    /// The point at `t_k` on `gas`.
    pub fn at<G: GasProperties>(gas: &G, t_k: f64) -> Point {
        Point {
            t_k,
            h: gas.enthalpy_kj_per_kg(t_k),
            s0: gas.standard_entropy_kj_per_kg_k(t_k),
        }
    }
}

/// The ideal (isentropic) and actual end of a compression or expansion.
#[derive(Debug, Clone, Copy)]
pub(crate) struct StageEnd {
    /// Isentropic exit.
    pub ideal: Point,
    /// Actual exit.
    pub actual: Point,
}

/// NaN-aware `a > b`: false when either is not a number.
pub(crate) fn greater(a: f64, b: f64) -> bool {
    matches!(a.partial_cmp(&b), Some(std::cmp::Ordering::Greater))
}

/// Compress from `inlet` through a pressure ratio r given as `ln_ratio`
/// = ln r > 0.
///
/// Isentropic: `s°(T2s) = s°(T1) + R ln r`, `h2 = h1 + (h2s − h1)/η`.
/// Polytropic: `s°(T2) = s°(T1) + (R/η_p) ln r` (exact for an ideal gas with
/// temperature-dependent cp, from `dh = v dp / η_p`).
pub(crate) fn compress<G: GasProperties>(
    gas: &G,
    inlet: Point,
    ln_ratio: f64,
    efficiency: f64,
    basis: EfficiencyBasis,
) -> Result<StageEnd, ThermoError> {
    let ds = gas.gas_constant_kj_per_kg_k() * ln_ratio;
    stage(gas, inlet, ds, 1.0 / efficiency, basis, None)
}

/// Expand from `inlet` through an expansion ratio r given as `ln_ratio`
/// = ln r > 0; `previous` (an earlier solve of nearly the same stage) seeds
/// the inverse solves.
///
/// Isentropic: `s°(T4s) = s°(T3) − R ln r`, `h4 = h3 − η (h3 − h4s)`.
/// Polytropic: `s°(T4) = s°(T3) − η_p R ln r`.
pub(crate) fn expand<G: GasProperties>(
    gas: &G,
    inlet: Point,
    ln_ratio: f64,
    efficiency: f64,
    basis: EfficiencyBasis,
    previous: Option<&StageEnd>,
) -> Result<StageEnd, ThermoError> {
    let ds = -gas.gas_constant_kj_per_kg_k() * ln_ratio;
    stage(gas, inlet, ds, efficiency, basis, previous)
}

/// One compression or expansion: `ds_ideal` is the change of s° along the
/// isentrope (`±R ln r`); the actual enthalpy change is the ideal one times
/// `factor` (1/η for a compressor, η for a turbine), or for a polytropic
/// efficiency the change of s° is `ds_ideal × factor`.
fn stage<G: GasProperties>(
    gas: &G,
    inlet: Point,
    ds_ideal: f64,
    factor: f64,
    basis: EfficiencyBasis,
    previous: Option<&StageEnd>,
) -> Result<StageEnd, ThermoError> {
    let s0_ideal = inlet.s0 + ds_ideal;
    let guess = match previous {
        Some(p) => p.ideal.t_k,
        None if G::USES_GUESS => inlet.t_k * (ds_ideal / gas.cp_kj_per_kg_k(inlet.t_k)).exp(),
        None => 0.0,
    };
    let t_ideal = gas.temperature_from_standard_entropy(s0_ideal, guess)?;
    let ideal = Point {
        t_k: t_ideal,
        h: gas.enthalpy_kj_per_kg(t_ideal),
        s0: s0_ideal,
    };
    let actual = match basis {
        EfficiencyBasis::Isentropic => {
            let h = inlet.h + (ideal.h - inlet.h) * factor;
            let guess = match previous {
                Some(p) => p.actual.t_k,
                None if G::USES_GUESS => t_ideal + (h - ideal.h) / gas.cp_kj_per_kg_k(t_ideal),
                None => 0.0,
            };
            let t_k = gas.temperature_from_enthalpy(h, guess)?;
            Point {
                t_k,
                h,
                s0: gas.standard_entropy_kj_per_kg_k(t_k),
            }
        }
        EfficiencyBasis::Polytropic => {
            let s0 = inlet.s0 + ds_ideal * factor;
            let guess = match previous {
                Some(p) => p.actual.t_k,
                None => inlet.t_k + (t_ideal - inlet.t_k) * factor,
            };
            let t_k = gas.temperature_from_standard_entropy(s0, guess)?;
            Point {
                t_k,
                h: gas.enthalpy_kj_per_kg(t_k),
                s0,
            }
        }
    };
    Ok(StageEnd { ideal, actual })
}

/// The working gas at a point of the engine and the fuel it carries per kg
/// of compressor inlet air (0 in the air-standard models).
#[derive(Debug, Clone)]
pub(crate) struct Stream<G> {
    pub gas: G,
    pub fuel_per_kg_air: f64,
}

impl<G> Stream<G> {
    /// Mass of the stream per kg of compressor inlet air.
    pub fn mass_per_kg_air(&self) -> f64 {
        1.0 + self.fuel_per_kg_air
    }
}

/// What leaves a combustor.
#[derive(Debug, Clone)]
pub(crate) struct Burn<G> {
    /// The gas leaving, with its accumulated fuel.
    pub stream: Stream<G>,
    /// Exit enthalpy, kJ per kg of the leaving gas.
    pub h_out: f64,
    /// Fuel energy supplied (LHV basis), kJ per kg of compressor inlet air.
    pub fuel_energy_kj_per_kg_air: f64,
}

/// A combustor model: how heat is added and what gas results.
pub(crate) trait Combustion {
    /// The gas property model of air and of the combustor exit gas.
    type Gas: GasProperties + Clone;
    /// True when the exit gas composition depends on the fuel burned.
    const COMPOSITION_FOLLOWS_FUEL: bool;
    /// Combustion efficiency: fraction of the fuel's LHV released.
    fn efficiency(&self) -> f64;
    /// Compressor air.
    fn air(&self) -> &Self::Gas;
    /// The gas of `stream` (per kg of the air it was burned in) diluted
    /// with unburned air so that the burned air is the fraction `share` of
    /// the total: the stream per kg of all the air. Complete lean
    /// combustion products plus air are the products of the same fuel in
    /// all of the air.
    fn diluted(
        &self,
        stream: &Stream<Self::Gas>,
        share: f64,
    ) -> Result<Stream<Self::Gas>, CycleError>;
    /// Heat `stream` (enthalpy `h_in` per kg of its gas) to `t_out_k`.
    /// `field` names the input that set `t_out_k`, for errors.
    fn burn(
        &self,
        stream: &Stream<Self::Gas>,
        h_in: f64,
        t_out_k: f64,
        field: &'static str,
    ) -> Result<Burn<Self::Gas>, CycleError>;
}

/// Air-standard combustor: the heat released raises the enthalpy of air,
/// whose mass does not change; the fuel supplies that heat divided by the
/// combustion efficiency.
pub(crate) struct AirStandard<G> {
    air: G,
    efficiency: f64,
}

impl<G> AirStandard<G> {
    pub fn new(air: G, efficiency: f64) -> Self {
        AirStandard { air, efficiency }
    }
}

impl<G: GasProperties + Clone> Combustion for AirStandard<G> {
    type Gas = G;
    const COMPOSITION_FOLLOWS_FUEL: bool = false;

    fn efficiency(&self) -> f64 {
        self.efficiency
    }

    fn air(&self) -> &G {
        &self.air
    }

    fn diluted(&self, stream: &Stream<G>, _share: f64) -> Result<Stream<G>, CycleError> {
        // Air-standard gas is air throughout and carries no fuel mass.
        Ok(stream.clone())
    }

    // Inlined into the hot section, where the copy of the stream's gas
    // folds away (out of line it is a copy of the whole mixture per call).
    #[inline]
    fn burn(
        &self,
        stream: &Stream<G>,
        h_in: f64,
        t_out_k: f64,
        field: &'static str,
    ) -> Result<Burn<G>, CycleError> {
        let h_out = stream.gas.enthalpy_kj_per_kg(t_out_k);
        let rise = h_out - h_in;
        if !greater(rise, 0.0) {
            return Err(not_hotter(field, t_out_k));
        }
        Ok(Burn {
            stream: stream.clone(),
            h_out,
            fuel_energy_kj_per_kg_air: rise * stream.mass_per_kg_air() / self.efficiency,
        })
    }
}

/// Burning a modelled fuel to complete-combustion products (CO2, H2O, N2,
/// with the excess O2 and the air's Ar).
///
/// Per kg of inlet air the gas holds `n = n_air + f δ` kmol of each species
/// (δ: change per kg of fuel burned), so its total enthalpy is
/// `H(T; f) = h_air(T) + f D(T)` with `D = Σ δᵢ hᵢ`. The fuel enters at
/// 298.15 K; with combustion efficiency η the unreleased `(1 − η) LHV` per kg
/// of fuel leaves the energy balance as a loss. The balance is linear in the
/// fuel added, so each combustor's fuel is found in closed form:
/// `Δf = (1 + f) (h(T_out) − h_in) / (η LHV − (D(T_out) − D(298.15 K)))`.
pub(crate) struct Products {
    air: Mixture,
    air_kmol_per_kg: [f64; 5],
    delta_kmol_per_kg_fuel: [f64; 5],
    delta_enthalpy: Nasa7,
    delta_enthalpy_at_reference: f64,
    lhv_kj_per_kg: f64,
    efficiency: f64,
}

impl Products {
    /// Products model for `fuel` (must be modelled) burning in dry air.
    pub fn new(air: Mixture, fuel: &Fuel, efficiency: f64) -> Result<Products, CycleError> {
        let species = [&N2, &O2, &AR, &CO2, &H2O];
        let mut fractions = [0.0; 5];
        for (slot, s) in fractions.iter_mut().zip(species) {
            *slot = DRY_AIR
                .iter()
                .find(|(a, _)| a.name == s.name)
                .map_or(0.0, |(_, x)| *x);
        }
        Products::in_air(air, fractions, fuel, efficiency)
    }

    /// Products model for `fuel` burning in `air` whose mole fractions of
    /// N2, O2, Ar, CO2, H2O are `fractions` (humid air carries H2O).
    pub fn in_air(
        air: Mixture,
        fractions: [f64; 5],
        fuel: &Fuel,
        efficiency: f64,
    ) -> Result<Products, CycleError> {
        let stoichiometry = fuel.stoichiometry().ok_or(CycleError::FuelNotModelled)?;
        let species = [&N2, &O2, &AR, &CO2, &H2O];
        let mut air_kmol_per_kg = [0.0; 5];
        for (slot, x) in air_kmol_per_kg.iter_mut().zip(fractions) {
            *slot = x / air.molar_mass_kg_per_kmol();
        }
        let delta = stoichiometry.products_kmol_per_kg;
        let mut delta_enthalpy = Nasa7::zero(1000.0);
        for (s, d) in species.iter().zip(delta) {
            delta_enthalpy.add_scaled(&s.poly, d * UNIVERSAL_GAS_CONSTANT_KJ_PER_KMOL_K);
        }
        Ok(Products {
            air,
            air_kmol_per_kg,
            delta_kmol_per_kg_fuel: delta,
            delta_enthalpy_at_reference: delta_enthalpy.enthalpy(REFERENCE_TEMPERATURE_K),
            delta_enthalpy,
            lhv_kj_per_kg: fuel.lhv_kj_per_kg(),
            efficiency,
        })
    }

    /// Fuel–air ratio at which the products hold no oxygen.
    pub fn stoichiometric_fuel_air_ratio(&self) -> f64 {
        -self.air_kmol_per_kg[1] / self.delta_kmol_per_kg_fuel[1]
    }

    /// The complete-combustion products of `fuel_per_kg_air` kg of fuel per
    /// kg of air (at most stoichiometric).
    pub fn gas(&self, fuel_per_kg_air: f64) -> Result<Mixture, ThermoError> {
        let n =
            |i: usize| self.air_kmol_per_kg[i] + fuel_per_kg_air * self.delta_kmol_per_kg_fuel[i];
        Mixture::from_moles(&[
            (&N2, n(0)),
            (&O2, n(1)),
            (&AR, n(2)),
            (&CO2, n(3)),
            (&H2O, n(4)),
        ])
    }
}

impl Combustion for Products {
    type Gas = Mixture;
    const COMPOSITION_FOLLOWS_FUEL: bool = true;

    fn efficiency(&self) -> f64 {
        self.efficiency
    }

    fn air(&self) -> &Mixture {
        &self.air
    }

    fn diluted(&self, stream: &Stream<Mixture>, share: f64) -> Result<Stream<Mixture>, CycleError> {
        let fuel = share * stream.fuel_per_kg_air;
        let gas = self.gas(fuel).map_err(|e| {
            CycleError::invalid(
                "turbine_cooling",
                e.to_string(),
                "expected a smaller fraction",
            )
        })?;
        Ok(Stream {
            gas,
            fuel_per_kg_air: fuel,
        })
    }

    fn burn(
        &self,
        stream: &Stream<Mixture>,
        h_in: f64,
        t_out_k: f64,
        field: &'static str,
    ) -> Result<Burn<Mixture>, CycleError> {
        let rise = stream.mass_per_kg_air() * (stream.gas.enthalpy_kj_per_kg(t_out_k) - h_in);
        if !greater(rise, 0.0) {
            return Err(not_hotter(field, t_out_k));
        }
        let released = self.efficiency * self.lhv_kj_per_kg
            - (self.delta_enthalpy.enthalpy(t_out_k) - self.delta_enthalpy_at_reference);
        let stoichiometric = self.stoichiometric_fuel_air_ratio();
        let added = rise / released;
        let fuel = stream.fuel_per_kg_air + added;
        if !(greater(released, 0.0) && fuel <= stoichiometric) {
            return Err(CycleError::invalid(
                field,
                format!(
                    "{t_out_k} K needs more fuel than the air can burn (fuel–air ratio above the stoichiometric {stoichiometric:.5})"
                ),
                "expected a lower temperature",
            ));
        }
        let gas = self.gas(fuel).map_err(|e| {
            CycleError::invalid(field, e.to_string(), "expected a lower temperature")
        })?;
        let h_out = gas.enthalpy_kj_per_kg(t_out_k);
        Ok(Burn {
            stream: Stream {
                gas,
                fuel_per_kg_air: fuel,
            },
            h_out,
            fuel_energy_kj_per_kg_air: added * self.lhv_kj_per_kg,
        })
    }
}

fn not_hotter(field: &'static str, t_out_k: f64) -> CycleError {
    CycleError::invalid(
        field,
        format!("{t_out_k} K is not above the combustor inlet temperature"),
        "expected a combustor exit temperature above its inlet",
    )
}
