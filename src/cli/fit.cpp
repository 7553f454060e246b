// coldcore fit FILE --probe-log LOG.csv [...] [--medium-log LOG.csv] [--write-product OUT.toml]:
// a heat-penetration study described the trade's way and the exact model calibrated to it.
#include <algorithm>
#include <filesystem>
#include <ostream>
#include <memory>

#include "cli/log_options.hpp"
#include "cli/library_files.hpp"
#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/error.hpp"

#include "coldcore/io/calibration_file.hpp"
#include "coldcore/io/logger_csv.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/io/scenario.hpp"
#include "coldcore/io/sha256.hpp"
#include "coldcore/process/heat_penetration.hpp"
#include "coldcore/report/fit_report.hpp"
#include "coldcore/version.hpp"

namespace coldcore::cli {

namespace {

struct FitArgs {
  std::string file;
  std::vector<std::string> probe_logs;
  std::string medium_log;
  std::string medium_column;
  LogFormatArgs log_format;  ///< every log of the study
  std::vector<std::string> probe_columns;
  std::string write_product;
  double max_gap_s = 60;
  std::string timezone;
  std::string date;
  std::string library;
  OutputArgs output;
};

struct ReadLog {
  TimeSeries series;
  std::string bytes;
};

ReadLog read_log(const std::string& path, const std::string& column, const FitArgs& a, const std::string& hint) {
  ReadLog r;
  r.bytes = io::read_text_file(path);
  io::LogOptions lo;
  lo.max_gap_s = a.max_gap_s;
  lo.temp_column = column;
  lo.choose_column_hint = hint;
  apply_log_format(a.log_format, lo);
  if (!a.timezone.empty()) lo.utc_offset_s = io::parse_utc_offset_s(a.timezone);
  r.series = io::parse_log_csv(r.bytes, path, lo);
  return r;
}

/// Every probe curve of every --probe-log (one per temperature column), on the medium's clock.
std::vector<process::ProbeCurve> probe_curves(const FitArgs& a, const std::optional<ReadLog>& medium,
                                              std::vector<KeyValue>& provenance, std::vector<std::string>& warnings) {
  std::vector<process::ProbeCurve> curves;
  for (const std::string& path : a.probe_logs) {
    const std::string bytes = io::read_text_file(path);
    std::vector<std::string> columns = io::temperature_columns(bytes);
    if (!a.probe_columns.empty()) {
      std::vector<std::string> chosen;
      for (const std::string& c : columns)
        if (std::find(a.probe_columns.begin(), a.probe_columns.end(), c) != a.probe_columns.end()) chosen.push_back(c);
      if (chosen.empty()) {
        std::string names;
        for (const std::string& c : columns) names += (names.empty() ? "" : ", ") + c;
        throw InputError(path + ": --probe-column names none of its temperature columns (" + names + ")");
      }
      columns = chosen;
    } else if (columns.size() <= 1) {
      columns = {""};
    }
    // One row per log, numbered from the second on, so that each label (and json key) is unique.
    const auto logs = std::count_if(provenance.begin(), provenance.end(),
                                    [](const KeyValue& kv) { return kv.key.rfind("probe log", 0) == 0; });
    provenance.push_back({logs ? "probe log " + std::to_string(logs + 1) : std::string("probe log"),
                          path + " (sha256 " + io::sha256_hex(bytes) + ")"});
    for (const std::string& col : columns) {
      const ReadLog r = read_log(path, col, a, "");
      warnings.insert(warnings.end(), r.series.warnings.begin(), r.series.warnings.end());
      process::ProbeCurve c;
      c.name = a.probe_logs.size() == 1 && !col.empty() ? col
               : col.empty() ? std::filesystem::path(path).stem().string()
                             : std::filesystem::path(path).stem().string() + ":" + col;
      double offset = 0;
      if (medium) {
        const auto& m = medium->series;
        if (m.start_unix_s.has_value() != r.series.start_unix_s.has_value())
          throw InputError(path + ": time column " + r.series.time_column + " and the medium log's " + m.time_column +
                           ": both logs must use timestamps, or both elapsed time from the same start");
        if (m.start_unix_s) offset = *r.series.start_unix_s - *m.start_unix_s;
        const double first = offset, last = offset + r.series.time_s.back();
        if (first < -1e-9 || last > m.time_s.back() + 1e-9)
          throw InputError(path + ": probe " + c.name + " has readings from " + fixed(first, 0) + " s to " +
                           fixed(last, 0) + " s of the process, the medium log " + a.medium_log + " covers 0 s to " +
                           fixed(m.time_s.back(), 0) + " s: every probe reading must lie within the medium log");
      }
      for (double t : r.series.time_s) c.time_s.push_back(t + offset);
      c.temp_C = r.series.temp_C;
      if (c.time_s.size() < 3)
        throw InputError(path + ": probe " + c.name + ": " + std::to_string(c.time_s.size()) +
                         " reading(s): a curve needs at least 3 (better, one every minute or less through the process)");
      curves.push_back(std::move(c));
    }
  }
  return curves;
}

int fit_report(const FitArgs& a, std::ostream& out, SideFiles& side) {
  const Format f = output_format(a.output);
  const TempUnit u = parse_temp_unit(a.output.units);
  if (a.probe_logs.empty()) throw InputError("fit: give at least one --probe-log LOG.csv");
  if (!a.write_product.empty() && a.file == "-")
    throw InputError("--write-product = " + a.write_product +
                     ": needs the product file by name (it is read twice), not standard input");
  const io::ProductFile file = io::load_product(a.file);
  io::require_constant_properties(file);
  const LibraryFiles lib = load_libraries(a.library, a.file);

  FitReportContext ctx;
  ctx.product_name = file.product.name;
  ctx.origin = a.file;
  ctx.provenance.push_back({"product file", a.file + " (sha256 " + file.sha256_hex + ")"});
  ctx.warnings = file.warnings;
  std::optional<ReadLog> medium;
  if (!a.medium_log.empty()) {
    medium = read_log(a.medium_log, a.medium_column, a, "choose one with --medium-column NAME");
    ctx.provenance.push_back({"medium log", a.medium_log + " (sha256 " + io::sha256_hex(medium->bytes) + ")"});
    ctx.warnings.insert(ctx.warnings.end(), medium->series.warnings.begin(), medium->series.warnings.end());
  }
  std::vector<process::ProbeCurve> probes = probe_curves(a, medium, ctx.provenance, ctx.warnings);

  process::StudyInput in;
  in.scheduled = io::scenario_of(file);
  in.libs = {&lib.organisms, &lib.rules, &lib.cooking};
  double end_s = 0;
  for (const auto& c : probes) end_s = std::max(end_s, c.time_s.back());
  std::optional<process::MediumTrace> trace;
  if (medium) trace = process::MediumTrace{medium->series.time_s, medium->series.temp_C};
  in.study_stages = process::study_stages(file.stages, trace, end_s, a.file);
  in.scheduled.stages.resize(in.study_stages.size());
  for (const Stage& s : in.study_stages) ctx.stage_names.push_back(s.name);
  in.probes = std::move(probes);
  const process::StudyAnalysis analysis = process::analyse_study(in);

  const auto lib_rows = library_provenance(lib);
  ctx.provenance.insert(ctx.provenance.end(), lib_rows.begin(), lib_rows.end());
  ctx.provenance.push_back({"date", report_date(a.date)});
  ctx.provenance.push_back({"version", kVersion});
  if (!a.write_product.empty()) {
    std::vector<std::string> study;
    for (const auto& kv : ctx.provenance) study.push_back(kv.key + ": " + kv.value);
    const Calibration cal = process::calibration_of(analysis.fit_slowest, ctx.stage_names,
                                                    analysis.curves[static_cast<std::size_t>(analysis.slowest)].name,
                                                    report_date(a.date), study);
    const ThermalProperties& tp = file.product.properties;
    const std::string toml = io::calibrated_product_toml(io::read_text_file(a.file), cal,
                                                         tp.density_kg_m3 * tp.specific_heat_J_kgK);
    write_whole_file(a.write_product, toml, "--write-product");
    ctx.written_product = a.write_product;
  }

  switch (f) {
    case Format::json: write_fit_json(analysis, ctx, out, u); break;
    case Format::csv:
      write_fit_csv(analysis, ctx, out, u);
      add_csv_sidecar(a.output, side, [&](std::ostream& o) { write_fit_json(analysis, ctx, o, u); });
      break;
    case Format::html: write_fit_html(analysis, ctx, out, u); break;
    case Format::md: {
      MarkdownReport md = write_fit_markdown(analysis, ctx, u, std::filesystem::path(a.output.out).stem().string());
      out << md.markdown;
      side = std::move(md.svg_files);
      break;
    }
    default: write_fit_text(analysis, ctx, out, u); break;
  }
  return kAllMet;
}

// fit has no verdict and no terminal note: nothing goes to `err`.
int run_fit(const FitArgs& a, std::ostream& out, std::ostream& /*err*/) {
  return with_output(a.output, out, [&](std::ostream& report, SideFiles& side) { return fit_report(a, report, side); });
}

}  // namespace

void add_fit_verb(CLI::App& app, VerbContext& ctx) {
  auto a = std::make_shared<FitArgs>();
  auto* sub = app.add_subcommand("fit", "heat-penetration study: f_h, j_h, f_c, j_c per probe; α and h fitted with intervals");
  sub->add_option("FILE", a->file, "product file: shape, size, density, specific heat, the stages as scheduled, starting k and h")->required();
  sub->add_option("--probe-log", a->probe_logs, "measured cold-spot log (repeat for several; a log may hold one *_C column per container)")->required();
  sub->add_option("--medium-log", a->medium_log, "measured medium log over the whole study (default: the scheduled media)");
  sub->add_option("--probe-column", a->probe_columns, "read only this temperature column of the probe logs (repeat for several; default: every *_C / *_F column is a probe)");
  sub->add_option("--medium-column", a->medium_column, "which temperature column of the medium log to use when it has several");
  add_log_format_options(*sub, a->log_format);
  sub->add_option("--write-product", a->write_product, "write the calibrated product file (fitted k and h, their intervals as ranges, the covariance) here");
  sub->add_option("--max-gap-s", a->max_gap_s, "gaps longer than this in a log are reported, s")->capture_default_str()->check(within(0, limits::duration_s.high, "s", true));
  sub->add_option("--timezone", a->timezone, "fixed UTC offset of timestamps written without one, e.g. +01:00");
  sub->add_option("--date", a->date, "report date for provenance, YYYY-MM-DD (default: today in local time)");
  add_output_options(*sub, a->output, {Format::text, Format::md, Format::html, Format::json, Format::csv});
  add_library_option(*sub, a->library);
  sub->callback([&ctx, a] {
    ctx.run = [a](std::ostream& out, std::ostream& err) { return run_fit(*a, out, err); };
  });
}

}  // namespace coldcore::cli
