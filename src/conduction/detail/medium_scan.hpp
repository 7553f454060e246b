#pragma once
// Whole-log scans of a medium schedule, written so that they vectorise (a 4 h log at 1 s has
// 14,401 points and simulate() reads it several times). Private.
#include <cstddef>

#include "coldcore/model/product.hpp"
#include "coldcore/model/stages.hpp"

namespace coldcore::detail {

/// Index of the first point whose temperature is not finite or whose time does not increase
/// past the previous point's; n if there is none.
std::size_t first_bad_point(const MediumPoint* p, std::size_t n);

/// Lowest and highest temperature of the points, widening lo and hi.
void widen_temperature_range(const MediumPoint* p, std::size_t n, double& lo, double& hi);

/// slope[k] = slope of piece k (points k to k+1), k < n − 1.
void piece_slopes(const MediumPoint* p, std::size_t n, double* slope);

/// max over k >= 1 of |slope[k] − slope[k−1]| (0 if n < 2).
double largest_slope_change(const double* slope, std::size_t n);

}  // namespace coldcore::detail
