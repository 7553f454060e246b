// Eigenvalues and coefficients of the conduction series, checked against outside references.
#include "coldcore/conduction/modes.hpp"

#include <doctest/doctest.h>

#include <boost/math/special_functions/bessel.hpp>
#include <boost/math/tools/toms748_solve.hpp>
#include <cmath>
#include <cstdint>
#include <limits>
#include <string>

#include "coldcore/error.hpp"
#include "support/csv_table.hpp"

using namespace coldcore;
using coldcore::test::read_csv;
using coldcore::test::WorstError;

namespace {

Geometry geometry_of(const std::string& s) {
  if (s == "slab") return Geometry::slab;
  if (s == "cylinder") return Geometry::cylinder;
  REQUIRE(s == "sphere");
  return Geometry::sphere;
}

constexpr double kPi = 3.14159265358979323846;

}  // namespace

TEST_CASE("modes: zeta / C / M / N match the mpmath 30-digit table to 1e-10 relative") {
  // Source: tests/reference/modes.csv from tests/reference/gen_modes.py (mpmath, 45-digit
  // working precision), Bi = 1e-6 … 1e6 and ∞, n = 1..50, all three geometries.
  const auto rows = read_csv("tests/reference/modes.csv");
  CHECK(rows.size() == 3 * 12 * 50);
  WorstError wz, wc, wm, wn;
  for (const auto& r : rows) {
    const Geometry g = geometry_of(r.text("geometry"));
    const double bi = r.num("biot");
    const int n = std::stoi(r.text("n"));
    const std::string at = r.text("geometry") + " Bi=" + r.text("biot") + " n=" + r.text("n");
    const double z = eigenvalue(g, bi, n);
    wz.add(z, r.num("zeta"), at);
    wc.add(centre_coefficient(g, bi, z), r.num("C"), at);
    wm.add(mean_coefficient(g, bi, z), r.num("M"), at);
    wn.add(mode_norm(g, bi, z), r.num("N"), at);
  }
  MESSAGE("worst zeta rel err " << wz.err << " at " << wz.where);
  MESSAGE("worst C rel err " << wc.err << " at " << wc.where);
  MESSAGE("worst M rel err " << wm.err << " at " << wm.where);
  MESSAGE("worst N rel err " << wn.err << " at " << wn.where);
  CHECK(wz.err < 1e-10);
  CHECK(wc.err < 1e-10);
  CHECK(wm.err < 1e-10);
  CHECK(wn.err < 1e-10);
}

TEST_CASE("modes: one-term table of the heat-transfer handbooks") {
  // Source: REFERENCES.md §3.1 (Incropera Table 5.1 / Çengel Table 4-2, 6-decimal values [D]
  // that reproduce the 4-decimal printed table). Checked to the printed precision: half a unit
  // in the 6th decimal (5e-7), i.e. every entry must be our value correctly rounded.
  struct Row { double bi, zs, cs, zc, cc, zp, cp; };
  const Row rows[] = {
      {0.01, 0.099834, 1.001661, 0.141245, 1.002496, 0.173032, 1.002998},
      {0.1, 0.311053, 1.016094, 0.441682, 1.024579, 0.542281, 1.029798},
      {0.5, 0.653271, 1.070128, 0.940771, 1.114255, 1.165561, 1.144106},
      {1, 0.860334, 1.119132, 1.255784, 1.207092, 1.570796, 1.273240},
      {2, 1.076874, 1.178456, 1.599449, 1.338377, 2.028758, 1.479319},
      {5, 1.313838, 1.240249, 1.989815, 1.502869, 2.570432, 1.787001},
      {10, 1.428870, 1.261963, 2.179497, 1.567692, 2.836300, 1.924909},
      {100, 1.555245, 1.273088, 2.380902, 1.601524, 3.110187, 1.999033},
      {kInfiniteBiot, 1.570796, 1.273240, 2.404826, 1.601975, 3.141593, 2.000000},
  };
  for (const auto& r : rows) {
    CAPTURE(r.bi);
    const double zs = eigenvalue(Geometry::slab, r.bi, 1);
    const double zc = eigenvalue(Geometry::cylinder, r.bi, 1);
    const double zp = eigenvalue(Geometry::sphere, r.bi, 1);
    CHECK(std::abs(zs - r.zs) <= 5.001e-7);
    CHECK(std::abs(centre_coefficient(Geometry::slab, r.bi, zs) - r.cs) <= 5.001e-7);
    CHECK(std::abs(zc - r.zc) <= 5.001e-7);
    CHECK(std::abs(centre_coefficient(Geometry::cylinder, r.bi, zc) - r.cc) <= 5.001e-7);
    CHECK(std::abs(zp - r.zp) <= 5.001e-7);
    CHECK(std::abs(centre_coefficient(Geometry::sphere, r.bi, zp) - r.cp) <= 5.001e-7);
  }
  // The 4-decimal printed entries quoted in REFERENCES.md §3.1 (Incropera Table 5.1, [M]).
  auto z1c1 = [](Geometry g, double bi) {
    const double z = eigenvalue(g, bi, 1);
    return std::pair{z, centre_coefficient(g, bi, z)};
  };
  auto [a1, b1] = z1c1(Geometry::slab, 1);
  CHECK(std::abs(a1 - 0.8603) <= 5e-5);
  CHECK(std::abs(b1 - 1.1191) <= 5e-5);
  auto [a2, b2] = z1c1(Geometry::cylinder, 1);
  CHECK(std::abs(a2 - 1.2558) <= 5e-5);
  CHECK(std::abs(b2 - 1.2071) <= 5e-5);
  auto [a3, b3] = z1c1(Geometry::sphere, 10);
  CHECK(std::abs(a3 - 2.8363) <= 5e-5);
  CHECK(std::abs(b3 - 1.9249) <= 5e-5);
  auto [a4, b4] = z1c1(Geometry::cylinder, 100);
  CHECK(std::abs(a4 - 2.3809) <= 5e-5);
  CHECK(std::abs(b4 - 1.6015) <= 5e-5);
}

TEST_CASE("modes: Bi = inf gives the zeros of J0 and the centre lag factors") {
  // Source: REFERENCES.md §3.3 (NAG s17alc / PARI besseljzero) and §7 item 4.
  const double j0[] = {2.4048256, 5.5200781, 8.6537279, 11.7915344, 14.9309177};
  for (int n = 1; n <= 5; ++n) CHECK(std::abs(eigenvalue(Geometry::cylinder, kInfiniteBiot, n) - j0[n - 1]) <= 1e-6);
  CHECK(std::abs(boost::math::cyl_bessel_j(1, eigenvalue(Geometry::cylinder, kInfiniteBiot, 1)) - 0.5191475) <= 1e-7);
  // Lag factors C1 at Bi → ∞: slab 4/π = 1.273, cylinder 2/(j01 J1(j01)) = 1.602, sphere 2
  // (REFERENCES.md §7 items 3 and 9, [D]; textbook 1.273 / 1.602 / 2.000).
  auto c1 = [](Geometry g) { return centre_coefficient(g, kInfiniteBiot, eigenvalue(g, kInfiniteBiot, 1)); };
  CHECK(std::abs(c1(Geometry::slab) - 1.2732395) <= 1e-7);
  CHECK(std::abs(c1(Geometry::cylinder) - 1.6019747) <= 1e-7);
  CHECK(std::abs(c1(Geometry::sphere) - 2.0000000) <= 1e-12);
  CHECK(std::abs(c1(Geometry::slab) - 1.273) <= 5e-4);
  CHECK(std::abs(c1(Geometry::cylinder) - 1.602) <= 5e-4);
  // Large Bi approaches the limit (continuity at the top of the domain).
  for (Geometry g : {Geometry::slab, Geometry::cylinder, Geometry::sphere}) {
    CHECK(eigenvalue(g, 1e12, 1) == doctest::Approx(eigenvalue(g, kInfiniteBiot, 1)).epsilon(1e-11));
  }
  // Sphere at Bi = 1 has ζ1 = π/2 exactly and C1 = 4/π (REFERENCES.md §7 item 1, analytic).
  const double zs = eigenvalue(Geometry::sphere, 1.0, 1);
  CHECK(std::abs(zs - kPi / 2) <= 1e-15);
  CHECK(std::abs(centre_coefficient(Geometry::sphere, 1.0, zs) - 4 / kPi) <= 1e-14);
}

TEST_CASE("modes: n up to 4000 strictly increasing / each inside its own bracket") {
  // Property of the eigen-equations (each root is alone in its interval); no outside table.
  for (Geometry g : {Geometry::slab, Geometry::cylinder, Geometry::sphere}) {
    for (double bi : {0.0, 1e-6, 0.3, 1.0, 7.0, 1e6, kInfiniteBiot}) {
      CAPTURE(to_string(g));
      CAPTURE(bi);
      const auto m = modes(g, bi, 4000);
      REQUIRE(m.size() == 4000);
      int bad_order = 0, bad_bracket = 0, bad_coeff = 0;
      for (std::size_t i = 0; i < m.size(); ++i) {
        const RootBracket b = eigenvalue_bracket(g, bi, m[i].n);
        // Bi = 0 and Bi = ∞ put the root on an end of its bracket.
        if (!(m[i].zeta >= b.lower && m[i].zeta <= b.upper)) ++bad_bracket;
        if (bi > 0 && std::isfinite(bi) && !(m[i].zeta > b.lower && m[i].zeta < b.upper)) ++bad_bracket;
        if (i > 0 && !(m[i].zeta > m[i - 1].zeta)) ++bad_order;
        if (!std::isfinite(m[i].coefficient) || !(m[i].mean_coefficient >= 0) || !(m[i].norm > 0)) ++bad_coeff;
      }
      CHECK(bad_order == 0);
      CHECK(bad_bracket == 0);
      CHECK(bad_coeff == 0);
      // Residual of the eigen-equation at the last root, in its scaled form.
      const double z = m.back().zeta;
      if (bi > 0 && std::isfinite(bi)) {
        double res = 0;
        if (g == Geometry::slab) res = z * std::sin(z) - bi * std::cos(z);
        if (g == Geometry::sphere) res = z * std::cos(z) - (1 - bi) * std::sin(z);
        if (g == Geometry::cylinder)
          res = z * boost::math::cyl_bessel_j(1, z) - bi * boost::math::cyl_bessel_j(0, z);
        CHECK(std::abs(res) <= 1e-9 * (z + bi));
      }
    }
  }
}

TEST_CASE("modes: very large Bi switches to the asymptotic root without a jump") {
  // Below 1e9 the root is solved (toms748); from 1e9 it is ζ∞·Bi/(Bi+1). Both sides must agree
  // to rounding, for n up to 4000, and Bi up to 1e300 must stay finite and below ζ∞.
  for (Geometry g : {Geometry::slab, Geometry::cylinder, Geometry::sphere}) {
    const auto below = modes(g, 1e9 * (1 - 1e-12), 4000);
    const auto at = modes(g, 1e9, 4000);
    const auto huge = modes(g, 1e300, 4000);
    const auto inf = modes(g, kInfiniteBiot, 4000);
    double worst_z = 0, worst_c = 0;
    int bad = 0;
    for (std::size_t i = 0; i < at.size(); ++i) {
      worst_z = std::max(worst_z, std::abs(below[i].zeta - at[i].zeta) / at[i].zeta);
      worst_c = std::max(worst_c, std::abs(below[i].coefficient - at[i].coefficient) / std::abs(at[i].coefficient));
      if (!(huge[i].zeta <= inf[i].zeta) || !(huge[i].zeta > at[i].zeta)) ++bad;
      if (std::abs(huge[i].coefficient - inf[i].coefficient) > 1e-12 * std::abs(inf[i].coefficient)) ++bad;
    }
    CAPTURE(to_string(g));
    CHECK(worst_z <= 1e-15);
    CHECK(worst_c <= 1e-11);
    CHECK(bad == 0);
  }
}

TEST_CASE("modes: Parseval - the coefficients rebuild the uniform initial profile") {
  // Σ C_n² N_n = ∫0^1 x^m dx = 1/(m+1) and Σ M_n = 1 (completeness of the modes with a uniform
  // initial profile); the tails decay like 1/n², so 4000 modes leave ~1e-4 relative.
  for (Geometry g : {Geometry::slab, Geometry::cylinder, Geometry::sphere}) {
    for (double bi : {0.01, 1.0, 50.0, kInfiniteBiot}) {
      CAPTURE(to_string(g));
      CAPTURE(bi);
      double sum_m = 0, sum_p = 0;
      for (const Mode& m : modes(g, bi, 4000)) {
        sum_m += m.mean_coefficient;
        sum_p += m.coefficient * m.coefficient * m.norm;
      }
      const double want = 1.0 / (geometry_exponent(g) + 1);
      CHECK(sum_p == doctest::Approx(want).epsilon(2e-4));
      CHECK(sum_m == doctest::Approx(1.0).epsilon(2e-4));
      CHECK(sum_m <= 1.0 + 1e-12);
    }
  }
}

TEST_CASE("modes: Bi = 0 is the insulated surface") {
  for (Geometry g : {Geometry::slab, Geometry::cylinder, Geometry::sphere}) {
    const auto m = modes(g, 0.0, 5);
    CHECK(m[0].zeta == 0);
    CHECK(m[0].coefficient == 1);
    CHECK(m[0].mean_coefficient == 1);
    for (std::size_t i = 1; i < m.size(); ++i) {
      CHECK(m[i].coefficient == 0);
      CHECK(m[i].mean_coefficient == 0);
    }
  }
  // Zeros of J1 (Abramowitz & Stegun Table 9.5: 3.8317, 7.0156) and roots of tan ζ = ζ
  // (A&S Table 4.19: 4.4934, 7.7253) are the insulated cylinder and sphere eigenvalues.
  CHECK(std::abs(eigenvalue(Geometry::cylinder, 0.0, 2) - 3.8317) <= 5e-5);
  CHECK(std::abs(eigenvalue(Geometry::cylinder, 0.0, 3) - 7.0156) <= 5e-5);
  CHECK(std::abs(eigenvalue(Geometry::sphere, 0.0, 2) - 4.4934) <= 5e-5);
  CHECK(std::abs(eigenvalue(Geometry::sphere, 0.0, 3) - 7.7253) <= 5e-5);
}

TEST_CASE("modes: eigenfunctions are normalised at the centre and vanish at Bi = inf surface") {
  for (Geometry g : {Geometry::slab, Geometry::cylinder, Geometry::sphere}) {
    const double z = eigenvalue(g, kInfiniteBiot, 3);
    CHECK(eigenfunction(g, z, 0.0) == 1.0);
    CHECK(std::abs(eigenfunction(g, z, 1.0)) <= 1e-14);
  }
  CHECK(eigenfunction(Geometry::slab, 2.0, 0.5) == doctest::Approx(std::cos(1.0)));
  CHECK(eigenfunction(Geometry::sphere, 2.0, 0.5) == doctest::Approx(std::sin(1.0)));
  CHECK(eigenfunction(Geometry::cylinder, 2.0, 0.5) == doctest::Approx(0.7651976865579666));  // J0(1), A&S Table 9.1
}

TEST_CASE("modes: bad input is refused with the place / value and requirement") {
  CHECK_THROWS_WITH_AS(eigenvalue(Geometry::slab, -1.0, 1), "eigenvalue: biot = -1: must be 0 or in [1e-06, inf]",
                       InputError);
  CHECK_THROWS_WITH_AS(eigenvalue(Geometry::sphere, 1e-7, 1),
                       "eigenvalue: biot = 9.9999999999999995e-08: must be 0 or in [1e-06, inf]", InputError);
  CHECK_THROWS_AS(eigenvalue(Geometry::cylinder, std::nan(""), 1), InputError);
  CHECK_THROWS_WITH_AS(eigenvalue(Geometry::slab, 1.0, 0), "eigenvalue: n = 0: must be >= 1", InputError);
  CHECK_THROWS_AS(modes(Geometry::slab, 1.0, -1), InputError);
  CHECK_THROWS_AS(centre_coefficient(Geometry::slab, 1.0, -0.5), InputError);
}

TEST_CASE("higher slab and sphere roots equal Boost's bracketed solve of the characteristic equation to 4 ulps") {
  // The engine finds roots n >= 2 of slab and sphere by Newton's method (history setup needs up
  // to ~100 of them); the reference is Boost.Math toms748 on the characteristic equation in
  // ζ = (n−1)π + δ, the form the engine solved before: slab (a+δ) sin δ = Bi cos δ, sphere
  // (a+δ) cos δ = (1 − Bi) sin δ. Bi spans 1e-6 … 1e8, including both sides of Bi = 1.
  const double bis[] = {1e-6, 1e-3, 0.1, 0.5, 0.999, 1.0, 1.001, 2.0, 10.0, 1e3, 1e6, 1e8};
  double worst = 0;
  std::string where;
  for (const Geometry g : {Geometry::slab, Geometry::sphere}) {
    for (const double bi : bis) {
      for (int n = 2; n <= 400; n += (n < 20 ? 1 : 37)) {
        const double a = (n - 1) * kPi;
        auto f = [&](double x) {
          return g == Geometry::slab ? (a + x) * std::sin(x) - bi * std::cos(x) : (a + x) * std::cos(x) - (1 - bi) * std::sin(x);
        };
        const double hi = g == Geometry::slab ? kPi / 2 : kPi;
        std::uintmax_t it = 200;
        const auto r = boost::math::tools::toms748_solve(f, 0.0, hi, boost::math::tools::eps_tolerance<double>(std::numeric_limits<double>::digits - 2), it);
        const double ref = a + 0.5 * (r.first + r.second);
        const double z = eigenvalue(g, bi, n);
        const double ulps = std::abs(z - ref) / (std::numeric_limits<double>::epsilon() * ref);
        if (ulps > worst) {
          worst = ulps;
          where = std::string(g == Geometry::slab ? "slab" : "sphere") + " Bi=" + std::to_string(bi) + " n=" + std::to_string(n);
        }
      }
    }
  }
  MESSAGE("worst difference " << worst << " ulps at " << where);
  CHECK(worst <= 4.0);
}
