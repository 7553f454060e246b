// Axis ticks at "nice" numbers and the dash patterns of the plots (svg_plot.hpp).
#include "coldcore/report/svg_plot.hpp"

#include <cassert>
#include <cmath>
#include <utility>

namespace coldcore::svg {

std::string_view dash_array(Dash d) {
  switch (d) {
    case Dash::solid: return "";
    case Dash::dashed: return "7 4";
    case Dash::dotted: return "1.5 3";
    case Dash::dash_dot: return "8 3 2 3";
    case Dash::long_dash: return "12 4";
    case Dash::short_dash: return "3 2";
  }
  return "";
}

double nice_number(double x, bool round) {
  assert(x > 0 && std::isfinite(x));
  const double expv = std::floor(std::log10(x));
  const double p = std::pow(10.0, expv);
  const double f = x / p;
  double nf;
  if (round)
    nf = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
  else
    nf = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
  return nf * p;
}

Ticks nice_ticks(double lo, double hi, int target_count) {
  assert(std::isfinite(lo) && std::isfinite(hi) && target_count >= 2);
  if (hi < lo) std::swap(lo, hi);
  if (hi - lo <= 1e-12 * std::max(1.0, std::fabs(lo))) {
    // A flat series still needs an axis: a unit-sized range around it.
    const double half = std::max(0.5, std::fabs(lo) * 0.05);
    lo -= half;
    hi += half;
  }
  Ticks t;
  const double range = nice_number(hi - lo, false);
  t.step = nice_number(range / (target_count - 1), true);
  t.first = std::floor(lo / t.step + 1e-9) * t.step;
  t.last = std::ceil(hi / t.step - 1e-9) * t.step;
  t.decimals = std::max(0, static_cast<int>(-std::floor(std::log10(t.step) + 1e-9)));
  const int n = static_cast<int>(std::lround((t.last - t.first) / t.step));
  for (int i = 0; i <= n; ++i) t.values.push_back(t.first + i * t.step);
  return t;
}

}  // namespace coldcore::svg
