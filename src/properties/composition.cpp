// ASHRAE mixing of Choi–Okos component properties (REFERENCES.md §5.3).
#include <cmath>
#include <sstream>
#include <string>

#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"
#include "coldcore/properties/composition.hpp"
#include "properties/detail/mixing.hpp"

namespace coldcore {
namespace {

void check_fraction(double x, const char* key, std::string_view origin) {
  if (!(std::isfinite(x) && x >= 0.0 && x <= 1.0))
    throw InputError(std::string(origin) + ": composition." + key + " = " + number_text(x, 6) +
                     ": must be within 0 and 1");
}

void check_mixture_temperature(double temp_C, std::string_view origin) {
  if (!(temp_C >= 0.0 && temp_C <= choi_okos_max_C)) {
    std::string why = temp_C < 0.0 && temp_C >= choi_okos_min_C
                          ? ": must be within 0 to 150 °C (below 0 °C the food may be partly "
                            "frozen; no ice-fraction model is implemented)"
                          : ": must be within 0 to 150 °C (unfrozen food, Choi–Okos validity range)";
    throw InputError(std::string(origin) + ": temp_C = " + number_text(temp_C, 6) + why);
  }
}

}  // namespace

void validate_composition(const Composition& c, std::string_view origin) {
  check_fraction(c.water, "water", origin);
  check_fraction(c.protein, "protein", origin);
  check_fraction(c.fat, "fat", origin);
  check_fraction(c.carbohydrate, "carbohydrate", origin);
  check_fraction(c.fiber, "fiber", origin);
  check_fraction(c.ash, "ash", origin);
  const double s = c.sum();
  if (!(std::fabs(s - 1.0) <= composition_sum_tolerance))
    throw InputError(std::string(origin) + ": composition sum = " + number_text(s, 6) +
                     ": must be 1 within 0.005");
}

ThermalProperties detail::mix_unchecked(const Composition& c, double temp_C) {
  const struct {
    FoodComponent comp;
    double x;
  } parts[] = {{FoodComponent::water, c.water},   {FoodComponent::protein, c.protein},
               {FoodComponent::fat, c.fat},       {FoodComponent::carbohydrate, c.carbohydrate},
               {FoodComponent::fiber, c.fiber},   {FoodComponent::ash, c.ash}};
  double cp = 0, specific_volume = 0, k_times_volume = 0;
  for (const auto& part : parts) {
    if (part.x == 0.0) continue;
    const ThermalProperties p = choi_okos_component(part.comp, temp_C);
    cp += part.x * p.specific_heat_J_kgK;
    const double v = part.x / p.density_kg_m3;  // m³ of this component per kg of food
    specific_volume += v;
    k_times_volume += v * p.conductivity_W_mK;
  }
  ThermalProperties out;
  out.specific_heat_J_kgK = cp;
  out.density_kg_m3 = 1.0 / specific_volume;
  out.conductivity_W_mK = k_times_volume / specific_volume;  // volume-fraction weights
  return out;
}

ThermalProperties composition_properties(const Composition& c, double temp_C,
                                         std::string_view origin) {
  validate_composition(c, origin);
  check_mixture_temperature(temp_C, origin);
  return detail::mix_unchecked(c, temp_C);
}

std::vector<PropertyRow> composition_table(const Composition& c, double from_C, double to_C,
                                           double step_C, std::string_view origin) {
  validate_composition(c, origin);
  check_mixture_temperature(from_C, origin);
  check_mixture_temperature(to_C, origin);
  if (!(to_C >= from_C))
    throw InputError(std::string(origin) + ": to_C = " + number_text(to_C, 6) + ": must be >= from_C (" +
                     number_text(from_C, 6) + ")");
  if (!(std::isfinite(step_C) && step_C > 0.0))
    throw InputError(std::string(origin) + ": step_C = " + number_text(step_C, 6) + ": must be > 0");
  const double n_steps = std::ceil((to_C - from_C) / step_C - 1e-9);
  if (n_steps > 10000)
    throw InputError(std::string(origin) + ": step_C = " + number_text(step_C, 6) +
                     ": gives more than 10001 rows; use a larger step");
  std::vector<PropertyRow> rows;
  const int n = static_cast<int>(n_steps);
  for (int i = 0; i <= n; ++i) {
    // Computed from the index, not accumulated, so rounding does not drift; last row is to_C.
    const double t = (i == n) ? to_C : from_C + i * step_C;
    const ThermalProperties p = composition_properties(c, t, origin);
    rows.push_back({t, p.conductivity_W_mK, p.density_kg_m3, p.specific_heat_J_kgK,
                    p.diffusivity_m2_s()});
  }
  return rows;
}

}  // namespace coldcore
