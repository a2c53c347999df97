//! The state table as the solve fills it, and the errors that point at the
//! input responsible when a state leaves the property data.

use super::components::Point;
use super::error::CycleError;
use super::StatePoint;
use crate::thermo::{GasProperties, ThermoError, STANDARD_PRESSURE_KPA};

/// A pressure and its logarithm relative to the standard pressure,
/// `ln(p / p°)`, carried along so that each state's entropy costs no
/// logarithm of its own.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Pressure {
    /// Pressure, kPa.
    pub kpa: f64,
    /// ln(p / 101.325 kPa).
    pub ln_rel: f64,
}

impl Pressure {
    /// The pressure `kpa`.
    pub fn new(kpa: f64) -> Pressure {
        let ln_rel = if kpa == STANDARD_PRESSURE_KPA {
            0.0
        } else {
            (kpa / STANDARD_PRESSURE_KPA).ln()
        };
        Pressure { kpa, ln_rel }
    }

    /// This pressure times a ratio r given with its logarithm.
    pub fn times(self, ratio: f64, ln_ratio: f64) -> Pressure {
        Pressure {
            kpa: self.kpa * ratio,
            ln_rel: self.ln_rel + ln_ratio,
        }
    }

    /// The pressure after a loss of the fraction `loss` of this one. The
    /// logarithm is that of the rounded factor `1 − loss` the pressure is
    /// multiplied by, so the two stay consistent.
    pub fn after_loss(self, loss: f64) -> Pressure {
        if loss == 0.0 {
            self
        } else {
            let factor = 1.0 - loss;
            self.times(factor, factor.ln())
        }
    }

    /// The pressure upstream of a loss of the fraction `loss` that ends at
    /// this one.
    pub fn before_loss(self, loss: f64) -> Pressure {
        if loss == 0.0 {
            self
        } else {
            let factor = 1.0 - loss;
            Pressure {
                kpa: self.kpa / factor,
                ln_rel: self.ln_rel - factor.ln(),
            }
        }
    }
}

/// State points in flow order.
pub(crate) struct StateTable(pub Vec<StatePoint>);

impl StateTable {
    /// An empty table with room for the largest cycle (14 states).
    pub fn new() -> Self {
        StateTable(Vec::with_capacity(14))
    }

    /// Record `point` at pressure `p` on a gas of gas constant `r`
    /// kJ/(kg·K): `s = s°(T) − R ln(p / p°)`.
    pub fn push(
        &mut self,
        id: &'static str,
        name: &'static str,
        point: Point,
        p: Pressure,
        r: f64,
    ) {
        self.0.push(StatePoint {
            id,
            name,
            temperature_k: point.t_k,
            pressure_kpa: p.kpa,
            enthalpy_kj_per_kg: point.h,
            entropy_kj_per_kg_k: point.s0 - r * p.ln_rel,
        });
    }
}

/// Map a property-range failure at `state` to an error on `field`.
pub(crate) fn data_range(
    field: &'static str,
    state: &'static str,
) -> impl Fn(ThermoError) -> CycleError {
    move |e| {
        CycleError::invalid(
            field,
            format!("state {state}: {e}"),
            "expected inputs that keep every state within the property data",
        )
    }
}

/// Ok when the input temperature `t_k` of `field` lies in `gas`'s range.
pub(crate) fn in_range<G: GasProperties>(
    gas: &G,
    field: &'static str,
    t_k: f64,
) -> Result<(), CycleError> {
    gas.check_temperature(t_k).map_err(|e| {
        CycleError::invalid(
            field,
            e.to_string(),
            "expected a temperature within the property data",
        )
    })
}
