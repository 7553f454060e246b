#include "conduction/detail/medium_scan.hpp"

#include <cfloat>
#include <cmath>

#include "conduction/detail/lanes.hpp"

namespace coldcore::detail {

COLDCORE_SIMD_CLONES std::size_t first_bad_point(const MediumPoint* p, std::size_t n) {
  if (n == 0) return 0;
  // A branch-free pass first: x − x is 0 for a finite x and NaN otherwise, and a sum of zeros
  // stays exactly 0 in any order. A bad log is then located point by point.
  double not_finite = p[0].temp_C - p[0].temp_C;
  double min_step = 1.0;
#pragma omp simd reduction(+ : not_finite) reduction(min : min_step)
  for (std::size_t k = 1; k < n; ++k) {
    const double dt = p[k].time_s - p[k - 1].time_s;
    not_finite += (p[k].temp_C - p[k].temp_C) + (dt - dt);
    min_step = dt < min_step ? dt : min_step;
  }
  if (not_finite == 0.0 && min_step > 0.0) return n;
  std::size_t k = 0;
  while (k < n && std::isfinite(p[k].temp_C) && (k == 0 || p[k].time_s > p[k - 1].time_s)) ++k;
  return k;
}

COLDCORE_SIMD_CLONES void widen_temperature_range(const MediumPoint* p, std::size_t n, double& lo, double& hi) {
  double l = lo, h = hi;
#pragma omp simd reduction(min : l) reduction(max : h)
  for (std::size_t k = 0; k < n; ++k) {
    l = p[k].temp_C < l ? p[k].temp_C : l;
    h = p[k].temp_C > h ? p[k].temp_C : h;
  }
  lo = l;
  hi = h;
}

COLDCORE_SIMD_CLONES void piece_slopes(const MediumPoint* p, std::size_t n, double* slope) {
  if (n < 2) return;
  const std::size_t pieces = n - 1;
#pragma omp simd
  for (std::size_t k = 0; k < pieces; ++k) slope[k] = (p[k + 1].temp_C - p[k].temp_C) / (p[k + 1].time_s - p[k].time_s);
}

COLDCORE_SIMD_CLONES double largest_slope_change(const double* slope, std::size_t n) {
  double m = 0.0;
#pragma omp simd reduction(max : m)
  for (std::size_t k = 1; k < n; ++k) {
    const double d = std::fabs(slope[k] - slope[k - 1]);
    m = d > m ? d : m;
  }
  return m;
}

}  // namespace coldcore::detail
