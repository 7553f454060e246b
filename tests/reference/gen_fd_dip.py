#!/usr/bin/env python3
"""Independent finite-volume reference for a process deviation (tests/process/deviation_test.cpp):
an INVENTED medium dip of 8 C for 6 min in the middle of a sphere's cook, scheduled vs delivered.

Case (invented, kofta-like): sphere R = 0.019 m, k = 0.48 W/mK, rho = 1052 kg/m3, cp = 3418 J/kgK,
initial 4 C. Stage "cook": medium 96 C, h = 120 W/m2K, 960 s. Delivered: the medium falls linearly
from 96 to 88 C over 420-430 s, holds 88 C to 790 s, rises back to 96 C at 800 s (6 min at 88 C).
Stage "chill": medium -2 C, h = 30 W/m2K, 3600 s. Lethality at the centre, F = integral of
10^((T - 70)/7.5) dt (s), over the cook stage and over the whole process.

Method (approach of gen_history_fd.py on branch history): vertex-centred finite volumes in r,
Crank-Nicolson with Rannacher start-up (two backward-Euler half steps at each stage start), tridiagonal
solves with scipy.linalg.solve_banded, medium breakpoints on the time grid with the exact interval mean.
F by the trapezoid rule on the step grid. Three grids (N, dt), (2N, dt/2), (4N, dt/4); the values written
are Richardson-extrapolated (second order) and the error estimate is |R(2N,4N) - R(N,2N)|.
Nothing here uses eigenfunction series: it is independent of the code under test.

Source: own derivation (standard conservative finite volumes); numpy/scipy double precision.
rerun: /usr/bin/python3 tests/reference/gen_fd_dip.py > tests/reference/fd_dip.csv
"""
import sys

import numpy as np
from scipy.linalg import solve_banded

K, RHO, CP = 0.48, 1052.0, 3418.0
R, T0 = 0.019, 4.0
TREF, Z = 70.0, 7.5
COOK = [(0.0, 96.0)]
DIP = [(0.0, 96.0), (420.0, 96.0), (430.0, 88.0), (790.0, 88.0), (800.0, 96.0)]
CHILL = [(0.0, -2.0)]
CASES = {
    "scheduled": [(COOK, 120.0, 960.0), (CHILL, 30.0, 3600.0)],
    "delivered": [(DIP, 120.0, 960.0), (CHILL, 30.0, 3600.0)],
}


def medium_at(pts, t):
    if t <= pts[0][0]:
        return pts[0][1]
    for (t0, a), (t1, b) in zip(pts, pts[1:]):
        if t <= t1:
            return a + (b - a) * (t - t0) / (t1 - t0)
    return pts[-1][1]


def lethal(T):
    return 10.0 ** ((T - TREF) / Z)


def run(stages, n_cells, dt):
    dr = R / n_cells
    rf = (np.arange(n_cells) + 0.5) * dr
    area = rf ** 2
    lo = np.concatenate(([0.0], rf))
    hi = np.concatenate((rf, [R]))
    vol = (hi ** 3 - lo ** 3) / 3.0
    area_s = R ** 2
    cond = K * area / dr
    cap = RHO * CP * vol
    T = np.full(n_cells + 1, T0)
    F_stage = []
    centre_end = []
    for pts, h, dur in stages:
        diag = np.zeros(n_cells + 1)
        diag[:-1] += cond
        diag[1:] += cond
        diag[-1] += h * area_s
        off = -cond
        nsteps = int(round(dur / dt))
        t_local = 0.0
        F = 0.0
        smoothing = True
        for _ in range(nsteps):
            L0 = lethal(T[0])
            sub = [(dt / 2, 1.0), (dt / 2, 1.0)] if smoothing else [(dt, 0.5)]
            smoothing = False
            for d, th in sub:
                ta, tb = t_local, t_local + d
                src = 0.5 * (medium_at(pts, ta) + medium_at(pts, tb)) if th == 0.5 else medium_at(pts, tb)
                ab = np.zeros((3, n_cells + 1))
                ab[0, 1:] = th * off
                ab[1, :] = cap / d + th * diag
                ab[2, :-1] = th * off
                AT = diag * T
                AT[:-1] += off * T[1:]
                AT[1:] += off * T[:-1]
                rhs = cap / d * T - (1 - th) * AT
                rhs[-1] += h * area_s * src
                T = solve_banded((1, 1), ab, rhs)
                t_local = tb
            F += 0.5 * dt * (L0 + lethal(T[0]))
        F_stage.append(F)
        centre_end.append(T[0])
    return F_stage, centre_end


def main():
    print("# fd_dip.csv: finite-volume Crank-Nicolson reference for an invented medium dip (8 C for 6 min mid-cook)")
    print("# generator: tests/reference/gen_fd_dip.py (case, method and source in its docstring)")
    print("# rerun: /usr/bin/python3 tests/reference/gen_fd_dip.py > tests/reference/fd_dip.csv")
    print(f"# sphere R = {R} m, k = {K}, rho = {RHO}, cp = {CP}, initial {T0} C; F at the centre, Tref = {TREF} C, z = {Z} C")
    rows = []
    for name, stages in CASES.items():
        vals = []
        for lvl in range(3):
            n, dt = 80 * 2 ** lvl, 2.0 / 2 ** lvl
            Fs, ce = run(stages, n, dt)
            vals.append([Fs[0], Fs[0] + Fs[1], ce[0], ce[1]])
        v = np.array(vals)
        ra = v[1] + (v[1] - v[0]) / 3.0
        rb = v[2] + (v[2] - v[1]) / 3.0
        err = np.abs(rb - ra)
        print(f"# {name}: three grids F_cook_s {v[0][0]:.6f} {v[1][0]:.6f} {v[2][0]:.6f}; extrapolated error estimate {err[0]:.2e} s")
        rows.append((name, rb, err))
    print("case,F_cook_s,F_total_s,centre_end_cook_C,centre_end_chill_C,F_cook_err_s,F_total_err_s")
    for name, rb, err in rows:
        print(f"{name},{rb[0]:.9f},{rb[1]:.9f},{rb[2]:.9f},{rb[3]:.9f},{err[0]:.2e},{err[1]:.2e}")


if __name__ == "__main__":
    sys.exit(main())
