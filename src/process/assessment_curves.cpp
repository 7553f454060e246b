// The curves a target is checked on: temperature functions, quadrature knots, credited stages and gaps.
#include "process/detail/assessing.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "lethality/detail/crossing.hpp"
#include "lethality/detail/text.hpp"
#include "coldcore/suggest.hpp"

namespace coldcore {

using namespace assessing;

namespace assessing {

Resolved resolve(const Target& t, const std::string& place, const OrganismLibrary& lib) {
  Resolved r;
  if (t.own) {
    if (!(t.own->z_C > 0))
      throw InputError(place + ".z_C = " + detail::num(t.own->z_C) + ": must be > 0");
    r.k.name = t.name.empty() ? "own kinetics" : t.name;
    r.k.reference_C = t.own->reference_C;
    r.k.z_C = t.own->z_C;
    r.k.D_ref_s = t.own->D_ref_s;
    r.k.source = "kinetics given in the target";
    return r;
  }
  if (t.organism.empty())
    throw InputError(place + ": organism: missing (name a library organism or give reference_C and z_C)");
  r.organism = &lib.at(t.organism, place);
  r.k = r.organism->kinetics;
  return r;
}

// The centre or mean temperature as a function of time.
std::function<double(double)> temp_function(const History& h, bool mean) {
  if (h.evaluate) {
    auto ev = h.evaluate;
    if (mean) return [ev](double t) { return ev(t).mean_C; };
    return [ev](double t) { return ev(t).centre_C; };
  }
  std::vector<double> ts, Ts;
  for (const auto& s : h.samples) {
    if (!ts.empty() && s.time_s <= ts.back()) continue;
    ts.push_back(s.time_s);
    Ts.push_back(mean ? s.mean_C : s.centre_C);
  }
  return detail::linear_log_curve(ts, Ts).temp_C_at;
}

// Sample times within [a, b] plus the ends, strictly increasing. With max_intervals > 0 the
// interior samples are thinned evenly to at most that many intervals (quadrature breakpoints:
// the adaptive rule refines inside them; crossing scans use every sample).
std::vector<double> knots(const History& h, double a, double b, std::size_t max_intervals) {
  std::vector<double> k{a};
  for (const auto& s : h.samples)
    if (s.time_s > k.back() && s.time_s < b) k.push_back(s.time_s);
  if (b > k.back()) k.push_back(b);
  if (max_intervals > 0 && k.size() > max_intervals + 1) {
    std::vector<double> thin;
    const double step = static_cast<double>(k.size() - 1) / static_cast<double>(max_intervals);
    for (std::size_t i = 0; i < max_intervals; ++i)
      thin.push_back(k[static_cast<std::size_t>(std::floor(i * step))]);
    thin.push_back(k.back());
    k.swap(thin);
  }
  return k;
}

// Knots of a curve within [a, b] plus the ends, strictly increasing.
std::vector<double> knots_of(const detail::Curve& c, double a, double b) {
  std::vector<double> k{a};
  for (double t : c.knots)
    if (t > k.back() && t < b) k.push_back(t);
  if (b > k.back()) k.push_back(b);
  return k;
}

// Probes per sample interval for crossing scans: dense engine output needs no sub-steps.
int probes_for(const std::vector<double>& k) { return k.size() > 2000 ? 1 : 4; }

double f_between(const History& h, const std::function<double(double)>& T, double a, double b,
                 const Kinetics& k, double rel_tol, double* error_estimate_s) {
  if (!(b > a)) return 0;
  const auto bp = knots(h, a, b, 512);
  const LethalityResult lr = f_value(T, bp, k, rel_tol);
  if (error_estimate_s) *error_estimate_s += lr.error_estimate_s;
  return lr.F_s;
}


// Intervals between readings further apart than max_gap_s (issue 11: nothing recorded there).
Gaps gaps_of_log(std::span<const double> times_s, double max_gap_s) {
  Gaps g;
  if (!std::isfinite(max_gap_s)) return g;
  for (std::size_t i = 1; i < times_s.size(); ++i)
    if (times_s[i] - times_s[i - 1] > max_gap_s) g.push_back({times_s[i - 1], times_s[i]});
  return g;
}

// [a, b] without the gaps, in order.
std::vector<std::pair<double, double>> recorded_pieces(double a, double b, const Gaps& gaps) {
  std::vector<std::pair<double, double>> out{{a, b}};
  for (const auto& [ga, gb] : gaps) {
    std::vector<std::pair<double, double>> next;
    for (const auto& [x, y] : out) {
      if (gb <= x || ga >= y) {
        next.emplace_back(x, y);
        continue;
      }
      if (ga > x) next.emplace_back(x, ga);
      if (gb < y) next.emplace_back(gb, y);
    }
    out = std::move(next);
  }
  return out;
}

// F over [a, b] less the unrecorded intervals.
double f_recorded(const History& h, const std::function<double(double)>& T, double a, double b, const Kinetics& k,
                  double rel_tol, const Gaps& gaps, double* error_estimate_s) {
  double F = 0;
  for (const auto& [x, y] : recorded_pieces(a, b, gaps)) F += f_between(h, T, x, y, k, rel_tol, error_estimate_s);
  return F;
}

// T where something was recorded; inside a gap, absolute zero: no time at temperature is
// credited there (cooking tables, minimum temperatures).
std::function<double(double)> recorded_only(const std::function<double(double)>& T, const Gaps& gaps) {
  if (gaps.empty()) return T;
  return [T, gaps](double t) {
    for (const auto& [a, b] : gaps)
      if (t > a && t < b) return -273.15;
    return T(t);
  };
}

void add_gap_knots(std::vector<double>& knots, const Gaps& gaps) {
  if (gaps.empty() || knots.empty()) return;
  for (const auto& [a, b] : gaps)
    for (double x : {a, b})
      if (x > knots.front() && x < knots.back()) knots.push_back(x);
  std::sort(knots.begin(), knots.end());
  knots.erase(std::unique(knots.begin(), knots.end()), knots.end());
}

TargetNote gap_note(Credit what, double from_s, double to_s, double limit_s) {
  TargetNote n{TargetNoteKind::gap_not_credited};
  n.credits = what;
  n.from_s = from_s;
  n.to_s = to_s;
  n.limit_s = limit_s;
  return n;
}

std::vector<TargetNote> gap_notes(const Gaps& gaps, double t0, Credit what) {
  std::vector<TargetNote> out;
  for (const auto& [a, b] : gaps) out.push_back(gap_note(what, a - t0, b - t0));
  return out;
}

TargetNote outside_range_note(double share, const Kinetics& k) {
  TargetNote n{TargetNoteKind::outside_valid_range};
  n.value = share;
  n.low_C = k.valid_min_C;
  n.high_C = k.valid_max_C;
  return n;
}

std::vector<int> credited(const Target& t, const History& h, const std::string& place) {
  std::vector<int> idx;
  if (t.stages.empty()) {
    for (std::size_t i = 0; i < h.stages.size(); ++i) idx.push_back(static_cast<int>(i));
    return idx;
  }
  std::vector<std::string> names;
  for (const auto& s : h.stages) names.push_back(s.name);
  for (const auto& want : t.stages) {
    bool found = false;
    for (std::size_t i = 0; i < h.stages.size(); ++i)
      if (h.stages[i].name == want) {
        if (std::find(idx.begin(), idx.end(), static_cast<int>(i)) == idx.end())
          idx.push_back(static_cast<int>(i));
        found = true;
      }
    if (!found) {
      std::string msg = place + ".stages: \"" + want + "\": no stage of that name";
      const std::string near = did_you_mean(want, names).value_or("");
      if (!near.empty()) msg += "; did you mean '" + near + "'?";
      throw InputError(msg);
    }
  }
  std::sort(idx.begin(), idx.end());
  return idx;
}

}  // namespace assessing

}  // namespace coldcore
