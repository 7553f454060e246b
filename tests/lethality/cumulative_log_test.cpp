// Cumulative trapezoid F on a log: its last value is the trapezoid F, and a hold at the
// reference temperature accrues F equal to the elapsed time (Bigelow definition).
#include <doctest/doctest.h>

#include <vector>

#include "coldcore/lethality/integrate.hpp"

TEST_CASE("cumulative trapezoid F ends at the trapezoid F and equals time at Tref") {
  coldcore::Kinetics k;
  k.reference_C = 70;
  k.z_C = 7.5;
  const std::vector<double> t = {0, 30, 60, 90, 120, 180};
  const std::vector<double> hold = {70, 70, 70, 70, 70, 70};
  const auto c = coldcore::cumulative_f_trapezoid_s(t, hold, k);
  REQUIRE(c.size() == t.size());
  for (size_t i = 0; i < t.size(); ++i) CHECK(c[i] == doctest::Approx(t[i]).epsilon(1e-14));
  const std::vector<double> ramp = {60, 64, 68, 72, 76, 80};
  const auto r = coldcore::cumulative_f_trapezoid_s(t, ramp, k);
  CHECK(r.back() == doctest::Approx(coldcore::f_trapezoid_s(t, ramp, k).F_s).epsilon(1e-14));
  for (size_t i = 1; i < r.size(); ++i) CHECK(r[i] > r[i - 1]);
}
