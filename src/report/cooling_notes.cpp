#include "coldcore/report/cooling_notes.hpp"

#include "coldcore/model/temperature_token.hpp"
#include "coldcore/report/format.hpp"

namespace coldcore {

std::string cooling_note_text(const CoolingNote& n, const CoolingCheck& c) {
  // The rule's chill-start condition concerns no step.
  switch (n.kind) {
    case CoolingNoteKind::chill_start_late:
      return "chilling began " + duration_text(n.at_s) + " after the cook; the rule requires within " +
             duration_text(n.limit_s);
    case CoolingNoteKind::chill_start_unknown:
      return "the time from the end of the cook to the start of chilling is not known: the rule's condition "
             "(within " + duration_text(n.limit_s) + ") is not demonstrated";
    default: break;
  }
  const CoolingStepResult& r = c.steps.at(n.step);
  const std::string& where = c.subject;
  const std::string from = temp_token(r.step.from_C, 10), to = temp_token(r.step.to_C, 10);
  std::string gap = "(";  // (built by appends: GCC 12 warns falsely (-Wrestrict) on "(" + std::string)
  gap.append(duration_text(n.gap_from_s)).append(" to ").append(duration_text(n.gap_to_s)).append(")");
  switch (n.kind) {
    case CoolingNoteKind::never_above_start:
      return where + " never exceeds " + from + " in the record; the clock starts at its highest temperature (" +
             temp_token(n.peak_C, 10) + " at " + duration_text(n.at_s) +
             ") and any earlier time above it is not counted";
    case CoolingNoteKind::above_start_at_end:
      return where + " is still above " + from + " at the end of the record: the step's clock never started";
    case CoolingNoteKind::start_in_gap:
      return "the clock would start inside a gap in the record " + gap + ": it is taken to start at the gap's start";
    case CoolingNoteKind::end_in_gap:
      return to + " is reached inside a gap in the record " + gap +
             ": it is taken as reached at the gap's end, the first reading after it";
    case CoolingNoteKind::end_not_reached:
      return where + " did not reach " + to + " within the record (at least " + duration_text(n.at_s) +
             " after the clock start)";
    case CoolingNoteKind::rose_again:
      return where + " rose above " + from + " again at " + duration_text(n.at_s) + "; the clock was not restarted";
    case CoolingNoteKind::advisory_exceeded:
      return "flag: " + r.step.label + " took longer than " + duration_text(n.limit_s) + " (or was not reached): " +
             r.step.source;
    case CoolingNoteKind::chill_start_late:
    case CoolingNoteKind::chill_start_unknown: break;  // worded above
  }
  return {};
}

std::vector<std::string> cooling_note_texts(const CoolingCheck& c) {
  std::vector<std::string> out;
  for (const auto& s : c.steps)
    for (const auto& n : s.notes) out.push_back(s.step.label + ": " + cooling_note_text(n, c));
  for (const auto& n : c.notes) out.push_back(cooling_note_text(n, c));
  return out;
}

}  // namespace coldcore
