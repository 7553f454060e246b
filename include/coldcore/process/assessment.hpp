#pragma once
/// The assessment model: one verdict per target, with margins, per-stage lethality and flags.
/// Pure computation over a History (or a measured cold-spot log); writers format it.
///
/// Verdicts: "met" only when the unrounded computed margin is larger than the computation's own
/// error bound (TargetResult::margin_uncertainty: quadrature error estimate, the accuracy of the
/// history's temperatures, crossing-time tolerances, unit-conversion rounding); otherwise "not
/// demonstrated" with the shortfall, or, inside the bound, "not demonstrated — within the
/// numerical uncertainty of the target", or, at a tie (|margin| within unit-conversion rounding),
/// "not demonstrated — exactly at the required value: not demonstrated by a positive margin". There is no "failed" verdict: a model can only fail to demonstrate.
/// Shown values never look better than the computed ones: lethality (F, log reductions), holds
/// achieved and margins are rounded DOWN; required values, elapsed cooling times and shortfalls
/// are rounded UP (3 significant figures; a 1e-12 relative allowance absorbs binary
/// representation error so that an exact 3 min is shown as 3.00, not 2.99).
///
/// Lethality is evaluated at the cold spot (History centre). Cooling rules and minimum
/// temperatures use Target::at ("centre" or "mean").
#include <array>
#include <limits>
#include <optional>
#include <span>
#include <string>
#include <vector>

#include "coldcore/conduction/history.hpp"
#include "coldcore/lethality/cooking_tables.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "coldcore/lethality/kinetics.hpp"
#include "coldcore/lethality/organisms.hpp"
#include "coldcore/process/cooling.hpp"
#include "coldcore/process/h_choice.hpp"
#include "coldcore/process/shown_values.hpp"
#include "coldcore/model/targets.hpp"

namespace coldcore {

enum class Verdict { met, not_demonstrated };
const char* to_string(Verdict v);   ///< "met" | "not demonstrated"
const char* to_string(TargetKind k);  ///< "log-reduction" | "F-value" | "cooling-rule" | "centre-min-temperature"

/// Options for assess(). Defaults in brackets.
struct AssessOptions {
  std::string origin = "targets";  ///< place used in error messages ["targets"], e.g. the product file
  double rel_tol = 1e-4;           ///< lethality integrals, relative [1e-4; the design asks 1e-3]
  bool prefer_weibull = true;      ///< use an organism's Weibull data for log reductions [true]
  /// Cooling-rule context (FSIS option 2). When unset, assess() takes chilling to start at the
  /// first stage whose medium at its start is below the rule's first step's end temperature and
  /// which follows a time above the first step's start temperature, and the cook to end at the end
  /// of the stage before it. assess_probe_log() cannot infer them.
  std::optional<double> cook_end_s;
  std::optional<double> chill_start_s;
  /// Cooking tables for cooking-table targets (products/cooking-tables.toml); a cooking-table
  /// target without them is an InputError. Not owned.
  const CookingTables* cooking_tables = nullptr;
  /// Out-of-range lethality is flagged when it exceeds this fraction of the credited F [0.001].
  double out_of_range_flag_fraction = 1e-3;
  /// Accuracy (K) of the History's temperatures, for the margin's error bound: the engine's
  /// HistoryOptions::tol_K of the run [1e-4, the engine default]. Not used for measured logs,
  /// whose rows are the data. (solve's search runs, at 1e-3 K, are assessed with this default:
  /// their verdicts only steer the search; every reported re-run uses the engine default.)
  double temperature_tol_K = 1e-4;
  /// assess_probe_log: readings further apart than this are a gap; no lethality is credited across
  /// it, and a cooling-rule step is not taken to start later than the gap's start nor to end
  /// before the gap's end [+inf: none].
  double max_gap_s = std::numeric_limits<double>::infinity();
  /// assess(History): intervals (absolute times) where the logged medium was not recorded
  /// (Stage::medium_gaps_s placed on the history's clock by process::evaluate); treated as above.
  std::vector<std::array<double, 2>> unrecorded_s;
};


struct StageLethality {
  std::string stage;
  double F_s = 0;        ///< lethality accrued in the stage (whether credited or not)
  bool credited = true;  ///< counted towards the target
  std::string F_text;    ///< minutes, rounded down
};

/// What "required / achieved / margin" measure for each kind:
///  log-reduction: log10 reductions; F-value: seconds of F; centre-min-temperature: seconds of
///  continuous hold at or above the temperature; cooling-rule: seconds of the BINDING step, the
///  one that decides the verdict (a failed non-advisory step, the one with the least margin; a
///  step never reached counts as margin min(0, limit − elapsed lower bound) and is binding over a
///  passed step; when every step passes, the tightest). required = its limit, achieved = its
///  elapsed time (a lower bound when never reached), margin = limit − elapsed, never positive for
///  a step never reached. When only the chill-start condition fails, that condition is the row.
/// What an assessment has to say about a target beyond its numbers; report words it
/// (report/target_notes.hpp). Times in s (gap times from the record's start), temperatures in °C.
enum class TargetNoteKind {
  kinetics_without_range,  ///< the target gives its own kinetics: no valid range is known
  value_from_memory,       ///< `key` of organism `subject` is from memory; `source`
  weibull_survival,        ///< Weibull model: value = δ at low_C (s), exponent = p
  never_reached,           ///< `subject` (the point) never reached low_C
  chill_start_inferred,    ///< chilling taken to start with stage `subject` at to_s; cook end at from_s
  exactly_at_required,     ///< the margin is a tie: not demonstrated
  within_uncertainty,      ///< |margin| is inside the error bound (TargetResult::margin_text)
  log_reduction_capped,    ///< counts above value (log10) are not shown
  outside_valid_range,     ///< value = share of the credited F outside [low_C, high_C]
  gap_not_credited,        ///< nothing of `credits` credited from from_s to to_s (limit_s: the gap
                           ///< limit when the log's own rows showed it; 0 otherwise)
  stages_ignored_on_log,   ///< stage filters cannot apply to a probe log
  h_used,                  ///< the heat transfer coefficient used: `h_choice`
};

/// What a gap note says was not credited.
enum class Credit { lethality, time_at_temperature, hold_time };

struct TargetNote {
  TargetNoteKind kind = TargetNoteKind::kinetics_without_range;
  double value = 0;
  double exponent = 0;
  double low_C = 0, high_C = 0;
  double from_s = 0, to_s = 0, limit_s = 0;
  Credit credits = Credit::lethality;
  std::string subject = {}, key = {}, source = {};
  process::HChoice h_choice = {};
};

struct TargetResult {
  std::string name;              ///< target name, or organism key, or rule key
  std::string column;            ///< csv column "F_<name>_min" for lethality targets, else ""
  TargetKind kind = TargetKind::f_value;
  std::string unit;              ///< "log10" | "min" (texts) — raw values are log10 or seconds
  double required = 0;
  double achieved = 0;
  double margin = 0;             ///< achieved − required (cooling: limit − elapsed)
  /// Error bound of `margin` in the same unit (>= 0): "met" needs margin > margin_uncertainty.
  double margin_uncertainty = 0;
  Verdict verdict = Verdict::not_demonstrated;
  std::string required_text, achieved_text, margin_text;  ///< rounded as stated above
  /// The margin cell when it is not a plain amount ("exactly at the required value", "within the
  /// numerical uncertainty (±…)", "not reached by the end of the process"); empty otherwise.
  std::string margin_shown;
  std::string verdict_text;      ///< "met, margin 0.52 log10" / "not demonstrated, shortfall 1.3 min"
  // Lethality targets:
  std::optional<Kinetics> kinetics;
  double F_s = 0;                ///< credited F (equivalent time at kinetics.reference_C)
  double F_required_s = 0;       ///< F needed (log-linear: logs × D; Weibull: δ·logs^(1/p))
  std::vector<StageLethality> stages;
  std::vector<int> credited_stages;  ///< indices into History::stages
  /// Lethality targets on a History: the unrecorded intervals (AssessOptions::unrecorded_s) left
  /// out of the credited stages, for the cumulative F column.
  std::vector<std::array<double, 2>> unrecorded_s;
  double F_outside_range_s = 0;  ///< credited F accrued outside [valid_min_C, valid_max_C]
  // Cooling-rule targets:
  std::optional<CoolingCheck> cooling;
  // cooking-table targets:
  std::optional<CookingCheck> cooking;
  // centre-min-temperature targets:
  std::optional<double> reached_s;   ///< first time the temperature was reached
  std::vector<TargetNote> notes;     ///< flags and provenance remarks
  std::string source;                ///< data source(s) behind the verdict
};

/// An assessment-wide finding; report words it (report/target_notes.hpp).
enum class AssessmentWarningKind {
  interpolated_history,  ///< the history has no exact evaluation: samples interpolated linearly
  log_rules_disagree,    ///< `target`: the three rules on a probe log differ by value (a share)
  log_sampling,          ///< `target`: what the log-sampling check found (`sampling`)
};

struct AssessmentWarning {
  AssessmentWarningKind kind = AssessmentWarningKind::interpolated_history;
  std::string target = {};
  double value = 0;
  SamplingNote sampling = {};
  bool operator==(const AssessmentWarning&) const = default;
};

struct Assessment {
  std::vector<TargetResult> targets;
  std::vector<AssessmentWarning> warnings;  ///< assessment-wide (history warnings are not repeated)
  /// True when there is at least one target and every target is met.
  bool all_met() const;
};

/// Assesses every target against a History.
/// REQUIRES: h.samples non-empty and increasing in time; h.evaluate set (otherwise the samples
/// are interpolated linearly and a warning says so).
/// Throws InputError for unknown organisms/rules/stages ("<origin>: target[i]: ..."), lethality
/// targets without kinetics, log-reduction targets without a D (or Weibull) value.
Assessment assess(const History& h, const std::vector<Target>& targets, const OrganismLibrary& organisms,
                  const RuleLibrary& rules, const AssessOptions& opts = {});

/// Cumulative credited F (seconds) of a lethality target at each of times_s (non-decreasing),
/// for csv columns F_<name>_min. REQUIRES: r.kinetics (a lethality TargetResult from assess on h).
std::vector<double> cumulative_f_s(const History& h, const TargetResult& r,
                                   std::span<const double> times_s, double rel_tol = 1e-4);

/// A cooking table (products/cooking-tables.toml) checked on a History at the centre (or the
/// mass-average when `mean`), by the equivalent-time integral of cooking_tables.hpp.
CookingCheck check_cooking_table(const History& h, const CookingTable& table, bool mean = false);

/// One lethality target on a measured log, by three rules.
struct ProbeLethality {
  std::string name;
  double F_trapezoid_s = 0, F_simpson_s = 0, F_linear_s = 0;  ///< the verdict uses the smallest
};

struct ProbeAssessment {
  std::vector<TargetResult> targets;    ///< as for assess(); lethality verdicts on the smallest F
  std::vector<ProbeLethality> lethality;  ///< the three F values per lethality target, in order
  std::vector<AssessmentWarning> warnings;  ///< sampling warnings, rule disagreement > 1 %
  bool all_met() const;
};

/// Assesses targets on a measured cold-spot log (time_s, temp_C rows, linear between rows for
/// rules and minimum temperatures). Stage filters cannot apply to a log and are noted.
/// REQUIRES: times strictly increasing (else InputError naming `origin` and the row).
ProbeAssessment assess_probe_log(std::span<const double> times_s, std::span<const double> temps_C,
                                 const std::vector<Target>& targets, const OrganismLibrary& organisms,
                                 const RuleLibrary& rules, const AssessOptions& opts = {},
                                 std::string_view origin = "log");

}  // namespace coldcore
