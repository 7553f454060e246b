#pragma once
/// Lethality integrals F = ∫ L(T(t)) dt (Bigelow General Method) along a temperature history:
/// adaptive quadrature for a temperature function the engine can evaluate anywhere, and fixed
/// rules for measured logs (probe / logger data).
#include <functional>
#include <span>
#include <string>
#include <vector>

#include "coldcore/lethality/kinetics.hpp"

namespace coldcore {

struct LethalityResult {
  double F_s = 0;              ///< equivalent time at Tref, seconds
  double error_estimate_s = 0; ///< Gauss–Kronrod error estimate (|K21 − G10| summed); pessimistic
  int evaluations = 0;         ///< temperature evaluations used
};

/// Options for f_value. Defaults: rel_tol 1e-4 (ten times tighter than the 0.1 % the design asks
/// for), initial split of every breakpoint interval into 2 pieces, at most 20000 subintervals.
struct FValueOptions {
  double rel_tol = 1e-4;
  int initial_pieces = 2;
  int max_intervals = 20000;
};

/// F over [breakpoints.front(), breakpoints.back()] for temp_C_at(t).
/// Globally adaptive Gauss–Kronrod (21-point Kronrod / 10-point Gauss pair from
/// boost/math/quadrature/gauss_kronrod.hpp, used non-adaptively per subinterval; the subinterval
/// with the largest error estimate is bisected until Σ error <= rel_tol · F, the QUADPACK QAG
/// strategy). Breakpoints must include every point where T(t) may have a kink (stage boundaries,
/// medium-profile corners); sample times are a good choice because they also locate peaks.
/// REQUIRES: breakpoints sorted non-decreasing, size >= 2, T finite on the range.
/// Throws NotConverged when max_intervals is reached before the tolerance, Error when T is not finite.
LethalityResult f_value(const std::function<double(double)>& temp_C_at,
                        std::span<const double> breakpoints_s, const Kinetics& k,
                        const FValueOptions& opts = {});

/// Same as above with only a relative tolerance given (the documented convenience form).
LethalityResult f_value(const std::function<double(double)>& temp_C_at,
                        std::span<const double> breakpoints_s, const Kinetics& k, double rel_tol);

/// What check_log_sampling found; report words it (numbers only here).
enum class SamplingNoteKind {
  too_few_rows,  ///< fewer than 3 rows: `count` rows
  gap,           ///< an interval from `from_s` to `to_s`, against the log's `median_interval_s`
  coarse,        ///< from `from_C` at `from_s` to `to_C` at `to_s`: more than z/10 in one interval
  more_gaps,     ///< `count` further gaps (only the first three are listed one by one)
  more_coarse,   ///< `count` further coarse intervals
};

struct SamplingNote {
  SamplingNoteKind kind = SamplingNoteKind::gap;
  double from_s = 0, to_s = 0;     ///< the interval (gap, coarse)
  double from_C = 0, to_C = 0;     ///< its end temperatures (coarse)
  double median_interval_s = 0;    ///< the log's median interval (gap)
  std::size_t count = 0;           ///< rows (too_few_rows) or further intervals (more_*)
  bool operator==(const SamplingNote&) const = default;
};

/// Result of integrating a measured log.
struct LogIntegral {
  double F_s = 0;
  std::vector<SamplingNote> notes;  ///< gaps, coarse sampling (see check_log_sampling)
};

/// Trapezoid rule on the lethal rates at the logged times (non-uniform spacing allowed).
/// REQUIRES: times strictly increasing (else InputError naming `origin` and the row), same sizes,
/// at least 2 rows.
LogIntegral f_trapezoid_s(std::span<const double> times_s, std::span<const double> temps_C,
                          const Kinetics& k, std::string_view origin = "log");

/// Cumulative trapezoid F (s) at every logged time (0 at the first row), for history columns.
/// Same requirements as f_trapezoid_s; the last value equals f_trapezoid_s(...).F_s.
std::vector<double> cumulative_f_trapezoid_s(std::span<const double> times_s, std::span<const double> temps_C,
                                             const Kinetics& k, std::string_view origin = "log");

/// Composite Simpson rule for non-uniform spacing (three-point parabola through each pair of
/// intervals; a last odd interval uses the three-point formula on its final interval).
/// Same requirements as f_trapezoid_s; with 2 rows it falls back to the trapezoid.
LogIntegral f_simpson_s(std::span<const double> times_s, std::span<const double> temps_C,
                        const Kinetics& k, std::string_view origin = "log");

/// Exact integral of L over the piecewise-linear interpolant of the log: per interval
/// Δt·(L1 − L0)/ln(L1/L0) (split at split_C when a split-z segment crosses it). Equals the
/// closed-form General Method result for a logged linear ramp to rounding.
LogIntegral f_piecewise_linear_s(std::span<const double> times_s, std::span<const double> temps_C,
                                 const Kinetics& k, std::string_view origin = "log");

/// Sampling warnings for a log used for lethality: a gap (an interval longer than 5 × the median
/// interval and at least 60 s), or coarse sampling (an interval whose temperature change exceeds
/// z/10, i.e. the lethal rate changes by more than 26 % across it, and which carries >= 1 % of F).
std::vector<SamplingNote> check_log_sampling(std::span<const double> times_s,
                                             std::span<const double> temps_C, const Kinetics& k);

/// Across a gap (an interval longer than max_gap_s) the temperature was not recorded: no
/// lethality is credited for it. Same rules as above, applied to each gap-free run of rows and
/// summed (a run of one row credits nothing). max_gap_s = +inf is the plain rule.
LogIntegral f_trapezoid_s(std::span<const double> times_s, std::span<const double> temps_C, const Kinetics& k,
                          std::string_view origin, double max_gap_s);
LogIntegral f_simpson_s(std::span<const double> times_s, std::span<const double> temps_C, const Kinetics& k,
                        std::string_view origin, double max_gap_s);
LogIntegral f_piecewise_linear_s(std::span<const double> times_s, std::span<const double> temps_C,
                                 const Kinetics& k, std::string_view origin, double max_gap_s);
/// Cumulative trapezoid F that stays flat across gaps longer than max_gap_s.
std::vector<double> cumulative_f_trapezoid_s(std::span<const double> times_s, std::span<const double> temps_C,
                                             const Kinetics& k, std::string_view origin, double max_gap_s);

/// Validates a log: sizes equal, >= 2 rows, finite values, times strictly increasing.
/// Throws InputError "<origin>: row <i>: time_s = <t>: must be greater than the previous row's".
void validate_log(std::span<const double> times_s, std::span<const double> temps_C,
                  std::string_view origin);

}  // namespace coldcore
