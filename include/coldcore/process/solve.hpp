#pragma once
/// Inverse questions as root finding on a forward model. Physics-free: the model is any callable
/// x -> margin (positive when every target is met), so it can be tested on analytic functions
/// and wrapped around simulate() + assess() by the process solvers (process/inverse.hpp).
///
/// Method: bracket, then solve. The bracket is [lo, hi]; when `expand` is set the feasible end is
/// pushed outward (doubling its distance from the other end) up to `limit` until the margin there
/// is positive. Inside the bracket Boost.Math toms748_solve (Alefeld, Potra & Shi 1995, ACM TOMS
/// 748) narrows the sign change to `rel_tol`·|x| + `abs_tol`. The answer returned is always the
/// end of the final bracket on the FEASIBLE side, so re-running the model at the answer gives a
/// margin >= 0 (never a number from the infeasible side of the root).
///
/// Never a made-up number: when the margin is not positive anywhere up to the limit, NoSolution
/// is thrown with the caller's reason text and the margin found at the limit; when toms748 does
/// not converge within max_iterations, NotConverged.
#include <functional>
#include <string>
#include <vector>

namespace coldcore::process {

/// Which side of the root meets the targets.
enum class FeasibleSide {
  above,  ///< margin grows with x: hold time, minimum medium temperature (answer: smallest x)
  below,  ///< margin falls with x: largest size (answer: largest x)
};

/// Options of solve_margin(). Defaults in brackets.
struct RootOptions {
  double rel_tol = 1e-7;    ///< relative width of the final bracket [1e-7]
  double abs_tol = 1e-9;    ///< absolute width added to the tolerance, in x units [1e-9]
  int max_iterations = 200; ///< toms748 iterations [200]; exceeding them throws NotConverged
  bool expand = false;      ///< push the feasible end of the bracket outward to `limit` [false]
  double limit = 0;         ///< expand: the farthest x tried (REQUIRES beyond the feasible end)
};

/// One evaluation of the model during the search (for reports and tests).
struct RootTrial {
  double x = 0;
  double margin = 0;
};

struct RootResult {
  double x = 0;              ///< feasible end of the final bracket: margin(x) >= 0
  double margin = 0;         ///< margin at x
  double other_x = 0;        ///< infeasible end of the final bracket (== x when met at the bound)
  bool met_at_bound = false; ///< the infeasible-side bound already meets the targets: x is that bound
  int evaluations = 0;
  std::vector<RootTrial> trials;  ///< every evaluation, in order
};

/// Finds the boundary of {x : margin(x) > 0} inside [lo, hi] (lo < hi), assuming margin is
/// continuous and monotone in the direction `side` says.
///  - side == above: tries lo first; if margin(lo) >= 0 the answer is lo (met_at_bound).
///    Then hi (expanded toward `limit` when opts.expand); if still < 0: NoSolution.
///  - side == below: mirror image (tries hi first, expands lo downward toward `limit`).
/// `why_none` is the start of the NoSolution message; the margin at the bound is appended.
/// REQUIRES: lo < hi, finite; with expand, limit beyond the feasible end. Else InputError.
RootResult solve_margin(const std::function<double(double)>& margin, double lo, double hi, FeasibleSide side,
                        const RootOptions& opts, const std::string& why_none);

/// x rounded to a multiple of `unit` toward the feasible side (UP for above, DOWN for below).
/// A value within 1e-9·unit of a multiple is taken as that multiple (binary representation).
/// REQUIRES: unit > 0.
double round_to_unit(double x, double unit, FeasibleSide side);

}  // namespace coldcore::process
