// The left-out modes' corrections of one stage's run (StageRun, detail/stage_run.hpp): the events
// whose surface and mean transient still counts, and the ring of a regular log's slope changes
// with its short filter.
#include <algorithm>
#include <vector>

#include "conduction/detail/lanes.hpp"
#include "conduction/detail/stage_run.hpp"

namespace coldcore::detail {

namespace {
// (built for AVX2 and baseline x86-64, like the step kernels; the same bits on either)
COLDCORE_SIMD_CLONES void fir_pair(const double* __restrict d, const double* __restrict ga, const double* __restrict gb,
                                   std::size_t from, std::size_t n, double& sa, double& sb) {
  fir_pair_body(d, ga, gb, from, n, sa, sb);
}
}  // namespace

void StageRun::note_event(double t, double ds, double jump) {
  if (ds == 0.0 && jump == 0.0) return;
  const double ex = jump != 0.0 ? std::max(eng_.expiry(basis_, t, ds, jump), t + slope_window_) : t + slope_window_;
  if (ex <= t) return;
  recent_.push_back(RecentEvent{t, ds, jump, ex});
  model_.recent_window_s = std::max(model_.recent_window_s, ex - t);
}

void StageRun::flush_ring() {
  for (long j = 1; j <= std::min<long>(ring_.run, 63); ++j) {
    const auto q = static_cast<std::size_t>((ring_.pos - static_cast<int>(j)) & 63);
    if (ring_.ds[q] != 0.0) recent_.push_back(RecentEvent{ring_.t[q], ring_.ds[q], 0.0, ring_.t[q] + slope_window_});
  }
  ring_.run = 0;
}

// The ring's part of the correction at the end of the current step (ages j·run_dt): a short FIR
// filter. Its taps are stored oldest first, so the events and the taps run the same way through
// memory and the sum takes four fixed lanes (vectorised, same order on every CPU).
void StageRun::ring_shadow(HistorySample& out) {
  if (ring_.taps == 0) {
    while (ring_.taps < 60 && static_cast<double>(ring_.taps + 1) * ring_.run_dt < slope_window_) ++ring_.taps;
    ring_.gs.assign(static_cast<std::size_t>(ring_.taps), 0.0);
    ring_.gm.assign(static_cast<std::size_t>(ring_.taps), 0.0);
    for (long j = 1; j <= ring_.taps; ++j) {
      const auto v = eng_.shadow_at(basis_, static_cast<double>(j) * ring_.run_dt);
      ring_.gs[static_cast<std::size_t>(ring_.taps - j)] = v.gs;
      ring_.gm[static_cast<std::size_t>(ring_.taps - j)] = v.gm;
    }
  }
  const long jw = std::min(ring_.run, ring_.taps);
  // d[i], i = 0..taps−1: the event (taps − i) steps back (the mirror holds the ring twice)
  const double* d = ring_.mirror.data() + ring_.pos + 64 - ring_.taps;
  double cs = 0, cm = 0;
  fir_pair(d, ring_.gs.data(), ring_.gm.data(), static_cast<std::size_t>(ring_.taps - jw),
           static_cast<std::size_t>(ring_.taps), cs, cm);
  out.surface_C += cs;
  out.mean_C += cm;
}

void StageRun::shadow(HistorySample& out) {
  if (recent_.empty()) return;
  double cs = 0, cm = 0;
  const double t = out.time_s;
  const double inv_dt = table_dt_ > 0 ? 1.0 / table_dt_ : 0.0;
  for (const auto& e : recent_) {
    if (e.t > t || e.expires <= t) continue;
    const double age = t - e.t;
    const long j = static_cast<long>(age * inv_dt + 0.5);
    if (table_dt_ > 0 && j >= 1 && j < 4096 && static_cast<double>(j) * table_dt_ == age) {
      while (table_.size() <= static_cast<std::size_t>(j))
        table_.push_back(eng_.shadow_at(basis_, static_cast<double>(table_.size()) * table_dt_));
      const auto& v = table_[static_cast<std::size_t>(j)];
      cs += e.ds * v.gs + e.jump * v.cs;
      cm += e.ds * v.gm + e.jump * v.cm;
    } else {
      const std::vector<RecentEvent> one{e};
      double a = 0, b = 0;
      eng_.shadow_correction(basis_, one, t, &scache_, a, b);
      cs += a;
      cm += b;
    }
  }
  out.surface_C += cs;
  out.mean_C += cm;
}

}  // namespace coldcore::detail
