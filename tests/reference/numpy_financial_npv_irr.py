"""Generate tests/reference/numpy_financial_npv_irr.json.

Reference values of net present value and internal rate of return from the
numpy-financial library (PyPI package `numpy-financial`), for the finance
tests. CI reads the committed JSON and needs no Python.

Each case is an investment at time 0 followed by yearly savings at the end
of each year (one change of sign, so the IRR is unique). Amounts are whole
cents so the Rust test can carry them exactly in Decimal.

Run from the repository root:
    pip install numpy-financial
    python3 tests/reference/numpy_financial_npv_irr.py
"""

import json
import random
from pathlib import Path

import numpy_financial as npf

OUT = Path(__file__).with_name("numpy_financial_npv_irr.json")


def case(rng: random.Random, years: int, rate: float) -> dict:
    investment = round(rng.uniform(1.0e5, 5.0e7), 2)
    base = investment / years * rng.uniform(1.05, 2.5)
    savings = [round(base * rng.uniform(0.6, 1.4), 2) for _ in range(years)]
    values = [-investment] + savings
    return {
        "rate": rate,
        "values": [f"{v:.2f}" for v in values],
        "npv": float(npf.npv(rate, values)),
        "irr": float(npf.irr(values)),
    }


def main() -> None:
    rng = random.Random(20240611)
    cases = []
    for years in (1, 2, 5, 10, 20, 30, 45, 60):
        for rate in (0.0, 0.03, 0.07, 0.12):
            cases.append(case(rng, years, rate))
    document = {
        "source": f"numpy-financial {npf.__version__}: npv(rate, values), irr(values)",
        "convention": "values[0] at t=0, values[t] at the end of year t",
        "cases": cases,
    }
    OUT.write_text(json.dumps(document, indent=1) + "\n")


if __name__ == "__main__":
    main()
