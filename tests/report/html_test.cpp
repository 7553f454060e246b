// The HTML run report: self-contained, well-formed, deterministic, cautions always, --units F.
// Input is a synthetic RunReport (tests/support/sample_report.hpp): the writer only formats.
#include <doctest/doctest.h>

#include <sstream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/html.hpp"
#include "coldcore/report/svg_plot.hpp"
#include "report_checks.hpp"
#include "support/sample_report.hpp"
#include "support/xml_check.hpp"

using namespace coldcore;
using namespace coldcore::testing;

namespace {
std::string html(const RunReport& r, TempUnit u = TempUnit::C) {
  std::ostringstream os;
  write_run_html(r, os, u);
  return os.str();
}
std::string after_doctype(const std::string& h) {
  REQUIRE(h.rfind("<!DOCTYPE html>\n", 0) == 0);
  return h.substr(16);
}
}  // namespace

TEST_CASE("html report is well-formed XML after its doctype / in both units") {
  const RunReport r = sample_report();
  for (TempUnit u : {TempUnit::C, TempUnit::F}) {
    const std::string h = html(r, u);
    CHECK(xml_problem(after_doctype(h)) == "");
    CHECK(count_of(h, "<svg ") == 3);  // temperature, lethality, cooling
  }
}

TEST_CASE("html report fetches nothing: no URL but the SVG namespace / no src/href/import") {
  const std::string h = html(sample_report());
  CHECK(external_urls(h).empty());
  CHECK(h.find("src=") == std::string::npos);
  CHECK(h.find("href=") == std::string::npos);
  CHECK(h.find("@import") == std::string::npos);
  CHECK(h.find("<script") == std::string::npos);
  CHECK(count_of(h, "url(") == count_of(h, "url(#"));  // only in-document clip paths
  // The check can fail: a link is caught.
  CHECK(external_urls("<a href=\"https://x.example\">") .size() == 1);
}

TEST_CASE("html report carries every caution / even when the model left them empty") {
  RunReport r = sample_report();
  for (const auto& c : cautions()) CHECK(html(r).find(svg::xml_escape(c)) != std::string::npos);
  r.cautions.clear();
  const std::string h = html(r);
  for (const auto& c : cautions()) CHECK(h.find(svg::xml_escape(c)) != std::string::npos);
  CHECK(h.find("id=\"cautions\"") != std::string::npos);
}

TEST_CASE("html report: same input / same bytes") {
  CHECK(html(sample_report()) == html(sample_report()));
  CHECK(html(sample_report(), TempUnit::F) == html(sample_report(), TempUnit::F));
}

TEST_CASE("html report has every section the issue lists") {
  const std::string h = html(sample_report());
  for (const char* s : {"<h1>", "Product and properties", "Process stages", "Temperatures against time",
                        "Cumulative lethality", "Cooling against the rule", "Reading this report", "Verdicts",
                        "Warnings", "Assumptions", "Provenance", "input SHA-256", "2026-01-01T00:00:00Z",
                        "Cautions", "time since process start (h)", "temperature (°C)", "F-value (min)"})
    CHECK_MESSAGE(h.find(s) != std::string::npos, std::string(s));
  CHECK(h.find("Synthetic sample &lt;meatballs&gt; &amp; &quot;quotes&quot;") != std::string::npos);
  CHECK(count_of(h, "class=\"rule-box\"") == 2);
  CHECK(count_of(h, "class=\"target-line\"") == 2);    // F70 line and the centre 72 °C line
  CHECK(count_of(h, "class=\"stage-line\"") == 2);  // chill start; the cooling window begins after it
  CHECK(h.find("class=\"verdict-not\">not demonstrated<") != std::string::npos);
  CHECK(h.find("class=\"verdict-met\">met<") != std::string::npos);
  CHECK(h.find("required F (F70) = 2.00 min") != std::string::npos);
}

TEST_CASE("--units F converts every temperature the writer formats - F-values stay in minutes") {
  const RunReport r = sample_report();
  const std::string c = html(r, TempUnit::C), f = html(r, TempUnit::F);
  // °F = °C × 1.8 + 32 (definition of the Fahrenheit scale).
  CHECK(c.find(">" + fixed(r.stages[0].centre_C, 2) + "<") != std::string::npos);
  CHECK(f.find(">" + fixed(r.stages[0].centre_C * 1.8 + 32, 2) + "<") != std::string::npos);
  CHECK(f.find("centre (°F)") != std::string::npos);
  CHECK(f.find("temperature (°F)") != std::string::npos);
  CHECK(f.find("temperature (°C)") == std::string::npos);
  CHECK(c.find("57.0 → 21.0 °C") != std::string::npos);   // rule box limits
  CHECK(f.find("134.6 → 69.8 °F") != std::string::npos);  // 57 °C, 21 °C in °F
  CHECK(f.find("required centre 161.6 °F") != std::string::npos);  // 72 °C
  CHECK(f.find("required F (F70) = 2.00 min") != std::string::npos);
}

TEST_CASE("Reading this report: Biot words / the lag / and the lumped curve only when provided") {
  const std::string with = html(sample_report());
  CHECK(with.find("The Biot number compares") != std::string::npos);
  CHECK(with.find("steam cook Bi = 0.900") != std::string::npos);
  CHECK(with.find("last point to warm") != std::string::npos);
  CHECK(with.find("class=\"series-lumped_centre_C\"") != std::string::npos);
  CHECK(with.find("The largest difference in this run is") != std::string::npos);
  CHECK(with.find("overstate safety") != std::string::npos);

  const std::string without = html(sample_report({false, 0.9}));
  CHECK(without.find("series-lumped_centre_C") == std::string::npos);
  CHECK(without.find("did not provide that curve") != std::string::npos);

  const std::string low = html(sample_report({false, 0.05}));
  CHECK(low.find("nearly the same centre temperature") != std::string::npos);
}

TEST_CASE("html report without history still writes tables / reading notes and cautions") {
  RunReport r = sample_report();
  r.history = {};
  r.rule_boxes.clear();
  const std::string h = html(r);
  CHECK(h.find("<svg") == std::string::npos);
  CHECK(xml_problem(after_doctype(h)) == "");
  CHECK(h.find("Reading this report") != std::string::npos);
  CHECK(h.find(svg::xml_escape(cautions().front())) != std::string::npos);
}

TEST_CASE("time axis in minutes up to 3 h / in hours beyond") {
  RunReport r = sample_report();
  CHECK(html(r).find("time since process start (h)") != std::string::npos);  // the sample chills ~3.8 h
  // Keep only the cook: the run then ends at 25 min.
  r.history.rows.resize(26);
  r.stages.resize(1);
  r.rule_boxes.clear();
  const std::string h = html(r);
  CHECK(h.find("time since process start (min)") != std::string::npos);
  CHECK(h.find("time since process start (h)") == std::string::npos);
}
