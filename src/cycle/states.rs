//! The state table as the solve fills it, and the errors that point at the
//! input responsible when a state leaves the property data.

use super::components::Point;
use super::error::CycleError;
use super::StatePoint;
use crate::thermo::{GasProperties, ThermoError, STANDARD_PRESSURE_KPA};

/// State points in flow order.
pub(crate) struct StateTable(pub Vec<StatePoint>);

impl StateTable {
    /// An empty table with room for the largest cycle (14 states).
    pub fn new() -> Self {
        StateTable(Vec::with_capacity(14))
    }

    /// Record `point` at `p_kpa` on a gas of gas constant `r` kJ/(kg·K):
    /// `s = s°(T) − R ln(p / p°)`.
    pub fn push(&mut self, id: &'static str, name: &'static str, point: Point, p_kpa: f64, r: f64) {
        self.0.push(StatePoint {
            id,
            name,
            temperature_k: point.t_k,
            pressure_kpa: p_kpa,
            enthalpy_kj_per_kg: point.h,
            entropy_kj_per_kg_k: point.s0 - r * (p_kpa / STANDARD_PRESSURE_KPA).ln(),
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
