#!/usr/bin/env python3
"""Reference values for the design-solver tests, computed with mpmath (general-purpose library).

Run: python3 tests/shared/design/reference/design-reference.py > tests/shared/design/reference/design-reference.json

Cases (parameters are written out here and in the tests; change both together):
1. ring-confined-steady: N equal wells on a ring of radius a, Thiem (1906) steady confined.
   For a ring, prod_k |z - a w^k| = |z^N - a^N| (w = exp(2 pi i/N)), so at z the drawdown of N
   wells of rate q is q/(2 pi T) (N ln R - ln|z^N - a^N|). Over a disc of radius rho < a the
   least drawdown is at z^N = -rho^N: |z^N - a^N| = a^N + rho^N. A regular N-gon of circumradius
   rho with vertices at angles (k + 1/2) 2 pi / N touches the disc there, so those vertices are
   the critical control points and the least total rate is N q with
   q = 2 pi T s / (N ln R - ln(a^N + rho^N)). By the rotational symmetry the LP optimum equals it.
2. ring-unconfined-steady: the same with Dupuit-Thiem in s_c = (H^2 - h^2)/(2H), T = K H.
3. single-well-theis: one well, Theis (1935); the uniform rate that brings the farthest vertex
   (distance r) to the target at t: q = 4 pi T s / E1(r^2 S/(4 T t)); then all pumps stop at t and
   the residual drawdown there is q/(4 pi T) [E1(r^2 S/(4T(t + t'))) - E1(r^2 S/(4T t'))] (Theis
   recovery by superposition); t' is where it has fallen to static - formation.
The design asks for target - 1e-3 m (DESIGN_TOLERANCE_M), so s includes that 1 mm.
"""
import json
import sys
import mpmath as mp
import numpy, scipy

mp.mp.dps = 30
TOL = mp.mpf('1e-3')

def ring_confined():
    K, top, base, static = mp.mpf('5e-4'), mp.mpf(0), mp.mpf(-30), mp.mpf(10)
    T = K * (top - base)
    R, N, a, rho = mp.mpf(500), 8, mp.mpf(20), mp.mpf(12)
    target = mp.mpf('3.5')
    s = static - (target - TOL)
    q = 2 * mp.pi * T * s / (N * mp.log(R) - mp.log(a**N + rho**N))
    return {'K': 5e-4, 'T_m2_s': float(T), 'R_m': 500, 'N': N, 'a_m': 20, 'rho_m': 12, 'required_m': float(s),
            'rate_each_m3_s': float(q), 'total_m3_s': float(N * q)}

def ring_unconfined():
    K, base, static = mp.mpf('5e-4'), mp.mpf(-20), mp.mpf(10)
    H = static - base
    T = K * H
    R, N, a, rho = mp.mpf(500), 8, mp.mpf(20), mp.mpf(12)
    target = mp.mpf('3.5')
    h = target - TOL - base
    sc = (H**2 - h**2) / (2 * H)
    q = 2 * mp.pi * T * sc / (N * mp.log(R) - mp.log(a**N + rho**N))
    return {'K': 5e-4, 'H_m': float(H), 'R_m': 500, 'N': N, 'a_m': 20, 'rho_m': 12, 'required_sc_m': float(sc),
            'rate_each_m3_s': float(q), 'total_m3_s': float(N * q)}

def single_well_theis():
    K, top, base, static, S = mp.mpf('1e-4'), mp.mpf(0), mp.mpf(-20), mp.mpf(5), mp.mpf('1e-4')
    T = K * (top - base)
    t = mp.mpf(86400)
    target, formation = mp.mpf(2), mp.mpf('2.5')
    r2 = mp.mpf(11)**2 + mp.mpf(1)**2   # well at (0,0), farthest vertex (11, ±1) of the 2 m square centred at (10, 0)
    s = static - (target - TOL)
    q = 4 * mp.pi * T * s / mp.e1(r2 * S / (4 * T * t))
    amp = q / (4 * mp.pi * T)
    residual = lambda tp: amp * (mp.e1(r2 * S / (4 * T * (t + tp))) - mp.e1(r2 * S / (4 * T * tp)))
    need = static - formation
    tp = mp.findroot(lambda x: residual(mp.exp(x)) - need, mp.log(100))
    # Time at which a nearer vertex (9, ±1) first reaches the target with rate q: same u as the far vertex at t.
    r2near = mp.mpf(9)**2 + 1
    u_star = mp.exp(mp.findroot(lambda x: amp * mp.e1(mp.exp(x)) - (static - target), mp.log(r2 * S / (4 * T * t))))
    return {'T_m2_s': float(T), 'S': 1e-4, 'designTime_s': 86400, 'rate_m3_s': float(q),
            'recoveryToFormation_s': float(mp.exp(tp)),
            'farVertexTimeToTarget_s': float(r2 * S / (4 * T * u_star)),
            'nearVertexTimeToTarget_s': float(r2near * S / (4 * T * u_star))}

out = {
    'generator': 'tests/shared/design/reference/design-reference.py',
    'versions': {'python': sys.version.split()[0], 'mpmath': mp.__version__, 'numpy': numpy.__version__, 'scipy': scipy.__version__},
    'ringConfinedSteady': ring_confined(),
    'ringUnconfinedSteady': ring_unconfined(),
    'singleWellTheis': single_well_theis(),
}
json.dump(out, sys.stdout, indent=2)
print()
