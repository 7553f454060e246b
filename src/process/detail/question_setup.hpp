#pragma once
// What the inverse questions share (solve_questions.cpp, solve_size_medium.cpp): the parameter
// being solved for, its bracket and rounding, and the one solve-round-verify run. Private.
#include <functional>
#include <string>
#include <vector>

#include "coldcore/process/inverse.hpp"
#include "coldcore/process/solve.hpp"

namespace coldcore::process::detail {

struct Setup {
  std::function<Scenario(double)> apply;   ///< scenario with the parameter set to x
  FeasibleSide side = FeasibleSide::above;
  double lo = 0, hi = 0;
  RootOptions ro;
  double unit = 0;
  double domain_lo = -1e300, domain_hi = 1e300;  ///< one-unit-less must stay inside
  std::vector<int> considered;
  std::string why_none;
  int stage = -1;
};

/// Brackets and solves the margin in the parameter, rounds toward the safe side and verifies;
/// NoSolution with the verdicts at the bound and the physical reason when there is no answer.
SolveResult run_question(Question q, const Setup& st, const Scenario& s, const Libraries& libs);

/// Every target of the scenario; InputError when there is none.
std::vector<int> all_targets(const Scenario& s);

SolveResult max_size(const Scenario& s, const Libraries& libs, const SolveOptions& o);
SolveResult min_medium(const Scenario& s, const Libraries& libs, const SolveOptions& o);

}  // namespace coldcore::process::detail
