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

TEST_CASE("assumptions are numbers too: report words them in the report's unit") {
  // 4 C = 39.2 F; a 2 K difference is 3.6 F (F = 1.8 C + 32).
  ProcessNote from_initial{ProcessNoteKind::assumes_search_from_initial};
  from_initial.temp_C = 4;
  CHECK(render_temperatures(assumption_text(from_initial), TempUnit::F) ==
        "the search starts at the initial product temperature (39.2 °F)");
  ProcessNote threshold = process::note_about(ProcessNoteKind::assumes_deviation_threshold, "cook", false);
  threshold.tol_K = 2;
  threshold.value = 120;
  CHECK(render_temperatures(assumption_text(threshold), TempUnit::F) ==
        "stage \"cook\" cools, so a reading warmer than the schedule by more than 3.6 °F is deviated; the medium is "
        "linear between logged readings; readings more than 120 s apart are a gap in the log");
  const auto searched = assumption_texts({process::note_about(ProcessNoteKind::assumes_size_search, "diameter", true),
                                          process::note_about(ProcessNoteKind::assumes_size_search, "diameter")});
  CHECK(searched.at(0) == "searched from the nominal diameter upward; smaller sizes are not examined");
  CHECK(searched.at(1) == "the nominal diameter does not meet every target; searched below it");
}

TEST_CASE("chill-time is solved for its end condition - worded in the report's unit") {
  process::SolveResult chill;
  chill.question = process::Question::chill_time;
  chill.end_C = 5;
  chill.end_point = "centre";
  // 5 C = 41 F (F = 1.8 C + 32).
  CHECK(render_temperatures(solved_for_texts(chill).at(0), TempUnit::F) == "centre at or below 41 °F");
  process::SolveResult hold;
  hold.considered = {"F70"};
  CHECK(solved_for_texts(hold) == std::vector<std::string>{"F70"});
}
