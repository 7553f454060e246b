#include "cli/output.hpp"

#include "cli/progress.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <ctime>
#include <filesystem>
#include <fstream>
#include <ostream>
#include <sstream>

#include "coldcore/error.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/report/csv_layout.hpp"
#include "coldcore/report/temperature_text.hpp"

namespace coldcore::cli {

void add_output_options(CLI::App& sub, OutputArgs& a, std::vector<Format> formats, bool with_step) {
  std::string list;
  for (Format f : formats) list += (list.empty() ? "" : " | ") + std::string(to_string(f));
  a.formats = std::move(formats);
  sub.add_option("-f,--format", a.format, list + " (default: named by the --out extension, else text)");
  sub.add_option("-o,--out", a.out, "write to this file instead of standard output (- : standard output)");
  sub.add_option("--units", a.units, "temperatures in C or F")->capture_default_str();
  if (std::find(a.formats.begin(), a.formats.end(), Format::csv) != a.formats.end())
    sub.add_flag("--csv-comments", a.csv_comments,
                 "csv: notes (cautions, verdicts, provenance) as leading '# ' lines instead of a last column "
                 "'notes' (the default puts the header first, as spreadsheets and pandas expect; -o x.csv also "
                 "writes x.meta.json)");
  // Bounded below so that a history table stays within a few million rows.
  if (with_step)
    sub.add_option("--step-s", a.step_s, "output sampling of history tables, s")
        ->capture_default_str()
        ->check(within(0.1, limits::duration_s.high, "s"));
}

void add_threads_option(CLI::App& sub, unsigned& threads) {
  sub.add_option("--threads", threads,
                 "--conservative: evaluate its cases on this many threads (default 0: every core; the result is "
                 "the same for any count)")
      ->check(CLI::Range(0u, 256u));
}

CLI::Validator within(double low, double high, const std::string& unit, bool low_open) {
  const auto text = [](double v) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.9g", v);
    return std::string(buf);
  };
  const std::string range = (low_open ? "greater than " + text(low) + " and at most " : "from " + text(low) + " to ") +
                            text(high) + (unit.empty() ? "" : " " + unit);
  return CLI::Validator(
      [=](std::string& s) -> std::string {
        char* end = nullptr;
        const double v = std::strtod(s.c_str(), &end);
        const bool ok = end != s.c_str() && *end == '\0' && std::isfinite(v) && (low_open ? v > low : v >= low) && v <= high;
        return ok ? std::string() : s + ": must be " + range;
      },
      range);
}

bool to_stdout(const OutputArgs& a) { return a.out.empty() || a.out == "-"; }

Format output_format(const OutputArgs& a) {
  std::string name = a.format;
  if (name.empty() && !to_stdout(a)) {
    std::string ext = std::filesystem::path(a.out).extension().string();
    for (char& c : ext) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    if (ext == ".htm") ext = ".html";
    if (ext == ".txt") ext = ".text";
    for (Format f : {Format::text, Format::md, Format::html, Format::json, Format::csv})
      if (ext == "." + std::string(to_string(f))) name = to_string(f);
    bool written = false;
    for (Format f : a.formats) written = written || name == to_string(f);
    if (!name.empty() && !written) {
      std::string list;
      for (Format f : a.formats) list += (list.empty() ? "" : "|") + std::string(to_string(f));
      throw InputError("--out = " + a.out + ": its extension names format " + name +
                       ", which this verb does not write; give a name ending in ." + list.substr(0, list.find('|')) +
                       " or choose with --format " + list);
    }
  }
  if (name.empty()) name = "text";
  const Format f = parse_format(name, a.formats);
  if (f == Format::md && to_stdout(a))
    throw InputError("--format md writes its plots as SVG files beside the report: give --out PATH.md");
  return f;
}

std::string today_local() {
  std::time_t now = std::time(nullptr);
  std::tm tm{};
  localtime_r(&now, &tm);
  char buf[16];
  std::strftime(buf, sizeof buf, "%Y-%m-%d", &tm);
  return buf;
}

std::string report_date(const std::string& given) {
  if (given.empty()) return today_local();
  int y = 0, m = 0, d = 0;
  char tail = 0;
  const bool shaped = given.size() == 10 && given[4] == '-' && given[7] == '-' &&
                      std::sscanf(given.c_str(), "%4d-%2d-%2d%c", &y, &m, &d, &tail) == 3;
  static constexpr int kDays[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
  const bool leap = (y % 4 == 0 && y % 100 != 0) || y % 400 == 0;
  const bool valid = shaped && y >= 1900 && m >= 1 && m <= 12 && d >= 1 &&
                     d <= kDays[m - 1] + (m == 2 && leap ? 1 : 0);
  if (!valid) throw InputError("--date = " + given + ": must be a calendar date YYYY-MM-DD, e.g. 2026-12-01");
  return given;
}

namespace {

namespace fs = std::filesystem;

// The temporary a file is written to before the rename: beside its target, so the rename stays
// within one file system.
fs::path temporary_for(const fs::path& target) {
  fs::path tmp = target;
  tmp += ".tmp-coldcore";
  return tmp;
}

// Refuses a target that would destroy an input or cannot be a file.
void check_target(const fs::path& target, const std::string& shown) {
  std::error_code ec;
  if (fs::is_directory(target, ec)) throw InputError(shown + ": is a directory; give a file name");
  // Replacing a device or FIFO by a rename would destroy it (root may): only plain files are replaced.
  if (fs::exists(target, ec) && !fs::is_regular_file(target, ec))
    throw InputError(shown + ": exists and is not a regular file; give a file name");
  const fs::path canonical = fs::weakly_canonical(target, ec);
  for (const auto& input : io::inputs_read()) {
    std::error_code e1;
    const bool same = (!ec && canonical == fs::weakly_canonical(input, e1)) || fs::equivalent(target, input, e1);
    if (same)
      throw InputError(shown + ": is the input file " + input.generic_string() +
                       "; choose another name (coldcore never overwrites what it reads)");
  }
}

// All or nothing: every file is written to its temporary first; only when all were written are
// they renamed into place. On any failure every temporary is removed and no target is touched
// (a rename that fails part-way leaves the earlier targets complete, never half-written).
void write_all_or_nothing(const std::vector<std::pair<fs::path, std::string>>& files,
                          const std::vector<std::string>& shown) {
  std::vector<fs::path> written;
  auto discard = [&written] {
    std::error_code ec;
    for (const auto& t : written) fs::remove(t, ec);
  };
  for (std::size_t i = 0; i < files.size(); ++i) {
    const fs::path tmp = temporary_for(files[i].first);
    std::ofstream f(tmp, std::ios::binary);
    if (!f) {
      discard();
      throw InputError(shown[i] + ": cannot be opened for writing");
    }
    written.push_back(tmp);
    f << files[i].second;
    f.flush();
    if (!f) {
      f.close();
      discard();
      throw InputError(shown[i] + ": write failed (disk full or not writable?)");
    }
  }
  for (std::size_t i = 0; i < files.size(); ++i) {
    std::error_code ec;
    fs::rename(written[i], files[i].first, ec);
    if (ec) {
      for (std::size_t j = i; j < written.size(); ++j) fs::remove(written[j], ec);
      throw InputError(shown[i] + ": cannot be written: " + ec.message());
    }
  }
}

}  // namespace

void write_whole_file(const std::string& path, const std::string& text, const std::string& option) {
  const std::string shown = option + " = " + path;
  check_target(path, shown);
  write_all_or_nothing({{fs::path(path), text}}, {shown});
}

int with_output(const OutputArgs& a, std::ostream& out, const std::function<int(std::ostream&)>& body) {
  return with_output(a, out, [&](std::ostream& o, SideFiles&) { return body(o); });
}

int with_output(const OutputArgs& a, std::ostream& out, const std::function<int(std::ostream&, SideFiles&)>& body) {
  std::ostringstream buf;
  SideFiles side;
  const int code = body(buf, side);
  // The report writers hand out final text (temperatures in the display unit).
  std::string text = buf.str();
  if (!a.csv_comments && output_format(a) == Format::csv) text = header_first_csv(text);
  if (to_stdout(a)) {
    out << text;
    return code;
  }
  const fs::path target(a.out);
  std::vector<std::pair<fs::path, std::string>> files;
  std::vector<std::string> shown;
  for (const auto& [name, content] : side) {
    files.emplace_back(target.parent_path() / name, content);
    shown.push_back("--out = " + a.out + ": side file " + (target.parent_path() / name).generic_string());
  }
  files.emplace_back(target, text);
  shown.push_back("--out = " + a.out);
  for (std::size_t i = 0; i < files.size(); ++i) check_target(files[i].first, shown[i]);
  write_all_or_nothing(files, shown);
  return code;
}

void add_csv_sidecar(const OutputArgs& a, SideFiles& side, const std::function<void(std::ostream&)>& write_json) {
  if (to_stdout(a) || a.csv_comments) return;
  fs::path name = fs::path(a.out).filename();
  if (name.extension() == ".csv") name.replace_extension();
  std::ostringstream json;
  write_json(json);
  side.emplace_back(name.string() + ".meta.json", json.str());
}

int with_report_output(const OutputArgs& a, std::string_view verb, std::ostream& out, std::ostream& err,
                       const std::function<int(std::ostream&, SideFiles&, VerdictSummary&)>& body) {
  VerdictSummary summary;
  const int code = with_output(a, out, [&](std::ostream& report, SideFiles& side) {
    const ProgressLine progress{std::string(verb)};  // erased before the report is written
    return body(report, side, summary);
  });
  // Said only after the file was written (with_output throws before that on any failure).
  if (!to_stdout(a))
    err << render_temperatures(summary_stderr_line(verb, summary, a.out), parse_temp_unit(a.units)) << "\n";
  return code;
}

}  // namespace coldcore::cli
