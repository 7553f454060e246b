#pragma once
/// `deviation --conservative`: the deviation (scheduled against delivered, verdicts, extra hold)
/// evaluated again under the documented worst case of the product file's ranges, beside the
/// nominal result (process/deviation.hpp), and the single choice that drove it.
///
/// Worst-case choices (every range given that applies; see process/conservative.hpp):
///   the LARGEST size (diameter, length, thickness), the LOWEST conductivity k, every stage h range
///   at its conservative end (as solve --conservative), and the initial temperature:
///   COLDEST when the deviated stage is a heating stage (process/h_ends.hpp: heating_stage) or
///   when the file has no cooling rule; WARMEST when the deviated stage is a cooling stage and a
///   cooling rule is among the targets (a warmer start cools later). initial_reason says which
///   and why.
/// All choices are applied together to the scheduled scenario (so the conservative "scheduled"
/// column is the worst-case product under the schedule) and the same medium log is replayed: a
/// log identical to the schedule still reproduces the (conservative) scheduled result.
/// Driving choice: each choice alone is evaluated the same way; the one needing the LARGEST extra
/// hold (no extension restoring the targets counts as largest) is named, ties broken by the
/// LEAST delivered margin (min over targets of target_margin(), inverse.hpp).
/// A measured probe log is a measurement: the ranges do not change it, so it is not re-evaluated.
#include <optional>
#include <string>
#include <vector>

#include "coldcore/process/conservative.hpp"
#include "coldcore/process/deviation.hpp"

namespace coldcore::process {

/// One worst-case choice applied alone.
struct DeviationChoiceResult {
  RangeSetting choice;
  bool all_met_delivered = false;
  double least_margin = 0;             ///< min over targets of target_margin(delivered)
  std::optional<double> extra_hold_s;  ///< rounded up; empty: none computed (extra_hold_none says why)
  NoHoldReason extra_hold_none = NoHoldReason::none;
};

/// The conservative part of a deviation record, kept apart from the nominal DeviationResult.
/// Why the coldest or the warmest start was taken (report words it).
enum class InitialChoiceReason {
  none,                  ///< no initial-temperature range
  deviated_stage_heats,  ///< a colder start delivers less lethality
  cools_without_rule,    ///< no cooling rule: the coldest start is conservative for the other targets
  cools_with_rule,       ///< a cooling rule among the targets: a warmer start cools later
};

struct InitialChoice {
  InitialChoiceReason reason = InitialChoiceReason::none;
  std::optional<std::string> deviated_stage;  ///< its name; empty without a (valid) deviated stage
};

struct ConservativeDeviation {
  std::vector<RangeSetting> choices;   ///< every applied choice
  InitialChoice initial;               ///< why the coldest or warmest start
  DeviationResult result;              ///< every choice together
  std::vector<DeviationChoiceResult> alone;
  std::optional<std::size_t> driven_by;  ///< index into `alone` of the driving choice
};

/// Worst-case choices of a deviation (above). `initial` receives why the initial temperature's end.
std::vector<RangeChoice> deviation_worst_case_choices(const DeviationInput& in, const Ranges& r,
                                                      InitialChoice* initial = nullptr);

/// Evaluates the deviation under the worst case and each choice alone.
/// Throws InputError when there is no medium log (a probe log alone does not depend on ranges) or
/// when the file gives no range that applies; otherwise as evaluate_deviation(). The evaluations
/// run on up to `threads` threads (0: the machine's cores); the result does not depend on it.
ConservativeDeviation evaluate_deviation_conservative(const DeviationInput& in, const Ranges& r, const Libraries& libs,
                                                      const DeviationOptions& o = {}, unsigned threads = 0);

}  // namespace coldcore::process
