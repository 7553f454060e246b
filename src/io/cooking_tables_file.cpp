// Reading cooking-tables.toml into the cooking tables (io/libraries.hpp).
#include <cmath>
#include <limits>
#include <set>
#include <string>

#include "coldcore/error.hpp"
#include "coldcore/io/libraries.hpp"
#include "coldcore/model/limits.hpp"
#include "coldcore/number_text.hpp"
#include "io/detail/library_toml.hpp"

namespace coldcore::io {

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
        throw InputError(o + ": " + rp + ".temp_C = " + number_text(from_C) +
                         ": must agree with temp_F = " + number_text(*cr.printed_F) + " (" +
                         number_text(from_F) + " C) within 0.5 C");
      cr.temp_C = std::max(from_F, from_C);
      detail::require_in(cr.temp_C, limits::temperature_C, origin, rp + ".temp (in C)", "C");
      const bool s = row->contains("hold_s"), m = row->contains("hold_min");
      if (s == m) throw InputError(o + ": " + rp + ": give exactly one of hold_s or hold_min");
      cr.printed_in_min = m;
      cr.hold_s = m ? 60.0 * detail::get_number(*row, "hold_min", origin, rp)
                    : detail::get_number(*row, "hold_s", origin, rp);
      if (cr.hold_s < 0)
        throw InputError(o + ": " + rp + (m ? ".hold_min = " : ".hold_s = ") +
                         number_text(m ? cr.hold_s / 60 : cr.hold_s) + ": must be >= 0");
      detail::require_in(cr.hold_s, limits::duration_s, origin, rp + ".hold (in s)", "s");
      cr.note = detail::get_string(*row, "note", origin, rp, false);
      if (!tab.rows.empty() && !(cr.temp_C > tab.rows.back().temp_C))
        throw InputError(o + ": " + rp + ": temperature " + number_text(cr.temp_C) +
                         " C: must be above the previous row's " + number_text(tab.rows.back().temp_C) + " C");
      tab.rows.push_back(cr);
    }
    out.tables.push_back(std::move(tab));
  }
  return out;
}

}  // namespace coldcore::io
