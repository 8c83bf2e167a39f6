#!/usr/bin/env python3
"""Reference values for the pit-floor time checks (tests/shared/floor/floor-timeline.test.ts).

One well pumping Q from t = 0 in an infinite confined aquifer (Theis 1935):
    h(r, t) = h0 - Q / (4 pi T) * E1(r^2 S / (4 T t))
A clay plug of saturated unit weight g_sat from formation z_f down to its base z_b over the aquifer.
Uplift (EN 1997-1 UPL with the recommended factors of Table A.15, gamma_dst = 1.0, gamma_stb = 0.9):
    safe while g_sat * (z - z_b) >= (1.0 / 0.9) * g_w * (h - z_b), so the deepest safe formation is
    z* = z_b + (1.0 / 0.9) * g_w * (h - z_b) / g_sat (not below z_f).
Power failure at t_p (superposition in time; Theis recovery equation):
    h(r, t_p + t') = h0 - Q / (4 pi T) * [E1(u(t_p + t')) - E1(u(t'))]
The time to unsafe is the t' at which h reaches the allowable level
    h_allow = z_b + g_sat * (z_f - z_b) / ((1.0 / 0.9) * g_w),
found with mpmath.findroot. Run: python3 scripts/reference/floor-time-checks.py > fixtures/reference/floor-time-checks.json
"""
import json
import mpmath as mp

mp.mp.dps = 30
K, b, S, h0, Q, r = mp.mpf('2e-4'), mp.mpf(20), mp.mpf('2e-4'), mp.mpf(13), mp.mpf('0.025'), mp.mpf(15)
T = K * b
g_w, g_sat, z_b, z_f = mp.mpf('9.81'), mp.mpf('19.5'), mp.mpf(5), mp.mpf(7)
fs_req = mp.mpf(1) / mp.mpf('0.9')
t_p = mp.mpf(604800)

def head(t):
    return h0 - Q / (4 * mp.pi * T) * mp.e1(r * r * S / (4 * T * t))

def safe_level(h):
    return max(z_f, z_b + fs_req * g_w * (h - z_b) / g_sat)

times = [mp.mpf(600) * mp.mpf(2) ** k for k in range(11)]
h_allow = z_b + g_sat * (z_f - z_b) / (fs_req * g_w)

def recovery_head(dt):
    return h0 - Q / (4 * mp.pi * T) * (mp.e1(r * r * S / (4 * T * (t_p + dt))) - mp.e1(r * r * S / (4 * T * dt)))

t_unsafe = mp.findroot(lambda dt: recovery_head(dt) - h_allow, (mp.mpf(1), mp.mpf(1e6)), solver='anderson')
print(json.dumps({
    'source': 'scripts/reference/floor-time-checks.py (mpmath ' + mp.__version__ + '): Theis (1935) heads, EN 1997-1 UPL recommended factors',
    'parameters': {'conductivity_m_s': 2e-4, 'thickness_m': 20, 'storativity': 2e-4, 'staticLevel_m': 13, 'rate_m3_s': 0.025, 'distance_m': 15,
                   'plugUnitWeightSat_kN_m3': 19.5, 'plugBase_m': 5, 'formationLevel_m': 7, 'stop_s': 604800},
    'safeDig': [{'time_s': float(t), 'head_m': float(head(t)), 'safeFormationLevel_m': float(safe_level(head(t)))} for t in times],
    'headAtStop_m': float(head(t_p)),
    'allowableLevel_m': float(h_allow),
    'timeToUnsafe_s': float(t_unsafe),
}, indent=2))
