#include "cli/output.hpp"

#include <filesystem>
#include <fstream>
#include <iostream>
#include <sstream>

#include "coldcore/error.hpp"

namespace coldcore::cli {

void add_output_options(CLI::App& sub, OutputArgs& a, bool with_step) {
  sub.add_option("--format", a.format, "text | md | html | json | csv (as the verb allows)")->capture_default_str();
  sub.add_option("--out", a.out, "write to this file instead of standard output");
  sub.add_option("--units", a.units, "temperatures in C or F")->capture_default_str();
  if (with_step) sub.add_option("--step-s", a.step_s, "output sampling of history tables, s")->capture_default_str();
}

int with_output(const OutputArgs& a, const std::function<int(std::ostream&)>& body) {
  std::ostringstream buf;
  const int code = body(buf);
  if (a.out.empty()) {
    std::cout << buf.str();
    return code;
  }
  // Write beside the target and rename, so a failed write never leaves half a report.
  const std::filesystem::path target(a.out);
  std::filesystem::path tmp = target;
  tmp += ".tmp-coldcore";
  {
    std::ofstream f(tmp, std::ios::binary);
    if (!f) throw InputError("--out = " + a.out + ": cannot be opened for writing");
    f << buf.str();
    f.flush();
    if (!f) throw InputError("--out = " + a.out + ": write failed");
  }
  std::error_code ec;
  std::filesystem::rename(tmp, target, ec);
  if (ec) {
    std::filesystem::remove(tmp, ec);
    throw InputError("--out = " + a.out + ": cannot be written");
  }
  return code;
}

}  // namespace coldcore::cli
