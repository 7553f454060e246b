#include "coldcore/process/assessment.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "lethality/detail/crossing.hpp"
#include "process/detail/assessing.hpp"


namespace coldcore {

using namespace assessing;

Assessment assess(const History& h, const std::vector<Target>& targets, const OrganismLibrary& organisms,
                  const RuleLibrary& rules, const AssessOptions& opts) {
  Assessment out;
  if (h.samples.empty()) throw InputError(opts.origin + ": history: no samples to assess");
  if (!h.evaluate)
    out.warnings.push_back({AssessmentWarningKind::interpolated_history});
  const auto centre = temp_function(h, false);
  const auto mean = temp_function(h, true);
  const double t0 = h.samples.front().time_s;
  const double t1 = std::max(h.samples.back().time_s, h.end_s());
  // Temperature accuracy behind every margin's bound; samples interpolated linearly are within
  // the engine's sample_tol_K (0.01 K, conduction/history.hpp) on top of it.
  const double tol_K = std::max(0.0, opts.temperature_tol_K) + (h.evaluate ? 0.0 : 0.01);
  for (std::size_t i = 0; i < targets.size(); ++i) {
    const Target& t = targets[i];
    const std::string place = opts.origin + ": target[" + std::to_string(i + 1) + "]";
    TargetResult r;
    r.kind = t.kind;
    r.name = label_of(t);
    if (t.at != "centre" && t.at != "mean")
      throw InputError(place + ".at = \"" + t.at + "\": must be \"centre\" or \"mean\"");
    const auto& T_at = t.at == "mean" ? mean : centre;
    switch (t.kind) {
      case TargetKind::log_reduction:
      case TargetKind::f_value: {
        const Resolved res = resolve(t, place, organisms);
        r.kinetics = res.k;
        r.column = "F_" + r.name + "_min";
        r.source = res.k.source;
        double F_err_s = 0;  // quadrature error estimates of the credited F
        if (h.stages.empty()) {
          r.F_s = f_between(h, centre, t0, t1, res.k, opts.rel_tol, &F_err_s);
        } else {
          r.credited_stages = credited(t, h, place);
          for (std::size_t s = 0; s < h.stages.size(); ++s) {
            StageLethality sl;
            sl.stage = h.stages[s].name;
            double stage_err_s = 0;
            sl.F_s = f_recorded(h, centre, h.stages[s].start_s, h.stages[s].end_s, res.k, opts.rel_tol, opts.unrecorded_s,
                                &stage_err_s);
            sl.credited = std::find(r.credited_stages.begin(), r.credited_stages.end(),
                                    static_cast<int>(s)) != r.credited_stages.end();
            if (sl.credited) F_err_s += stage_err_s;
            sl.F_text = minutes_down(sl.F_s);
            if (sl.credited) r.F_s += sl.F_s;
            r.stages.push_back(sl);
          }
          r.F_outside_range_s = outside_range(h, centre, res.k, r.credited_stages, opts.rel_tol);
        }
        r.unrecorded_s = opts.unrecorded_s;
        gap_notes(r, opts.unrecorded_s, t0, Credit::lethality);
        // The quadrature stops when its error estimate is within rel_tol·F (integrate.hpp), so
        // rel_tol·F bounds it; taken as the bound (not the estimate itself, which jumps as the
        // adaptive mesh changes) so that the margin stays smooth in a solve's parameter.
        F_err_s = std::max(F_err_s, opts.rel_tol * r.F_s);
        F_err_s += r.F_s * f_relative_error_of_temperature(res.k, tol_K);
        lethality_verdict(r, t, res, opts, place, F_err_s);
        provenance_notes(r, res);
        if (r.F_s > 0 && r.F_outside_range_s > opts.out_of_range_flag_fraction * r.F_s)
          r.notes.push_back(outside_range_note(r.F_outside_range_s / r.F_s, res.k));
        break;
      }
      case TargetKind::cooling_rule: {
        const CoolingRule& rule = rules.at(t.rule, place);
        std::vector<TargetNote> ctx_notes;
        CoolingContext ctx = infer_context(h, rule, opts, T_at, ctx_notes);
        ctx.where = t.at == "mean" ? "mass-average temperature" : "cold spot";
        ctx.unrecorded_s = opts.unrecorded_s;
        std::vector<double> bp = knots(h, t0, t1);
        const CoolingCheck c = check_cooling(T_at, bp, rule, ctx, probes_for(bp));
        cooling_result(r, c, rule, crossing_error(T_at, tol_K, t0, t1));
        for (auto& n : ctx_notes) r.notes.push_back(n);
        break;
      }
      case TargetKind::cooking_table: {
        const CookingTable& table = cooking_table_for(t, place, opts);
        detail::Curve c;
        c.temp_C_at = recorded_only(T_at, opts.unrecorded_s);
        c.knots = knots(h, t0, t1);
        add_gap_knots(c.knots, opts.unrecorded_s);
        c.probes = probes_for(c.knots);
        const CookingCheck check = opts.unrecorded_s.empty()
                                       ? check_cooking_table(h, table, t.at == "mean")
                                       : check_cooking_table(c.temp_C_at, c.knots, table, c.probes);
        cooking_result(r, check, cooking_uncertainty(c, table, check, tol_K));
        gap_notes(r, opts.unrecorded_s, t0, Credit::time_at_temperature);
        break;
      }
      case TargetKind::centre_min_temperature: {
        detail::Curve c;
        c.temp_C_at = T_at;
        c.knots = knots(h, t0, t1);
        c.probes = probes_for(c.knots);
        min_temperature_result(r, t, c, crossing_error(T_at, tol_K, t0, t1), opts.unrecorded_s);
        gap_notes(r, opts.unrecorded_s, t0, Credit::hold_time);
        break;
      }
    }
    out.targets.push_back(std::move(r));
  }
  return out;
}

std::vector<double> cumulative_f_s(const History& h, const TargetResult& r,
                                   std::span<const double> times_s, double rel_tol) {
  std::vector<double> out;
  if (!r.kinetics) return out;
  const auto centre = temp_function(h, false);
  const double t0 = h.samples.empty() ? 0.0 : h.samples.front().time_s;
  // Credited intervals: the credited stages, or everything when the history has no stages.
  std::vector<std::pair<double, double>> spans;
  if (h.stages.empty()) {
    spans.emplace_back(t0, std::numeric_limits<double>::infinity());
  } else {
    for (int i : r.credited_stages)
      for (const auto& piece : recorded_pieces(h.stages[static_cast<std::size_t>(i)].start_s,
                                               h.stages[static_cast<std::size_t>(i)].end_s, r.unrecorded_s))
        spans.push_back(piece);
  }
  double acc = 0, prev = t0;
  for (double t : times_s) {
    if (t > prev) {
      for (const auto& [a, b] : spans) {
        const double lo = std::max(a, prev), hi = std::min(b, t);
        if (hi > lo) acc += f_between(h, centre, lo, hi, *r.kinetics, rel_tol);
      }
      prev = t;
    }
    out.push_back(acc);
  }
  return out;
}

CookingCheck check_cooking_table(const History& h, const CookingTable& table, bool mean) {
  if (h.samples.empty()) throw InputError("history: no samples to check against " + table.key);
  const double t0 = h.samples.front().time_s;
  const double t1 = std::max(h.samples.back().time_s, h.end_s());
  const auto k = knots(h, t0, t1);
  if (k.size() < 2) throw InputError("history: a single instant cannot be checked against " + table.key);
  return check_cooking_table(temp_function(h, mean), k, table, probes_for(k));
}

ProbeAssessment assess_probe_log(std::span<const double> times_s, std::span<const double> temps_C,
                                 const std::vector<Target>& targets, const OrganismLibrary& organisms,
                                 const RuleLibrary& rules, const AssessOptions& opts,
                                 std::string_view origin) {
  validate_log(times_s, temps_C, origin);
  ProbeAssessment out;
  const detail::Curve curve = detail::linear_log_curve(times_s, temps_C);
  for (std::size_t i = 0; i < targets.size(); ++i) {
    const Target& t = targets[i];
    const std::string place = opts.origin + ": target[" + std::to_string(i + 1) + "]";
    TargetResult r;
    r.kind = t.kind;
    r.name = label_of(t);
    switch (t.kind) {
      case TargetKind::log_reduction:
      case TargetKind::f_value: {
        const Resolved res = resolve(t, place, organisms);
        r.kinetics = res.k;
        r.column = "F_" + r.name + "_min";
        r.source = res.k.source;
        ProbeLethality pl;
        pl.name = r.name;
        const LogIntegral tr = f_trapezoid_s(times_s, temps_C, res.k, origin, opts.max_gap_s);
        pl.F_trapezoid_s = tr.F_s;
        pl.F_simpson_s = f_simpson_s(times_s, temps_C, res.k, origin, opts.max_gap_s).F_s;
        pl.F_linear_s = f_piecewise_linear_s(times_s, temps_C, res.k, origin, opts.max_gap_s).F_s;
        if (std::isfinite(opts.max_gap_s))  // issue 11: no lethality credited where nothing was recorded
          for (std::size_t g = 1; g < times_s.size(); ++g)
            if (times_s[g] - times_s[g - 1] > opts.max_gap_s)
              r.notes.push_back(gap_note(Credit::lethality, times_s[g - 1], times_s[g], opts.max_gap_s));
        r.F_s = std::min({pl.F_trapezoid_s, pl.F_simpson_s, pl.F_linear_s});
        const double hi = std::max({pl.F_trapezoid_s, pl.F_simpson_s, pl.F_linear_s});
        if (r.F_s > 0 && hi - r.F_s > 0.01 * r.F_s)
          out.warnings.push_back({AssessmentWarningKind::log_rules_disagree, r.name, (hi - r.F_s) / r.F_s});
        for (const auto& n : tr.notes) out.warnings.push_back({AssessmentWarningKind::log_sampling, r.name, 0, n});
        if (!t.stages.empty())
          r.notes.push_back({TargetNoteKind::stages_ignored_on_log});
        // Out-of-range share on the linear interpolant.
        if (res.organism) {
          double outside = 0;
          const double total = pl.F_linear_s;
          for (const auto& [a, b] : curve.intervals_at_or_above(res.k.valid_max_C, curve.start())) {
            std::vector<double> bp = knots_of(curve, a, b);
            outside += f_value(curve.temp_C_at, bp, res.k, opts.rel_tol).F_s;
          }
          double in_or_above = 0;
          for (const auto& [a, b] : curve.intervals_at_or_above(res.k.valid_min_C, curve.start())) {
            std::vector<double> bp = knots_of(curve, a, b);
            in_or_above += f_value(curve.temp_C_at, bp, res.k, opts.rel_tol).F_s;
          }
          outside += std::max(0.0, total - in_or_above);
          r.F_outside_range_s = outside;
          if (total > 0 && outside > opts.out_of_range_flag_fraction * total)
            r.notes.push_back(outside_range_note(outside / total, res.k));
        }
        // The log's rows are the data: the smallest of three exact rules on them is credited, so
        // the bound is the rounding of the sums (a few ulp per row).
        const double F_err_s = 4 * kEps * static_cast<double>(times_s.size() + 4) * std::abs(r.F_s);
        lethality_verdict(r, t, res, opts, place, F_err_s);
        provenance_notes(r, res);
        out.lethality.push_back(pl);
        break;
      }
      case TargetKind::cooling_rule: {
        const CoolingRule& rule = rules.at(t.rule, place);
        CoolingContext ctx;
        ctx.cook_end_s = opts.cook_end_s;
        ctx.chill_start_s = opts.chill_start_s;
        ctx.unrecorded_s = gaps_of_log(times_s, opts.max_gap_s);
        ctx.where = "probe";  // a measured log: what it shows is where the probe was
        const CoolingCheck c = check_cooling(times_s, temps_C, rule, ctx, origin);
        cooling_result(r, c, rule, crossing_error(curve.temp_C_at, 0.0, curve.start(), curve.end()));
        break;
      }
      case TargetKind::cooking_table: {
        const CookingTable& table = cooking_table_for(t, place, opts);
        const Gaps gaps = gaps_of_log(times_s, opts.max_gap_s);
        if (gaps.empty()) {
          const CookingCheck check = check_cooking_table(times_s, temps_C, table, origin);
          cooking_result(r, check, cooking_uncertainty(curve, table, check, 0.0));
        } else {  // no time at temperature credited across a gap
          detail::Curve c = curve;
          c.temp_C_at = recorded_only(curve.temp_C_at, gaps);
          add_gap_knots(c.knots, gaps);
          const CookingCheck check = check_cooking_table(c.temp_C_at, c.knots, table, c.probes);
          cooking_result(r, check, cooking_uncertainty(c, table, check, 0.0));
          gap_notes(r, gaps, times_s.front(), Credit::time_at_temperature);
        }
        break;
      }
      case TargetKind::centre_min_temperature:
        min_temperature_result(r, t, curve, crossing_error(curve.temp_C_at, 0.0, curve.start(), curve.end()),
                               gaps_of_log(times_s, opts.max_gap_s));
        break;
    }
    out.targets.push_back(std::move(r));
  }
  return out;
}

}  // namespace coldcore
