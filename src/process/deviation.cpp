#include "coldcore/process/deviation.hpp"
#include "coldcore/model/temperature_token.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>

#include "coldcore/error.hpp"
#include "coldcore/lethality/kinetics.hpp"
#include "coldcore/process/h_ends.hpp"

#include "process/detail/inverse_text.hpp"

namespace coldcore::process {

namespace {

using detail::num;
using detail::is_lethality;

std::optional<double> logs_of(const TargetResult& r, double F_s) {
  if (r.kind == TargetKind::log_reduction) {
    if (r.kinetics && r.F_s > 0) return r.achieved * (F_s / r.F_s);  // same kinetics: logs ∝ F when log-linear
    return r.achieved;
  }
  if (r.kinetics && r.kinetics->D_ref_s) return log_reduction_linear(F_s, *r.kinetics);
  return std::nullopt;
}

/// The deviated stage with its medium replaced by `medium`; a duration-ended stage lasts
/// `stage_s` and, for x > 0, is extended by x at `hold_C` (a 1 ms ramp from the log's value at
/// stage_s, times must increase).
Scenario extended(const Scenario& base, std::size_t k, const MediumProfile& medium, double stage_s, double x,
                  double hold_C) {
  Scenario c = base;
  Stage& st = c.stages[k];
  st.medium = medium;
  st.medium_gaps_s.clear();  // the deviation log replaces the scheduled medium; its gaps are split out below
  if (st.end.kind != StageEndKind::duration) return c;
  st.end.duration_s = stage_s;
  if (x > 0) {
    const double d = stage_s;
    auto& pts = st.medium.points;
    const double at_d = st.medium.at(d);
    while (!pts.empty() && pts.back().time_s >= d) pts.pop_back();
    pts.push_back({d, at_d});
    pts.push_back({d + std::min(1e-3, x / 2), hold_C});
    st.medium.description += " + " + num(x) + " s at " + temp_token(hold_C, 5);
    st.end.duration_s = d + x;
  }
  return c;
}

/// Stage k of `c` (duration-ended) split at the gaps of its log: each gap becomes a stage of its
/// own named "<stage> (gap in the log)" that no lethality target credits (the medium in it is
/// unknown, so its lethality cannot be credited); the recorded parts keep the stage's name, so a
/// target crediting the stage by name credits them. Same h and medium, so the temperatures are
/// those of the unsplit stage.
Scenario without_gap_credit(Scenario c, std::size_t k, const std::vector<DeviationEvent>& events) {
  const Stage st = c.stages[k];
  if (st.end.kind != StageEndKind::duration) {
    // Its end is found by the run: the gaps stay on the stage as unrecorded intervals (process::
    // evaluate leaves them out of every credit and counts them against cooling rules).
    for (const auto& e : events)
      if (e.kind == DeviationKind::log_gap) c.stages[k].medium_gaps_s.push_back({e.start_s, e.end_s});
    return c;
  }
  const double end = st.end.duration_s;
  const std::string gap_name = st.name + " (gap in the log)";
  std::vector<Stage> parts;
  const auto part = [&](double a, double b, const std::string& name) {
    if (!(b > a)) return;
    Stage p = st;
    p.name = name;
    p.end.duration_s = b - a;
    p.medium.points.clear();
    p.medium.points.push_back({0, st.medium.at(a)});
    for (const auto& q : st.medium.points)
      if (q.time_s > a && q.time_s < b) p.medium.points.push_back({q.time_s - a, q.temp_C});
    p.medium.points.push_back({b - a, st.medium.at(b)});
    // A gap part is unrecorded as a whole: a cooling-rule step completing in it counts from its end.
    p.medium_gaps_s.clear();
    if (name == gap_name) p.medium_gaps_s.push_back({0.0, b - a});
    parts.push_back(std::move(p));
  };
  double t = 0;
  for (const auto& e : events) {
    if (e.kind != DeviationKind::log_gap || e.start_s >= end) continue;
    part(t, e.start_s, st.name);
    part(e.start_s, std::min(e.end_s, end), gap_name);
    t = std::min(e.end_s, end);
  }
  if (parts.empty()) return c;  // no gap
  part(t, end, st.name);
  const bool recorded_part = std::any_of(parts.begin(), parts.end(), [&](const Stage& p) { return p.name == st.name; });
  if (!recorded_part)
    throw InputError("medium log of stage \"" + st.name + "\": no two readings are close enough to record any "
                     "of the stage (every interval is a gap); nothing in it can be credited");
  c.stages.erase(c.stages.begin() + static_cast<std::ptrdiff_t>(k));
  c.stages.insert(c.stages.begin() + static_cast<std::ptrdiff_t>(k), parts.begin(), parts.end());
  if (k < c.per_target_h.size()) {  // keep the per-stage h choices aligned with the stages
    const auto flag = c.per_target_h[k];
    c.per_target_h.insert(c.per_target_h.begin() + static_cast<std::ptrdiff_t>(k), parts.size() - 1, flag);
  }
  for (auto& t : c.targets) {
    if (!is_lethality(t.kind) || !t.stages.empty()) continue;
    for (const auto& sg : c.stages)  // "all stages" becomes every stage but the gaps
      if (sg.name != gap_name && std::find(t.stages.begin(), t.stages.end(), sg.name) == t.stages.end())
        t.stages.push_back(sg.name);
  }
  return c;
}

/// `log` cut at `end_s` (a point interpolated there when needed).
MediumProfile cut_at(const MediumProfile& log, double end_s) {
  MediumProfile c = log;
  const double at_end = log.at(end_s);
  auto& pts = c.points;
  while (!pts.empty() && pts.back().time_s > end_s) pts.pop_back();
  if (pts.empty() || pts.back().time_s < end_s) pts.push_back({end_s, at_end});
  c.description += " (cut at " + num(end_s) + " s)";
  return c;
}

}  // namespace

std::vector<DeviationEvent> find_deviations(const MediumProfile& schedule, const MediumProfile& log,
                                            const DeviationScan& scan) {
  std::vector<DeviationEvent> out;
  const DeviationKind medium_kind = scan.stage_heats ? DeviationKind::medium_colder : DeviationKind::medium_warmer;
  std::optional<DeviationEvent> run;  // the run of deviated readings in progress
  for (const auto& p : log.points) {
    const double s = schedule.at(p.time_s);
    const double dep = scan.stage_heats ? s - p.temp_C : p.temp_C - s;  // > 0: unfavourable side
    if (dep > scan.tolerance_K) {
      if (!run) {
        run = DeviationEvent{};
        run->kind = medium_kind;
        run->start_s = p.time_s;
      }
      run->end_s = p.time_s;
      if (dep > run->departure_K) {
        run->departure_K = dep;
        run->extreme_C = p.temp_C;
        run->extreme_at_s = p.time_s;
        run->scheduled_at_extreme_C = s;
      }
    } else if (run) {
      out.push_back(*run);
      run.reset();
    }
  }
  if (run) out.push_back(*run);
  for (std::size_t i = 1; i < log.points.size(); ++i) {
    const double t0 = log.points[i - 1].time_s, t1 = log.points[i].time_s;
    if (t1 - t0 > scan.max_gap_s) {
      DeviationEvent g;
      g.kind = DeviationKind::log_gap;
      g.start_s = t0;
      g.end_s = t1;
      out.push_back(g);
    }
  }
  const double log_end = log.points.back().time_s;
  if (scan.scheduled_end_s && log_end < *scan.scheduled_end_s) {
    DeviationEvent e;
    e.kind = DeviationKind::stage_shortened;
    e.start_s = log_end;
    e.end_s = *scan.scheduled_end_s;
    out.push_back(e);
  }
  std::stable_sort(out.begin(), out.end(),
                   [](const DeviationEvent& x, const DeviationEvent& y) { return x.start_s < y.start_s; });
  return out;
}

DeviationResult evaluate_deviation(const DeviationInput& in, const Libraries& libs, const DeviationOptions& o) {
  const Scenario& s = in.scheduled;
  if (!in.medium_log && in.probe_time_s.empty())
    throw InputError("deviation: give --medium-log or --probe-log (nothing to compare with the schedule)");
  DeviationResult r;
  r.scheduled = evaluate(s, libs);
  add_h_notes(r.scheduled, r.notes);
  r.assumptions.push_back({ProcessNoteKind::assumes_schedule_as_written});
  std::vector<int> considered;
  for (std::size_t i = 0; i < s.targets.size(); ++i)
    if (is_lethality(s.targets[i].kind) || s.targets[i].kind == TargetKind::centre_min_temperature ||
        s.targets[i].kind == TargetKind::cooking_table)
      considered.push_back(static_cast<int>(i));

  if (in.medium_log) {
    if (in.stage < 0 || in.stage >= static_cast<int>(s.stages.size()))
      throw InputError("--stage: the deviated stage must be one of the file's stages");
    const std::size_t k = static_cast<std::size_t>(in.stage);
    const Stage& st = s.stages[k];
    r.stage = st.name;
    r.stage_start_s = r.scheduled.history.stages[k].start_s;
    const double log_end = in.medium_log->points.back().time_s;
    if (st.end.kind == StageEndKind::duration && !(log_end > 0))
      throw InputError("medium log: a single reading cannot say how long stage \"" + st.name +
                       "\" lasted; give at least two rows");
    const double sched_len = r.scheduled.history.stages[k].end_s - r.stage_start_s;
    const bool by_duration = st.end.kind == StageEndKind::duration;
    r.stage_heats = heating_stage(s, k);
    r.scheduled_stage_s = sched_len;
    r.delivered_stage_s = by_duration ? log_end : sched_len;
    DeviationScan scan;
    scan.stage_heats = r.stage_heats;
    if (by_duration) scan.scheduled_end_s = st.end.duration_s;
    scan.tolerance_K = o.tolerance_K;
    scan.max_gap_s = o.max_gap_s;
    r.events = find_deviations(st.medium, *in.medium_log, scan);
    ProcessNote log_start = note_about(ProcessNoteKind::assumes_medium_log_starts, st.name, by_duration);
    if (by_duration) log_start.value = st.end.duration_s;
    r.assumptions.push_back(log_start);
    ProcessNote threshold = note_about(ProcessNoteKind::assumes_deviation_threshold, st.name, r.stage_heats);
    threshold.value = o.max_gap_s;
    threshold.tol_K = o.tolerance_K;
    r.assumptions.push_back(threshold);
    if (!by_duration && log_end + 1e-9 < sched_len)
      r.notes.push_back({ProcessNoteKind::medium_log_short, log_end, sched_len});
    double gap_total_s = 0;
    int gaps = 0;
    for (const auto& e : r.events)
      if (e.kind == DeviationKind::log_gap) {
        gap_total_s += e.end_s - e.start_s;
        ++gaps;
      }
    // A duration stage is split at its gaps; a condition-ended one carries them (without_gap_credit).
    if (gaps > 0) {
      ProcessNote n{ProcessNoteKind::log_gaps_not_credited, gap_total_s};
      n.count = static_cast<std::size_t>(gaps);
      r.notes.push_back(n);
    }
    r.delivered = evaluate(without_gap_credit(extended(s, k, *in.medium_log, r.delivered_stage_s, 0, 0), k, r.events), libs);

    // Extra hold at the scheduled medium temperature (from the end of the delivered stage) that
    // restores every lethality target; returns the rounded hold, its proof and one unit less.
    r.extension_medium_C = st.medium.at(by_duration ? st.end.duration_s : sched_len);
    struct Hold {
      double unrounded_s = 0, rounded_s = 0;
      Check restored;
      std::optional<Check> one_less;
    };
    const auto solve_hold = [&](const MediumProfile& log, double stage_s) -> Hold {
      const double hold_C = r.extension_medium_C;
      const auto apply = [&](double x) { return without_gap_credit(extended(s, k, log, stage_s, x, hold_C), k, r.events); };
      RootOptions ro;
      ro.expand = true;
      ro.limit = o.max_extra_s;
      ro.rel_tol = 1e-6;
      ro.abs_tol = 1e-3;
      const RootResult root =
          solve_margin([&](double x) { return evaluate(apply(x), libs, considered, search_history_options()).margin; },
                       0.0, std::max(60.0, o.unit_s), FeasibleSide::above, ro, "");
      Hold h;
      h.unrounded_s = root.x;
      double rounded = root.met_at_bound ? 0.0 : round_to_unit(root.x, o.unit_s, FeasibleSide::above);
      Check c{rounded, evaluate(apply(rounded), libs, considered)};
      for (int i = 0; i < 3 && !c.eval.considered_met; ++i) {  // a tie is not "met"
        rounded += o.unit_s;
        c = Check{rounded, evaluate(apply(rounded), libs, considered)};
      }
      h.rounded_s = rounded;
      h.restored = c;
      if (rounded > 0) {
        const double less = std::max(0.0, rounded - o.unit_s);
        h.one_less = Check{less, evaluate(apply(less), libs, considered)};
      }
      return h;
    };
    r.extension_search_s = o.max_extra_s;
    if (!by_duration) {
      r.extra_hold_none = NoHoldReason::stage_ends_by_condition;
    } else if (considered.empty()) {
      r.extra_hold_none = NoHoldReason::no_target_to_restore;
    } else {
      try {
        Hold h = solve_hold(*in.medium_log, r.delivered_stage_s);
        r.extra_hold_unrounded_s = h.unrounded_s;
        r.extra_hold_s = h.rounded_s;
        r.restored = std::move(h.restored);
        r.restored_one_unit_less = std::move(h.one_less);
      } catch (const NoSolution&) {
        r.extra_hold_none = NoHoldReason::no_extension_restores;
      }
      // A hold extension already given: what the log cut at the scheduled end would have needed.
      if (log_end > st.end.duration_s) {
        r.extension_given_s = log_end - st.end.duration_s;
        try {
          r.extension_needed_s = solve_hold(cut_at(*in.medium_log, st.end.duration_s), st.end.duration_s).rounded_s;
        } catch (const NoSolution&) {
          r.extension_needed_none = NoHoldReason::no_extension_restores;
        }
      }
    }
  }

  if (!in.probe_time_s.empty()) {
    AssessOptions ao;
    ao.max_gap_s = o.max_gap_s;  // no lethality credited across a gap in the probe log
    ao.origin = s.origin;
    ao.cooking_tables = libs.cooking;
    r.probe = assess_probe_log(in.probe_time_s, in.probe_temp_C, s.targets, *libs.organisms, *libs.rules, ao,
                               in.probe_origin);
    r.assumptions.push_back({ProcessNoteKind::assumes_probe_is_cold_spot});
  }

  // Per-target comparison: delivered from the medium-log run when there is one, else the probe.
  for (std::size_t i = 0; i < s.targets.size(); ++i) {
    DeviationTarget t;
    const TargetResult& sched = r.scheduled.assessment.targets[i];
    const TargetResult& del = r.delivered ? r.delivered->assessment.targets[i] : r.probe->targets[i];
    t.name = sched.name;
    t.kind = sched.kind;
    t.lethality = is_lethality(sched.kind);
    t.scheduled = sched;
    t.delivered = del;
    t.verdict = del.verdict;
    if (t.lethality) {
      t.scheduled_F_s = sched.F_s;
      t.delivered_F_s = del.F_s;
      t.scheduled_logs = logs_of(sched, sched.F_s);
      t.delivered_logs = logs_of(sched, del.F_s);
      if (del.kind == TargetKind::log_reduction) t.delivered_logs = del.achieved;
      if (sched.kind == TargetKind::log_reduction) t.scheduled_logs = sched.achieved;
    }
    r.targets.push_back(std::move(t));
  }
  r.all_met_delivered = r.delivered ? r.delivered->all_met : r.probe->all_met();
  if (r.delivered && r.probe && r.delivered->all_met != r.probe->all_met())
    r.notes.push_back({ProcessNoteKind::model_probe_disagree});
  return r;
}

}  // namespace coldcore::process
