// Wording of the departures a deviation record names (process/deviation.hpp: DeviationEvent).
#include <string>

#include "coldcore/report/deviation_report.hpp"
#include "coldcore/report/run_report.hpp"

namespace coldcore {

namespace {

std::string temp(double c, TempUnit u) { return fixed(display_temp(c, u), 2) + " " + std::string(unit_symbol(u)); }

/// "40 min 00 s to 46 min 00 s into the stage (2400-2760 s)"
std::string span(const process::DeviationEvent& e) {
  return duration_text(e.start_s) + " to " + duration_text(e.end_s) + " into the stage (" + fixed(e.start_s, 0) +
         "-" + fixed(e.end_s, 0) + " s)";
}

}  // namespace

std::string_view to_string(process::DeviationKind k) {
  switch (k) {
    case process::DeviationKind::medium_colder: return "medium_colder";
    case process::DeviationKind::medium_warmer: return "medium_warmer";
    case process::DeviationKind::stage_shortened: return "stage_shortened";
    case process::DeviationKind::log_gap: return "log_gap";
  }
  return "unknown";
}

namespace {

// " (clock 2026-11-30 08:40:00 UTC to 08:46:00 UTC)": the span as the log's own clock reads it.
std::string clock_span(const process::DeviationEvent& e, std::optional<double> start_unix_s, bool to_end = true) {
  if (!start_unix_s) return "";
  const std::string a = utc_text(*start_unix_s + e.start_s);
  if (!to_end) return " (clock " + a + ")";
  std::string b = utc_text(*start_unix_s + e.end_s);
  if (b.compare(0, 11, a, 0, 11) == 0) b.erase(0, 11);  // same day: the time only
  return " (clock " + a + " to " + b + ")";
}

}  // namespace

std::string deviation_event_text(const process::DeviationEvent& e, TempUnit u, std::optional<double> clock_start_unix_s) {
  using process::DeviationKind;
  const std::string clock = clock_span(e, clock_start_unix_s);
  // a difference: kelvin, or Fahrenheit degrees
  const std::string diff = fixed(display_temp_difference(e.departure_K, u), 2) + (u == TempUnit::C ? " K" : " °F");
  switch (e.kind) {
    case DeviationKind::medium_colder:
      return "medium colder than scheduled in a stage that heats, " + span(e) + clock + "; lowest " + temp(e.extreme_C, u) +
             " at " + fixed(e.extreme_at_s, 0) + " s, scheduled " + temp(e.scheduled_at_extreme_C, u) + " (" + diff +
             " colder)";
    case DeviationKind::medium_warmer:
      return "medium warmer than scheduled in a stage that cools, " + span(e) + clock + "; highest " + temp(e.extreme_C, u) +
             " at " + fixed(e.extreme_at_s, 0) + " s, scheduled " + temp(e.scheduled_at_extreme_C, u) + " (" + diff +
             " warmer)";
    case DeviationKind::stage_shortened:
      return "stage shorter than scheduled by " + duration_text(e.end_s - e.start_s) + ": the log ends " +
             duration_text(e.start_s) + " into the stage (" + fixed(e.start_s, 0) + " s)" +
             clock_span(e, clock_start_unix_s, false) + ", the scheduled end is " +
             duration_text(e.end_s) + " (" + fixed(e.end_s, 0) + " s)";
    case DeviationKind::log_gap:
      return "gap in the log of " + duration_text(e.end_s - e.start_s) + ", " + span(e) + clock +
             ": the medium meanwhile is unknown, and no lethality accrued in it is credited";
  }
  return "";
}

std::string no_deviation_text(const process::DeviationResult& r) {
  return std::string("none: no logged reading ") + (r.stage_heats ? "colder" : "warmer") +
         " than the schedule by more than the tolerance, no gap in the log, and the stage not shortened";
}

}  // namespace coldcore
