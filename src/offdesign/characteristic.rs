//! The generic component characteristics of a fixed machine away from its
//! design point. Each is a smooth function equal to 1 at design, so the
//! rating point is reproduced exactly.
//!
//! These are generic shapes, not a particular machine's maps; a bid's own
//! curves, where it gives them, replace them in a later step.

/// Exponent of corrected speed in the compressor's corrected flow at a
/// fixed vane setting: `W√T/p ∝ (N/√T)^a`, a = 1.
///
/// From memory: the constant-speed lines of a multistage axial compressor
/// at high speed are steep (nearly vertical) and space roughly in
/// proportion to corrected speed near design (Saravanamuttoo et al., *Gas
/// Turbine Theory*, off-design chapter; Walsh and Fletcher, *Gas Turbine
/// Performance*, compressor maps). Corrected flow is therefore taken
/// independent of pressure ratio along a speed line.
pub const FLOW_SPEED_EXPONENT: f64 = 1.0;

/// Compressor efficiency loss per squared fractional corrected-speed
/// deviation: `η/η_d = 1 − b_N (1 − N_c/N_cd)² − b_V (1 − w)²`, b_N = 1.5.
/// Generic parabolic fall-off away from the design speed (from memory, after
/// the efficiency islands of a generic axial map in Saravanamuttoo et al.
/// and Walsh and Fletcher).
pub const COMPRESSOR_SPEED_LOSS: f64 = 1.5;

/// Compressor efficiency loss per squared vane closure (1 − w), b_V = 0.3:
/// closing the inlet guide vanes to 70 % flow costs about 2.7 % of the
/// design efficiency (from memory; Kim and Hwang, J. Eng. Gas Turbines
/// Power 125 (2003), show losses of a few points over the guide-vane range,
/// and Razak, *Industrial Gas Turbines*, describes the same trend).
pub const COMPRESSOR_VANE_LOSS: f64 = 0.3;

/// Turbine efficiency loss per squared fractional deviation of the blade
/// speed ratio: `η/η_d = 1 − c (1 − ν/ν_d)²`, c = 0.4, with
/// `ν ∝ U/√(2 Δh_is)` at constant mechanical speed, so
/// `ν/ν_d = √(Δh_is,d / Δh_is)`. From memory: the bell-shaped efficiency
/// against velocity ratio of an axial turbine stage (Saravanamuttoo et al.,
/// turbine chapter), which is flat near its optimum.
pub const TURBINE_LOADING_LOSS: f64 = 0.4;

/// Lowest and highest compressor corrected-speed ratio the generic
/// characteristic is used over (about −40 °C to +60 °C around an ISO
/// rating); outside, the machine is beyond any characteristic we state.
pub const CORRECTED_SPEED_RANGE: (f64, f64) = (0.90, 1.12);

/// Compressor corrected flow over its design value, at corrected-speed
/// ratio `speed` (N_c/N_cd) and guide-vane airflow fraction `vanes` (the
/// fraction of the rated corrected flow the vane setting passes at rated
/// corrected speed).
pub fn corrected_flow_fraction(speed: f64, vanes: f64) -> f64 {
    vanes * speed.powf(FLOW_SPEED_EXPONENT)
}

/// Compressor isentropic (or polytropic) efficiency over its design value.
pub fn compressor_efficiency_factor(speed: f64, vanes: f64) -> f64 {
    let ds = 1.0 - speed;
    let dv = 1.0 - vanes;
    1.0 - COMPRESSOR_SPEED_LOSS * ds * ds - COMPRESSOR_VANE_LOSS * dv * dv
}

/// Turbine efficiency over its design value, given the isentropic enthalpy
/// drop over its design value (`loading` = Δh_is / Δh_is,d > 0).
pub fn turbine_efficiency_factor(loading: f64) -> f64 {
    let d = 1.0 - 1.0 / loading.sqrt();
    1.0 - TURBINE_LOADING_LOSS * d * d
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_characteristic_is_one_at_design() {
        assert_eq!(corrected_flow_fraction(1.0, 1.0), 1.0);
        assert_eq!(compressor_efficiency_factor(1.0, 1.0), 1.0);
        assert_eq!(turbine_efficiency_factor(1.0), 1.0);
    }

    #[test]
    fn efficiencies_fall_away_from_design() {
        assert!(compressor_efficiency_factor(0.95, 1.0) < 1.0);
        assert!(compressor_efficiency_factor(1.0, 0.7) < 1.0);
        assert!(turbine_efficiency_factor(0.8) < 1.0);
        assert!(turbine_efficiency_factor(1.2) < 1.0);
    }
}
