// Layouts of the fit report: text, and Markdown / HTML through the shared rich-document pieces.
#include <algorithm>
#include <ostream>
#include <sstream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "fit_content.hpp"
#include "rich_page.hpp"

namespace coldcore {

using detail::FitContent;
using detail::FitSection;
using detail::RunFigure;

namespace {

// Display width: UTF-8 lead bytes (α, ², ° are one column each).
std::size_t cells(const std::string& s) {
  return static_cast<std::size_t>(std::count_if(s.begin(), s.end(), [](char ch) { return (ch & 0xC0) != 0x80; }));
}

void text_table(std::ostream& out, const detail::TextTable& t) {
  std::vector<std::size_t> width;
  for (const auto& row : t)
    for (std::size_t c = 0; c < row.size(); ++c) {
      if (width.size() <= c) width.push_back(0);
      width[c] = std::max(width[c], cells(row[c]));
    }
  for (const auto& row : t) {
    out << "  ";
    for (std::size_t c = 0; c < row.size(); ++c) {
      out << row[c];
      if (c + 1 < row.size()) out << std::string(width[c] - cells(row[c]) + 2, ' ');
    }
    out << "\n";
  }
}

void rich(const FitContent& fc, const std::vector<RunFigure>& figures, detail::RichDoc& d) {
  d.begin(fc.title);
  d.paragraph(fc.lead);
  for (const FitSection& s : fc.sections) {
    d.section_begin(s.id, s.heading);
    for (const auto& st : s.statements) d.statement(st);
    if (!s.key_values.empty()) d.key_value(s.key_values);
    if (!s.table.empty()) d.table(s.table, s.numeric);
    for (const auto& p : s.paragraphs) d.paragraph(p);
    if (!s.items.empty()) d.list(s.items, s.id == "provenance");
    d.section_end();
    if (s.id == "fit") d.figures(figures);
  }
  d.end(cautions());
}

}  // namespace

static void write_fit_text_unrendered(const process::StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u);

void write_fit_text(const process::StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_fit_text_unrendered(a, c, o, u); });
}

static void write_fit_text_unrendered(const process::StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u) {
  const FitContent fc = detail::fit_content(a, c, u);
  out << fc.title << "\n" << std::string(std::min<std::size_t>(cells(fc.title), 60), '=') << "\n" << fc.lead << "\n";
  for (const FitSection& s : fc.sections) {
    out << "\n" << s.heading << "\n";
    for (const auto& st : s.statements) out << "  >> " << st << "\n";
    std::size_t kw = 0;
    for (const auto& kv : s.key_values) kw = std::max(kw, cells(kv.key));
    for (const auto& kv : s.key_values) out << "  " << kv.key << ":" << std::string(kw - cells(kv.key) + 2, ' ') << kv.value << "\n";
    if (!s.table.empty()) text_table(out, s.table);
    for (const auto& p : s.paragraphs) out << "  " << p << "\n";
    for (const auto& i : s.items) out << "  - " << i << "\n";
  }
  out << "\n";
  write_sign_off_text(out);
  out << "Cautions\n";
  for (const auto& cau : cautions()) out << "  * " << cau << "\n";
}

static void write_fit_html_unrendered(const process::StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u);

void write_fit_html(const process::StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_fit_html_unrendered(a, c, o, u); });
}

static void write_fit_html_unrendered(const process::StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u) {
  auto d = detail::html_doc(out);
  rich(detail::fit_content(a, c, u), detail::fit_figures(a, u), *d);
}

static MarkdownReport write_fit_markdown_unrendered(const process::StudyAnalysis& a, const FitReportContext& c, TempUnit u, std::string_view svg_basename);

MarkdownReport write_fit_markdown(const process::StudyAnalysis& a, const FitReportContext& c, TempUnit u, std::string_view svg_basename) {
  return rendered(write_fit_markdown_unrendered(a, c, u, svg_basename), u);
}

static MarkdownReport write_fit_markdown_unrendered(const process::StudyAnalysis& a, const FitReportContext& c, TempUnit u,
                                  std::string_view svg_basename) {
  MarkdownReport r;
  std::ostringstream o;
  auto d = detail::md_doc(o, svg_basename, r.svg_files);
  rich(detail::fit_content(a, c, u), detail::fit_figures(a, u), *d);
  d.reset();
  r.markdown = o.str();
  return r;
}

}  // namespace coldcore
