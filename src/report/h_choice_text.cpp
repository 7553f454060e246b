#include "coldcore/report/h_choice_text.hpp"

#include "coldcore/number_text.hpp"

namespace coldcore {

using process::HReason;

namespace {

std::string num(double v) { return number_text(v, 6); }

const char* reason_text(HReason r) {
  switch (r) {
    case HReason::heating_kept_for_rule:
      return "a heating stage; the cooling rule is timed in the cooling stages and the low end is kept for it";
    case HReason::heating_slower: return "slower heating, conservative for lethality and minimum temperatures";
    case HReason::cooling_slower_for_rule: return "slower cooling, conservative for a cooling rule";
    case HReason::cooling_credited_faster:
      return "a cooling stage credited by this lethality target: faster cooling, less lethality accrues, "
             "conservative for it";
    case HReason::cooling_not_credited:
      return "a cooling stage this lethality target does not credit (nor any stage after it): its h does not "
             "change the target";
    case HReason::cooling_faster_for_hold:
      return "a cooling stage: faster cooling shortens the time at or above the temperature, conservative for it";
  }
  return "";
}

}  // namespace

std::string h_choice_text(const process::HChoice& c) {
  return "stage \"" + c.stage_name + "\": h " + num(c.h_W_m2K) + " W/m2K, the " +
         (c.end == process::HEnd::low ? "low" : "high") + " end of " + num(c.low_W_m2K) + "-" + num(c.high_W_m2K) +
         (c.range_label.empty() ? "" : " (" + c.range_label + ")") + ": " + reason_text(c.why);
}

std::string h_use_text(const process::HUse& u) {
  std::string names;
  if (u.every_target) {
    names = "every target";
  } else {
    for (const auto& n : u.targets) names += (names.empty() ? "" : ", ") + ("\"" + n + "\"");
    if (names.empty()) names = "no target";
  }
  return h_choice_text(u.choice) + "; used for " + names;
}

}  // namespace coldcore
