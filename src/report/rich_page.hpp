#pragma once
// Pieces shared by every rich (HTML and Markdown) report, so that run, probe, solve and
// deviation reports look alike and escape alike: the HTML page shell with its print CSS, tables,
// key-value tables, lists, figures, the cautions box; the same for Markdown. Text in, markup out:
// every function escapes what it is given.
#include <iosfwd>
#include <memory>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "coldcore/process/assessment.hpp"
#include "coldcore/report/run_report.hpp"
#include "coldcore/report/verdict_summary.hpp"
#include "run_figures.hpp"

namespace coldcore::detail {

/// "margin" cell of a target: the margin when positive, else "shortfall <amount>" (the
/// assessment's margin text is unsigned for a shortfall).
std::string margin_cell(const TargetResult& t);
/// One row per target: target, kind, required, achieved, margin, verdict ("met" / "not
/// demonstrated"); met[i] says whether row i + 1 is met.
TextTable target_table(const std::vector<TargetResult>& targets, std::vector<bool>& met);

// ---- HTML (polyglot markup: the document after its doctype is well-formed XML) ----

/// Doctype, head with the inline CSS, <body>, the <h1> title and the lead sentence.
void html_page_begin(std::ostream& o, const std::string& title);
/// The same with its own lead sentence (a report about measured data).
/// The printed pages' header beside the title: "lot <lot> · <date>" from what is known (either
/// may be empty; the date is provenance's "date").
std::string running_text(std::string_view lot, const std::vector<KeyValue>& provenance);
/// `running`: the printed pages' header text beside the title (lot, date), may be empty.
void html_page_begin(std::ostream& o, const std::string& title, std::string_view lead, std::string_view running = {});
/// The verdict summary box, just after the title and lead (verdict_summary.hpp): the sentence
/// in words (never colour alone), classed "met", "not-demonstrated" or "no-verdict".
void html_verdict_summary(std::ostream& o, const VerdictSummary& s);
/// The cautions box (always last) and the closing tags.
void html_page_end(std::ostream& o, const std::vector<std::string>& cautions);
void html_section_begin(std::ostream& o, std::string_view id, std::string_view heading);
void html_section_end(std::ostream& o);
void html_paragraph(std::ostream& o, std::string_view text);
/// A table; numeric[c] right-aligns column c; key_value lets long values wrap anywhere.
void html_table(std::ostream& o, const TextTable& t, const std::vector<bool>& numeric = {}, bool key_value = false);
/// A table whose last column is a verdict: met[i] marks row i + 1 "verdict-met", else "verdict-not".
void html_verdict_table(std::ostream& o, const TextTable& t, const std::vector<bool>& met);
void html_key_value_table(std::ostream& o, const std::vector<KeyValue>& kv, const char* key_head = "item");
void html_list(std::ostream& o, const std::vector<std::string>& items, const char* css_class = nullptr);
/// A "plots" section with one <figure> per plot (inline SVG); nothing when `figures` is empty.
void html_figures(std::ostream& o, const std::vector<RunFigure>& figures);

// ---- Markdown (CommonMark plus pipe tables) ----

/// Backslash-escapes what would start emphasis, links, code, html or break a table cell.
std::string md_escape(std::string_view s);
/// "# title" and the lead sentence as a bold quote.
void md_page_begin(std::ostream& o, const std::string& title);
/// The same with its own lead sentence (a report about measured data).
void md_page_begin(std::ostream& o, const std::string& title, std::string_view lead);
/// "**Verdict summary: <sentence>**", just after the title and lead (verdict_summary.hpp).
void md_verdict_summary(std::ostream& o, const VerdictSummary& s);
void md_heading(std::ostream& o, std::string_view heading);  ///< "## heading"
void md_paragraph(std::ostream& o, std::string_view text);
void md_table(std::ostream& o, const TextTable& t);
void md_key_value_table(std::ostream& o, const std::vector<KeyValue>& kv);
void md_list(std::ostream& o, const std::vector<std::string>& items);
/// A "Plots" section: each figure as an image link to `<svg_basename>-<key>.svg`, whose
/// standalone SVG text is appended to `svg_files`.
void md_figures(std::ostream& o, const std::vector<RunFigure>& figures, std::string_view svg_basename,
                std::vector<std::pair<std::string, std::string>>& svg_files);
/// The cautions as a quoted list (always last).
void md_cautions(std::ostream& o, const std::vector<std::string>& cautions);

}  // namespace coldcore::detail

namespace coldcore::detail {

/// One report's content written once for both rich formats: the solve and deviation writers
/// call these in order (a function per section), html_doc / md_doc turn them into markup.
class RichDoc {
 public:
  virtual ~RichDoc() = default;
  /// `running`: the printed pages' header beside the title (lot, date); may be empty.
  virtual void begin(const std::string& title, std::string_view running = {}) = 0;
  /// The verdict summary the report opens with (call just after begin).
  virtual void verdict_summary(const VerdictSummary& s) = 0;
  virtual void section_begin(std::string_view id, std::string_view heading) = 0;
  virtual void section_end() = 0;
  virtual void paragraph(std::string_view text) = 0;
  /// A sentence set apart (bold, boxed in HTML): the answer to use, the disposition statement.
  virtual void statement(std::string_view text) = 0;
  virtual void table(const TextTable& t, const std::vector<bool>& numeric = {}) = 0;
  virtual void verdict_table(const TextTable& t, const std::vector<bool>& met) = 0;
  virtual void key_value(const std::vector<KeyValue>& kv) = 0;
  virtual void list(const std::vector<std::string>& items, bool warnings = false) = 0;
  virtual void figures(const std::vector<RunFigure>& figures) = 0;
  /// The cautions box and the end of the document.
  virtual void end(const std::vector<std::string>& cautions) = 0;
};

std::unique_ptr<RichDoc> html_doc(std::ostream& o);
/// Markdown; figures become `<svg_basename>-<key>.svg` entries appended to `svg_files`.
std::unique_ptr<RichDoc> md_doc(std::ostream& o, std::string_view svg_basename,
                                std::vector<std::pair<std::string, std::string>>& svg_files);

}  // namespace coldcore::detail
