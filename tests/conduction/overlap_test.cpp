// Eigenfunction inner products for projections between Biot numbers.
#include "coldcore/conduction/overlap.hpp"

#include <doctest/doctest.h>

#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <cmath>

#include "coldcore/conduction/modes.hpp"
#include "coldcore/error.hpp"

using namespace coldcore;

namespace {

// Independent reference: adaptive Gauss–Kronrod (Boost.Math) of the definition.
double quadrature_overlap(Geometry g, double a, double b) {
  const int m = geometry_exponent(g);
  auto f = [&](double x) { return std::pow(x, m) * eigenfunction(g, a, x) * eigenfunction(g, b, x); };
  return boost::math::quadrature::gauss_kronrod<double, 61>::integrate(f, 0.0, 1.0, 8, 1e-13);
}

}  // namespace

TEST_CASE("overlap: agrees with adaptive quadrature of the definition") {
  double worst = 0;
  for (Geometry g : {Geometry::slab, Geometry::cylinder, Geometry::sphere})
    for (double bi_a : {0.05, 2.0, kInfiniteBiot})
      for (double bi_b : {0.3, 2.0, 2.0001, 40.0})
        for (int na : {1, 2, 7, 30})
          for (int nb : {1, 3, 7, 30}) {
            const double a = eigenvalue(g, bi_a, na), b = eigenvalue(g, bi_b, nb);
            const double got = mode_overlap(g, a, b), want = quadrature_overlap(g, a, b);
            worst = std::max(worst, std::abs(got - want));
            CAPTURE(to_string(g));
            CAPTURE(a);
            CAPTURE(b);
            CHECK(std::abs(got - want) <= 1e-12);
          }
  MESSAGE("worst |overlap - quadrature| = " << worst);
}

TEST_CASE("overlap: modes of one Biot number are orthogonal and the diagonal is the norm") {
  // Sturm–Liouville orthogonality with weight x^m (property of the eigenproblem).
  for (Geometry g : {Geometry::slab, Geometry::cylinder, Geometry::sphere})
    for (double bi : {1e-6, 0.7, 15.0, kInfiniteBiot}) {
      const auto m = modes(g, bi, 60);
      double worst_off = 0, worst_diag = 0;
      for (std::size_t i = 0; i < m.size(); i += 7)
        for (std::size_t j = 0; j < m.size(); j += 5) {
          const double o = mode_overlap(g, m[i].zeta, m[j].zeta);
          if (i == j)
            worst_diag = std::max(worst_diag, std::abs(o - m[i].norm) / m[i].norm);
          else
            worst_off = std::max(worst_off, std::abs(o));
        }
      CAPTURE(to_string(g));
      CAPTURE(bi);
      CHECK(worst_off <= 1e-12);
      CHECK(worst_diag <= 1e-11);
      // The uniform profile's coefficients: C_n = ∫ x^m X_n / N_n.
      for (const Mode& md : m) CHECK(mode_integral(g, md.zeta) / md.norm == doctest::Approx(md.coefficient).epsilon(1e-10));
    }
  CHECK_THROWS_AS(mode_overlap(Geometry::slab, -1, 2), InputError);
}
