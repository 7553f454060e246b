#!/usr/bin/env python3
"""Synthetic heat-penetration studies (logger CSVs with known truth) from an independent
finite-volume conduction model.

What it computes: the temperature history at the geometric centre (the cold spot) of
  (a) a sphere (1-D radial) and
  (b) a finite cylinder (axisymmetric 2-D r-z, quarter domain: axis r = 0 and mid-plane z = 0
      are symmetry planes),
with uniform initial temperature, constant k, rho, cp (one INVENTED case has a temperature-
dependent k), heated or cooled by a piecewise-linear medium temperature through a convective
surface (Robin condition, h in W/m2K; h = inf means the surface node equals the medium).

Method: vertex-centred finite volumes (a node on the axis/centre, half control volumes at the
symmetry planes and at the surface), conservative face conductances (k * face area / spacing),
lumped (diagonal) capacity. The 2-D operator is the Kronecker sum of the 1-D radial and axial
operators. Crank-Nicolson in time with a Rannacher start: every stage (and every jump of the medium
or of h) begins with two backward-Euler half steps, which use the same sparse LU factor
(scipy.sparse.linalg.splu) as the Crank-Nicolson steps. Stage boundaries lie on the time grid.
The temperature-dependent case (broken heating) is solved with Crank-Nicolson and three Picard
iterations per step on a tridiagonal (banded) system.
No eigenfunction series is used anywhere: this is independent of the code under test.

Checks (asserted on every run, before anything is written):
  sphere,   h = inf, Fo = 0.2:                                centre theta = 0.277078
  cylinder, R = 0.0375 m, half-height 0.05 m, alpha 1.4e-7, h = inf, t = 1800 s:
                                                              centre theta = 0.534528
  (theta = (T - T_medium)/(T_initial - T_medium)), each within 2e-4.
Convergence: every written data set is computed on a fine grid and again on a grid with half the
nodes in each direction and twice the time step; the largest centre difference over the written
rows is printed in a comment line of each output and asserted < 0.01 K.

All data written are INVENTED (synthetic truth for tests and the Harbour Lane Kitchen demo).
Noise: numpy.random.default_rng with the fixed seeds below; readings rounded to 0.1 degC where
stated.

rerun (from the repository root; about 6 minutes on 2 cores, most of it the six cans):
    /usr/bin/python3 tests/reference/gen_heat_penetration.py
"""
import math
import multiprocessing
import os
import sys
import time

import numpy as np
import scipy.sparse as sp
from scipy.linalg import solve_banded
from scipy.sparse.linalg import splu

ROOT = os.path.dirname(os.path.dirname(os.path.dirname(os.path.abspath(__file__))))
OUT_REF = os.path.join(ROOT, "tests", "reference", "heat_penetration")
OUT_LOGS = os.path.join(ROOT, "products", "logs")
GEN = "tests/reference/gen_heat_penetration.py"
RERUN = "/usr/bin/python3 tests/reference/gen_heat_penetration.py"
INF = math.inf


# ----------------------------------------------------------------------------------------------
# 1-D vertex-centred finite-volume pieces (geometric factors 4*pi / 2*pi / per unit area dropped
# consistently). Nodes x_i = i*dx, i = 0..N; node 0 is the centre/symmetry plane, node N the
# surface. Returns (vol[N+1], gface[N] = face "area"/dx between i and i+1, surface area).
# ----------------------------------------------------------------------------------------------
def grid_1d(kind, length, n):
    dx = length / n
    x = np.arange(n + 1) * dx
    lo = np.clip(x - dx / 2, 0.0, length)
    hi = np.clip(x + dx / 2, 0.0, length)
    xf = x[:-1] + dx / 2                       # face positions
    if kind == "sphere":
        vol = (hi ** 3 - lo ** 3) / 3.0
        area_f = xf ** 2
        area_s = length ** 2
    elif kind == "cyl":
        vol = (hi ** 2 - lo ** 2) / 2.0
        area_f = xf.copy()
        area_s = length
    elif kind == "slab":
        vol = hi - lo
        area_f = np.ones_like(xf)
        area_s = 1.0
    else:
        raise ValueError(kind)
    return vol, area_f / dx, area_s


def operator_1d(kind, length, n, k, h):
    """Conductance matrix L (k included) and boundary vector b for the unknown nodes, with
    M dT/dt = -L T + b * T_medium.  h = inf: the surface node is the medium (not an unknown)."""
    vol, g, a_s = grid_1d(kind, length, n)
    g = k * g
    nn = n + 1
    main = np.zeros(nn)
    main[:-1] += g
    main[1:] += g
    L = sp.diags([main, -g, -g], [0, 1, -1], shape=(nn, nn), format="csr")
    if h == INF:
        b = np.zeros(n)
        b[-1] = g[-1]                          # conductance to the (Dirichlet) surface node
        return L[:n, :n].tocsr(), b, vol[:n]
    L = L.tolil()
    L[n, n] += h * a_s
    b = np.zeros(nn)
    b[-1] = h * a_s
    return L.tocsr(), b, vol


def build_system(geom, h, n):
    """geom: dict(shape, R, H (half-length, cylinder), k, rho, cp). n: (nr,) or (nr, nz).
    Returns diagonal capacity vector m, sparse L, vector b, index of the centre node."""
    rc = geom["rho"] * geom["cp"]
    if geom["shape"] == "sphere":
        L, b, vol = operator_1d("sphere", geom["R"], n[0], geom["k"], h)
        return rc * vol, L, b
    # finite cylinder: Kronecker sum of the radial (cyl) and axial (slab) operators
    Lr, br, vr = operator_1d("cyl", geom["R"], n[0], geom["k"], h)
    Lz, bz, vz = operator_1d("slab", geom["H"], n[1], geom["k"], h)
    Mr, Mz = sp.diags(vr), sp.diags(vz)
    L = (sp.kron(Lr, Mz) + sp.kron(Mr, Lz)).tocsc()
    b = np.kron(br, vz) + np.kron(vr, bz)
    return rc * np.kron(vr, vz), L, b


# ----------------------------------------------------------------------------------------------
# Process: list of segments (t0, t1, Tm(t0+), Tm(t1-), h). The medium is linear within a segment;
# jumps (of Tm or h) may only happen between segments. All t0, t1 must lie on the time grid.
# ----------------------------------------------------------------------------------------------
def medium_at(segments, t):
    """Left-continuous medium value (the value just before a jump at a segment boundary)."""
    for (t0, t1, a, b, _h) in segments:
        if t0 <= t <= t1:
            return a + (b - a) * (t - t0) / (t1 - t0)
    raise ValueError(t)


def simulate_linear(geom, segments, T0, n, dt, out_times):
    """Centre temperature at out_times (all on the time grid) for a constant-k problem."""
    out_steps = {int(round(t / dt)): i for i, t in enumerate(out_times)}
    res = np.full(len(out_times), np.nan)
    T = None
    step = 0
    cache = {}
    for (t0, t1, a, b_end, h) in segments:
        if h not in cache:
            m, L, b = build_system(geom, h, n)
            A = (sp.diags(m) + 0.5 * dt * L).tocsc()
            B = (sp.diags(m) - 0.5 * dt * L).tocsr()
            cache[h] = (m, b, splu(A), B)
        m, b, lu, B = cache[h]
        if T is None:
            T = np.full(len(m), float(T0))
            if 0 in out_steps:
                res[out_steps[0]] = T[0]
        elif len(T) != len(m):
            raise ValueError("h = inf and finite h cannot be mixed in one run")
        nsteps = int(round((t1 - t0) / dt))
        assert abs(nsteps * dt - (t1 - t0)) < 1e-9, "segment not on the time grid"
        for s in range(nsteps):
            ta = t0 + s * dt
            if s == 0:
                # Rannacher start: two backward-Euler half steps (matrix m + dt/2 L, same LU)
                for hs in (0.5, 1.0):
                    tm = a + (b_end - a) * (ta + hs * dt - t0) / (t1 - t0)
                    T = lu.solve(m * T + 0.5 * dt * b * tm)
            else:
                tma = a + (b_end - a) * (ta - t0) / (t1 - t0)
                tmb = a + (b_end - a) * (ta + dt - t0) / (t1 - t0)
                T = lu.solve(B @ T + 0.5 * dt * b * (tma + tmb))
            step += 1
            if step in out_steps:
                res[out_steps[step]] = T[0]
    assert not np.isnan(res).any(), "output time outside the process"
    return res


def simulate_sphere_kT(geom, kfun, segments, T0, n, dt, out_times, picard=3):
    """Sphere with k = kfun(T) (face k from the mean of the two nodes), finite h only."""
    vol, g, a_s = grid_1d("sphere", geom["R"], n)
    m = geom["rho"] * geom["cp"] * vol
    out_steps = {int(round(t / dt)): i for i, t in enumerate(out_times)}
    res = np.full(len(out_times), np.nan)
    T = np.full(n + 1, float(T0))
    if 0 in out_steps:
        res[out_steps[0]] = T[0]
    step = 0

    def lmat(Tk, h):
        gf = g * kfun(0.5 * (Tk[:-1] + Tk[1:]))
        main = np.zeros(n + 1)
        main[:-1] += gf
        main[1:] += gf
        main[-1] += h * a_s
        return main, gf

    def apply(main, gf, x):
        y = main * x
        y[:-1] -= gf * x[1:]
        y[1:] -= gf * x[:-1]
        return y

    for (t0, t1, a, b_end, h) in segments:
        assert h != INF
        nsteps = int(round((t1 - t0) / dt))
        for s in range(nsteps):
            ta = t0 + s * dt
            substeps = [(0.5, "be"), (1.0, "be")] if s == 0 else [(1.0, "cn")]
            for (hs, kind) in substeps:
                tstart = ta + (hs - 0.5) * dt if kind == "be" else ta
                sdt = 0.5 * dt if kind == "be" else dt
                tm_new = a + (b_end - a) * (tstart + sdt - t0) / (t1 - t0)
                tm_old = a + (b_end - a) * (tstart - t0) / (t1 - t0)
                Tn = T.copy()
                Tg = T.copy()
                for _ in range(picard):
                    main, gf = lmat(0.5 * (Tn + Tg) if kind == "cn" else Tg, h)
                    ab = np.zeros((3, n + 1))
                    ab[0, 1:] = -gf
                    ab[2, :-1] = -gf
                    if kind == "be":
                        ab[1] = m + sdt * main
                        ab[0, 1:] *= sdt
                        ab[2, :-1] *= sdt
                        rhs = m * Tn
                        rhs[-1] += sdt * h * a_s * tm_new
                    else:
                        ab[1] = m + 0.5 * sdt * main
                        ab[0, 1:] *= 0.5 * sdt
                        ab[2, :-1] *= 0.5 * sdt
                        rhs = m * Tn - 0.5 * sdt * apply(main, gf, Tn)
                        rhs[-1] += 0.5 * sdt * h * a_s * (tm_old + tm_new)
                    Tg = solve_banded((1, 1), ab, rhs)
                T = Tg
            step += 1
            if step in out_steps:
                res[out_steps[step]] = T[0]
    assert not np.isnan(res).any()
    return res


def converged(run_fine, run_coarse, label):
    """Run both resolutions; return fine result and max |fine - coarse| (asserted < 0.01 K)."""
    t = time.time()
    fine = run_fine()
    coarse = run_coarse()
    diff = float(np.max(np.abs(fine - coarse)))
    print(f"  {label}: max |fine - coarse| centre = {diff:.2e} K ({time.time() - t:.1f} s)",
          file=sys.stderr)
    assert diff < 0.01, f"{label}: not converged ({diff} K)"
    return fine, diff


# ----------------------------------------------------------------------------------------------
# Checks against known exact values (theta at the centre, h = inf)
# ----------------------------------------------------------------------------------------------
def run_checks():
    lines = []
    # sphere, Bi = inf, Fo = 0.2: R = 0.03, alpha = 1e-7 -> t = 0.2 * R^2 / alpha = 1800 s
    g = dict(shape="sphere", R=0.03, k=0.5, rho=1000.0, cp=5000.0)
    alpha = g["k"] / (g["rho"] * g["cp"])
    t_end = 0.2 * g["R"] ** 2 / alpha
    seg = [(0.0, t_end, 100.0, 100.0, INF)]
    T = simulate_linear(g, seg, 0.0, (400,), t_end / 3600, [t_end])[0]
    th = (T - 100.0) / (0.0 - 100.0)
    print(f"  check sphere h=inf Fo=0.2: theta = {th:.6f} (exact 0.277078)", file=sys.stderr)
    assert abs(th - 0.277078) < 2e-4, th
    lines.append(f"sphere h=inf Fo=0.2 centre theta {th:.6f} (exact 0.277078)")
    # finite cylinder R = 0.0375, half-height 0.05, alpha = 1.4e-7, h = inf, t = 1800 s
    g = dict(shape="cyl", R=0.0375, H=0.05, k=0.5, rho=1000.0, cp=0.5 / (1000.0 * 1.4e-7))
    seg = [(0.0, 1800.0, 100.0, 100.0, INF)]
    T = simulate_linear(g, seg, 0.0, (75, 100), 1.0, [1800.0])[0]
    th = (T - 100.0) / (0.0 - 100.0)
    print(f"  check cylinder h=inf t=1800 s: theta = {th:.6f} (exact 0.534528)", file=sys.stderr)
    assert abs(th - 0.534528) < 2e-4, th
    lines.append(f"finite cylinder R 0.0375 m half-height 0.05 m alpha 1.4e-7 h=inf t 1800 s "
                 f"centre theta {th:.6f} (exact 0.534528)")
    return lines


# ----------------------------------------------------------------------------------------------
# Scenarios (all INVENTED)
# ----------------------------------------------------------------------------------------------
CAN = dict(shape="cyl", R=0.073 / 2, H=0.110 / 2, k=0.50, rho=1068.0, cp=3319.0)
CAN_H_HEAT, CAN_H_COOL = 600.0, 400.0
CAN_SEGMENTS = [(0.0, 600.0, 40.0, 121.1, CAN_H_HEAT),        # come-up 40 -> 121.1 in 10 min
                (600.0, 4200.0, 121.1, 121.1, CAN_H_HEAT),     # hold 60 min
                (4200.0, 7200.0, 25.0, 25.0, CAN_H_COOL)]      # cooling water 25 C, 50 min
CAN_FINE, CAN_COARSE = ((160, 240), 1.0), ((80, 120), 2.0)

SPH = dict(shape="sphere", R=0.030, k=0.45, rho=1050.0, cp=3500.0)
SPH_H = 150.0
SPH_SEGMENTS = [(0.0, 300.0, 5.0, 95.0, SPH_H),
                (300.0, 3600.0, 95.0, 95.0, SPH_H),
                (3600.0, 7200.0, 2.0, 2.0, SPH_H)]
SPH_FINE, SPH_COARSE = ((800,), 0.25), ((400,), 0.5)

BRK = dict(shape="sphere", R=0.030, k=0.50, rho=1050.0, cp=3500.0)
BRK_H, BRK_K1, BRK_K2 = 300.0, 0.50, 0.25
# switch temperature: the brief's 70 C gave slopes differing by a factor of only 1.15 (at 70 C the
# outer shell turns to the low k within minutes, so the first part is never dominated by k = 0.50);
# raised to 90 C, where the fitted slopes differ by a factor of ~1.6 (checked in broken_heating())
BRK_SWITCH_C = 90.0
BRK_WIDTH_K = 0.5            # k changes smoothly over about +-0.5 K (tanh) around the switch
BRK_SEGMENTS = [(0.0, 7200.0, 100.0, 100.0, BRK_H)]

SEED_CAN_STUDY = 20261204
SEED_SPHERE_NOISY = 4101
SEED_BROKEN = 4102
SEED_TOO_SHORT = 4103


def fmt(x, nd):
    s = f"{x:.{nd}f}"
    return "0." + "0" * nd if s == "-0." + "0" * nd else s


def write_csv(path, comments, header, rows):
    os.makedirs(os.path.dirname(path), exist_ok=True)
    with open(path, "w", newline="\n") as f:
        for c in comments:
            f.write("# " + c + "\n" if c else "#\n")
        f.write(",".join(header) + "\n")
        for r in rows:
            f.write(",".join(r) + "\n")
    print(f"wrote {os.path.relpath(path, ROOT)}", file=sys.stderr)


def gen_comments(title, seed=None):
    c = [f"INVENTED data: {title}",
         f"generator: {GEN} (finite-volume model, numpy/scipy; no series solution)",
         f"rerun from the repository root: {RERUN}"]
    if seed is not None:
        c.append(f"noise: numpy.random.default_rng({seed})")
    return c


def sphere_desc(g):
    return (f"sphere diameter {2 * g['R']:.3f} m, k {g['k']} W/mK, rho {g['rho']} kg/m3, "
            f"cp {g['cp']} J/kgK")


def grid_desc(fine, coarse, shape):
    if shape == "sphere":
        return (f"grid: {fine[0][0]} radial intervals, dt {fine[1]} s (check grid "
                f"{coarse[0][0]} intervals, dt {coarse[1]} s)")
    return (f"grid: {fine[0][0]} radial x {fine[0][1]} axial intervals on the quarter domain, "
            f"dt {fine[1]} s (check grid {coarse[0][0]} x {coarse[0][1]}, dt {coarse[1]} s)")


def sphere_run(segs, T0, times, res):
    return simulate_linear(SPH, segs, T0, res[0], res[1], times)


def sphere_clean_and_noisy(check_lines):
    # (a) clean, every 10 s, 6 decimals
    times = np.arange(0, 7201, 10.0)
    cen, diff = converged(lambda: sphere_run(SPH_SEGMENTS, 5.0, times, SPH_FINE),
                          lambda: sphere_run(SPH_SEGMENTS, 5.0, times, SPH_COARSE),
                          "sphere_clean")
    med = [medium_at(SPH_SEGMENTS, t) for t in times]
    proc = ("medium 5 -> 95 C linear over 5 min, 95 C to 60 min, then 2 C to 120 min "
            "(the row at 3600 s carries the value just before the step); "
            f"h {SPH_H} W/m2K throughout; initial 5 C")
    conv = (f"convergence: max |centre fine - centre check grid| over the rows = {diff:.1e} K; "
            + grid_desc(SPH_FINE, SPH_COARSE, "sphere"))
    write_csv(os.path.join(OUT_REF, "sphere_clean.csv"),
              gen_comments("synthetic truth curve, no noise, not rounded") +
              [sphere_desc(SPH), proc, conv] + ["model check: " + s for s in check_lines],
              ["time_s", "medium_C", "centre_C"],
              [[fmt(t, 0), fmt(m, 6), fmt(c, 6)] for t, m, c in zip(times, med, cen)])
    # (b) noisy, every 30 s (taken from the same fine run), sigma 0.1 K, rounded to 0.1 C
    sel = np.arange(0, len(times), 3)
    t30, c30, m30 = times[sel], cen[sel], np.array(med)[sel]
    rng = np.random.default_rng(SEED_SPHERE_NOISY)
    nc = rng.normal(0.0, 0.1, len(t30))
    nm = rng.normal(0.0, 0.1, len(t30))
    write_csv(os.path.join(OUT_REF, "sphere_noisy.csv"),
              gen_comments("sphere_clean.csv at 30 s with logger noise sigma 0.1 K on centre and "
                           "medium (centre draws first, then medium), rounded to 0.1 C",
                           SEED_SPHERE_NOISY) + [sphere_desc(SPH), proc, conv],
              ["time_s", "medium_C", "centre_C"],
              [[fmt(t, 0), fmt(round(m + b, 1), 1), fmt(round(c + a, 1), 1)]
               for t, m, c, a, b in zip(t30, m30, c30, nc, nm)])
    # (e) too short: first 6 minutes, 30 s
    t6 = np.arange(0, 361, 30.0)
    c6, diff6 = converged(lambda: sphere_run(SPH_SEGMENTS, 5.0, t6, SPH_FINE),
                          lambda: sphere_run(SPH_SEGMENTS, 5.0, t6, SPH_COARSE), "too_short")
    m6 = np.array([medium_at(SPH_SEGMENTS, t) for t in t6])
    rng = np.random.default_rng(SEED_TOO_SHORT)
    nc = rng.normal(0.0, 0.1, len(t6))
    nm = rng.normal(0.0, 0.1, len(t6))
    write_csv(os.path.join(OUT_REF, "too_short.csv"),
              gen_comments("the sphere of sphere_clean.csv, only the first 6 min (come-up and "
                           "lag: the probe never reaches a straight semi-log portion); noise "
                           "sigma 0.1 K on centre and medium, rounded to 0.1 C", SEED_TOO_SHORT)
              + [sphere_desc(SPH), proc,
                 f"convergence: max |centre fine - centre check grid| over the rows = "
                 f"{diff6:.1e} K; " + grid_desc(SPH_FINE, SPH_COARSE, "sphere")],
              ["time_s", "medium_C", "centre_C"],
              [[fmt(t, 0), fmt(round(m + b, 1), 1), fmt(round(c + a, 1), 1)]
               for t, m, c, a, b in zip(t6, m6, c6, nc, nm)])


def can_run(g, T0, times, res):
    return simulate_linear(g, CAN_SEGMENTS, T0, res[0], res[1], times)


CAN_PROC = ("medium 40 -> 121.1 C linear over 10 min (come-up), 121.1 C to 70 min (hold), then "
            "cooling water 25 C to 120 min (the row at 4200 s carries the value just before the "
            f"step); h {CAN_H_HEAT:g} W/m2K heating (water-immersion retort), {CAN_H_COOL:g} "
            "W/m2K cooling")


def can_desc(k):
    alpha = k / (CAN["rho"] * CAN["cp"])
    return (f"finite cylinder diameter 0.073 m, length 0.110 m, k {k:g} W/mK, rho {CAN['rho']:g}"
            f" kg/m3, cp {CAN['cp']:g} J/kgK, alpha {alpha:.6e} m2/s; cold spot = geometric "
            "centre")


def can_clean():
    times = np.arange(0, 7201, 10.0)
    cen, diff = converged(lambda: can_run(CAN, 40.0, times, CAN_FINE),
                          lambda: can_run(CAN, 40.0, times, CAN_COARSE), "can_clean")
    med = [medium_at(CAN_SEGMENTS, t) for t in times]
    write_csv(os.path.join(OUT_REF, "can_clean.csv"),
              gen_comments("synthetic truth curve of the corned-beef can, no noise, not rounded")
              + [can_desc(CAN["k"]) + "; initial 40 C", CAN_PROC,
                 f"convergence: max |centre fine - centre check grid| over the rows = {diff:.1e} "
                 "K; " + grid_desc(CAN_FINE, CAN_COARSE, "cyl")],
              ["time_s", "medium_C", "centre_C"],
              [[fmt(t, 0), fmt(m, 6), fmt(c, 6)] for t, m, c in zip(times, med, cen)])


def can_study_job(job):
    factor, initial, i = job
    g = dict(CAN, k=CAN["k"] * factor)
    times = np.arange(0, 7201, 30.0)
    return converged(lambda: can_run(g, initial, times, CAN_FINE),
                     lambda: can_run(g, initial, times, CAN_COARSE), f"can study probe{i + 1}")


def can_study():
    rng = np.random.default_rng(SEED_CAN_STUDY)
    factors = np.clip(rng.normal(1.0, 0.03, 6), 0.93, 1.07)
    initials = rng.uniform(38.0, 42.0, 6)
    alpha0 = CAN["k"] / (CAN["rho"] * CAN["cp"])
    times = np.arange(0, 7201, 30.0)
    # alpha * factor through k (rho, cp unchanged); the six containers run on 2 processes
    jobs = [(float(factors[i]), float(initials[i]), i) for i in range(6)]
    with multiprocessing.Pool(2) as pool:
        results = pool.map(can_study_job, jobs)
    probes = [r[0] for r in results]
    diffs = [r[1] for r in results]
    med = np.array([medium_at(CAN_SEGMENTS, t) for t in times])
    noise_m = rng.normal(0.0, 0.15, len(times))
    noise_p = rng.normal(0.0, 0.1, (6, len(times)))
    truth = [f"probe{i + 1}: alpha factor {factors[i]:.6f} (alpha {alpha0 * factors[i]:.6e} m2/s)"
             f", initial {initials[i]:.4f} C" for i in range(6)]
    common = (gen_comments("heat-penetration study of six cans of corned beef at the Harbour Lane "
                           "Kitchen (a fictional kitchen); not a measurement", SEED_CAN_STUDY)
              + ["draw order: 6 alpha factors N(1, 0.03) clipped to [0.93, 1.07], 6 initial "
                 "temperatures U(38, 42) C, medium noise (sigma 0.15 K), probe noise (sigma "
                 "0.1 K, 6 x rows); every reading rounded to 0.1 C; a reading every 30 s",
                 "alpha factor 1: " + can_desc(CAN["k"]),
                 CAN_PROC + "; the model is driven by the exact medium, the medium log is that "
                 "plus noise",
                 "true parameters per container (thermocouple at the geometric centre):"]
              + ["  " + s for s in truth]
              + [f"convergence: max |centre fine - centre check grid| over the rows = "
                 f"{max(diffs):.1e} K (worst probe); " + grid_desc(CAN_FINE, CAN_COARSE, "cyl")])
    write_csv(os.path.join(OUT_LOGS, "can-study-medium.csv"), common, ["time_s", "medium_C"],
              [[fmt(t, 0), fmt(round(m + e, 1), 1)] for t, m, e in zip(times, med, noise_m)])
    write_csv(os.path.join(OUT_LOGS, "can-study-probes.csv"), common,
              ["time_s"] + [f"probe{i + 1}_C" for i in range(6)],
              [[fmt(t, 0)] + [fmt(round(probes[i][j] + noise_p[i, j], 1), 1) for i in range(6)]
               for j, t in enumerate(times)])
    write_csv(os.path.join(OUT_REF, "can_study_truth.csv"),
              gen_comments("true parameters of products/logs/can-study-*.csv", SEED_CAN_STUDY)
              + [f"alpha = k/(rho cp) * factor with k {CAN['k']}, rho {CAN['rho']:g}, "
                 f"cp {CAN['cp']:g}; geometry and process as in can_clean.csv"],
              ["probe", "alpha_m2_s", "h_heat_W_m2K", "h_cool_W_m2K", "initial_C"],
              [[f"probe{i + 1}", f"{alpha0 * factors[i]:.9e}", f"{CAN_H_HEAT:g}",
                f"{CAN_H_COOL:g}", f"{initials[i]:.6f}"] for i in range(6)])
    return factors, initials


def brk_k(T):
    return BRK_K2 + (BRK_K1 - BRK_K2) * 0.5 * (1.0 - np.tanh((T - BRK_SWITCH_C) / BRK_WIDTH_K))


def semilog_slope(t, T, lo, hi):
    """Least-squares slope of log10(100 - T) per minute over readings with lo <= t <= hi (s)."""
    sel = (t >= lo) & (t <= hi)
    y = np.log10(100.0 - T[sel])
    p = np.polyfit(t[sel] / 60.0, y, 1)
    resid = float(np.max(np.abs(y - np.polyval(p, t[sel] / 60.0))))
    return p[0], int(sel.sum()), resid


BRK_FIT1 = (720.0, 1920.0)     # first straight part (s), 12-32 min, chosen from the local slopes
BRK_FIT2 = (3600.0, 5700.0)    # second straight part (s), 60-95 min (100 - T from ~6 K to ~1.3 K)


def broken_heating():
    times = np.arange(0, 7201, 30.0)
    cen, diff = converged(
        lambda: simulate_sphere_kT(BRK, brk_k, BRK_SEGMENTS, 20.0, 400, 0.5, times),
        lambda: simulate_sphere_kT(BRK, brk_k, BRK_SEGMENTS, 20.0, 200, 1.0, times),
        "broken_heating")
    # local semi-log slope of the clean curve (per minute), to show the two straight parts
    y = np.log10(100.0 - cen)
    loc = np.gradient(y, times / 60.0)
    for t, s, c in zip(times[::10], loc[::10], cen[::10]):
        print(f"    t {t / 60:6.1f} min  T {c:7.3f}  dlog10/dmin {s:.5f}", file=sys.stderr)
    s1, n1, r1 = semilog_slope(times, cen, *BRK_FIT1)
    s2, n2, r2 = semilog_slope(times, cen, *BRK_FIT2)
    rng = np.random.default_rng(SEED_BROKEN)
    noisy_c = np.round(cen + rng.normal(0.0, 0.1, len(times)), 1)
    noisy_m = np.round(100.0 + rng.normal(0.0, 0.1, len(times)), 1)
    ns1, _, _ = semilog_slope(times, noisy_c, *BRK_FIT1)
    ns2, _, _ = semilog_slope(times, noisy_c, *BRK_FIT2)
    print(f"  broken heating slopes (clean) {s1:.5f} ({n1} readings, max residual {r1:.4f}), "
          f"{s2:.5f} ({n2}, {r2:.4f}); noisy {ns1:.5f}, {ns2:.5f}; ratio {s1 / s2:.2f}",
          file=sys.stderr)
    assert s1 / s2 > 1.4 and ns1 / ns2 > 1.4, "the two slopes do not differ clearly"
    assert n1 >= 30 and n2 >= 30 and r1 < 0.02 and r2 < 0.02
    write_csv(os.path.join(OUT_REF, "broken_heating.csv"),
              gen_comments("a product that thickens on heating (crude model): broken-heating "
                           "semi-log curve with two straight slopes; noise sigma 0.1 K on centre "
                           "(first draws) then medium, rounded to 0.1 C", SEED_BROKEN)
              + [f"sphere diameter 0.060 m, rho {BRK['rho']:g} kg/m3, cp {BRK['cp']:g} J/kgK, "
                 f"h {BRK_H:g} W/m2K, initial 20 C, medium 100 C from t = 0 for 120 min",
                 f"k = {BRK_K1} W/mK below {BRK_SWITCH_C:g} C and {BRK_K2} W/mK above (local "
                 f"temperature; smooth tanh change of half-width {BRK_WIDTH_K} K; face k from "
                 "the mean of its two nodes; Crank-Nicolson with 3 Picard iterations)",
                 f"slopes of log10(100 - T_centre) per minute, least squares on the clean curve: "
                 f"{s1:.5f} over {BRK_FIT1[0] / 60:g}-{BRK_FIT1[1] / 60:g} min ({n1} readings), "
                 f"{s2:.5f} over {BRK_FIT2[0] / 60:g}-{BRK_FIT2[1] / 60:g} min ({n2} readings); "
                 f"ratio {s1 / s2:.2f}; largest departure from each line {r1:.3f} and {r2:.3f} "
                 f"(log10 units); on the written noisy readings {ns1:.5f} and {ns2:.5f}",
                 "the change between the parts is gradual (the low-k shell grows inward); "
                 f"the switch temperature was raised from 70 C to {BRK_SWITCH_C:g} C so that the "
                 "two slopes differ clearly (at 70 C their ratio was only 1.15)",
                 f"convergence: max |centre fine - centre check grid| over the rows = {diff:.1e} "
                 "K; grid 400 radial intervals, dt 0.5 s (check grid 200, dt 1 s)"],
              ["time_s", "medium_C", "centre_C"],
              [[fmt(t, 0), fmt(m, 1), fmt(c, 1)] for t, m, c in zip(times, noisy_m, noisy_c)])
    return s1, s2, ns1, ns2


def truth_table():
    na = ""
    rows = [
        ["sphere_clean.csv", "sphere", "0.060", na, "0.45", "1050", "3500", "150", "150", "5"],
        ["sphere_noisy.csv", "sphere", "0.060", na, "0.45", "1050", "3500", "150", "150", "5"],
        ["too_short.csv", "sphere", "0.060", na, "0.45", "1050", "3500", "150", "150", "5"],
        ["can_clean.csv", "finite-cylinder", "0.073", "0.110", "0.50", "1068", "3319", "600",
         "400", "40"],
        ["broken_heating.csv", "sphere", "0.060", na, "0.50", "1050", "3500", "300", na, "20"],
    ]
    write_csv(os.path.join(OUT_REF, "truth.csv"),
              gen_comments("true parameters of the synthetic studies in this folder")
              + ["an empty field means not applicable (a sphere has no length; broken_heating.csv "
                 "has no cooling stage)",
                 f"broken_heating.csv: k is {BRK_K1} W/mK below {BRK_SWITCH_C:g} C and {BRK_K2} "
                 "W/mK above (the k column gives the starting value)",
                 "process of each file: see its own comment lines"],
              ["file", "shape", "diameter_m", "length_m", "k_W_mK", "rho_kg_m3", "cp_J_kgK",
               "h_heat_W_m2K", "h_cool_W_m2K", "initial_C"], rows)


def main():
    t0 = time.time()
    only = set(sys.argv[1:])
    print("checks:", file=sys.stderr)
    check_lines = run_checks()
    if not only or "broken" in only:
        broken_heating()
    if not only or "sphere" in only:
        sphere_clean_and_noisy(check_lines)
    if not only or "can" in only:
        can_clean()
    if not only or "study" in only:
        can_study()
    if not only:
        truth_table()
    print(f"done in {time.time() - t0:.0f} s", file=sys.stderr)


if __name__ == "__main__":
    main()
