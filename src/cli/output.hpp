#pragma once
// Common output options (--format, --out, --units, --step-s) and writing to a file without
// leaving it half-written: the report is built in memory and the file written only on success.
#include <functional>
#include <iosfwd>
#include <string>

#include <CLI/CLI.hpp>

#include "coldcore/report/format.hpp"

namespace coldcore::cli {

struct OutputArgs {
  std::string format = "text";
  std::string out;        ///< empty: stdout
  std::string units = "C";
  double step_s = 60;     ///< output sampling for history tables
};

void add_output_options(CLI::App& sub, OutputArgs& a, bool with_step = false);

/// Runs `body` writing into a buffer; on success writes the buffer to --out (or stdout) and
/// returns body's exit code. On an exception nothing is written.
int with_output(const OutputArgs& a, const std::function<int(std::ostream&)>& body);

}  // namespace coldcore::cli
