#!/usr/bin/env python3
"""Reference values for the power failure of a steady design (tests/shared/design/design-recovery.test.ts).

One well at the origin, steady state with a given radius of influence R (Thiem 1906; Dupuit-Thiem
when unconfined, superposed in the discharge potential s_c = (H^2 - h^2) / (2H)). Every pump stops
at the steady state; from then on an injection of the same rate (Theis 1935 superposition):
    s'(r, t') = Q / (2 pi T) * ln(R / r) - Q / (4 pi T) * E1(r^2 S / (4 T t'))
(unconfined: in s_c with T = K H, S = Sy, then h = base + sqrt(H^2 - 2 H s_c)).

Design cases (the single-well pit of tests/shared/design/design-test-helpers.ts, critical point the
far vertex (11, 1)): the steady rate that puts the critical point at the target (the design asks
for target - 1e-3 m, DESIGN_TOLERANCE_M, as tests/shared/design/reference/design-reference.py),
and the time after the stop until it is back at formation level.

Floor case (the clay plug of scripts/reference/floor-time-checks.py, steady rate Q = 0.04 m3/s,
R = 500 m, observation at r = 15 m): the steady head, the deepest safe formation level at the steady
state (EN 1997-1 UPL recommended factors, gamma_dst = 1.0, gamma_stb = 0.9):
    z* = z_b + (1.0 / 0.9) * g_w * (h - z_b) / g_sat
and the time after the stop until the head rises above the allowable level of a formation at 7 m:
    h_allow = z_b + g_sat * (z_f - z_b) / ((1.0 / 0.9) * g_w).
Roots with mpmath.findroot. Run from the repository root:
    python3 scripts/reference/steady-recovery.py > fixtures/reference/steady-recovery.json
"""
import json
import platform
import mpmath as mp

mp.mp.dps = 30


def design_case(kind):
    K, base, static, R = mp.mpf('1e-4'), mp.mpf(-20), mp.mpf(5), mp.mpf(300)
    target, formation = mp.mpf(2) - mp.mpf('1e-3'), mp.mpf('2.5')
    r = mp.sqrt(mp.mpf(11) ** 2 + 1)
    if kind == 'confined':
        T, S = K * 20, mp.mpf('1e-4')  # top 0, base -20
        var = lambda level: static - level
        level_of = lambda v: static - v
    else:
        H = static - base
        T, S = K * H, mp.mpf('0.1')
        var = lambda level: (H * H - (level - base) ** 2) / (2 * H)
        level_of = lambda v: base + mp.sqrt(H * H - 2 * H * v)
    Q = 2 * mp.pi * T * var(target) / mp.log(R / r)
    steady = Q / (2 * mp.pi * T) * mp.log(R / r)
    residual = lambda dt: steady - Q / (4 * mp.pi * T) * mp.e1(r * r * S / (4 * T * dt))
    t = mp.findroot(lambda lt: residual(mp.e ** lt) - var(formation), mp.log(600))
    t = mp.e ** t
    return {
        'rate_m3_s': float(Q),
        'designLevel_m': float(target),
        'criticalDistance_m': float(r),
        'influenceRadius_m': float(R),
        'recoveryToFormation_s': float(t),
        'levelAt': [{'sinceStop_s': float(dt), 'level_m': float(level_of(residual(mp.mpf(dt))))} for dt in (60, 600, 3600)],
    }


def floor_case():
    K, b, S, h0, Q, r, R = mp.mpf('2e-4'), mp.mpf(20), mp.mpf('2e-4'), mp.mpf(13), mp.mpf('0.04'), mp.mpf(15), mp.mpf(500)
    T = K * b
    g_w, g_sat, z_b = mp.mpf('9.81'), mp.mpf('19.5'), mp.mpf(5)
    fs_req = mp.mpf(1) / mp.mpf('0.9')
    steady_head = h0 - Q / (2 * mp.pi * T) * mp.log(R / r)
    safe = z_b + fs_req * g_w * (steady_head - z_b) / g_sat
    h_allow = z_b + g_sat * (mp.mpf(7) - z_b) / (fs_req * g_w)
    head = lambda dt: steady_head + Q / (4 * mp.pi * T) * mp.e1(r * r * S / (4 * T * dt))
    lt = mp.findroot(lambda x: head(mp.e ** x) - h_allow, mp.log(60))
    return {
        'rate_m3_s': 0.04, 'influenceRadius_m': 500, 'distance_m': 15,
        'steadyHead_m': float(steady_head),
        'safeFormationLevelAtSteady_m': float(safe),
        'allowableLevelFormation7_m': float(h_allow),
        'timeToUnsafeFormation7_s': float(mp.e ** lt),
    }


print(json.dumps({
    'source': 'scripts/reference/steady-recovery.py: Thiem / Dupuit-Thiem steady cone minus the Theis (1935) injection from the stop',
    'versions': {'python': platform.python_version(), 'mpmath': mp.__version__, 'precision_decimal_digits': mp.mp.dps},
    'confined': design_case('confined'),
    'unconfined': design_case('unconfined'),
    'floor': floor_case(),
}, indent=2))
