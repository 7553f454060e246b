#include "coldcore/process/study.hpp"

#include <algorithm>
#include <cmath>

#include "coldcore/error.hpp"

namespace coldcore::process {

namespace {

double trace_at(const MediumTrace& m, double t) {
  if (t <= m.time_s.front()) return m.temp_C.front();
  if (t >= m.time_s.back()) return m.temp_C.back();
  const auto it = std::upper_bound(m.time_s.begin(), m.time_s.end(), t);
  const std::size_t j = static_cast<std::size_t>(it - m.time_s.begin());
  const double w = (t - m.time_s[j - 1]) / (m.time_s[j] - m.time_s[j - 1]);
  return m.temp_C[j - 1] + w * (m.temp_C[j] - m.temp_C[j - 1]);
}

/// The logged medium over [start, end], as points from the stage start. Where the schedule steps
/// at a stage boundary (step_at_start / step_at_end), the log is not interpolated across it: the
/// readings between which the step fell belong to different stages, so the stage's first (last)
/// reading inside it is held back to its start (forward to its end).
MediumProfile logged_span(const MediumTrace& m, double start_s, double end_s, bool step_at_start, bool step_at_end) {
  MediumProfile p;
  p.description = "logged medium";
  std::vector<MediumPoint> inside;
  for (std::size_t i = 0; i < m.time_s.size(); ++i) {
    const double t = m.time_s[i];
    const bool after_start = step_at_start ? t > start_s : t >= start_s;
    const bool before_end = step_at_end ? t < end_s : t <= end_s;
    if (after_start && before_end) inside.push_back({t - start_s, m.temp_C[i]});
  }
  const double span = end_s - start_s;
  const double first = step_at_start && !inside.empty() ? inside.front().temp_C : trace_at(m, start_s);
  const double last = step_at_end && !inside.empty() ? inside.back().temp_C : trace_at(m, end_s);
  p.points.push_back({0.0, first});
  for (const MediumPoint& q : inside)
    if (q.time_s > 0 && q.time_s < span) p.points.push_back(q);
  if (span > 0) p.points.push_back({span, last});
  return p;
}

/// True when the schedule's medium jumps (by more than 0.5 K) from stage i − 1's end to stage i's start.
bool scheduled_step(const std::vector<Stage>& st, std::size_t i) {
  if (i == 0 || i >= st.size()) return false;
  const Stage& before = st[i - 1];
  return std::abs(before.medium.at(before.end.duration_s) - st[i].medium.at(0)) > 0.5;
}

}  // namespace

std::vector<double> stage_starts_s(const std::vector<Stage>& stages) {
  std::vector<double> starts;
  double t = 0;
  for (const Stage& s : stages) {
    starts.push_back(t);
    t += s.end.duration_s;
  }
  return starts;
}

std::vector<Stage> study_stages(const std::vector<Stage>& scheduled, const std::optional<MediumTrace>& logged,
                                double end_s, const std::string& origin) {
  if (!(end_s > 0)) throw InputError(origin + ": the study has no reading after the process start");
  std::vector<Stage> out;
  double start = 0;
  for (std::size_t i = 0; i < scheduled.size() && start < end_s; ++i) {
    Stage s = scheduled[i];
    const bool last_kept = i + 1 == scheduled.size() ||
                           (s.end.kind == StageEndKind::duration && start + s.end.duration_s >= end_s);
    if (s.end.kind != StageEndKind::duration && !last_kept)
      throw InputError(origin + ": stage[" + std::to_string(i + 1) + "] (\"" + s.name +
                       "\") ends on a temperature: a study needs its duration (duration_*) unless it is the last stage");
    const double end = last_kept ? end_s : start + s.end.duration_s;
    s.end = StageEnd{};
    s.end.kind = StageEndKind::duration;
    s.end.duration_s = end - start;
    s.medium_gaps_s.clear();
    if (logged) s.medium = logged_span(*logged, start, end, scheduled_step(scheduled, i), scheduled_step(scheduled, i + 1));
    out.push_back(std::move(s));
    start = end;
  }
  return out;
}

}  // namespace coldcore::process
