// Plots and plain-words text for the rich report formats. Only formatting and selection happen
// here: every curve is a history column the model computed; the one summary (the largest gap
// between the lumped and the exact centre) is a difference of two given columns.
#include "run_figures.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <limits>
#include <optional>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/temperature_text.hpp"

namespace coldcore::detail {

namespace {

using svg::Dash;
namespace oi = svg::okabe_ito;

struct CurveStyle {
  const char* column;
  const char* legend;
  const char* colour;
  Dash dash;
  double width;
};

// Drawing order: the centre last, on top. Dash patterns all differ.
constexpr CurveStyle kTempCurves[] = {
    {"medium_C", "medium", oi::orange, Dash::long_dash, 1.6},
    {"surface_C", "surface", oi::vermillion, Dash::dashed, 1.6},
    {"mean_C", "mass-average", oi::bluish_green, Dash::dash_dot, 1.6},
    {"lumped_centre_C", "centre by the lumped shortcut", oi::reddish_purple, Dash::short_dash, 2.0},
    {"centre_C", "centre (cold spot), exact", oi::blue, Dash::solid, 2.4},
    {"measured_C", "measured by the probe", oi::blue, Dash::solid, 2.4},
};

const CurveStyle* temp_style(std::string_view column) {
  for (const auto& c : kTempCurves)
    if (column == c.column) return &c;
  return nullptr;
}

constexpr const char* kFColours[] = {oi::blue, oi::vermillion, oi::bluish_green, oi::reddish_purple, oi::orange,
                                     oi::sky_blue, oi::black};
constexpr Dash kFDashes[] = {Dash::solid, Dash::dashed, Dash::dash_dot, Dash::short_dash, Dash::long_dash};

std::string default_target_label(const TargetLine& t, TempUnit u, bool temperature) {
  if (temperature) {
    const std::string stem = t.column.size() > 2 ? t.column.substr(0, t.column.size() - 2) : t.column;
    return "required " + stem + " " + fixed(display_temp(t.value, u), 1) + " " + std::string(unit_symbol(u));
  }
  if (is_f_column(t.column)) return "required F (" + f_name(t.column) + ") = " + fixed(t.value, 2) + " min";
  return "required " + t.column + " = " + fixed(t.value, 2);
}

void add_stage_lines(svg::LinePlot& p, const RunReport& r, const TimeScale& ts) {
  for (const auto& s : r.stages) p.vlines.push_back({s.start_s / ts.seconds_per_unit, s.name});
}

svg::Series make_series(const CurveStyle& c, std::vector<double> x, std::vector<double> y) {
  svg::Series s;
  s.name = c.legend;
  s.x = std::move(x);
  s.y = std::move(y);
  s.colour = c.colour;
  s.dash = c.dash;
  s.width_px = c.width;
  s.css_class = std::string("series-") + c.column;
  return s;
}

}  // namespace

std::optional<size_t> column_index(const HistoryTable& h, std::string_view name) {
  for (size_t i = 0; i < h.columns.size(); ++i)
    if (h.columns[i].name == name) return i;
  return std::nullopt;
}

bool is_f_column(std::string_view n) {
  return n.size() > 6 && n.substr(0, 2) == "F_" && n.substr(n.size() - 4) == "_min";
}

std::string f_name(std::string_view column) { return std::string(column.substr(2, column.size() - 6)); }

std::vector<double> column_values(const HistoryTable& h, size_t i, bool temperature, TempUnit u) {
  std::vector<double> v;
  v.reserve(h.rows.size());
  for (const auto& row : h.rows) {
    const double x = i < row.size() ? row[i] : std::numeric_limits<double>::quiet_NaN();
    v.push_back(temperature ? display_temp(x, u) : x);
  }
  return v;
}

double report_end_s(const RunReport& r) {
  double end_s = 0;
  if (auto t = column_index(r.history, "time_s"))
    for (const auto& row : r.history.rows)
      if (*t < row.size() && std::isfinite(row[*t])) end_s = std::max(end_s, row[*t]);
  for (const auto& s : r.stages) end_s = std::max(end_s, s.end_s);
  for (const auto& b : r.rule_boxes) end_s = std::max(end_s, b.t1_s);
  return end_s;
}

// Minutes for processes up to 3 h, hours beyond: readable tick labels either way.
TimeScale time_scale_for(double end_s) {
  if (end_s <= 3 * 3600.0) return {60.0, "time since process start (min)"};
  return {3600.0, "time since process start (h)"};
}

TimeScale time_scale(const RunReport& r) { return time_scale_for(report_end_s(r)); }

std::string display_column_name(const Column& c, TempUnit u) {
  if (!c.temperature || u == TempUnit::C) return c.name;
  std::string n = c.name;
  if (n.size() >= 2 && n.compare(n.size() - 2, 2, "_C") == 0) return n.substr(0, n.size() - 1) + "F";
  return n;
}

const std::vector<std::string>& report_cautions(const RunReport& r) {
  return r.cautions.empty() ? cautions() : r.cautions;
}

std::string lead_sentence() {
  return "Engineering estimate from a conduction model, not a validated process. Read the cautions at the "
         "end of this report before using any of it.";
}

std::string lead_sentence(const RunReport& r) {
  if (!r.measured) return lead_sentence();
  return "Engineering estimate from a measured temperature log, not a validated process. Read the cautions at the "
         "end of this report before using any of it.";
}

std::string subject_heading(const RunReport& r) { return r.measured ? "Measured log" : "Product and properties"; }

std::vector<std::string> delivered_lines(const RunReport& r) {
  std::vector<std::string> out;
  for (const auto& d : r.delivered) {
    out.push_back(d.name + ": " + delivered_text(d));
    for (const auto& line : d.details) out.push_back(d.name + ": " + line);
  }
  return out;
}

std::vector<RunFigure> run_figures(const RunReport& r, TempUnit u) {
  std::vector<RunFigure> out;
  const auto t_col = column_index(r.history, "time_s");
  if (!t_col || r.history.rows.empty()) return out;
  TimeScale ts = time_scale(r);
  if (r.measured) {  // a log counts from its first reading; say its clock time when it has one
    const bool hours = ts.seconds_per_unit == 3600.0;
    ts.label = "time since the first reading";
    if (r.measured->start_unix_s) ts.label += ", " + utc_text(*r.measured->start_unix_s);
    ts.label += hours ? " (h)" : " (min)";
  }
  std::vector<double> t = column_values(r.history, *t_col, false, u);
  for (double& x : t) x /= ts.seconds_per_unit;
  const std::string temp_label = "temperature (" + std::string(unit_symbol(u)) + ")";

  // Temperatures against time, with stage boundaries and temperature targets.
  {
    RunFigure f;
    f.key = "temperature";
    f.plot.id = "plot-temperature";
    f.plot.title = r.measured ? "Measured temperature against time" : "Temperatures against time";
    f.plot.x.label = ts.label;
    f.plot.x.min = 0;
    f.plot.y.label = temp_label;
    for (const auto& c : kTempCurves)
      if (auto i = column_index(r.history, c.column))
        f.plot.series.push_back(make_series(c, t, column_values(r.history, *i, true, u)));
    for (const auto& tl : r.target_lines)
      if (const CurveStyle* c = temp_style(tl.column); c && column_index(r.history, tl.column)) {
        f.plot.hlines.push_back({display_temp(tl.value, u),
                                 tl.label.empty() ? default_target_label(tl, u, true) : tl.label, oi::black,
                                 Dash::dotted});
      }
    add_stage_lines(f.plot, r, ts);
    if (r.measured)
      f.caption = "The temperature the probe logged (log " + r.measured->log + ", " +
                  std::to_string(r.measured->readings) + " readings) against time, straight between readings.";
    else
      f.caption = "Medium, surface, mass-average and centre temperature of the product against time; dashed "
                  "vertical lines mark where each stage starts.";
    if (column_index(r.history, "lumped_centre_C"))
      f.caption += " The short-dash curve labelled 'centre by the lumped shortcut' is the lumped-capacitance shortcut for the centre, drawn to show "
                   "how far it is from the exact centre.";
    if (!f.plot.series.empty()) out.push_back(std::move(f));
  }

  // Cumulative lethality with the required values.
  {
    RunFigure f;
    f.key = "lethality";
    f.plot.id = "plot-lethality";
    f.plot.title = r.measured ? "Cumulative lethality at the probe" : "Cumulative lethality at the centre";
    f.plot.x.label = ts.label;
    f.plot.x.min = 0;
    f.plot.y.label = "F-value (min)";
    f.plot.y.min = 0;
    size_t k = 0;
    for (size_t i = 0; i < r.history.columns.size(); ++i) {
      const auto& c = r.history.columns[i];
      if (c.temperature || !is_f_column(c.name)) continue;
      svg::Series s;
      s.name = "F (" + f_name(c.name) + ")";
      s.x = t;
      s.y = column_values(r.history, i, false, u);
      s.colour = kFColours[k % std::size(kFColours)];
      s.dash = kFDashes[k % std::size(kFDashes)];
      s.width_px = 2.2;
      s.css_class = "series-" + c.name;
      for (const auto& tl : r.target_lines)
        if (tl.column == c.name)
          f.plot.hlines.push_back({tl.value, tl.label.empty() ? default_target_label(tl, u, false) : tl.label,
                                   s.colour, Dash::dotted});
      f.plot.series.push_back(std::move(s));
      ++k;
    }
    add_stage_lines(f.plot, r, ts);
    // A requirement under 5 % of the axis would lie on zero: decades instead (issue 16), from a
    // hundredth of the smallest requirement.
    double top = 0, least_required = std::numeric_limits<double>::infinity();
    for (const auto& s : f.plot.series)
      for (double v : s.y)
        if (std::isfinite(v)) top = std::max(top, v);
    for (const auto& h : f.plot.hlines)
      if (h.y > 0) least_required = std::min(least_required, h.y);
    const bool log_axis = std::isfinite(least_required) && least_required < 0.05 * top;
    if (log_axis) {
      f.plot.y.log_scale = true;
      f.plot.y.min = least_required / 100;
      f.plot.y.label = "F-value (min, log scale)";
    }
    if (r.measured)
      f.caption = "Lethality accumulated from the measured temperatures (trapezoid rule over the readings), as "
                  "minutes at each target's reference temperature" +
                  std::string(r.target_lines.empty() ? "; no target was given, so no required value is drawn."
                                                     : "; the dotted line is the required value.");
    else
      f.caption = "Lethality accumulated at the centre, as minutes at each target's reference temperature; the "
                  "dotted line is the required value.";
    if (log_axis)
      f.caption += " The F axis is logarithmic (decades), so that a requirement far below the F delivered stays "
                   "visible.";
    if (!f.plot.series.empty()) out.push_back(std::move(f));
  }

  // Cooling against the rule's limits: only the rule's time window.
  if (!r.rule_boxes.empty()) {
    RunFigure f;
    f.key = "cooling";
    f.plot.id = "plot-cooling";
    f.plot.title = "Cooling against the rule's limits";
    f.plot.x.label = ts.label;
    f.plot.y.label = temp_label;
    double lo = std::numeric_limits<double>::infinity(), hi = -lo;
    for (const auto& b : r.rule_boxes) {
      lo = std::min({lo, b.t0_s, b.t1_s});
      hi = std::max({hi, b.t0_s, b.t1_s});
      f.plot.boxes.push_back({b.t0_s / ts.seconds_per_unit, b.t1_s / ts.seconds_per_unit,
                              display_temp(b.temp_lo_C, u), display_temp(b.temp_hi_C, u),
                              b.label + (b.label.empty() ? "" : ": ") +
                                  (b.limits.empty() ? fixed(display_temp(b.temp_hi_C, u), 1) + " → " +
                                                          fixed(display_temp(b.temp_lo_C, u), 1) + " " +
                                                          std::string(unit_symbol(u))
                                                    : render_temperatures(b.limits, u)),
                              oi::reddish_purple});
    }
    const double pad = 0.05 * (hi - lo);
    f.plot.x.min = std::max(0.0, lo - pad) / ts.seconds_per_unit;
    f.plot.x.max = (hi + pad) / ts.seconds_per_unit;
    for (const char* col : {"medium_C", "centre_C", "measured_C"})
      if (auto i = column_index(r.history, col))
        f.plot.series.push_back(make_series(*temp_style(col), t, column_values(r.history, *i, true, u)));
    add_stage_lines(f.plot, r, ts);
    f.caption = std::string("Each shaded box is one step of the cooling rule: the ") +
                (r.measured ? "measured temperature" : "centre") +
                " must leave the box through its lower edge before the heavy right edge (the step's deadline).";
    out.push_back(std::move(f));
  }
  return out;
}

std::string biot_text(const StageRow& s) {
  if (s.h_infinite) return "∞ (surface held at the medium temperature)";
  return biot_number_text(s.biot);
}

TextTable stage_table(const RunReport& r, TempUnit u) {
  const std::string us(unit_symbol(u));
  TextTable t = {{"stage", "start", "end", "ended by", "medium", "h (W/m²K)", biot_symbol(r), "centre (" + us + ")",
                  "surface (" + us + ")", "mean (" + us + ")"}};
  for (const auto& s : r.stages)
    t.push_back({s.name, duration_text(s.start_s), duration_text(s.end_s), s.ended_by, s.medium,
                 s.h_infinite ? "∞" : fixed(s.h_W_m2K, 1), s.h_infinite ? "∞" : biot_text(s),
                 fixed(display_temp(s.centre_C, u), 2), fixed(display_temp(s.surface_C, u), 2),
                 fixed(display_temp(s.mean_C, u), 2)});
  return t;
}

TextTable verdict_table(const RunReport& r) {
  const bool split = !r.scenarios.empty();
  TextTable t = {{"target", "kind", "required", "achieved", "margin", "verdict"}};
  if (split) t[0].push_back("scenario");
  for (const auto& v : r.verdicts) {
    t.push_back({v.name, v.kind, v.required, v.achieved, v.margin, std::string(verdict_word(v.met))});
    if (split) t.back().push_back(v.scenario.substr(0, v.scenario.find(':')));
  }
  return t;
}

RunReport scenario_as_report(const ScenarioView& v) {
  RunReport one;
  one.stages = v.stages;
  one.history = v.history;
  one.target_lines = v.target_lines;
  one.rule_boxes = v.rule_boxes;
  return one;
}

void tag_scenario_figures(std::vector<RunFigure>& figures, const ScenarioView& v) {
  const std::string tag = "scenario" + std::to_string(v.number);
  for (auto& f : figures) {
    f.key = tag + "-" + f.key;
    f.plot.id = "plot-" + f.key;
    f.plot.title += " (scenario " + std::to_string(v.number) + ")";
    std::string label = v.label;
    if (!label.empty()) label[0] = 'S';  // "scenario 2: ..." opens the caption
    f.caption = label + ". " + f.caption;
  }
}

std::vector<RunFigure> scenario_figures(const RunReport& r, TempUnit u) {
  std::vector<RunFigure> out;
  for (const auto& v : r.scenarios) {
    auto figures = run_figures(scenario_as_report(v), u);
    tag_scenario_figures(figures, v);
    for (auto& f : figures) out.push_back(std::move(f));
  }
  return out;
}

std::vector<RunFigure> report_figures(const RunReport& r, TempUnit u) {
  return r.scenarios.empty() ? run_figures(r, u) : scenario_figures(r, u);
}

TextTable scenario_stage_table(const RunReport& r, const ScenarioView& v, TempUnit u) {
  const std::string us(unit_symbol(u));
  TextTable t = {{"stage", "start", "end", "ended by", "h (W/m²K)", biot_symbol(r), "centre (" + us + ")",
                  "surface (" + us + ")", "mean (" + us + ")"}};
  for (const auto& s : v.stages)
    t.push_back({s.name, duration_text(s.start_s), duration_text(s.end_s), s.ended_by,
                 s.h_infinite ? "∞" : fixed(s.h_W_m2K, 1), s.h_infinite ? "∞" : biot_text(s),
                 fixed(display_temp(s.centre_C, u), 2), fixed(display_temp(s.surface_C, u), 2),
                 fixed(display_temp(s.mean_C, u), 2)});
  return t;
}

std::string scenario_heading(const ScenarioView& v) {
  std::string names;
  for (const auto& t : v.targets) names += (names.empty() ? "" : ", ") + t;
  return v.label + "; targets: " + names;
}

}  // namespace coldcore::detail
