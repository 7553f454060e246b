#include "coldcore/process/deviation.hpp"
#include "coldcore/report/temperature_text.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>

#include "coldcore/error.hpp"
#include "coldcore/lethality/kinetics.hpp"

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

/// The deviated stage with its medium replaced by `medium` and, for x > 0, extended by x at
/// `hold_C` (a 1 ms ramp from the log's value at the scheduled end, times must increase).
Scenario extended(const Scenario& base, std::size_t k, const MediumProfile& medium, double x, double hold_C) {
  Scenario c = base;
  Stage& st = c.stages[k];
  st.medium = medium;
  if (x > 0 && st.end.kind == StageEndKind::duration) {
    const double d = st.end.duration_s;
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

}  // namespace

DeviationEvent find_deviation(const MediumProfile& schedule, const MediumProfile& log, double tolerance_K) {
  DeviationEvent e;
  e.lowest_C = 1e300;
  for (const auto& p : log.points) {
    const double s = schedule.at(p.time_s);
    const double drop = s - p.temp_C;
    if (p.temp_C < e.lowest_C) {
      e.lowest_C = p.temp_C;
      e.lowest_at_s = p.time_s;
      e.scheduled_at_lowest_C = s;
    }
    e.largest_drop_K = std::max(e.largest_drop_K, drop);
    if (drop > tolerance_K) {
      if (!e.found) e.start_s = p.time_s;
      e.found = true;
      e.end_s = p.time_s;
    }
  }
  return e;
}

DeviationResult evaluate_deviation(const DeviationInput& in, const Libraries& libs, const DeviationOptions& o) {
  const Scenario& s = in.scheduled;
  if (!in.medium_log && in.probe_time_s.empty())
    throw InputError("deviation: give --medium-log or --probe-log (nothing to compare with the schedule)");
  DeviationResult r;
  r.scheduled = evaluate(s, libs);
  add_h_notes(r.scheduled, r.notes);
  r.assumptions.push_back("the scheduled process is the product file as written; the delivered one differs only "
                          "where the logs say so");
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
    r.event = find_deviation(st.medium, *in.medium_log, o.tolerance_K);
    const double log_end = in.medium_log->points.back().time_s;
    const double sched_len = r.scheduled.history.stages[k].end_s - r.stage_start_s;
    r.assumptions.push_back("the medium log's first row is the start of stage \"" + st.name +
                            "\"; the stage keeps its scheduled end (" +
                            (st.end.kind == StageEndKind::duration ? "duration " + num(st.end.duration_s) + " s"
                                                                   : std::string("its temperature condition")) +
                            ") and h; other stages as scheduled");
    r.assumptions.push_back("the medium is linear between logged readings; a reading is deviated when it is more than " +
                            num(o.tolerance_K) + " K below the schedule at that time");
    if (log_end + 1e-9 < sched_len)
      r.notes.push_back("the medium log covers " + num(log_end) + " s of the stage's " + num(sched_len) +
                        " s; its last reading is held to the end");
    if (st.end.kind == StageEndKind::duration && log_end > st.end.duration_s + 1e-9)
      r.notes.push_back("the medium log runs " + num(log_end - st.end.duration_s) +
                        " s past the stage's scheduled end; readings after it are not used");
    r.delivered = evaluate(extended(s, k, *in.medium_log, 0, 0), libs);

    // Extra hold at the scheduled medium temperature that restores every lethality target.
    r.extension_medium_C = st.medium.at(sched_len);
    if (st.end.kind != StageEndKind::duration) {
      r.extra_hold_note = "stage \"" + st.name + "\" ends by a temperature condition, not a duration; no extension "
                          "is computed";
    } else if (considered.empty()) {
      r.extra_hold_note = "no lethality or minimum-temperature target to restore";
    } else {
      const double hold_C = r.extension_medium_C;
      const auto apply = [&](double x) { return extended(s, k, *in.medium_log, x, hold_C); };
      RootOptions ro;
      ro.expand = true;
      ro.limit = o.max_extra_s;
      ro.rel_tol = 1e-6;
      ro.abs_tol = 1e-3;
      try {
        const RootResult root = solve_margin([&](double x) { return evaluate(apply(x), libs, considered, search_history_options()).margin; }, 0.0,
                                             std::max(60.0, o.unit_s), FeasibleSide::above, ro, "");
        r.extra_hold_unrounded_s = root.x;
        double rounded = root.met_at_bound ? 0.0 : round_to_unit(root.x, o.unit_s, FeasibleSide::above);
        Check c{rounded, evaluate(apply(rounded), libs, considered)};
        for (int i = 0; i < 3 && !c.eval.considered_met; ++i) {  // a tie is not "met"
          rounded += o.unit_s;
          c = Check{rounded, evaluate(apply(rounded), libs, considered)};
        }
        r.extra_hold_s = rounded;
        r.restored = c;
        if (rounded > 0) {
          const double less = std::max(0.0, rounded - o.unit_s);
          r.restored_one_unit_less = Check{less, evaluate(apply(less), libs, considered)};
        }
      } catch (const NoSolution&) {
        r.extra_hold_note = "no extension of stage \"" + st.name + "\" at " + temp_token(hold_C, 5) + " up to " +
                            num(o.max_extra_s / 3600.0) + " h restores every lethality target";
      }
    }
  }

  if (!in.probe_time_s.empty()) {
    AssessOptions ao;
    ao.origin = s.origin;
    ao.cooking_tables = libs.cooking;
    r.probe = assess_probe_log(in.probe_time_s, in.probe_temp_C, s.targets, *libs.organisms, *libs.rules, ao,
                               in.probe_origin);
    r.assumptions.push_back("the probe log is the cold-spot temperature, time 0 at the start of the first stage; "
                            "lethality from it uses the smallest of three integration rules");
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
    r.notes.push_back("the model with the logged medium and the measured probe log disagree on whether every target "
                      "is met; the probe is a measurement at one point, the model assumes the cold spot");
  return r;
}

}  // namespace coldcore::process
