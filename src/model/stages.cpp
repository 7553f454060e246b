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

double MediumProfile::lowest_C() const {
  assert(!points.empty());
  double m = points.front().temp_C;
  for (const auto& p : points) m = std::min(m, p.temp_C);
  return m;
}

double MediumProfile::highest_C() const {
  assert(!points.empty());
  double m = points.front().temp_C;
  for (const auto& p : points) m = std::max(m, p.temp_C);
  return m;
}

bool stage_heats(const Stage& stage, double before_C) { return stage.medium.highest_C() >= before_C; }

std::vector<bool> heating_stages(const std::vector<Stage>& stages, double initial_C) {
  std::vector<bool> out;
  out.reserve(stages.size());
  double before = initial_C;
  for (const Stage& s : stages) {
    out.push_back(stage_heats(s, before));
    before = s.medium.lowest_C();
  }
  return out;
}

}  // namespace coldcore
