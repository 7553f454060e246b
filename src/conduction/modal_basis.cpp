#include "conduction/detail/modal_basis.hpp"

#include <algorithm>
#include <boost/math/special_functions/bessel.hpp>
#include <cmath>
#include <stdexcept>

#include "coldcore/conduction/modes.hpp"
#include "coldcore/conduction/quasi_steady.hpp"
#include "coldcore/error.hpp"
#include <string>

namespace coldcore::detail {

// Beyond this many product modes a history would need hundreds of MB: refuse instead.
constexpr std::size_t kMaxProductModes = 200000;

int AxisModes::m() const { return geometry_exponent(geometry); }

AxisModes axis_modes(Geometry g, double biot, double half_length_m, int count) {
  AxisModes a;
  a.geometry = g;
  a.biot = biot;
  a.half_length_m = half_length_m;
  const auto ms = modes(g, biot, count);
  const double m1 = geometry_exponent(g) + 1.0;
  for (const auto& md : ms) {
    const double z = md.zeta;
    a.zeta.push_back(z);
    a.coef.push_back(md.coefficient);
    a.norm.push_back(md.norm);
    // mean of X over the volume: (m+1)∫x^m X dx = (m+1)·C·N (C = ∫x^m X / N)
    a.xbar.push_back(m1 * md.coefficient * md.norm);
    if (std::isinf(biot)) {
      a.surf.push_back(0.0);
      switch (g) {
        case Geometry::slab: a.dsurf.push_back(-z * std::sin(z)); break;
        case Geometry::cylinder: a.dsurf.push_back(-z * boost::math::cyl_bessel_j(1, z)); break;
        case Geometry::sphere: a.dsurf.push_back(std::cos(z) - std::sin(z) / z); break;
      }
    } else {
      const double x1 = eigenfunction(g, z, 1.0);
      a.surf.push_back(x1);
      a.dsurf.push_back(-biot * x1);
    }
  }
  return a;
}

double axis_value(const AxisModes& a, int n, const AxisPoint& p) {
  if (p.mean) return a.xbar[n];
  if (p.x == 0.0) return 1.0;
  if (p.x == 1.0) return a.surf[n];
  return eigenfunction(a.geometry, a.zeta[n], p.x);
}

int modes_needed(Geometry g, double biot, double half_length_m, double alpha, double lambda_cut) {
  (void)g;
  (void)biot;
  // ζ_n > (n−1)π in every geometry, so n <= ζ_max/π + 1 modes can lie below the cut.
  const double zeta_max = half_length_m * std::sqrt(lambda_cut / alpha);
  return static_cast<int>(std::floor(zeta_max / M_PI)) + 2;
}

Point Basis::surface_point() const {
  Point p{};
  p[surface_axis].x = 1.0;
  return p;
}

Point Basis::mean_point() const {
  Point p{};
  for (auto& q : p) q.mean = true;
  return p;
}

namespace {

// Σ_n C_n X_n(p)/(μ + λ_n) for one axis, in closed form. μ = 0: (L²/α)·P; μ > 0: slab only.
double axis_shifted_sum(const AxisModes& a, double alpha, double mu, const AxisPoint& p) {
  const double l2a = a.half_length_m * a.half_length_m / alpha;
  if (mu == 0.0) {
    return l2a * (p.mean ? ramp_profile_mean(a.geometry, a.biot) : ramp_profile(a.geometry, a.biot, p.x));
  }
  if (a.geometry != Geometry::slab) throw std::logic_error("axis_shifted_sum: shifted sum needs a slab axis");
  const double kappa = std::sqrt(mu * l2a);
  return (p.mean ? shifted_slab_profile_mean(a.biot, kappa) : shifted_slab_profile(a.biot, kappa, p.x)) / mu;
}

// Σ over all product modes of axes[first..] of b Φ(p)/(μ + λ), written as the closed form of the
// first axis plus a sum over its modes of the (fast-decaying) difference between the inner sum
// and its interior value 1/(μ + λ_i).
double product_sum(const std::vector<AxisModes>& ext, double alpha, std::size_t first, double mu,
                   const Point& p) {
  const AxisModes& a = ext[first];
  if (first + 1 == ext.size()) return axis_shifted_sum(a, alpha, mu, p[first]);
  double sum = 0.0;
  for (std::size_t i = 0; i < a.zeta.size(); ++i) {
    const double nu = mu + a.lambda(static_cast<int>(i), alpha);
    const double inner = product_sum(ext, alpha, first + 1, nu, p) - 1.0 / nu;
    sum += a.coef[i] * axis_value(a, static_cast<int>(i), p[first]) * inner;
  }
  return axis_shifted_sum(a, alpha, mu, p[first]) + sum;
}

}  // namespace

double Basis::full_ramp_sum(const Point& p) const {
  if (axes.size() == 1) return axis_shifted_sum(axes[0], alpha, 0.0, p[0]);
  return product_sum(ext, alpha, 0, 0.0, p);
}

std::vector<double> Basis::values(const Point& p) const {
  std::vector<double> v(lambda.size(), 1.0);
  std::vector<std::vector<double>> per_axis(axes.size());
  for (std::size_t a = 0; a < axes.size(); ++a) {
    per_axis[a].resize(axes[a].zeta.size());
    for (std::size_t n = 0; n < axes[a].zeta.size(); ++n)
      per_axis[a][n] = axis_value(axes[a], static_cast<int>(n), p[a]);
  }
  for (std::size_t k = 0; k < v.size(); ++k)
    for (std::size_t a = 0; a < axes.size(); ++a) v[k] *= per_axis[a][index[k][a]];
  return v;
}

Basis make_basis(std::vector<AxisModes> axes, double alpha, int surface_axis, double lambda_cut) {
  Basis B;
  B.axes = std::move(axes);
  B.alpha = alpha;
  B.surface_axis = surface_axis;
  B.lambda_cut = lambda_cut;
  const std::size_t na = B.axes.size();
  for (std::size_t a = 0; a < na; ++a) B.dense[a] = static_cast<int>(B.axes[a].zeta.size());
  std::array<int, 3> idx{0, 0, 0};
  const int n0 = B.dense[0], n1 = na > 1 ? B.dense[1] : 1, n2 = na > 2 ? B.dense[2] : 1;
  for (idx[0] = 0; idx[0] < n0; ++idx[0])
    for (idx[1] = 0; idx[1] < n1; ++idx[1])
      for (idx[2] = 0; idx[2] < n2; ++idx[2]) {
        double lam = 0.0, b = 1.0, s = 1.0, mn = 1.0;
        for (std::size_t a = 0; a < na; ++a) {
          const auto& ax = B.axes[a];
          lam += ax.lambda(idx[a], alpha);
          b *= ax.coef[idx[a]];
          s *= (static_cast<int>(a) == surface_axis) ? ax.surf[idx[a]] : 1.0;
          mn *= ax.xbar[idx[a]];
        }
        // always keep the first mode (Bi = 0 axis aside, λ_1 is the slowest)
        const bool first = idx[0] == 0 && idx[1] == 0 && idx[2] == 0;
        if (lam > lambda_cut && !first) continue;
        if (B.index.size() >= kMaxProductModes)
          throw NotConverged("simulate: product modes: more than " + std::to_string(kMaxProductModes) +
                             " needed (lambda_cut = " + std::to_string(lambda_cut) +
                             " 1/s): the body is too elongated for the product series at this tol_K; "
                             "raise tol_K or model the long directions as a slab or cylinder");
        B.index.push_back(idx);
        B.lambda.push_back(lam);
        B.b.push_back(b);
        B.surface.push_back(s);
        B.mean.push_back(mn);
      }
  for (std::size_t k = 0; k < B.lambda.size(); ++k) B.b_over_lambda.push_back(B.b[k] / B.lambda[k]);
  if (na > 1) {
    // Outer axes of the product sums need more modes than the kept set: the summand decays like
    // i^-4 at a surface point (exponentially at interior points); 300 (2D) or 120 (3D) outer
    // modes leave a relative remainder below ~1e-7 of the sum, i.e. < 1e-6 K for ramps < 1 K/s.
    const int outer = na == 2 ? 300 : 120;
    for (std::size_t k = 0; k < na; ++k) {
      const auto& a = B.axes[k];
      if (k + 1 == na) B.ext.push_back(a);  // innermost is closed form
      else B.ext.push_back(axis_modes(a.geometry, a.biot, a.half_length_m, std::max<int>(outer, a.zeta.size())));
    }
  }
  B.full_centre = B.full_ramp_sum(B.centre_point());
  B.full_surface = B.full_ramp_sum(B.surface_point());
  B.full_mean = B.full_ramp_sum(B.mean_point());
  double kc = 0, ks = 0, km = 0;
  for (std::size_t k = 0; k < B.lambda.size(); ++k) {
    kc += B.b[k] / B.lambda[k];
    ks += B.b[k] * B.surface[k] / B.lambda[k];
    km += B.b[k] * B.mean[k] / B.lambda[k];
  }
  B.q_centre = B.full_centre - kc;
  B.q_surface = B.full_surface - ks;
  B.q_mean = B.full_mean - km;

  // shadow modes: 1D up to 4× the kept ζ (16× λ), products up to 2× per axis (4× λ)
  {
    const double f = na == 1 ? 16.0 : 4.0;
    const double lam_end = f * lambda_cut;
    std::vector<AxisModes> sx;
    for (const auto& a : B.axes)
      sx.push_back(axis_modes(a.geometry, a.biot, a.half_length_m,
                              modes_needed(a.geometry, a.biot, a.half_length_m, alpha, lam_end)));
    auto& sh = B.shadow;
    sh.lambda_end = lam_end;
    sh.lambda_first = lam_end;
    double sum_s = 0, sum_m = 0, sum_sj = 0, sum_mj = 0;
    std::vector<std::array<double, 3>> cand;  // λ, b·Φ(surface), b·Φ(mean)
    std::array<int, 3> j{0, 0, 0};
    const int m0 = static_cast<int>(sx[0].zeta.size()), m1 = na > 1 ? static_cast<int>(sx[1].zeta.size()) : 1,
              m2 = na > 2 ? static_cast<int>(sx[2].zeta.size()) : 1;
    for (j[0] = 0; j[0] < m0; ++j[0])
      for (j[1] = 0; j[1] < m1; ++j[1])
        for (j[2] = 0; j[2] < m2; ++j[2]) {
          double lam = 0.0, b = 1.0, sv = 1.0, mv = 1.0;
          for (std::size_t a = 0; a < na; ++a) {
            lam += sx[a].lambda(j[a], alpha);
            b *= sx[a].coef[j[a]];
            sv *= (static_cast<int>(a) == surface_axis) ? sx[a].surf[j[a]] : 1.0;
            mv *= sx[a].xbar[j[a]];
          }
          const bool first = j[0] == 0 && j[1] == 0 && j[2] == 0;
          if (lam <= lambda_cut || first || lam > lam_end) continue;
          cand.push_back({lam, b * sv, b * mv});
        }
    // products: only the 2K slowest left-out modes (the remainder term covers the rest), so that an
    // event's correction costs about two steps
    std::sort(cand.begin(), cand.end(), [](const auto& x, const auto& y) { return x[0] < y[0]; });
    const std::size_t keep = na == 1 ? cand.size() : std::min(cand.size(), 2 * B.lambda.size());
    if (keep < cand.size()) sh.lambda_end = cand[keep][0];
    for (std::size_t c = 0; c < keep; ++c) {
      const double lam = cand[c][0], bs = cand[c][1], bm = cand[c][2];
      sh.lambda.push_back(lam);
      sh.bs.push_back(bs);
      sh.bm.push_back(bm);
      sh.lambda_first = std::min(sh.lambda_first, lam);
      sum_s += bs / lam;
      sum_m += bm / lam;
      sum_sj += bs;
      sum_mj += bm;
    }
    sh.ramp_surface = B.q_surface - sum_s;
    sh.ramp_mean = B.q_mean - sum_m;
    // Σ over all modes of bΦ is the expansion of 1: 1 at the mean; at the surface point of a 1D
    // body with finite Bi also 1 (positive terms); for Bi = ∞ 0. In products the surface series
    // converges only conditionally: no jump remainder is used there.
    double kept_sj = 0, kept_mj = 0;
    for (std::size_t k = 0; k < B.lambda.size(); ++k) {
      kept_sj += B.b[k] * B.surface[k];
      kept_mj += B.b[k] * B.mean[k];
    }
    const bool surface_ok = na == 1 && !std::isinf(B.axes[0].biot);
    sh.jump_surface = surface_ok ? 1.0 - kept_sj - sum_sj : 0.0;
    sh.jump_mean = 1.0 - kept_mj - sum_mj;
  }
  return B;
}

std::vector<double> projection_matrix(const AxisModes& from, const AxisModes& to) {
  const std::size_t ni = from.zeta.size(), nj = to.zeta.size();
  std::vector<double> M(ni * nj);
  const bool finite = !std::isinf(from.biot) && !std::isinf(to.biot);
  for (std::size_t i = 0; i < ni; ++i)
    for (std::size_t j = 0; j < nj; ++j) {
      // (ζ_i² − ζ'_j²)∫x^m X_i X'_j = X'_j'(1) X_i(1) − X_i'(1) X'_j(1)   (Green's identity)
      const double num = finite ? (from.biot - to.biot) * from.surf[i] * to.surf[j]
                                : to.dsurf[j] * from.surf[i] - from.dsurf[i] * to.surf[j];
      const double den = (from.zeta[i] - to.zeta[j]) * (from.zeta[i] + to.zeta[j]);
      M[i * nj + j] = num / den / to.norm[j];
    }
  return M;
}

std::vector<double> ramp_profile_projection(const AxisModes& from, const AxisModes& to) {
  const double m1 = from.m() + 1.0;
  const double p1 = std::isinf(from.biot) ? 0.0 : 1.0 / (m1 * from.biot);  // P(1)
  std::vector<double> v(to.zeta.size());
  for (std::size_t j = 0; j < v.size(); ++j) {
    // ζ'²∫x^m P X' = ∫x^m X' − [P(1) X''(1) − P'(1) X'(1)],  P'(1) = −1/(m+1)
    const double boundary = p1 * to.dsurf[j] + to.surf[j] / m1;
    const double integral = to.coef[j] * to.norm[j];
    v[j] = (integral - boundary) / (to.zeta[j] * to.zeta[j]) / to.norm[j];
  }
  return v;
}

}  // namespace coldcore::detail
