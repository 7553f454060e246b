#pragma once
// ASHRAE mixing without input checks, for callers that have validated the composition once and
// check the temperature range themselves (the solver's property callables run it per node).
#include "coldcore/properties/composition.hpp"

namespace coldcore::detail {

/// REQUIRES: validate_composition(c) passed; 0 <= temp_C <= 150.
ThermalProperties mix_unchecked(const Composition& c, double temp_C);

}  // namespace coldcore::detail
