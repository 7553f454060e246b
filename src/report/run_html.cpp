// Self-contained HTML run report. Written as polyglot markup (every element closed, attributes
// quoted, only XML's five entities) so that the document after its doctype is well-formed XML.
#include <ostream>

#include "coldcore/report/html.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "rich_page.hpp"
#include "run_figures.hpp"

namespace coldcore {

static void write_run_html_unrendered(const RunReport& r, std::ostream& o, TempUnit u);

void write_run_html(const RunReport& r, std::ostream& o, TempUnit u) {
  write_rendered(o, u, [&](std::ostream& o) { write_run_html_unrendered(r, o, u); });
}

static void write_run_html_unrendered(const RunReport& r, std::ostream& o, TempUnit u) {
  using namespace detail;
  html_page_begin(o, r.title, lead_sentence(r), running_text(r.measured ? r.measured->lot : "", r.provenance));
  html_verdict_summary(o, verdict_summary(r));
  if (!r.product.empty()) {
    html_section_begin(o, "product", subject_heading(r));
    html_key_value_table(o, r.product, "item");
    html_section_end(o);
  }
  if (!r.stages.empty()) {
    html_section_begin(o, "process", "Process stages");
    html_paragraph(o, std::string("Times from the process start; temperatures at each stage's end.") +
                          (r.scenarios.empty() ? "" : " The h shown are scenario 1's; every scenario follows."));
    html_table(o, stage_table(r, u), {false, true, true, false, false, true, true, true, true, true});
    std::vector<std::string> notes;
    for (const auto& s : r.stages)
      if (!s.biot_note.empty()) notes.push_back(s.name + ": " + s.biot_note);
    html_list(o, notes);
    html_section_end(o);
  }
  if (!r.scenarios.empty()) {  // every scenario's history behind the verdicts (issue 11)
    html_section_begin(o, "scenarios", "Scenarios");
    html_paragraph(o, "The targets need different ends of an h range, so each was evaluated on the scenario "
                      "conservative for it; each verdict names its scenario. Times from the process start; "
                      "temperatures at each stage's end.");
    for (const auto& v : r.scenarios) {
      html_paragraph(o, scenario_heading(v));
      html_table(o, scenario_stage_table(r, v, u), {false, true, true, false, true, true, true, true, true});
    }
    html_section_end(o);
  }
  html_figures(o, report_figures(r, u));
  html_section_begin(o, "reading", "Reading this report");
  for (const auto& p : reading_paragraphs(r, u)) html_paragraph(o, p);
  html_section_end(o);

  if (!r.verdicts.empty()) {
    html_section_begin(o, "verdicts", "Verdicts");
    std::vector<bool> met;
    for (const auto& v : r.verdicts) met.push_back(v.met);
    html_verdict_table(o, verdict_table(r), met);
    std::vector<std::string> details;
    for (const auto& v : r.verdicts)
      for (const auto& d : v.details) details.push_back(v.name + ": " + d);
    html_list(o, details);
    html_section_end(o);
  }
  if (!r.delivered.empty()) {
    html_section_begin(o, "delivered", delivered_heading());
    html_list(o, delivered_lines(r));
    html_section_end(o);
  }
  if (!r.warnings.empty()) {
    html_section_begin(o, "warnings", "Warnings");
    html_list(o, r.warnings, "warnings");
    html_section_end(o);
  }
  if (!r.assumptions.empty()) {
    html_section_begin(o, "assumptions", "Assumptions");
    html_list(o, r.assumptions);
    html_section_end(o);
  }
  if (!r.provenance.empty()) {
    html_section_begin(o, "provenance", "Provenance");
    html_key_value_table(o, r.provenance, "item");
    html_section_end(o);
  }
  html_page_end(o, report_cautions(r));
}

}  // namespace coldcore
