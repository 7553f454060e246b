#pragma once
/// Temperature history of a product through a staged process: the output of the conduction
/// engine and the input of lethality, cooling checks and reports.
#include <functional>
#include <string>
#include <vector>

#include "coldcore/process/schedule.hpp"

namespace coldcore {

/// Temperatures at one instant. time_s from the start of the first stage.
struct HistorySample {
  double time_s = 0;
  double medium_C = 0;
  double centre_C = 0;   ///< geometric centre: the cold spot of a symmetric conduction product
  double surface_C = 0;  ///< slowest surface point is not needed; this is the face/mid-face centre
  double mean_C = 0;     ///< mass-average temperature
  int stage = 0;         ///< index into History::stages
};

enum class StageEndedBy { duration, condition, cap };

struct StageRecord {
  std::string name;
  double start_s = 0;
  double end_s = 0;
  StageEndedBy ended_by = StageEndedBy::duration;
  double h_W_m2K = 0;
  double biot = 0;          ///< h·L/k with L the smallest half-dimension (radius, half-thickness)
  HistorySample at_end;
};

struct History {
  /// The engine's own sample points, increasing in time, with a sample at every stage boundary
  /// (both sides of a boundary share the boundary time; the later one belongs to the new stage).
  std::vector<HistorySample> samples;
  std::vector<StageRecord> stages;
  std::vector<std::string> warnings;
  /// Exact evaluation at any 0 <= t <= end; O(modes). Set by the engine.
  std::function<HistorySample(double time_s)> evaluate;
  double end_s() const { return stages.empty() ? 0.0 : stages.back().end_s; }
};

}  // namespace coldcore
