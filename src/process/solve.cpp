#include "coldcore/process/solve.hpp"

#include <cmath>
#include <cstdint>
#include <sstream>

#include <boost/math/tools/toms748_solve.hpp>

#include "coldcore/error.hpp"

#include "process/detail/inverse_text.hpp"

namespace coldcore::process {

namespace {

using detail::num;

}  // namespace

RootResult solve_margin(const std::function<double(double)>& margin, double lo, double hi, FeasibleSide side,
                        const RootOptions& opts, const std::string& why_none) {
  if (!(std::isfinite(lo) && std::isfinite(hi) && lo < hi))
    throw InputError("solve bracket = [" + num(lo) + ", " + num(hi) + "]: must be finite with lo < hi");
  RootResult r;
  const auto eval = [&](double x) {
    const double m = margin(x);
    ++r.evaluations;
    r.trials.push_back({x, m});
    if (std::isnan(m)) throw NotConverged("solve: the forward model returned no margin (NaN) at x = " + num(x));
    return m;
  };
  const bool above = side == FeasibleSide::above;
  // The bound on the infeasible side first: if it already meets the targets, that is the answer.
  double inf_x = above ? lo : hi;
  double inf_m = eval(inf_x);
  if (inf_m >= 0) {
    r.x = r.other_x = inf_x;
    r.margin = inf_m;
    r.met_at_bound = true;
    return r;
  }
  double feas_x = above ? hi : lo;
  double feas_m = eval(feas_x);
  if (opts.expand) {
    const bool limit_ok = above ? opts.limit >= feas_x : opts.limit <= feas_x;
    if (!std::isfinite(opts.limit) || !limit_ok)
      throw InputError("solve limit = " + num(opts.limit) + ": must lie beyond the bracket's feasible end " +
                       num(feas_x));
    // Double the distance from the infeasible end until feasible or at the limit; each failed
    // trial becomes the new infeasible end, so the final bracket is as tight as the trials allow.
    while (feas_m < 0 && feas_x != opts.limit) {
      inf_x = feas_x;
      inf_m = feas_m;
      const double span = std::abs(feas_x - (above ? lo : hi));  // distance from the fixed end doubles
      double next = above ? feas_x + span : feas_x - span;
      if (above ? next > opts.limit : next < opts.limit) next = opts.limit;
      feas_x = next;
      feas_m = eval(feas_x);
    }
  }
  if (feas_m < 0)
    throw NoSolution(why_none + " (margin at the search bound " + num(feas_x) + ": " + num(feas_m) + ")");
  if (feas_m == 0) {
    r.x = feas_x;
    r.other_x = inf_x;
    r.margin = 0;
    return r;
  }
  double a = std::min(inf_x, feas_x), b = std::max(inf_x, feas_x);
  double fa = above ? inf_m : feas_m, fb = above ? feas_m : inf_m;
  std::uintmax_t iters = static_cast<std::uintmax_t>(opts.max_iterations);
  const auto tol = [&](double x0, double x1) {
    return std::abs(x1 - x0) <= opts.rel_tol * std::max(std::abs(x0), std::abs(x1)) + opts.abs_tol;
  };
  // toms748 keeps a sign-changing bracket; it may evaluate a point exactly at a root (f = 0), in
  // which case it returns a degenerate bracket there.
  const auto br = boost::math::tools::toms748_solve(eval, a, b, fa, fb, tol, iters);
  if (iters >= static_cast<std::uintmax_t>(opts.max_iterations) && !tol(br.first, br.second))
    throw NotConverged("solve: toms748 did not narrow the bracket [" + num(br.first) + ", " + num(br.second) +
                       "] within " + std::to_string(opts.max_iterations) + " iterations");
  // The feasible end of the final bracket; its margin is looked up among the trials (toms748
  // evaluated it) or evaluated once more.
  r.x = above ? br.second : br.first;
  r.other_x = above ? br.first : br.second;
  double mx = NAN;
  for (auto it = r.trials.rbegin(); it != r.trials.rend(); ++it)
    if (it->x == r.x) {
      mx = it->margin;
      break;
    }
  if (std::isnan(mx)) mx = eval(r.x);
  if (mx < 0)  // a non-monotone model: say so rather than return the infeasible side
    throw NotConverged("solve: the margin is not monotone near x = " + num(r.x) + " (margin " + num(mx) + ")");
  r.margin = mx;
  return r;
}

double round_to_unit(double x, double unit, FeasibleSide side) {
  if (!(unit > 0) || !std::isfinite(unit)) throw InputError("rounding unit = " + num(unit) + ": must be > 0");
  const double q = x / unit;
  const double nearest = std::round(q);
  if (std::abs(q - nearest) <= 1e-9 * std::max(1.0, std::abs(q))) return nearest * unit;
  return (side == FeasibleSide::above ? std::ceil(q) : std::floor(q)) * unit;
}

}  // namespace coldcore::process
