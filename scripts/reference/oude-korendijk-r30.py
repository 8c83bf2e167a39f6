#!/usr/bin/env python3
"""Independent least-squares Theis fit of the textbook readings in
fixtures/pumping-tests/oude-korendijk-r30.csv (typed from memory of Kruseman & de Ridder,
"Analysis and Evaluation of Pumping Test Data", 2nd ed., piezometer at r = 30 m; Q = 788 m3/d).

Fits s = Q/(4 pi T) E1(r^2 S/(4 T t)) with scipy.optimize.curve_fit (Levenberg-Marquardt) in
log T, log S over every reading, as drydig's fitTheisCurve does, and also with the residuals
taken in log(s) (the weighting of a type-curve match on log-log paper), for the record.

Run from the repository root:
  python3 scripts/reference/oude-korendijk-r30.py
It writes fixtures/reference/oude-korendijk-r30.json.
"""
import csv
import datetime
import json
import math
import pathlib
import platform

import numpy as np
import scipy
from scipy import optimize, special

Q = 788.0 / 86400.0  # m3/s
ROOT = pathlib.Path(__file__).resolve().parents[2]
rows = list(csv.DictReader(open(ROOT / "fixtures/pumping-tests/oude-korendijk-r30.csv")))
t = np.array([float(r["time_min"]) * 60.0 for r in rows])
s = np.array([float(r["drawdown_m"]) for r in rows])
r = float(rows[0]["distance_m"])


def theis(tt, lnT, lnS):
    T, S = math.exp(lnT), math.exp(lnS)
    return Q / (4 * math.pi * T) * special.exp1(r * r * S / (4 * T * tt))


start = [math.log(5e-3), math.log(1.5e-4)]
p, _ = optimize.curve_fit(theis, t, s, p0=start, xtol=1e-14, ftol=1e-14, gtol=1e-14, maxfev=10000)
rmse = float(np.sqrt(np.mean((s - theis(t, *p)) ** 2)))
pl, _ = optimize.curve_fit(lambda tt, a, b: np.log(theis(tt, a, b)), t, np.log(s), p0=start, xtol=1e-14, ftol=1e-14, gtol=1e-14, maxfev=10000)

out = {
    "source": "scipy.optimize.curve_fit of fixtures/pumping-tests/oude-korendijk-r30.csv (readings from memory of Kruseman & de Ridder, 2nd ed.)",
    "rate_m3_s": Q,
    "distance_m": r,
    "theis": {"transmissivity_m2_s": math.exp(p[0]), "storativity": math.exp(p[1]), "rmse_m": rmse},
    "theisLogResiduals": {"transmissivity_m2_s": math.exp(pl[0]), "storativity": math.exp(pl[1])},
    "versions": {"python": platform.python_version(), "numpy": np.__version__, "scipy": scipy.__version__},
    "date_utc": datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%d"),
}
(ROOT / "fixtures/reference/oude-korendijk-r30.json").write_text(json.dumps(out, indent=2) + "\n")
print(json.dumps(out, indent=2))
