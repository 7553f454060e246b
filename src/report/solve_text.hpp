#pragma once
// How solve answers are shown, shared by the text and the rich writers of `coldcore solve`.
#include <string>

#include "coldcore/process/inverse.hpp"
#include "coldcore/report/format.hpp"

namespace coldcore::detail {

/// The answer in display form: durations as h/min/s, sizes in mm, temperatures in --units.
inline std::string solve_shown(const process::SolveResult& r, double v, TempUnit u) {
  if (r.unit == "s") return duration_text(v) + " (" + fixed(v, 0) + " s)";
  if (r.unit == "m") return fixed(v * 1000.0, 3) + " mm";
  return fixed(display_temp(v, u), 2) + " " + std::string(unit_symbol(u));
}

/// Unrounded values are shown with enough digits to see the rounding went the safe way.
inline std::string solve_shown_raw(const process::SolveResult& r, double v, TempUnit u) {
  if (r.unit == "s") return fixed(v, 2) + " s";
  if (r.unit == "m") return fixed(v * 1000.0, 4) + " mm";
  return fixed(display_temp(v, u), 4) + " " + std::string(unit_symbol(u));
}

/// "rounded up to 1 min 00 s (60 s)" / "rounded down to 1.000 mm" / "rounded up to 0.90 °F".
inline std::string solve_rounding_text(const process::SolveResult& r, TempUnit u) {
  return std::string("rounded ") + (r.question == process::Question::max_size ? "down" : "up") + " to " +
         (r.unit == "C" ? fixed(display_temp_difference(r.unit_step, u), 2) + " " + std::string(unit_symbol(u))
                        : solve_shown(r, r.unit_step, u));
}

}  // namespace coldcore::detail
