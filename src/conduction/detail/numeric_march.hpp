#pragma once
// Private pieces of the finite-volume solver shared by numeric.cpp and numeric_march.cpp.
#include <vector>

#include "coldcore/conduction/numeric.hpp"

namespace coldcore::detail {

/// One base (level-0) time step.
struct BaseStep {
  double t0_s = 0;
  double t1_s = 0;  ///< exact end (a must-hit time when the step lands on one)
  int segment = 0;
  bool segment_start = false;  ///< first step of its segment: Rannacher start-up applies
};

/// Marches one resolution: `cells` cells, every base step split into `divisor` equal sub-steps.
/// sample_times_s: sorted, unique, each equal to the end of some base step or 0.
/// Returns one sample per entry of sample_times_s; fills steps and the final profile.
struct LevelSolution {
  std::vector<NumericSample> samples;
  long steps = 0;
  std::vector<double> node_r_m;
  std::vector<double> node_T_C;
};

LevelSolution march_level(const NumericProblem& problem, const std::vector<BaseStep>& base_steps,
                          const std::vector<double>& sample_times_s, int cells, int divisor,
                          const NumericOptions& options);

/// Start time (s) of each segment and, at the end, the total duration.
std::vector<double> segment_starts(const NumericProblem& problem);

/// Medium temperature at global time t (the later segment's at a shared boundary).
double medium_at(const NumericProblem& problem, const std::vector<double>& starts, double t);

}  // namespace coldcore::detail
