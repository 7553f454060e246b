// One resolution of the finite-volume solver: grid, Crank–Nicolson steps with Rannacher start-up,
// Picard iteration on k(T) and ρcp(T), Thomas solve. See numeric.hpp for the method summary.
#include <algorithm>
#include <cmath>
#include <sstream>
#include <string>

#include "conduction/detail/numeric_march.hpp"
#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"

namespace coldcore::detail {
namespace {

double checked(double value, const char* what, double temp_C) {
  if (!(std::isfinite(value) && value > 0.0))
    throw InputError("numeric: " + std::string(what) + "(T = " + number_text(temp_C, 10) +
                     " °C) = " + number_text(value, 10) + ": must be finite and > 0");
  return value;
}

/// Grid geometry per unit of the transverse measure (m² of slab face, radian·m of cylinder,
/// steradian of sphere): exact control volumes between face midpoints and face areas r^m.
struct Grid {
  int n = 0;                       // nodes 0..n
  double dr = 0;
  std::vector<double> r;           // node positions
  std::vector<double> volume;      // control volume of each node
  std::vector<double> face_area;   // face j between node j and j+1 (size n)
  double surface_area = 0;
};

Grid make_grid(Geometry g, double R, int cells) {
  const int m = g == Geometry::slab ? 0 : g == Geometry::cylinder ? 1 : 2;
  auto measure = [m](double r) { return std::pow(r, m + 1) / (m + 1); };  // ∫0^r ρ^m dρ
  Grid grid;
  grid.n = cells;
  grid.dr = R / cells;
  grid.r.resize(cells + 1);
  grid.volume.resize(cells + 1);
  grid.face_area.resize(cells);
  for (int i = 0; i <= cells; ++i) grid.r[i] = (i == cells) ? R : i * grid.dr;
  for (int j = 0; j < cells; ++j) grid.face_area[j] = std::pow((j + 0.5) * grid.dr, m);
  for (int i = 0; i <= cells; ++i) {
    const double lo = i == 0 ? 0.0 : (i - 0.5) * grid.dr;
    const double hi = i == cells ? R : (i + 0.5) * grid.dr;
    grid.volume[i] = measure(hi) - measure(lo);
  }
  grid.surface_area = std::pow(R, m);
  return grid;
}

/// Mean ρcp over [a, b] (the chord of H = ∫ρcp dT), 3-point Gauss–Legendre; exact for ρcp
/// polynomials to degree 5 and equal to ρcp(a) when a == b, so no division by a − b is needed.
double chord_capacity(const NumericMaterial& mat, double a, double b) {
  static const double x = 0.5 * std::sqrt(0.6);
  const double d = b - a;
  if (mat.volumetric_enthalpy_J_m3 && std::fabs(d) > 1e-6) {
    // Exact chord of the given enthalpy; below 1e-6 K the difference of two H values of order
    // 1e8 J/m³ would lose digits, and the midpoint capacity is then the chord to O(d²).
    const double ha = mat.volumetric_enthalpy_J_m3(a), hb = mat.volumetric_enthalpy_J_m3(b);
    return checked((hb - ha) / d, "volumetric_enthalpy_J_m3 chord", a);
  }
  if (mat.volumetric_enthalpy_J_m3)
    return checked(mat.volumetric_heat_capacity_J_m3K(a + 0.5 * d), "volumetric_heat_capacity_J_m3K",
                   a + 0.5 * d);
  const double c1 = checked(mat.volumetric_heat_capacity_J_m3K(a + (0.5 - x) * d),
                            "volumetric_heat_capacity_J_m3K", a + (0.5 - x) * d);
  const double c2 = checked(mat.volumetric_heat_capacity_J_m3K(a + 0.5 * d),
                            "volumetric_heat_capacity_J_m3K", a + 0.5 * d);
  const double c3 = checked(mat.volumetric_heat_capacity_J_m3K(a + (0.5 + x) * d),
                            "volumetric_heat_capacity_J_m3K", a + (0.5 + x) * d);
  return (5.0 * c1 + 8.0 * c2 + 5.0 * c3) / 18.0;
}

/// Face conductances A·k/Δr with k at the face's mean temperature.
void conductances(const Grid& grid, const NumericMaterial& mat, const std::vector<double>& T,
                  std::vector<double>& G) {
  for (int j = 0; j < grid.n; ++j) {
    const double tf = 0.5 * (T[j] + T[j + 1]);
    G[j] = grid.face_area[j] * checked(mat.conductivity_W_mK(tf), "conductivity_W_mK", tf) / grid.dr;
  }
}

/// Thomas algorithm for a diagonally dominant tridiagonal system (our matrix always is:
/// capacity/Δt plus conductances on the diagonal). a: sub, b: diag, c: super; d is overwritten.
void thomas(const std::vector<double>& a, std::vector<double>& b, const std::vector<double>& c,
            std::vector<double>& d) {
  const std::size_t n = b.size();
  for (std::size_t i = 1; i < n; ++i) {
    const double w = a[i] / b[i - 1];
    b[i] -= w * c[i - 1];
    d[i] -= w * d[i - 1];
  }
  d[n - 1] /= b[n - 1];
  for (std::size_t i = n - 1; i-- > 0;) d[i] = (d[i] - c[i] * d[i + 1]) / b[i];
}

double volume_mean(const Grid& grid, const std::vector<double>& T) {
  double s = 0, v = 0;
  for (int i = 0; i <= grid.n; ++i) {
    s += grid.volume[i] * T[i];
    v += grid.volume[i];
  }
  return s / v;
}

/// The equations of one time step in energy form (phase change).
struct StepEquations {
  const Grid& grid;
  const NumericMaterial& mat;
  const std::vector<double>& T_old;
  const std::vector<double>& H_old;
  const std::vector<double>& flux_old;
  double theta, dt, hA, Tm_b, surf_old;
  bool held;
};

/// Enthalpy iteration of Swaminathan & Voller (1992), "A general enthalpy method for modeling
/// solidification processes", Metall. Trans. B 23:651–664: linearise H about the iterate with
/// the apparent capacity, solve for T, apply the predicted change in H-space and map back
/// through T(H). Unlike Picard on the chord capacity or plain Newton in T, it does not cycle or
/// stall at the kinks of H(T) where a node enters or leaves the latent band.
/// On return G holds the conductances used in the last solve.
void enthalpy_solve(const StepEquations& e, std::vector<double>& T, std::vector<double>& G,
                    const NumericOptions& options, double time_s) {
  const std::size_t size = T.size();
  const int n = e.grid.n;
  std::vector<double> H(size), C(size), a(size), b(size), c(size), d(size);
  for (std::size_t i = 0; i < size; ++i) H[i] = e.mat.volumetric_enthalpy_J_m3(T[i]);
  for (int it = 1;; ++it) {
    conductances(e.grid, e.mat, T, G);
    for (int i = 0; i <= n; ++i) {
      C[i] = checked(e.mat.volumetric_heat_capacity_J_m3K(T[i]), "volumetric_heat_capacity_J_m3K", T[i]);
      const double m = e.grid.volume[i] / e.dt;
      const double gl = i > 0 ? G[i - 1] : 0.0;
      const double gr = i < n ? G[i] : 0.0;
      a[i] = -e.theta * gl;
      c[i] = -e.theta * gr;
      b[i] = m * C[i] + e.theta * (gl + gr);
      d[i] = m * (C[i] * T[i] - H[i] + e.H_old[i]) + (1.0 - e.theta) * e.flux_old[i];
    }
    if (e.held) {
      a[n] = 0.0;
      b[n] = 1.0;
      d[n] = e.Tm_b;
    } else {
      b[n] += e.theta * e.hA;
      d[n] += e.theta * e.hA * e.Tm_b + (1.0 - e.theta) * e.surf_old;
    }
    thomas(a, b, c, d);
    double change = 0;
    for (int i = 0; i <= n; ++i) {
      double t_new = d[i];
      if (!(e.held && i == n)) {
        const double h_pred = H[i] + C[i] * (d[i] - T[i]);
        const double t_mapped = e.mat.temperature_from_enthalpy_C(h_pred);
        if (!std::isfinite(t_mapped))
          throw InputError("numeric: temperature_from_enthalpy_C(H = " + number_text(h_pred, 10) + ") = " +
                           number_text(t_mapped, 10) + ": must be finite");
        // Safeguard: take the smaller of the two moves (both point the same way, H being
        // monotone). Mapping back through T(H) overshoots when a node leaves the latent band
        // (the capacity drops along the way) and the linear prediction overshoots when it
        // enters it; the smaller move never crosses into a piece it has not seen yet.
        if (std::fabs(t_mapped - T[i]) <= std::fabs(d[i] - T[i])) {
          t_new = t_mapped;
          H[i] = h_pred;
        } else {
          t_new = d[i];
          H[i] = e.mat.volumetric_enthalpy_J_m3(t_new);
        }
      }
      change = std::max(change, std::fabs(t_new - T[i]));
      T[i] = t_new;
    }
    if (change <= options.picard_tol_K) return;
    if (it >= options.enthalpy_max_iter)
      throw NotConverged("numeric: enthalpy iteration at t = " + number_text(time_s, 10) + " s changed " +
                         number_text(change, 10) + " K after " + std::to_string(it) +
                         " iterations: above picard_tol_K = " + number_text(options.picard_tol_K, 10));
  }
}

}  // namespace

double medium_at(const NumericProblem& problem, const std::vector<double>& starts, double t) {
  // The later segment owns a shared boundary instant; the end of the last segment is its own.
  std::size_t s = 0;
  while (s + 1 < problem.segments.size() && starts[s + 1] <= t) ++s;
  return problem.segments[s].medium.at(t - starts[s]);
}

std::vector<double> segment_starts(const NumericProblem& problem) {
  std::vector<double> starts{0.0};
  for (const auto& s : problem.segments) starts.push_back(starts.back() + s.duration_s);
  return starts;
}

LevelSolution march_level(const NumericProblem& problem, const std::vector<BaseStep>& base_steps,
                          const std::vector<double>& sample_times_s, int cells, int divisor,
                          const NumericOptions& options) {
  const Grid grid = make_grid(problem.geometry, problem.half_size_m, cells);
  const NumericMaterial& mat = problem.material;
  const std::vector<double> starts = segment_starts(problem);
  const int n = grid.n;
  const std::size_t size = static_cast<std::size_t>(n) + 1;

  std::vector<double> T(size, problem.initial_C), T_old(size), T_iter(size), T_new(size);
  std::vector<double> G_old(n), G(n), a(size), b(size), c(size), d(size), flux_old(size), cap(size);
  std::vector<double> H_old(size);
  double heat_J = 0;  // per unit transverse measure; divided by surface_area when reported

  LevelSolution out;
  std::size_t next_sample = 0;
  auto record = [&](double t) {
    while (next_sample < sample_times_s.size() && sample_times_s[next_sample] <= t) {
      NumericSample s;
      s.time_s = sample_times_s[next_sample];
      s.medium_C = medium_at(problem, starts, t);
      s.centre_C = T[0];
      s.surface_C = T[n];
      s.mean_C = volume_mean(grid, T);
      s.heat_in_J_m2 = heat_J / grid.surface_area;
      out.samples.push_back(s);
      ++next_sample;
    }
  };
  if (!sample_times_s.empty() && sample_times_s.front() == 0.0) {
    // The initial state, before any contact with the medium.
    NumericSample s;
    s.medium_C = problem.segments.front().medium.at(0.0);
    s.centre_C = s.surface_C = s.mean_C = problem.initial_C;
    out.samples.push_back(s);
    next_sample = 1;
  }

  int substeps_done_in_segment = 0;
  for (const BaseStep& base : base_steps) {
    const NumericSegment& seg = problem.segments[base.segment];
    if (base.segment_start) substeps_done_in_segment = 0;
    const double t_seg0 = starts[base.segment];
    const double sub_dt = (base.t1_s - base.t0_s) / divisor;
    for (int k = 0; k < divisor; ++k) {
      const double t0 = base.t0_s + k * sub_dt;
      const double t1 = (k + 1 == divisor) ? base.t1_s : t0 + sub_dt;
      // Rannacher start-up: the first two sub-steps of a segment are each taken as two
      // backward-Euler half-steps; CN alone would let the surface jump ring for many steps.
      const bool startup = substeps_done_in_segment < 2;
      const int parts = startup ? 2 : 1;
      const double theta = startup ? 1.0 : 0.5;
      for (int part = 0; part < parts; ++part) {
        const double ta = t0 + (t1 - t0) * part / parts;
        const double tb = part + 1 == parts ? t1 : t0 + (t1 - t0) * (part + 1) / parts;
        const double dt = tb - ta;
        const double Tm_a = seg.medium.at(ta - t_seg0);
        const double Tm_b = seg.medium.at(tb - t_seg0);
        const double hA = seg.h_infinite ? 0.0 : seg.h_W_m2K * grid.surface_area;
        T_old = T;
        conductances(grid, mat, T_old, G_old);
        for (int i = 0; i <= n; ++i) {
          double f = 0;
          if (i < n) f += G_old[i] * (T_old[i + 1] - T_old[i]);
          if (i > 0) f -= G_old[i - 1] * (T_old[i] - T_old[i - 1]);
          flux_old[i] = f;
        }
        const double surf_old = hA * (Tm_a - T_old[n]);
        T_iter = T_old;
        if (seg.h_infinite) T_iter[n] = Tm_b;
        if (mat.volumetric_enthalpy_J_m3) {
          // Phase change: Picard on the chord capacity cycles when a node crosses the latent
          // band; the enthalpy iteration does not.
          StepEquations eq{grid, mat, T_old, H_old, flux_old, theta, dt, hA, Tm_b, surf_old,
                           seg.h_infinite};
          for (int i = 0; i <= n; ++i) H_old[i] = mat.volumetric_enthalpy_J_m3(T_old[i]);
          enthalpy_solve(eq, T_iter, G, options, tb);
        } else {
          int it = 0;
          double change = 0;
          for (;;) {
            conductances(grid, mat, T_iter, G);
            for (int i = 0; i <= n; ++i) {
              cap[i] = grid.volume[i] * chord_capacity(mat, T_old[i], T_iter[i]) / dt;
              const double gl = i > 0 ? G[i - 1] : 0.0;
              const double gr = i < n ? G[i] : 0.0;
              a[i] = -theta * gl;
              c[i] = -theta * gr;
              b[i] = cap[i] + theta * (gl + gr);
              d[i] = cap[i] * T_old[i] + (1.0 - theta) * flux_old[i];
            }
            if (seg.h_infinite) {
              a[n] = 0.0;
              b[n] = 1.0;
              d[n] = Tm_b;
            } else {
              b[n] += theta * hA;
              d[n] += theta * hA * Tm_b + (1.0 - theta) * surf_old;
            }
            T_new = d;
            thomas(a, b, c, T_new);
            change = 0;
            for (int i = 0; i <= n; ++i) change = std::max(change, std::fabs(T_new[i] - T_iter[i]));
            T_iter.swap(T_new);
            ++it;
            if (change <= options.picard_tol_K) break;
            if (it >= options.picard_max_iter)
              throw NotConverged("numeric: Picard iteration at t = " + number_text(tb, 10) + " s changed " +
                                 number_text(change, 10) + " K after " + std::to_string(it) +
                                 " iterations: above picard_tol_K = " + number_text(options.picard_tol_K, 10));
          }
        }
        T.swap(T_iter);
        // Heat through the surface in this step, from the same weights the scheme used, so that
        // Σ heat = Σ enthalpy change exactly (to the Picard tolerance).
        if (seg.h_infinite) {
          const double into_interior_new = G[n - 1] * (T[n - 1] - T[n]);
          const double e_surface = grid.volume[n] * chord_capacity(mat, T_old[n], T[n]) *
                                   (T[n] - T_old[n]);
          heat_J += e_surface - dt * (theta * into_interior_new + (1.0 - theta) * flux_old[n]);
        } else {
          heat_J += dt * (theta * hA * (Tm_b - T[n]) + (1.0 - theta) * surf_old);
        }
        ++out.steps;
      }
      ++substeps_done_in_segment;
    }
    record(base.t1_s);
  }
  out.node_r_m = grid.r;
  out.node_T_C = T;
  return out;
}

}  // namespace coldcore::detail
