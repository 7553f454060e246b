#pragma once
/// The h a stage with a per-target h range took, and why, as numbers (process/h_ends.hpp chooses
/// it; report/h_choice_text.hpp words it).
#include <cstddef>
#include <string>
#include <vector>

namespace coldcore::process {

enum class HEnd { low, high };

/// Why an end was taken (the rules of process/h_ends.hpp; common practice: a higher h moves the
/// product toward the medium faster).
enum class HReason {
  heating_kept_for_rule,     ///< a heating stage; a cooling rule is timed in the cooling stages
  heating_slower,            ///< slower heating: conservative for lethality and minimum temperatures
  cooling_slower_for_rule,   ///< slower cooling: conservative for a cooling rule
  cooling_credited_faster,   ///< a cooling stage a lethality target credits: faster cooling, less lethality
  cooling_not_credited,      ///< a cooling stage the lethality target does not credit: h changes nothing
  cooling_faster_for_hold,   ///< faster cooling shortens the time at or above a temperature
};

struct HChoice {
  std::size_t stage = 0;       ///< index into the stages (the file counts from 1)
  HEnd end = HEnd::low;
  double h_W_m2K = 0;
  HReason why = HReason::heating_slower;
  std::string stage_name = {};
  double low_W_m2K = 0, high_W_m2K = 0;  ///< the range
  std::string range_label = {};         ///< where the range comes from (e.g. medium_type = ...), or empty
  bool operator==(const HChoice&) const = default;
};

/// One choice and the targets it served.
struct HUse {
  HChoice choice;
  std::vector<std::string> targets = {};  ///< their names; empty with `every_target` or when none
  bool every_target = false;
  bool operator==(const HUse&) const = default;
};

}  // namespace coldcore::process
