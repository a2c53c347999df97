//! The cycle chain: inlet → compression (with intercooling) → regenerator
//! air side → combustor → expansion (with reheat) → regenerator gas side →
//! exhaust, then the first-law check. Generic over the combustor model so
//! the cold-air path compiles to closed forms and the polynomial paths to
//! Newton solves, with no dynamic dispatch.

use super::components::{greater, Combustion, Point};
use super::compression::compression;
use super::config::{EngineConfig, Regenerator};
use super::error::CycleError;
use super::hot::{Hot, HotSection, ReheatSplit};
use super::states::{data_range, in_range, Pressure, StateTable};
use super::StatePoint;
use crate::thermo::{GasProperties, REFERENCE_TEMPERATURE_K};

/// First-law closure tolerance, relative to the heat input.
pub(crate) const CLOSURE_TOLERANCE: f64 = 1e-9;

/// Convergence of the regenerator loop: |Δh5| relative to |h5| (or 1 kJ/kg).
/// The first law closes exactly at any iterate (h5 and the gas-side exit are
/// set from one heat q); this tolerance only bounds the error in the
/// effectiveness actually applied (T5 within about 1e-7 K).
const REGENERATOR_TOLERANCE: f64 = 1e-10;

/// Everything the result needs, per kg of compressor inlet air where
/// specific.
pub(crate) struct Solved {
    pub states: Vec<StatePoint>,
    pub compressor_work: f64,
    pub turbine_work: f64,
    pub heat_input: f64,
    pub heat_rejected: f64,
    pub residual: f64,
    pub exhaust_temperature_k: f64,
    pub fuel_per_kg_air: f64,
}

/// Solve the cycle of `cfg` (already validated) with combustor model `c`
/// and the turbine-cooling fraction `cooling` (0: none).
pub(crate) fn run<C: Combustion>(
    cfg: &EngineConfig,
    c: &C,
    cooling: f64,
) -> Result<Solved, CycleError> {
    let air = c.air();
    let r_air = air.gas_constant_kj_per_kg_k();
    let t3 = cfg.turbine_inlet_temperature_k;
    in_range(air, "ambient_temperature_k", cfg.ambient_temperature_k)?;
    in_range(air, "turbine_inlet_temperature_k", t3)?;
    if let Some(rh) = &cfg.reheat {
        in_range(air, "reheat.temperature_k", rh.temperature_k)?;
    }

    let mut table = StateTable::new();
    let ambient = Pressure::new(cfg.ambient_pressure_kpa);
    let p1 = ambient.after_loss(cfg.inlet_pressure_loss);
    let inlet = Point::at(air, cfg.ambient_temperature_k);
    table.push("1", "compressor inlet", inlet, p1, r_air);
    let (compressed, p2) = compression(cfg, air, inlet, p1, &mut table)?;
    let delivery = compressed.exit.actual;
    let (t2, h2) = (delivery.t_k, delivery.h);
    if !greater(t3, t2) {
        return Err(CycleError::invalid(
            "turbine_inlet_temperature_k",
            format!("{t3} K is not above the compressor exit temperature {t2:.2} K"),
            format!("expected a turbine inlet temperature above {t2:.2} K"),
        ));
    }

    // Pressures through the hot section.
    let regen = cfg.regenerator;
    let p5 = regen.map_or(p2, |r| p2.after_loss(r.air_side_pressure_loss));
    let p3 = p5.after_loss(cfg.combustor_pressure_loss);
    let p6 = ambient.before_loss(cfg.exhaust_pressure_loss);
    let p4 = regen.map_or(p6, |r| p6.before_loss(r.gas_side_pressure_loss));
    let ln_turbine_ratio = p3.ln_rel - p4.ln_rel;
    if !greater(ln_turbine_ratio, 0.0) {
        return Err(CycleError::invalid(
            "pressure_ratio",
            format!(
                "after the pressure losses the turbine inlet ({:.3} kPa) is not above its exit ({:.3} kPa)",
                p3.kpa, p4.kpa
            ),
            format!(
                "expected a pressure ratio above {:.4} or smaller losses",
                cfg.pressure_ratio * p4.kpa / p3.kpa
            ),
        ));
    }
    let section = HotSection {
        combustion: c,
        t3_k: t3,
        ln_turbine_ratio,
        reheat: reheat_split(cfg, ln_turbine_ratio)?,
        efficiency: cfg.turbine_efficiency,
        basis: cfg.efficiency_basis,
        cooling,
    };

    // The hot section with the compressor delivery entering the combustor;
    // a regenerator then raises the combustor inlet enthalpy to h5.
    let mut hot = section.run(h2, None)?;
    let h5 = match &regen {
        None => None,
        Some(rg) => Some(regenerate(&section, rg, air, delivery, &mut hot)?),
    };
    if let Some(h5) = h5 {
        let t5 = air
            .temperature_from_enthalpy(h5, t2 + (h5 - h2) / air.cp_kj_per_kg_k(t2))
            .map_err(data_range("regenerator.effectiveness", "5"))?;
        let point = Point {
            t_k: t5,
            h: h5,
            s0: air.standard_entropy_kj_per_kg_k(t5),
        };
        table.push("5", "regenerator air exit", point, p5, r_air);
    }
    section.record(&hot, &mut table, p3, p4, cfg.combustor_pressure_loss);
    let exit = hot.exit_stream();
    let m_exhaust = exit.mass_per_kg_air();
    let last = hot.last.actual;
    let exhaust = match h5 {
        None => last,
        Some(h5) => {
            let h6 = last.h - (h5 - h2) / m_exhaust;
            let guess = last.t_k - (last.h - h6) / exit.gas.cp_kj_per_kg_k(last.t_k);
            let t6 = exit
                .gas
                .temperature_from_enthalpy(h6, guess)
                .map_err(data_range("regenerator.effectiveness", "6"))?;
            let point = Point {
                t_k: t6,
                h: h6,
                s0: exit.gas.standard_entropy_kj_per_kg_k(t6),
            };
            table.push(
                "6",
                "regenerator gas exit",
                point,
                p6,
                exit.gas.gas_constant_kj_per_kg_k(),
            );
            point
        }
    };

    // First law, per kg of compressor inlet air.
    let heat_input = hot.fuel_energy;
    let heat_rejected = m_exhaust
        * (exhaust.h - exit.gas.enthalpy_kj_per_kg(REFERENCE_TEMPERATURE_K))
        - (inlet.h - air.enthalpy_kj_per_kg(REFERENCE_TEMPERATURE_K))
        + compressed.intercooler_heat
        + (1.0 - c.efficiency()) * heat_input;
    let net = hot.turbine_work - compressed.work;
    let residual = net - (heat_input - heat_rejected);
    if residual.is_nan() || residual.abs() > CLOSURE_TOLERANCE * heat_input {
        return Err(CycleError::EnergyBalance {
            residual_kj_per_kg: residual,
            heat_input_kj_per_kg: heat_input,
        });
    }
    Ok(Solved {
        states: table.0,
        compressor_work: compressed.work,
        turbine_work: hot.turbine_work,
        heat_input,
        heat_rejected,
        residual,
        exhaust_temperature_k: exhaust.t_k,
        fuel_per_kg_air: exit.fuel_per_kg_air,
    })
}

/// Expansion ratios around the reheat combustor, if any, given the
/// logarithm of the overall turbine expansion ratio.
pub(crate) fn reheat_split(
    cfg: &EngineConfig,
    ln_turbine_ratio: f64,
) -> Result<Option<ReheatSplit>, CycleError> {
    let Some(rh) = &cfg.reheat else {
        return Ok(None);
    };
    let ln_available = ln_turbine_ratio + (-cfg.combustor_pressure_loss).ln_1p();
    let r_hp = rh
        .pressure_split
        .unwrap_or_else(|| (0.5 * ln_turbine_ratio).exp());
    let ln_hp = r_hp.ln();
    let ln_lp = ln_available - ln_hp;
    if !(greater(ln_hp, 0.0) && greater(ln_lp, 0.0)) {
        return Err(CycleError::invalid(
            "reheat.pressure_split",
            format!("a high-pressure turbine ratio of {r_hp:.4} leaves no expansion for the low-pressure turbine after the reheat combustor's loss"),
            format!("expected a ratio in (1, {:.4})", ln_available.exp()),
        ));
    }
    Ok(Some(ReheatSplit {
        r_hp,
        ln_hp,
        ln_lp,
        t_k: rh.temperature_k,
    }))
}

/// Solve the regenerator: find the combustor inlet enthalpy h5 such that
/// `h5 = h2 + q(h5)`, where the heat passed q depends on the turbine exit,
/// which (with `products`) depends on the fuel burned and so on h5. The
/// air-standard models need one pass; `products` iterates by secant.
/// `hot` enters solved for h5 = h2 and leaves solved for the returned h5.
fn regenerate<C: Combustion>(
    section: &HotSection<'_, C>,
    rg: &Regenerator,
    air: &C::Gas,
    delivery: Point,
    hot: &mut Hot<C::Gas>,
) -> Result<f64, CycleError> {
    let (t2, h2) = (delivery.t_k, delivery.h);
    let heat_passed = |hot: &Hot<C::Gas>| -> Result<f64, CycleError> {
        let t4 = hot.last.actual.t_k;
        if !greater(t4, t2) {
            return Err(CycleError::invalid(
                "regenerator.effectiveness",
                format!("the turbine exit ({t4:.2} K) is not hotter than the compressor exit ({t2:.2} K), so a regenerator would heat the exhaust instead of the combustor air"),
                "remove the regenerator, or raise the turbine inlet temperature or lower the pressure ratio",
            ));
        }
        let stream = hot.exit_stream();
        let gas_side =
            stream.mass_per_kg_air() * (hot.last.actual.h - stream.gas.enthalpy_kj_per_kg(t2));
        let air_side = air.enthalpy_kj_per_kg(t4) - h2;
        Ok(rg.effectiveness * air_side.min(gas_side))
    };
    let q0 = heat_passed(hot)?;
    if !C::COMPOSITION_FOLLOWS_FUEL && section.cooling == 0.0 {
        // The turbine gas does not depend on the fuel (and, uncooled, the
        // rotor inlet not on h5): q is final, and only the combustor's fuel
        // energy changes.
        let h5 = h2 + q0;
        section.rebase(hot, h5)?;
        return Ok(h5);
    }
    let (mut x0, mut g0) = (h2, q0);
    let mut x1 = h2 + q0;
    *hot = section.run(x1, Some(hot))?;
    let mut g1 = h2 + heat_passed(hot)? - x1;
    for _ in 0..60 {
        if g1.abs() <= REGENERATOR_TOLERANCE * x1.abs().max(1.0) {
            return Ok(x1);
        }
        let slope = (g1 - g0) / (x1 - x0);
        let next = if slope.is_finite() && slope != 0.0 {
            x1 - g1 / slope
        } else {
            x1 + g1
        };
        (x0, g0) = (x1, g1);
        x1 = next;
        *hot = section.run(x1, Some(hot))?;
        g1 = h2 + heat_passed(hot)? - x1;
    }
    Err(CycleError::NoConvergence { last_change: g1 })
}
