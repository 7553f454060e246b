#!/usr/bin/env python3
"""Reference eigenvalues and series coefficients for tests/conduction/modes_test.cpp.

Source: mpmath (arbitrary precision), working precision 45 digits, values printed to 25
significant digits (accurate to at least 30 digits before rounding).
Each root is found independently of the C++ code: bracketed in its textbook interval and
solved with mpmath's bracketing solver on the textbook form of the eigen-equation
    slab      zeta*sin(zeta) - Bi*cos(zeta) = 0          on ((n-1)pi, (n-1/2)pi)
    cylinder  zeta*J1(zeta) - Bi*J0(zeta) = 0            on (j1_{n-1}, j0_n), j1_0 = 0
    sphere    zeta*cos(zeta) - (1-Bi)*sin(zeta) = 0      on ((n-1)pi, n*pi), n=1 excludes 0
Bi = inf uses the exact limits (n-1/2)pi, besseljzero(0, n), n*pi.
Coefficients from the textbook formulas (Incropera, Fundamentals of Heat and Mass Transfer, 5.6):
    C  slab 4 sin z/(2z + sin 2z); cylinder (2/z) J1/(J0^2+J1^2); sphere 4(sin z - z cos z)/(2z - sin 2z)
    M  (mean) slab C sin z/z; cylinder C 2 J1/z; sphere C 3 (sin z - z cos z)/z^3
    N  (norm, int_0^1 x^m X^2 dx) slab 1/2 + sin 2z/(4z); cylinder (J0^2+J1^2)/2; sphere (1/2 - sin 2z/(4z))/z^2
Columns: geometry,biot,n,zeta,C,M,N

rerun: /usr/bin/python3 tests/reference/gen_modes.py > tests/reference/modes.csv
"""
import mpmath as mp

mp.mp.dps = 45
BIOTS = ["1e-6", "0.01", "0.1", "0.5", "1", "2", "5", "10", "100", "1000", "1e6", "inf"]
NMAX = 50


def bracket_solve(f, a, b):
    fa, fb = f(a), f(b)
    assert fa * fb < 0, (a, b, fa, fb)
    x = mp.findroot(f, (a, b), solver="anderson", tol=mp.mpf(10) ** (-40), verify=False)
    # fall back to bisection polishing if the bracketing solver left the interval
    if not (a < x < b) or abs(f(x)) > mp.mpf(10) ** (-35):
        lo, hi, flo = a, b, fa
        for _ in range(400):
            mid = (lo + hi) / 2
            fm = f(mid)
            if (fm < 0) == (flo < 0):
                lo, flo = mid, fm
            else:
                hi = mid
            if hi - lo < mp.mpf(10) ** (-42) * hi:
                break
        x = (lo + hi) / 2
    return x


def root(geom, bi, n):
    pi = mp.pi
    if bi == mp.inf:
        if geom == "slab":
            return (n - mp.mpf(1) / 2) * pi
        if geom == "cylinder":
            return mp.besseljzero(0, n)
        return n * pi
    if geom == "slab":
        f = lambda z: z * mp.sin(z) - bi * mp.cos(z)
        return bracket_solve(f, (n - 1) * pi, (n - mp.mpf(1) / 2) * pi)
    if geom == "cylinder":
        lo = mp.mpf(0) if n == 1 else mp.besseljzero(1, n - 1)
        f = lambda z: z * mp.besselj(1, z) - bi * mp.besselj(0, z)
        return bracket_solve(f, lo, mp.besseljzero(0, n))
    if n == 1:
        # divide by z to drop the trivial root at 0; start just above 0
        f = lambda z: mp.cos(z) - (1 - bi) * mp.sin(z) / z
        return bracket_solve(f, mp.mpf(10) ** (-20), pi)
    f = lambda z: z * mp.cos(z) - (1 - bi) * mp.sin(z)
    return bracket_solve(f, (n - 1) * pi, n * pi)


def coeffs(geom, z):
    s, c = mp.sin(z), mp.cos(z)
    if geom == "slab":
        C = 4 * s / (2 * z + mp.sin(2 * z))
        return C, C * s / z, mp.mpf(1) / 2 + mp.sin(2 * z) / (4 * z)
    if geom == "cylinder":
        j0, j1 = mp.besselj(0, z), mp.besselj(1, z)
        C = 2 / z * j1 / (j0 ** 2 + j1 ** 2)
        return C, C * 2 * j1 / z, (j0 ** 2 + j1 ** 2) / 2
    C = 4 * (s - z * c) / (2 * z - mp.sin(2 * z))
    return C, C * 3 * (s - z * c) / z ** 3, (mp.mpf(1) / 2 - mp.sin(2 * z) / (4 * z)) / z ** 2


def main():
    print("# mpmath %s, 45-digit working precision, 25 significant digits printed" % mp.__version__)
    print("# rerun: /usr/bin/python3 tests/reference/gen_modes.py > tests/reference/modes.csv")
    print("geometry,biot,n,zeta,C,M,N")
    for geom in ("slab", "cylinder", "sphere"):
        for bs in BIOTS:
            bi = mp.inf if bs == "inf" else mp.mpf(bs)
            for n in range(1, NMAX + 1):
                z = root(geom, bi, n)
                C, M, N = coeffs(geom, z)
                print(",".join([geom, bs, str(n)] + [mp.nstr(v, 25, min_fixed=-5, max_fixed=0) for v in (z, C, M, N)]))


if __name__ == "__main__":
    main()
