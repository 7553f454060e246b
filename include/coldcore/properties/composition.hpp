#pragma once
/// Thermal properties of a food from its proximate composition: the Choi–Okos (1986) component
/// polynomials combined by the ASHRAE mixing rules.
///
/// Source: Choi, Y. & Okos, M. R. (1986) "Effects of temperature and composition on the thermal
/// properties of foods", in Le Maguer & Jelen (eds.), Food Engineering and Process Applications,
/// Vol. 1, pp. 93–101; as reproduced in the ASHRAE Refrigeration Handbook, "Thermal Properties of
/// Foods" (coefficients as listed in REFERENCES.md §5.3).
/// Mixing (ASHRAE): cp = Σ x_i·cp_i; 1/ρ = Σ x_i/ρ_i; k parallel = Σ x_v,i·k_i with volume fractions
/// x_v,i = (x_i/ρ_i) / Σ (x_j/ρ_j).
///
/// Scope: the component polynomials are valid from −40 to 150 °C. The mixture functions are for
/// UNFROZEN food only (0 to 150 °C): below the initial freezing point part of the water is ice and
/// an ice-fraction model would be needed; none is implemented, so compositions refuse T < 0 °C.
#include <string_view>
#include <vector>

#include "coldcore/model/thermal.hpp"

namespace coldcore {

/// Components with their own Choi–Okos polynomials.
enum class FoodComponent { water, ice, protein, fat, carbohydrate, fiber, ash };

std::string_view to_string(FoodComponent c);

/// Lowest and highest temperature of the Choi–Okos fits, °C.
inline constexpr double choi_okos_min_C = -40.0;
inline constexpr double choi_okos_max_C = 150.0;

/// Property values of one pure component at one temperature (SI: W/m·K, kg/m³, J/kg·K).
/// Water uses the liquid cp branch from 0 to 150 °C and the −40 to 0 °C branch below 0 °C
/// (supercooled liquid); ice is its own component.
/// REQUIRES: −40 <= temp_C <= 150, else InputError
///   "<origin>: temp_C = <T>: must be within -40 to 150 °C (Choi–Okos validity range)".
ThermalProperties choi_okos_component(FoodComponent c, double temp_C,
                                      std::string_view origin = "choi-okos");

/// Proximate composition as mass fractions (kg per kg of food). All unfrozen.
struct Composition {
  double water = 0;
  double protein = 0;
  double fat = 0;
  double carbohydrate = 0;
  double fiber = 0;
  double ash = 0;
  double sum() const { return water + protein + fat + carbohydrate + fiber + ash; }
};

/// Absolute tolerance on the sum of the mass fractions.
inline constexpr double composition_sum_tolerance = 0.005;

/// Checks every fraction is finite and within [0, 1] and that they sum to 1 within 0.005.
/// Throws InputError, e.g. "<origin>: composition sum = 0.95: must be 1 within 0.005",
/// "<origin>: composition.fat = -0.1: must be within 0 and 1".
void validate_composition(const Composition& c, std::string_view origin = "composition");

/// Mixture k, ρ, cp of an unfrozen food at temp_C by the ASHRAE rules above (fractions are used
/// as given, not renormalised). Accuracy: that of the Choi–Okos fits (a few per cent against
/// measured foods); e.g. lean beef 74/22/3/1 water/protein/fat/ash at 20 °C gives k 0.517,
/// ρ 1056, cp 3609 (REFERENCES §7 item 20).
/// REQUIRES: validate_composition passes; 0 <= temp_C <= 150 (InputError otherwise, naming the
/// value and the range; below 0 °C the message says freezing is not modelled).
ThermalProperties composition_properties(const Composition& c, double temp_C,
                                         std::string_view origin = "composition");

/// One row of a property table.
struct PropertyRow {
  double temp_C = 0;
  double conductivity_W_mK = 0;
  double density_kg_m3 = 0;
  double specific_heat_J_kgK = 0;
  double diffusivity_m2_s = 0;  ///< k/(ρ·cp) of the mixture
};

/// Properties from from_C to to_C inclusive in steps of step_C (the last row is exactly to_C
/// even when the span is not a multiple of the step).
/// REQUIRES: 0 <= from_C <= to_C <= 150, step_C > 0, at most 10001 rows; InputError otherwise.
std::vector<PropertyRow> composition_table(const Composition& c, double from_C, double to_C,
                                           double step_C, std::string_view origin = "composition");

}  // namespace coldcore
