#pragma once
// Scaled complementary error function and the semi-infinite-solid heat-uptake function, for the
// short-time forms of series.cpp.
#include <boost/math/special_functions/erf.hpp>
#include <boost/math/special_functions/gamma.hpp>
#include <cmath>

namespace coldcore::detail {

/// erfcx(z) = exp(z²) erfc(z), relative error ~1e-13 (exp(z²) rounding at z near 26).
inline double erfcx(double z) {
  if (z < 0) {
    // z >= -26 in every use here (arguments are η + H√Fo with |H√Fo| < 1); exp(z²) is finite.
    return 2 * std::exp(z * z) - erfcx(-z);
  }
  if (z < 26) return std::exp(z * z) * boost::math::erfc(z);
  // Asymptotic series 1/(z√π) Σ (−1)^k (2k−1)!!/(2z²)^k; at z >= 26 the 9th term is < 1e-19.
  const double iz2 = 1 / (2 * z * z);
  double term = 1, sum = 1;
  for (int k = 1; k <= 8; ++k) {
    term *= -(2 * k - 1) * iz2;
    sum += term;
  }
  return sum / (z * std::sqrt(M_PI));
}

/// G(c) = erfcx(c) − 1 + 2c/√π = Σ_{k>=2} (−c)^k/Γ(k/2+1), and G(c) − c², both without the
/// cancellation of the closed form at small |c|.
struct UptakeG {
  double g;         ///< G(c)
  double g_minus2;  ///< G(c) − c²
};
inline UptakeG uptake_g(double c) {
  if (std::abs(c) >= 0.5) {
    const double g = erfcx(c) - 1 + 2 * c / std::sqrt(M_PI);
    return {g, g - c * c};
  }
  double g3 = 0;  // Σ_{k>=3}
  double p = c * c;
  for (int k = 3; k <= 40; ++k) {
    p *= -c;
    g3 += p / boost::math::tgamma(k / 2.0 + 1);
  }
  return {c * c + g3, g3};
}

}  // namespace coldcore::detail
