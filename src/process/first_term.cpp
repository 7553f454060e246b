// First-term relations (f, j) <-> (α, Bi); the relations are stated in first_term.hpp.
#include "coldcore/process/first_term.hpp"

#include <algorithm>
#include <boost/math/tools/roots.hpp>
#include <boost/math/tools/toms748_solve.hpp>
#include <cmath>
#include <cstdint>
#include <limits>
#include <sstream>
#include <vector>

#include "coldcore/error.hpp"

namespace coldcore::process {

namespace {

// One 1-D factor of a product: its geometry and characteristic length L.
struct Axis {
  Geometry geometry;
  double length_m;
};

[[noreturn]] void reject(const char* where, const char* key, double value, const char* requirement) {
  std::ostringstream m;
  m << where << ": " << key << " = " << value << ": " << requirement;
  throw InputError(m.str());
}

void require_positive(const char* where, const char* key, double value) {
  if (!std::isfinite(value) || !(value > 0)) reject(where, key, value, "must be > 0 and finite");
}

void require_first_term_biot(const char* where, double biot) {
  require_biot(biot, where);
  if (biot == 0) reject(where, "biot", biot, "must be in [1e-06, inf] (at 0 the first mode does not decay)");
}

std::vector<Axis> axes_of(const Product& p, const char* where) {
  const Dimensions& d = p.dims;
  switch (p.shape) {
    case Shape::sphere:
      require_positive(where, "product.dims.diameter_m", d.diameter_m);
      return {{Geometry::sphere, d.diameter_m / 2}};
    case Shape::cylinder:
      require_positive(where, "product.dims.diameter_m", d.diameter_m);
      return {{Geometry::cylinder, d.diameter_m / 2}};
    case Shape::slab:
      require_positive(where, "product.dims.thickness_m", d.thickness_m);
      return {{Geometry::slab, d.thickness_m / 2}};
    case Shape::finite_cylinder:
      require_positive(where, "product.dims.diameter_m", d.diameter_m);
      require_positive(where, "product.dims.length_m", d.length_m);
      return {{Geometry::cylinder, d.diameter_m / 2}, {Geometry::slab, d.length_m / 2}};
    case Shape::brick:
      for (double s : d.size_m) require_positive(where, "product.dims.size_m[i]", s);
      return {{Geometry::slab, d.size_m[0] / 2}, {Geometry::slab, d.size_m[1] / 2}, {Geometry::slab, d.size_m[2] / 2}};
  }
  reject(where, "product.shape", static_cast<double>(p.shape), "is not a known shape");
}

double smallest_length(const std::vector<Axis>& axes) {
  double L = axes.front().length_m;
  for (const Axis& a : axes) L = std::min(L, a.length_m);
  return L;
}

// Bi of one axis from the Bi of the smallest dimension (shared h/k); ∞ stays ∞.
double axis_biot(const Axis& a, double biot_smallest, double L_smallest) {
  return std::isinf(biot_smallest) ? biot_smallest : biot_smallest * a.length_m / L_smallest;
}

double product_j(const std::vector<Axis>& axes, double biot_smallest, double L_smallest) {
  double j = 1;
  for (const Axis& a : axes) j *= first_term_j(a.geometry, axis_biot(a, biot_smallest, L_smallest));
  return j;
}

// Σ ζ1(Bi_i)²/(ln10·L_i²) = 1/(f·α).
double rate_per_alpha(const std::vector<Axis>& axes, double biot_smallest, double L_smallest) {
  double sum = 0;
  for (const Axis& a : axes)
    sum += 1.0 / (first_term_f_alpha_over_L2(a.geometry, axis_biot(a, biot_smallest, L_smallest)) * a.length_m * a.length_m);
  return sum;
}

constexpr double kLowestBiot = 1e-6;
constexpr double kHighestBiot = 1e6;

}  // namespace

double first_term_f_alpha_over_L2(Geometry g, double biot) {
  require_first_term_biot("first_term_f_alpha_over_L2", biot);
  const double z1 = eigenvalue(g, biot, 1);
  return std::log(10.0) / (z1 * z1);
}

double first_term_j(Geometry g, double biot) {
  require_first_term_biot("first_term_j", biot);
  return centre_coefficient(g, biot, eigenvalue(g, biot, 1));
}

FirstTermHeating first_term_heating(const Product& product, double alpha_m2_s, double biot_smallest_dimension) {
  constexpr const char* where = "first_term_heating";
  require_positive(where, "alpha_m2_s", alpha_m2_s);
  require_first_term_biot(where, biot_smallest_dimension);
  const std::vector<Axis> axes = axes_of(product, where);
  const double L = smallest_length(axes);
  return {1.0 / (alpha_m2_s * rate_per_alpha(axes, biot_smallest_dimension, L)),
          product_j(axes, biot_smallest_dimension, L)};
}

FirstTermEstimate first_term_estimate(const Product& product, double f_s, double j, double rho_cp_J_m3K) {
  constexpr const char* where = "first_term_estimate";
  require_positive(where, "f_s", f_s);
  require_positive(where, "j", j);
  require_positive(where, "rho_cp_J_m3K", rho_cp_J_m3K);
  const std::vector<Axis> axes = axes_of(product, where);
  const double L = smallest_length(axes);

  FirstTermEstimate e;
  if (j < 1) {
    e.status = FirstTermStatus::j_below_one;
    e.biot_smallest_dimension = e.alpha_m2_s = e.h_W_m2K = std::numeric_limits<double>::quiet_NaN();
    return e;
  }
  double biot;
  if (j >= product_j(axes, kInfiniteBiot, L)) {
    e.status = FirstTermStatus::j_at_or_above_infinite_biot;
    biot = kInfiniteBiot;
  } else {
    e.status = FirstTermStatus::estimated;
    const double lo = std::log(kLowestBiot), hi = std::log(kHighestBiot);
    const auto gap = [&](double ln_biot) { return product_j(axes, std::exp(ln_biot), L) - j; };
    const double g_lo = gap(lo), g_hi = gap(hi);
    if (g_lo >= 0) {
      biot = kLowestBiot;  // j in [1, j(1e-6)]: the bottom of the range
    } else if (g_hi <= 0) {
      biot = kHighestBiot;  // j in [j(1e6), j(∞)): the top of the range
    } else {
      std::uintmax_t iterations = 200;
      const auto bracket = boost::math::tools::toms748_solve(gap, lo, hi, g_lo, g_hi,
                                                             boost::math::tools::eps_tolerance<double>(50), iterations);
      if (iterations >= 200) throw NotConverged("first_term_estimate: toms748 did not converge on Bi");
      biot = std::exp((bracket.first + bracket.second) / 2);
    }
  }
  e.biot_smallest_dimension = biot;
  e.alpha_m2_s = 1.0 / (f_s * rate_per_alpha(axes, biot, L));
  e.h_W_m2K = biot * e.alpha_m2_s * rho_cp_J_m3K / L;  // h = Bi·k/L with k = α·rho·cp
  return e;
}

}  // namespace coldcore::process
