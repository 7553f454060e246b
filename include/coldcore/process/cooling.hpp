#pragma once
/// Cooling (stabilisation) rules as data (products/cooling-rules.toml) and a checker that reports,
/// for each step of a rule, the elapsed time, the limit and the margin.
///
/// Clock definition (exact). For a step "from_C -> to_C within limit":
///  - the step's clock starts at the first time t_start at which the temperature falls through
///    from_C: T(t) > from_C just before t_start and T(t_start) <= from_C (the crossing is located
///    by root finding on the curve; for a log, on its linear interpolation). Later re-heating above
///    from_C does not restart the clock (it is noted).
///  - if the record is never above from_C, the clock starts at the time of the record's highest
///    temperature (the last time it is reached on the scan grid; the first row for a log that only
///    cools) and a note says the time spent above from_C before the record, if any, is not counted.
///  - if the record ends still above from_C, the clock never starts: not demonstrated.
///  - the step ends at the first time t_end >= t_start with T(t_end) <= to_C.
///    elapsed = t_end − t_start; margin = limit − elapsed. If to_C is never reached, elapsed is the
///    lower bound (record end − t_start) and the step is not demonstrated.
///  - a step passes only when to_C was reached and margin > 0 (strictly; a tie is not shown as met).
///  - advisory steps (FSIS Appendix B option 2: 48.9 -> 26.7 °C in more than 1 h) never fail the
///    rule; exceeding them raises a flag in the notes.
/// Rule-level condition chill_start_within_s (option 2: chilling begun within 90 min after the
/// cook): needs CoolingContext::cook_end_s and chill_start_s; when either is missing the condition
/// — and so the rule — is not demonstrated.
#include <array>
#include <functional>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "coldcore/model/cooling_rules.hpp"

namespace coldcore {

/// Extra facts the temperature record cannot show.
struct CoolingContext {
  std::optional<double> cook_end_s;     ///< end of the cook cycle
  std::optional<double> chill_start_s;  ///< when chilling began
  std::string where = "cold spot";      ///< label of the temperature checked (notes only)
  /// Intervals in which nothing was recorded (gaps in a log). Counted against the rule: a step's
  /// clock that starts inside one starts at its start, a step that completes inside one
  /// completes at its end (the first reading after it).
  std::vector<std::array<double, 2>> unrecorded_s;
};

/// What a cooling check has to say beyond its numbers; report words it (report/cooling_notes.hpp).
enum class CoolingNoteKind {
  never_above_start,   ///< the record never exceeds from_C: clock from its peak (peak_C at at_s)
  above_start_at_end,  ///< still above from_C at the end: the clock never started
  start_in_gap,        ///< the clock would start in the gap [gap_from_s, gap_to_s]: taken at its start
  end_in_gap,          ///< to_C is reached in the gap [gap_from_s, gap_to_s]: taken at its end
  end_not_reached,     ///< to_C not reached in the record; at_s = elapsed since the clock start
  rose_again,          ///< rose above from_C again at at_s; the clock was not restarted
  advisory_exceeded,   ///< rule note: the advisory step `step` took longer than its limit
  chill_start_late,    ///< rule note: chilling began at_s after the cook; limit_s allowed
  chill_start_unknown, ///< rule note: cook end or chill start unknown; limit_s allowed
};

/// One note with its values: times in s from the record's start unless said otherwise,
/// temperatures in °C. The step's own temperatures are in CoolingStepResult::step.
struct CoolingNote {
  CoolingNoteKind kind = CoolingNoteKind::never_above_start;
  double at_s = 0;
  double peak_C = 0;
  double gap_from_s = 0, gap_to_s = 0;
  double limit_s = 0;
  std::size_t step = 0;  ///< the step (index into CoolingCheck::steps) the note concerns
};

struct CoolingStepResult {
  CoolingStep step;
  std::optional<double> start_s;   ///< clock start
  std::optional<double> end_s;     ///< reached to_C
  double elapsed_s = 0;            ///< end − start, or a lower bound when not reached
  double margin_s = 0;             ///< within − elapsed
  bool reached = false;
  bool passed = false;             ///< reached && margin > 0 (advisory steps: not exceeded)
  /// Temperature at the end of the record, when to_C was not reached (or the clock never started).
  std::optional<double> temp_at_record_end_C;
  std::vector<CoolingNote> notes;
};

struct CoolingCheck {
  std::string rule_key;
  std::vector<CoolingStepResult> steps;
  std::optional<double> chill_delay_s;   ///< chill_start − cook_end when both known
  std::optional<double> chill_delay_margin_s;
  bool passed = false;                   ///< every non-advisory step passed and the chill-start condition met
  std::vector<CoolingNote> notes;        ///< flags (advisory steps exceeded, missing context)
  std::string subject = "cold spot";     ///< CoolingContext::where: what the temperatures are of
};

/// Checks a measured log (linear between rows). REQUIRES: times strictly increasing (else InputError).
CoolingCheck check_cooling(std::span<const double> times_s, std::span<const double> temps_C,
                           const CoolingRule& rule, const CoolingContext& ctx = {},
                           std::string_view origin = "log");

/// Checks a temperature function known everywhere (the engine's History::evaluate), smooth between
/// the given breakpoints; each breakpoint interval is probed `probes` times for crossings.
CoolingCheck check_cooling(const std::function<double(double)>& temp_C_at,
                           std::span<const double> breakpoints_s, const CoolingRule& rule,
                           const CoolingContext& ctx = {}, int probes = 4);

}  // namespace coldcore
