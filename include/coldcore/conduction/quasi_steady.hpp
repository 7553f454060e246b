#pragma once
/// Quasi-steady profiles of a body whose medium temperature ramps at a constant rate.
///
/// Under a medium ramp T∞(t) = T∞0 + s·t the temperature relative to the medium, u = T − T∞,
/// tends to the quasi-steady profile u(x) = −s·(L²/α)·P(x), where P solves −∇²P = 1 on x in
/// [0, 1] with P'(0) = 0 and P'(1) + Bi·P(1) = 0 (∇² the dimensionless Laplacian of the
/// geometry, weight x^m, m = 0 slab, 1 cylinder, 2 sphere):
///     P(x) = (1 − x²) / (2(m+1)) + 1 / ((m+1)·Bi)         (the 1/Bi term is 0 for Bi = ∞)
/// Its eigen-expansion is P(x) = Σ_n C_n X_n(x) / ζ_n², so the sum over the modes a truncated
/// series neglects, Σ_{n>N} C_n X_n(x)/ζ_n², is P(x) minus the first N terms (history engine).
/// Derived here by direct integration (check: −∇²P = 1 and the Robin condition hold exactly).
#include "coldcore/model/shape.hpp"

namespace coldcore {

/// P(x) above. REQUIRES: biot > 0 (kInfiniteBiot allowed), 0 <= x <= 1.
double ramp_profile(Geometry g, double biot, double x);

/// Mass average of P: (m+1)∫0^1 x^m P dx = 1/((m+1)(m+3)) + 1/((m+1)·Bi).
double ramp_profile_mean(Geometry g, double biot);

/// The shifted slab problem −S'' + κ²·S = 1, S'(0) = 0, S'(1) + Bi·S(1) = 0, times κ²:
/// κ²·S(y) = 1 − Bi·cosh(κy) / (κ sinh κ + Bi cosh κ), evaluated without overflow for large κ.
/// Its eigen-expansion is Σ_n C_n cos(ζ_n y) κ² / (κ² + ζ_n²) (slab modes). Used for the
/// neglected-mode sums of products of modes (finite cylinder, brick).
/// REQUIRES: kappa > 0, biot > 0 (kInfiniteBiot allowed), 0 <= y <= 1.
double shifted_slab_profile(double biot, double kappa, double y);
/// Mean over y of shifted_slab_profile: 1 − Bi·(sinh κ/κ) / (κ sinh κ + Bi cosh κ).
double shifted_slab_profile_mean(double biot, double kappa);

}  // namespace coldcore
