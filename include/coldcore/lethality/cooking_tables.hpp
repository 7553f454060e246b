#pragma once
/// Published cooking time–temperature tables as data (products/cooking-tables.toml) and a check
/// that a cold-spot history meets a table by the equivalent-time integral.
///
/// Equivalent-time integral (the table itself as the kinetics, conservative step form): with rows
/// sorted by temperature T_1 < T_2 < ... and hold times t_i, a moment spent at temperature T with
/// T_i <= T < T_(i+1) is credited as 1/t_i of the requirement (the time of the next-lower row,
/// never an interpolated shorter one); below T_1 there is no credit. The lethality fraction is
///   Φ = Σ_i (time spent in [T_i, T_(i+1))) / t_i,
/// and a row with hold 0 ("instant") is met the moment T reaches it. The table is met when
/// Φ > 1 (strictly) or an instant row is reached. The equivalent time at row r is Φ·t_r.
/// This reading credits no lethality the table does not grant to a product held at the row
/// temperature; it is stricter than any smooth interpolation between rows.
/// Row temperatures: when a row gives both °F and °C, the higher of (°F − 32)/1.8 and the printed
/// °C is used (conservative; e.g. Food Code 145 °F printed as 63 °C uses 63 °C).
#include <functional>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace coldcore {

struct CookingRow {
  double temp_C = 0;      ///< temperature used (see above)
  std::optional<double> printed_F, printed_C;
  double hold_s = 0;      ///< 0 = instant
  bool printed_in_min = false;  ///< hold printed in minutes (rounding unit 1 min) or seconds
  std::string note;
};

struct CookingTable {
  std::string key, name, source, status, note;
  std::optional<double> log_reduction;  ///< performance standard the table stands for, if any
  std::vector<CookingRow> rows;         ///< ascending temperature
};

struct CookingTables {
  std::vector<CookingTable> tables;
  std::string origin;
  const CookingTable* find(std::string_view key) const;
  /// Else InputError "<place>: table = "<key>": not in <origin>; did you mean '<nearest>'?".
  const CookingTable& at(std::string_view key, std::string_view place) const;
};

struct CookingCheck {
  std::string table_key, source;
  double fraction = 0;                 ///< Φ; +inf when an instant row was reached
  std::optional<double> instant_reached_s;  ///< time the instant row's temperature was reached
  std::vector<double> equivalent_s;    ///< Φ·t_r per row (inf when instant reached)
  std::vector<double> longest_hold_s;  ///< literal reading: longest continuous time >= T_r, per row
  std::optional<std::size_t> literal_row;  ///< first row whose literal hold was met (> t_r), if any
  bool met = false;                    ///< Φ > 1 or instant row reached
};

/// Checks a temperature function (smooth between breakpoints, probed `probes` times per interval).
CookingCheck check_cooking_table(const std::function<double(double)>& temp_C_at,
                                 std::span<const double> breakpoints_s, const CookingTable& table,
                                 int probes = 4);

/// Checks a measured log (linear between rows). REQUIRES: times strictly increasing (else InputError).
CookingCheck check_cooking_table(std::span<const double> times_s, std::span<const double> temps_C,
                                 const CookingTable& table, std::string_view origin = "log");

}  // namespace coldcore
