#include "coldcore/process/fit_bound.hpp"

#include <algorithm>
#include <cmath>

#include <boost/math/distributions/students_t.hpp>

namespace coldcore::process {

Scenario shifted_scenario(const Scenario& s, const Calibration& c, const std::vector<double>& d) {
  Scenario out = s;
  if (d.empty()) return out;
  out.product.properties.conductivity_W_mK *= std::exp(d[0]);
  std::size_t k = 1;
  for (const CalibratedH& g : c.h) {
    if (g.status != CalibratedHStatus::fitted) continue;
    const double f = std::exp(d[k++]);
    for (Stage& st : out.stages)
      if (std::find(g.stages.begin(), g.stages.end(), st.name) != g.stages.end()) st.h_W_m2K *= f;
  }
  return out;
}

std::vector<double> fit_gradient(const Calibration& c, const std::function<double(const std::vector<double>&)>& q,
                                 double q0) {
  const std::size_t p = c.parameters();
  std::vector<double> g(p, 0.0);
  for (std::size_t i = 0; i < p; ++i) {
    const double se = std::sqrt(c.covariance_log[i][i]);
    if (!(se > 0)) continue;
    std::vector<double> d(p, 0.0);
    d[i] = se;
    g[i] = (q(d) - q0) / se;
  }
  return g;
}

double one_sided_t95(const Calibration& c) {
  return boost::math::quantile(boost::math::students_t(std::max(c.dof, 1)), 0.95);
}

std::vector<double> least_favourable_shift(const Calibration& c, const std::vector<double>& g) {
  const std::size_t p = g.size();
  std::vector<double> Cg(p, 0.0);
  double gCg = 0;
  for (std::size_t i = 0; i < p; ++i) {
    for (std::size_t j = 0; j < p; ++j) Cg[i] += c.covariance_log[i][j] * g[j];
    gCg += g[i] * Cg[i];
  }
  std::vector<double> d(p, 0.0);
  if (!(gCg > 0)) return d;
  const double scale = -one_sided_t95(c) / std::sqrt(gCg);
  for (std::size_t i = 0; i < p; ++i) d[i] = scale * Cg[i];
  return d;
}

std::vector<TargetResult> targets_at_fit_bound(const Scenario& s, const Calibration& c, const Libraries& libs) {
  const Evaluation nominal = evaluate(s, libs);
  const std::size_t n = nominal.assessment.targets.size(), p = c.parameters();
  // One forward run per parameter serves every target's gradient.
  std::vector<std::vector<double>> grad(n, std::vector<double>(p, 0.0));
  for (std::size_t i = 0; i < p; ++i) {
    const double se = std::sqrt(c.covariance_log[i][i]);
    if (!(se > 0)) continue;
    std::vector<double> d(p, 0.0);
    d[i] = se;
    const Evaluation e = evaluate(shifted_scenario(s, c, d), libs);
    for (std::size_t t = 0; t < n; ++t)
      grad[t][i] = (target_margin(e.assessment.targets[t]) - target_margin(nominal.assessment.targets[t])) / se;
  }
  std::vector<TargetResult> out;
  for (std::size_t t = 0; t < n; ++t) {
    const std::vector<double> d = least_favourable_shift(c, grad[t]);
    out.push_back(evaluate(shifted_scenario(s, c, d), libs).assessment.targets[t]);
  }
  return out;
}

SolveResult solve_at_fit_bound(Question q, const Scenario& s, const Calibration& c, const Libraries& libs,
                               const SolveOptions& opts, const SolveResult& nominal) {
  // Larger is safer for the size; for hold, chill and medium a larger answer is the cautious one,
  // so the "safer" quantity is its negative.
  const double sign = q == Question::max_size ? 1.0 : -1.0;
  const auto answer = [&](const std::vector<double>& d) {
    return sign * solve(q, shifted_scenario(s, c, d), libs, opts).answer;
  };
  const std::vector<double> g = fit_gradient(c, answer, sign * nominal.answer);
  return solve(q, shifted_scenario(s, c, least_favourable_shift(c, g)), libs, opts);
}

}  // namespace coldcore::process
