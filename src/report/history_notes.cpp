#include "coldcore/report/history_notes.hpp"

#include "coldcore/model/temperature_token.hpp"
#include "coldcore/number_text.hpp"

namespace coldcore {

std::string stage_note_text(const StageNote& n) {
  const std::string watched = n.on_mean ? "mean" : "centre";
  const std::string stage = "stage " + std::to_string(n.stage_number) + " '" + n.stage_name + "': ";
  switch (n.kind) {
    case StageNoteKind::ended_at_start:
      return stage + watched + " is already at or past " + temp_token(n.target_C) +
             " at the stage start; the stage ends at once";
    case StageNoteKind::cap_reached:
      return stage + watched + " did not reach " + temp_token(n.target_C) + " within the cap of " +
             number_text(n.cap_s, 10) + " s; stage ended at the cap with the " + watched + " at " + temp_token(n.value_C);
  }
  return stage;
}

std::vector<std::string> history_warnings(const History& h) {
  std::vector<std::string> out;
  out.reserve(h.notes.size());
  for (const auto& n : h.notes) out.push_back(stage_note_text(n));
  return out;
}

}  // namespace coldcore
