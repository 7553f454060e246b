// Reading organisms.toml into the organism library (io/libraries.hpp).
#include <optional>
#include <set>
#include <string>

#include "coldcore/io/libraries.hpp"
#include "coldcore/model/limits.hpp"
#include "coldcore/number_text.hpp"
#include "io/detail/fields.hpp"
#include "io/detail/sourced.hpp"

namespace coldcore::io {

namespace {

using detail::Fields;
using detail::plain_keys;
using detail::sourced;

// Weibull shape p: published fits lie roughly within 0.2-5 (from memory); 0.05-20 only stops garbage.
constexpr limits::Range kWeibullShape{0.05, 20.0};

// Reads a sourced time given as <stem>_s or <stem>_min (exactly one of them), in s.
std::optional<Sourced> sourced_time(const Fields& f, const std::string& stem) {
  const bool s = f.node(stem + "_s") != nullptr, m = f.node(stem + "_min") != nullptr;
  if (s && m) f.fail_at("", "give " + stem + "_s or " + stem + "_min, not both");
  if (s) return sourced(f, stem + "_s", 1.0);
  if (m) return sourced(f, stem + "_min", 60.0);
  return std::nullopt;
}

// A rate parameter: > 0 (a zero or negative one has no meaning) and within `r`, in SI `unit`.
void require_positive_in(const Fields& f, const std::string& what, const Sourced& v, const limits::Range& r,
                         std::string_view unit) {
  if (!(v.value > 0)) f.fail_value(what, v.value, "must be > 0");
  f.require_value_range(what, v.value, r, unit);
}

Weibull read_weibull(const Fields& w, Organism& o) {
  auto delta = sourced_time(w, "delta_ref");
  if (!delta) w.missing("delta_ref_min", "the Weibull scale at the reference temperature (delta_ref_s or delta_ref_min)");
  require_positive_in(w, "delta_ref", *delta, limits::duration_s, "s");
  const Sourced p = sourced(w, "p");
  require_positive_in(w, "p", p, kWeibullShape, "(dimensionless)");
  o.values.emplace_back("weibull.delta_ref_s", *delta);
  o.values.emplace_back("weibull.p", p);
  return Weibull{delta->value, p.value};
}

EquivalenceTable read_equivalence(const Fields& e) {
  EquivalenceTable eq;
  eq.source = e.required_string("source", "the publication the table is taken from");
  eq.status = detail::source_status(e);
  eq.note = e.string("note").value_or("");
  eq.F_ref_s = 60.0 * e.required_number("F_ref_min", "the reference process's F-value in min");
  e.require_value_range("F_ref_min (in s)", eq.F_ref_s, limits::duration_s, "s");
  const toml::node* rows_node = e.node("rows_min");
  if (rows_node == nullptr) e.missing("rows_min", "[[temp_C, time_min], ...]");
  const toml::array* rows = rows_node->as_array();
  if (rows == nullptr) e.fail("rows_min", "must be [[temp_C, time_min], ...]");
  for (std::size_t r = 0; r < rows->size(); ++r) {
    const toml::array* row = (*rows)[r].as_array();
    const auto T = row && row->size() == 2 ? (*row)[0].value<double>() : std::nullopt;
    const auto m = row && row->size() == 2 ? (*row)[1].value<double>() : std::nullopt;
    if (!T || !m || !(*m > 0) || !limits::temperature_C.contains(*T) || !limits::duration_s.contains(*m * 60.0))
      e.fail_at("rows_min[" + std::to_string(r + 1) + "]",
                "must be [temp_C, time_min] with temp_C from " + number_text(limits::temperature_C.low) + " to " +
                    number_text(limits::temperature_C.high) + " and time_min > 0, at most a year");
    eq.rows.push_back({*T, *m * 60.0});
  }
  return eq;
}

Organism read_organism(const Fields& f, std::set<std::string>& seen) {
  Organism o;
  Kinetics& k = o.kinetics;
  k.key = f.required_string("key", "the organism's key, in double quotes (targets name it)");
  if (k.key.empty()) f.fail("key", "must not be empty");
  if (!seen.insert(k.key).second) f.fail("key", "duplicate key");
  k.name = f.required_string("name", "a name for reports, in double quotes");
  o.kind = f.required_string("kind", "\"vegetative\", \"spore\" or \"quality\"");
  if (o.kind != "vegetative" && o.kind != "spore" && o.kind != "quality")
    f.fail("kind", "must be \"vegetative\", \"spore\" or \"quality\"");
  auto add = [&](const std::string& key, const Sourced& v) { o.values.emplace_back(key, v); };
  const Sourced ref = sourced(f, "reference_C");
  f.require_value_range("reference_C", ref.value, limits::temperature_C, "C");
  add("reference_C", ref);
  k.reference_C = ref.value;
  const Sourced z = sourced(f, "z_C");
  require_positive_in(f, "z_C", z, limits::z_C, "C");
  add("z_C", z);
  k.z_C = z.value;
  const bool has_z_below = f.node("z_below_C") != nullptr;
  if (has_z_below != (f.node("split_C") != nullptr)) f.fail_at("", "z_below_C and split_C must be given together");
  if (has_z_below) {
    const Sourced zb = sourced(f, "z_below_C");
    require_positive_in(f, "z_below_C", zb, limits::z_C, "C");
    const Sourced sp = sourced(f, "split_C");
    f.require_value_range("split_C", sp.value, limits::temperature_C, "C");
    add("z_below_C", zb);
    add("split_C", sp);
    k.z_below_C = zb.value;
    k.split_C = sp.value;
  }
  if (auto d = sourced_time(f, "D_ref")) {
    require_positive_in(f, "D_ref", *d, limits::duration_s, "s");
    add("D_ref_s", *d);
    k.D_ref_s = d->value;
  }
  const Sourced vmin = sourced(f, "valid_min_C");
  const Sourced vmax = sourced(f, "valid_max_C");
  f.require_value_range("valid_min_C", vmin.value, limits::temperature_C, "C");
  f.require_value_range("valid_max_C", vmax.value, limits::temperature_C, "C");
  if (!(vmin.value < vmax.value))
    f.fail_value("valid_min_C", vmin.value, "must be < valid_max_C = " + number_text(vmax.value));
  if (k.reference_C < vmin.value || k.reference_C > vmax.value)
    f.fail_value("reference_C", k.reference_C,
                 "must lie in the valid range [" + number_text(vmin.value) + ", " + number_text(vmax.value) + "]");
  add("valid_min_C", vmin);
  add("valid_max_C", vmax);
  k.valid_min_C = vmin.value;
  k.valid_max_C = vmax.value;
  if (const toml::node* w = f.node("weibull")) {
    if (!w->is_table()) f.fail("weibull", "must be a table { delta_ref_s|delta_ref_min = ..., p = ... }");
    k.weibull = read_weibull(f.nested("weibull", *w->as_table(), plain_keys({"delta_ref_s", "delta_ref_min", "p"})), o);
  }
  if (const toml::node* e = f.node("equivalence")) {
    if (!e->is_table()) f.fail("equivalence", "must be a table { source, status, F_ref_min, rows_min }");
    o.equivalence = read_equivalence(
        f.nested("equivalence", *e->as_table(), plain_keys({"source", "status", "note", "F_ref_min", "rows_min"})));
  }
  // The organism's source line: each value's source once, in the order read.
  k.source.clear();
  for (const auto& [key, v] : o.values) {
    if (k.source.find(v.source) == std::string::npos) {
      if (!k.source.empty()) k.source += "; ";
      k.source += v.source;
    }
  }
  return o;
}

}  // namespace

OrganismLibrary parse_organisms(std::string_view toml_text, std::string_view origin) {
  const toml::table doc = detail::parse_toml(toml_text, std::string(origin));
  const Fields root(doc, std::string(origin), "", plain_keys({"schema", "organism"}));
  root.require_schema_1(false);  // custom organisms written without one are accepted
  OrganismLibrary lib;
  lib.origin = std::string(origin);
  std::set<std::string> seen;
  for (const Fields& f : root.entries("organism", "[[organism]] tables",
                                      plain_keys({"key", "name", "kind", "reference_C", "z_C", "z_below_C", "split_C",
                                                  "D_ref_s", "D_ref_min", "valid_min_C", "valid_max_C", "weibull",
                                                  "equivalence", "note"})))
    lib.organisms.push_back(read_organism(f, seen));
  return lib;
}

}  // namespace coldcore::io
