#pragma once
// Common output options (-f/--format, -o/--out, --units, --step-s) and writing to a file without
// leaving it half-written: the report is built in memory and the file written only on success.
#include <functional>
#include <iosfwd>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include <CLI/CLI.hpp>

#include "coldcore/model/limits.hpp"
#include "coldcore/report/format.hpp"
#include "coldcore/report/verdict_summary.hpp"

namespace coldcore::cli {

struct OutputArgs {
  std::string format;     ///< empty: named by the --out extension, else text
  std::string out;        ///< empty or "-": stdout
  std::string units = "C";
  double step_s = 60;     ///< output sampling for history tables
  bool csv_comments = false;  ///< csv: notes as leading '# ' lines instead of a notes column
  std::vector<Format> formats;  ///< the formats the verb writes (set by add_output_options)
};

/// Adds -f/--format (help lists `formats`, the verb's own), -o/--out, --units, --csv-comments
/// when the verb writes csv and, with_step, --step-s.
void add_output_options(CLI::App& sub, OutputArgs& a, std::vector<Format> formats, bool with_step = false);

/// True when the report goes to standard output (no --out, or --out -).
bool to_stdout(const OutputArgs& a);

/// The format to write: --format when given; else the one the --out extension names (.txt,
/// .md, .html/.htm, .json, .csv); else text. InputError when the verb does not write it, or for
/// md on standard output (its plots are files beside the report).
Format output_format(const OutputArgs& a);

/// Adds --threads N (a --conservative run's cases on N threads; 0: every core).
void add_threads_option(CLI::App& sub, unsigned& threads);

/// A CLI11 check that a numeric option is finite and within [low, high] (`low_open`: > low),
/// stated in `unit`; NaN and inf fail. Message: `--opt: nan: must be from 0 to 1 s`.
CLI::Validator within(double low, double high, const std::string& unit, bool low_open = false);

/// Today's date in local time (TZ), YYYY-MM-DD, for report provenance: the date the person
/// signing the record sees on the wall (UTC is a day off in the evening west of Greenwich).
std::string today_local();

/// The report date: `given` when it is a calendar date YYYY-MM-DD (years 1900-9999), today in
/// local time when it is empty; anything else is an InputError
/// `--date = 2026-13-45: must be a calendar date YYYY-MM-DD, e.g. 2026-12-01`.
std::string report_date(const std::string& given);

/// Runs `body` writing into a buffer; on success writes the buffer to --out (or to `out`) and
/// returns body's exit code. On an exception nothing is written. A csv report is turned into the
/// header-first layout (report/csv_layout.hpp) unless --csv-comments.
int with_output(const OutputArgs& a, std::ostream& out, const std::function<int(std::ostream&)>& body);

/// Writes `text` to `path` whole or not at all (a temporary renamed into place), refusing an
/// input file, a directory or a device; messages start with `<option> = <path>`.
void write_whole_file(const std::string& path, const std::string& text, const std::string& option);


/// Files written beside --out (e.g. the SVG plots of a Markdown report): name relative to the
/// folder of --out, and content.
using SideFiles = std::vector<std::pair<std::string, std::string>>;

/// As above, and the body may add side files; they are written only when --out is given and
/// the body succeeded (a body that adds side files without --out is refused by the verb).
int with_output(const OutputArgs& a, std::ostream& out, const std::function<int(std::ostream&, SideFiles&)>& body);

/// A csv report written to --out gets its metadata beside it: "x.meta.json" for x.csv, holding
/// the verb's json report (cautions, provenance, verdicts, notes), written by `write_json`.
/// Nothing is added for standard output or with --csv-comments (the notes are then in the file).
void add_csv_sidecar(const OutputArgs& a, SideFiles& side, const std::function<void(std::ostream&)>& write_json);

/// As above, for a verb whose report opens with a verdict summary (run, probe, solve,
/// deviation): the body sets `summary` to the one its report shows; once the report is written
/// to --out, one line goes to `err`: "coldcore <verb>: <sentence>; report written to <out>".
/// Nothing is added on stdout output (the report opens with the same sentence).
int with_report_output(const OutputArgs& a, std::string_view verb, std::ostream& out, std::ostream& err,
                       const std::function<int(std::ostream&, SideFiles&, VerdictSummary&)>& body);

}  // namespace coldcore::cli
