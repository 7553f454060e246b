#include "coldcore/model/stages.hpp"

#include <algorithm>
#include <cassert>

namespace coldcore {

double MediumProfile::at(double time_s) const {
  assert(!points.empty());
  if (time_s <= points.front().time_s) return points.front().temp_C;
  if (time_s >= points.back().time_s) return points.back().temp_C;
  auto hi = std::upper_bound(points.begin(), points.end(), time_s,
                             [](double t, const MediumPoint& p) { return t < p.time_s; });
  auto lo = hi - 1;
  const double w = (time_s - lo->time_s) / (hi->time_s - lo->time_s);
  return lo->temp_C + w * (hi->temp_C - lo->temp_C);
}

}  // namespace coldcore
