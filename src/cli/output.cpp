#include "cli/output.hpp"

#include <ctime>
#include <filesystem>
#include <fstream>
#include <iostream>
#include <sstream>

#include "coldcore/error.hpp"
#include "coldcore/report/temperature_text.hpp"

namespace coldcore::cli {

void add_output_options(CLI::App& sub, OutputArgs& a, bool with_step) {
  sub.add_option("--format", a.format, "text | md | html | json | csv (as the verb allows)")->capture_default_str();
  sub.add_option("--out", a.out, "write to this file instead of standard output");
  sub.add_option("--units", a.units, "temperatures in C or F")->capture_default_str();
  if (with_step) sub.add_option("--step-s", a.step_s, "output sampling of history tables, s")->capture_default_str();
}

std::string today_utc() {
  std::time_t now = std::time(nullptr);
  std::tm tm{};
  gmtime_r(&now, &tm);
  char buf[16];
  std::strftime(buf, sizeof buf, "%Y-%m-%d", &tm);
  return buf;
}

namespace {

// Write beside the target and rename, so a failed write never leaves half a file.
void write_whole_file(const std::filesystem::path& target, const std::string& content) {
  std::filesystem::path tmp = target;
  tmp += ".tmp-coldcore";
  {
    std::ofstream f(tmp, std::ios::binary);
    if (!f) throw InputError("--out = " + target.string() + ": cannot be opened for writing");
    f << content;
    f.flush();
    if (!f) throw InputError("--out = " + target.string() + ": write failed");
  }
  std::error_code ec;
  std::filesystem::rename(tmp, target, ec);
  if (ec) {
    std::filesystem::remove(tmp, ec);
    throw InputError("--out = " + target.string() + ": cannot be written");
  }
}

}  // namespace

int with_output(const OutputArgs& a, const std::function<int(std::ostream&)>& body) {
  return with_output(a, [&](std::ostream& out, SideFiles&) { return body(out); });
}

int with_output(const OutputArgs& a, const std::function<int(std::ostream&, SideFiles&)>& body) {
  std::ostringstream buf;
  SideFiles side;
  const int code = body(buf, side);
  // Temperatures inside free text reach here as tokens (report/temperature_text.hpp): shown in
  // the display unit now, for every verb and format (the body has validated --units).
  const TempUnit u = parse_temp_unit(a.units);
  const std::string text = render_temperatures(buf.str(), u);
  if (a.out.empty()) {
    std::cout << text;
    return code;
  }
  const std::filesystem::path target(a.out);
  for (const auto& [name, content] : side) write_whole_file(target.parent_path() / name, render_temperatures(content, u));
  write_whole_file(target, text);
  return code;
}

int with_report_output(const OutputArgs& a, std::string_view verb,
                       const std::function<int(std::ostream&, SideFiles&, VerdictSummary&)>& body) {
  VerdictSummary summary;
  const int code = with_output(a, [&](std::ostream& out, SideFiles& side) { return body(out, side, summary); });
  // Said only after the file was written (with_output throws before that on any failure).
  if (!a.out.empty())
    std::cerr << render_temperatures(summary_stderr_line(verb, summary, a.out), parse_temp_unit(a.units)) << "\n";
  return code;
}

}  // namespace coldcore::cli
