#pragma once
/// The process a product goes through: stages, each with a medium temperature profile, a surface
/// heat-transfer coefficient and an end condition. All values SI (s, °C, W/m²K); unit conversion
/// happens once, in io/.
#include <array>
#include <string>
#include <vector>

namespace coldcore {

/// One point of a medium schedule; time from the stage's start.
struct MediumPoint {
  double time_s = 0;
  double temp_C = 0;
};

/// Medium temperature of a stage: piecewise-linear through points (strictly increasing times,
/// first at t = 0), held constant after the last point. A constant medium is one point.
struct MediumProfile {
  std::vector<MediumPoint> points;
  std::string description;       ///< "constant", "points", or "log <file> (sha256 ...)"
  double at(double time_s) const;  ///< REQUIRES: !points.empty()
  double lowest_C() const;         ///< lowest point; REQUIRES: !points.empty()
  double highest_C() const;        ///< highest point; REQUIRES: !points.empty()
};

enum class StageEndKind {
  duration,        ///< runs for duration_s
  until_centre,    ///< until the centre reaches target_C (rising or falling), capped at max_duration_s
  until_mean,      ///< until the mass-average reaches target_C, capped at max_duration_s
};

struct StageEnd {
  StageEndKind kind = StageEndKind::duration;
  double duration_s = 0;      ///< kind == duration
  double target_C = 0;        ///< until_*: the temperature to reach
  double max_duration_s = 0;  ///< until_*: the cap; reaching it is reported, never silently accepted
};

struct Stage {
  std::string name;
  MediumProfile medium;
  /// A logged medium (medium_log): the intervals, from the stage start, between readings further
  /// apart than the log's allowed gap. Nothing was recorded there: no lethality is credited in
  /// them and a cooling-rule step that completes in one counts only from its end (issue 11).
  std::vector<std::array<double, 2>> medium_gaps_s;
  double h_W_m2K = 0;          ///< > 0; surface heat-transfer coefficient
  bool h_infinite = false;     ///< true: surface held at the medium temperature (Bi = ∞)
  StageEnd end;
};

/// Stage direction, the one rule every verb uses: a stage HEATS when its highest medium point is
/// not below the lowest medium point of the stage before it (the first stage: not below the
/// product's initial temperature); otherwise it COOLS. A rule on the schedule alone, so it needs
/// no simulation. `before_C`: that lowest point, or the initial temperature.
bool stage_heats(const Stage& stage, double before_C);
/// stage_heats of every stage in turn, the first against `initial_C`.
std::vector<bool> heating_stages(const std::vector<Stage>& stages, double initial_C);

}  // namespace coldcore
