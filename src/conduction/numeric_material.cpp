// Property callables for the finite-volume solver.
#include <memory>

#include "coldcore/conduction/numeric.hpp"

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
  return {[c, where](double t) { return composition_properties(c, t, *where).conductivity_W_mK; },
          [c, where](double t) {
            const ThermalProperties p = composition_properties(c, t, *where);
            return p.density_kg_m3 * p.specific_heat_J_kgK;
          }};
}

}  // namespace coldcore
