#pragma once
// The fit's starting point (fit_model.cpp), for fit_study (fit.cpp). Private to src/process/.
#include <vector>

#include "coldcore/process/fit.hpp"

namespace coldcore::process::detail {

/// The h groups: stages with the same h and direction (heating or cooling) share one fitted h;
/// consecutive stages at infinite h form one fixed group.
std::vector<FittedH> stage_groups(const std::vector<Stage>& stages, const std::vector<bool>& heats);

/// A probe's initial temperature: the mean of its readings up to `window_s` (at least the first).
double initial_of(const ProbeCurve& c, double window_s);

}  // namespace coldcore::process::detail
