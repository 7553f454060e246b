// coldcore run FILE: forward simulation of the scheduled process, with assessment.
#include <filesystem>
#include <iostream>

#include "cli/library_files.hpp"
#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/conduction/history.hpp"
#include "coldcore/error.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/report/assessment.hpp"
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
};

int run_run(const RunArgs& a, std::ostream& out, SideFiles& side) {
  const Format f = parse_format(a.output.format, {Format::text, Format::md, Format::html, Format::json, Format::csv});
  const TempUnit u = parse_temp_unit(a.output.units);
  if (f == Format::md && a.output.out.empty())
    throw InputError("--format md writes its plots as SVG files beside the report: give --out PATH.md");
  const io::ProductFile file = io::load_product(a.file);
  io::require_constant_properties(file);
  const LibraryFiles lib = load_libraries("", a.file);
  const History history = simulate(file.product, file.stages);
  AssessOptions assess_opts;
  assess_opts.origin = file.origin;
  assess_opts.cooking_tables = &lib.cooking;
  const Assessment assessment = assess(history, file.targets, lib.organisms, lib.rules, assess_opts);
  RunReportOptions opts;
  opts.step_s = a.output.step_s;
  opts.date = a.date.empty() ? today_utc() : a.date;
  opts.version = kVersion;
  RunReport report = build_run_report(file, history, opts);
  add_assessment(report, history, assessment, file.targets);
  switch (f) {
    case Format::json: write_run_json(report, out, u); break;
    case Format::csv: write_run_csv(report, out, u); break;
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
  bool capped = false;
  for (const auto& st : history.stages)
    if (st.ended_by == StageEndedBy::cap) {
      capped = true;
      std::cerr << "coldcore: " << file.origin << ": stage '" << st.name << "' reached its cap at "
                << duration_text(st.end_s - st.start_s) << " before its end condition was met\n";
    }
  if (capped) return kNotDemonstrated;
  return assessment.targets.empty() || assessment.all_met() ? kAllMet : kNotDemonstrated;
}

}  // namespace

void add_run_verb(CLI::App& app, VerbContext& ctx) {
  auto args = std::make_shared<RunArgs>();
  auto* sub = app.add_subcommand("run", "forward simulation of the scheduled process, with assessment");
  sub->add_option("FILE", args->file, "product file (TOML, schema 1)")->required();
  add_output_options(*sub, args->output, /*with_step=*/true);
  sub->add_option("--date", args->date, "report date for provenance, YYYY-MM-DD (default: today, UTC)");
  sub->callback([&ctx, args] {
    ctx.run = [args] {
      return with_output(args->output,
                         [&](std::ostream& out, SideFiles& side) { return run_run(*args, out, side); });
    };
  });
}

}  // namespace coldcore::cli
