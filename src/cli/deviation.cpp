// coldcore deviation FILE --medium-log LOG.csv [--stage NAME] [--probe-log LOG.csv] [--lot ID] [--conservative]
#include <ctime>
#include <filesystem>
#include <memory>
#include <optional>

#include "cli/log_options.hpp"
#include "cli/library_files.hpp"
#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/error.hpp"
#include "coldcore/io/logger_csv.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/io/scenario.hpp"
#include "coldcore/io/sha256.hpp"
#include "coldcore/process/deviation.hpp"
#include "coldcore/process/deviation_conservative.hpp"
#include "coldcore/report/deviation_report.hpp"
#include "coldcore/report/run_builder.hpp"
#include "coldcore/version.hpp"

namespace coldcore::cli {

namespace {

struct DeviationArgs {
  std::string file, medium_log, probe_log, stage, lot, library, date, column, probe_column, timezone;
  LogFormatArgs log_format;        ///< both logs; --time-column names the medium log's
  std::string probe_time_column;   ///< --probe-time-column
  double tolerance_K = 0.5;
  double max_gap_s = 60;
  double round_min = 1;
  bool conservative = false;
  unsigned threads = 0;  ///< --conservative: worker threads, 0 = every core
  OutputArgs output;
};

int deviation_report(const DeviationArgs& a, std::ostream& out, SideFiles& side, VerdictSummary& summary) {
  const Format f = output_format(a.output);
  const TempUnit u = parse_temp_unit(a.output.units);
  if (a.medium_log.empty() && a.probe_log.empty())
    throw InputError("deviation: give --medium-log LOG.csv and/or --probe-log LOG.csv");
  if (!(a.tolerance_K > 0)) throw InputError("--tolerance-K = " + std::to_string(a.tolerance_K) + ": must be > 0");
  if (!(a.max_gap_s > 0)) throw InputError("--max-gap-s = " + std::to_string(a.max_gap_s) + ": must be > 0");
  if (!(a.round_min > 0)) throw InputError("--round-min = " + std::to_string(a.round_min) + ": must be > 0");
  const io::ProductFile file = io::load_product(a.file);
  io::require_constant_properties(file);
  const LibraryFiles libs = load_libraries(a.library, a.file);
  process::DeviationInput in;
  in.scheduled = io::scenario_of(file);
  DeviationRecordInfo info;
  info.product_name = file.product.name;
  info.lot = a.lot;
  info.warnings = file.warnings;
  if (!a.medium_log.empty()) {
    const std::string text = io::read_text_file(a.medium_log);
    io::LogOptions lo;
    lo.temp_column = a.column;
    apply_log_format(a.log_format, lo);
    lo.max_gap_s = a.max_gap_s;
    if (!a.timezone.empty()) lo.utc_offset_s = io::parse_utc_offset_s(a.timezone);
    const TimeSeries log = io::parse_log_csv(text, a.medium_log, lo);
    for (const auto& w : log.warnings) info.warnings.push_back(w);
    in.medium_log = io::medium_profile(log, a.medium_log, text);
    in.stage = a.stage.empty() ? process::default_stage(in.scheduled, true)
                               : process::stage_index(in.scheduled, a.stage, "--stage");
    info.medium_log = a.medium_log;
    info.medium_log_start_unix_s = log.start_unix_s;
    info.medium_log_sha256 = io::sha256_hex(text);
  }
  if (!a.probe_log.empty()) {
    const std::string text = io::read_text_file(a.probe_log);
    io::LogOptions lo;
    lo.temp_column = a.probe_column;
    lo.choose_column_hint = "choose one with --probe-temp-column NAME";
    apply_log_format(a.log_format, lo);
    lo.time_column = a.probe_time_column;
    lo.max_gap_s = a.max_gap_s;
    if (!a.timezone.empty()) lo.utc_offset_s = io::parse_utc_offset_s(a.timezone);
    const TimeSeries log = io::parse_log_csv(text, a.probe_log, lo);
    for (const auto& w : log.warnings) info.warnings.push_back(w);
    in.probe_time_s = log.time_s;
    in.probe_temp_C = log.temp_C;
    in.probe_origin = a.probe_log;
    info.probe_log = a.probe_log;
    info.probe_log_sha256 = io::sha256_hex(text);
  }
  process::DeviationOptions o;
  o.tolerance_K = a.tolerance_K;
  o.max_gap_s = a.max_gap_s;
  o.unit_s = a.round_min * 60.0;
  const process::DeviationResult r = process::evaluate_deviation(in, {&libs.organisms, &libs.rules, &libs.cooking}, o);
  std::optional<process::ConservativeDeviation> cons;
  if (a.conservative) {
    cons = process::evaluate_deviation_conservative(in, io::ranges_of(file), {&libs.organisms, &libs.rules, &libs.cooking}, o,
                                                    a.threads);
    info.conservative = &*cons;
  }
  summary = verdict_summary(r, info.conservative);
  info.provenance = {{"tool", std::string("coldcore ") + kVersion},
                     {"input", file.origin},
                     {"input SHA-256", file.sha256_hex},
                     {"date", report_date(a.date)}};
  const auto lib_rows = library_provenance(libs);
  info.provenance.insert(info.provenance.end() - 1, lib_rows.begin(), lib_rows.end());
  // The rich formats plot the runs evaluate_deviation already made (sampled, not re-run).
  std::optional<RunReport> sched_plot, deliv_plot;
  if (f == Format::md || f == Format::html) {
    // each target's F column from its own h scenario (issue 11)
    sched_plot = build_rerun_report(r.scheduled, in.scheduled.targets, a.output.step_s);
    info.scheduled_plot = &*sched_plot;
    if (r.delivered) {
      deliv_plot = build_rerun_report(*r.delivered, in.scheduled.targets, a.output.step_s);
      info.delivered_plot = &*deliv_plot;
    }
    info.probe_time_s = in.probe_time_s;
    info.probe_temp_C = in.probe_temp_C;
  }
  switch (f) {
    case Format::html: write_deviation_html(r, info, out, u); break;
    case Format::md: {
      MarkdownReport md = write_deviation_markdown(r, info, u, std::filesystem::path(a.output.out).stem().string());
      out << md.markdown;
      side = std::move(md.svg_files);
      break;
    }
    case Format::json: write_deviation_json(r, info, out, u); break;
    case Format::csv:
      write_deviation_csv(r, info, out, u);
      add_csv_sidecar(a.output, side, [&](std::ostream& o) { write_deviation_json(r, info, o, u); });
      break;
    default: write_deviation_text(r, info, out, u); break;
  }
  // The worst case not met is not a demonstrated process either.
  return r.all_met_delivered && (!cons || cons->result.all_met_delivered) ? kAllMet : kNotDemonstrated;
}

int run_deviation(const DeviationArgs& a, std::ostream& out, std::ostream& err) {
  return with_report_output(a.output, "deviation", out, err, [&](std::ostream& report, SideFiles& side, VerdictSummary& s) {
    return deviation_report(a, report, side, s);
  });
}

}  // namespace

void add_deviation_verb(CLI::App& app, VerbContext& ctx) {
  auto args = std::make_shared<DeviationArgs>();
  auto* sub = app.add_subcommand("deviation", "delivered versus scheduled lethality from a logged medium or probe");
  sub->add_option("FILE", args->file, "product file (TOML, schema 1)")->required();
  sub->add_option("--medium-log", args->medium_log, "logged medium of the deviated stage (CSV, first row = stage start)");
  sub->add_option("--stage", args->stage, "the deviated stage (default: the last heating stage)");
  sub->add_option("--probe-log", args->probe_log, "measured cold-spot log (CSV, first row = process start)");
  sub->add_option("--lot", args->lot, "lot or batch identifier for the record");
  // --temp-column as on probe; --column kept for scripts written before it.
  sub->add_option("--temp-column,--column", args->column, "temperature column of the medium log, when it has several");
  sub->add_option("--probe-temp-column", args->probe_column, "temperature column of the probe log, when it has several");
  add_log_format_options(*sub, args->log_format);
  sub->add_option("--probe-time-column", args->probe_time_column, "the probe log's time column by its header name");
  sub->add_option("--tolerance-K", args->tolerance_K, "a reading this far on the unfavourable side of the schedule is deviated")->capture_default_str()->check(within(0, 50, "K", true));
  sub->add_option("--max-gap-s", args->max_gap_s,
                  "readings further apart than this are a gap in the log (no lethality credited in it), s")
      ->capture_default_str()
      ->check(within(0, limits::duration_s.high, "s", true));
  sub->add_option("--timezone", args->timezone,
                  "fixed UTC offset of log timestamps written without one, e.g. +01:00 (needed when they jump by a clock change)");
  sub->add_option("--round-min", args->round_min, "additional time rounded UP to this, min")->capture_default_str()->check(within(0, 1440, "min", true));
  sub->add_flag("--conservative", args->conservative,
                "also evaluate the deviation at the documented worst case of the file's ranges and name the choice that drove it");
  add_threads_option(*sub, args->threads);
  add_library_option(*sub, args->library);
  sub->add_option("--date", args->date, "record date, YYYY-MM-DD (default: today in local time)");
  add_output_options(*sub, args->output, {Format::text, Format::md, Format::html, Format::json, Format::csv}, /*with_step=*/true);
  sub->callback([&ctx, args] {
    ctx.run = [args](std::ostream& out, std::ostream& err) { return run_deviation(*args, out, err); };
  });
}

}  // namespace coldcore::cli
