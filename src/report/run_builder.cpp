#include "coldcore/report/run_builder.hpp"
#include "coldcore/report/temperature_text.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <numbers>

#include "coldcore/conduction/lumped_history.hpp"
#include "coldcore/error.hpp"
#include "coldcore/model/limits.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/cooling_notes.hpp"
#include "coldcore/report/h_choice_text.hpp"
#include "coldcore/report/history_notes.hpp"
#include "coldcore/report/target_notes.hpp"
#include "rich_page.hpp"

namespace coldcore {

double volume_to_area_m(const Product& p) {
  const Dimensions& d = p.dims;
  switch (p.shape) {
    case Shape::sphere: return d.diameter_m / 6.0;
    case Shape::cylinder: return d.diameter_m / 4.0;
    case Shape::finite_cylinder: {
      const double r = d.diameter_m / 2, len = d.length_m;
      return r * len / (2.0 * (r + len));
    }
    case Shape::slab: return d.thickness_m / 2.0;
    case Shape::brick: {
      const double a = d.size_m[0], b = d.size_m[1], c = d.size_m[2];
      return a * b * c / (2.0 * (a * b + b * c + c * a));
    }
  }
  return 0;
}

double biot_volume_to_area(const Product& p, double h_W_m2K) {
  return h_W_m2K * volume_to_area_m(p) / p.properties.conductivity_W_mK;
}

std::string biot_symbol(const RunReport& r) { return r.biot_length.empty() ? "Bi" : "Bi(" + r.biot_length + ")"; }

std::string biot_number_text(double biot) {
  if (biot != 0 && std::fabs(biot) < 0.01) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.2g", biot);
    return buf;
  }
  return fixed(biot, 3);
}

// The three regimes: Bi is the ratio of the resistance to conduction inside the product to the
// resistance to convection at its surface (Incropera et al., Fundamentals of Heat and Mass Transfer,
// ch. 5, from memory); below 0.1 on Lc = V/A the lumped-capacitance treatment is fair
// (REFERENCES 3.2).
std::string biot_note(const Product& p, const Stage& s) {
  if (s.h_infinite)
    return "surface held at the medium temperature (Bi(V/A) -> inf): heating is limited only by conduction "
           "inside the product, and the centre lags the surface the most.";
  const double bi = biot_volume_to_area(p, s.h_W_m2K);
  const std::string b = "Bi(V/A) = " + biot_number_text(bi);
  if (bi < 0.1)
    return b + " < 0.1: the inside stays nearly uniform, so lumped capacitance would be a fair shortcut here; "
               "the exact series is used all the same.";
  if (bi <= 1.0)
    return b + ", between 0.1 and 1: the surface resistance dominates, but the inside's is no longer negligible: "
               "the centre still lags the surface, so lumped capacitance would misstate the centre and the exact "
               "series is needed.";
  return b + " > 1: the resistance inside the product dominates: the surface nears the medium temperature long "
             "before the centre does; lumped capacitance would misstate the centre and the exact series is needed.";
}

namespace {

std::string ended_by_text(StageEndedBy e) {
  switch (e) {
    case StageEndedBy::duration: return "duration";
    case StageEndedBy::condition: return "condition met";
    case StageEndedBy::cap: return "CAP REACHED";
  }
  return "?";
}

std::string shape_dims(const Product& p) {
  const Dimensions& d = p.dims;
  auto mm = [](double m) { return fixed(m * 1000.0, 1) + " mm"; };
  switch (p.shape) {
    case Shape::sphere: return "sphere, diameter " + mm(d.diameter_m);
    case Shape::cylinder: return "infinite cylinder, diameter " + mm(d.diameter_m);
    case Shape::finite_cylinder: return "finite cylinder, diameter " + mm(d.diameter_m) + ", length " + mm(d.length_m);
    case Shape::slab: return "slab, thickness " + mm(d.thickness_m);
    case Shape::brick: return "brick, " + mm(d.size_m[0]) + " x " + mm(d.size_m[1]) + " x " + mm(d.size_m[2]);
  }
  return "?";
}

std::vector<double> output_times(const History& h, double step_s) {
  std::vector<double> t;
  const double end = h.end_s();
  if (end / step_s > static_cast<double>(limits::max_output_rows))
    throw InputError("--step-s = " + fixed(step_s, 3) + ": gives " + fixed(std::ceil(end / step_s), 0) +
                     " rows over the " + fixed(end, 0) + " s process; at most " +
                     std::to_string(limits::max_output_rows) + " rows: give --step-s " +
                     fixed(std::ceil(end / static_cast<double>(limits::max_output_rows)), 0) + " or more");
  for (double x = 0; x < end; x += step_s) t.push_back(x);
  for (const auto& s : h.stages) t.push_back(s.end_s);
  std::sort(t.begin(), t.end());
  t.erase(std::unique(t.begin(), t.end()), t.end());
  return t;
}

}  // namespace

RunReport build_run_report(const Scenario& model, const InputSource& source, const History& history,
                           const RunReportOptions& opts) {
  if (!(opts.step_s > 0) || !std::isfinite(opts.step_s))
    throw InputError("--step-s = " + fixed(opts.step_s, 3) + ": must be > 0");
  const Product& p = model.product;
  // the stages as they ran: the h of each from its record (a stage with an h range ran at the
  // end of it that the shown scenario took)
  std::vector<Stage> ran = model.stages;
  for (std::size_t i = 0; i < ran.size() && i < history.stages.size(); ++i)
    if (!ran[i].h_infinite) ran[i].h_W_m2K = history.stages[i].h_W_m2K;
  RunReport r;
  r.verb = "run";
  r.title = "coldcore run: " + p.name;
  const double alpha = p.properties.diffusivity_m2_s();
  r.product = {
      {"name", p.name},
      {"shape", shape_dims(p)},
      {"initial temperature", temp_token_fixed(p.initial_C, 2)},
      {"conductivity k", fixed(p.properties.conductivity_W_mK, 4) + " W/m·K"},
      {"density rho", fixed(p.properties.density_kg_m3, 1) + " kg/m³"},
      {"specific heat cp", fixed(p.properties.specific_heat_J_kgK, 1) + " J/kg·K"},
      {"diffusivity alpha", fixed(alpha * 1e7, 4) + "e-7 m²/s"},
  };
  for (size_t i = 0; i < history.stages.size() && i < ran.size(); ++i) {
    const StageRecord& rec = history.stages[i];
    const Stage& st = ran[i];
    StageRow row;
    row.name = rec.name;
    row.start_s = rec.start_s;
    row.end_s = rec.end_s;
    row.ended_by = ended_by_text(rec.ended_by);
    row.medium = st.medium.description;
    row.h_W_m2K = st.h_W_m2K;
    row.h_infinite = st.h_infinite;
    // one Biot number in the table, the notes and "Reading this report": on V/A
    row.biot = st.h_infinite ? rec.biot : biot_volume_to_area(p, st.h_W_m2K);
    row.biot_note = biot_note(p, st);
    row.centre_C = rec.at_end.centre_C;
    row.surface_C = rec.at_end.surface_C;
    row.mean_C = rec.at_end.mean_C;
    r.stages.push_back(row);
  }
  r.biot_length = "V/A";
  r.biot_length_m = volume_to_area_m(p);
  r.history.columns = {{"time_s", false}, {"medium_C", true}, {"centre_C", true}, {"surface_C", true}, {"mean_C", true}};
  for (double t : output_times(history, opts.step_s)) {
    const HistorySample s = history.evaluate(t);
    r.history.rows.push_back({t, s.medium_C, s.centre_C, s.surface_C, s.mean_C});
  }
  // When any stage has Bi(V/A) > 0.1, show the lumped shortcut beside the exact centre so the
  // reader sees how far off it would be (a comparison only; never used for a verdict).
  bool lumped_misleads = false;
  for (const auto& st : ran)
    lumped_misleads = lumped_misleads || st.h_infinite || biot_volume_to_area(p, st.h_W_m2K) > 0.1;
  if (lumped_misleads && history.stages.size() == ran.size()) {
    std::vector<double> times;
    for (const auto& row : r.history.rows) times.push_back(row[0]);
    const std::vector<double> lumped = lumped_history_C(p, volume_to_area_m(p), ran, history, times);
    r.history.columns.push_back({"lumped_centre_C", true});
    for (size_t i = 0; i < r.history.rows.size(); ++i) r.history.rows[i].push_back(lumped[i]);
  }
  r.warnings = source.warnings;
  const auto engine_notes = history_warnings(history);
  r.warnings.insert(r.warnings.end(), engine_notes.begin(), engine_notes.end());
  r.assumptions = {
      "Heat moves by conduction only; no convection inside the product, no headspace.",
      "Uniform initial temperature; constant thermal properties as given in the product file.",
      "No phase change (no freezing, thawing or evaporation) and no internal heat generation.",
      "Surface heat-transfer coefficient constant within each stage; medium temperature as scheduled.",
      "The cold spot is the geometric centre (symmetric heating from every face).",
  };
  r.provenance = {{"tool", "coldcore " + opts.version}, {"input", source.origin}, {"input SHA-256", source.sha256_hex}};
  if (!opts.date.empty()) r.provenance.push_back({"date", opts.date});
  r.cautions = cautions();
  return r;
}

namespace {

RunReport rerun_report(const History& history, const std::vector<const History*>& history_of,
                       const Assessment& assessment, const std::vector<Target>& targets, double step_s) {
  if (!(step_s > 0) || !std::isfinite(step_s))
    throw InputError("--step-s = " + fixed(step_s, 3) + ": must be > 0");
  RunReport r;
  for (const StageRecord& rec : history.stages) {
    StageRow row;
    row.name = rec.name;
    row.start_s = rec.start_s;
    row.end_s = rec.end_s;
    row.ended_by = ended_by_text(rec.ended_by);
    row.h_W_m2K = rec.h_W_m2K;
    row.biot = rec.biot;  // not shown: these rows only mark the stages on plots
    row.centre_C = rec.at_end.centre_C;
    row.surface_C = rec.at_end.surface_C;
    row.mean_C = rec.at_end.mean_C;
    r.stages.push_back(row);
  }
  r.biot_length = "half-dimension";  // the engine's records: half-thickness or radius
  r.biot_length_m = 0;
  r.history.columns = {{"time_s", false}, {"medium_C", true}, {"centre_C", true}, {"surface_C", true}, {"mean_C", true}};
  if (history.evaluate)
    for (double t : output_times(history, step_s)) {
      const HistorySample s = history.evaluate(t);
      r.history.rows.push_back({t, s.medium_C, s.centre_C, s.surface_C, s.mean_C});
    }
  add_assessment(r, history_of, assessment, targets);
  r.warnings.clear();  // the verbs list the run's warnings themselves
  r.cautions = cautions();
  return r;
}

}  // namespace

RunReport build_rerun_report(const History& history, const Assessment& assessment,
                             const std::vector<Target>& targets, double step_s) {
  return rerun_report(history, std::vector<const History*>(assessment.targets.size(), &history), assessment, targets,
                      step_s);
}

RunReport build_rerun_report(const process::Evaluation& e, const std::vector<Target>& targets, double step_s,
                             const Product* p) {
  // each target's F from the scenario it was evaluated on (the histories evaluate made)
  std::vector<const History*> history_of(e.assessment.targets.size(), &e.history);
  for (std::size_t t = 0; t < e.target_scenario.size() && t < history_of.size(); ++t)
    history_of[t] = &e.h_scenarios.at(static_cast<std::size_t>(e.target_scenario[t])).history;
  RunReport r = rerun_report(e.history, history_of, e.assessment, targets, step_s);
  add_scenarios(r, e, p, targets, step_s);
  return r;
}

}  // namespace coldcore

namespace coldcore {

namespace {


}  // namespace

VerdictRow verdict_row(const TargetResult& t) {
  VerdictRow v;
  v.name = t.name;
  v.kind = to_string(t.kind);
  v.required = t.required_text;
  v.achieved = t.achieved_text;
  v.margin = detail::margin_cell(t);  // a shortfall says so, not a bare amount
  v.met = t.verdict == Verdict::met;
  v.cooling = t.cooling;
  v.required_value = t.required;
  v.achieved_value = t.achieved;
  v.margin_value = t.margin;
  v.margin_uncertainty_value = t.margin_uncertainty;
  v.value_unit = t.unit == "log10" ? "log10" : (t.unit == "fraction" ? "fraction" : "s");
  if (t.kinetics) {
    const Kinetics& k = *t.kinetics;
    v.details.push_back("credited F = " + minutes_down(t.F_s) + " at " + temp_token_fixed(k.reference_C, 1) + " (z " +
                        temp_difference_token_fixed(k.z_C, 2) + "); F needed " + minutes_up(t.F_required_s));
    for (const auto& s : t.stages)
      v.details.push_back("stage '" + s.stage + "': F " + s.F_text + (s.credited ? "" : " (not credited)"));
    if (t.F_outside_range_s > 0)
      v.details.push_back("F credited outside the data's valid range (" + temp_token_fixed(k.valid_min_C, 1) + " to " +
                          temp_token_fixed(k.valid_max_C, 1) + "): " + minutes_down(t.F_outside_range_s));
  }
  if (t.cooling) {
    for (const auto& st : t.cooling->steps) {
      std::string line = "step " + st.step.label + ": ";
      if (!st.start_s) {
        line += "clock never started";
      } else if (!st.reached) {
        line += "not reached within the record (at least " + duration_text(st.elapsed_s) + ", limit " +
                duration_text(st.step.within_s) + ")";
      } else {
        line += "took " + duration_text(st.elapsed_s) + " of " + duration_text(st.step.within_s) +
                (st.passed ? " (passed)" : " (exceeded)");
      }
      if (st.step.advisory) line += " [advisory]";
      v.details.push_back(line);
      for (const auto& n : st.notes) v.details.push_back(cooling_note_text(n, *t.cooling));
    }
    for (const auto& n : t.cooling->notes) v.details.push_back(cooling_note_text(n, *t.cooling));
  }
  if (t.cooking) {
    if (t.cooking->instant_reached_s)
      v.details.push_back("the table's instant row was reached at " + duration_text(*t.cooking->instant_reached_s));
    else
      v.details.push_back("equivalent-time fraction of the table's requirement: " + shown_down(t.cooking->fraction) +
                          " (met when above 1)");
  }
  if (t.reached_s) v.details.push_back("first reached at " + duration_text(*t.reached_s));
  for (const auto& n : t.notes) v.details.push_back(target_note_text(n, t));
  if (!t.source.empty()) v.details.push_back("source: " + t.source);
  return v;
}

void add_assessment(RunReport& report, const History& history, const Assessment& assessment,
                    const std::vector<Target>& targets) {
  add_assessment(report, std::vector<const History*>(assessment.targets.size(), &history), assessment, targets);
}

void add_h_assumptions(RunReport& report, const process::Evaluation& e) {
  if (e.h_scenarios.size() > 1)
    report.assumptions.push_back(
        "The targets need different ends of an h range, so they were evaluated on " +
        std::to_string(e.h_scenarios.size()) +
        " scenarios, each target on the one conservative for it; every verdict names its scenario, and the "
        "report shows each scenario's history.");
  for (const auto& u : e.h_uses) report.assumptions.push_back("h per target: " + h_use_text(u) + ".");
}

void add_assessment(RunReport& report, const std::vector<const History*>& history_of, const Assessment& assessment,
                    const std::vector<Target>& targets) {
  std::vector<double> times;
  times.reserve(report.history.rows.size());
  for (const auto& row : report.history.rows) times.push_back(row[0]);
  for (std::size_t ti = 0; ti < assessment.targets.size(); ++ti) {
    const TargetResult& t = assessment.targets[ti];
    report.verdicts.push_back(verdict_row(t));
    if (t.kinetics && !t.column.empty()) {
      const std::vector<double> f = cumulative_f_s(*history_of.at(ti), t, times);
      // F columns follow mean_C (DESIGN.md csv order); the lumped comparison stays last.
      auto& cols = report.history.columns;
      size_t at = cols.size();
      if (!cols.empty() && cols.back().name == "lumped_centre_C") at = cols.size() - 1;
      cols.insert(cols.begin() + static_cast<std::ptrdiff_t>(at), Column{t.column, false});
      for (size_t i = 0; i < report.history.rows.size(); ++i) {
        auto& row = report.history.rows[i];
        row.insert(row.begin() + static_cast<std::ptrdiff_t>(at), f[i] / 60.0);
      }
      report.target_lines.push_back({t.column, t.F_required_s / 60.0, "required " + t.name + " " + minutes_up(t.F_required_s)});
    }
    if (t.cooling) {
      int n = 0;
      for (const auto& st : t.cooling->steps) {
        ++n;
        if (!st.start_s) continue;
        // the writers append the step's limits in the display unit
        report.rule_boxes.push_back({"step " + std::to_string(n) + " (" + duration_text(st.step.within_s) + ")",
                                     *st.start_s, *st.start_s + st.step.within_s, st.step.from_C, st.step.to_C,
                                  st.step.from_text + " → " + st.step.to_text});
      }
    }
  }
  for (const auto& target : targets)
    if (target.kind == TargetKind::centre_min_temperature)
      report.target_lines.push_back({target.at == "mean" ? "mean_C" : "centre_C", target.min_temp_C, ""});
  for (const auto& w : assessment.warnings) report.warnings.push_back(assessment_warning_text(w));
}

void add_fit_bound(RunReport& report, const std::vector<TargetResult>& at_bound, const Calibration& c) {
  report.assumptions.push_back(
      "Calibrated by a heat-penetration study (" + c.date + ", design probe " + c.design_probe + ", " +
      std::to_string(c.n_points) + " readings, residual RMS " + fixed(c.rms_K, 3) +
      " K): each target is also shown at the one-sided 95 % bound of the fit, the least favourable point of the "
      "fit's confidence region for that target (delta method, Student t with " + std::to_string(c.dof) +
      " degrees of freedom), computed with the full model. The bound covers the fit's statistical uncertainty only, "
      "not container-to-container variation beyond the probes studied.");
  for (std::size_t i = 0; i < report.verdicts.size() && i < at_bound.size(); ++i) {
    VerdictRow& v = report.verdicts[i];
    const TargetResult& t = at_bound[i];
    VerdictRow::AtFitBound b;
    b.achieved = t.achieved_text;
    b.margin = detail::margin_cell(t);
    b.met = t.verdict == Verdict::met;
    b.achieved_value = t.achieved;
    b.margin_value = t.margin;
    v.details.push_back("at the 95 % bound of the fit: achieved " + b.achieved + ", margin " + b.margin + " (" +
                        std::string(verdict_word(b.met)) + ")");
    if (v.met && !b.met)
      report.warnings.push_back(v.name + ": met with the fitted values but not demonstrated at the 95 % bound of the "
                                "fit; more study data (or a longer process) is needed to claim it with confidence");
    v.at_fit_bound = b;
  }
}

}  // namespace coldcore
