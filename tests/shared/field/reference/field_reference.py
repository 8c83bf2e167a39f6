"""Reference values for the field-engine tests, computed with mpmath (30 significant digits).

Independent of the TypeScript code: each case writes the published formula out directly.
- Theis (1935): s = Q/(4 pi T) E1(u), u = r^2 S / (4 T t)            (mpmath.e1)
- Hantush & Jacob (1955): W(u, b) = int_u^inf exp(-y - b^2/(4y))/y dy  (mpmath.quad)
- de Glee (1930): s = Q/(2 pi T) K0(r/B)                              (mpmath.besselk)
- Image wells (Ferris et al. 1962, USGS WSP 1536-E) for two perpendicular lines and for a strip
  between two parallel lines, written in the lines' own coordinates (xi across, eta along), the
  strip series summed to |n| = 3000 (terms beyond underflow far below 1e-30 m).

Run: python3 tests/shared/field/reference/field_reference.py > tests/shared/field/reference/field-reference.json
"""
import json
import platform

import mpmath as mp

mp.mp.dps = 30


def theis(Q, T, S, r, t):
    u = r * r * S / (4 * T * t)
    return Q / (4 * mp.pi * T) * mp.e1(u)


def hantush_w(u, b):
    f = lambda y: mp.exp(-y - b * b / (4 * y)) / y
    return mp.quad(f, [u, u * 10, u * 1000, mp.inf])


def main():
    out = {
        "generator": "tests/shared/field/reference/field_reference.py",
        "mpmath": mp.__version__,
        "python": platform.python_version(),
        "dps": mp.mp.dps,
    }

    Q, T, S, t = mp.mpf("0.01"), mp.mpf("0.005"), mp.mpf("0.0002"), mp.mpf(86400)
    out["theis"] = {
        "rate_m3_s": 0.01, "transmissivity_m2_s": 0.005, "storativity": 0.0002, "time_s": 86400,
        "cases": [{"r_m": r, "drawdown_m": float(theis(Q, T, S, mp.mpf(r), t))} for r in [0.1, 5, 30, 200, 1000]],
    }

    B = mp.mpf(300)
    cases = []
    for r in [5, 30, 200, 600]:
        for tt in [3600, 86400, 864000]:
            u = mp.mpf(r) ** 2 * S / (4 * T * tt)
            cases.append({"r_m": r, "time_s": tt, "drawdown_m": float(Q / (4 * mp.pi * T) * hantush_w(u, mp.mpf(r) / B))})
    out["hantush"] = {"rate_m3_s": 0.01, "transmissivity_m2_s": 0.005, "storativity": 0.0002, "leakageFactor_m": 300, "cases": cases}
    out["deGlee"] = {
        "rate_m3_s": 0.01, "transmissivity_m2_s": 0.005, "leakageFactor_m": 300,
        "cases": [{"r_m": r, "drawdown_m": float(Q / (2 * mp.pi * T) * mp.besselk(0, mp.mpf(r) / B))} for r in [5, 30, 200, 600, 3000]],
    }

    # Corner: constant-head line eta-axis... in plain x, y: constant head along y = 0 (sign -1),
    # no-flow along x = 0 (sign +1), aquifer in x > 0, y > 0, well at (30, 20).
    Qc, Tc, Sc, tc = mp.mpf("0.004"), mp.mpf("0.003"), mp.mpf("0.0001"), mp.mpf(2 * 86400)
    x0, y0 = mp.mpf(30), mp.mpf(20)
    wells = [(x0, y0, 1), (-x0, y0, 1), (x0, -y0, -1), (-x0, -y0, -1)]
    pts = [(0, 10), (15, 0), (60, 5), (10, 45), (0, 0), (100, 80)]
    corner = []
    for px, py in pts:
        s = mp.mpf(0)
        for wx, wy, sg in wells:
            s += sg * theis(Qc, Tc, Sc, mp.sqrt((px - wx) ** 2 + (py - wy) ** 2), tc)
        corner.append({"x": px, "y": py, "drawdown_m": float(s)})
    out["corner"] = {
        "rate_m3_s": 0.004, "transmissivity_m2_s": 0.003, "storativity": 0.0001, "time_s": 2 * 86400,
        "well": [30, 20], "constantHead": "y = 0", "noFlow": "x = 0", "cases": corner,
    }

    # Strip: no-flow line at xi = 0 (sign s1 = +1), constant head at xi = d (sign s2 = -1).
    # Images: xi0 + 2nd with sign (s1 s2)^|n|, -xi0 + 2nd with sign s1 (s1 s2)^|n|.
    d, xi0 = mp.mpf(40), mp.mpf(12)
    Qs, Ts, Ss, ts = mp.mpf("0.005"), mp.mpf("0.002"), mp.mpf("0.0001"), mp.mpf(5 * 86400)
    s1, s2 = 1, -1
    M = 3000
    strip = []
    for pxi, peta in [(0, 0), (20, 10), (40, 5), (5, -30), (39, 60), (12, 0.5)]:
        pxi, peta = mp.mpf(pxi), mp.mpf(peta)
        s = mp.mpf(0)
        for n in range(-M, M + 1):
            for xi, sg in [(xi0 + 2 * n * d, (s1 * s2) ** abs(n)), (-xi0 + 2 * n * d, s1 * (s1 * s2) ** abs(n))]:
                s += sg * theis(Qs, Ts, Ss, mp.sqrt((pxi - xi) ** 2 + peta ** 2), ts)
        strip.append({"xi_m": float(pxi), "eta_m": float(peta), "drawdown_m": float(s)})
    out["strip"] = {
        "rate_m3_s": 0.005, "transmissivity_m2_s": 0.002, "storativity": 0.0001, "time_s": 5 * 86400,
        "spacing_m": 40, "well_xi_m": 12, "noFlowAt": "xi = 0", "constantHeadAt": "xi = d", "terms": M, "cases": strip,
    }
    print(json.dumps(out, indent=1))


if __name__ == "__main__":
    main()
