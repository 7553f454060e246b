// coldcore probe LOG.csv: lethality and cooling compliance from a measured cold-spot log.
#include <filesystem>
#include <iostream>
#include <optional>

#include "cli/library_files.hpp"
#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/error.hpp"
#include "coldcore/io/logger_csv.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/io/sha256.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "coldcore/report/assessment.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/html.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/report/run_builder.hpp"
#include "coldcore/version.hpp"

namespace coldcore::cli {

namespace {

struct ProbeArgs {
  std::string log;
  std::string organism;
  std::optional<double> target_log;
  std::string rule;
  std::optional<double> reference_C, z_C, D_min, F_min;
  std::string temp_column;
  double max_gap_s = 60;
  std::string date;
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
      // No requirement given: F is reported, no verdict is claimed.
      t.kind = TargetKind::f_value;
      t.F_required_s = 0;
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

int run_probe(const ProbeArgs& a, std::ostream& out, SideFiles& side, VerdictSummary& summary) {
  const Format f = parse_format(a.output.format, {Format::text, Format::md, Format::html, Format::json, Format::csv});
  const TempUnit u = parse_temp_unit(a.output.units);
  if (f == Format::md && a.output.out.empty())
    throw InputError("--format md writes its plots as SVG files beside the report: give --out PATH.md");
  bool has_requirement = true;
  const std::vector<Target> targets = probe_targets(a, has_requirement);
  const std::string bytes = io::read_text_file(a.log);
  io::LogOptions lo;
  lo.max_gap_s = a.max_gap_s;
  lo.temp_column = a.temp_column;
  const io::TimeSeries log = io::parse_log_csv(bytes, a.log, lo);
  const LibraryFiles lib = load_libraries("", "");
  AssessOptions opts;
  opts.origin = a.log;
  opts.cooking_tables = &lib.cooking;
  const ProbeAssessment pa = assess_probe_log(log.time_s, log.temp_C, targets, lib.organisms, lib.rules, opts, a.log);

  RunReport r;
  r.verb = "probe";
  r.title = "coldcore probe: measured cold-spot log " + a.log;
  const double span = log.time_s.back() - log.time_s.front();
  r.product = {{"log", a.log},
               {"columns", log.time_column + ", " + log.temp_column},
               {"rows", std::to_string(log.time_s.size())},
               {"duration", duration_text(span)},
               {"mean interval", duration_text(log.time_s.size() > 1 ? span / static_cast<double>(log.time_s.size() - 1) : 0.0)}};
  r.history.columns = {{"time_s", false}, {"centre_C", true}};
  for (size_t i = 0; i < log.time_s.size(); ++i) r.history.rows.push_back({log.time_s[i], log.temp_C[i]});
  size_t lethal_index = 0;
  for (size_t i = 0; i < pa.targets.size(); ++i) {
    const TargetResult& t = pa.targets[i];
    VerdictRow v = verdict_row(t);
    if (t.kinetics) {
      const ProbeLethality& pl = pa.lethality.at(lethal_index++);
      v.details.insert(v.details.begin(),
                       "General Method on the log: trapezoid " + shown_down(pl.F_trapezoid_s / 60.0) + " min, Simpson " +
                           shown_down(pl.F_simpson_s / 60.0) + " min, exact on the linear interpolant " +
                           shown_down(pl.F_linear_s / 60.0) + " min; the verdict uses the smallest");
      const auto cum = cumulative_f_trapezoid_s(log.time_s, log.temp_C, *t.kinetics, a.log);
      const std::string col = t.column.empty() ? "F_" + t.name + "_min" : t.column;
      r.history.columns.push_back({col, false});
      for (size_t k = 0; k < cum.size(); ++k) r.history.rows[k].push_back(cum[k] / 60.0);
      if (!has_requirement) {
        v.met = false;
        v.required = "none given";
        v.margin = "-";
        v.details.push_back("no requirement was given (--target-log or --F-min): lethality is reported, no verdict is claimed");
      } else {
        r.target_lines.push_back({col, t.F_required_s / 60.0, ""});
      }
    }
    if (t.cooling) {
      int n = 0;
      for (const auto& st : t.cooling->steps) {
        ++n;
        if (st.start_s)
          r.rule_boxes.push_back({"step " + std::to_string(n) + " (" + duration_text(st.step.within_s) + ")", *st.start_s,
                                  *st.start_s + st.step.within_s, st.step.from_C, st.step.to_C});
      }
    }
    r.verdicts.push_back(v);
  }
  r.warnings = log.warnings;
  r.warnings.insert(r.warnings.end(), pa.warnings.begin(), pa.warnings.end());
  r.assumptions = {"The log is the temperature at the product's slowest-heating point; its placement and the probe's calibration are the user's to verify.",
                   "Temperatures between logged rows are taken as linear in time.",
                   "Lethality uses log-linear (Bigelow) kinetics with the D and z values stated."};
  r.provenance = {{"tool", std::string("coldcore ") + kVersion}, {"input", a.log}, {"input SHA-256", io::sha256_hex(bytes)}};
  // the data libraries the assessment read (found without a product file: names only)
  const auto lib_rows = library_provenance(lib, /*names_only=*/true);
  r.provenance.insert(r.provenance.end(), lib_rows.begin(), lib_rows.end());
  r.provenance.push_back({"date", a.date.empty() ? today_utc() : a.date});
  r.cautions = cautions();
  summary = verdict_summary(r);
  switch (f) {
    case Format::json: write_run_json(r, out, u); break;
    case Format::csv: write_run_csv(r, out, u); break;
    case Format::html: write_run_html(r, out, u); break;
    case Format::md: {
      MarkdownReport md = write_run_markdown(r, u, std::filesystem::path(a.output.out).stem().string());
      out << md.markdown;
      side = std::move(md.svg_files);
      break;
    }
    default: write_run_text(r, out, u); break;
  }
  if (!has_requirement && a.rule.empty()) return kAllMet;  // nothing was asked to be met
  for (size_t i = 0; i < pa.targets.size(); ++i) {
    const bool lethal = pa.targets[i].kinetics.has_value();
    if (lethal && !has_requirement) continue;
    if (pa.targets[i].verdict != Verdict::met) return kNotDemonstrated;
  }
  return kAllMet;
}

}  // namespace

void add_probe_verb(CLI::App& app, VerbContext& ctx) {
  auto a = std::make_shared<ProbeArgs>();
  auto* sub = app.add_subcommand("probe", "lethality and cooling compliance from a measured cold-spot log");
  sub->add_option("LOG", a->log, "CSV log: a time column (time_s, time_min, time_h or timestamp) and a temperature column (*_C or *_F)")->required();
  sub->add_option("--organism", a->organism, "organism key of the library (coldcore organisms)");
  sub->add_option("--target-log", a->target_log, "required log10 reduction");
  sub->add_option("--rule", a->rule, "cooling-rule key of the library (coldcore rules)");
  sub->add_option("--reference-C", a->reference_C, "own kinetics: reference temperature, °C");
  sub->add_option("--z-C", a->z_C, "own kinetics: z, °C");
  sub->add_option("--D-min", a->D_min, "own kinetics: D at the reference temperature, min");
  sub->add_option("--F-min", a->F_min, "own kinetics: required F at the reference temperature, min");
  sub->add_option("--temp-column", a->temp_column, "which temperature column to use when the log has several");
  sub->add_option("--max-gap-s", a->max_gap_s, "gaps longer than this are reported, s")->capture_default_str();
  sub->add_option("--date", a->date, "report date for provenance, YYYY-MM-DD (default: today, UTC)");
  add_output_options(*sub, a->output);
  sub->callback([&ctx, a] {
    ctx.run = [a] {
      return with_report_output(a->output, "probe", [&](std::ostream& out, SideFiles& side, VerdictSummary& s) {
        return run_probe(*a, out, side, s);
      });
    };
  });
}

}  // namespace coldcore::cli
