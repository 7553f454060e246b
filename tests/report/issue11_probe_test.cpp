// Issue 11, defect 4 and the probe stumble: probe without a target shows what was delivered and
// claims no verdict; a probe report says measured, names its log, its lot and its clock time.
// Expected values: a constant 70 °C for 4 min delivers F70 = 4 min by the definition of F
// (F = ∫ 10^((T − Tref)/z) dt, DESIGN.md; common practice); with D70 = 0.5 min that is
// 4 / 0.5 = 8 log10. The clock time of 2026-11-30T07:00:00+01:00 is 1796018400 s since 1970 UTC
// (GNU date: `date -u -d 2026-11-30T06:00:00Z +%s`).
#include <doctest/doctest.h>

#include <sstream>

#include "support/xml_check.hpp"

#include "coldcore/io/logger_csv.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/html.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/report/probe_report.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "lethality/lethality_support.hpp"
#include "support/libraries.hpp"

using namespace coldcore;

namespace {

const OrganismLibrary& orgs() { return test::project_organisms(); }
const RuleLibrary& rules() { return test::project_rules(); }

TimeSeries constant_log() {
  return io::parse_log_csv(test::read_source_file("tests/cli/probe/constant-70C.csv"), "constant-70C.csv");
}

// Own kinetics 70 °C / z 7.5 °C / D 0.5 min, no requirement: the placeholder log reduction of 1
// only makes the assessment compute the delivered values (as `coldcore probe` does).
Target own_without_requirement() {
  Target t;
  t.name = "own";
  t.kind = TargetKind::log_reduction;
  t.log_reduction = 1;
  OwnKinetics k;
  k.reference_C = 70;
  k.z_C = 7.5;
  k.D_ref_s = 30;
  t.own = k;
  return t;
}

RunReport probe_report(bool requirement, const std::string& lot) {
  const TimeSeries log = constant_log();
  const ProbeAssessment pa = assess_probe_log(log.time_s, log.temp_C, {own_without_requirement()}, orgs(), rules());
  ProbeReportOptions o;
  o.log_path = "constant-70C.csv";
  o.log_sha256 = std::string(64, 'a');
  o.lot = lot;
  o.lethality_requirement = requirement;
  o.date = "2026-12-01";
  o.version = "test";
  return build_probe_report(log, pa, o);
}

std::string text_of(const RunReport& r) {
  std::ostringstream o;
  write_run_text(r, o, TempUnit::C);
  return render_temperatures(o.str(), TempUnit::C);
}
std::string json_of(const RunReport& r) {
  std::ostringstream o;
  write_run_json(r, o, TempUnit::C);
  return render_temperatures(o.str(), TempUnit::C);
}
std::string csv_of(const RunReport& r) {
  std::ostringstream o;
  write_run_csv(r, o, TempUnit::C);
  return render_temperatures(o.str(), TempUnit::C);
}
std::string html_of(const RunReport& r) {
  std::ostringstream o;
  write_run_html(r, o, TempUnit::C);
  return render_temperatures(o.str(), TempUnit::C);
}
std::string md_of(const RunReport& r) {
  return render_temperatures(write_run_markdown(r, TempUnit::C, "p").markdown, TempUnit::C);
}

bool has(const std::string& s, const std::string& what) { return s.find(what) != std::string::npos; }

}  // namespace

TEST_CASE("issue 11: a timestamped log gives its first row's clock time - a log in seconds has none") {
  const TimeSeries log = constant_log();
  REQUIRE(log.start_unix_s.has_value());
  CHECK(*log.start_unix_s == 1796018400.0);
  CHECK(log.time_s.front() == 0.0);
  CHECK(utc_text(*log.start_unix_s) == "2026-11-30 06:00:00 UTC");
  CHECK(utc_text(*log.start_unix_s + 240.9) == "2026-11-30 06:04:00 UTC");  // whole seconds, rounded down
  CHECK(utc_text(0) == "1970-01-01 00:00:00 UTC");
  const TimeSeries secs = io::parse_log_csv("time_s,probe_C\n0,5\n30,6\n", "s.csv");
  CHECK_FALSE(secs.start_unix_s.has_value());
}

TEST_CASE("issue 11: probe without a target shows what was delivered and claims no verdict / in every format") {
  const RunReport r = probe_report(false, "");
  CHECK(r.verdicts.empty());
  CHECK(r.target_lines.empty());  // no required line is drawn
  REQUIRE(r.delivered.size() == 1);
  const DeliveredRow& d = r.delivered[0];
  CHECK(d.F_s == doctest::Approx(240.0).epsilon(1e-9));
  REQUIRE(d.log_reduction.has_value());
  CHECK(*d.log_reduction == doctest::Approx(8.0).epsilon(1e-9));

  const std::string text = text_of(r);
  CHECK(has(text, "Delivered lethality (no target given: no verdict)\n"
                  "  own: F 4.00 min at 70.0 °C (z 7.50 °C), 8.00 log10\n"));
  CHECK(has(text, "own: no target was given (--target-log, or --F-min with own kinetics): the delivered lethality "
                  "is shown and no verdict is claimed"));
  for (const auto& s : {text, md_of(r), html_of(r), csv_of(r), json_of(r)}) {
    CHECK_FALSE(has(s, "not demonstrated"));
    CHECK_FALSE(has(s, "none given"));
    CHECK_FALSE(has(s, "F needed"));
  }
  for (const auto& s : {text, md_of(r), html_of(r), csv_of(r)}) CHECK(has(s, "F 4.00 min at 70.0 °C (z 7.50 °C), 8.00 log10"));
  const std::string json = json_of(r);
  CHECK(has(json, "\"F_text\": \"4.00 min at 70.0 °C (z 7.50 °C)\""));
  CHECK(has(json, "\"log_reduction_text\": \"8.00 log10\""));
  CHECK(has(json, "\"assessment\": []"));
  CHECK(has(json, "\"verdict\": \"none: no target given\""));
  CHECK(has(json, "\"log_reduction\": 8"));
  CHECK(has(json, "\"F_min\": 4,"));  // 240 s; F-values in minutes in every verb (issue 16)
  const std::string csv = csv_of(r);
  CHECK(has(csv, "# delivered, no target given, no verdict: own: F 4.00 min at 70.0 °C (z 7.50 °C), 8.00 log10\n"));
  CHECK_FALSE(has(csv, "# verdict:"));
  CHECK(has(md_of(r), "## Delivered lethality (no target given: no verdict)"));
  CHECK(has(html_of(r), "<h2>Delivered lethality (no target given: no verdict)</h2>"));
  CHECK(has(md_of(r), "no target was given, so no required value is drawn"));
}

TEST_CASE("issue 11: the probe report says measured / names the log / its lot and its clock time") {
  const RunReport r = probe_report(true, "L-2026-11-30-A");
  REQUIRE(r.verdicts.size() == 1);
  CHECK(r.title == "coldcore probe: measured cold-spot log constant-70C.csv, lot L-2026-11-30-A");
  CHECK(r.history.columns.at(1).name == "measured_C");
  const std::string html = html_of(r), md = md_of(r);
  for (const auto& s : {html, md}) {
    CHECK(has(s, "Engineering estimate from a measured temperature log, not a validated process."));
    CHECK(has(s, "Measured log"));
    CHECK(has(s, "L-2026-11-30-A"));
    CHECK(has(s, "2026-11-30 06:00:00 UTC"));
    CHECK(has(s, "This report is about measured data: the 9 temperatures logged in constant-70C.csv, the first at "
                 "2026-11-30 06:00:00 UTC."));
    // none of the model report's wording
    CHECK_FALSE(has(s, "conduction model"));
    CHECK_FALSE(has(s, "centre (cold spot), exact"));
    CHECK_FALSE(has(s, "Biot"));
    CHECK_FALSE(has(s, "mass-average"));
    CHECK_FALSE(has(s, "Product and properties"));
    // the cautions of measured data, with every duty the walk over all verbs checks
    for (const char* p : {"engineering estimates", "heat-penetration", "temperature-distribution", "process authority",
                          "regulator", "local food codes"})
      CHECK_MESSAGE(has(s, p), p);
  }
  CHECK(has(html, "measured by the probe"));
  // polyglot markup: well-formed XML after the doctype (as html_test checks the sample report)
  REQUIRE(std::string(html).rfind("<!DOCTYPE html>\n", 0) == 0);
  CHECK(coldcore::testing::xml_problem(std::string(html).substr(16)) == "");  // the curve's legend in the temperature plot
  CHECK(has(html, "time since the first reading, 2026-11-30 06:00:00 UTC (min)"));
  CHECK(has(md, "The temperature the probe logged (log constant-70C.csv, 9 readings) against time"));

  const std::string text = text_of(r);
  CHECK(has(text, "Measured log\n  log: constant-70C.csv\n  lot: L-2026-11-30-A\n  columns: timestamp, probe_C\n"
                  "  readings: 9\n  first reading: 2026-11-30 06:00:00 UTC\n  last reading: 2026-11-30 06:04:00 UTC\n"));
  CHECK_FALSE(has(text, "conduction model"));
  const std::string json = json_of(r);
  for (const char* k : {"\"measured\": {", "\"log\": \"constant-70C.csv\"", "\"lot\": \"L-2026-11-30-A\"",
                        "\"readings\": 9", "\"start_unix_s\": 1796018400",
                        "\"first_reading_utc\": \"2026-11-30 06:00:00 UTC\""})
    CHECK_MESSAGE(has(json, k), k);
  CHECK(has(json, "\"measured_C\": 70"));
  const std::string csv = csv_of(r);
  CHECK(has(csv, "# lot: L-2026-11-30-A\n"));
  CHECK(has(csv, "# first reading: 2026-11-30 06:00:00 UTC\n"));
  CHECK(has(csv, "\ntime_s,measured_C,F_own_min\n0,70,0\n"));

  // without a lot the report says that none was given
  CHECK(has(text_of(probe_report(true, "")), "  lot: not given (--lot)\n"));
}
