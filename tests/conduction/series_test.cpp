// Step response from the exact series, checked against outside references.
#include "coldcore/conduction/series.hpp"

#include <doctest/doctest.h>

#include <cmath>
#include <string>

#include "coldcore/conduction/modes.hpp"
#include "coldcore/error.hpp"
#include "support/csv_table.hpp"

using namespace coldcore;
using coldcore::test::read_csv;

namespace {

Geometry geometry_of(const std::string& s) {
  if (s == "slab") return Geometry::slab;
  if (s == "cylinder") return Geometry::cylinder;
  REQUIRE(s == "sphere");
  return Geometry::sphere;
}

const Geometry kAll[] = {Geometry::slab, Geometry::cylinder, Geometry::sphere};

double centre(Geometry g, double bi, double fo) { return step_response(g, bi, fo, 0.0).theta; }

}  // namespace

TEST_CASE("series: centre / r/R = 0.5 / surface and mean match the mpmath sums to 1e-8") {
  // Source: tests/reference/series.csv from tests/reference/gen_series.py (mpmath, 45 digits),
  // Fo = 1e-4 … 2, Bi = 0.1 … 200 and ∞, all three geometries.
  const auto rows = read_csv("tests/reference/series.csv");
  CHECK(rows.size() == 3 * 5 * 9 * 4);
  double worst = 0, worst_bound_ratio = 0;
  std::string where;
  int bound_violations = 0;
  for (const auto& r : rows) {
    const Geometry g = geometry_of(r.text("geometry"));
    const double bi = r.num("biot"), fo = r.num("fourier");
    const bool mean = r.text("x") == "mean";
    const StepResponse s = mean ? mean_step_response(g, bi, fo) : step_response(g, bi, fo, r.num("x"));
    const double err = std::abs(s.theta - r.num("theta"));
    if (err > s.error_bound) ++bound_violations;  // the reported bound must hold
    if (s.error_bound > 1e-9) ++bound_violations;
    if (!(err <= worst)) {
      worst = err;
      where = r.text("geometry") + " Bi=" + r.text("biot") + " Fo=" + r.text("fourier") + " x=" + r.text("x");
    }
    worst_bound_ratio = std::max(worst_bound_ratio, s.error_bound);
    CHECK(s.method == SeriesMethod::series);
  }
  MESSAGE("worst |theta - mpmath| = " << worst << " at " << where << "; largest reported bound " << worst_bound_ratio);
  CHECK(worst <= 1e-8);
  CHECK(bound_violations == 0);
}

TEST_CASE("series: REFERENCES §3.4 exact-series centre values and §7 items 5-6") {
  // Source: REFERENCES.md §3.4 ([D], 6 decimals) — abs 1e-6 (§7 item 5 tolerance).
  CHECK(std::abs(centre(Geometry::slab, kInfiniteBiot, 0.2) - 0.772312) <= 1e-6);
  CHECK(std::abs(centre(Geometry::slab, kInfiniteBiot, 0.1) - 0.949305) <= 1e-6);
  CHECK(std::abs(centre(Geometry::slab, 1, 0.2) - 0.950642) <= 1e-6);
  CHECK(std::abs(centre(Geometry::cylinder, kInfiniteBiot, 0.2) - 0.501487) <= 1e-6);
  CHECK(std::abs(centre(Geometry::cylinder, 10, 0.5) - 0.145800) <= 1e-6);
  CHECK(std::abs(centre(Geometry::sphere, kInfiniteBiot, 0.2) - 0.277078) <= 1e-6);
  CHECK(std::abs(centre(Geometry::sphere, kInfiniteBiot, 0.5) - 0.014384) <= 1e-6);
  CHECK(std::abs(centre(Geometry::sphere, 10, 0.05) - 0.982564) <= 1e-6);
  CHECK(std::abs(centre(Geometry::sphere, 0.1, 1.0) - 0.767431) <= 1e-6);
  CHECK(std::abs(step_response(Geometry::sphere, kInfiniteBiot, 0.2, 0.5).theta - 0.176867) <= 1e-6);
  // One-term column of §3.4.
  CHECK(std::abs(one_term_theta(Geometry::slab, kInfiniteBiot, 0.1, 0) - 0.994838) <= 1e-6);
  CHECK(std::abs(one_term_theta(Geometry::sphere, 10, 0.05, 0) - 1.287431) <= 1e-6);
  // §7 item 6: sphere(Bi = 1) centre = slab(Bi = ∞) centre (same eigenvalues and coefficients).
  const double fo[] = {0.1, 0.2, 0.3};
  const double want[] = {0.949305, 0.772312, 0.606804};
  for (int i = 0; i < 3; ++i) {
    const double a = centre(Geometry::sphere, 1.0, fo[i]);
    const double b = centre(Geometry::slab, kInfiniteBiot, fo[i]);
    CHECK(a == doctest::Approx(b).epsilon(1e-9));
    CHECK(std::abs(a - want[i]) <= 1e-6);
  }
}

TEST_CASE("series: finite cylinder product rule and lag factors (REFERENCES §7 items 8-9)") {
  // §7 item 8 [D]: R = 0.0375 m, half-height 0.05 m, α = 1.4e-7 m²/s, Bi = ∞, t = 1800 s.
  const double fo_r = 1.4e-7 * 1800 / (0.0375 * 0.0375), fo_h = 1.4e-7 * 1800 / (0.05 * 0.05);
  CHECK(std::abs(fo_r - 0.1792) <= 1e-4);
  CHECK(std::abs(fo_h - 0.1008) <= 1e-4);
  CHECK(std::abs(centre(Geometry::cylinder, kInfiniteBiot, fo_r) - 0.563772) <= 1e-5);
  CHECK(std::abs(centre(Geometry::slab, kInfiniteBiot, fo_h) - 0.948129) <= 1e-5);
  const StepResponse p = finite_cylinder_step_response(kInfiniteBiot, fo_r, 0, kInfiniteBiot, fo_h, 0);
  CHECK(std::abs(p.theta - 0.534528) <= 1e-5);
  CHECK(p.error_bound <= 1e-9);
  // The same case in dimensional form (k arbitrary at Bi = ∞ is not possible: use a huge h).
  const StepResponse d = finite_cylinder_point_theta(0.075, 0.10, 1e12, 0.5, 1.4e-7, 1800, 0.0, 0.0);
  CHECK(std::abs(d.theta - 0.534528) <= 1e-5);
  const StepResponse dm = finite_cylinder_mean_theta(0.075, 0.10, 1e12, 0.5, 1.4e-7, 1800);
  CHECK(dm.theta < d.theta);
  CHECK_THROWS_AS(finite_cylinder_point_theta(0.075, 0.10, 20, 0.5, 1.4e-7, 1800, 0.05, 0.0), InputError);
  // A cube of side 0.04 m at its centre equals the cube of the slab (half-thickness 0.02 m).
  const double bs = 20 * 0.02 / 0.5, fs = 1.4e-7 * 900 / (0.02 * 0.02);
  const double sl = step_response(Geometry::slab, bs, fs, 0.5).theta;
  CHECK(brick_point_theta({0.04, 0.04, 0.04}, 20, 0.5, 1.4e-7, 900, {0.01, -0.01, 0.01}).theta ==
        doctest::Approx(sl * sl * sl).epsilon(1e-9));
  const double slm = mean_step_response(Geometry::slab, bs, fs).theta;
  CHECK(brick_mean_theta({0.04, 0.04, 0.04}, 20, 0.5, 1.4e-7, 900).theta == doctest::Approx(slm * slm * slm).epsilon(1e-9));
  // §7 item 9: long-time lag factors C1 at Bi = ∞; finite cylinder = cylinder × slab = 2.03970.
  auto c1 = [](Geometry g) { return centre_coefficient(g, kInfiniteBiot, eigenvalue(g, kInfiniteBiot, 1)); };
  CHECK(std::abs(c1(Geometry::slab) - 1.27324) <= 1e-5);
  CHECK(std::abs(c1(Geometry::cylinder) - 1.60197) <= 1e-5);
  CHECK(std::abs(c1(Geometry::sphere) - 2.00000) <= 1e-5);
  CHECK(std::abs(c1(Geometry::cylinder) * c1(Geometry::slab) - 2.03970) <= 1e-5);
  // The long-time series approaches the lag factor times the first exponential.
  const double z = eigenvalue(Geometry::sphere, kInfiniteBiot, 1);
  CHECK(centre(Geometry::sphere, kInfiniteBiot, 2.0) / std::exp(-z * z * 2.0) == doctest::Approx(2.0).epsilon(1e-12));
}

TEST_CASE("series: one-term approximation within 2 % for Fo > 0.2 / useless at sphere Bi = 10 / Fo = 0.05") {
  // Handbook statement (Çengel, "within 2 percent" for Fo > 0.2; REFERENCES.md §3.2 and §7 item 7).
  double worst = 0;
  for (Geometry g : kAll)
    for (double bi : {0.1, 1.0, 10.0, kInfiniteBiot})
      for (double fo : {0.2, 0.25, 0.3, 0.5, 1.0, 2.0}) {
        const double exact = centre(g, bi, fo);
        const double rel = std::abs(one_term_theta(g, bi, fo, 0) - exact) / exact;
        worst = std::max(worst, rel);
        CHECK(rel <= 0.02);
      }
  MESSAGE("worst one-term error for Fo >= 0.2: " << worst);
  CHECK(worst == doctest::Approx(0.0153).epsilon(0.02));  // §3.2: max 1.53 % (slab, Bi = 1, Fo = 0.2)
  const double exact = centre(Geometry::sphere, 10, 0.05);
  CHECK(std::abs(one_term_theta(Geometry::sphere, 10, 0.05, 0) - exact) / exact > 0.25);
}

TEST_CASE("series: Bi -> 0 approaches exp(-m Bi Fo) / m = 1 / 2 / 3") {
  // Lumped limit (Incropera §5.1/§5.6): ζ1² → (m)·Bi with m = 1, 2, 3 for slab, cylinder, sphere.
  const double m[] = {1, 2, 3};
  for (int i = 0; i < 3; ++i) {
    const Geometry g = kAll[i];
    double prev = 1;
    for (double bi : {1e-2, 1e-3, 1e-4, 1e-5}) {
      const double fo = 0.5 / bi;  // exp(−m/2): well away from 0 and 1
      const double lumped = std::exp(-m[i] * bi * fo);
      const double dc = std::abs(centre(g, bi, fo) / lumped - 1);
      const double dm = std::abs(mean_step_response(g, bi, fo).theta / lumped - 1);
      CAPTURE(bi);
      CHECK(dc <= 2 * bi);
      CHECK(dm <= 2 * bi);
      CHECK(dc < prev);
      prev = dc;
    }
  }
}

TEST_CASE("series: a long finite cylinder is the infinite cylinder - a brick with two long sides is the slab") {
  // Newman product rule consistency (Incropera §5.8).
  const double bi_r = 3.0, fo_r = 0.15;
  for (double ratio : {50.0, 200.0}) {  // half-length = ratio × R
    const double bi_h = bi_r * ratio, fo_h = fo_r / (ratio * ratio);
    for (double r : {0.0, 0.5, 1.0}) {
      const StepResponse fc = finite_cylinder_step_response(bi_r, fo_r, r, bi_h, fo_h, 0.0);
      CHECK(std::abs(fc.theta - step_response(Geometry::cylinder, bi_r, fo_r, r).theta) <= 1e-9);
    }
    const StepResponse fm = finite_cylinder_mean_step_response(bi_r, fo_r, bi_h, fo_h);
    // The mean includes the end layers: differs by O(√Fo_H) = O(1/ratio).
    CHECK(std::abs(fm.theta - mean_step_response(Geometry::cylinder, bi_r, fo_r).theta) <= 2.0 / ratio);
  }
  const double bi = 0.8, fo = 0.3;
  const StepResponse b = brick_step_response({bi, bi * 100, bi * 100}, {fo, fo / 1e4, fo / 1e4}, {0.4, 0, 0});
  CHECK(std::abs(b.theta - step_response(Geometry::slab, bi, fo, 0.4).theta) <= 1e-9);
  // A cube: the product of three equal slabs.
  const double s = step_response(Geometry::slab, bi, fo, 0).theta;
  CHECK(brick_step_response({bi, bi, bi}, {fo, fo, fo}, {0, 0, 0}).theta == doctest::Approx(s * s * s).epsilon(1e-9));
  const double sm = mean_step_response(Geometry::slab, bi, fo).theta;
  CHECK(brick_mean_step_response({bi, bi, bi}, {fo, fo, fo}).theta == doctest::Approx(sm * sm * sm).epsilon(1e-9));
}

TEST_CASE("series: the term count follows the tail bound and the bound holds") {
  // The cylinder coefficient bound |C_n| <= 2.6/√ζ_n stated in series.hpp, n <= 4000.
  int bad = 0;
  for (double bi : {1e-6, 0.01, 0.3, 1.0, 3.0, 30.0, 1e3, 1e6, kInfiniteBiot})
    for (const Mode& m : modes(Geometry::cylinder, bi, 4000))
      if (m.n >= 2 && std::abs(m.coefficient) * std::sqrt(m.zeta) > 2.6) ++bad;
  CHECK(bad == 0);
  // The actual remainder after N terms is below the bound (here with 4000 modes as "all").
  for (Geometry g : kAll)
    for (double bi : {0.5, 20.0, kInfiniteBiot})
      for (double fo : {1e-5, 1e-3, 0.05})
        for (double x : {0.0, 0.7, 1.0, -1.0}) {
          const auto m = modes(g, bi, 4000);
          const int n = series_terms_needed(g, fo, x, 1e-10, 4000);
          REQUIRE(n > 0);
          double rest = 0;
          for (std::size_t i = static_cast<std::size_t>(n); i < m.size(); ++i) {
            const double c = x < 0 ? m[i].mean_coefficient : m[i].coefficient * eigenfunction(g, m[i].zeta, x);
            rest += std::abs(c) * std::exp(-m[i].zeta * m[i].zeta * fo);
          }
          CHECK(rest <= series_tail_bound(g, fo, x, n));
          CHECK(series_tail_bound(g, fo, x, n) <= 1e-10);
          if (n > 1) CHECK(series_tail_bound(g, fo, x, n - 1) > 1e-10);
        }
  // Smaller Fo needs more terms.
  CHECK(step_response(Geometry::sphere, 5, 1e-4, 0.0).terms > step_response(Geometry::sphere, 5, 1e-2, 0.0).terms);
}

TEST_CASE("series: short-time forms agree with the series where both apply") {
  // Forcing the short-time branch with a small max_terms at Fo = 1e-5 … 1e-3, where the
  // series (default options) is converged; the opposite face / centre is then > 15 √Fo away and
  // its influence is below 1e-40. Cases include Bi = 1 (H = 0) and Bi just off 1 (Taylor branch).
  SeriesOptions forced;
  forced.max_terms = 3;
  double worst = 0;
  for (double bi : {0.1, 0.5, 1.0, 1.00001, 0.99999, 2.0, 10.0, 200.0, kInfiniteBiot})
    for (double fo : {1e-5, 1e-4, 1e-3}) {
      for (double x : {1.0, 0.99, 0.97, 0.9, 0.5, 0.0}) {
        for (Geometry g : {Geometry::slab, Geometry::sphere}) {
          const StepResponse st = step_response(g, bi, fo, x, forced);
          const StepResponse se = step_response(g, bi, fo, x);
          CAPTURE(to_string(g));
          CAPTURE(bi);
          CAPTURE(fo);
          CAPTURE(x);
          CHECK(st.method == SeriesMethod::short_time);
          CHECK(se.method == SeriesMethod::series);
          CHECK(std::abs(st.theta - se.theta) <= st.error_bound + se.error_bound);
          worst = std::max(worst, std::abs(st.theta - se.theta));
        }
      }
      for (Geometry g : {Geometry::slab, Geometry::sphere}) {
        const StepResponse st = mean_step_response(g, bi, fo, forced);
        const StepResponse se = mean_step_response(g, bi, fo);
        CAPTURE(bi);
        CAPTURE(fo);
        CHECK(st.method == SeriesMethod::short_time);
        CHECK(std::abs(st.theta - se.theta) <= st.error_bound + se.error_bound);
        worst = std::max(worst, std::abs(st.theta - se.theta));
      }
    }
  MESSAGE("worst |short-time - series| = " << worst);
  CHECK(worst <= 1e-9);
}

TEST_CASE("series: at the default switch the short-time result equals a longer series") {
  // Find the largest Fo where 4000 terms are not enough at the surface, evaluate just below it
  // with the default options (short time) and with 12000 terms (series).
  for (Geometry g : {Geometry::slab, Geometry::sphere}) {
    double fo = 1e-6;
    while (series_terms_needed(g, fo, 1.0, 0.5e-9, 4000) > 0) fo *= 0.9;
    CAPTURE(to_string(g));
    CAPTURE(fo);
    SeriesOptions longer;
    longer.max_terms = 12000;
    for (double bi : {0.7, 1.0, 40.0, kInfiniteBiot}) {
      for (double x : {1.0, 0.9995, 0.999, 0.5}) {
        const StepResponse st = step_response(g, bi, fo, x);
        const StepResponse se = step_response(g, bi, fo, x, longer);
        CHECK(st.method == SeriesMethod::short_time);
        CHECK(se.method == SeriesMethod::series);
        CHECK(std::abs(st.theta - se.theta) <= 1e-9);
      }
    }
    // The mean's tail decays faster (|M_n| ~ 1/ζ_n²), so its switch is at a smaller Fo.
    double fm = fo;
    while (series_terms_needed(g, fm, -1.0, 0.5e-9, 4000) > 0) fm *= 0.9;
    CAPTURE(fm);
    for (double bi : {0.7, 1.0, 40.0, kInfiniteBiot}) {
      const StepResponse st = mean_step_response(g, bi, fm);
      const StepResponse se = mean_step_response(g, bi, fm, longer);
      CHECK(st.method == SeriesMethod::short_time);
      CHECK(se.method == SeriesMethod::series);
      CHECK(std::abs(st.theta - se.theta) <= 1e-9);
    }
  }
  // The cylinder has no short-time surface form: interior points are θ = 1 (bounded), the
  // surface and the mean refuse rather than return an unconverged sum.
  const double fo = 1e-8;
  const StepResponse c = step_response(Geometry::cylinder, 5, fo, 0.9);
  CHECK(c.method == SeriesMethod::short_time);
  CHECK(c.theta == 1.0);
  CHECK(c.error_bound <= 1e-9);
  CHECK_THROWS_AS(step_response(Geometry::cylinder, 5, fo, 1.0), NotConverged);
  CHECK_THROWS_AS(mean_step_response(Geometry::cylinder, 5, fo), NotConverged);
}

TEST_CASE("series: limits and refused input") {
  for (Geometry g : kAll) {
    CHECK(step_response(g, 3, 0.0, 0.7).theta == 1.0);
    CHECK(step_response(g, 0.0, 5.0, 0.7).theta == 1.0);  // insulated: stays at the initial value
    if (g != Geometry::cylinder)  // short-time mean 1 − (m+1)·2√(Fo/π) + …
      CHECK(mean_step_response(g, kInfiniteBiot, 1e-12).theta == doctest::Approx(1.0).epsilon(1e-5));
    CHECK(std::abs(step_response(g, kInfiniteBiot, 0.3, 1.0).theta) <= 1e-9);  // fixed surface
  }
  CHECK_THROWS_WITH_AS(step_response(Geometry::slab, 1, -0.1, 0), "step_response: fourier = -0.10000000000000001: must be finite and >= 0",
                       InputError);
  CHECK_THROWS_WITH_AS(step_response(Geometry::slab, 1, 0.1, 1.5), "step_response: x = 1.5: must be in [0, 1]", InputError);
  CHECK_THROWS_WITH_AS(mean_step_response(Geometry::sphere, -2, 0.1), "mean_step_response: biot = -2: must be 0 or in [1e-06, inf]",
                       InputError);
  SeriesOptions bad;
  bad.tol = 0;
  CHECK_THROWS_WITH_AS(step_response(Geometry::slab, 1, 0.1, 0, bad), "step_response: tol = 0: must be > 0", InputError);
  // Too few supplied modes for the tolerance: refused, never a partial sum.
  const auto m = modes(Geometry::sphere, 2.0, 5);
  CHECK_THROWS_AS(step_response(Geometry::sphere, m, 1e-3, 0.0), NotConverged);
  CHECK(step_response(Geometry::sphere, m, 1.0, 0.0).theta == doctest::Approx(centre(Geometry::sphere, 2.0, 1.0)).epsilon(1e-12));
}
