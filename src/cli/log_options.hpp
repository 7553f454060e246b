#pragma once
// The options that say how a logger's csv is written (issue 16): --time-column, --delimiter and
// --decimal-comma, shared by every verb that reads a log (probe, deviation, fit).
#include <string>

#include <CLI/CLI.hpp>

#include "coldcore/io/logger_csv.hpp"

namespace coldcore::cli {

struct LogFormatArgs {
  std::string time_column;  ///< empty: the first column named as a time
  std::string delimiter;    ///< "," ";" "tab"; empty: from the header
  bool decimal_comma = false;
};

/// Adds --delimiter and --decimal-comma, and --time-column unless the verb names its own
/// (time_option empty).
void add_log_format_options(CLI::App& sub, LogFormatArgs& a, const std::string& time_option = "--time-column");

/// `lo` with the format options applied (time column, separator, decimal mark). Throws
/// InputError for a --delimiter that is not ',', ';' or tab.
void apply_log_format(const LogFormatArgs& a, io::LogOptions& lo);

}  // namespace coldcore::cli
