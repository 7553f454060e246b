#include "coldcore/io/scenario.hpp"

namespace coldcore::io {

Scenario scenario_of(const ProductFile& file) {
  Scenario s{file.product, file.stages, file.targets, file.origin};
  bool any = false;
  std::vector<std::optional<StageHRange>> per(file.stages.size());
  for (std::size_t i = 0; i < file.stages.size() && i < file.stage_h.size(); ++i) {
    const StageH& sh = file.stage_h[i];
    if (sh.medium_type.empty() || !sh.h_range_W_m2K) continue;
    per[i] = StageHRange{(*sh.h_range_W_m2K)[0], (*sh.h_range_W_m2K)[1],
                                  "medium_type = \"" + sh.medium_type + "\""};
    any = true;
  }
  if (any) s.per_target_h = std::move(per);
  return s;
}

Ranges ranges_of(const ProductFile& file) {
  Ranges r;
  r.diameter_m = file.ranges.diameter_m;
  r.length_m = file.ranges.length_m;
  r.thickness_m = file.ranges.thickness_m;
  r.conductivity_W_mK = file.ranges.conductivity_W_mK;
  r.initial_C = file.ranges.initial_C;
  for (const auto& sh : file.stage_h) r.stage_h_W_m2K.push_back(sh.h_range_W_m2K);
  return r;
}

}  // namespace coldcore::io
