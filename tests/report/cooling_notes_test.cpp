// The cooling check's notes are numbers (process/cooling.hpp); report words them, in the unit the
// report is written in. Limits: Food Code 3-501.14 two-stage rule, 57 -> 21 C in 2 h
// (REFERENCES 2.2); FSIS Appendix B option 2, chilling begun within 90 min (REFERENCES 2.3).
#include <doctest/doctest.h>

#include <string>
#include <vector>

#include "coldcore/process/cooling.hpp"
#include "coldcore/report/cooling_notes.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "support/libraries.hpp"

using namespace coldcore;

namespace {

CoolingCheck check(std::vector<double> minutes, std::vector<double> temps_C, const char* rule,
                   const CoolingContext& ctx = {}) {
  for (double& m : minutes) m *= 60;
  return check_cooling(minutes, temps_C, test::project_rules().at(rule, "test"), ctx);
}

}  // namespace

TEST_CASE("a re-heat above 57 C is worded in the report's unit with its time") {
  CoolingContext ctx;
  ctx.where = "probe";
  // 50 -> 60 C between 10 and 20 min: back above 57 C at 17 min (linear between readings).
  const CoolingCheck c = check({0, 10, 20, 60, 300}, {70, 50, 60, 21, 4}, "two-stage-6h", ctx);
  const std::vector<std::string> texts = cooling_note_texts(c);
  REQUIRE(texts.size() == 2);  // once per step of the rule: both clocks start at the first fall through 57 C
  // 57 C = 134.6 F (F = 1.8 C + 32); the step label shows whole degrees, as the rule tables do.
  CHECK(render_temperatures(texts[0], TempUnit::F) ==
        "135 °F -> 70 °F: probe rose above 134.6 °F again at 17 min 00 s; the clock was not restarted");
  CHECK(render_temperatures(texts[1], TempUnit::C) ==
        "57 °C -> 5 °C: probe rose above 57 °C again at 17 min 00 s; the clock was not restarted");
}

TEST_CASE("a record that ends above the step's start temperature says the clock never started") {
  const CoolingCheck c = check({0, 100}, {80, 70}, "two-stage-6h");
  const std::vector<std::string> texts = cooling_note_texts(c);
  REQUIRE_FALSE(texts.empty());
  CHECK(render_temperatures(texts[0], TempUnit::C) ==
        "57 °C -> 21 °C: cold spot is still above 57 °C at the end of the record: the step's clock never started");
}

TEST_CASE("the chill-start condition is worded with both durations") {
  CoolingContext ctx;
  ctx.cook_end_s = 0;
  ctx.chill_start_s = 100 * 60;  // 100 min after the cook; option 2 allows 90
  const CoolingCheck c =
      check({0, 20, 70, 370, 500}, {60, 48.9, 26.7, 12.8, 4.4}, "fsis-stabilization-option-2", ctx);
  REQUIRE_FALSE(c.notes.empty());
  CHECK(cooling_note_text(c.notes.back(), c) ==
        "chilling began 1 h 40 min 00 s after the cook; the rule requires within 1 h 30 min 00 s");
}
