#!/usr/bin/python3
"""Exact eigenfunction-series temperatures for checking the finite-volume solver.

Source: the classical series solution of transient 1D conduction with a convective surface
(constant k, rho, cp, uniform initial temperature, constant medium temperature), e.g. Carslaw &
Jaeger, Conduction of Heat in Solids, 2nd ed. (slab §3.11, cylinder §7.7, sphere §9.4):
  theta = sum C_n exp(-zeta_n^2 Fo) X_n(x),  theta = (T - T_medium)/(T_initial - T_medium)
  slab:     zeta tan zeta = Bi,         C_n = 4 sin z/(2z + sin 2z),      X = cos(z x)
  cylinder: zeta J1(zeta)/J0(zeta) = Bi, C_n = (2/z) J1/(J0^2 + J1^2),   X = J0(z x)
  sphere:   1 - zeta cot zeta = Bi,     C_n = 4(sin z - z cos z)/(2z - sin 2z), X = sin(z x)/(z x)
  mean:     slab sin z/z; cylinder 2 J1(z)/z; sphere 3(sin z - z cos z)/z^3 (times C_n e^{-z^2 Fo})
Precision: mpmath, 30 significant digits; eigenvalues by bisection to 1e-28 inside their own
bracket; terms summed until the next term's bound is below 1e-25 (printed values are exact to
the 10 decimals shown). Self-checks against REFERENCES.md section 3.4 values are asserted.
Product: 40 mm sphere / 40 mm diameter cylinder / 40 mm thick slab (half-size 0.02 m),
k 0.5 W/mK, rho 1050 kg/m3, cp 3600 J/kgK, initially 5 C, in 90 C medium; h chosen for
Bi = 0.5, 5, 50 (h = 12.5, 125, 1250 W/m2K), h = 500 W/m2K (Bi = 20) and h = inf (surface held
at the medium temperature; at x = 1 the series is not used and the surface is the medium, 90 C).
rerun: /usr/bin/python3 tests/reference/gen_numeric_check.py > tests/reference/numeric_check.csv
"""
import mpmath as mp

mp.mp.dps = 30


def bisect(g, a, b):
    ga = g(a)
    for _ in range(200):
        m = (a + b) / 2
        gm = g(m)
        if (gm > 0) == (ga > 0):
            a, ga = m, gm
        else:
            b = m
        if b - a < mp.mpf("1e-28"):
            break
    return (a + b) / 2


def roots(geometry, bi, count):
    if bi == mp.inf:  # surface held at the medium temperature
        if geometry == "slab":
            return [(n - mp.mpf(0.5)) * mp.pi for n in range(1, count + 1)]
        if geometry == "cylinder":
            return [mp.besseljzero(0, n) for n in range(1, count + 1)]
        return [n * mp.pi for n in range(1, count + 1)]
    bi = mp.mpf(bi)
    out = []
    for n in range(1, count + 1):
        if geometry == "slab":
            g = lambda z: z * mp.sin(z) - bi * mp.cos(z)
            a, b = (n - 1) * mp.pi, (n - mp.mpf(0.5)) * mp.pi
        elif geometry == "cylinder":
            g = lambda z: z * mp.besselj(1, z) - bi * mp.besselj(0, z)
            a = mp.besseljzero(1, n - 1) if n > 1 else mp.mpf(0)
            b = mp.besseljzero(0, n)
        else:
            g = lambda z: z * mp.cos(z) - (1 - bi) * mp.sin(z)
            a, b = (n - 1) * mp.pi, n * mp.pi
        eps = mp.mpf("1e-25")
        out.append(bisect(g, a + eps, b - eps))
    return out


def coeff(geometry, z):
    if geometry == "slab":
        return 4 * mp.sin(z) / (2 * z + mp.sin(2 * z))
    if geometry == "cylinder":
        j0, j1 = mp.besselj(0, z), mp.besselj(1, z)
        return (2 / z) * j1 / (j0**2 + j1**2)
    return 4 * (mp.sin(z) - z * mp.cos(z)) / (2 * z - mp.sin(2 * z))


def shape(geometry, z, x):
    if geometry == "slab":
        return mp.cos(z * x)
    if geometry == "cylinder":
        return mp.besselj(0, z * x)
    return mp.mpf(1) if x == 0 else mp.sin(z * x) / (z * x)


def mean_shape(geometry, z):
    if geometry == "slab":
        return mp.sin(z) / z
    if geometry == "cylinder":
        return 2 * mp.besselj(1, z) / z
    return 3 * (mp.sin(z) - z * mp.cos(z)) / z**3


_cache = {}


def theta(geometry, bi, fo, x=None):
    """x = None gives the mean; otherwise the point x = r/R."""
    key = (geometry, bi)
    if key not in _cache:
        _cache[key] = [(z, coeff(geometry, z)) for z in roots(geometry, bi, 60)]
    fo = mp.mpf(fo)
    s = mp.mpf(0)
    for z, c in _cache[key]:
        e = mp.exp(-z * z * fo)
        s += c * e * (mean_shape(geometry, z) if x is None else shape(geometry, z, x))
        if 3 * abs(c) * e < mp.mpf("1e-25"):
            return s
    raise RuntimeError("series not converged for %s Bi=%s Fo=%s" % (geometry, bi, fo))


# Self-checks: REFERENCES.md section 3.4 exact centre values (6 decimals).
assert abs(theta("sphere", 10, "0.05", 0) - mp.mpf("0.982564")) < 6e-7
assert abs(theta("cylinder", 10, "0.5", 0) - mp.mpf("0.145800")) < 6e-7
assert abs(theta("slab", 1, "0.2", 0) - mp.mpf("0.950642")) < 6e-7
assert abs(theta("sphere", 1, "0.3", 0) - mp.mpf("0.606804")) < 6e-7
assert abs(theta("sphere", "0.1", "1.0", 0) - mp.mpf("0.767431")) < 6e-7
assert abs(theta("sphere", mp.inf, "0.2", 0) - mp.mpf("0.277078")) < 6e-7
assert abs(theta("cylinder", mp.inf, "0.2", 0) - mp.mpf("0.501487")) < 6e-7
assert abs(theta("slab", mp.inf, "0.2", 0) - mp.mpf("0.772312")) < 6e-7

R = mp.mpf("0.02")
k, rho, cp = mp.mpf("0.5"), mp.mpf(1050), mp.mpf(3600)
alpha = k / (rho * cp)
T0, Tm = mp.mpf(5), mp.mpf(90)
times = [60, 300, 600, 1500, 3000, 6000]

print("# Exact series check values; see the generator header for source and precision.")
print("# rerun: /usr/bin/python3 tests/reference/gen_numeric_check.py > tests/reference/numeric_check.csv")
print("geometry,biot,h_W_m2K,half_size_m,k_W_mK,rho_kg_m3,cp_J_kgK,initial_C,medium_C,"
      "time_s,fourier,centre_C,surface_C,mean_C")
for geometry in ("sphere", "cylinder", "slab"):
    for h in ("12.5", "125", "500", "1250", "inf"):
        h = mp.mpf(h)
        bi = h * R / k if h != mp.inf else mp.inf
        for t in times:
            fo = alpha * t / R**2
            surf = mp.mpf(0) if bi == mp.inf else theta(geometry, bi, fo, 1)
            vals = [T0 * th + Tm * (1 - th) for th in
                    (theta(geometry, bi, fo, 0), surf, theta(geometry, bi, fo))]
            print("%s,%s,%s,%s,%s,%s,%s,%s,%s,%d,%s,%s,%s,%s" % (
                geometry, mp.nstr(bi, 6), mp.nstr(h, 6), mp.nstr(R, 6), mp.nstr(k, 6),
                mp.nstr(rho, 6), mp.nstr(cp, 6), mp.nstr(T0, 6), mp.nstr(Tm, 6), t,
                mp.nstr(fo, 10), *[mp.nstr(v, 15, min_fixed=-1, max_fixed=4) for v in vals]))
