"""Generate cantera_air_cycles.json and cantera_products_cycles.json.

An independent implementation of brayfin's cycle definitions (see the
module documentation of src/cycle/mod.rs) on top of Cantera (PyPI package
`cantera`): every property and every inverse solve (T from h and p; T from
s and p) is Cantera's, with GRI-Mech 3.0 data from `gri30.yaml`.

Definitions mirrored (and nothing else shared with the Rust code):
- dry air N2 0.78084, O2 0.20946, Ar 0.00934, CO2 0.00036 by mole;
- pressure losses as fractions of the local pressure (inlet, regenerator
  air side, combustor, reheat combustor = combustor's, regenerator gas side,
  exhaust), turbine exit pressure p_amb / ((1 - exhaust)(1 - gas side));
- isentropic efficiency on enthalpy; polytropic efficiency as the entropy
  rise s2 = s1 + (1/eta - 1) R ln r in the compressor and
  s4 = s3 + (1 - eta) R ln r in the turbine (r: the stage's pressure ratio);
- intercooler split at the given ratio or sqrt(overall), exit at a given
  temperature or T_out = T_in - eps (T_in - T_amb), no pressure loss;
- reheat split at the given HP ratio or sqrt(overall turbine ratio);
- regenerator q = eps * min(h_air(T4) - h2, m_gas (h_gas(T4) - h_gas(T2)));
- air model: air of unchanged mass, fuel energy = enthalpy rise / eta_b;
- products: complete combustion (C -> CO2, H -> H2O, N -> N2, rest O2) by
  element balance; fuel enters at 298.15 K; each combustor's fuel found by
  bisection of the energy balance with (1 - eta_b) LHV lost per kg fuel;
  regenerator h5 found by fixed-point iteration;
- efficiency = (w_t - w_c) eta_m eta_g (1 - aux) / fuel energy (LHV).

Run from the repository root:  python3 tests/reference/cantera_cycles.py
The fixtures are committed; the Rust tests read them and need no Python.
"""

import json
import math
import os
import time

import cantera as ct

AIR = {"N2": 0.78084, "O2": 0.20946, "AR": 0.00934, "CO2": 0.00036}
T_REF = 298.15
FUELS = {
    "methane": {"CH4": 1.0},
    "CH4=0.9,C2H6=0.05,C3H8=0.02,N2=0.02,CO2=0.01":
        {"CH4": 0.9, "C2H6": 0.05, "C3H8": 0.02, "N2": 0.02, "CO2": 0.01},
    "CH4=0.5,H2=0.3,CO=0.2": {"CH4": 0.5, "H2": 0.3, "CO": 0.2},
}


def base(pr, tit):
    return {
        "ambient_temperature_k": 288.15, "ambient_pressure_kpa": 101.325,
        "pressure_ratio": pr, "turbine_inlet_temperature_k": tit,
        "compressor_efficiency": 1.0, "turbine_efficiency": 1.0,
        "polytropic": False,
        "inlet_pressure_loss": 0.0, "exhaust_pressure_loss": 0.0,
        "combustor_pressure_loss": 0.0, "combustion_efficiency": 1.0,
        "mechanical_efficiency": 1.0, "generator_efficiency": 1.0,
        "auxiliary_load_fraction": 0.0,
        "regenerator": None, "intercooler": None, "reheat": None,
    }


def with_(cfg, **kw):
    out = dict(cfg)
    out.update(kw)
    return out


def regen(eps, air_loss=0.0, gas_loss=0.0):
    return {"effectiveness": eps, "air_side_pressure_loss": air_loss,
            "gas_side_pressure_loss": gas_loss}


def air_cases():
    c = []
    # Ideal simple cycles across the pressure-ratio and TIT ranges.
    for pr, tit in [(4, 1000), (8, 1200), (15, 1400), (25, 1600), (40, 1800)]:
        c.append(base(pr, tit))
    # Component efficiencies 0.75-0.95, isentropic and polytropic.
    c.append(with_(base(10, 1300), compressor_efficiency=0.85, turbine_efficiency=0.88))
    c.append(with_(base(20, 1500), compressor_efficiency=0.88, turbine_efficiency=0.91))
    c.append(with_(base(30, 1700), compressor_efficiency=0.75, turbine_efficiency=0.80))
    c.append(with_(base(18, 1600), compressor_efficiency=0.90, turbine_efficiency=0.88, polytropic=True))
    c.append(with_(base(35, 1800), compressor_efficiency=0.92, turbine_efficiency=0.90, polytropic=True))
    # Losses and shaft efficiencies.
    c.append(with_(base(16, 1450), compressor_efficiency=0.86, turbine_efficiency=0.89,
                   inlet_pressure_loss=0.01, exhaust_pressure_loss=0.015,
                   combustor_pressure_loss=0.04, combustion_efficiency=0.995,
                   mechanical_efficiency=0.985, generator_efficiency=0.98,
                   auxiliary_load_fraction=0.01, ambient_temperature_k=303.15,
                   ambient_pressure_kpa=98.0))
    # Regenerator.
    c.append(with_(base(4, 1000), regenerator=regen(1.0)))
    c.append(with_(base(6, 1200), compressor_efficiency=0.84, turbine_efficiency=0.87,
                   regenerator=regen(0.8)))
    c.append(with_(base(8, 1350), compressor_efficiency=0.86, turbine_efficiency=0.89,
                   combustor_pressure_loss=0.03, regenerator=regen(0.85, 0.02, 0.03)))
    c.append(with_(base(5, 1100), compressor_efficiency=0.80, turbine_efficiency=0.85,
                   polytropic=True, regenerator=regen(0.7)))
    # Intercooling.
    c.append(with_(base(20, 1400), intercooler={"pressure_split": None, "exit_temperature_k": 300.0,
                                               "effectiveness": None}))
    c.append(with_(base(30, 1500), compressor_efficiency=0.87, turbine_efficiency=0.9,
                   intercooler={"pressure_split": 4.0, "exit_temperature_k": None,
                                "effectiveness": 0.85}))
    # Reheat.
    c.append(with_(base(25, 1500), reheat={"pressure_split": None, "temperature_k": 1500.0}))
    c.append(with_(base(30, 1600), compressor_efficiency=0.88, turbine_efficiency=0.9,
                   combustor_pressure_loss=0.03,
                   reheat={"pressure_split": 8.0, "temperature_k": 1450.0}))
    # Everything together.
    c.append(with_(base(12, 1400), compressor_efficiency=0.85, turbine_efficiency=0.88,
                   regenerator=regen(0.8, 0.02, 0.02),
                   intercooler={"pressure_split": None, "exit_temperature_k": 305.0,
                                "effectiveness": None},
                   reheat={"pressure_split": None, "temperature_k": 1400.0}))
    c.append(with_(base(9, 1250), compressor_efficiency=0.9, turbine_efficiency=0.9,
                   polytropic=True, regenerator=regen(0.9),
                   intercooler={"pressure_split": 3.0, "exit_temperature_k": None,
                                "effectiveness": 0.9},
                   reheat={"pressure_split": 2.5, "temperature_k": 1250.0}))
    c.append(with_(base(40, 1800), compressor_efficiency=0.95, turbine_efficiency=1.0))
    c.append(with_(base(4, 1000), compressor_efficiency=1.0, turbine_efficiency=0.75))
    return c


def products_cases():
    c = []
    for fuel in FUELS:
        c.append(with_(base(15, 1400), fuel=fuel))
        c.append(with_(base(20, 1700), compressor_efficiency=0.88, turbine_efficiency=0.9, fuel=fuel))
    c.append(with_(base(8, 1300), compressor_efficiency=0.86, turbine_efficiency=0.89,
                   regenerator=regen(0.85, 0.02, 0.03), fuel="methane"))
    c.append(with_(base(6, 1200), compressor_efficiency=0.84, turbine_efficiency=0.87,
                   combustion_efficiency=0.99, regenerator=regen(0.8),
                   fuel="CH4=0.9,C2H6=0.05,C3H8=0.02,N2=0.02,CO2=0.01"))
    c.append(with_(base(25, 1500), compressor_efficiency=0.9, turbine_efficiency=0.9,
                   polytropic=True, reheat={"pressure_split": None, "temperature_k": 1450.0},
                   fuel="methane"))
    c.append(with_(base(12, 1400), compressor_efficiency=0.85, turbine_efficiency=0.88,
                   combustor_pressure_loss=0.04, combustion_efficiency=0.995,
                   regenerator=regen(0.8, 0.02, 0.02),
                   intercooler={"pressure_split": None, "exit_temperature_k": 305.0,
                                "effectiveness": None},
                   reheat={"pressure_split": None, "temperature_k": 1400.0},
                   fuel="CH4=0.5,H2=0.3,CO=0.2"))
    return c


class Gas:
    """A Cantera phase of fixed mass-fraction composition."""

    def __init__(self, sol, y):
        self.sol, self.y = sol, y

    def set_tp(self, t, p):
        self.sol.TPY = t, p, self.y
        return self.sol

    def h(self, t):
        return self.set_tp(t, ct.one_atm).enthalpy_mass

    def r(self):
        self.sol.Y = self.y
        return ct.gas_constant / self.sol.mean_molecular_weight

    def state_sp(self, s, p):
        self.sol.TPY = 1000.0, p, self.y
        self.sol.SP = s, p
        return self.sol.T, self.sol.enthalpy_mass

    def state_hp(self, h, p):
        self.sol.TPY = 1000.0, p, self.y
        self.sol.HP = h, p
        return self.sol.T, self.sol.entropy_mass


class Chemistry:
    """Complete combustion of a fuel in dry air, by element balance."""

    def __init__(self, sol, fuel_x):
        self.sol = sol
        sol.TPX = T_REF, ct.one_atm, AIR
        self.air_mass = sol.mean_molecular_weight
        sol.TPX = T_REF, ct.one_atm, fuel_x
        self.fuel_x = fuel_x
        self.fuel_mass = sol.mean_molecular_weight
        self.h_fuel = sol.enthalpy_mass
        f = 0.01
        air = Gas(sol, self._y(0.0))
        prod = Gas(sol, self._y(f))
        self.lhv = (air.h(T_REF) + f * self.h_fuel - (1 + f) * prod.h(T_REF)) / f

    def _elements(self, x, kmol):
        el = {"C": 0.0, "H": 0.0, "O": 0.0, "N": 0.0, "Ar": 0.0}
        for sp, xi in x.items():
            for e in el:
                el[e] += kmol * xi * self.sol.n_atoms(sp, e)
        return el

    def _y(self, f):
        el_air = self._elements(AIR, 1.0 / self.air_mass)
        el_fuel = self._elements(self.fuel_x, f / self.fuel_mass)
        el = {e: el_air[e] + el_fuel[e] for e in el_air}
        moles = {"CO2": el["C"], "H2O": el["H"] / 2, "N2": el["N"] / 2, "AR": el["Ar"],
                 "O2": (el["O"] - 2 * el["C"] - el["H"] / 2) / 2}
        if moles["O2"] < 0:
            raise ValueError("rich")
        mass = {sp: n * self.sol.molecular_weights[self.sol.species_index(sp)]
                for sp, n in moles.items()}
        total = sum(mass.values())
        return {sp: m / total for sp, m in mass.items()}

    def gas(self, f):
        return Gas(self.sol, self._y(f))

    def burn(self, f_in, h_in, t_out, eta):
        """Fuel added so that gas (f_in, h_in per kg gas) leaves at t_out."""
        def excess(df):
            lhs = (1 + f_in) * h_in + df * self.h_fuel - (1 - eta) * df * self.lhv
            return lhs - (1 + f_in + df) * self.gas(f_in + df).h(t_out)
        lo, hi = 0.0, 0.2
        while True:
            try:
                self._y(f_in + hi)
                break
            except ValueError:
                hi *= 0.9
        for _ in range(200):
            mid = 0.5 * (lo + hi)
            if excess(mid) > 0:
                hi = mid
            else:
                lo = mid
            if hi - lo < 1e-16:
                break
        return 0.5 * (lo + hi)


SOLUTION = ct.Solution("gri30.yaml")


def solve(cfg, model):
    sol = SOLUTION
    chem = Chemistry(sol, FUELS[cfg["fuel"]]) if model == "products" else None
    air = Gas(sol, chem._y(0.0) if chem else None)
    if air.y is None:
        sol.TPX = 300.0, ct.one_atm, AIR
        air = Gas(sol, dict(zip(sol.species_names, sol.Y)))
    eta_c, eta_t = cfg["compressor_efficiency"], cfg["turbine_efficiency"]
    poly = cfg["polytropic"]
    t_amb, p_amb = cfg["ambient_temperature_k"], cfg["ambient_pressure_kpa"] * 1e3
    states = {}

    def record(sid, t, p):
        states[sid] = t

    def compress(gas, t_in, p_in, ratio, tag_s, tag):
        s_in = gas.set_tp(t_in, p_in).entropy_mass
        h_in = sol.enthalpy_mass
        p_out = p_in * ratio
        t_s, h_s = gas.state_sp(s_in, p_out)
        if poly:
            t, _ = gas.state_sp(s_in + gas.r() * (1 / eta_c - 1) * math.log(ratio), p_out)
            h = gas.h(t)
        else:
            h = h_in + (h_s - h_in) / eta_c
            t, _ = gas.state_hp(h, p_out)
        record(tag_s, t_s, p_out)
        record(tag, t, p_out)
        return t, h, h - h_in, p_out

    def expand(gas, t_in, p_in, ratio, tag_s, tag):
        s_in = gas.set_tp(t_in, p_in).entropy_mass
        h_in = sol.enthalpy_mass
        p_out = p_in / ratio
        t_s, h_s = gas.state_sp(s_in, p_out)
        if poly:
            t, _ = gas.state_sp(s_in + gas.r() * (1 - eta_t) * math.log(ratio), p_out)
            h = gas.h(t)
        else:
            h = h_in - eta_t * (h_in - h_s)
            t, _ = gas.state_hp(h, p_out)
        record(tag_s, t_s, p_out)
        record(tag, t, p_out)
        return t, h, h_in - h, p_out

    p1 = p_amb * (1 - cfg["inlet_pressure_loss"])
    record("1", t_amb, p1)
    h1 = air.h(t_amb)
    q_ic = 0.0
    ic = cfg["intercooler"]
    if ic:
        r_lp = ic["pressure_split"] or math.sqrt(cfg["pressure_ratio"])
        t2a, h2a, w1, p2a = compress(air, t_amb, p1, r_lp, "2as", "2a")
        if ic["exit_temperature_k"] is not None:
            t2b = ic["exit_temperature_k"]
        else:
            t2b = t2a - ic["effectiveness"] * (t2a - t_amb)
        record("2b", t2b, p2a)
        q_ic = h2a - air.h(t2b)
        t2, h2, w2, p2 = compress(air, t2b, p2a, cfg["pressure_ratio"] / r_lp, "2s", "2")
        w_c = w1 + w2
    else:
        t2, h2, w_c, p2 = compress(air, t_amb, p1, cfg["pressure_ratio"], "2s", "2")

    rg = cfg["regenerator"]
    p5 = p2 * (1 - rg["air_side_pressure_loss"]) if rg else p2
    loss_b = cfg["combustor_pressure_loss"]
    p3 = p5 * (1 - loss_b)
    p6 = p_amb / (1 - cfg["exhaust_pressure_loss"])
    p4 = p6 / (1 - rg["gas_side_pressure_loss"]) if rg else p6
    t3 = cfg["turbine_inlet_temperature_k"]
    eta_b = cfg["combustion_efficiency"]
    rh = cfg["reheat"]

    def hot(h5):
        """Combustor(s) and turbine(s) for combustor inlet enthalpy h5."""
        if chem:
            f1 = chem.burn(0.0, h5, t3, eta_b)
            g1 = chem.gas(f1)
            q = f1 * chem.lhv
        else:
            f1, g1 = 0.0, air
            q = (air.h(t3) - h5) / eta_b
        h3 = g1.h(t3)
        if rh:
            r_t = p3 / p4
            r_hp = rh["pressure_split"] or math.sqrt(r_t)
            t3a, h3a, w_hp, p3a = expand(g1, t3, p3, r_hp, "3as", "3a")
            p3b = p3a * (1 - loss_b)
            t3b = rh["temperature_k"]
            record("3b", t3b, p3b)
            if chem:
                f2 = chem.burn(f1, h3a, t3b, eta_b)
                g2 = chem.gas(f1 + f2)
                q += f2 * chem.lhv
            else:
                f2, g2 = 0.0, air
                q += (air.h(t3b) - h3a) / eta_b
            t4, h4, w_lp, _ = expand(g2, t3b, p3b, p3b / p4, "4s", "4")
            w_t = (1 + f1) * w_hp + (1 + f1 + f2) * w_lp
            return t4, h4, w_t, q, f1 + f2, g2
        t4, h4, w, _ = expand(g1, t3, p3, p3 / p4, "4s", "4")
        return t4, h4, (1 + f1) * w, q, f1, g1

    if rg:
        h5 = h2
        for _ in range(200):
            t4, h4, w_t, q_in, f, g = hot(h5)
            m = 1 + f
            q = rg["effectiveness"] * min(air.h(t4) - h2, m * (h4 - g.h(t2)))
            new = h2 + q
            if abs(new - h5) < 1e-12 * abs(new):
                h5 = new
                break
            h5 = new
        t4, h4, w_t, q_in, f, g = hot(h5)
        t5, _ = air.state_hp(h5, p5)
        record("5", t5, p5)
        h6 = h4 - (h5 - h2) / (1 + f)
        t6, _ = g.state_hp(h6, p6)
        record("6", t6, p6)
        t_exh = t6
    else:
        t4, h4, w_t, q_in, f, g = hot(h2)
        t_exh = t4
    record("3", t3, p3)
    net = w_t - w_c
    elec = net * cfg["mechanical_efficiency"] * cfg["generator_efficiency"] * (
        1 - cfg["auxiliary_load_fraction"])
    out = {
        "temperatures_k": states,
        "compressor_work_kj_per_kg": w_c / 1e3,
        "turbine_work_kj_per_kg": w_t / 1e3,
        "heat_input_kj_per_kg": q_in / 1e3,
        "thermal_efficiency": elec / q_in,
        "exhaust_temperature_k": t_exh,
        "intercooler_heat_kj_per_kg": q_ic / 1e3,
    }
    if chem:
        out["fuel_air_ratio"] = f
        out["fuel_lhv_kj_per_kg"] = chem.lhv / 1e3
    return out


def main():
    here = os.path.dirname(os.path.abspath(__file__))
    for model, cases, name in [("air", air_cases(), "cantera_air_cycles.json"),
                               ("products", products_cases(), "cantera_products_cycles.json")]:
        rows = []
        for cfg in cases:
            rows.append({"config": cfg, "expected": solve(cfg, model)})
        out = {
            "source": "Cantera %s, gri30.yaml (GRI-Mech 3.0); independent cycle "
                      "implementation in tests/reference/cantera_cycles.py" % ct.__version__,
            "gas_model": model,
            "cases": rows,
        }
        with open(os.path.join(here, name), "w") as f:
            json.dump(out, f, indent=1)
            f.write("\n")
    # Time one simple-cycle-with-regenerator solve, for the README's
    # comparison with brayfin's benches (not part of the fixture).
    cfg = with_(base(8, 1350), compressor_efficiency=0.86, turbine_efficiency=0.89,
                regenerator=regen(0.85))
    n = 200
    start = time.perf_counter()
    for _ in range(n):
        solve(cfg, "air")
    print("air cycle with regenerator via Cantera: %.1f us per solve"
          % ((time.perf_counter() - start) / n * 1e6))


if __name__ == "__main__":
    main()
