#pragma once
// One stage of simulate(): the stepping loop from the stage's start sample to its end (its
// duration, a centre or mean condition, or its cap). Private; see history.cpp for the
// representation and the engine's state.
//
// A step is one of two kinds. The general step (stage_run.cpp) handles every case: a checked
// step with a midpoint test, a short step sampled at both ends, the left-out modes' correction
// after recent events and the root finding of an end condition. A run of equal short steps in a
// duration stage (a regular 1 s log) takes the lean path (lean_steps.cpp), the same arithmetic
// for that case without the branches. Both read and write the loop's position (StepPosition) and
// the ring of recent slope changes (SlopeRing) in place.
#include <array>
#include <cstddef>
#include <vector>

#include "coldcore/conduction/history.hpp"
#include "conduction/detail/history_engine.hpp"

namespace coldcore::detail {

/// The slope changes of a run of equal short steps (a regular log), and the taps of the short
/// filter that gives their left-out-mode correction at the surface and in the mean.
struct SlopeRing {
  std::array<double, 64> ds{}, t{};
  std::array<double, 128> mirror{};  // ds mirrored twice: the last 64 events contiguous
  int pos = 0;                       // the next slot
  long run = 0;                      // steps in the current run
  double run_dt = -1.0;              // their length (−1: no run)
  long taps = 0;                     // filter length; 0: to be built for run_dt
  std::vector<double> gs, gm;        // tap i: the factor at age (taps − i)·run_dt, oldest first

  void push(double time_s, double slope_change) {
    ds[static_cast<std::size_t>(pos)] = slope_change;
    mirror[static_cast<std::size_t>(pos)] = mirror[static_cast<std::size_t>(pos) + 64] = slope_change;
    t[static_cast<std::size_t>(pos)] = time_s;
    pos = (pos + 1) & 63;
  }
};

/// Where the stepping loop stands in its stage: what the general step and the lean path share.
struct StepPosition {
  std::size_t piece = 0;     // the medium piece of the next step
  double t_local = 0.0;      // time since the stage start
  double slope = 0.0;        // the medium's slope on the current step
  double pending_ds = 0.0;   // the slope change recorded at the next step start
  int until_checkpoint = 1;  // steps to the next checkpoint (the first step has one)
  HistorySample end_s{};     // the sample at the end of the last step
  bool finished = false;
};

/// What a stage's steps read (fixed while it runs) and the state they advance.
struct StageContext {
  const Engine* eng = nullptr;
  const Basis* basis = nullptr;
  StageModel* model = nullptr;
  SampleVector* samples = nullptr;
  const MediumPoint* points = nullptr;
  std::size_t n_points = 0;
  const double* piece_slope = nullptr;  // the medium's slope on each piece
  double t_abs = 0.0;                   // the stage start
  double limit = 0.0;                   // duration, or the cap of an end condition
  int index = 0;                        // as in History::stages
  ModalState* st = nullptr;
  StepCache* cache = nullptr;
};

/// The lean path: takes steps while the next one is a step of length ring.run_dt that ends inside
/// the limit and, for a projected stage, after the insulated time. Returns the number taken
/// (0: nothing changed).
/// REQUIRES: a duration stage, no pending recent events (their corrections are the general
/// step's), ring.run > 0 (the ring holds this run's events), the stage's step_ds ending with the
/// run's slope changes so far (the filter reads them from it) and the taps built for run_dt.
std::size_t lean_steps(const StageContext& c, StepPosition& p, SlopeRing& ring);

/// One stage's stepping loop. simulate() has already pushed the stage's start sample and applied
/// its start event to the state; run() appends the stage's samples and steps to the model.
class StageRun {
 public:
  StageRun(const Engine& eng, StageModel& model, const Stage& stage, const HistoryOptions& options, ModalState& state,
           SampleVector& samples, double start_s, double start_slope, bool force_general_steps);
  // c_ points into this object (cache_, piece_slope_): a copy or a move would leave it pointing
  // into the original.
  StageRun(const StageRun&) = delete;
  StageRun& operator=(const StageRun&) = delete;

  /// True when an end condition already holds at the stage start (the stage then ends at once).
  bool ended_at_start() const { return ended_at_start_; }
  void run();

  StageEndedBy ended_by() const { return ended_by_; }
  const HistorySample& last() const { return last_; }
  double end_s() const { return c_.t_abs + pos_.t_local; }
  double end_slope() const { return pos_.slope; }
  /// The value the end condition watches (centre or mean) in a sample.
  double watched(const HistorySample& h) const { return on_mean_ ? h.mean_C : h.centre_C; }

 private:
  void step();
  void lean_run();
  /// Starts a run of the ring (or ends one) for a step of length `remaining`, and records the
  /// step start's slope change in the ring or among the recent events.
  void note_step_event(double ta, double ds_here, bool fused, double remaining);
  void note_event(double t, double ds, double jump);
  void flush_ring();
  void ring_shadow(HistorySample& out);
  void shadow(HistorySample& out);
  double centre_at(const ModalState& q, double t, double tm, double slope) const;
  void fill(HistorySample& out, const ModalState& q, double t, double tm, double slope);
  double distance_to_end(const HistorySample& h) const { return (watched(h) - stage_.end.target_C) * dir_; }
  /// Time within the step [ta, ...) at which the watched value reaches the target, between lo and
  /// hi (offsets from ta), by root finding on the exact evaluation from the step start.
  double crossing(const ModalState& step_start, double ta, double tm_a, double lo, double hi);

  StageContext c_;
  const Engine& eng_;
  const Basis& basis_;
  StageModel& model_;
  const Stage& stage_;
  const HistoryOptions& options_;
  ModalState& st_;
  bool force_general_;

  bool until_ = false, on_mean_ = false, ended_at_start_ = false;
  double dir_ = 0.0;  // +1: the watched value rises to the target, −1: falls
  StageEndedBy ended_by_ = StageEndedBy::duration;
  double h_guess_ = -1.0;  // next trial length of a checked step
  double h_nocheck_ = 0.0, h_min_ = 0.0;
  bool first_step_ = true;
  HistorySample last_{};

  StepPosition pos_;
  SlopeRing ring_;
  StepCache cache_;
  FlatBuffer piece_slope_;
  ModalState end_st_, mid_st_, start_st_;
  HistorySample mid_s_{};
  // events of this stage whose surface/mean transient still counts; slope events share one
  // window from the stage's largest slope change (no logarithm per step)
  std::vector<RecentEvent> recent_;
  double slope_window_ = 0.0;
  std::vector<ShadowValues> scache_;
  // factors at ages that are whole multiples of the last step length (a regular log) come from
  // a table; others from a small cache
  double table_dt_ = -1.0;
  std::vector<ShadowValues> table_;
};

}  // namespace coldcore::detail
