#pragma once
// State of the history engine, shared by simulate() and History::evaluate. Private.
#include <algorithm>
#include <cmath>
#include <cstddef>
#include <memory>
#include <vector>

#include "coldcore/conduction/history.hpp"
#include "conduction/detail/lanes.hpp"
#include "conduction/detail/modal_basis.hpp"

namespace coldcore::detail {

/// Running sums of the medium events (slope change ds, level jump j) of one epoch.
struct EpochSums {
  double ds = 0;     // Σ Δs_j
  double ds_t = 0;   // Σ Δs_j (t_j − origin)
  double jump = 0;   // Σ J_j
};

/// K rounded up to whole groups of four: the stepping kernel works on whole groups, and the
/// padding modes (zero amplitude, zero decay factor) stay exactly zero.
inline std::size_t padded_modes(std::size_t K) { return (K + 3) & ~std::size_t{3}; }

/// Modal state at one instant: amplitudes of u = T − T∞ on the kept modes, plus the centre's
/// transient memory of recent events, held for two epochs (see history.cpp).
struct ModalState {
  std::vector<double> a, w_prev, w_cur;  // K entries; simulate's own state is padded (padded_modes)
  EpochSums s_prev, s_cur;
  long epoch = 0;
};

/// Growable flat array of doubles whose appended space is left uninitialised: checkpoints are
/// written right after they are appended, and zero-filling them first (std::vector::resize) cost
/// about as much as writing them.
class FlatBuffer {
 public:
  void reserve(std::size_t n) {
    if (n > cap_) grow(n);
  }
  /// n uninitialised doubles at the end (valid until the next append or reserve)
  double* append(std::size_t n) {
    if (size_ + n > cap_) grow(std::max(size_ + n, 2 * cap_));
    double* out = p_.get() + size_;
    size_ += n;
    return out;
  }
  void push_back(double v) { *append(1) = v; }
  /// room for n more values: write them from the returned pointer, then commit() how many
  double* room(std::size_t n) {
    reserve(size_ + n);
    return p_.get() + size_;
  }
  void commit(std::size_t n) { size_ += n; }
  const double* data() const { return p_.get(); }
  const double* begin() const { return p_.get(); }
  const double* end() const { return p_.get() + size_; }
  double operator[](std::size_t i) const { return p_[i]; }
  double back() const { return p_[size_ - 1]; }
  std::size_t size() const { return size_; }
  bool empty() const { return size_ == 0; }

 private:
  void grow(std::size_t n) {
    auto q = std::make_unique_for_overwrite<double[]>(n);
    if (size_ > 0) std::copy(p_.get(), p_.get() + size_, q.get());
    p_ = std::move(q);
    cap_ = n;
  }
  std::unique_ptr<double[]> p_;
  std::size_t size_ = 0, cap_ = 0;
};

struct StageModel {
  std::shared_ptr<const Basis> basis;
  bool projected = false;
  double start_s = 0, end_s = 0;
  double origin_s = 0;          // epoch origin (start of the run of stages sharing this basis)
  FlatBuffer step_t;   // absolute start of each internal step
  FlatBuffer step_tm;  // medium at the step start
  FlatBuffer step_slope;
  FlatBuffer step_ds;  // slope change applied at the step start (before advancing)
  int stride = 1;                     // a checkpoint every `stride` steps
  // state at step_t[k·stride], after its event, flat: a, w_prev, w_cur (K each), then
  // s_prev (3), s_cur (3), epoch: 3K + 7 doubles per checkpoint
  FlatBuffer checkpoints;
  std::size_t checkpoint_count() const;
  void store_checkpoint(const ModalState& st);
  void load_checkpoint(std::size_t i, ModalState& st) const;
  ModalState end_state;
  double end_tm = 0, end_slope = 0;
  HistorySample start_sample;
  int index = 0;
  double start_ds = 0, start_jump = 0;  // the event at the stage start
  double recent_window_s = 0;           // largest age at which an event's transient still counts
};

/// exp(−λΔ) and (1 − exp(−λΔ))/λ of the last step length, reused while Δ repeats (a 1 s log).
struct StepCache {
  double dt = -1;
  const Basis* basis = nullptr;
  std::vector<double> e, bg;  // bg = b(1 − e)/λ; both padded with zeros to padded_modes(K)
  std::vector<double> bl, vs, vm;  // the basis' b/λ, surface and mean values, padded likewise
  std::vector<double> axis_e[3];  // products: per-axis exponentials e^{−λ_n dt}
};

/// A recent event (change of medium slope ds, jump of u by `jump`) whose left-out-mode transient
/// still matters at the surface and for the mean.
struct RecentEvent {
  double t = 0, ds = 0, jump = 0, expires = 0;
};
struct ShadowValues {
  double age = 0, gs = 0, gm = 0, cs = 0, cm = 0;
};

/// Sums over the kept modes that the three reported temperatures need.
struct ModalSums {
  double a = 0, a_surface = 0, a_mean = 0, w_prev = 0, w_cur = 0;
  bool combined = false;  // a already holds Σ(a − w_prev − w_cur) (w sums zero)
};

struct Engine {
  double alpha = 0;
  double tau_insulated_s = 0;   // 0.01·L_min²/α: the centre cannot feel the surface before this
  double epoch_s = 0;           // tau_insulated_s / 2
  double inv_epoch_s = 0;
  std::vector<StageModel> stages;
  double tol_K = 1e-4;

  /// left-out-mode transient factors at `age` after an event (surface and mean)
  ShadowValues shadow_at(const Basis& B, double age) const;
  /// time after which an event's surface/mean transient is below tol/100
  double expiry(const Basis& B, double t, double ds, double jump) const;
  /// surface and mean corrections at t from the events
  void shadow_correction(const Basis& B, const std::vector<RecentEvent>& ev, double t, std::vector<ShadowValues>* cache,
                         double& surface, double& mean) const;

  // advance by dt at medium slope s (exact for a linear medium)
  void advance(const Basis& B, ModalState& st, double dt, double slope) const;
  void advance(const Basis& B, ModalState& st, double dt, double slope, StepCache& cache) const;
  /// advance (as above) and return the sums of the new state in the same pass
  ModalSums advance_and_sum(const Basis& B, ModalState& st, double dt, double slope, StepCache& cache) const;
  ModalSums sums(const Basis& B, const ModalState& st) const;
  /// add_event at t_event, then advance by dt, then sum, in one pass over the modes (the hot path
  /// of a 1 s log). If `checkpoint` is set, the state after the event is appended to it.
  /// (inline: defined in history.cpp, used there only)
  inline ModalSums event_advance_sum(const Basis& B, ModalState& st, double origin, double t_event, double ds, double jump,
                                     double dt, double slope, StepCache& cache, FlatBuffer* checkpoint) const;
  /// fills `cache` for step length dt in basis B (if it does not already hold them)
  void fill_cache(const Basis& B, double dt, StepCache& cache) const;
  inline double centre_from(const Basis& B, const ModalState& st, const ModalSums& s, double origin, double t, double tm,
                            double slope) const;
  void add_event(const Basis& B, ModalState& st, double origin, double t, double ds, double jump) const;
  inline long epoch_of(double origin, double t) const;
  double centre(const Basis& B, const ModalState& st, double origin, double t, double tm, double slope) const;
  double surface(const Basis& B, const ModalState& st, double tm, double slope) const;
  double mean(const Basis& B, const ModalState& st, double tm, double slope) const;
  double at_point(const Basis& B, const ModalState& st, const Point& p, double tm, double slope) const;

  /// State, medium and slope of stage i at absolute time t (start_s < t <= end_s).
  void state_at(const StageModel& S, double t, ModalState& st, double& tm, double& slope) const;
  /// Centre of stage j continued past its end with the medium held at its end value.
  double centre_continued(int j, double t) const;
  HistorySample sample(int i, double t) const;
  double profile(int i, double t, const Point& p) const;
};

/// Starts epoch e of the centre's transient memory: the current epoch's becomes the previous one.
void roll_epoch(ModalState& st, long e);

// Inline: called once per step of a 1 s log.
inline long Engine::epoch_of(double origin, double t) const {
  // t >= origin always: truncation is floor (and avoids a libm call on plain x86-64)
  const double x = (t - origin) * inv_epoch_s;
  return x >= 0 ? static_cast<long>(x) : static_cast<long>(std::floor(x));
}

inline double Engine::centre_from(const Basis& B, const ModalState& st, const ModalSums& s, double origin, double t,
                                  double tm, double slope) const {
  const long d = epoch_of(origin, t) - st.epoch;
  if (s.combined && d != 0) {
    // The step ends in a later epoch (once per epoch): the memory sums are needed apart. They are
    // taken in four fixed lanes over the padded modes, as the lean path takes them
    // (lean_steps.cpp), so that both paths give the same bits (history_paths_test.cpp).
    ModalSums apart = s;
    apart.combined = false;
    Lanes lp = {0, 0, 0, 0}, lc = lp;
    const std::size_t Kp = padded_modes(B.lambda.size());
    for (std::size_t k = 0; k < Kp; k += 4) {
      lp += load4(st.w_prev.data() + k);
      lc += load4(st.w_cur.data() + k);
    }
    apart.w_prev = lane_sum(lp);
    apart.w_cur = lane_sum(lc);
    apart.a = s.a + apart.w_prev + apart.w_cur;
    return centre_from(B, st, apart, origin, t, tm, slope);
  }
  const bool use_prev = d <= 0, use_cur = d <= 1;
  double corr = 0.0;
  const double tau0 = t - origin;
  auto add = [&](const EpochSums& e) { corr += e.ds * B.full_centre - (e.ds * tau0 - e.ds_t) + e.jump; };
  if (use_prev) {
    add(st.s_prev);
    corr -= s.w_prev;
  }
  if (use_cur) {
    add(st.s_cur);
    corr -= s.w_cur;
  }
  return tm + s.a - slope * B.q_centre + corr;
}

/// Coefficients on `to`'s kept modes of the profile T − tm_to of state `st` in basis `from`
/// (medium tm_from, slope slope_from at that instant): closed-form inner products per axis.
std::vector<double> project_state(const Basis& from, const ModalState& st, double tm_from, double slope_from,
                                  const Basis& to, double tm_to);

}  // namespace coldcore::detail
