// Reading cooking-tables.toml into the cooking tables (io/libraries.hpp).
#include <algorithm>
#include <cmath>
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

// One printed row: a temperature in °F, °C or both (then they must agree), and its hold.
CookingRow read_row(const Fields& row) {
  CookingRow cr;
  cr.printed_F = row.number("temp_F");
  cr.printed_C = row.number("temp_C");
  if (!cr.printed_F && !cr.printed_C) row.fail_at("", "temp_F or temp_C: missing");
  const double from_F = cr.printed_F ? (*cr.printed_F - 32.0) / 1.8 : -1e300;
  const double from_C = cr.printed_C ? *cr.printed_C : -1e300;
  if (cr.printed_F && cr.printed_C && std::abs(from_F - from_C) > 0.5)
    row.fail_value("temp_C", from_C,
                   "must agree with temp_F = " + number_text(*cr.printed_F) + " (" + number_text(from_F) +
                       " C) within 0.5 C");
  cr.temp_C = std::max(from_F, from_C);
  row.require_value_range("temp (in C)", cr.temp_C, limits::temperature_C, "C");
  const bool s = row.node("hold_s") != nullptr, m = row.node("hold_min") != nullptr;
  if (s == m) row.fail_at("", "give exactly one of hold_s or hold_min");
  cr.printed_in_min = m;
  const char* hold_key = m ? "hold_min" : "hold_s";
  cr.hold_s = *row.number(hold_key) * (m ? 60.0 : 1.0);
  if (cr.hold_s < 0) row.fail(hold_key, "must be >= 0");
  row.require_value_range("hold (in s)", cr.hold_s, limits::duration_s, "s");
  cr.note = row.string("note").value_or("");
  return cr;
}

CookingTable read_table(const Fields& f, std::set<std::string>& seen) {
  CookingTable tab;
  detail::read_heading(tab, f, seen, "the table", "the publication or code the table is taken from");
  tab.log_reduction = f.number("log_reduction");
  const std::string row_form = "{ temp_F = ..., temp_C = ..., hold_min|hold_s = ... }";
  const auto rows = f.entries("rows", "[" + row_form + ", ...]", plain_keys({"temp_F", "temp_C", "hold_s", "hold_min", "note"}));
  if (rows.empty()) f.fail("rows", "must hold at least one row " + row_form);
  for (const Fields& row : rows) {
    const CookingRow cr = read_row(row);
    if (!tab.rows.empty() && !(cr.temp_C > tab.rows.back().temp_C))
      row.fail_at("", "temperature " + number_text(cr.temp_C) + " C: must be above the previous row's " +
                          number_text(tab.rows.back().temp_C) + " C");
    tab.rows.push_back(cr);
  }
  return tab;
}

}  // namespace

CookingTables parse_cooking_tables(std::string_view toml_text, std::string_view origin) {
  const toml::table doc = detail::parse_toml(toml_text, std::string(origin));
  const Fields root(doc, std::string(origin), "", plain_keys({"schema", "table"}));
  root.require_schema_1(false);  // custom tables written without one are accepted
  CookingTables out;
  out.origin = std::string(origin);
  std::set<std::string> seen;
  for (const Fields& f : root.entries("table", "[[table]] tables",
                                      plain_keys({"key", "name", "source", "status", "note", "log_reduction", "rows"})))
    out.tables.push_back(read_table(f, seen));
  return out;
}

}  // namespace coldcore::io
