#!/usr/bin/python3
"""Independent fine-grid reference for the finite-volume solver with temperature-dependent
properties, a ramped medium, a change of h between segments and a held surface (h = inf).

Source: our own method-of-lines solution written independently of the C++ solver, by a
different discretisation: cell-centred finite volumes (the C++ solver is vertex-centred),
harmonic-mean face conductivity, non-conservative capacity form rho*cp(T_i) dT_i/dt, surface
temperature from the flux balance k (Ts - T_last)/(dr/2) = h (T_medium - Ts), centre by the
symmetric fit T = a + b r^2 through the first two cells, mean by the midpoint rule. Time by
scipy.integrate.solve_ivp (Radau, rtol = atol = 1e-10, tridiagonal Jacobian sparsity), restarted
at every medium breakpoint and segment boundary.
Precision: solved with 200, 400 and 800 cells; the printed value is the Richardson extrapolation
(4 T_800 - T_400)/3 and ref_uncertainty_K = |T_800 - T_400|/3 (the error estimate of T_800,
much larger than that of the printed value). The observed order from the three grids is printed
in a comment line (expected about 2).
Properties of case "beef-slab" are Choi-Okos (1986) polynomials (REFERENCES.md section 5.3,
transcribed here separately from the C++ code) mixed by the ASHRAE rules for 74/22/3/1
water/protein/fat/ash.
rerun: /usr/bin/python3 tests/reference/gen_numeric_kt_check.py > tests/reference/numeric_kt_check.csv
"""
import numpy as np
from scipy.integrate import solve_ivp
from scipy.sparse import diags


def q(c, t):
    return c[0] + c[1] * t + c[2] * t * t


CHOI_OKOS = {  # k, rho, cp(kJ/kgK)
    "water": ((0.57109, 1.7625e-3, -6.7036e-6), (997.18, 3.1439e-3, -3.7574e-3), (4.1762, -9.0864e-5, 5.4731e-6)),
    "protein": ((0.17881, 1.1958e-3, -2.7178e-6), (1329.9, -0.51840, 0.0), (2.0082, 1.2089e-3, -1.3129e-6)),
    "fat": ((0.18071, -2.7604e-4, -1.7749e-7), (925.59, -0.41757, 0.0), (1.9842, 1.4733e-3, -4.8008e-6)),
    "ash": ((0.32962, 1.4011e-3, -2.9069e-6), (2423.8, -0.28063, 0.0), (1.0926, 1.8896e-3, -3.6817e-6)),
}
BEEF = {"water": 0.74, "protein": 0.22, "fat": 0.03, "ash": 0.01}


def beef_k(t):
    sv = sum(x / q(CHOI_OKOS[c][1], t) for c, x in BEEF.items())
    return sum(x / q(CHOI_OKOS[c][1], t) * q(CHOI_OKOS[c][0], t) for c, x in BEEF.items()) / sv


def beef_c(t):
    sv = sum(x / q(CHOI_OKOS[c][1], t) for c, x in BEEF.items())
    cp = 1000.0 * sum(x * q(CHOI_OKOS[c][2], t) for c, x in BEEF.items())
    return cp / sv


CASES = [
    # name, geometry exponent m, half size, initial, k(T), rho*cp(T), segments, output times
    # segment: (duration_s, h or inf, [(t_s, medium_C), ...] from the segment start)
    dict(name="poly-sphere", geometry="sphere", R=0.02, T0=5.0,
         k=lambda t: 0.45 + 1.5e-3 * t - 4e-6 * t * t,
         c=lambda t: 1050.0 * (3500.0 + 2.0 * t + 0.01 * t * t),
         segments=[(1800.0, 300.0, [(0.0, 5.0), (600.0, 90.0)]), (1800.0, 50.0, [(0.0, 2.0)])],
         times=[120, 300, 600, 900, 1200, 1800, 2100, 2700, 3600]),
    dict(name="beef-slab", geometry="slab", R=0.015, T0=4.0, k=beef_k, c=beef_c,
         segments=[(2400.0, 200.0, [(0.0, 95.0)])],
         times=[60, 300, 900, 1500, 2400]),
    dict(name="poly-cylinder-held", geometry="cylinder", R=0.025, T0=10.0,
         k=lambda t: 0.40 + 2.5e-3 * t,
         c=lambda t: 3.8e6 - 4000.0 * t,
         segments=[(3000.0, float("inf"), [(0.0, 80.0)])],
         times=[60, 300, 1000, 2000, 3000]),
]


def medium(points, t):
    ts = [p[0] for p in points]
    vs = [p[1] for p in points]
    return float(np.interp(t, ts, vs))


def solve(case, n):
    m = {"slab": 0, "cylinder": 1, "sphere": 2}[case["geometry"]]
    R = case["R"]
    dr = R / n
    rf = np.arange(n + 1) * dr                       # faces
    vol = (rf[1:] ** (m + 1) - rf[:-1] ** (m + 1)) / (m + 1)
    area = rf ** m                                   # area of each face
    k, c = case["k"], case["c"]
    state = {"h": None, "pts": None, "t0": 0.0}

    def surface_temp(t_last, t_abs):
        tm = medium(state["pts"], t_abs - state["t0"])
        if state["h"] == float("inf"):
            return tm
        ts = t_last
        for _ in range(30):
            g = k(0.5 * (ts + t_last)) / (0.5 * dr)
            ts_new = (state["h"] * tm + g * t_last) / (state["h"] + g)
            if abs(ts_new - ts) < 1e-13:
                break
            ts = ts_new
        return ts_new

    def rhs(t_abs, T):
        kc = k(T)
        kf = 2 * kc[:-1] * kc[1:] / (kc[:-1] + kc[1:])  # harmonic mean at interior faces
        flux = np.zeros(n + 1)                            # outward flux through each face
        flux[1:-1] = -kf * (T[1:] - T[:-1]) / dr * area[1:-1]
        ts = surface_temp(T[-1], t_abs)
        flux[-1] = -k(0.5 * (ts + T[-1])) * (ts - T[-1]) / (0.5 * dr) * area[-1]
        return (flux[:-1] - flux[1:]) / (vol * c(T))

    def observe(T, t_abs):
        ts = surface_temp(T[-1], t_abs)
        return ((9 * T[0] - T[1]) / 8, ts, float(np.sum(vol * T) / np.sum(vol)))

    sparsity = diags([1, 1, 1], [-1, 0, 1], shape=(n, n))
    T = np.full(n, case["T0"])
    out = {}
    t_start = 0.0
    for duration, h, pts in case["segments"]:
        state.update(h=h, pts=pts, t0=t_start)
        breaks = sorted({t_start + p[0] for p in pts if 0 < p[0] < duration} | {t_start, t_start + duration})
        for a, b in zip(breaks[:-1], breaks[1:]):
            want = [t for t in case["times"] if a < t <= b]
            sol = solve_ivp(rhs, (a, b), T, method="Radau", t_eval=sorted(set(want) | {b}),
                            rtol=1e-10, atol=1e-10, jac_sparsity=sparsity)
            assert sol.success, sol.message
            for t in want:
                # At a segment end the temperatures are those at that instant under the ending
                # segment's surface condition, as the C++ solver reports them.
                out[t] = observe(sol.y[:, list(sol.t).index(t)], t)
            T = sol.y[:, -1]
        t_start += duration
    return out


print("# Fine-grid SciPy reference with k(T), rho*cp(T); see the generator header.")
print("# rerun: /usr/bin/python3 tests/reference/gen_numeric_kt_check.py > tests/reference/numeric_kt_check.csv")
rows = []
for case in CASES:
    s200, s400, s800 = (solve(case, n) for n in (200, 400, 800))
    orders = []
    for t in case["times"]:
        vals = []
        for j in range(3):
            a, b, c = s200[t][j], s400[t][j], s800[t][j]
            if abs(b - c) > 1e-7:
                orders.append(np.log2(abs(a - b) / abs(b - c)))
            vals.append(((4 * c - b) / 3, abs(c - b) / 3))
        rows.append((case["name"], t, vals))
    print("# %s: observed order from 200/400/800 cells: min %.2f median %.2f max %.2f"
          % (case["name"], min(orders), float(np.median(orders)), max(orders)))
print("case,time_s,centre_C,surface_C,mean_C,ref_uncertainty_K")
for name, t, vals in rows:
    print("%s,%d,%.6f,%.6f,%.6f,%.2e" % (name, t, vals[0][0], vals[1][0], vals[2][0],
                                         max(v[1] for v in vals)))
