// Verdict words, shown values (rounded to the safe side) and the error bounds behind a margin.
#include "process/detail/assessing.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "lethality/detail/crossing.hpp"

namespace coldcore {

using namespace assessing;

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

namespace assessing {

// ---- Error bounds of a margin (issue 11: "met" on a margin of rounding noise) ----


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

// The verdict and the margin and verdict texts from r.margin and r.margin_uncertainty (every
// error term but rounding, which is added here). "met" needs margin > margin_uncertainty; a tie
// (|margin| within rounding) and a margin inside the bound are named as such, never "shortfall 0".
void decide(TargetResult& r) {
  const ShownUnit u = shown_unit(r.unit);
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
    r.notes.push_back({TargetNoteKind::exactly_at_required});
  } else if (std::abs(r.margin) <= r.margin_uncertainty) {
    r.margin_text = "±" + shown_up(r.margin_uncertainty * u.scale, 2) + u.suffix;
    r.margin_shown = "within the numerical uncertainty (" + r.margin_text + ")";
    r.verdict_text = "not demonstrated — within the numerical uncertainty of the target (margin " +
                     signed_small(r.margin, u) + ", uncertainty " + r.margin_text + ")";
    r.notes.push_back({TargetNoteKind::within_uncertainty});
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
  decide(r);
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
  r.achieved_text = shown_log_reduction(r.achieved, r.required) + " (credited F " + minutes_down(r.F_s) + ")";
  if (r.verdict == Verdict::met) {
    r.margin_text = "more than " + shown_down(n - r.required) + " log10";
    r.verdict_text = "met, margin " + r.margin_text;
  }
  TargetNote note{TargetNoteKind::log_reduction_capped};
  note.value = n;
  r.notes.push_back(note);
}

}  // namespace assessing

}  // namespace coldcore
