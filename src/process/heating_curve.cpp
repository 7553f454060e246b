// Semi-log description of a cold-spot curve; the criterion is stated in heating_curve.hpp.
#include "coldcore/process/heating_curve.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>
#include <string>

#include "coldcore/error.hpp"

namespace coldcore::process {

namespace {

[[noreturn]] void reject(const char* key, double value, const char* requirement) {
  std::ostringstream m;
  m << "describe_curve: " << key << " = " << value << ": " << requirement;
  throw InputError(m.str());
}

// The usable points: absolute time and driving difference d > 0 (kelvin).
struct Usable {
  std::vector<double> t;
  std::vector<double> d;
};

// Least-squares sums of y = log10 d against t − t0. t0 is the run's last time, so the sums do
// not lose digits to large absolute times.
struct RunSums {
  double t0 = 0;
  double n = 0, sx = 0, sy = 0, sxx = 0, sxy = 0, syy = 0;
  void add(double t, double y) {
    const double x = t - t0;
    n += 1;
    sx += x;
    sy += y;
    sxx += x * x;
    sxy += x * y;
    syy += y * y;
  }
  double slope() const { return (n * sxy - sx * sy) / (n * sxx - sx * sx); }
  double intercept_at_t0() const { return (sy - slope() * sx) / n; }
};

double allowed_K(double d, const CurveOptions& o) { return std::max(o.residual_K, o.residual_rel * d); }

// Every point of [first, last] within the tolerance of the line, in kelvin.
bool within_tolerance(const Usable& u, int first, int last, const RunSums& s, const CurveOptions& o) {
  const double b = s.slope();
  const double a = s.intercept_at_t0();
  if (!std::isfinite(a) || !std::isfinite(b)) return false;
  for (int i = first; i <= last; ++i) {
    const double fit = std::pow(10.0, a + b * (u.t[i] - s.t0));
    if (std::abs(fit - u.d[i]) > allowed_K(u.d[i], o)) return false;
  }
  return true;
}

// The first index of the run ending at `last`, grown backward one point at a time while the line
// stays within the tolerance; −1 when even min_points points fail.
int grow_backward(const Usable& u, int last, const CurveOptions& o) {
  int first = last - o.min_points + 1;
  if (first < 0) return -1;
  RunSums s;
  s.t0 = u.t[last];
  for (int i = first; i <= last; ++i) s.add(u.t[i], std::log10(u.d[i]));
  if (!within_tolerance(u, first, last, s, o)) return -1;
  while (first > 0) {
    RunSums longer = s;
    longer.add(u.t[first - 1], std::log10(u.d[first - 1]));
    if (!within_tolerance(u, first - 1, last, longer, o)) break;
    s = longer;
    --first;
  }
  return first;
}

StraightPortion fit_portion(const Usable& u, int first, int last) {
  RunSums s;
  s.t0 = u.t[last];
  for (int i = first; i <= last; ++i) s.add(u.t[i], std::log10(u.d[i]));
  StraightPortion p;
  p.from_s = u.t[first];
  p.to_s = u.t[last];
  p.points = last - first + 1;
  p.slope_per_s = s.slope();
  p.intercept = s.intercept_at_t0() - p.slope_per_s * s.t0;
  const double ss_tot = s.syy - s.sy * s.sy / s.n;
  double ss_res = 0;
  for (int i = first; i <= last; ++i) {
    const double r = std::log10(u.d[i]) - (s.intercept_at_t0() + p.slope_per_s * (u.t[i] - s.t0));
    ss_res += r * r;
  }
  p.r2 = ss_tot > 0 ? 1.0 - ss_res / ss_tot : 0.0;
  return p;
}

// Falls and spans enough log cycles to count as a straight portion.
bool qualifies(const StraightPortion& p, const CurveOptions& o) {
  return p.slope_per_s < 0 && -p.slope_per_s * (p.to_s - p.from_s) >= o.min_span_log_cycles;
}

double probe_at(const std::vector<double>& t, const std::vector<double>& T, double at_s) {
  if (at_s <= t.front()) return T.front();
  if (at_s >= t.back()) return T.back();
  const auto hi = static_cast<std::size_t>(std::upper_bound(t.begin(), t.end(), at_s) - t.begin());
  const std::size_t lo = hi - 1;
  const double w = (at_s - t[lo]) / (t[hi] - t[lo]);
  return T[lo] + w * (T[hi] - T[lo]);
}

void check_inputs(const std::vector<double>& time_s, const std::vector<double>& temp_C, double medium_C,
                  double phase_start_s, double phase_end_s, double corrected_zero, const CurveOptions& o) {
  if (time_s.size() != temp_C.size())
    reject("temp_C.size()", static_cast<double>(temp_C.size()), "must equal time_s.size()");
  if (time_s.empty()) reject("time_s.size()", 0, "must be >= 1");
  for (std::size_t i = 0; i < time_s.size(); ++i) {
    if (!std::isfinite(time_s[i])) reject("time_s", time_s[i], "must be finite");
    if (!std::isfinite(temp_C[i])) reject("temp_C", temp_C[i], "must be finite");
    if (i > 0 && !(time_s[i] > time_s[i - 1])) reject("time_s", time_s[i], "must be strictly increasing");
  }
  if (!std::isfinite(medium_C)) reject("medium_C", medium_C, "must be finite");
  if (!std::isfinite(phase_start_s)) reject("phase_start_s", phase_start_s, "must be finite");
  if (!std::isfinite(phase_end_s) || phase_end_s < phase_start_s)
    reject("phase_end_s", phase_end_s, "must be finite and >= phase_start_s");
  if (!std::isfinite(corrected_zero)) reject("corrected_zero_s", corrected_zero, "must be finite");
  if (!(o.min_difference_K > 0)) reject("min_difference_K", o.min_difference_K, "must be > 0");
  if (o.min_points < 3) reject("min_points", o.min_points, "must be >= 3");
  if (!(o.residual_K > 0)) reject("residual_K", o.residual_K, "must be > 0");
  if (!(o.residual_rel >= 0)) reject("residual_rel", o.residual_rel, "must be >= 0");
  if (!(o.min_span_log_cycles > 0)) reject("min_span_log_cycles", o.min_span_log_cycles, "must be > 0");
  if (!(o.broken_slope_ratio > 1)) reject("broken_slope_ratio", o.broken_slope_ratio, "must be > 1");
}

}  // namespace

CurveDescription describe_curve(const std::vector<double>& time_s, const std::vector<double>& temp_C,
                                double medium_C, double phase_start_s, double phase_end_s,
                                double corrected_zero, bool heating, const CurveOptions& o) {
  check_inputs(time_s, temp_C, medium_C, phase_start_s, phase_end_s, corrected_zero, o);
  const double sign = heating ? 1.0 : -1.0;  // d = sign·(T_m − T) > 0 before the medium is reached
  CurveDescription c;
  c.medium_C = medium_C;
  c.initial_C = probe_at(time_s, temp_C, phase_start_s);
  c.corrected_zero_s = corrected_zero;
  if (sign * (medium_C - c.initial_C) < o.min_difference_K) {
    c.status = CurveStatus::no_driving_difference;
    return c;
  }

  Usable u;
  for (std::size_t i = 0; i < time_s.size(); ++i) {
    if (time_s[i] < phase_start_s || time_s[i] > phase_end_s) continue;
    const double d = sign * (medium_C - temp_C[i]);
    if (d < o.min_difference_K) continue;
    u.t.push_back(time_s[i]);
    u.d.push_back(d);
  }
  const int n = static_cast<int>(u.t.size());
  if (n < o.min_points) {
    c.status = CurveStatus::too_few_points;
    return c;
  }

  const int later_first = grow_backward(u, n - 1, o);
  const StraightPortion later = later_first >= 0 ? fit_portion(u, later_first, n - 1) : StraightPortion{};
  if (later_first < 0 || !qualifies(later, o)) {
    c.status = CurveStatus::never_straight;
    return c;
  }
  c.status = CurveStatus::described;
  c.straight = later;

  // An earlier straight run, latest end first; the first one found is the candidate.
  for (int last = later_first - 1; last >= o.min_points - 1; --last) {
    const int first = grow_backward(u, last, o);
    if (first < 0) continue;
    const StraightPortion earlier = fit_portion(u, first, last);
    if (!qualifies(earlier, o)) continue;
    // f_later / f_earlier = slope_earlier / slope_later.
    if (earlier.slope_per_s / later.slope_per_s > o.broken_slope_ratio) {
      c.broken = true;
      c.straight = earlier;
      c.second = later;
      c.f2_s = -1.0 / later.slope_per_s;
      c.break_s = (later.intercept - earlier.intercept) / (earlier.slope_per_s - later.slope_per_s);
    }
    break;
  }

  c.f_s = -1.0 / c.straight.slope_per_s;
  const double d_at_zero = std::pow(10.0, c.straight.intercept + c.straight.slope_per_s * corrected_zero);
  c.pseudo_initial_C = medium_C - sign * d_at_zero;
  c.j = (medium_C - c.pseudo_initial_C) / (medium_C - c.initial_C);
  return c;
}

double corrected_zero_s(double come_up_s) {
  if (!std::isfinite(come_up_s) || come_up_s < 0) {
    std::ostringstream m;
    m << "corrected_zero_s: come_up_s = " << come_up_s << ": must be finite and >= 0";
    throw InputError(m.str());
  }
  return 0.58 * come_up_s;  // Ball: 42 % of come-up counts as time at the medium temperature
}

}  // namespace coldcore::process
