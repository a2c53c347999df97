#!/usr/bin/env python3
"""Write the Corvel Bay demo's hourly weather and dispatch profile.

Corvel Bay is an invented place; these files are synthetic, made by the
stated model below from a fixed seed, and are no record of any real
weather or any real plant's dispatch.

Weather model (one non-leap year, 2025, 8760 hours, local standard time):

    T(d, h) = T_mean + A_year * cos(2*pi*(d - d_peak) / 365)
              + A_day * cos(2*pi*(h - h_peak) / 24) + e(t)

with T_mean = 15 degC, A_year = 9 K, d_peak = day 205 (late July),
A_day = 5 K, h_peak = 15:00, and e(t) an AR(1) noise, e(t) = 0.95 e(t-1)
+ N(0, 0.9 K). Relative humidity falls as the air warms within the day:

    RH = 68 % - 2.2 %/K * (T - daily mean T) + N(0, 4 %), clipped to 12..100 %.

Dispatch model (a peaking unit that runs on hot afternoons and evenings and
on cold winter evenings), load as % of the output available that hour:

    hours 13..21 with T >= 25 degC: 100 %
    hours 12..22 with 21 degC <= T < 25 degC: 80 %
    hours 17..20 in December, January, February with T < 4 degC: 60 %
    otherwise 0 (off).

Temperatures are written in degF (the column name says so). Run from the
repository root:  python3 scenarios/data/make_weather.py
"""

import csv
import math
import os
import random
from datetime import datetime, timedelta

SEED = 20250314
YEAR = 2025
T_MEAN_C = 15.0
A_YEAR_K = 9.0
D_PEAK = 205
A_DAY_K = 5.0
H_PEAK = 15
PHI = 0.95
SIGMA_K = 0.9


def weather(rng):
    """Hourly (timestamp, degC, RH %) for the year."""
    start = datetime(YEAR, 1, 1)
    noise = 0.0
    rows = []
    for i in range(8760):
        at = start + timedelta(hours=i)
        day = at.timetuple().tm_yday
        noise = PHI * noise + rng.gauss(0.0, SIGMA_K)
        daily_mean = T_MEAN_C + A_YEAR_K * math.cos(2 * math.pi * (day - D_PEAK) / 365)
        t = daily_mean + A_DAY_K * math.cos(2 * math.pi * (at.hour - H_PEAK) / 24) + noise
        rh = 68.0 - 2.2 * (t - daily_mean) + rng.gauss(0.0, 4.0)
        rows.append((at, t, min(100.0, max(12.0, rh))))
    return rows


def load_pct(at, t):
    """The dispatch rule above."""
    if 13 <= at.hour <= 21 and t >= 25.0:
        return 100
    if 12 <= at.hour <= 22 and 21.0 <= t < 25.0:
        return 80
    if at.month in (12, 1, 2) and 17 <= at.hour <= 20 and t < 4.0:
        return 60
    return 0


def main():
    here = os.path.dirname(os.path.abspath(__file__))
    rng = random.Random(SEED)
    rows = weather(rng)
    with open(os.path.join(here, "corvel-bay-weather.csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["timestamp", "dry_bulb_degF", "rh_pct"])
        for at, t, rh in rows:
            w.writerow([at.strftime("%Y-%m-%dT%H:%M"), f"{t * 9 / 5 + 32:.1f}", f"{rh:.0f}"])
    with open(os.path.join(here, "corvel-bay-dispatch.csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["timestamp", "load_pct"])
        for at, t, _ in rows:
            w.writerow([at.strftime("%Y-%m-%dT%H:%M"), load_pct(at, t)])
    run = [load_pct(at, t) for at, t, _ in rows]
    print(
        f"run hours {sum(1 for x in run if x > 0)}; at 100 % {run.count(100)}, "
        f"80 % {run.count(80)}, 60 % {run.count(60)}; "
        f"T {min(r[1] for r in rows):.1f}..{max(r[1] for r in rows):.1f} degC"
    )


if __name__ == "__main__":
    main()
