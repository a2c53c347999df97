//! Part-load control: from a requested load to the vane setting and firing
//! temperature that give it, within the exhaust temperature limit.

use super::error::OffDesignError;
use super::machine::{Hint, Machine, Matched};
use super::roots::{increasing_root, Eval, Found};
use super::{Ambient, Limit, Strategy};
use crate::cycle::CycleError;

/// Output is matched to the target within this fraction of it (above the
/// matching's own noise of about 1e-9).
const LOAD_TOLERANCE: f64 = 1e-8;
/// The exhaust temperature is held to its limit within this, K.
const EXHAUST_TOLERANCE_K: f64 = 1e-6;
/// Bracket width at which a search stops, relative to the variable.
const BRACKET_TOLERANCE: f64 = 1e-13;

/// A cycle refusal met while searching: below the valid region (no net
/// work, firing below the compressor delivery) or a real error.
fn undefined_or<T>(e: CycleError) -> Result<Eval<T>, OffDesignError> {
    match e {
        CycleError::NoNetWork { .. } => Ok(None),
        CycleError::Invalid {
            field: "turbine_inlet_temperature_k" | "regenerator.effectiveness",
            ..
        } => Ok(None),
        source => Err(OffDesignError::Cycle {
            context: "off-design point".into(),
            source,
        }),
    }
}

fn cycle_error(source: CycleError) -> OffDesignError {
    OffDesignError::Cycle {
        context: "off-design point".into(),
        source,
    }
}

impl Machine {
    /// The state at `vanes` with the firing temperature at its rated value,
    /// unless the exhaust limit binds first (then lowered to hold it).
    pub(crate) fn at_vanes(
        &self,
        ambient: &Ambient,
        vanes: f64,
        hint: Option<Hint>,
    ) -> Result<(Matched, Limit), OffDesignError> {
        let rated_firing = self.design.turbine_inlet_temperature_k;
        let hot = self
            .matched(ambient, vanes, rated_firing, hint)
            .map_err(cycle_error)?;
        let over = hot.turbine_exit_k() - self.exhaust_limit_k;
        if over <= EXHAUST_TOLERANCE_K {
            return Ok((hot, Limit::FiringTemperature));
        }
        // Exhaust temperature rises with firing temperature at fixed vanes:
        // lower the firing temperature until it sits at the limit.
        let lo = hot.delivery_k();
        // About 1.3 K of exhaust per K of firing near design (first guess).
        let x0 = rated_firing - over / 1.3;
        let limit_k = self.exhaust_limit_k;
        let exhaust = |r: &crate::cycle::CycleResult, _air: f64| {
            r.states
                .iter()
                .find(|s| s.id == "4")
                .map_or(f64::NAN, |s| s.temperature_k)
                - limit_k
        };
        // The folded search first; its root must lie in the bracket the
        // nested search would use.
        let fast = self.matched_to_goal(ambient, &hot, x0, lo, EXHAUST_TOLERANCE_K, exhaust);
        if let Some(m) = fast.filter(|m| m.firing_temperature_k <= rated_firing) {
            return Ok((m, Limit::ExhaustTemperature));
        }
        let cooling = self.turbine_cooling;
        let mut hint = Some(hot.hint(cooling));
        let found = increasing_root(
            |t3| match self.matched(ambient, vanes, t3, hint) {
                Ok(m) => {
                    hint = Some(m.hint(cooling));
                    Ok(Some((m.turbine_exit_k() - self.exhaust_limit_k, m)))
                }
                Err(e) => undefined_or(e),
            },
            lo,
            (rated_firing, over, hot),
            x0,
            EXHAUST_TOLERANCE_K,
            BRACKET_TOLERANCE * rated_firing,
        )?;
        match found {
            Found::Root(m) => Ok((m, Limit::ExhaustTemperature)),
            Found::Undefined => Err(OffDesignError::NoOperatingPoint(format!(
                "the exhaust temperature limit {:.2} K cannot be held at {:.2} K ambient with the guide vanes at {:.3} of rated flow: the machine makes no net work at any firing temperature that keeps its exhaust that cool",
                self.exhaust_limit_k, ambient.temperature_k, vanes
            ))),
        }
    }

    /// Base load at `ambient`: vanes open, rated firing temperature unless
    /// the exhaust limit binds first.
    pub(crate) fn base(&self, ambient: &Ambient) -> Result<(Matched, Limit), OffDesignError> {
        self.at_vanes(ambient, 1.0, None)
    }

    /// At fixed `vanes`, lower the firing temperature from `top` until the
    /// output is `target_kw`.
    fn at_output_by_firing(
        &self,
        ambient: &Ambient,
        top: Matched,
        target_kw: f64,
    ) -> Result<Matched, OffDesignError> {
        let vanes = top.vanes;
        let hi_t3 = top.firing_temperature_k;
        let lo = top.delivery_k();
        let top_kw = top.net_output_kw();
        // Output is roughly linear in firing temperature above the point of
        // no net work, which lies some way above the compressor delivery.
        let zero_guess = lo + 0.45 * (hi_t3 - lo);
        let x0 = zero_guess + (hi_t3 - zero_guess) * target_kw / top_kw;
        let output =
            |r: &crate::cycle::CycleResult, air: f64| air * r.electrical_work_kj_per_kg - target_kw;
        let fast = self.matched_to_goal(ambient, &top, x0, lo, LOAD_TOLERANCE * target_kw, output);
        if let Some(m) = fast.filter(|m| m.firing_temperature_k <= hi_t3) {
            return Ok(m);
        }
        let cooling = self.turbine_cooling;
        let mut hint = Some(top.hint(cooling));
        let found = increasing_root(
            |t3| match self.matched(ambient, vanes, t3, hint) {
                Ok(m) => {
                    hint = Some(m.hint(cooling));
                    Ok(Some((m.net_output_kw() - target_kw, m)))
                }
                Err(e) => undefined_or(e),
            },
            lo,
            (hi_t3, top_kw - target_kw, top),
            x0,
            LOAD_TOLERANCE * target_kw,
            BRACKET_TOLERANCE * hi_t3,
        )?;
        match found {
            Found::Root(m) => Ok(m),
            Found::Undefined => Err(OffDesignError::NoOperatingPoint(format!(
                "no firing temperature gives {target_kw:.1} kW at {:.2} K ambient with the guide vanes at {vanes:.3} of rated flow (below some firing temperature the machine makes no net work, or a regenerator's hot side would be colder than its air side); raise the minimum load",
                ambient.temperature_k
            ))),
        }
    }

    /// Guide-vane control below base load: close the vanes holding the
    /// exhaust at its limit (firing temperature at most rated), down to the
    /// minimum airflow; below that, lower the firing temperature.
    pub(crate) fn by_guide_vanes(
        &self,
        ambient: &Ambient,
        base: Matched,
        target_kw: f64,
    ) -> Result<(Matched, Limit), OffDesignError> {
        let w_min = self.control.minimum_airflow;
        let cooling = self.turbine_cooling;
        let (closed, closed_limit) = self.at_vanes(ambient, w_min, Some(base.hint(cooling)))?;
        let closed_kw = closed.net_output_kw();
        if closed_kw <= target_kw {
            if (closed_kw - target_kw).abs() <= LOAD_TOLERANCE * target_kw {
                return Ok((closed, closed_limit));
            }
            if closed_limit == Limit::ExhaustTemperature {
                if let Some(m) = self.vane_segment(ambient, &base, &closed, target_kw) {
                    return Ok((m, Limit::ExhaustTemperature));
                }
            }
            let base_kw = base.net_output_kw();
            // First guess: output roughly proportional to air flow.
            let x0 = w_min + (1.0 - w_min) * (target_kw - closed_kw) / (base_kw - closed_kw);
            let mut hint = Some(closed.hint(cooling));
            let found = increasing_root(
                |w| {
                    let (m, limit) = self.at_vanes(ambient, w, hint)?;
                    hint = Some(m.hint(cooling));
                    Ok(Some((m.net_output_kw() - target_kw, (m, limit))))
                },
                w_min,
                (1.0, base_kw - target_kw, (base, Limit::FiringTemperature)),
                x0,
                LOAD_TOLERANCE * target_kw,
                BRACKET_TOLERANCE,
            )?;
            return match found {
                Found::Root(found) => Ok(found),
                Found::Undefined => Err(OffDesignError::NoConvergence {
                    what: "guide-vane",
                    last_change: f64::NAN,
                }),
            };
        }
        let m = self.at_output_by_firing(ambient, closed, target_kw)?;
        Ok((m, Limit::MinimumAirflow))
    }

    /// The vane segment solved directly: find the vane setting w and firing
    /// temperature T3 with output `target_kw` and the exhaust at its limit,
    /// by Newton's method on the two equations (Jacobian by finite
    /// differences once, then Broyden updates). Starts from the straight
    /// line between the closed (`closed`) and open (`base`) ends. `None`
    /// when it does not converge within its budget or lands on a firing
    /// temperature above rated (a cold day, where the firing limit binds
    /// first): the nested search then answers.
    fn vane_segment(
        &self,
        ambient: &Ambient,
        base: &Matched,
        closed: &Matched,
        target_kw: f64,
    ) -> Option<Matched> {
        let limit = self.exhaust_limit_k;
        let rated = self.design.turbine_inlet_temperature_k;
        let cooling = self.turbine_cooling;
        let (p0, p1) = (closed.net_output_kw(), base.net_output_kw());
        let s = (target_kw - p0) / (p1 - p0);
        let mut x = [
            closed.vanes + s * (base.vanes - closed.vanes),
            closed.firing_temperature_k
                + s * (base.firing_temperature_k - closed.firing_temperature_k),
        ];
        let mut hint = Some(base.hint(cooling));
        let eval = |x: [f64; 2], hint: &mut Option<Hint>| -> Option<([f64; 2], Matched)> {
            let m = self.matched(ambient, x[0], x[1], *hint).ok()?;
            *hint = Some(m.hint(cooling));
            let r = [
                m.net_output_kw() / target_kw - 1.0,
                (m.turbine_exit_k() - limit) / limit,
            ];
            Some((r, m))
        };
        let (mut r, mut m) = eval(x, &mut hint)?;
        // Jacobian by forward differences.
        let steps = [1e-5, 1e-5 * x[1]];
        let mut jac = [[0.0; 2]; 2];
        for (k, step) in steps.iter().enumerate() {
            let mut xk = x;
            xk[k] += step;
            let (rk, _) = eval(xk, &mut hint)?;
            for i in 0..2 {
                jac[i][k] = (rk[i] - r[i]) / step;
            }
        }
        for _ in 0..12 {
            let converged = r[0].abs() <= LOAD_TOLERANCE
                && (m.turbine_exit_k() - limit).abs() <= EXHAUST_TOLERANCE_K;
            if converged {
                let in_range = m.firing_temperature_k <= rated
                    && m.vanes >= self.control.minimum_airflow
                    && m.vanes <= 1.0;
                return in_range.then_some(m);
            }
            let det = jac[0][0] * jac[1][1] - jac[0][1] * jac[1][0];
            if !(det.is_finite() && det != 0.0) {
                return None;
            }
            let dx = [
                -(jac[1][1] * r[0] - jac[0][1] * r[1]) / det,
                -(-jac[1][0] * r[0] + jac[0][0] * r[1]) / det,
            ];
            let next = [x[0] + dx[0], x[1] + dx[1]];
            let (rn, mn) = eval(next, &mut hint)?;
            // Broyden's update: J += ((Δr − J Δx) Δxᵀ) / (Δxᵀ Δx).
            let norm = dx[0] * dx[0] + dx[1] * dx[1];
            if norm > 0.0 {
                for i in 0..2 {
                    let predicted = jac[i][0] * dx[0] + jac[i][1] * dx[1];
                    let miss = (rn[i] - r[i]) - predicted;
                    for k in 0..2 {
                        jac[i][k] += miss * dx[k] / norm;
                    }
                }
            }
            (x, r, m) = (next, rn, mn);
        }
        None
    }

    /// Firing-temperature control: vanes open, firing temperature lowered
    /// until the output is the target.
    pub(crate) fn by_firing_temperature(
        &self,
        ambient: &Ambient,
        base: Matched,
        target_kw: f64,
    ) -> Result<(Matched, Limit), OffDesignError> {
        let m = self.at_output_by_firing(ambient, base, target_kw)?;
        Ok((m, Limit::FixedAirflow))
    }

    /// The control's answer for `target_kw` below base load.
    pub(crate) fn part_load(
        &self,
        ambient: &Ambient,
        base: Matched,
        target_kw: f64,
    ) -> Result<(Matched, Limit), OffDesignError> {
        match self.control.strategy {
            Strategy::GuideVanes => self.by_guide_vanes(ambient, base, target_kw),
            Strategy::FiringTemperature => self.by_firing_temperature(ambient, base, target_kw),
        }
    }
}
