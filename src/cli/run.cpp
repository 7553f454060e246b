// coldcore run FILE: forward simulation of the scheduled process, with assessment.
#include <ctime>
#include <iostream>

#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/conduction/history.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/report/run_builder.hpp"
#include "coldcore/version.hpp"

namespace coldcore::cli {

namespace {

struct RunArgs {
  std::string file;
  OutputArgs output;
  std::string date;  ///< provenance date; default today (UTC)
};

std::string today_utc() {
  std::time_t now = std::time(nullptr);
  std::tm tm{};
  gmtime_r(&now, &tm);
  char buf[16];
  std::strftime(buf, sizeof buf, "%Y-%m-%d", &tm);
  return buf;
}

int run_run(const RunArgs& a, std::ostream& out) {
  const Format f = parse_format(a.output.format, {Format::text, Format::json, Format::csv});
  const TempUnit u = parse_temp_unit(a.output.units);
  const io::ProductFile file = io::load_product(a.file);
  const History history = simulate(file.product, file.stages);
  RunReportOptions opts;
  opts.step_s = a.output.step_s;
  opts.date = a.date.empty() ? today_utc() : a.date;
  opts.version = kVersion;
  const RunReport report = build_run_report(file, history, opts);
  switch (f) {
    case Format::json: write_run_json(report, out, u); break;
    case Format::csv: write_run_csv(report, out, u); break;
    default: write_run_text(report, out, u); break;
  }
  for (const auto& v : report.verdicts)
    if (!v.met) return kNotDemonstrated;
  return kAllMet;
}

}  // namespace

void add_run_verb(CLI::App& app, VerbContext& ctx) {
  auto args = std::make_shared<RunArgs>();
  auto* sub = app.add_subcommand("run", "forward simulation of the scheduled process, with assessment");
  sub->add_option("FILE", args->file, "product file (TOML, schema 1)")->required();
  add_output_options(*sub, args->output, /*with_step=*/true);
  sub->add_option("--date", args->date, "report date for provenance, YYYY-MM-DD (default: today, UTC)");
  sub->callback([&ctx, args] {
    ctx.run = [args] { return with_output(args->output, [&](std::ostream& out) { return run_run(*args, out); }); };
  });
}

}  // namespace coldcore::cli
