"""Generate cantera_datasheets.json: vendor-style datasheets of known engines.

An independent implementation of the simple-cycle design point that
brayfin's datasheet calibration fits (src/datasheet/calibrate.rs, turbine
cooling and humid air as in src/cycle/mod.rs), on Cantera's properties
(GRI-Mech 3.0, `gri30.yaml`). Nothing is shared with the Rust code but the
definitions:

- humid air: vapour mole fraction x_w = RH p_sat(T) / p, p_sat from the
  IAPWS-IF97 region-4 saturation equation; dry part N2 0.78084, O2 0.20946,
  Ar 0.00934, CO2 0.00036;
- inlet loss, then a polytropic compressor: s°(T2) = s°(T1) + (R/eta_c) ln r
  (s° at a fixed pressure, ideal gas);
- combustor burning the fraction (1 - c) of the air to the firing
  temperature T3 (complete combustion, fuel at 298.15 K), pressure loss;
- coolant at the combustor inlet (compressor delivery, or the regenerator
  air exit) mixed adiabatically ahead of the rotor;
- polytropic turbine from the mixed state: s°(T4) = s°(T3r) + eta_t R ln(p4/p3),
  exhausting at p_amb / (1 - exhaust loss);
- with a regenerator: air side p5 = p2 (1 - air loss), gas side
  p4 = p6 / (1 - gas loss), heat passed q = eps min(h_air(T4) - h2,
  (1 + f)(h4 - h_gas(T2))) per kg of air, iterated with the fuel it saves;
  the exhaust is the regenerator gas exit;
- net output (w_t - w_c) eta_mech eta_gen per kg of air; air flow from the
  rated output; heat rate 3600 f LHV / w_el (LHV from Cantera enthalpies at
  298.15 K, water as vapour).

Each engine follows the calibration's stated relations (turbine polytropic
efficiency 0.01 below the compressor's; eta_mech = eta_gen; pressure losses
1 %, 1 %, 4 %; cooling 0.0004 per K above 1 200 K where the datasheet does not
state both pressure ratio and firing temperature), because those are what the
figures cannot determine. The engines themselves are chosen by hand within
current practice; the figures are Cantera's.

Run from the repository root:  python3 tests/reference/cantera_datasheets.py
The fixture is committed; the Rust test reads it and needs no Python.
"""

import json
import math
import os

import cantera as ct

T_REF = 298.15
DRY = {"N2": 0.78084, "O2": 0.20946, "AR": 0.00934, "CO2": 0.00036}
IF97 = [0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2,
        0.12020824702470e5, -0.32325550322333e7, 0.14915108613530e2,
        -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849,
        0.65017534844798e3]
SOL = ct.Solution("gri30.yaml")
P_REF = ct.one_atm
LOSSES = {"inlet": 0.01, "exhaust": 0.01, "combustor": 0.04}
GAP = 0.01


def p_sat_pa(t):
    n = IF97
    th = t + n[8] / (t - n[9])
    a = th * th + n[0] * th + n[1]
    b = n[2] * th * th + n[3] * th + n[4]
    c = n[5] * th * th + n[6] * th + n[7]
    return (2 * c / (-b + math.sqrt(b * b - 4 * a * c))) ** 4 * 1e6


def air_x(t, p_kpa, rh):
    xw = rh * p_sat_pa(t) / (p_kpa * 1e3)
    x = {k: v * (1 - xw) for k, v in DRY.items()}
    x["H2O"] = xw
    return x


class Gas:
    def __init__(self, y):
        self.y = y
        SOL.TPY = 300.0, P_REF, y
        self.r = ct.gas_constant / SOL.mean_molecular_weight

    def h(self, t):
        SOL.TPY = t, P_REF, self.y
        return SOL.enthalpy_mass

    def s0(self, t):
        SOL.TPY = t, P_REF, self.y
        return SOL.entropy_mass

    def t_from_h(self, h):
        SOL.TPY = 1000.0, P_REF, self.y
        SOL.HP = h, P_REF
        return SOL.T

    def t_from_s0(self, s):
        SOL.TPY = 1000.0, P_REF, self.y
        SOL.SP = s, P_REF
        return SOL.T


class Chemistry:
    """Complete combustion of `fuel` (mole fractions) in air `x_air`."""

    def __init__(self, x_air, fuel):
        self.x_air = x_air
        self.fuel = fuel
        SOL.TPX = T_REF, P_REF, x_air
        self.m_air = SOL.mean_molecular_weight
        SOL.TPX = T_REF, P_REF, fuel
        self.m_fuel = SOL.mean_molecular_weight
        self.h_fuel = SOL.enthalpy_mass
        f = 0.01
        self.lhv = (self.gas(0).h(T_REF) + f * self.h_fuel - (1 + f) * self.gas(f).h(T_REF)) / f

    def y(self, f):
        el = {"C": 0.0, "H": 0.0, "O": 0.0, "N": 0.0, "Ar": 0.0}
        for x, kmol in [(self.x_air, 1 / self.m_air), (self.fuel, f / self.m_fuel)]:
            for sp, xi in x.items():
                for e in el:
                    el[e] += kmol * xi * SOL.n_atoms(sp, e)
        moles = {"CO2": el["C"], "H2O": el["H"] / 2, "N2": el["N"] / 2, "AR": el["Ar"],
                 "O2": (el["O"] - 2 * el["C"] - el["H"] / 2) / 2}
        mass = {sp: n * SOL.molecular_weights[SOL.species_index(sp)] for sp, n in moles.items()}
        total = sum(mass.values())
        return {sp: m / total for sp, m in mass.items()}

    def gas(self, f):
        return Gas(self.y(f))

    def burn(self, h_in, t_out):
        """Fuel per kg of air entering at h_in so the gas leaves at t_out."""
        def excess(df):
            return h_in + df * self.h_fuel - (1 + df) * self.gas(df).h(t_out)
        lo, hi = 0.0, 0.06
        for _ in range(200):
            mid = 0.5 * (lo + hi)
            if excess(mid) > 0:
                hi = mid
            else:
                lo = mid
            if hi - lo < 1e-17:
                break
        return 0.5 * (lo + hi)


def datasheet(e):
    amb = e["rating"]
    chem = Chemistry(air_x(amb["temperature_k"], amb["pressure_kpa"], amb["relative_humidity"]),
                     e["fuel"])
    air = chem.gas(0.0)
    p_amb = amb["pressure_kpa"] * 1e3
    p1 = p_amb * (1 - LOSSES["inlet"])
    p2 = p1 * e["pressure_ratio"]
    rg = e.get("regenerator")
    p5 = p2 * (1 - rg["air_side_pressure_loss"]) if rg else p2
    p3 = p5 * (1 - LOSSES["combustor"])
    p6 = p_amb / (1 - LOSSES["exhaust"])
    p4 = p6 / (1 - rg["gas_side_pressure_loss"]) if rg else p6
    t1 = amb["temperature_k"]
    h1 = air.h(t1)
    eta_c = e["compressor_polytropic_efficiency"]
    eta_t = eta_c - GAP
    t2 = air.t_from_s0(air.s0(t1) + air.r / eta_c * math.log(p2 / p1))
    h2 = air.h(t2)
    c = e["turbine_cooling"]

    def hot(h5):
        fc = chem.burn(h5, e["firing_temperature_k"])
        h3 = chem.gas(fc).h(e["firing_temperature_k"])
        f = (1 - c) * fc
        g = chem.gas(f)
        h3r = ((1 - c) * (1 + fc) * h3 + c * h5) / (1 + f)
        t3r = g.t_from_h(h3r)
        t4 = g.t_from_s0(g.s0(t3r) + eta_t * g.r * math.log(p4 / p3))
        return f, g, h3r, t4, g.h(t4)

    h5 = h2
    f, g, h3r, t4, h4 = hot(h5)
    t_exhaust, h_exhaust = t4, h4
    if rg:
        for _ in range(300):
            q = rg["effectiveness"] * min(air.h(t4) - h2, (1 + f) * (h4 - g.h(t2)))
            new = h2 + q
            done = abs(new - h5) <= 1e-13 * abs(new)
            h5 = new
            f, g, h3r, t4, h4 = hot(h5)
            if done:
                break
        h_exhaust = h4 - (h5 - h2) / (1 + f)
        t_exhaust = g.t_from_h(h_exhaust)
    w_t = (1 + f) * (h3r - h4)
    w_c = h2 - h1
    w_el = (w_t - w_c) * e["electro_mechanical_efficiency"]
    air_flow = e["net_output_kw"] * 1e3 / w_el
    q_in = f * chem.lhv
    # The datasheet's own energy balance with Cantera enthalpies: exhaust
    # above the inlet state, both from 298.15 K.
    exhaust = air_flow * ((1 + f) * (h_exhaust - g.h(T_REF)) - (h1 - air.h(T_REF)))
    fuel_energy = air_flow * q_in
    return {
        "net_output_kw": e["net_output_kw"],
        "heat_rate_kj_per_kwh": 3600 * q_in / w_el,
        "exhaust_flow_kg_per_s": air_flow * (1 + f),
        "exhaust_temperature_k": t_exhaust,
        "air_flow_kg_per_s": air_flow,
        "lhv_kj_per_kg": chem.lhv / 1e3,
        "remainder_fraction": (fuel_energy - e["net_output_kw"] * 1e3 - exhaust) / fuel_energy,
    }


def cooling(t3):
    return 0.0004 * max(0.0, t3 - 1200.0)


GAS = {"CH4": 0.93, "C2H6": 0.04, "C3H8": 0.01, "N2": 0.01, "CO2": 0.01}
ISO = {"temperature_k": 288.15, "pressure_kpa": 101.325, "relative_humidity": 0.6}
ENGINES = [
    # (name, r, T3, eta_c, cooling or None (correlation), eps, P kW, rating, fuel,
    #  states ratio, states firing)
    ("heavy-duty F-like, both stated", 17.0, 1700.0, 0.910, 0.17, 0.975, 250000.0, ISO,
     {"CH4": 1.0}, True, True),
    ("heavy-duty E-like, ratio stated", 12.5, 1400.0, 0.895, None, 0.972, 120000.0, ISO,
     GAS, True, False),
    ("aero-derivative, firing stated", 30.0, 1560.0, 0.915, None, 0.978, 45000.0,
     {"temperature_k": 303.15, "pressure_kpa": 98.0, "relative_humidity": 0.4},
     {"CH4": 1.0}, False, True),
    ("industrial, ratio stated, hot humid site", 15.5, 1500.0, 0.900, None, 0.965, 30000.0,
     {"temperature_k": 308.15, "pressure_kpa": 100.0, "relative_humidity": 0.8},
     GAS, True, False),
    ("H-like, both stated", 23.0, 1850.0, 0.925, 0.23, 0.982, 400000.0, ISO,
     {"CH4": 1.0}, True, True),
    ("highland, firing stated", 18.0, 1600.0, 0.905, None, 0.97, 80000.0,
     {"temperature_k": 278.15, "pressure_kpa": 85.0, "relative_humidity": 0.3},
     GAS, False, True),
    ("recuperated industrial, ratio stated", 9.0, 1420.0, 0.89, None, 0.965, 5000.0, ISO,
     {"CH4": 1.0}, True, False),
]
REGENERATORS = {
    "recuperated industrial, ratio stated": {
        "effectiveness": 0.86, "air_side_pressure_loss": 0.02, "gas_side_pressure_loss": 0.03},
}


def main():
    cases = []
    for name, r, t3, eta, c, eps, p, rating, fuel, s_r, s_t in ENGINES:
        engine = {
            "pressure_ratio": r,
            "firing_temperature_k": t3,
            "compressor_polytropic_efficiency": eta,
            "turbine_cooling": cooling(t3) if c is None else c,
            "electro_mechanical_efficiency": eps,
            "net_output_kw": p,
            "rating": rating,
            "fuel": fuel,
        }
        if name in REGENERATORS:
            engine["regenerator"] = REGENERATORS[name]
        cases.append({
            "name": name,
            "engine": engine,
            "states_pressure_ratio": s_r,
            "states_firing_temperature": s_t,
            "datasheet": datasheet(engine),
        })
    out = {
        "generator": "tests/reference/cantera_datasheets.py",
        "cantera": ct.__version__,
        "mechanism": "gri30.yaml",
        "cases": cases,
    }
    path = os.path.join("tests", "reference", "cantera_datasheets.json")
    with open(path, "w") as fh:
        json.dump(out, fh, indent=1)
        fh.write("\n")


if __name__ == "__main__":
    main()
