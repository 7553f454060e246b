// Typed reads of one table's values (io/detail/fields.hpp): strings, numbers, arrays of
// tables, quantities converted to SI, and the range checks that follow them.
#include <cmath>

#include "io/detail/fields.hpp"

namespace coldcore::io::detail {

std::optional<std::string> Fields::string(std::string_view key) const {
  const toml::node* n = node(key);
  if (n == nullptr) return std::nullopt;
  if (auto s = n->as_string()) return s->get();
  fail(key, "must be a string, in double quotes");
}

std::string Fields::required_string(std::string_view key, const std::string& requirement) const {
  auto s = string(key);
  if (!s) missing(key, requirement);
  return *s;
}

double Fields::number_of(std::string_view key, const toml::node& n, bool allow_inf,
                         std::string_view what) const {
  double v = 0;
  if (auto i = n.as_integer()) {
    v = static_cast<double>(i->get());
  } else if (auto f = n.as_floating_point()) {
    v = f->get();
  } else {
    fail(key, what.empty() ? std::string("must be a number") : "must be a number (" + std::string(what) + ")");
  }
  if (std::isnan(v) || (!allow_inf && std::isinf(v))) fail(key, "must be a finite number");
  return v;
}

std::optional<double> Fields::number(std::string_view key, std::string_view what) const {
  const toml::node* n = node(key);
  if (n == nullptr) return std::nullopt;
  return number_of(key, *n, false, what);
}

double Fields::required_number(std::string_view key, const std::string& requirement, std::string_view what) const {
  const toml::node* n = node(key);
  if (n == nullptr) missing(key, requirement);
  return number_of(key, *n, false, what);
}

const toml::array& Fields::tables(std::string_view key, const std::string& requirement) const {
  const toml::node* n = node(key);
  if (n == nullptr) missing(key, requirement);
  const toml::array* a = n->as_array();
  // An empty array is an array of tables too: the caller decides whether none is allowed.
  if (a == nullptr || !(a->empty() || a->is_array_of_tables())) fail(key, "must be " + requirement);
  return *a;
}

std::optional<double> Fields::quantity_si(std::string_view base, Found* found) const {
  auto f = find(base);
  if (!f) return std::nullopt;
  const KeySpec* spec = nullptr;
  for (const auto& s : specs_)
    if (s.name == base) spec = &s;
  const std::string what = std::string(quantity_name(spec->quantity)) + " in " + f->unit;
  const double raw = number_of(f->key, *f->node, false, what);
  if (found != nullptr) *found = *f;
  return *to_si(spec->quantity, raw, f->unit);
}

void Fields::require_range(std::string_view key, double si, const limits::Range& r, std::optional<Quantity> q,
                           std::string_view unit, std::string_view why) const {
  if (r.contains(si)) return;
  std::string need = "must be " + range_text(r, q, unit);
  if (!why.empty()) need += " (" + std::string(why) + ")";
  fail(key, need);
}

void Fields::require_value_range(std::string_view what, double value, const limits::Range& r,
                                 std::string_view unit) const {
  if (!r.contains(value)) fail_value(what, value, "must be " + range_text(r, std::nullopt, unit));
}

}  // namespace coldcore::io::detail
