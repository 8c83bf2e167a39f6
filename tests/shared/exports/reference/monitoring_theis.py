"""Reference levels for tests/shared/exports/monitoring-plan.test.ts.

Theis (1935): s = Q/(4 pi T) W(u), u = r^2 S / (4 T t), W(u) = E1(u) (Abramowitz & Stegun 5.1.1),
superposed in space (two wells) and in time (a rate step of -Q at t_stop for the well that stops).
Computed with mpmath at 30 digits. Run: python3 monitoring_theis.py > monitoring_theis.json
"""
import json
import sys

import mpmath as mp

mp.mp.dps = 30

K = mp.mpf('2e-4')
b = mp.mpf(20)           # aquifer top 0 m, base -20 m
T = K * b
S = mp.mpf('2e-4')
static = mp.mpf(10)
DAY = 86400
wells = [  # x, y, rate m3/s, stop time s (None: runs on)
    (0, 0, mp.mpf('0.01'), None),
    (50, 0, mp.mpf('0.008'), 5 * DAY),
]
piezometer = (20, 10)
times_d = [1, 2, 5, 6, 12]


def drawdown(t):
    s = mp.mpf(0)
    for x, y, q, stop in wells:
        r2 = mp.mpf(piezometer[0] - x) ** 2 + mp.mpf(piezometer[1] - y) ** 2
        s += q / (4 * mp.pi * T) * mp.e1(r2 * S / (4 * T * t))
        if stop is not None and t > stop:
            s -= q / (4 * mp.pi * T) * mp.e1(r2 * S / (4 * T * (t - stop)))
    return s


rows = [{"time_d": d, "level_m": float(static - drawdown(mp.mpf(d * DAY)))} for d in times_d]
print(json.dumps({
    "source": "Theis (1935) superposed in space and time; E1 by mpmath",
    "versions": {"python": sys.version.split()[0], "mpmath": mp.__version__},
    "rows": rows,
}, indent=2))
