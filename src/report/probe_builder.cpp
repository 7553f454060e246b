// The report model of `coldcore probe`: measured data, named as such.
#include "coldcore/report/target_notes.hpp"
#include "coldcore/report/probe_report.hpp"

#include "coldcore/lethality/integrate.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/run_builder.hpp"
#include "coldcore/report/temperature_text.hpp"

namespace coldcore {

namespace {

// Lethality delivered without a requirement: F (and log reductions when a D is known), the
// evidence lines of the verdict row, but no "F needed" and no verdict.
DeliveredRow delivered_row(const TargetResult& t, const VerdictRow& v) {
  const Kinetics& k = *t.kinetics;
  DeliveredRow d;
  d.name = t.name;
  d.kind = to_string(t.kind);
  d.F_s = t.F_s;
  d.reference_C = k.reference_C;
  d.z_C = k.z_C;
  d.F_text = shown_down(t.F_s / 60.0) + " min at " + temp_token_fixed(k.reference_C, 1) + " (z " +
             temp_difference_token_fixed(k.z_C, 2) + ")";
  if (t.kind == TargetKind::log_reduction) {
    d.log_reduction = t.achieved;
    d.log_text = t.achieved_text;
  }
  for (const auto& line : v.details) {
    if (line.rfind("credited F = ", 0) == 0) continue;  // carries "F needed": said in F_text instead
    d.details.push_back(line);
  }
  d.details.push_back("no target was given (--target-log, or --F-min with own kinetics): the delivered lethality "
                      "is shown and no verdict is claimed");
  return d;
}

}  // namespace

RunReport build_probe_report(const TimeSeries& log, const ProbeAssessment& pa, const ProbeReportOptions& opts) {
  RunReport r;
  r.verb = "probe";
  r.title = "coldcore probe: measured cold-spot log " + opts.log_path + (opts.lot.empty() ? "" : ", lot " + opts.lot);
  MeasuredSource m;
  m.log = opts.log_path;
  m.lot = opts.lot;
  m.start_unix_s = log.start_unix_s;
  m.readings = log.time_s.size();
  r.measured = m;

  const double span = log.time_s.back() - log.time_s.front();
  r.product = {{"log", opts.log_path}, {"lot", opts.lot.empty() ? "not given (--lot)" : opts.lot}};
  r.product.push_back({"columns", log.time_column + ", " + log.temp_column});
  r.product.push_back({"readings", std::to_string(log.time_s.size())});
  if (log.start_unix_s) {
    r.product.push_back({"first reading", utc_text(*log.start_unix_s)});
    r.product.push_back({"last reading", utc_text(*log.start_unix_s + span)});
  } else {
    r.product.push_back({"clock time", "not in the log (its time column counts from its first row)"});
  }
  r.product.push_back({"duration", duration_text(span)});
  r.product.push_back({"mean interval", duration_text(log.time_s.size() > 1
                                                          ? span / static_cast<double>(log.time_s.size() - 1)
                                                          : 0.0)});

  r.history.columns = {{"time_s", false}, {"measured_C", true}};
  for (size_t i = 0; i < log.time_s.size(); ++i) r.history.rows.push_back({log.time_s[i], log.temp_C[i]});
  size_t lethal_index = 0;
  for (const TargetResult& t : pa.targets) {
    VerdictRow v = verdict_row(t);
    if (t.kinetics) {
      const ProbeLethality& pl = pa.lethality.at(lethal_index++);
      v.general_method_F_min = std::array<double, 3>{pl.F_trapezoid_s / 60.0, pl.F_simpson_s / 60.0, pl.F_linear_s / 60.0};
      v.details.insert(v.details.begin(),
                       "General Method on the log: trapezoid " + shown_down(pl.F_trapezoid_s / 60.0) + " min, Simpson " +
                           shown_down(pl.F_simpson_s / 60.0) + " min, exact on the linear interpolant " +
                           shown_down(pl.F_linear_s / 60.0) + " min; the " +
                           (opts.lethality_requirement ? "verdict" : "delivered F") + " uses the smallest");
      const auto cum = cumulative_f_trapezoid_s(log.time_s, log.temp_C, *t.kinetics, opts.log_path, opts.max_gap_s);
      const std::string col = t.column.empty() ? "F_" + t.name + "_min" : t.column;
      r.history.columns.push_back({col, false});
      for (size_t k = 0; k < cum.size(); ++k) r.history.rows[k].push_back(cum[k] / 60.0);
      if (!opts.lethality_requirement) {
        r.delivered.push_back(delivered_row(t, v));
        continue;  // no verdict row, no required line
      }
      r.target_lines.push_back({col, t.F_required_s / 60.0, "required " + t.name + " " + minutes_up(t.F_required_s)});
    }
    if (t.cooling) {
      int n = 0;
      for (const auto& st : t.cooling->steps) {
        ++n;
        if (st.start_s && log.start_unix_s)  // the step's clock on the log's clock (a record reads it so)
          v.details.push_back("step " + st.step.label + ": clock started " + utc_text(*log.start_unix_s + *st.start_s) +
                              ", deadline " + utc_text(*log.start_unix_s + *st.start_s + st.step.within_s));
        if (st.start_s)
          r.rule_boxes.push_back({"step " + std::to_string(n) + " (" + duration_text(st.step.within_s) + ")", *st.start_s,
                                  *st.start_s + st.step.within_s, st.step.from_C, st.step.to_C,
                                  st.step.from_text + " → " + st.step.to_text});
      }
    }
    r.verdicts.push_back(v);
  }
  r.warnings = log.warnings;
  for (const auto& w : pa.warnings) r.warnings.push_back(assessment_warning_text(w));
  r.assumptions = {"The log is the temperature at the product's slowest-heating point; its placement and the probe's "
                   "calibration are the user's to verify.",
                   "Temperatures between logged rows are taken as linear in time.",
                   "Lethality uses log-linear (Bigelow) kinetics with the D and z values stated."};
  r.provenance = {{"tool", "coldcore " + opts.version}, {"input", opts.log_path}, {"input SHA-256", opts.log_sha256}};
  r.provenance.insert(r.provenance.end(), opts.library_provenance.begin(), opts.library_provenance.end());
  if (!opts.date.empty()) r.provenance.push_back({"date", opts.date});
  r.cautions = measured_cautions();
  return r;
}

}  // namespace coldcore
