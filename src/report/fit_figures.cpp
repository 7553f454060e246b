// Plots of the fit report: measured and fitted cold-spot curves, the semi-log heating curve with
// its straight portion, and the residuals of the design fit.
#include <cmath>

#include "coldcore/report/format.hpp"
#include "fit_content.hpp"

namespace coldcore::detail {

using namespace process;

std::vector<RunFigure> fit_figures(const StudyAnalysis& a, TempUnit u) {
  std::vector<RunFigure> figs;
  const FitResult& f = a.fit_slowest;
  if (f.probes.empty()) return figs;
  const ProbeFit& p = f.probes.front();
  const std::string sym(unit_symbol(u));
  const char* others[] = {svg::okabe_ito::sky_blue, svg::okabe_ito::bluish_green, svg::okabe_ito::reddish_purple,
                          svg::okabe_ito::yellow};

  RunFigure curves;
  curves.key = "fit";
  curves.plot.id = "fit-curves";
  curves.plot.title = "Measured and fitted cold-spot temperature";
  curves.plot.x.label = "time (min)";
  curves.plot.y.label = "temperature (" + sym + ")";
  if (a.fit_pool) {
    int k = 0;
    for (const ProbeFit& q : a.fit_pool->probes) {
      if (q.name == p.name) continue;
      svg::Series s;
      s.name = q.name + " measured";
      for (std::size_t i = 0; i < q.time_s.size(); ++i) {
        s.x.push_back(q.time_s[i] / 60.0);
        s.y.push_back(display_temp(q.measured_C[i], u));
      }
      s.colour = others[k++ % 4];
      s.dash = svg::Dash::dotted;
      s.width_px = 1.0;
      curves.plot.series.push_back(std::move(s));
    }
  }
  svg::Series meas, model;
  meas.name = p.name + " measured (design probe)";
  model.name = p.name + " fitted model";
  for (std::size_t i = 0; i < p.time_s.size(); ++i) {
    meas.x.push_back(p.time_s[i] / 60.0);
    meas.y.push_back(display_temp(p.measured_C[i], u));
    model.x.push_back(p.time_s[i] / 60.0);
    model.y.push_back(display_temp(p.model_C[i], u));
  }
  meas.colour = svg::okabe_ito::orange;
  meas.dash = svg::Dash::short_dash;
  model.colour = svg::okabe_ito::blue;
  curves.plot.series.push_back(std::move(meas));
  curves.plot.series.push_back(std::move(model));
  curves.caption = "The design probe's readings (short dashes) and the fitted exact model (solid line); the other "
                   "probes' readings dotted.";
  figs.push_back(std::move(curves));

  const ProbeDescription& d = a.curves[static_cast<std::size_t>(a.slowest)];
  if (d.heating.status == CurveStatus::described) {
    RunFigure semi;
    semi.key = "semilog";
    semi.plot.id = "fit-semilog";
    semi.plot.title = "Heating curve on a log scale: log10(T_R − T)";
    semi.plot.x.label = "time (min)";
    semi.plot.y.label = "log10(T_R − T / K)";
    svg::Series pts, line;
    pts.name = p.name + " readings";
    line.name = "straight portion, extended to the corrected zero";
    for (std::size_t i = 0; i < p.time_s.size() && p.time_s[i] <= a.phases.heating_end_s; ++i) {
      const double diff = a.phases.retort_C - p.measured_C[i];
      if (diff <= 0.1) continue;
      pts.x.push_back(p.time_s[i] / 60.0);
      pts.y.push_back(std::log10(diff));
    }
    const StraightPortion& s = d.heating.straight;
    for (double t : {d.heating.corrected_zero_s, s.to_s}) {
      line.x.push_back(t / 60.0);
      line.y.push_back(s.intercept + s.slope_per_s * t);
    }
    pts.colour = svg::okabe_ito::orange;
    pts.dash = svg::Dash::short_dash;
    line.colour = svg::okabe_ito::black;
    semi.plot.series = {std::move(pts), std::move(line)};
    semi.plot.vlines.push_back({s.from_s / 60.0, "straight from"});
    semi.caption = "The semi-log heating curve of the design probe (short dashes) and the straight line fitted to "
                   "its straight portion (solid), extended back to the corrected zero: f_h is the time it takes "
                   "to fall one log cycle.";
    figs.push_back(std::move(semi));
  }

  RunFigure res;
  res.key = "residuals";
  res.plot.id = "fit-residuals";
  res.plot.title = "Residuals of the design fit (model − measured)";
  res.plot.x.label = "time (min)";
  res.plot.y.label = "residual (K)";
  svg::Series r;
  r.name = "model − measured";
  for (std::size_t i = 1; i < p.time_s.size(); ++i) {
    r.x.push_back(p.time_s[i] / 60.0);
    r.y.push_back(p.model_C[i] - p.measured_C[i]);
  }
  r.colour = svg::okabe_ito::vermillion;
  res.plot.series = {std::move(r)};
  res.plot.hlines.push_back({0.0, "0", svg::okabe_ito::black, svg::Dash::long_dash});
  res.caption = "Residuals in kelvin; a pattern (rather than scatter about zero) shows what the model leaves out.";
  figs.push_back(std::move(res));
  return figs;
}

}  // namespace coldcore::detail
