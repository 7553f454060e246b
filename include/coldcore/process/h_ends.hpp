#pragma once
/// Stages whose h is a RANGE taken at the end that is conservative for each target (a stage that
/// names medium_type, io/media.hpp; or an h range under --conservative, conservative.hpp): which
/// end serves which target, and the split of a Scenario's targets into groups sharing one set of
/// h choices. Pure computation; no I/O. evaluate() (inverse.hpp) applies it, so run, solve and
/// deviation all evaluate each target on the scenario that is conservative for it.
///
/// Stage direction (heating_stage): a stage HEATS when its highest medium point is not below the
/// lowest medium point of the stage before it (the first stage: not below the product's initial
/// temperature); otherwise it COOLS. A rule on the schedule alone, so it needs no simulation.
///
/// Which end (common practice: a higher h moves the product toward the medium faster):
///  heating stage, every target: the LOW end. Slower heating gives less lethality and reaches a
///    minimum temperature later; a cooling rule is timed in the cooling stages, and the low end is
///    kept for it here as well.
///  cooling stage:
///    cooling rule: the LOW end (slower cooling is conservative for a cooling rule);
///    log-reduction / F-value target crediting this stage or a later one: the HIGH end (faster
///      cooling, so less lethality accrues in the stage, and a colder start for later credited
///      stages);
///    centre-min-temperature / cooking-table target: the HIGH end (faster cooling shortens the
///      time at or above the temperature; these targets see the whole history);
///    a lethality target crediting neither this stage nor a later one: the LOW end (the stage's h
///      does not change what that target credits).
/// Targets with the same choices form one group; groups are in the order of their first target.
/// With one group (the common case: no credited cooling stage with a range) the scenario is
/// evaluated once, exactly as before.
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "coldcore/model/product.hpp"
#include "coldcore/model/scenario.hpp"
#include "coldcore/model/stages.hpp"
#include "coldcore/model/targets.hpp"
#include "coldcore/process/h_choice.hpp"

namespace coldcore::process {

using coldcore::Scenario;  // model/scenario.hpp
using coldcore::StageHRange;


struct TargetGroup {
  std::vector<int> targets;      ///< indices into Scenario::targets (empty only when there are none)
  std::vector<HChoice> choices;  ///< one per stage with a per-target range, in stage order
};

/// Direction of stage i as described above. REQUIRES i < s.stages.size().
bool heating_stage(const Scenario& s, std::size_t i);

/// The choices for target t (an index into s.targets; t < 0: no target, every stage low).
std::vector<HChoice> h_choices_for(const Scenario& s, int t);

/// Groups s.targets by their choices. Always at least one group; without per-target ranges one
/// group holding every target with no choices.
std::vector<TargetGroup> group_targets_by_h(const Scenario& s);

/// A copy of s with the group's h set on its stages and no per-target ranges left.
Scenario apply_h_choices(const Scenario& s, const std::vector<HChoice>& choices);

}  // namespace coldcore::process
