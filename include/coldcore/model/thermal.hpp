#pragma once
/// Thermal properties of a product, in SI units.

namespace coldcore {

struct ThermalProperties {
  double conductivity_W_mK = 0;   ///< k > 0
  double density_kg_m3 = 0;       ///< rho > 0
  double specific_heat_J_kgK = 0; ///< cp > 0
  /// alpha = k / (rho cp), m²/s.
  double diffusivity_m2_s() const { return conductivity_W_mK / (density_kg_m3 * specific_heat_J_kgK); }
};

}  // namespace coldcore
