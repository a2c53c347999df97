//! Species data: NASA 7-coefficient polynomials and elemental composition of
//! every gas brayfin models.
//!
//! Sources (coefficients copied digit for digit, with the source of each block
//! beside it):
//! - GRI-Mech 3.0 thermodynamic data (G. P. Smith, D. M. Golden, M. Frenklach
//!   et al., Gas Research Institute), as carried in Cantera's `gri30.yaml`:
//!   N2, O2, Ar, CO2, H2O, CH4, C2H6, C3H8, CO, H2.
//! - n-butane is not in GRI-Mech 3.0. Its coefficients are from B. J. McBride,
//!   S. Gordon and M. A. Reno, "Coefficients for Calculating Thermodynamic and
//!   Transport Properties of Individual Species", NASA TM-4513 (1993), as
//!   carried in Cantera's `nasa_gas.yaml` (species `C4H10,n-butane`, data
//!   note "L 6/90").
//!
//! All polynomials break at 1000 K and refer to a standard-state pressure of
//! 101.325 kPa. Their published ranges start at 200 K or 300 K (N2, Ar, C3H8:
//! 300 K); brayfin uses every one from 200 K to 3000 K, extrapolating the
//! low range of the three 300 K species down to 200 K (a smooth cubic in T,
//! which Cantera also evaluates there).

use super::nasa7::Nasa7;

/// Standard atomic weights, kg/kmol: the conventional values of the IUPAC
/// Commission on Isotopic Abundances and Atomic Weights (abridged table),
/// the same values Cantera uses.
pub mod atomic_weight {
    /// Carbon, kg/kmol (IUPAC).
    pub const C: f64 = 12.011;
    /// Hydrogen, kg/kmol (IUPAC).
    pub const H: f64 = 1.008;
    /// Oxygen, kg/kmol (IUPAC).
    pub const O: f64 = 15.999;
    /// Nitrogen, kg/kmol (IUPAC).
    pub const N: f64 = 14.007;
    /// Argon, kg/kmol (IUPAC).
    pub const AR: f64 = 39.95;
}

/// Atoms of each element in one molecule.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Atoms {
    /// Carbon atoms.
    pub c: f64,
    /// Hydrogen atoms.
    pub h: f64,
    /// Oxygen atoms.
    pub o: f64,
    /// Nitrogen atoms.
    pub n: f64,
    /// Argon atoms.
    pub ar: f64,
}

/// One ideal-gas species: its formula, elemental composition and NASA-7
/// polynomial (dimensionless: `cp/R`, `h/R` in K, `s°/R`).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Species {
    /// Formula as brayfin writes it (e.g. `"CO2"`, `"nC4H10"`).
    pub name: &'static str,
    /// Elemental composition.
    pub atoms: Atoms,
    /// Thermodynamic polynomial (dimensionless).
    pub poly: Nasa7,
}

impl Species {
    /// Molar mass in kg/kmol from the composition and the standard atomic
    /// weights.
    pub fn molar_mass_kg_per_kmol(&self) -> f64 {
        let a = &self.atoms;
        a.c * atomic_weight::C
            + a.h * atomic_weight::H
            + a.o * atomic_weight::O
            + a.n * atomic_weight::N
            + a.ar * atomic_weight::AR
    }
}

const fn atoms(c: f64, h: f64, o: f64, n: f64, ar: f64) -> Atoms {
    Atoms { c, h, o, n, ar }
}

/// Nitrogen. GRI-Mech 3.0 (`gri30.yaml`), published range 300–5000 K.
pub const N2: Species = Species {
    name: "N2",
    atoms: atoms(0.0, 0.0, 0.0, 2.0, 0.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [
            3.298677,
            0.0014082404,
            -3.963222e-06,
            5.641515e-09,
            -2.444854e-12,
            -1020.8999,
            3.950372,
        ],
        high: [
            2.92664,
            0.0014879768,
            -5.68476e-07,
            1.0097038e-10,
            -6.753351e-15,
            -922.7977,
            5.980528,
        ],
    },
};

/// Oxygen. GRI-Mech 3.0 (`gri30.yaml`), published range 200–3500 K.
pub const O2: Species = Species {
    name: "O2",
    atoms: atoms(0.0, 0.0, 2.0, 0.0, 0.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [
            3.78245636,
            -0.00299673416,
            9.84730201e-06,
            -9.68129509e-09,
            3.24372837e-12,
            -1063.94356,
            3.65767573,
        ],
        high: [
            3.28253784,
            0.00148308754,
            -7.57966669e-07,
            2.09470555e-10,
            -2.16717794e-14,
            -1088.45772,
            5.45323129,
        ],
    },
};

/// Argon. GRI-Mech 3.0 (`gri30.yaml`), published range 300–5000 K.
pub const AR: Species = Species {
    name: "Ar",
    atoms: atoms(0.0, 0.0, 0.0, 0.0, 1.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [2.5, 0.0, 0.0, 0.0, 0.0, -745.375, 4.366],
        high: [2.5, 0.0, 0.0, 0.0, 0.0, -745.375, 4.366],
    },
};

/// Carbon dioxide. GRI-Mech 3.0 (`gri30.yaml`), published range 200–3500 K.
pub const CO2: Species = Species {
    name: "CO2",
    atoms: atoms(1.0, 0.0, 2.0, 0.0, 0.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [
            2.35677352,
            0.00898459677,
            -7.12356269e-06,
            2.45919022e-09,
            -1.43699548e-13,
            -48371.9697,
            9.90105222,
        ],
        high: [
            3.85746029,
            0.00441437026,
            -2.21481404e-06,
            5.23490188e-10,
            -4.72084164e-14,
            -48759.166,
            2.27163806,
        ],
    },
};

/// Water vapour. GRI-Mech 3.0 (`gri30.yaml`), published range 200–3500 K.
pub const H2O: Species = Species {
    name: "H2O",
    atoms: atoms(0.0, 2.0, 1.0, 0.0, 0.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [
            4.19864056,
            -0.0020364341,
            6.52040211e-06,
            -5.48797062e-09,
            1.77197817e-12,
            -30293.7267,
            -0.849032208,
        ],
        high: [
            3.03399249,
            0.00217691804,
            -1.64072518e-07,
            -9.7041987e-11,
            1.68200992e-14,
            -30004.2971,
            4.9667701,
        ],
    },
};

/// Methane. GRI-Mech 3.0 (`gri30.yaml`), published range 200–3500 K.
pub const CH4: Species = Species {
    name: "CH4",
    atoms: atoms(1.0, 4.0, 0.0, 0.0, 0.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [
            5.14987613,
            -0.0136709788,
            4.91800599e-05,
            -4.84743026e-08,
            1.66693956e-11,
            -10246.6476,
            -4.64130376,
        ],
        high: [
            0.074851495,
            0.0133909467,
            -5.73285809e-06,
            1.22292535e-09,
            -1.0181523e-13,
            -9468.34459,
            18.437318,
        ],
    },
};

/// Ethane. GRI-Mech 3.0 (`gri30.yaml`), published range 200–3500 K.
pub const C2H6: Species = Species {
    name: "C2H6",
    atoms: atoms(2.0, 6.0, 0.0, 0.0, 0.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [
            4.29142492,
            -0.0055015427,
            5.99438288e-05,
            -7.08466285e-08,
            2.68685771e-11,
            -11522.2055,
            2.66682316,
        ],
        high: [
            1.0718815,
            0.0216852677,
            -1.00256067e-05,
            2.21412001e-09,
            -1.9000289e-13,
            -11426.3932,
            15.1156107,
        ],
    },
};

/// Propane. GRI-Mech 3.0 (`gri30.yaml`), published range 300–5000 K.
pub const C3H8: Species = Species {
    name: "C3H8",
    atoms: atoms(3.0, 8.0, 0.0, 0.0, 0.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [
            0.93355381,
            0.026424579,
            6.1059727e-06,
            -2.1977499e-08,
            9.5149253e-12,
            -13958.52,
            19.201691,
        ],
        high: [
            7.5341368,
            0.018872239,
            -6.2718491e-06,
            9.1475649e-10,
            -4.7838069e-14,
            -16467.516,
            -17.892349,
        ],
    },
};

/// n-Butane. NASA TM-4513 (McBride, Gordon & Reno 1993) via Cantera's
/// `nasa_gas.yaml`, published range 200–6000 K.
pub const N_C4H10: Species = Species {
    name: "nC4H10",
    atoms: atoms(4.0, 10.0, 0.0, 0.0, 0.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [
            6.14746806,
            1.55947389e-04,
            9.67913517e-05,
            -1.2548391e-07,
            4.97816555e-11,
            -1.75994402e+04,
            -1.09409879,
        ],
        high: [
            9.44535834,
            0.0257858073,
            -9.23619122e-06,
            1.48632755e-09,
            -8.87897158e-14,
            -2.01382165e+04,
            -26.3470076,
        ],
    },
};

/// Carbon monoxide. GRI-Mech 3.0 (`gri30.yaml`), published range 200–3500 K.
pub const CO: Species = Species {
    name: "CO",
    atoms: atoms(1.0, 0.0, 1.0, 0.0, 0.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [
            3.57953347,
            -0.00061035368,
            1.01681433e-06,
            9.07005884e-10,
            -9.04424499e-13,
            -14344.086,
            3.50840928,
        ],
        high: [
            2.71518561,
            0.00206252743,
            -9.98825771e-07,
            2.30053008e-10,
            -2.03647716e-14,
            -14151.8724,
            7.81868772,
        ],
    },
};

/// Hydrogen. GRI-Mech 3.0 (`gri30.yaml`), published range 200–3500 K.
pub const H2: Species = Species {
    name: "H2",
    atoms: atoms(0.0, 2.0, 0.0, 0.0, 0.0),
    poly: Nasa7 {
        t_mid_k: 1000.0,
        low: [
            2.34433112,
            0.00798052075,
            -1.9478151e-05,
            2.01572094e-08,
            -7.37611761e-12,
            -917.935173,
            0.683010238,
        ],
        high: [
            3.3372792,
            -4.94024731e-05,
            4.99456778e-07,
            -1.79566394e-10,
            2.00255376e-14,
            -950.158922,
            -3.20502331,
        ],
    },
};

/// Every species brayfin models, for look-up by name.
pub const ALL: [&Species; 11] = [
    &N2, &O2, &AR, &CO2, &H2O, &CH4, &C2H6, &C3H8, &N_C4H10, &CO, &H2,
];

/// Find a species by its formula (`"CH4"`; n-butane answers to `"nC4H10"`
/// and `"C4H10"`). Exact, case-sensitive match.
pub fn by_name(name: &str) -> Option<&'static Species> {
    if name == "C4H10" {
        return Some(&N_C4H10);
    }
    ALL.iter().copied().find(|s| s.name == name)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Molar masses from the IUPAC conventional atomic weights; methane
    /// 16.043 kg/kmol and CO2 44.009 kg/kmol (as printed in Cantera's
    /// gri30 species table).
    #[test]
    fn molar_masses_follow_from_atomic_weights() {
        assert!((CH4.molar_mass_kg_per_kmol() - 16.043).abs() < 1e-9);
        assert!((CO2.molar_mass_kg_per_kmol() - 44.009).abs() < 1e-9);
        assert!((N2.molar_mass_kg_per_kmol() - 28.014).abs() < 1e-9);
    }

    #[test]
    fn every_polynomial_breaks_at_1000_k_so_mixtures_sum() {
        for s in ALL {
            assert_eq!(s.poly.t_mid_k, 1000.0, "{}", s.name);
        }
    }

    #[test]
    fn lookup_by_name_accepts_both_butane_spellings() {
        assert_eq!(by_name("C4H10").map(|s| s.name), Some("nC4H10"));
        assert_eq!(by_name("nC4H10").map(|s| s.name), Some("nC4H10"));
        assert!(by_name("XYZ").is_none());
    }
}
