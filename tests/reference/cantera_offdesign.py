"""Generate cantera_offdesign.json: fixed machines away from their rating.

An independent implementation of brayfin's off-design definitions (module
documentation of src/offdesign/mod.rs and src/offdesign/characteristic.rs,
turbine cooling and humid air in src/cycle/mod.rs) on Cantera's properties
(GRI-Mech 3.0, `gri30.yaml`) and scipy's general-purpose root finder
(`scipy.optimize.root`, Powell hybrid method). Nothing is shared with the
Rust code but the definitions:

- humid air: vapour mole fraction x_w = RH p_sat(T) / p, p_sat from the
  IAPWS-IF97 region-4 saturation equation (over ice below 273.15 K: the IAPWS
  2011 sublimation equation); dry part N2 0.78084, O2 0.20946, Ar 0.00934,
  CO2 0.00036;
- cycle: inlet loss, isentropic compressor, regenerator air side, combustor
  burning the fraction (1 - c) of the air to the firing temperature T3
  (complete combustion, fuel at 298.15 K, (1 - eta_b) LHV lost), coolant at
  the combustor inlet enthalpy mixed adiabatically ahead of the rotor,
  isentropic turbine from the mixed state, regenerator gas side, exhaust
  loss; q_regen = eps min(h_air(T4) - h2, m_gas (h_gas(T4) - h_gas(T2)));
- machine fixed at its rating: air flow from the rated output, nozzle flow
  capacity m (1 - c + f) sqrt(T3) / p3, turbine isentropic drop;
- compressor: corrected-speed ratio N = sqrt(T_rating / T); corrected flow
  fraction w N; efficiency factor 1 - 1.5 (1 - N)^2 - 0.3 (1 - w)^2;
  air flow m_rated w N (p / p_rating) N;
- turbine: efficiency factor 1 - 0.4 (1 - sqrt(dh_design / dh))^2;
- control: base load at the rated firing temperature unless the turbine
  exit exceeds its limit (the rated turbine exit), then the firing
  temperature that holds it; guide vanes close (exhaust at its limit,
  firing at most rated) to the minimum airflow 0.7, then the firing
  temperature falls; firing-temperature control keeps the vanes open.

Each point solves the matching (pressure ratio, turbine efficiency) and the
control unknowns (firing temperature, vane setting) together as one system
with scipy; the Rust code nests one-dimensional searches instead.

Run from the repository root:  python3 tests/reference/cantera_offdesign.py
The fixture is committed; the Rust test reads it and needs no Python.
"""

import json
import math
import os

import cantera as ct
import numpy as np
from scipy.optimize import root

T_REF = 298.15
DRY = {"N2": 0.78084, "O2": 0.20946, "AR": 0.00934, "CO2": 0.00036}
IF97 = [0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2,
        0.12020824702470e5, -0.32325550322333e7, 0.14915108613530e2,
        -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849,
        0.65017534844798e3]
SOL = ct.Solution("gri30.yaml")


def p_sat_pa(t):
    if t >= 273.15:
        n = IF97
        th = t + n[8] / (t - n[9])
        a = th * th + n[0] * th + n[1]
        b = n[2] * th * th + n[3] * th + n[4]
        c = n[5] * th * th + n[6] * th + n[7]
        return (2 * c / (-b + math.sqrt(b * b - 4 * a * c))) ** 4 * 1e6
    th = t / 273.16
    s = sum(a * th ** b for a, b in zip([-0.212144006e2, 0.273203819e2, -0.610598130e1],
                                        [0.333333333e-2, 0.120666667e1, 0.170333333e1]))
    return 611.657 * math.exp(s / th)


def air_x(t, p_kpa, rh):
    xw = rh * p_sat_pa(t) / (p_kpa * 1e3)
    x = {k: v * (1 - xw) for k, v in DRY.items()}
    x["H2O"] = xw
    return x


class Gas:
    def __init__(self, y):
        self.y = y

    def h(self, t):
        SOL.TPY = t, ct.one_atm, self.y
        return SOL.enthalpy_mass

    def s(self, t, p):
        SOL.TPY = t, p, self.y
        return SOL.entropy_mass

    def t_from_h(self, h, p):
        SOL.TPY = 1000.0, p, self.y
        SOL.HP = h, p
        return SOL.T

    def t_from_s(self, s, p):
        SOL.TPY = 1000.0, p, self.y
        SOL.SP = s, p
        return SOL.T


class Chemistry:
    """Complete combustion of methane in air of mole fractions `x_air`."""

    def __init__(self, x_air):
        self.x_air = x_air
        SOL.TPX = T_REF, ct.one_atm, x_air
        self.m_air = SOL.mean_molecular_weight
        SOL.TPX = T_REF, ct.one_atm, {"CH4": 1.0}
        self.m_fuel = SOL.mean_molecular_weight
        self.h_fuel = SOL.enthalpy_mass
        f = 0.01
        self.lhv = (self.gas(0).h(T_REF) + f * self.h_fuel - (1 + f) * self.gas(f).h(T_REF)) / f

    def y(self, f):
        el = {"C": 0.0, "H": 0.0, "O": 0.0, "N": 0.0, "Ar": 0.0}
        for x, kmol in [(self.x_air, 1 / self.m_air), ({"CH4": 1.0}, f / self.m_fuel)]:
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

    def burn(self, h_in, t_out, eta):
        """Fuel per kg of air entering at h_in so the gas leaves at t_out."""
        def excess(df):
            return h_in + df * self.h_fuel - (1 - eta) * df * self.lhv \
                - (1 + df) * self.gas(df).h(t_out)
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


def cycle(m, t_amb, p_amb_kpa, rh, pr, t3, eta_c, eta_t):
    """The cycle per kg of air; returns a dict of what matching needs."""
    chem = Chemistry(air_x(t_amb, p_amb_kpa, rh))
    air = chem.gas(0.0)
    p_amb = p_amb_kpa * 1e3
    p1 = p_amb * (1 - m["inlet_pressure_loss"])
    h1 = air.h(t_amb)
    s1 = air.s(t_amb, p1)
    p2 = p1 * pr
    h2s = air.h(air.t_from_s(s1, p2))
    h2 = h1 + (h2s - h1) / eta_c
    t2 = air.t_from_h(h2, p2)
    rg = m["regenerator"]
    p5 = p2 * (1 - rg["air_side_pressure_loss"]) if rg else p2
    p3 = p5 * (1 - m["combustor_pressure_loss"])
    p6 = p_amb / (1 - m["exhaust_pressure_loss"])
    p4 = p6 / (1 - rg["gas_side_pressure_loss"]) if rg else p6
    c = m["turbine_cooling"]
    eta_b = m["combustion_efficiency"]

    def hot(h5):
        fc = chem.burn(h5, t3, eta_b)
        g3 = chem.gas(fc)
        h3 = g3.h(t3)
        f = (1 - c) * fc
        g = chem.gas(f)
        h3r = ((1 - c) * (1 + fc) * h3 + c * h5) / (1 + f)
        t3r = g.t_from_h(h3r, p3)
        s3r = g.s(t3r, p3)
        h4s = g.h(g.t_from_s(s3r, p4))
        h4 = h3r - eta_t * (h3r - h4s)
        t4 = g.t_from_h(h4, p4)
        return f, g, h3r, h4s, h4, t4

    h5 = h2
    f, g, h3r, h4s, h4, t4 = hot(h5)
    if rg:
        for _ in range(300):
            q = rg["effectiveness"] * min(air.h(t4) - h2, (1 + f) * (h4 - g.h(t2)))
            new = h2 + q
            if abs(new - h5) <= 1e-13 * abs(new):
                h5 = new
                break
            h5 = new
            f, g, h3r, h4s, h4, t4 = hot(h5)
        f, g, h3r, h4s, h4, t4 = hot(h5)
        h6 = h4 - (h5 - h2) / (1 + f)
        t_stack = g.t_from_h(h6, p6)
    else:
        t_stack = t4
    w_t = (1 + f) * (h3r - h4)
    w_c = h2 - h1
    elec = (w_t - w_c) * m["mechanical_efficiency"] * m["generator_efficiency"] * (
        1 - m["auxiliary_load_fraction"])
    q_in = f * chem.lhv
    return {"elec": elec, "q_in": q_in, "f": f, "p3": p3, "dh_is": h3r - h4s,
            "t4": t4, "t_stack": t_stack, "t2": t2}


class Machine:
    def __init__(self, m):
        self.m = m
        r = m["rating"]
        self.rating = r
        d = cycle(m, r["temperature_k"], r["pressure_kpa"], r["relative_humidity"],
                  m["pressure_ratio"], m["turbine_inlet_temperature_k"],
                  m["compressor_efficiency"], m["turbine_efficiency"])
        self.air = m["net_output_kw"] * 1e3 / d["elec"]
        self.capacity = self.air * (1 - m["turbine_cooling"] + d["f"]) \
            * math.sqrt(m["turbine_inlet_temperature_k"]) / d["p3"]
        self.dh = d["dh_is"]
        self.limit = d["t4"]

    def state(self, amb, w, t3, pr, eta_t):
        m = self.m
        n = math.sqrt(self.rating["temperature_k"] / amb["temperature_k"])
        air = self.air * w * n * (amb["pressure_kpa"] / self.rating["pressure_kpa"]) * n
        eta_c = m["compressor_efficiency"] * (1 - 1.5 * (1 - n) ** 2 - 0.3 * (1 - w) ** 2)
        r = cycle(m, amb["temperature_k"], amb["pressure_kpa"], amb["relative_humidity"],
                  pr, t3, eta_c, eta_t)
        r["air"] = air
        r["power"] = air * r["elec"] / 1e3
        r["capacity_error"] = air * (1 - m["turbine_cooling"] + r["f"]) * math.sqrt(t3) \
            / r["p3"] / self.capacity - 1
        r["eta_error"] = eta_t / (m["turbine_efficiency"] * (
            1 - 0.4 * (1 - math.sqrt(self.dh / r["dh_is"])) ** 2)) - 1
        return r

    def solve(self, amb, unknowns, fixed, extra):
        """Solve for `unknowns` (names with first guesses) the matching
        equations plus the `extra` residual functions."""
        names = list(unknowns)

        def unpack(x):
            v = dict(fixed)
            v.update({k: xi * unknowns[k] for k, xi in zip(names, x)})
            return v

        def residuals(x):
            v = unpack(x)
            s = self.state(amb, v["w"], v["t3"], v["pr"], v["eta_t"])
            return [s["capacity_error"], s["eta_error"]] + [e(s, v) for e in extra]

        sol = root(residuals, np.ones(len(names)), method="hybr",
                   options={"xtol": 1e-14, "maxfev": 2000})
        if max(abs(r) for r in sol.fun) > 1e-11:
            raise RuntimeError("no solution: %s %s" % (sol.message, sol.fun))
        v = unpack(sol.x)
        return v, self.state(amb, v["w"], v["t3"], v["pr"], v["eta_t"])

    def point(self, amb, load, strategy):
        m = self.m
        t3r = m["turbine_inlet_temperature_k"]
        guess = {"pr": m["pressure_ratio"], "eta_t": m["turbine_efficiency"]}
        exhaust = lambda s, v: s["t4"] / self.limit - 1

        def at_vanes(w):
            v, s = self.solve(amb, dict(guess), {"w": w, "t3": t3r}, [])
            if s["t4"] <= self.limit + 1e-8:
                return v, s, "firing-temperature"
            v, s = self.solve(amb, dict(guess, t3=t3r - 20), {"w": w}, [exhaust])
            return v, s, "exhaust-temperature"

        vb, sb, limit = at_vanes(1.0)
        if load == 1.0:
            return vb, sb, limit
        target = load * sb["power"]
        power = lambda s, v: s["power"] / target - 1
        if strategy == "firing-temperature":
            v, s = self.solve(amb, dict(guess, t3=vb["t3"] * (0.6 + 0.4 * load)), {"w": 1.0},
                              [power])
            return v, s, "fixed-airflow"
        vc, sc, _ = at_vanes(0.7)
        if sc["power"] <= target:
            # On the vane segment: exhaust at its limit (or the firing
            # temperature at its rated value, where that binds first).
            try:
                v, s = self.solve(amb, dict(guess, w=0.7 + 0.3 * load, t3=t3r - 30), {},
                                  [exhaust, power])
                if v["t3"] <= t3r + 1e-9:
                    return v, s, "exhaust-temperature"
            except RuntimeError:
                pass
            v, s = self.solve(amb, dict(guess, w=0.7 + 0.3 * load), {"t3": t3r}, [power])
            return v, s, "firing-temperature"
        v, s = self.solve(amb, dict(guess, t3=vc["t3"] * (0.6 + 0.4 * load)), {"w": 0.7},
                          [power])
        return v, s, "minimum-airflow"


def machine(name, pr, t3, eta_c, eta_t, cooling, regenerator, rh):
    return {
        "name": name, "pressure_ratio": pr, "turbine_inlet_temperature_k": t3,
        "compressor_efficiency": eta_c, "turbine_efficiency": eta_t,
        "inlet_pressure_loss": 0.01, "exhaust_pressure_loss": 0.015,
        "combustor_pressure_loss": 0.04, "combustion_efficiency": 0.995,
        "mechanical_efficiency": 0.99, "generator_efficiency": 0.982,
        "auxiliary_load_fraction": 0.012, "turbine_cooling": cooling,
        "regenerator": regenerator, "net_output_kw": 50000.0,
        "rating": {"temperature_k": 288.15, "pressure_kpa": 101.325, "relative_humidity": rh},
    }


def amb(t, p=101.325, rh=0.0):
    return {"temperature_k": t, "pressure_kpa": p, "relative_humidity": rh}


def main():
    machines = [
        machine("simple", 19.0, 1500.0, 0.86, 0.89, 0.0, None, 0.0),
        machine("simple-cooled-humid", 17.0, 1700.0, 0.88, 0.90, 0.15, None, 0.6),
        machine("regenerated", 10.0, 1450.0, 0.865, 0.895, 0.0,
                {"effectiveness": 0.84, "air_side_pressure_loss": 0.025,
                 "gas_side_pressure_loss": 0.035}, 0.0),
    ]
    points = [
        (amb(263.15), 1.0, "guide-vanes"),
        (amb(303.15), 1.0, "guide-vanes"),
        (amb(318.15, 95.0), 1.0, "guide-vanes"),
        (amb(288.15), 0.8, "guide-vanes"),
        (amb(303.15), 0.6, "guide-vanes"),
        (amb(263.15), 0.5, "guide-vanes"),
        (amb(288.15, 85.0), 0.4, "guide-vanes"),
        (amb(303.15), 0.7, "firing-temperature"),
        (amb(278.15), 0.5, "firing-temperature"),
    ]
    out = {"source": "Cantera %s (gri30.yaml, GRI-Mech 3.0) and scipy %s root (hybr); "
                     "tests/reference/cantera_offdesign.py" % (ct.__version__,
                                                              __import__("scipy").__version__),
           "machines": []}
    for m in machines:
        mach = Machine(m)
        rows = []
        for a, load, strategy in points:
            if m["rating"]["relative_humidity"] > 0:
                a = dict(a, relative_humidity=0.3 if a["temperature_k"] < 290 else 0.8)
            v, s, limit = mach.point(a, load, strategy)
            rows.append({
                "ambient": a, "load": load, "strategy": strategy,
                "expected": {
                    "net_output_kw": s["power"],
                    "thermal_efficiency": s["elec"] / s["q_in"],
                    "air_flow_kg_per_s": s["air"],
                    "pressure_ratio": v["pr"],
                    "firing_temperature_k": v["t3"],
                    "exhaust_temperature_k": s["t4"],
                    "stack_temperature_k": s["t_stack"],
                    "airflow_fraction": v["w"],
                    "limit": limit,
                },
            })
            print(m["name"], a, load, strategy, limit, round(s["power"], 1),
                  round(s["elec"] / s["q_in"], 6))
        out["machines"].append({"machine": m, "points": rows})
    here = os.path.dirname(os.path.abspath(__file__))
    with open(os.path.join(here, "cantera_offdesign.json"), "w") as f:
        json.dump(out, f, indent=1)
        f.write("\n")


if __name__ == "__main__":
    main()
