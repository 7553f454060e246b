#pragma once
/// Process deviations: the scheduled process against what was delivered, from a logged medium
/// (the stage's scheduled medium replaced by the log) and/or a measured cold-spot probe log.
/// Pure computation over the forward model (process/inverse.hpp); writers format the result.
///
/// Delivered lethality and cooling compliance come from the same simulate + assess as the
/// schedule, so a log identical to the schedule reproduces the scheduled result (to the engine's
/// accuracy). A duration-ended stage lasts as long as its medium log (a log that ends early is a
/// shortened stage; one that runs past the scheduled end is a hold extension, credited as
/// delivered). The additional time that restores the targets is the extension of the deviated
/// stage at its scheduled medium temperature (the schedule's value at the stage end), solved with
/// solve_margin() and rounded UP to `unit_s`; its forward re-run is kept as proof.
///
/// The record never decides the product's fate: disposition is for the process authority.
#include <optional>
#include <string>
#include <vector>

#include "coldcore/process/inverse.hpp"

namespace coldcore::process {

/// What kind of departure from the schedule, each in the direction unfavourable to a target.
enum class DeviationKind {
  medium_colder,    ///< a stage that heats: logged medium below the schedule by more than the tolerance
  medium_warmer,    ///< a stage that cools: logged medium above the schedule by more than the tolerance
  stage_shortened,  ///< the log (and so the delivered stage) ends before the scheduled stage end
  log_gap,          ///< no reading for longer than the allowed gap: the medium meanwhile is unknown
};

/// One departure. Times from the stage's start. Medium kinds: a run of consecutive deviated
/// readings (start = first, end = last) and its extreme reading; stage_shortened: from the log's
/// end to the scheduled end; log_gap: from the reading before the gap to the one after it.
struct DeviationEvent {
  DeviationKind kind = DeviationKind::medium_colder;
  double start_s = 0, end_s = 0;
  double extreme_C = 0;               ///< medium kinds: lowest (colder) or highest (warmer) reading
  double extreme_at_s = 0;            ///< when, from the stage's start
  double scheduled_at_extreme_C = 0;  ///< the schedule at that time
  double departure_K = 0;             ///< medium kinds: |reading − schedule| at the extreme (> tolerance)
};

/// How the log was read against the schedule (find_deviations).
struct DeviationScan {
  bool stage_heats = true;                 ///< the stage's direction (h_ends.hpp: heating_stage)
  std::optional<double> scheduled_end_s;   ///< duration-ended stage: its scheduled duration
  double tolerance_K = 0.5;
  double max_gap_s = 60;
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
  double tolerance_K = 0.5;     ///< a reading this far on the unfavourable side counts as deviated [0.5 K]
  double max_gap_s = 60;        ///< readings further apart than this are a gap in the log [60 s]
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

/// Why a deviation has no extra hold (report words it).
enum class NoHoldReason {
  none,                     ///< there is one (or nothing was asked)
  stage_ends_by_condition,  ///< the deviated stage ends by a temperature condition, not a duration
  no_target_to_restore,     ///< no lethality or minimum-temperature target
  no_extension_restores,    ///< no extension at extension_medium_C up to extension_search_s restores them
};

struct DeviationResult {
  Evaluation scheduled;
  std::optional<Evaluation> delivered;         ///< with the logged medium
  std::optional<ProbeAssessment> probe;        ///< measured cold-spot log
  std::vector<DeviationTarget> targets;        ///< per target: delivered = medium-log run, else probe
  std::vector<DeviationEvent> events;          ///< every departure of the medium log, in time order
  bool stage_heats = true;                     ///< direction of the deviated stage
  double scheduled_stage_s = 0;                ///< scheduled length of the deviated stage
  double delivered_stage_s = 0;                ///< delivered length (the log's length for a duration stage)
  /// The log ran past the scheduled end (a hold extension given): how long, and the extension
  /// at the scheduled medium the solver finds for the log cut at the scheduled end (what was
  /// needed), rounded UP to unit_s; empty when none was found (extension_needed_none says why).
  std::optional<double> extension_given_s, extension_needed_s;
  NoHoldReason extension_needed_none = NoHoldReason::none;
  std::string stage;                           ///< name of the deviated stage ("" for a probe only)
  double stage_start_s = 0;                    ///< in the scheduled history
  bool all_met_delivered = false;
  /// Extension of the deviated stage at its scheduled medium that restores every lethality and
  /// minimum-temperature target: unrounded and rounded UP to unit_s; 0 when already met.
  std::optional<double> extra_hold_unrounded_s, extra_hold_s;
  double extension_medium_C = 0;
  double extension_search_s = 0;               ///< the longest extension searched (max_extra_s)
  std::optional<Check> restored;               ///< re-run with the rounded extension
  std::optional<Check> restored_one_unit_less; ///< one unit less (must not restore, when > 0)
  NoHoldReason extra_hold_none = NoHoldReason::none;  ///< why there is none, when there is none
  std::vector<ProcessNote> notes;
  std::vector<ProcessNote> assumptions;  ///< the assumes_* kinds; report words them
};

/// Evaluates a deviation. REQUIRES: medium_log (with a valid stage) or a probe log (or both).
/// Throws InputError (nothing to evaluate, bad stage), NoSolution is NOT thrown for the extra hold:
/// when no extension up to max_extra_s restores the targets, extra_hold_* stay empty and
/// extra_hold_none says why.
DeviationResult evaluate_deviation(const DeviationInput& in, const Libraries& libs, const DeviationOptions& o = {});

/// The departures alone (exposed for tests): readings of `log` against `schedule`, in time order
/// of their start (medium runs, gaps, then a shortened end).
std::vector<DeviationEvent> find_deviations(const MediumProfile& schedule, const MediumProfile& log,
                                            const DeviationScan& scan);

}  // namespace coldcore::process
