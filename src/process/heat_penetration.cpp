#include "coldcore/process/heat_penetration.hpp"

#include <algorithm>
#include <cmath>

#include "coldcore/error.hpp"
#include "coldcore/process/h_ends.hpp"

namespace coldcore::process {

namespace {

double profile_at(const std::vector<Stage>& stages, double t) {
  double start = 0;
  for (std::size_t i = 0; i < stages.size(); ++i) {
    const double end = start + stages[i].end.duration_s;
    if (t < end || i + 1 == stages.size()) return stages[i].medium.at(t - start);
    start = end;
  }
  return 0;
}

StudyPhases phases_of(const StudyInput& in) {
  // The schedule timed as the study ran: the scheduled media over the study's stage spans.
  std::vector<Stage> timed = in.study_stages;
  for (std::size_t i = 0; i < timed.size(); ++i) timed[i].medium = in.scheduled.stages[i].medium;
  Scenario s = in.scheduled;
  s.stages = timed;
  StudyPhases p;
  double start = 0, end_s = 0;
  for (const Stage& st : timed) end_s += st.end.duration_s;
  p.heating_end_s = end_s;
  for (std::size_t i = 0; i < timed.size(); ++i) {
    if (i > 0 && !heating_stage(s, i)) {
      p.heating_end_s = start;
      p.has_cooling = true;
      p.cooling_medium_C = timed[i].medium.at(0);
      break;
    }
    start += timed[i].end.duration_s;
  }
  p.retort_C = profile_at(timed, std::max(0.0, p.heating_end_s - 1e-9));
  // Come-up: the first time the scheduled medium is within 0.5 K of T_R (sampled at 1 s, then
  // refined by bisection; the schedule is piecewise linear).
  double lo = 0, hi = p.heating_end_s;
  for (double t = 0; t <= p.heating_end_s; t += 1.0)
    if (profile_at(timed, t) >= p.retort_C - 0.5) {
      hi = t;
      break;
    } else {
      lo = t;
    }
  for (int k = 0; k < 40 && hi > lo; ++k) {
    const double mid = 0.5 * (lo + hi);
    (profile_at(timed, mid) >= p.retort_C - 0.5 ? hi : lo) = mid;
  }
  p.come_up_s = profile_at(timed, 0) >= p.retort_C - 0.5 ? 0.0 : hi;
  p.corrected_zero_s = corrected_zero_s(p.come_up_s);
  return p;
}

double medium_at(const std::vector<Stage>& study, double t) { return profile_at(study, t); }

ProbeDescription describe_probe(const StudyInput& in, const StudyPhases& ph, const ProbeCurve& c) {
  ProbeDescription d;
  d.name = c.name;
  d.initial_C = c.temp_C.front();
  d.heating = describe_curve(c.time_s, c.temp_C, ph.retort_C, 0.0, ph.heating_end_s, ph.corrected_zero_s, true);
  if (ph.has_cooling && c.time_s.back() > ph.heating_end_s)
    d.cooling = describe_curve(c.time_s, c.temp_C, ph.cooling_medium_C, ph.heating_end_s, c.time_s.back(),
                               ph.heating_end_s, false);
  // After the come-up only: a hot-filled container may start warmer than the water coming up.
  for (std::size_t i = 0; i < c.time_s.size() && c.time_s[i] < ph.heating_end_s; ++i) {
    if (c.time_s[i] < ph.come_up_s) continue;
    const double m = medium_at(in.study_stages, c.time_s[i]);
    if (c.temp_C[i] > m + 1.0) {
      d.hotter_than_medium = ProbeAnomaly{static_cast<int>(i) + 1, c.time_s[i], c.temp_C[i], m};
      break;
    }
  }
  std::vector<Target> lethal;
  for (const Target& t : in.scheduled.targets)
    if (t.kind == TargetKind::f_value || t.kind == TargetKind::log_reduction) {
      Target u = t;
      u.stages.clear();  // a log has no stages
      lethal.push_back(u);
      break;
    }
  if (!lethal.empty()) {
    const ProbeAssessment pa = assess_probe_log(c.time_s, c.temp_C, lethal, *in.libs.organisms, *in.libs.rules, {}, c.name);
    if (!pa.targets.empty() && pa.targets.front().kinetics) d.F_s = pa.targets.front().F_s;
  }
  return d;
}

FitInput fit_input(const StudyInput& in, std::vector<ProbeCurve> probes) {
  FitInput f;
  f.product = in.scheduled.product;
  f.stages = in.study_stages;
  f.probes = std::move(probes);
  Scenario s = in.scheduled;  // the direction comes from the schedule, not from a noisy log
  s.stages.resize(in.study_stages.size());
  for (std::size_t i = 0; i < s.stages.size(); ++i) f.heating.push_back(heating_stage(s, i));
  return f;
}

}  // namespace

Scenario calibrated_scenario(const Scenario& scheduled, const FitResult& fit) {
  Scenario s = scheduled;
  s.product.properties.conductivity_W_mK = fit.conductivity_W_mK;
  for (const FittedH& g : fit.h)
    if (g.status != HStatus::fixed_infinite)
      for (int i : g.stages) s.stages[static_cast<std::size_t>(i)].h_W_m2K = g.h_W_m2K;
  return s;
}

StudyAnalysis analyse_study(const StudyInput& in) {
  if (in.probes.empty()) throw InputError("fit: no probe curve");
  StudyAnalysis a;
  a.phases = phases_of(in);
  for (const ProbeCurve& c : in.probes) a.curves.push_back(describe_probe(in, a.phases, c));

  // The design probe: largest f_h among the described curves (a broken curve by its later,
  // slower f); without any, the least lethality; else the first.
  double worst_f = -1;
  for (std::size_t i = 0; i < a.curves.size(); ++i) {
    const CurveDescription& h = a.curves[i].heating;
    if (h.status != CurveStatus::described) continue;
    const double f = h.broken ? std::max(h.f_s, h.f2_s) : h.f_s;
    if (f > worst_f) {
      worst_f = f;
      a.slowest = static_cast<int>(i);
    }
  }
  double least = INFINITY;
  for (std::size_t i = 0; i < a.curves.size(); ++i)
    if (a.curves[i].F_s && *a.curves[i].F_s < least) {
      least = *a.curves[i].F_s;
      a.least_lethality = static_cast<int>(i);
    }
  if (worst_f < 0 && a.least_lethality >= 0) a.slowest = a.least_lethality;

  a.fit_slowest = fit_study(fit_input(in, {in.probes[static_cast<std::size_t>(a.slowest)]}));
  if (in.probes.size() > 1) a.fit_pool = fit_study(fit_input(in, in.probes));

  const ProbeDescription& design = a.curves[static_cast<std::size_t>(a.slowest)];
  const ThermalProperties& tp = in.scheduled.product.properties;
  if (design.heating.status == CurveStatus::described && !design.heating.broken) {
    CrossCheck cc;
    cc.estimate = first_term_estimate(in.scheduled.product, design.heating.f_s, design.heating.j,
                                      tp.density_kg_m3 * tp.specific_heat_J_kgK);
    if (cc.estimate.status != FirstTermStatus::j_below_one)
      cc.alpha_ratio = cc.estimate.alpha_m2_s / a.fit_slowest.alpha_m2_s;
    // Bi of the last heating stage (the straight portion lies in it).
    int last_heating = 0;
    double start = 0;
    for (std::size_t i = 0; i < in.study_stages.size(); ++i) {
      if (start < a.phases.heating_end_s) last_heating = static_cast<int>(i);
      start += in.study_stages[i].end.duration_s;
    }
    double biot = INFINITY;
    for (const FittedH& g : a.fit_slowest.h)
      if (std::find(g.stages.begin(), g.stages.end(), last_heating) != g.stages.end()) biot = g.biot;
    cc.predicted = first_term_heating(in.scheduled.product, a.fit_slowest.alpha_m2_s, biot);
    cc.f_ratio = cc.predicted.f_s / design.heating.f_s;
    cc.disagrees = std::abs(cc.f_ratio - 1.0) > kCrossCheckTolerance;
    a.cross_check = cc;

    // Ball's formula for the first F-value or log-reduction target, beside the exact hold.
    for (const Target& t : in.scheduled.targets) {
      if (t.kind != TargetKind::f_value && t.kind != TargetKind::log_reduction) continue;
      Target u = t;
      u.stages.clear();
      const std::vector<double> one_t{0.0, 1.0}, one_T{a.phases.retort_C, a.phases.retort_C};
      const ProbeAssessment pa = assess_probe_log(one_t, one_T, {u}, *in.libs.organisms, *in.libs.rules, {}, "ball");
      if (pa.targets.empty() || !pa.targets.front().kinetics) break;
      const TargetResult& r = pa.targets.front();
      ClassicalEstimate ce;
      ce.target = t.name;
      ce.ball = ball_process_time(design.heating.f_s, design.heating.j, a.phases.retort_C, design.initial_C,
                                  r.F_required_s, r.kinetics->reference_C, r.kinetics->z_C, a.phases.come_up_s);
      Scenario cal = calibrated_scenario(in.scheduled, a.fit_slowest);
      cal.product.initial_C = design.initial_C;
      try {
        SolveOptions so;
        const SolveResult sr = solve(Question::hold_time, cal, in.libs, so);
        ce.exact_hold_s = sr.rounded;
        ce.stage = sr.stage;
      } catch (const NoSolution& e) {
        ce.exact_failed = e.what();
      }
      a.classical = ce;
      break;
    }
  }
  return a;
}

}  // namespace coldcore::process
