// The history engine's exact step: advancing the modal state over a linear piece of the medium,
// medium events and epochs, and the checkpoints a stage keeps (see history.cpp for the
// representation).
#include <algorithm>
#include <cmath>
#include <cstddef>
#include <vector>

#include "conduction/detail/history_engine.hpp"
#include "conduction/detail/lanes.hpp"

namespace coldcore::detail {

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
    const double bg = b[k] * (-std::expm1(x) / lam[k]);  // as fill_cache forms it
    a[k] = stepped_amplitude(a[k], e, slope, bg);
    wp[k] *= e;
    wc[k] *= e;
  }
}

void Engine::fill_cache(const Basis& B, double dt, StepCache& c) const {
  if (c.dt == dt && c.basis == &B) return;  // a regular log: every step after the first hits
  const std::size_t K = B.lambda.size();
  c.e.resize(K);  // (truncates old padding; it is restored below)
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
      c.bg[k] = one_minus_e * B.b_over_lambda[k];
    }
  } else {
    for (std::size_t k = 0; k < K; ++k) {
      const double x = -B.lambda[k] * dt;
      c.e[k] = std::exp(x);
      c.bg[k] = B.b[k] * (-std::expm1(x) / B.lambda[k]);
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
  const double* bg = c.bg.data();
#pragma omp simd
  for (std::size_t k = 0; k < K; ++k) {
    a[k] = stepped_amplitude(a[k], e[k], slope, bg[k]);
    wp[k] *= e[k];
    wc[k] *= e[k];
  }
}

ModalSums Engine::advance_and_sum(const Basis& B, ModalState& st, double dt, double slope, StepCache& c) const {
  advance(B, st, dt, slope, c);  // fills the cache when dt changes
  return sums(B, st);
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
  roll_epoch(st, epoch_of(origin, t));
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

}  // namespace coldcore::detail
