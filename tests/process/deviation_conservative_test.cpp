// deviation --conservative: the worst case of the ranges beside the nominal deviation.
#include <doctest/doctest.h>

#include "coldcore/report/conservative_text.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "coldcore/error.hpp"
#include "coldcore/process/deviation_conservative.hpp"
#include "inverse_support.hpp"

using namespace coldcore;

namespace {

MediumProfile log_of(const std::vector<MediumPoint>& pts) {
  MediumProfile p;
  p.points = pts;
  p.description = "test log";
  return p;
}

// Invented: the 8 C dip of tests/reference/gen_fd_dip.py (96 -> 88 C for 6 min mid-cook).
const std::vector<MediumPoint> kDip = {{0, 96}, {420, 96}, {430, 88}, {790, 88}, {800, 96}, {960, 96}};

/// Invented tolerance ranges around the test sphere (38 mm, 4 C, cook h 120).
process::Ranges ranges() {
  process::Ranges r;
  r.diameter_m = std::array<double, 2>{0.036, 0.040};
  r.initial_C = std::array<double, 2>{2.0, 6.0};
  r.stage_h_W_m2K = {std::array<double, 2>{80.0, 160.0}, std::nullopt};
  return r;
}

process::DeviationInput dip_input(std::vector<MediumPoint> log) {
  process::DeviationInput in;
  in.scheduled = test::dip_sphere({test::f_target("P70 cook", 120.0, {"cook"})});
  in.stage = 0;
  in.medium_log = log_of(std::move(log));
  return in;
}

}  // namespace

TEST_CASE("deviation --conservative: worst-case delivered F below the nominal / extra hold at least as long") {
  const test::Libs libs;
  const auto in = dip_input(kDip);
  const auto nominal = process::evaluate_deviation(in, libs.get());
  const auto c = process::evaluate_deviation_conservative(in, ranges(), libs.get());
  REQUIRE(c.choices.size() == 3);
  // a larger sphere, lower h and colder start all slow heating (common practice): less lethality
  CHECK(c.result.targets[0].delivered_F_s < nominal.targets[0].delivered_F_s * 0.99);
  CHECK(c.result.targets[0].scheduled_F_s < nominal.targets[0].scheduled_F_s * 0.99);
  REQUIRE(nominal.extra_hold_s);
  REQUIRE(c.result.extra_hold_s);
  CHECK(*c.result.extra_hold_s >= *nominal.extra_hold_s);
  // the deviated stage heats: the coldest start (2 C) is the one taken
  CHECK(render_temperatures(range_setting_text(c.choices[2]), TempUnit::C) == "initial 2 °C (coldest, for heating)");
  CHECK(c.initial.reason == process::InitialChoiceReason::deviated_stage_heats);
  CHECK(initial_choice_text(c.initial).find("heats") != std::string::npos);
  // The worst case is the scenario with every choice applied by hand (independent of the choice code).
  auto by_hand = in;
  by_hand.scheduled.product.dims.diameter_m = 0.040;
  by_hand.scheduled.product.initial_C = 2.0;
  by_hand.scheduled.stages[0].h_W_m2K = 80.0;
  const auto hand = process::evaluate_deviation(by_hand, libs.get());
  CHECK(c.result.targets[0].delivered_F_s == doctest::Approx(hand.targets[0].delivered_F_s).epsilon(1e-9));
  // The driver is one of the choices, and needs the largest extra hold of them alone.
  REQUIRE(c.alone.size() == 3);
  double largest = -1;
  std::size_t largest_at = 0;
  for (std::size_t k = 0; k < c.alone.size(); ++k) {
    const auto& a = c.alone[k];
    REQUIRE(a.extra_hold_s);
    CHECK(*a.extra_hold_s <= *c.result.extra_hold_s);  // each alone needs no more than all together
    if (*a.extra_hold_s > largest) { largest = *a.extra_hold_s; largest_at = k; }
  }
  CHECK(c.driven_by == largest_at);
}

TEST_CASE("deviation --conservative: a log identical to the schedule reproduces the worst-case schedule") {
  const test::Libs libs;
  std::vector<MediumPoint> flat;
  for (double t = 0; t <= 960; t += 10) flat.push_back({t, 96});
  const auto c = process::evaluate_deviation_conservative(dip_input(flat), ranges(), libs.get());
  for (const auto& t : c.result.targets) {
    CHECK(t.delivered_F_s == doctest::Approx(t.scheduled_F_s).epsilon(1e-6));
    CHECK(t.verdict == t.scheduled.verdict);
  }
}

TEST_CASE("deviation --conservative: a deviated cooling stage with a cooling rule takes the warmest start") {
  process::DeviationInput in;
  Target rule;
  rule.kind = TargetKind::cooling_rule;
  rule.name = rule.rule = "two-stage-6h";
  in.scheduled = test::dip_sphere({rule});
  in.stage = 1;
  in.medium_log = log_of({{0, -2}, {3600, -2}});
  process::InitialChoice why;
  const auto ch = process::deviation_worst_case_choices(in, ranges(), &why);
  REQUIRE_FALSE(ch.empty());
  CHECK(render_temperatures(range_setting_text(ch.back().setting), TempUnit::C) ==
        "initial 6 °C (warmest, for chilling)");  // a warmer start cools later
  CHECK(why.reason == process::InitialChoiceReason::cools_with_rule);
  CHECK(initial_choice_text(why).find("cools and a cooling rule") != std::string::npos);
}

TEST_CASE("deviation --conservative: refused without a range that applies / or with a probe log only") {
  const test::Libs libs;
  CHECK_THROWS_WITH_AS(process::evaluate_deviation_conservative(dip_input(kDip), process::Ranges{}, libs.get()),
                       doctest::Contains("--conservative: the file gives no range that applies to the deviation"),
                       InputError);
  process::DeviationInput probe_only;
  probe_only.scheduled = test::dip_sphere({test::f_target("P70", 120.0)});
  probe_only.probe_time_s = {0, 60};
  probe_only.probe_temp_C = {4, 5};
  CHECK_THROWS_WITH_AS(process::evaluate_deviation_conservative(probe_only, ranges(), libs.get()),
                       doctest::Contains("needs --medium-log"), InputError);
}
