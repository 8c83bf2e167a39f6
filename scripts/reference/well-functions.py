#!/usr/bin/env python3
"""Reference values of the well functions for drydig's engine tests.

Writes fixtures/reference/well-functions.json with high-precision values of
  E1(u)           mpmath.e1                (Theis well function W(u))
  K0(x)           mpmath.besselk(0, x)
  W(u, beta)      Hantush-Jacob leaky well function, by mpmath.quad
together with the library versions, the working precision and the date.

W(u, beta) = int_u^inf exp(-y - beta^2/(4y)) / y dy is integrated twice, by two different
routes, and the script records how far apart they are:
  primary: after the log substitution y = e^s, int_{ln u} exp(-e^s - c e^-s) ds, c = beta^2/4;
  check:   in y directly, int_u exp(-y - c/y)/y dy, with extra geometric splits (factor 8).
Both are split at the same points (see hantush_breakpoints): the peak y = beta/2 when it lies
above u, and where the exponent y + c/y has risen by k^2 above its minimum, k = 1 ... 10; the
upper limit (a rise of 100) leaves out less than e^-100 of the peak integrand. An infinite upper
limit is avoided on purpose: tanh-sinh would evaluate exp(-e^s) at enormous s.

Run from the repository root:  python3 scripts/reference/well-functions.py
Values are written as decimal strings with 25 significant digits so that the tests parse them to
the nearest double without going through a binary float here.
"""
import datetime
import json
import pathlib
import platform
import sys

import mpmath
from mpmath import mp, mpf

mp.dps = 30
DIGITS = 25


def fmt(v):
    return mpmath.nstr(v, DIGITS, min_fixed=1, max_fixed=0) if v != 0 else "0"


def logspace(lo, hi, n):
    a, b = mpmath.log10(mpf(lo)), mpmath.log10(mpf(hi))
    # Round each argument to a double so that the test evaluates exactly the tabulated point.
    return [mpf(float(mpf(10) ** (a + (b - a) * i / (n - 1)))) for i in range(n)]


def hantush_breakpoints(u, beta):
    """Points y >= u where the exponent phi(y) = y + c/y (c = beta^2/4) reaches phi_min + k^2,
    k = 0 ... 10, on both sides of its minimum; between neighbours the integrand is smooth and
    changes by at most e^(2k+1), which tanh-sinh integrates to full precision. The last point,
    where phi = phi_min + 100, leaves a neglected tail below e^-100 of the peak integrand."""
    c = beta * beta / 4
    peak = beta / 2
    phi_min = 2 * mpmath.sqrt(c) if peak > u else u + c / u
    pts = {u}
    if peak > u:
        pts.add(peak)
    for k in range(1, 11):
        level = phi_min + mpf(k * k)
        root = mpmath.sqrt(level * level - 4 * c)
        for y in ((level + root) / 2, (level - root) / 2 if c > 0 else None):
            if y is not None and y > u:
                pts.add(y)
    return sorted(pts)


def exponent_minimum(u, beta):
    c = beta * beta / 4
    return beta if beta / 2 > u else u + c / u


# mpmath.quad judges convergence by an absolute tolerance, so each integrand is divided by its
# peak value exp(-phi_min) and the result multiplied back; otherwise a value like 1e-133 would
# pass as "converged" at the first, crude level.
def hantush_log(u, beta):
    c = beta * beta / 4
    m = exponent_minimum(u, beta)
    pts = [mpmath.log(y) for y in hantush_breakpoints(u, beta)]
    f = lambda s: mpmath.exp(m - mpmath.exp(s) - c * mpmath.exp(-s))
    v, err = mpmath.quad(f, pts, error=True)
    return v * mpmath.exp(-m), err * mpmath.exp(-m)


def hantush_direct(u, beta):
    c = beta * beta / 4
    pts = []
    for y in hantush_breakpoints(u, beta):
        # Subdivide long stretches geometrically: near y = 0 the integrand behaves like 1/y.
        while pts and y > 8 * pts[-1]:
            pts.append(8 * pts[-1])
        pts.append(y)
    m = exponent_minimum(u, beta)
    f = lambda y: mpmath.exp(m - y - c / y) / y
    v, err = mpmath.quad(f, pts, error=True)
    return v * mpmath.exp(-m), err * mpmath.exp(-m)


def main():
    root = pathlib.Path(__file__).resolve().parents[2]
    out = root / "fixtures" / "reference" / "well-functions.json"

    e1_args = logspace("1e-12", "700", 400) + [mpf(v) for v in
               (0.5, 1, 2, 4, 5, 8, 10, 20, 50, 100, 705, 710, 720, 730, 740, 745, 746, 750, 800, 1000)]
    e1 = [[fmt(u), fmt(mpmath.e1(u))] for u in e1_args]

    k0_args = logspace("1e-8", "700", 400) + [mpf(v) for v in
               (0.5, 1, 2, 4, 5, 8, 10, 20, 50, 100, 705, 710, 720, 740, 745, 750, 800, 1000)]
    k0 = [[fmt(x), fmt(mpmath.besselk(0, x))] for x in k0_args]

    u_grid = logspace("1e-8", "20", 21)
    b_grid = logspace("1e-4", "10", 21)
    pairs = [(u, b) for u in u_grid for b in b_grid]
    edge_u = [mpf(v) for v in ("1e-12", "1e-10", "1e-6", "0.01", "1", "30", "50", "100", "300")]
    edge_b = [mpf(v) for v in ("1e-8", "1e-6", "0.5", "2", "15", "20", "30", "50", "100", "200")]
    edges = [(u, b) for u in edge_u for b in edge_b]
    hantush = []
    worst_disagreement = mpf(0)
    worst_error_estimate = mpf(0)
    for i, (u, b) in enumerate(pairs + edges):
        if i % 50 == 0:
            print(f"hantush {i}/{len(pairs) + len(edges)}", file=sys.stderr, flush=True)
        v, err = hantush_log(u, b)
        w, _ = hantush_direct(u, b)
        if v != 0:
            worst_disagreement = max(worst_disagreement, abs(v - w) / abs(v))
            worst_error_estimate = max(worst_error_estimate, abs(err) / abs(v))
        hantush.append({"u": fmt(u), "rOverB": fmt(b), "W": fmt(v), "inBox": (u, b) in pairs})

    doc = {
        "what": "Reference values of E1(u) = W(u), K0(x) and the Hantush-Jacob W(u, r/B)",
        "generator": "scripts/reference/well-functions.py",
        "command": "python3 scripts/reference/well-functions.py",
        "date_utc": datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%dT%H:%M:%SZ"),
        "versions": {"python": platform.python_version(), "mpmath": mpmath.__version__},
        "precision_decimal_digits": mp.dps,
        "significant_digits_written": DIGITS,
        "methods": {
            "e1": "mpmath.e1(u)",
            "k0": "mpmath.besselk(0, x)",
            "hantush": "mpmath.quad (tanh-sinh) of exp(-e^s - (r/B)^2 e^-s / 4) over s from ln u, "
                       "split where the exponent has risen k^2 above its minimum, k = 0..10",
        },
        "hantush_check": {
            "second_route": "mpmath.quad of exp(-y - (r/B)^2/(4y))/y over y from u, same splits "
                            "plus geometric ones",
            "max_relative_disagreement": mpmath.nstr(worst_disagreement, 3),
            "max_relative_error_estimate": mpmath.nstr(worst_error_estimate, 3),
        },
        "e1": e1,
        "k0": k0,
        "hantush": hantush,
    }
    out.write_text(json.dumps(doc, indent=1) + "\n")
    print(f"wrote {out.relative_to(root)}: {len(e1)} E1, {len(k0)} K0, {len(hantush)} Hantush values; "
          f"Hantush routes agree to {mpmath.nstr(worst_disagreement, 3)}", file=sys.stderr)


if __name__ == "__main__":
    main()
