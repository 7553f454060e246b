#include "coldcore/report/process_notes.hpp"

#include "coldcore/model/temperature_token.hpp"
#include "coldcore/number_text.hpp"

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
    case ProcessNoteKind::h_per_target: return "h per target: " + n.subject;
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
    default: return {};
  }
}

}  // namespace

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
