#pragma once
// One curve abstraction for the assessment: a model history and a measured log each say what
// they show for a target (its lethality with an error bound, a cooling check, a cooking check,
// the curve behind a minimum temperature); assess_targets turns that into verdicts with one
// switch over the target kinds. Private to src/process/.
#include <optional>
#include <string>
#include <vector>

#include "process/detail/assessing.hpp"

namespace coldcore::assessing {

/// Lethality at the cold spot (or the probe) for one target.
struct LethalityEvidence {
  double F_s = 0;                 ///< credited F
  double F_error_s = 0;           ///< bound of F_s's own error (quadrature, temperature accuracy, sums)
  double F_outside_range_s = 0;   ///< credited F accrued outside the kinetics' valid range
  double share_base_s = 0;        ///< the F of which F_outside_range_s is a share (0: no share)
  std::vector<int> credited_stages;
  std::vector<StageLethality> stages;
  Gaps unrecorded_s;
  std::vector<TargetNote> notes;  ///< before the verdict's own notes
  std::vector<AssessmentWarning> warnings;
  std::optional<ProbeLethality> rules;  ///< the three rules of a measured log
};

struct CoolingEvidence {
  CoolingCheck check;
  CrossingError error;
  std::vector<TargetNote> notes;  ///< after the check's own notes
};

struct CookingEvidence {
  CookingCheck check;
  double fraction_uncertainty = 0;
  std::vector<TargetNote> notes;
};

struct MinTemperatureEvidence {
  detail::Curve curve;
  CrossingError error;
  Gaps gaps;
  std::vector<TargetNote> notes;
};

class AssessedCurve {
 public:
  virtual ~AssessedCurve() = default;
  /// `place` names the target in errors ("<origin>: target[i]").
  virtual LethalityEvidence lethality(const Target& t, const Resolved& res, const std::string& place) const = 0;
  virtual CoolingEvidence cooling(const Target& t, const CoolingRule& rule) const = 0;
  virtual CookingEvidence cooking(const Target& t, const CookingTable& table) const = 0;
  virtual MinTemperatureEvidence min_temperature(const Target& t) const = 0;
};

struct AssessedTargets {
  std::vector<TargetResult> targets;
  std::vector<AssessmentWarning> warnings;
  std::vector<ProbeLethality> rules;  ///< per lethality target of a measured log, in order
};

/// Every target's verdict on one curve (the only switch over target kinds in the assessment).
AssessedTargets assess_targets(const AssessedCurve& curve, const std::vector<Target>& targets,
                               const OrganismLibrary& organisms, const RuleLibrary& rules,
                               const AssessOptions& opts);

}  // namespace coldcore::assessing
