// Reading cooling-rules.toml into the rule library (io/libraries.hpp).
#include <cmath>
#include <set>
#include <string>
#include <utility>

#include "coldcore/io/libraries.hpp"
#include "coldcore/model/limits.hpp"
#include "coldcore/model/temperature_token.hpp"
#include "coldcore/number_text.hpp"
#include "io/detail/fields.hpp"
#include "io/detail/sourced.hpp"

namespace coldcore::io {

namespace {

using detail::Fields;
using detail::plain_keys;

/// A step's limit in °C, and its label token. A limit may be written in °C, in °F, or in both
/// when the rule's source states both (a code's "57 °C (135 °F)"): the °C value is then the one
/// computed with, each unit is shown as written, and the two must agree within 0.5 °C (the
/// rounding such codes use) so that a typo is caught.
double temperature(const Fields& s, const std::string& stem, std::string* label, std::optional<double>* written_F) {
  const std::optional<double> c = s.number(stem + "_C"), f = s.number(stem + "_F");
  if (!c && !f) s.fail_at("", "give " + stem + "_C, " + stem + "_F, or both as the rule's source writes them");
  const double v = c ? *c : (*f - 32.0) / 1.8;
  s.require_value_range(stem + " (in C)", v, limits::temperature_C, "C");
  if (c && f && std::abs((*f - 32.0) / 1.8 - *c) > 0.5)
    s.fail_at("", stem + "_C = " + number_text(*c) + " and " + stem + "_F = " + number_text(*f) + " (" +
                      number_text((*f - 32.0) / 1.8) + " C) disagree: the two must be the same limit within 0.5 C");
  if (f) *written_F = *f;
  if (label)
    *label = c && f ? temp_token_written(number_text(*c), number_text(*f), v)
                    : temp_token_text(number_text(std::round(v * 10) / 10), v);
  return v;
}

double duration_s(const Fields& s, const std::string& stem) {
  int n = 0;
  double v = 0;
  std::string key;
  for (auto [suffix, scale] : {std::pair{"_s", 1.0}, std::pair{"_min", 60.0}, std::pair{"_h", 3600.0}}) {
    if (auto written = s.number(stem + suffix)) {
      ++n;
      key = stem + suffix;
      v = *written * scale;
    }
  }
  if (n != 1) s.fail_at("", "give exactly one of " + stem + "_s, " + stem + "_min or " + stem + "_h");
  if (!(v > 0)) s.fail(key, "must be > 0");
  s.require_value_range(stem + " (in s)", v, limits::duration_s, "s");
  return v;
}

CoolingStep read_step(const Fields& s) {
  CoolingStep st;
  st.from_C = temperature(s, "from", &st.from_text, &st.from_written_F);
  st.to_C = temperature(s, "to", &st.to_text, &st.to_written_F);
  if (!(st.to_C < st.from_C))
    s.fail_at("", "to = " + number_text(st.to_C) + " C: must be below from = " + number_text(st.from_C) + " C");
  st.within_s = duration_s(s, "within");
  if (const toml::node* a = s.node("advisory")) {
    if (!a->is_boolean()) s.fail("advisory", "must be true or false");
    st.advisory = a->as_boolean()->get();
  }
  st.source = s.required_string("source", "the code or guide the step is taken from");
  st.status = detail::source_status(s);
  st.label = s.string("label").value_or("");
  // from_label words the start ("ambient") and keeps the end a temperature (shown in --units)
  const std::string from_label = s.string("from_label").value_or("");
  if (st.label.empty()) st.label = (from_label.empty() ? st.from_text : from_label) + " -> " + st.to_text;
  return st;
}

CoolingRule read_rule(const Fields& f, std::set<std::string>& seen) {
  CoolingRule r;
  detail::read_heading(r, f, seen, "the rule", "the code or guide the rule is taken from");
  if (auto m = f.number("chill_start_within_min")) {
    if (!(*m > 0)) f.fail("chill_start_within_min", "must be > 0");
    r.chill_start_within_s = *m * 60.0;
    r.chill_start_source =
        f.required_string("chill_start_source", "the code or guide the chill-start limit is taken from");
  }
  const auto steps = f.entries("step", "[[rule.step]] tables",
                               plain_keys({"from_C", "from_F", "to_C", "to_F", "within_s", "within_min", "within_h",
                                           "advisory", "source", "status", "label", "from_label"}));
  if (steps.empty()) f.fail("step", "must be one or more [[rule.step]] tables");
  for (const Fields& s : steps) r.steps.push_back(read_step(s));
  return r;
}

}  // namespace

RuleLibrary parse_cooling_rules(std::string_view toml_text, std::string_view origin) {
  const toml::table doc = detail::parse_toml(toml_text, std::string(origin));
  const Fields root(doc, std::string(origin), "", plain_keys({"schema", "rule"}));
  root.require_schema_1(false);  // custom rules written without one are accepted
  RuleLibrary lib;
  lib.origin = std::string(origin);
  std::set<std::string> seen;
  for (const Fields& f : root.entries("rule", "[[rule]] tables",
                                      plain_keys({"key", "name", "source", "status", "note", "step",
                                                  "chill_start_within_min", "chill_start_source"})))
    lib.rules.push_back(read_rule(f, seen));
  return lib;
}

}  // namespace coldcore::io
