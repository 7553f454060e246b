// Choi–Okos (1986) component polynomials, coefficients as in REFERENCES.md §5.3.
// T in °C; the fits give k in W/m·K, ρ in kg/m³ and cp in kJ/kg·K (converted to J/kg·K here).
#include <cmath>
#include <sstream>
#include <string>

#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"
#include "coldcore/properties/composition.hpp"

namespace coldcore {
namespace {

struct Quadratic {
  double c0, c1, c2;
  double at(double t) const { return c0 + (c1 + c2 * t) * t; }
};

struct ComponentFit {
  Quadratic k, rho, cp;
};

// Each line is one row of the §5.3 table; the 0 °C value of every fit is its constant term,
// which the tests use to guard against the copying errors of public implementations listed in REFERENCES §7.
constexpr ComponentFit protein_fit{{0.17881, 1.1958e-3, -2.7178e-6}, {1329.9, -0.51840, 0.0},
                                   {2.0082, 1.2089e-3, -1.3129e-6}};
constexpr ComponentFit fat_fit{{0.18071, -2.7604e-4, -1.7749e-7}, {925.59, -0.41757, 0.0},
                               {1.9842, 1.4733e-3, -4.8008e-6}};
constexpr ComponentFit carbohydrate_fit{{0.20141, 1.3874e-3, -4.3312e-6}, {1599.1, -0.31046, 0.0},
                                        {1.5488, 1.9625e-3, -5.9399e-6}};
constexpr ComponentFit fiber_fit{{0.18331, 1.2497e-3, -3.1683e-6}, {1311.5, -0.36589, 0.0},
                                 {1.8459, 1.8306e-3, -4.6509e-6}};
constexpr ComponentFit ash_fit{{0.32962, 1.4011e-3, -2.9069e-6}, {2423.8, -0.28063, 0.0},
                               {1.0926, 1.8896e-3, -3.6817e-6}};
// Water: liquid cp branch for 0..150 °C; the second branch covers −40..0 °C.
constexpr ComponentFit water_fit{{0.57109, 1.7625e-3, -6.7036e-6}, {997.18, 3.1439e-3, -3.7574e-3},
                                 {4.1762, -9.0864e-5, 5.4731e-6}};
constexpr Quadratic water_cp_below_zero{4.0817, -5.3062e-3, 9.9516e-4};
constexpr ComponentFit ice_fit{{2.2196, -6.2489e-3, 1.0154e-4}, {916.89, -0.13071, 0.0},
                               {2.0623, 6.0769e-3, 0.0}};

const ComponentFit& fit_of(FoodComponent c) {
  switch (c) {
    case FoodComponent::water: return water_fit;
    case FoodComponent::ice: return ice_fit;
    case FoodComponent::protein: return protein_fit;
    case FoodComponent::fat: return fat_fit;
    case FoodComponent::carbohydrate: return carbohydrate_fit;
    case FoodComponent::fiber: return fiber_fit;
    case FoodComponent::ash: return ash_fit;
  }
  return water_fit;  // unreachable: every enumerator is handled above
}

}  // namespace

std::string_view to_string(FoodComponent c) {
  switch (c) {
    case FoodComponent::water: return "water";
    case FoodComponent::ice: return "ice";
    case FoodComponent::protein: return "protein";
    case FoodComponent::fat: return "fat";
    case FoodComponent::carbohydrate: return "carbohydrate";
    case FoodComponent::fiber: return "fiber";
    case FoodComponent::ash: return "ash";
  }
  return "unknown";
}

ThermalProperties choi_okos_component(FoodComponent c, double temp_C, std::string_view origin) {
  if (!(temp_C >= choi_okos_min_C && temp_C <= choi_okos_max_C))
    throw InputError(std::string(origin) + ": temp_C = " + number_text(temp_C, 6) +
                     ": must be within -40 to 150 °C (Choi–Okos validity range)");
  const ComponentFit& f = fit_of(c);
  ThermalProperties p;
  p.conductivity_W_mK = f.k.at(temp_C);
  p.density_kg_m3 = f.rho.at(temp_C);
  const double cp_kJ = (c == FoodComponent::water && temp_C < 0.0) ? water_cp_below_zero.at(temp_C)
                                                                    : f.cp.at(temp_C);
  p.specific_heat_J_kgK = 1000.0 * cp_kJ;
  return p;
}

}  // namespace coldcore
