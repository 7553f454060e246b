// Cooking-table targets in the assessment: FSIS Appendix A, 7-log column (REFERENCES 1.4,
// verbatim copy of the 1999 table): 140 °F (60.0 °C) must be held 12 min.
#include <doctest/doctest.h>

#include "coldcore/io/libraries.hpp"
#include "coldcore/error.hpp"
#include "coldcore/process/assessment.hpp"
#include "lethality/lethality_support.hpp"

using namespace coldcore;

namespace {

struct Libraries {
  OrganismLibrary organisms = io::parse_organisms(test::read_source_file("products/organisms.toml"), "organisms.toml");
  RuleLibrary rules = io::parse_cooling_rules(test::read_source_file("products/cooling-rules.toml"), "cooling-rules.toml");
  CookingTables tables = io::parse_cooking_tables(test::read_source_file("products/cooking-tables.toml"), "cooking-tables.toml");
};

const Libraries& libs() {
  static const Libraries l;
  return l;
}

// Centre held at 140 °F (exactly 60 °C) for `hold_s`, with fast ramps from and back to 20 °C.
History hold_140F(double hold_s) {
  auto temp = [hold_s](double t) {
    if (t < 1) return 20.0 + 40.0 * t;
    if (t < 1 + hold_s) return 60.0;
    if (t < 2 + hold_s) return 60.0 - 40.0 * (t - 1 - hold_s);
    return 20.0;
  };
  return test::analytic_history(temp, {{"hold", hold_s + 60}}, 1.0);
}

Target table_target() {
  Target t;
  t.kind = TargetKind::cooking_table;
  t.table = "fsis-appendix-a-7-log";
  t.name = "appendix-a";
  return t;
}

}  // namespace

TEST_CASE("cooking-table target: 12.5 min at 140 F meets the 12 min row / 11.5 min does not") {
  AssessOptions opts;
  opts.cooking_tables = &libs().tables;
  const Assessment ok = assess(hold_140F(12.5 * 60), {table_target()}, libs().organisms, libs().rules, opts);
  REQUIRE(ok.targets.size() == 1);
  CHECK(ok.targets[0].verdict == Verdict::met);
  CHECK(ok.targets[0].achieved > 1.0);
  const Assessment short_hold = assess(hold_140F(11.5 * 60), {table_target()}, libs().organisms, libs().rules, opts);
  CHECK(short_hold.targets[0].verdict == Verdict::not_demonstrated);
  CHECK(short_hold.targets[0].achieved < 1.0);
}

TEST_CASE("cooking-table target without the tables loaded is refused") {
  CHECK_THROWS_AS(assess(hold_140F(600), {table_target()}, libs().organisms, libs().rules, {}), InputError);
}
