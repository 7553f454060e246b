// The Markdown run report and its SVG files. Input is a synthetic RunReport.
#include <doctest/doctest.h>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/markdown.hpp"
#include "report/rich_page.hpp"
#include "lethality/lethality_support.hpp"
#include "report_checks.hpp"
#include "support/sample_report.hpp"
#include "support/xml_check.hpp"

using namespace coldcore;
using namespace coldcore::testing;

TEST_CASE("markdown returns the text and one SVG file per plot / referenced by name") {
  const MarkdownReport m = write_run_markdown(sample_report(), TempUnit::C, "run-1");
  REQUIRE(m.svg_files.size() == 3);
  CHECK(m.svg_files[0].first == "run-1-temperature.svg");
  CHECK(m.svg_files[1].first == "run-1-lethality.svg");
  CHECK(m.svg_files[2].first == "run-1-cooling.svg");
  for (const auto& [name, svg] : m.svg_files) {
    const std::string& svg_name = name;  // a plain reference: clang 14 cannot capture a structured binding
    CAPTURE(svg_name);
    CHECK(m.markdown.find("](<" + name + ">)") != std::string::npos);
    CHECK(svg.rfind("<?xml version=\"1.0\" encoding=\"UTF-8\"?>", 0) == 0);
    CHECK(xml_problem(svg) == "");
    CHECK(external_urls(svg).empty());
  }
  CHECK(external_urls(m.markdown).empty());
}

TEST_CASE("markdown carries every caution / even when the model left them empty") {
  RunReport r = sample_report();
  r.cautions.clear();
  const MarkdownReport m = write_run_markdown(r, TempUnit::C, "x");
  for (const auto& c : cautions()) CHECK(m.markdown.find("> - " + c) != std::string::npos);
}

TEST_CASE("markdown has the same sections as html / and escapes table cells") {
  const std::string md = write_run_markdown(sample_report(), TempUnit::C, "x").markdown;
  for (const char* s : {"# Synthetic sample", "## Product and properties", "## Process stages", "## Plots",
                        "## Reading this report", "## Verdicts", "## Warnings", "## Assumptions", "## Provenance",
                        "## Cautions", "The Biot number compares", "| not demonstrated |", "| met |",
                        "2026-01-01T00:00:00Z"})
    CHECK_MESSAGE(md.find(s) != std::string::npos, std::string(s));
  CHECK(md.find("| pipe \\| and \\*stars\\* |") != std::string::npos);
  CHECK(md.find("\\<meatballs>") != std::string::npos);
}

TEST_CASE("markdown: same input / same bytes - --units F in text and plots") {
  const MarkdownReport a = write_run_markdown(sample_report(), TempUnit::F, "x");
  const MarkdownReport b = write_run_markdown(sample_report(), TempUnit::F, "x");
  CHECK(a.markdown == b.markdown);
  CHECK(a.svg_files == b.svg_files);
  const RunReport r = sample_report();
  // °F = °C × 1.8 + 32 (definition of the Fahrenheit scale).
  CHECK(a.markdown.find("| " + fixed(r.stages[1].centre_C * 1.8 + 32, 2) + " |") != std::string::npos);
  CHECK(a.markdown.find("centre (°F)") != std::string::npos);
  CHECK(a.svg_files[0].second.find("temperature (°F)") != std::string::npos);
  CHECK(a.svg_files[2].second.find("134.6 → 69.8 °F") != std::string::npos);
  CHECK(a.svg_files[1].second.find("F-value (min)") != std::string::npos);
}

// issue 16: Markdown that reads as plain text. Backslashes only where CommonMark (spec 0.30,
// commonmark.org) would read markup: emphasis needs a flanking * or _ (an intraword _ never
// is), a block quote, heading or list marker only starts a line, < only opens a tag or autolink
// before a letter, / ! or ?.
TEST_CASE("issue 16: md_escape leaves plain text plain and escapes what would be markup") {
  using coldcore::detail::md_escape;
  CHECK(md_escape("z_C = 7.5, F_70") == "z_C = 7.5, F_70");
  CHECK(md_escape("cook -> hold, centre >= 72 C, < 0.1") == "cook -> hold, centre >= 72 C, < 0.1");
  CHECK(md_escape("2 * 3") == "2 * 3");
  CHECK(md_escape("-") == "-");
  CHECK(md_escape("*stars* and _under_") == "\\*stars\\* and \\_under\\_");
  CHECK(md_escape("# not a heading") == "\\# not a heading");
  CHECK(md_escape("> not a quote") == "\\> not a quote");
  CHECK(md_escape("- not a list") == "\\- not a list");
  CHECK(md_escape("12. not a list") == "12\\. not a list");
  CHECK(md_escape("<b>bold</b>") == "\\<b>bold\\</b>");
  CHECK(md_escape("a | b") == "a \\| b");
  CHECK(md_escape("[link](x)") == "\\[link](x)");
  CHECK(md_escape("two\nlines") == "two lines");
}

// issue 16: a caption names curves by their line style and legend label, never by a colour
// (meaningless on a black-and-white print; common practice for printed figures).
TEST_CASE("issue 16: plot captions name no colour") {
  for (const char* report : {"reports/kofta-balls.md", "reports/corned-beef-can.md", "reports/chicken-sausage-log.md",
                             "reports/kofta-probe.md", "reports/corned-beef-can-deviation.md", "reports/kofta-balls-solve.md"}) {
    const std::string md = coldcore::test::read_source_file(report);
    CAPTURE(report);
    for (const char* colour : {" purple", " orange", " blue", " green", " vermillion", " yellow", " grey", " black curve", " red "})
      CHECK(md.find(colour) == std::string::npos);
  }
}
