#include "coldcore/report/target_notes.hpp"

#include "coldcore/model/temperature_token.hpp"
#include "coldcore/number_text.hpp"
#include "coldcore/report/h_choice_text.hpp"
#include "coldcore/process/shown_values.hpp"

namespace coldcore {

namespace {

const char* credited_text(Credit c) {
  switch (c) {
    case Credit::lethality: return "no lethality credited across";
    case Credit::time_at_temperature: return "no time at temperature credited across";
    case Credit::hold_time: return "no hold time credited across";
  }
  return "nothing credited across";
}

}  // namespace

std::string target_note_text(const TargetNote& n, const TargetResult& t) {
  switch (n.kind) {
    case TargetNoteKind::kinetics_without_range:
      return "kinetics given in the target: no valid temperature range is known for them";
    case TargetNoteKind::value_from_memory:
      return n.key + " of " + n.subject + " is from memory (unconfirmed): " + n.source;
    case TargetNoteKind::weibull_survival:
      return "Weibull survival (delta = " + shown_down(n.value / 60) + " min at " + temp_token(n.low_C, 10) +
             ", p = " + number_text(n.exponent, 10) + "): log10 reduction = (F/delta)^p";
    case TargetNoteKind::never_reached: return n.subject + " never reached " + temp_token(n.low_C, 10);
    case TargetNoteKind::chill_start_inferred:
      return "chilling taken to start with stage '" + n.subject + "' at " + minutes_down(n.to_s) +
             "; cook taken to end at " + minutes_down(n.from_s);
    case TargetNoteKind::exactly_at_required:
      return "exactly at the required value: not demonstrated by a positive margin";
    case TargetNoteKind::within_uncertainty:
      return "within the numerical uncertainty of the target: the margin " +
             signed_small(t.margin, shown_unit(t.unit)) +
             " is inside the computation's error bound " + t.margin_text +
             " (integration error, temperature accuracy, crossing times, unit rounding)";
    case TargetNoteKind::log_reduction_capped:
      return "log reductions above " + number_text(n.value, 10) +
             " are not shown as a count: kinetic data are fitted over at most about 9 log cycles "
             "and no target in common use asks more than 12 (the botulinum cook), so a larger count "
             "extrapolates the survivor curve past anything a validation could observe (common "
             "practice; the 9 cycles from memory); the credited F is the result";
    case TargetNoteKind::outside_valid_range:
      return "flag: " + shown_up(100 * n.value, 2) + " % of the credited F accrued outside the data's valid range " +
             temp_token(n.low_C, 10) + " to " + temp_token(n.high_C, 10);
    case TargetNoteKind::gap_not_credited:
      return std::string(credited_text(n.credits)) + " the gap in the log from " + minutes_down(n.from_s) + " to " +
             minutes_down(n.to_s) + (n.limit_s > 0 ? " (longer than " + shown_down(n.limit_s) + " s)" : "") +
             ": the temperature meanwhile was not recorded";
    case TargetNoteKind::stages_ignored_on_log:
      return "stages cannot be selected on a probe log: the whole log is credited";
    case TargetNoteKind::h_used: return "h used: " + h_choice_text(n.h_choice);
  }
  return {};
}

std::vector<std::string> target_note_texts(const TargetResult& t) {
  std::vector<std::string> out;
  out.reserve(t.notes.size());
  for (const auto& n : t.notes) out.push_back(target_note_text(n, t));
  return out;
}

}  // namespace coldcore
