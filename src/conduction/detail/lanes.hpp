#pragma once
// Four-lane arithmetic for the stepping loop's hot sums. Private.
//
// The sums run in four fixed lanes combined in a fixed order, so a result does not depend on the
// vector width of the machine: the AVX2 clones (COLDCORE_SIMD_CLONES, chosen at run time where the
// CPU has AVX2; no FMA, so each operation rounds as in plain code) and the baseline SSE2 build give
// the same bits, and reports stay byte-identical between machines.
#include <cstddef>
#include <cstring>

// The helpers are always inlined; GCC's note about the ABI of passing 32-byte vectors when AVX is
// off concerns out-of-line calls only.
#pragma GCC diagnostic ignored "-Wpsabi"

#if defined(__x86_64__) && defined(__GNUC__) && !defined(__clang__)
#define COLDCORE_SIMD_CLONES __attribute__((target_clones("avx2", "default")))
#else
#define COLDCORE_SIMD_CLONES
#endif

namespace coldcore::detail {

using Lanes = double __attribute__((vector_size(32)));  // four doubles (GCC/Clang vector extension)

[[gnu::always_inline]] inline Lanes load4(const double* p) {
  Lanes v;
  std::memcpy(&v, p, sizeof v);
  return v;
}
[[gnu::always_inline]] inline void store4(double* p, const Lanes& v) { std::memcpy(p, &v, sizeof v); }
[[gnu::always_inline]] inline double lane_sum(const Lanes& v) { return (v[0] + v[1]) + (v[2] + v[3]); }

/// {lane_sum(a), lane_sum(b), lane_sum(c), lane_sum(d)} by a transpose: the same additions in the
/// same order, in fewer instructions. GCC spells the lane shuffle __builtin_shuffle (index vector),
/// Clang __builtin_shufflevector (constant indices); both pick the same lanes.
#if defined(__clang__)
#define COLDCORE_SHUFFLE4(x, y, i0, i1, i2, i3) __builtin_shufflevector(x, y, i0, i1, i2, i3)
#else
using LaneIndex = long long __attribute__((vector_size(32)));
#define COLDCORE_SHUFFLE4(x, y, i0, i1, i2, i3) __builtin_shuffle(x, y, LaneIndex{i0, i1, i2, i3})
#endif
[[gnu::always_inline]] inline Lanes lane_sums(const Lanes& a, const Lanes& b, const Lanes& c, const Lanes& d) {
  const Lanes ab = COLDCORE_SHUFFLE4(a, b, 0, 4, 2, 6) + COLDCORE_SHUFFLE4(a, b, 1, 5, 3, 7);
  const Lanes cd = COLDCORE_SHUFFLE4(c, d, 0, 4, 2, 6) + COLDCORE_SHUFFLE4(c, d, 1, 5, 3, 7);
  return COLDCORE_SHUFFLE4(ab, cd, 0, 1, 4, 5) + COLDCORE_SHUFFLE4(ab, cd, 2, 3, 6, 7);
}
#undef COLDCORE_SHUFFLE4

/// The first n (1..4) values of p in lanes 0..n−1, zeros after. Written out, not as a loop, which
/// the compiler would turn into a memcpy call.
[[gnu::always_inline]] inline Lanes load_tail(const double* p, std::size_t n) {
  return Lanes{p[0], n > 1 ? p[1] : 0.0, n > 2 ? p[2] : 0.0, n > 3 ? p[3] : 0.0};
}
[[gnu::always_inline]] inline void store_tail(double* p, const Lanes& v, std::size_t n) {
  p[0] = v[0];
  if (n > 1) p[1] = v[1];
  if (n > 2) p[2] = v[2];
  if (n > 3) p[3] = v[3];
}

/// One mode's amplitude over one step at medium slope s: a·e − s·bg (e = e^{−λΔ},
/// bg = b(1 − e)/λ). The one stepping formula: the step kernel applies it to four lanes and
/// Engine::advance to single modes, so the paths give the same bits.
template <class T>
[[gnu::always_inline]] inline T stepped_amplitude(T a, T e, T slope, T bg) {
  return a * e - slope * bg;
}

/// One pass over the K modes of a step: the event's slope change ds enters w_cur (a, w_prev, w_cur
/// are the modal state), then all three decay over the step (e = e^{−λΔ}, bg = b(1 − e)/λ) and the
/// sums Σ(a − w_prev − w_cur), Σ a·vs, Σ a·vm are taken. With Store, the state after the event
/// (before the decay) is written to ck in the checkpoint layout (a, w_prev, w_cur; K each).
/// REQUIRES: every array holds padded_modes(K) entries, the padding zero (it then stays zero and
/// adds exact zeros to the sums).
/// The sums are left in lanes (combine them with lane_sum or lane_sums). `groups`, if given, is
/// padded_modes(K)/4 as a constant, so that the loop unrolls.
template <bool Store>
[[gnu::always_inline]] inline void step_kernel_lanes(std::size_t K, double* __restrict a, double* __restrict wp,
                                                     double* __restrict wc, const double* __restrict e,
                                                     const double* __restrict bg, const double* __restrict bl,
                                                     const double* __restrict vs, const double* __restrict vm,
                                                     double ds, double slope, double* __restrict ck, Lanes& s0,
                                                     Lanes& s1, Lanes& s2, std::size_t groups = 0) {
  s0 = Lanes{0, 0, 0, 0};
  s1 = s0;
  s2 = s0;
  const Lanes dsv = {ds, ds, ds, ds}, slv = {slope, slope, slope, slope};
  const std::size_t n = groups > 0 ? 4 * groups : K;
#pragma GCC unroll 8
  for (std::size_t k = 0; k < n; k += 4) {
    const Lanes ek = load4(e + k), ak0 = load4(a + k), wpk0 = load4(wp + k);
    const Lanes wce = load4(wc + k) + load4(bl + k) * dsv;
    if constexpr (Store) {
      if (k + 4 <= K) {
        store4(ck + k, ak0);
        store4(ck + K + k, wpk0);
        store4(ck + 2 * K + k, wce);
      } else {  // the checkpoint layout has no padding
        store_tail(ck + k, ak0, K - k);
        store_tail(ck + K + k, wpk0, K - k);
        store_tail(ck + 2 * K + k, wce, K - k);
      }
    }
    const Lanes ak = stepped_amplitude(ak0, ek, slv, load4(bg + k));
    const Lanes wck = wce * ek;
    const Lanes wpk = wpk0 * ek;
    store4(a + k, ak);
    store4(wc + k, wck);
    store4(wp + k, wpk);
    s0 += ak - wpk - wck;
    s1 += ak * load4(vs + k);
    s2 += ak * load4(vm + k);
  }
}

/// step_kernel_lanes with the sums combined.
template <bool Store>
[[gnu::always_inline]] inline void step_kernel_body(std::size_t K, double* __restrict a, double* __restrict wp,
                                                    double* __restrict wc, const double* __restrict e,
                                                    const double* __restrict bg, const double* __restrict bl,
                                                    const double* __restrict vs, const double* __restrict vm, double ds,
                                                    double slope, double* __restrict ck, double& s0_out, double& s1_out,
                                                    double& s2_out) {
  Lanes s0, s1, s2;
  step_kernel_lanes<Store>(K, a, wp, wc, e, bg, bl, vs, vm, ds, slope, ck, s0, s1, s2);
  s0_out = lane_sum(s0);
  s1_out = lane_sum(s1);
  s2_out = lane_sum(s2);
}

/// Σ d[i]·ga[i] and Σ d[i]·gb[i] over i in [from, n), in four fixed lanes (left in lanes).
[[gnu::always_inline]] inline void fir_pair_lanes(const double* __restrict d, const double* __restrict ga,
                                                  const double* __restrict gb, std::size_t from, std::size_t n,
                                                  Lanes& sa, Lanes& sb) {
  sa = Lanes{0, 0, 0, 0};
  sb = sa;
  std::size_t i = from;
  for (; i + 4 <= n; i += 4) {
    const Lanes di = load4(d + i);
    sa += di * load4(ga + i);
    sb += di * load4(gb + i);
  }
  if (i < n) {
    const Lanes di = load_tail(d + i, n - i);
    sa += di * load_tail(ga + i, n - i);
    sb += di * load_tail(gb + i, n - i);
  }
}

/// fir_pair_lanes (from = 0, then lane_sum) for four consecutive outputs at once, one per lane:
/// output l sums d[l + i]·ga[i] and d[l + i]·gb[i] over i < n. Each output gets the same
/// additions in the same order as fir_pair_lanes followed by lane_sum, so the bits are the same.
[[gnu::always_inline]] inline void fir_pair_four(const double* __restrict d, const double* __restrict ga,
                                                 const double* __restrict gb, std::size_t n, Lanes& sa_out,
                                                 Lanes& sb_out) {
  Lanes a0 = {0, 0, 0, 0}, a1 = a0, a2 = a0, a3 = a0, b0 = a0, b1 = a0, b2 = a0, b3 = a0;
  auto tap = [&](std::size_t i, Lanes& sa, Lanes& sb) {
    const Lanes di = load4(d + i);
    sa += di * Lanes{ga[i], ga[i], ga[i], ga[i]};
    sb += di * Lanes{gb[i], gb[i], gb[i], gb[i]};
  };
  std::size_t i = 0;
  for (; i + 4 <= n; i += 4) {
    tap(i, a0, b0);
    tap(i + 1, a1, b1);
    tap(i + 2, a2, b2);
    tap(i + 3, a3, b3);
  }
  if (i < n) tap(i, a0, b0);
  if (i + 1 < n) tap(i + 1, a1, b1);
  if (i + 2 < n) tap(i + 2, a2, b2);
  sa_out = (a0 + a1) + (a2 + a3);
  sb_out = (b0 + b1) + (b2 + b3);
}

/// fir_pair_lanes with the sums combined.
[[gnu::always_inline]] inline void fir_pair_body(const double* __restrict d, const double* __restrict ga,
                                                 const double* __restrict gb, std::size_t from, std::size_t n,
                                                 double& sa_out, double& sb_out) {
  Lanes sa, sb;
  fir_pair_lanes(d, ga, gb, from, n, sa, sb);
  sa_out = lane_sum(sa);
  sb_out = lane_sum(sb);
}

}  // namespace coldcore::detail
