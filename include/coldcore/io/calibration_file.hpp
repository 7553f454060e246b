#pragma once
/// The [calibration] table of a product file, read and written, and the calibrated product file
/// `coldcore fit --write-product` writes.
///
/// [calibration]  alpha_m2_s, alpha_ci95_m2_s = [low, high], covariance_log = [[...], ...]
///                (of [ln α, ln h of each fitted group]), dof, rms_K, n_points, design_probe,
///                date, study = ["file: sha256 ...", ...]
/// [[calibration.h]]  stages = ["name", ...], status = "fitted" | "lower_bound" |
///                "not_identified", h_W_m2K, ci95_W_m2K = [low, high] (fitted only)
/// The loader refuses a calibration the file no longer matches: the file's k must give α, and
/// every named stage must exist and carry the group's h (edit k or h by hand and the
/// covariance would describe another product, so fit again or remove [calibration]).
#include <array>
#include <string>
#include <string_view>
#include <vector>

#include <toml++/toml.h>

#include "coldcore/model/calibration.hpp"
#include "coldcore/model/product.hpp"
#include "coldcore/model/stages.hpp"

namespace coldcore::io {

/// Reads [calibration] (InputError `<origin>: calibration.<key> = <value>: <requirement>`).
Calibration parse_calibration(const toml::table& t, const std::string& origin);

/// Refuses a calibration that does not match the product and stages (see above).
void check_calibration(const Calibration& c, const Product& p, const std::vector<Stage>& stages,
                       const std::string& origin);

/// The calibrated product file: `original` (a schema-1 product file) with the fitted k as
/// product.properties.conductivity_W_mK and its interval as product.ranges.conductivity_W_mK, each
/// fitted group's h on its stages (h_W_m2K, with h_range_W_m2K = the interval; a lower bound
/// without a range; medium_type replaced), and the [calibration] table. A header names the study,
/// and the original file follows commented out, so the sources of its other values stay beside
/// them. REQUIRES: original parses (the caller loaded it); stage names of `c` exist.
std::string calibrated_product_toml(std::string_view original, const Calibration& c, double rho_cp_J_m3K);

}  // namespace coldcore::io
