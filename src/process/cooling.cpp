#include "coldcore/process/cooling.hpp"
#include "coldcore/model/temperature_token.hpp"

#include <cmath>
#include <set>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "lethality/detail/crossing.hpp"
#include "lethality/detail/text.hpp"
#include "lethality/detail/toml_read.hpp"

namespace coldcore {

const CoolingRule* RuleLibrary::find(std::string_view key) const {
  for (const auto& r : rules)
    if (r.key == key) return &r;
  return nullptr;
}

const CoolingRule& RuleLibrary::at(std::string_view key, std::string_view place) const {
  if (const CoolingRule* r = find(key)) return *r;
  std::vector<std::string> keys;
  for (const auto& r : rules) keys.push_back(r.key);
  std::string msg = std::string(place) + ": rule = \"" + std::string(key) + "\": not in " +
                    (origin.empty() ? std::string("the rule library") : origin);
  const std::string near = detail::nearest(key, keys);
  if (!near.empty()) msg += "; did you mean '" + near + "'?";
  throw InputError(msg);
}

namespace {

/// A step's limit in °C, and its label token. A limit may be written in °C, in °F, or in both
/// when the rule's source states both (a code's "57 °C (135 °F)"): the °C value is then the one
/// computed with, each unit is shown as written, and the two must agree within 0.5 °C (the
/// rounding such codes use) so that a typo is caught.
double temperature(const toml::table& t, const std::string& stem, std::string_view origin,
                   const std::string& place, std::string* label, std::optional<double>* written_F) {
  const bool c = t.contains(stem + "_C"), f = t.contains(stem + "_F");
  if (!c && !f)
    throw InputError(std::string(origin) + ": " + place + ": give " + stem + "_C, " + stem + "_F, or both as the rule's source writes them");
  const double v_C = c ? detail::get_number(t, stem + "_C", origin, place) : 0.0;
  const double v_F = f ? detail::get_number(t, stem + "_F", origin, place) : 0.0;
  const double v = c ? v_C : (v_F - 32.0) / 1.8;
  detail::require_in(v, limits::temperature_C, origin, place + "." + stem + " (in C)", "C");
  if (c && f && std::abs((v_F - 32.0) / 1.8 - v_C) > 0.5)
    throw InputError(std::string(origin) + ": " + place + ": " + stem + "_C = " + detail::num(v_C) + " and " + stem +
                     "_F = " + detail::num(v_F) + " (" + detail::num((v_F - 32.0) / 1.8) +
                     " C) disagree: the two must be the same limit within 0.5 C");
  if (f) *written_F = v_F;
  if (label)
    *label = c && f ? temp_token_written(detail::num(v_C), detail::num(v_F), v)
                    : temp_token_text(detail::num(std::round(v * 10) / 10), v);
  return v;
}

double duration_s(const toml::table& t, const std::string& stem, std::string_view origin,
                  const std::string& place) {
  int n = 0;
  double v = 0;
  std::string key;
  for (auto [suffix, scale] : {std::pair{"_s", 1.0}, std::pair{"_min", 60.0}, std::pair{"_h", 3600.0}}) {
    if (t.contains(stem + suffix)) {
      ++n;
      key = stem + suffix;
      v = detail::get_number(t, key, origin, place) * scale;
    }
  }
  if (n != 1)
    throw InputError(std::string(origin) + ": " + place + ": give exactly one of " + stem +
                     "_s, " + stem + "_min or " + stem + "_h");
  if (!(v > 0))
    throw InputError(std::string(origin) + ": " + place + "." + key + " = " + detail::num(v) +
                     ": must be > 0");
  detail::require_in(v, limits::duration_s, origin, place + "." + stem + " (in s)", "s");
  return v;
}

std::string minutes(double s) { return detail::num(s / 60.0) + " min"; }

}  // namespace

RuleLibrary parse_cooling_rules(std::string_view toml_text, std::string_view origin) {
  const toml::table root = detail::parse_toml(toml_text, origin);
  detail::check_keys(root, {"schema", "rule"}, origin, "top level");
  RuleLibrary lib;
  lib.origin = std::string(origin);
  const toml::array* arr = root["rule"].as_array();
  if (!arr) throw InputError(std::string(origin) + ": rule: missing ([[rule]] tables)");
  std::set<std::string> seen;
  for (std::size_t i = 0; i < arr->size(); ++i) {
    const toml::table* t = (*arr)[i].as_table();
    const std::string place = "rule[" + std::to_string(i + 1) + "]";
    if (!t) throw InputError(std::string(origin) + ": " + place + ": must be a table");
    detail::check_keys(*t,
                       {"key", "name", "source", "status", "note", "step", "chill_start_within_min",
                        "chill_start_source"},
                       origin, place);
    CoolingRule r;
    r.key = detail::get_string(*t, "key", origin, place);
    if (!seen.insert(r.key).second)
      throw InputError(std::string(origin) + ": " + place + ".key = \"" + r.key + "\": duplicate key");
    r.name = detail::get_string(*t, "name", origin, place);
    r.source = detail::get_string(*t, "source", origin, place);
    r.status = detail::get_string(*t, "status", origin, place);
    detail::check_status(r.status, origin, place);
    r.note = detail::get_string(*t, "note", origin, place, false);
    if (t->contains("chill_start_within_min")) {
      const double m = detail::get_number(*t, "chill_start_within_min", origin, place);
      if (!(m > 0))
        throw InputError(std::string(origin) + ": " + place + ".chill_start_within_min = " +
                         detail::num(m) + ": must be > 0");
      r.chill_start_within_s = m * 60.0;
      r.chill_start_source = detail::get_string(*t, "chill_start_source", origin, place);
    }
    const toml::array* steps = (*t)["step"].as_array();
    if (!steps || steps->empty())
      throw InputError(std::string(origin) + ": " + place + ".step: missing ([[rule.step]] tables)");
    for (std::size_t j = 0; j < steps->size(); ++j) {
      const toml::table* s = (*steps)[j].as_table();
      const std::string sp = place + ".step[" + std::to_string(j + 1) + "]";
      if (!s) throw InputError(std::string(origin) + ": " + sp + ": must be a table");
      detail::check_keys(*s,
                         {"from_C", "from_F", "to_C", "to_F", "within_s", "within_min", "within_h",
                          "advisory", "source", "status", "label", "from_label"},
                         origin, sp);
      CoolingStep st;
      st.from_C = temperature(*s, "from", origin, sp, &st.from_text, &st.from_written_F);
      st.to_C = temperature(*s, "to", origin, sp, &st.to_text, &st.to_written_F);
      if (!(st.to_C < st.from_C))
        throw InputError(std::string(origin) + ": " + sp + ": to = " + detail::num(st.to_C) +
                         " C: must be below from = " + detail::num(st.from_C) + " C");
      st.within_s = duration_s(*s, "within", origin, sp);
      if (s->contains("advisory")) {
        auto a = (*s)["advisory"].value<bool>();
        if (!a) throw InputError(std::string(origin) + ": " + sp + ".advisory: must be true or false");
        st.advisory = *a;
      }
      st.source = detail::get_string(*s, "source", origin, sp);
      st.status = detail::get_string(*s, "status", origin, sp);
      detail::check_status(st.status, origin, sp);
      st.label = detail::get_string(*s, "label", origin, sp, false);
      // from_label words the start ("ambient") and keeps the end a temperature (shown in --units)
      const std::string from_label = detail::get_string(*s, "from_label", origin, sp, false);
      if (st.label.empty())
        st.label = (from_label.empty() ? st.from_text : from_label) + " -> " + st.to_text;
      r.steps.push_back(st);
    }
    lib.rules.push_back(std::move(r));
  }
  return lib;
}

namespace {

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
