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
}

/// The hot section solved for one combustor inlet enthalpy.
pub(crate) struct Hot<G> {
    /// Main combustor exit.
    pub burn: Burn<G>,
    /// State 3.
    pub turbine_inlet: Point,
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
        match &self.reheat {
            Some((_, burn, _)) => &burn.stream,
            None => &self.burn.stream,
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
                    reheat: Some((hp, second, reheated)),
                    last,
                })
            }
        }
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
        let r1 = hot.burn.stream.gas.gas_constant_kj_per_kg_k();
        table.push("3", "turbine inlet", hot.turbine_inlet, p3, r1);
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
