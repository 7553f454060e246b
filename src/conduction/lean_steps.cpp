// The lean path of the stepping loop (see detail/lean_steps.hpp). Built with AVX2 clones: the
// modal kernel and the ring filter are inlined into one loop.
#include "conduction/detail/lean_steps.hpp"

#include <algorithm>

#include "conduction/detail/lanes.hpp"

namespace coldcore::detail {

COLDCORE_SIMD_CLONES std::size_t lean_steps(LeanRun& r) {
  const Engine& eng = *r.eng;
  const Basis& B = *r.basis;
  StageModel& S = *r.stage_model;
  ModalState& st = *r.st;
  StepCache& c = *r.cache;
  std::vector<HistorySample>& samples = *r.samples;
  const std::size_t K = B.lambda.size();
  const MediumPoint* P = r.points;
  const std::size_t n_points = r.n_points;
  const double* piece_slope = r.piece_slope;
  const double origin = S.origin_s, tau_ins = eng.tau_insulated_s, start_s = S.start_s;
  const bool projected = S.projected;
  const double t_abs = r.t_abs, limit = r.limit, run_dt = r.run_dt;
  const long taps = r.run_taps;
  const double* tab_gs = r.tab_gs;
  const double* tab_gm = r.tab_gm;
  double* ring_ds = r.ring_ds;
  double* ring2 = r.ring2;
  double* ring_t = r.ring_t;
  // the loop state in locals (stores through the pointers above cannot then alias it)
  std::size_t piece = r.piece;
  double t_local = r.t_local, slope = r.slope, pending_ds = r.pending_ds;
  int until_checkpoint = r.until_checkpoint;
  const int stride = S.stride;
  int ring_pos = r.ring_pos;
  long run = r.run;
  HistorySample e = r.end_s;
  bool finished = false;
  if (c.dt != run_dt || c.basis != &B) eng.fill_cache(B, run_dt, c);
  // at most one step per remaining medium piece: room for that many, committed at the end
  const std::size_t max_steps = n_points - 1 - std::min(piece, n_points - 1);
  double* out_t = S.step_t.room(max_steps);
  double* out_tm = S.step_tm.room(max_steps);
  double* out_slope = S.step_slope.room(max_steps);
  double* out_ds = S.step_ds.room(max_steps);
  const std::size_t samples0 = samples.size();
  samples.resize(samples0 + max_steps);  // cheaper than a push_back per step; cut back below
  HistorySample* out_samples = samples.data() + samples0;
  std::size_t steps = 0;
  double prev_tb = -1.0;  // (no step yet: ta >= origin >= 0 never equals it)
  long prev_ep_b = 0;
  while (piece + 1 < n_points && P[piece + 1].time_s <= t_local) ++piece;
  for (;;) {
    if (piece + 1 >= n_points) break;
    const double piece_end = std::min(P[piece + 1].time_s, limit);
    const double h = piece_end - t_local;
    const double ta = t_abs + t_local, tb = ta + h;
    if (h != run_dt || (projected && tb - start_s <= tau_ins)) break;
    const double ds = piece_slope[piece] - slope;
    pending_ds = ds;
    slope = piece_slope[piece];
    const double tm_a = P[piece].temp_C + slope * (t_local - P[piece].time_s);
    const bool checkpoint_here = --until_checkpoint == 0;
    if (checkpoint_here) until_checkpoint = stride;
    out_t[steps] = ta;
    out_tm[steps] = tm_a;
    out_slope[steps] = slope;
    out_ds[steps] = ds;
    ring_ds[ring_pos] = ds;
    ring2[ring_pos] = ring2[ring_pos + 64] = ds;
    ring_t[ring_pos] = ta;
    ring_pos = (ring_pos + 1) & 63;
    ++run;
    // Engine::event_advance_sum for a slope event (no jump), with the kernel inlined
    // the epoch of the step start is the last step end's when the times are the same number
    const long ep = ta == prev_tb ? prev_ep_b : eng.epoch_of(origin, ta);
    if (ep != st.epoch) roll_epoch(st, ep);
    st.s_cur.ds += ds;
    st.s_cur.ds_t += ds * (ta - origin);
    Lanes l0, l1, l2;
    if (checkpoint_here) {
      double* ck = S.checkpoints.append(3 * K + 7);
      const double tail[7] = {st.s_prev.ds, st.s_prev.ds_t, st.s_prev.jump, st.s_cur.ds, st.s_cur.ds_t, st.s_cur.jump,
                              static_cast<double>(st.epoch)};
      std::copy(tail, tail + 7, ck + 3 * K);
      step_kernel_lanes<true>(K, st.a.data(), st.w_prev.data(), st.w_cur.data(), c.e.data(), c.bg.data(), c.bl.data(),
                              c.vs.data(), c.vm.data(), ds, slope, ck, l0, l1, l2);
    } else {
      step_kernel_lanes<false>(K, st.a.data(), st.w_prev.data(), st.w_cur.data(), c.e.data(), c.bg.data(), c.bl.data(),
                               c.vs.data(), c.vm.data(), ds, slope, nullptr, l0, l1, l2);
    }
    // the ring's left-out-mode correction (the ring filter of simulate)
    const long jw = std::min(run, taps);
    Lanes la, lb;
    fir_pair_lanes(ring2 + ring_pos + 64 - taps, tab_gs, tab_gm, static_cast<std::size_t>(taps - jw),
                   static_cast<std::size_t>(taps), la, lb);
    const Lanes sums = lane_sums(l0, l1, l2, la);
    ModalSums sm;
    sm.a = sums[0];
    sm.a_surface = sums[1];
    sm.a_mean = sums[2];
    sm.combined = true;
    const double cs = sums[3], cm = lane_sum(lb);
    const double tm_b = tm_a + slope * h;
    e.time_s = tb;
    e.medium_C = tm_b;
    e.stage = r.stage;
    const long ep_b = eng.epoch_of(origin, tb);
    prev_tb = tb;
    prev_ep_b = ep_b;
    if (ep_b == st.epoch) {
      // Engine::centre_from for a step ending in the same epoch (the same arithmetic)
      const double tau0 = tb - origin;
      double corr = 0.0;
      corr += st.s_prev.ds * B.full_centre - (st.s_prev.ds * tau0 - st.s_prev.ds_t) + st.s_prev.jump;
      corr += st.s_cur.ds * B.full_centre - (st.s_cur.ds * tau0 - st.s_cur.ds_t) + st.s_cur.jump;
      e.centre_C = tm_b + sm.a - slope * B.q_centre + corr;
    } else {
      // the step ends in a later epoch (once per epoch): the memory sums are needed apart
      Lanes lp = {0, 0, 0, 0}, lc = lp;
      const double* wp = st.w_prev.data();
      const double* wc = st.w_cur.data();
      for (std::size_t k = 0; k < K; k += 4) {
        lp += load4(wp + k);
        lc += load4(wc + k);
      }
      ModalSums full;
      full.w_prev = lane_sum(lp);
      full.w_cur = lane_sum(lc);
      full.a = sm.a + full.w_prev + full.w_cur;
      full.a_surface = sm.a_surface;
      full.a_mean = sm.a_mean;
      e.centre_C = eng.centre_from(B, st, full, origin, tb, tm_b, slope);
    }
    e.surface_C = tm_b + sm.a_surface - slope * B.q_surface;
    e.mean_C = tm_b + sm.a_mean - slope * B.q_mean;
    e.surface_C += cs;
    e.mean_C += cm;
    t_local = piece_end;
    out_samples[steps] = e;
    ++steps;
    if (t_local >= limit) {
      finished = true;
      break;
    }
    ++piece;  // t_local is this piece's end, and times strictly increase (validated): the next starts here
  }
  samples.resize(samples0 + steps);
  S.step_t.commit(steps);
  S.step_tm.commit(steps);
  S.step_slope.commit(steps);
  S.step_ds.commit(steps);
  r.piece = piece;
  r.t_local = t_local;
  r.slope = slope;
  r.pending_ds = pending_ds;
  r.until_checkpoint = until_checkpoint;
  r.ring_pos = ring_pos;
  r.run = run;
  r.end_s = e;
  r.finished = finished;
  return steps;
}

}  // namespace coldcore::detail
