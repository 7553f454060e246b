#pragma once
/// The lumped-capacitance shortcut through a staged process, for showing how far it would be
/// from the exact centre: the whole product at one temperature T with
///   ρ·cp·(V/A)·dT/dt = h·(T∞(t) − T),
/// solved exactly over each piecewise-linear piece of the medium (no time-step error).
/// It is a teaching comparison, never used for a verdict.
#include <vector>

#include "coldcore/conduction/history.hpp"

namespace coldcore {

/// Lumped temperature (°C) at each of times_s (non-decreasing, from 0), with the stages laid
/// out as the engine ran them (History::stages gives each stage's start and end).
/// `volume_to_area_m` = V/A of the product. A stage with h_infinite follows the medium.
/// REQUIRES: product properties > 0, volume_to_area_m > 0, stages.size() == history.stages.size().
std::vector<double> lumped_history_C(const Product& product, double volume_to_area_m,
                                     const std::vector<Stage>& stages, const History& history,
                                     const std::vector<double>& times_s);

}  // namespace coldcore
