// The md and html writers of `coldcore solve` and `coldcore deviation`: well-formed and
// self-contained, the verdict rows and the disposition statement present, --units F applied,
// same input ⇒ same bytes. Inputs are synthetic result structs (no physics is run): the writers
// only format. The plot data is the synthetic sample report (tests/support/sample_report.hpp).
#include <doctest/doctest.h>

#include <fstream>
#include <sstream>

#include "coldcore/model/temperature_token.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/deviation_report.hpp"
#include "coldcore/report/solve_report.hpp"
#include "coldcore/report/svg_plot.hpp"
#include "report_checks.hpp"
#include "support/sample_report.hpp"
#include "support/xml_check.hpp"

using namespace coldcore;
using namespace coldcore::testing;

namespace {

// A note that carries free text: the h choice's note names the targets it served as the file
// names them.
process::ProcessNote free_note(std::string text) {
  process::ProcessNote n{process::ProcessNoteKind::h_per_target};
  n.h_use.targets = {std::move(text)};
  return n;
}

TargetResult target(const std::string& name, bool met, double margin, const std::string& margin_text) {
  TargetResult t;
  t.name = name;
  t.kind = TargetKind::f_value;
  t.unit = "min";
  t.required = 120;
  t.achieved = 120 + margin;
  t.margin = margin;
  t.verdict = met ? Verdict::met : Verdict::not_demonstrated;
  t.required_text = "2.00 min";
  t.achieved_text = met ? "2.52 min" : "1.48 min";
  t.margin_text = margin_text;
  t.verdict_text = (met ? "met, margin " : "not demonstrated, shortfall ") + margin_text;
  return t;
}

// min-medium: the answer is a temperature, so --units F shows in the answer itself.
process::SolveResult solve_result() {
  process::SolveResult r;
  r.question = process::Question::min_medium;
  r.stage = "steam cook";
  r.quantity = "medium";
  r.unit = "C";
  r.answer = 71.234;
  r.rounded = 71.5;
  r.unit_step = 0.5;
  r.nominal = 84;
  r.verification.value = 71.5;
  r.verification.eval.all_met = true;
  r.verification.eval.considered_met = true;
  r.verification.eval.assessment.targets = {target("F70 <cook>", true, 31.2, "0.52 min")};
  process::Check less;
  less.value = 71.0;
  less.eval.assessment.targets = {target("F70 <cook>", false, -31.2, "0.52 min")};
  r.one_unit_less = less;
  r.considered = {"F70 <cook>"};
  r.notes = {free_note("a note with *stars* & <angle brackets>")};
  r.assumptions = {{process::ProcessNoteKind::assumes_stages_kept}};
  return r;
}

SolveReportContext solve_context(const RunReport* plot) {
  SolveReportContext c;
  c.product_name = "Synthetic sphere & \"friends\"";
  c.provenance = {{"tool", "coldcore test"}, {"input SHA-256", std::string(64, 'a')}, {"date", "2026-12-01"}};
  c.verification_plot = plot;
  return c;
}

process::DeviationResult deviation_result() {
  process::DeviationResult r;
  r.stage = "retort hold";
  r.stage_start_s = 600;
  process::DeviationEvent e;
  e.kind = process::DeviationKind::medium_colder;
  e.start_s = 2400;
  e.end_s = 2760;
  e.extreme_C = 113.1;
  e.extreme_at_s = 2400;
  e.scheduled_at_extreme_C = 121.1;
  e.departure_K = 8;
  r.events = {e};
  process::DeviationTarget t;
  t.name = "F0";
  t.kind = TargetKind::f_value;
  t.lethality = true;
  t.scheduled_F_s = 1014;
  t.delivered_F_s = 100;
  t.scheduled = target("F0", true, 31.2, "0.52 min");
  t.delivered = target("F0", false, -20, "0.34 min");
  t.verdict = Verdict::not_demonstrated;
  r.targets = {t};
  r.all_met_delivered = false;
  r.extra_hold_s = 360;
  r.extra_hold_unrounded_s = 331.2;
  r.extension_medium_C = 121.1;
  process::Check restored;
  restored.value = 360;
  restored.eval.all_met = true;
  restored.eval.assessment.targets = {target("F0", true, 3, "0.05 min")};
  r.restored = restored;
  process::Check less;
  less.value = 300;
  less.eval.assessment.targets = {target("F0", false, -3, "0.05 min")};
  r.restored_one_unit_less = less;
  r.notes = {free_note("a note")};
  process::ProcessNote threshold =
      process::note_about(process::ProcessNoteKind::assumes_deviation_threshold, "retort", true);
  threshold.value = 120;
  threshold.tol_K = 1;
  r.assumptions = {threshold};
  return r;
}

DeviationRecordInfo deviation_info(const RunReport* sched, const RunReport* deliv) {
  DeviationRecordInfo i;
  i.product_name = "Synthetic can";
  i.lot = "CB-0412 <x>";
  i.medium_log = "hold.csv";
  i.medium_log_sha256 = std::string(64, 'b');
  i.provenance = {{"tool", "coldcore test"}, {"date", "2026-12-01"}};
  i.scheduled_plot = sched;
  i.delivered_plot = deliv;
  return i;
}

std::string solve_html(const RunReport* plot, TempUnit u = TempUnit::C) {
  std::ostringstream o;
  write_solve_html(solve_result(), solve_context(plot), o, u);
  return o.str();
}

std::string deviation_html(const RunReport* s, const RunReport* d, TempUnit u = TempUnit::C) {
  std::ostringstream o;
  write_deviation_html(deviation_result(), deviation_info(s, d), o, u);
  return o.str();
}

std::string after_doctype(const std::string& h) {
  REQUIRE(h.rfind("<!DOCTYPE html>\n", 0) == 0);
  return h.substr(16);
}

void check_self_contained(const std::string& h) {
  CHECK(external_urls(h).empty());
  CHECK(h.find("src=") == std::string::npos);
  CHECK(h.find("href=") == std::string::npos);
  CHECK(h.find("<script") == std::string::npos);
  CHECK(h.find("@import") == std::string::npos);
  CHECK(count_of(h, "url(") == count_of(h, "url(#"));
}

}  // namespace

TEST_CASE("solve html: well-formed / self-contained / every section / verdict rows") {
  const RunReport plot = sample_report();
  for (TempUnit u : {TempUnit::C, TempUnit::F}) {
    const std::string h = solve_html(&plot, u);
    CHECK(xml_problem(after_doctype(h)) == "");
    check_self_contained(h);
    CHECK(count_of(h, "<svg ") == 3);  // the sample has temperature, lethality and cooling data
  }
  const std::string h = solve_html(&plot);
  for (const char* s : {"<h1>coldcore solve --for min-medium: lowest medium temperature", "Question and product",
                        "id=\"answer\"", "Verification: forward re-run at 71.50 °C", "One unit less: re-run at 71.00 °C",
                        "Notes", "Assumptions", "Provenance", "id=\"cautions\"", "Synthetic sphere &amp; &quot;friends&quot;",
                        "71.2340 °C", "rounded up to 0.50 °C"})
    CHECK_MESSAGE(h.find(s) != std::string::npos, s);
  // one met row (verification) and one not demonstrated row (one unit less), shortfall signed
  CHECK(count_of(h, "<td class=\"verdict-met\">met</td>") == 1);
  CHECK(count_of(h, "<td class=\"verdict-not\">not demonstrated</td>") == 1);
  CHECK(h.find("<td>shortfall 0.52 min</td>") != std::string::npos);
  CHECK(h.find("<td>F70 &lt;cook&gt;</td>") != std::string::npos);
  for (const auto& c : cautions()) CHECK(h.find(svg::xml_escape(c)) != std::string::npos);
  // No plot data: no figures, still well-formed.
  const std::string bare = solve_html(nullptr);
  CHECK(bare.find("<svg") == std::string::npos);
  CHECK(xml_problem(after_doctype(bare)) == "");
}

TEST_CASE("solve html and md: --units F converts the answer and the plots - same input / same bytes") {
  const RunReport plot = sample_report();
  const std::string f = solve_html(&plot, TempUnit::F);
  // °F = °C × 1.8 + 32 (definition of the Fahrenheit scale); a 0.5 K step is 0.9 °F.
  CHECK(f.find("160.70 °F") != std::string::npos);    // 71.5 °C, the answer to use
  CHECK(f.find("160.2212 °F") != std::string::npos);  // 71.234 °C, unrounded
  CHECK(f.find("rounded up to 0.90 °F") != std::string::npos);
  CHECK(f.find("159.80 °F") != std::string::npos);    // 71.0 °C, one unit less
  CHECK(f.find("temperature (°F)") != std::string::npos);
  CHECK(f.find("°C") == std::string::npos);
  CHECK(solve_html(&plot, TempUnit::F) == f);
  CHECK(solve_html(&plot) == solve_html(&plot));
  const auto m1 = write_solve_markdown(solve_result(), solve_context(&plot), TempUnit::F, "ans");
  const auto m2 = write_solve_markdown(solve_result(), solve_context(&plot), TempUnit::F, "ans");
  CHECK(m1.markdown == m2.markdown);
  CHECK(m1.svg_files == m2.svg_files);
  CHECK(m1.markdown.find("160.70 °F") != std::string::npos);
  CHECK(m1.markdown.find("°C") == std::string::npos);
}

TEST_CASE("solve md: tables / escaped text / plots as well-formed standalone SVG files beside it") {
  const RunReport plot = sample_report();
  const auto m = write_solve_markdown(solve_result(), solve_context(&plot), TempUnit::C, "kofta-solve");
  CHECK(m.markdown.rfind("# coldcore solve --for min-medium", 0) == 0);
  CHECK(m.markdown.find("| F70 \\<cook> | F-value | 2.00 min | 2.52 min | 0.52 min | met |") != std::string::npos);
  CHECK(m.markdown.find("| F70 \\<cook> | F-value | 2.00 min | 1.48 min | shortfall 0.52 min | not demonstrated |") !=
        std::string::npos);
  CHECK(m.markdown.find("a note with \\*stars\\* & \\<angle brackets>") != std::string::npos);
  REQUIRE(m.svg_files.size() == 3);
  CHECK(m.svg_files[0].first == "kofta-solve-temperature.svg");
  for (const auto& [name, text] : m.svg_files) {
    const std::string& svg_name = name;  // a plain reference: clang 14 cannot capture a structured binding
    CHECK_MESSAGE(xml_problem(text) == "", svg_name);
    CHECK(m.markdown.find("(<" + name + ">)") != std::string::npos);
  }
  CHECK(external_urls(m.markdown).empty());
  for (const auto& c : cautions()) CHECK(m.markdown.find("> - " + c) != std::string::npos);
  CHECK(m.markdown.find("## Cautions") != std::string::npos);
}

TEST_CASE("solve html: the conservative section lists choices / the worst case / each choice alone / the driver") {
  const RunReport plot = sample_report();
  process::ConservativeSolve cs;
  process::RangeSetting diameter{process::RangeFactor::diameter, 0.044};
  process::RangeSetting h{process::RangeFactor::stage_h, 80};
  h.stage = "cook";
  cs.choices = {diameter, h};
  cs.result = solve_result();
  cs.result->rounded = 75.0;
  cs.alone = {{diameter, 73.0, ""}, {h, std::nullopt, "no medium up to 200 C"}};
  cs.driven_by = 1;
  cs.driven_by_no_solution = true;
  SolveReportContext c = solve_context(&plot);
  c.conservative = &cs;
  std::ostringstream o;
  write_solve_html(solve_result(), c, o, TempUnit::C);
  const std::string html = o.str();
  CHECK(xml_problem(after_doctype(html)) == "");
  for (const char* s : {"id=\"conservative\"", "<li>diameter 44 mm (largest)</li>", "Worst case: use 75.00 °C",
                        "<td>driven by</td><td>stage &quot;cook&quot; h 80 W/m2K (lowest) (no solution with it alone)</td>",
                        "<td>73.00 °C</td>", "no solution: no medium up to 200 C"})
    CHECK_MESSAGE(html.find(s) != std::string::npos, s);
  CHECK(solve_html(&plot).find("id=\"conservative\"") == std::string::npos);
}

TEST_CASE("deviation html: well-formed / self-contained / record / verdicts / extra hold / disposition / sign-off") {
  RunReport sched = sample_report(), deliv = sample_report();
  for (auto& row : deliv.history.rows) row[2] -= 1.0;  // a different delivered centre curve
  for (TempUnit u : {TempUnit::C, TempUnit::F}) {
    const std::string h = deviation_html(&sched, &deliv, u);
    CHECK(xml_problem(after_doctype(h)) == "");
    check_self_contained(h);
    CHECK(count_of(h, "<svg ") == 2);  // temperatures, cumulative F
  }
  const std::string h = deviation_html(&sched, &deliv);
  for (const char* s : {"<h1>coldcore deviation record: lot CB-0412 &lt;x&gt;", "Deviation record",
                        "<td>deviation 1 of 1</td><td>medium colder than scheduled in a stage that heats, 40 min 00 s "
                        "to 46 min 00 s into the stage (2400-2760 s); lowest 113.10 °C at 2400 s, scheduled 121.10 °C "
                        "(8.00 K colder)</td>", "<td>medium log SHA-256</td>", "<td>tool</td><td>coldcore test</td>",
                        "the medium is linear between logged readings", "16.9 min → 1.66 min",
                        "<td>shortfall 0.34 min</td>", "Additional time that restores the targets",
                        "121.10 °C", "6 min 00 s (360 s), rounded up from 331.2 s",
                        "One unit less (5 min 00 s (300 s))"})
    CHECK_MESSAGE(h.find(s) != std::string::npos, s);
  CHECK(h.find("class=\"series-probe\"") == std::string::npos);
  CHECK(h.find("medium, logged (delivered)") != std::string::npos);
  CHECK(h.find("centre, scheduled") != std::string::npos);
  CHECK(h.find(svg::xml_escape(disposition_statement())) != std::string::npos);
  // the sign-off every record carries (issue 16): five lines to fill in by hand
  CHECK(count_of(h, "<td class=\"line\"> </td>") == 5);
  for (const char* l : {"<td>Prepared by (name, role)</td>", "<td>Reviewed by (process authority)</td>", "<td>Date</td>",
                        "<td>Decision (accept / hold / reprocess / reject)</td>", "<td>Corrective action</td>"})
    CHECK_MESSAGE(h.find(l) != std::string::npos, l);
  CHECK(count_of(h, "class=\"verdict-not\">not demonstrated<") == 2);  // delivered; one unit less
  CHECK(count_of(h, "class=\"verdict-met\">met<") == 1);               // the restored re-run
  for (const auto& c : cautions()) CHECK(h.find(svg::xml_escape(c)) != std::string::npos);
  // Without plot data: no figures, still every section.
  const std::string bare = deviation_html(nullptr, nullptr);
  CHECK(bare.find("<svg") == std::string::npos);
  CHECK(xml_problem(after_doctype(bare)) == "");
  CHECK(bare.find(svg::xml_escape(disposition_statement())) != std::string::npos);
}

TEST_CASE("deviation html and md: --units F for every temperature - same input / same bytes") {
  RunReport sched = sample_report();
  const std::string f = deviation_html(&sched, &sched, TempUnit::F);
  // °F = °C × 1.8 + 32; differences × 1.8 (definition of the Fahrenheit scale).
  CHECK(f.find("235.58 °F") != std::string::npos);  // lowest 113.1 °C
  CHECK(f.find("249.98 °F") != std::string::npos);  // scheduled 121.1 °C, and the extension medium
  CHECK(f.find("14.40 °F") != std::string::npos);   // 8 K drop
  CHECK(f.find("temperature (°F)") != std::string::npos);
  CHECK(f.find("°C") == std::string::npos);
  CHECK(f.find("1.66 min") != std::string::npos);  // F stays in minutes
  CHECK(deviation_html(&sched, &sched, TempUnit::F) == f);
  const auto m = write_deviation_markdown(deviation_result(), deviation_info(&sched, &sched), TempUnit::F, "dev");
  CHECK(m.markdown.find("235.58 °F") != std::string::npos);
  CHECK(m.markdown.find("°C") == std::string::npos);
  CHECK(m.markdown == write_deviation_markdown(deviation_result(), deviation_info(&sched, &sched), TempUnit::F, "dev").markdown);
}

TEST_CASE("deviation md: disposition statement / blank reviewer lines / plots as files") {
  RunReport sched = sample_report();
  const auto m = write_deviation_markdown(deviation_result(), deviation_info(&sched, nullptr), TempUnit::C, "cb");
  CHECK(m.markdown.find("**" + disposition_statement() + "**") != std::string::npos);
  for (const char* l : {"Reviewed by (process authority): ___", "Date: ___", "Decision (accept / hold / reprocess / reject): ___",
                        "Corrective action: ___"})
    CHECK(m.markdown.find(l) != std::string::npos);
  CHECK(m.markdown.find("| F0 (F-value) | 16.9 min → 1.66 min | - | 2.00 min | shortfall 0.34 min | met | not demonstrated |") !=
        std::string::npos);
  REQUIRE(m.svg_files.size() == 2);
  CHECK(m.svg_files[0].first == "cb-temperature.svg");
  CHECK(m.svg_files[1].first == "cb-lethality.svg");
  for (const auto& svg : m.svg_files) CHECK_MESSAGE(xml_problem(svg.second) == "", svg.first);
  CHECK(m.markdown.find("## Cautions") != std::string::npos);
}

TEST_CASE("deviation plots: a measured probe log is drawn when given") {
  DeviationRecordInfo i = deviation_info(nullptr, nullptr);
  i.probe_time_s = {0, 600, 1200};
  i.probe_temp_C = {20, 60, 75};
  std::ostringstream o;
  write_deviation_html(deviation_result(), i, o, TempUnit::C);
  CHECK(count_of(o.str(), "<svg ") == 1);  // temperatures only: no run, no F curves
  CHECK(o.str().find("class=\"series-probe\"") != std::string::npos);
  CHECK(xml_problem(after_doctype(o.str())) == "");
}

TEST_CASE("the committed example solve and deviation reports are well-formed and self-contained") {
  // Written by scripts/make_reports.sh; cli.reports_current keeps them current.
  for (const char* name : {"kofta-balls-solve", "corned-beef-can-deviation"}) {
    const std::string dir = std::string(COLDCORE_SOURCE_DIR) + "/reports/";
    std::ifstream f(dir + name + ".html", std::ios::binary);
    REQUIRE_MESSAGE(f, name);
    std::stringstream ss;
    ss << f.rdbuf();
    const std::string h = ss.str();
    CHECK_MESSAGE(xml_problem(after_doctype(h)) == "", name);
    check_self_contained(h);
    CHECK(count_of(h, "<svg ") >= 2);
    for (const char* plot : {"-temperature.svg", "-lethality.svg"}) {
      std::ifstream s(dir + name + plot, std::ios::binary);
      const std::string file = std::string(name) + plot;
      REQUIRE_MESSAGE(s, file);
      std::stringstream st;
      st << s.rdbuf();
      CHECK_MESSAGE(xml_problem(st.str()) == "", file);
    }
  }
}

// Library output is final text (issue 12 item 3): a token in a note leaves every solve and
// deviation writer in the display unit (63 °C = 145.4 °F by the scale's definition).
TEST_CASE("solve and deviation writers render temperature tokens themselves - no token bytes leave the API") {
  process::SolveResult s = solve_result();
  s.notes.push_back(free_note("held above " + temp_token(63)));
  process::DeviationResult d = deviation_result();
  d.notes.push_back(free_note("held above " + temp_token(63)));
  const RunReport plot = sample_report();
  for (TempUnit u : {TempUnit::C, TempUnit::F}) {
    CAPTURE(static_cast<int>(u));
    std::ostringstream st, sj, sc, sh, dt, dj, dc, dh;
    write_solve_text(s, solve_context(&plot), st, u);
    write_solve_json(s, solve_context(&plot), sj, u);
    write_solve_csv(s, solve_context(&plot), sc, u);
    write_solve_html(s, solve_context(&plot), sh, u);
    write_deviation_text(d, deviation_info(&plot, &plot), dt, u);
    write_deviation_json(d, deviation_info(&plot, &plot), dj, u);
    write_deviation_csv(d, deviation_info(&plot, &plot), dc, u);
    write_deviation_html(d, deviation_info(&plot, &plot), dh, u);
    const MarkdownReport sm = write_solve_markdown(s, solve_context(&plot), u, "s");
    const MarkdownReport dm = write_deviation_markdown(d, deviation_info(&plot, &plot), u, "d");
    const std::string shown = u == TempUnit::C ? "above 63 °C" : "above 145.4 °F";
    for (const std::string& out : {st.str(), sj.str(), sc.str(), sh.str(), dt.str(), dj.str(), dc.str(), dh.str(),
                                   sm.markdown, dm.markdown}) {
      CHECK(out.find(temperature_token::open) == std::string::npos);
      CHECK(out.find(shown) != std::string::npos);
    }
  }
}
