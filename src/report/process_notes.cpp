#include "coldcore/report/process_notes.hpp"

#include "coldcore/model/temperature_token.hpp"
#include "coldcore/number_text.hpp"
#include "coldcore/report/h_choice_text.hpp"

namespace coldcore {

using process::ProcessNote;
using process::ProcessNoteKind;

namespace {

std::string num(double v, int significant = 10) { return number_text(v, significant); }

std::string common_note_text(const ProcessNote& n) {
  switch (n.kind) {
    case ProcessNoteKind::h_scenarios:
      return "the targets need different ends of an h range, so they were evaluated on " + std::to_string(n.count) +
             " scenarios, each target on the one conservative for it; the result is the least favourable over them";
    case ProcessNoteKind::h_per_target: return "h per target: " + h_use_text(n.h_use);
    case ProcessNoteKind::medium_log_short:
      return "the medium log covers " + num(n.value) + " s of the stage's " + num(n.other) +
             " s; its last reading is held to the end";
    case ProcessNoteKind::log_gaps_not_credited:
      return "lethality accrued in the " + std::to_string(n.count) + " gap(s) of the medium log (" + num(n.value) +
             " s in all) is not credited, and a cooling-rule step that completes in one is taken to complete at its "
             "end: the medium meanwhile is unknown; the product's temperature is carried across them by linear "
             "interpolation of the medium";
    case ProcessNoteKind::model_probe_disagree:
      return "the model with the logged medium and the measured probe log disagree on whether every target is met; "
             "the probe is a measurement at one point, the model assumes the cold spot";
    case ProcessNoteKind::chill_h_low_end:
      return "the end temperature is reached with every h range at its low end (slower cooling)";
    default: return assumption_text(n);
  }
}

}  // namespace

std::string assumption_text(const ProcessNote& n) {
  const std::string stage = "stage \"" + n.subject + "\"";
  switch (n.kind) {
    case ProcessNoteKind::assumes_schedule_as_written:
      return "the scheduled process is the product file as written; the delivered one differs only where the logs say so";
    case ProcessNoteKind::assumes_medium_log_starts:
      return "the medium log's first row is the start of " + stage + "; " +
             (n.reached ? "the stage lasts as long as the log (scheduled duration " + num(n.value, 6) + " s)"
                        : std::string("the stage keeps its temperature condition as its end")) +
             "; h and the other stages as scheduled";
    case ProcessNoteKind::assumes_deviation_threshold:
      return stage + " " + (n.reached ? "heats, so a reading colder" : "cools, so a reading warmer") +
             " than the schedule by more than " + temp_difference_token(n.tol_K) +
             " is deviated; the medium is linear between logged readings; readings more than " + num(n.value, 6) +
             " s apart are a gap in the log";
    case ProcessNoteKind::assumes_probe_is_cold_spot:
      return "the probe log is the cold-spot temperature, time 0 at the start of the first stage; lethality from it "
             "uses the smallest of three integration rules";
    case ProcessNoteKind::assumes_worst_case_replay:
      return "worst case of the file's ranges: every choice applied together to the scheduled process, and the same "
             "medium log replayed on it";
    case ProcessNoteKind::assumes_fixed_duration:
      return stage + " ends by a temperature condition in the file; for this question it is given a fixed duration";
    case ProcessNoteKind::assumes_hold_time_targets:
      return "solved for the lethality and minimum-temperature targets, each with its own stage credit; cooling rules "
             "are re-checked on the re-run only";
    case ProcessNoteKind::assumes_chill_end:
      return "chill-time answers the end temperature; the cooling rules are checked on the re-run and reported as "
             "they come out, met or not";
    case ProcessNoteKind::assumes_size_search:
      return n.reached ? "searched from the nominal " + n.subject + " upward; smaller sizes are not examined"
                       : "the nominal " + n.subject + " does not meet every target; searched below it";
    case ProcessNoteKind::assumes_diameter_varied:
      return "finite cylinder: the diameter is varied, the length kept as in the file";
    case ProcessNoteKind::assumes_smallest_edge_varied:
      return "brick: the smallest edge is varied, the other edges kept as in the file";
    case ProcessNoteKind::assumes_stages_kept:
      return "the stages as scheduled (durations, or their temperature conditions and caps) are kept";
    case ProcessNoteKind::assumes_constant_medium:
      return stage + " has a medium profile in the file; for this question it is replaced by a constant medium "
             "(nominal shown is the profile's highest point)";
    case ProcessNoteKind::assumes_search_from_initial:
      return "the search starts at the initial product temperature (" + temp_token(n.temp_C, 4) + ")";
    default: return {};
  }
}

std::vector<std::string> solved_for_texts(const process::SolveResult& r) {
  if (r.end_C) return {r.end_point + " at or below " + temp_token(*r.end_C, 4)};
  return r.considered;
}

std::vector<std::string> assumption_texts(const std::vector<ProcessNote>& assumptions) {
  std::vector<std::string> out;
  for (const auto& n : assumptions) out.push_back(assumption_text(n));
  return out;
}

std::string solve_note_text(const ProcessNote& n, const process::SolveResult& r) {
  switch (n.kind) {
    case ProcessNoteKind::rounded_again:
      return "the answer rounded to " + process::parameter_text(r.question, n.value) +
             " did not meet every target on re-run; one more unit taken";
    case ProcessNoteKind::one_unit_less_meets:
      return "one unit less (" + process::parameter_text(r.question, n.value) +
             ") also meets every target: the answer is limited by the search bound, not by the targets";
    case ProcessNoteKind::one_unit_less_outside:
      return "one unit less (" + process::parameter_text(r.question, n.value) + ") is outside the parameter's domain; not re-run";
    case ProcessNoteKind::met_at_bound:
      return "every target is already met at the bound " + process::parameter_text(r.question, n.value) +
             " of the search; the answer is that bound";
    case ProcessNoteKind::chill_end_reached:
      return "the " + n.subject + " reaches " + temp_token(n.temp_C, 4) + " after " + num(n.value, 7) +
             " s of the stage; at the rounded duration it is " + temp_token(n.other_C, 6);
    case ProcessNoteKind::chill_one_unit_less:
      return "one unit less (" + num(n.value) + " s) leaves the " + n.subject + " at " + temp_token(n.other_C, 6) +
             (n.reached ? ", below the end temperature"
                        : ", not below the end temperature by more than the model's temperature accuracy (" +
                              num(n.tol_K) + " K)");
    default: return common_note_text(n);
  }
}

std::vector<std::string> solve_note_texts(const process::SolveResult& r) {
  std::vector<std::string> out;
  for (const auto& n : r.notes) out.push_back(solve_note_text(n, r));
  return out;
}

std::string deviation_note_text(const ProcessNote& n) { return common_note_text(n); }

std::vector<std::string> deviation_note_texts(const std::vector<ProcessNote>& notes) {
  std::vector<std::string> out;
  for (const auto& n : notes) out.push_back(deviation_note_text(n));
  return out;
}

}  // namespace coldcore
