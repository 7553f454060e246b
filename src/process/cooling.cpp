#include "coldcore/process/cooling.hpp"

#include <cmath>
#include <set>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "lethality/detail/crossing.hpp"

namespace coldcore {

namespace {

CoolingCheck check_curve(const detail::Curve& c, const CoolingRule& rule, const CoolingContext& ctx) {
  CoolingCheck out;
  out.rule_key = rule.key;
  out.subject = ctx.where;
  bool all = true;
  for (const CoolingStep& st : rule.steps) {
    CoolingStepResult r;
    r.step = st;
    std::optional<double> start = c.first_fall_through(st.from_C, c.start());
    if (!start) {
      const auto [max_T, max_at] = c.max_on_grid();
      if (max_T <= st.from_C) {
        start = max_at;
        CoolingNote n{CoolingNoteKind::never_above_start};
        n.step = out.steps.size();
        n.peak_C = max_T;
        n.at_s = max_at - c.start();
        r.notes.push_back(n);
      } else {
        CoolingNote n{CoolingNoteKind::above_start_at_end};
        n.step = out.steps.size();
        r.notes.push_back(n);
      }
    }
    if (start) {
      r.end_s = c.first_at_or_below(st.to_C, *start);
      r.reached = r.end_s.has_value();
      // issue 11: an unrecorded interval counts against the rule.
      for (const auto& [a, b] : ctx.unrecorded_s) {
        if (*start > a && *start < b) {
          CoolingNote n{CoolingNoteKind::start_in_gap};
          n.step = out.steps.size();
          n.gap_from_s = a - c.start();
          n.gap_to_s = b - c.start();
          r.notes.push_back(n);
          start = a;
        }
        if (r.end_s && *r.end_s > a && *r.end_s < b) {
          CoolingNote n{CoolingNoteKind::end_in_gap};
          n.step = out.steps.size();
          n.gap_from_s = a - c.start();
          n.gap_to_s = b - c.start();
          r.notes.push_back(n);
          r.end_s = b;
        }
      }
      r.start_s = start;
      r.elapsed_s = (r.reached ? *r.end_s : c.end()) - *start;
      r.margin_s = st.within_s - r.elapsed_s;
      if (!r.reached) {
        CoolingNote n{CoolingNoteKind::end_not_reached};
        n.step = out.steps.size();
        n.at_s = r.elapsed_s;
        r.notes.push_back(n);
      }
      // Re-heating above from_C after the clock started: the clock is not restarted.
      const double stop = r.reached ? *r.end_s : c.end();
      for (const auto& [a, b] : c.intervals_at_or_above(st.from_C, *start)) {
        if (a > *start + 1e-6 && a < stop && c.temp_C_at(0.5 * (a + b)) > st.from_C) {
          CoolingNote n{CoolingNoteKind::rose_again};
          n.step = out.steps.size();
          n.at_s = a - c.start();
          r.notes.push_back(n);
          break;
        }
      }
      r.passed = r.reached && r.margin_s > 0;
    }
    if (!r.reached) r.temp_at_record_end_C = c.temp_C_at(c.end());
    if (st.advisory) {
      if (!r.passed) {
        CoolingNote n{CoolingNoteKind::advisory_exceeded};
        n.step = out.steps.size();
        n.limit_s = st.within_s;
        out.notes.push_back(n);
      }
    } else if (!r.passed) {
      all = false;
    }
    out.steps.push_back(std::move(r));
  }
  if (rule.chill_start_within_s) {
    if (ctx.cook_end_s && ctx.chill_start_s) {
      out.chill_delay_s = *ctx.chill_start_s - *ctx.cook_end_s;
      out.chill_delay_margin_s = *rule.chill_start_within_s - *out.chill_delay_s;
      if (!(*out.chill_delay_margin_s > 0)) {
        all = false;
        CoolingNote n{CoolingNoteKind::chill_start_late};
        n.at_s = *out.chill_delay_s;
        n.limit_s = *rule.chill_start_within_s;
        out.notes.push_back(n);
      }
    } else {
      all = false;
      CoolingNote n{CoolingNoteKind::chill_start_unknown};
      n.limit_s = *rule.chill_start_within_s;
      out.notes.push_back(n);
    }
  }
  out.passed = all;
  return out;
}

}  // namespace

CoolingCheck check_cooling(std::span<const double> times_s, std::span<const double> temps_C,
                           const CoolingRule& rule, const CoolingContext& ctx,
                           std::string_view origin) {
  validate_log(times_s, temps_C, origin);
  return check_curve(detail::linear_log_curve(times_s, temps_C), rule, ctx);
}

CoolingCheck check_cooling(const std::function<double(double)>& temp_C_at,
                           std::span<const double> breakpoints_s, const CoolingRule& rule,
                           const CoolingContext& ctx, int probes) {
  if (breakpoints_s.size() < 2)
    throw InputError("check_cooling: breakpoints = " + std::to_string(breakpoints_s.size()) +
                     ": must be >= 2");
  detail::Curve c;
  c.temp_C_at = temp_C_at;
  c.knots.assign(breakpoints_s.begin(), breakpoints_s.end());
  c.probes = std::max(1, probes);
  return check_curve(c, rule, ctx);
}

}  // namespace coldcore
