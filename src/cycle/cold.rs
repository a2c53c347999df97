//! The cold-air standard in closed form: the cycle of [`super::solver`] for a
//! gas of constant cp, where every end state is a power law of its pressure
//! ratio and no state needs an inverse solve:
//!
//! - isentropic end `T_s = T_in · r^(±(k−1)/k)`, computed as
//!   `exp(±(k−1)/k · ln r)` from the logarithm of the ratio the pressures
//!   already carry;
//! - actual end by isentropic efficiency `T = T_in + (T_s − T_in)/η`
//!   (compressor) or `T = T_in − η (T_in − T_s)` (turbine), by polytropic
//!   efficiency `T = T_in · r^(±(k−1)/(k η^±1))`;
//! - standard entropy `s° = cp ln(T / 298.15 K)`, one logarithm per state
//!   whose temperature is not on a known isentrope (`s°(T_s)` is the
//!   inlet's plus `±R ln r`), and `s = s° − R ln(p / p°)` with the pressure's
//!   logarithm shared by every state at that pressure.
//!
//! This path only solves, it never explains: when any check of the generic
//! solver would fail here (an input the physics does not allow, a
//! temperature the model cannot hold, a first-law residual above the
//! tolerance) it returns `None`, and the caller runs the generic solver,
//! which meets the same failure and reports it with its field. On every
//! cycle this path solves, both agree to rounding (`cold_tests.rs` checks
//! both directions on random engines).

use super::components::greater;
use super::config::{EfficiencyBasis, EngineConfig, IntercoolerExit};
use super::solver::{reheat_split, Solved, CLOSURE_TOLERANCE};
use super::states::Pressure;
use super::StatePoint;
use crate::thermo::cold_air::ColdAir;
use crate::thermo::{GasProperties, REFERENCE_TEMPERATURE_K};

/// 1 / 298.15 K, so each standard entropy costs a multiplication and a
/// logarithm, no division.
const INVERSE_REFERENCE_TEMPERATURE: f64 = 1.0 / REFERENCE_TEMPERATURE_K;

/// The gas constants the closed forms use.
#[derive(Clone, Copy)]
struct Gas {
    /// cp, kJ/(kg·K).
    cp: f64,
    /// R, kJ/(kg·K).
    r: f64,
    /// (k − 1)/k = R/cp.
    exponent: f64,
}

/// A state's temperature (K) and standard entropy (kJ/(kg·K)).
#[derive(Clone, Copy)]
struct Ts {
    t_k: f64,
    s0: f64,
}

/// Ideal and actual end of a compression or expansion.
#[derive(Clone, Copy)]
struct End {
    ideal: Ts,
    actual: Ts,
}

/// Whether every temperature seen is one the cold-air model holds (finite
/// and > 0, the condition of its inverse solves), kept as a running sum
/// (infinite or NaN as soon as one temperature is) and a running minimum,
/// and checked once. A sum that overflows only sends the cycle to the
/// generic solver.
struct Holds {
    sum: f64,
    min: f64,
}

impl Holds {
    #[inline(always)]
    fn new() -> Holds {
        Holds {
            sum: 0.0,
            min: f64::INFINITY,
        }
    }

    #[inline(always)]
    fn see(&mut self, t_k: f64) {
        self.sum += t_k;
        if t_k < self.min {
            self.min = t_k;
        }
    }

    #[inline(always)]
    fn see_end(&mut self, end: &End) {
        self.see(end.ideal.t_k);
        self.see(end.actual.t_k);
    }

    #[inline(always)]
    fn all(&self) -> bool {
        self.sum.is_finite() && self.min > 0.0
    }
}

impl Gas {
    /// The state at `t_k`.
    #[inline(always)]
    fn at(self, t_k: f64) -> Ts {
        Ts {
            t_k,
            s0: self.cp * (t_k * INVERSE_REFERENCE_TEMPERATURE).ln(),
        }
    }

    /// Compress from `inlet` through a ratio r > 1 given as `ln_ratio`.
    #[inline(always)]
    fn compress(self, inlet: Ts, ln_ratio: f64, eta: f64, basis: EfficiencyBasis) -> End {
        let ideal = Ts {
            t_k: inlet.t_k * (self.exponent * ln_ratio).exp(),
            s0: inlet.s0 + self.r * ln_ratio,
        };
        let actual = match basis {
            EfficiencyBasis::Isentropic => self.at(inlet.t_k + (ideal.t_k - inlet.t_k) / eta),
            EfficiencyBasis::Polytropic => Ts {
                t_k: inlet.t_k * (self.exponent * ln_ratio / eta).exp(),
                s0: inlet.s0 + self.r * ln_ratio / eta,
            },
        };
        End { ideal, actual }
    }

    /// Expand from `inlet` through a ratio r > 1 given as `ln_ratio`.
    #[inline(always)]
    fn expand(self, inlet: Ts, ln_ratio: f64, eta: f64, basis: EfficiencyBasis) -> End {
        let ideal = Ts {
            t_k: inlet.t_k * (-self.exponent * ln_ratio).exp(),
            s0: inlet.s0 - self.r * ln_ratio,
        };
        let actual = match basis {
            EfficiencyBasis::Isentropic => self.at(inlet.t_k - eta * (inlet.t_k - ideal.t_k)),
            EfficiencyBasis::Polytropic => Ts {
                t_k: inlet.t_k * (-self.exponent * ln_ratio * eta).exp(),
                s0: inlet.s0 - self.r * ln_ratio * eta,
            },
        };
        End { ideal, actual }
    }
}

/// The state table being filled.
struct Table {
    gas: Gas,
    states: Vec<StatePoint>,
}

impl Table {
    #[inline(always)]
    fn push(&mut self, id: &'static str, name: &'static str, state: Ts, p: Pressure) {
        self.states.push(StatePoint {
            id,
            name,
            temperature_k: state.t_k,
            pressure_kpa: p.kpa,
            enthalpy_kj_per_kg: self.gas.cp * state.t_k,
            entropy_kj_per_kg_k: state.s0 - self.gas.r * p.ln_rel,
        });
    }
}

/// Compression from state 1: the delivery (2s, 2), the compressor work and
/// the intercooler heat, all as temperature differences (× cp later).
struct Compressed {
    exit: End,
    work_k: f64,
    intercooler_k: f64,
}

/// Solve `cfg` (already validated) on cold air `air` with combustion
/// efficiency `eta_b`; `None` when the generic solver must run instead (see
/// the module documentation).
#[inline(always)]
pub(crate) fn run(cfg: &EngineConfig, air: &ColdAir, eta_b: f64) -> Option<Solved> {
    let gas = Gas {
        cp: air.constant_cp_kj_per_kg_k(),
        r: air.gas_constant_kj_per_kg_k(),
        exponent: air.isentropic_exponent(),
    };
    let t1 = cfg.ambient_temperature_k;
    let t3 = cfg.turbine_inlet_temperature_k;
    air.check_temperature(t1).ok()?;
    air.check_temperature(t3).ok()?;
    if let Some(rh) = &cfg.reheat {
        air.check_temperature(rh.temperature_k).ok()?;
    }
    let regen = cfg.regenerator;
    let count = 6
        + 3 * usize::from(cfg.intercooler.is_some())
        + 2 * usize::from(regen.is_some())
        + 3 * usize::from(cfg.reheat.is_some());
    let mut table = Table {
        gas,
        states: Vec::with_capacity(count),
    };
    let (eta_c, eta_t, basis) = (
        cfg.compressor_efficiency,
        cfg.turbine_efficiency,
        cfg.efficiency_basis,
    );

    let mut seen = Holds::new();
    let ambient = Pressure::new(cfg.ambient_pressure_kpa);
    let p1 = ambient.after_loss(cfg.inlet_pressure_loss);
    let inlet = gas.at(t1);
    table.push("1", "compressor inlet", inlet, p1);
    // Every pressure first: their logarithms wait on no temperature, so
    // they overlap with the compression (measurably faster than computing
    // them after it).
    let ln_ratio = cfg.pressure_ratio.ln();
    let p2 = p1.times(cfg.pressure_ratio, ln_ratio);
    let p5 = regen.map_or(p2, |r| p2.after_loss(r.air_side_pressure_loss));
    let p3 = p5.after_loss(cfg.combustor_pressure_loss);
    let p6 = ambient.before_loss(cfg.exhaust_pressure_loss);
    let p4 = regen.map_or(p6, |r| p6.before_loss(r.gas_side_pressure_loss));
    let ln_turbine_ratio = p3.ln_rel - p4.ln_rel;
    if !greater(ln_turbine_ratio, 0.0) {
        return None;
    }
    let split = match cfg.reheat {
        None => None,
        Some(_) => reheat_split(cfg, ln_turbine_ratio).ok()?,
    };

    // Compression: one compressor, or a low-pressure compressor, the
    // intercooler and a high-pressure compressor.
    let compressed = match &cfg.intercooler {
        None => {
            let exit = gas.compress(inlet, ln_ratio, eta_c, basis);
            seen.see_end(&exit);
            Compressed {
                exit,
                work_k: exit.actual.t_k - t1,
                intercooler_k: 0.0,
            }
        }
        Some(ic) => {
            let r_lp = ic
                .pressure_split
                .unwrap_or_else(|| cfg.pressure_ratio.sqrt());
            let ln_lp = r_lp.ln();
            let lp = gas.compress(inlet, ln_lp, eta_c, basis);
            seen.see_end(&lp);
            let p2a = p1.times(r_lp, ln_lp);
            let t2a = lp.actual.t_k;
            let t2b = match ic.exit {
                IntercoolerExit::TemperatureK(t) => t,
                IntercoolerExit::Effectiveness(e) => t2a - e * (t2a - t1),
            };
            if !greater(t2a, t2b) {
                return None;
            }
            air.check_temperature(t2b).ok()?;
            let cooled = gas.at(t2b);
            let hp = gas.compress(cooled, ln_ratio - ln_lp, eta_c, basis);
            seen.see_end(&hp);
            table.push(
                "2as",
                "low-pressure compressor exit, isentropic",
                lp.ideal,
                p2a,
            );
            table.push("2a", "low-pressure compressor exit", lp.actual, p2a);
            table.push("2b", "intercooler exit", cooled, p2a);
            Compressed {
                exit: hp,
                work_k: (t2a - t1) + (hp.actual.t_k - t2b),
                intercooler_k: t2a - t2b,
            }
        }
    };
    let delivery = compressed.exit.actual;
    let t2 = delivery.t_k;
    table.push(
        "2s",
        "compressor exit, isentropic",
        compressed.exit.ideal,
        p2,
    );
    table.push("2", "compressor exit", delivery, p2);
    if !greater(t3, t2) {
        return None;
    }

    // Expansion: one turbine, or a high-pressure turbine, the reheat
    // combustor and a low-pressure turbine; turbine temperature drop and
    // reheat temperature rise, K.
    let turbine_inlet = gas.at(t3);
    let (last, reheat, turbine_k, reheat_rise_k) = match split {
        None => {
            let last = gas.expand(turbine_inlet, ln_turbine_ratio, eta_t, basis);
            seen.see_end(&last);
            (last, None, t3 - last.actual.t_k, 0.0)
        }
        Some(split) => {
            let hp = gas.expand(turbine_inlet, split.ln_hp, eta_t, basis);
            seen.see_end(&hp);
            let t3a = hp.actual.t_k;
            if !greater(split.t_k, t3a) || !greater(gas.cp * split.t_k - gas.cp * t3a, 0.0) {
                return None;
            }
            let reheated = gas.at(split.t_k);
            let last = gas.expand(reheated, split.ln_lp, eta_t, basis);
            seen.see_end(&last);
            let work_k = (t3 - t3a) + (split.t_k - last.actual.t_k);
            (last, Some((hp, reheated, split)), work_k, split.t_k - t3a)
        }
    };
    let t4 = last.actual.t_k;

    // Regenerator: with one gas and equal flows both sides' heat capacities
    // are equal, so q = ε cp (T4 − T2).
    let (combustor_inlet_k, exhaust_k) = match &regen {
        None => (t2, t4),
        Some(rg) => {
            if !greater(t4, t2) {
                return None;
            }
            let t5 = t2 + rg.effectiveness * (t4 - t2);
            let t6 = t4 - (t5 - t2);
            seen.see(t5);
            seen.see(t6);
            table.push("5", "regenerator air exit", gas.at(t5), p5);
            (t5, t6)
        }
    };
    let main_rise = gas.cp * t3 - gas.cp * combustor_inlet_k;
    if !greater(main_rise, 0.0) {
        return None;
    }
    table.push("3", "turbine inlet", turbine_inlet, p3);
    if let Some((hp, reheated, split)) = reheat {
        let p3a = p3.times(1.0 / split.r_hp, -split.ln_hp);
        table.push(
            "3as",
            "high-pressure turbine exit, isentropic",
            hp.ideal,
            p3a,
        );
        table.push("3a", "high-pressure turbine exit", hp.actual, p3a);
        table.push(
            "3b",
            "reheat combustor exit",
            reheated,
            p3a.after_loss(cfg.combustor_pressure_loss),
        );
    }
    table.push("4s", "turbine exit, isentropic", last.ideal, p4);
    table.push("4", "turbine exit", last.actual, p4);
    if regen.is_some() {
        table.push("6", "regenerator gas exit", gas.at(exhaust_k), p6);
    }

    // First law, per kg of compressor inlet air.
    let cp = gas.cp;
    let heat_input = (main_rise + cp * reheat_rise_k) / eta_b;
    let h_reference = cp * REFERENCE_TEMPERATURE_K;
    let heat_rejected = (cp * exhaust_k - h_reference) - (cp * t1 - h_reference)
        + cp * compressed.intercooler_k
        + (1.0 - eta_b) * heat_input;
    let compressor_work = cp * compressed.work_k;
    let turbine_work = cp * turbine_k;
    let residual = (turbine_work - compressor_work) - (heat_input - heat_rejected);
    if !seen.all() || residual.is_nan() || residual.abs() > CLOSURE_TOLERANCE * heat_input {
        return None;
    }
    Some(Solved {
        states: table.states,
        compressor_work,
        turbine_work,
        heat_input,
        heat_rejected,
        residual,
        exhaust_temperature_k: exhaust_k,
        fuel_per_kg_air: 0.0,
    })
}
