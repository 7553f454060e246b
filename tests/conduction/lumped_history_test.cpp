// Lumped shortcut through stages: against the closed-form lumped solution
// θ = exp(−Bi_Lc·Fo_Lc) (lumped capacitance, e.g. Incropera ch. 5 — formula from memory,
// it is the exact solution of the lumped ODE) and against a ramp's steady lag s/β.
#include <doctest/doctest.h>

#include <cmath>

#include "coldcore/conduction/lumped_history.hpp"

using namespace coldcore;

namespace {

Product small_sphere() {
  Product p;
  p.shape = Shape::sphere;
  p.dims.diameter_m = 0.01;
  p.initial_C = 10;
  p.properties = {0.5, 1000, 4000};
  return p;
}

History two_stage_records(double d1, double d2) {
  History h;
  StageRecord a, b;
  a.name = "hot";
  a.start_s = 0;
  a.end_s = d1;
  b.name = "cold";
  b.start_s = d1;
  b.end_s = d1 + d2;
  h.stages = {a, b};
  return h;
}

}  // namespace

TEST_CASE("lumped history: a constant medium gives the exponential approach") {
  const Product p = small_sphere();
  const double va = 0.005 / 3;  // V/A of a sphere = R/3
  Stage hot;
  hot.medium.points = {{0, 90}};
  hot.h_W_m2K = 20;
  Stage cold;
  cold.medium.points = {{0, 0}};
  cold.h_W_m2K = 50;
  const History h = two_stage_records(600, 600);
  const auto T = lumped_history_C(p, va, {hot, cold}, h, {0, 300, 600, 900, 1200});
  const double beta1 = 20 / (1000 * 4000 * va), beta2 = 50 / (1000 * 4000 * va);
  CHECK(T[0] == doctest::Approx(10));
  CHECK(T[1] == doctest::Approx(90 - 80 * std::exp(-beta1 * 300)).epsilon(1e-13));
  const double T600 = 90 - 80 * std::exp(-beta1 * 600);
  CHECK(T[2] == doctest::Approx(T600).epsilon(1e-13));
  CHECK(T[3] == doctest::Approx(T600 * std::exp(-beta2 * 300)).epsilon(1e-12));
  CHECK(T[4] == doctest::Approx(T600 * std::exp(-beta2 * 600)).epsilon(1e-12));
}

TEST_CASE("lumped history: under a long ramp the product lags the medium by s/beta") {
  const Product p = small_sphere();
  const double va = 0.005 / 3;
  Stage ramp;
  ramp.medium.points = {{0, 10}, {20000, 110}};
  ramp.h_W_m2K = 20;
  History h;
  StageRecord r;
  r.start_s = 0;
  r.end_s = 20000;
  h.stages = {r};
  const auto T = lumped_history_C(p, va, {ramp}, h, {20000});
  const double beta = 20 / (1000 * 4000 * va), s = 100.0 / 20000;
  CHECK(T[0] == doctest::Approx(110 - s / beta).epsilon(1e-9));
}
