#!/usr/bin/python3
"""Neumann's exact solution for freezing of a semi-infinite solid, to check the solver's
enthalpy (phase-change) form.

Source: Carslaw & Jaeger, Conduction of Heat in Solids, 2nd ed., §11.2 (Neumann's solution);
also Özişik, Heat Conduction, ch. 10. Liquid initially at T_i > T_f; at t = 0 the face x = 0 is
held at T_s < T_f; equal densities; latent heat released at the single temperature T_f.
  frozen  0 < x < X:  T = T_s + (T_f - T_s) erf(x / (2 sqrt(a_s t))) / erf(lam)
  liquid  x > X:      T = T_i - (T_i - T_f) erfc(x / (2 sqrt(a_l t))) / erfc(lam sqrt(a_s/a_l))
  front   X = 2 lam sqrt(a_s t), lam the root of
  exp(-lam^2)/erf(lam) - (k_l/k_s) sqrt(a_s/a_l) (T_i - T_f)/(T_f - T_s)
      * exp(-lam^2 a_s/a_l)/erfc(lam sqrt(a_s/a_l)) = lam sqrt(pi) L / (c_s (T_f - T_s))
  heat removed through the face per m^2 by time t: 2 k_s (T_f - T_s) sqrt(t/(pi a_s)) / erf(lam).
Product (invented, food-like): k_s 1.6, k_l 0.5 W/mK; rho 1050 kg/m3; c_s 1900, c_l 3600 J/kgK;
latent heat 230 kJ/kg; T_f = -1.5 C; T_i = 8 C; T_s = -30 C; t = 1800 s. The C++ test solves a
slab of half-thickness 0.1 m (its centre stays within 1e-3 K of T_i, and at depths <= 0.06 m
the far face is felt by far less than 1e-6 K, so the slab is semi-infinite for this purpose)
with the latent heat spread over a narrow band around T_f.
Precision: mpmath, 30 digits; lam by findroot to 1e-25.
rerun: /usr/bin/python3 tests/reference/gen_neumann_check.py > tests/reference/neumann_check.csv
"""
import mpmath as mp

mp.mp.dps = 30
ks, kl = mp.mpf("1.6"), mp.mpf("0.5")
rho = mp.mpf(1050)
cs, cl = mp.mpf(1900), mp.mpf(3600)
latent = mp.mpf(230000)
Tf, Ti, Ts = mp.mpf("-1.5"), mp.mpf(8), mp.mpf(-30)
t = mp.mpf(1800)
a_s, a_l = ks / (rho * cs), kl / (rho * cl)
nu = mp.sqrt(a_s / a_l)


def f(lam):
    return (mp.exp(-lam**2) / mp.erf(lam)
            - (kl / ks) * nu * (Ti - Tf) / (Tf - Ts) * mp.exp(-(lam * nu)**2) / mp.erfc(lam * nu)
            - lam * mp.sqrt(mp.pi) * latent / (cs * (Tf - Ts)))


lam = mp.findroot(f, mp.mpf("0.5"))
assert abs(f(lam)) < mp.mpf("1e-25")
X = 2 * lam * mp.sqrt(a_s * t)


def temp(x):
    if x <= X:
        return Ts + (Tf - Ts) * mp.erf(x / (2 * mp.sqrt(a_s * t))) / mp.erf(lam)
    return Ti - (Ti - Tf) * mp.erfc(x / (2 * mp.sqrt(a_l * t))) / mp.erfc(lam * nu)


heat = 2 * ks * (Tf - Ts) * mp.sqrt(t / (mp.pi * a_s)) / mp.erf(lam)
print("# Neumann exact freezing solution; see the generator header for source and precision.")
print("# rerun: /usr/bin/python3 tests/reference/gen_neumann_check.py > tests/reference/neumann_check.csv")
print("# lambda = %s, front depth X = %s m, heat removed = %s J/m2 at t = 1800 s"
      % (mp.nstr(lam, 12), mp.nstr(X, 12), mp.nstr(heat, 12)))
print("quantity,depth_m,value")
print("heat_removed_J_m2,0,%s" % mp.nstr(heat, 12))
print("front_depth_m,0,%s" % mp.nstr(X, 12))
for i in range(0, 25):
    x = mp.mpf(i) * mp.mpf("0.0025")
    print("temp_C,%s,%s" % (mp.nstr(x, 6), mp.nstr(temp(x), 12)))
