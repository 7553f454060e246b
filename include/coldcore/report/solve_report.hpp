#pragma once
/// Writers of `coldcore solve` answers: text, json, csv, md, html (cautions always). They format a
/// process::SolveResult; nothing is recomputed.
///
/// Every format opens with the verdict summary of the verification re-run (verdict_summary.hpp;
/// JSON "verdict_summary", csv its leading '# verdict summary: ' line).
/// JSON: {"question", "stage", "quantity", "answer_<u>" (unrounded), "rounded_<u>" (to use),
///        "unit_<u>", "nominal_<u>", "verification": {"value_<u>", "all_met", "considered_met",
///        "targets": [...]}, "one_unit_less": {...} | null, "considered_targets", "notes",
///        "assumptions", "warnings", "provenance", "cautions"}, with <u> = s | m | C (SI).
/// csv: '# ' comment lines (cautions, provenance, notes), then one row per target and re-run:
///        run,value_<u>,target,kind,required,achieved,margin,unit,verdict,met   (met: true | false)
/// Shown lethality is rounded down and times up (assessment.hpp); the answer to use is rounded
/// toward the safe side by the solver.
#include <iosfwd>
#include <string>
#include <vector>

#include "coldcore/process/conservative.hpp"
#include "coldcore/process/inverse.hpp"
#include "coldcore/report/format.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/report/run_report.hpp"

namespace coldcore {

struct SolveReportContext {
  std::string product_name;
  std::vector<KeyValue> provenance;   ///< tool, input, SHA-256, libraries, date
  std::vector<std::string> warnings;  ///< file warnings
  /// --conservative: the worst case beside the nominal answer (JSON key "conservative").
  const process::ConservativeSolve* conservative = nullptr;
  /// md/html plots: the verification re-run's own history and assessment, sampled by
  /// build_rerun_report (run_builder.hpp). Null: the rich reports have no plots.
  const RunReport* verification_plot = nullptr;
  /// A calibrated product: the answer at the one-sided 95 % bound of the fit
  /// (process/fit_bound.hpp; JSON key "at_fit_bound"). Null otherwise.
  const process::SolveResult* at_fit_bound = nullptr;
};

/// "62 min; 66 min at the one-sided 95 % bound of the fit" style line for a calibrated product.
std::string fit_bound_sentence(const process::SolveResult& nominal, const process::SolveResult& bound, TempUnit u);

void write_solve_text(const process::SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u);
void write_solve_json(const process::SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u);
void write_solve_csv(const process::SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u);

/// Self-contained HTML (inline CSS and SVG, nothing fetched; well-formed XML after the doctype):
/// title naming the question; question and product; the answer (unrounded and the value to use,
/// in the question's unit); the verification re-run and the one-unit-less re-run, one row per
/// target (required, achieved, margin, verdict "met" / "not demonstrated"); the plots of the
/// verification re-run when `c.verification_plot` is set; the --conservative section when
/// `c.conservative` is set; notes, warnings, assumptions, provenance, the cautions box.
/// Temperatures in `u`, F-values in minutes. Same input ⇒ same bytes (no clock is read).
void write_solve_html(const process::SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u);
/// The same content as Markdown; plots as `<svg_basename>-<plot>.svg` files (see markdown.hpp).
/// REQUIRES: svg_basename a plain, non-empty file name.
MarkdownReport write_solve_markdown(const process::SolveResult& r, const SolveReportContext& c, TempUnit u,
                                    std::string_view svg_basename);

/// Shared by the solve and deviation writers: one target result in JSON.
/// Every target carries "met" (true only for the verdict "met") and, for a cooling rule, its steps.
void write_target_json(class JsonWriter& w, const TargetResult& t);
/// Unit of TargetResult's raw numbers (required, achieved, margin): "log10", "s" or "fraction"
/// (its `unit` names the unit of the texts).
const char* raw_unit(const TargetResult& t);
/// The key "cooling_steps": one object per step {"label", "advisory", "clock_started", "reached",
/// "passed", "elapsed_s" (a lower bound when not reached), "within_s", "margin_s"}.
void write_cooling_steps_json(class JsonWriter& w, const CoolingCheck& c);

}  // namespace coldcore
