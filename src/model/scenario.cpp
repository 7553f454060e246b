#include "coldcore/model/scenario.hpp"

namespace coldcore {

bool Ranges::any() const {
  if (diameter_m || length_m || thickness_m || conductivity_W_mK || initial_C) return true;
  for (const auto& h : stage_h_W_m2K)
    if (h) return true;
  return false;
}

}  // namespace coldcore
