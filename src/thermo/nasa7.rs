//! NASA 7-coefficient polynomials: the two-range parameterisation of an
//! ideal gas's heat capacity, enthalpy and standard-state entropy.
//!
//! For a range with coefficients `a1..a7` (McBride, Gordon & Reno, NASA
//! TM-4513, 1993, eqs. 1–3):
//!
//! ```text
//! cp/R  = a1 + a2 T + a3 T² + a4 T³ + a5 T⁴
//! h/R   = a1 T + a2 T²/2 + a3 T³/3 + a4 T⁴/4 + a5 T⁵/5 + a6
//! s°/R  = a1 ln T + a2 T + a3 T²/2 + a4 T³/3 + a5 T⁴/4 + a7
//! ```
//!
//! Species data are stored dimensionless (divided by the universal gas
//! constant R, per mole). Because every expression is linear in the
//! coefficients, a weighted sum of polynomials that share the same range
//! break is again a polynomial of this form: a mixture is evaluated as fast
//! as one species, and a polynomial scaled by `R / M` gives mass-specific
//! values directly (kJ/kg, kJ/(kg·K)).

/// A two-range NASA 7-coefficient polynomial.
///
/// The `low` coefficients apply for `T ≤ t_mid_k`, the `high` ones above it
/// (the same convention as Cantera's `NasaPoly2`). The values returned are in
/// the units of the coefficients: for species data `cp/R`, `h/R` (K) and
/// `s°/R`; for a polynomial scaled by a specific gas constant in kJ/(kg·K),
/// kJ/(kg·K), kJ/kg and kJ/(kg·K).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Nasa7 {
    /// Temperature of the break between the two ranges, K.
    pub t_mid_k: f64,
    /// Coefficients `a1..a7` for `T ≤ t_mid_k`.
    pub low: [f64; 7],
    /// Coefficients `a1..a7` for `T > t_mid_k`.
    pub high: [f64; 7],
}

impl Nasa7 {
    /// The polynomial that is zero everywhere, with the given range break;
    /// the starting point of a weighted sum.
    pub const fn zero(t_mid_k: f64) -> Nasa7 {
        Nasa7 {
            t_mid_k,
            low: [0.0; 7],
            high: [0.0; 7],
        }
    }

    #[inline]
    fn coefficients(&self, temperature_k: f64) -> &[f64; 7] {
        if temperature_k <= self.t_mid_k {
            &self.low
        } else {
            &self.high
        }
    }

    /// Heat capacity at constant pressure, `cp` in the coefficients' units.
    #[inline]
    pub fn cp(&self, temperature_k: f64) -> f64 {
        let a = self.coefficients(temperature_k);
        let t = temperature_k;
        a[0] + t * (a[1] + t * (a[2] + t * (a[3] + t * a[4])))
    }

    /// Enthalpy (absolute: includes the enthalpy of formation carried by
    /// `a6`), in the coefficients' units times kelvin.
    #[inline]
    pub fn enthalpy(&self, temperature_k: f64) -> f64 {
        let a = self.coefficients(temperature_k);
        let t = temperature_k;
        t * (a[0] + t * (a[1] / 2.0 + t * (a[2] / 3.0 + t * (a[3] / 4.0 + t * a[4] / 5.0)))) + a[5]
    }

    /// Standard-state entropy `s°` (at the reference pressure of the data),
    /// in the coefficients' units.
    #[inline]
    pub fn standard_entropy(&self, temperature_k: f64) -> f64 {
        let a = self.coefficients(temperature_k);
        let t = temperature_k;
        a[0] * t.ln() + t * (a[1] + t * (a[2] / 2.0 + t * (a[3] / 3.0 + t * a[4] / 4.0))) + a[6]
    }

    /// Add `weight × other` to this polynomial (both ranges).
    ///
    /// Invariant: both polynomials break at the same temperature; the caller
    /// checks this (see [`Nasa7::same_break`]).
    pub fn add_scaled(&mut self, other: &Nasa7, weight: f64) {
        for i in 0..7 {
            self.low[i] += weight * other.low[i];
            self.high[i] += weight * other.high[i];
        }
    }

    /// This polynomial with every coefficient multiplied by `factor`
    /// (changes the units, e.g. from dimensionless to kJ/(kg·K)).
    pub fn scaled(&self, factor: f64) -> Nasa7 {
        let mut out = Nasa7::zero(self.t_mid_k);
        out.add_scaled(self, factor);
        out
    }

    /// Add a constant to the entropy of both ranges (`a7`): used for the
    /// entropy of mixing, `−Σ xᵢ ln xᵢ`.
    pub fn add_entropy_constant(&mut self, constant: f64) {
        self.low[6] += constant;
        self.high[6] += constant;
    }

    /// Whether two polynomials break between ranges at the same temperature,
    /// so that their weighted sum is again a two-range polynomial.
    pub fn same_break(&self, other: &Nasa7) -> bool {
        self.t_mid_k == other.t_mid_k
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Argon is a monatomic gas: cp/R = 5/2 exactly at every temperature
    /// (kinetic theory; GRI-Mech 3.0 carries a1 = 2.5 and a2..a5 = 0).
    #[test]
    fn monatomic_gas_has_constant_cp_and_linear_enthalpy() {
        let ar = Nasa7 {
            t_mid_k: 1000.0,
            low: [2.5, 0.0, 0.0, 0.0, 0.0, -745.375, 4.366],
            high: [2.5, 0.0, 0.0, 0.0, 0.0, -745.375, 4.366],
        };
        for t in [300.0, 999.0, 1000.0, 1001.0, 2500.0] {
            assert_eq!(ar.cp(t), 2.5);
            assert!((ar.enthalpy(t) - (2.5 * t - 745.375)).abs() < 1e-12 * t);
        }
        let ds = ar.standard_entropy(2000.0) - ar.standard_entropy(1000.0);
        assert!((ds - 2.5 * 2.0_f64.ln()).abs() < 1e-13);
    }

    /// Consistency of the three expressions: dh/dT = cp and ds°/dT = cp/T
    /// (definitions), checked by central differences on an arbitrary
    /// polynomial.
    #[test]
    fn enthalpy_and_entropy_are_integrals_of_cp() {
        let p = Nasa7 {
            t_mid_k: 1000.0,
            low: [3.3, 1.4e-3, -3.9e-6, 5.6e-9, -2.4e-12, -1020.0, 3.9],
            high: [2.9, 1.5e-3, -5.7e-7, 1.0e-10, -6.8e-15, -922.0, 5.9],
        };
        for t in [250.0, 600.0, 1500.0, 2900.0] {
            let d = 1e-3;
            let dh = (p.enthalpy(t + d) - p.enthalpy(t - d)) / (2.0 * d);
            let ds = (p.standard_entropy(t + d) - p.standard_entropy(t - d)) / (2.0 * d);
            assert!((dh - p.cp(t)).abs() < 1e-7 * p.cp(t));
            assert!((ds - p.cp(t) / t).abs() < 1e-7 * p.cp(t) / t);
        }
    }

    #[test]
    fn weighted_sum_evaluates_as_the_sum_of_evaluations() {
        let a = Nasa7 {
            t_mid_k: 1000.0,
            low: [3.3, 1.4e-3, -3.9e-6, 5.6e-9, -2.4e-12, -1020.0, 3.9],
            high: [2.9, 1.5e-3, -5.7e-7, 1.0e-10, -6.8e-15, -922.0, 5.9],
        };
        let b = Nasa7 {
            t_mid_k: 1000.0,
            low: [3.8, -3.0e-3, 9.8e-6, -9.7e-9, 3.2e-12, -1064.0, 3.7],
            high: [3.3, 1.5e-3, -7.6e-7, 2.1e-10, -2.2e-14, -1088.0, 5.5],
        };
        assert!(a.same_break(&b));
        let mut sum = a.scaled(0.79);
        sum.add_scaled(&b, 0.21);
        for t in [300.0, 1000.0, 2000.0] {
            let expect = 0.79 * a.enthalpy(t) + 0.21 * b.enthalpy(t);
            assert!((sum.enthalpy(t) - expect).abs() < 1e-12 * expect.abs().max(1.0));
        }
    }
}
