// Every report format carries every caution (DESIGN.md: "report writers ... cautions always"),
// in both temperature units. Input is the synthetic RunReport.
#include <doctest/doctest.h>

#include <sstream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/html.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/model/temperature_token.hpp"
#include "coldcore/report/svg_plot.hpp"
#include "support/sample_report.hpp"

using namespace coldcore;

TEST_CASE("text / json / csv / markdown and html all carry every caution") {
  const RunReport r = testing::sample_report();
  for (TempUnit u : {TempUnit::C, TempUnit::F}) {
    std::ostringstream text, json, csv, html;
    write_run_text(r, text, u);
    write_run_json(r, json, u);
    write_run_csv(r, csv, u);
    write_run_html(r, html, u);
    const std::string md = write_run_markdown(r, u, "x").markdown;
    for (const auto& c : cautions()) {
      CAPTURE(c);
      CHECK(text.str().find(c) != std::string::npos);
      CHECK(json.str().find(JsonWriter::escape(c)) != std::string::npos);
      CHECK(csv.str().find("# caution: " + c) != std::string::npos);
      CHECK(md.find(c) != std::string::npos);
      CHECK(html.str().find(svg::xml_escape(c)) != std::string::npos);
    }
  }
}

// The report API hands out final text: a temperature that a lower layer wrote into a note as a
// token (model/temperature_token.hpp) leaves every writer in the display unit, with no token
// bytes left for the caller to render (issue 12 item 3; 57 °C = 134.6 °F by the scale's definition).
TEST_CASE("every run writer renders temperature tokens itself - library output is final text") {
  RunReport r = testing::sample_report();
  r.warnings.push_back("the centre stayed above " + temp_token(57) + " for a while");
  for (TempUnit u : {TempUnit::C, TempUnit::F}) {
    CAPTURE(static_cast<int>(u));
    std::ostringstream text, json, csv, html;
    write_run_text(r, text, u);
    write_run_json(r, json, u);
    write_run_csv(r, csv, u);
    write_run_html(r, html, u);
    const MarkdownReport md = write_run_markdown(r, u, "x");
    const std::string shown = u == TempUnit::C ? "above 57 °C" : "above 134.6 °F";
    for (const std::string& out : {text.str(), json.str(), csv.str(), html.str(), md.markdown}) {
      CHECK(out.find(temperature_token::open) == std::string::npos);
      CHECK(out.find(shown) != std::string::npos);
    }
    for (const auto& [name, svg] : md.svg_files) CHECK(svg.find(temperature_token::open) == std::string::npos);
  }
}
