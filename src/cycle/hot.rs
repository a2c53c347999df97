//! The hot section: combustor, turbine, and optionally a reheat combustor
//! between a high- and a low-pressure turbine. Solved for a given combustor
//! inlet enthalpy, so the regenerator loop can call it repeatedly.

use super::components::{expand, greater, Burn, Combustion, Point, StageEnd, Stream};
use super::config::EfficiencyBasis;
use super::error::CycleError;
use super::states::{data_range, Pressure, StateTable};
use crate::thermo::GasProperties;

/// How the expansion is split around a reheat combustor.
#[derive(Debug, Clone, Copy)]
pub(crate) struct ReheatSplit {
    /// High-pressure turbine expansion ratio.
    pub r_hp: f64,
    /// Its logarithm.
    pub ln_hp: f64,
    /// Logarithm of the low-pressure turbine expansion ratio (after the
    /// reheat combustor's loss).
    pub ln_lp: f64,
    /// Reheat combustor exit temperature, K.
    pub t_k: f64,
}

/// The fixed data of the hot section.
pub(crate) struct HotSection<'a, C> {
    pub combustion: &'a C,
    pub t3_k: f64,
    /// Logarithm of the overall turbine expansion ratio.
    pub ln_turbine_ratio: f64,
    pub reheat: Option<ReheatSplit>,
    pub efficiency: f64,
    pub basis: EfficiencyBasis,
    /// Turbine cooling: fraction of the combustor-inlet air that bypasses
    /// the combustor and mixes with its gas ahead of the rotor, [0, 1).
    pub cooling: f64,
}

/// The hot section solved for one combustor inlet enthalpy.
pub(crate) struct Hot<G> {
    /// Main combustor exit (per kg of the air it burns).
    pub burn: Burn<G>,
    /// State 3.
    pub turbine_inlet: Point,
    /// With turbine cooling: the gas after the coolant has mixed in (per
    /// kg of compressor inlet air) and the rotor inlet, state 3r.
    pub cooled: Option<(Stream<G>, Point)>,
    /// High-pressure turbine end, reheat combustor exit and state 3b.
    pub reheat: Option<(StageEnd, Burn<G>, Point)>,
    /// Last turbine's end (states 4s, 4).
    pub last: StageEnd,
    /// Turbine work of all turbines, kJ per kg of inlet air.
    pub turbine_work: f64,
    /// Fuel energy of all combustors (LHV), kJ per kg of inlet air.
    pub fuel_energy: f64,
}

impl<G> Hot<G> {
    /// The gas leaving the last turbine.
    pub fn exit_stream(&self) -> &Stream<G> {
        match (&self.reheat, &self.cooled) {
            (Some((_, burn, _)), _) => &burn.stream,
            (None, Some((stream, _))) => stream,
            (None, None) => &self.burn.stream,
        }
    }

    /// The gas entering the first rotor and its state.
    fn rotor(&self) -> (&Stream<G>, Point) {
        match &self.cooled {
            Some((stream, point)) => (stream, *point),
            None => (&self.burn.stream, self.turbine_inlet),
        }
    }
}

impl<C: Combustion> HotSection<'_, C> {
    /// Burn air entering at enthalpy `h_in` (kJ/kg) to state 3 and expand;
    /// `previous`, a solve at a nearby `h_in`, seeds the expansions.
    pub fn run(
        &self,
        h_in: f64,
        previous: Option<&Hot<C::Gas>>,
    ) -> Result<Hot<C::Gas>, CycleError> {
        let c = self.combustion;
        let intake = Stream {
            gas: c.air().clone(),
            fuel_per_kg_air: 0.0,
        };
        let burn = c.burn(&intake, h_in, self.t3_k, "turbine_inlet_temperature_k")?;
        let gas = &burn.stream.gas;
        let turbine_inlet = Point {
            t_k: self.t3_k,
            h: burn.h_out,
            s0: gas.standard_entropy_kj_per_kg_k(self.t3_k),
        };
        if self.cooling > 0.0 {
            return self.run_cooled(h_in, burn, turbine_inlet, previous);
        }
        let m1 = burn.stream.mass_per_kg_air();
        let (eta, basis) = (self.efficiency, self.basis);
        match self.reheat {
            None => {
                let seed = previous.map(|p| &p.last);
                let last = expand(gas, turbine_inlet, self.ln_turbine_ratio, eta, basis, seed)
                    .map_err(data_range("turbine_inlet_temperature_k", "4"))?;
                Ok(Hot {
                    turbine_work: m1 * (burn.h_out - last.actual.h),
                    fuel_energy: burn.fuel_energy_kj_per_kg_air,
                    burn,
                    turbine_inlet,
                    cooled: None,
                    reheat: None,
                    last,
                })
            }
            Some(split) => {
                let seed = previous.and_then(|p| p.reheat.as_ref().map(|r| &r.0));
                let hp = expand(gas, turbine_inlet, split.ln_hp, eta, basis, seed)
                    .map_err(data_range("reheat.pressure_split", "3a"))?;
                let t3a = hp.actual.t_k;
                if !greater(split.t_k, t3a) {
                    return Err(CycleError::invalid(
                        "reheat.temperature_k",
                        format!(
                            "{} K is not above the high-pressure turbine exit {t3a:.2} K",
                            split.t_k
                        ),
                        format!("expected a reheat temperature above {t3a:.2} K"),
                    ));
                }
                let second =
                    c.burn(&burn.stream, hp.actual.h, split.t_k, "reheat.temperature_k")?;
                let gas2 = &second.stream.gas;
                let reheated = Point {
                    t_k: split.t_k,
                    h: second.h_out,
                    s0: gas2.standard_entropy_kj_per_kg_k(split.t_k),
                };
                let seed = previous.map(|p| &p.last);
                let last = expand(gas2, reheated, split.ln_lp, eta, basis, seed)
                    .map_err(data_range("reheat.temperature_k", "4"))?;
                let m2 = second.stream.mass_per_kg_air();
                Ok(Hot {
                    turbine_work: m1 * (burn.h_out - hp.actual.h)
                        + m2 * (second.h_out - last.actual.h),
                    fuel_energy: burn.fuel_energy_kj_per_kg_air + second.fuel_energy_kj_per_kg_air,
                    burn,
                    turbine_inlet,
                    cooled: None,
                    reheat: Some((hp, second, reheated)),
                    last,
                })
            }
        }
    }

    /// The hot section with turbine cooling: the combustor burns the
    /// fraction `1 − c` of the air entering it to state 3 (the firing
    /// temperature); the rest, at the combustor inlet enthalpy `h_in`, mixes
    /// adiabatically at constant pressure with the combustor gas ahead of
    /// the rotor. Per kg of compressor inlet air the mixed gas holds the
    /// fuel `(1 − c) f_c` and has the enthalpy
    /// `h_3r = ((1 − c)(1 + f_c) h_3 + c h_in) / (1 + (1 − c) f_c)`; the
    /// rotor inlet temperature T_3r follows from it on the mixed gas, and
    /// the expansion starts there.
    fn run_cooled(
        &self,
        h_in: f64,
        burn: Burn<C::Gas>,
        turbine_inlet: Point,
        previous: Option<&Hot<C::Gas>>,
    ) -> Result<Hot<C::Gas>, CycleError> {
        let c = self.combustion;
        let share = 1.0 - self.cooling;
        let mixed = c.diluted(&burn.stream, share)?;
        let m_mix = mixed.mass_per_kg_air();
        let h_mix =
            (share * burn.stream.mass_per_kg_air() * burn.h_out + self.cooling * h_in) / m_mix;
        let guess = previous
            .and_then(|p| p.cooled.as_ref().map(|(_, point)| point.t_k))
            .unwrap_or(self.t3_k);
        let t_mix = mixed
            .gas
            .temperature_from_enthalpy(h_mix, guess)
            .map_err(data_range("turbine_cooling", "3r"))?;
        let rotor = Point {
            t_k: t_mix,
            h: h_mix,
            s0: mixed.gas.standard_entropy_kj_per_kg_k(t_mix),
        };
        let mut burn = burn;
        burn.fuel_energy_kj_per_kg_air *= share;
        let mut hot = Hot {
            turbine_work: 0.0,
            fuel_energy: burn.fuel_energy_kj_per_kg_air,
            burn,
            turbine_inlet,
            cooled: Some((mixed, rotor)),
            reheat: None,
            last: StageEnd {
                ideal: rotor,
                actual: rotor,
            },
        };
        self.expand_from_rotor(&mut hot, previous)?;
        Ok(hot)
    }

    /// Expand from the rotor inlet of `hot` (through the reheat combustor,
    /// if any), filling its turbine stages, work and fuel energy.
    fn expand_from_rotor(
        &self,
        hot: &mut Hot<C::Gas>,
        previous: Option<&Hot<C::Gas>>,
    ) -> Result<(), CycleError> {
        let c = self.combustion;
        let (eta, basis) = (self.efficiency, self.basis);
        let (stream, rotor) = hot.rotor();
        let stream = stream.clone();
        let m1 = stream.mass_per_kg_air();
        match self.reheat {
            None => {
                let seed = previous.map(|p| &p.last);
                let last = expand(&stream.gas, rotor, self.ln_turbine_ratio, eta, basis, seed)
                    .map_err(data_range("turbine_inlet_temperature_k", "4"))?;
                hot.turbine_work = m1 * (rotor.h - last.actual.h);
                hot.last = last;
            }
            Some(split) => {
                let seed = previous.and_then(|p| p.reheat.as_ref().map(|r| &r.0));
                let hp = expand(&stream.gas, rotor, split.ln_hp, eta, basis, seed)
                    .map_err(data_range("reheat.pressure_split", "3a"))?;
                let t3a = hp.actual.t_k;
                if !greater(split.t_k, t3a) {
                    return Err(CycleError::invalid(
                        "reheat.temperature_k",
                        format!(
                            "{} K is not above the high-pressure turbine exit {t3a:.2} K",
                            split.t_k
                        ),
                        format!("expected a reheat temperature above {t3a:.2} K"),
                    ));
                }
                let second = c.burn(&stream, hp.actual.h, split.t_k, "reheat.temperature_k")?;
                let gas2 = &second.stream.gas;
                let reheated = Point {
                    t_k: split.t_k,
                    h: second.h_out,
                    s0: gas2.standard_entropy_kj_per_kg_k(split.t_k),
                };
                let seed = previous.map(|p| &p.last);
                let last = expand(gas2, reheated, split.ln_lp, eta, basis, seed)
                    .map_err(data_range("reheat.temperature_k", "4"))?;
                let m2 = second.stream.mass_per_kg_air();
                hot.turbine_work =
                    m1 * (rotor.h - hp.actual.h) + m2 * (second.h_out - last.actual.h);
                hot.fuel_energy += second.fuel_energy_kj_per_kg_air;
                hot.reheat = Some((hp, second, reheated));
                hot.last = last;
            }
        }
        Ok(())
    }

    /// Move `hot` to another combustor inlet enthalpy `h_in`, when the gas
    /// does not depend on the fuel (air-standard models): only the main
    /// combustor's fuel energy changes; the turbines do not.
    pub fn rebase(&self, hot: &mut Hot<C::Gas>, h_in: f64) -> Result<(), CycleError> {
        let c = self.combustion;
        let intake = Stream {
            gas: c.air().clone(),
            fuel_per_kg_air: 0.0,
        };
        let burn = c.burn(&intake, h_in, self.t3_k, "turbine_inlet_temperature_k")?;
        hot.fuel_energy += burn.fuel_energy_kj_per_kg_air - hot.burn.fuel_energy_kj_per_kg_air;
        hot.burn = burn;
        Ok(())
    }

    /// Record states 3, (3as, 3a, 3b), 4s, 4 of `hot`: turbine inlet at
    /// `p3`, exit at `p4`, reheat combustor with pressure-loss fraction
    /// `reheat_loss`.
    pub fn record(
        &self,
        hot: &Hot<C::Gas>,
        table: &mut StateTable,
        p3: Pressure,
        p4: Pressure,
        reheat_loss: f64,
    ) {
        let r_burn = hot.burn.stream.gas.gas_constant_kj_per_kg_k();
        table.push("3", "turbine inlet", hot.turbine_inlet, p3, r_burn);
        let (rotor_stream, _) = hot.rotor();
        let r1 = rotor_stream.gas.gas_constant_kj_per_kg_k();
        if let Some((_, rotor)) = &hot.cooled {
            table.push("3r", "rotor inlet (after coolant mixing)", *rotor, p3, r1);
        }
        let mut r_last = r1;
        if let (Some((hp, second, reheated)), Some(split)) = (&hot.reheat, self.reheat) {
            let p3a = p3.times(1.0 / split.r_hp, -split.ln_hp);
            let r2 = second.stream.gas.gas_constant_kj_per_kg_k();
            table.push(
                "3as",
                "high-pressure turbine exit, isentropic",
                hp.ideal,
                p3a,
                r1,
            );
            table.push("3a", "high-pressure turbine exit", hp.actual, p3a, r1);
            table.push(
                "3b",
                "reheat combustor exit",
                *reheated,
                p3a.after_loss(reheat_loss),
                r2,
            );
            r_last = r2;
        }
        table.push("4s", "turbine exit, isentropic", hot.last.ideal, p4, r_last);
        table.push("4", "turbine exit", hot.last.actual, p4, r_last);
    }
}
