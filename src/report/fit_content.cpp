#include "fit_content.hpp"

#include <charconv>
#include <cmath>

#include "coldcore/report/format.hpp"

namespace coldcore::detail {

using namespace process;

std::string sci(double x, int significant) {
  if (!std::isfinite(x)) return x > 0 ? "inf" : "n/a";
  char buf[64];
  const auto r = std::to_chars(buf, buf + sizeof buf, x, std::chars_format::scientific, significant - 1);
  return std::string(buf, r.ptr);
}

namespace {

std::string minutes(double s) { return fixed(s / 60.0, 1) + " min"; }
std::string h_text(double h) { return std::isfinite(h) ? fixed(h, 0) + " W/m²K" : "inf (surface at the medium)"; }

std::string status_text(CurveStatus s) {
  switch (s) {
    case CurveStatus::described: return "described";
    case CurveStatus::too_few_points: return "too few readings far enough from the medium";
    case CurveStatus::never_straight: return "no straight portion (the curve is still bending at its end)";
    case CurveStatus::no_driving_difference: return "the probe starts too close to the medium";
  }
  return "";
}

std::string stage_list(const std::vector<int>& stages, const std::vector<std::string>& names) {
  std::string s;
  for (int i : stages) s += (s.empty() ? "" : ", ") + names[static_cast<std::size_t>(i)];
  return s;
}

std::string temp(double c, TempUnit u) { return fixed(display_temp(c, u), 1) + " " + std::string(unit_symbol(u)); }

void add_fit_section(FitContent& out, const std::string& id, const std::string& heading, const FitResult& f,
                     const std::vector<std::string>& stage_name) {
  FitSection s;
  s.id = id;
  s.heading = heading;
  s.key_values.push_back({"probes fitted", std::to_string(f.probes.size())});
  s.key_values.push_back({"readings fitted", std::to_string(f.n_points) + " (" + std::to_string(f.n_parameters) +
                                                 " parameters: α, each fitted h and each probe's initial "
                                                 "temperature; " + std::to_string(f.dof) + " degrees of freedom)"});
  s.key_values.push_back({"α (thermal diffusivity)", sci(f.alpha_m2_s) + " m²/s, 95 % interval " +
                                                         sci(f.alpha_ci95_m2_s[0]) + " to " + sci(f.alpha_ci95_m2_s[1])});
  s.key_values.push_back({"k (α·ρ·cp)", fixed(f.conductivity_W_mK, 4) + " W/mK"});
  for (const FittedH& g : f.h) {
    const std::string key = "h, " + stage_list(g.stages, stage_name);
    switch (g.status) {
      case HStatus::fitted:
        s.key_values.push_back({key, h_text(g.h_W_m2K) + ", 95 % interval " + fixed(g.ci95_W_m2K[0], 0) + " to " +
                                         fixed(g.ci95_W_m2K[1], 0) + " (Bi " + fixed(g.biot, 2) + ")"});
        break;
      case HStatus::lower_bound:
        s.key_values.push_back({key, "at least " + h_text(g.h_W_m2K) +
                                         ": a higher h fits as well (Bi above " + fixed(g.biot, 1) +
                                         "), so h has no upper limit from these data; it is held at this lower bound, "
                                         "the slower-heating choice"});
        break;
      case HStatus::fixed_infinite:
        s.key_values.push_back({key, "inf, as the file gives it (not fitted)"});
        break;
      case HStatus::not_identified:
        s.key_values.push_back({key, h_text(g.h_W_m2K) +
                                         " kept from the file: no reading depends on it (not identified)"});
        break;
    }
  }
  s.key_values.push_back({"residual RMS", fixed(f.rms_K, 3) + " K"});
  for (const FittedH& g : f.h)  // the first fitted group is parameter 1 of the correlation matrix
    if (g.status == HStatus::fitted && f.correlation.size() > 1) {
      s.key_values.push_back({"correlation of ln α and ln h (" + stage_list(g.stages, stage_name) + ")",
                              fixed(f.correlation[0][1], 3)});
      break;
    }
  if (f.intervals_span_bound)
    s.items.push_back("an h is only bounded below: the intervals of α and of the other h span the fit at that bound "
                      "and the fit with that h at the top of its range, since any larger h fits as well");
  if (!f.converged) s.items.push_back("the least-squares solver stopped before meeting its tolerance");
  if (f.at_limit)
    s.items.push_back("the fit ran to the edge of the accepted range of k (0.01 to 10 W/mK) or h (0.1 to 1e6 "
                      "W/m²K): these readings do not look like this product in this process; check the probe "
                      "position, the logs and the file before using any value here");
  out.sections.push_back(std::move(s));
}

}  // namespace

FitContent fit_content(const StudyAnalysis& a, const FitReportContext& c, TempUnit u) {
  FitContent out;
  out.title = "Heat-penetration study: " + c.product_name;
  out.lead = "A calibration of the exact conduction model to measured cold-spot temperatures. The fitted values "
             "describe these containers in this equipment; they are estimates with the stated intervals.";
  const std::vector<std::string>& stage_name = c.stage_names;

  FitSection ph;
  ph.id = "phases";
  ph.heading = "Process phases (from the schedule)";
  ph.key_values = {{"heating until", minutes(a.phases.heating_end_s)},
                   {"T_R (medium while heating)", temp(a.phases.retort_C, u)},
                   {"come-up", minutes(a.phases.come_up_s)},
                   {"corrected zero (58 % of come-up)", minutes(a.phases.corrected_zero_s)}};
  if (a.phases.has_cooling) ph.key_values.push_back({"T_W (cooling medium)", temp(a.phases.cooling_medium_C, u)});
  out.sections.push_back(ph);

  FitSection cv;
  cv.id = "curves";
  cv.heading = "Heating and cooling curves, per probe";
  cv.table.push_back({"probe", "T_I", "f_h", "j_h", "straight portion", "r²", "f_c", "j_c", "F delivered", "note"});
  cv.numeric = {false, true, true, true, false, true, true, true, true, false};
  for (std::size_t i = 0; i < a.curves.size(); ++i) {
    const ProbeDescription& d = a.curves[i];
    const CurveDescription& h = d.heating;
    std::vector<std::string> row{d.name, temp(d.initial_C, u)};
    if (h.status == CurveStatus::described) {
      row.push_back(minutes(h.f_s));
      row.push_back(fixed(h.j, 3));
      row.push_back(minutes(h.straight.from_s) + " to " + minutes(h.straight.to_s) + ", " +
                    std::to_string(h.straight.points) + " points");
      row.push_back(fixed(h.straight.r2, 4));
    } else {
      row.insert(row.end(), {"—", "—", status_text(h.status), "—"});
    }
    if (d.cooling && d.cooling->status == CurveStatus::described) {
      row.push_back(minutes(d.cooling->f_s));
      row.push_back(fixed(d.cooling->j, 3));
    } else {
      row.insert(row.end(), {"—", "—"});
    }
    row.push_back(d.F_s ? fixed(std::floor(*d.F_s / 60.0 * 100.0) / 100.0, 2) + " min" : "—");
    std::string note;
    if (static_cast<int>(i) == a.slowest) note = "slowest heating (design)";
    if (static_cast<int>(i) == a.least_lethality) note += std::string(note.empty() ? "" : "; ") + "least lethality";
    if (h.broken)
      note += std::string(note.empty() ? "" : "; ") + "BROKEN heating: f_h " + minutes(h.f_s) + " then " +
              minutes(h.f2_s) + " after " + minutes(h.break_s);
    if (d.hotter_than_medium)
      note += std::string(note.empty() ? "" : "; ") + "reading " + std::to_string(d.hotter_than_medium->reading) +
              " is hotter than the medium while heating (" + temp(d.hotter_than_medium->probe_C, u) + " against " +
              temp(d.hotter_than_medium->medium_C, u) + "): misplaced or swapped thermocouple?";
    row.push_back(note);
    cv.table.push_back(row);
  }
  cv.paragraphs.push_back(
      "f is the time for the straight portion of log(|T_medium − T|) to fall by one log cycle; j the lag factor "
      "at the corrected zero (heating) or at the start of cooling. Straight portion: the longest run of readings "
      "ending at the last reading at least 2 K from the medium whose least-squares line keeps every reading within "
      "max(0.5 K, 1.5 %) of it and spans at least 0.3 log cycles. A broken curve (a later slope slower by more "
      "than 20 %) is reported with both slopes, never forced into one line.");
  out.sections.push_back(cv);

  add_fit_section(out, "fit", "Model fit to the slowest-heating probe (design value)", a.fit_slowest, stage_name);
  out.sections.back().statements.push_back("Design value: the slowest-heating probe, " +
                                           a.curves[static_cast<std::size_t>(a.slowest)].name +
                                           " (common practice: a process is set for the slowest container).");
  if (a.fit_pool) add_fit_section(out, "pool", "Model fit to all probes together (for comparison)", *a.fit_pool, stage_name);

  if (a.cross_check) {
    FitSection x;
    x.id = "cross-check";
    x.heading = "Cross-check by the first-term relations";
    const FirstTermEstimate& e = a.cross_check->estimate;
    if (e.status == FirstTermStatus::j_below_one) {
      x.paragraphs.push_back("j_h is below 1: the first-term relations give no estimate.");
    } else {
      x.key_values = {{"f_h measured / predicted by the fit's first term",
                       minutes(a.curves[static_cast<std::size_t>(a.slowest)].heating.f_s) + " / " +
                           minutes(a.cross_check->predicted.f_s)},
                      {"j_h measured / predicted", fixed(a.curves[static_cast<std::size_t>(a.slowest)].heating.j, 3) +
                                                       " / " + fixed(a.cross_check->predicted.j, 3)},
                      {"α from f_h and ζ1(Bi)", sci(e.alpha_m2_s) + " m²/s"},
                      {"Bi from j_h = C1(Bi)", std::isfinite(e.biot_smallest_dimension)
                                                   ? fixed(e.biot_smallest_dimension, 2)
                                                   : std::string("inf (j_h at or above the Bi = ∞ value)")},
                      {"first-term α / fitted α", fixed(a.cross_check->alpha_ratio, 3)}};
      x.paragraphs.push_back(
          a.cross_check->disagrees
              ? "The f_h the fitted model predicts differs from the measured one by more than 10 %: check the "
                "straight portion, the come-up and the probe position before using either."
              : "The f_h the fitted model predicts agrees with the measured one within 10 %. (Bi from j_h is "
                "ill-conditioned at high Bi and j_h rests on the corrected zero, so α from (f_h, j_h) is shown but "
                "not used for the flag.)");
    }
    out.sections.push_back(x);
  }
  if (a.classical) {
    const ClassicalEstimate& ce = *a.classical;
    FitSection b;
    b.id = "classical";
    b.heading = "Ball's formula beside the exact model (" + ce.target + ")";
    if (!ce.ball.in_table) {
      b.paragraphs.push_back("f_h/U = " + fixed(ce.ball.fh_over_U, 2) +
                             " lies outside the f_h/U : log g table (0.5 to 200): no Ball estimate is made.");
    } else {
      b.key_values = {{"f_h/U", fixed(ce.ball.fh_over_U, 3)},
                      {"log g (°F), interpolated", fixed(ce.ball.log10_g_F, 3) + " (interpolation uncertainty ±" +
                                                       fixed(ce.ball.interpolation_error_log10_g, 3) + ")"},
                      {"B (from the corrected zero)", minutes(ce.ball.B_s)},
                      {"operator's process time (B − 0.42 · come-up)", minutes(ce.ball.operator_time_s)}};
      if (!ce.ball.z_matches_table)
        b.items.push_back("the table is for z = 10 °C (18 °F); this target's z differs, so Ball's value is only indicative");
    }
    if (ce.exact_hold_s) {
      b.key_values.push_back({"exact model: hold of " + ce.stage, minutes(*ce.exact_hold_s) + " (rounded up)"});
      if (ce.ball.in_table)
        b.key_values.push_back({"difference (Ball − exact)", fixed((ce.ball.operator_time_s - *ce.exact_hold_s) / 60.0, 1) + " min"});
    } else if (!ce.exact_failed.empty()) {
      b.items.push_back("exact model: no hold time: " + ce.exact_failed);
    }
    b.paragraphs.push_back("Ball's method assumes a straight heating curve from the corrected zero and j_c = 1.41; "
                           "the exact model follows the whole logged process. Use the longer of the two only with a "
                           "process authority's review.");
    out.sections.push_back(b);
  }
  if (!c.written_product.empty()) {
    FitSection w;
    w.id = "written";
    w.heading = "Calibrated product file";
    w.paragraphs.push_back("Written to " + c.written_product +
                           ": the fitted k and h with their 95 % intervals as ranges (used by --conservative) and the "
                           "covariance (used for the bound that run and solve report).");
    out.sections.push_back(w);
  }
  FitSection pv;
  pv.id = "provenance";
  pv.heading = "Provenance";
  pv.key_values = c.provenance;
  pv.items = c.warnings;
  out.sections.push_back(pv);
  return out;
}

}  // namespace coldcore::detail
