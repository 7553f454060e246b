// Issue 16: cooling-rule limits shown as the rule writes them. The US FDA Food Code 2022,
// 3-501.14, writes its two-stage limits in both units: 57°C (135°F) to 21°C (70°F) within 2 h and
// to 5°C (41°F) within 6 h. A °F report must show 135 / 70 / 41 °F (not 134.6 / 69.8, which 57 and
// 21 °C convert to), a °C report 57 / 21 / 5 °C; the values computed with stay the °C ones.
#include <doctest/doctest.h>

#include <string>

#include "coldcore/io/libraries.hpp"
#include "coldcore/error.hpp"
#include "coldcore/process/cooling.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "lethality/lethality_support.hpp"

using namespace coldcore;

TEST_CASE("issue 16: the Food Code rule shows its limits as written / in either unit") {
  const RuleLibrary lib = io::parse_cooling_rules(test::read_source_file("products/cooling-rules.toml"), "r.toml");
  const CoolingRule& rule = lib.at("two-stage-6h", "test");
  REQUIRE(rule.steps.size() == 2);
  const CoolingStep& s1 = rule.steps[0];
  const CoolingStep& s2 = rule.steps[1];
  CHECK(render_temperatures(s1.label, TempUnit::F) == "135 °F -> 70 °F");
  CHECK(render_temperatures(s2.label, TempUnit::F) == "135 °F -> 41 °F");
  CHECK(render_temperatures(s1.label, TempUnit::C) == "57 °C -> 21 °C");
  CHECK(render_temperatures(s2.label, TempUnit::C) == "57 °C -> 5 °C");
  // computed with the °C values the code states
  CHECK(s1.from_C == 57);
  CHECK(s1.to_C == 21);
  CHECK(s2.to_C == 5);
  REQUIRE(s1.from_written_F);
  CHECK(*s1.from_written_F == 135);
}

TEST_CASE("issue 16: a limit written in both units must be one limit") {
  const std::string head =
      "schema = 1\n[[rule]]\nkey = \"k\"\nname = \"n\"\nsource = \"s\"\nstatus = \"confirmed\"\n"
      "[[rule.step]]\nto_C = 5\nwithin_h = 4\nsource = \"s\"\nstatus = \"confirmed\"\n";
  // 57 °C is 134.6 °F: within the 0.5 °C such codes round to.
  CHECK_NOTHROW(io::parse_cooling_rules(head + "from_C = 57\nfrom_F = 135\n", "r.toml"));
  // 135 °F written beside 75 °C is a typo, not a rounding.
  CHECK_THROWS_WITH_AS(io::parse_cooling_rules(head + "from_C = 75\nfrom_F = 135\n", "r.toml"),
                       "r.toml: rule[1].step[1]: from_C = 75 and from_F = 135 (57.22222222 C) disagree: the two must be "
                       "the same limit within 0.5 C",
                       InputError);
  CHECK_THROWS_WITH_AS(io::parse_cooling_rules(head, "r.toml"),
                       "r.toml: rule[1].step[1]: give from_C, from_F, or both as the rule's source writes them",
                       InputError);
}
