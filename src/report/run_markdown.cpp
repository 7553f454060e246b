// Markdown run report (CommonMark plus pipe tables) with the plots as standalone SVG files.
#include <sstream>

#include "coldcore/report/markdown.hpp"
#include "coldcore/report/svg_plot.hpp"
#include "run_figures.hpp"

namespace coldcore {

namespace {

// Backslash-escapes the characters that would start emphasis, links, code, html or break a
// table cell; newlines become spaces so a cell stays on its row.
std::string md_escape(std::string_view s) {
  std::string r;
  r.reserve(s.size());
  for (char c : s) {
    switch (c) {
      case '\\': case '`': case '*': case '_': case '[': case ']': case '<': case '>': case '|': case '#':
        r += '\\';
        r += c;
        break;
      case '\n': case '\r': r += ' '; break;
      default: r += c;
    }
  }
  return r;
}

void table(std::ostream& o, const detail::TextTable& t) {
  if (t.empty()) return;
  for (size_t r = 0; r < t.size(); ++r) {
    o << "|";
    for (const auto& c : t[r]) o << " " << md_escape(c) << " |";
    o << "\n";
    if (r == 0) {
      o << "|";
      for (size_t c = 0; c < t[0].size(); ++c) o << " --- |";
      o << "\n";
    }
  }
  o << "\n";
}

void key_value_table(std::ostream& o, const std::vector<KeyValue>& kv) {
  detail::TextTable t = {{"item", "value"}};
  for (const auto& e : kv) t.push_back({e.key, e.value});
  table(o, t);
}

void list(std::ostream& o, const std::vector<std::string>& items) {
  if (items.empty()) return;
  for (const auto& s : items) o << "- " << md_escape(s) << "\n";
  o << "\n";
}

}  // namespace

MarkdownReport write_run_markdown(const RunReport& r, TempUnit u, std::string_view svg_basename) {
  MarkdownReport rep;
  std::ostringstream o;
  o << "# " << md_escape(r.title) << "\n\n";
  o << "> **" << md_escape(detail::lead_sentence()) << "**\n\n";
  if (!r.product.empty()) {
    o << "## Product and properties\n\n";
    key_value_table(o, r.product);
  }
  if (!r.stages.empty()) {
    o << "## Process stages\n\nTimes from the process start; temperatures at each stage's end.\n\n";
    table(o, detail::stage_table(r, u));
    std::vector<std::string> notes;
    for (const auto& s : r.stages)
      if (!s.biot_note.empty()) notes.push_back(s.name + ": " + s.biot_note);
    list(o, notes);
  }
  const auto figures = detail::run_figures(r, u);
  if (!figures.empty()) {
    o << "## Plots\n\n";
    for (const auto& f : figures) {
      const std::string file = std::string(svg_basename) + "-" + f.key + ".svg";
      // The file name goes in a link destination: angle brackets allow any character but <>\n.
      o << "![" << md_escape(f.plot.title) << "](<" << file << ">)\n\n*" << md_escape(f.caption) << "*\n\n";
      rep.svg_files.emplace_back(file, svg::render_svg(f.plot, true));
    }
  }
  o << "## Reading this report\n\n";
  for (const auto& p : detail::reading_paragraphs(r, u)) o << md_escape(p) << "\n\n";
  if (!r.verdicts.empty()) {
    o << "## Verdicts\n\n";
    table(o, detail::verdict_table(r));
    std::vector<std::string> details;
    for (const auto& v : r.verdicts)
      for (const auto& d : v.details) details.push_back(v.name + ": " + d);
    list(o, details);
  }
  if (!r.warnings.empty()) {
    o << "## Warnings\n\n";
    list(o, r.warnings);
  }
  if (!r.assumptions.empty()) {
    o << "## Assumptions\n\n";
    list(o, r.assumptions);
  }
  if (!r.provenance.empty()) {
    o << "## Provenance\n\n";
    key_value_table(o, r.provenance);
  }
  o << "## Cautions\n\n";
  for (const auto& c : detail::report_cautions(r)) o << "> - " << md_escape(c) << "\n";
  rep.markdown = o.str();
  return rep;
}

}  // namespace coldcore
