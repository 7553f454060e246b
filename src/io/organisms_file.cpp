// Reading organisms.toml into the organism library (io/libraries.hpp).
#include <optional>
#include <set>
#include <string>

#include "coldcore/error.hpp"
#include "coldcore/io/libraries.hpp"
#include "coldcore/model/limits.hpp"
#include "coldcore/number_text.hpp"
#include "io/detail/library_toml.hpp"

namespace coldcore::io {

namespace {

// Weibull shape p: published fits lie roughly within 0.2-5 (from memory); 0.05-20 only stops garbage.
constexpr limits::Range kWeibullShape{0.05, 20.0};


// Reads a sourced time given as <stem>_s or <stem>_min (exactly one of them).
std::optional<Sourced> sourced_time(const toml::table& t, const std::string& stem,
                                    std::string_view origin, const std::string& place) {
  const bool s = t.contains(stem + "_s"), m = t.contains(stem + "_min");
  if (s && m)
    throw InputError(std::string(origin) + ": " + place + ": give " + stem + "_s or " + stem +
                     "_min, not both");
  if (s) return detail::get_sourced(t, stem + "_s", origin, place, 1.0);
  if (m) return detail::get_sourced(t, stem + "_min", origin, place, 60.0);
  return std::nullopt;
}

void require_positive(const Sourced& v, std::string_view origin, const std::string& where) {
  if (!(v.value > 0))
    throw InputError(std::string(origin) + ": " + where + " = " + number_text(v.value) +
                     ": must be > 0");
}


}  // namespace

OrganismLibrary parse_organisms(std::string_view toml_text, std::string_view origin) {
  const toml::table root = detail::parse_toml(toml_text, origin);
  detail::check_keys(root, {"schema", "organism"}, origin, "top level");
  OrganismLibrary lib;
  lib.origin = std::string(origin);
  if (root.contains("schema") && detail::get_number(root, "schema", origin, "top level") != 1)
    throw InputError(std::string(origin) + ": schema = " +
                     number_text(detail::get_number(root, "schema", origin, "top level")) +
                     ": must be 1");
  const toml::array* arr = root["organism"].as_array();
  if (!arr) throw InputError(std::string(origin) + ": organism: missing ([[organism]] tables)");
  std::set<std::string> seen;
  for (std::size_t i = 0; i < arr->size(); ++i) {
    const toml::table* t = (*arr)[i].as_table();
    const std::string place = "organism[" + std::to_string(i + 1) + "]";
    if (!t) throw InputError(std::string(origin) + ": " + place + ": must be a table");
    detail::check_keys(*t,
                       {"key", "name", "kind", "reference_C", "z_C", "z_below_C", "split_C",
                        "D_ref_s", "D_ref_min", "valid_min_C", "valid_max_C", "weibull",
                        "equivalence", "note"},
                       origin, place);
    Organism o;
    Kinetics& k = o.kinetics;
    k.key = detail::get_string(*t, "key", origin, place);
    if (k.key.empty()) throw InputError(std::string(origin) + ": " + place + ".key = \"\": must not be empty");
    if (!seen.insert(k.key).second)
      throw InputError(std::string(origin) + ": " + place + ".key = \"" + k.key +
                       "\": duplicate key");
    k.name = detail::get_string(*t, "name", origin, place);
    o.kind = detail::get_string(*t, "kind", origin, place);
    if (o.kind != "vegetative" && o.kind != "spore" && o.kind != "quality")
      throw InputError(std::string(origin) + ": " + place + ".kind = \"" + o.kind +
                       "\": must be \"vegetative\", \"spore\" or \"quality\"");
    auto add = [&](const std::string& key, const Sourced& v) { o.values.emplace_back(key, v); };
    const Sourced ref = detail::get_sourced(*t, "reference_C", origin, place);
    detail::require_in(ref.value, limits::temperature_C, origin, place + ".reference_C", "C");
    add("reference_C", ref);
    k.reference_C = ref.value;
    const Sourced z = detail::get_sourced(*t, "z_C", origin, place);
    require_positive(z, origin, place + ".z_C");
    detail::require_in(z.value, limits::z_C, origin, place + ".z_C", "C");
    add("z_C", z);
    k.z_C = z.value;
    if (t->contains("z_below_C") != t->contains("split_C"))
      throw InputError(std::string(origin) + ": " + place +
                       ": z_below_C and split_C must be given together");
    if (t->contains("z_below_C")) {
      const Sourced zb = detail::get_sourced(*t, "z_below_C", origin, place);
      require_positive(zb, origin, place + ".z_below_C");
      detail::require_in(zb.value, limits::z_C, origin, place + ".z_below_C", "C");
      const Sourced sp = detail::get_sourced(*t, "split_C", origin, place);
      detail::require_in(sp.value, limits::temperature_C, origin, place + ".split_C", "C");
      add("z_below_C", zb);
      add("split_C", sp);
      k.z_below_C = zb.value;
      k.split_C = sp.value;
    }
    if (auto d = sourced_time(*t, "D_ref", origin, place)) {
      require_positive(*d, origin, place + ".D_ref");
      detail::require_in(d->value, limits::duration_s, origin, place + ".D_ref", "s");
      add("D_ref_s", *d);
      k.D_ref_s = d->value;
    }
    const Sourced vmin = detail::get_sourced(*t, "valid_min_C", origin, place);
    const Sourced vmax = detail::get_sourced(*t, "valid_max_C", origin, place);
    detail::require_in(vmin.value, limits::temperature_C, origin, place + ".valid_min_C", "C");
    detail::require_in(vmax.value, limits::temperature_C, origin, place + ".valid_max_C", "C");
    if (!(vmin.value < vmax.value))
      throw InputError(std::string(origin) + ": " + place + ".valid_min_C = " +
                       number_text(vmin.value) + ": must be < valid_max_C = " +
                       number_text(vmax.value));
    if (k.reference_C < vmin.value || k.reference_C > vmax.value)
      throw InputError(std::string(origin) + ": " + place + ".reference_C = " +
                       number_text(k.reference_C) + ": must lie in the valid range [" +
                       number_text(vmin.value) + ", " + number_text(vmax.value) + "]");
    add("valid_min_C", vmin);
    add("valid_max_C", vmax);
    k.valid_min_C = vmin.value;
    k.valid_max_C = vmax.value;
    if (const toml::table* w = (*t)["weibull"].as_table()) {
      const std::string wp = place + ".weibull";
      detail::check_keys(*w, {"delta_ref_s", "delta_ref_min", "p"}, origin, wp);
      auto delta = sourced_time(*w, "delta_ref", origin, wp);
      if (!delta) throw InputError(std::string(origin) + ": " + wp + ".delta_ref_min: missing");
      require_positive(*delta, origin, wp + ".delta_ref");
      detail::require_in(delta->value, limits::duration_s, origin, wp + ".delta_ref", "s");
      const Sourced p = detail::get_sourced(*w, "p", origin, wp);
      require_positive(p, origin, wp + ".p");
      detail::require_in(p.value, kWeibullShape, origin, wp + ".p", "(dimensionless)");
      add("weibull.delta_ref_s", *delta);
      add("weibull.p", p);
      k.weibull = Weibull{delta->value, p.value};
    } else if (t->contains("weibull")) {
      throw InputError(std::string(origin) + ": " + place + ".weibull: must be a table");
    }
    if (const toml::table* e = (*t)["equivalence"].as_table()) {
      const std::string ep = place + ".equivalence";
      detail::check_keys(*e, {"source", "status", "note", "F_ref_min", "rows_min"}, origin, ep);
      EquivalenceTable eq;
      eq.source = detail::get_string(*e, "source", origin, ep);
      eq.status = detail::get_string(*e, "status", origin, ep);
      detail::check_status(eq.status, origin, ep);
      eq.note = detail::get_string(*e, "note", origin, ep, false);
      eq.F_ref_s = 60.0 * detail::get_number(*e, "F_ref_min", origin, ep);
      detail::require_in(eq.F_ref_s, limits::duration_s, origin, ep + ".F_ref_min (in s)", "s");
      const toml::array* rows = (*e)["rows_min"].as_array();
      if (!rows) throw InputError(std::string(origin) + ": " + ep + ".rows_min: missing");
      for (std::size_t r = 0; r < rows->size(); ++r) {
        const toml::array* row = (*rows)[r].as_array();
        const auto T = row && row->size() == 2 ? (*row)[0].value<double>() : std::nullopt;
        const auto m = row && row->size() == 2 ? (*row)[1].value<double>() : std::nullopt;
        if (!T || !m || !(*m > 0) || !limits::temperature_C.contains(*T) ||
            !limits::duration_s.contains(*m * 60.0))
          throw InputError(std::string(origin) + ": " + ep + ".rows_min[" + std::to_string(r + 1) +
                           "]: must be [temp_C, time_min] with temp_C from " + number_text(limits::temperature_C.low) +
                           " to " + number_text(limits::temperature_C.high) + " and time_min > 0, at most a year");
        eq.rows.push_back({*T, *m * 60.0});
      }
      o.equivalence = eq;
    }
    k.source.clear();
    for (const auto& [key, v] : o.values) {
      if (k.source.find(v.source) == std::string::npos) {
        if (!k.source.empty()) k.source += "; ";
        k.source += v.source;
      }
    }
    lib.organisms.push_back(std::move(o));
  }
  return lib;
}

}  // namespace coldcore::io
