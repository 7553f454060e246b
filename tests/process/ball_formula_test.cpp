// Ball formula method against the f_h/U : log g table of REFERENCES.md §4 (Table 38.6 of the
// cited chapter) and values worked by hand.
#include <doctest/doctest.h>

#include <array>
#include <cmath>

#include "coldcore/error.hpp"
#include "coldcore/process/ball_formula.hpp"

using namespace coldcore;
using namespace coldcore::process;

TEST_CASE("ball_log10_g: every table node is reproduced exactly (REFERENCES.md §4)") {
  const std::array<double, 9> fh_over_U = {0.5, 1, 2, 5, 10, 20, 50, 100, 200};
  const std::array<double, 9> log_g = {-1.29, -0.273, 0.298, 0.742, 0.955, 1.112, 1.27, 1.365, 1.447};
  for (std::size_t i = 0; i < fh_over_U.size(); ++i) {
    CAPTURE(fh_over_U[i]);
    const auto v = ball_log10_g(fh_over_U[i]);
    REQUIRE(v.has_value());
    CHECK(v->log10_g_F == log_g[i]);
    CHECK(v->error_log10_g == 0);
  }
}

TEST_CASE("ball_log10_g: between nodes / linear in log10(f_h/U) with a small non-zero error estimate") {
  // derived: f_h/U = √(10·20) lies half way between the nodes 10 and 20 in log10, so the linear
  // value is (0.955 + 1.112)/2 = 1.0335. The nodes 5, 10, 20 are equally spaced in log10 (step
  // log10 2), so the quadratic through them exceeds the chord at the midpoint by −Δ²/8 with
  // Δ² = 0.742 − 2·0.955 + 1.112 = −0.056: error 0.007.
  const auto mid = ball_log10_g(std::sqrt(200.0));
  REQUIRE(mid.has_value());
  CHECK(mid->log10_g_F == doctest::Approx(1.0335).epsilon(1e-12));
  CHECK(mid->error_log10_g == doctest::Approx(0.007).epsilon(1e-9));
  // Every interval: the estimate is > 0 and smaller than a quarter of the interval's change of
  // log g (derived bound: a quadratic's midpoint departure from its chord is h²|y''|/8).
  const std::array<double, 9> nodes = {0.5, 1, 2, 5, 10, 20, 50, 100, 200};
  for (std::size_t i = 0; i + 1 < nodes.size(); ++i) {
    const double x = std::sqrt(nodes[i] * nodes[i + 1]);
    CAPTURE(x);
    const auto v = ball_log10_g(x);
    const auto lo = ball_log10_g(nodes[i]), hi = ball_log10_g(nodes[i + 1]);
    REQUIRE(v.has_value());
    CHECK(v->error_log10_g > 0);
    CHECK(v->error_log10_g < 0.25 * std::abs(hi->log10_g_F - lo->log10_g_F));
    CHECK(v->log10_g_F == doctest::Approx((lo->log10_g_F + hi->log10_g_F) / 2).epsilon(1e-12));
  }
}

TEST_CASE("ball_log10_g: no value outside [0.5 / 200] (no extrapolation)") {
  CHECK_FALSE(ball_log10_g(0.49).has_value());
  CHECK_FALSE(ball_log10_g(200.5).has_value());
  CHECK_FALSE(ball_log10_g(std::nan("")).has_value());
}

TEST_CASE("ball_process_time: worked example (derived by hand)") {
  // f_h = 30 min, j_h = 1.4, T_R = 121.1 °C, T_I = 21.1 °C (I_h = 100 K = 180 °F), F = 3 min at
  // 121.1 °C, z = 10 °C: U = 180 s, f_h/U = 10 → log g = 0.955 (table node).
  // B = 1800·(log10(1.4·180) − 0.955) = 1800·(2.4014005 − 0.955) = 2603.52 s; come-up 10 min:
  // operator time = 2603.52 − 0.42·600 = 2351.52 s. g = 10^0.955 °F = 9.0157 °F = 5.0087 K.
  const BallResult r = ball_process_time(1800, 1.4, 121.1, 21.1, 180, 121.1, 10, 600);
  REQUIRE(r.in_table);
  CHECK(r.U_s == doctest::Approx(180));
  CHECK(r.fh_over_U == doctest::Approx(10));
  CHECK(r.log10_g_F == doctest::Approx(0.955));
  CHECK(r.g_K == doctest::Approx(5.0087).epsilon(1e-4));
  CHECK(r.B_s == doctest::Approx(2603.52).epsilon(1e-5));
  CHECK(r.operator_time_s == doctest::Approx(2351.52).epsilon(1e-5));
  CHECK(r.z_matches_table);
  // Units: with I_h and g both in kelvin the same B follows (a mix of K and °F would give
  // 1800·(log10 140 − 0.955) = 2143.9 s instead).
  CHECK(r.B_s == doctest::Approx(1800 * (std::log10(1.4 * 100) - std::log10(r.g_K))).epsilon(1e-12));
}

TEST_CASE("ball_process_time: U at a retort below the reference / z off the table / out of table") {
  // derived: U = 180·10^((121.1 − 115)/10) = 180·10^0.61 = 180·4.073803 = 733.28 s.
  const BallResult r = ball_process_time(3000, 1.4, 115, 21.1, 180, 121.1, 10, 0);
  CHECK(r.U_s == doctest::Approx(733.28).epsilon(1e-5));
  CHECK(r.in_table);
  CHECK(ball_process_time(3000, 1.4, 115, 21.1, 180, 121.1, 8, 0).z_matches_table == false);
  // f_h/U = 60/180 = 0.33 and 40000/180 = 222: outside the table.
  const BallResult low = ball_process_time(60, 1.4, 121.1, 21.1, 180, 121.1, 10, 0);
  CHECK_FALSE(low.in_table);
  CHECK(low.fh_over_U == doctest::Approx(1.0 / 3));
  CHECK(low.B_s == 0);
  CHECK_FALSE(ball_process_time(40000, 1.4, 121.1, 21.1, 180, 121.1, 10, 0).in_table);
}

TEST_CASE("ball_process_time: bad input names the value and the range") {
  CHECK_THROWS_WITH_AS(ball_process_time(1800, -1, 121.1, 21.1, 180, 121.1, 10, 0),
                       "ball_process_time: j_h = -1: must be > 0", InputError);
  CHECK_THROWS_WITH_AS(ball_process_time(1800, 1.4, 121.1, 130, 180, 121.1, 10, 0),
                       "ball_process_time: initial_C = 130: must be below retort_C", InputError);
  CHECK_THROWS_AS(ball_process_time(0, 1.4, 121.1, 21.1, 180, 121.1, 10, 0), InputError);
  CHECK_THROWS_AS(ball_process_time(1800, 1.4, 121.1, 21.1, 180, 121.1, 10, -5), InputError);
}
