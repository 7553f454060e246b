#pragma once
/// What an inverse question or a deviation has to say beyond its numbers; report words it
/// (report/process_notes.hpp). Values are in the answer's SI unit (s, m or °C) unless said.
#include <cstddef>
#include <string>
#include <utility>

#include "coldcore/process/h_choice.hpp"

namespace coldcore::process {

enum class ProcessNoteKind {
  rounded_again,          ///< the answer rounded to `value` failed its re-run; one more unit taken
  one_unit_less_meets,    ///< one unit less (`value`) also meets every target: the search bound limits
  one_unit_less_outside,  ///< one unit less (`value`) is outside the parameter's domain; not re-run
  met_at_bound,           ///< every target is already met at the search bound `value`
  chill_end_reached,      ///< `subject` (the point) reaches temp_C after `value` s; other_C at the rounded time
  chill_one_unit_less,    ///< one unit less (`value` s) leaves `subject` at other_C; `reached` below
                          ///< temp_C, or not by more than `tol_K`
  chill_h_low_end,        ///< the end temperature is reached with every h range at its low end
  h_scenarios,            ///< the targets were evaluated on `count` h scenarios
  h_per_target,           ///< `h_use`: the h a stage took and for which targets
  medium_log_short,       ///< the medium log covers `value` s of the stage's `other` s
  log_gaps_not_credited,  ///< `count` gaps of the medium log, `value` s in all, are not credited
  model_probe_disagree,   ///< the model and the probe log disagree on whether every target is met

  // What an answer assumes (SolveResult::assumptions, DeviationResult::assumptions):
  assumes_schedule_as_written,   ///< deviation: the delivered process differs only where the logs say
  assumes_medium_log_starts,     ///< the medium log starts stage `subject`; `reached`: it lasts as long as
                                 ///< the log (scheduled duration `value` s), else keeps its end condition
  assumes_deviation_threshold,   ///< stage `subject` heats (`reached`) or cools; deviated beyond `tol_K`;
                                 ///< readings more than `value` s apart are a gap
  assumes_probe_is_cold_spot,    ///< the probe log is the cold spot, on the first stage's clock
  assumes_worst_case_replay,     ///< deviation --conservative: every choice together, the log replayed
  assumes_fixed_duration,        ///< stage `subject` ends by a temperature; here it has a fixed duration
  assumes_hold_time_targets,     ///< hold-time: lethality and minimum-temperature targets; rules re-checked
  assumes_chill_end,             ///< chill-time answers the end temperature; rules as they come out
  assumes_size_search,           ///< searched `subject` (the size) from the nominal up when `reached`
                                 ///< (the nominal meets every target), else below it
  assumes_diameter_varied,       ///< finite cylinder: the diameter varies, the length is kept
  assumes_smallest_edge_varied,  ///< brick: the smallest edge varies, the other edges are kept
  assumes_stages_kept,           ///< the stages as scheduled are kept
  assumes_constant_medium,       ///< stage `subject`'s medium profile replaced by a constant medium
  assumes_search_from_initial,   ///< the medium search starts at the initial temperature temp_C
};

struct ProcessNote {
  ProcessNoteKind kind = ProcessNoteKind::h_scenarios;
  double value = 0, other = 0;
  double temp_C = 0, other_C = 0, tol_K = 0;
  bool reached = false;
  std::size_t count = 0;
  std::string subject = {};
  HUse h_use = {};
  bool operator==(const ProcessNote&) const = default;
};

/// A note about `subject` (a stage's or a size's name), with its yes/no in `reached`.
inline ProcessNote note_about(ProcessNoteKind kind, std::string subject, bool reached = false) {
  ProcessNote n{kind};
  n.subject = std::move(subject);
  n.reached = reached;
  return n;
}

}  // namespace coldcore::process
