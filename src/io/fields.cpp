#include "io/detail/fields.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <map>
#include <sstream>

#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"
#include "coldcore/suggest.hpp"
#include "io/detail/text.hpp"

namespace coldcore::io::detail {

namespace {

bool starts_with(std::string_view s, std::string_view prefix) {
  return s.size() > prefix.size() && s.substr(0, prefix.size()) == prefix;
}

bool accepts(Quantity q, std::string_view unit) {
  for (auto u : unit_suffixes(q))
    if (u == unit) return true;
  return false;
}

/// For a medium key's suffix: (time unit, temperature unit), or nullopt.
std::optional<std::pair<std::string, std::string>> medium_units(std::string_view suffix) {
  if (accepts(Quantity::temperature, suffix)) return std::pair<std::string, std::string>{"s", std::string(suffix)};
  const auto us = suffix.find('_');
  if (us == std::string_view::npos) return std::nullopt;
  const auto tu = suffix.substr(0, us), temp = suffix.substr(us + 1);
  if (accepts(Quantity::time, tu) && accepts(Quantity::temperature, temp))
    return std::pair<std::string, std::string>{std::string(tu), std::string(temp)};
  return std::nullopt;
}

/// Every accepted spelling of a spec, for "did you mean".
std::vector<std::string> all_spellings(const KeySpec& s) {
  std::vector<std::string> out;
  switch (s.form) {
    case KeyForm::plain: out.push_back(s.name); break;
    case KeyForm::quantity:
      for (auto u : unit_suffixes(s.quantity)) out.push_back(s.name + "_" + std::string(u));
      break;
    case KeyForm::medium:
      for (auto t : unit_suffixes(Quantity::temperature)) {
        out.push_back(s.name + "_" + std::string(t));
        for (auto tu : unit_suffixes(Quantity::time))
          out.push_back(s.name + "_" + std::string(tu) + "_" + std::string(t));
      }
      break;
  }
  return out;
}

/// Short form for an "accepted keys" list: "diameter_m|mm", "medium_C|F".
std::string short_form(const KeySpec& s) {
  if (s.form == KeyForm::plain) return s.name;
  const Quantity q = s.form == KeyForm::medium ? Quantity::temperature : s.quantity;
  std::string out = s.name + "_";
  bool first = true;
  for (auto u : unit_suffixes(q)) {
    if (!first) out += "|";
    out += u;
    first = false;
  }
  return out;
}

}  // namespace

double from_si(Quantity q, double si, std::string_view unit) {
  // to_si is a + b·x for every unit; invert it from two points.
  const double a = *to_si(q, 0.0, unit), b = *to_si(q, 1.0, unit) - a;
  return (si - a) / b;
}

std::string range_text(const limits::Range& r, std::optional<Quantity> q, std::string_view unit) {
  // Nine significant figures drop the conversion's last-bit noise (-328, not -328.00000000000006).
  const auto tidy = [](double v) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.9g", v);
    return format_number(std::strtod(buf, nullptr));
  };
  const double lo = q ? from_si(*q, r.low, unit) : r.low, hi = q ? from_si(*q, r.high, unit) : r.high;
  return "from " + tidy(lo) + " to " + tidy(hi) + (unit.empty() ? "" : " ") + std::string(unit_text(unit));
}

std::string spellings(std::string_view base, Quantity q) {
  std::string out;
  const auto units = unit_suffixes(q);
  for (std::size_t i = 0; i < units.size(); ++i) {
    if (i > 0) out += i + 1 == units.size() ? " or " : ", ";
    out += std::string(base) + "_" + std::string(units[i]);
  }
  return out;
}

toml::table parse_toml(std::string_view text, const std::string& origin) {
  try {
    return toml::parse(text, origin);
  } catch (const toml::parse_error& e) {
    throw InputError(origin + ":" + std::to_string(e.source().begin.line) + ":" +
                     std::to_string(e.source().begin.column) + ": not valid TOML: " + std::string(e.description()));
  }
}

std::string format_value(const toml::node& n) {
  if (auto v = n.as_integer()) return std::to_string(v->get());
  if (auto v = n.as_floating_point()) return format_number(v->get());
  if (auto v = n.as_string()) return quote(v->get());
  if (auto v = n.as_boolean()) return v->get() ? "true" : "false";
  if (auto a = n.as_array()) {
    std::string out = "[";
    for (std::size_t i = 0; i < a->size(); ++i) {
      if (i > 0) out += ", ";
      out += format_value(*a->get(i));
    }
    return out + "]";
  }
  if (auto t = n.as_table()) {
    // Inline when short; a whole [[stage]] table in a message would hide the point.
    std::string out = "{";
    bool first = true;
    for (auto&& [k, v] : *t) {
      out += first ? " " : ", ";
      out += std::string(k.str()) + " = " + format_value(v);
      first = false;
    }
    out += first ? "}" : " }";
    return out.size() <= 80 ? out : "{ ... }";
  }
  std::ostringstream os;
  n.visit([&](auto&& x) { os << x; });
  return os.str();
}

Fields::Fields(const toml::table& table, std::string origin, std::string path, std::vector<KeySpec> specs)
    : table_(table), origin_(std::move(origin)), path_(std::move(path)), specs_(std::move(specs)) {
  std::map<std::string, std::string> seen_base;  // base -> first spelling seen
  for (auto&& [k, v] : table_) {
    const std::string key(k.str());
    bool plain_match = false;
    for (const auto& s : specs_)
      if (s.form == KeyForm::plain && s.name == key) plain_match = true;
    if (plain_match) continue;

    const KeySpec* base = nullptr;
    for (const auto& s : specs_)
      if (s.form != KeyForm::plain && starts_with(key, s.name + "_") &&
          (base == nullptr || s.name.size() > base->name.size()))
        base = &s;
    if (base != nullptr) {
      const std::string suffix = key.substr(base->name.size() + 1);
      const bool ok = base->form == KeyForm::quantity ? accepts(base->quantity, suffix)
                                                      : medium_units(suffix).has_value();
      if (!ok) {
        std::string msg = "unknown unit suffix '_" + suffix + "'; ";
        // Suggest only a change of letter case or a dropped plural 's' ("_MM", "_mins"): nudging
        // "_in" towards "_m" would turn inches into metres.
        for (const auto& sp : all_spellings(*base)) {
          const std::string sp_suffix = sp.substr(base->name.size() + 1);
          if (edit_distance(suffix, sp_suffix) == 0 || suffix == sp_suffix + "s") {
            msg += "did you mean '" + sp + "'? ";
            break;
          }
        }
        msg += base->form == KeyForm::quantity
                   ? "accepted: " + spellings(base->name, base->quantity)
                   : "accepted: " + base->name + "_C or " + base->name + "_F (points may name the time unit: " +
                         base->name + "_min_C)";
        fail(key, msg);
      }
      auto [it, inserted] = seen_base.emplace(base->name, key);
      if (!inserted) fail(key, "given together with " + it->second + "; give one");
      continue;
    }

    std::vector<std::string> candidates;
    for (const auto& s : specs_)
      for (auto& c : all_spellings(s)) candidates.push_back(c);
    if (auto near = did_you_mean(key, candidates)) fail(key, "unknown key; did you mean '" + *near + "'?");
    std::string list;
    for (const auto& s : specs_) list += (list.empty() ? "" : ", ") + short_form(s);
    fail(key, "unknown key; accepted keys here: " + list);
  }
}

std::string Fields::key_path(std::string_view key) const {
  return path_.empty() ? std::string(key) : path_ + "." + std::string(key);
}

void Fields::fail(std::string_view key, const std::string& requirement) const {
  const toml::node* n = table_.get(key);
  std::string msg = origin_ + ": " + key_path(key);
  if (n != nullptr) msg += " = " + format_value(*n);
  throw InputError(msg + ": " + requirement);
}

void Fields::missing(std::string_view key, const std::string& requirement) const {
  throw InputError(origin_ + ": " + key_path(key) + ": missing: " + requirement);
}

void Fields::fail_value(std::string_view what, double value, const std::string& requirement) const {
  // number_text, not format_value: a converted value would show its last-bit noise.
  throw InputError(origin_ + ": " + key_path(what) + " = " + number_text(value) + ": " + requirement);
}

void Fields::fail_at(std::string_view where, const std::string& problem) const {
  const std::string place = where.empty() ? path_ : key_path(where);
  throw InputError(origin_ + ": " + (place.empty() ? "" : place + ": ") + problem);
}

Fields Fields::nested(std::string_view where, const toml::table& t, std::vector<KeySpec> specs) const {
  return Fields(t, origin_, key_path(where), std::move(specs));
}

std::vector<Fields> Fields::entries(std::string_view key, const std::string& requirement,
                                    const std::vector<KeySpec>& specs) const {
  const toml::array& a = tables(key, requirement);
  std::vector<Fields> out;
  out.reserve(a.size());
  for (std::size_t i = 0; i < a.size(); ++i)
    out.push_back(nested(std::string(key) + "[" + std::to_string(i + 1) + "]", *a.get(i)->as_table(), specs));
  return out;
}

const toml::node* Fields::node(std::string_view plain_key) const { return table_.get(plain_key); }

void Fields::require_schema_1(bool required) const {
  const toml::node* schema = node("schema");
  if (schema == nullptr) {
    if (required) missing("schema", "must be 1");
    return;
  }
  if (!schema->is_integer() || schema->as_integer()->get() != 1) fail("schema", "must be 1");
}

std::optional<Found> Fields::find(std::string_view base) const {
  const KeySpec* spec = nullptr;
  for (const auto& s : specs_)
    if (s.form != KeyForm::plain && s.name == base) spec = &s;
  if (spec == nullptr) return std::nullopt;
  for (auto&& [k, v] : table_) {
    const std::string key(k.str());
    if (!starts_with(key, spec->name + "_")) continue;
    const std::string suffix = key.substr(spec->name.size() + 1);
    if (spec->form == KeyForm::quantity && accepts(spec->quantity, suffix))
      return Found{key, suffix, "", &v};
    if (spec->form == KeyForm::medium)
      if (auto units = medium_units(suffix)) return Found{key, units->second, units->first, &v};
  }
  return std::nullopt;
}

}  // namespace coldcore::io::detail
