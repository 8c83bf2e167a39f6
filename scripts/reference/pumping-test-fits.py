#!/usr/bin/env python3
"""Reference fits for drydig's pumping-test analysis (shared/testing/).

Makes two invented, seeded, noisy data sets (numpy's default_rng), fits them with scipy's
general-purpose least squares (scipy.optimize.curve_fit, Levenberg-Marquardt) and records the
fitted parameters, their 95 % confidence intervals (Student t on the log-parameter covariance,
as drydig reports them) and the RMSE:
  theis    s = Q/(4 pi T) E1(r^2 S/(4 T t)), two observation wells fitted at once, log T, log S
  hantush  s = Q/(4 pi T) W(u, r/B), W by scipy.integrate.quad of exp(-y - b^2/(4y))/y, log T, log S, log B
The data are invented for this check only (no field test).

Run from the repository root:
  python3 scripts/reference/pumping-test-fits.py
It writes fixtures/reference/pumping-test-fits.json.
"""
import datetime
import json
import math
import pathlib
import platform

import numpy as np
import scipy
from scipy import integrate, optimize, special, stats

Q = 0.012  # m3/s
TRUE = {"theis": {"T": 1.5e-3, "S": 2.0e-4}, "hantush": {"T": 8.0e-4, "S": 1.0e-4, "B": 150.0}}
NOISE_M = 0.005


def hantush_w(u, beta):
    f = lambda y: math.exp(-y - beta * beta / (4 * y)) / y
    val, _ = integrate.quad(f, u, np.inf, limit=400, epsabs=0, epsrel=1e-12)
    return val


def theis(X, lnT, lnS):
    t, r = X
    T, S = math.exp(lnT), math.exp(lnS)
    return Q / (4 * math.pi * T) * special.exp1(r * r * S / (4 * T * t))


def hantush(X, lnT, lnS, lnB):
    t, r = X
    T, S, B = math.exp(lnT), math.exp(lnS), math.exp(lnB)
    return np.array([Q / (4 * math.pi * T) * hantush_w(rr * rr * S / (4 * T * tt), rr / B) for tt, rr in zip(t, r)])


def make(kind, rng):
    times = np.geomspace(60, 2.0e5, 30)
    wells = [("PZ1", 12.0), ("PZ2", 40.0)] if kind == "theis" else [("PZ1", 25.0)]
    rows = []
    for name, r in wells:
        for t in times:
            rows.append((float(t), r, name))
    t = np.array([x[0] for x in rows])
    r = np.array([x[1] for x in rows])
    p = TRUE[kind]
    clean = theis((t, r), math.log(p["T"]), math.log(p["S"])) if kind == "theis" else hantush((t, r), math.log(p["T"]), math.log(p["S"]), math.log(p["B"]))
    s = clean + rng.normal(0, NOISE_M, len(t))
    return rows, t, r, s


def fit(kind, t, r, s):
    if kind == "theis":
        f, p0 = theis, [math.log(1e-3), math.log(1e-4)]
    else:
        f, p0 = hantush, [math.log(1e-3), math.log(1e-4), math.log(300.0)]
    popt, pcov = optimize.curve_fit(f, (t, r), s, p0=p0, method="lm", xtol=1e-14, ftol=1e-14, maxfev=20000)
    resid = s - f((t, r), *popt)
    n, m = len(s), len(popt)
    tq = stats.t.ppf(0.975, n - m)
    names = ["transmissivity_m2_s", "storativity", "leakageFactor_m"][:m]
    out = {"rmse_m": float(math.sqrt(np.mean(resid ** 2)))}
    for k, name in enumerate(names):
        half = tq * math.sqrt(pcov[k, k])
        out[name] = math.exp(popt[k])
        out[name + "_interval"] = [math.exp(popt[k] - half), math.exp(popt[k] + half)]
    return out


def main():
    rng = np.random.default_rng(20261202)
    cases = {}
    for kind in ("theis", "hantush"):
        rows, t, r, s = make(kind, rng)
        cases[kind] = {
            "rate_m3_s": Q,
            "true": TRUE[kind],
            "noise_m": NOISE_M,
            "readings": [{"time_s": a, "distance_m": b, "well": c, "drawdown_m": float(d)} for (a, b, c), d in zip(rows, s)],
            "fit": fit(kind, t, r, s),
        }
    doc = {
        "about": "scipy.optimize.curve_fit (LM) fits of invented seeded noisy data; see scripts/reference/pumping-test-fits.py",
        "generated": datetime.datetime.now(datetime.timezone.utc).isoformat(timespec="seconds"),
        "versions": {"python": platform.python_version(), "numpy": np.__version__, "scipy": scipy.__version__},
        "confidence": 0.95,
        "cases": cases,
    }
    path = pathlib.Path("fixtures/reference/pumping-test-fits.json")
    path.write_text(json.dumps(doc, indent=1) + "\n")
    print(f"wrote {path}")
    for k, c in cases.items():
        print(k, c["fit"])


if __name__ == "__main__":
    main()
