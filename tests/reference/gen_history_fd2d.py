#!/usr/bin/env python3
"""Independent 2D finite-volume reference for the history engine: a finite cylinder (r, z).

Method: vertex-centred finite volumes in r (node at the axis and at r = R) and in z (node at the
mid-plane z = 0, symmetric, and at the end face z = H), conservative conductances, convective
(Robin) condition on the side and the end face; the 2D operator is the Kronecker sum of the 1D
ones. Crank-Nicolson in time with Rannacher start-up (two backward-Euler half steps at t = 0 and
after the medium's jump), sparse LU (scipy.sparse.linalg.splu) factored once per stage. Medium
piecewise linear with breakpoints on the time grid; the source uses the exact interval mean.
Three grids (Nr, Nz, dt), (2Nr, 2Nz, dt/2), (4Nr, 4Nz, dt/4), Richardson-extrapolated assuming
second order; the header reports the observed order and the error estimate of the written values.
No eigenfunction series is used: independent of the code under test.

Source: own derivation (standard conservative finite volumes); numpy/scipy double precision.
rerun: /usr/bin/python3 tests/reference/gen_history_fd2d.py > tests/reference/history_fd2d.csv
"""
import sys

import numpy as np
import scipy.sparse as sp
from scipy.sparse.linalg import splu

K, RHO, CP = 0.5, 1050.0, 3600.0
ALPHA = K / (RHO * CP)
R, H = 0.02, 0.025           # radius, half-length (m): diameter 40 mm, length 50 mm
T0 = 5.0
STAGES = [([(0, 20.0), (600, 90.0)], 200.0, 1800.0), ([(0, 2.0)], 200.0, 1800.0)]
NAME = "ramp-hold-step-finite-cylinder"


def output_times():
    total = sum(s[2] for s in STAGES)
    ts = set(float(t) for t in range(0, int(total) + 1, 60))
    start = 0.0
    for pts, _, dur in STAGES:
        for tp, _ in pts:
            for d in (4.0, 20.0):
                if tp + d < dur:
                    ts.add(start + tp + d)
        start += dur
    return sorted(ts)


def medium_at(pts, t):
    if t <= pts[0][0]:
        return pts[0][1]
    for (t0, a), (t1, b) in zip(pts, pts[1:]):
        if t <= t1:
            return a + (b - a) * (t - t0) / (t1 - t0)
    return pts[-1][1]


def axis(n, L, m):
    d = L / n
    rf = (np.arange(n) + 0.5) * d
    lo = np.concatenate(([0.0], rf))
    hi = np.concatenate((rf, [L]))
    vol = (hi ** (m + 1) - lo ** (m + 1)) / (m + 1)
    cond = K * rf ** m / d
    D = np.zeros((n + 1, n + 1))
    for i in range(n):
        D[i, i] += cond[i]
        D[i + 1, i + 1] += cond[i]
        D[i, i + 1] -= cond[i]
        D[i + 1, i] -= cond[i]
    e = np.zeros(n + 1)
    e[-1] = L ** m          # surface area factor of the last node
    return sp.csr_matrix(D), vol, e


def run(nr, nz, dt):
    Dr, vr, er = axis(nr, R, 1)
    Dz, vz, ez = axis(nz, H, 0)
    Vr, Vz = sp.diags(vr), sp.diags(vz)
    cap = RHO * CP * np.kron(vr, vz)
    times, centre, mean = [0.0], [T0], [T0]
    T = np.full(cap.size, T0)
    t_abs = 0.0
    for pts, h, dur in STAGES:
        A = (sp.kron(Dr + sp.diags(h * er), Vz) + sp.kron(Vr, Dz + sp.diags(h * ez))).tocsc()
        src = h * (np.kron(er, vz) + np.kron(vr, ez))
        C = sp.diags(cap)
        lu_cn = splu((C / dt + 0.5 * A).tocsc())
        lu_be = splu((C / (dt / 2) + A).tocsc())
        n = int(round(dur / dt))
        t_loc = 0.0
        for k in range(n):
            if k == 0:
                for _ in range(2):
                    tb = t_loc + dt / 2
                    T = lu_be.solve(cap / (dt / 2) * T + src * medium_at(pts, tb))
                    t_loc = tb
            else:
                ta, tb = t_loc, t_loc + dt
                tm = 0.5 * (medium_at(pts, ta) + medium_at(pts, tb))
                T = lu_cn.solve(cap / dt * T - 0.5 * (A @ T) + src * tm)
                t_loc = tb
            times.append(t_abs + t_loc)
            centre.append(T[0])
            mean.append(np.dot(cap, T) / cap.sum())
        t_abs += dur
    return np.array(times), np.array(centre), np.array(mean)


def main():
    ts = output_times()
    grids = [(20, 25, 4.0), (40, 50, 2.0), (80, 100, 1.0)]
    vals = []
    for nr, nz, dt in grids:
        tt, c, mn = run(nr, nz, dt)
        idx = np.rint(np.array(ts) / dt).astype(int)
        assert np.allclose(tt[idx], ts)
        vals.append([c[idx], mn[idx]])
    vals = np.array(vals)
    d01 = np.abs(vals[0] - vals[1]).max(axis=1)
    d12 = np.abs(vals[1] - vals[2]).max(axis=1)
    ra = vals[1] + (vals[1] - vals[0]) / 3
    rb = vals[2] + (vals[2] - vals[1]) / 3
    est = np.abs(rb - ra)
    print("# history_fd2d.csv: 2D finite-volume Crank-Nicolson reference (finite cylinder) for the history engine")
    print("# generator: tests/reference/gen_history_fd2d.py (method and source in its docstring)")
    print("# rerun: /usr/bin/python3 tests/reference/gen_history_fd2d.py > tests/reference/history_fd2d.csv")
    print(f"# case {NAME}: finite cylinder R = {R} m, half-length {H} m, k = {K}, rho = {RHO}, cp = {CP},"
          f" initial {T0} C; stages {STAGES}")
    print("# convergence (max over output times, K), centre / mean:")
    for (g0, g1, d) in ((grids[0], grids[1], d01), (grids[1], grids[2], d12)):
        print(f"#   {g0} vs {g1}: {d[0]:.2e} {d[1]:.2e}")
    print(f"#   observed order {np.log2(d01[0] / d12[0]):.2f} {np.log2(d01[1] / d12[1]):.2f};"
          f" Richardson-extrapolated values (written): error estimate {est[0].max():.2e} {est[1].max():.2e} K")
    print("case,time_s,centre_C,mean_C,centre_err_K,mean_err_K")
    for i, t in enumerate(ts):
        print(f"{NAME},{t:.6f},{rb[0][i]:.9f},{rb[1][i]:.9f},{est[0][i]:.2e},{est[1][i]:.2e}")


if __name__ == "__main__":
    sys.exit(main())
