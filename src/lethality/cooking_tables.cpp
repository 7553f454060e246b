#include "coldcore/lethality/cooking_tables.hpp"

#include <cmath>
#include <limits>
#include <set>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "coldcore/model/find_by_key.hpp"
#include "lethality/detail/crossing.hpp"
#include "lethality/detail/text.hpp"

namespace coldcore {

const CookingTable* CookingTables::find(std::string_view key) const { return find_by_key(tables, key); }

const CookingTable& CookingTables::at(std::string_view key, std::string_view place) const {
  return at_by_key(tables, key, place, "table", origin.empty() ? "the cooking tables" : origin);
}

namespace {

using Intervals = std::vector<std::pair<double, double>>;

// Total time with T >= level.
double time_at_or_above(const Intervals& above) {
  double s = 0;
  for (const auto& [a, b] : above) s += b - a;
  return s;
}

CookingCheck check_curve(const detail::Curve& c, const CookingTable& table) {
  CookingCheck out;
  out.table_key = table.key;
  out.source = table.source;
  const std::size_t n = table.rows.size();
  // One sampling of the curve, and each row's intervals found once (issue 13: every row used to
  // scan the whole grid three times).
  const detail::Curve::Sampled sampled = c.sample(c.start());
  std::vector<Intervals> above_row(n);
  for (std::size_t i = 0; i < n; ++i) above_row[i] = c.intervals_at_or_above(table.rows[i].temp_C, sampled);
  double phi = 0;
  for (std::size_t i = 0; i < n; ++i) {
    const CookingRow& row = table.rows[i];
    const Intervals& above = above_row[i];
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
    const double in_band = time_at_or_above(above) - (i + 1 < n ? time_at_or_above(above_row[i + 1]) : 0.0);
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
