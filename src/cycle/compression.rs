//! Compression from state 1 to state 2, through one compressor or through a
//! low-pressure compressor, an intercooler and a high-pressure compressor.

use super::components::{compress, greater, Point, StageEnd};
use super::config::{EngineConfig, IntercoolerExit};
use super::error::CycleError;
use super::states::{data_range, in_range, Pressure, StateTable};
use crate::thermo::GasProperties;

/// The compressor delivery and what it cost, per kg of inlet air.
pub(crate) struct Compression {
    /// Delivery (state 2) and its isentropic counterpart (2s).
    pub exit: StageEnd,
    /// Work of all compressors, kJ/kg.
    pub work: f64,
    /// Heat removed by the intercooler, kJ/kg (0 without one).
    pub intercooler_heat: f64,
}

/// Compress from `inlet` (state 1, pressure `p1`), recording the states
/// `2as, 2a, 2b` (intercooled) and `2s, 2` into `table`. Returns the
/// compression and the delivery pressure.
pub(crate) fn compression<G: GasProperties>(
    cfg: &EngineConfig,
    air: &G,
    inlet: Point,
    p1: Pressure,
    table: &mut StateTable,
) -> Result<(Compression, Pressure), CycleError> {
    let eta = cfg.compressor_efficiency;
    let basis = cfg.efficiency_basis;
    let r_air = air.gas_constant_kj_per_kg_k();
    let ln_ratio = cfg.pressure_ratio.ln();
    let p2 = p1.times(cfg.pressure_ratio, ln_ratio);
    let result = match &cfg.intercooler {
        None => {
            let exit = compress(air, inlet, ln_ratio, eta, basis)
                .map_err(data_range("pressure_ratio", "2"))?;
            Compression {
                exit,
                work: exit.actual.h - inlet.h,
                intercooler_heat: 0.0,
            }
        }
        Some(ic) => {
            let r_lp = ic
                .pressure_split
                .unwrap_or_else(|| cfg.pressure_ratio.sqrt());
            let ln_lp = r_lp.ln();
            let lp = compress(air, inlet, ln_lp, eta, basis)
                .map_err(data_range("pressure_ratio", "2a"))?;
            let p2a = p1.times(r_lp, ln_lp);
            table.push(
                "2as",
                "low-pressure compressor exit, isentropic",
                lp.ideal,
                p2a,
                r_air,
            );
            table.push("2a", "low-pressure compressor exit", lp.actual, p2a, r_air);
            let t2a = lp.actual.t_k;
            let (t2b, field) = match ic.exit {
                IntercoolerExit::TemperatureK(t) => (t, "intercooler.exit_temperature_k"),
                IntercoolerExit::Effectiveness(e) => (
                    t2a - e * (t2a - cfg.ambient_temperature_k),
                    "intercooler.effectiveness",
                ),
            };
            if !greater(t2a, t2b) {
                return Err(CycleError::invalid(
                    field,
                    format!("intercooler exit {t2b} K is not below the low-pressure compressor exit {t2a:.2} K"),
                    format!("expected an intercooler exit temperature below {t2a:.2} K"),
                ));
            }
            in_range(air, field, t2b)?;
            let cooled = Point::at(air, t2b);
            table.push("2b", "intercooler exit", cooled, p2a, r_air);
            let hp = compress(air, cooled, ln_ratio - ln_lp, eta, basis)
                .map_err(data_range("pressure_ratio", "2"))?;
            Compression {
                exit: hp,
                work: (lp.actual.h - inlet.h) + (hp.actual.h - cooled.h),
                intercooler_heat: lp.actual.h - cooled.h,
            }
        }
    };
    table.push(
        "2s",
        "compressor exit, isentropic",
        result.exit.ideal,
        p2,
        r_air,
    );
    table.push("2", "compressor exit", result.exit.actual, p2, r_air);
    Ok((result, p2))
}
