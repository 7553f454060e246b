// h ranges taken per target (process/h_ends.hpp): lethality on the high end of a credited cooling
// stage, the cooling rule on the low end, each equal to an explicit run at that h.
#include <doctest/doctest.h>

#include "coldcore/process/conservative.hpp"
#include "coldcore/process/h_ends.hpp"
#include "coldcore/process/inverse.hpp"
#include "coldcore/report/conservative_text.hpp"
#include "coldcore/report/h_choice_text.hpp"
#include "inverse_support.hpp"

using namespace coldcore;

namespace {

Target rule_target() {
  Target t;
  t.kind = TargetKind::cooling_rule;
  t.name = "two-stage-6h";
  t.rule = "two-stage-6h";  // FDA Food Code 3-501.14 in products/cooling-rules.toml
  return t;
}

/// The invented sphere of inverse_support.hpp with a 4 h chill whose h is a range 20-60 W/m2K
/// (blast-chill in products/media.toml), an F target crediting every stage (the chill included)
/// and a cooling rule.
process::Scenario split_sphere() {
  auto s = test::dip_sphere({test::f_target("P70 all stages", 120.0), rule_target()});
  s.stages[1].end.duration_s = 4 * 3600.0;
  s.per_target_h = {std::nullopt, process::StageHRange{20.0, 60.0, "test range"}};
  return s;
}

process::Scenario explicit_h(process::Scenario s, double chill_h) {
  s.per_target_h.clear();
  s.stages[1].h_W_m2K = chill_h;
  return s;
}

}  // namespace

TEST_CASE("h ends: stage direction from the schedule alone") {
  const auto s = split_sphere();
  CHECK(process::heating_stage(s, 0));        // 96 C medium above the 4 C start
  CHECK_FALSE(process::heating_stage(s, 1));  // -2 C medium below the cook's 96 C
}

TEST_CASE("h ends: a credited cooling stage splits lethality (high h) from the cooling rule (low h)") {
  const test::Libs libs;
  const auto s = split_sphere();
  const auto groups = process::group_targets_by_h(s);
  REQUIRE(groups.size() == 2);
  REQUIRE(groups[0].choices.size() == 1);
  CHECK(groups[0].targets == std::vector<int>{0});
  // common practice: a higher h cools faster, so less lethality accrues in a cooling stage
  CHECK(groups[0].choices[0].end == process::HEnd::high);
  CHECK(groups[0].choices[0].h_W_m2K == 60.0);
  // common practice: a lower h cools slower, the conservative side of a cooling rule
  CHECK(groups[1].targets == std::vector<int>{1});
  CHECK(groups[1].choices[0].end == process::HEnd::low);

  const auto e = process::evaluate(s, libs.get());
  REQUIRE(e.h_scenarios.size() == 2);
  const auto hi = process::evaluate(explicit_h(s, 60.0), libs.get());
  const auto lo = process::evaluate(explicit_h(s, 20.0), libs.get());
  const auto& f = e.assessment.targets[0];
  const auto& rule = e.assessment.targets[1];
  // F equals a run with h_W_m2K = 60 given explicitly (same engine, same inputs: to 1e-12)
  CHECK(f.F_s == doctest::Approx(hi.assessment.targets[0].F_s).epsilon(1e-12));
  // ... and is below the low-end F: the chill's high h lets less lethality accrue (strictly)
  CHECK(f.F_s < lo.assessment.targets[0].F_s * (1 - 1e-4));
  // the cooling rule equals the explicit low-end run, and differs from the high-end one
  CHECK(rule.achieved == doctest::Approx(lo.assessment.targets[1].achieved).epsilon(1e-12));
  CHECK(rule.achieved > hi.assessment.targets[1].achieved);  // slower cooling takes longer
  CHECK(rule.verdict == lo.assessment.targets[1].verdict);
  // Which h was used and why is said per target and overall.
  bool said = false;
  for (const auto& n : f.notes)
    said = said || (n.kind == TargetNoteKind::h_used && n.h_choice.end == process::HEnd::high &&
                    n.h_choice.h_W_m2K == 60 && n.h_choice.low_W_m2K == 20 && n.h_choice.high_W_m2K == 60 &&
                    n.h_choice.why == process::HReason::cooling_credited_faster);
  CHECK(said);
  REQUIRE(e.h_uses.size() == 2);
  CHECK(h_use_text(e.h_uses[0]).find("h 60 W/m2K, the high end of 20-60") != std::string::npos);
  std::vector<process::ProcessNote> notes;
  process::add_h_notes(e, notes);
  CHECK(notes.front().kind == process::ProcessNoteKind::h_scenarios);
  CHECK(notes.front().count == 2);
}

TEST_CASE("h ends: when the lethality target credits the cook only / one scenario at the low end serves all") {
  const test::Libs libs;
  auto s = split_sphere();
  s.targets[0].stages = {"cook"};  // the chill's h cannot change what this target credits
  const auto groups = process::group_targets_by_h(s);
  REQUIRE(groups.size() == 1);
  CHECK(groups[0].choices[0].end == process::HEnd::low);
  const auto e = process::evaluate(s, libs.get());
  CHECK(e.h_scenarios.empty());
  const auto lo = process::evaluate(explicit_h(s, 20.0), libs.get());
  CHECK(e.assessment.targets[0].F_s == doctest::Approx(lo.assessment.targets[0].F_s).epsilon(1e-12));
  CHECK(e.assessment.targets[1].achieved == doctest::Approx(lo.assessment.targets[1].achieved).epsilon(1e-12));
}

TEST_CASE("h ends: a range on a heating stage takes the low end for every target") {
  auto s = split_sphere();
  s.per_target_h = {process::StageHRange{80.0, 160.0, "oven"}, std::nullopt};
  const auto groups = process::group_targets_by_h(s);
  REQUIRE(groups.size() == 1);  // common practice: slower heating is conservative for lethality
  CHECK(groups[0].choices[0].h_W_m2K == 80.0);
}

TEST_CASE("h ends: solve hold-time over two scenarios needs the high-end chill's lethality") {
  const test::Libs libs;
  const auto s = split_sphere();
  // F credited in every stage: at the high end the chill adds less, so a longer cook is needed
  // than with the low end given explicitly (and the same as the high end given explicitly).
  const auto split = process::solve(process::Question::hold_time, s, libs.get());
  const auto hi = process::solve(process::Question::hold_time, explicit_h(s, 60.0), libs.get());
  const auto lo = process::solve(process::Question::hold_time, explicit_h(s, 20.0), libs.get());
  CHECK(split.rounded == hi.rounded);
  CHECK(split.answer == doctest::Approx(hi.answer).epsilon(1e-5));
  CHECK(split.answer > lo.answer);
  bool said = false;
  for (const auto& n : split.notes) said = said || n.kind == process::ProcessNoteKind::h_scenarios;
  CHECK(said);
}

TEST_CASE("h ends: a minimum-temperature target joins the lethality side in a cooling stage") {
  auto s = split_sphere();
  Target hold;
  hold.kind = TargetKind::centre_min_temperature;
  hold.name = "70 C for 2 min";  // UK chilled-food benchmark temperature (REFERENCES 1.3), as a hold
  hold.min_temp_C = 70;
  hold.hold_s = 120;
  s.targets.push_back(hold);
  const auto groups = process::group_targets_by_h(s);
  REQUIRE(groups.size() == 2);
  // faster cooling shortens the time at or above the temperature: the high end (common practice)
  CHECK(groups[0].targets == std::vector<int>{0, 2});
  CHECK(groups[0].choices[0].end == process::HEnd::high);
  CHECK(groups[1].targets == std::vector<int>{1});
}

TEST_CASE("solve --conservative: an h_range on a credited chill is taken at its high end for lethality") {
  const test::Libs libs;
  auto s = test::dip_sphere({test::f_target("P70 all stages", 120.0)});
  process::Ranges r;
  r.stage_h_W_m2K = {std::nullopt, std::array<double, 2>{20.0, 60.0}};
  const auto c = process::solve_conservative(process::Question::hold_time, s, r, libs.get());
  REQUIRE(c.choices.size() == 1);
  CHECK(c.choices[0].factor == process::RangeFactor::stage_h);
  CHECK(c.choices[0].per_target);  // at the conservative end per target
  CHECK(range_setting_text(c.choices[0]).find("at the conservative end per target") != std::string::npos);
  REQUIRE(c.result);
  // common practice: the high h cools faster, less lethality in the credited chill: a longer cook
  auto hi = s;
  hi.stages[1].h_W_m2K = 60.0;
  const auto explicit_hi = process::solve(process::Question::hold_time, hi, libs.get());
  CHECK(c.result->rounded == explicit_hi.rounded);
  CHECK(c.result->answer == doctest::Approx(explicit_hi.answer).epsilon(1e-5));
  const auto nominal = process::solve(process::Question::hold_time, s, libs.get());  // chill h 30
  CHECK(c.result->answer > nominal.answer);
}
