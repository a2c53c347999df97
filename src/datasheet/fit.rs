//! The calibration's fit: two gas-path unknowns and the electro-mechanical
//! efficiency found by Newton's method with a forward-difference Jacobian
//! and step halving, each unknown kept within bounds (see
//! [`mod@super::calibrate`] for what is fitted and why).

use super::calibrate::{CalibrationOptions, Residuals};
use super::{Datasheet, DatasheetError};
use crate::cycle::{self, CycleResult, GasModel};

/// Which two gas-path unknowns are fitted (beside ε).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(super) enum Fit {
    EfficiencyAndCooling,
    EfficiencyAndFiring,
    EfficiencyAndRatio,
    RatioAndFiring,
}

impl Fit {
    pub(super) fn names(&self) -> [&'static str; 3] {
        let [a, b] = match self {
            Fit::EfficiencyAndCooling => ["compressor_polytropic_efficiency", "turbine_cooling"],
            Fit::EfficiencyAndFiring => {
                ["compressor_polytropic_efficiency", "firing_temperature_k"]
            }
            Fit::EfficiencyAndRatio => ["compressor_polytropic_efficiency", "pressure_ratio"],
            Fit::RatioAndFiring => ["pressure_ratio", "firing_temperature_k"],
        };
        [a, b, "electro_mechanical_efficiency"]
    }
}

/// One candidate engine in the fit.
#[derive(Debug, Clone, Copy)]
pub(super) struct Engine {
    pub(super) eta_c: f64,
    pub(super) pressure_ratio: f64,
    pub(super) firing_k: f64,
    pub(super) cooling: f64,
    pub(super) electro_mechanical: f64,
}

/// The fit as a problem in three unknowns.
pub(super) struct Problem<'a> {
    pub(super) sheet: &'a Datasheet,
    pub(super) options: &'a CalibrationOptions,
    pub(super) fit: Fit,
    pub(super) start: Engine,
}

/// Lower and upper bounds of each unknown.
const ETA_BOUNDS: (f64, f64) = (0.6, 0.999);
const RATIO_BOUNDS: (f64, f64) = (2.0, 80.0);
const COOLING_BOUNDS: (f64, f64) = (0.0, 0.45);
const EPSILON_BOUNDS: (f64, f64) = (0.5, 1.0);
const FIRING_MAX_K: f64 = 2600.0;

impl Problem<'_> {
    fn x0(&self) -> [f64; 3] {
        let s = &self.start;
        let [a, b] = match self.fit {
            Fit::EfficiencyAndCooling => [s.eta_c, s.cooling],
            Fit::EfficiencyAndFiring => [s.eta_c, s.firing_k],
            Fit::EfficiencyAndRatio => [s.eta_c, s.pressure_ratio],
            Fit::RatioAndFiring => [s.pressure_ratio, s.firing_k],
        };
        [a, b, s.electro_mechanical]
    }

    fn bounds(&self) -> [(f64, f64); 3] {
        let eta_high = ETA_BOUNDS.1.min(1.0 + self.options.efficiency_gap - 1e-3);
        let eta = (ETA_BOUNDS.0, eta_high);
        let firing = (self.sheet.exhaust_temperature_k + 1.0, FIRING_MAX_K);
        let [a, b] = match self.fit {
            Fit::EfficiencyAndCooling => [eta, COOLING_BOUNDS],
            Fit::EfficiencyAndFiring => [eta, firing],
            Fit::EfficiencyAndRatio => [eta, RATIO_BOUNDS],
            Fit::RatioAndFiring => [RATIO_BOUNDS, firing],
        };
        [a, b, EPSILON_BOUNDS]
    }

    pub(super) fn engine(&self, x: &[f64; 3]) -> Engine {
        let mut e = self.start;
        match self.fit {
            Fit::EfficiencyAndCooling => {
                e.eta_c = x[0];
                e.cooling = x[1];
            }
            Fit::EfficiencyAndFiring => {
                e.eta_c = x[0];
                e.firing_k = x[1];
                e.cooling = self.options.cooling_for(x[1]);
            }
            Fit::EfficiencyAndRatio => {
                e.eta_c = x[0];
                e.pressure_ratio = x[1];
            }
            Fit::RatioAndFiring => {
                e.pressure_ratio = x[0];
                e.firing_k = x[1];
                e.cooling = self.options.cooling_for(x[1]);
            }
        }
        e.electro_mechanical = x[2];
        e
    }

    pub(super) fn evaluate(
        &self,
        e: &Engine,
    ) -> Result<(CycleResult, Residuals), cycle::CycleError> {
        let config = self.options.config(self.sheet, e);
        let detail = cycle::Detail {
            turbine_cooling: e.cooling,
            relative_humidity: self.sheet.rating.relative_humidity,
        };
        let result =
            cycle::solve_detailed(&config, &detail, &GasModel::Products, &self.sheet.fuel)?;
        let flows = result.flows.ok_or(cycle::CycleError::NoConvergence {
            last_change: f64::NAN,
        })?;
        let residuals = Residuals {
            heat_rate_relative: result.heat_rate_kj_per_kwh / self.sheet.heat_rate_lhv_kj_per_kwh()
                - 1.0,
            exhaust_temperature_k: result.exhaust_temperature_k - self.sheet.exhaust_temperature_k,
            exhaust_flow_relative: flows.exhaust_flow_kg_per_s / self.sheet.exhaust_flow_kg_per_s
                - 1.0,
            net_output_relative: flows.net_output_kw / self.sheet.net_output_kw - 1.0,
        };
        Ok((result, residuals))
    }

    /// The three conditions at `x`, each relative.
    fn residual(&self, x: &[f64; 3]) -> Option<[f64; 3]> {
        let (_, r) = self.evaluate(&self.engine(x)).ok()?;
        Some([
            r.heat_rate_relative,
            r.exhaust_temperature_k / self.sheet.exhaust_temperature_k,
            r.exhaust_flow_relative,
        ])
    }

    pub(super) fn newton(&self) -> Result<[f64; 3], DatasheetError> {
        let bounds = self.bounds();
        let clamp = |x: [f64; 3]| {
            let mut y = x;
            for (v, (lo, hi)) in y.iter_mut().zip(bounds) {
                *v = v.clamp(lo, hi);
            }
            y
        };
        let norm = |r: &[f64; 3]| r.iter().map(|v| v * v).sum::<f64>().sqrt();
        let mut x = clamp(self.x0());
        let mut r = self.residual(&x).ok_or_else(|| {
            DatasheetError::NoFit(
                "the starting engine does not solve; the figures are far from any single-shaft gas turbine".into(),
            )
        })?;
        for _ in 0..60 {
            if r.iter().all(|v| v.abs() <= 1e-9) {
                return Ok(x);
            }
            let mut jacobian = [[0.0; 3]; 3];
            for j in 0..3 {
                let (lo, hi) = bounds[j];
                let mut h = 1e-6 * x[j].abs().max(1e-3);
                if x[j] + h > hi {
                    h = -h;
                }
                let mut xh = x;
                xh[j] = (x[j] + h).max(lo);
                let rh = self.residual(&xh).ok_or_else(|| self.stuck(&x))?;
                for i in 0..3 {
                    jacobian[i][j] = (rh[i] - r[i]) / h;
                }
            }
            let Some(step) = solve3(jacobian, [-r[0], -r[1], -r[2]]) else {
                return Err(self.stuck(&x));
            };
            let mut lambda = 1.0;
            let mut accepted = None;
            for _ in 0..30 {
                let trial = clamp([
                    x[0] + lambda * step[0],
                    x[1] + lambda * step[1],
                    x[2] + lambda * step[2],
                ]);
                if let Some(rt) = self.residual(&trial) {
                    if norm(&rt) < norm(&r) {
                        accepted = Some((trial, rt));
                        break;
                    }
                }
                lambda *= 0.5;
            }
            match accepted {
                Some((xt, rt)) => {
                    x = xt;
                    r = rt;
                }
                None => return Err(self.stuck(&x)),
            }
        }
        if r.iter().all(|v| v.abs() <= 1e-7) {
            Ok(x)
        } else {
            Err(self.stuck(&x))
        }
    }

    /// The failure message: which unknown sits at its bound, if one.
    fn stuck(&self, x: &[f64; 3]) -> DatasheetError {
        let names = self.fit.names();
        let at_bound: Vec<String> = x
            .iter()
            .zip(self.bounds())
            .zip(names)
            .filter(|((v, (lo, hi)), _)| {
                (**v - lo).abs() <= 1e-9 * lo.abs().max(1.0) || (**v - hi).abs() <= 1e-9 * hi.abs()
            })
            .map(|((v, (lo, _)), name)| {
                let side = if (*v - lo).abs() <= 1e-9 * lo.abs().max(1.0) {
                    "below"
                } else {
                    "above"
                };
                format!("{name} would have to go {side} {v:.4}")
            })
            .collect();
        let why = if at_bound.is_empty() {
            "the iteration found no engine that reproduces rating.heat_rate, rating.exhaust_temperature and rating.exhaust_flow together".to_string()
        } else {
            format!(
                "no engine of this arrangement reproduces rating.heat_rate, rating.exhaust_temperature and rating.exhaust_flow together: {}",
                at_bound.join(", ")
            )
        };
        DatasheetError::NoFit(why)
    }
}

/// Solve the 3 × 3 system `a x = b` by Gaussian elimination with partial
/// pivoting; `None` when singular.
fn solve3(mut a: [[f64; 3]; 3], mut b: [f64; 3]) -> Option<[f64; 3]> {
    for k in 0..3 {
        let p = (k..3).max_by(|&i, &j| a[i][k].abs().total_cmp(&a[j][k].abs()))?;
        if a[p][k] == 0.0 || !a[p][k].is_finite() {
            return None;
        }
        a.swap(k, p);
        b.swap(k, p);
        let pivot_row = a[k];
        for i in k + 1..3 {
            let m = a[i][k] / pivot_row[k];
            for (cell, pivot) in a[i].iter_mut().zip(pivot_row).skip(k) {
                *cell -= m * pivot;
            }
            b[i] -= m * b[k];
        }
    }
    let mut x = [0.0; 3];
    for k in (0..3).rev() {
        let s: f64 = (k + 1..3).map(|j| a[k][j] * x[j]).sum();
        x[k] = (b[k] - s) / a[k][k];
    }
    x.iter().all(|v| v.is_finite()).then_some(x)
}

#[cfg(test)]
mod tests {
    use super::solve3;
    use crate::datasheet::balance::root;

    /// A 3 × 3 system whose first pivot is zero (needs the row swap), with
    /// the answer (1, −2, 3) worked by hand; and a singular one.
    #[test]
    fn solve3_pivots_and_refuses_singular_systems() {
        let a = [[0.0, 2.0, 1.0], [1.0, 1.0, 1.0], [2.0, -1.0, 4.0]];
        let x = [1.0, -2.0, 3.0];
        let b = [
            a[0][0] * x[0] + a[0][1] * x[1] + a[0][2] * x[2],
            a[1][0] * x[0] + a[1][1] * x[1] + a[1][2] * x[2],
            a[2][0] * x[0] + a[2][1] * x[1] + a[2][2] * x[2],
        ];
        let got = solve3(a, b).unwrap();
        for (g, e) in got.iter().zip(x) {
            assert!((g - e).abs() < 1e-12, "{got:?}");
        }
        let singular = [[1.0, 2.0, 3.0], [2.0, 4.0, 6.0], [0.0, 1.0, 1.0]];
        assert!(solve3(singular, [1.0, 2.0, 3.0]).is_none());
    }

    #[test]
    fn root_finds_the_square_root_of_two_and_gives_up_without_values() {
        let r = root(|x| Some(x * x - 2.0), 1.0, 2.0).unwrap();
        assert!((r - 2f64.sqrt()).abs() < 1e-12);
        assert!(root(|_| None, 1.0, 2.0).is_none());
        assert!(root(|_| Some(1.0), 1.0, 2.0).is_none());
    }
}
