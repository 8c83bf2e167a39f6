#!/usr/bin/env python3
"""Reference values of Hantush's (1961) partial-penetration correction f_s (drydig
shared/wells/partial-penetration-correction.ts), in the form of Kruseman & de Ridder (1994, ch. 10):

  s = Q/(4 pi T) (W + f_s)
  piezometer at depth a:   f_s = 4D/(pi (l-d)) sum_n 1/n K0(beta_n) cos(n pi a/D) [sin(n pi l/D) - sin(n pi d/D)]
  screen d'..l':           f_s = 4D^2/(pi^2 (l-d)(l'-d')) sum_n 1/n^2 K0(beta_n) [sin(n pi l/D) - sin(n pi d/D)] [sin(n pi l'/D) - sin(n pi d'/D)]
  beta_n = n pi r sqrt(Kv/Kh) / D, leaky: sqrt((r/B)^2 + beta_n^2) (Hantush 1964)

Depths are measured down from the aquifer top; d, l the pumped screen's top and bottom.
The series is summed with mpmath at 30 digits until beta_n > 90 (K0 < 1e-40).

Independent check (isotropic, non-leaky cases): the steady head of a uniform line sink along the
screen between two no-flow planes, by the method of images along z (segments reflected in z = 0
and z = D, potential of a segment lambda/(4 pi K) [asinh((z2-z)/r) - asinh((z1-z)/r)], averaged over
an observation screen in closed form), summed over images with mpmath.nsum. Its difference
between r and r_ref = 3D must equal Q/(4 pi T) [2 ln(r_ref/r) + f_s(r) - f_s(r_ref)]. The largest
relative disagreement is written under "image_check".

Run from the repository root:
  python3 scripts/reference/partial-penetration.py
It writes fixtures/reference/partial-penetration.json.
"""
import datetime
import json
import pathlib
import platform

import mpmath as mp

mp.mp.dps = 30


def series(r, D, d, l, d2, l2=None, ratio=1, B=None):
    r, D, d, l, d2 = (mp.mpf(x) for x in (r, D, d, l, d2))
    l2 = d2 if l2 is None else mp.mpf(l2)
    scaled = mp.pi * r / (D * mp.sqrt(ratio))
    leak = r / mp.mpf(B) if B is not None else mp.mpf(0)
    k = mp.pi / D
    total = mp.mpf(0)
    n = 1
    while True:
        beta = mp.sqrt(leak**2 + (n * scaled) ** 2)
        if beta > 90:
            break
        pumped = mp.sin(n * k * l) - mp.sin(n * k * d)
        if l2 > d2:
            observed = (mp.sin(n * k * l2) - mp.sin(n * k * d2)) / (n * k * (l2 - d2))
        else:
            observed = mp.cos(n * k * d2)
        total += mp.besselk(0, beta) * pumped * observed / n
        n += 1
    return 4 * D / (mp.pi * (l - d)) * total


def segment_potential(r, z, z1, z2):
    """Integral over the segment [z1, z2] of 1/sqrt(r^2 + (z - zeta)^2) (per unit strength)."""
    return mp.asinh((z2 - z) / r) - mp.asinh((z1 - z) / r)


def primitive(x):
    return x * mp.asinh(x) - mp.sqrt(1 + x * x)


def segment_potential_mean(r, d2, l2, z1, z2):
    """Mean over the observation screen [d2, l2] of segment_potential(r, z, z1, z2)."""
    # int asinh((c - z)/r) dz over [d2, l2] = r [F((c - d2)/r) - F((c - l2)/r)]
    def part(c):
        return r * (primitive((c - d2) / r) - primitive((c - l2) / r))

    return (part(z2) - part(z1)) / (l2 - d2)


def image_sum_head(r, D, d, l, d2, l2):
    """4 pi K (l - d)/Q times the head from the screen and its images (up to a constant), at r."""
    r, D, d, l, d2 = (mp.mpf(x) for x in (r, D, d, l, d2))
    l2 = None if l2 is None else mp.mpf(l2)

    def pot(z1, z2):
        if l2 is None:
            return segment_potential(r, d2, z1, z2)
        return segment_potential_mean(r, d2, l2, z1, z2)

    def pair(m):
        shift = 2 * m * D
        return pot(d + shift, l + shift) + pot(-l + shift, -d + shift)

    return pair


def image_difference(r, r_ref, D, d, l, d2, l2):
    a = image_sum_head(r, D, d, l, d2, l2)
    b = image_sum_head(r_ref, D, d, l, d2, l2)
    term = lambda m: (a(m) - b(m)) + (a(-m) - b(-m))
    total = (a(0) - b(0)) + mp.nsum(term, [1, mp.inf])
    # s = Q/(4 pi K (l - d)) * total;  Q/(4 pi T) = Q/(4 pi K D)  =>  in units of Q/(4 pi T): total * D/(l - d)
    return total * mp.mpf(D) / (mp.mpf(l) - mp.mpf(d))


# Invented geometries (D = aquifer thickness, depths below the aquifer top, metres).
CASES = [
    # piezometers, isotropic, D = 20 m, screen 4..10 m
    *[{"r": r, "D": 20, "d": 4, "l": 10, "d2": a} for r in (0.5, 2, 6, 15, 30) for a in (0, 7, 18)],
    # observation screens and the pumped well's own screen (r = r_w)
    {"r": 0.1, "D": 20, "d": 4, "l": 10, "d2": 4, "l2": 10},
    {"r": 0.1, "D": 20, "d": 0, "l": 5, "d2": 0, "l2": 5},
    {"r": 3, "D": 20, "d": 4, "l": 10, "d2": 12, "l2": 16},
    # a well point 0.05 m in radius, screen 4.5..7.5 m below the water table, H = 18.5 m
    {"r": 0.05, "D": 18.5, "d": 4.5, "l": 7.5, "d2": 4.5, "l2": 7.5},
    {"r": 2, "D": 18.5, "d": 4.5, "l": 7.5, "d2": 0},
    # anisotropic Kh/Kv = 10 and 4
    {"r": 0.05, "D": 18.5, "d": 4.5, "l": 7.5, "d2": 4.5, "l2": 7.5, "ratio": 10},
    {"r": 5, "D": 20, "d": 4, "l": 10, "d2": 0, "ratio": 10},
    {"r": 40, "D": 20, "d": 4, "l": 10, "d2": 0, "ratio": 10},
    {"r": 2, "D": 20, "d": 0, "l": 8, "d2": 15, "ratio": 4},
    # leaky, B = 60 m
    {"r": 0.1, "D": 20, "d": 4, "l": 10, "d2": 4, "l2": 10, "B": 60},
    {"r": 5, "D": 20, "d": 4, "l": 10, "d2": 0, "B": 60, "ratio": 4},
    # full penetration: exactly 0
    {"r": 1, "D": 20, "d": 0, "l": 20, "d2": 3},
]


def main():
    rows = []
    worst = mp.mpf(0)
    for c in CASES:
        f = series(c["r"], c["D"], c["d"], c["l"], c["d2"], c.get("l2"), c.get("ratio", 1), c.get("B"))
        rows.append({**c, "fs": mp.nstr(f, 20)})
        if c.get("ratio", 1) == 1 and c.get("B") is None:
            r_ref = 3 * c["D"]
            f_ref = series(r_ref, c["D"], c["d"], c["l"], c["d2"], c.get("l2"))
            expected = 2 * mp.log(mp.mpf(r_ref) / c["r"]) + f - f_ref
            got = image_difference(c["r"], r_ref, c["D"], c["d"], c["l"], c["d2"], c.get("l2"))
            worst = max(worst, abs(got - expected) / abs(expected))
    out = {
        "source": "Hantush (1961) partial-penetration correction, Kruseman & de Ridder (1994) ch. 10 form; series summed with mpmath",
        "versions": {"python": platform.python_version(), "mpmath": mp.__version__},
        "precision_decimal_digits": mp.mp.dps,
        "date_utc": datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%d"),
        "image_check": {"what": "steady head difference r vs 3D by z-images of the line sink (isotropic cases)", "max_relative_difference": mp.nstr(worst, 3)},
        "cases": rows,
    }
    path = pathlib.Path("fixtures/reference/partial-penetration.json")
    path.write_text(json.dumps(out, indent=1) + "\n")
    print(f"wrote {path} ({len(rows)} cases); image check max rel. difference {mp.nstr(worst, 3)}")


if __name__ == "__main__":
    main()
