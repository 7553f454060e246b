#pragma once
/// How values are shown: rounded to the safe side, one helper for every layer. Lethality and
/// margins are rounded down, requirements and times that must be held are rounded up.
#include <string>
#include <string_view>

namespace coldcore {

/// Log reductions above this are not shown as a count (process/target_verdict.cpp says why): the
/// text shows "more than N log10" with the credited F; the raw number stays in
/// TargetResult::achieved. N = max(kMeaningfulLogReduction, the target's own requirement rounded up).
inline constexpr double kMeaningfulLogReduction = 15;

/// `significant` figures, toward −∞ (down) or +∞ (up). A relative allowance of 1e-12 absorbs
/// binary representation error, so 0.3 is not shown as 0.299.
std::string shown_down(double value, int significant = 3);
std::string shown_up(double value, int significant = 3);

/// Seconds as minutes, "12.3 min", rounded down / up.
std::string minutes_down(double seconds);
std::string minutes_up(double seconds);

/// A log reduction as shown anywhere: "6.00 log10" rounded down, or "more than N log10" beyond
/// N = max(kMeaningfulLogReduction, ceil(required_logs)) (the count is then no result).
std::string shown_log_reduction(double logs, double required_logs = 0);

/// How a target's raw values are shown: scale to the shown unit and its suffix.
struct ShownUnit {
  double scale = 1;
  std::string suffix;
};
inline const ShownUnit kShownLog{1.0, " log10"};
inline const ShownUnit kShownMin{1.0 / 60.0, " min"};

/// The shown unit of a TargetResult::unit: "log10", "min", else the bare number (fractions).
ShownUnit shown_unit(std::string_view unit);

/// A small signed amount, "+0.012 min" (positive rounded down) or "-0.013 min" (negative: its
/// size rounded up), 2 significant figures.
std::string signed_small(double value, const ShownUnit& u);

}  // namespace coldcore
