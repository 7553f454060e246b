#include "coldcore/report/conservative_text.hpp"

#include "coldcore/model/temperature_token.hpp"
#include "coldcore/number_text.hpp"

namespace coldcore {

using process::RangeFactor;

namespace {

std::string num(double v) { return number_text(v, 6); }

}  // namespace

std::string range_setting_text(const process::RangeSetting& s) {
  switch (s.factor) {
    case RangeFactor::diameter: return "diameter " + num(s.value * 1000) + " mm (largest)";
    case RangeFactor::length: return "length " + num(s.value * 1000) + " mm (largest)";
    case RangeFactor::thickness: return "thickness " + num(s.value * 1000) + " mm (largest)";
    case RangeFactor::conductivity: return "conductivity " + num(s.value) + " W/mK (lowest)";
    case RangeFactor::stage_h:
      return s.per_target ? "stage \"" + s.stage + "\" h " + num(s.value) + "-" + num(s.high) +
                                " W/m2K at the conservative end per target (high where a credited cooling stage, "
                                "low otherwise)"
                          : "stage \"" + s.stage + "\" h " + num(s.value) + " W/m2K (lowest)";
    case RangeFactor::initial:
      return "initial " + temp_token(s.value) + " (" + (s.heating ? "coldest, for heating" : "warmest, for chilling") +
             ")";
  }
  return {};
}

std::vector<std::string> range_setting_texts(const std::vector<process::RangeSetting>& s) {
  std::vector<std::string> out;
  for (const auto& x : s) out.push_back(range_setting_text(x));
  return out;
}

std::string driven_by_text(const process::ConservativeSolve& c) {
  if (!c.driven_by || *c.driven_by >= c.alone.size()) return {};
  return range_setting_text(c.alone[*c.driven_by].choice) +
         (c.driven_by_no_solution ? " (no solution with it alone)" : "");
}

std::string driven_by_text(const process::ConservativeDeviation& c) {
  if (!c.driven_by || *c.driven_by >= c.alone.size()) return {};
  return range_setting_text(c.alone[*c.driven_by].choice);
}

std::string initial_choice_text(const process::InitialChoice& c) {
  const std::string st = c.deviated_stage ? "\"" + *c.deviated_stage + "\"" : "(none)";
  switch (c.reason) {
    case process::InitialChoiceReason::none: return {};
    case process::InitialChoiceReason::deviated_stage_heats:
      return "the deviated stage " + st + " heats: a colder start delivers less lethality";
    case process::InitialChoiceReason::cools_without_rule:
      return "the deviated stage " + st + " cools but no cooling rule is among the targets: the coldest start is the "
             "conservative one for the lethality and minimum-temperature targets";
    case process::InitialChoiceReason::cools_with_rule:
      return "the deviated stage " + st + " cools and a cooling rule is among the targets: a warmer start cools later";
  }
  return {};
}

std::string no_hold_text(process::NoHoldReason why, const process::DeviationResult& r) {
  switch (why) {
    case process::NoHoldReason::none: return {};
    case process::NoHoldReason::stage_ends_by_condition:
      return "stage \"" + r.stage + "\" ends by a temperature condition, not a duration; no extension is computed";
    case process::NoHoldReason::no_target_to_restore: return "no lethality or minimum-temperature target to restore";
    case process::NoHoldReason::no_extension_restores:
      return "no extension of stage \"" + r.stage + "\" at " + temp_token(r.extension_medium_C, 5) + " up to " +
             num(r.extension_search_s / 3600.0) + " h restores every lethality target";
  }
  return {};
}

}  // namespace coldcore
