#include "coldcore/conduction/quasi_steady.hpp"

#include <cmath>

#include "coldcore/conduction/modes.hpp"

namespace coldcore {

double ramp_profile(Geometry g, double biot, double x) {
  const double m1 = geometry_exponent(g) + 1.0;
  const double surface = std::isinf(biot) ? 0.0 : 1.0 / (m1 * biot);
  return (1.0 - x * x) / (2.0 * m1) + surface;
}

double ramp_profile_mean(Geometry g, double biot) {
  const double m1 = geometry_exponent(g) + 1.0;
  const double surface = std::isinf(biot) ? 0.0 : 1.0 / (m1 * biot);
  return 1.0 / (m1 * (m1 + 2.0)) + surface;
}

// Divide numerator and denominator by cosh κ so that nothing overflows:
// Bi cosh(κy)/(κ sinh κ + Bi cosh κ) = Bi r(y) / (κ tanh κ + Bi), r(y) = cosh(κy)/cosh κ.
double shifted_slab_profile(double biot, double kappa, double y) {
  const double r = std::exp(kappa * (y - 1.0)) * (1.0 + std::exp(-2.0 * kappa * y)) /
                   (1.0 + std::exp(-2.0 * kappa));
  const double t = std::tanh(kappa);
  const double frac = std::isinf(biot) ? r : biot * r / (kappa * t + biot);
  return 1.0 - frac;
}

double shifted_slab_profile_mean(double biot, double kappa) {
  const double t = std::tanh(kappa);
  const double frac = std::isinf(biot) ? t / kappa : biot * (t / kappa) / (kappa * t + biot);
  return 1.0 - frac;
}

}  // namespace coldcore
