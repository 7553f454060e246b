// Every report format carries every caution (DESIGN.md: "report writers ... cautions always"),
// in both temperature units. Input is the synthetic RunReport.
#include <doctest/doctest.h>

#include <sstream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/html.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/markdown.hpp"
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
