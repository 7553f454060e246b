// History engine: staged medium schedules through the exact modal series.
//
// Representation within a stage (one basis = one set of Biot numbers):
//   T(x,t) = T∞(t) + Σ_K a_k Φ_k(x) − s(t)·Q(x) + (centre only) transient of the left-out modes.
// a_k' = −λ_k a_k − b_k s: exact over each linear piece of the medium (recursive Duhamel).
// Q(x) = Σ_{k∉K} b_k Φ_k(x)/λ_k is the quasi-steady ramp part of the left-out modes (closed form).
// After a slope change Δs or a level jump J at t_j, the left-out modes are not yet quasi-steady;
// at the centre their sum is, exactly while Θ(τ) = ∫0^τ θ_step(centre) dt = τ (Fo <= 0.01):
//   Δs·[Q_full − τ − Σ_K b e^{−λτ}/λ] + J·[1 − Σ_K b e^{−λτ}]
// The Σ_K parts are carried recursively in w (they decay with the modes); events older than
// τ_ins/2 are dropped a whole epoch at a time, by which time their left-out part has decayed
// below tol (the mode cut is chosen for that), so only two epochs are ever held.
#include "coldcore/conduction/history.hpp"
#include "coldcore/model/temperature_token.hpp"

#include <algorithm>
#include <boost/math/tools/toms748_solve.hpp>
#include <cmath>
#include <cstring>
#include <cstdint>
#include <sstream>

#include "coldcore/conduction/modes.hpp"
#include "coldcore/error.hpp"
#include "conduction/detail/history_engine.hpp"
#include "conduction/detail/lanes.hpp"
#include "conduction/detail/lean_steps.hpp"
#include "conduction/detail/medium_scan.hpp"

namespace coldcore {
namespace detail {

// The centre cannot feel a change at the surface before Fo = 0.01 on the smallest half-dimension:
// 1 − θ_step(centre) < 2e-10 there (sphere, Bi = ∞, the worst case: ≈ 2·e^{−1/(4Fo)}/√(πFo)), so
// Θ(τ) = ∫0^τ θ_step(centre) = τ holds to that inside the window.
constexpr double kInsulatedFourier = 0.01;

std::size_t StageModel::checkpoint_count() const { return checkpoints.size() / (3 * basis->lambda.size() + 7); }

void StageModel::store_checkpoint(const ModalState& st) {
  const std::size_t K = basis->lambda.size();  // the state may carry padding beyond K
  double* p = checkpoints.append(3 * K + 7);
  std::copy(st.a.begin(), st.a.begin() + static_cast<std::ptrdiff_t>(K), p);
  std::copy(st.w_prev.begin(), st.w_prev.begin() + static_cast<std::ptrdiff_t>(K), p + K);
  std::copy(st.w_cur.begin(), st.w_cur.begin() + static_cast<std::ptrdiff_t>(K), p + 2 * K);
  const double tail[7] = {st.s_prev.ds, st.s_prev.ds_t, st.s_prev.jump, st.s_cur.ds, st.s_cur.ds_t, st.s_cur.jump,
                          static_cast<double>(st.epoch)};
  std::copy(tail, tail + 7, p + 3 * K);
}

void StageModel::load_checkpoint(std::size_t i, ModalState& st) const {
  const std::size_t K = basis->lambda.size();
  const double* p = checkpoints.data() + i * (3 * K + 7);
  st.a.assign(p, p + K);
  st.w_prev.assign(p + K, p + 2 * K);
  st.w_cur.assign(p + 2 * K, p + 3 * K);
  p += 3 * K;
  st.s_prev = EpochSums{p[0], p[1], p[2]};
  st.s_cur = EpochSums{p[3], p[4], p[5]};
  st.epoch = static_cast<long>(p[6]);
}


void Engine::advance(const Basis& B, ModalState& st, double dt, double slope) const {
  if (B.axes.size() > 1) {
    // products: the factorised exponentials of the cached form are far cheaper than K exp calls
    StepCache c;
    advance(B, st, dt, slope, c);
    return;
  }
  const std::size_t K = B.lambda.size();
  double* a = st.a.data();
  double* wp = st.w_prev.data();
  double* wc = st.w_cur.data();
  const double* lam = B.lambda.data();
  const double* b = B.b.data();
  for (std::size_t k = 0; k < K; ++k) {
    const double x = -lam[k] * dt;
    const double e = std::exp(x);
    const double g = -std::expm1(x) / lam[k];
    a[k] = a[k] * e - b[k] * slope * g;
    wp[k] *= e;
    wc[k] *= e;
  }
}

void Engine::fill_cache(const Basis& B, double dt, StepCache& c) const {
  if (c.dt == dt && c.basis == &B) return;  // a regular log: every step after the first hits
  const std::size_t K = B.lambda.size();
  c.e.resize(K);  // (truncates old padding; it is restored below)
  c.g.resize(K);
  c.bg.resize(K);
  if (B.axes.size() > 1) {
    // A product mode decays as the product of its axis modes, e^{−(λi+λj+λk)dt}, so K
    // exponentials reduce to one per axis mode and K products. Where λ·dt is small, 1 − e
    // would cancel: those few modes keep expm1.
    const std::size_t A = B.axes.size();
    for (std::size_t ax = 0; ax < A; ++ax) {
      const AxisModes& am = B.axes[ax];
      c.axis_e[ax].resize(am.zeta.size());
      for (std::size_t n = 0; n < am.zeta.size(); ++n)
        c.axis_e[ax][n] = std::exp(-am.lambda(static_cast<int>(n), B.alpha) * dt);
    }
    for (std::size_t k = 0; k < K; ++k) {
      const auto& ix = B.index[k];
      double e = c.axis_e[0][static_cast<std::size_t>(ix[0])] * c.axis_e[1][static_cast<std::size_t>(ix[1])];
      if (A > 2) e *= c.axis_e[2][static_cast<std::size_t>(ix[2])];
      const double x = B.lambda[k] * dt;
      const double one_minus_e = x > 0.5 ? 1.0 - e : -std::expm1(-x);
      c.e[k] = e;
      c.g[k] = one_minus_e / B.lambda[k];
      c.bg[k] = one_minus_e * B.b_over_lambda[k];
    }
  } else {
    for (std::size_t k = 0; k < K; ++k) {
      const double x = -B.lambda[k] * dt;
      c.e[k] = std::exp(x);
      c.g[k] = -std::expm1(x) / B.lambda[k];
      c.bg[k] = B.b[k] * c.g[k];
    }
  }
  const std::size_t Kp = padded_modes(K);
  c.e.resize(Kp, 0.0);
  c.bg.resize(Kp, 0.0);
  if (c.basis != &B) {
    c.bl.assign(B.b_over_lambda.begin(), B.b_over_lambda.end());
    c.vs.assign(B.surface.begin(), B.surface.end());
    c.vm.assign(B.mean.begin(), B.mean.end());
    c.bl.resize(Kp, 0.0);
    c.vs.resize(Kp, 0.0);
    c.vm.resize(Kp, 0.0);
  }
  c.dt = dt;
  c.basis = &B;
}

void Engine::advance(const Basis& B, ModalState& st, double dt, double slope, StepCache& c) const {
  const std::size_t K = B.lambda.size();
  fill_cache(B, dt, c);
  double* a = st.a.data();
  double* wp = st.w_prev.data();
  double* wc = st.w_cur.data();
  const double* e = c.e.data();
  const double* g = c.g.data();
  const double* b = B.b.data();
#pragma omp simd
  for (std::size_t k = 0; k < K; ++k) {
    a[k] = a[k] * e[k] - b[k] * slope * g[k];
    wp[k] *= e[k];
    wc[k] *= e[k];
  }
}

ModalSums Engine::advance_and_sum(const Basis& B, ModalState& st, double dt, double slope, StepCache& c) const {
  advance(B, st, dt, slope, c);  // fills the cache when dt changes
  const std::size_t K = B.lambda.size();
  double* a = st.a.data();
  const double* vs = B.surface.data();
  const double* vm = B.mean.data();
  const double* wp = st.w_prev.data();
  const double* wc = st.w_cur.data();
  double s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0;
#pragma omp simd reduction(+ : s0, s1, s2, s3, s4)
  for (std::size_t k = 0; k < K; ++k) {
    s0 += a[k];
    s1 += a[k] * vs[k];
    s2 += a[k] * vm[k];
    s3 += wp[k];
    s4 += wc[k];
  }
  return ModalSums{s0, s1, s2, s3, s4};
}

void roll_epoch(ModalState& st, long e) {
  if (e == st.epoch + 1) {
    st.w_prev.swap(st.w_cur);
    std::fill(st.w_cur.begin(), st.w_cur.end(), 0.0);
    st.s_prev = st.s_cur;
    st.s_cur = EpochSums{};
  } else if (e > st.epoch + 1) {
    std::fill(st.w_prev.begin(), st.w_prev.end(), 0.0);
    std::fill(st.w_cur.begin(), st.w_cur.end(), 0.0);
    st.s_prev = st.s_cur = EpochSums{};
  }
  st.epoch = std::max(st.epoch, e);
}

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

COLDCORE_SIMD_CLONES void fir_pair(const double* __restrict d, const double* __restrict ga, const double* __restrict gb,
                                   std::size_t from, std::size_t n, double& sa, double& sb) {
  fir_pair_body(d, ga, gb, from, n, sa, sb);
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

ModalSums Engine::sums(const Basis& B, const ModalState& st) const {
  const std::size_t K = B.lambda.size();
  const double* a = st.a.data();
  const double* vs = B.surface.data();
  const double* vm = B.mean.data();
  const double* wp = st.w_prev.data();
  const double* wc = st.w_cur.data();
  double s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0;
#pragma omp simd reduction(+ : s0, s1, s2, s3, s4)
  for (std::size_t k = 0; k < K; ++k) {
    s0 += a[k];
    s1 += a[k] * vs[k];
    s2 += a[k] * vm[k];
    s3 += wp[k];
    s4 += wc[k];
  }
  return ModalSums{s0, s1, s2, s3, s4};
}


void Engine::add_event(const Basis& B, ModalState& st, double origin, double t, double ds, double jump) const {
  const long e = epoch_of(origin, t);
  if (e == st.epoch + 1) {
    st.w_prev.swap(st.w_cur);
    std::fill(st.w_cur.begin(), st.w_cur.end(), 0.0);
    st.s_prev = st.s_cur;
    st.s_cur = EpochSums{};
  } else if (e > st.epoch + 1) {
    std::fill(st.w_prev.begin(), st.w_prev.end(), 0.0);
    std::fill(st.w_cur.begin(), st.w_cur.end(), 0.0);
    st.s_prev = st.s_cur = EpochSums{};
  }
  st.epoch = std::max(st.epoch, e);
  if (ds == 0.0 && jump == 0.0) return;
  const std::size_t K = B.lambda.size();
  const double* b = B.b.data();
  const double* bl = B.b_over_lambda.data();
  double* a = st.a.data();
  double* wc = st.w_cur.data();
  if (jump != 0.0) {
#pragma omp simd
    for (std::size_t k = 0; k < K; ++k) a[k] += b[k] * jump;
  }
#pragma omp simd
  for (std::size_t k = 0; k < K; ++k) wc[k] += bl[k] * ds + b[k] * jump;
  st.s_cur.ds += ds;
  st.s_cur.ds_t += ds * (t - origin);
  st.s_cur.jump += jump;
}

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

}  // namespace detail

namespace {

using detail::AxisModes;
using detail::Basis;
using detail::Engine;
using detail::ModalState;
using detail::StageModel;

std::string fmt(double v) {
  std::ostringstream s;
  s.precision(10);
  s << v;
  return s.str();
}

[[noreturn]] void bad(const std::string& key, double v, const std::string& req) {
  throw InputError("simulate: " + key + " = " + fmt(v) + ": " + req);
}

struct AxisSpec {
  Geometry g;
  double half_m;
};

std::vector<AxisSpec> product_axes(const Product& p) {
  const auto& d = p.dims;
  auto need = [](const char* key, double v) {
    if (!(v > 0) || !std::isfinite(v)) bad(std::string("product.") + key, v, "must be > 0");
  };
  switch (p.shape) {
    case Shape::sphere: need("diameter_m", d.diameter_m); return {{Geometry::sphere, d.diameter_m / 2}};
    case Shape::cylinder: need("diameter_m", d.diameter_m); return {{Geometry::cylinder, d.diameter_m / 2}};
    case Shape::slab: need("thickness_m", d.thickness_m); return {{Geometry::slab, d.thickness_m / 2}};
    case Shape::finite_cylinder:
      need("diameter_m", d.diameter_m);
      need("length_m", d.length_m);
      return {{Geometry::cylinder, d.diameter_m / 2}, {Geometry::slab, d.length_m / 2}};
    case Shape::brick:
      need("size_m[0]", d.size_m[0]);
      need("size_m[1]", d.size_m[1]);
      need("size_m[2]", d.size_m[2]);
      return {{Geometry::slab, d.size_m[0] / 2}, {Geometry::slab, d.size_m[1] / 2}, {Geometry::slab, d.size_m[2] / 2}};
  }
  return {};
}

void validate(const Product& p, const std::vector<Stage>& stages, const HistoryOptions& o) {
  const auto& pr = p.properties;
  if (!(pr.conductivity_W_mK > 0)) bad("product.properties.conductivity_W_mK", pr.conductivity_W_mK, "must be > 0");
  if (!(pr.density_kg_m3 > 0)) bad("product.properties.density_kg_m3", pr.density_kg_m3, "must be > 0");
  if (!(pr.specific_heat_J_kgK > 0)) bad("product.properties.specific_heat_J_kgK", pr.specific_heat_J_kgK, "must be > 0");
  if (!std::isfinite(p.initial_C)) bad("product.initial_C", p.initial_C, "must be finite");
  if (!(o.tol_K > 0)) bad("options.tol_K", o.tol_K, "must be > 0");
  if (!(o.sample_tol_K > 0)) bad("options.sample_tol_K", o.sample_tol_K, "must be > 0");
  if (stages.empty()) throw InputError("simulate: stages: must have at least one stage");
  for (std::size_t i = 0; i < stages.size(); ++i) {
    const auto& s = stages[i];
    const std::string at = "stage[" + std::to_string(i) + "]";
    if (!s.h_infinite && !(s.h_W_m2K > 0 && std::isfinite(s.h_W_m2K))) bad(at + ".h_W_m2K", s.h_W_m2K, "must be > 0");
    if (s.medium.points.empty()) throw InputError("simulate: " + at + ".medium: must have at least one point");
    if (s.medium.points.front().time_s != 0) bad(at + ".medium.points[0].time_s", s.medium.points.front().time_s, "must be 0");
    // a plain scan first (a 4 h log at 1 s has 14,401 points); the message only for a bad one
    const MediumPoint* pts = s.medium.points.data();
    const std::size_t n = s.medium.points.size();
    const std::size_t k = detail::first_bad_point(pts, n);
    if (k < n) {
      const std::string key = at + ".medium.points[" + std::to_string(k) + "]";
      if (!std::isfinite(pts[k].temp_C)) bad(key + ".temp_C", pts[k].temp_C, "must be finite");
      bad(key + ".time_s", pts[k].time_s, "must increase");
    }
    if (s.end.kind == StageEndKind::duration) {
      if (!(s.end.duration_s >= 0) || !std::isfinite(s.end.duration_s)) bad(at + ".duration_s", s.end.duration_s, "must be >= 0");
    } else {
      if (!(s.end.max_duration_s > 0) || !std::isfinite(s.end.max_duration_s))
        bad(at + ".max_duration_s", s.end.max_duration_s, "must be > 0 (a cap is mandatory)");
      if (!std::isfinite(s.end.target_C)) bad(at + ".target_C", s.end.target_C, "must be finite");
    }
  }
}

double pick_lambda_cut(const Product& p, const std::vector<Stage>& stages, double tau_ins, double tol) {
  double lo = p.initial_C, hi = p.initial_C;
  for (const auto& s : stages) detail::widen_temperature_range(s.medium.points.data(), s.medium.points.size(), lo, hi);
  const double span = hi - lo + 1.0;
  // Left-out modes must decay below tol over half the insulated time (epoch length):
  // e^{−λ_cut·τ/2}·(10·span) <= tol.
  return 2.0 / tau_ins * std::log(std::max(10.0, 10.0 * span / tol));
}

}  // namespace

History simulate(const Product& product, const std::vector<Stage>& stages, const HistoryOptions& opt) {
  validate(product, stages, opt);
  const auto axes = product_axes(product);
  const double k_W = product.properties.conductivity_W_mK;
  const double alpha = product.properties.diffusivity_m2_s();
  int surface_axis = 0;
  for (std::size_t a = 1; a < axes.size(); ++a)
    if (axes[a].half_m < axes[surface_axis].half_m) surface_axis = static_cast<int>(a);
  const double l_min = axes[surface_axis].half_m;

  auto eng = std::make_shared<Engine>();
  eng->alpha = alpha;
  eng->tau_insulated_s = detail::kInsulatedFourier * l_min * l_min / alpha;
  eng->epoch_s = eng->tau_insulated_s / 2.0;
  eng->inv_epoch_s = 1.0 / eng->epoch_s;
  eng->tol_K = opt.tol_K;
  const double lambda_cut = pick_lambda_cut(product, stages, eng->tau_insulated_s, opt.tol_K);

  History H;
  std::shared_ptr<const Basis> basis;
  std::vector<double> basis_biots;
  ModalState st;
  double t_abs = 0.0;
  double prev_tm = 0.0, prev_slope = 0.0;

  for (std::size_t i = 0; i < stages.size(); ++i) {
    const Stage& stg = stages[i];
    const auto& pts = stg.medium.points;
    std::vector<double> biots;
    for (const auto& ax : axes) biots.push_back(stg.h_infinite ? kInfiniteBiot : stg.h_W_m2K * ax.half_m / k_W);
    StageModel S;
    S.index = static_cast<int>(i);
    S.start_s = t_abs;
    const double tm0 = pts.front().temp_C;
    const double s0 = pts.size() > 1 ? (pts[1].temp_C - pts[0].temp_C) / (pts[1].time_s - pts[0].time_s) : 0.0;
    const bool same = basis && biots == basis_biots;
    if (!same) {
      std::vector<AxisModes> am;
      for (std::size_t a = 0; a < axes.size(); ++a) {
        const int n = detail::modes_needed(axes[a].g, biots[a], axes[a].half_m, alpha, lambda_cut);
        am.push_back(detail::axis_modes(axes[a].g, biots[a], axes[a].half_m, std::max(n, 3)));
      }
      auto nb = std::make_shared<const Basis>(detail::make_basis(std::move(am), alpha, surface_axis, lambda_cut));
      const std::size_t K = nb->lambda.size();
      ModalState ns;
      const std::size_t Kp = detail::padded_modes(K);
      ns.w_prev.assign(Kp, 0.0);
      ns.w_cur.assign(Kp, 0.0);
      ns.epoch = 0;
      if (i == 0) {
        ns.a.assign(Kp, 0.0);
      } else {
        ns.a = detail::project_state(*basis, st, prev_tm, prev_slope, *nb, tm0);
        ns.a.resize(Kp, 0.0);
        S.projected = true;
      }
      S.origin_s = t_abs;
      basis = nb;
      basis_biots = biots;
      st = std::move(ns);
      const double jump = i == 0 ? product.initial_C - tm0 : 0.0;
      eng->add_event(*basis, st, S.origin_s, t_abs, s0, jump);
      S.start_ds = s0;
      S.start_jump = jump;
    } else {
      S.origin_s = eng->stages.back().origin_s;
      eng->add_event(*basis, st, S.origin_s, t_abs, s0 - prev_slope, prev_tm - tm0);
      S.start_ds = s0 - prev_slope;
      S.start_jump = prev_tm - tm0;
    }
    S.basis = basis;
    const Basis& B = *basis;

    // the sample at the stage start: continuity of the solid's temperatures
    HistorySample start;
    start.time_s = t_abs;
    start.medium_C = tm0;
    start.stage = static_cast<int>(i);
    if (i == 0) {
      start.centre_C = start.mean_C = start.surface_C = product.initial_C;
    } else {
      const auto& prev = H.samples.back();
      start.centre_C = prev.centre_C;
      start.mean_C = prev.mean_C;
      start.surface_C = prev.surface_C;
    }
    if (stg.h_infinite) start.surface_C = tm0;
    S.start_sample = start;
    H.samples.push_back(start);

    // end condition
    const bool until = stg.end.kind != StageEndKind::duration;
    const double limit = until ? stg.end.max_duration_s : stg.end.duration_s;
    const bool on_mean = stg.end.kind == StageEndKind::until_mean;
    double dir = 0.0;
    bool ended_at_start = false;
    if (until) {
      const double v0 = on_mean ? start.mean_C : start.centre_C;
      dir = tm0 > v0 ? 1.0 : tm0 < v0 ? -1.0 : (stg.end.target_C >= v0 ? 1.0 : -1.0);
      if ((stg.end.target_C - v0) * dir <= 0) ended_at_start = true;
    }

    // checkpoint stride: keep the stored amplitudes within 2^22 doubles (32 MB) per stage;
    // evaluate() re-advances at most `stride` exact steps from the nearest checkpoint, and the
    // lethality quadrature calls it very often, so memory is traded for speed here. With few
    // modes a checkpoint at every step is not worth its memory traffic (it cost simulate() more
    // than the stepping itself): re-advancing up to ~256 mode-steps is small beside the O(K)
    // exponentials and the recent-event corrections evaluate() needs anyway (a 1 s sphere log:
    // a checkpoint every 14 steps, 0.6 MB per 4 h).
    const std::size_t K = B.lambda.size();
    const double est_steps = static_cast<double>(pts.size()) + 64.0;
    const double budget = std::max(4194304.0, 48.0 * (3.0 * K + 7.0));  // and at least ~48 checkpoints
    const int min_stride = std::max(1, static_cast<int>(256 / std::max<std::size_t>(K, 1)));
    S.stride = std::max(min_stride, static_cast<int>(std::ceil(est_steps * (3.0 * K + 7.0) / budget)));
    S.step_t.reserve(static_cast<std::size_t>(est_steps));
    S.step_tm.reserve(static_cast<std::size_t>(est_steps));
    S.step_slope.reserve(static_cast<std::size_t>(est_steps));
    S.step_ds.reserve(static_cast<std::size_t>(est_steps));
    S.checkpoints.reserve((static_cast<std::size_t>(est_steps) / S.stride + 2) * (3 * K + 7));
    H.samples.reserve(H.samples.size() + static_cast<std::size_t>(est_steps));

    double h_guess = -1.0;      // next trial length of a checked step
    int until_checkpoint = 1;  // steps to the next checkpoint (the first step has one)
    StageEndedBy ended_by = until ? StageEndedBy::cap : StageEndedBy::duration;
    double t_local = 0.0;
    double slope = s0;
    double pending_ds = 0.0;  // event to record at the next step start (first: already applied)
    bool first_step = true;
    const double h_nocheck = eng->tau_insulated_s / 8.0;
    const double h_min = eng->tau_insulated_s * 1e-4;
    std::size_t piece = 0;
    HistorySample last = start;
    bool finished = ended_at_start || limit == 0.0;
    if (ended_at_start) {
      ended_by = StageEndedBy::condition;
      H.warnings.push_back("stage[" + std::to_string(i) + "] '" + stg.name + "': " + (on_mean ? "mean" : "centre") +
                           " is already at or past " + temp_token(stg.end.target_C) + " at the stage start; the stage ends at once");
    }

    ModalState end_st, mid_st, start_st;
    HistorySample mid_s{}, end_s{};
    detail::StepCache cache;
    std::vector<detail::RecentEvent> recent;
    std::vector<detail::ShadowValues> scache;
    // events of this stage whose surface/mean transient still counts; slope events share one
    // window from the stage's largest slope change (no logarithm per step)
    // the medium's slope on each piece, computed once
    detail::FlatBuffer piece_slope;  // (written whole below: no zero-fill first)
    detail::piece_slopes(pts.data(), pts.size(), piece_slope.room(pts.size() - 1));
    piece_slope.commit(pts.size() - 1);
    double max_ds = std::max(std::abs(S.start_ds), detail::largest_slope_change(piece_slope.data(), piece_slope.size()));
    if (!piece_slope.empty()) max_ds = std::max(max_ds, std::abs(piece_slope.back()));
    const double slope_window = eng->expiry(B, 0.0, max_ds, 0.0);
    auto note_event = [&](double t, double ds, double jump) {
      if (ds == 0.0 && jump == 0.0) return;
      const double ex = jump != 0.0 ? std::max(eng->expiry(B, t, ds, jump), t + slope_window) : t + slope_window;
      if (ex <= t) return;
      recent.push_back(detail::RecentEvent{t, ds, jump, ex});
      S.recent_window_s = std::max(S.recent_window_s, ex - t);
    };
    note_event(t_abs, S.start_ds, S.start_jump);
    // factors at ages that are whole multiples of the last step length (a regular log) come from
    // a table; others from a small cache
    double table_dt = -1.0;
    std::vector<detail::ShadowValues> table;
    std::array<double, 64> ring_ds{}, ring_t{};
    std::array<double, 128> ring2{};  // ring_ds mirrored twice: the last 64 events contiguous
    int ring_pos = 0;
    long run = 0;
    double run_dt = -1.0;
    auto flush_ring = [&]() {
      for (long j = 1; j <= std::min<long>(run, 63); ++j) {
        const int q = (ring_pos - static_cast<int>(j)) & 63;
        if (ring_ds[q] != 0.0) recent.push_back(detail::RecentEvent{ring_t[q], ring_ds[q], 0.0, ring_t[q] + slope_window});
      }
      run = 0;
    };
    // the ring's part of the correction at the end of the current step (ages j·run_dt): a short
    // FIR filter. Its taps are stored oldest first, so the events and the taps run the same way
    // through memory and the sum takes four fixed lanes (vectorised, same order on every CPU).
    std::vector<double> tab_gs, tab_gm;  // tab_g*[i]: factor at age (run_taps − i)·run_dt
    long run_taps = 0;
    auto ring_shadow = [&](HistorySample& out) {
      if (run_taps == 0) {
        while (run_taps < 60 && static_cast<double>(run_taps + 1) * run_dt < slope_window) ++run_taps;
        tab_gs.assign(static_cast<std::size_t>(run_taps), 0.0);
        tab_gm.assign(static_cast<std::size_t>(run_taps), 0.0);
        for (long j = 1; j <= run_taps; ++j) {
          const auto v = eng->shadow_at(B, static_cast<double>(j) * run_dt);
          tab_gs[static_cast<std::size_t>(run_taps - j)] = v.gs;
          tab_gm[static_cast<std::size_t>(run_taps - j)] = v.gm;
        }
      }
      const long jw = std::min(run, run_taps);
      // d[i], i = 0..run_taps−1: the event (run_taps − i) steps back (ring2 mirrors the ring)
      const double* d = ring2.data() + ring_pos + 64 - run_taps;
      double cs = 0, cm = 0;
      detail::fir_pair(d, tab_gs.data(), tab_gm.data(), static_cast<std::size_t>(run_taps - jw),
               static_cast<std::size_t>(run_taps), cs, cm);
      out.surface_C += cs;
      out.mean_C += cm;
    };
    auto shadow = [&](HistorySample& out) {
      if (recent.empty()) return;
      double cs = 0, cm = 0;
      const double t = out.time_s;
      const double inv_dt = table_dt > 0 ? 1.0 / table_dt : 0.0;
      for (const auto& e : recent) {
        if (e.t > t || e.expires <= t) continue;
        const double age = t - e.t;
        const long j = static_cast<long>(age * inv_dt + 0.5);
        if (table_dt > 0 && j >= 1 && j < 4096 && static_cast<double>(j) * table_dt == age) {
          while (table.size() <= static_cast<std::size_t>(j))
            table.push_back(eng->shadow_at(B, static_cast<double>(table.size()) * table_dt));
          const auto& v = table[static_cast<std::size_t>(j)];
          cs += e.ds * v.gs + e.jump * v.cs;
          cm += e.ds * v.gm + e.jump * v.cm;
        } else {
          const std::vector<detail::RecentEvent> one{e};
          double a = 0, b = 0;
          eng->shadow_correction(B, one, t, &scache, a, b);
          cs += a;
          cm += b;
        }
      }
      out.surface_C += cs;
      out.mean_C += cm;
    };
    auto value_of = [&](const HistorySample& h) { return on_mean ? h.mean_C : h.centre_C; };
    auto f_of = [&](const HistorySample& h) { return (value_of(h) - stg.end.target_C) * dir; };
    auto centre_at = [&](const ModalState& q, double t, double tm, double sl) {
      if (S.projected && t - S.start_s <= eng->tau_insulated_s) return eng->centre_continued(static_cast<int>(i) - 1, t);
      return eng->centre(B, q, S.origin_s, t, tm, sl);
    };
    auto fill = [&](HistorySample& out, const ModalState& q, double t, double tm, double sl) {
      out.time_s = t;
      out.medium_C = tm;
      out.stage = static_cast<int>(i);
      out.centre_C = centre_at(q, t, tm, sl);
      out.surface_C = eng->surface(B, q, tm, sl);
      out.mean_C = eng->mean(B, q, tm, sl);
      shadow(out);
    };

    // A run of equal short steps in a duration stage (a regular 1 s log) takes the lean path
    // (detail/lean_steps.hpp): the same arithmetic as the general step below for that case.
    auto lean_run = [&]() {
      detail::LeanRun r;
      r.eng = eng.get();
      r.basis = &B;
      r.stage_model = &S;
      r.samples = &H.samples;
      r.points = pts.data();
      r.n_points = pts.size();
      r.piece_slope = piece_slope.data();
      r.t_abs = t_abs;
      r.limit = limit;
      r.run_dt = run_dt;
      r.stage = static_cast<int>(i);
      r.tab_gs = tab_gs.data();
      r.tab_gm = tab_gm.data();
      r.run_taps = run_taps;
      r.st = &st;
      r.cache = &cache;
      r.piece = piece;
      r.t_local = t_local;
      r.slope = slope;
      r.pending_ds = pending_ds;
      r.until_checkpoint = until_checkpoint;
      r.ring_ds = ring_ds.data();
      r.ring2 = ring2.data();
      r.ring_t = ring_t.data();
      r.ring_pos = ring_pos;
      r.run = run;
      if (detail::lean_steps(r) == 0) return;
      piece = r.piece;
      t_local = r.t_local;
      slope = r.slope;
      pending_ds = r.pending_ds;
      until_checkpoint = r.until_checkpoint;
      ring_pos = r.ring_pos;
      run = r.run;
      end_s = r.end_s;
      last = r.end_s;
      finished = r.finished;
    };

    while (!finished) {
      if (!until && !first_step && run > 0 && run_dt > 0 && run_taps > 0 && recent.empty()) {
        lean_run();
        if (finished) break;
      }
      // current medium piece
      while (piece + 1 < pts.size() && pts[piece + 1].time_s <= t_local) ++piece;
      const double piece_end = piece + 1 < pts.size() ? std::min(pts[piece + 1].time_s, limit) : limit;
      const double new_slope = piece + 1 < pts.size() ? piece_slope[piece] : 0.0;
      if (!first_step) pending_ds = new_slope - slope;
      slope = new_slope;
      const double tm_a = piece + 1 < pts.size() ? pts[piece].temp_C + slope * (t_local - pts[piece].time_s)
                                                 : pts.back().temp_C;
      const double ta = t_abs + t_local;
      const double remaining = piece_end - t_local;
      const bool checkpoint_here = --until_checkpoint == 0;
      if (checkpoint_here) until_checkpoint = S.stride;
      const bool fused = remaining <= h_nocheck && !until;
      // the step start: apply its event, then record it (checkpoint = state after the event)
      if (!fused) {
        if (!first_step) eng->add_event(B, st, S.origin_s, ta, pending_ds, 0.0);
        if (checkpoint_here) S.store_checkpoint(st);
      }
      S.step_t.push_back(ta);
      S.step_tm.push_back(tm_a);
      S.step_slope.push_back(slope);
      S.step_ds.push_back(first_step ? 0.0 : pending_ds);
      const double ds_here = first_step ? 0.0 : pending_ds;
      first_step = false;
      if (!recent.empty())
        recent.erase(std::remove_if(recent.begin(), recent.end(), [&](const detail::RecentEvent& e) { return e.expires <= ta; }),
                     recent.end());
      // a run of equal short steps (a regular log) keeps its events in a ring: the correction is
      // then a short fixed filter over the last slope changes
      const bool ring_ok = fused && slope_window < 60.0 * remaining;
      if (!(ring_ok && remaining == run_dt)) {
        flush_ring();
        if (run_dt != (ring_ok ? remaining : -1.0)) run_taps = 0;  // new step length: new filter
        run_dt = ring_ok ? remaining : -1.0;
        if (ring_ok && table_dt != run_dt) {
          table_dt = run_dt;
          table.clear();
        }
      }
      if (ring_ok) {
        ring_ds[ring_pos] = ds_here;
        ring2[ring_pos] = ring2[ring_pos + 64] = ds_here;
        ring_t[ring_pos] = ta;
        ring_pos = (ring_pos + 1) & 63;
        ++run;
        S.recent_window_s = std::max(S.recent_window_s, slope_window);
      } else {
        note_event(ta, ds_here, 0.0);
      }

      double h = remaining;
      bool have_mid = false;
      const ModalState* step_start = &st;
      if (h <= h_nocheck) {
        // short step (e.g. a 1 s log): no midpoint check; advance in place
        if (until) {
          start_st = st;
          step_start = &start_st;
        }
        const auto sm = fused ? eng->event_advance_sum(B, st, S.origin_s, ta, ds_here, 0.0, h, slope, cache,
                                                       checkpoint_here ? &S.checkpoints : nullptr)
                              : eng->advance_and_sum(B, st, h, slope, cache);
        const double tb = ta + h, tm_b = tm_a + slope * h;
        end_s.time_s = tb;
        end_s.medium_C = tm_b;
        end_s.stage = static_cast<int>(i);
        end_s.centre_C = (S.projected && tb - S.start_s <= eng->tau_insulated_s)
                             ? eng->centre_continued(static_cast<int>(i) - 1, tb)
                             : eng->centre_from(B, st, sm, S.origin_s, tb, tm_b, slope);
        end_s.surface_C = tm_b + sm.a_surface - slope * B.q_surface;
        end_s.mean_C = tm_b + sm.a_mean - slope * B.q_mean;
        if (!recent.empty()) shadow(end_s);
        if (run > 0) ring_shadow(end_s);
      } else {
        // start from twice the last accepted step of this stage (not the whole piece each time)
        if (h_guess > 0) h = std::min(h, h_guess);
        for (;;) {
          end_st = st;  // reuses end_st's storage (no allocation)
          eng->advance(B, end_st, h, slope, cache);
          fill(end_s, end_st, ta + h, tm_a + slope * h, slope);
          mid_st = st;
          eng->advance(B, mid_st, h / 2, slope);
          fill(mid_s, mid_st, ta + h / 2, tm_a + slope * h / 2, slope);
          have_mid = true;
          const double ec = std::abs(mid_s.centre_C - 0.5 * (last.centre_C + end_s.centre_C));
          const double em = std::abs(mid_s.mean_C - 0.5 * (last.mean_C + end_s.mean_C));
          const double es = stg.h_infinite ? 0.0 : std::abs(mid_s.surface_C - 0.5 * (last.surface_C + end_s.surface_C));
          if (std::max({ec, em, es}) <= opt.sample_tol_K || h / 2 < h_min) break;
          h /= 2;
        }
        h_guess = 2 * h;
      }

      // end condition: crossing within (last, mid] or (mid, end]
      bool crossed = false, mid_before = false;
      double t_cross = 0.0;
      if (until) {
        const HistorySample* seg_a = &last;
        const HistorySample* cands[2] = {have_mid ? &mid_s : nullptr, &end_s};
        for (const HistorySample* c : cands) {
          if (!c) continue;
          if (f_of(*c) >= 0 && f_of(*seg_a) < 0) {
            // root-find on the exact evaluation from the step start
            const double lo = seg_a->time_s - ta, hi = c->time_s - ta;
            ModalState q;
            auto f = [&](double tau) {
              q = *step_start;
              eng->advance(B, q, tau, slope);
              const double tt = ta + tau;
              const double tm = tm_a + slope * tau;
              double v;
              if (on_mean) {
                HistorySample tmp;
                tmp.time_s = tt;
                tmp.mean_C = eng->mean(B, q, tm, slope);
                shadow(tmp);
                v = tmp.mean_C;
              } else {
                v = centre_at(q, tt, tm, slope);
              }
              return (v - stg.end.target_C) * dir;
            };
            const double flo = f(lo), fhi = f(hi);
            if (fhi == 0) {
              t_cross = hi;
            } else if (flo >= 0) {
              t_cross = lo;
            } else {
              std::uintmax_t it = 100;
              auto tolf = [&](double x, double y) { return std::abs(x - y) <= opt.crossing_tol_s; };
              auto r = boost::math::tools::toms748_solve(f, lo, hi, flo, fhi, tolf, it);
              if (it >= 100)
                throw NotConverged("simulate: stage[" + std::to_string(i) + "]: crossing time root-finder did not converge");
              t_cross = 0.5 * (r.first + r.second);
            }
            crossed = true;
            mid_before = have_mid && c != &mid_s;
            break;
          }
          seg_a = c;
        }
      }
      if (crossed) {
        if (mid_before) H.samples.push_back(mid_s);
        ModalState q = *step_start;
        eng->advance(B, q, t_cross, slope);
        st = std::move(q);
        t_local += t_cross;
        ended_by = StageEndedBy::condition;
        finished = true;
        HistorySample e;
        fill(e, st, t_abs + t_local, tm_a + slope * t_cross, slope);
        H.samples.push_back(e);
        last = e;
      } else {
        if (have_mid) H.samples.push_back(mid_s);
        if (step_start == &st && (have_mid || h > h_nocheck)) std::swap(st, end_st);
        t_local += h;
        if (h == remaining) t_local = piece_end;  // land exactly on breakpoints
        if (t_local >= limit) finished = true;
        H.samples.push_back(end_s);
        last = end_s;
      }
    }
    S.end_s = t_abs + t_local;
    S.end_state = st;
    S.end_tm = last.medium_C;
    S.end_slope = S.step_t.empty() ? s0 : slope;
    if (S.step_t.empty()) S.end_tm = tm0;
    if (S.checkpoints.empty()) S.store_checkpoint(st);

    StageRecord rec;
    rec.name = stg.name;
    rec.start_s = S.start_s;
    rec.end_s = S.end_s;
    rec.ended_by = ended_by;
    rec.h_W_m2K = stg.h_infinite ? kInfiniteBiot : stg.h_W_m2K;
    rec.biot = stg.h_infinite ? kInfiniteBiot : stg.h_W_m2K * l_min / k_W;
    rec.at_end = last;
    H.stages.push_back(rec);
    if (until && ended_by == StageEndedBy::cap) {
      H.warnings.push_back("stage[" + std::to_string(i) + "] '" + stg.name + "': " + (on_mean ? "mean" : "centre") +
                           " did not reach " + temp_token(stg.end.target_C) + " within the cap of " + fmt(limit) +
                           " s; stage ended at the cap with the " + (on_mean ? "mean" : "centre") + " at " +
                           temp_token(value_of(last)));
    }
    prev_tm = S.end_tm;
    prev_slope = S.end_slope;
    t_abs = S.end_s;
    eng->stages.push_back(std::move(S));
  }

  std::shared_ptr<const Engine> ce = eng;
  const double end = H.end_s();
  auto find_stage = [ce](double t) {
    int i = static_cast<int>(ce->stages.size()) - 1;
    while (i > 0 && ce->stages[i].start_s > t) --i;
    return i;
  };
  H.evaluate = [ce, end, find_stage](double t) {
    if (!(t >= 0.0 && t <= end * (1 + 1e-12) + 1e-12))
      throw InputError("History::evaluate: time_s = " + fmt(t) + ": must be in [0, " + fmt(end) + "]");
    return ce->sample(find_stage(t), std::min(t, end));
  };
  const int naxes = static_cast<int>(axes.size());
  H.temperature_at = [ce, end, find_stage, naxes](double t, std::array<double, 3> pos) {
    if (!(t >= 0.0 && t <= end * (1 + 1e-12) + 1e-12))
      throw InputError("History::temperature_at: time_s = " + fmt(t) + ": must be in [0, " + fmt(end) + "]");
    detail::Point p{};
    for (int a = 0; a < 3; ++a) {
      const double x = std::abs(pos[a]);
      if (a < naxes && !(x <= 1.0)) throw InputError("History::temperature_at: position[" + std::to_string(a) + "] = " + fmt(pos[a]) + ": must be in [-1, 1]");
      p[a].x = a < naxes ? x : 0.0;
    }
    return ce->profile(find_stage(t), std::min(t, end), p);
  };
  return H;
}

}  // namespace coldcore
