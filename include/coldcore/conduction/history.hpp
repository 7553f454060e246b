#pragma once
/// Temperature history of a product through a staged process: the output of the conduction
/// engine and the input of lethality, cooling checks and reports.
#include <array>
#include <functional>
#include <memory>
#include <new>
#include <string>
#include <utility>
#include <vector>

#include "coldcore/model/product.hpp"
#include "coldcore/model/stages.hpp"

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

/// The allocator of History::samples. Making room without a value (resize) leaves the new
/// samples unwritten: the engine writes every one right after making room, and zero-filling a
/// 4 h history at 1 s first (690 kB) took about a twentieth of simulate(). Every other
/// construction is as std::allocator's. HistorySample is an aggregate of numbers, so its storage
/// may be written without constructing it first.
template <class T>
struct SampleAllocator : std::allocator<T> {
  SampleAllocator() noexcept = default;
  template <class U>
  SampleAllocator(const SampleAllocator<U>&) noexcept {}
  template <class U>
  void construct(U*) noexcept {}  // value-less: left for the writer
  template <class U, class... Args>
  void construct(U* p, Args&&... args) {
    ::new (static_cast<void*>(p)) U(std::forward<Args>(args)...);
  }
  friend bool operator==(const SampleAllocator&, const SampleAllocator&) noexcept { return true; }
};
using SampleVector = std::vector<HistorySample, SampleAllocator<HistorySample>>;

/// How a stage with an end condition (centre or mean reaches a target) ran, when the report
/// should say so. Numbers only: the report writes the sentence in the chosen units.
enum class StageNoteKind {
  ended_at_start,  ///< the watched value was already at or past the target at the stage start
  cap_reached,     ///< the target was not reached within the stage's cap; the stage ended there
};
struct StageNote {
  StageNoteKind kind = StageNoteKind::cap_reached;
  int stage_number = 0;    ///< as the product file counts its stages: from 1
  std::string stage_name;
  bool on_mean = false;    ///< the condition watches the mean temperature (else the centre)
  double target_C = 0;
  double value_C = 0;      ///< the watched value at the stage start (ended_at_start) or at the cap
  double cap_s = 0;        ///< the cap (cap_reached)
};

struct History {
  /// The engine's own sample points, increasing in time, with a sample at every stage boundary
  /// (both sides of a boundary share the boundary time; the later one belongs to the new stage).
  SampleVector samples;
  std::vector<StageRecord> stages;
  std::vector<StageNote> notes;
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
  /// Target accuracy (K) of centre, mean and surface temperatures, at samples and through
  /// evaluate(). It sets the number of modes: every mode left out must decay by tol_K/(10·span)
  /// (span = range of initial and medium temperatures + 1 K) within half the centre's insulated
  /// time 0.005·L²/α (L = smallest half-dimension). Default 1e-4 K.
  double tol_K = 1e-4;
  /// Linear interpolation between consecutive samples stays within this (K) for centre, mean and
  /// surface, checked at each internal step's midpoint, for steps longer than 1/8 of the centre's
  /// insulated time (shorter steps, e.g. a 1 s log, are sampled at both ends). Default 0.01 K.
  double sample_tol_K = 0.01;
  /// The crossing time of an until_centre / until_mean end is found to this (s). Default 1e-6 s.
  double crossing_tol_s = 1e-6;
  /// For tests: every step takes the general path, none the lean path a regular log's run of
  /// equal short steps takes. The two do the same arithmetic, so the samples must be the same
  /// bits either way (tests/conduction/history_paths_test.cpp).
  bool force_general_steps = false;
};

/// Temperature history of `product` through `stages`, by the exact eigenfunction series of each
/// stage's surface condition (products of 1D modes for finite cylinder = cylinder × slab and
/// brick = slab³, modes with λ_i + λ_j (+ λ_k) below the cut):
///  - within a stage the modal amplitudes are advanced exactly over each piecewise-linear piece of
///    the medium (recursive Duhamel), O(modes) per internal step, no re-summation of the past;
///  - the modes the truncated sum leaves out are corrected in closed form: their quasi-steady ramp
///    part Σ b Φ/λ = (L²/α)·P(x) − kept terms (quasi_steady.hpp; products through the shifted slab
///    profile); at the centre also their exact transient after every change of the medium's slope
///    or level, Δs·[Q − τ − Σ_kept b e^{−λτ}/λ] + J·[1 − Σ_kept b e^{−λτ}], valid while the centre
///    is insulated (Fo <= 0.01, error < 2e-10 relative); for the surface and the mean through the
///    next left-out modes (up to 4× the kept ζ in 1D, 2× per axis in products) plus a remainder;
///  - between stages with a different h the profile is projected onto the new modes (closed-form
///    inner products per axis, ∫x^m X_i X'_j = [X'_j'(1)X_i(1) − X_i'(1)X'_j(1)]/(ζ_i² − ζ'_j²),
///    and of the ramp profile); for Fo <= 0.01 after such a boundary the centre is still the
///    continuation of the previous stage (to 2e-10 of the jump) and is evaluated that way;
///  - same h in consecutive stages: the amplitudes simply continue (a jump of the medium is an
///    event like any other).
/// Internal steps are the medium's breakpoints, stage ends, an end condition's crossing, and
/// subdivisions for sample_tol_K; mode counts follow tol_K. Output sampling does not change
/// accuracy: evaluate() is exact at any time (it re-advances at most a few dozen exact steps from
/// the nearest stored checkpoint).
/// Stage ends: duration; until_centre / until_mean with direction from the medium (rising if the
/// medium starts above the value); the crossing is root-found (toms748, crossing_tol_s) on the
/// exact evaluation within the step; reaching max_duration_s ends the stage with
/// StageEndedBy::cap and a warning naming the stage; a target already reached at the stage start
/// ends it at once (condition) with a warning.
/// Reported surface: centre of the face across the smallest half-dimension (sphere/cylinder:
/// r = R; finite cylinder: the side if R <= length/2, else the end face; brick: the face across its
/// thinnest side). StageRecord::biot = h·L_min/k (kInfiniteBiot for h_infinite).
/// Measured (tests/conduction/history_fd_test.cpp, a noisy 1 s log): centre 2e-8 K vs a
/// converged finite-volume reference, 4e-10 K vs tol 1e-12; surface <= 7e-5 K, mean <= 1e-8 K.
/// Known limits: right after a jump of the medium (Fo < 0.01) the surface and mean of products and
/// of projected stages carry the truncation error of the series there (the centre does not); the
/// transient of the last slope changes before a change of h is not projected; profile values at
/// interior points (History::temperature_at) get the quasi-steady but not the transient
/// correction.
/// REQUIRES: product dimensions > 0 for its shape, properties > 0, every stage h_W_m2K > 0 or
/// h_infinite, medium points non-empty with increasing times from 0, duration >= 0 or a cap > 0.
/// Throws InputError "simulate: <key> = <value>: <requirement>" otherwise; NotConverged if a
/// crossing cannot be located, or if a product body would need more than 200000 product modes
/// (e.g. a 10 × 100 × 100 mm brick at tol 1e-4 K: very elongated bodies are refused, not
/// approximated).
/// Cost: O(K) per internal step and per evaluate(); K ≈ 18 modes for a 40 mm sphere,
/// ≈ 400 for a 40 × 60 mm finite cylinder at the default tolerance.
History simulate(const Product& product, const std::vector<Stage>& stages, const HistoryOptions& options = {});

}  // namespace coldcore
