#pragma once
/// From a loaded product file to the process layer's inputs: the Scenario every process verb
/// evaluates, and the tolerance ranges of --conservative.
#include "coldcore/io/product_file.hpp"
#include "coldcore/model/scenario.hpp"

namespace coldcore::io {

/// Product, stages, targets and origin of `file`; a stage that names medium_type gets its
/// medium's h range in Scenario::per_target_h, so each target is evaluated at the end of it that
/// is conservative for that target (process/h_ends.hpp). A stage with h_W_m2K (and perhaps
/// h_range_W_m2K) keeps its h; its range is used only by --conservative (ranges_of).
Scenario scenario_of(const ProductFile& file);

/// [product.ranges] and every stage's h range (h_range_W_m2K or the medium's), in SI.
Ranges ranges_of(const ProductFile& file);

}  // namespace coldcore::io
