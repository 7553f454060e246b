// Self-contained HTML run report. Written as polyglot markup (every element closed, attributes
// quoted, only XML's five entities) so that the document after its doctype is well-formed XML.
#include <ostream>

#include "coldcore/report/html.hpp"
#include "coldcore/report/svg_plot.hpp"
#include "run_figures.hpp"

namespace coldcore {

namespace {

using svg::xml_escape;

// Plain and printable: content fits 180 mm (A4 minus 15 mm margins, narrower than letter).
constexpr const char* kCss = R"css(
@page { margin: 14mm 15mm; }
html { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
body { font-family: "DejaVu Sans", Arial, Helvetica, sans-serif; font-size: 10.5pt; line-height: 1.4;
       color: #111111; background: #FFFFFF; max-width: 180mm; margin: 8mm auto; padding: 0 4mm; }
h1 { font-size: 17pt; margin: 0 0 2mm 0; }
h2 { font-size: 13pt; margin: 6mm 0 2mm 0; border-bottom: 1px solid #999999; break-after: avoid; }
p.lead { margin: 0 0 3mm 0; padding: 2mm 3mm; border-left: 4px solid #D55E00; background: #F6F6F6; }
table { border-collapse: collapse; width: 100%; margin: 1mm 0 2mm 0; font-size: 9pt; break-inside: auto; }
tr { break-inside: avoid; }
th, td { border: 1px solid #BBBBBB; padding: 1mm 1.5mm; text-align: left; vertical-align: top;
         overflow-wrap: break-word; }
table.key-value td { overflow-wrap: anywhere; }
th { background: #EEEEEE; }
td.num { text-align: right; white-space: nowrap; }
td.verdict-met { font-weight: bold; }
td.verdict-not { font-weight: bold; background: #F0E442; }
figure { margin: 3mm 0; break-inside: avoid; }
figure svg { width: 100%; height: auto; display: block; }
figcaption { font-size: 9pt; color: #333333; }
ul { margin: 1mm 0 2mm 0; padding-left: 6mm; }
.warnings li { font-weight: bold; }
.cautions { border: 2px solid #000000; padding: 2mm 4mm; margin-top: 6mm; break-inside: avoid; }
.cautions h2 { border: none; margin-top: 1mm; }
@media print { body { max-width: none; margin: 0; padding: 0; } }
)css";

void table(std::ostream& o, const detail::TextTable& t, const std::vector<bool>& numeric = {},
           bool key_value = false) {
  if (t.empty()) return;
  o << (key_value ? "<table class=\"key-value\">\n<thead><tr>" : "<table>\n<thead><tr>");
  for (const auto& h : t[0]) o << "<th>" << xml_escape(h) << "</th>";
  o << "</tr></thead>\n<tbody>\n";
  for (size_t r = 1; r < t.size(); ++r) {
    o << "<tr>";
    for (size_t c = 0; c < t[r].size(); ++c) {
      const bool num = c < numeric.size() && numeric[c];
      o << (num ? "<td class=\"num\">" : "<td>") << xml_escape(t[r][c]) << "</td>";
    }
    o << "</tr>\n";
  }
  o << "</tbody>\n</table>\n";
}

void key_value_table(std::ostream& o, const std::vector<KeyValue>& kv, const char* key_head) {
  detail::TextTable t = {{key_head, "value"}};
  for (const auto& e : kv) t.push_back({e.key, e.value});
  table(o, t, {}, true);  // long unbroken values (SHA-256) may wrap anywhere
}

void list(std::ostream& o, const std::vector<std::string>& items, const char* cls = nullptr) {
  if (items.empty()) return;
  o << (cls ? std::string("<ul class=\"") + cls + "\">\n" : std::string("<ul>\n"));
  for (const auto& s : items) o << "<li>" << xml_escape(s) << "</li>\n";
  o << "</ul>\n";
}

}  // namespace

void write_run_html(const RunReport& r, std::ostream& o, TempUnit u) {
  o << "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n"
    << "<meta charset=\"utf-8\"/>\n<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n"
    << "<title>" << xml_escape(r.title) << "</title>\n<style>" << kCss << "</style>\n</head>\n<body>\n";
  o << "<h1>" << xml_escape(r.title) << "</h1>\n";
  o << "<p class=\"lead\">" << xml_escape(detail::lead_sentence()) << "</p>\n";

  if (!r.product.empty()) {
    o << "<section id=\"product\">\n<h2>Product and properties</h2>\n";
    key_value_table(o, r.product, "item");
    o << "</section>\n";
  }
  if (!r.stages.empty()) {
    o << "<section id=\"process\">\n<h2>Process stages</h2>\n<p>Times from the process start; temperatures at "
         "each stage's end.</p>\n";
    table(o, detail::stage_table(r, u), {false, true, true, false, false, true, true, true, true, true});
    std::vector<std::string> notes;
    for (const auto& s : r.stages)
      if (!s.biot_note.empty()) notes.push_back(s.name + ": " + s.biot_note);
    list(o, notes);
    o << "</section>\n";
  }
  const auto figures = detail::run_figures(r, u);
  if (!figures.empty()) {
    o << "<section id=\"plots\">\n<h2>Plots</h2>\n";
    for (const auto& f : figures) {
      o << "<figure id=\"figure-" << xml_escape(f.key) << "\">\n" << svg::render_svg(f.plot, false);
      o << "<figcaption>" << xml_escape(f.caption) << "</figcaption>\n</figure>\n";
    }
    o << "</section>\n";
  }
  o << "<section id=\"reading\">\n<h2>Reading this report</h2>\n";
  for (const auto& p : detail::reading_paragraphs(r, u)) o << "<p>" << xml_escape(p) << "</p>\n";
  o << "</section>\n";

  if (!r.verdicts.empty()) {
    o << "<section id=\"verdicts\">\n<h2>Verdicts</h2>\n<table>\n<thead><tr>";
    const auto t = detail::verdict_table(r);
    for (const auto& h : t[0]) o << "<th>" << xml_escape(h) << "</th>";
    o << "</tr></thead>\n<tbody>\n";
    for (size_t i = 0; i < r.verdicts.size(); ++i) {
      o << "<tr>";
      for (size_t c = 0; c + 1 < t[i + 1].size(); ++c) o << "<td>" << xml_escape(t[i + 1][c]) << "</td>";
      o << "<td class=\"" << (r.verdicts[i].met ? "verdict-met" : "verdict-not") << "\">"
        << xml_escape(t[i + 1].back()) << "</td></tr>\n";
    }
    o << "</tbody>\n</table>\n";
    std::vector<std::string> details;
    for (const auto& v : r.verdicts)
      for (const auto& d : v.details) details.push_back(v.name + ": " + d);
    list(o, details);
    o << "</section>\n";
  }
  if (!r.warnings.empty()) {
    o << "<section id=\"warnings\">\n<h2>Warnings</h2>\n";
    list(o, r.warnings, "warnings");
    o << "</section>\n";
  }
  if (!r.assumptions.empty()) {
    o << "<section id=\"assumptions\">\n<h2>Assumptions</h2>\n";
    list(o, r.assumptions);
    o << "</section>\n";
  }
  if (!r.provenance.empty()) {
    o << "<section id=\"provenance\">\n<h2>Provenance</h2>\n";
    key_value_table(o, r.provenance, "item");
    o << "</section>\n";
  }
  o << "<section id=\"cautions\" class=\"cautions\">\n<h2>Cautions</h2>\n";
  list(o, detail::report_cautions(r));
  o << "</section>\n</body>\n</html>\n";
}

}  // namespace coldcore
