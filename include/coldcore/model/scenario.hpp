#pragma once
/// What one forward run evaluates, as io reads it from a product file and every process verb
/// takes it: the product, its stages and targets, the h range a stage may take per target, and
/// the tolerance ranges that --conservative searches.
#include <array>
#include <optional>
#include <string>
#include <vector>

#include "coldcore/model/product.hpp"
#include "coldcore/model/stages.hpp"
#include "coldcore/model/targets.hpp"

namespace coldcore {

/// The h range of one stage taken per target. REQUIRES 0 < low_W_m2K <= high_W_m2K.
struct StageHRange {
  double low_W_m2K = 0, high_W_m2K = 0;
  std::string label;  ///< where the range comes from, e.g. medium_type = "blast-air" (source; status)
};

/// The forward model's inputs.
struct Scenario {
  Product product;
  std::vector<Stage> stages;
  std::vector<Target> targets;
  std::string origin = "product";  ///< for messages
  /// Parallel to stages (or empty): a stage with a range takes, for each target, the end that is
  /// conservative for it (process/h_ends.hpp); its h_W_m2K is then replaced at evaluation.
  std::vector<std::optional<StageHRange>> per_target_h = {};
};

/// Tolerance ranges [low, high] in SI; stage_h parallel to Scenario::stages (empty entries: no
/// range). --conservative evaluates their worst case (process/conservative.hpp).
struct Ranges {
  std::optional<std::array<double, 2>> diameter_m, length_m, thickness_m, conductivity_W_mK, initial_C;
  std::vector<std::optional<std::array<double, 2>>> stage_h_W_m2K;
  bool any() const;
};

}  // namespace coldcore
