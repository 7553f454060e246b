#include "coldcore/process/assessment.hpp"
#include "coldcore/model/temperature_token.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "lethality/detail/crossing.hpp"
#include "lethality/detail/text.hpp"
#include "lethality/detail/toml_read.hpp"

namespace coldcore {

const char* to_string(Verdict v) { return v == Verdict::met ? "met" : "not demonstrated"; }

const char* to_string(TargetKind k) {
  switch (k) {
    case TargetKind::log_reduction: return "log-reduction";
    case TargetKind::f_value: return "F-value";
    case TargetKind::cooling_rule: return "cooling-rule";
    case TargetKind::centre_min_temperature: return "centre-min-temperature";
    case TargetKind::cooking_table: return "cooking-table";
  }
  return "?";
}

bool Assessment::all_met() const {
  if (targets.empty()) return false;
  for (const auto& t : targets)
    if (t.verdict != Verdict::met) return false;
  return true;
}

bool ProbeAssessment::all_met() const {
  if (targets.empty()) return false;
  for (const auto& t : targets)
    if (t.verdict != Verdict::met) return false;
  return true;
}

namespace {

std::string shown(double value, int significant, bool up) {
  if (!std::isfinite(value)) return value > 0 ? "inf" : (value < 0 ? "-inf" : "nan");
  if (value == 0) return "0";
  const int e = static_cast<int>(std::floor(std::log10(std::abs(value))));
  const int decimals = std::max(0, significant - 1 - e);
  const double scale = std::pow(10.0, significant - 1 - e);
  // Allowance for binary representation error (documented in the header).
  const double x = value * scale;
  const double nudge = 1e-12 * std::abs(x);
  const double r = up ? std::ceil(x - nudge) : std::floor(x + nudge);
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, r / scale);
  return buf;
}

}  // namespace

std::string shown_down(double value, int significant) { return shown(value, significant, false); }
std::string shown_up(double value, int significant) { return shown(value, significant, true); }

std::string shown_log_reduction(double logs, double required_logs) {
  const double n = std::max(kMeaningfulLogReduction, std::ceil(required_logs));
  if (logs > n) return "more than " + detail::num(n) + " log10";
  return shown_down(logs) + " log10";
}

namespace {

std::string minutes_down(double s) { return shown_down(s / 60.0) + " min"; }
std::string minutes_up(double s) { return shown_up(s / 60.0) + " min"; }

// ---- Error bounds of a margin (issue 11: "met" on a margin of rounding noise) ----

constexpr double kEps = std::numeric_limits<double>::epsilon();

// Rounding of the unit conversions behind a margin (min × 60, D_min × 60, °F → °C, h × 3600)
// and of the subtraction itself: a few ulp of the operands. A margin inside it is a tie.
double rounding_bound(double a, double b) { return 16 * kEps * (std::abs(a) + std::abs(b)); }

// Crossing-time error of detail::Curve::refine (toms748 to 1e-9 s + 1e-15·t; either end of the
// final bracket may be returned, so twice that).
double refine_tol_s(double t) { return 2 * (1e-9 + 1e-15 * std::abs(t)); }

// Error of a crossing time at t when the temperatures are accurate to tol_K: the root finder's
// tolerance plus tol_K / |dT/dt| (a temperature error moves the crossing by that much). A
// tangent crossing (slope 0) has no bound: infinite, so nothing resting on it is "met".
double crossing_uncertainty_s(const std::function<double(double)>& T, double t, double tol_K, double lo,
                              double hi) {
  double u = refine_tol_s(t);
  if (tol_K > 0) {
    const double step = std::max(1e-3, 1e-7 * std::abs(t));
    const double a = std::max(lo, t - step), b = std::min(hi, t + step);
    const double slope = b > a ? std::abs(T(b) - T(a)) / (b - a) : 0.0;
    u += slope > 0 ? tol_K / slope : std::numeric_limits<double>::infinity();
  }
  return u;
}

// Relative error of F on a history whose temperatures are accurate to tol_K: the lethal rate
// 10^((T − Tref)/z) moves by the factor 10^(±tol_K/z), so F by at most ln 10 · tol_K / z (first
// order; the split-z kinetics use the smaller z, the larger sensitivity).
double f_relative_error_of_temperature(const Kinetics& k, double tol_K) {
  double z = k.z_C;
  if (k.z_below_C && *k.z_below_C > 0) z = std::min(z, *k.z_below_C);
  return z > 0 ? std::expm1(std::log(10.0) * tol_K / z) : 0.0;
}

// How a kind's raw values are shown: scale to the shown unit and its suffix.
struct ShownUnit {
  double scale = 1;
  std::string suffix;
};
const ShownUnit kLog{1.0, " log10"};
const ShownUnit kMin{1.0 / 60.0, " min"};

std::string signed_small(double v, const ShownUnit& u) {
  return (v > 0 ? "+" + shown_down(v * u.scale, 2) : "-" + shown_up(-v * u.scale, 2)) + u.suffix;
}

// The verdict and the margin and verdict texts from r.margin and r.margin_uncertainty (every
// error term but rounding, which is added here). "met" needs margin > margin_uncertainty; a tie
// (|margin| within rounding) and a margin inside the bound are named as such, never "shortfall 0".
void decide(TargetResult& r, const ShownUnit& u) {
  const double tie = rounding_bound(r.required, r.achieved);
  r.margin_uncertainty = std::max(0.0, r.margin_uncertainty) + tie;
  r.verdict = r.margin > r.margin_uncertainty ? Verdict::met : Verdict::not_demonstrated;
  r.margin_shown.clear();
  if (r.verdict == Verdict::met) {
    const std::string m = shown_down(r.margin * u.scale);
    r.margin_text = (std::stod(m) == 0 ? "< " + shown_up(r.margin * u.scale, 1) : m) + u.suffix;
    r.verdict_text = "met, margin " + r.margin_text;
  } else if (std::abs(r.margin) <= tie) {
    r.margin_text = "0" + u.suffix;
    r.margin_shown = "exactly at the required value";
    r.verdict_text = "not demonstrated — exactly at the required value: not demonstrated by a positive margin";
    r.notes.push_back("exactly at the required value: not demonstrated by a positive margin");
  } else if (std::abs(r.margin) <= r.margin_uncertainty) {
    r.margin_text = "±" + shown_up(r.margin_uncertainty * u.scale, 2) + u.suffix;
    r.margin_shown = "within the numerical uncertainty (" + r.margin_text + ")";
    r.verdict_text = "not demonstrated — within the numerical uncertainty of the target (margin " +
                     signed_small(r.margin, u) + ", uncertainty " + r.margin_text + ")";
    r.notes.push_back("within the numerical uncertainty of the target: the margin " + signed_small(r.margin, u) +
                      " is inside the computation's error bound " + r.margin_text +
                      " (integration error, temperature accuracy, crossing times, unit rounding)");
  } else {
    r.margin_text = shown_up(-r.margin * u.scale) + u.suffix;
    r.verdict_text = "not demonstrated, shortfall " + r.margin_text;
  }
}

// Verdict and texts for targets where a larger achieved value is better; log_units selects
// log10 or minutes. r.margin_uncertainty holds the error terms of the computation.
void finish(TargetResult& r, bool log_units) {
  if (log_units) {
    r.unit = "log10";
    r.required_text = shown_up(r.required) + " log10";
    r.achieved_text = shown_down(r.achieved) + " log10";
  } else {
    r.unit = "min";
    r.required_text = minutes_up(r.required);
    r.achieved_text = minutes_down(r.achieved);
  }
  decide(r, log_units ? kLog : kMin);
}

// Log reductions beyond N = max(15, the requirement rounded up) are not a result. Why 15: D- and
// Weibull data are fitted to survivor counts over at most about 7–9 log cycles (challenge inocula
// of 10^7–10^9 per g down to a detection limit near 1 per g: common practice, from memory), and no
// target in common use asks more than 12 (the botulinum cook, 12D: common practice). A count
// above 15 extrapolates the survivor curve past anything a validation could observe; the text
// shows "more than N log10" with the credited F, and the raw count stays in `achieved`.
void cap_log_reduction_text(TargetResult& r) {
  const double n = std::max(kMeaningfulLogReduction, std::ceil(r.required));
  if (!(r.achieved > n)) return;
  const std::string n_text = detail::num(n);
  r.achieved_text = shown_log_reduction(r.achieved, r.required) + " (credited F " + minutes_down(r.F_s) + ")";
  if (r.verdict == Verdict::met) {
    r.margin_text = "more than " + shown_down(n - r.required) + " log10";
    r.verdict_text = "met, margin " + r.margin_text;
  }
  r.notes.push_back("log reductions above " + n_text +
                    " are not shown as a count: kinetic data are fitted over at most about 9 log cycles "
                    "and no target in common use asks more than 12 (the botulinum cook), so a larger count "
                    "extrapolates the survivor curve past anything a validation could observe (common "
                    "practice; the 9 cycles from memory); the credited F is the result");
}

struct Resolved {
  Kinetics k;
  const Organism* organism = nullptr;
};

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
std::vector<double> knots(const History& h, double a, double b, std::size_t max_intervals = 0) {
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
                 const Kinetics& k, double rel_tol, double* error_estimate_s = nullptr) {
  if (!(b > a)) return 0;
  const auto bp = knots(h, a, b, 512);
  const LethalityResult lr = f_value(T, bp, k, rel_tol);
  if (error_estimate_s) *error_estimate_s += lr.error_estimate_s;
  return lr.F_s;
}

using Gaps = std::vector<std::array<double, 2>>;

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
                  double rel_tol, const Gaps& gaps, double* error_estimate_s = nullptr) {
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

void gap_notes(TargetResult& r, const Gaps& gaps, double t0, const char* what) {
  for (const auto& [a, b] : gaps)
    r.notes.push_back(std::string(what) + " the gap in the log from " + minutes_down(a - t0) + " to " +
                      minutes_down(b - t0) + ": the temperature meanwhile was not recorded");
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
      const std::string near = detail::nearest(want, names);
      if (!near.empty()) msg += "; did you mean '" + near + "'?";
      throw InputError(msg);
    }
  }
  std::sort(idx.begin(), idx.end());
  return idx;
}

void provenance_notes(TargetResult& r, const Resolved& res) {
  if (!res.organism) {
    r.notes.push_back("kinetics given in the target: no valid temperature range is known for them");
    return;
  }
  for (const auto& [key, v] : res.organism->values)
    if (v.status == "from memory")
      r.notes.push_back(key + " of " + res.k.key + " is from memory (unconfirmed): " + v.source);
}

// F credited outside the organism's valid range, over the credited stages.
double outside_range(const History& h, const std::function<double(double)>& T, const Kinetics& k,
                     const std::vector<int>& stages, double rel_tol) {
  if (k.valid_min_C <= -1e299 && k.valid_max_C >= 1e299) return 0;
  double out = 0;
  for (int i : stages) {
    const auto& st = h.stages[static_cast<std::size_t>(i)];
    if (!(st.end_s > st.start_s)) continue;
    detail::Curve c;
    c.temp_C_at = T;
    c.knots = knots(h, st.start_s, st.end_s);
    c.probes = probes_for(c.knots);
    for (const auto& [a, b] : c.intervals_at_or_above(k.valid_max_C, st.start_s))
      out += f_between(h, T, a, b, k, rel_tol);
    double in_or_above_min = 0;
    for (const auto& [a, b] : c.intervals_at_or_above(k.valid_min_C, st.start_s))
      in_or_above_min += f_between(h, T, a, b, k, rel_tol);
    const double stage_F = f_between(h, T, st.start_s, st.end_s, k, rel_tol);
    out += std::max(0.0, stage_F - in_or_above_min);
  }
  return out;
}

// Required F and log bookkeeping shared by History and probe assessment. F_uncertainty_s is the
// error bound of r.F_s (quadrature estimate, temperature accuracy or summation rounding); it is
// carried into the target's unit through the same (monotone) conversion as F itself.
void lethality_verdict(TargetResult& r, const Target& t, const Resolved& res, const AssessOptions& o,
                       const std::string& place, double F_uncertainty_s) {
  const Kinetics& k = res.k;
  if (t.kind == TargetKind::log_reduction) {
    if (!(t.log_reduction > 0))
      throw InputError(place + ".log_reduction = " + detail::num(t.log_reduction) + ": must be > 0");
    const bool weibull = o.prefer_weibull && k.weibull.has_value();
    if (!weibull && !k.D_ref_s)
      throw InputError(place + ": organism = \"" + k.key +
                       "\": has no D value; a log-reduction target needs D_ref (or Weibull data)");
    r.required = t.log_reduction;
    const auto logs = [&](double F_s) {
      return weibull ? log_reduction_weibull(F_s, k) : log_reduction_linear(F_s, k);
    };
    if (weibull) {
      r.F_required_s = k.weibull->delta_ref_s * std::pow(t.log_reduction, 1.0 / k.weibull->p);
      r.notes.push_back("Weibull survival (delta = " + shown_down(k.weibull->delta_ref_s / 60) +
                        " min at " + temp_token(k.reference_C, 10) + ", p = " +
                        detail::num(k.weibull->p) + "): log10 reduction = (F/delta)^p");
    } else {
      r.F_required_s = t.log_reduction * *k.D_ref_s;
    }
    r.achieved = logs(r.F_s);
    r.margin = r.achieved - r.required;
    r.margin_uncertainty = logs(r.F_s + F_uncertainty_s) - r.achieved;
    finish(r, true);
    cap_log_reduction_text(r);
  } else {
    if (!(t.F_required_s > 0))
      throw InputError(place + ".F = " + detail::num(t.F_required_s / 60) + " min: must be > 0");
    r.required = t.F_required_s;
    r.F_required_s = t.F_required_s;
    r.achieved = r.F_s;
    r.margin = r.achieved - r.required;
    r.margin_uncertainty = F_uncertainty_s;
    finish(r, false);
  }
}

std::string label_of(const Target& t) {
  if (!t.name.empty()) return t.name;
  if (!t.organism.empty()) return t.organism;
  if (!t.rule.empty()) return t.rule;
  if (t.kind == TargetKind::centre_min_temperature)
    return t.at + " >= " + temp_token(t.min_temp_C, 10);
  return to_string(t.kind);
}

// Error bound (s) of a crossing time on the checked curve; 0 for a time that is no crossing.
using CrossingError = std::function<double(double time_s, double level_C)>;

// The rule's row carries the BINDING step: the one that decides the verdict (issue 11). Each
// non-advisory step is ranked by margin − its error bound; a step never reached (or whose clock
// never started) has no positive margin, min(0, limit − elapsed lower bound), so it binds over any
// passed step. When every step passes but the chill-start condition does not (or is not known),
// the condition is the row.
void cooling_result(TargetResult& r, const CoolingCheck& c, const CoolingRule& rule, const CrossingError& err) {
  r.cooling = c;
  r.source = rule.source;
  r.unit = "min";
  const CoolingStepResult* binding = nullptr;
  double binding_margin = 0, binding_err = 0;
  for (const auto& s : c.steps) {
    if (s.step.advisory) continue;
    const double m = s.reached ? s.margin_s : std::min(0.0, s.margin_s);
    double e = 0;
    if (s.reached && s.start_s && s.end_s) e = err(*s.start_s, s.step.from_C) + err(*s.end_s, s.step.to_C);
    if (!binding || m - e < binding_margin - binding_err) {
      binding = &s;
      binding_margin = m;
      binding_err = e;
    }
  }
  for (const auto& s : c.steps)
    for (const auto& n : s.notes) r.notes.push_back(s.step.label + ": " + n);
  for (const auto& n : c.notes) r.notes.push_back(n);
  const bool steps_ok = binding && binding->reached && binding_margin > binding_err;
  const bool condition_row =
      rule.chill_start_within_s && (!binding || steps_ok) &&
      (!c.chill_delay_margin_s || !binding || *c.chill_delay_margin_s <= binding_margin - binding_err);
  if (condition_row) {
    r.required = *rule.chill_start_within_s;
    r.required_text = minutes_down(r.required) + " (chilling begun after the cook)";
    if (!c.chill_delay_s || !c.chill_delay_margin_s) {
      r.achieved = 0;
      r.margin = 0;
      r.margin_uncertainty = 0;
      r.verdict = Verdict::not_demonstrated;
      r.achieved_text = "not known";
      r.margin_text = "none";
      r.margin_shown = "none: the time from the end of the cook to the start of chilling is not known";
      r.verdict_text = "not demonstrated — the time from the end of the cook to the start of chilling is not known";
      return;
    }
    r.achieved = *c.chill_delay_s;
    r.margin = *c.chill_delay_margin_s;
    r.margin_uncertainty = 0;  // both times are given or are stage boundaries, not crossings
    r.achieved_text = minutes_up(r.achieved);
    decide(r, kMin);
    return;
  }
  if (!binding) {  // only advisory steps: nothing to demonstrate
    r.verdict = Verdict::not_demonstrated;
    r.required_text = r.achieved_text = "-";
    r.margin_text = "none";
    r.margin_shown = "none: the rule has no required step";
    r.verdict_text = "not demonstrated — the rule has no required step";
    return;
  }
  const CoolingStepResult& s = *binding;
  r.required = s.step.within_s;
  r.achieved = s.elapsed_s;
  r.margin = binding_margin;
  r.margin_uncertainty = binding_err;
  // A limit is a good quantity here (shown down), an elapsed time a bad one (shown up).
  r.required_text = minutes_down(r.required) + " (step " + s.step.label + ")";
  if (s.reached) {
    r.achieved_text = minutes_up(r.achieved);
    decide(r, kMin);
    if (r.verdict == Verdict::met && !c.passed) {  // cannot happen: every step and condition passed
      r.verdict = Verdict::not_demonstrated;
      r.verdict_text = "not demonstrated (see notes)";
    }
    return;
  }
  // Never reached: no positive margin. The temperature at the end of the process is the result.
  r.verdict = Verdict::not_demonstrated;
  const std::string at_end =
      s.temp_at_record_end_C ? temp_token_fixed(*s.temp_at_record_end_C, 2) + " at the end" : "no temperature";
  const std::string what = s.start_s ? "not reached by the end of the process" : "clock never started by the end of the process";
  r.achieved_text = std::string(s.start_s ? "not reached" : "clock never started") + " (" + at_end + ")";
  r.margin_uncertainty = 0;
  if (r.margin < 0) {
    r.margin_text = "at least " + minutes_up(-r.margin);
    r.margin_shown = "shortfall at least " + minutes_up(-r.margin) + ": " + what;
    r.verdict_text = "not demonstrated, shortfall at least " + minutes_up(-r.margin) + ": step " + s.step.label +
                     " " + what + " (" + at_end + ")";
  } else {
    r.margin_text = "none";
    r.margin_shown = "none: " + what;
    r.verdict_text = "not demonstrated — step " + s.step.label + " " + what + " (" + at_end + ")";
  }
}

// Φ is the equivalent-time fraction of the table's requirement (cooking_tables.hpp): met when
// Φ > 1 or the instant row was reached.
void cooking_result(TargetResult& r, const CookingCheck& c, double fraction_uncertainty) {
  r.cooking = c;
  r.source = c.source;
  r.unit = "fraction";
  r.required = 1.0;
  r.achieved = c.fraction;
  r.margin = c.fraction - 1.0;
  r.required_text = "table equivalence 1.00";
  if (c.instant_reached_s) {
    r.margin_uncertainty = fraction_uncertainty;  // infinite when the peak is within the temperature error
    r.verdict = c.met && !std::isinf(fraction_uncertainty) ? Verdict::met : Verdict::not_demonstrated;
    r.achieved_text = "instant row reached";
    r.margin_text = "-";
    r.verdict_text = r.verdict == Verdict::met
                         ? "met, equivalent-time fraction instant row reached"
                         : "not demonstrated — within the numerical uncertainty of the target (the peak is within "
                           "the temperature accuracy of the instant row)";
    if (r.verdict != Verdict::met) r.margin_shown = "within the numerical uncertainty";
    return;
  }
  r.achieved_text = "equivalence " + shown_down(c.fraction);
  r.margin_uncertainty = fraction_uncertainty;
  decide(r, ShownUnit{1.0, ""});
  if (!c.met) r.verdict = Verdict::not_demonstrated;
  if (r.verdict == Verdict::met || r.margin_shown.empty())
    r.verdict_text = std::string(to_string(r.verdict)) + ", equivalent-time fraction " + r.achieved_text;
}

// Error bound of Φ: every crossing of a row temperature moves time between the bands around it,
// by at most its crossing error over that row's hold; an instant row whose peak is within the
// temperature accuracy is undecided (infinite); with the instant row reached, only that row
// decides. One scan of the grid finds the crossings; the slope at a crossing is taken as the
// smallest of the interval's secant and the one-sided slopes at its ends (a lower bound of |T'|
// inside an interval without an inflection; the grid is fine enough for the scan's own crossings).
double cooking_uncertainty(const detail::Curve& c, const CookingTable& table, const CookingCheck& check,
                           double tol_K) {
  const std::vector<double> g = c.grid(c.start());
  std::vector<double> T(g.size());
  double hi = -std::numeric_limits<double>::infinity();
  for (std::size_t i = 0; i < g.size(); ++i) hi = std::max(hi, T[i] = c.temp_C_at(g[i]));
  for (const auto& row : table.rows)
    if (row.hold_s <= 0 && tol_K > 0 && hi >= row.temp_C && hi - row.temp_C <= tol_K)
      return std::numeric_limits<double>::infinity();
  if (check.instant_reached_s) return 0;
  double u = 0;
  for (std::size_t i = 0; i + 1 < g.size(); ++i) {
    const double lo_T = std::min(T[i], T[i + 1]), hi_T = std::max(T[i], T[i + 1]);
    if (!(hi_T > lo_T)) continue;
    double slope = -1;  // computed once per interval, only when a row is crossed in it
    for (const auto& row : table.rows) {
      if (row.hold_s <= 0 || !(row.temp_C > lo_T && row.temp_C <= hi_T)) continue;
      if (slope < 0) {
        const double w = g[i + 1] - g[i], d = std::min(1e-3, w / 4);
        const double s_a = std::abs(c.temp_C_at(g[i] + d) - T[i]) / d;
        const double s_b = std::abs(T[i + 1] - c.temp_C_at(g[i + 1] - d)) / d;
        slope = std::min({(hi_T - lo_T) / w, s_a, s_b});
      }
      const double e = refine_tol_s(g[i + 1]) +
                       (tol_K > 0 ? (slope > 0 ? tol_K / slope : std::numeric_limits<double>::infinity()) : 0.0);
      u += e / row.hold_s;
    }
  }
  return u;
}

const CookingTable& cooking_table_for(const Target& t, const std::string& place, const AssessOptions& opts) {
  if (opts.cooking_tables == nullptr) throw InputError(place + ": cooking-table target but no cooking tables were loaded");
  return opts.cooking_tables->at(t.table, place);
}

void min_temperature_result(TargetResult& r, const Target& t, const detail::Curve& c, const CrossingError& err,
                            const Gaps& gaps = {}) {
  const auto runs = c.intervals_at_or_above(t.min_temp_C, c.start());
  double longest = 0, longest_err = 0;
  const auto is_gap_end = [&gaps](double x) {
    for (const auto& [a, b] : gaps)
      if (x == a || x == b) return true;
    return false;
  };
  for (const auto& run : runs)
    for (const auto& [a, b] : recorded_pieces(run.first, run.second, gaps))  // a hold is not credited across a gap
      if (b - a > longest) {
        longest = b - a;
        // The ends of the record and of a gap are no crossings; the crossings carry their error.
        longest_err = (a > c.start() && !is_gap_end(a) ? err(a, t.min_temp_C) : 0.0) +
                      (b < c.end() && !is_gap_end(b) ? err(b, t.min_temp_C) : 0.0);
      }
  if (!runs.empty()) r.reached_s = runs.front().first;
  r.required = t.hold_s;
  r.achieved = longest;
  r.margin = longest - t.hold_s;
  r.margin_uncertainty = longest_err;
  if (runs.empty())
    r.notes.push_back(t.at + " never reached " + temp_token(t.min_temp_C, 10));
  r.source = "target";
  finish(r, false);
}

// CrossingError on T: a time where T is at `level` is a crossing (root finder + temperature
// error); any other time (a record end, the highest point of a record) is exact.
CrossingError crossing_error(const std::function<double(double)>& T, double tol_K, double lo, double hi) {
  return [T, tol_K, lo, hi](double t, double level) {
    if (!(std::abs(T(t) - level) <= 1e-6 + tol_K)) return 0.0;
    return crossing_uncertainty_s(T, t, tol_K, lo, hi);
  };
}

// Context for rules with a chill-start condition, inferred from the stages (see AssessOptions).
CoolingContext infer_context(const History& h, const CoolingRule& rule, const AssessOptions& o,
                             const std::function<double(double)>& T, std::vector<std::string>& notes) {
  CoolingContext ctx;
  ctx.cook_end_s = o.cook_end_s;
  ctx.chill_start_s = o.chill_start_s;
  if (!rule.chill_start_within_s || (ctx.cook_end_s && ctx.chill_start_s) || rule.steps.empty())
    return ctx;
  const double hot = rule.steps.front().from_C, cold = rule.steps.front().to_C;
  bool was_hot = false;
  for (std::size_t i = 0; i < h.stages.size(); ++i) {
    const auto& st = h.stages[i];
    const double medium_start = h.evaluate ? h.evaluate(st.start_s).medium_C : st.at_end.medium_C;
    if (was_hot && medium_start < cold && i > 0) {
      if (!ctx.chill_start_s) ctx.chill_start_s = st.start_s;
      if (!ctx.cook_end_s) {
        // The cook ends at the end of the last stage before chilling whose medium was hot.
        for (std::size_t j = i; j-- > 0;) {
          const double m = h.evaluate ? h.evaluate(h.stages[j].start_s).medium_C : h.stages[j].at_end.medium_C;
          if (m >= hot) {
            ctx.cook_end_s = h.stages[j].end_s;
            break;
          }
        }
      }
      if (ctx.cook_end_s && ctx.chill_start_s)
        notes.push_back("chilling taken to start with stage '" + st.name + "' at " +
                        minutes_down(*ctx.chill_start_s) + "; cook taken to end at " +
                        minutes_down(*ctx.cook_end_s));
      break;
    }
    if (T(st.end_s) > hot || T(st.start_s) > hot) was_hot = true;
    if (!was_hot) {
      const auto bp = knots(h, st.start_s, st.end_s);
      for (double t : bp)
        if (T(t) > hot) {
          was_hot = true;
          break;
        }
    }
  }
  return ctx;
}

}  // namespace

Assessment assess(const History& h, const std::vector<Target>& targets, const OrganismLibrary& organisms,
                  const RuleLibrary& rules, const AssessOptions& opts) {
  Assessment out;
  if (h.samples.empty()) throw InputError(opts.origin + ": history: no samples to assess");
  if (!h.evaluate)
    out.warnings.push_back("history has no exact evaluation: samples are interpolated linearly");
  const auto centre = temp_function(h, false);
  const auto mean = temp_function(h, true);
  const double t0 = h.samples.front().time_s;
  const double t1 = std::max(h.samples.back().time_s, h.end_s());
  // Temperature accuracy behind every margin's bound; samples interpolated linearly are within
  // the engine's sample_tol_K (0.01 K, conduction/history.hpp) on top of it.
  const double tol_K = std::max(0.0, opts.temperature_tol_K) + (h.evaluate ? 0.0 : 0.01);
  for (std::size_t i = 0; i < targets.size(); ++i) {
    const Target& t = targets[i];
    const std::string place = opts.origin + ": target[" + std::to_string(i + 1) + "]";
    TargetResult r;
    r.kind = t.kind;
    r.name = label_of(t);
    if (t.at != "centre" && t.at != "mean")
      throw InputError(place + ".at = \"" + t.at + "\": must be \"centre\" or \"mean\"");
    const auto& T_at = t.at == "mean" ? mean : centre;
    switch (t.kind) {
      case TargetKind::log_reduction:
      case TargetKind::f_value: {
        const Resolved res = resolve(t, place, organisms);
        r.kinetics = res.k;
        r.column = "F_" + r.name + "_min";
        r.source = res.k.source;
        double F_err_s = 0;  // quadrature error estimates of the credited F
        if (h.stages.empty()) {
          r.F_s = f_between(h, centre, t0, t1, res.k, opts.rel_tol, &F_err_s);
        } else {
          r.credited_stages = credited(t, h, place);
          for (std::size_t s = 0; s < h.stages.size(); ++s) {
            StageLethality sl;
            sl.stage = h.stages[s].name;
            double stage_err_s = 0;
            sl.F_s = f_recorded(h, centre, h.stages[s].start_s, h.stages[s].end_s, res.k, opts.rel_tol, opts.unrecorded_s,
                                &stage_err_s);
            sl.credited = std::find(r.credited_stages.begin(), r.credited_stages.end(),
                                    static_cast<int>(s)) != r.credited_stages.end();
            if (sl.credited) F_err_s += stage_err_s;
            sl.F_text = minutes_down(sl.F_s);
            if (sl.credited) r.F_s += sl.F_s;
            r.stages.push_back(sl);
          }
          r.F_outside_range_s = outside_range(h, centre, res.k, r.credited_stages, opts.rel_tol);
        }
        r.unrecorded_s = opts.unrecorded_s;
        gap_notes(r, opts.unrecorded_s, t0, "no lethality credited across");
        // The quadrature stops when its error estimate is within rel_tol·F (integrate.hpp), so
        // rel_tol·F bounds it; taken as the bound (not the estimate itself, which jumps as the
        // adaptive mesh changes) so that the margin stays smooth in a solve's parameter.
        F_err_s = std::max(F_err_s, opts.rel_tol * r.F_s);
        F_err_s += r.F_s * f_relative_error_of_temperature(res.k, tol_K);
        lethality_verdict(r, t, res, opts, place, F_err_s);
        provenance_notes(r, res);
        if (r.F_s > 0 && r.F_outside_range_s > opts.out_of_range_flag_fraction * r.F_s)
          r.notes.push_back("flag: " + shown_up(100 * r.F_outside_range_s / r.F_s, 2) +
                            " % of the credited F accrued outside the data's valid range " +
                            temp_token(res.k.valid_min_C, 10) + " to " + temp_token(res.k.valid_max_C, 10));
        break;
      }
      case TargetKind::cooling_rule: {
        const CoolingRule& rule = rules.at(t.rule, place);
        std::vector<std::string> ctx_notes;
        CoolingContext ctx = infer_context(h, rule, opts, T_at, ctx_notes);
        ctx.where = t.at == "mean" ? "mass-average temperature" : "cold spot";
        ctx.unrecorded_s = opts.unrecorded_s;
        std::vector<double> bp = knots(h, t0, t1);
        const CoolingCheck c = check_cooling(T_at, bp, rule, ctx, probes_for(bp));
        cooling_result(r, c, rule, crossing_error(T_at, tol_K, t0, t1));
        for (auto& n : ctx_notes) r.notes.push_back(n);
        break;
      }
      case TargetKind::cooking_table: {
        const CookingTable& table = cooking_table_for(t, place, opts);
        detail::Curve c;
        c.temp_C_at = recorded_only(T_at, opts.unrecorded_s);
        c.knots = knots(h, t0, t1);
        add_gap_knots(c.knots, opts.unrecorded_s);
        c.probes = probes_for(c.knots);
        const CookingCheck check = opts.unrecorded_s.empty()
                                       ? check_cooking_table(h, table, t.at == "mean")
                                       : check_cooking_table(c.temp_C_at, c.knots, table, c.probes);
        cooking_result(r, check, cooking_uncertainty(c, table, check, tol_K));
        gap_notes(r, opts.unrecorded_s, t0, "no time at temperature credited across");
        break;
      }
      case TargetKind::centre_min_temperature: {
        detail::Curve c;
        c.temp_C_at = T_at;
        c.knots = knots(h, t0, t1);
        c.probes = probes_for(c.knots);
        min_temperature_result(r, t, c, crossing_error(T_at, tol_K, t0, t1), opts.unrecorded_s);
        gap_notes(r, opts.unrecorded_s, t0, "no hold time credited across");
        break;
      }
    }
    out.targets.push_back(std::move(r));
  }
  return out;
}

std::vector<double> cumulative_f_s(const History& h, const TargetResult& r,
                                   std::span<const double> times_s, double rel_tol) {
  std::vector<double> out;
  if (!r.kinetics) return out;
  const auto centre = temp_function(h, false);
  const double t0 = h.samples.empty() ? 0.0 : h.samples.front().time_s;
  // Credited intervals: the credited stages, or everything when the history has no stages.
  std::vector<std::pair<double, double>> spans;
  if (h.stages.empty()) {
    spans.emplace_back(t0, std::numeric_limits<double>::infinity());
  } else {
    for (int i : r.credited_stages)
      for (const auto& piece : recorded_pieces(h.stages[static_cast<std::size_t>(i)].start_s,
                                               h.stages[static_cast<std::size_t>(i)].end_s, r.unrecorded_s))
        spans.push_back(piece);
  }
  double acc = 0, prev = t0;
  for (double t : times_s) {
    if (t > prev) {
      for (const auto& [a, b] : spans) {
        const double lo = std::max(a, prev), hi = std::min(b, t);
        if (hi > lo) acc += f_between(h, centre, lo, hi, *r.kinetics, rel_tol);
      }
      prev = t;
    }
    out.push_back(acc);
  }
  return out;
}

CookingCheck check_cooking_table(const History& h, const CookingTable& table, bool mean) {
  if (h.samples.empty()) throw InputError("history: no samples to check against " + table.key);
  const double t0 = h.samples.front().time_s;
  const double t1 = std::max(h.samples.back().time_s, h.end_s());
  const auto k = knots(h, t0, t1);
  if (k.size() < 2) throw InputError("history: a single instant cannot be checked against " + table.key);
  return check_cooking_table(temp_function(h, mean), k, table, probes_for(k));
}

ProbeAssessment assess_probe_log(std::span<const double> times_s, std::span<const double> temps_C,
                                 const std::vector<Target>& targets, const OrganismLibrary& organisms,
                                 const RuleLibrary& rules, const AssessOptions& opts,
                                 std::string_view origin) {
  validate_log(times_s, temps_C, origin);
  ProbeAssessment out;
  const detail::Curve curve = detail::linear_log_curve(times_s, temps_C);
  for (std::size_t i = 0; i < targets.size(); ++i) {
    const Target& t = targets[i];
    const std::string place = opts.origin + ": target[" + std::to_string(i + 1) + "]";
    TargetResult r;
    r.kind = t.kind;
    r.name = label_of(t);
    switch (t.kind) {
      case TargetKind::log_reduction:
      case TargetKind::f_value: {
        const Resolved res = resolve(t, place, organisms);
        r.kinetics = res.k;
        r.column = "F_" + r.name + "_min";
        r.source = res.k.source;
        ProbeLethality pl;
        pl.name = r.name;
        const LogIntegral tr = f_trapezoid_s(times_s, temps_C, res.k, origin, opts.max_gap_s);
        pl.F_trapezoid_s = tr.F_s;
        pl.F_simpson_s = f_simpson_s(times_s, temps_C, res.k, origin, opts.max_gap_s).F_s;
        pl.F_linear_s = f_piecewise_linear_s(times_s, temps_C, res.k, origin, opts.max_gap_s).F_s;
        if (std::isfinite(opts.max_gap_s))  // issue 11: no lethality credited where nothing was recorded
          for (std::size_t g = 1; g < times_s.size(); ++g)
            if (times_s[g] - times_s[g - 1] > opts.max_gap_s)
              r.notes.push_back("no lethality credited across the gap in the log from " + minutes_down(times_s[g - 1]) +
                                " to " + minutes_down(times_s[g]) + " (longer than " + shown_down(opts.max_gap_s) +
                                " s): the temperature meanwhile was not recorded");
        r.F_s = std::min({pl.F_trapezoid_s, pl.F_simpson_s, pl.F_linear_s});
        const double hi = std::max({pl.F_trapezoid_s, pl.F_simpson_s, pl.F_linear_s});
        if (r.F_s > 0 && hi - r.F_s > 0.01 * r.F_s)
          out.warnings.push_back(r.name + ": trapezoid, Simpson and linear-interpolation F differ by " +
                                 shown_up(100 * (hi - r.F_s) / r.F_s, 2) +
                                 " %; the smallest is used (the log may be too coarse)");
        for (const auto& w : tr.warnings) out.warnings.push_back(r.name + ": " + w);
        if (!t.stages.empty())
          r.notes.push_back("stages cannot be selected on a probe log: the whole log is credited");
        // Out-of-range share on the linear interpolant.
        if (res.organism) {
          double outside = 0;
          const double total = pl.F_linear_s;
          for (const auto& [a, b] : curve.intervals_at_or_above(res.k.valid_max_C, curve.start())) {
            std::vector<double> bp = knots_of(curve, a, b);
            outside += f_value(curve.temp_C_at, bp, res.k, opts.rel_tol).F_s;
          }
          double in_or_above = 0;
          for (const auto& [a, b] : curve.intervals_at_or_above(res.k.valid_min_C, curve.start())) {
            std::vector<double> bp = knots_of(curve, a, b);
            in_or_above += f_value(curve.temp_C_at, bp, res.k, opts.rel_tol).F_s;
          }
          outside += std::max(0.0, total - in_or_above);
          r.F_outside_range_s = outside;
          if (total > 0 && outside > opts.out_of_range_flag_fraction * total)
            r.notes.push_back("flag: " + shown_up(100 * outside / total, 2) +
                              " % of the credited F accrued outside the data's valid range " +
                              temp_token(res.k.valid_min_C, 10) + " to " +
                              temp_token(res.k.valid_max_C, 10));
        }
        // The log's rows are the data: the smallest of three exact rules on them is credited, so
        // the bound is the rounding of the sums (a few ulp per row).
        const double F_err_s = 4 * kEps * static_cast<double>(times_s.size() + 4) * std::abs(r.F_s);
        lethality_verdict(r, t, res, opts, place, F_err_s);
        provenance_notes(r, res);
        out.lethality.push_back(pl);
        break;
      }
      case TargetKind::cooling_rule: {
        const CoolingRule& rule = rules.at(t.rule, place);
        CoolingContext ctx;
        ctx.cook_end_s = opts.cook_end_s;
        ctx.chill_start_s = opts.chill_start_s;
        ctx.unrecorded_s = gaps_of_log(times_s, opts.max_gap_s);
        const CoolingCheck c = check_cooling(times_s, temps_C, rule, ctx, origin);
        cooling_result(r, c, rule, crossing_error(curve.temp_C_at, 0.0, curve.start(), curve.end()));
        break;
      }
      case TargetKind::cooking_table: {
        const CookingTable& table = cooking_table_for(t, place, opts);
        const Gaps gaps = gaps_of_log(times_s, opts.max_gap_s);
        if (gaps.empty()) {
          const CookingCheck check = check_cooking_table(times_s, temps_C, table, origin);
          cooking_result(r, check, cooking_uncertainty(curve, table, check, 0.0));
        } else {  // no time at temperature credited across a gap
          detail::Curve c = curve;
          c.temp_C_at = recorded_only(curve.temp_C_at, gaps);
          add_gap_knots(c.knots, gaps);
          const CookingCheck check = check_cooking_table(c.temp_C_at, c.knots, table, c.probes);
          cooking_result(r, check, cooking_uncertainty(c, table, check, 0.0));
          gap_notes(r, gaps, times_s.front(), "no time at temperature credited across");
        }
        break;
      }
      case TargetKind::centre_min_temperature:
        min_temperature_result(r, t, curve, crossing_error(curve.temp_C_at, 0.0, curve.start(), curve.end()),
                               gaps_of_log(times_s, opts.max_gap_s));
        break;
    }
    out.targets.push_back(std::move(r));
  }
  return out;
}

}  // namespace coldcore
