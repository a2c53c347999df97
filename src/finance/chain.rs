//! Discount and escalation factors advanced period by period.
//!
//! A factor `g^t` is carried from one cash time to the next by multiplying by
//! `g^Δt`. Full years step by exactly `Δt = 1`, a single multiplication by
//! `g`; only partial periods take a fractional power. This keeps the cost per
//! row to one multiplication per factor, with the rounding error of `n`
//! products (under 1e-14 relative over 60 years) instead of a power per row.

/// A factor `growth^t`, advanced through increasing times `t` (years).
#[derive(Debug, Clone, Copy)]
pub(crate) struct FactorChain {
    growth: f64,
    value: f64,
    /// The factor at `t = 0`: 1, or `growth^-b` for a chain whose base time
    /// is `b` (see [`FactorChain::discount_to`]).
    start: f64,
}

impl FactorChain {
    /// The factor `growth^t` starting at `t = 0` (value 1).
    pub(crate) fn new(growth: f64) -> FactorChain {
        FactorChain {
            growth,
            value: 1.0,
            start: 1.0,
        }
    }

    /// A chain for a discount rate to a base time `base_years` (years since
    /// commercial operation; negative for a date before it): the factor
    /// `(1 + d)^-(t - base)`. A base of 0 is [`FactorChain::discount`]
    /// exactly.
    pub(crate) fn discount_to(rate: f64, base_years: f64) -> FactorChain {
        let mut chain = FactorChain::discount(rate);
        let start = chain.at(-base_years);
        chain.start = start;
        chain.value = start;
        chain
    }

    /// A chain for a discount rate: the factor `(1 + d)^-t`.
    pub(crate) fn discount(rate: f64) -> FactorChain {
        FactorChain::new(1.0 / (1.0 + rate))
    }

    /// A chain for an escalation rate: the factor `(1 + e)^t`.
    pub(crate) fn escalation(rate: f64) -> FactorChain {
        FactorChain::new(1.0 + rate)
    }

    /// Move forward by `step_years` (≥ 0) and return the new factor.
    pub(crate) fn advance(&mut self, step_years: f64) -> f64 {
        if step_years == 1.0 {
            self.value *= self.growth;
        } else if step_years != 0.0 {
            self.value *= self.growth.powf(step_years);
        }
        self.value
    }

    /// The factor `growth^t` at an arbitrary time, without moving the chain.
    pub(crate) fn at(&self, time_years: f64) -> f64 {
        // 1^t is 1 for every t (IEEE 754 `pow`), so a flat chain needs no
        // power.
        let factor = if time_years == 0.0 || self.growth == 1.0 {
            1.0
        } else {
            self.growth.powf(time_years)
        };
        if self.start == 1.0 {
            factor
        } else {
            self.start * factor
        }
    }
}
