#pragma once
/// Step response of a solid initially at Ti placed in a medium at T∞ with a constant surface
/// heat-transfer coefficient: θ = (T − T∞)/(Ti − T∞) from the exact eigenfunction series,
/// for slab, infinite cylinder and sphere, and by Newman's product rule for the finite cylinder
/// (infinite cylinder × slab) and the brick (slab × slab × slab).
///
/// Position x: slab |position|/L from the mid-plane (L = half-thickness); cylinder and sphere r/R.
/// Fo = α t/L² (or α t/R²), Bi = h L/k (or h R/k), Bi in the domain of modes.hpp.
///
/// Term count (method `series`). With ζ_n ≥ (n−1)π for every geometry and a bound
/// |C_n X_n(x)| <= B(ζ_n) that does not increase with ζ, the tail after N terms obeys
///     Σ_{n>N} |C_n X_n(x)| e^{−ζ_n² Fo} <= B(πN) · [ e^{−aN²} + √π/(2√a) · erfc(√a N) ],
/// a = π² Fo (the sum of the decreasing function B(πy)e^{−a y²} over y = N, N+1, … bounded by its
/// first term plus its integral). Bounds used, for ζ >= π:
///     slab      |C_n| <= 2/ζ (C = 2 sin ζ/(ζ + sin ζ cos ζ), sin ζ cos ζ >= 0), |cos| <= 1;
///     cylinder  |C_n| <= 2.6/√ζ (asymptotically √(2π)/√ζ; verified for n <= 4000 over
///               Bi = 1e-6 … ∞ in tests/conduction/series_test.cpp), |J0(z)| <= min(1, √(2/(πz)))
///               (Watson §13.74);
///     sphere    |C_n| <= 4(1+ζ)/(2ζ−1), |sin(z)/z| <= min(1, 1/z).
/// For the mean, |M_n| <= 2/ζ² (slab), 2.6·2·0.7858 ζ^(−11/6) (cylinder, Landau's bound
/// |J1(z)| <= 0.7858 z^(−1/3)), 4(1+ζ)/(2ζ−1)·3(1+ζ)/ζ³ (sphere).
/// N is the smallest count whose tail bound is <= tol/2; the reported error_bound is that tail
/// plus 256 ε Σ|terms| for the rounding of the sum and of the coefficients (the measured C_n
/// error is <= 5e-14 relative, see modes.hpp).
///
/// Short times (method `short_time`), used only when N would exceed max_terms (with the default
/// options that is Fo below about 1.1e-7 for points and 5e-8 for the mean; tol = 1e-9):
///   * Any geometry, any point at a distance d = 1 − x from the surface where the heat has not yet
///     arrived: θ = 1 with error bound
///       slab 2 erfc(d/(2√Fo));  cylinder, sphere 2 e^{−d²/(4Fo)}/√(π Fo) + erfc(1/√Fo).
///     Derivation (maximum principle): the fixed-surface-temperature case (Bi = ∞) cools every
///     point at least as fast as any finite Bi; for the sphere u = r(1 − θ) solves the slab
///     equation on (0,1) with u(0) = 0, u(1) = 1 and is dominated by the image solution
///     erfc((1−r)/2√Fo) − erfc((1+r)/2√Fo) + r erfc(1/√Fo); the cylinder is dominated by the
///     sphere because the sphere's 1 − θ increases with r; the slab's by the two-face image sum.
///   * Slab near its surface: the semi-infinite solid with a convective surface (Carslaw & Jaeger,
///     Conduction of Heat in Solids, §2.7): θ = erf(η) + e^{−η²} erfcx(η + Bi√Fo), η = d/(2√Fo),
///     with the opposite face's contribution bounded by 2 erfc((2 − d)/(2√Fo)).
///     Slab mean: 1 − θ̄ = (erfcx(b) − 1 + 2b/√π)/Bi, b = Bi√Fo (heat taken up by the
///     semi-infinite solid), opposite face bounded by 2 erfc(1/(2√Fo)).
///   * Sphere near its surface and its mean: v = rθ solves the slab equation with initial v = r and
///     the convective condition ∂v/∂r = (1 − Bi) v at r = 1; its semi-infinite form is closed
///     (see series.cpp), opposite-side bound 4 erfc(1/(2√Fo))·(1 + Bi).
///   * Cylinder near its surface, and the cylinder mean: no short-time form is implemented; the
///     functions throw NotConverged (raise max_terms or use the numeric solver).
/// Nothing here ever returns an unconverged sum: if neither method meets tol, NotConverged.
#include <array>
#include <vector>

#include "coldcore/conduction/modes.hpp"
#include "coldcore/model/shape.hpp"

namespace coldcore {

struct SeriesOptions {
  double tol = 1e-9;     ///< absolute tolerance on θ (θ is between 0 and 1). REQUIRES: > 0.
  int max_terms = 4000;  ///< largest series length before switching to the short-time form.
};

enum class SeriesMethod { series, short_time };

/// "series" or "short-time".
const char* to_string(SeriesMethod m);

struct StepResponse {
  double theta = 1;                          ///< (T − T∞)/(Ti − T∞)
  SeriesMethod method = SeriesMethod::series;
  int terms = 0;                             ///< series terms summed (0 for short_time)
  double error_bound = 0;                    ///< |θ − exact| <= error_bound <= tol
};

/// θ at position x (0 = centre or mid-plane, 1 = surface) after Fourier number `fourier`.
/// REQUIRES: biot in the modes.hpp domain, fourier >= 0 and finite, 0 <= x <= 1 (InputError).
/// fourier == 0 or biot == 0 gives θ = 1 exactly. Throws NotConverged as described above.
StepResponse step_response(Geometry g, double biot, double fourier, double x, const SeriesOptions& opts = {});

/// Mass-average θ: Σ M_n exp(−ζ_n² Fo). Same contract as step_response.
StepResponse mean_step_response(Geometry g, double biot, double fourier, const SeriesOptions& opts = {});

/// Series evaluation with caller-supplied modes (modes(g, biot, count)), for callers that evaluate
/// many times. Throws NotConverged if the tail bound needs more modes than supplied (no
/// short-time switch here).
StepResponse step_response(Geometry g, const std::vector<Mode>& modes, double fourier, double x, double tol = 1e-9);
StepResponse mean_step_response(Geometry g, const std::vector<Mode>& modes, double fourier, double tol = 1e-9);

/// Smallest N whose tail bound (above) is <= tail_tol, or -1 if more than max_terms are needed.
/// x < 0 means the mean. Exposed for tests and for callers that size their mode sets.
int series_terms_needed(Geometry g, double fourier, double x, double tail_tol, int max_terms);

/// The tail bound after N terms at x (x < 0: the mean). REQUIRES: N >= 1, fourier > 0.
double series_tail_bound(Geometry g, double fourier, double x, int N);

/// One factor of a product solution: a 1D geometry with its own Bi, Fo and position.
struct ProductFactor {
  Geometry geometry;
  double biot;
  double fourier;
  double x;  ///< ignored by the mean functions
};

/// Newman's product rule θ = Π θ_i (Incropera §5.8). Each factor is evaluated to tol/(2k) for k
/// factors; the error bound of the product is Σ e_i Π_{j≠i}(|θ_j| + e_j). method is short_time
/// if any factor used it; terms is the sum over factors.
StepResponse product_step_response(const std::vector<ProductFactor>& factors, const SeriesOptions& opts = {});
StepResponse product_mean_step_response(const std::vector<ProductFactor>& factors, const SeriesOptions& opts = {});

/// Finite cylinder of radius R and half-length H: infinite cylinder (Bi_R = hR/k, Fo_R = αt/R²,
/// r/R) × slab (Bi_H = hH/k, Fo_H = αt/H², z/H from the mid-plane).
StepResponse finite_cylinder_step_response(double biot_radius, double fourier_radius, double r_over_R,
                                           double biot_half_length, double fourier_half_length,
                                           double z_over_H, const SeriesOptions& opts = {});
StepResponse finite_cylinder_mean_step_response(double biot_radius, double fourier_radius, double biot_half_length,
                                                double fourier_half_length, const SeriesOptions& opts = {});

/// Brick with half-sides L1, L2, L3: slab × slab × slab, each with its own Bi_i = hL_i/k,
/// Fo_i = αt/L_i² and x_i = |position_i|/L_i.
StepResponse brick_step_response(const std::array<double, 3>& biot, const std::array<double, 3>& fourier,
                                 const std::array<double, 3>& x, const SeriesOptions& opts = {});
StepResponse brick_mean_step_response(const std::array<double, 3>& biot, const std::array<double, 3>& fourier,
                                      const SeriesOptions& opts = {});

/// Dimensional forms of the product rule for a product of uniform properties.
/// Finite cylinder: diameter D, length L; the point at radius r_m (0 … D/2) and axial distance
/// z_m from the mid-plane (−L/2 … L/2). Bi and Fo per factor from R = D/2 and H = L/2.
/// REQUIRES: sizes, k, alpha > 0; h >= 0; time_s >= 0; the point inside (InputError otherwise).
StepResponse finite_cylinder_point_theta(double diameter_m, double length_m, double h_W_m2K, double k_W_mK,
                                         double alpha_m2_s, double time_s, double r_m, double z_m,
                                         const SeriesOptions& opts = {});
StepResponse finite_cylinder_mean_theta(double diameter_m, double length_m, double h_W_m2K, double k_W_mK,
                                        double alpha_m2_s, double time_s, const SeriesOptions& opts = {});
/// Brick with full sides a, b, c; the point at signed offsets from the centre (|offset_i| <= side_i/2).
StepResponse brick_point_theta(const std::array<double, 3>& sides_m, double h_W_m2K, double k_W_mK,
                               double alpha_m2_s, double time_s, const std::array<double, 3>& offset_m,
                               const SeriesOptions& opts = {});
StepResponse brick_mean_theta(const std::array<double, 3>& sides_m, double h_W_m2K, double k_W_mK,
                              double alpha_m2_s, double time_s, const SeriesOptions& opts = {});

/// One-term approximation C_1 X_1(x) exp(−ζ_1² Fo) (the handbook form; within 2 % of the series
/// for Fo > 0.2, Çengel / Heisler). For teaching and comparison only.
double one_term_theta(Geometry g, double biot, double fourier, double x);

}  // namespace coldcore
