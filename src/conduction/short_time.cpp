// The short-time forms of the step response (see series.hpp for the derivations): used where the
// series would need more terms than allowed, i.e. at very small Fourier numbers.
#include "conduction/detail/short_time.hpp"

#include <boost/math/constants/constants.hpp>
#include <boost/math/special_functions/erf.hpp>
#include <boost/math/special_functions/gamma.hpp>
#include <cmath>
#include <limits>
#include <string>

#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"
#include "conduction/detail/special.hpp"

namespace coldcore::detail {
namespace {

constexpr double kPi = boost::math::constants::pi<double>();
constexpr double kEps = std::numeric_limits<double>::epsilon();

// 1 − θ <= this at distance d from the surface, for every Bi.
double interior_bound(Geometry g, double fourier, double d) {
  const double sf = std::sqrt(fourier);
  if (g == Geometry::slab) return 2 * boost::math::erfc(d / (2 * sf));
  return 2 * std::exp(-d * d / (4 * fourier)) / std::sqrt(kPi * fourier) + boost::math::erfc(1 / sf);
}

// Opposite-side influence, e^{−1/(4Fo)} times a polynomial factor (see series.hpp).
double far_side_bound(double biot, double fourier, double factor) {
  const double b = std::isinf(biot) ? 1.0 : 1 + biot;
  return factor * b * (1 + 1 / std::sqrt(fourier)) * boost::math::erfc(1 / (2 * std::sqrt(fourier)));
}

// θ of the semi-infinite solid with a convective surface at depth η = d/(2√Fo).
double semi_infinite_theta(double biot, double fourier, double d) {
  const double sf = std::sqrt(fourier);
  const double eta = d / (2 * sf);
  if (std::isinf(biot)) return boost::math::erf(eta);
  return boost::math::erf(eta) + std::exp(-eta * eta) * erfcx(eta + biot * sf);
}

// 1 − mean θ of the slab from heat uptake G(b)/Bi, b = Bi√Fo.
double slab_uptake(double biot, double fourier) {
  const double sf = std::sqrt(fourier);
  if (std::isinf(biot)) return 2 * sf / std::sqrt(kPi);
  const double b = biot * sf;
  if (b >= 0.5) return uptake_g(b).g / biot;
  // G(b)/Bi = Bi·Fo·Σ_{k>=2} (−b)^{k−2}/Γ(k/2+1)
  double s = 0, p = 1;
  for (int k = 2; k <= 40; ++k) {
    s += p / boost::math::tgamma(k / 2.0 + 1);
    p *= -b;
  }
  return biot * fourier * s;
}

// Sphere, v = rθ: z(s) = v − (1 − s) at depth s = 1 − r (series.hpp). H = Bi − 1.
double sphere_z(double biot, double fourier, double s) {
  const double sf = std::sqrt(fourier);
  const double eta = s / (2 * sf);
  if (std::isinf(biot)) return -boost::math::erfc(eta);
  const double h = biot - 1;
  const double c = h * sf;
  const double ec = boost::math::erfc(eta);
  const double ex = std::exp(-eta * eta);
  if (std::abs(c) < 1e-4) {
    // [erfc(η) − g(c)]/H with g(c) = e^{−η²} erfcx(η + c), by its Taylor series in c
    // (the closed form cancels): g1 = 2η erfc(η) − (2/√π)e^{−η²},
    // g2 = (2 + 4η²) erfc(η) − (4η/√π) e^{−η²}.
    const double g1 = 2 * eta * ec - 2 / std::sqrt(kPi) * ex;
    const double g2 = (2 + 4 * eta * eta) * ec - 4 * eta / std::sqrt(kPi) * ex;
    const double f = -sf * (g1 + g2 * c / 2);
    return -biot * f;
  }
  return -(biot / h) * (ec - ex * erfcx(eta + c));
}

// Sphere 1 − mean θ = 3 Bi [G/H² + (G − c²)/H³], c = H√Fo (series.hpp).
double sphere_uptake(double biot, double fourier) {
  const double sf = std::sqrt(fourier);
  if (std::isinf(biot)) return 3 * (2 * sf / std::sqrt(kPi) - fourier);
  const double h = biot - 1;
  const double c = h * sf;
  double a, b;
  if (std::abs(c) >= 0.5) {
    const auto u = uptake_g(c);
    a = u.g / (h * h);
    b = u.g_minus2 / (h * h * h);
  } else {
    // G/H² = Σ_{k>=2} (−1)^k H^{k−2} Fo^{k/2}/Γ(k/2+1); (G − c²)/H³ = Σ_{k>=3} (−1)^k H^{k−3} Fo^{k/2}/Γ(k/2+1)
    a = fourier;  // k = 2 term
    b = 0;
    double p = fourier;  // (−1)^k H^{k−2} Fo^{k/2}, at k = 2
    double q = 1;        // (−1)^k H^{k−3} Fo^{k/2}·… built as Fo^{3/2} (−1) H^0 at k = 3
    q = -fourier * sf;
    for (int k = 3; k <= 40; ++k) {
      p *= -h * sf;
      const double gk = boost::math::tgamma(k / 2.0 + 1);
      a += p / gk;
      b += q / gk;
      q *= -h * sf;
    }
  }
  return 3 * biot * (a + b);
}

}  // namespace

StepResponse short_time_point(Geometry g, double biot, double fourier, double x, double tol, int max_terms,
                              const char* where) {
  const double d = 1 - x;
  const double eint = interior_bound(g, fourier, d);
  if (eint <= tol) return {1.0, SeriesMethod::short_time, 0, eint};
  double theta = 0, err = 0;
  if (g == Geometry::slab) {
    theta = semi_infinite_theta(biot, fourier, d);
    err = far_side_bound(biot, fourier, 2) + 16 * kEps;
  } else if (g == Geometry::sphere && x >= 0.5) {
    theta = 1 + sphere_z(biot, fourier, d) / x;
    err = far_side_bound(biot, fourier, 8) + 1e-13;
  } else {
    throw NotConverged(std::string(where) + "(" + std::string(to_string(g)) + "): fourier = " + number_text(fourier, 17) +
                       ", x = " + number_text(x, 17) + ": the series needs more than max_terms = " +
                       std::to_string(max_terms) +
                       " terms and no short-time form covers this point; raise max_terms or use the numeric solver");
  }
  if (!(err <= tol))
    throw NotConverged(std::string(where) + ": fourier = " + number_text(fourier, 17) + ": short-time error bound " +
                       number_text(err, 17) + " exceeds tol " + number_text(tol, 17));
  return {theta, SeriesMethod::short_time, 0, err};
}

StepResponse short_time_mean(Geometry g, double biot, double fourier, double tol, int max_terms,
                             const char* where) {
  double theta = 0, err = 0;
  if (g == Geometry::slab) {
    theta = 1 - slab_uptake(biot, fourier);
    err = far_side_bound(biot, fourier, 2) + 16 * kEps;
  } else if (g == Geometry::sphere) {
    theta = 1 - sphere_uptake(biot, fourier);
    err = far_side_bound(biot, fourier, 24) + 1e-13;
  } else {
    throw NotConverged(std::string(where) + "(cylinder): fourier = " + number_text(fourier, 17) +
                       ": the series needs more than max_terms = " + std::to_string(max_terms) +
                       " terms and no short-time form covers the cylinder mean; raise max_terms or use the "
                       "numeric solver");
  }
  if (!(err <= tol))
    throw NotConverged(std::string(where) + ": fourier = " + number_text(fourier, 17) + ": short-time error bound " +
                       number_text(err, 17) + " exceeds tol " + number_text(tol, 17));
  return {theta, SeriesMethod::short_time, 0, err};
}

}  // namespace coldcore::detail
