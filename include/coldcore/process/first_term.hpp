#pragma once
/// First-term relations between the trade's heating parameters (f_h, j_h) at the geometric
/// centre and the conduction parameters (α, Bi). Long after the start only the first mode of
/// modes.hpp is left, θ_centre → C1·exp(−ζ1²·α·t/L²), so on the semi-log plot
///     f·α/L² = ln10/ζ1(Bi)²      and      j = C1(Bi)
/// (REFERENCES.md §4 "Theoretical conduction-heating values"). Shapes built by Newman's product
/// rule (finite cylinder = cylinder × slab, brick = slab × slab × slab) multiply θ, so
///     1/f = Σ 1/f_i      and      j = Π j_i,      Bi_i = h·L_i/k,
/// all axes sharing h and k. L: sphere and cylinder radius, slab half-thickness, finite cylinder
/// radius R and half-length H, brick half-sides. Pure computation.
#include "coldcore/conduction/modes.hpp"
#include "coldcore/model/product.hpp"
#include "coldcore/model/shape.hpp"

namespace coldcore::process {

/// f·α/L² = ln10/ζ1(Bi)² for one 1-D geometry. REQUIRES: 1e-6 <= biot <= ∞ (InputError).
double first_term_f_alpha_over_L2(Geometry g, double biot);
/// j = C1(Bi), the centre coefficient of the first mode. REQUIRES: as above.
double first_term_j(Geometry g, double biot);

struct FirstTermHeating {
  double f_s = 0;  ///< seconds per log cycle
  double j = 0;    ///< lag factor at the centre
};

/// f and j of a product for a diffusivity and the Biot number of its smallest dimension (the
/// other axes get Bi·L_i/L_smallest). REQUIRES: alpha_m2_s > 0, biot as above, dimensions > 0.
FirstTermHeating first_term_heating(const Product& product, double alpha_m2_s, double biot_smallest_dimension);

enum class FirstTermStatus {
  estimated,                    ///< Bi found in [1e-6, 1e6]
  j_at_or_above_infinite_biot,  ///< j >= its Bi = ∞ value: Bi and h infinite, α from f at Bi = ∞
  j_below_one                   ///< j < 1 is not a first-term centre value: α and h are NaN
};

struct FirstTermEstimate {
  FirstTermStatus status = FirstTermStatus::j_below_one;
  double biot_smallest_dimension = 0;  ///< h·L_smallest/k; +inf allowed
  double alpha_m2_s = 0;
  double h_W_m2K = 0;                  ///< +inf allowed
};

/// Inverts j = Π C1(Bi_i) for Bi (toms748 on ln Bi, Bi of the smallest dimension in [1e-6, 1e6];
/// j between 1 and its Bi = 1e-6 value gives 1e-6, j between its 1e6 and ∞ values gives 1e6),
/// then α from f: 1/f = Σ α·ζ1(Bi_i)²/(ln10·L_i²). k = α·rho_cp gives h = Bi·k/L_smallest.
/// REQUIRES (InputError): f_s > 0, j > 0, rho_cp_J_m3K > 0, all finite; product dimensions > 0.
FirstTermEstimate first_term_estimate(const Product& product, double f_s, double j, double rho_cp_J_m3K);

}  // namespace coldcore::process
