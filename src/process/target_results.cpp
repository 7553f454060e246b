// One target's result: lethality, cooling-rule, cooking-table and minimum-temperature verdicts.
#include "process/detail/assessing.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "coldcore/model/temperature_token.hpp"
#include "lethality/detail/crossing.hpp"
#include "lethality/detail/text.hpp"
#include "coldcore/suggest.hpp"

namespace coldcore {

using namespace assessing;

namespace assessing {

void provenance_notes(TargetResult& r, const Resolved& res) {
  if (!res.organism) {
    r.notes.push_back({TargetNoteKind::kinetics_without_range});
    return;
  }
  for (const auto& [key, v] : res.organism->values)
    if (v.status == "from memory")
    {
      TargetNote n{TargetNoteKind::value_from_memory};
      n.key = key;
      n.subject = res.k.key;
      n.source = v.source;
      r.notes.push_back(std::move(n));
    }
}

// F credited outside the organism's valid range, over the credited stages.
double outside_range(const History& h, const std::function<double(double)>& T, const Kinetics& k,
                     const std::vector<int>& stages, double rel_tol, std::span<const double> stage_F_s) {
  if (k.valid_min_C <= -1e299 && k.valid_max_C >= 1e299) return 0;
  double out = 0;
  for (int i : stages) {
    const auto& st = h.stages[static_cast<std::size_t>(i)];
    if (!(st.end_s > st.start_s)) continue;
    // The stage's whole F is the same integral the caller already has: reuse it (the same call
    // gives the same bits, so nothing changes but the time).
    const bool known = static_cast<std::size_t>(i) < stage_F_s.size();
    const auto F_of = [&](double a, double b) {
      return known && a == st.start_s && b == st.end_s ? stage_F_s[static_cast<std::size_t>(i)]
                                                       : f_between(h, T, a, b, k, rel_tol);
    };
    detail::Curve c;
    c.temp_C_at = T;
    c.knots = knots(h, st.start_s, st.end_s);
    c.probes = probes_for(c.knots);
    const detail::Curve::Sampled sampled = c.sample(st.start_s);  // both levels read one sampling
    for (const auto& [a, b] : c.intervals_at_or_above(k.valid_max_C, sampled)) out += F_of(a, b);
    double in_or_above_min = 0;
    for (const auto& [a, b] : c.intervals_at_or_above(k.valid_min_C, sampled)) in_or_above_min += F_of(a, b);
    const double stage_F = F_of(st.start_s, st.end_s);
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
      TargetNote n{TargetNoteKind::weibull_survival};
      n.value = k.weibull->delta_ref_s;
      n.low_C = k.reference_C;
      n.exponent = k.weibull->p;
      r.notes.push_back(n);
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
    decide(r);
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
    decide(r);
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
  decide(r);
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
                            const Gaps& gaps) {
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
  {
    TargetNote n{TargetNoteKind::never_reached};
    n.subject = t.at;
    n.low_C = t.min_temp_C;
    r.notes.push_back(std::move(n));
  }
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
                             const std::function<double(double)>& T, std::vector<TargetNote>& notes) {
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
      if (ctx.cook_end_s && ctx.chill_start_s) {
        TargetNote n{TargetNoteKind::chill_start_inferred};
        n.subject = st.name;
        n.from_s = *ctx.cook_end_s;
        n.to_s = *ctx.chill_start_s;
        notes.push_back(std::move(n));
      }
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

}  // namespace assessing

}  // namespace coldcore
