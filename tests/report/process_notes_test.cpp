// The inverse questions' and the deviation's notes are numbers (process/process_notes.hpp);
// report words them with the answer's unit, temperatures in the report's unit.
#include <doctest/doctest.h>

#include <string>

#include "coldcore/report/process_notes.hpp"
#include "coldcore/report/temperature_text.hpp"

using namespace coldcore;
using process::ProcessNote;
using process::ProcessNoteKind;

TEST_CASE("a solve note names the parameter with its unit") {
  process::SolveResult hold;
  hold.question = process::Question::hold_time;
  hold.notes = {{ProcessNoteKind::one_unit_less_meets, 780}};
  CHECK(solve_note_texts(hold).at(0) ==
        "one unit less (780 s) also meets every target: the answer is limited by the search bound, not by the targets");
  process::SolveResult size;
  size.question = process::Question::max_size;
  size.notes = {{ProcessNoteKind::one_unit_less_outside, 0.038}};
  CHECK(solve_note_texts(size).at(0) == "one unit less (38 mm) is outside the parameter's domain; not re-run");
  // 72.5 C = 162.5 F (F = 1.8 C + 32).
  process::SolveResult medium;
  medium.question = process::Question::min_medium;
  medium.notes = {{ProcessNoteKind::met_at_bound, 72.5}};
  CHECK(render_temperatures(solve_note_texts(medium).at(0), TempUnit::F) ==
        "every target is already met at the bound 162.5 °F of the search; the answer is that bound");
}

TEST_CASE("a deviation note counts the gaps of the medium log and their length") {
  ProcessNote gaps{ProcessNoteKind::log_gaps_not_credited, 300};
  gaps.count = 2;
  CHECK(deviation_note_text(gaps).find("lethality accrued in the 2 gap(s) of the medium log (300 s in all) is not "
                                       "credited") == 0);
}
