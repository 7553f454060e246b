// Finite-volume solver driver: input checks, the base time-step sequence and the Richardson
// self-check over nested resolutions (see numeric.hpp).
#include <algorithm>
#include <cmath>
#include <sstream>
#include <string>

#include "conduction/detail/numeric_march.hpp"
#include "coldcore/conduction/numeric.hpp"
#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"

namespace coldcore {
namespace {

[[noreturn]] void bad(const std::string& key, double value, const std::string& rule) {
  throw InputError("numeric: " + key + " = " + number_text(value, 10) + ": " + rule);
}

void validate(const NumericProblem& p, const std::vector<double>& times, const NumericOptions& o) {
  if (!(std::isfinite(p.half_size_m) && p.half_size_m > 0)) bad("half_size_m", p.half_size_m, "must be > 0");
  if (!std::isfinite(p.initial_C)) bad("initial_C", p.initial_C, "must be finite");
  if (!p.material.conductivity_W_mK || !p.material.volumetric_heat_capacity_J_m3K)
    throw InputError("numeric: material: both property callables must be set");
  if (static_cast<bool>(p.material.volumetric_enthalpy_J_m3) !=
      static_cast<bool>(p.material.temperature_from_enthalpy_C))
    throw InputError("numeric: material: volumetric_enthalpy_J_m3 and temperature_from_enthalpy_C "
                     "must be set together");
  if (p.segments.empty()) throw InputError("numeric: segments: at least one is required");
  double total = 0;
  for (std::size_t s = 0; s < p.segments.size(); ++s) {
    const auto& seg = p.segments[s];
    const std::string at = "segment[" + std::to_string(s) + "].";
    if (!(std::isfinite(seg.duration_s) && seg.duration_s > 0))
      bad(at + "duration_s", seg.duration_s, "must be > 0");
    if (!seg.h_infinite && !(std::isfinite(seg.h_W_m2K) && seg.h_W_m2K > 0))
      bad(at + "h_W_m2K", seg.h_W_m2K, "must be > 0 (or h_infinite)");
    if (seg.medium.points.empty()) throw InputError("numeric: " + at + "medium: has no points");
    if (seg.medium.points.front().time_s != 0.0)
      bad(at + "medium.points[0].time_s", seg.medium.points.front().time_s, "must be 0");
    for (std::size_t i = 0; i < seg.medium.points.size(); ++i) {
      const auto& pt = seg.medium.points[i];
      const std::string key = at + "medium.points[" + std::to_string(i) + "]";
      if (!std::isfinite(pt.temp_C)) bad(key + ".temp_C", pt.temp_C, "must be finite");
      if (i > 0 && !(pt.time_s > seg.medium.points[i - 1].time_s))
        bad(key + ".time_s", pt.time_s, "must be greater than the previous point's time");
    }
    total += seg.duration_s;
  }
  for (std::size_t i = 0; i < times.size(); ++i)
    if (!(times[i] >= 0 && times[i] <= total))
      bad("output_times_s[" + std::to_string(i) + "]", times[i],
          "must be within 0 and the total duration " + number_text(total, 10) + " s");
  if (!(o.tol_K > 0)) bad("options.tol_K", o.tol_K, "must be > 0");
  if (o.base_cells < 2) bad("options.base_cells", o.base_cells, "must be >= 2");
  if (!(o.base_fourier_step > 0)) bad("options.base_fourier_step", o.base_fourier_step, "must be > 0");
  if (o.max_level < 2 || o.max_level > 12) bad("options.max_level", o.max_level, "must be within 2 and 12");
  if (o.fixed_cells < 0) bad("options.fixed_cells", o.fixed_cells, "must be >= 0");
  if (o.fixed_step_divisor < 1) bad("options.fixed_step_divisor", o.fixed_step_divisor, "must be >= 1");
  if (o.picard_max_iter < 1) bad("options.picard_max_iter", o.picard_max_iter, "must be >= 1");
  if (o.enthalpy_max_iter < 1) bad("options.enthalpy_max_iter", o.enthalpy_max_iter, "must be >= 1");
  if (!(o.picard_tol_K > 0)) bad("options.picard_tol_K", o.picard_tol_K, "must be > 0");
}

/// Level-0 steps: land on every must-hit time (outputs, medium breakpoints, segment ends); after
/// each segment start begin at 1/64 of the base step and grow by 1.25 per step, because the
/// surface changes fastest right after the medium or h changes.
std::vector<detail::BaseStep> base_steps(const NumericProblem& p, const std::vector<double>& times,
                                         double dt_base) {
  const std::vector<double> starts = detail::segment_starts(p);
  std::vector<double> hits(times.begin(), times.end());
  for (std::size_t s = 0; s < p.segments.size(); ++s) {
    hits.push_back(starts[s + 1]);
    for (const auto& pt : p.segments[s].medium.points)
      if (pt.time_s > 0 && starts[s] + pt.time_s < starts[s + 1]) hits.push_back(starts[s] + pt.time_s);
  }
  std::sort(hits.begin(), hits.end());
  std::vector<detail::BaseStep> steps;
  std::size_t h = 0;
  for (std::size_t s = 0; s < p.segments.size(); ++s) {
    double t = starts[s];
    double grow = dt_base / 64.0;
    bool first = true;
    while (t < starts[s + 1]) {
      while (h < hits.size() && hits[h] <= t) ++h;
      const double target = h < hits.size() ? std::min(hits[h], starts[s + 1]) : starts[s + 1];
      double t1 = t + grow;
      // Land exactly on the target; absorb a sliver below 1/4 step into this step.
      if (t1 >= target - 0.25 * grow) t1 = target;
      steps.push_back({t, t1, static_cast<int>(s), first});
      first = false;
      t = t1;
      grow = std::min(dt_base, 1.25 * grow);
    }
  }
  return steps;
}

double max_difference(const std::vector<NumericSample>& a, const std::vector<NumericSample>& b) {
  double worst = 0;
  for (std::size_t i = 0; i < a.size(); ++i) {
    worst = std::max(worst, std::fabs(a[i].centre_C - b[i].centre_C));
    worst = std::max(worst, std::fabs(a[i].surface_C - b[i].surface_C));
    worst = std::max(worst, std::fabs(a[i].mean_C - b[i].mean_C));
  }
  return worst;
}

}  // namespace

NumericResult solve_numeric(const NumericProblem& problem, const std::vector<double>& output_times_s,
                            const NumericOptions& options) {
  validate(problem, output_times_s, options);
  std::vector<double> unique_times = output_times_s;
  std::sort(unique_times.begin(), unique_times.end());
  unique_times.erase(std::unique(unique_times.begin(), unique_times.end()), unique_times.end());

  const double T0 = problem.initial_C;
  const double k0 = problem.material.conductivity_W_mK(T0);
  const double c0 = problem.material.volumetric_heat_capacity_J_m3K(T0);
  if (!(std::isfinite(k0) && k0 > 0)) bad("material.conductivity_W_mK(initial_C)", k0, "must be > 0");
  if (!(std::isfinite(c0) && c0 > 0))
    bad("material.volumetric_heat_capacity_J_m3K(initial_C)", c0, "must be > 0");
  const double R = problem.half_size_m;
  const double dt_base = options.base_fourier_step * R * R * c0 / k0;
  // March only as far as the latest requested time (the whole process if none is requested).
  auto steps = base_steps(problem, unique_times, dt_base);
  if (!unique_times.empty()) {
    const double t_stop = unique_times.back();
    while (!steps.empty() && steps.back().t0_s >= t_stop) steps.pop_back();
  }

  auto finish = [&](detail::LevelSolution&& sol, int cells, double estimate) {
    NumericResult r;
    for (double t : output_times_s) {
      const auto pos = std::lower_bound(unique_times.begin(), unique_times.end(), t) - unique_times.begin();
      r.samples.push_back(sol.samples[static_cast<std::size_t>(pos)]);
    }
    r.cells = cells;
    r.steps = sol.steps;
    r.error_estimate_K = estimate;
    r.node_r_m = std::move(sol.node_r_m);
    r.node_T_C = std::move(sol.node_T_C);
    return r;
  };

  if (options.fixed_cells > 0)
    return finish(detail::march_level(problem, steps, unique_times, options.fixed_cells,
                                      options.fixed_step_divisor, options),
                  options.fixed_cells, 0.0);

  const bool phase_change = static_cast<bool>(problem.material.volumetric_enthalpy_J_m3);
  auto coarse = detail::march_level(problem, steps, unique_times, options.base_cells, 1, options);
  double estimate = 0;
  for (int level = 1; level <= options.max_level; ++level) {
    const int cells = options.base_cells << level;
    auto fine = detail::march_level(problem, steps, unique_times, cells, 1 << level, options);
    // Second order in Δr and Δt with both halved: error(fine) ≈ (fine − coarse)/(4 − 1).
    // A latent-heat kink makes the scheme first order at best: error(fine) ≈ (fine − coarse).
    estimate = max_difference(fine.samples, coarse.samples) / (phase_change ? 1.0 : 3.0);
    // Accept from level 2 on: the 10-cell level-0 grid is too coarse to be in the asymptotic range.
    if (level >= 2 && estimate <= options.tol_K) return finish(std::move(fine), cells, estimate);
    coarse = std::move(fine);
  }
  throw NotConverged("numeric: self-check error estimate = " + number_text(estimate, 10) + " K at " +
                     std::to_string(options.base_cells << options.max_level) +
                     " cells: above tol_K = " + number_text(options.tol_K, 10));
}

}  // namespace coldcore
