#pragma once
/// Process deviations: the scheduled process against what was delivered, from a logged medium
/// (the stage's scheduled medium replaced by the log) and/or a measured cold-spot probe log.
/// Pure computation over the forward model (process/inverse.hpp); writers format the result.
///
/// Delivered lethality and cooling compliance come from the same simulate + assess as the
/// schedule, so a log identical to the schedule reproduces the scheduled result (to the engine's
/// accuracy). The additional time that restores the targets is the extension of the deviated
/// stage at its scheduled medium temperature (the schedule's value at the stage end), solved with
/// solve_margin() and rounded UP to `unit_s`; its forward re-run is kept as proof.
///
/// The record never decides the product's fate: disposition is for the process authority.
#include <optional>
#include <string>
#include <vector>

#include "coldcore/process/inverse.hpp"

namespace coldcore::process {

/// Where the logged medium fell below the schedule by more than the tolerance.
struct DeviationEvent {
  bool found = false;
  double start_s = 0;        ///< first logged reading below schedule − tolerance, from the stage's start
  double end_s = 0;          ///< last such reading, from the stage's start
  double lowest_C = 0;       ///< lowest logged medium temperature in the stage
  double lowest_at_s = 0;    ///< when, from the stage's start
  double scheduled_at_lowest_C = 0;
  double largest_drop_K = 0; ///< max(schedule − log) over the readings
};

/// One target, scheduled against delivered. F in seconds (equivalent time at the reference).
struct DeviationTarget {
  std::string name;
  TargetKind kind = TargetKind::f_value;
  bool lethality = false;
  double scheduled_F_s = 0, delivered_F_s = 0;   ///< lethality targets
  std::optional<double> scheduled_logs, delivered_logs;  ///< where the target has a D (or is a log target)
  TargetResult scheduled, delivered;             ///< full results (texts rounded as in assessment.hpp)
  Verdict verdict = Verdict::not_demonstrated;   ///< of the delivered process
};

struct DeviationOptions {
  double tolerance_K = 0.5;     ///< a reading this far below the schedule counts as deviated [0.5 K]
  double unit_s = 60;           ///< extra-hold rounding unit, rounded UP [60 s]
  double max_extra_s = 24 * 3600.0;  ///< search bound of the extra hold [24 h]
};

struct DeviationInput {
  Scenario scheduled;
  int stage = -1;                              ///< index of the deviated stage (medium log)
  std::optional<MediumProfile> medium_log;     ///< logged medium, time from the stage's start
  /// Measured cold-spot log, time from the process start (first stage), SI.
  std::vector<double> probe_time_s, probe_temp_C;
  std::string probe_origin = "probe log";
};

struct DeviationResult {
  Evaluation scheduled;
  std::optional<Evaluation> delivered;         ///< with the logged medium
  std::optional<ProbeAssessment> probe;        ///< measured cold-spot log
  std::vector<DeviationTarget> targets;        ///< per target: delivered = medium-log run, else probe
  DeviationEvent event;
  std::string stage;                           ///< name of the deviated stage ("" for a probe only)
  double stage_start_s = 0;                    ///< in the scheduled history
  bool all_met_delivered = false;
  /// Extension of the deviated stage at its scheduled medium that restores every lethality and
  /// minimum-temperature target: unrounded and rounded UP to unit_s; 0 when already met.
  std::optional<double> extra_hold_unrounded_s, extra_hold_s;
  double extension_medium_C = 0;
  std::optional<Check> restored;               ///< re-run with the rounded extension
  std::optional<Check> restored_one_unit_less; ///< one unit less (must not restore, when > 0)
  std::string extra_hold_note;                 ///< why there is none, when there is none
  std::vector<std::string> notes;
  std::vector<std::string> assumptions;
};

/// Evaluates a deviation. REQUIRES: medium_log (with a valid stage) or a probe log (or both).
/// Throws InputError (nothing to evaluate, bad stage), NoSolution is NOT thrown for the extra hold:
/// when no extension up to max_extra_s restores the targets, extra_hold_* stay empty and
/// extra_hold_note says why.
DeviationResult evaluate_deviation(const DeviationInput& in, const Libraries& libs, const DeviationOptions& o = {});

/// The deviated event alone (exposed for tests): readings of `log` against `schedule`.
DeviationEvent find_deviation(const MediumProfile& schedule, const MediumProfile& log, double tolerance_K);

}  // namespace coldcore::process
