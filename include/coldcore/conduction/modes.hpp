#pragma once
/// Eigenvalues, eigenfunctions and expansion coefficients of transient conduction with a
/// convective surface in the three one-dimensional geometries (slab, infinite cylinder, sphere).
///
/// Dimensionless problem: θ = (T − T∞)/(Ti − T∞), x = position/L (slab: L = half-thickness,
/// x from the mid-plane) or x = r/R (cylinder, sphere), Fo = α·t/L², Bi = h·L/k.
/// For a uniform initial θ0 = 1 the solution is
///     θ(x, Fo) = Σ_n C_n · X_n(x) · exp(−ζ_n² · Fo)
///     mean θ(Fo) = Σ_n M_n · exp(−ζ_n² · Fo)          (mass average)
/// with the eigen-equations
///     slab      ζ · tan ζ        = Bi      X(x) = cos(ζx)
///     cylinder  ζ · J1(ζ)/J0(ζ)  = Bi      X(x) = J0(ζx)
///     sphere    1 − ζ · cot ζ    = Bi      X(x) = sin(ζx)/(ζx)
/// (Incropera et al., Fundamentals of Heat and Mass Transfer, §5.6; Carslaw & Jaeger,
/// Conduction of Heat in Solids, §3.10, §7.7, §9.8.)
///
/// Domain of Biot numbers: biot == 0 exactly (insulated surface: ζ_1 = 0, C_1 = 1, every other
/// C_n = 0), or 1e-6 <= biot <= kInfiniteBiot (biot = +infinity is a fixed surface temperature).
/// Anything else (negative, NaN, or 0 < biot < 1e-6) throws InputError; below 1e-6 use the lumped
/// solution (lumped.hpp), which differs from the series by O(Bi) there.
///
/// Accuracy (measured against the mpmath table tests/reference/modes.csv, n = 1..50,
/// Bi = 1e-6 … 1e6 and ∞; the test requires 1e-10 relative): ζ_n worst 5e-16 relative,
/// C_n 5e-14, M_n 2e-15, N_n 1e-13 (worst rows: cylinder Bi = 100, n = 37).
/// Each root is bracketed in its own interval and solved with Boost.Math toms748:
///     slab      ((n−1)π, (n−½)π)
///     cylinder  (j1,n−1 , j0,n)   consecutive zeros of J1 (j1,0 = 0) and J0
///     sphere    ((n−1)π, nπ)
/// so ζ_n is strictly increasing in n. Bi = ∞ returns the exact limits (n−½)π, j0,n, nπ;
/// Bi >= 1e9 returns ζ∞·Bi/(Bi+1), exact to O((ζ/Bi)²) relative (continuity at 1e9 is tested).
/// n is tested up to 4000.
#include <limits>
#include <vector>

#include "coldcore/model/shape.hpp"

namespace coldcore {

/// A fixed surface temperature (h → ∞).
inline constexpr double kInfiniteBiot = std::numeric_limits<double>::infinity();
/// Smallest non-zero Biot number the eigen-solver accepts.
inline constexpr double kMinPositiveBiot = 1e-6;

/// Throws InputError "<where>: biot = <value>: must be 0 or in [1e-06, inf]" unless biot is in
/// the domain above. `where` names the calling function or input place.
void require_biot(double biot, const char* where);

/// The n-th eigenvalue ζ_n (n = 1, 2, …). REQUIRES: biot in the domain above, n >= 1
/// (InputError otherwise). Throws NotConverged if toms748 fails (never observed).
double eigenvalue(Geometry g, double biot, int n);

/// ζ_1 … ζ_count. REQUIRES: count >= 0.
std::vector<double> eigenvalues(Geometry g, double biot, int count);

/// The open interval (lower, upper) that holds ζ_n alone (see the brackets above).
struct RootBracket {
  double lower;
  double upper;
};
RootBracket eigenvalue_bracket(Geometry g, double biot, int n);

/// X(x) normalised to X(0) = 1: slab cos(ζx), cylinder J0(ζx), sphere sin(ζx)/(ζx).
/// REQUIRES: zeta >= 0, 0 <= x <= 1 (x slightly outside is not checked; x is |position|/L).
double eigenfunction(Geometry g, double zeta, double x);

/// C_n such that θ(x, Fo) = Σ C_n X_n(x) exp(−ζ_n² Fo) for a uniform initial θ0 = 1.
///   slab     4 sin ζ / (2ζ + sin 2ζ)
///   cylinder (2/ζ) J1(ζ) / (J0(ζ)² + J1(ζ)²)
///   sphere   4 (sin ζ − ζ cos ζ) / (2ζ − sin 2ζ)
/// biot must be the Biot number ζ belongs to: it is used (through the eigen-equation) to
/// evaluate the factor that is nearly zero (sin ζ for the slab at small Bi, J1 or J0 for the
/// cylinder, sin ζ for the sphere at large Bi) without cancellation, so high modes keep full
/// relative accuracy.
double centre_coefficient(Geometry g, double biot, double zeta);

/// M_n such that mean θ(Fo) = Σ M_n exp(−ζ_n² Fo); M_n = (m+1) C_n ∫0^1 x^m X_n dx >= 0:
///   slab C_n sin ζ/ζ, cylinder C_n 2 J1(ζ)/ζ, sphere C_n 3 (sin ζ − ζ cos ζ)/ζ³.
double mean_coefficient(Geometry g, double biot, double zeta);

/// N_n = ∫0^1 x^m X_n(x)² dx with m = 0, 1, 2 for slab, cylinder, sphere:
///   slab 1/2 + sin 2ζ/(4ζ), cylinder (J0² + J1²)/2, sphere (1/2 − sin 2ζ/(4ζ))/ζ².
/// The modes are orthogonal with weight x^m; projecting a profile f gives
/// a_n = ∫0^1 x^m f X_n dx / N_n.
double mode_norm(Geometry g, double biot, double zeta);

struct Mode {
  int n;                    ///< 1-based index
  double zeta;              ///< ζ_n
  double coefficient;       ///< C_n (centre coefficient)
  double mean_coefficient;  ///< M_n
  double norm;              ///< N_n
};

/// The first `count` modes. REQUIRES: count >= 0, biot in the domain above.
std::vector<Mode> modes(Geometry g, double biot, int count);

/// The Fourier number beyond which the second term at the centre is below 1 % of the first, so
/// the one-term form is good to about 1 % there (0 when it always is). NaN with fewer than two
/// modes.
double one_term_fourier(const std::vector<Mode>& m);

/// The exponent m of the weight x^m: 0 slab, 1 cylinder, 2 sphere. Also the lumped-capacitance
/// factor is m + 1 (mean θ → exp(−(m+1)·Bi·Fo) as Bi → 0).
int geometry_exponent(Geometry g);

}  // namespace coldcore
