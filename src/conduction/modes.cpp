#include "coldcore/conduction/modes.hpp"

#include <boost/math/constants/constants.hpp>
#include <boost/math/special_functions/bessel.hpp>
#include <boost/math/special_functions/sinc.hpp>
#include <boost/math/tools/roots.hpp>
#include <boost/math/tools/toms748_solve.hpp>
#include <algorithm>
#include <cmath>
#include <limits>
#include <cstdint>
#include <sstream>
#include <string>

#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"

namespace coldcore {
namespace {

constexpr double kPi = boost::math::constants::pi<double>();

// cos δ − sin δ/δ without cancellation at small δ (the sphere's first root at small Bi sits at
// δ ≈ √(3 Bi), where both terms are ≈ 1 and their difference ≈ −δ²/3).
double cos_minus_sinc(double d) {
  if (std::abs(d) > 0.5) return std::cos(d) - std::sin(d) / d;
  // Σ_{k>=1} (−1)^k δ^{2k} · 2k/(2k+1)!
  const double d2 = d * d;
  double term = 1.0;  // δ^{2k}/(2k+1)! built up incrementally
  double sum = 0.0;
  for (int k = 1; k <= 12; ++k) {
    term *= d2 / ((2.0 * k) * (2.0 * k + 1.0));
    sum += ((k % 2) ? -1.0 : 1.0) * term * (2.0 * k);
  }
  return sum;
}

double bessel_j0(double z) { return boost::math::cyl_bessel_j(0, z); }
double bessel_j1(double z) { return boost::math::cyl_bessel_j(1, z); }

// Solve f = 0 on [lo, hi] where f(lo) and f(hi) have opposite signs.
template <class F>
double solve_bracketed(F f, double lo, double hi, const char* what, int n, double biot) {
  const double flo = f(lo);
  const double fhi = f(hi);
  if (flo == 0) return lo;
  if (fhi == 0) return hi;
  if ((flo < 0) == (fhi < 0)) {
    throw NotConverged(std::string(what) + ": n = " + std::to_string(n) + ", biot = " + number_text(biot, 17) +
                       ": root not bracketed in [" + number_text(lo, 17) + ", " + number_text(hi, 17) + "]");
  }
  std::uintmax_t iters = 200;
  boost::math::tools::eps_tolerance<double> tol(std::numeric_limits<double>::digits - 2);
  auto r = boost::math::tools::toms748_solve(f, lo, hi, flo, fhi, tol, iters);
  if (iters >= 200) {
    throw NotConverged(std::string(what) + ": n = " + std::to_string(n) + ", biot = " + number_text(biot, 17) +
                       ": toms748 did not converge in 200 iterations");
  }
  return 0.5 * (r.first + r.second);
}

// The root δ of δ = c − atan(k/(a + δ)) for a >= π (the higher roots of the slab, c = 0,
// k = −Bi, and of the sphere, c = π/2, k = 1 − Bi), by Newton's method from the fixed-point
// guess. g(δ) = δ − c + atan(k/(a + δ)) has g' = 1 − k/((a + δ)² + k²), within 1/(2(a + δ)) < 0.16
// of 1, so the iteration converges fast from anywhere in the bracket; a few evaluations replace
// the ~10 of a bracketed solve (a history needs up to ~100 roots). The tests check the result
// against the mpmath table to 1e-10 and against the bracketed solve to a few ulps.
// Returns NaN if it has not settled within 20 iterations or leaves [lo, hi] (the caller then
// uses the bracketed solve).
double higher_root(double a, double c, double k, double lo, double hi) {
  double d = c - std::atan(k / (a + c));
  for (int i = 0; i < 20; ++i) {
    const double z = a + d;
    const double g = d - c + std::atan(k / z);
    const double step = g / (1.0 - k / (z * z + k * k));
    d -= step;
    if (!(d >= lo && d <= hi)) return std::nan("");
    if (std::abs(step) <= 1e-16 * (a + d)) return d;
  }
  return std::nan("");
}

// sign of the larger of two numbers that share a sign (sin and cos of an angle in the first or
// third quadrant): the larger one is computed with full relative accuracy, so its sign is safe.
double sign_of_larger(double a, double b) { return std::copysign(1.0, std::abs(a) >= std::abs(b) ? a : b); }

void require_n(int n, const char* where) {
  if (n < 1) throw InputError(std::string(where) + ": n = " + std::to_string(n) + ": must be >= 1");
}

void require_zeta(double zeta, const char* where) {
  if (!(zeta >= 0) || !std::isfinite(zeta))
    throw InputError(std::string(where) + ": zeta = " + number_text(zeta, 17) + ": must be finite and >= 0");
}

// Above this Bi the root is ζ∞·Bi/(Bi + 1) to within O((ζ/Bi)²) relative (< 2e-10·ε for n <= 4000):
// slab (b − ε) cot ε = Bi gives ε = b/(Bi + 1 + bε/3 + …), sphere ε = c/Bi + …, cylinder
// J0(j − ε) ≈ J1(j) ε gives ε = j/(Bi + O(1)). The bracketed solve would fail here because
// cos((n−½)π) and J0(j0,n) evaluated at the rounded end points are as large as the true
// function values.
constexpr double kAsymptoticBiot = 1e9;

double asymptotic_root(double root_at_infinity, double biot) { return root_at_infinity * (biot / (biot + 1)); }

double slab_root(double biot, int n) {
  const double a = (n - 1) * kPi;
  if (biot == 0) return a;
  if (std::isinf(biot)) return (n - 0.5) * kPi;
  if (biot >= kAsymptoticBiot) return asymptotic_root((n - 0.5) * kPi, biot);
  // ζ = a + δ, δ in (0, π/2): tan ζ = tan δ, so solve (a+δ) sin δ = Bi cos δ in δ; working in δ
  // keeps full relative precision when δ is tiny (small Bi) and for large n.
  if (n >= 2) {
    const double d = higher_root(a, 0.0, -biot, 0.0, kPi / 2);
    if (!std::isnan(d)) return a + d;
  }
  double d;
  if (biot <= 1) {
    d = solve_bracketed([&](double x) { return (a + x) * std::sin(x) - biot * std::cos(x); }, 0.0, kPi / 2,
                        "eigenvalue(slab)", n, biot);
  } else {
    d = solve_bracketed([&](double x) { return (a + x) * std::sin(x) / biot - std::cos(x); }, 0.0, kPi / 2,
                        "eigenvalue(slab)", n, biot);
  }
  return a + d;
}

double sphere_root(double biot, int n) {
  const double a = (n - 1) * kPi;
  if (std::isinf(biot)) return n * kPi;
  if (biot >= kAsymptoticBiot) return asymptotic_root(n * kPi, biot);
  if (n == 1) {
    if (biot == 0) return 0.0;
    // Divide ζ cos ζ − (1 − Bi) sin ζ by ζ to remove the trivial root ζ = 0.
    const double s = biot <= 1 ? 1.0 : 1.0 / biot;
    return solve_bracketed(
        [&](double x) { return s * (cos_minus_sinc(x) + biot * boost::math::sinc_pi(x)); }, 0.0, kPi,
        "eigenvalue(sphere)", n, biot);
  }
  // ζ = a + δ, δ in (0, π): (a+δ) cos δ = (1 − Bi) sin δ, i.e. δ = π/2 − atan((1 − Bi)/(a + δ)).
  {
    const double d = higher_root(a, kPi / 2, 1 - biot, 0.0, kPi);
    if (!std::isnan(d)) return a + d;
  }
  double d;
  if (biot <= 1) {
    d = solve_bracketed([&](double x) { return (a + x) * std::cos(x) - (1 - biot) * std::sin(x); }, 0.0, kPi,
                        "eigenvalue(sphere)", n, biot);
  } else {
    d = solve_bracketed([&](double x) { return (a + x) * std::cos(x) / biot - (1 / biot - 1) * std::sin(x); },
                        0.0, kPi, "eigenvalue(sphere)", n, biot);
  }
  return a + d;
}

double cylinder_root(double biot, int n) {
  const double lo = boost::math::cyl_bessel_j_zero(1.0, n - 1);  // j1,0 = 0
  const double hi = boost::math::cyl_bessel_j_zero(0.0, n);
  if (biot == 0) return lo;
  if (std::isinf(biot)) return hi;
  if (biot >= kAsymptoticBiot) return asymptotic_root(hi, biot);
  if (biot <= 1) {
    return solve_bracketed([&](double z) { return z * bessel_j1(z) - biot * bessel_j0(z); }, lo, hi,
                           "eigenvalue(cylinder)", n, biot);
  }
  return solve_bracketed([&](double z) { return z * bessel_j1(z) / biot - bessel_j0(z); }, lo, hi,
                         "eigenvalue(cylinder)", n, biot);
}

// The three coefficient-bearing quantities of one mode, evaluated without cancellation.
struct ModeParts {
  double coefficient;
  double mean;
  double norm;
};

ModeParts slab_parts(double biot, double zeta) {
  if (zeta == 0) return {1.0, 1.0, 1.0};  // Bi = 0, n = 1: the uniform mode
  // tan ζ = t = Bi/ζ; sin ζ and cos ζ share the sign s (first/third quadrant).
  const double s = sign_of_larger(std::sin(zeta), std::cos(zeta));
  const double t = biot / zeta;
  double sn, cs;
  if (t <= 1) {
    cs = s / std::sqrt(1 + t * t);
    sn = t * cs;
  } else {
    const double it = 1 / t;  // 0 at Bi = ∞
    sn = s / std::sqrt(1 + it * it);
    cs = it * sn;
  }
  const double sc = sn * cs;  // >= 0
  const double c = 2 * sn / (zeta + sc);
  return {c, c * sn / zeta, 0.5 + sc / (2 * zeta)};
}

ModeParts cylinder_parts(double biot, double zeta) {
  if (zeta == 0) return {1.0, 1.0, 0.5};
  double j0 = bessel_j0(zeta);
  double j1 = bessel_j1(zeta);
  // Eigen-equation ζ J1 = Bi J0: evaluate the smaller factor from the larger one.
  if (std::isinf(biot)) {
    j0 = 0;
  } else if (std::abs(j0) >= std::abs(j1)) {
    j1 = biot * j0 / zeta;
  } else {
    j0 = zeta * j1 / biot;
  }
  const double q = j0 * j0 + j1 * j1;
  const double c = 2 * j1 / (zeta * q);
  return {c, c * 2 * j1 / zeta, q / 2};
}

ModeParts sphere_parts(double biot, double zeta) {
  if (zeta == 0) return {1.0, 1.0, 1.0 / 3.0};
  // ζ cot ζ = 1 − Bi. σ = sign(sin ζ); cos ζ = σ·(1 − Bi)/ζ·|sin ζ|.
  const double sn0 = std::sin(zeta), cs0 = std::cos(zeta);
  double sigma;
  if (std::abs(sn0) >= std::abs(cs0) || biot == 1) {
    sigma = std::copysign(1.0, sn0);
  } else {
    sigma = std::copysign(1.0, cs0) * (biot < 1 ? 1.0 : -1.0);
  }
  // b = Bi sin ζ = sin ζ − ζ cos ζ and d = ζ − sin ζ cos ζ, both in closed forms from the
  // eigen-equation that have no cancellation (d at the first mode of small Bi, b at large Bi).
  double b, d;
  if (biot <= 1) {
    const double w = 1 - biot;
    const double den = zeta * zeta + w * w;
    b = sigma * biot * zeta / std::sqrt(den);
    d = zeta * (zeta * zeta - biot * w) / den;
  } else {
    const double ib = 1 / biot;  // 0 at Bi = ∞
    const double zb = zeta * ib;
    const double den = zb * zb + (ib - 1) * (ib - 1);
    b = sigma * zeta / std::sqrt(den);
    d = zeta * (zb * zb - ib + 1) / den;
  }
  const double c = 2 * b / d;
  return {c, c * 3 * b / (zeta * zeta * zeta), d / (2 * zeta * zeta * zeta)};
}

ModeParts parts(Geometry g, double biot, double zeta, const char* where) {
  require_biot(biot, where);
  require_zeta(zeta, where);
  switch (g) {
    case Geometry::slab: return slab_parts(biot, zeta);
    case Geometry::cylinder: return cylinder_parts(biot, zeta);
    case Geometry::sphere: return sphere_parts(biot, zeta);
  }
  return {0, 0, 0};
}

}  // namespace

void require_biot(double biot, const char* where) {
  if (biot == 0 || (biot >= kMinPositiveBiot && biot <= kInfiniteBiot)) return;
  throw InputError(std::string(where) + ": biot = " + number_text(biot, 17) + ": must be 0 or in [1e-06, inf]");
}

int geometry_exponent(Geometry g) {
  switch (g) {
    case Geometry::slab: return 0;
    case Geometry::cylinder: return 1;
    case Geometry::sphere: return 2;
  }
  return 0;
}

double eigenvalue(Geometry g, double biot, int n) {
  require_biot(biot, "eigenvalue");
  require_n(n, "eigenvalue");
  switch (g) {
    case Geometry::slab: return slab_root(biot, n);
    case Geometry::cylinder: return cylinder_root(biot, n);
    case Geometry::sphere: return sphere_root(biot, n);
  }
  return 0;
}

std::vector<double> eigenvalues(Geometry g, double biot, int count) {
  if (count < 0) throw InputError("eigenvalues: count = " + std::to_string(count) + ": must be >= 0");
  std::vector<double> z;
  z.reserve(static_cast<std::size_t>(count));
  for (int n = 1; n <= count; ++n) z.push_back(eigenvalue(g, biot, n));
  return z;
}

RootBracket eigenvalue_bracket(Geometry g, double biot, int n) {
  require_biot(biot, "eigenvalue_bracket");
  require_n(n, "eigenvalue_bracket");
  switch (g) {
    case Geometry::slab: return {(n - 1) * kPi, (n - 0.5) * kPi};
    case Geometry::cylinder:
      return {boost::math::cyl_bessel_j_zero(1.0, n - 1), boost::math::cyl_bessel_j_zero(0.0, n)};
    case Geometry::sphere: return {(n - 1) * kPi, n * kPi};
  }
  return {0, 0};
}

double eigenfunction(Geometry g, double zeta, double x) {
  const double z = zeta * x;
  switch (g) {
    case Geometry::slab: return std::cos(z);
    case Geometry::cylinder: return bessel_j0(z);
    case Geometry::sphere: return boost::math::sinc_pi(z);
  }
  return 0;
}

double centre_coefficient(Geometry g, double biot, double zeta) {
  return parts(g, biot, zeta, "centre_coefficient").coefficient;
}

double mean_coefficient(Geometry g, double biot, double zeta) {
  return parts(g, biot, zeta, "mean_coefficient").mean;
}

double mode_norm(Geometry g, double biot, double zeta) { return parts(g, biot, zeta, "mode_norm").norm; }

std::vector<Mode> modes(Geometry g, double biot, int count) {
  if (count < 0) throw InputError("modes: count = " + std::to_string(count) + ": must be >= 0");
  require_biot(biot, "modes");
  std::vector<Mode> out;
  out.reserve(static_cast<std::size_t>(count));
  for (int n = 1; n <= count; ++n) {
    const double z = eigenvalue(g, biot, n);
    const ModeParts p = parts(g, biot, z, "modes");
    out.push_back({n, z, p.coefficient, p.mean, p.norm});
  }
  return out;
}

double one_term_fourier(const std::vector<Mode>& m) {
  if (m.size() < 2) return std::numeric_limits<double>::quiet_NaN();
  const double ratio = std::abs(m[1].coefficient / m[0].coefficient);
  const double fo = std::log(100.0 * ratio) / (m[1].zeta * m[1].zeta - m[0].zeta * m[0].zeta);
  return std::max(fo, 0.0);
}

}  // namespace coldcore
