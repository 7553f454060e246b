// coldcore run FILE: forward simulation of the scheduled process, with assessment.
#include <filesystem>
#include <ostream>

#include "cli/library_files.hpp"
#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/conduction/history.hpp"
#include "coldcore/error.hpp"
#include "coldcore/process/fit_bound.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/io/scenario.hpp"
#include "coldcore/process/inverse.hpp"
#include "coldcore/process/assessment.hpp"
#include "coldcore/report/html.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/report/run_builder.hpp"
#include "coldcore/version.hpp"

namespace coldcore::cli {

namespace {

struct RunArgs {
  std::string file;
  OutputArgs output;
  std::string date;  ///< provenance date; default today (UTC)
  std::string library;  ///< --library DIR; empty: the search order of cli/library_files.hpp
};

int run_report(const RunArgs& a, std::ostream& out, std::ostream& err, SideFiles& side, VerdictSummary& summary) {
  const Format f = output_format(a.output);
  const TempUnit u = parse_temp_unit(a.output.units);
  const io::ProductFile file = io::load_product(a.file);
  io::require_constant_properties(file);
  const LibraryFiles lib = load_libraries(a.library, a.file);
  // process::evaluate: each target on the h scenario conservative for it (process/h_ends.hpp).
  const process::Scenario scenario = io::scenario_of(file);
  const process::Evaluation eval = process::evaluate(scenario, {&lib.organisms, &lib.rules, &lib.cooking});
  const History& history = eval.history;
  const Assessment& assessment = eval.assessment;
  RunReportOptions opts;
  opts.step_s = a.output.step_s;
  opts.date = report_date(a.date);
  opts.version = kVersion;
  RunReport report = build_run_report(scenario, {file.origin, file.sha256_hex, file.warnings}, history, opts);
  // the data libraries the assessment read, with their SHA-256, before the date
  const auto lib_rows = library_provenance(lib);
  const bool dated = !report.provenance.empty() && report.provenance.back().key == "date";
  report.provenance.insert(report.provenance.end() - (dated ? 1 : 0), lib_rows.begin(), lib_rows.end());
  std::vector<const History*> history_of(assessment.targets.size(), &history);
  for (std::size_t t = 0; t < eval.target_scenario.size(); ++t)
    history_of[t] = &eval.h_scenarios[static_cast<std::size_t>(eval.target_scenario[t])].history;
  add_assessment(report, history_of, assessment, file.targets);
  add_scenarios(report, eval, &file.product, file.targets, a.output.step_s);  // every scenario's history
  add_h_assumptions(report, eval);
  if (file.calibration)
    add_fit_bound(report, process::targets_at_fit_bound(scenario, *file.calibration, {&lib.organisms, &lib.rules, &lib.cooking}),
                  *file.calibration);
  summary = verdict_summary(report);
  switch (f) {
    case Format::json: write_run_json(report, out, u); break;
    case Format::csv:
      write_run_csv(report, out, u);
      add_csv_sidecar(a.output, side, [&](std::ostream& o) { write_run_json(report, o, u); });
      break;
    case Format::html: write_run_html(report, out, u); break;
    case Format::md: {
      const std::string base = std::filesystem::path(a.output.out).stem().string();
      MarkdownReport md = write_run_markdown(report, u, base);
      out << md.markdown;
      side = std::move(md.svg_files);
      break;
    }
    default: write_run_text(report, out, u); break;
  }
  // A stage that hit its cap did not run as scheduled: say so on stderr and never exit 0.
  // (In every h scenario: a stage capped in any of them was not demonstrated as scheduled.)
  bool capped = false;
  std::vector<const History*> runs{&history};
  for (std::size_t i = 1; i < eval.h_scenarios.size(); ++i) runs.push_back(&eval.h_scenarios[i].history);
  for (const History* h : runs)
    for (const auto& st : h->stages)
      if (st.ended_by == StageEndedBy::cap) {
        capped = true;
        err << "coldcore: " << file.origin << ": stage '" << st.name << "' reached its cap at "
                  << duration_text(st.end_s - st.start_s) << " before its end condition was met"
                  << (runs.size() > 1 ? " (in one of the h scenarios)" : "") << "\n";
      }
  if (capped) return kNotDemonstrated;
  return assessment.targets.empty() || assessment.all_met() ? kAllMet : kNotDemonstrated;
}

int run_run(const RunArgs& a, std::ostream& out, std::ostream& err) {
  return with_report_output(a.output, "run", out, err, [&](std::ostream& report, SideFiles& side, VerdictSummary& s) {
    return run_report(a, report, err, side, s);
  });
}

}  // namespace

void add_run_verb(CLI::App& app, VerbContext& ctx) {
  auto args = std::make_shared<RunArgs>();
  auto* sub = app.add_subcommand("run", "forward simulation of the scheduled process, with assessment");
  sub->add_option("FILE", args->file, "product file (TOML, schema 1)")->required();
  add_output_options(*sub, args->output, {Format::text, Format::md, Format::html, Format::json, Format::csv}, /*with_step=*/true);
  sub->add_option("--date", args->date, "report date for provenance, YYYY-MM-DD (default: today in local time)");
  add_library_option(*sub, args->library);
  sub->callback([&ctx, args] {
    ctx.run = [args](std::ostream& out, std::ostream& err) { return run_run(*args, out, err); };
  });
}

}  // namespace coldcore::cli
