#!/usr/bin/python3
# Reference lethality values for tests/lethality/reference_test.cpp.
# Source: direct numerical integration, independent of coldcore:
#   F = integral of 10^((T(t) - Tref)/z) dt  (Bigelow General Method definition) with mpmath.quad
#   at 30 significant digits; split-z lethal rate as in products/organisms.toml (continuous at split);
#   Weibull: scipy.integrate.solve_ivp (Radau, rtol 1e-11) of the published non-isothermal rate form
#   d(-log10 S)/dt = (p/delta(T)) (-log10 S)^((p-1)/p), delta(T) = delta_ref * 10^(-(T - Tref)/z)
#   (Peleg & Cole 1998; Mafart et al. 2002 - from memory), started at t0 = 1e-3 s from the isothermal
#   solution at T(0).
# Precision: F to >= 12 significant digits (mpmath); Weibull log reductions to about 1e-8 relative.
# rerun: /usr/bin/python3 tests/reference/gen_lethality.py > tests/reference/lethality.csv
import math
import mpmath as mp
import numpy as np
from scipy.integrate import solve_ivp

mp.mp.dps = 30

def heat(t, Tm, Ti, tau):
    return Tm - (Tm - Ti) * mp.e ** (-t / tau)

def cook_chill(t):
    # heat towards 80 C (tau 900 s) for 2400 s, then cool towards 0 C (tau 1200 s).
    t = mp.mpf(t)
    if t <= 2400:
        return heat(t, 80, 5, 900)
    T1 = heat(2400, 80, 5, 900)
    return T1 * mp.e ** (-(t - 2400) / 1200)

def rate(T, tref, z, split=None, z_below=None):
    if split is not None and T < split:
        return mp.mpf(10) ** ((split - tref) / z + (T - split) / z_below)
    return mp.mpf(10) ** ((T - tref) / z)

print("# case,quantity,value")
print("# retort: T = 121.1 - 81.1 exp(-t/600) C, 0..3600 s, Tref 121.1, z 10")
F = mp.quad(lambda t: rate(heat(t, 121.1, 40, 600), 121.1, 10), [0, 600, 1800, 3600])
print(f"retort,F_s,{mp.nstr(F, 17)}")
print("# cook-chill: heat towards 80 C (Ti 5, tau 900 s) to 2400 s, then towards 0 C (tau 1200 s) to 9600 s; Tref 70, z 7.5")
Fc = mp.quad(lambda t: rate(cook_chill(t), 70, 7.5), [0, 1200, 2400])
Fk = mp.quad(lambda t: rate(cook_chill(t), 70, 7.5), [2400, 3600, 9600])
print(f"cook-chill,F_cook_s,{mp.nstr(Fc, 17)}")
print(f"cook-chill,F_chill_s,{mp.nstr(Fk, 17)}")
print("# split: T = 95 - 20 exp(-t/300) C, 0..1800 s; Tref 90, z 10 at/above 90, z 9 below")
# the crossing of 90 C is at t = 300 ln 4
tc = 300 * mp.log(4)
Fs = mp.quad(lambda t: rate(95 - 20 * mp.e ** (-t / 300), 90, 10, 90, 9), [0, tc, 1800])
print(f"split,F_s,{mp.nstr(Fs, 17)}")

# Weibull on the retort profile, z 10, Tref 121.1, delta_ref 30 s.
def weibull_ivp(p, delta_ref, tend):
    Tf = lambda t: 121.1 - 81.1 * math.exp(-t / 600)
    inv_delta = lambda t: 10 ** ((Tf(t) - 121.1) / 10) / delta_ref
    t0 = 1e-3
    y0 = (t0 * inv_delta(0.0)) ** p
    f = lambda t, y: [p * inv_delta(t) * max(y[0], 0.0) ** ((p - 1) / p)]
    sol = solve_ivp(f, (t0, tend), [y0], method="Radau", rtol=1e-11, atol=1e-30)
    return sol.y[0][-1]

for p in (0.6, 1.5):
    print(f"# weibull p {p}: retort profile to 3600 s, delta_ref 30 s, Tref 121.1, z 10")
    print(f"weibull-{p},log_reduction,{weibull_ivp(p, 30.0, 3600.0):.15g}")
