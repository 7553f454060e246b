// The history engine's evaluation at any time: centre, surface, mean and profile values of a
// modal state, the left-out modes' transient after recent events, and a stored stage's state at
// any instant (from its nearest checkpoint). Used by History::evaluate and temperature_at.
#include <algorithm>
#include <cmath>
#include <cstddef>
#include <vector>

#include "conduction/detail/history_engine.hpp"

namespace coldcore::detail {

double Engine::centre(const Basis& B, const ModalState& st, double origin, double t, double tm, double slope) const {
  const long d = epoch_of(origin, t) - st.epoch;
  const bool use_prev = d <= 0, use_cur = d <= 1;
  const std::size_t K = B.lambda.size();
  double sum = 0.0;
  const double* a = st.a.data();
  const double* wp = st.w_prev.data();
  const double* wc = st.w_cur.data();
  const double cp = use_prev ? 1.0 : 0.0, cc = use_cur ? 1.0 : 0.0;
#pragma omp simd reduction(+ : sum)
  for (std::size_t k = 0; k < K; ++k) sum += a[k] - cp * wp[k] - cc * wc[k];
  double corr = 0.0;
  const double tau0 = t - origin;
  auto add = [&](const EpochSums& s) { corr += s.ds * B.full_centre - (s.ds * tau0 - s.ds_t) + s.jump; };
  if (use_prev) add(st.s_prev);
  if (use_cur) add(st.s_cur);
  return tm + sum - slope * B.q_centre + corr;
}

double Engine::surface(const Basis& B, const ModalState& st, double tm, double slope) const {
  double sum = 0.0;
  const std::size_t K = B.lambda.size();
  const double* a = st.a.data();
  const double* v = B.surface.data();
#pragma omp simd reduction(+ : sum)
  for (std::size_t k = 0; k < K; ++k) sum += a[k] * v[k];
  return tm + sum - slope * B.q_surface;
}

double Engine::mean(const Basis& B, const ModalState& st, double tm, double slope) const {
  double sum = 0.0;
  const std::size_t K = B.lambda.size();
  const double* a = st.a.data();
  const double* v = B.mean.data();
#pragma omp simd reduction(+ : sum)
  for (std::size_t k = 0; k < K; ++k) sum += a[k] * v[k];
  return tm + sum - slope * B.q_mean;
}

double Engine::at_point(const Basis& B, const ModalState& st, const Point& p, double tm, double slope) const {
  const auto v = B.values(p);
  double sum = 0.0, kept = 0.0;
  for (std::size_t k = 0; k < v.size(); ++k) {
    sum += st.a[k] * v[k];
    kept += B.b[k] * v[k] / B.lambda[k];
  }
  const double q = B.full_ramp_sum(p) - kept;
  return tm + sum - slope * q;
}

ShadowValues Engine::shadow_at(const Basis& B, double age) const {
  const auto& sh = B.shadow;
  ShadowValues v;
  v.age = age;
  double gs = 0, gm = 0, cs = 0, cm = 0;
  for (std::size_t k = 0; k < sh.lambda.size(); ++k) {
    const double e = std::exp(-sh.lambda[k] * age);
    cs += sh.bs[k] * e;
    cm += sh.bm[k] * e;
    gs += sh.bs[k] * e / sh.lambda[k];
    gm += sh.bm[k] * e / sh.lambda[k];
  }
  const double r = std::exp(-sh.lambda_end * age);
  v.gs = gs + sh.ramp_surface * r;
  v.gm = gm + sh.ramp_mean * r;
  v.cs = cs + sh.jump_surface * r;
  v.cm = cm + sh.jump_mean * r;
  return v;
}

double Engine::expiry(const Basis& B, double t, double ds, double jump) const {
  const auto& sh = B.shadow;
  double scale = std::abs(ds) * (std::abs(B.q_surface) + std::abs(B.q_mean));
  if (jump != 0.0) {
    double js = std::abs(sh.jump_surface) + std::abs(sh.jump_mean);
    for (std::size_t k = 0; k < sh.lambda.size(); ++k) js += std::abs(sh.bs[k]) + std::abs(sh.bm[k]);
    scale += std::abs(jump) * js;
  }
  const double ratio = 100.0 * scale / tol_K;
  if (ratio <= 1.0) return t;
  return t + std::log(ratio) / sh.lambda_first;
}

void Engine::shadow_correction(const Basis& B, const std::vector<RecentEvent>& ev, double t,
                               std::vector<ShadowValues>* cache, double& surface, double& mean) const {
  surface = 0;
  mean = 0;
  for (const auto& e : ev) {
    if (e.t > t || e.expires <= t) continue;
    const double age = t - e.t;
    ShadowValues v;
    bool found = false;
    if (cache) {
      for (const auto& c : *cache)
        if (c.age == age) {
          v = c;
          found = true;
          break;
        }
    }
    if (!found) {
      v = shadow_at(B, age);
      if (cache) {
        if (cache->size() >= 64) cache->clear();
        cache->push_back(v);
      }
    }
    surface += e.ds * v.gs + e.jump * v.cs;
    mean += e.ds * v.gm + e.jump * v.cm;
  }
}

void Engine::state_at(const StageModel& S, double t, ModalState& st, double& tm, double& slope) const {
  const auto& B = *S.basis;
  // a time on a step boundary belongs to the step that ends there (left limit): the left-out
  // modes are then quasi-steady, so surface and mean are exact there too
  std::size_t step = static_cast<std::size_t>(std::lower_bound(S.step_t.begin(), S.step_t.end(), t) - S.step_t.begin());
  step = step == 0 ? 0 : step - 1;
  const std::size_t ck = step / static_cast<std::size_t>(S.stride);
  S.load_checkpoint(ck, st);
  // Scratch reused across calls (evaluate() is called hundreds of thousands of times by the
  // lethality quadrature); invalidated here so it is refilled for this basis and step.
  thread_local StepCache cache;
  cache.basis = nullptr;
  cache.dt = -1;
  for (std::size_t k = ck * S.stride; k < step; ++k) {
    advance(B, st, S.step_t[k + 1] - S.step_t[k], S.step_slope[k], cache);
    add_event(B, st, S.origin_s, S.step_t[k + 1], S.step_ds[k + 1], 0.0);
  }
  const double tau = t - S.step_t[step];
  advance(B, st, tau, S.step_slope[step]);
  slope = S.step_slope[step];
  tm = S.step_tm[step] + slope * tau;
}

double Engine::centre_continued(int j, double t) const {
  const StageModel& S = stages[j];
  if (S.projected && t - S.start_s <= tau_insulated_s && j > 0) return centre_continued(j - 1, t);
  const auto& B = *S.basis;
  ModalState st = S.end_state;
  add_event(B, st, S.origin_s, S.end_s, -S.end_slope, 0.0);
  advance(B, st, t - S.end_s, 0.0);
  return centre(B, st, S.origin_s, t, S.end_tm, 0.0);
}

HistorySample Engine::sample(int i, double t) const {
  const StageModel& S = stages[i];
  if (t <= S.start_s || S.step_t.empty()) return S.start_sample;
  ModalState st;
  double tm = 0, slope = 0;
  state_at(S, t, st, tm, slope);
  const auto& B = *S.basis;
  HistorySample h;
  h.time_s = t;
  h.medium_C = tm;
  h.stage = i;
  if (S.projected && t - S.start_s <= tau_insulated_s && i > 0) h.centre_C = centre_continued(i - 1, t);
  else h.centre_C = centre(B, st, S.origin_s, t, tm, slope);
  h.surface_C = surface(B, st, tm, slope);
  h.mean_C = mean(B, st, tm, slope);
  // transient of the left-out modes after recent events of this stage
  std::vector<RecentEvent> ev;
  std::size_t k = static_cast<std::size_t>(std::lower_bound(S.step_t.begin(), S.step_t.end(), t) - S.step_t.begin());
  while (k > 0) {
    --k;
    if (S.step_t[k] < t - S.recent_window_s) break;
    const double ds = k == 0 ? S.start_ds : S.step_ds[k];
    const double jump = k == 0 ? S.start_jump : 0.0;
    if (ds != 0.0 || jump != 0.0) ev.push_back(RecentEvent{S.step_t[k], ds, jump, expiry(B, S.step_t[k], ds, jump)});
  }
  double cs = 0, cm = 0;
  shadow_correction(B, ev, t, nullptr, cs, cm);
  h.surface_C += cs;
  h.mean_C += cm;
  return h;
}

double Engine::profile(int i, double t, const Point& p) const {
  bool is_centre = true;
  for (const auto& q : p) is_centre = is_centre && !q.mean && q.x == 0.0;
  if (is_centre) return sample(i, t).centre_C;
  const StageModel& S = stages[i];
  if (t <= S.start_s || S.step_t.empty()) {
    if (i == 0) return S.start_sample.centre_C;  // uniform initial temperature
    // continuity: the profile at the end of the previous stage
    const StageModel& P = stages[i - 1];
    return at_point(*P.basis, P.end_state, p, P.end_tm, P.end_slope);
  }
  ModalState st;
  double tm = 0, slope = 0;
  state_at(S, t, st, tm, slope);
  return at_point(*S.basis, st, p, tm, slope);
}

}  // namespace coldcore::detail
