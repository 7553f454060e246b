// A measured cold-spot (probe) log as the assessment sees it: linear between rows, lethality by
// three exact rules on the rows, nothing credited across a gap.
#include <algorithm>
#include <cmath>

#include "coldcore/lethality/integrate.hpp"
#include "coldcore/process/assessment.hpp"
#include "lethality/detail/crossing.hpp"
#include "process/detail/assessed_curve.hpp"

namespace coldcore {

using namespace assessing;

namespace {

class LogCurve final : public AssessedCurve {
 public:
  LogCurve(std::span<const double> times_s, std::span<const double> temps_C, const AssessOptions& o,
           std::string_view origin)
      : times_s_(times_s), temps_C_(temps_C), o_(o), origin_(origin),
        curve_(detail::linear_log_curve(times_s, temps_C)), gaps_(gaps_of_log(times_s, o.max_gap_s)) {}

  LethalityEvidence lethality(const Target& t, const Resolved& res, const std::string&) const override {
    LethalityEvidence e;
    ProbeLethality pl;
    pl.name = label_of(t);
    const LogIntegral tr = f_trapezoid_s(times_s_, temps_C_, res.k, origin_, o_.max_gap_s);
    pl.F_trapezoid_s = tr.F_s;
    pl.F_simpson_s = f_simpson_s(times_s_, temps_C_, res.k, origin_, o_.max_gap_s).F_s;
    pl.F_linear_s = f_piecewise_linear_s(times_s_, temps_C_, res.k, origin_, o_.max_gap_s).F_s;
    for (const auto& [a, b] : gaps_)  // issue 11: no lethality credited where nothing was recorded
      e.notes.push_back(gap_note(Credit::lethality, a, b, o_.max_gap_s));
    e.F_s = std::min({pl.F_trapezoid_s, pl.F_simpson_s, pl.F_linear_s});
    const double hi = std::max({pl.F_trapezoid_s, pl.F_simpson_s, pl.F_linear_s});
    if (e.F_s > 0 && hi - e.F_s > 0.01 * e.F_s)
      e.warnings.push_back({AssessmentWarningKind::log_rules_disagree, pl.name, (hi - e.F_s) / e.F_s});
    for (const auto& n : tr.notes) e.warnings.push_back({AssessmentWarningKind::log_sampling, pl.name, 0, n});
    if (!t.stages.empty()) e.notes.push_back({TargetNoteKind::stages_ignored_on_log});
    if (res.organism) {  // out-of-range share on the linear interpolant
      e.share_base_s = pl.F_linear_s;
      e.F_outside_range_s = f_at_or_above(res.k.valid_max_C, res.k) +
                            std::max(0.0, pl.F_linear_s - f_at_or_above(res.k.valid_min_C, res.k));
    }
    // The log's rows are the data: the smallest of three exact rules on them is credited, so
    // the bound is the rounding of the sums (a few ulp per row).
    e.F_error_s = 4 * kEps * static_cast<double>(times_s_.size() + 4) * std::abs(e.F_s);
    e.rules = pl;
    return e;
  }

  CoolingEvidence cooling(const Target&, const CoolingRule& rule) const override {
    CoolingContext ctx;
    ctx.cook_end_s = o_.cook_end_s;
    ctx.chill_start_s = o_.chill_start_s;
    ctx.unrecorded_s = gaps_;
    ctx.where = "probe";  // a measured log: what it shows is where the probe was
    CoolingEvidence e;
    e.check = check_cooling(times_s_, temps_C_, rule, ctx, origin_);
    e.error = exact_rows();
    return e;
  }

  CookingEvidence cooking(const Target&, const CookingTable& table) const override {
    CookingEvidence e;
    if (gaps_.empty()) {
      e.check = check_cooking_table(times_s_, temps_C_, table, origin_);
      e.fraction_uncertainty = cooking_uncertainty(curve_, table, e.check, 0.0);
    } else {  // no time at temperature credited across a gap
      detail::Curve c = curve_;
      c.temp_C_at = recorded_only(curve_.temp_C_at, gaps_);
      add_gap_knots(c.knots, gaps_);
      e.check = check_cooking_table(c.temp_C_at, c.knots, table, c.probes);
      e.fraction_uncertainty = cooking_uncertainty(c, table, e.check, 0.0);
      e.notes = gap_notes(gaps_, times_s_.front(), Credit::time_at_temperature);
    }
    return e;
  }

  MinTemperatureEvidence min_temperature(const Target&) const override {
    MinTemperatureEvidence e;
    e.curve = curve_;
    e.error = exact_rows();
    e.gaps = gaps_;
    return e;
  }

 private:
  /// The rows are the data: a crossing's error is only that of finding it on the interpolant.
  CrossingError exact_rows() const { return crossing_error(curve_.temp_C_at, 0.0, curve_.start(), curve_.end()); }

  /// F of the linear interpolant over the times at or above T_C.
  double f_at_or_above(double T_C, const Kinetics& k) const {
    double F = 0;
    for (const auto& [a, b] : curve_.intervals_at_or_above(T_C, curve_.start()))
      F += f_value(curve_.temp_C_at, knots_of(curve_, a, b), k, o_.rel_tol).F_s;
    return F;
  }

  std::span<const double> times_s_, temps_C_;
  const AssessOptions& o_;
  std::string_view origin_;
  detail::Curve curve_;
  Gaps gaps_;
};

}  // namespace

ProbeAssessment assess_probe_log(std::span<const double> times_s, std::span<const double> temps_C,
                                 const std::vector<Target>& targets, const OrganismLibrary& organisms,
                                 const RuleLibrary& rules, const AssessOptions& opts,
                                 std::string_view origin) {
  validate_log(times_s, temps_C, origin);
  AssessedTargets a = assess_targets(LogCurve(times_s, temps_C, opts, origin), targets, organisms, rules, opts);
  ProbeAssessment out;
  out.targets = std::move(a.targets);
  out.lethality = std::move(a.rules);
  out.warnings = std::move(a.warnings);
  return out;
}

}  // namespace coldcore
