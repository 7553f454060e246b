#pragma once
// Level crossings of a temperature curve (private). A curve is a function plus knots (the
// points between which it is smooth: engine samples, or the rows of a linearly interpolated log)
// and a number of probes per knot interval used to catch excursions inside one interval.
#include <algorithm>
#include <boost/math/tools/toms748_solve.hpp>
#include <cstdint>
#include <functional>
#include <optional>
#include <span>
#include <vector>

namespace coldcore::detail {

struct Curve {
  std::function<double(double)> temp_C_at;
  std::vector<double> knots;  ///< sorted, size >= 2
  int probes = 1;             ///< sub-steps per knot interval (1 for a linear log)

  double start() const { return knots.front(); }
  double end() const { return knots.back(); }

  /// Probe times in [from, end], increasing, starting with `from`.
  std::vector<double> grid(double from) const {
    std::vector<double> g{from};
    for (std::size_t i = 0; i + 1 < knots.size(); ++i) {
      const double a = knots[i], b = knots[i + 1];
      if (b <= from) continue;
      for (int j = 1; j <= probes; ++j) {
        const double t = (j == probes) ? b : a + (b - a) * j / probes;
        if (t > g.back()) g.push_back(t);
      }
    }
    return g;
  }

  /// Root of T(t) = level in [a, b] where T(a) and T(b) bracket it (toms748, to 1e-9 s or
  /// machine precision of t).
  double refine(double a, double b, double level) const {
    auto f = [&](double t) { return temp_C_at(t) - level; };
    const double fa = f(a), fb = f(b);
    if (fb == 0) return b;
    if (fa == 0) return a;
    std::uintmax_t iters = 200;
    auto tol = [](double x, double y) { return std::abs(x - y) <= 1e-9 + 1e-15 * std::abs(x); };
    auto r = boost::math::tools::toms748_solve(f, a, b, fa, fb, tol, iters);
    // For a falling curve return the later bound (T <= level there): conservative for clocks.
    return fb <= 0 ? r.second : r.first;
  }

  /// First time >= from at which the curve falls to or below `level` from above:
  /// T(t−) > level and T(t) <= level. nullopt if it never does.
  std::optional<double> first_fall_through(double level, double from) const {
    const auto g = grid(from);
    double Ta = temp_C_at(g[0]);
    for (std::size_t i = 0; i + 1 < g.size(); ++i) {
      const double Tb = temp_C_at(g[i + 1]);
      if (Ta > level && Tb <= level) return refine(g[i], g[i + 1], level);
      Ta = Tb;
    }
    return std::nullopt;
  }

  /// First time >= from at which T <= level (from itself when T(from) <= level).
  std::optional<double> first_at_or_below(double level, double from) const {
    if (temp_C_at(from) <= level) return from;
    return first_fall_through(level, from);
  }

  /// Maximal intervals within [from, end] where T >= level, as (start, end) pairs.
  std::vector<std::pair<double, double>> intervals_at_or_above(double level, double from) const {
    return intervals_at_or_above(level, sample(from));
  }

  /// The probe grid from `from` with the temperature at each of its times.
  struct Sampled {
    std::vector<double> t, T;
  };
  Sampled sample(double from) const {
    Sampled s{grid(from), {}};
    s.T.reserve(s.t.size());
    for (double t : s.t) s.T.push_back(temp_C_at(t));
    return s;
  }

  /// As above on a grid sampled once: several levels read one sampling (the curve is a pure
  /// function of time, so the intervals are the same as sampling anew for each level).
  std::vector<std::pair<double, double>> intervals_at_or_above(double level, const Sampled& s) const {
    std::vector<std::pair<double, double>> out;
    const auto& g = s.t;
    bool inside = s.T[0] >= level;
    double begin = g[0];
    for (std::size_t i = 0; i + 1 < g.size(); ++i) {
      const double Tb = s.T[i + 1];
      const bool now = Tb >= level;
      if (now == inside) continue;
      const double t = refine(g[i], g[i + 1], level);
      if (now) {
        begin = t;
      } else {
        out.emplace_back(begin, t);
      }
      inside = now;
    }
    if (inside) out.emplace_back(begin, g.back());
    return out;
  }

  /// Maximum of T on the probe grid, and its (last) time.
  std::pair<double, double> max_on_grid() const {
    const auto g = grid(start());
    double best = temp_C_at(g[0]), at = g[0];
    for (double t : g) {
      const double v = temp_C_at(t);
      if (v >= best) {
        best = v;
        at = t;
      }
    }
    return {best, at};
  }
};

/// A curve that interpolates a log linearly between rows.
inline Curve linear_log_curve(std::span<const double> times_s, std::span<const double> temps_C) {
  Curve c;
  c.knots.assign(times_s.begin(), times_s.end());
  std::vector<double> T(temps_C.begin(), temps_C.end());
  std::vector<double> ts = c.knots;
  c.temp_C_at = [ts, T](double t) {
    if (t <= ts.front()) return T.front();
    if (t >= ts.back()) return T.back();
    const auto hi = std::upper_bound(ts.begin(), ts.end(), t);
    const std::size_t j = static_cast<std::size_t>(hi - ts.begin());
    const double w = (t - ts[j - 1]) / (ts[j] - ts[j - 1]);
    return T[j - 1] + w * (T[j] - T[j - 1]);
  };
  c.probes = 1;
  return c;
}

}  // namespace coldcore::detail
