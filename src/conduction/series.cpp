#include "coldcore/conduction/series.hpp"

#include "coldcore/conduction/lumped.hpp"

#include <boost/math/constants/constants.hpp>
#include <boost/math/special_functions/bessel.hpp>
#include <boost/math/special_functions/erf.hpp>
#include <boost/math/special_functions/sinc.hpp>
#include <cmath>
#include <limits>
#include <sstream>
#include <string>

#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"
#include "conduction/detail/short_time.hpp"

namespace coldcore {
namespace {

constexpr double kPi = boost::math::constants::pi<double>();
constexpr double kEps = std::numeric_limits<double>::epsilon();
// Largest observed |C_n|·√ζ_n of the cylinder is √(2π) = 2.5066 (limit n → ∞); 2.6 is checked
// for n <= 4000 in series_test.cpp.
constexpr double kCylinderCoeffBound = 2.6;
// Landau (2000), J. London Math. Soc. 61: |J_ν(x)| <= 0.7858 x^(−1/3) for all ν > 0, x > 0.
constexpr double kLandauC = 0.7858;

void require_inputs(double biot, double fourier, double x, const char* where, bool check_x) {
  require_biot(biot, where);
  if (!(fourier >= 0) || !std::isfinite(fourier))
    throw InputError(std::string(where) + ": fourier = " + number_text(fourier, 17) + ": must be finite and >= 0");
  if (check_x && !(x >= 0 && x <= 1))
    throw InputError(std::string(where) + ": x = " + number_text(x, 17) + ": must be in [0, 1]");
}

void require_tol(const SeriesOptions& o, const char* where) {
  if (!(o.tol > 0) || !std::isfinite(o.tol))
    throw InputError(std::string(where) + ": tol = " + number_text(o.tol, 17) + ": must be > 0");
  if (o.max_terms < 1)
    throw InputError(std::string(where) + ": max_terms = " + std::to_string(o.max_terms) + ": must be >= 1");
}

// Bound on |C(ζ) X(ζ x)| (x >= 0) or on |M(ζ)| (x < 0), valid and non-increasing for ζ >= π.
double term_bound(Geometry g, double zeta, double x) {
  switch (g) {
    case Geometry::slab:
      return x < 0 ? 2 / (zeta * zeta) : 2 / zeta;
    case Geometry::cylinder: {
      const double c = kCylinderCoeffBound / std::sqrt(zeta);
      if (x < 0) return c * 2 * kLandauC * std::pow(zeta, -1.0 / 3.0) / zeta;
      const double z = zeta * x;
      return z > 2 / kPi ? c * std::sqrt(2 / (kPi * z)) : c;
    }
    case Geometry::sphere: {
      const double c = 4 * (1 + zeta) / (2 * zeta - 1);
      if (x < 0) return c * 3 * (1 + zeta) / (zeta * zeta * zeta);
      const double z = zeta * x;
      return z > 1 ? c / z : c;
    }
  }
  return std::numeric_limits<double>::infinity();
}

struct Sum {
  double value;
  double abs_sum;
};

Sum sum_modes(Geometry g, const std::vector<Mode>& m, int count, double fourier, double x) {
  double s = 0, a = 0;
  for (int i = 0; i < count; ++i) {
    const Mode& md = m[static_cast<std::size_t>(i)];
    const double e = std::exp(-md.zeta * md.zeta * fourier);
    const double t = (x < 0 ? md.mean_coefficient : md.coefficient * eigenfunction(g, md.zeta, x)) * e;
    s += t;
    a += std::abs(t);
  }
  return {s, a};
}

StepResponse finish_series(Geometry g, const std::vector<Mode>& m, int count, double fourier, double x,
                           double tol, const char* where) {
  const Sum s = sum_modes(g, m, count, fourier, x);
  const double err = series_tail_bound(g, fourier, x, count) + 256 * kEps * (s.abs_sum + 1);
  if (!(err <= tol))
    throw NotConverged(std::string(where) + ": fourier = " + number_text(fourier, 17) + ": error bound " + number_text(err, 17) +
                       " exceeds tol " + number_text(tol, 17) + " after " + std::to_string(count) + " terms");
  return {s.value, SeriesMethod::series, count, err};
}

StepResponse evaluate(Geometry g, double biot, double fourier, double x, const SeriesOptions& opts,
                      const char* where) {
  require_tol(opts, where);
  require_inputs(biot, fourier, x, where, x >= 0);
  if (biot == 0 || fourier == 0) return {1.0, SeriesMethod::series, 0, 0.0};
  const int n = series_terms_needed(g, fourier, x, opts.tol / 2, opts.max_terms);
  if (n < 0)
    return x < 0 ? detail::short_time_mean(g, biot, fourier, opts.tol, opts.max_terms, where)
                 : detail::short_time_point(g, biot, fourier, x, opts.tol, opts.max_terms, where);
  const std::vector<Mode> m = modes(g, biot, n);
  return finish_series(g, m, n, fourier, x, opts.tol, where);
}

StepResponse combine(const std::vector<StepResponse>& parts) {
  StepResponse r{1.0, SeriesMethod::series, 0, 0.0};
  for (const auto& p : parts) {
    r.theta *= p.theta;
    r.terms += p.terms;
    if (p.method == SeriesMethod::short_time) r.method = SeriesMethod::short_time;
  }
  for (std::size_t i = 0; i < parts.size(); ++i) {
    double e = parts[i].error_bound;
    for (std::size_t j = 0; j < parts.size(); ++j)
      if (j != i) e *= std::abs(parts[j].theta) + parts[j].error_bound;
    r.error_bound += e;
  }
  return r;
}

}  // namespace

const char* to_string(SeriesMethod m) { return m == SeriesMethod::series ? "series" : "short-time"; }

double series_tail_bound(Geometry g, double fourier, double x, int N) {
  const double a = kPi * kPi * fourier;
  const double sa = std::sqrt(a);
  const double nn = static_cast<double>(N);
  return term_bound(g, kPi * nn, x) *
         (std::exp(-a * nn * nn) + std::sqrt(kPi) / (2 * sa) * boost::math::erfc(sa * nn));
}

int series_terms_needed(Geometry g, double fourier, double x, double tail_tol, int max_terms) {
  if (series_tail_bound(g, fourier, x, max_terms) > tail_tol) return -1;
  if (series_tail_bound(g, fourier, x, 1) <= tail_tol) return 1;
  int lo = 1, hi = max_terms;  // tail(lo) > tol >= tail(hi); the bound decreases in N
  while (hi - lo > 1) {
    const int mid = lo + (hi - lo) / 2;
    if (series_tail_bound(g, fourier, x, mid) <= tail_tol)
      hi = mid;
    else
      lo = mid;
  }
  return hi;
}

StepResponse step_response(Geometry g, double biot, double fourier, double x, const SeriesOptions& opts) {
  if (std::isnan(x) || x < 0 || x > 1)
    throw InputError("step_response: x = " + number_text(x, 17) + ": must be in [0, 1]");
  return evaluate(g, biot, fourier, x, opts, "step_response");
}

StepResponse mean_step_response(Geometry g, double biot, double fourier, const SeriesOptions& opts) {
  return evaluate(g, biot, fourier, -1.0, opts, "mean_step_response");
}

StepResponse step_response(Geometry g, const std::vector<Mode>& m, double fourier, double x, double tol) {
  if (std::isnan(x) || x < 0 || x > 1)
    throw InputError("step_response: x = " + number_text(x, 17) + ": must be in [0, 1]");
  if (!(fourier >= 0) || !std::isfinite(fourier))
    throw InputError("step_response: fourier = " + number_text(fourier, 17) + ": must be finite and >= 0");
  if (fourier == 0) return {1.0, SeriesMethod::series, 0, 0.0};
  const int count = static_cast<int>(m.size());
  const int n = count == 0 ? -1 : series_terms_needed(g, fourier, x, tol / 2, count);
  if (n < 0)
    throw NotConverged("step_response: fourier = " + number_text(fourier, 17) + ": " + std::to_string(count) +
                       " modes are not enough for tol " + number_text(tol, 17));
  return finish_series(g, m, n, fourier, x, tol, "step_response");
}

StepResponse mean_step_response(Geometry g, const std::vector<Mode>& m, double fourier, double tol) {
  if (!(fourier >= 0) || !std::isfinite(fourier))
    throw InputError("mean_step_response: fourier = " + number_text(fourier, 17) + ": must be finite and >= 0");
  if (fourier == 0) return {1.0, SeriesMethod::series, 0, 0.0};
  const int count = static_cast<int>(m.size());
  const int n = count == 0 ? -1 : series_terms_needed(g, fourier, -1.0, tol / 2, count);
  if (n < 0)
    throw NotConverged("mean_step_response: fourier = " + number_text(fourier, 17) + ": " + std::to_string(count) +
                       " modes are not enough for tol " + number_text(tol, 17));
  return finish_series(g, m, n, fourier, -1.0, tol, "mean_step_response");
}

StepResponse product_step_response(const std::vector<ProductFactor>& factors, const SeriesOptions& opts) {
  require_tol(opts, "product_step_response");
  SeriesOptions o = opts;
  o.tol = opts.tol / (2.0 * static_cast<double>(std::max<std::size_t>(1, factors.size())));
  std::vector<StepResponse> parts;
  for (const auto& f : factors) parts.push_back(step_response(f.geometry, f.biot, f.fourier, f.x, o));
  return combine(parts);
}

StepResponse product_mean_step_response(const std::vector<ProductFactor>& factors, const SeriesOptions& opts) {
  require_tol(opts, "product_mean_step_response");
  SeriesOptions o = opts;
  o.tol = opts.tol / (2.0 * static_cast<double>(std::max<std::size_t>(1, factors.size())));
  std::vector<StepResponse> parts;
  for (const auto& f : factors) parts.push_back(mean_step_response(f.geometry, f.biot, f.fourier, o));
  return combine(parts);
}

StepResponse finite_cylinder_step_response(double biot_radius, double fourier_radius, double r_over_R,
                                           double biot_half_length, double fourier_half_length, double z_over_H,
                                           const SeriesOptions& opts) {
  return product_step_response({{Geometry::cylinder, biot_radius, fourier_radius, r_over_R},
                                {Geometry::slab, biot_half_length, fourier_half_length, z_over_H}},
                               opts);
}

StepResponse finite_cylinder_mean_step_response(double biot_radius, double fourier_radius, double biot_half_length,
                                                double fourier_half_length, const SeriesOptions& opts) {
  return product_mean_step_response({{Geometry::cylinder, biot_radius, fourier_radius, 0.0},
                                     {Geometry::slab, biot_half_length, fourier_half_length, 0.0}},
                                    opts);
}

StepResponse brick_step_response(const std::array<double, 3>& biot, const std::array<double, 3>& fourier,
                                 const std::array<double, 3>& x, const SeriesOptions& opts) {
  return product_step_response({{Geometry::slab, biot[0], fourier[0], x[0]},
                                {Geometry::slab, biot[1], fourier[1], x[1]},
                                {Geometry::slab, biot[2], fourier[2], x[2]}},
                               opts);
}

StepResponse brick_mean_step_response(const std::array<double, 3>& biot, const std::array<double, 3>& fourier,
                                      const SeriesOptions& opts) {
  return product_mean_step_response({{Geometry::slab, biot[0], fourier[0], 0.0},
                                     {Geometry::slab, biot[1], fourier[1], 0.0},
                                     {Geometry::slab, biot[2], fourier[2], 0.0}},
                                    opts);
}

namespace {

double position_fraction(double offset_m, double half_m, const char* where, const char* key) {
  const double x = std::abs(offset_m) / half_m;
  if (!(x <= 1 + 1e-12))
    throw InputError(std::string(where) + ": " + key + " = " + number_text(offset_m, 17) + ": must be within +-" + number_text(half_m, 17) +
                     " (inside the product)");
  return std::min(x, 1.0);
}

}  // namespace

StepResponse finite_cylinder_point_theta(double diameter_m, double length_m, double h_W_m2K, double k_W_mK,
                                         double alpha_m2_s, double time_s, double r_m, double z_m,
                                         const SeriesOptions& opts) {
  const double r = diameter_m / 2, hl = length_m / 2;
  const double bi_r = biot_number(h_W_m2K, r, k_W_mK), bi_h = biot_number(h_W_m2K, hl, k_W_mK);
  const double fo_r = fourier_number(alpha_m2_s, time_s, r), fo_h = fourier_number(alpha_m2_s, time_s, hl);
  if (r_m < 0) throw InputError("finite_cylinder_point_theta: r_m = " + number_text(r_m, 17) + ": must be >= 0");
  return finite_cylinder_step_response(bi_r, fo_r, position_fraction(r_m, r, "finite_cylinder_point_theta", "r_m"),
                                       bi_h, fo_h, position_fraction(z_m, hl, "finite_cylinder_point_theta", "z_m"),
                                       opts);
}

StepResponse finite_cylinder_mean_theta(double diameter_m, double length_m, double h_W_m2K, double k_W_mK,
                                        double alpha_m2_s, double time_s, const SeriesOptions& opts) {
  const double r = diameter_m / 2, hl = length_m / 2;
  return finite_cylinder_mean_step_response(biot_number(h_W_m2K, r, k_W_mK), fourier_number(alpha_m2_s, time_s, r),
                                            biot_number(h_W_m2K, hl, k_W_mK),
                                            fourier_number(alpha_m2_s, time_s, hl), opts);
}

StepResponse brick_point_theta(const std::array<double, 3>& sides_m, double h_W_m2K, double k_W_mK,
                               double alpha_m2_s, double time_s, const std::array<double, 3>& offset_m,
                               const SeriesOptions& opts) {
  std::array<double, 3> bi{}, fo{}, x{};
  for (int i = 0; i < 3; ++i) {
    const double half = sides_m[static_cast<std::size_t>(i)] / 2;
    bi[i] = biot_number(h_W_m2K, half, k_W_mK);
    fo[i] = fourier_number(alpha_m2_s, time_s, half);
    x[i] = position_fraction(offset_m[i], half, "brick_point_theta", "offset_m");
  }
  return brick_step_response(bi, fo, x, opts);
}

StepResponse brick_mean_theta(const std::array<double, 3>& sides_m, double h_W_m2K, double k_W_mK,
                              double alpha_m2_s, double time_s, const SeriesOptions& opts) {
  std::array<double, 3> bi{}, fo{};
  for (std::size_t i = 0; i < 3; ++i) {
    bi[i] = biot_number(h_W_m2K, sides_m[i] / 2, k_W_mK);
    fo[i] = fourier_number(alpha_m2_s, time_s, sides_m[i] / 2);
  }
  return brick_mean_step_response(bi, fo, opts);
}

double one_term_theta(Geometry g, double biot, double fourier, double x) {
  require_inputs(biot, fourier, x, "one_term_theta", true);
  const double z = eigenvalue(g, biot, 1);
  return centre_coefficient(g, biot, z) * eigenfunction(g, z, x) * std::exp(-z * z * fourier);
}

}  // namespace coldcore
