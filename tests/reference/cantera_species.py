"""Generate cantera_species.json: species and dry-air properties from Cantera.

Reference library: Cantera (PyPI package `cantera`), evaluating the
GRI-Mech 3.0 thermodynamic data in its `gri30.yaml` (N2, O2, Ar, CO2, H2O,
CH4, C2H6, C3H8, CO, H2) and the NASA TM-4513 data in its `nasa_gas.yaml`
(n-butane, species `C4H10,n-butane`).

For each species and temperature: cp/R, h/(R T) and s°/R (standard state,
101.325 kPa). For dry air (N2 0.78084, O2 0.20946, Ar 0.00934,
CO2 0.00036 by mole) as a Cantera ideal-gas mixture: cp, h and s per kg at
101.325 kPa (s includes the entropy of mixing), and the mean molar mass.

Run from the repository root:  python3 tests/reference/cantera_species.py
The fixture is committed; the Rust tests read it and need no Python.
"""

import json
import os

import cantera as ct

TEMPERATURES_K = [250.0, 300.0, 400.0, 500.0, 600.0, 800.0, 999.0, 1001.0,
                  1200.0, 1500.0, 2000.0, 2500.0, 3000.0]
GRI_SPECIES = {"N2": "N2", "O2": "O2", "Ar": "AR", "CO2": "CO2", "H2O": "H2O",
               "CH4": "CH4", "C2H6": "C2H6", "C3H8": "C3H8", "CO": "CO",
               "H2": "H2"}
AIR = {"N2": 0.78084, "O2": 0.20946, "AR": 0.00934, "CO2": 0.00036}


def species_rows(thermo, name):
    rows = []
    r = ct.gas_constant  # J/(kmol K)
    for t in TEMPERATURES_K:
        rows.append({
            "species": name,
            "temperature_k": t,
            "cp_over_r": thermo.cp(t) / r,
            "h_over_rt": thermo.h(t) / (r * t),
            "s0_over_r": thermo.s(t) / r,
        })
    return rows


def main():
    gri = ct.Solution("gri30.yaml")
    rows = []
    for ours, theirs in GRI_SPECIES.items():
        rows += species_rows(gri.species(theirs).thermo, ours)
    nasa = {s.name: s for s in ct.Species.list_from_file("nasa_gas.yaml")}
    rows += species_rows(nasa["C4H10,n-butane"].thermo, "nC4H10")

    air_rows = []
    for t in TEMPERATURES_K:
        gri.TPX = t, ct.one_atm, AIR
        air_rows.append({
            "temperature_k": t,
            "cp_kj_per_kg_k": gri.cp_mass / 1e3,
            "h_kj_per_kg": gri.enthalpy_mass / 1e3,
            "s_kj_per_kg_k": gri.entropy_mass / 1e3,
        })
    out = {
        "source": "Cantera %s; gri30.yaml (GRI-Mech 3.0) and nasa_gas.yaml "
                  "(NASA TM-4513) data" % ct.__version__,
        "generator": "tests/reference/cantera_species.py",
        "species": rows,
        "air": {
            "molar_mass_kg_per_kmol": gri.mean_molecular_weight,
            "states": air_rows,
        },
    }
    here = os.path.dirname(os.path.abspath(__file__))
    with open(os.path.join(here, "cantera_species.json"), "w") as f:
        json.dump(out, f, indent=1)
        f.write("\n")


if __name__ == "__main__":
    main()
