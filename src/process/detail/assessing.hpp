#pragma once
// The pieces the assessment is built from, shared by its source files in src/process/
// (assessment*.cpp, assess_targets.cpp, target_verdict.cpp, target_results.cpp). Private to src/process/.
#include <array>
#include <functional>
#include <limits>
#include <span>
#include <string>
#include <utility>
#include <vector>

#include "coldcore/lethality/integrate.hpp"
#include "coldcore/process/assessment.hpp"
#include "lethality/detail/crossing.hpp"

namespace coldcore::assessing {

// ---- verdicts, shown values and error bounds (target_verdict.cpp) ----

inline constexpr double kEps = std::numeric_limits<double>::epsilon();

/// Rounding of the unit conversions behind a margin and of the subtraction: a tie inside it.
double rounding_bound(double a, double b);
/// Crossing-time error of detail::Curve::refine.
double refine_tol_s(double t);
/// Error of a crossing time at t when the temperatures are accurate to tol_K (∞ at a tangent).
double crossing_uncertainty_s(const std::function<double(double)>& T, double t, double tol_K, double lo, double hi);
/// Relative error of F on a history whose temperatures are accurate to tol_K.
double f_relative_error_of_temperature(const Kinetics& k, double tol_K);
/// The verdict, margin and verdict texts from r.margin and r.margin_uncertainty, shown in r.unit.
void decide(TargetResult& r);
void finish(TargetResult& r, bool log_units);
void cap_log_reduction_text(TargetResult& r);

// ---- curves, quadrature knots and gaps (assessment_curves.cpp) ----

struct Resolved {
  Kinetics k;
  const Organism* organism = nullptr;
};
Resolved resolve(const Target& t, const std::string& place, const OrganismLibrary& lib);
std::function<double(double)> temp_function(const History& h, bool mean);
std::vector<double> knots(const History& h, double a, double b, std::size_t max_intervals = 0);
std::vector<double> knots_of(const detail::Curve& c, double a, double b);
int probes_for(const std::vector<double>& k);
double f_between(const History& h, const std::function<double(double)>& T, double a, double b, const Kinetics& k,
                 double rel_tol, double* error_estimate_s = nullptr);
/// Unrecorded intervals of a log: [start, end] of each gap.
using Gaps = std::vector<std::array<double, 2>>;
Gaps gaps_of_log(std::span<const double> times_s, double max_gap_s);
std::vector<std::pair<double, double>> recorded_pieces(double a, double b, const Gaps& gaps);
double f_recorded(const History& h, const std::function<double(double)>& T, double a, double b, const Kinetics& k,
                  double rel_tol, const Gaps& gaps, double* error_estimate_s = nullptr);
std::function<double(double)> recorded_only(const std::function<double(double)>& T, const Gaps& gaps);
void add_gap_knots(std::vector<double>& knots, const Gaps& gaps);
/// "nothing of `what` credited from from_s to to_s" (limit_s: the gap limit, 0 when not stated).
TargetNote gap_note(Credit what, double from_s, double to_s, double limit_s = 0);
/// A gap note per gap, times from t0.
std::vector<TargetNote> gap_notes(const Gaps& gaps, double t0, Credit what);
/// The flag for a share of the credited F outside the kinetics' valid range.
TargetNote outside_range_note(double share, const Kinetics& k);
std::vector<int> credited(const Target& t, const History& h, const std::string& place);

// ---- one target's result (target_results.cpp) ----

/// Error bound (s) of a crossing time on the checked curve; 0 for a time that is no crossing.
using CrossingError = std::function<double(double time_s, double level_C)>;
void provenance_notes(TargetResult& r, const Resolved& res);
/// Credited F outside the kinetics' valid range. `stage_F_s`, when given, holds each stage's whole
/// F as f_between computes it (indexed by stage), so that it is not integrated again.
double outside_range(const History& h, const std::function<double(double)>& T, const Kinetics& k,
                     const std::vector<int>& stages, double rel_tol, std::span<const double> stage_F_s = {});
void lethality_verdict(TargetResult& r, const Target& t, const Resolved& res, const AssessOptions& o,
                       const std::string& place, double F_uncertainty_s);
std::string label_of(const Target& t);
void cooling_result(TargetResult& r, const CoolingCheck& c, const CoolingRule& rule, const CrossingError& err);
void cooking_result(TargetResult& r, const CookingCheck& c, double fraction_uncertainty);
double cooking_uncertainty(const detail::Curve& c, const CookingTable& table, const CookingCheck& check, double tol_K);
const CookingTable& cooking_table_for(const Target& t, const std::string& place, const AssessOptions& opts);
void min_temperature_result(TargetResult& r, const Target& t, const detail::Curve& c, const CrossingError& err,
                            const Gaps& gaps = {});
CrossingError crossing_error(const std::function<double(double)>& T, double tol_K, double lo, double hi);
CoolingContext infer_context(const History& h, const CoolingRule& rule, const AssessOptions& o,
                             const std::function<double(double)>& T, std::vector<TargetNote>& notes);

}  // namespace coldcore::assessing
