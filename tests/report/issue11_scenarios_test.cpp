// Issue 11, defect 6: with medium_type (h split per target, process/h_ends.hpp) every verdict
// names its scenario and the report shows the history behind each verdict, in every format.
// The product is the invented tests/cli/media-split/chill-credited.toml: the P70 target credits
// the blast chill, so it is evaluated at the HIGH end of the medium's 20–60 W/m²K (faster cooling,
// less lethality), the cooling rule at the LOW end (slower cooling): the rule of h_ends.hpp, from
// common practice (a higher h moves the product toward the medium faster).
// The check that the shown history is the one behind a verdict is independent of the report
// code: the rule's first step (57 → 21 °C, FDA Food Code 3-501.14, REFERENCES 2.2) is timed here
// by linear interpolation of the shown centre temperatures, and must match the verdict's time on
// the scenario it names, and not the other scenario's.
#include <doctest/doctest.h>

#include <cmath>
#include <optional>
#include <sstream>

#include "coldcore/io/libraries.hpp"
#include "support/xml_check.hpp"

#include "coldcore/io/product_file.hpp"
#include "coldcore/io/scenario.hpp"
#include "coldcore/process/inverse.hpp"
#include "coldcore/report/html.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/report/run_builder.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "lethality/lethality_support.hpp"

using namespace coldcore;

namespace {

struct Built {
  process::Evaluation eval;
  RunReport report;
};

// As `coldcore run` builds it (src/cli/run.cpp), sampled every `step_s`.
Built build(double step_s) {
  static const OrganismLibrary orgs =
      io::parse_organisms(test::read_source_file("products/organisms.toml"), "organisms.toml");
  static const RuleLibrary rules =
      io::parse_cooling_rules(test::read_source_file("products/cooling-rules.toml"), "cooling-rules.toml");
  const io::ProductFile file =
      io::load_product(std::string(COLDCORE_SOURCE_DIR) + "/tests/cli/media-split/chill-credited.toml");
  Built b;
  b.eval = process::evaluate(io::scenario_of(file), {&orgs, &rules, nullptr});
  RunReportOptions o;
  o.step_s = step_s;
  o.date = "2026-12-01";
  o.version = "test";
  b.report = build_run_report(io::scenario_of(file), {file.origin, file.sha256_hex, file.warnings}, b.eval.history, o);
  std::vector<const History*> history_of(b.eval.assessment.targets.size(), &b.eval.history);
  for (std::size_t t = 0; t < b.eval.target_scenario.size(); ++t)
    history_of[t] = &b.eval.h_scenarios[static_cast<std::size_t>(b.eval.target_scenario[t])].history;
  add_assessment(b.report, history_of, b.eval.assessment, file.targets);
  add_scenarios(b.report, b.eval, &file.product, file.targets, step_s);
  return b;
}

// First time the centre column falls to `temp_C` at or after `from_s`, by linear interpolation.
std::optional<double> falls_to(const HistoryTable& h, double temp_C, double from_s) {
  for (std::size_t i = 1; i < h.rows.size(); ++i) {
    const double t0 = h.rows[i - 1][0], t1 = h.rows[i][0], c0 = h.rows[i - 1][2], c1 = h.rows[i][2];
    if (t1 < from_s || !(c0 > temp_C) || c1 > temp_C) continue;
    return t0 + (t1 - t0) * (c0 - temp_C) / (c0 - c1);
  }
  return std::nullopt;
}

double step1_elapsed_s(const HistoryTable& h) {
  const auto start = falls_to(h, 57.0, 0);
  REQUIRE(start.has_value());
  const auto end = falls_to(h, 21.0, *start);
  REQUIRE(end.has_value());
  return *end - *start;
}

bool has(const std::string& s, const std::string& what) { return s.find(what) != std::string::npos; }

}  // namespace

TEST_CASE("issue 11: with h split per target each verdict names its scenario / and its history is shown") {
  const Built b = build(1.0);  // 1 s rows: the interpolated crossing is good to well under a second
  const RunReport& r = b.report;
  REQUIRE(r.scenarios.size() == 2);
  CHECK(r.scenarios[0].label == "scenario 1: \"blast chill\" h 60 W/m²K (high end)");
  CHECK(r.scenarios[1].label == "scenario 2: \"blast chill\" h 20 W/m²K (low end)");
  CHECK(r.scenarios[0].targets == std::vector<std::string>{"P70"});
  CHECK(r.scenarios[1].targets == std::vector<std::string>{"two-stage-6h"});
  REQUIRE(r.verdicts.size() == 2);
  CHECK(r.verdicts[0].scenario == r.scenarios[0].label);
  CHECK(r.verdicts[1].scenario == r.scenarios[1].label);
  CHECK(r.verdicts[1].details.front() == "verdict from scenario 2: \"blast chill\" h 20 W/m²K (low end)");
  // each scenario's stage table shows the h it ran at
  CHECK(r.scenarios[0].stages.at(1).h_W_m2K == 60);
  CHECK(r.scenarios[1].stages.at(1).h_W_m2K == 20);

  // The rule's verdict time, on its own scenario's shown history (and not on the other's).
  const TargetResult& rule = b.eval.assessment.targets.at(1);
  REQUIRE(rule.cooling.has_value());
  const double verdict_s = rule.cooling->steps.at(0).elapsed_s;
  CHECK(std::fabs(step1_elapsed_s(r.scenarios[1].history) - verdict_s) < 1.0);
  CHECK(std::fabs(step1_elapsed_s(r.scenarios[0].history) - verdict_s) > 60.0);
  // P70's F: the last row of its scenario's F column is the verdict's credited F (numbers unchanged).
  const TargetResult& p70 = b.eval.assessment.targets.at(0);
  const auto& last = r.scenarios[0].history.rows.back();
  REQUIRE(r.scenarios[0].history.columns.at(5).name == "F_P70_min");
  CHECK(last.at(5) * 60.0 == doctest::Approx(p70.F_s).epsilon(1e-3));
  CHECK(r.scenarios[0].history.columns.back().name == "lumped_centre_C");  // scenario 1 = the report's rows
  CHECK(r.scenarios[1].history.columns.back().name == "mean_C");  // the rule's scenario has no F column
}

TEST_CASE("issue 11: every format shows each scenario's history and names the scenario of each verdict") {
  const RunReport r = build(60.0).report;
  std::ostringstream text, json, csv, html;
  write_run_text(r, text, TempUnit::C);
  write_run_json(r, json, TempUnit::C);
  write_run_csv(r, csv, TempUnit::C);
  write_run_html(r, html, TempUnit::C);
  const std::string md = write_run_markdown(r, TempUnit::C, "x").markdown;
  const std::string t = render_temperatures(text.str(), TempUnit::C);
  CHECK(has(t, "  scenario 1: \"blast chill\" h 60 W/m²K (high end); targets: P70\n"));
  CHECK(has(t, "  scenario 2: \"blast chill\" h 20 W/m²K (low end); targets: two-stage-6h\n"));
  CHECK(has(t, "verdict scenario\n"));
  CHECK(has(t, "two-stage-6h: verdict from scenario 2: \"blast chill\" h 20 W/m²K (low end)\n"));

  const std::string j = json.str();
  CHECK(has(j, "\"scenarios\": [\n    {\n      \"number\": 1,\n      \"label\": \"scenario 1: \\\"blast chill\\\" h 60 W/m²K (high end)\""));
  CHECK(has(j, "\"scenario\": \"scenario 2: \\\"blast chill\\\" h 20 W/m²K (low end)\""));

  // csv: one block per scenario under one header; an F cell only on its own scenario's rows
  const std::string c = csv.str();
  CHECK(has(c, "# scenario 2: \"blast chill\" h 20 W/m²K (low end); targets: two-stage-6h\n"));
  CHECK(has(c, "\nscenario,time_s,medium_C,centre_C,surface_C,mean_C,F_P70_min,lumped_centre_C\n1,0,96,4,4,4,0,4\n"));
  CHECK(has(c, "\n2,0,96,4,4,4,,\n"));
  // (the required text also names the binding step since the verdict merge: check both ends)
  CHECK(has(c, "# verdict: two-stage-6h: met (required 120 min"));
  CHECK(has(c, "achieved 21.0 min, margin 99.0 min), from scenario 2: \"blast chill\" h 20 W/m²K (low end)\n"));

  for (const std::string& rich : {html.str(), md}) {
    CHECK(has(rich, "Scenarios"));
    CHECK(has(rich, "(scenario 2)"));  // plot titles
  }
  CHECK(has(md, "scenario 1: \"blast chill\" h 60 W/m²K (high end); targets: P70"));
  CHECK(has(html.str(), "id=\"figure-scenario2-cooling\""));
  // polyglot markup: well-formed XML after the doctype (as html_test checks the sample report)
  REQUIRE(std::string(html.str()).rfind("<!DOCTYPE html>\n", 0) == 0);
  CHECK(coldcore::testing::xml_problem(std::string(html.str()).substr(16)) == "");
  CHECK(has(html.str(), "id=\"figure-scenario1-lethality\""));
  CHECK(has(md, "(<x-scenario2-cooling.svg>)"));
}
