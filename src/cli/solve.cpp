// coldcore solve FILE --for hold-time|chill-time|max-size|min-medium: inverse questions.
#include <ctime>
#include <filesystem>
#include <memory>

#include "cli/library_files.hpp"
#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/error.hpp"
#include "coldcore/process/fit_bound.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/io/scenario.hpp"
#include "coldcore/process/conservative.hpp"
#include "coldcore/process/inverse.hpp"
#include "coldcore/report/run_builder.hpp"
#include "coldcore/report/solve_report.hpp"
#include "coldcore/version.hpp"

namespace coldcore::cli {

namespace {

struct SolveArgs {
  std::string file;
  std::string question;
  std::string stage;
  std::string library;
  std::string date;
  double round_min = 1;      ///< hold/chill unit
  double round_mm = 1;       ///< size unit
  double round_C = 0.5;      ///< medium unit
  double max_hold_h = 48;
  std::optional<double> end_C;
  bool mean = false;
  bool conservative = false;
  unsigned threads = 0;  ///< --conservative: worker threads, 0 = every core
  OutputArgs output;
};

process::Question parse_question(const std::string& s) {
  using process::Question;
  for (Question q : {Question::hold_time, Question::chill_time, Question::max_size, Question::min_medium})
    if (s == process::to_string(q)) return q;
  throw InputError("--for = " + s + ": must be hold-time, chill-time, max-size or min-medium");
}

int solve_report(const SolveArgs& a, std::ostream& out, SideFiles& side, VerdictSummary& summary) {
  const Format f = output_format(a.output);
  const TempUnit u = parse_temp_unit(a.output.units);
  const process::Question q = parse_question(a.question);
  if (!(a.round_min > 0)) throw InputError("--round-min = " + std::to_string(a.round_min) + ": must be > 0");
  if (!(a.round_mm > 0)) throw InputError("--round-mm = " + std::to_string(a.round_mm) + ": must be > 0");
  if (!(a.round_C > 0)) throw InputError("--round-C = " + std::to_string(a.round_C) + ": must be > 0");
  if (!(a.max_hold_h > 0)) throw InputError("--max-hold-h = " + std::to_string(a.max_hold_h) + ": must be > 0");
  const io::ProductFile file = io::load_product(a.file);
  io::require_constant_properties(file);
  const LibraryFiles libs = load_libraries(a.library, a.file);
  const process::Scenario s = io::scenario_of(file);
  process::SolveOptions o;
  o.stage = a.stage;
  o.unit_s = a.round_min * 60.0;
  o.unit_m = a.round_mm / 1000.0;
  o.unit_C = a.round_C;
  o.max_hold_s = a.max_hold_h * 3600.0;
  o.end_C = a.end_C;
  o.mean = a.mean;
  const process::SolveResult r = process::solve(q, s, {&libs.organisms, &libs.rules, &libs.cooking}, o);
  std::optional<process::ConservativeSolve> cons;
  if (a.conservative) {
    cons = process::solve_conservative(q, s, io::ranges_of(file), {&libs.organisms, &libs.rules, &libs.cooking}, o,
                                       a.threads);
  }
  std::optional<process::SolveResult> at_bound;
  if (file.calibration)
    at_bound = process::solve_at_fit_bound(q, s, *file.calibration, {&libs.organisms, &libs.rules, &libs.cooking}, o, r);
  SolveReportContext c;
  if (at_bound) c.at_fit_bound = &*at_bound;
  c.product_name = file.product.name;
  c.warnings = file.warnings;
  if (cons) c.conservative = &*cons;
  summary = verdict_summary(r, c.conservative);
  c.provenance = {{"tool", std::string("coldcore ") + kVersion},
                  {"input", file.origin},
                  {"input SHA-256", file.sha256_hex},
                  {"date", report_date(a.date)}};
  const auto lib_rows = library_provenance(libs);
  c.provenance.insert(c.provenance.end() - 1, lib_rows.begin(), lib_rows.end());
  // The rich formats plot the verification re-run the solver already made (sampled, not re-run).
  std::optional<RunReport> plot;
  if (f == Format::md || f == Format::html) {
    // each target's F from its own h scenario; every scenario plotted when split (issue 11)
    plot = build_rerun_report(r.verification.eval, s.targets, a.output.step_s);
    c.verification_plot = &*plot;
  }
  switch (f) {
    case Format::html: write_solve_html(r, c, out, u); break;
    case Format::md: {
      MarkdownReport md = write_solve_markdown(r, c, u, std::filesystem::path(a.output.out).stem().string());
      out << md.markdown;
      side = std::move(md.svg_files);
      break;
    }
    case Format::json: write_solve_json(r, c, out, u); break;
    case Format::csv:
      write_solve_csv(r, c, out, u);
      add_csv_sidecar(a.output, side, [&](std::ostream& o) { write_solve_json(r, c, o, u); });
      break;
    default: write_solve_text(r, c, out, u); break;
  }
  // The answer exists; the exit code says whether its re-run meets every target.
  const bool ok = q == process::Question::chill_time ? r.end_C && r.end_reached_at_rounded
                                                     : r.verification.eval.considered_met;
  // A conservative question without an answer is not a demonstrated process either.
  const bool cons_ok = !cons || (cons->result && cons->result->verification.eval.considered_met);
  return ok && cons_ok ? kAllMet : kNotDemonstrated;
}

int run_solve(const SolveArgs& a, std::ostream& out, std::ostream& err) {
  return with_report_output(a.output, "solve", out, err, [&](std::ostream& report, SideFiles& side, VerdictSummary& s) {
    return solve_report(a, report, side, s);
  });
}

}  // namespace

void add_solve_verb(CLI::App& app, VerbContext& ctx) {
  auto args = std::make_shared<SolveArgs>();
  auto* sub = app.add_subcommand("solve", "inverse questions: hold-time, chill-time, max-size, min-medium");
  sub->add_option("FILE", args->file, "product file (TOML, schema 1)")->required();
  sub->add_option("--for", args->question, "hold-time | chill-time | max-size | min-medium")->required();
  sub->add_option("--stage", args->stage, "stage to change (default: last heating stage; chill-time: last cooling)");
  sub->add_option("--round-min", args->round_min, "hold/chill answers rounded UP to this, min")->capture_default_str()->check(within(0, 1440, "min", true));
  sub->add_option("--round-mm", args->round_mm, "max-size answer rounded DOWN to this, mm")->capture_default_str()->check(within(0, 1000, "mm", true));
  sub->add_option("--round-C", args->round_C, "min-medium answer rounded UP to this, °C")->capture_default_str()->check(within(0, 50, "C", true));
  sub->add_option("--max-hold-h", args->max_hold_h, "search bound for hold and chill times, h")->capture_default_str()->check(within(0, limits::duration_s.high / 3600, "h", true));
  sub->add_option("--end-C", args->end_C, "chill-time: end temperature, °C (default: the stage's until_* value)")->check(within(limits::temperature_C.low, limits::temperature_C.high, "C"));
  sub->add_flag("--mean", args->mean, "chill-time: the mass average instead of the centre");
  sub->add_flag("--conservative", args->conservative,
                "also solve the documented worst case of the file's ranges and name the choice that drove it");
  add_threads_option(*sub, args->threads);
  add_library_option(*sub, args->library);
  sub->add_option("--date", args->date, "report date for provenance, YYYY-MM-DD (default: today in local time)");
  add_output_options(*sub, args->output, {Format::text, Format::md, Format::html, Format::json, Format::csv}, /*with_step=*/true);
  sub->callback([&ctx, args] {
    ctx.run = [args](std::ostream& out, std::ostream& err) { return run_solve(*args, out, err); };
  });
}

}  // namespace coldcore::cli
