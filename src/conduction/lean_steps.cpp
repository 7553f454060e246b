// The lean path of the stepping loop (see detail/stage_run.hpp). Built with AVX2 clones.
//
// The run is taken in three passes: a scan that finds how many steps it holds and their start
// times, a pass that fills their medium, slope and slope change (no dependence between steps, so
// it vectorises), and the recurrence over the modes. The recurrence is instantiated for each
// small count of mode groups, so the modal kernel is fully unrolled. The ring filter, which does
// not depend on the modal state, then corrects the run's samples four at a time. Each value is
// the same expression, in the same order, as in the general step.
#include "conduction/detail/stage_run.hpp"

#include <algorithm>

#include "conduction/detail/lanes.hpp"

namespace coldcore::detail {

namespace {

/// What the recurrence reads and writes besides the stage (one run of n steps, inputs filled).
struct LeanPass {
  std::size_t n = 0;
  const double* step_t = nullptr;   // n step starts
  const double* step_tm = nullptr;  // medium at each step start
  const double* step_slope = nullptr;
  const double* step_ds = nullptr;  // the slope change at each step start; the run's earlier
                                    // changes lie just before it (step_ds[-1], ...)
  HistorySample* out = nullptr;     // n samples
};

template <std::size_t Groups>
[[gnu::always_inline]] inline void recurrence(const StageContext& r, StepPosition& pos, SlopeRing& ring,
                                              const LeanPass& p) {
  const Engine& eng = *r.eng;
  const Basis& B = *r.basis;
  StageModel& S = *r.model;
  ModalState& st = *r.st;
  const StepCache& c = *r.cache;
  const std::size_t K = B.lambda.size();
  // a fixed group count unrolls the kernel; 0: as many groups as the padded modes need
  const std::size_t KL = Groups > 0 ? 4 * Groups : K;
  const std::size_t Kp = padded_modes(K);
  const double origin = S.origin_s, run_dt = ring.run_dt;
  const double full_centre = B.full_centre, q_centre = B.q_centre, q_surface = B.q_surface, q_mean = B.q_mean;
  const double *e_ = c.e.data(), *bg = c.bg.data(), *bl = c.bl.data(), *vs = c.vs.data(), *vm = c.vm.data();
  double* a = st.a.data();
  // the centre's transient memory in locals (stores into the mode arrays cannot alias them)
  double* wp = st.w_prev.data();
  double* wc = st.w_cur.data();
  bool swapped = false;
  EpochSums sp = st.s_prev, sc = st.s_cur;
  long epoch = st.epoch;
  int until_checkpoint = pos.until_checkpoint;
  const int stride = S.stride;
  long run = ring.run;
  HistorySample e{};
  e.stage = r.index;
  double prev_tb = -1.0;  // (no step yet: ta >= origin >= 0 never equals it)
  long prev_ep_b = 0;
  for (std::size_t i = 0; i < p.n; ++i) {
    const double ta = p.step_t[i], ds = p.step_ds[i], slope = p.step_slope[i], tm_a = p.step_tm[i];
    const double tb = ta + run_dt;
    const bool checkpoint_here = --until_checkpoint == 0;
    if (checkpoint_here) until_checkpoint = stride;
    ++run;
    // Engine::event_advance_sum for a slope event (no jump), with the kernel inlined; the epoch
    // of the step start is the last step end's when the times are the same number
    const long ep = ta == prev_tb ? prev_ep_b : eng.epoch_of(origin, ta);
    if (ep != epoch) {  // roll_epoch
      if (ep == epoch + 1) {
        std::swap(wp, wc);
        swapped = !swapped;
        std::fill(wc, wc + Kp, 0.0);
        sp = sc;
        sc = EpochSums{};
      } else if (ep > epoch + 1) {
        std::fill(wp, wp + Kp, 0.0);
        std::fill(wc, wc + Kp, 0.0);
        sp = sc = EpochSums{};
      }
      epoch = std::max(epoch, ep);
    }
    sc.ds += ds;
    sc.ds_t += ds * (ta - origin);
    Lanes l0, l1, l2;
    if (checkpoint_here) {
      double* ck = S.checkpoints.append(3 * K + 7);
      const double tail[7] = {sp.ds, sp.ds_t, sp.jump, sc.ds, sc.ds_t, sc.jump, static_cast<double>(epoch)};
      std::copy(tail, tail + 7, ck + 3 * K);
      step_kernel_lanes<true>(K, a, wp, wc, e_, bg, bl, vs, vm, ds, slope, ck, l0, l1, l2, Groups);
    } else {
      step_kernel_lanes<false>(K, a, wp, wc, e_, bg, bl, vs, vm, ds, slope, nullptr, l0, l1, l2, Groups);
    }
    const Lanes sums = lane_sums(l0, l1, l2, Lanes{0, 0, 0, 0});
    const double tm_b = tm_a + slope * run_dt;
    e.time_s = tb;
    e.medium_C = tm_b;
    const long ep_b = eng.epoch_of(origin, tb);
    prev_tb = tb;
    prev_ep_b = ep_b;
    const double tau0 = tb - origin;
    if (ep_b == epoch) {
      // Engine::centre_from for a step ending in the same epoch (the same arithmetic)
      double corr = 0.0;
      corr += sp.ds * full_centre - (sp.ds * tau0 - sp.ds_t) + sp.jump;
      corr += sc.ds * full_centre - (sc.ds * tau0 - sc.ds_t) + sc.jump;
      e.centre_C = tm_b + sums[0] - slope * q_centre + corr;
    } else {
      // the step ends in a later epoch (once per epoch): Engine::centre_from with the memory sums
      Lanes lp = {0, 0, 0, 0}, lc = lp;
      for (std::size_t k = 0; k < KL; k += 4) {
        lp += load4(wp + k);
        lc += load4(wc + k);
      }
      const double w_prev = lane_sum(lp), w_cur = lane_sum(lc);
      const double full_a = sums[0] + w_prev + w_cur;
      const long d = ep_b - epoch;
      double corr = 0.0;
      if (d <= 0) {
        corr += sp.ds * full_centre - (sp.ds * tau0 - sp.ds_t) + sp.jump;
        corr -= w_prev;
      }
      if (d <= 1) {
        corr += sc.ds * full_centre - (sc.ds * tau0 - sc.ds_t) + sc.jump;
        corr -= w_cur;
      }
      e.centre_C = tm_b + full_a - slope * q_centre + corr;
    }
    e.surface_C = tm_b + sums[1] - slope * q_surface;
    e.mean_C = tm_b + sums[2] - slope * q_mean;
    p.out[i] = e;  // surface and mean without the ring's correction yet (ring_correction)
  }
  if (swapped) st.w_prev.swap(st.w_cur);
  st.s_prev = sp;
  st.s_cur = sc;
  st.epoch = epoch;
  pos.until_checkpoint = until_checkpoint;
  ring.run = run;
}

/// Adds the ring filter's left-out-mode correction (the ring filter of simulate) to the surface
/// and mean of the run's samples: over the last min(run, taps) slope changes at each step,
/// oldest first, step_ds[i − taps + 1 + from ...]. run0 is the run's length before these steps.
/// Four outputs at a time once the run is longer than the filter (the same sums as one by one).
[[gnu::always_inline]] inline void ring_correction(const SlopeRing& ring, const LeanPass& p, long run0) {
  const long taps = ring.taps;
  const double* gs = ring.gs.data();
  const double* gm = ring.gm.data();
  const std::size_t ut = static_cast<std::size_t>(taps);
  std::size_t i = 0;
  while (i < p.n) {
    const long run = run0 + static_cast<long>(i) + 1;
    const std::ptrdiff_t first = static_cast<std::ptrdiff_t>(i) + 1 - taps;
    if (run >= taps && i + 4 <= p.n) {
      Lanes cs, cm;
      fir_pair_four(p.step_ds + first, gs, gm, ut, cs, cm);
      for (int l = 0; l < 4; ++l) {
        p.out[i + static_cast<std::size_t>(l)].surface_C += cs[l];
        p.out[i + static_cast<std::size_t>(l)].mean_C += cm[l];
      }
      i += 4;
      continue;
    }
    const std::size_t from = static_cast<std::size_t>(taps - std::min(run, taps));
    Lanes la, lb;
    fir_pair_lanes(p.step_ds + first + static_cast<std::ptrdiff_t>(from), gs + from, gm + from, 0, ut - from, la, lb);
    p.out[i].surface_C += lane_sum(la);
    p.out[i].mean_C += lane_sum(lb);
    ++i;
  }
}

}  // namespace

COLDCORE_SIMD_CLONES std::size_t lean_steps(const StageContext& r, StepPosition& pos, SlopeRing& ring) {
  const Engine& eng = *r.eng;
  StageModel& S = *r.model;
  const MediumPoint* P = r.points;
  const std::size_t n_points = r.n_points;
  const double t_abs = r.t_abs, limit = r.limit, run_dt = ring.run_dt;
  const double tau_ins = eng.tau_insulated_s, start_s = S.start_s;
  const bool projected = S.projected;
  if (r.cache->dt != run_dt || r.cache->basis != r.basis) eng.fill_cache(*r.basis, run_dt, *r.cache);
  std::size_t piece = pos.piece;
  while (piece + 1 < n_points && P[piece + 1].time_s <= pos.t_local) ++piece;
  // at most one step per remaining medium piece: room for that many, committed at the end
  const std::size_t max_steps = n_points - 1 - std::min(piece, n_points - 1);
  double* out_t = S.step_t.room(max_steps);
  double* out_tm = S.step_tm.room(max_steps);
  double* out_slope = S.step_slope.room(max_steps);
  double* out_ds = S.step_ds.room(max_steps);

  // 1. the steps of the run: each a whole medium piece of length run_dt
  const std::size_t piece0 = piece;
  const double t_local0 = pos.t_local;
  double t_local = t_local0;
  std::size_t n = 0;
  bool finished = false;
  for (;;) {
    if (piece + 1 >= n_points) break;
    const double piece_end = std::min(P[piece + 1].time_s, limit);
    const double h = piece_end - t_local;
    const double ta = t_abs + t_local, tb = ta + h;
    if (h != run_dt || (projected && tb - start_s <= tau_ins)) break;
    out_t[n++] = ta;
    t_local = piece_end;
    if (t_local >= limit) {
      finished = true;
      break;
    }
    ++piece;  // t_local is this piece's end, and times strictly increase (validated): the next starts here
  }
  if (n == 0) return 0;

  // 2. medium, slope and slope change at each step start (a step after the first starts at its
  // piece's first point)
  const double* piece_slope = r.piece_slope;
  out_slope[0] = piece_slope[piece0];
  out_ds[0] = out_slope[0] - pos.slope;
  out_tm[0] = P[piece0].temp_C + out_slope[0] * (t_local0 - P[piece0].time_s);
  for (std::size_t i = 1; i < n; ++i) {
    const MediumPoint& q = P[piece0 + i];
    const double s = piece_slope[piece0 + i];
    out_slope[i] = s;
    out_ds[i] = s - piece_slope[piece0 + i - 1];
    out_tm[i] = q.temp_C + s * (q.time_s - q.time_s);
  }

  // 3. the recurrence
  SampleVector& samples = *r.samples;
  const std::size_t samples0 = samples.size();
  samples.resize(samples0 + n);
  LeanPass pass;
  pass.n = n;
  pass.step_t = out_t;
  pass.step_tm = out_tm;
  pass.step_slope = out_slope;
  pass.step_ds = out_ds;
  pass.out = samples.data() + samples0;
  const long run0 = ring.run;
  switch (padded_modes(r.basis->lambda.size()) / 4) {
    case 1: recurrence<1>(r, pos, ring, pass); break;
    case 2: recurrence<2>(r, pos, ring, pass); break;
    case 3: recurrence<3>(r, pos, ring, pass); break;
    case 4: recurrence<4>(r, pos, ring, pass); break;
    case 5: recurrence<5>(r, pos, ring, pass); break;
    case 6: recurrence<6>(r, pos, ring, pass); break;
    case 7: recurrence<7>(r, pos, ring, pass); break;
    case 8: recurrence<8>(r, pos, ring, pass); break;
    default: recurrence<0>(r, pos, ring, pass); break;
  }
  ring_correction(ring, pass, run0);
  pos.end_s = pass.out[n - 1];
  S.step_t.commit(n);
  S.step_tm.commit(n);
  S.step_slope.commit(n);
  S.step_ds.commit(n);

  // the ring holds the run's last 64 slope changes (at the positions it would have had, had each
  // step been pushed)
  const std::size_t ring_from = n > 64 ? n - 64 : 0;
  ring.pos = static_cast<int>((static_cast<std::size_t>(ring.pos) + ring_from) & 63);
  for (std::size_t i = ring_from; i < n; ++i) ring.push(out_t[i], out_ds[i]);
  pos.piece = piece;
  pos.t_local = t_local;
  pos.slope = out_slope[n - 1];
  pos.pending_ds = out_ds[n - 1];
  pos.finished = finished;
  return n;
}

}  // namespace coldcore::detail
