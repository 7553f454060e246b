#pragma once
/// Conservative evaluation: the documented worst case of the product's tolerance ranges, solved
/// beside the nominal answer. The worst case takes, where a range is given:
///   the LARGEST size (diameter, length, thickness), the LOWEST conductivity k, every stage's
///   h_range_W_m2K at the end conservative for each target (process/h_ends.hpp: the LOW end, except
///   the HIGH end in a cooling stage for the lethality and minimum-temperature targets it affects;
///   a stage naming medium_type is taken that way nominally already, so it adds no choice), and
///   the COLDEST initial temperature for heating questions (hold-time, min-medium, and max-size
///   when a lethality or minimum-temperature target exists) or the WARMEST for chilling
///   (chill-time, and max-size with cooling rules only).
/// deviation --conservative uses the same choices (process/deviation_conservative.hpp).
/// Which choice drove it: each choice is applied alone and the question re-solved; the choice whose
/// answer alone is the least favourable (longest time, smallest size, highest medium) is named.
#include <array>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "coldcore/process/inverse.hpp"

namespace coldcore::process {

using coldcore::Ranges;  // model/scenario.hpp

/// What a worst-case choice sets and to what, as numbers (report words it: "diameter 44 mm
/// (largest)", "initial 2 °C (coldest, for heating)").
enum class RangeFactor { diameter, length, thickness, conductivity, stage_h, initial };

struct RangeSetting {
  RangeFactor factor = RangeFactor::diameter;
  double value = 0;         ///< m (sizes), W/mK, W/m2K (stage_h: the range's low end) or °C
  double high = 0;          ///< stage_h with per_target: the range's high end (W/m2K)
  bool per_target = false;  ///< stage_h: at the end conservative for each target, not the low end
  bool heating = true;      ///< initial: the coldest start (heating) or the warmest (chilling)
  std::string stage = {};   ///< stage_h: the stage's name
  bool operator==(const RangeSetting&) const = default;
};

/// One worst-case choice: what it sets, and how.
struct RangeChoice {
  RangeSetting setting;
  std::function<void(Scenario&)> apply;
};

/// The choices for question q (see above). Empty when no range applies.
std::vector<RangeChoice> worst_case_choices(Question q, const Scenario& s, const Ranges& r);
/// The same with the initial-temperature direction given (`heating`: the coldest start) and the
/// size ranges included or not.
std::vector<RangeChoice> worst_case_choices(const Scenario& s, const Ranges& r, bool heating, bool sizes);

struct ChoiceAnswer {
  RangeSetting choice;
  std::optional<double> rounded;  ///< nullopt when that choice alone has no solution
  std::string no_solution;        ///< its reason then
};

struct ConservativeSolve {
  std::vector<RangeSetting> choices;      ///< every applied choice
  std::optional<SolveResult> result;      ///< all choices together (nullopt: no solution)
  std::string no_solution;                ///< reason when result is empty
  std::vector<ChoiceAnswer> alone;        ///< each choice alone
  /// Index into `alone` of the least favourable single choice (none without choices); a choice
  /// with no solution alone drives it over any choice that has one.
  std::optional<std::size_t> driven_by;
  bool driven_by_no_solution = false;
};

/// Solves q with every worst-case choice applied, and with each alone. Throws InputError when no
/// range applies to the question. The solves run on up to `threads` threads (0: the machine's
/// cores); the result is the same for every thread count.
ConservativeSolve solve_conservative(Question q, const Scenario& s, const Ranges& r, const Libraries& libs,
                                     const SolveOptions& o = {}, unsigned threads = 0);

}  // namespace coldcore::process
