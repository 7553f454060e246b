// Root-finding wrapper on analytic margins whose roots are known in closed form.
#include <cmath>

#include <doctest/doctest.h>

#include "coldcore/error.hpp"
#include "coldcore/process/solve.hpp"

using coldcore::process::FeasibleSide;
using coldcore::process::RootOptions;
using coldcore::process::round_to_unit;
using coldcore::process::solve_margin;

TEST_CASE("solve_margin: increasing margin / root of log(x/3) is 3 (analytic)") {
  RootOptions o;
  o.rel_tol = 1e-10;
  const auto r = solve_margin([](double x) { return std::log(x / 3.0); }, 1.0, 10.0, FeasibleSide::above, o, "none");
  CHECK(r.x == doctest::Approx(3.0).epsilon(1e-9));
  CHECK(r.x >= 3.0 * (1 - 1e-15));  // the feasible side of the root
  CHECK(r.margin >= 0);
  CHECK(r.other_x <= r.x);
  CHECK_FALSE(r.met_at_bound);
}

TEST_CASE("solve_margin: decreasing margin (largest size) / root of 1 - x^2/4 is 2 (analytic)") {
  RootOptions o;
  const auto r = solve_margin([](double x) { return 1 - x * x / 4; }, 0.1, 5.0, FeasibleSide::below, o, "none");
  CHECK(r.x == doctest::Approx(2.0).epsilon(1e-6));
  CHECK(r.x <= 2.0);
  CHECK(r.margin >= 0);
}

TEST_CASE("solve_margin: bracket expansion finds a root far beyond the first guess") {
  RootOptions o;
  o.expand = true;
  o.limit = 1e6;
  // margin = x - 12345.6: the first hi (10) fails, doubling reaches it.
  const auto r = solve_margin([](double x) { return x - 12345.6; }, 0.0, 10.0, FeasibleSide::above, o, "none");
  CHECK(r.x == doctest::Approx(12345.6).epsilon(1e-9));
  CHECK(r.x >= 12345.6);
  // every trial before the last expansion was infeasible
  CHECK(r.trials.size() > 10);
}

TEST_CASE("solve_margin: met at the lower bound returns the bound / flagged") {
  const auto r = solve_margin([](double x) { return x + 1; }, 0.0, 10.0, FeasibleSide::above, {}, "none");
  CHECK(r.met_at_bound);
  CHECK(r.x == 0.0);
  CHECK(r.evaluations == 1);
}

TEST_CASE("solve_margin: no answer within the limit throws NoSolution with the reason") {
  RootOptions o;
  o.expand = true;
  o.limit = 100;
  // a margin that saturates below zero: like F accrued in a medium too cold to ever reach the target
  const auto sat = [](double x) { return -1.0 + 0.5 * (1 - std::exp(-x)); };
  CHECK_THROWS_WITH_AS(solve_margin(sat, 0.0, 1.0, FeasibleSide::above, o, "medium too cold"),
                       doctest::Contains("medium too cold (margin at the search bound 100: -0.5)"),
                       coldcore::NoSolution);
  CHECK_THROWS_AS(solve_margin([](double) { return -1.0; }, 0.0, 1.0, FeasibleSide::below, {}, "x"),
                  coldcore::NoSolution);
}

TEST_CASE("solve_margin: bad bracket and bad limit are input errors") {
  CHECK_THROWS_AS(solve_margin([](double x) { return x; }, 2.0, 1.0, FeasibleSide::above, {}, "x"),
                  coldcore::InputError);
  RootOptions o;
  o.expand = true;
  o.limit = 0.5;
  CHECK_THROWS_AS(solve_margin([](double x) { return x - 5; }, 0.0, 1.0, FeasibleSide::above, o, "x"),
                  coldcore::InputError);
}

TEST_CASE("solve_margin: a kinked margin (min of two targets) still brackets its root") {
  // min(x - 4, 2x - 9): the binding target changes at x = 5; root at 4.5 (analytic)
  const auto m = [](double x) { return std::min(x - 4, 2 * x - 9); };
  const auto r = solve_margin(m, 0.0, 20.0, FeasibleSide::above, {}, "x");
  CHECK(r.x == doctest::Approx(4.5).epsilon(1e-7));
  CHECK(m(r.x) >= 0);
}

TEST_CASE("round_to_unit: up for above / down for below / exact multiples kept") {
  CHECK(round_to_unit(61.0, 60, FeasibleSide::above) == 120);
  CHECK(round_to_unit(120.0, 60, FeasibleSide::above) == 120);
  CHECK(round_to_unit(120.0 + 1e-10, 60, FeasibleSide::above) == 120);  // binary noise
  CHECK(round_to_unit(119.0, 60, FeasibleSide::below) == 60);
  CHECK(round_to_unit(0.0427, 0.001, FeasibleSide::below) == doctest::Approx(0.042));
  CHECK_THROWS_AS(round_to_unit(1, 0, FeasibleSide::above), coldcore::InputError);
}
