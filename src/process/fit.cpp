#include "coldcore/process/fit.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <optional>

#include <Eigen/Dense>
#include <boost/math/distributions/students_t.hpp>
#include <unsupported/Eigen/LevenbergMarquardt>

#include "coldcore/error.hpp"
#include "coldcore/model/limits.hpp"
#include "process/detail/parallel.hpp"
#include "process/detail/fit_parts.hpp"

namespace coldcore::process {

namespace {

constexpr double kStep = 1e-3;          // forward-difference step in ln θ
constexpr double kStepInitial = 0.01;  // and in a probe's initial temperature, K

/// Which parameters are free and how they map onto the stages.
struct Layout {
  std::vector<FittedH> groups;
  std::vector<int> free_groups;  ///< indices into groups fitted now
  bool alpha_free = true;
  double alpha = 0;              ///< when not free
};

struct Model {
  const FitInput& in;
  Layout layout;
  int n = 0;
  std::vector<double> initial_C;  ///< per probe

  /// α and the free h groups (the physical parameters), then one initial temperature per probe.
  int shared() const { return (layout.alpha_free ? 1 : 0) + static_cast<int>(layout.free_groups.size()); }
  int parameters() const { return shared() + static_cast<int>(in.probes.size()); }
  int first_row(std::size_t probe) const {
    int r = 0;
    for (std::size_t i = 0; i < probe; ++i) r += static_cast<int>(in.probes[i].time_s.size());
    return r;
  }

  /// α and the stages' h for parameter vector x.
  std::pair<Product, std::vector<Stage>> apply(const Eigen::VectorXd& x) const {
    Product p = in.product;
    const double rho_cp = p.properties.density_kg_m3 * p.properties.specific_heat_J_kgK;
    int k = 0;
    const auto clamp_alpha = [](double a, double rc) {
      return std::clamp(a, limits::conductivity_W_mK.low / rc, limits::conductivity_W_mK.high / rc);
    };
    // Within the accepted ranges of model/limits.hpp: a wild trial step (bad data) must not reach
    // the engine with a value it refuses; a fit that ends at a limit is reported as such.
    const double alpha = layout.alpha_free ? clamp_alpha(std::exp(x[k++]), rho_cp) : layout.alpha;
    p.properties.conductivity_W_mK = alpha * rho_cp;
    std::vector<Stage> st = in.stages;
    for (const FittedH& g : layout.groups)
      for (int s : g.stages) st[static_cast<std::size_t>(s)].h_W_m2K = g.h_W_m2K;
    for (int gi : layout.free_groups) {
      const double h = std::clamp(std::exp(x[k++]), limits::h_W_m2K.low, limits::h_W_m2K.high);
      for (int s : layout.groups[static_cast<std::size_t>(gi)].stages) st[static_cast<std::size_t>(s)].h_W_m2K = h;
    }
    return {p, st};
  }

  /// Residuals model − measured at every reading of every probe, probe by probe.
  Eigen::VectorXd residuals(const Eigen::VectorXd& x, std::vector<std::vector<double>>* curves = nullptr) const {
    const auto applied = apply(x);  // named members: a lambda may not capture structured bindings (C++20, clang < 16)
    const Product& p = applied.first;
    const std::vector<Stage>& st = applied.second;
    std::vector<std::vector<double>> model(in.probes.size());
    detail::for_each_index(in.probes.size(), [&](std::size_t i) {
      const ProbeCurve& c = in.probes[i];
      model[i] = model_curve(p, st, x[shared() + static_cast<Eigen::Index>(i)], c.time_s, in.engine);
    });
    Eigen::VectorXd r(n);
    int k = 0;
    for (std::size_t i = 0; i < in.probes.size(); ++i)
      for (std::size_t j = 0; j < in.probes[i].time_s.size(); ++j) r[k++] = model[i][j] - in.probes[i].temp_C[j];
    if (curves) *curves = std::move(model);
    return r;
  }

  /// Forward differences: ln θ columns re-run every probe; a probe's initial temperature moves
  /// only its own rows (the response is linear in it, so the step is exact).
  Eigen::MatrixXd jacobian(const Eigen::VectorXd& x, const Eigen::VectorXd& r0) const {
    Eigen::MatrixXd J = Eigen::MatrixXd::Zero(n, x.size());
    for (Eigen::Index c = 0; c < shared(); ++c) {
      Eigen::VectorXd xs = x;
      xs[c] += kStep;
      J.col(c) = (residuals(xs) - r0) / kStep;
    }
    const auto applied = apply(x);  // named members: a lambda may not capture structured bindings (C++20, clang < 16)
    const Product& p = applied.first;
    const std::vector<Stage>& st = applied.second;
    detail::for_each_index(in.probes.size(), [&](std::size_t i) {
      const ProbeCurve& c = in.probes[i];
      const Eigen::Index col = shared() + static_cast<Eigen::Index>(i);
      const std::vector<double> moved = model_curve(p, st, x[col] + kStepInitial, c.time_s, in.engine);
      const int row0 = first_row(i);
      for (std::size_t j = 0; j < c.time_s.size(); ++j) {
        const Eigen::Index row = row0 + static_cast<Eigen::Index>(j);
        J(row, col) = (moved[j] - c.temp_C[j] - r0[row]) / kStepInitial;
      }
    });
    return J;
  }
};

struct LmFunctor : Eigen::DenseFunctor<double> {
  const Model& m;
  LmFunctor(const Model& model, int params) : DenseFunctor<double>(params, model.n), m(model) {}
  int operator()(const InputType& x, ValueType& f) const {
    f = m.residuals(x);
    return 0;
  }
  int df(const InputType& x, JacobianType& J) const {
    J = m.jacobian(x, m.residuals(x));
    return 0;
  }
};

struct Solution {
  Eigen::VectorXd x;
  Eigen::VectorXd r;
  double ssr = 0;
  int iterations = 0;
  bool converged = false;
};

Solution minimise(const Model& m, Eigen::VectorXd x) {
  Solution s;
  if (x.size() > 0) {
    LmFunctor f(m, static_cast<int>(x.size()));
    Eigen::LevenbergMarquardt<LmFunctor> lm(f);
    lm.setXtol(1e-8);
    lm.setFtol(1e-10);
    lm.setMaxfev(200);
    const auto status = lm.minimize(x);
    s.iterations = static_cast<int>(lm.nfev());
    using namespace Eigen::LevenbergMarquardtSpace;
    s.converged = status == RelativeReductionTooSmall || status == RelativeErrorTooSmall ||
                  status == RelativeErrorAndReductionTooSmall || status == CosinusTooSmall ||
                  status == FtolTooSmall || status == XtolTooSmall || status == GtolTooSmall;
  } else {
    s.converged = true;
  }
  s.x = x;
  s.r = m.residuals(x);
  s.ssr = s.r.squaredNorm();
  return s;
}

Eigen::VectorXd start_vector(const Model& m, double alpha) {
  Eigen::VectorXd x(m.parameters());
  int k = 0;
  if (m.layout.alpha_free) x[k++] = std::log(alpha);
  for (int gi : m.layout.free_groups) x[k++] = std::log(m.layout.groups[static_cast<std::size_t>(gi)].h_W_m2K);
  for (double t0 : m.initial_C) x[k++] = t0;
  return x;
}

/// Stores the solution's values into the layout (α and every free group's h).
void store(Model& m, const Eigen::VectorXd& x) {
  int k = 0;
  const ThermalProperties& tp = m.in.product.properties;
  const double rho_cp = tp.density_kg_m3 * tp.specific_heat_J_kgK;
  if (m.layout.alpha_free)
    m.layout.alpha = std::clamp(std::exp(x[k++]), limits::conductivity_W_mK.low / rho_cp,
                                limits::conductivity_W_mK.high / rho_cp);
  for (int gi : m.layout.free_groups)
    m.layout.groups[static_cast<std::size_t>(gi)].h_W_m2K =
        std::clamp(std::exp(x[k++]), limits::h_W_m2K.low, limits::h_W_m2K.high);
  for (double& t0 : m.initial_C) t0 = x[k++];
}

/// Smallest h of group `gi` whose profiled SSR stays within `limit` (α and the other groups
/// refitted at each trial): bisection in ln h below the optimum.
double profile_lower_bound(const Model& fitted, int gi, double limit) {
  Model m = fitted;
  m.layout.free_groups.erase(std::find(m.layout.free_groups.begin(), m.layout.free_groups.end(), gi));
  const double h_hat = fitted.layout.groups[static_cast<std::size_t>(gi)].h_W_m2K;
  const auto ssr_at = [&](double h) {
    Model t = m;
    t.layout.groups[static_cast<std::size_t>(gi)].h_W_m2K = h;
    return minimise(t, start_vector(t, fitted.layout.alpha)).ssr;
  };
  double inside = std::log(h_hat), outside = inside;
  // Step down a decade at a time until the fit is clearly worse (or h is absurdly small).
  for (int i = 0; i < 8; ++i) {
    outside -= std::log(10.0);
    if (ssr_at(std::exp(outside)) > limit) break;
    inside = outside;
  }
  for (int i = 0; i < 9; ++i) {  // 9 halvings of a decade: 0.5 % in h (rounded toward the fit, inside)
    const double mid = 0.5 * (inside + outside);
    (ssr_at(std::exp(mid)) > limit ? outside : inside) = mid;
  }
  return std::exp(inside);
}

/// Biot number of every study stage at parameters x (from one cheap run of the engine).
std::vector<double> stage_biots(const Model& m, const Eigen::VectorXd& x) {
  const auto [p0, st] = m.apply(x);
  Product p = p0;
  p.initial_C = m.initial_C.front();
  HistoryOptions quick;
  quick.tol_K = 1e-2;
  const History h = simulate(p, st, quick);
  std::vector<double> out;
  for (const StageRecord& r : h.stages) out.push_back(r.biot);
  return out;
}

}  // namespace

FitResult fit_study(const FitInput& in) {
  if (in.probes.empty()) throw InputError("fit: no probe curve to fit");
  Model m{in, {}, 0, {}};
  for (const ProbeCurve& c : in.probes) {
    if (c.time_s.size() < 3)
      throw InputError("fit: probe " + c.name + " has " + std::to_string(c.time_s.size()) +
                       " readings: at least 3 are needed");
    m.n += static_cast<int>(c.time_s.size());
  }
  const ThermalProperties& tp = in.product.properties;
  const double window_s = 0.02 * std::pow(smallest_half_dimension_m(in.product), 2) / tp.diffusivity_m2_s();
  for (const ProbeCurve& c : in.probes) m.initial_C.push_back(detail::initial_of(c, window_s));
  const double rho_cp = tp.density_kg_m3 * tp.specific_heat_J_kgK;
  FitResult res;
  res.alpha_start_m2_s = tp.diffusivity_m2_s();
  m.layout.groups = detail::stage_groups(
      in.stages, in.heating.size() == in.stages.size() ? in.heating : heating_stages(in.stages, in.product.initial_C));
  m.layout.alpha = res.alpha_start_m2_s;
  for (int g = 0; g < static_cast<int>(m.layout.groups.size()); ++g)
    if (m.layout.groups[static_cast<std::size_t>(g)].status == HStatus::fitted) m.layout.free_groups.push_back(g);
  if (m.n < m.parameters() + 2)
    throw InputError("fit: " + std::to_string(m.n) + " readings for " + std::to_string(m.parameters()) +
                     " parameters: at least parameters + 2 are needed");

  Solution sol = minimise(m, start_vector(m, res.alpha_start_m2_s));
  store(m, sol.x);
  res.iterations = sol.iterations;
  res.converged = sol.converged;

  // Identifiability of each h group, from the Jacobian at the optimum.
  Eigen::MatrixXd J = m.jacobian(sol.x, sol.r);
  int dof = m.n - m.parameters();
  double t95 = boost::math::quantile(boost::math::students_t(std::max(dof, 1)), 0.975);
  Eigen::MatrixXd cov = (J.transpose() * J).completeOrthogonalDecomposition().pseudoInverse() * (sol.ssr / dof);
  const double ssr_limit = sol.ssr * (1.0 + t95 * t95 / dof);
  std::vector<int> fixed_now;
  std::optional<std::pair<Eigen::VectorXd, Eigen::MatrixXd>> span_top;  // the fit with bounded h at the top
  {
    const std::vector<double> biots = stage_biots(m, sol.x);
    int k = m.layout.alpha_free ? 1 : 0;
    for (int gi : m.layout.free_groups) {
      FittedH& g = m.layout.groups[static_cast<std::size_t>(gi)];
      g.biot = biots[static_cast<std::size_t>(g.stages.front())];
      const double se = std::sqrt(std::max(cov(k, k), 0.0));
      // High Bi first: there h ran off toward infinity (up to the limit, where the readings no
      // longer move with it); elsewhere a change of h that moves no reading by 1 mK means no
      // reading depends on this group.
      const bool high = g.biot > kHighBiot || g.h_W_m2K >= limits::h_W_m2K.high * 0.9999;
      if (!high && J.col(k).cwiseAbs().maxCoeff() < 1e-3) {
        g.status = HStatus::not_identified;
        g.h_W_m2K = g.h_start_W_m2K;
        fixed_now.push_back(gi);
      } else if (high || !std::isfinite(se) || 2 * t95 * se > std::log(100.0)) {
        g.status = HStatus::lower_bound;
        fixed_now.push_back(gi);
      }
      ++k;
    }
  }
  if (!fixed_now.empty()) {
    for (int gi : fixed_now) {
      FittedH& g = m.layout.groups[static_cast<std::size_t>(gi)];
      if (g.status == HStatus::lower_bound) g.h_W_m2K = profile_lower_bound(m, gi, ssr_limit);
    }
    for (int gi : fixed_now)
      m.layout.free_groups.erase(std::find(m.layout.free_groups.begin(), m.layout.free_groups.end(), gi));
    sol = minimise(m, start_vector(m, m.layout.alpha));
    store(m, sol.x);
    res.iterations += sol.iterations;
    res.converged = res.converged && sol.converged;
    J = m.jacobian(sol.x, sol.r);
    dof = m.n - m.parameters();
    t95 = boost::math::quantile(boost::math::students_t(std::max(dof, 1)), 0.975);
    cov = (J.transpose() * J).completeOrthogonalDecomposition().pseudoInverse() * (sol.ssr / dof);
    // With an h held at its lower bound the other parameters' intervals would be conditional on
    // that one value; any larger h fits as well, so they span the fit at the bound and the fit
    // with that h at the top of its range (a surface at the medium, in effect).
    bool any_bound = false;
    Model top = m;
    for (int gi : fixed_now)
      if (m.layout.groups[static_cast<std::size_t>(gi)].status == HStatus::lower_bound) {
        top.layout.groups[static_cast<std::size_t>(gi)].h_W_m2K = limits::h_W_m2K.high;
        any_bound = true;
      }
    if (any_bound) {
      const Solution st = minimise(top, start_vector(top, m.layout.alpha));
      const Eigen::MatrixXd Jt = top.jacobian(st.x, st.r);
      const Eigen::MatrixXd ct = (Jt.transpose() * Jt).completeOrthogonalDecomposition().pseudoInverse() * (st.ssr / dof);
      span_top = std::make_pair(st.x, ct);
      res.intervals_span_bound = true;
    }
  }

  // The result.
  res.alpha_m2_s = m.layout.alpha;
  res.conductivity_W_mK = m.layout.alpha * rho_cp;
  res.alpha_se_log = std::sqrt(std::max(cov(0, 0), 0.0));
  res.alpha_ci95_m2_s = {res.alpha_m2_s * std::exp(-t95 * res.alpha_se_log),
                         res.alpha_m2_s * std::exp(t95 * res.alpha_se_log)};
  // The interval of parameter k (a log) widened to cover the top fit's interval too.
  const auto widened = [&](Eigen::Index k, std::array<double, 2> ci) {
    if (!span_top) return ci;
    const double x = span_top->first[k], se = std::sqrt(std::max(span_top->second(k, k), 0.0));
    return std::array<double, 2>{std::min(ci[0], std::exp(x - t95 * se)), std::max(ci[1], std::exp(x + t95 * se))};
  };
  res.alpha_ci95_m2_s = widened(0, res.alpha_ci95_m2_s);
  // A widened interval widens the standard error the covariance carries (scale[k] ≥ 1), so the
  // bound run and solve draw from the calibration is as wide as the intervals shown.
  std::vector<double> scale(static_cast<std::size_t>(m.shared()), 1.0);
  const auto widen_se = [&](Eigen::Index k, double value, const std::array<double, 2>& ci, double& se_log) {
    const double half = std::max(std::log(value / ci[0]), std::log(ci[1] / value)) / t95;
    if (se_log > 0 && half > se_log) {
      scale[static_cast<std::size_t>(k)] = half / se_log;
      se_log = half;
    }
  };
  widen_se(0, res.alpha_m2_s, res.alpha_ci95_m2_s, res.alpha_se_log);
  res.parameters = {"alpha"};
  {
    const std::vector<double> biots = stage_biots(m, sol.x);
    int k = 1;
    for (int gi = 0; gi < static_cast<int>(m.layout.groups.size()); ++gi) {
      FittedH& g = m.layout.groups[static_cast<std::size_t>(gi)];
      g.biot = biots[static_cast<std::size_t>(g.stages.front())];
      if (std::find(m.layout.free_groups.begin(), m.layout.free_groups.end(), gi) == m.layout.free_groups.end()) continue;
      g.se_log = std::sqrt(std::max(cov(k, k), 0.0));
      g.ci95_W_m2K = widened(k, {g.h_W_m2K * std::exp(-t95 * g.se_log), g.h_W_m2K * std::exp(t95 * g.se_log)});
      widen_se(k, g.h_W_m2K, g.ci95_W_m2K, g.se_log);
      res.parameters.push_back("h:" + std::to_string(gi));
      ++k;
    }
  }
  res.h = m.layout.groups;
  const auto at_edge = [](double v, const limits::Range& r) { return v <= r.low * 1.0001 || v >= r.high * 0.9999; };
  res.at_limit = at_edge(res.conductivity_W_mK, limits::conductivity_W_mK);
  for (const FittedH& g : res.h)
    if (g.status == HStatus::fitted && at_edge(g.h_W_m2K, limits::h_W_m2K)) res.at_limit = true;
  const auto p = static_cast<std::size_t>(m.shared());  // the physical block; the initial temperatures are nuisance
  res.covariance_log.assign(p, std::vector<double>(p, 0.0));
  res.correlation.assign(p, std::vector<double>(p, 0.0));
  for (std::size_t a = 0; a < p; ++a)
    for (std::size_t b = 0; b < p; ++b) {
      const auto ia = static_cast<Eigen::Index>(a), ib = static_cast<Eigen::Index>(b);
      res.covariance_log[a][b] = cov(ia, ib) * scale[a] * scale[b];
      const double d = std::sqrt(cov(ia, ia) * cov(ib, ib));
      res.correlation[a][b] = d > 0 ? cov(ia, ib) / d : (a == b ? 1.0 : 0.0);
    }
  res.n_points = m.n;
  res.n_parameters = m.parameters();
  res.dof = dof;
  res.t95 = t95;
  res.rms_K = std::sqrt(sol.ssr / m.n);
  std::vector<std::vector<double>> curves;
  m.residuals(sol.x, &curves);
  for (std::size_t i = 0; i < in.probes.size(); ++i) {
    const ProbeCurve& c = in.probes[i];
    ProbeFit pf;
    pf.name = c.name;
    pf.time_s = c.time_s;
    pf.measured_C = c.temp_C;
    pf.model_C = curves[i];
    double ss = 0;
    for (std::size_t j = 0; j < c.time_s.size(); ++j) ss += (pf.model_C[j] - c.temp_C[j]) * (pf.model_C[j] - c.temp_C[j]);
    pf.rms_K = std::sqrt(ss / static_cast<double>(c.time_s.size()));
    pf.initial_C = m.initial_C[i];
    res.probes.push_back(std::move(pf));
  }
  return res;
}

}  // namespace coldcore::process
