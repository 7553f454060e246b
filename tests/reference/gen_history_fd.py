#!/usr/bin/env python3
"""Independent finite-difference reference for the history engine (tests/conduction/history_test.cpp).

Method: vertex-centred finite volumes in r (node at the centre and at the surface), Crank-Nicolson
in time with Rannacher start-up (two backward-Euler half steps after t = 0 and after every jump of
the medium or of h), tridiagonal solves with scipy.linalg.solve_banded. Medium piecewise linear;
breakpoints lie on the time grid and the source uses the exact interval mean. The solution is
computed on three grids (N, dt), (2N, dt/2), (4N, dt/4) and Richardson-extrapolated assuming
second order in both; the header table reports the observed order and the error estimate of the
extrapolated values (|R(2N,4N) - R(N,2N)|, a conservative bound for the reported value).
Nothing here uses eigenfunction series: it is independent of the code under test.

Source: own derivation (standard conservative finite volumes); numpy/scipy double precision.
rerun: /usr/bin/python3 tests/reference/gen_history_fd.py > tests/reference/history_fd.csv
"""
import math
import sys

import numpy as np
from scipy.linalg import solve_banded

# ---- cases ------------------------------------------------------------------------------------
# Properties shared by all cases: k = 0.5 W/mK, rho = 1050 kg/m3, cp = 3600 J/kgK.
K, RHO, CP = 0.5, 1050.0, 3600.0
ALPHA = K / (RHO * CP)

# A stage: (points [(t_s, T_C)...] from the stage start, h_W_m2K, duration_s)
CASES = {
    # ramp 20 -> 90 C over 600 s, hold to 1800 s, then a step to 2 C held for 1800 s; h = 200.
    "ramp-hold-step-sphere": dict(geom="sphere", R=0.02, T0=5.0,
                                  stages=[([(0, 20.0), (600, 90.0)], 200.0, 1800.0),
                                          ([(0, 2.0)], 200.0, 1800.0)]),
    "ramp-hold-step-cylinder": dict(geom="cylinder", R=0.02, T0=5.0,
                                    stages=[([(0, 20.0), (600, 90.0)], 200.0, 1800.0),
                                            ([(0, 2.0)], 200.0, 1800.0)]),
    # hot-water cook at 85 C (h = 500) for 2400 s, then cold-air chill at 2 C (h = 20) for 7200 s.
    "cook-chill-sphere": dict(geom="sphere", R=0.02, T0=5.0,
                              stages=[([(0, 85.0)], 500.0, 2400.0),
                                      ([(0, 2.0)], 20.0, 7200.0)]),
}
# Output times (s): every 60 s plus points just after the breakpoints (mid-step checks).
def output_times(case):
    total = sum(s[2] for s in case["stages"])
    ts = set(float(t) for t in range(0, int(total) + 1, 60))
    start = 0.0
    for pts, _, dur in case["stages"]:
        for tp, _ in pts:
            for d in (2.0, 6.0, 20.0):
                if tp + d < dur:
                    ts.add(start + tp + d)
        start += dur
    return sorted(ts)

CHILL_TARGET_C = 10.0   # cook-chill: time when the centre falls to 10 C in the chill stage


def medium_at(pts, t):
    if t <= pts[0][0]:
        return pts[0][1]
    for (t0, T0), (t1, T1) in zip(pts, pts[1:]):
        if t <= t1:
            return T0 + (T1 - T0) * (t - t0) / (t1 - t0)
    return pts[-1][1]


def run(case, n_cells, dt):
    geom, R = case["geom"], case["R"]
    m = {"slab": 0, "cylinder": 1, "sphere": 2}[geom]
    dr = R / n_cells
    r = np.arange(n_cells + 1) * dr
    rf = (np.arange(n_cells) + 0.5) * dr            # faces between nodes
    area = rf ** m                                    # face areas (common factor dropped)
    lo = np.concatenate(([0.0], rf))
    hi = np.concatenate((rf, [R]))
    vol = (hi ** (m + 1) - lo ** (m + 1)) / (m + 1)   # control volumes
    area_s = R ** m
    cond = K * area / dr                              # conductance between nodes i, i+1
    T = np.full(n_cells + 1, case["T0"])
    times, centre, mean, surf = [0.0], [T[0]], [np.dot(vol, T) / vol.sum()], [T[-1]]
    t_abs = 0.0

    def matrices(h):
        # C dT/dt = -A T + b(t); A tridiagonal (symmetric), b = h area_s T_m at the surface node.
        diag = np.zeros(n_cells + 1)
        diag[:-1] += cond
        diag[1:] += cond
        diag[-1] += h * area_s
        off = -cond
        return diag, off

    for pts, h, dur in case["stages"]:
        diag, off = matrices(h)
        cap = RHO * CP * vol
        nsteps = int(round(dur / dt))
        assert abs(nsteps * dt - dur) < 1e-9
        for bp, _ in pts:
            assert abs(bp / dt - round(bp / dt)) < 1e-9
        t_local = 0.0
        smoothing = 2        # Rannacher: first step of each stage as two backward-Euler halves
        for _ in range(nsteps):
            if smoothing:
                sub = [(dt / 2, 1.0), (dt / 2, 1.0)]
                smoothing = 0
            else:
                sub = [(dt, 0.5)]
            for d, th in sub:
                ta, tb = t_local, t_local + d
                # interval mean of the medium (exact for a linear piece; breakpoints are on the grid)
                tm_mean = 0.5 * (medium_at(pts, ta) + medium_at(pts, tb))
                tm_b = medium_at(pts, tb)
                # (C/d + th A) T^{n+1} = (C/d - (1-th) A) T^n + b, with b from the medium
                ab = np.zeros((3, n_cells + 1))
                ab[0, 1:] = th * off
                ab[1, :] = cap / d + th * diag
                ab[2, :-1] = th * off
                AT = diag * T
                AT[:-1] += off * T[1:]
                AT[1:] += off * T[:-1]
                rhs = cap / d * T - (1 - th) * AT
                src = tm_mean if th == 0.5 else tm_b
                rhs[-1] += h * area_s * src
                T = solve_banded((1, 1), ab, rhs)
                t_local = tb
            t_abs_now = t_abs + t_local
            times.append(t_abs_now)
            centre.append(T[0])
            mean.append(np.dot(vol, T) / vol.sum())
            surf.append(T[-1])
        t_abs += dur
    return np.array(times), np.array(centre), np.array(mean), np.array(surf)


def sample(times, values, ts):
    # output times are on every grid (multiples of the coarsest dt)
    idx = np.rint(np.array(ts) / (times[1] - times[0])).astype(int)
    assert np.allclose(times[idx], ts)
    return values[idx]


def main():
    base = {"ramp-hold-step-sphere": (160, 2.0), "ramp-hold-step-cylinder": (160, 2.0),
            "cook-chill-sphere": (160, 2.0)}
    out_rows = []
    header = []
    header.append("# history_fd.csv: finite-volume Crank-Nicolson reference for the history engine")
    header.append("# generator: tests/reference/gen_history_fd.py (method and source in its docstring)")
    header.append("# rerun: /usr/bin/python3 tests/reference/gen_history_fd.py > tests/reference/history_fd.csv")
    header.append(f"# properties: k = {K} W/mK, rho = {RHO} kg/m3, cp = {CP} J/kgK (alpha = {ALPHA:.10e} m2/s)")
    for name, case in CASES.items():
        desc = "; ".join(f"stage{i}: medium {pts} h={h} for {dur} s" for i, (pts, h, dur) in enumerate(case["stages"]))
        header.append(f"# case {name}: {case['geom']} R = {case['R']} m, initial {case['T0']} C; {desc}")
    header.append("# convergence (max over output times, K): columns = grid, |T(h)-T(h/2)| centre/mean/surface")
    for name, case in CASES.items():
        n0, dt0 = base[name]
        ts = output_times(case)
        runs = []
        for lvl in range(3):
            n, dt = n0 * 2 ** lvl, dt0 / 2 ** lvl
            tt, c, mn, s = run(case, n, dt)
            runs.append((n, dt, tt, c, mn, s))
        vals = []
        for (_, _, tt, c, mn, s) in runs:
            vals.append([sample(tt, c, ts), sample(tt, mn, ts), sample(tt, s, ts)])
        vals = np.array(vals)   # [level, quantity, time]
        d01 = np.abs(vals[0] - vals[1]).max(axis=1)
        d12 = np.abs(vals[1] - vals[2]).max(axis=1)
        rich_a = vals[1] + (vals[1] - vals[0]) / 3.0
        rich_b = vals[2] + (vals[2] - vals[1]) / 3.0
        est_row = np.abs(rich_b - rich_a)
        est = est_row.max(axis=1)
        order = np.log2(d01 / d12)
        header.append(f"#   {name}: N={runs[0][0]},dt={runs[0][1]} vs N={runs[1][0]},dt={runs[1][1]}: "
                      f"{d01[0]:.2e} {d01[1]:.2e} {d01[2]:.2e}")
        header.append(f"#   {name}: N={runs[1][0]},dt={runs[1][1]} vs N={runs[2][0]},dt={runs[2][1]}: "
                      f"{d12[0]:.2e} {d12[1]:.2e} {d12[2]:.2e}  (observed order {order[0]:.2f} {order[1]:.2f} {order[2]:.2f})")
        header.append(f"#   {name}: Richardson-extrapolated values (written below): error estimate "
                      f"{est[0]:.2e} {est[1]:.2e} {est[2]:.2e} K")
        for i, t in enumerate(ts):
            out_rows.append((name, t, rich_b[0][i], rich_b[1][i], rich_b[2][i],
                             est_row[0][i], est_row[1][i], est_row[2][i]))
        if name == "cook-chill-sphere":
            # crossing of the chill target by the centre, on the finest grid and extrapolated
            crossings = []
            for (_, dt, tt, c, _, _) in runs:
                cook_end = case["stages"][0][2]
                mask = tt >= cook_end
                t2, c2 = tt[mask], c[mask]
                j = np.argmax(c2 <= CHILL_TARGET_C)
                assert c2[j] <= CHILL_TARGET_C and j > 1
                # cubic through 4 points around the crossing, then bisection
                sl = slice(j - 2, j + 2)
                p = np.polyfit(t2[sl] - t2[j], c2[sl] - CHILL_TARGET_C, 3)
                a, b = t2[j - 1] - t2[j], 0.0
                for _ in range(80):
                    mid = 0.5 * (a + b)
                    if np.polyval(p, mid) > 0:
                        a = mid
                    else:
                        b = mid
                crossings.append(t2[j] + 0.5 * (a + b))
            cr = crossings[2] + (crossings[2] - crossings[1]) / 3.0
            header.append(f"#   {name}: centre reaches {CHILL_TARGET_C} C at t = "
                          f"{crossings[0]:.3f} / {crossings[1]:.3f} / {crossings[2]:.3f} s (three grids),"
                          f" extrapolated {cr:.3f} s")
            out_rows.append((name + ":crossing", cr, CHILL_TARGET_C, float("nan"), float("nan"),
                             abs(cr - (crossings[1] + (crossings[1] - crossings[0]) / 3.0)), 0.0, 0.0))
    print("\n".join(header))
    header_cols = "case,time_s,centre_C,mean_C,surface_C,centre_err_K,mean_err_K,surface_err_K"
    print("# the *_err_K columns are the per-row error estimates of the extrapolated values;")
    print("# rows right after a jump of the medium have large surface/mean estimates: tests skip those")
    print(header_cols)
    for row in out_rows:
        print(f"{row[0]},{row[1]:.6f},{row[2]:.9f},{row[3]:.9f},{row[4]:.9f},{row[5]:.2e},{row[6]:.2e},{row[7]:.2e}")


if __name__ == "__main__":
    sys.exit(main())
