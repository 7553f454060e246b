// Plots of scheduled against delivered. Selection and unit conversion only: every curve is a
// column of the sampled re-run reports or the probe log as read.
#include "deviation_figures.hpp"

#include <algorithm>
#include <optional>

namespace coldcore::detail {

namespace {

using svg::Dash;
namespace oi = svg::okabe_ito;

struct Run {
  const RunReport* report;
  const char* which;  // "scheduled" | "delivered"
  Dash dash;
};

std::vector<double> scaled_time(const RunReport& r, const TimeScale& ts) {
  std::vector<double> t;
  if (auto i = column_index(r.history, "time_s")) t = column_values(r.history, *i, false, TempUnit::C);
  for (double& x : t) x /= ts.seconds_per_unit;
  return t;
}

void add_curve(svg::LinePlot& p, const RunReport& r, const TimeScale& ts, const char* column, std::string name,
               const char* colour, Dash dash, double width, TempUnit u, bool temperature) {
  const auto i = column_index(r.history, column);
  if (!i || r.history.rows.empty()) return;
  svg::Series s;
  s.name = std::move(name);
  s.x = scaled_time(r, ts);
  s.y = column_values(r.history, *i, temperature, u);
  s.colour = colour;
  s.dash = dash;
  s.width_px = width;
  s.css_class = std::string("series-") + column;
  p.series.push_back(std::move(s));
}

// The figures of one scheduled and one delivered run (either may be absent).
std::vector<RunFigure> figures_of(const process::DeviationResult& r, const DeviationRecordInfo& i, TempUnit u,
                                  const RunReport* sched, const RunReport* deliv) {
  std::vector<RunFigure> out;
  const bool probe = !i.probe_time_s.empty() && i.probe_time_s.size() == i.probe_temp_C.size();
  if (!sched && !deliv && !probe) return out;
  double end_s = 0;
  for (const RunReport* rep : {sched, deliv})
    if (rep) end_s = std::max(end_s, report_end_s(*rep));
  if (probe) end_s = std::max(end_s, i.probe_time_s.back());
  const TimeScale ts = time_scale_for(end_s);
  const RunReport* stages_from = sched ? sched : deliv;

  const auto add_marks = [&](svg::LinePlot& p) {
    if (stages_from)
      for (const auto& s : stages_from->stages) p.vlines.push_back({s.start_s / ts.seconds_per_unit, s.name});
    if (!r.stage.empty())
      for (const auto& e : r.events) {
        const bool gap = e.kind == process::DeviationKind::log_gap;
        const bool shortened = e.kind == process::DeviationKind::stage_shortened;
        p.vlines.push_back({(r.stage_start_s + e.start_s) / ts.seconds_per_unit,
                            gap ? "gap start" : shortened ? "delivered stage end" : "deviation start"});
        if (!shortened)
          p.vlines.push_back({(r.stage_start_s + e.end_s) / ts.seconds_per_unit, gap ? "gap end" : "deviation end"});
      }
  };

  {
    RunFigure f;
    f.key = "temperature";
    f.plot.id = "plot-temperature";
    f.plot.title = "Scheduled against delivered temperatures";
    f.plot.x.label = ts.label;
    f.plot.x.min = 0;
    f.plot.y.label = "temperature (" + std::string(unit_symbol(u)) + ")";
    if (sched) {
      add_curve(f.plot, *sched, ts, "medium_C", "medium, scheduled", oi::sky_blue, Dash::long_dash, 1.6, u, true);
      add_curve(f.plot, *sched, ts, "centre_C", "centre, scheduled", oi::blue, Dash::dashed, 2.0, u, true);
    }
    if (deliv) {
      add_curve(f.plot, *deliv, ts, "medium_C", "medium, logged (delivered)", oi::orange, Dash::dash_dot, 1.6, u, true);
      add_curve(f.plot, *deliv, ts, "centre_C", "centre, delivered (model)", oi::vermillion, Dash::solid, 2.4, u, true);
    }
    if (probe) {
      svg::Series s;
      s.name = "centre, measured probe log";
      for (size_t k = 0; k < i.probe_time_s.size(); ++k) {
        s.x.push_back(i.probe_time_s[k] / ts.seconds_per_unit);
        s.y.push_back(display_temp(i.probe_temp_C[k], u));
      }
      s.colour = oi::black;
      s.dash = Dash::dotted;
      s.width_px = 2.0;
      s.css_class = "series-probe";
      f.plot.series.push_back(std::move(s));
    }
    add_marks(f.plot);
    f.caption = "Medium and centre temperature as scheduled (dashed) and as delivered; vertical lines mark where each "
                "scheduled stage starts and, when the log fell below the schedule, the deviation's start and end.";
    if (!f.plot.series.empty()) out.push_back(std::move(f));
  }

  if (sched || deliv) {
    RunFigure f;
    f.key = "lethality";
    f.plot.id = "plot-lethality";
    f.plot.title = "Cumulative lethality at the centre, scheduled against delivered";
    f.plot.x.label = ts.label;
    f.plot.x.min = 0;
    f.plot.y.label = "F-value (min)";
    f.plot.y.min = 0;
    constexpr const char* kColours[] = {oi::blue, oi::vermillion, oi::bluish_green, oi::reddish_purple, oi::orange};
    size_t k = 0;
    const RunReport* cols_from = sched ? sched : deliv;
    for (const auto& c : cols_from->history.columns) {
      if (c.temperature || !is_f_column(c.name)) continue;
      const char* colour = kColours[k++ % std::size(kColours)];
      const std::string n = f_name(c.name);
      if (sched) add_curve(f.plot, *sched, ts, c.name.c_str(), "F (" + n + "), scheduled", colour, Dash::dashed, 1.8, u, false);
      if (deliv) add_curve(f.plot, *deliv, ts, c.name.c_str(), "F (" + n + "), delivered", colour, Dash::solid, 2.4, u, false);
      for (const auto& tl : cols_from->target_lines)
        if (tl.column == c.name) f.plot.hlines.push_back({tl.value, tl.label, colour, Dash::dotted});
    }
    add_marks(f.plot);
    f.caption = "Lethality accumulated at the centre, as minutes at each target's reference temperature: scheduled "
                "(dashed) and delivered (solid); the dotted line is the required value.";
    if (!f.plot.series.empty()) out.push_back(std::move(f));
  }
  return out;
}

}  // namespace

// With h split per target (issue 11), one set of figures per scenario: the scheduled and the
// delivered run of that scenario, so that every verdict's history is shown.
std::vector<RunFigure> deviation_figures(const process::DeviationResult& r, const DeviationRecordInfo& i, TempUnit u) {
  const RunReport* sched = i.scheduled_plot;
  const RunReport* deliv = i.delivered_plot;
  const std::size_t n = std::max(sched ? sched->scenarios.size() : 0, deliv ? deliv->scenarios.size() : 0);
  if (n == 0) return figures_of(r, i, u, sched, deliv);
  std::vector<RunFigure> out;
  for (std::size_t k = 0; k < n; ++k) {
    std::optional<RunReport> s, d;
    if (sched && k < sched->scenarios.size()) s = scenario_as_report(sched->scenarios[k]);
    if (deliv && k < deliv->scenarios.size()) d = scenario_as_report(deliv->scenarios[k]);
    const ScenarioView& v = sched && k < sched->scenarios.size() ? sched->scenarios[k] : deliv->scenarios[k];
    auto figures = figures_of(r, i, u, s ? &*s : nullptr, d ? &*d : nullptr);
    tag_scenario_figures(figures, v);
    for (auto& f : figures) out.push_back(std::move(f));
  }
  return out;
}

}  // namespace coldcore::detail
