// The verdict summary every report opens with (issue 11, "you can't see at a glance whether it
// passed"). The sentences are the ones the issue asks for: "1 of 2 targets NOT DEMONSTRATED:
// <target> (shortfall ...)", "All 3 targets met", "No target given: no verdict".
// Lethality on a constant log: F at the reference temperature is the time spent there
// (F = ∫ 10^((T − Tref)/z) dt, the General Method; common practice).
#include <doctest/doctest.h>

#include <sstream>

#include "coldcore/process/assessment.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/report/html.hpp"
#include "coldcore/report/run_builder.hpp"
#include "coldcore/report/verdict_summary.hpp"

using namespace coldcore;

namespace {

// An own-kinetics F-value target at 70 °C, z 7.5 K, requiring `F_min` minutes.
Target f70(const std::string& name, double F_min) {
  Target t;
  t.name = name;
  t.kind = TargetKind::f_value;
  OwnKinetics k;
  k.reference_C = 70;
  k.z_C = 7.5;
  t.own = k;
  t.F_required_s = F_min * 60.0;
  return t;
}

// A measured log held at exactly 70 °C for 2 min (rows every 10 s): F70 = 2.00 min.
RunReport report_of(const std::vector<Target>& targets) {
  std::vector<double> ts, Ts;
  for (int i = 0; i <= 12; ++i) {
    ts.push_back(10.0 * i);
    Ts.push_back(70.0);
  }
  const ProbeAssessment pa = assess_probe_log(ts, Ts, targets, OrganismLibrary{}, RuleLibrary{});
  RunReport r;
  r.title = "verdict summary test";
  for (const auto& t : pa.targets) r.verdicts.push_back(verdict_row(t));
  return r;
}

}  // namespace

TEST_CASE("issue 11: a report whose targets are all met opens with \"All N targets met\"") {
  const RunReport r = report_of({f70("F70-1", 1.0), f70("F70-1.5", 1.5), f70("F70-0.5", 0.5)});
  const VerdictSummary s = verdict_summary(r);
  CHECK(s.sentence == "All 3 targets met");
  CHECK(s.all_met);
  CHECK(s.main().targets == 3);
  CHECK(s.main().met == 3);
  CHECK(s.main().not_demonstrated == 0);
  CHECK(verdict_summary(report_of({f70("F70-1", 1.0)})).sentence == "1 of 1 target met");
}

TEST_CASE("issue 11: a report with a target not demonstrated names it and its shortfall first") {
  // F70 delivered 2.00 min against 3 min required: shortfall 1.00 min (rounded up).
  const RunReport r = report_of({f70("F70-1", 1.0), f70("F70-3", 3.0)});
  const VerdictSummary s = verdict_summary(r);
  CHECK(s.sentence == "1 of 2 targets NOT DEMONSTRATED: F70-3 (shortfall 1.00 min)");
  CHECK_FALSE(s.all_met);
  CHECK(s.main().not_demonstrated == 1);
  REQUIRE(s.main().not_met.size() == 1);
  CHECK(s.main().not_met[0].name == "F70-3");

  // every format opens with it: text just after the title, csv its first line, json a top-level
  // object, html a box right after the title and lead, markdown a bold line there
  std::ostringstream text, csv, json, html;
  write_run_text(r, text, TempUnit::C);
  CHECK(text.str().rfind("verdict summary test\n\nVerdict summary: 1 of 2 targets NOT DEMONSTRATED: F70-3 (shortfall 1.00 min)\n\n", 0) == 0);
  write_run_csv(r, csv, TempUnit::C);
  CHECK(csv.str().rfind("# verdict summary: 1 of 2 targets NOT DEMONSTRATED: F70-3 (shortfall 1.00 min)\n", 0) == 0);
  write_run_json(r, json, TempUnit::C);
  CHECK(json.str().find("\"verdict_summary\": {\n    \"sentence\": \"1 of 2 targets NOT DEMONSTRATED: F70-3 (shortfall 1.00 min)\",\n"
                        "    \"all_met\": false,\n    \"scope\": \"\",\n    \"targets\": 2,\n    \"met\": 1,\n"
                        "    \"not_demonstrated\": 1,\n    \"not_demonstrated_targets\": [\n      \"F70-3\"\n    ]\n  }") !=
        std::string::npos);
  CHECK(json.str().find("\"met\": false") != std::string::npos);
  write_run_html(r, html, TempUnit::C);
  const std::string h = html.str();
  const auto box = h.find("<p id=\"verdict-summary\" class=\"verdict-summary not-demonstrated\">Verdict summary: "
                          "1 of 2 targets NOT DEMONSTRATED: F70-3 (shortfall 1.00 min)</p>");
  CHECK(box != std::string::npos);
  CHECK(box < h.find("<section"));
  CHECK(box > h.find("<p class=\"lead\">"));
  const std::string md = write_run_markdown(r, TempUnit::C, "t").markdown;
  const auto line = md.find("**Verdict summary: 1 of 2 targets NOT DEMONSTRATED: F70-3 (shortfall 1.00 min)**\n");
  CHECK(line != std::string::npos);
  CHECK(line < md.find("\n## "));
}

TEST_CASE("issue 11: a report without a target says there is no verdict") {
  const RunReport r = report_of({});
  const VerdictSummary s = verdict_summary(r);
  CHECK(s.sentence == "No target given: no verdict");
  CHECK_FALSE(s.all_met);
  CHECK(s.main().targets == 0);
  std::ostringstream html;
  write_run_html(r, html, TempUnit::C);
  CHECK(html.str().find("class=\"verdict-summary no-verdict\">Verdict summary: No target given: no verdict</p>") !=
        std::string::npos);
}

TEST_CASE("issue 11: solve and deviation summaries name what their verdicts are of / and the worst case") {
  VerdictCount nominal = count_verdicts({{"F0", true, "13.9 min"}, {"c-botulinum", true, "68.5 log10"}}, "as delivered");
  CHECK(summarize_verdicts({nominal}).sentence == "As delivered: all 2 targets met");
  VerdictCount worst = count_verdicts({{"F0", false, "shortfall 0.4 min"}, {"c-botulinum", true, "1 log10"}},
                                      "worst case of the file's ranges");
  const VerdictSummary both = summarize_verdicts({nominal, worst});
  CHECK(both.sentence ==
        "As delivered: all 2 targets met; worst case of the file's ranges: 1 of 2 targets NOT DEMONSTRATED: F0 (shortfall 0.4 min)");
  CHECK_FALSE(both.all_met);  // the worst case not met is not a demonstrated process
  VerdictCount none;
  none.scope = "worst case of the file's ranges";
  none.no_answer = true;
  const VerdictSummary no_answer = summarize_verdicts({count_verdicts({{"L", true, "1 log10"}}, "at the answer to use"), none});
  CHECK(no_answer.sentence == "At the answer to use: 1 of 1 target met; worst case of the file's ranges: no answer, so no verdict");
  CHECK_FALSE(no_answer.all_met);
  // the margin cell "-" (no amount) is not shown in brackets
  CHECK(summarize_verdicts({count_verdicts({{"table", false, "-"}})}).sentence == "1 of 1 target NOT DEMONSTRATED: table");
}

TEST_CASE("issue 11: the stderr line of a verb writing to --out is the report's sentence") {
  const VerdictSummary s = summarize_verdicts({count_verdicts({{"listeria-monocytogenes", false, "shortfall 0.4 log10"},
                                                               {"two-stage-6h", true, "104 min"}})});
  CHECK(summary_stderr_line("run", s, "r.html") ==
        "coldcore run: 1 of 2 targets NOT DEMONSTRATED: listeria-monocytogenes (shortfall 0.4 log10); report written to r.html");
}
