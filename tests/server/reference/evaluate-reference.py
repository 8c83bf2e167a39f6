#!/usr/bin/env python3
"""Reference drawdowns for tests/server/routes/evaluate-reference.test.ts.

Closed-form single-well solutions evaluated with mpmath at 30 significant digits, independently of
the drydig engine, so the HTTP route can be checked end to end against published formulas:

  Theis (1935):            s = Q/(4 pi T) E1(u),  u = r^2 S / (4 T t)
  Thiem (1906):            s = Q/(2 pi T) ln(R/r)
  Dupuit-Thiem:            H^2 - h^2 = Q/(pi K) ln(R/r),  s = H - h
  Theis on the discharge potential (unconfined, Jacob 1944 correction inverted):
                           s_c = Q/(4 pi K H) E1(r^2 Sy / (4 K H t)),  s = H - sqrt(H^2 - 2 H s_c)
  Hantush & Jacob (1955):  s = Q/(4 pi T) W(u, r/B),  W(u, b) = int_u^inf exp(-y - b^2/(4y)) / y dy
  de Glee (1930):          s = Q/(2 pi T) K0(r/B)
  Image well for a straight constant-head line (Ferris et al. 1962): s = Q/(4 pi T) [E1(u1) - E1(u2)]

Run:  python3 tests/server/reference/evaluate-reference.py > tests/server/reference/evaluate-reference.json
"""
import json
import platform
import mpmath as mp

mp.mp.dps = 30

Q = mp.mpf('0.01')          # m3/s
K = mp.mpf('1e-4')          # m/s
TOP, BASE = mp.mpf(0), mp.mpf(-20)
b = TOP - BASE              # 20 m
T = K * b                   # 2e-3 m2/s
S = mp.mpf('1e-4')
SY = mp.mpf('0.1')
STATIC = mp.mpf(5)          # confined: piezometric level 5 m above the aquifer top
STATIC_U = mp.mpf(-2)       # unconfined case: water table at -2 m, H = 18 m
H = STATIC_U - BASE
R = mp.mpf(500)
B = mp.mpf(300)
t = mp.mpf(86400)
T_LEAKY = mp.mpf(3600)      # short enough that Hantush-Jacob differs from de Glee's steady state
RADII = [mp.mpf(10), mp.mpf(50), mp.mpf(200)]


def theis(r, T_, S_, t_):
    return Q / (4 * mp.pi * T_) * mp.e1(r * r * S_ / (4 * T_ * t_))


def hantush_w(u, beta):
    return mp.quad(lambda y: mp.exp(-y - beta * beta / (4 * y)) / y, [u, u * 10, u * 1000, mp.inf])


# W(u, b) tends to E1(u) as b -> 0: a check on the quadrature.
assert abs(hantush_w(mp.mpf('0.01'), mp.mpf('1e-12')) - mp.e1(mp.mpf('0.01'))) < mp.mpf('1e-10')

rows = {}
rows['theis'] = [float(theis(r, T, S, t)) for r in RADII]
rows['thiem'] = [float(Q / (2 * mp.pi * T) * mp.log(R / r)) for r in RADII]
rows['dupuit_thiem'] = [float(H - mp.sqrt(H * H - Q / (mp.pi * K) * mp.log(R / r))) for r in RADII]
rows['theis_unconfined'] = [float(H - mp.sqrt(H * H - 2 * H * theis(r, K * H, SY, t))) for r in RADII]
rows['hantush_jacob'] = [float(Q / (4 * mp.pi * T) * hantush_w(r * r * S / (4 * T * T_LEAKY), r / B)) for r in RADII]
rows['de_glee'] = [float(Q / (2 * mp.pi * T) * mp.besselk(0, r / B)) for r in RADII]

# Constant-head line x = 100 m, well at the origin, points on y = 0 at x = -50, 0 + 10, 50.
line_x = mp.mpf(100)
image_points = [(mp.mpf(-50), mp.mpf(0)), (mp.mpf(10), mp.mpf(0)), (mp.mpf(50), mp.mpf(0))]
rows['theis_constant_head_line'] = [
    float(theis(abs(x), T, S, t) - theis(abs(2 * line_x - x), T, S, t)) for x, _ in image_points
]

print(json.dumps({
    'generator': 'tests/server/reference/evaluate-reference.py',
    'versions': {'python': platform.python_version(), 'mpmath': mp.__version__},
    'parameters': {
        'rate_m3_s': float(Q), 'conductivity_m_s': float(K), 'top_m': float(TOP), 'base_m': float(BASE),
        'storativity': float(S), 'specificYield': float(SY), 'confinedStaticLevel_m': float(STATIC),
        'unconfinedStaticLevel_m': float(STATIC_U), 'influenceRadius_m': float(R), 'leakageFactor_m': float(B),
        'time_s': float(t), 'leakyTime_s': float(T_LEAKY), 'radii_m': [float(r) for r in RADII], 'constantHeadLineX_m': float(line_x),
        'imagePoints': [[float(x), float(y)] for x, y in image_points],
    },
    'drawdown_m': rows,
}, indent=1))
