// The h scenarios of a run whose targets were split (process/h_ends.hpp), as report views: the
// histories evaluate made, sampled, each with its own targets' F columns, lines and boxes.
#include <algorithm>
#include <cmath>
#include <cstdio>

#include "coldcore/error.hpp"
#include "coldcore/report/run_builder.hpp"

namespace coldcore {

namespace {

std::vector<double> sample_times(const History& h, double step_s) {
  std::vector<double> t;
  for (double x = 0; x < h.end_s(); x += step_s) t.push_back(x);
  for (const auto& s : h.stages) t.push_back(s.end_s);
  std::sort(t.begin(), t.end());
  t.erase(std::unique(t.begin(), t.end()), t.end());
  return t;
}

std::string h_number(double h_W_m2K) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", h_W_m2K);
  return buf;
}

std::string choice_text(const History& h, const process::HChoice& c) {
  const std::string stage = c.stage < h.stages.size() ? h.stages[c.stage].name : "stage " + std::to_string(c.stage + 1);
  return "\"" + stage + "\" h " + h_number(c.h_W_m2K) + " W/m²K (" + (c.end == process::HEnd::low ? "low" : "high") +
         " end)";
}

std::string ended_by_words(StageEndedBy e) {
  switch (e) {
    case StageEndedBy::duration: return "duration";
    case StageEndedBy::condition: return "condition met";
    case StageEndedBy::cap: return "CAP REACHED";
  }
  return "?";
}

}  // namespace

void add_scenarios(RunReport& report, const process::Evaluation& e, const Product* p,
                   const std::vector<Target>& targets, double step_s) {
  if (e.h_scenarios.size() < 2) return;
  if (!(step_s > 0) || !std::isfinite(step_s)) throw InputError("--step-s = " + fixed(step_s, 3) + ": must be > 0");
  for (std::size_t si = 0; si < e.h_scenarios.size(); ++si) {
    const process::HScenarioRun& run = e.h_scenarios[si];
    const History& h = run.history;
    ScenarioView v;
    v.number = static_cast<int>(si) + 1;
    std::string choices;
    for (const auto& c : run.choices) choices += (choices.empty() ? "" : "; ") + choice_text(h, c);
    v.label = "scenario " + std::to_string(v.number) + ": " + choices;
    for (const StageRecord& rec : h.stages) {
      StageRow row;
      row.name = rec.name;
      row.start_s = rec.start_s;
      row.end_s = rec.end_s;
      row.ended_by = ended_by_words(rec.ended_by);
      row.h_W_m2K = rec.h_W_m2K;
      row.h_infinite = std::isinf(rec.biot);
      row.biot = row.h_infinite || !p ? rec.biot : biot_volume_to_area(*p, rec.h_W_m2K);  // one Bi: V/A
      row.centre_C = rec.at_end.centre_C;
      row.surface_C = rec.at_end.surface_C;
      row.mean_C = rec.at_end.mean_C;
      v.stages.push_back(row);
    }
    const std::vector<double> times = sample_times(h, step_s);
    v.history.columns = {{"time_s", false}, {"medium_C", true}, {"centre_C", true}, {"surface_C", true}, {"mean_C", true}};
    if (h.evaluate)
      for (double t : times) {
        const HistorySample s = h.evaluate(t);
        v.history.rows.push_back({t, s.medium_C, s.centre_C, s.surface_C, s.mean_C});
      }
    for (int ti : run.targets) {
      const auto i = static_cast<std::size_t>(ti);
      const TargetResult& t = e.assessment.targets.at(i);
      v.targets.push_back(t.name);
      if (i < report.verdicts.size()) {
        report.verdicts[i].scenario = v.label;
        report.verdicts[i].details.insert(report.verdicts[i].details.begin(), "verdict from " + v.label);
      }
      if (t.kinetics && !t.column.empty() && !v.history.rows.empty()) {
        const std::vector<double> f = cumulative_f_s(h, t, times);
        v.history.columns.push_back({t.column, false});
        for (std::size_t k = 0; k < v.history.rows.size(); ++k) v.history.rows[k].push_back(f[k] / 60.0);
        v.target_lines.push_back({t.column, t.F_required_s / 60.0,
                                  "required " + t.name + " " + minutes_up(t.F_required_s)});
      }
      if (t.cooling) {
        int n = 0;
        for (const auto& st : t.cooling->steps) {
          ++n;
          if (!st.start_s) continue;
          v.rule_boxes.push_back({"step " + std::to_string(n) + " (" + duration_text(st.step.within_s) + ")",
                                  *st.start_s, *st.start_s + st.step.within_s, st.step.from_C, st.step.to_C,
                                  st.step.from_text + " → " + st.step.to_text});
        }
      }
      if (i < targets.size() && targets[i].kind == TargetKind::centre_min_temperature)
        v.target_lines.push_back({targets[i].at == "mean" ? "mean_C" : "centre_C", targets[i].min_temp_C, ""});
    }
    // Scenario 1's history is the one the report's own rows sample: keep the lumped comparison
    // ("Reading this report" describes it), last, as in the report's history.
    const auto& cols = report.history.columns;
    const auto lumped = std::find_if(cols.begin(), cols.end(), [](const Column& c) { return c.name == "lumped_centre_C"; });
    if (si == 0 && lumped != cols.end() && report.history.rows.size() == v.history.rows.size()) {
      const auto li = static_cast<std::size_t>(lumped - cols.begin());
      v.history.columns.push_back(*lumped);
      for (std::size_t k = 0; k < v.history.rows.size(); ++k)
        v.history.rows[k].push_back(li < report.history.rows[k].size() ? report.history.rows[k][li] : std::nan(""));
    }
    report.scenarios.push_back(std::move(v));
  }
}

}  // namespace coldcore
