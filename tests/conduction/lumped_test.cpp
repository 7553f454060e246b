// Dimensionless groups and the lumped-capacitance solution.
#include "coldcore/conduction/lumped.hpp"

#include <doctest/doctest.h>

#include <cmath>

#include "coldcore/error.hpp"

using namespace coldcore;

TEST_CASE("lumped: criterion with Lc = V/A (REFERENCES §3.2 and §7 item 21)") {
  // §7 item 21: sphere R = 0.01 m, k = 0.5 W/mK. h = 10 → Bi(Lc = R/3) = 0.0667 allowed;
  // h = 50 → 0.333, must use the series (rule Bi < 0.1, common practice).
  const double bi10 = biot_number(10, 0.01, 0.5), bi50 = biot_number(50, 0.01, 0.5);
  CHECK(lumped_biot(Geometry::sphere, bi10) == doctest::Approx(0.0667).epsilon(1e-3));
  CHECK(biot_number(10, lumped_length_m(Geometry::sphere, 0.01), 0.5) == doctest::Approx(0.0666667).epsilon(1e-5));
  CHECK(lumped_warning(Geometry::sphere, bi10).empty());
  CHECK(lumped_warning(Geometry::sphere, bi50) ==
        "lumped capacitance with Bi = 0.333 (Lc = V/A = R/3 for a sphere) > 0.1: the product is not at a uniform "
        "temperature; the centre lags the lumped value, use the exact series");
  CHECK(lumped_length_m(Geometry::slab, 0.02) == 0.02);
  CHECK(lumped_length_m(Geometry::cylinder, 0.02) == 0.01);
  CHECK(lumped_warning(Geometry::cylinder, 0.15).empty());   // Bi_c = 0.075
  CHECK(!lumped_warning(Geometry::cylinder, 0.25).empty());  // Bi_c = 0.125
}

TEST_CASE("lumped: solution and comparison with the exact series") {
  // θ = exp(−Bi_c Fo_c) = exp(−(m+1) Bi Fo) (Incropera §5.2).
  CHECK(lumped_theta(0.05, 4.0) == doctest::Approx(std::exp(-0.2)));
  CHECK(lumped_theta(Geometry::sphere, 0.05, 4.0) == doctest::Approx(std::exp(-0.6)));
  // Bi_c·Fo_c is the same product from either length convention.
  const double h = 20, k = 0.5, R = 0.01, alpha = 1.4e-7, t = 300;
  const double lc = lumped_length_m(Geometry::sphere, R);
  CHECK(lumped_theta(biot_number(h, lc, k), fourier_number(alpha, t, lc)) ==
        doctest::Approx(lumped_theta(Geometry::sphere, biot_number(h, R, k), fourier_number(alpha, t, R))).epsilon(1e-13));
  // Small Bi: lumped is close to both centre and mean; the centre runs warmer (lags).
  const LumpedComparison a = compare_lumped(Geometry::sphere, 0.06, 3.0);
  CHECK(a.lumped_valid);
  CHECK(a.warning.empty());
  CHECK(std::abs(a.centre_difference) < 0.02);  // Bi_c = 0.02: within 2 %
  CHECK(std::abs(a.mean_difference) < 0.005);
  CHECK(a.centre_difference < 0);
  // Large Bi: lumped badly underestimates the centre and the warning is set.
  const LumpedComparison b = compare_lumped(Geometry::sphere, 3.0, 0.2);
  CHECK(!b.lumped_valid);
  CHECK(!b.warning.empty());
  CHECK(b.centre_difference < -0.3);
  CHECK(b.exact_centre.error_bound <= 1e-9);
}

TEST_CASE("lumped: groups refuse bad input") {
  CHECK(fourier_number(1.4e-7, 3600, 0.02) == doctest::Approx(1.26));
  CHECK(thermal_diffusivity_m2_s(0.5, 1000, 3500) == doctest::Approx(1.428571e-7).epsilon(1e-6));
  CHECK_THROWS_WITH_AS(biot_number(10, 0, 0.5), "biot_number: length_m = 0: must be > 0", InputError);
  CHECK_THROWS_WITH_AS(fourier_number(1e-7, -1, 0.1), "fourier_number: time_s = -1: must be >= 0", InputError);
  CHECK_THROWS_AS(biot_number(-1, 0.1, 0.5), InputError);
}
