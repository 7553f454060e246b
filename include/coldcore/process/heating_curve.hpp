#pragma once
/// The trade's semi-log description of a measured cold-spot curve (heat-penetration practice,
/// REFERENCES.md §4): the straight portion of log10|T_m − T| against t, its f (seconds per log
/// cycle), the pseudo-initial temperature T_A at the corrected zero, the lag factor j and, for a
/// broken curve, the second portion. Pure computation; no I/O.
///
/// Stated criterion (describe_curve):
///  1. Usable points: those of the phase [phase_start_s, phase_end_s] whose driving difference
///     d = T_m − T (heating) or T − T_m (cooling) is >= min_difference_K; points closer to the
///     medium (or past it) are left out.
///  2. Straight: a least-squares line of log10 d against t over consecutive usable points keeps
///     every point within max(residual_K, residual_rel·d) kelvin of the line (the line's value
///     converted back to a temperature), falls (slope < 0) and spans at least
///     min_span_log_cycles of log10 d between its first and last point.
///  3. The straight portion is grown backward from the last usable point one point at a time while
///     the line stays within the tolerance (so the longest such run whose shorter runs all pass);
///     it needs >= min_points points and must be straight by 2. Otherwise never_straight.
///  4. Broken: before the straight portion's first point, runs ending at each earlier point (latest
///     first) are grown backward the same way; the first that is straight with >= min_points
///     points is the candidate. The curve is broken when the later portion is slower by more
///     than broken_slope_ratio: f_later > broken_slope_ratio·f_earlier. Only that direction
///     counts, because the lag of a conduction curve bends the other way (its early slope is
///     flatter, f_early > f_late), and it must not be read as a break.
///     When broken, `straight` is the earlier portion (f_s, T_A and j come from it), `second` the
///     later one, and break_s is where the two lines cross.
///  5. T_A = T_m ∓ 10^(line at corrected_zero_s) (− heating, + cooling); j = (T_m − T_A)/(T_m − T_I),
///     with T_I the probe at phase_start_s (linear between points; the nearest end of the log
///     when phase_start_s lies outside it).
/// Cost: O(n²) for the straight portion, up to O(n³) in the search for an earlier portion.
#include <vector>

namespace coldcore::process {

/// A fitted straight run of log10|T_m − T| against absolute time t.
struct StraightPortion {
  double from_s = 0, to_s = 0;  ///< times of its first and last point
  double r2 = 0;                ///< coefficient of determination of the fit
  int points = 0;
  double slope_per_s = 0;       ///< d log10(|T_m − T|)/dt, < 0
  double intercept = 0;         ///< log10(|T_m − T|) of the line at t = 0 (absolute time axis)
};

enum class CurveStatus {
  described,             ///< a straight portion was found
  too_few_points,        ///< fewer than min_points usable points
  never_straight,        ///< no run ending at the last usable point is straight
  no_driving_difference  ///< T_I is not at least min_difference_K on the far side of the medium
};

struct CurveDescription {
  CurveStatus status = CurveStatus::too_few_points;
  double medium_C = 0;          ///< T_R (heating) or T_W (cooling) used
  double initial_C = 0;         ///< T_I: probe at phase start
  double corrected_zero_s = 0;  ///< absolute time the lag factor refers to
  StraightPortion straight;     ///< the (first) straight portion
  double f_s = 0;               ///< −1/slope: seconds per log cycle
  double pseudo_initial_C = 0;  ///< T_A: the line extended back to the corrected zero
  double j = 0;                 ///< (T_m − T_A)/(T_m − T_I)
  bool broken = false;          ///< two straight portions with clearly different slopes
  StraightPortion second;       ///< when broken: the later portion
  double f2_s = 0;              ///< when broken
  double break_s = 0;           ///< when broken: where the two lines meet
};

struct CurveOptions {
  double min_difference_K = 2.0;     ///< points closer than this to the medium are left out
  int min_points = 6;                ///< fewest points of a straight portion
  double residual_K = 0.5;           ///< straightness: |fit − T| <= max(residual_K,
  double residual_rel = 0.015;       ///<   residual_rel·|T_m − T|) at every point
  double min_span_log_cycles = 0.3;  ///< a straight portion spans at least this drop of log10
  double broken_slope_ratio = 1.2;   ///< f_later / f_earlier above this: broken
};

/// Describes one heating or cooling phase of a cold-spot log by the criterion above.
/// time_s: strictly increasing absolute times (s); temp_C the probe at those times. heating: T
/// rises toward medium_C; otherwise it falls toward it. REQUIRES (InputError otherwise): equal
/// sizes, finite values, strictly increasing times, phase_start_s <= phase_end_s, option values
/// positive (min_points >= 3, broken_slope_ratio > 1).
CurveDescription describe_curve(const std::vector<double>& time_s, const std::vector<double>& temp_C,
                                double medium_C, double phase_start_s, double phase_end_s,
                                double corrected_zero_s, bool heating, const CurveOptions& options = {});

/// Ball's corrected zero: 58 % of the come-up time after the start of come-up (42 % of come-up
/// credited as time at the medium temperature; REFERENCES.md §4). REQUIRES: come_up_s >= 0, finite.
double corrected_zero_s(double come_up_s);

}  // namespace coldcore::process
