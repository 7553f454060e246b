#pragma once
/// A heat-penetration study analysed the trade's way and by the exact model: each probe's heating
/// and cooling curve described (f, j, straight portion, broken heating), the slowest-heating
/// probe named, the model fitted to it and to the pool, the first-term relations and Ball's
/// formula beside the fit. Pure computation over fit.hpp, heating_curve.hpp, first_term.hpp,
/// ball_formula.hpp and the inverse questions; report/ renders the result.
///
/// Phases (from the schedule, timed as the study ran): heating lasts until the first stage that
/// cools (h_ends.hpp's heating_stage rule); T_R is the scheduled medium at the heating end; the
/// come-up is the time the scheduled medium takes to come within 0.5 K of T_R; the corrected
/// zero is 58 % of it (Ball). The cooling curve starts at the heating end with T_W the scheduled
/// medium there and no come-up credit.
/// The design value is the slowest-heating probe (largest f_h; common practice).
#include <optional>
#include <string>
#include <vector>

#include "coldcore/process/ball_formula.hpp"
#include "coldcore/process/first_term.hpp"
#include "coldcore/process/fit.hpp"
#include "coldcore/process/heating_curve.hpp"
#include "coldcore/process/inverse.hpp"

namespace coldcore::process {

struct StudyPhases {
  double heating_end_s = 0;
  double retort_C = 0;
  double come_up_s = 0;
  double corrected_zero_s = 0;
  bool has_cooling = false;
  double cooling_medium_C = 0;
};

/// A probe reading on the wrong side of the medium while heating after the come-up (hotter than
/// the medium by more than 1 K): a misplaced or swapped thermocouple.
struct ProbeAnomaly {
  int reading = 0;          ///< 1-based index of the reading in the probe's curve
  double time_s = 0, probe_C = 0, medium_C = 0;
};

struct ProbeDescription {
  std::string name;
  double initial_C = 0;
  CurveDescription heating;
  std::optional<CurveDescription> cooling;
  std::optional<ProbeAnomaly> hotter_than_medium;
  /// Delivered lethality of the first lethality target at this probe's log (trapezoid).
  std::optional<double> F_s;
};

/// The first-term relations beside the fit, both ways: (α, Bi) from the measured (f_h, j_h), and
/// (f_h, j_h) the fitted α and h predict. j is measured at the corrected zero, which only
/// approximates the come-up, and Bi from j is ill-conditioned near the Bi = ∞ plateau, so the
/// flag rests on f_h: a predicted f_h more than kCrossCheckTolerance from the measured one.
struct CrossCheck {
  FirstTermEstimate estimate;
  double alpha_ratio = 0;    ///< first-term α / fitted α (0 when j_h < 1 gives no estimate)
  FirstTermHeating predicted;///< f_h and j_h of the fitted model's first term
  double f_ratio = 0;        ///< predicted f_h / measured f_h
  bool disagrees = false;    ///< |f_ratio − 1| > kCrossCheckTolerance
};
inline constexpr double kCrossCheckTolerance = 0.10;

/// Ball's process time beside the exact model's hold for the calibrated product.
struct ClassicalEstimate {
  BallResult ball;
  std::string target;        ///< the lethality target it is computed for
  std::string stage;         ///< the hold stage the exact model solves
  std::optional<double> exact_hold_s;  ///< solve hold-time (rounded up) on the calibrated model
  std::string exact_failed;  ///< why there is no exact hold (NoSolution text), else ""
};

struct StudyAnalysis {
  StudyPhases phases;
  std::vector<ProbeDescription> curves;
  int slowest = 0;           ///< index into curves: the design probe
  int least_lethality = -1;  ///< index into curves; -1 without a lethality target
  FitResult fit_slowest;
  std::optional<FitResult> fit_pool;   ///< with two or more probes
  std::optional<CrossCheck> cross_check;
  std::optional<ClassicalEstimate> classical;
};

struct StudyInput {
  Scenario scheduled;                 ///< the product file as scheduled (k and h the starting values)
  std::vector<Stage> study_stages;    ///< study_stages(): the study's clock, logged medium
  std::vector<ProbeCurve> probes;
  Libraries libs;
};

StudyAnalysis analyse_study(const StudyInput& in);

/// The calibrated scenario: the scheduled one with the fit's k and h (per stage group).
Scenario calibrated_scenario(const Scenario& scheduled, const FitResult& fit);

}  // namespace coldcore::process
