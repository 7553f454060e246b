// What the fit rests on besides the minimisation (fit.cpp): the h groups and the probes' initial
// temperatures it starts from, the engine's accuracy for finite differences, the model curve at
// the readings' times, and the calibration a fit writes.
#include <algorithm>
#include <map>
#include <utility>
#include <string>
#include <vector>

#include "coldcore/process/fit.hpp"
#include "process/detail/fit_parts.hpp"

namespace coldcore::process {

namespace detail {

std::vector<FittedH> stage_groups(const std::vector<Stage>& stages, const std::vector<bool>& heats) {
  std::vector<FittedH> groups;
  std::map<std::pair<double, bool>, int> by_h;
  for (int i = 0; i < static_cast<int>(stages.size()); ++i) {
    const Stage& s = stages[static_cast<std::size_t>(i)];
    if (s.h_infinite) {
      if (groups.empty() || groups.back().status != HStatus::fixed_infinite || groups.back().stages.back() != i - 1) {
        FittedH g;
        g.status = HStatus::fixed_infinite;
        g.h_W_m2K = g.h_start_W_m2K = s.h_W_m2K;
        groups.push_back(g);
      }
      groups.back().stages.push_back(i);
      continue;
    }
    const std::pair<double, bool> key{s.h_W_m2K, heats[static_cast<std::size_t>(i)]};
    auto it = by_h.find(key);
    if (it == by_h.end()) {
      FittedH g;
      g.h_W_m2K = g.h_start_W_m2K = s.h_W_m2K;
      groups.push_back(g);
      it = by_h.emplace(key, static_cast<int>(groups.size()) - 1).first;
    }
    groups[static_cast<std::size_t>(it->second)].stages.push_back(i);
  }
  return groups;
}

/// A probe's initial temperature: the mean of its readings while the centre cannot yet have
/// moved (Fo <= 0.02 at the file's α: the centre is then within 1e-6 of its start), so one
/// noisy first reading does not bias the whole fit.
double initial_of(const ProbeCurve& c, double window_s) {
  double sum = 0;
  int n = 0;
  for (std::size_t i = 0; i < c.time_s.size() && (i == 0 || c.time_s[i] <= window_s); ++i, ++n) sum += c.temp_C[i];
  return sum / n;
}

}  // namespace detail

HistoryOptions FitInput::fit_engine_options() {
  // Finite differences of the model need it far smoother than the readings' noise (0.1 K):
  // 1e-4 K against a parameter step of 1e-3 in ln θ is 0.1 K per unit of ln θ, under 1 % of the
  // readings' sensitivity to α or h (tens of kelvin per unit). The coverage benchmark
  // (coldcore_bench --case fit-coverage) gives the same intervals as at 1e-5 K.
  HistoryOptions o;
  o.tol_K = 1e-4;
  o.sample_tol_K = 0.05;
  return o;
}

Calibration calibration_of(const FitResult& fit, const std::vector<std::string>& stage_names,
                           const std::string& design_probe, const std::string& date,
                           const std::vector<std::string>& study) {
  Calibration c;
  c.alpha_m2_s = fit.alpha_m2_s;
  c.alpha_ci95_m2_s = fit.alpha_ci95_m2_s;
  for (const FittedH& g : fit.h) {
    if (g.status == HStatus::fixed_infinite) continue;
    CalibratedH ch;
    for (int i : g.stages) ch.stages.push_back(stage_names[static_cast<std::size_t>(i)]);
    ch.status = g.status == HStatus::fitted        ? CalibratedHStatus::fitted
                : g.status == HStatus::lower_bound ? CalibratedHStatus::lower_bound
                                                   : CalibratedHStatus::not_identified;
    ch.h_W_m2K = g.h_W_m2K;
    ch.ci95_W_m2K = g.ci95_W_m2K;
    c.h.push_back(std::move(ch));
  }
  c.covariance_log = fit.covariance_log;
  c.dof = fit.dof;
  c.rms_K = fit.rms_K;
  c.n_points = fit.n_points;
  c.design_probe = design_probe;
  c.date = date;
  c.study = study;
  return c;
}

std::vector<double> model_curve(const Product& product, const std::vector<Stage>& stages, double initial_C,
                                const std::vector<double>& time_s, const HistoryOptions& engine) {
  Product p = product;
  p.initial_C = initial_C;
  const History h = simulate(p, stages, engine);
  std::vector<double> out;
  out.reserve(time_s.size());
  // Readings at the engine's own sample times (a probe logged with the medium) are read off the
  // samples; others are evaluated exactly. Both are the same exact series.
  std::size_t k = 0;
  for (double t : time_s) {
    const double tc = std::clamp(t, 0.0, h.end_s());
    while (k + 1 < h.samples.size() && h.samples[k + 1].time_s <= tc) ++k;
    out.push_back(h.samples[k].time_s == tc ? h.samples[k].centre_C : h.evaluate(tc).centre_C);
  }
  return out;
}

}  // namespace coldcore::process
