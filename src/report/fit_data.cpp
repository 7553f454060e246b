// Machine-readable outputs of the fit report: JSON (the contract other programs read) and CSV.
#include <cmath>
#include <ostream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/json_contract.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "fit_content.hpp"

namespace coldcore {

using namespace process;

namespace {

const char* h_status_key(HStatus s) {
  switch (s) {
    case HStatus::fitted: return "fitted";
    case HStatus::lower_bound: return "lower_bound";
    case HStatus::fixed_infinite: return "fixed_infinite";
    case HStatus::not_identified: return "not_identified";
  }
  return "";
}

const char* curve_status_key(CurveStatus s) {
  switch (s) {
    case CurveStatus::described: return "described";
    case CurveStatus::too_few_points: return "too_few_points";
    case CurveStatus::never_straight: return "never_straight";
    case CurveStatus::no_driving_difference: return "no_driving_difference";
  }
  return "";
}

void pair(JsonWriter& w, const std::array<double, 2>& v) { w.begin_array().value(v[0]).value(v[1]).end_array(); }

void fit_json(JsonWriter& w, const FitResult& f, const std::vector<std::string>& stage_names) {
  w.begin_object();
  w.key("alpha_m2_s").value(f.alpha_m2_s);
  w.key("alpha_ci95_m2_s");
  pair(w, f.alpha_ci95_m2_s);
  w.key("conductivity_W_mK").value(f.conductivity_W_mK);
  w.key("h").begin_array();
  for (const FittedH& g : f.h) {
    w.begin_object();
    w.key("stages").begin_array();
    for (int i : g.stages) w.value(stage_names[static_cast<std::size_t>(i)]);
    w.end_array();
    w.key("status").value(h_status_key(g.status));
    w.key("h_infinite").value(!std::isfinite(g.h_W_m2K));
    if (std::isfinite(g.h_W_m2K)) w.key("h_W_m2K").value(g.h_W_m2K);
    else w.key("h_W_m2K").null();
    w.key("h_lower_bound").value(g.status == HStatus::lower_bound);
    w.key("h_ci95_W_m2K");
    if (g.status == HStatus::fitted) pair(w, g.ci95_W_m2K);
    else w.null();
    w.key("biot");
    std::isfinite(g.biot) ? w.value(g.biot) : w.null();  // null with h_infinite
    w.end_object();
  }
  w.end_array();
  // The first fitted group also at the top level, as the contract names it.
  for (const FittedH& g : f.h)
    if (g.status == HStatus::fitted || g.status == HStatus::lower_bound) {
      w.key("h_W_m2K").value(g.h_W_m2K);
      w.key("h_ci95_W_m2K");
      if (g.status == HStatus::fitted) pair(w, g.ci95_W_m2K);
      else w.null();
      w.key("h_lower_bound").value(g.status == HStatus::lower_bound);
      break;
    }
  w.key("rms_K").value(f.rms_K);
  w.key("n_points").value(f.n_points);
  w.key("n_parameters").value(f.n_parameters);
  w.key("dof").value(f.dof);
  w.key("t95").value(f.t95);
  w.key("parameters").value(f.parameters);
  w.key("correlation").begin_array();
  for (const auto& row : f.correlation) {
    w.begin_array();
    for (double x : row) w.value(x);
    w.end_array();
  }
  w.end_array();
  w.key("probes").begin_array();
  for (const ProbeFit& p : f.probes) w.value(p.name);
  w.end_array();
  w.key("converged").value(f.converged);
  w.key("at_limit").value(f.at_limit);
  w.key("intervals_span_bound").value(f.intervals_span_bound);
  w.end_object();
}

void curve_json(JsonWriter& w, const CurveDescription* c, const char* f_key, const char* j_key) {
  if (c && c->status == CurveStatus::described) {
    w.key(f_key).value(c->f_s);
    w.key(j_key).value(c->j);
  } else {
    w.key(f_key).null();
    w.key(j_key).null();
  }
}

}  // namespace

static void write_fit_json_unrendered(const StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u);

void write_fit_json(const StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_fit_json_unrendered(a, c, o, u); });
}

static void write_fit_json_unrendered(const StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u) {
  JsonWriter w(out);
  w.begin_object();
  write_json_envelope(w, "fit", u);
  const std::string us(unit_suffix(u));
  w.key("product").value(c.product_name);
  w.key("fit");
  fit_json(w, a.fit_slowest, c.stage_names);
  w.key("fit_pool");
  if (a.fit_pool) fit_json(w, *a.fit_pool, c.stage_names);
  else w.null();
  w.key("phases").begin_object();
  w.key("heating_end_s").value(a.phases.heating_end_s);
  w.key("retort_" + us).value(display_temp(a.phases.retort_C, u));
  w.key("come_up_s").value(a.phases.come_up_s);
  w.key("corrected_zero_s").value(a.phases.corrected_zero_s);
  w.key("cooling_medium_" + us);
  if (a.phases.has_cooling) w.value(display_temp(a.phases.cooling_medium_C, u));
  else w.null();
  w.end_object();
  w.key("curves").begin_array();
  for (const ProbeDescription& d : a.curves) {
    w.begin_object();
    w.key("probe").value(d.name);
    w.key("initial_" + us).value(display_temp(d.initial_C, u));
    w.key("heating_status").value(curve_status_key(d.heating.status));
    curve_json(w, &d.heating, "f_h_s", "j_h");
    const CurveDescription* cool = d.cooling ? &*d.cooling : nullptr;
    w.key("cooling_status");
    if (cool) w.value(curve_status_key(cool->status));
    else w.null();
    curve_json(w, cool, "f_c_s", "j_c");
    const bool described = d.heating.status == CurveStatus::described;
    w.key("straight_from_s");
    described ? w.value(d.heating.straight.from_s) : w.null();
    w.key("straight_to_s");
    described ? w.value(d.heating.straight.to_s) : w.null();
    w.key("straight_r2");
    described ? w.value(d.heating.straight.r2) : w.null();
    w.key("straight_points").value(described ? d.heating.straight.points : 0);
    w.key("broken").value(d.heating.broken);
    w.key("f_2_s");
    d.heating.broken ? w.value(d.heating.f2_s) : w.null();
    w.key("break_s");
    d.heating.broken ? w.value(d.heating.break_s) : w.null();
    w.key("F_delivered_min");
    d.F_s ? w.value(*d.F_s / 60.0) : w.null();
    w.key("hotter_than_medium_at_reading");
    d.hotter_than_medium ? w.value(d.hotter_than_medium->reading) : w.null();
    w.end_object();
  }
  w.end_array();
  w.key("slowest_probe").value(a.curves[static_cast<std::size_t>(a.slowest)].name);
  w.key("least_lethality_probe");
  a.least_lethality >= 0 ? w.value(a.curves[static_cast<std::size_t>(a.least_lethality)].name) : w.null();
  w.key("cross_check");
  if (a.cross_check && a.cross_check->estimate.status != FirstTermStatus::j_below_one) {
    w.begin_object();
    w.key("alpha_m2_s").value(a.cross_check->estimate.alpha_m2_s);
    w.key("biot");
    std::isfinite(a.cross_check->estimate.biot_smallest_dimension) ? w.value(a.cross_check->estimate.biot_smallest_dimension)
                                                                   : w.null();
    w.key("biot_infinite").value(!std::isfinite(a.cross_check->estimate.biot_smallest_dimension));
    w.key("alpha_ratio").value(a.cross_check->alpha_ratio);
    w.key("predicted_f_h_s").value(a.cross_check->predicted.f_s);
    w.key("predicted_j_h").value(a.cross_check->predicted.j);
    w.key("f_ratio").value(a.cross_check->f_ratio);
    w.key("disagrees").value(a.cross_check->disagrees);
    w.end_object();
  } else {
    w.null();
  }
  w.key("classical");
  if (a.classical) {
    const ClassicalEstimate& ce = *a.classical;
    w.begin_object();
    w.key("target").value(ce.target);
    w.key("in_table").value(ce.ball.in_table);
    w.key("fh_over_U").value(ce.ball.fh_over_U);
    w.key("log10_g_F");
    ce.ball.in_table ? w.value(ce.ball.log10_g_F) : w.null();
    w.key("ball_B_s");
    ce.ball.in_table ? w.value(ce.ball.B_s) : w.null();
    w.key("ball_operator_time_s");
    ce.ball.in_table ? w.value(ce.ball.operator_time_s) : w.null();
    w.key("exact_hold_s");
    ce.exact_hold_s ? w.value(*ce.exact_hold_s) : w.null();
    w.key("stage").value(ce.stage);
    w.end_object();
  } else {
    w.null();
  }
  w.key("written_product");
  c.written_product.empty() ? w.null() : w.value(c.written_product);
  w.key("warnings").value(c.warnings);
  w.key("cautions").value(cautions());
  w.key("provenance");
  write_labelled_object(w, c.provenance);
  w.end_object();
  out << "\n";
}

static void write_fit_csv_unrendered(const StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u);

void write_fit_csv(const StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_fit_csv_unrendered(a, c, o, u); });
}

static void write_fit_csv_unrendered(const StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u) {
  for (const auto& cau : cautions()) out << "# caution: " << cau << "\n";
  out << "# heat-penetration study of " << c.product_name << "; design probe " << a.curves[static_cast<std::size_t>(a.slowest)].name
      << "; model columns from the fit to the design probe (model_design) and to all probes (model_pool)\n";
  const std::string s(unit_suffix(u));
  out << "probe,time_s,measured_" << s << ",model_design_" << s << ",model_pool_" << s << ",residual_design_K\n";
  const FitResult& f = a.fit_slowest;
  for (std::size_t k = 0; k < (a.fit_pool ? a.fit_pool->probes.size() : f.probes.size()); ++k) {
    const ProbeFit& pool_or_design = a.fit_pool ? a.fit_pool->probes[k] : f.probes[k];
    const bool is_design = pool_or_design.name == f.probes.front().name;
    for (std::size_t i = 0; i < pool_or_design.time_s.size(); ++i) {
      out << csv_cell(pool_or_design.name) << "," << csv_number(pool_or_design.time_s[i]) << ","
          << csv_number(display_temp(pool_or_design.measured_C[i], u)) << ",";
      if (is_design) out << csv_number(display_temp(f.probes.front().model_C[i], u));
      out << ",";
      if (a.fit_pool) out << csv_number(display_temp(pool_or_design.model_C[i], u));
      out << ",";
      if (is_design) out << csv_number(f.probes.front().model_C[i] - f.probes.front().measured_C[i]);
      out << "\n";
    }
  }
}

}  // namespace coldcore
