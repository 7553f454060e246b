#pragma once
/// A measured temperature log as the readers hand it on (io/logger_csv.hpp produces it; the
/// assessment and the probe report read it).
#include <optional>
#include <string>
#include <vector>

namespace coldcore {

/// A log in SI units, time rebased so that the first row is at t = 0.
struct TimeSeries {
  std::vector<double> time_s;          ///< strictly increasing, time_s[0] == 0
  std::vector<double> temp_C;
  std::vector<std::string> warnings;   ///< e.g. gaps longer than io::LogOptions::max_gap_s
  std::string time_column;             ///< header name of the time column as read
  std::string temp_column;             ///< header name of the temperature column as read
  /// The first row's timestamp in seconds since 1970-01-01T00:00:00Z when the time column is a
  /// timestamp (a time without zone read as UTC, see io::parse_iso8601_s); nullopt for time_s/_min/_h.
  std::optional<double> start_unix_s;
};

}  // namespace coldcore
