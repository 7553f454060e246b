// One stage's stepping loop (see detail/stage_run.hpp): the general step, its step control, the
// left-out modes' corrections after recent events and the end condition's root finding, plus
// the fused event-advance-sum pass that a 1 s log's steps take.
#include "conduction/detail/stage_run.hpp"

#include <algorithm>
#include <boost/math/tools/toms748_solve.hpp>
#include <cmath>
#include <cstdint>
#include <string>

#include "coldcore/error.hpp"
#include "conduction/detail/lanes.hpp"
#include "conduction/detail/medium_scan.hpp"

namespace coldcore::detail {

namespace {
// The hot loop of a 1 s log, built twice: for AVX2 (chosen at run time where the CPU has it; no
// FMA, so the arithmetic is the same) and for the baseline x86-64 the build targets.

COLDCORE_SIMD_CLONES void step_kernel_store(std::size_t K, double* __restrict a, double* __restrict wp,
                                            double* __restrict wc, const double* __restrict e,
                                            const double* __restrict bg, const double* __restrict bl,
                                            const double* __restrict vs, const double* __restrict vm, double ds,
                                            double slope, double* __restrict ck, double& s0, double& s1, double& s2) {
  step_kernel_body<true>(K, a, wp, wc, e, bg, bl, vs, vm, ds, slope, ck, s0, s1, s2);
}
COLDCORE_SIMD_CLONES void step_kernel_plain(std::size_t K, double* __restrict a, double* __restrict wp,
                                            double* __restrict wc, const double* __restrict e,
                                            const double* __restrict bg, const double* __restrict bl,
                                            const double* __restrict vs, const double* __restrict vm, double ds,
                                            double slope, double& s0, double& s1, double& s2) {
  step_kernel_body<false>(K, a, wp, wc, e, bg, bl, vs, vm, ds, slope, nullptr, s0, s1, s2);
}
}  // namespace

[[gnu::always_inline]] inline ModalSums Engine::event_advance_sum(const Basis& B, ModalState& st, double origin,
                                                                 double t_event, double ds, double jump, double dt, double slope, StepCache& c, FlatBuffer* checkpoint) const {
  const long ep = epoch_of(origin, t_event);
  if (ep != st.epoch) roll_epoch(st, ep);
  st.s_cur.ds += ds;
  st.s_cur.ds_t += ds * (t_event - origin);
  st.s_cur.jump += jump;
  const std::size_t K = B.lambda.size();
  if (c.dt != dt || c.basis != &B) fill_cache(B, dt, c);
  double* a = st.a.data();
  double* wc = st.w_cur.data();
  if (jump != 0.0) {
    const double* b = B.b.data();
    for (std::size_t k = 0; k < K; ++k) {
      a[k] += b[k] * jump;
      wc[k] += b[k] * jump;
    }
  }
  // the w sums are needed apart only when the end of the step lies in a later epoch (rare):
  // the caller then recomputes them with sums()
  ModalSums out;
  if (checkpoint) {
    double* ck = checkpoint->append(3 * K + 7);
    const double tail[7] = {st.s_prev.ds, st.s_prev.ds_t, st.s_prev.jump, st.s_cur.ds, st.s_cur.ds_t, st.s_cur.jump,
                            static_cast<double>(st.epoch)};
    std::copy(tail, tail + 7, ck + 3 * K);
    step_kernel_store(K, a, st.w_prev.data(), wc, c.e.data(), c.bg.data(), c.bl.data(), c.vs.data(), c.vm.data(), ds,
                      slope, ck, out.a, out.a_surface, out.a_mean);
  } else {
    step_kernel_plain(K, a, st.w_prev.data(), wc, c.e.data(), c.bg.data(), c.bl.data(), c.vs.data(), c.vm.data(), ds,
                      slope, out.a, out.a_surface, out.a_mean);
  }
  out.combined = true;  // out.a = Σ (a − w_prev − w_cur): only valid together with combined = true
  return out;
}
StageRun::StageRun(const Engine& eng, StageModel& model, const Stage& stage, const HistoryOptions& options,
                   ModalState& state, SampleVector& samples, double start_s, double start_slope,
                   bool force_general_steps)
    : eng_(eng),
      basis_(*model.basis),
      model_(model),
      stage_(stage),
      options_(options),
      st_(state),
      force_general_(force_general_steps) {
  const auto& pts = stage.medium.points;
  last_ = samples.back();  // the stage's start sample
  until_ = stage.end.kind != StageEndKind::duration;
  on_mean_ = stage.end.kind == StageEndKind::until_mean;
  const double limit = until_ ? stage.end.max_duration_s : stage.end.duration_s;
  const double tm0 = pts.front().temp_C;
  if (until_) {
    const double v0 = watched(last_);
    dir_ = tm0 > v0 ? 1.0 : tm0 < v0 ? -1.0 : (stage.end.target_C >= v0 ? 1.0 : -1.0);
    if ((stage.end.target_C - v0) * dir_ <= 0) ended_at_start_ = true;
  }

  // checkpoint stride: keep the stored amplitudes within 2^22 doubles (32 MB) per stage;
  // evaluate() re-advances at most `stride` exact steps from the nearest checkpoint, and the
  // lethality quadrature calls it very often, so memory is traded for speed here. With few
  // modes a checkpoint at every step is not worth its memory traffic (it cost simulate() more
  // than the stepping itself): re-advancing up to ~256 mode-steps is small beside the O(K)
  // exponentials and the recent-event corrections evaluate() needs anyway (a 1 s sphere log:
  // a checkpoint every 14 steps, 0.6 MB per 4 h).
  const std::size_t K = basis_.lambda.size();
  const double est_steps = static_cast<double>(pts.size()) + 64.0;
  const double budget = std::max(4194304.0, 48.0 * (3.0 * K + 7.0));  // and at least ~48 checkpoints
  const int min_stride = std::max(1, static_cast<int>(256 / std::max<std::size_t>(K, 1)));
  model.stride = std::max(min_stride, static_cast<int>(std::ceil(est_steps * (3.0 * K + 7.0) / budget)));
  model.step_t.reserve(static_cast<std::size_t>(est_steps));
  model.step_tm.reserve(static_cast<std::size_t>(est_steps));
  model.step_slope.reserve(static_cast<std::size_t>(est_steps));
  model.step_ds.reserve(static_cast<std::size_t>(est_steps));
  model.checkpoints.reserve((static_cast<std::size_t>(est_steps) / model.stride + 2) * (3 * K + 7));
  samples.reserve(samples.size() + static_cast<std::size_t>(est_steps));

  ended_by_ = until_ ? StageEndedBy::cap : StageEndedBy::duration;
  pos_.slope = start_slope;
  h_nocheck_ = eng.tau_insulated_s / 8.0;
  h_min_ = eng.tau_insulated_s * 1e-4;
  pos_.end_s = last_;
  pos_.finished = ended_at_start_ || limit == 0.0;
  if (ended_at_start_) ended_by_ = StageEndedBy::condition;

  // the medium's slope on each piece, computed once (written whole: no zero-fill first)
  detail::piece_slopes(pts.data(), pts.size(), piece_slope_.room(pts.size() - 1));
  piece_slope_.commit(pts.size() - 1);
  double max_ds = std::max(std::abs(model.start_ds), largest_slope_change(piece_slope_.data(), piece_slope_.size()));
  if (!piece_slope_.empty()) max_ds = std::max(max_ds, std::abs(piece_slope_.back()));
  slope_window_ = eng.expiry(basis_, 0.0, max_ds, 0.0);
  note_event(start_s, model.start_ds, model.start_jump);

  c_.eng = &eng;
  c_.basis = &basis_;
  c_.model = &model;
  c_.samples = &samples;
  c_.points = pts.data();
  c_.n_points = pts.size();
  c_.piece_slope = piece_slope_.data();
  c_.t_abs = start_s;
  c_.limit = limit;
  c_.index = model.index;
  c_.st = &st_;
  c_.cache = &cache_;
}

void StageRun::run() {
  while (!pos_.finished) step();
}

double StageRun::centre_at(const ModalState& q, double t, double tm, double slope) const {
  if (model_.projected && t - model_.start_s <= eng_.tau_insulated_s) return eng_.centre_continued(c_.index - 1, t);
  return eng_.centre(basis_, q, model_.origin_s, t, tm, slope);
}

void StageRun::fill(HistorySample& out, const ModalState& q, double t, double tm, double slope) {
  out.time_s = t;
  out.medium_C = tm;
  out.stage = c_.index;
  out.centre_C = centre_at(q, t, tm, slope);
  out.surface_C = eng_.surface(basis_, q, tm, slope);
  out.mean_C = eng_.mean(basis_, q, tm, slope);
  shadow(out);
}

void StageRun::lean_run() {
  if (lean_steps(c_, pos_, ring_) == 0) return;
  last_ = pos_.end_s;
}

void StageRun::note_step_event(double ta, double ds_here, bool fused, double remaining) {
  // a run of equal short steps (a regular log) keeps its events in a ring: the correction is
  // then a short fixed filter over the last slope changes
  const bool ring_ok = fused && slope_window_ < 60.0 * remaining;
  if (!(ring_ok && remaining == ring_.run_dt)) {
    flush_ring();
    if (ring_.run_dt != (ring_ok ? remaining : -1.0)) ring_.taps = 0;  // new step length: new filter
    ring_.run_dt = ring_ok ? remaining : -1.0;
    if (ring_ok && table_dt_ != ring_.run_dt) {
      table_dt_ = ring_.run_dt;
      table_.clear();
    }
  }
  if (ring_ok) {
    ring_.push(ta, ds_here);
    ++ring_.run;
    model_.recent_window_s = std::max(model_.recent_window_s, slope_window_);
  } else {
    note_event(ta, ds_here, 0.0);
  }
}

double StageRun::crossing(const ModalState& step_start, double ta, double tm_a, double lo, double hi) {
  const double slope = pos_.slope;
  ModalState q;
  auto f = [&](double tau) {
    q = step_start;
    eng_.advance(basis_, q, tau, slope);
    const double tt = ta + tau;
    const double tm = tm_a + slope * tau;
    double v;
    if (on_mean_) {
      HistorySample tmp;
      tmp.time_s = tt;
      tmp.mean_C = eng_.mean(basis_, q, tm, slope);
      shadow(tmp);
      v = tmp.mean_C;
    } else {
      v = centre_at(q, tt, tm, slope);
    }
    return (v - stage_.end.target_C) * dir_;
  };
  const double flo = f(lo), fhi = f(hi);
  if (fhi == 0) return hi;
  if (flo >= 0) return lo;
  std::uintmax_t it = 100;
  auto tolf = [&](double x, double y) { return std::abs(x - y) <= options_.crossing_tol_s; };
  auto r = boost::math::tools::toms748_solve(f, lo, hi, flo, fhi, tolf, it);
  if (it >= 100)
    throw NotConverged("simulate: stage[" + std::to_string(c_.index) + "]: crossing time root-finder did not converge");
  return 0.5 * (r.first + r.second);
}

void StageRun::step() {
  if (!until_ && !force_general_ && !first_step_ && ring_.run > 0 && ring_.run_dt > 0 && ring_.taps > 0 &&
      recent_.empty()) {
    lean_run();
    if (pos_.finished) return;
  }
  const auto& pts = stage_.medium.points;
  const double limit = c_.limit;
  // current medium piece
  while (pos_.piece + 1 < pts.size() && pts[pos_.piece + 1].time_s <= pos_.t_local) ++pos_.piece;
  const std::size_t piece = pos_.piece;
  const double piece_end = piece + 1 < pts.size() ? std::min(pts[piece + 1].time_s, limit) : limit;
  const double new_slope = piece + 1 < pts.size() ? piece_slope_[piece] : 0.0;
  if (!first_step_) pos_.pending_ds = new_slope - pos_.slope;
  pos_.slope = new_slope;
  const double slope = new_slope;
  const double tm_a = piece + 1 < pts.size() ? pts[piece].temp_C + slope * (pos_.t_local - pts[piece].time_s)
                                             : pts.back().temp_C;
  const double ta = c_.t_abs + pos_.t_local;
  const double remaining = piece_end - pos_.t_local;
  const bool checkpoint_here = --pos_.until_checkpoint == 0;
  if (checkpoint_here) pos_.until_checkpoint = model_.stride;
  const bool fused = remaining <= h_nocheck_ && !until_;
  // the step start: apply its event, then record it (checkpoint = state after the event)
  if (!fused) {
    if (!first_step_) eng_.add_event(basis_, st_, model_.origin_s, ta, pos_.pending_ds, 0.0);
    if (checkpoint_here) model_.store_checkpoint(st_);
  }
  model_.step_t.push_back(ta);
  model_.step_tm.push_back(tm_a);
  model_.step_slope.push_back(slope);
  model_.step_ds.push_back(first_step_ ? 0.0 : pos_.pending_ds);
  const double ds_here = first_step_ ? 0.0 : pos_.pending_ds;
  first_step_ = false;
  if (!recent_.empty())
    recent_.erase(std::remove_if(recent_.begin(), recent_.end(), [&](const RecentEvent& e) { return e.expires <= ta; }),
                  recent_.end());
  note_step_event(ta, ds_here, fused, remaining);

  HistorySample& end_s = pos_.end_s;
  double h = remaining;
  bool have_mid = false;
  const ModalState* step_start = &st_;
  if (h <= h_nocheck_) {
    // short step (e.g. a 1 s log): no midpoint check; advance in place
    if (until_) {
      start_st_ = st_;
      step_start = &start_st_;
    }
    const auto sm = fused ? eng_.event_advance_sum(basis_, st_, model_.origin_s, ta, ds_here, 0.0, h, slope, cache_,
                                                   checkpoint_here ? &model_.checkpoints : nullptr)
                          : eng_.advance_and_sum(basis_, st_, h, slope, cache_);
    const double tb = ta + h, tm_b = tm_a + slope * h;
    end_s.time_s = tb;
    end_s.medium_C = tm_b;
    end_s.stage = c_.index;
    end_s.centre_C = (model_.projected && tb - model_.start_s <= eng_.tau_insulated_s)
                         ? eng_.centre_continued(c_.index - 1, tb)
                         : eng_.centre_from(basis_, st_, sm, model_.origin_s, tb, tm_b, slope);
    end_s.surface_C = tm_b + sm.a_surface - slope * basis_.q_surface;
    end_s.mean_C = tm_b + sm.a_mean - slope * basis_.q_mean;
    if (!recent_.empty()) shadow(end_s);
    if (ring_.run > 0) ring_shadow(end_s);
  } else {
    // start from twice the last accepted step of this stage (not the whole piece each time)
    if (h_guess_ > 0) h = std::min(h, h_guess_);
    for (;;) {
      end_st_ = st_;  // reuses end_st_'s storage (no allocation)
      eng_.advance(basis_, end_st_, h, slope, cache_);
      fill(end_s, end_st_, ta + h, tm_a + slope * h, slope);
      mid_st_ = st_;
      eng_.advance(basis_, mid_st_, h / 2, slope);
      fill(mid_s_, mid_st_, ta + h / 2, tm_a + slope * h / 2, slope);
      have_mid = true;
      const double ec = std::abs(mid_s_.centre_C - 0.5 * (last_.centre_C + end_s.centre_C));
      const double em = std::abs(mid_s_.mean_C - 0.5 * (last_.mean_C + end_s.mean_C));
      const double es = stage_.h_infinite ? 0.0 : std::abs(mid_s_.surface_C - 0.5 * (last_.surface_C + end_s.surface_C));
      if (std::max({ec, em, es}) <= options_.sample_tol_K || h / 2 < h_min_) break;
      h /= 2;
    }
    h_guess_ = 2 * h;
  }

  // end condition: crossing within (last, mid] or (mid, end]
  bool crossed = false, mid_before = false;
  double t_cross = 0.0;
  if (until_) {
    const HistorySample* seg_a = &last_;
    const HistorySample* cands[2] = {have_mid ? &mid_s_ : nullptr, &end_s};
    for (const HistorySample* cand : cands) {
      if (!cand) continue;
      if (distance_to_end(*cand) >= 0 && distance_to_end(*seg_a) < 0) {
        t_cross = crossing(*step_start, ta, tm_a, seg_a->time_s - ta, cand->time_s - ta);
        crossed = true;
        mid_before = have_mid && cand != &mid_s_;
        break;
      }
      seg_a = cand;
    }
  }
  SampleVector& samples = *c_.samples;
  if (crossed) {
    if (mid_before) samples.push_back(mid_s_);
    ModalState q = *step_start;
    eng_.advance(basis_, q, t_cross, slope);
    st_ = std::move(q);
    pos_.t_local += t_cross;
    ended_by_ = StageEndedBy::condition;
    pos_.finished = true;
    HistorySample e;
    fill(e, st_, c_.t_abs + pos_.t_local, tm_a + slope * t_cross, slope);
    samples.push_back(e);
    last_ = e;
  } else {
    if (have_mid) samples.push_back(mid_s_);
    if (step_start == &st_ && (have_mid || h > h_nocheck_)) std::swap(st_, end_st_);
    pos_.t_local += h;
    if (h == remaining) pos_.t_local = piece_end;  // land exactly on breakpoints
    if (pos_.t_local >= limit) pos_.finished = true;
    samples.push_back(end_s);
    last_ = end_s;
  }
}

}  // namespace coldcore::detail
