// Deviations: identity, an invented dip against an independent finite-volume reference, extra hold.
#include <cmath>

#include <doctest/doctest.h>

#include "../support/csv_table.hpp"
#include "coldcore/process/deviation.hpp"
#include "inverse_support.hpp"

using namespace coldcore;

namespace {

MediumProfile log_of(const std::vector<MediumPoint>& pts) {
  MediumProfile p;
  p.points = pts;
  p.description = "test log";
  return p;
}

// The dip of gen_fd_dip.py: 96 -> 88 C over 420-430 s, 88 C to 790 s, back to 96 C at 800 s.
const std::vector<MediumPoint> kDip = {{0, 96}, {420, 96}, {430, 88}, {790, 88}, {800, 96}, {960, 96}};

/// kDip gives only the corners of the dip (the finite-volume reference's medium), not a logger's
/// readings: its long linear pieces are known, not gaps.
process::DeviationOptions corners_only() {
  process::DeviationOptions o;
  o.max_gap_s = 1e9;
  return o;
}

}  // namespace

TEST_CASE("deviation: a logged medium identical to the schedule reproduces the scheduled result to 1e-6") {
  const test::Libs libs;
  process::DeviationInput in;
  in.scheduled = test::dip_sphere({test::f_target("P70", 120.0, {"cook"}), test::f_target("all", 120.0)});
  in.stage = 0;
  std::vector<MediumPoint> flat;
  for (double t = 0; t <= 960; t += 10) flat.push_back({t, 96});  // a logger every 10 s
  in.medium_log = log_of(flat);
  const auto r = process::evaluate_deviation(in, libs.get());
  for (const auto& t : r.targets) {
    CHECK(t.delivered_F_s == doctest::Approx(t.scheduled_F_s).epsilon(1e-6));
    CHECK(t.verdict == t.scheduled.verdict);
  }
  CHECK(r.events.empty());
  REQUIRE(r.extra_hold_s);
  CHECK(*r.extra_hold_s == 0.0);
}

TEST_CASE("deviation: invented 8 C dip for 6 min mid-cook, F within 0.5 % of the finite-volume reference") {
  // tests/reference/fd_dip.csv from gen_fd_dip.py (independent finite volumes, Richardson-extrapolated)
  const auto rows = test::read_csv("tests/reference/fd_dip.csv");
  const auto find = [&](const std::string& c) {
    for (const auto& r : rows)
      if (r.text("case") == c) return r;
    FAIL("no row " << c);
    return rows.front();
  };
  const test::Libs libs;
  process::DeviationInput in;
  in.scheduled = test::dip_sphere({test::f_target("cook-only", 60.0, {"cook"}), test::f_target("whole", 60.0)});
  in.stage = 0;
  in.medium_log = log_of(kDip);
  const auto r = process::evaluate_deviation(in, libs.get(), corners_only());
  const auto sched = find("scheduled"), del = find("delivered");
  CHECK(r.targets[0].scheduled_F_s == doctest::Approx(sched.num("F_cook_s")).epsilon(0.005));
  CHECK(r.targets[0].delivered_F_s == doctest::Approx(del.num("F_cook_s")).epsilon(0.005));
  CHECK(r.targets[1].scheduled_F_s == doctest::Approx(sched.num("F_total_s")).epsilon(0.005));
  CHECK(r.targets[1].delivered_F_s == doctest::Approx(del.num("F_total_s")).epsilon(0.005));
  // the event: first and last readings more than 0.5 K below the schedule, lowest 88 C
  REQUIRE(r.events.size() == 1);
  CHECK(r.events[0].kind == process::DeviationKind::medium_colder);
  CHECK(r.events[0].start_s == 430.0);
  CHECK(r.events[0].end_s == 790.0);
  CHECK(r.events[0].extreme_C == 88.0);
}

TEST_CASE("deviation: extra hold at the scheduled medium restores the target; one unit less does not") {
  const test::Libs libs;
  // 15 min of F70 in the cook: the schedule (about 22.9 min, fd_dip.csv) meets it, the dip (8.2 min) does not.
  process::DeviationInput in;
  in.scheduled = test::dip_sphere({test::f_target("P70-15", 900.0, {"cook"})});
  in.stage = 0;
  in.medium_log = log_of(kDip);
  const auto r = process::evaluate_deviation(in, libs.get(), corners_only());
  CHECK(r.scheduled.all_met);
  CHECK_FALSE(r.all_met_delivered);
  CHECK(r.targets[0].verdict == Verdict::not_demonstrated);
  REQUIRE(r.extra_hold_s);
  CHECK(*r.extra_hold_s > 0);
  CHECK(std::fmod(*r.extra_hold_s, 60.0) == 0.0);
  CHECK(*r.extra_hold_s >= *r.extra_hold_unrounded_s);
  CHECK(r.extension_medium_C == 96.0);
  REQUIRE(r.restored);
  CHECK(r.restored->eval.all_met);
  REQUIRE(r.restored_one_unit_less);
  CHECK_FALSE(r.restored_one_unit_less->eval.all_met);
}
