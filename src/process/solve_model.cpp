// The forward model of the inverse questions: simulate + assess, reduced to one margin.
#include <algorithm>
#include <cmath>
#include <limits>

#include "coldcore/error.hpp"
#include "coldcore/process/inverse.hpp"

namespace coldcore::process {

namespace {

bool is_lethality(TargetKind k) { return k == TargetKind::log_reduction || k == TargetKind::f_value; }

}  // namespace

double target_margin(const TargetResult& r) {
  double m = 0;
  if (is_lethality(r.kind) && r.F_required_s > 0) {
    // F/F_required − 1 is monotone in F for log-linear and Weibull targets alike, and finite at F = 0.
    m = r.F_s / r.F_required_s - 1.0;
    // Less the margin's error bound (issue 11), relative: exact for F and log-linear targets,
    // first order for Weibull; it keeps the margin continuous where the verdict turns "met".
    if (r.required > 0) m -= r.margin_uncertainty / r.required;
  } else if (r.required > 0) {
    m = (r.margin - r.margin_uncertainty) / r.required;
  } else {
    m = r.margin - r.margin_uncertainty;
  }
  // The sign must agree with the verdict: the root finder's "feasible" is the report's "met".
  constexpr double kTiny = 1e-12;
  const bool met = r.verdict == Verdict::met;
  if (met && !(m > 0)) m = kTiny;
  if (!met && !(m < 0)) m = -kTiny;
  return m;
}

namespace {

HUse h_use(const Scenario& s, const HChoice& c, const std::vector<int>& targets) {
  HUse u{c};
  u.every_target = targets.size() == s.targets.size();
  if (!u.every_target)
    for (int i : targets) u.targets.push_back(s.targets[static_cast<std::size_t>(i)].name);
  return u;
}

// Stage::medium_gaps_s on the history's clock, cut to each stage as it ran (issue 11: what was
// not recorded is not credited).
std::vector<std::array<double, 2>> unrecorded_on(const History& h, const std::vector<Stage>& stages) {
  std::vector<std::array<double, 2>> out;
  for (std::size_t i = 0; i < h.stages.size() && i < stages.size(); ++i)
    for (const auto& [a, b] : stages[i].medium_gaps_s) {
      const double from = h.stages[i].start_s + a, to = std::min(h.stages[i].start_s + b, h.stages[i].end_s);
      if (to > from) out.push_back({from, to});
    }
  return out;
}

template <class T>
void push_unique(std::vector<T>& v, const T& x) {
  if (std::find(v.begin(), v.end(), x) == v.end()) v.push_back(x);
}

}  // namespace

Evaluation evaluate(const Scenario& s, const Libraries& libs, const std::vector<int>& considered,
                    const HistoryOptions& hopts) {
  if (libs.organisms == nullptr || libs.rules == nullptr)
    throw InputError("evaluate: organism and rule libraries are required");
  Evaluation e;
  AssessOptions ao;
  ao.origin = s.origin;
  ao.cooking_tables = libs.cooking;
  const std::vector<TargetGroup> groups = group_targets_by_h(s);
  for (const auto& g : groups)
    for (const auto& c : g.choices) e.h_uses.push_back(h_use(s, c, g.targets));
  if (groups.size() == 1) {
    if (groups[0].choices.empty()) {
      e.history = simulate(s.product, s.stages, hopts);
    } else {
      const Scenario one = apply_h_choices(s, groups[0].choices);
      e.history = simulate(one.product, one.stages, hopts);
    }
    ao.unrecorded_s = unrecorded_on(e.history, s.stages);
    e.assessment = assess(e.history, s.targets, *libs.organisms, *libs.rules, ao);
  } else {
    // Each target from the scenario conservative for it; every scenario assesses every target so
    // that input errors name the same target[i] whichever scenario meets them first.
    e.target_scenario.assign(s.targets.size(), 0);
    e.assessment.targets.resize(s.targets.size());
    for (std::size_t gi = 0; gi < groups.size(); ++gi) {
      const Scenario one = apply_h_choices(s, groups[gi].choices);
      HScenarioRun run{groups[gi].targets, groups[gi].choices, simulate(one.product, one.stages, hopts)};
      ao.unrecorded_s = unrecorded_on(run.history, s.stages);
      Assessment a = assess(run.history, s.targets, *libs.organisms, *libs.rules, ao);
      for (int t : groups[gi].targets) {
        const auto ti = static_cast<std::size_t>(t);
        e.assessment.targets[ti] = std::move(a.targets[ti]);
        e.target_scenario[ti] = static_cast<int>(gi);
      }
      for (const auto& w : a.warnings) push_unique(e.assessment.warnings, w);
      e.h_scenarios.push_back(std::move(run));
    }
    e.history = e.h_scenarios.front().history;
  }
  for (const auto& g : groups)
    for (int t : g.targets)
      for (const auto& c : g.choices)
      {
        TargetNote n{TargetNoteKind::h_used};
        n.h_choice = c;
        e.assessment.targets[static_cast<std::size_t>(t)].notes.push_back(std::move(n));
      }
  e.all_met = e.assessment.all_met();
  double m = std::numeric_limits<double>::infinity();
  const auto& t = e.assessment.targets;
  if (considered.empty()) {
    for (const auto& r : t) m = std::min(m, target_margin(r));
  } else {
    for (int i : considered) m = std::min(m, target_margin(t.at(static_cast<std::size_t>(i))));
  }
  if (t.empty()) m = -1;  // nothing to meet is not "met"
  e.margin = m;
  e.considered_met = m > 0;
  return e;
}

void add_h_notes(const Evaluation& e, std::vector<ProcessNote>& notes) {
  if (e.h_scenarios.size() > 1) {
    ProcessNote n{ProcessNoteKind::h_scenarios};
    n.count = e.h_scenarios.size();
    push_unique(notes, n);
  }
  for (const auto& h : e.h_uses) {
    ProcessNote n{ProcessNoteKind::h_per_target};
    n.h_use = h;
    push_unique(notes, n);
  }
}

HistoryOptions search_history_options() {
  HistoryOptions o;
  o.tol_K = 1e-3;
  o.sample_tol_K = 0.05;
  return o;
}

int default_stage(const Scenario& s, bool heating) {
  const History h = simulate(s.product, s.stages, search_history_options());
  int found = -1;
  for (std::size_t i = 0; i < h.stages.size(); ++i) {
    const auto& rec = h.stages[i];
    const double centre_start = h.evaluate(rec.start_s).centre_C;
    const double medium_end = rec.at_end.medium_C;
    if (heating ? medium_end > centre_start : medium_end < centre_start) found = static_cast<int>(i);
  }
  if (found < 0)
    throw NoSolution(std::string("no ") + (heating ? "heating" : "cooling") +
                     " stage (medium " + (heating ? "above" : "below") +
                     " the centre) in the process; name one with --stage");
  return found;
}

int stage_index(const Scenario& s, const std::string& name, const std::string& place) {
  std::string names;
  for (std::size_t i = 0; i < s.stages.size(); ++i) {
    if (s.stages[i].name == name) return static_cast<int>(i);
    if (i > 0) names += ", ";
    names += "\"";
    names += s.stages[i].name;
    names += "\"";
  }
  throw InputError(place + " = \"" + name + "\": no such stage; stages are " + names);
}

const char* to_string(Question q) {
  switch (q) {
    case Question::hold_time: return "hold-time";
    case Question::chill_time: return "chill-time";
    case Question::max_size: return "max-size";
    case Question::min_medium: return "min-medium";
  }
  return "?";
}

}  // namespace coldcore::process
