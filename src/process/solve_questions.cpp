// The inverse questions: set up the parameter, bracket, solve, round, verify. The time questions
// are here; the size and medium questions in solve_size_medium.cpp.
#include <algorithm>
#include <cmath>
#include <functional>
#include <sstream>

#include "coldcore/error.hpp"
#include "coldcore/model/temperature_token.hpp"
#include "coldcore/lethality/kinetics.hpp"
#include "coldcore/process/inverse.hpp"

#include "process/detail/inverse_text.hpp"
#include "process/detail/question_setup.hpp"

namespace coldcore::process {

namespace {

using detail::num;
using detail::is_lethality;
using detail::Setup;

/// Which targets' verdicts at a bound explain a NoSolution, in words.
std::string shortfalls(const Evaluation& e, const std::vector<int>& considered) {
  std::string out;
  for (std::size_t i = 0; i < e.assessment.targets.size(); ++i) {
    if (!considered.empty() && std::find(considered.begin(), considered.end(), static_cast<int>(i)) == considered.end())
      continue;
    const auto& r = e.assessment.targets[i];
    if (r.verdict == Verdict::met) continue;
    out += (out.empty() ? "" : "; ") + r.name + " " + r.verdict_text;
  }
  return out;
}

/// Plain-words physical reason a stage cannot deliver a target however long it lasts.
std::string physical_reason(const Scenario& s, const Evaluation& at_bound, int stage, const std::vector<int>& considered) {
  std::string why;
  const double tmax = s.stages[static_cast<std::size_t>(stage)].medium.highest_C();
  for (int i : considered) {
    const Target& t = s.targets[static_cast<std::size_t>(i)];
    const TargetResult& r = at_bound.assessment.targets[static_cast<std::size_t>(i)];
    if (r.verdict == Verdict::met) continue;
    if (t.kind == TargetKind::centre_min_temperature && tmax <= t.min_temp_C)
      why += "; the stage's medium (at most " + temp_token(tmax, 4) + ") is not above " + r.name + "'s " +
             temp_token(t.min_temp_C, 4) + ", so the " + t.at + " can never reach it";
    if (is_lethality(t.kind) && r.kinetics) {
      const double rate = lethal_rate(tmax, *r.kinetics);
      why += "; at the stage's highest medium temperature, " + temp_token(tmax, 4) + ", " + r.name + " accrues at most " +
             num(rate * 60.0, 3) + " min of F per hour against " + num(r.F_required_s / 60.0, 4) + " min required";
    }
  }
  return why;
}

Check check_at(const Setup& st, const Libraries& libs, double x) {
  Check c;
  c.value = x;
  c.eval = evaluate(st.apply(x), libs, st.considered);
  return c;
}

/// Rounds toward the safe side, verifies, and re-runs one unit on the unsafe side.
void round_and_verify(SolveResult& res, const Setup& st, const Libraries& libs) {
  const double sign = st.side == FeasibleSide::above ? 1.0 : -1.0;
  res.unit_step = st.unit;
  res.rounded = round_to_unit(res.answer, st.unit, st.side);
  res.verification = check_at(st, libs, res.rounded);
  // A root within binary noise of a multiple rounds onto it; a tie is not "met", so step once.
  for (int k = 0; k < 3 && !res.verification.eval.considered_met; ++k) {
    res.rounded += sign * st.unit;
    res.notes.push_back({ProcessNoteKind::rounded_again, res.rounded - sign * st.unit});
    res.verification = check_at(st, libs, res.rounded);
  }
  if (!res.verification.eval.considered_met)
    throw NotConverged(std::string(to_string(res.question)) + ": the rounded answer " + num(res.rounded) +
                       " does not meet every target on re-run (margin " + num(res.verification.eval.margin) +
                       "); the margin is not monotone in the parameter");
  const double less = res.rounded - sign * st.unit;
  if (less >= st.domain_lo && less <= st.domain_hi) {
    res.one_unit_less = check_at(st, libs, less);
    if (res.one_unit_less->eval.considered_met)
      res.notes.push_back({ProcessNoteKind::one_unit_less_meets, less});
  } else {
    res.notes.push_back({ProcessNoteKind::one_unit_less_outside, less});
  }
}

}  // namespace

std::string parameter_text(Question q, double x) {
  switch (q) {
    case Question::hold_time:
    case Question::chill_time: return num(x).append(" s");  // (append: GCC 12's false -Wrestrict on +)
    case Question::max_size: return num(x * 1000).append(" mm");
    case Question::min_medium: return temp_token(x);
  }
  return num(x);
}

namespace detail {

SolveResult run_question(Question q, const Setup& st, const Scenario& s, const Libraries& libs) {
  SolveResult res;
  res.question = q;
  for (int i : st.considered) res.considered.push_back(s.targets[static_cast<std::size_t>(i)].name);
  const auto margin = [&](double x) {
    return evaluate(st.apply(x), libs, st.considered, search_history_options()).margin;
  };
  try {
    res.root = solve_margin(margin, st.lo, st.hi, st.side, st.ro, st.why_none);
  } catch (const NoSolution&) {
    // Say why: the verdicts at the bound and, where it applies, the physical limit.
    const double bound = st.ro.expand ? st.ro.limit : (st.side == FeasibleSide::above ? st.hi : st.lo);
    const Evaluation e = evaluate(st.apply(bound), libs, st.considered, search_history_options());
    std::string why = st.why_none + ": at the bound " + parameter_text(q, bound) + ", " + shortfalls(e, st.considered);
    if (st.stage >= 0) why += physical_reason(s, e, st.stage, st.considered);
    throw NoSolution(why);
  }
  res.answer = res.root.x;
  if (res.root.met_at_bound)
    res.notes.push_back({ProcessNoteKind::met_at_bound, res.root.x});
  round_and_verify(res, st, libs);
  return res;
}

std::vector<int> all_targets(const Scenario& s) {
  std::vector<int> v;
  for (std::size_t i = 0; i < s.targets.size(); ++i) v.push_back(static_cast<int>(i));
  if (v.empty()) throw InputError(s.origin + ": target: missing: the question needs at least one [[target]]");
  return v;
}

}  // namespace detail

namespace {

using detail::all_targets;
using detail::run_question;

double stage_duration_s(const Scenario& s, int idx) {
  const Stage& st = s.stages[static_cast<std::size_t>(idx)];
  if (st.end.kind == StageEndKind::duration) return st.end.duration_s;
  const History h = simulate(s.product, s.stages, search_history_options());
  const auto& rec = h.stages[static_cast<std::size_t>(idx)];
  return rec.end_s - rec.start_s;
}

SolveResult hold_time(const Scenario& s, const Libraries& libs, const SolveOptions& o) {
  Setup st;
  st.stage = o.stage.empty() ? default_stage(s, true) : stage_index(s, o.stage, "--stage");
  for (std::size_t i = 0; i < s.targets.size(); ++i)
    if (is_lethality(s.targets[i].kind) || s.targets[i].kind == TargetKind::centre_min_temperature ||
        s.targets[i].kind == TargetKind::cooking_table)
      st.considered.push_back(static_cast<int>(i));
  if (st.considered.empty())
    throw InputError(s.origin + ": target: missing: hold-time needs a log-reduction, F-value or "
                     "centre-min-temperature target");
  const std::size_t k = static_cast<std::size_t>(st.stage);
  const double nominal = stage_duration_s(s, st.stage);
  st.apply = [s, k](double x) {
    Scenario c = s;
    c.stages[k].end = StageEnd{};
    c.stages[k].end.kind = StageEndKind::duration;
    c.stages[k].end.duration_s = std::max(0.0, x);
    return c;
  };
  st.side = FeasibleSide::above;
  // 1 s, not 0: a stage of zero length is not a process the engine and the checks accept.
  st.lo = 1.0;
  st.hi = std::clamp(nominal, 60.0, o.max_hold_s);
  st.ro.expand = true;
  st.ro.limit = o.max_hold_s;
  st.ro.rel_tol = o.rel_tol;
  st.ro.abs_tol = 1e-3;
  st.unit = o.unit_s;
  st.domain_lo = 0;
  st.why_none = "no hold time of stage \"" + s.stages[k].name + "\" up to " + num(o.max_hold_s / 3600.0) +
                " h meets every lethality target";
  SolveResult r = run_question(Question::hold_time, st, s, libs);
  r.stage = s.stages[k].name;
  r.quantity = "duration";
  r.unit = std::string(1, 's');  // (a one-character literal trips GCC 12's false -Wrestrict here)
  r.nominal = nominal;
  if (s.stages[k].end.kind != StageEndKind::duration)
    r.assumptions.push_back(note_about(ProcessNoteKind::assumes_fixed_duration, r.stage));
  r.assumptions.push_back({ProcessNoteKind::assumes_hold_time_targets});
  return r;
}

SolveResult chill_time(const Scenario& s, const Libraries& libs, const SolveOptions& o) {
  const int idx = o.stage.empty() ? default_stage(s, false) : stage_index(s, o.stage, "--stage");
  const std::size_t k = static_cast<std::size_t>(idx);
  const Stage& stg = s.stages[k];
  double end_C = 0;
  bool mean = o.mean;
  if (o.end_C) {
    end_C = *o.end_C;
  } else if (stg.end.kind != StageEndKind::duration) {
    end_C = stg.end.target_C;
    mean = mean || stg.end.kind == StageEndKind::until_mean;
  } else {
    throw InputError("--end-C: missing: stage \"" + stg.name + "\" ends by duration; give the end temperature");
  }
  const double nominal = stage_duration_s(s, idx);
  // One long run of the chill stage: its exact evaluation gives the temperature at any duration.
  // Slower cooling is the conservative side of an end temperature: every h range at its low end.
  Scenario longrun = apply_h_choices(s, h_choices_for(s, -1));
  longrun.stages[k].end = StageEnd{};
  longrun.stages[k].end.duration_s = o.max_hold_s;
  longrun.stages.resize(k + 1);
  const History h = simulate(longrun.product, longrun.stages);
  const double t0 = h.stages[k].start_s;
  const auto where = [&](double t) {
    const HistorySample smp = h.evaluate(t0 + t);
    return mean ? smp.mean_C : smp.centre_C;
  };
  Setup st;
  st.stage = idx;
  st.apply = [s, k](double x) {
    Scenario c = s;
    c.stages[k].end = StageEnd{};
    c.stages[k].end.duration_s = std::max(0.0, x);
    return c;
  };
  st.considered = all_targets(s);
  st.unit = o.unit_s;
  st.domain_lo = 0;
  RootOptions ro;
  ro.expand = true;
  ro.limit = o.max_hold_s;
  ro.rel_tol = o.rel_tol;
  ro.abs_tol = 1e-3;
  SolveResult res;
  res.question = Question::chill_time;
  res.stage = stg.name;
  res.quantity = "duration";
  res.unit = "s";
  res.nominal = nominal;
  const std::string point = mean ? "mass average" : "centre";
  try {
    res.root = solve_margin([&](double t) { return end_C - where(t); }, 0.0, std::clamp(nominal, 60.0, o.max_hold_s),
                            FeasibleSide::above, ro, "");
  } catch (const NoSolution&) {
    const double final_C = where(o.max_hold_s);
    std::string why = "the " + point + " does not fall to " + temp_token(end_C, 4) + " within " +
                      num(o.max_hold_s / 3600.0) + " h of stage \"" + stg.name + "\" (it is at " +
                      temp_token(final_C, 4) + " then)";
    const double medium_min = stg.medium.lowest_C();
    if (medium_min >= end_C)
      why += "; the medium (at least " + temp_token(medium_min, 4) + ") is not below the end temperature, so it never can";
    throw NoSolution(why);
  }
  res.answer = res.root.x;
  res.unit_step = o.unit_s;
  // "Reached" needs the end temperature beaten by more than the long run's temperature accuracy
  // (HistoryOptions::tol_K; issue 11: never "met" inside the error bound). The answer and both
  // re-runs apply this one condition: a re-run's considered_met IS the end condition, and its
  // margin is end_C − the temperature at the end (K).
  const double tol_K = HistoryOptions{}.tol_K;
  const auto reached = [&](double t) { return end_C - where(t) > tol_K; };
  res.rounded = round_to_unit(res.answer, o.unit_s, FeasibleSide::above);
  for (int i = 0; i < 3 && !reached(res.rounded); ++i) res.rounded += o.unit_s;  // a tie is not "reached"
  const auto end_check = [&](double x) {
    Check c = check_at(st, libs, x);
    c.eval.margin = end_C - where(x);
    c.eval.considered_met = reached(x);
    return c;
  };
  res.verification = end_check(res.rounded);
  if (res.rounded - o.unit_s >= 0) res.one_unit_less = end_check(res.rounded - o.unit_s);
  res.end_C = end_C;
  res.end_tol_K = tol_K;
  res.end_point = point;
  res.end_at_rounded_C = where(res.rounded);
  res.end_reached_at_rounded = reached(res.rounded);
  if (res.one_unit_less) {
    res.end_at_less_C = where(res.rounded - o.unit_s);
    res.end_reached_at_less = reached(res.rounded - o.unit_s);
  }
  ProcessNote end_note{ProcessNoteKind::chill_end_reached, res.answer};
  end_note.temp_C = end_C;
  end_note.other_C = where(res.rounded);
  end_note.subject = point;
  res.notes.push_back(end_note);
  if (res.one_unit_less) {
    ProcessNote less{ProcessNoteKind::chill_one_unit_less, res.rounded - o.unit_s};
    less.temp_C = end_C;
    less.other_C = where(res.rounded - o.unit_s);
    less.reached = *res.end_reached_at_less;
    less.tol_K = tol_K;
    less.subject = point;
    res.notes.push_back(less);
  }
  res.assumptions.push_back({ProcessNoteKind::assumes_chill_end});
  return res;
}

}  // namespace

SolveResult solve(Question q, const Scenario& s, const Libraries& libs, const SolveOptions& o) {
  if (!(o.unit_s > 0) || !(o.unit_m > 0) || !(o.unit_C > 0))
    throw InputError("--round: must be > 0");
  SolveResult r;
  switch (q) {
    case Question::hold_time: r = hold_time(s, libs, o); break;
    case Question::chill_time: r = chill_time(s, libs, o); break;
    case Question::max_size: r = detail::max_size(s, libs, o); break;
    case Question::min_medium: r = detail::min_medium(s, libs, o); break;
    default: throw InputError("--for: unknown question");
  }
  add_h_notes(r.verification.eval, r.notes);
  if (q == Question::chill_time && !s.per_target_h.empty())
    r.notes.push_back({ProcessNoteKind::chill_h_low_end});
  return r;
}

}  // namespace coldcore::process
