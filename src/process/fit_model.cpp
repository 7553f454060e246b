// What the fit rests on besides the minimisation (fit.cpp): the engine's accuracy for finite
// differences, the model curve at the readings' times, and the calibration a fit writes.
#include <algorithm>
#include <string>
#include <vector>

#include "coldcore/process/fit.hpp"

namespace coldcore::process {

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
