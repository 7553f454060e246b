// Markdown run report (CommonMark plus pipe tables) with the plots as standalone SVG files.
#include <sstream>

#include "coldcore/report/markdown.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "rich_page.hpp"
#include "run_figures.hpp"

namespace coldcore {

MarkdownReport rendered(MarkdownReport md, TempUnit u) {
  md.markdown = render_temperatures(md.markdown, u);
  for (auto& [name, svg] : md.svg_files) svg = render_temperatures(svg, u);
  return md;
}

static MarkdownReport write_run_markdown_unrendered(const RunReport& r, TempUnit u, std::string_view svg_basename);

MarkdownReport write_run_markdown(const RunReport& r, TempUnit u, std::string_view svg_basename) {
  return rendered(write_run_markdown_unrendered(r, u, svg_basename), u);
}

static MarkdownReport write_run_markdown_unrendered(const RunReport& r, TempUnit u, std::string_view svg_basename) {
  using namespace detail;
  MarkdownReport rep;
  std::ostringstream o;
  md_page_begin(o, r.title, lead_sentence(r));
  md_verdict_summary(o, verdict_summary(r));
  if (!r.product.empty()) {
    md_heading(o, subject_heading(r));
    md_key_value_table(o, r.product);
  }
  if (!r.stages.empty()) {
    md_heading(o, "Process stages");
    md_paragraph(o, std::string("Times from the process start; temperatures at each stage's end.") +
                        (r.scenarios.empty() ? "" : " The h shown are scenario 1's; every scenario follows."));
    md_table(o, stage_table(r, u));
    std::vector<std::string> notes;
    for (const auto& s : r.stages)
      if (!s.biot_note.empty()) notes.push_back(s.name + ": " + s.biot_note);
    md_list(o, notes);
  }
  if (!r.scenarios.empty()) {  // every scenario's history behind the verdicts (issue 11)
    md_heading(o, "Scenarios");
    md_paragraph(o, "The targets need different ends of an h range, so each was evaluated on the scenario "
                    "conservative for it; each verdict names its scenario. Times from the process start; "
                    "temperatures at each stage's end.");
    for (const auto& v : r.scenarios) {
      md_paragraph(o, scenario_heading(v));
      md_table(o, scenario_stage_table(r, v, u));
    }
  }
  md_figures(o, report_figures(r, u), svg_basename, rep.svg_files);
  md_heading(o, "Reading this report");
  for (const auto& p : reading_paragraphs(r, u)) md_paragraph(o, p);
  if (!r.verdicts.empty()) {
    md_heading(o, "Verdicts");
    md_table(o, verdict_table(r));
    std::vector<std::string> details;
    for (const auto& v : r.verdicts)
      for (const auto& d : v.details) details.push_back(v.name + ": " + d);
    md_list(o, details);
  }
  if (!r.delivered.empty()) {
    md_heading(o, delivered_heading());
    md_list(o, delivered_lines(r));
  }
  if (!r.warnings.empty()) {
    md_heading(o, "Warnings");
    md_list(o, r.warnings);
  }
  if (!r.assumptions.empty()) {
    md_heading(o, "Assumptions");
    md_list(o, r.assumptions);
  }
  if (!r.provenance.empty()) {
    md_heading(o, "Provenance");
    md_key_value_table(o, r.provenance);
  }
  md_cautions(o, report_cautions(r));
  rep.markdown = o.str();
  return rep;
}

}  // namespace coldcore
