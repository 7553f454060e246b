// Shared HTML and Markdown pieces of the rich reports. Moved here from the run writers so that
// every verb's report uses one CSS, one escaping and one cautions box.
#include "rich_page.hpp"

#include <cctype>
#include <ostream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/svg_plot.hpp"

namespace coldcore::detail {

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
p.verdict-summary { font-size: 12pt; font-weight: bold; margin: 0 0 3mm 0; padding: 2mm 3mm; border: 2px solid #000000; }
p.verdict-summary.not-demonstrated { border-width: 4px; background: #F0E442; }
p.verdict-summary.no-verdict { border-style: dashed; }
p.statement { font-weight: bold; padding: 2mm 3mm; border: 1px solid #000000; }
table.sign-off { width: 100%; }
table.sign-off td { border: none; padding: 4mm 1.5mm 1mm 1.5mm; }
table.sign-off td.line { border-bottom: 1px solid #000000; width: 75%; }
@media print { body { max-width: none; margin: 0; padding: 0; } }
)css";

}  // namespace

std::string margin_cell(const TargetResult& t) {
  if (!t.margin_shown.empty()) return t.margin_shown;  // a tie, inside the error bound, never reached
  return t.margin > 0 || t.margin_text == "-" ? t.margin_text : "shortfall " + t.margin_text;
}

TextTable target_table(const std::vector<TargetResult>& targets, std::vector<bool>& met) {
  TextTable t = {{"target", "kind", "required", "achieved", "margin", "verdict"}};
  met.clear();
  for (const auto& tr : targets) {
    const bool m = tr.verdict == Verdict::met;
    t.push_back({tr.name, std::string(to_string(tr.kind)), tr.required_text, tr.achieved_text, margin_cell(tr),
                 std::string(verdict_word(m))});
    met.push_back(m);
  }
  return t;
}

void html_page_begin(std::ostream& o, const std::string& title) { html_page_begin(o, title, lead_sentence()); }

namespace {

// A CSS string literal inside <style> (raw text, no entities): quotes and backslashes escaped,
// '<', '>' and '&' as CSS escapes (no "</style" can end the element, and the page stays
// well-formed XML), line breaks as spaces.
std::string css_string(std::string_view s) {
  std::string out = "\"";
  for (char ch : s) {
    if (ch == '<' || ch == '>' || ch == '&') {  // CSS escapes: the page stays well-formed XML too
      out += ch == '<' ? "\\3c " : ch == '>' ? "\\3e " : "\\26 ";
      continue;
    }
    if (ch == '"' || ch == '\\') out += '\\';
    out += (ch == '\n' || ch == '\r') ? ' ' : ch;
  }
  return out + "\"";
}

}  // namespace

std::string running_text(std::string_view lot, const std::vector<KeyValue>& provenance) {
  std::string s = lot.empty() ? "" : "lot " + std::string(lot);
  for (const auto& kv : provenance)
    if (kv.key == "date") s += (s.empty() ? "" : " · ") + kv.value;
  return s;
}

void html_page_begin(std::ostream& o, const std::string& title, std::string_view lead, std::string_view running) {
  o << "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n"
    << "<meta charset=\"utf-8\"/>\n<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n"
    << "<title>" << xml_escape(title) << "</title>\n<style>" << kCss << "</style>\n";
  // The printed record's running header and footer (CSS paged media margin boxes): what it is,
  // the lot and date when known, and "page X of Y", on every page.
  o << "<style>@page { @top-left { content: " << css_string(title)
    << "; font-size: 8pt; color: #333333; } @top-right { content: " << css_string(running)
    << "; font-size: 8pt; color: #333333; } @bottom-left { content: \"engineering estimate: see the cautions; "
       "decided by the signed reviewer\"; font-size: 8pt; color: #333333; } @bottom-right { content: \"page \" "
       "counter(page) \" of \" counter(pages); font-size: 8pt; color: #333333; } }</style>\n</head>\n<body>\n";
  o << "<h1>" << xml_escape(title) << "</h1>\n";
  o << "<p class=\"lead\">" << xml_escape(lead) << "</p>\n";
}

void html_verdict_summary(std::ostream& o, const VerdictSummary& s) {
  const VerdictCount& m = s.main();
  const char* cls = s.all_met ? "met" : (s.parts.size() == 1 && m.targets == 0 ? "no-verdict" : "not-demonstrated");
  o << "<p id=\"verdict-summary\" class=\"verdict-summary " << cls << "\">Verdict summary: " << xml_escape(s.sentence)
    << "</p>\n";
}

void html_sign_off(std::ostream& o) {
  o << "<section id=\"sign-off\">\n<h2>Sign-off</h2>\n<p>" << xml_escape(sign_off_note()) << "</p>\n";
  o << "<table class=\"sign-off\">\n<tbody>\n";
  for (const auto& l : sign_off_labels()) o << "<tr><td>" << xml_escape(l) << "</td><td class=\"line\"> </td></tr>\n";
  o << "</tbody>\n</table>\n</section>\n";
}

void html_page_end(std::ostream& o, const std::vector<std::string>& cautions) {
  html_sign_off(o);
  o << "<section id=\"cautions\" class=\"cautions\">\n<h2>Cautions</h2>\n";
  html_list(o, cautions);
  o << "</section>\n</body>\n</html>\n";
}

void html_section_begin(std::ostream& o, std::string_view id, std::string_view heading) {
  o << "<section id=\"" << xml_escape(id) << "\">\n<h2>" << xml_escape(heading) << "</h2>\n";
}

void html_section_end(std::ostream& o) { o << "</section>\n"; }

void html_paragraph(std::ostream& o, std::string_view text) { o << "<p>" << xml_escape(text) << "</p>\n"; }

void html_table(std::ostream& o, const TextTable& t, const std::vector<bool>& numeric, bool key_value) {
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

void html_verdict_table(std::ostream& o, const TextTable& t, const std::vector<bool>& met) {
  if (t.empty()) return;
  o << "<table>\n<thead><tr>";
  for (const auto& h : t[0]) o << "<th>" << xml_escape(h) << "</th>";
  o << "</tr></thead>\n<tbody>\n";
  for (size_t i = 1; i < t.size(); ++i) {
    o << "<tr>";
    for (size_t c = 0; c + 1 < t[i].size(); ++c) o << "<td>" << xml_escape(t[i][c]) << "</td>";
    if (!t[i].empty())
      o << "<td class=\"" << (i - 1 < met.size() && met[i - 1] ? "verdict-met" : "verdict-not") << "\">"
        << xml_escape(t[i].back()) << "</td>";
    o << "</tr>\n";
  }
  o << "</tbody>\n</table>\n";
}

void html_key_value_table(std::ostream& o, const std::vector<KeyValue>& kv, const char* key_head) {
  TextTable t = {{key_head, "value"}};
  for (const auto& e : kv) t.push_back({e.key, e.value});
  html_table(o, t, {}, true);  // long unbroken values (SHA-256) may wrap anywhere
}

void html_list(std::ostream& o, const std::vector<std::string>& items, const char* css_class) {
  if (items.empty()) return;
  o << (css_class ? std::string("<ul class=\"") + css_class + "\">\n" : std::string("<ul>\n"));
  for (const auto& s : items) o << "<li>" << xml_escape(s) << "</li>\n";
  o << "</ul>\n";
}

void html_figures(std::ostream& o, const std::vector<RunFigure>& figures) {
  if (figures.empty()) return;
  o << "<section id=\"plots\">\n<h2>Plots</h2>\n";
  for (const auto& f : figures) {
    o << "<figure id=\"figure-" << xml_escape(f.key) << "\">\n" << svg::render_svg(f.plot, false);
    o << "<figcaption>" << xml_escape(f.caption) << "</figcaption>\n</figure>\n";
  }
  o << "</section>\n";
}

// Backslashes only where CommonMark would otherwise read markup, so that the Markdown still
// reads as plain text ("z_C", "->", ">= 72 C" stay as written).
std::string md_escape(std::string_view s) {
  const auto is_alnum = [](char c) { return std::isalnum(static_cast<unsigned char>(c)) != 0; };
  const auto is_space = [](char c) { return c == ' ' || c == '\t' || c == '\n' || c == '\r'; };
  std::string r;
  r.reserve(s.size() + 8);
  std::size_t first = 0;  // the first character that is not a space: where block markup starts
  while (first < s.size() && s[first] == ' ') ++first;
  for (std::size_t i = 0; i < s.size(); ++i) {
    const char c = s[i];
    const char prev = i > 0 ? s[i - 1] : ' ', next = i + 1 < s.size() ? s[i + 1] : ' ';
    bool escape = false;
    switch (c) {
      case '\\': case '`': case '|': escape = true; break;  // escapes, code spans, table cells
      case '*': escape = !(is_space(prev) && is_space(next)); break;  // could open or close emphasis
      case '_': escape = !(is_alnum(prev) && is_alnum(next)); break;  // intraword _ is never emphasis
      case '<': escape = is_alnum(next) || next == '/' || next == '!' || next == '?'; break;  // a tag or autolink
      case '[': escape = s.find(']', i) != std::string_view::npos; break;  // could be a link
      case '#': case '>': escape = i == first; break;  // a heading or block quote at the start
      case '-': case '+': escape = i == first && i + 1 < s.size() && is_space(next); break;  // a list item
      case '.': case ')': {  // "1. " at the start: an ordered list
        std::size_t d = first;
        while (d < i && std::isdigit(static_cast<unsigned char>(s[d]))) ++d;
        escape = d == i && i > first && is_space(next);
        break;
      }
      default: break;
    }
    if (c == '\n' || c == '\r') {
      r += ' ';  // a cell stays on its row
      continue;
    }
    if (escape) r += '\\';
    r += c;
  }
  return r;
}

void md_page_begin(std::ostream& o, const std::string& title) { md_page_begin(o, title, lead_sentence()); }

void md_page_begin(std::ostream& o, const std::string& title, std::string_view lead) {
  o << "# " << md_escape(title) << "\n\n";
  o << "> **" << md_escape(lead) << "**\n\n";
}

void md_verdict_summary(std::ostream& o, const VerdictSummary& s) {
  o << "**Verdict summary: " << md_escape(s.sentence) << "**\n\n";
}

void md_heading(std::ostream& o, std::string_view heading) { o << "## " << md_escape(heading) << "\n\n"; }

void md_paragraph(std::ostream& o, std::string_view text) { o << md_escape(text) << "\n\n"; }

void md_table(std::ostream& o, const TextTable& t) {
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

void md_key_value_table(std::ostream& o, const std::vector<KeyValue>& kv) {
  TextTable t = {{"item", "value"}};
  for (const auto& e : kv) t.push_back({e.key, e.value});
  md_table(o, t);
}

void md_list(std::ostream& o, const std::vector<std::string>& items) {
  if (items.empty()) return;
  for (const auto& s : items) o << "- " << md_escape(s) << "\n";
  o << "\n";
}

void md_figures(std::ostream& o, const std::vector<RunFigure>& figures, std::string_view svg_basename,
                std::vector<std::pair<std::string, std::string>>& svg_files) {
  if (figures.empty()) return;
  o << "## Plots\n\n";
  for (const auto& f : figures) {
    const std::string file = std::string(svg_basename) + "-" + f.key + ".svg";
    // The file name goes in a link destination: angle brackets allow any character but <>\n.
    o << "![" << md_escape(f.plot.title) << "](<" << file << ">)\n\n*" << md_escape(f.caption) << "*\n\n";
    svg_files.emplace_back(file, svg::render_svg(f.plot, true));
  }
}

void md_cautions(std::ostream& o, const std::vector<std::string>& cautions) {
  o << "## Sign-off\n\n" << md_escape(sign_off_note()) << "\n\n";
  // a bare run of underscores is no emphasis in CommonMark: left unescaped, it reads as a line
  for (const auto& l : sign_off_labels()) o << md_escape(l) << ": " << std::string(40, '_') << "\n\n";
  o << "## Cautions\n\n";
  for (const auto& c : cautions) o << "> - " << md_escape(c) << "\n";
}

}  // namespace coldcore::detail

namespace coldcore::detail {

namespace {

class HtmlDoc final : public RichDoc {
 public:
  explicit HtmlDoc(std::ostream& o) : o_(o) {}
  void begin(const std::string& title, std::string_view running) override {
    html_page_begin(o_, title, lead_sentence(), running);
  }
  void verdict_summary(const VerdictSummary& s) override { html_verdict_summary(o_, s); }
  void section_begin(std::string_view id, std::string_view heading) override { html_section_begin(o_, id, heading); }
  void section_end() override { html_section_end(o_); }
  void paragraph(std::string_view text) override { html_paragraph(o_, text); }
  void statement(std::string_view text) override {
    o_ << "<p class=\"statement\">" << svg::xml_escape(text) << "</p>\n";
  }
  void table(const TextTable& t, const std::vector<bool>& numeric) override { html_table(o_, t, numeric); }
  void verdict_table(const TextTable& t, const std::vector<bool>& met) override { html_verdict_table(o_, t, met); }
  void key_value(const std::vector<KeyValue>& kv) override { html_key_value_table(o_, kv); }
  void list(const std::vector<std::string>& items, bool warnings) override {
    html_list(o_, items, warnings ? "warnings" : nullptr);
  }
  void figures(const std::vector<RunFigure>& f) override { html_figures(o_, f); }
  void end(const std::vector<std::string>& cautions) override { html_page_end(o_, cautions); }

 private:
  std::ostream& o_;
};

class MdDoc final : public RichDoc {
 public:
  MdDoc(std::ostream& o, std::string_view base, std::vector<std::pair<std::string, std::string>>& files)
      : o_(o), base_(base), files_(files) {}
  void begin(const std::string& title, std::string_view) override { md_page_begin(o_, title); }
  void verdict_summary(const VerdictSummary& s) override { md_verdict_summary(o_, s); }
  void section_begin(std::string_view, std::string_view heading) override { md_heading(o_, heading); }
  void section_end() override {}
  void paragraph(std::string_view text) override { md_paragraph(o_, text); }
  void statement(std::string_view text) override { o_ << "**" << md_escape(text) << "**\n\n"; }
  void table(const TextTable& t, const std::vector<bool>&) override { md_table(o_, t); }
  void verdict_table(const TextTable& t, const std::vector<bool>&) override { md_table(o_, t); }
  void key_value(const std::vector<KeyValue>& kv) override { md_key_value_table(o_, kv); }
  void list(const std::vector<std::string>& items, bool) override { md_list(o_, items); }
  void figures(const std::vector<RunFigure>& f) override { md_figures(o_, f, base_, files_); }
  void end(const std::vector<std::string>& cautions) override { md_cautions(o_, cautions); }

 private:
  std::ostream& o_;
  std::string base_;
  std::vector<std::pair<std::string, std::string>>& files_;
};

}  // namespace

std::unique_ptr<RichDoc> html_doc(std::ostream& o) { return std::make_unique<HtmlDoc>(o); }

std::unique_ptr<RichDoc> md_doc(std::ostream& o, std::string_view svg_basename,
                                std::vector<std::pair<std::string, std::string>>& svg_files) {
  return std::make_unique<MdDoc>(o, svg_basename, svg_files);
}

}  // namespace coldcore::detail
