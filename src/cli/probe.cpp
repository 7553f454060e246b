// coldcore probe LOG.csv: lethality and cooling compliance from a measured cold-spot log.
#include <filesystem>
#include <ostream>
#include <optional>

#include "cli/log_options.hpp"
#include "cli/library_files.hpp"
#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/error.hpp"
#include "coldcore/io/logger_csv.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/io/sha256.hpp"
#include "coldcore/process/assessment.hpp"
#include "coldcore/report/html.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/report/probe_report.hpp"
#include "coldcore/version.hpp"

namespace coldcore::cli {

namespace {

struct ProbeArgs {
  std::string log;
  LogFormatArgs log_format;
  std::string library;  ///< --library DIR; empty: beside the log, then the usual search order
  std::string organism;
  std::optional<double> target_log;
  std::string rule;
  std::optional<double> reference_C, z_C, D_min, F_min;
  std::string temp_column;
  double max_gap_s = 60;
  std::string timezone;
  std::string date;
  std::string lot;
  OutputArgs output;
};

std::vector<Target> probe_targets(const ProbeArgs& a, bool& lethality_has_requirement) {
  std::vector<Target> targets;
  const bool own = a.reference_C || a.z_C || a.D_min;
  if (own && !a.organism.empty())
    throw InputError("--organism = " + a.organism + ": give either a library organism or own kinetics (--reference-C, --z-C, --D-min), not both");
  lethality_has_requirement = true;
  if (own) {
    if (!a.reference_C || !a.z_C) throw InputError("own kinetics: --reference-C and --z-C are both required");
    if (!(*a.z_C > 0)) throw InputError("--z-C = " + fixed(*a.z_C, 3) + ": must be > 0");
    Target t;
    t.name = "own";
    OwnKinetics k;
    k.reference_C = *a.reference_C;
    k.z_C = *a.z_C;
    if (a.D_min) {
      if (!(*a.D_min > 0)) throw InputError("--D-min = " + fixed(*a.D_min, 4) + ": must be > 0");
      k.D_ref_s = *a.D_min * 60.0;
    }
    t.own = k;
    if (a.target_log) {
      if (!a.D_min) throw InputError("--target-log needs --D-min with own kinetics");
      t.kind = TargetKind::log_reduction;
      t.log_reduction = *a.target_log;
    } else if (a.F_min) {
      t.kind = TargetKind::f_value;
      t.F_required_s = *a.F_min * 60.0;
    } else {
      // No requirement given: F (and, with a D, the log reductions) is reported, no verdict is
      // claimed. The placeholder requirement only makes assess compute those values.
      if (a.D_min) {
        t.kind = TargetKind::log_reduction;
        t.log_reduction = 1.0;
      } else {
        t.kind = TargetKind::f_value;
        t.F_required_s = 60;  // placeholder (assess refuses 0); the delivered F does not depend on it
      }
      lethality_has_requirement = false;
    }
    targets.push_back(t);
  } else if (!a.organism.empty()) {
    Target t;
    t.name = a.organism;
    t.organism = a.organism;
    t.kind = TargetKind::log_reduction;
    t.log_reduction = a.target_log.value_or(1.0);
    lethality_has_requirement = a.target_log.has_value();
    targets.push_back(t);
  }
  if (a.target_log && !(*a.target_log > 0))
    throw InputError("--target-log = " + fixed(*a.target_log, 3) + ": must be > 0");
  if (!a.rule.empty()) {
    Target t;
    t.kind = TargetKind::cooling_rule;
    t.name = a.rule;
    t.rule = a.rule;
    targets.push_back(t);
  }
  if (targets.empty()) throw InputError("probe: give --organism KEY (or own kinetics) and/or --rule KEY");
  return targets;
}

int probe_report(const ProbeArgs& a, std::ostream& out, std::ostream& err, SideFiles& side, VerdictSummary& summary) {
  const Format f = output_format(a.output);
  const TempUnit u = parse_temp_unit(a.output.units);
  bool has_requirement = true;
  const std::vector<Target> targets = probe_targets(a, has_requirement);
  const std::string bytes = io::read_text_file(a.log);
  io::LogOptions lo;
  lo.max_gap_s = a.max_gap_s;
  lo.temp_column = a.temp_column;
  apply_log_format(a.log_format, lo);
  if (!a.timezone.empty()) lo.utc_offset_s = io::parse_utc_offset_s(a.timezone);
  const TimeSeries log = io::parse_log_csv(bytes, a.log, lo);
  const LibraryFiles lib = load_libraries(a.library, a.log);
  AssessOptions opts;
  opts.max_gap_s = a.max_gap_s;  // issue 11: no lethality across a gap
  opts.origin = a.log;
  opts.cooking_tables = &lib.cooking;
  const ProbeAssessment pa = assess_probe_log(log.time_s, log.temp_C, targets, lib.organisms, lib.rules, opts, a.log);

  ProbeReportOptions ro;
  ro.log_path = a.log;
  ro.log_sha256 = io::sha256_hex(bytes);
  ro.lot = a.lot;
  ro.lethality_requirement = has_requirement;
  ro.library_provenance = library_provenance(lib, /*names_only=*/true);  // found without a product file
  ro.date = report_date(a.date);
  ro.version = kVersion;
  ro.max_gap_s = a.max_gap_s;
  const RunReport r = build_probe_report(log, pa, ro);
  summary = verdict_summary(r);
  switch (f) {
    case Format::json: write_run_json(r, out, u); break;
    case Format::csv:
      write_run_csv(r, out, u);
      add_csv_sidecar(a.output, side, [&](std::ostream& o) { write_run_json(r, o, u); });
      break;
    case Format::html: write_run_html(r, out, u); break;
    case Format::md: {
      MarkdownReport md = write_run_markdown(r, u, std::filesystem::path(a.output.out).stem().string());
      out << md.markdown;
      side = std::move(md.svg_files);
      break;
    }
    default: write_run_text(r, out, u); break;
  }
  if (!has_requirement)
    err << "coldcore: probe: no target given (--target-log, or --F-min with own kinetics): the delivered "
                 "lethality is reported, no verdict is claimed\n";
  if (!has_requirement && a.rule.empty()) return kAllMet;  // nothing was asked to be met
  for (size_t i = 0; i < pa.targets.size(); ++i) {
    const bool lethal = pa.targets[i].kinetics.has_value();
    if (lethal && !has_requirement) continue;
    if (pa.targets[i].verdict != Verdict::met) return kNotDemonstrated;
  }
  return kAllMet;
}

int run_probe(const ProbeArgs& a, std::ostream& out, std::ostream& err) {
  return with_report_output(a.output, "probe", out, err, [&](std::ostream& report, SideFiles& side, VerdictSummary& s) {
    return probe_report(a, report, err, side, s);
  });
}

}  // namespace

void add_probe_verb(CLI::App& app, VerbContext& ctx) {
  auto a = std::make_shared<ProbeArgs>();
  auto* sub = app.add_subcommand("probe", "lethality and cooling compliance from a measured cold-spot log");
  sub->add_option("LOG", a->log, "CSV log: a time column (time_s, time_min, time_h or timestamp) and a temperature column (*_C or *_F)")->required();
  sub->add_option("--organism", a->organism, "organism key of the library (coldcore organisms)");
  sub->add_option("--target-log", a->target_log, "required log10 reduction")->check(within(0, 100, "log10", true));
  sub->add_option("--rule", a->rule, "cooling-rule key of the library (coldcore rules)");
  sub->add_option("--reference-C", a->reference_C, "own kinetics: reference temperature, °C")->check(within(limits::temperature_C.low, limits::temperature_C.high, "C"));
  sub->add_option("--z-C", a->z_C, "own kinetics: z, °C")->check(within(limits::z_C.low, limits::z_C.high, "C"));
  sub->add_option("--D-min", a->D_min, "own kinetics: D at the reference temperature, min")->check(within(0, limits::duration_s.high / 60, "min", true));
  sub->add_option("--F-min", a->F_min, "own kinetics: required F at the reference temperature, min")->check(within(0, limits::duration_s.high / 60, "min", true));
  sub->add_option("--temp-column", a->temp_column, "which temperature column to use when the log has several");
  add_log_format_options(*sub, a->log_format);
  sub->add_option("--max-gap-s", a->max_gap_s, "gaps longer than this are reported, s")->capture_default_str()->check(within(0, limits::duration_s.high, "s", true));
  sub->add_option("--lot", a->lot, "lot or batch identifier for the report");
  sub->add_option("--timezone", a->timezone,
                  "fixed UTC offset of timestamps written without one, e.g. +01:00 (needed when they jump by a clock change)");
  sub->add_option("--date", a->date, "report date for provenance, YYYY-MM-DD (default: today in local time)");
  add_output_options(*sub, a->output, {Format::text, Format::md, Format::html, Format::json, Format::csv});
  add_library_option(*sub, a->library);
  sub->callback([&ctx, a] {
    ctx.run = [a](std::ostream& out, std::ostream& err) { return run_probe(*a, out, err); };
  });
}

}  // namespace coldcore::cli
