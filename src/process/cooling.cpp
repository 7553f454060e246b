#include "coldcore/process/cooling.hpp"
#include "coldcore/model/temperature_token.hpp"

#include <cmath>
#include <set>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "lethality/detail/crossing.hpp"
#include "lethality/detail/text.hpp"

namespace coldcore {

namespace {

std::string minutes(double s) { return detail::num(s / 60.0) + " min"; }

CoolingCheck check_curve(const detail::Curve& c, const CoolingRule& rule, const CoolingContext& ctx) {
  CoolingCheck out;
  out.rule_key = rule.key;
  bool all = true;
  for (const CoolingStep& st : rule.steps) {
    CoolingStepResult r;
    r.step = st;
    std::optional<double> start = c.first_fall_through(st.from_C, c.start());
    if (!start) {
      const auto [max_T, max_at] = c.max_on_grid();
      if (max_T <= st.from_C) {
        start = max_at;
        r.notes.push_back(ctx.where + " never exceeds " + temp_token(st.from_C, 10) +
                          " in the record; the clock starts at its highest temperature (" +
                          temp_token(max_T, 10) + " at " + minutes(max_at - c.start()) +
                          ") and any earlier time above it is not counted");
      } else {
        r.notes.push_back(ctx.where + " is still above " + temp_token(st.from_C, 10) +
                          " at the end of the record: the step's clock never started");
      }
    }
    if (start) {
      r.end_s = c.first_at_or_below(st.to_C, *start);
      r.reached = r.end_s.has_value();
      // issue 11: an unrecorded interval counts against the rule.
      for (const auto& [a, b] : ctx.unrecorded_s) {
        if (*start > a && *start < b) {
          r.notes.push_back("the clock would start inside a gap in the record (" + minutes(a - c.start()) + " to " +
                            minutes(b - c.start()) + "): it is taken to start at the gap's start");
          start = a;
        }
        if (r.end_s && *r.end_s > a && *r.end_s < b) {
          r.notes.push_back(temp_token(st.to_C, 10) + " is reached inside a gap in the record (" +
                            minutes(a - c.start()) + " to " + minutes(b - c.start()) +
                            "): it is taken as reached at the gap's end, the first reading after it");
          r.end_s = b;
        }
      }
      r.start_s = start;
      r.elapsed_s = (r.reached ? *r.end_s : c.end()) - *start;
      r.margin_s = st.within_s - r.elapsed_s;
      if (!r.reached)
        r.notes.push_back(ctx.where + " did not reach " + temp_token(st.to_C, 10) +
                          " within the record (" + minutes(r.elapsed_s) + " after the clock start)");
      // Re-heating above from_C after the clock started: the clock is not restarted.
      const double stop = r.reached ? *r.end_s : c.end();
      for (const auto& [a, b] : c.intervals_at_or_above(st.from_C, *start)) {
        if (a > *start + 1e-6 && a < stop && c.temp_C_at(0.5 * (a + b)) > st.from_C) {
          r.notes.push_back(ctx.where + " rose above " + temp_token(st.from_C, 10) + " again at " +
                            minutes(a - c.start()) + "; the clock was not restarted");
          break;
        }
      }
      r.passed = r.reached && r.margin_s > 0;
    }
    if (!r.reached) r.temp_at_record_end_C = c.temp_C_at(c.end());
    if (st.advisory) {
      if (!r.passed)
        out.notes.push_back("flag: " + st.label + " took longer than " + minutes(st.within_s) +
                            " (or was not reached): " + st.source);
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
        out.notes.push_back("chilling began " + minutes(*out.chill_delay_s) +
                            " after the cook; the rule requires within " +
                            minutes(*rule.chill_start_within_s));
      }
    } else {
      all = false;
      out.notes.push_back("the time from the end of the cook to the start of chilling is not known: "
                          "the rule's condition (within " + minutes(*rule.chill_start_within_s) +
                          ") is not demonstrated");
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
