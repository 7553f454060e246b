#include "coldcore/conduction/overlap.hpp"

#include <boost/math/quadrature/gauss.hpp>
#include <boost/math/special_functions/bessel.hpp>
#include <boost/math/special_functions/sinc.hpp>
#include <cmath>
#include <sstream>
#include <string>

#include "coldcore/conduction/modes.hpp"
#include "coldcore/error.hpp"

namespace coldcore {
namespace {

using GL = boost::math::quadrature::gauss<double, 15>;

void require_arg(double v, const char* where, const char* key) {
  if (!(v >= 0) || !std::isfinite(v)) {
    std::ostringstream s;
    s.precision(17);
    s << where << ": " << key << " = " << v << ": must be finite and >= 0";
    throw InputError(s.str());
  }
}

double j0(double z) { return boost::math::cyl_bessel_j(0, z); }
double j1(double z) { return boost::math::cyl_bessel_j(1, z); }

double weight(Geometry g, double x) {
  const int m = geometry_exponent(g);
  return m == 0 ? 1.0 : m == 1 ? x : x * x;
}

}  // namespace

double mode_integral(Geometry g, double z) {
  require_arg(z, "mode_integral", "z");
  if (z <= 2) return GL::integrate([&](double x) { return weight(g, x) * eigenfunction(g, z, x); }, 0.0, 1.0);
  switch (g) {
    case Geometry::slab: return std::sin(z) / z;
    case Geometry::cylinder: return j1(z) / z;
    case Geometry::sphere: return (std::sin(z) - z * std::cos(z)) / (z * z * z);
  }
  return 0;
}

double mode_overlap(Geometry g, double a, double b) {
  require_arg(a, "mode_overlap", "a");
  require_arg(b, "mode_overlap", "b");
  if (a > b) std::swap(a, b);
  if (b <= 2) {
    return GL::integrate(
        [&](double x) { return weight(g, x) * eigenfunction(g, a, x) * eigenfunction(g, b, x); }, 0.0, 1.0);
  }
  if (a == 0) return mode_integral(g, b);
  switch (g) {
    case Geometry::slab:
      return 0.5 * (boost::math::sinc_pi(b - a) + boost::math::sinc_pi(a + b));
    case Geometry::sphere:
      return (boost::math::sinc_pi(b - a) - boost::math::sinc_pi(a + b)) / (2 * a * b);
    case Geometry::cylinder: {
      const double j0a = j0(a), j1a = j1(a);
      if (b - a <= 0.5) {
        if (b == a) return 0.5 * (j0a * j0a + j1a * j1a);
        const double mean =
            GL::integrate([&](double t) { return j0a * t * j0(t) + a * j1a * j1(t); }, a, b) / (b - a);
        return mean / (a + b);
      }
      return (b * j0a * j1(b) - a * j1a * j0(b)) / ((b - a) * (b + a));
    }
  }
  return 0;
}

}  // namespace coldcore
