// Property callables for the finite-volume solver.
#include <memory>

#include "coldcore/conduction/numeric.hpp"
#include "properties/detail/mixing.hpp"

namespace coldcore {

NumericMaterial constant_material(const ThermalProperties& p) {
  const double k = p.conductivity_W_mK;
  const double c = p.density_kg_m3 * p.specific_heat_J_kgK;
  return {[k](double) { return k; }, [c](double) { return c; }};
}

NumericMaterial composition_material(const Composition& c, std::string origin) {
  validate_composition(c, origin);
  // Shared so the two callables (and their copies) keep one origin string alive.
  auto where = std::make_shared<const std::string>(std::move(origin));
  // The composition is checked once here; per call only the temperature range is checked (via
  // composition_properties on the rare out-of-range path, so the message is the same).
  auto props = [c, where](double t) {
    if (!(t >= 0.0 && t <= choi_okos_max_C)) return composition_properties(c, t, *where);
    return detail::mix_unchecked(c, t);
  };
  return {[props](double t) { return props(t).conductivity_W_mK; },
          [props](double t) {
            const ThermalProperties p = props(t);
            return p.density_kg_m3 * p.specific_heat_J_kgK;
          }};
}

}  // namespace coldcore
