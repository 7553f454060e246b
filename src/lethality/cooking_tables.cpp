#include "coldcore/lethality/cooking_tables.hpp"

#include <cmath>
#include <limits>
#include <set>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "lethality/detail/crossing.hpp"
#include "lethality/detail/text.hpp"
#include "lethality/detail/toml_read.hpp"

namespace coldcore {

const CookingTable* CookingTables::find(std::string_view key) const {
  for (const auto& t : tables)
    if (t.key == key) return &t;
  return nullptr;
}

const CookingTable& CookingTables::at(std::string_view key, std::string_view place) const {
  if (const CookingTable* t = find(key)) return *t;
  std::vector<std::string> keys;
  for (const auto& t : tables) keys.push_back(t.key);
  std::string msg = std::string(place) + ": table = \"" + std::string(key) + "\": not in " +
                    (origin.empty() ? std::string("the cooking tables") : origin);
  const std::string near = detail::nearest(key, keys);
  if (!near.empty()) msg += "; did you mean '" + near + "'?";
  throw InputError(msg);
}

CookingTables parse_cooking_tables(std::string_view toml_text, std::string_view origin) {
  const toml::table root = detail::parse_toml(toml_text, origin);
  detail::check_keys(root, {"schema", "table"}, origin, "top level");
  CookingTables out;
  out.origin = std::string(origin);
  const toml::array* arr = root["table"].as_array();
  if (!arr) throw InputError(std::string(origin) + ": table: missing ([[table]] tables)");
  std::set<std::string> seen;
  const std::string o(origin);
  for (std::size_t i = 0; i < arr->size(); ++i) {
    const toml::table* t = (*arr)[i].as_table();
    const std::string place = "table[" + std::to_string(i + 1) + "]";
    if (!t) throw InputError(o + ": " + place + ": must be a table");
    detail::check_keys(*t, {"key", "name", "source", "status", "note", "log_reduction", "rows"},
                       origin, place);
    CookingTable tab;
    tab.key = detail::get_string(*t, "key", origin, place);
    if (!seen.insert(tab.key).second)
      throw InputError(o + ": " + place + ".key = \"" + tab.key + "\": duplicate key");
    tab.name = detail::get_string(*t, "name", origin, place);
    tab.source = detail::get_string(*t, "source", origin, place);
    tab.status = detail::get_string(*t, "status", origin, place);
    detail::check_status(tab.status, origin, place);
    tab.note = detail::get_string(*t, "note", origin, place, false);
    if (t->contains("log_reduction"))
      tab.log_reduction = detail::get_number(*t, "log_reduction", origin, place);
    const toml::array* rows = (*t)["rows"].as_array();
    if (!rows || rows->empty()) throw InputError(o + ": " + place + ".rows: missing");
    for (std::size_t r = 0; r < rows->size(); ++r) {
      const std::string rp = place + ".rows[" + std::to_string(r + 1) + "]";
      const toml::table* row = (*rows)[r].as_table();
      if (!row) throw InputError(o + ": " + rp + ": must be { temp_F = ..., temp_C = ..., hold_min|hold_s = ... }");
      detail::check_keys(*row, {"temp_F", "temp_C", "hold_s", "hold_min", "note"}, origin, rp);
      CookingRow cr;
      if (row->contains("temp_F")) cr.printed_F = detail::get_number(*row, "temp_F", origin, rp);
      if (row->contains("temp_C")) cr.printed_C = detail::get_number(*row, "temp_C", origin, rp);
      if (!cr.printed_F && !cr.printed_C) throw InputError(o + ": " + rp + ": temp_F or temp_C: missing");
      const double from_F = cr.printed_F ? (*cr.printed_F - 32.0) / 1.8 : -1e300;
      const double from_C = cr.printed_C ? *cr.printed_C : -1e300;
      if (cr.printed_F && cr.printed_C && std::abs(from_F - from_C) > 0.5)
        throw InputError(o + ": " + rp + ".temp_C = " + detail::num(from_C) +
                         ": must agree with temp_F = " + detail::num(*cr.printed_F) + " (" +
                         detail::num(from_F) + " C) within 0.5 C");
      cr.temp_C = std::max(from_F, from_C);
      detail::require_in(cr.temp_C, limits::temperature_C, origin, rp + ".temp (in C)", "C");
      const bool s = row->contains("hold_s"), m = row->contains("hold_min");
      if (s == m) throw InputError(o + ": " + rp + ": give exactly one of hold_s or hold_min");
      cr.printed_in_min = m;
      cr.hold_s = m ? 60.0 * detail::get_number(*row, "hold_min", origin, rp)
                    : detail::get_number(*row, "hold_s", origin, rp);
      if (cr.hold_s < 0)
        throw InputError(o + ": " + rp + (m ? ".hold_min = " : ".hold_s = ") +
                         detail::num(m ? cr.hold_s / 60 : cr.hold_s) + ": must be >= 0");
      detail::require_in(cr.hold_s, limits::duration_s, origin, rp + ".hold (in s)", "s");
      cr.note = detail::get_string(*row, "note", origin, rp, false);
      if (!tab.rows.empty() && !(cr.temp_C > tab.rows.back().temp_C))
        throw InputError(o + ": " + rp + ": temperature " + detail::num(cr.temp_C) +
                         " C: must be above the previous row's " + detail::num(tab.rows.back().temp_C) + " C");
      tab.rows.push_back(cr);
    }
    out.tables.push_back(std::move(tab));
  }
  return out;
}

namespace {

// Total time with T >= level.
double time_at_or_above(const detail::Curve& c, double level) {
  double s = 0;
  for (const auto& [a, b] : c.intervals_at_or_above(level, c.start())) s += b - a;
  return s;
}

CookingCheck check_curve(const detail::Curve& c, const CookingTable& table) {
  CookingCheck out;
  out.table_key = table.key;
  out.source = table.source;
  const std::size_t n = table.rows.size();
  double phi = 0;
  for (std::size_t i = 0; i < n; ++i) {
    const CookingRow& row = table.rows[i];
    const auto above = c.intervals_at_or_above(row.temp_C, c.start());
    double longest = 0;
    for (const auto& [a, b] : above) longest = std::max(longest, b - a);
    out.longest_hold_s.push_back(longest);
    if (!out.literal_row && !above.empty() &&
        (row.hold_s == 0 ? true : longest > row.hold_s))
      out.literal_row = i;
    if (row.hold_s == 0) {
      if (!above.empty() && !out.instant_reached_s) out.instant_reached_s = above.front().first;
      continue;
    }
    const double in_band = time_at_or_above(c, row.temp_C) -
                           (i + 1 < n ? time_at_or_above(c, table.rows[i + 1].temp_C) : 0.0);
    phi += in_band / row.hold_s;
  }
  const double inf = std::numeric_limits<double>::infinity();
  out.fraction = out.instant_reached_s ? inf : phi;
  for (const auto& row : table.rows)
    out.equivalent_s.push_back(row.hold_s > 0 ? out.fraction * row.hold_s
                                              : (out.instant_reached_s ? inf : 0.0));
  out.met = out.instant_reached_s.has_value() || out.fraction > 1.0;
  return out;
}

}  // namespace

CookingCheck check_cooking_table(const std::function<double(double)>& temp_C_at,
                                 std::span<const double> breakpoints_s, const CookingTable& table,
                                 int probes) {
  if (breakpoints_s.size() < 2)
    throw InputError("check_cooking_table: breakpoints = " + std::to_string(breakpoints_s.size()) +
                     ": must be >= 2");
  detail::Curve c;
  c.temp_C_at = temp_C_at;
  c.knots.assign(breakpoints_s.begin(), breakpoints_s.end());
  c.probes = std::max(1, probes);
  return check_curve(c, table);
}

CookingCheck check_cooking_table(std::span<const double> times_s, std::span<const double> temps_C,
                                 const CookingTable& table, std::string_view origin) {
  validate_log(times_s, temps_C, origin);
  return check_curve(detail::linear_log_curve(times_s, temps_C), table);
}

}  // namespace coldcore
