#pragma once
/// Temperature history of a product through a staged process: the output of the conduction
/// engine and the input of lethality, cooling checks and reports.
#include <array>
#include <functional>
#include <string>
#include <vector>

#include "coldcore/process/schedule.hpp"

namespace coldcore {

/// Temperatures at one instant. time_s from the start of the first stage.
struct HistorySample {
  double time_s = 0;
  double medium_C = 0;
  double centre_C = 0;   ///< geometric centre: the cold spot of a symmetric conduction product
  double surface_C = 0;  ///< slowest surface point is not needed; this is the face/mid-face centre
  double mean_C = 0;     ///< mass-average temperature
  int stage = 0;         ///< index into History::stages
};

enum class StageEndedBy { duration, condition, cap };

struct StageRecord {
  std::string name;
  double start_s = 0;
  double end_s = 0;
  StageEndedBy ended_by = StageEndedBy::duration;
  double h_W_m2K = 0;
  double biot = 0;          ///< h·L/k with L the smallest half-dimension (radius, half-thickness)
  HistorySample at_end;
};

struct History {
  /// The engine's own sample points, increasing in time, with a sample at every stage boundary
  /// (both sides of a boundary share the boundary time; the later one belongs to the new stage).
  std::vector<HistorySample> samples;
  std::vector<StageRecord> stages;
  std::vector<std::string> warnings;
  /// Exact evaluation at any 0 <= t <= end; O(modes). Set by the engine.
  std::function<HistorySample(double time_s)> evaluate;
  /// Temperature (°C) at any 0 <= t <= end and any point, O(modes). Position is dimensionless per
  /// axis, 0 = centre, 1 = surface: sphere, cylinder [0] = r/R; slab [0] = x/(thickness/2);
  /// finite cylinder [0] = r/R, [1] = z/(length/2); brick [i] = x_i/(size_i/2). Unused entries 0.
  /// Set by the engine (added for profile outputs; not part of the original contract).
  std::function<double(double time_s, std::array<double, 3> position)> temperature_at;
  double end_s() const { return stages.empty() ? 0.0 : stages.back().end_s; }
};

/// Options of the history engine. Defaults are the documented accuracy contract.
struct HistoryOptions {
  /// Target accuracy (K) of every temperature the engine returns, at samples and through
  /// evaluate(): it sets the number of modes (through the decay of the left-out modes over the
  /// centre's insulation time 0.01·L²/α, see simulate()). Default 1e-4 K.
  double tol_K = 1e-4;
  /// Linear interpolation between consecutive samples stays within this (K) for centre, mean and
  /// surface, checked at each internal step's midpoint, for steps longer than 1/8 of the centre's
  /// insulation time (shorter steps, e.g. a 1 s log, are sampled at both ends). Default 0.01 K.
  double sample_tol_K = 0.01;
  /// The crossing time of an until_centre / until_mean end is found to this (s). Default 1e-6 s.
  double crossing_tol_s = 1e-6;
};

/// Temperature history of `product` through `stages`, by the exact eigenfunction series of each
/// stage's surface condition (products of 1D modes for finite cylinder and brick):
///  - within a stage the modal amplitudes are advanced exactly over each piecewise-linear piece of
///    the medium (recursive Duhamel), O(modes) per internal step;
///  - the modes the truncated sum leaves out are corrected in closed form: their quasi-steady ramp
///    part (quasi_steady.hpp), and at the centre also their transient after every change of the
///    medium's slope or level (exact while the centre is insulated from the surface, Fo <= 0.01;
///    after that the left-out modes have decayed below tol_K);
///  - between stages with a different h the profile is projected onto the new modes (closed-form
///    inner products); for Fo <= 0.01 after such a boundary the centre is, to 1e-10 of the jump,
///    still the continuation of the previous stage, and is evaluated that way.
/// Internal steps are the medium's breakpoints, stage ends, the crossing of an end condition, and
/// subdivisions for sample_tol_K; mode counts follow tol_K. Output sampling does not change
/// accuracy: evaluate() is exact at any time.
/// Stage ends: duration; until_centre / until_mean with direction from the medium (rising if the
/// medium is above the value at the stage start); the crossing is root-found (toms748) on the exact
/// evaluation; reaching max_duration_s ends the stage with StageEndedBy::cap and a warning; a
/// target already reached at the stage start ends it at once (condition) with a warning.
/// Limits (stated honestly): surface and mean within 0.01·L²/α after a jump of the medium carry the
/// truncation error of the series there (the centre does not); in products (finite cylinder,
/// brick) the left-out quasi-steady part is projected through 4× the kept modes per axis.
/// REQUIRES: product dimensions > 0 for its shape, properties > 0, every stage h_W_m2K > 0 or
/// h_infinite, medium points non-empty with increasing times from 0, duration >= 0 or a cap > 0.
/// Throws InputError naming `stage[i].<key>` otherwise.
History simulate(const Product& product, const std::vector<Stage>& stages, const HistoryOptions& options = {});

}  // namespace coldcore
