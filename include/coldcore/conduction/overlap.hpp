#pragma once
/// Inner products of eigenfunctions with different eigenvalues, for projecting a profile that
/// was expanded in the modes of one Biot number onto the modes of another (a stage change of h).
#include "coldcore/model/shape.hpp"

namespace coldcore {

/// ∫0^1 x^m X(a x) X(b x) dx with m = 0, 1, 2 for slab, cylinder, sphere and X as in modes.hpp
/// (cos, J0, sin(z)/z). a == b gives the norm; a or b == 0 is the uniform mode X = 1.
/// Closed forms: slab ½[sinc(a−b) + sinc(a+b)]; sphere [sinc(a−b) − sinc(a+b)]/(2ab);
/// cylinder (Lommel) [b J0(a) J1(b) − a J1(a) J0(b)]/(b² − a²), evaluated for |a − b| <= 0.5 as
/// the mean over [a, b] of J0(a) t J0(t) + a J1(a) J1(t), divided by a + b (15-point
/// Gauss–Legendre), which removes the cancellation of the closed form. For max(a, b) <= 2 the
/// definition itself is integrated (15-point Gauss–Legendre; the integrand is entire and slowly
/// varying there). Accuracy: ~1e-14 absolute, checked against adaptive Gauss–Kronrod quadrature
/// in tests/conduction/overlap_test.cpp. REQUIRES: a >= 0, b >= 0, finite (InputError).
double mode_overlap(Geometry g, double a, double b);

/// ∫0^1 x^m X(z x) dx (the weight of a uniform profile): slab sin z/z, cylinder J1(z)/z,
/// sphere (sin z − z cos z)/z³; 1/(m+1) at z = 0. REQUIRES: z >= 0, finite.
double mode_integral(Geometry g, double z);

}  // namespace coldcore
