#pragma once
// The lean path of the stepping loop: a run of equal short steps in a duration stage (a regular
// 1 s log). Private; see simulate() in history.cpp, whose general step does the same arithmetic
// for this case with more branches.
#include <cstddef>
#include <vector>

#include "coldcore/conduction/history.hpp"
#include "conduction/detail/history_engine.hpp"

namespace coldcore::detail {

/// What a run of equal short steps reads and updates. The caller copies its loop state in and
/// back out.
struct LeanRun {
  // the stage (read)
  const Engine* eng = nullptr;
  const Basis* basis = nullptr;
  StageModel* stage_model = nullptr;
  SampleVector* samples = nullptr;
  const MediumPoint* points = nullptr;
  std::size_t n_points = 0;
  const double* piece_slope = nullptr;
  double t_abs = 0, limit = 0, run_dt = 0;
  int stage = 0;
  const double* tab_gs = nullptr;  // ring filter taps, oldest first (run_taps of them)
  const double* tab_gm = nullptr;
  long run_taps = 0;
  // the loop state (read and written)
  ModalState* st = nullptr;
  StepCache* cache = nullptr;
  std::size_t piece = 0;
  double t_local = 0, slope = 0, pending_ds = 0;
  int until_checkpoint = 1;
  double* ring_ds = nullptr;  // 64 entries
  double* ring2 = nullptr;    // 128: ring_ds mirrored twice
  double* ring_t = nullptr;   // 64
  int ring_pos = 0;
  long run = 0;
  HistorySample end_s{};
  bool finished = false;
};

/// Takes steps while the next one is a step of length run_dt that ends inside the limit and,
/// for a projected stage, after the insulated time. Returns the number of steps taken.
/// REQUIRES: a duration stage, no pending recent events (their corrections are the general
/// step's), run > 0 (the ring holds this run's events), the stage's step_ds ending with the
/// run's slope changes so far (simulate records each ring event there too; the filter reads
/// them from it) and the filter taps built for run_dt.
std::size_t lean_steps(LeanRun& r);

}  // namespace coldcore::detail
