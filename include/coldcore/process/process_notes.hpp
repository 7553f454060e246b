#pragma once
/// What an inverse question or a deviation has to say beyond its numbers; report words it
/// (report/process_notes.hpp). Values are in the answer's SI unit (s, m or °C) unless said.
#include <cstddef>
#include <string>

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
  h_per_target,           ///< `subject` describes the h a stage took and for which targets
  medium_log_short,       ///< the medium log covers `value` s of the stage's `other` s
  log_gaps_not_credited,  ///< `count` gaps of the medium log, `value` s in all, are not credited
  model_probe_disagree,   ///< the model and the probe log disagree on whether every target is met
};

struct ProcessNote {
  ProcessNoteKind kind = ProcessNoteKind::h_scenarios;
  double value = 0, other = 0;
  double temp_C = 0, other_C = 0, tol_K = 0;
  bool reached = false;
  std::size_t count = 0;
  std::string subject = {};
  bool operator==(const ProcessNote&) const = default;
};

}  // namespace coldcore::process
