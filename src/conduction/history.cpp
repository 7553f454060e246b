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

#include <algorithm>
#include <cmath>
#include <memory>
#include <sstream>

#include "coldcore/conduction/modes.hpp"
#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"
#include "conduction/detail/history_engine.hpp"
#include "conduction/detail/medium_scan.hpp"
#include "conduction/detail/stage_run.hpp"

namespace coldcore {
namespace detail {

// The centre cannot feel a change at the surface before Fo = 0.01 on the smallest half-dimension:
// 1 − θ_step(centre) < 2e-10 there (sphere, Bi = ∞, the worst case: ≈ 2·e^{−1/(4Fo)}/√(πFo)), so
// Θ(τ) = ∫0^τ θ_step(centre) = τ holds to that inside the window.
constexpr double kInsulatedFourier = 0.01;

}  // namespace detail

namespace {

using detail::AxisModes;
using detail::Basis;
using detail::Engine;
using detail::ModalState;
using detail::StageModel;

[[noreturn]] void bad(const std::string& key, double v, const std::string& req) {
  throw InputError("simulate: " + key + " = " + number_text(v, 10) + ": " + req);
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

    detail::StageRun run(*eng, S, stg, opt, st, H.samples, t_abs, s0, opt.force_general_steps);
    if (run.ended_at_start())
      H.notes.push_back(StageNote{StageNoteKind::ended_at_start, static_cast<int>(i) + 1, stg.name,
                                  stg.end.kind == StageEndKind::until_mean, stg.end.target_C, run.watched(start), 0.0});
    run.run();
    const HistorySample last = run.last();
    S.end_s = run.end_s();
    S.end_state = st;
    S.end_tm = last.medium_C;
    S.end_slope = S.step_t.empty() ? s0 : run.end_slope();
    if (S.step_t.empty()) S.end_tm = tm0;
    if (S.checkpoints.empty()) S.store_checkpoint(st);

    StageRecord rec;
    rec.name = stg.name;
    rec.start_s = S.start_s;
    rec.end_s = S.end_s;
    rec.ended_by = run.ended_by();
    rec.h_W_m2K = stg.h_infinite ? kInfiniteBiot : stg.h_W_m2K;
    rec.biot = stg.h_infinite ? kInfiniteBiot : stg.h_W_m2K * l_min / k_W;
    rec.at_end = last;
    H.stages.push_back(rec);
    if (stg.end.kind != StageEndKind::duration && run.ended_by() == StageEndedBy::cap)
      H.notes.push_back(StageNote{StageNoteKind::cap_reached, static_cast<int>(i) + 1, stg.name,
                                  stg.end.kind == StageEndKind::until_mean, stg.end.target_C, run.watched(last),
                                  stg.end.max_duration_s});
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
      throw InputError("History::evaluate: time_s = " + number_text(t, 10) + ": must be in [0, " + number_text(end, 10) + "]");
    return ce->sample(find_stage(t), std::min(t, end));
  };
  const int naxes = static_cast<int>(axes.size());
  H.temperature_at = [ce, end, find_stage, naxes](double t, std::array<double, 3> pos) {
    if (!(t >= 0.0 && t <= end * (1 + 1e-12) + 1e-12))
      throw InputError("History::temperature_at: time_s = " + number_text(t, 10) + ": must be in [0, " + number_text(end, 10) + "]");
    detail::Point p{};
    for (int a = 0; a < 3; ++a) {
      const double x = std::abs(pos[a]);
      if (a < naxes && !(x <= 1.0)) throw InputError("History::temperature_at: position[" + std::to_string(a) + "] = " + number_text(pos[a], 10) + ": must be in [-1, 1]");
      p[a].x = a < naxes ? x : 0.0;
    }
    return ce->profile(find_stage(t), std::min(t, end), p);
  };
  return H;
}

}  // namespace coldcore
