// Reading cooling-rules.toml into the rule library (io/libraries.hpp).
#include <cmath>
#include <set>
#include <string>

#include "coldcore/error.hpp"
#include "coldcore/io/libraries.hpp"
#include "coldcore/model/limits.hpp"
#include "coldcore/model/temperature_token.hpp"
#include "coldcore/number_text.hpp"
#include "io/detail/library_toml.hpp"

namespace coldcore::io {

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
    throw InputError(std::string(origin) + ": " + place + ": " + stem + "_C = " + number_text(v_C) + " and " + stem +
                     "_F = " + number_text(v_F) + " (" + number_text((v_F - 32.0) / 1.8) +
                     " C) disagree: the two must be the same limit within 0.5 C");
  if (f) *written_F = v_F;
  if (label)
    *label = c && f ? temp_token_written(number_text(v_C), number_text(v_F), v)
                    : temp_token_text(number_text(std::round(v * 10) / 10), v);
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
    throw InputError(std::string(origin) + ": " + place + "." + key + " = " + number_text(v) +
                     ": must be > 0");
  detail::require_in(v, limits::duration_s, origin, place + "." + stem + " (in s)", "s");
  return v;
}

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
                         number_text(m) + ": must be > 0");
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
        throw InputError(std::string(origin) + ": " + sp + ": to = " + number_text(st.to_C) +
                         " C: must be below from = " + number_text(st.from_C) + " C");
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

}  // namespace coldcore::io
