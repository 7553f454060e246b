#pragma once
// Product-of-1D-modes basis of one stage (one set of surface conditions) and the sums over the
// modes it leaves out. Private to the history engine.
#include <array>
#include <vector>

#include "coldcore/model/shape.hpp"

namespace coldcore::detail {

/// Modes of one axis: Geometry, Biot number, half-length (m). Values are per mode n (0-based).
struct AxisModes {
  Geometry geometry = Geometry::slab;
  double biot = 0;
  double half_length_m = 0;
  std::vector<double> zeta, coef, surf, xbar, norm, dsurf;  // ζ, C, X(1), mean of X, N, X'(1)
  int m() const;
  double lambda(int n, double alpha) const {  // 1/s
    return alpha * zeta[n] * zeta[n] / (half_length_m * half_length_m);
  }
};

AxisModes axis_modes(Geometry g, double biot, double half_length_m, int count);

/// A position for evaluation, per axis: x in [0,1], or the mass average over that axis.
struct AxisPoint {
  bool mean = false;
  double x = 0;
};
using Point = std::array<AxisPoint, 3>;

/// Value of the axis mode n at p (X_n(x), or the mean of X_n).
double axis_value(const AxisModes& a, int n, const AxisPoint& p);

struct Basis {
  std::vector<AxisModes> axes;  // 1 to 3 axes
  double alpha = 0;
  int surface_axis = 0;         // the reported surface point: x = 1 on this axis, 0 on the others
  // kept product modes (λ <= lambda_cut)
  std::vector<std::array<int, 3>> index;
  std::vector<double> lambda, b, surface, mean;  // b = projection of 1 = product of C; Φ(0) = 1
  std::vector<double> b_over_lambda;
  double lambda_cut = 0;
  // Σ over ALL modes of b Φ/λ (s), and the part left out by the kept set (Q = full − kept)
  double full_centre = 0, full_surface = 0, full_mean = 0;
  double q_centre = 0, q_surface = 0, q_mean = 0;
  std::array<int, 3> dense{1, 1, 1};  // per-axis mode counts (the kept set lies inside)
  std::vector<AxisModes> ext;         // products only: outer axes with many modes, for full_ramp_sum

  /// The first left-out modes (λ_cut < λ <= lambda_shadow_end), for the transient of the surface
  /// and mean after an event; beyond them a remainder decaying like e^{−λ_end τ}.
  struct Shadow {
    std::vector<double> lambda, bs, bm;  // λ, b·Φ(surface), b·Φ(mean)
    double ramp_surface = 0, ramp_mean = 0;  // remainders of Σ bΦ/λ beyond the shadow modes
    double jump_surface = 0, jump_mean = 0;  // remainders of Σ bΦ beyond them
    double lambda_end = 0, lambda_first = 0;
  } shadow;

  Point centre_point() const { return Point{}; }
  Point surface_point() const;
  Point mean_point() const;
  /// Σ over all modes of b Φ(p)/λ, in s (closed form in 1D, semi-closed products otherwise).
  double full_ramp_sum(const Point& p) const;
  /// Kept-mode values Φ_k(p).
  std::vector<double> values(const Point& p) const;
};

/// Builds the basis: axes with their Biot numbers, all product modes with λ <= lambda_cut.
Basis make_basis(std::vector<AxisModes> axes, double alpha, int surface_axis, double lambda_cut);

/// Modes per axis needed so that every product mode with λ <= lambda_cut is present.
int modes_needed(Geometry g, double biot, double half_length_m, double alpha, double lambda_cut);

/// Weighted inner products ∫0^1 x^m X_i X'_j dx between the modes of two axes of the same
/// geometry with different Biot numbers (closed form from the two eigen-equations),
/// divided by the norm of the new mode j: the projection matrix (rows old i, columns new j).
std::vector<double> projection_matrix(const AxisModes& from, const AxisModes& to);
/// ∫0^1 x^m P_from X'_j dx / N_j with P the ramp profile of `from` (closed form).
std::vector<double> ramp_profile_projection(const AxisModes& from, const AxisModes& to);

}  // namespace coldcore::detail
