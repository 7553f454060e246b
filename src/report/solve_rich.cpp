// Markdown and HTML answers of `coldcore solve`. The content is written once, a function per
// section, into a RichDoc; html_doc / md_doc make the markup. Only formatting: every number is a
// field of the SolveResult or of the verification re-run the solver made.
#include <cctype>
#include <sstream>

#include "coldcore/report/conservative_text.hpp"
#include "coldcore/report/process_notes.hpp"
#include "coldcore/report/target_notes.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/solve_report.hpp"
#include "coldcore/report/history_notes.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "rich_page.hpp"
#include "run_figures.hpp"
#include "solve_text.hpp"

namespace coldcore {

namespace {

using detail::RichDoc;
using detail::TextTable;
using process::Check;
using process::Question;
using process::SolveResult;

std::string question_words(Question q) {
  switch (q) {
    case Question::hold_time: return "shortest hold time that meets every target";
    case Question::chill_time: return "chilling time to the end temperature";
    case Question::max_size: return "largest size that still meets every target";
    case Question::min_medium: return "lowest medium temperature that meets every target";
  }
  return "?";
}

std::string joined(const std::vector<std::string>& v) {
  std::string s;
  for (size_t i = 0; i < v.size(); ++i) s += (i ? ", " : "") + v[i];
  return s;
}

/// One row per target of a re-run: required, achieved, margin, verdict.
void check_table(RichDoc& d, const std::vector<TargetResult>& targets) {
  std::vector<bool> met;
  const TextTable t = detail::target_table(targets, met);
  if (met.empty()) d.paragraph("No targets to assess.");
  else d.verdict_table(t, met);
}
void check_table(RichDoc& d, const Check& c) { check_table(d, c.eval.assessment.targets); }

std::string end_line(const SolveResult& r, double at_C, bool reached, TempUnit u) {
  return "The " + r.end_point + " at the end of the stage: " + fixed(display_temp(at_C, u), 3) + " " +
         std::string(unit_symbol(u)) + " (end temperature " + fixed(display_temp(*r.end_C, u), 2) + " " +
         std::string(unit_symbol(u)) + ": " + (reached ? "reached" : "not reached") + ").";
}

void question_section(RichDoc& d, const SolveResult& r, const SolveReportContext& c, TempUnit u) {
  d.section_begin("question", "Question and product");
  std::vector<KeyValue> kv = {{"product", c.product_name},
                              {"question", std::string("--for ") + process::to_string(r.question) + ": " +
                                               question_words(r.question)}};
  if (!r.stage.empty()) kv.push_back({"stage changed", r.stage});
  kv.push_back({"quantity", r.quantity});
  kv.push_back({"scheduled value", detail::solve_shown(r, r.nominal, u)});
  kv.push_back({"solved for", joined(solved_for_texts(r))});
  if (r.end_C) kv.push_back({"end temperature (" + r.end_point + ")", fixed(display_temp(*r.end_C, u), 2) + " " +
                                                                        std::string(unit_symbol(u))});
  d.key_value(kv);
  d.section_end();
}

void answer_section(RichDoc& d, const SolveResult& r, const SolveReportContext& c, TempUnit u) {
  d.section_begin("answer", "Answer");
  d.statement("Use " + detail::solve_shown(r, r.rounded, u) + " (" + detail::solve_rounding_text(r, u) +
              ", toward the safe side).");
  if (c.at_fit_bound) d.statement("Fit bound: " + fit_bound_sentence(r, *c.at_fit_bound, u) + ".");
  d.key_value({{"answer, unrounded", detail::solve_shown_raw(r, r.answer, u)},
               {"answer to use", detail::solve_shown(r, r.rounded, u)},
               {"rounding", detail::solve_rounding_text(r, u)},
               {"scheduled value", detail::solve_shown(r, r.nominal, u)},
               {"root-finder evaluations", std::to_string(r.root.evaluations)}});
  d.section_end();
}

void verification_section(RichDoc& d, const SolveResult& r, TempUnit u) {
  d.section_begin("verification", "Verification: forward re-run at " + detail::solve_shown(r, r.rounded, u));
  d.paragraph(r.verification.eval.all_met ? "Every target is met in the forward re-run of the value to use."
                                          : "NOT every target is met in the forward re-run of the value to use.");
  check_table(d, r.verification);
  if (r.end_C) d.paragraph(end_line(r, r.end_at_rounded_C, r.end_reached_at_rounded, u));
  d.section_end();

  if (r.one_unit_less) {
    d.section_begin("one-unit-less", "One unit less: re-run at " + detail::solve_shown(r, r.one_unit_less->value, u));
    if (r.end_C)  // chill-time: the end temperature decides; the targets are shown beside it
      d.paragraph("The duration one rounding unit shorter, re-run forward; the end temperature below says whether "
                  "it is still reached.");
    else
      d.paragraph(std::string("The value one rounding unit on the unsafe side, re-run forward: ") +
                  (r.one_unit_less->eval.considered_met
                       ? "every target solved for is still met (see the notes for why)."
                       : "not every target solved for is met, so the answer is within one unit of the limit."));
    check_table(d, *r.one_unit_less);
    if (r.end_C && r.end_at_less_C) d.paragraph(end_line(r, *r.end_at_less_C, r.end_reached_at_less.value_or(false), u));
    d.section_end();
  } else {
    d.section_begin("one-unit-less", "One unit less");
    d.paragraph("Not re-run: one unit on the unsafe side is outside the question's domain.");
    d.section_end();
  }
}

void plot_section(RichDoc& d, const SolveReportContext& c, TempUnit u) {
  if (!c.verification_plot) return;
  auto figures = detail::report_figures(*c.verification_plot, u);  // every h scenario's when split
  for (auto& f : figures) {
    if (!f.plot.title.empty()) f.plot.title[0] = static_cast<char>(std::tolower(static_cast<unsigned char>(f.plot.title[0])));
    f.plot.title = "Verification re-run: " + f.plot.title;
    f.caption = "The forward re-run at the answer to use. " + f.caption;
  }
  d.figures(figures);
}

void conservative_section(RichDoc& d, const SolveResult& r, const SolveReportContext& c, TempUnit u) {
  if (!c.conservative) return;
  const auto& cs = *c.conservative;
  d.section_begin("conservative", "Conservative: documented worst case of the file's ranges");
  d.paragraph("Choices applied together:");
  d.list(range_setting_texts(cs.choices));
  if (cs.result) {
    d.statement("Worst case: use " + detail::solve_shown(r, cs.result->rounded, u) + " (nominal: " +
                detail::solve_shown(r, r.rounded, u) + ").");
    d.key_value({{"worst-case answer, unrounded", detail::solve_shown_raw(r, cs.result->answer, u)},
                 {"worst-case answer to use", detail::solve_shown(r, cs.result->rounded, u)},
                 {"nominal answer to use", detail::solve_shown(r, r.rounded, u)},
                 {"driven by", driven_by_text(cs)}});
    d.paragraph("Forward re-run of the worst case at " + detail::solve_shown(r, cs.result->rounded, u) + ":");
    check_table(d, cs.result->verification);
  } else {
    d.statement("Worst case: no solution: " + cs.no_solution);
    d.key_value({{"driven by", driven_by_text(cs)}});
  }
  TextTable t = {{"choice alone", "answer to use"}};
  for (const auto& a : cs.alone)
    t.push_back({range_setting_text(a.choice), a.rounded ? detail::solve_shown(r, *a.rounded, u) : "no solution: " + a.no_solution});
  d.table(t);
  d.section_end();
}

void closing_sections(RichDoc& d, const SolveResult& r, const SolveReportContext& c) {
  if (!r.notes.empty()) {
    d.section_begin("notes", "Notes");
    d.list(solve_note_texts(r));
    d.section_end();
  }
  std::vector<std::string> warns = c.warnings;
  const auto& ev = r.verification.eval;
  const auto engine_notes = history_warnings(ev.history);
  warns.insert(warns.end(), engine_notes.begin(), engine_notes.end());
  for (const auto& w : ev.assessment.warnings) warns.push_back(assessment_warning_text(w));
  if (!warns.empty()) {
    d.section_begin("warnings", "Warnings");
    d.list(warns, true);
    d.section_end();
  }
  if (!r.assumptions.empty()) {
    d.section_begin("assumptions", "Assumptions");
    d.list(assumption_texts(r.assumptions));
    d.section_end();
  }
  if (!c.provenance.empty()) {
    d.section_begin("provenance", "Provenance");
    d.key_value(c.provenance);
    d.section_end();
  }
}

void write_solve_doc(RichDoc& d, const SolveResult& r, const SolveReportContext& c, TempUnit u) {
  d.begin(std::string("coldcore solve --for ") + process::to_string(r.question) + ": " + question_words(r.question) +
          " — " + c.product_name,
          detail::running_text("", c.provenance));
  d.verdict_summary(verdict_summary(r, c.conservative));
  question_section(d, r, c, u);
  answer_section(d, r, c, u);
  verification_section(d, r, u);
  plot_section(d, c, u);
  conservative_section(d, r, c, u);
  closing_sections(d, r, c);
  d.end(cautions());
}

}  // namespace

static void write_solve_html_unrendered(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u);

void write_solve_html(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_solve_html_unrendered(r, c, o, u); });
}

static void write_solve_html_unrendered(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u) {
  const auto d = detail::html_doc(out);
  write_solve_doc(*d, r, c, u);
}

static MarkdownReport write_solve_markdown_unrendered(const SolveResult& r, const SolveReportContext& c, TempUnit u, std::string_view svg_basename);

MarkdownReport write_solve_markdown(const SolveResult& r, const SolveReportContext& c, TempUnit u, std::string_view svg_basename) {
  return rendered(write_solve_markdown_unrendered(r, c, u, svg_basename), u);
}

static MarkdownReport write_solve_markdown_unrendered(const SolveResult& r, const SolveReportContext& c, TempUnit u,
                                    std::string_view svg_basename) {
  MarkdownReport rep;
  std::ostringstream o;
  const auto d = detail::md_doc(o, svg_basename, rep.svg_files);
  write_solve_doc(*d, r, c, u);
  rep.markdown = o.str();
  return rep;
}

}  // namespace coldcore
