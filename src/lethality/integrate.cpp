#include "coldcore/lethality/integrate.hpp"

#include <algorithm>
#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <cmath>
#include <queue>

#include "coldcore/error.hpp"
#include "lethality/detail/crossing.hpp"
#include "lethality/detail/text.hpp"

namespace coldcore {
namespace {

struct Piece {
  double a, b, value, error;
  bool operator<(const Piece& o) const { return error < o.error; }
};

}  // namespace

LethalityResult f_value(const std::function<double(double)>& temp_C_at,
                        std::span<const double> breakpoints_s, const Kinetics& k,
                        const FValueOptions& opts) {
  using GK = boost::math::quadrature::gauss_kronrod<double, 21>;
  LethalityResult out;
  if (breakpoints_s.size() < 2) return out;
  auto rate = [&](double t) {
    ++out.evaluations;
    const double T = temp_C_at(t);
    if (!std::isfinite(T))
      throw Error("f_value: temperature = " + detail::num(T) + " at t = " + detail::num(t) +
                  " s: must be finite");
    return lethal_rate(T, k);
  };
  // max_depth = 0: one Kronrod/Gauss pair per call, error = |K21 − G10|; the adaptivity is ours
  // (global, largest error first) so the tolerance is relative to the whole F, not per piece.
  auto piece = [&](double a, double b) {
    double err = 0;
    const double v = GK::integrate(rate, a, b, 0, 0.0, &err);
    return Piece{a, b, v, err};
  };
  std::vector<double> bps(breakpoints_s.begin(), breakpoints_s.end());
  if (k.split_C && k.z_below_C) {
    // The lethal rate has a kink where T crosses split_C: make every crossing a breakpoint.
    detail::Curve c;
    c.temp_C_at = temp_C_at;
    c.knots = bps;
    c.probes = 4;
    std::vector<double> extra;
    const auto g = c.grid(c.start());
    for (std::size_t i = 0; i + 1 < g.size(); ++i) {
      const double fa = temp_C_at(g[i]) - *k.split_C, fb = temp_C_at(g[i + 1]) - *k.split_C;
      if ((fa < 0) != (fb < 0)) extra.push_back(c.refine(g[i], g[i + 1], *k.split_C));
    }
    bps.insert(bps.end(), extra.begin(), extra.end());
    std::sort(bps.begin(), bps.end());
  }
  std::priority_queue<Piece> queue;
  double total = 0, total_err = 0;
  const int pieces = std::max(1, opts.initial_pieces);
  for (std::size_t i = 0; i + 1 < bps.size(); ++i) {
    const double a = bps[i], b = bps[i + 1];
    if (!(b > a)) continue;
    for (int j = 0; j < pieces; ++j) {
      const double pa = a + (b - a) * j / pieces;
      const double pb = (j + 1 == pieces) ? b : a + (b - a) * (j + 1) / pieces;
      Piece p = piece(pa, pb);
      total += p.value;
      total_err += p.error;
      queue.push(p);
    }
  }
  // Tiny absolute floor: F below 1e-12 s is zero for every purpose here.
  auto done = [&] { return total_err <= opts.rel_tol * std::abs(total) || total_err < 1e-12; };
  while (!done()) {
    if (static_cast<int>(queue.size()) >= opts.max_intervals)
      throw NotConverged("f_value: " + std::to_string(queue.size()) +
                         " subintervals, error estimate " + detail::num(total_err) +
                         " s > rel_tol " + detail::num(opts.rel_tol) + " of F = " +
                         detail::num(total) + " s");
    Piece worst = queue.top();
    queue.pop();
    const double mid = 0.5 * (worst.a + worst.b);
    if (!(mid > worst.a && mid < worst.b))
      throw NotConverged("f_value: subinterval at t = " + detail::num(worst.a) +
                         " s cannot be split further; error estimate " + detail::num(total_err));
    Piece left = piece(worst.a, mid), right = piece(mid, worst.b);
    total += left.value + right.value - worst.value;
    total_err += left.error + right.error - worst.error;
    queue.push(left);
    queue.push(right);
  }
  // Recompute the sums from the pieces to avoid drift from the running updates.
  total = 0;
  total_err = 0;
  while (!queue.empty()) {
    total += queue.top().value;
    total_err += queue.top().error;
    queue.pop();
  }
  out.F_s = total;
  out.error_estimate_s = total_err;
  return out;
}

LethalityResult f_value(const std::function<double(double)>& temp_C_at,
                        std::span<const double> breakpoints_s, const Kinetics& k, double rel_tol) {
  FValueOptions o;
  o.rel_tol = rel_tol;
  return f_value(temp_C_at, breakpoints_s, k, o);
}

void validate_log(std::span<const double> times_s, std::span<const double> temps_C,
                  std::string_view origin) {
  const std::string o(origin);
  if (times_s.size() != temps_C.size())
    throw InputError(o + ": " + std::to_string(times_s.size()) + " times but " +
                     std::to_string(temps_C.size()) + " temperatures: must be equal");
  if (times_s.size() < 2)
    throw InputError(o + ": rows = " + std::to_string(times_s.size()) + ": must be >= 2");
  for (std::size_t i = 0; i < times_s.size(); ++i) {
    if (!std::isfinite(times_s[i]))
      throw InputError(o + ": row " + std::to_string(i + 1) + ": time_s = " +
                       detail::num(times_s[i]) + ": must be finite");
    if (!std::isfinite(temps_C[i]))
      throw InputError(o + ": row " + std::to_string(i + 1) + ": temp_C = " +
                       detail::num(temps_C[i]) + ": must be finite");
    if (i > 0 && !(times_s[i] > times_s[i - 1]))
      throw InputError(o + ": row " + std::to_string(i + 1) + ": time_s = " +
                       detail::num(times_s[i]) + ": must be greater than the previous row's " +
                       detail::num(times_s[i - 1]));
  }
}

LogIntegral f_trapezoid_s(std::span<const double> times_s, std::span<const double> temps_C,
                          const Kinetics& k, std::string_view origin) {
  validate_log(times_s, temps_C, origin);
  LogIntegral out;
  double s = 0;
  double prev = lethal_rate(temps_C[0], k);
  for (std::size_t i = 1; i < times_s.size(); ++i) {
    const double cur = lethal_rate(temps_C[i], k);
    s += 0.5 * (prev + cur) * (times_s[i] - times_s[i - 1]);
    prev = cur;
  }
  out.F_s = s;
  out.notes = check_log_sampling(times_s, temps_C, k);
  return out;
}

std::vector<double> cumulative_f_trapezoid_s(std::span<const double> times_s, std::span<const double> temps_C,
                                             const Kinetics& k, std::string_view origin) {
  validate_log(times_s, temps_C, origin);
  std::vector<double> out(times_s.size(), 0.0);
  double prev = lethal_rate(temps_C[0], k);
  for (std::size_t i = 1; i < times_s.size(); ++i) {
    const double cur = lethal_rate(temps_C[i], k);
    out[i] = out[i - 1] + 0.5 * (prev + cur) * (times_s[i] - times_s[i - 1]);
    prev = cur;
  }
  return out;
}

LogIntegral f_simpson_s(std::span<const double> times_s, std::span<const double> temps_C,
                        const Kinetics& k, std::string_view origin) {
  validate_log(times_s, temps_C, origin);
  const std::size_t n = times_s.size();
  LogIntegral out;
  if (n == 2) {
    out = f_trapezoid_s(times_s, temps_C, k, origin);
    return out;
  }
  std::vector<double> f(n);
  for (std::size_t i = 0; i < n; ++i) f[i] = lethal_rate(temps_C[i], k);
  const std::size_t intervals = n - 1;
  double s = 0;
  std::size_t i = 0;
  // Pairs of intervals: parabola through three points with spacings h0, h1.
  for (; i + 2 <= intervals - (intervals % 2); i += 2) {
    const double h0 = times_s[i + 1] - times_s[i];
    const double h1 = times_s[i + 2] - times_s[i + 1];
    const double hs = h0 + h1;
    s += hs / 6.0 *
         ((2.0 - h1 / h0) * f[i] + hs * hs / (h0 * h1) * f[i + 1] + (2.0 - h0 / h1) * f[i + 2]);
  }
  if (intervals % 2 == 1) {
    // Last interval alone, integrating the parabola through the last three points over it.
    const std::size_t j = n - 1;
    const double h0 = times_s[j - 1] - times_s[j - 2];
    const double h1 = times_s[j] - times_s[j - 1];
    s += f[j] * (2 * h1 * h1 + 3 * h0 * h1) / (6 * (h0 + h1)) +
         f[j - 1] * (h1 * h1 + 3 * h1 * h0) / (6 * h0) -
         f[j - 2] * h1 * h1 * h1 / (6 * h0 * (h0 + h1));
  }
  out.F_s = s;
  out.notes = check_log_sampling(times_s, temps_C, k);
  return out;
}

namespace {

// ∫ over [0, dt] of L(T) with T linear from t0 to t1, same z branch throughout.
double linear_segment(double dt, double temp0, double temp1, const Kinetics& k) {
  const double L0 = lethal_rate(temp0, k), L1 = lethal_rate(temp1, k);
  const double u = std::log(L1) - std::log(L0);
  if (std::abs(u) < 1e-12) return dt * 0.5 * (L0 + L1);
  return dt * L0 * std::expm1(u) / u;
}

}  // namespace

LogIntegral f_piecewise_linear_s(std::span<const double> times_s, std::span<const double> temps_C,
                                 const Kinetics& k, std::string_view origin) {
  validate_log(times_s, temps_C, origin);
  LogIntegral out;
  double s = 0;
  for (std::size_t i = 1; i < times_s.size(); ++i) {
    const double dt = times_s[i] - times_s[i - 1];
    const double a = temps_C[i - 1], b = temps_C[i];
    if (k.split_C && k.z_below_C && (a - *k.split_C) * (b - *k.split_C) < 0) {
      const double w = (*k.split_C - a) / (b - a);  // fraction of dt before the split
      s += linear_segment(w * dt, a, *k.split_C, k) + linear_segment((1 - w) * dt, *k.split_C, b, k);
    } else {
      s += linear_segment(dt, a, b, k);
    }
  }
  out.F_s = s;
  out.notes = check_log_sampling(times_s, temps_C, k);
  return out;
}

std::vector<SamplingNote> check_log_sampling(std::span<const double> times_s,
                                             std::span<const double> temps_C, const Kinetics& k) {
  std::vector<SamplingNote> w;
  const std::size_t n = times_s.size();
  if (n < 3) {
    w.push_back({.kind = SamplingNoteKind::too_few_rows, .count = n});
    return w;
  }
  std::vector<double> dts(n - 1);
  for (std::size_t i = 1; i < n; ++i) dts[i - 1] = times_s[i] - times_s[i - 1];
  std::vector<double> sorted = dts;
  std::nth_element(sorted.begin(), sorted.begin() + sorted.size() / 2, sorted.end());
  const double median = sorted[sorted.size() / 2];
  double total = 0;
  std::vector<double> contrib(n - 1);
  for (std::size_t i = 1; i < n; ++i) {
    contrib[i - 1] = 0.5 * (lethal_rate(temps_C[i - 1], k) + lethal_rate(temps_C[i], k)) * dts[i - 1];
    total += contrib[i - 1];
  }
  std::size_t gaps = 0, coarse = 0;
  for (std::size_t i = 0; i + 1 < n; ++i) {
    if (dts[i] > 5 * median && dts[i] >= 60) {
      if (++gaps <= 3)
        w.push_back({.kind = SamplingNoteKind::gap, .from_s = times_s[i], .to_s = times_s[i + 1],
                     .median_interval_s = median});
    }
    const double z_here = (k.split_C && k.z_below_C && std::max(temps_C[i], temps_C[i + 1]) < *k.split_C)
                              ? *k.z_below_C : k.z_C;
    if (std::abs(temps_C[i + 1] - temps_C[i]) > 0.1 * z_here && total > 0 &&
        contrib[i] >= 0.01 * total) {
      if (++coarse <= 3)
        w.push_back({.kind = SamplingNoteKind::coarse, .from_s = times_s[i], .to_s = times_s[i + 1],
                     .from_C = temps_C[i], .to_C = temps_C[i + 1]});
    }
  }
  if (gaps > 3) w.push_back({.kind = SamplingNoteKind::more_gaps, .count = gaps - 3});
  if (coarse > 3) w.push_back({.kind = SamplingNoteKind::more_coarse, .count = coarse - 3});
  return w;
}

namespace {

/// Sum of `rule` over the gap-free runs of the log (runs of >= 2 rows; a gap credits nothing).
template <class Rule>
LogIntegral over_recorded_runs(std::span<const double> t, std::span<const double> T, double max_gap_s, Rule rule) {
  LogIntegral out;
  std::size_t first = 0;
  for (std::size_t i = 1; i <= t.size(); ++i) {
    if (i < t.size() && !(t[i] - t[i - 1] > max_gap_s)) continue;
    if (i - first >= 2) {
      LogIntegral part = rule(t.subspan(first, i - first), T.subspan(first, i - first));
      out.F_s += part.F_s;
    }
    first = i;
  }
  return out;
}

}  // namespace

LogIntegral f_trapezoid_s(std::span<const double> times_s, std::span<const double> temps_C, const Kinetics& k,
                          std::string_view origin, double max_gap_s) {
  LogIntegral out = f_trapezoid_s(times_s, temps_C, k, origin);  // validates, and the sampling warnings
  out.F_s = over_recorded_runs(times_s, temps_C, max_gap_s, [&](auto t, auto T) {
              return f_trapezoid_s(t, T, k, origin);
            }).F_s;
  return out;
}

LogIntegral f_simpson_s(std::span<const double> times_s, std::span<const double> temps_C, const Kinetics& k,
                        std::string_view origin, double max_gap_s) {
  LogIntegral out = f_simpson_s(times_s, temps_C, k, origin);
  out.F_s = over_recorded_runs(times_s, temps_C, max_gap_s, [&](auto t, auto T) {
              return f_simpson_s(t, T, k, origin);
            }).F_s;
  return out;
}

LogIntegral f_piecewise_linear_s(std::span<const double> times_s, std::span<const double> temps_C,
                                 const Kinetics& k, std::string_view origin, double max_gap_s) {
  LogIntegral out = f_piecewise_linear_s(times_s, temps_C, k, origin);
  out.F_s = over_recorded_runs(times_s, temps_C, max_gap_s, [&](auto t, auto T) {
              return f_piecewise_linear_s(t, T, k, origin);
            }).F_s;
  return out;
}

std::vector<double> cumulative_f_trapezoid_s(std::span<const double> times_s, std::span<const double> temps_C,
                                             const Kinetics& k, std::string_view origin, double max_gap_s) {
  validate_log(times_s, temps_C, origin);
  std::vector<double> out(times_s.size(), 0.0);
  for (std::size_t i = 1; i < times_s.size(); ++i) {
    const double dt = times_s[i] - times_s[i - 1];
    out[i] = out[i - 1] + (dt > max_gap_s ? 0.0 : 0.5 * (lethal_rate(temps_C[i - 1], k) + lethal_rate(temps_C[i], k)) * dt);
  }
  return out;
}

}  // namespace coldcore
