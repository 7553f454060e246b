#!/usr/bin/env python3
"""Reference step responses theta = (T - Tinf)/(Ti - Tinf) for tests/conduction/series_test.cpp.

Source: mpmath sums of the exact eigenfunction series (Incropera, Fundamentals of Heat and Mass
Transfer, 5.6; Carslaw & Jaeger, Conduction of Heat in Solids), 45-digit working precision,
eigenvalues from tests/reference/gen_modes.py (bracketed mpmath roots of the textbook
eigen-equations). Each sum runs until exp(-zeta_n^2 Fo) < 1e-30 (the coefficients are bounded by
~3 at the centre), so every printed value is converged to far below 1e-12. Printed with 16
significant digits.
Positions: x = 0 (centre), 0.5, 1 (surface); "mean" is the mass average.
Columns: geometry,biot,fourier,x,theta   (x = mean for the mass average)

rerun: /usr/bin/python3 tests/reference/gen_series.py > tests/reference/series.csv
"""
import os
import sys

import mpmath as mp

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import gen_modes  # noqa: E402

mp.mp.dps = 45  # gen_modes sets 45 on import as well
BIOTS = ["0.1", "1", "10", "200", "inf"]
FOS = ["1e-4", "1e-3", "0.01", "0.05", "0.1", "0.2", "0.5", "1", "2"]
POS = ["0", "0.5", "1", "mean"]


def X(geom, z, x):
    if geom == "slab":
        return mp.cos(z * x)
    if geom == "cylinder":
        return mp.besselj(0, z * x)
    return mp.mpf(1) if x == 0 else mp.sin(z * x) / (z * x)


def main():
    print("# mpmath %s, 45-digit working precision, series summed to exp(-zeta^2 Fo) < 1e-30" % mp.__version__)
    print("# rerun: /usr/bin/python3 tests/reference/gen_series.py > tests/reference/series.csv")
    print("geometry,biot,fourier,x,theta")
    fo_min = min(mp.mpf(f) for f in FOS)
    nmax = int(mp.sqrt(mp.log(mp.mpf(10) ** 30) / fo_min) / mp.pi) + 3
    for geom in ("slab", "cylinder", "sphere"):
        for bs in BIOTS:
            bi = mp.inf if bs == "inf" else mp.mpf(bs)
            modes = []
            for n in range(1, nmax + 1):
                z = gen_modes.root(geom, bi, n)
                C, M, N = gen_modes.coeffs(geom, z)
                modes.append((z, C, M))
            for fs in FOS:
                fo = mp.mpf(fs)
                for ps in POS:
                    tot = mp.mpf(0)
                    for z, C, M in modes:
                        e = mp.exp(-z * z * fo)
                        tot += (M if ps == "mean" else C * X(geom, z, mp.mpf(ps))) * e
                        if e < mp.mpf(10) ** (-30):
                            break
                    else:
                        raise SystemExit("not converged: %s %s %s" % (geom, bs, fs))
                    print(",".join([geom, bs, fs, ps, mp.nstr(tot, 16, min_fixed=-5, max_fixed=0)]))


if __name__ == "__main__":
    main()
