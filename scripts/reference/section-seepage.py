#!/usr/bin/env python3
"""Reference values for drydig's section-seepage tests (shared/section).

Writes fixtures/reference/section-seepage.json with

  sheetPile   flow under a single sheet pile driven to depth d in a pervious layer of
              thickness T on an impermeable base, heads H upstream and 0 downstream on the
              surface (Harr 1962, Groundwater and Seepage, ch. 5, conformal mapping):
                  q / (k H) = K(k') / (2 K(k)),  k = sin(pi d / (2 T)),  k' = sqrt(1 - k^2)
              with K the complete elliptic integral of the first kind of modulus k.
              Computed with mpmath.ellipk (which takes the parameter m = k^2) at 30 digits,
              checked against scipy.special.ellipk (double precision); the largest relative
              disagreement is recorded.

Run from the repository root:  python3 scripts/reference/section-seepage.py
"""
import datetime
import json
import pathlib
import platform

import mpmath
import scipy
import scipy.special
from mpmath import mp, mpf

mp.dps = 30


def harr_shape_factor(d_over_t):
    k = mpmath.sin(mpmath.pi * mpf(d_over_t) / 2)
    m = k * k
    return mpmath.ellipk(1 - m) / (2 * mpmath.ellipk(m)), k


def main():
    rows = []
    worst = 0.0
    for d_over_t in ["0.1", "0.2", "0.3", "0.4", "0.5", "0.6", "0.7", "0.8", "0.9"]:
        q, k = harr_shape_factor(d_over_t)
        m = float(k * k)
        check = scipy.special.ellipk(1 - m) / (2 * scipy.special.ellipk(m))
        worst = max(worst, abs(check - float(q)) / float(q))
        rows.append({"dOverT": d_over_t, "modulus": mpmath.nstr(k, 20), "qOverKH": mpmath.nstr(q, 20)})
    out = {
        "source": "Harr (1962) Groundwater and Seepage, ch. 5: single sheet pile in a layer of finite depth, q/(kH) = K(k')/(2K(k)), k = sin(pi d/2T)",
        "sheetPile": rows,
        "scipyCheckMaxRelativeDifference": worst,
        "versions": {"python": platform.python_version(), "mpmath": mpmath.__version__, "scipy": scipy.__version__},
        "precision_decimal_digits": mp.dps,
        "date_utc": datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%d"),
    }
    path = pathlib.Path("fixtures/reference/section-seepage.json")
    path.write_text(json.dumps(out, indent=2) + "\n")
    print(f"wrote {path} ({len(rows)} rows; scipy agrees to {worst:.1e})")


if __name__ == "__main__":
    main()
