#include "coldcore/process/assessment.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "lethality/detail/crossing.hpp"
#include "process/detail/assessed_curve.hpp"


namespace coldcore {

using namespace assessing;

namespace {

/// A model history as the assessment sees it: exact where the engine can evaluate, linear
/// between samples otherwise.
class HistoryCurve final : public AssessedCurve {
 public:
  HistoryCurve(const History& h, const AssessOptions& o)
      : h_(h), o_(o), centre_(temp_function(h, false)), mean_(temp_function(h, true)),
        t0_(h.samples.front().time_s), t1_(std::max(h.samples.back().time_s, h.end_s())),
        // Temperature accuracy behind every margin's bound; samples interpolated linearly are
        // within the engine's sample_tol_K (0.01 K, conduction/history.hpp) on top of it.
        tol_K_(std::max(0.0, o.temperature_tol_K) + (h.evaluate ? 0.0 : 0.01)) {}

  LethalityEvidence lethality(const Target& t, const Resolved& res, const std::string& place) const override {
    LethalityEvidence e;
    double F_err_s = 0;  // quadrature error estimates of the credited F
    if (h_.stages.empty()) {
      e.F_s = f_between(h_, centre_, t0_, t1_, res.k, o_.rel_tol, &F_err_s);
    } else {
      e.credited_stages = credited(t, h_, place);
      for (std::size_t s = 0; s < h_.stages.size(); ++s) {
        StageLethality sl;
        sl.stage = h_.stages[s].name;
        double stage_err_s = 0;
        sl.F_s = f_recorded(h_, centre_, h_.stages[s].start_s, h_.stages[s].end_s, res.k, o_.rel_tol,
                            o_.unrecorded_s, &stage_err_s);
        sl.credited = std::find(e.credited_stages.begin(), e.credited_stages.end(), static_cast<int>(s)) !=
                      e.credited_stages.end();
        if (sl.credited) F_err_s += stage_err_s;
        sl.F_text = minutes_down(sl.F_s);
        if (sl.credited) e.F_s += sl.F_s;
        e.stages.push_back(sl);
      }
      // Without gaps a stage's F is f_between over the whole stage: outside_range reuses it.
      std::vector<double> stage_F_s;
      if (o_.unrecorded_s.empty())
        for (const auto& sl : e.stages) stage_F_s.push_back(sl.F_s);
      e.F_outside_range_s = outside_range(h_, centre_, res.k, e.credited_stages, o_.rel_tol, stage_F_s);
    }
    e.share_base_s = e.F_s;
    e.unrecorded_s = o_.unrecorded_s;
    e.notes = gap_notes(o_.unrecorded_s, t0_, Credit::lethality);
    // The quadrature stops when its error estimate is within rel_tol·F (integrate.hpp), so
    // rel_tol·F bounds it; taken as the bound (not the estimate itself, which jumps as the
    // adaptive mesh changes) so that the margin stays smooth in a solve's parameter.
    e.F_error_s = std::max(F_err_s, o_.rel_tol * e.F_s) + e.F_s * f_relative_error_of_temperature(res.k, tol_K_);
    return e;
  }

  CoolingEvidence cooling(const Target& t, const CoolingRule& rule) const override {
    const auto& T = at(t);
    CoolingEvidence e;
    CoolingContext ctx = infer_context(h_, rule, o_, T, e.notes);
    ctx.where = t.at == "mean" ? "mass-average temperature" : "cold spot";
    ctx.unrecorded_s = o_.unrecorded_s;
    std::vector<double> bp = knots(h_, t0_, t1_);
    e.check = check_cooling(T, bp, rule, ctx, probes_for(bp));
    e.error = crossing_error(T, tol_K_, t0_, t1_);
    return e;
  }

  CookingEvidence cooking(const Target& t, const CookingTable& table) const override {
    detail::Curve c;
    c.temp_C_at = recorded_only(at(t), o_.unrecorded_s);
    c.knots = knots(h_, t0_, t1_);
    add_gap_knots(c.knots, o_.unrecorded_s);
    c.probes = probes_for(c.knots);
    CookingEvidence e;
    e.check = o_.unrecorded_s.empty() ? check_cooking_table(h_, table, t.at == "mean")
                                      : check_cooking_table(c.temp_C_at, c.knots, table, c.probes);
    e.fraction_uncertainty = cooking_uncertainty(c, table, e.check, tol_K_);
    e.notes = gap_notes(o_.unrecorded_s, t0_, Credit::time_at_temperature);
    return e;
  }

  MinTemperatureEvidence min_temperature(const Target& t) const override {
    MinTemperatureEvidence e;
    e.curve.temp_C_at = at(t);
    e.curve.knots = knots(h_, t0_, t1_);
    e.curve.probes = probes_for(e.curve.knots);
    e.error = crossing_error(at(t), tol_K_, t0_, t1_);
    e.gaps = o_.unrecorded_s;
    e.notes = gap_notes(o_.unrecorded_s, t0_, Credit::hold_time);
    return e;
  }

 private:
  const std::function<double(double)>& at(const Target& t) const { return t.at == "mean" ? mean_ : centre_; }

  const History& h_;
  const AssessOptions& o_;
  std::function<double(double)> centre_, mean_;
  double t0_, t1_, tol_K_;
};

}  // namespace

Assessment assess(const History& h, const std::vector<Target>& targets, const OrganismLibrary& organisms,
                  const RuleLibrary& rules, const AssessOptions& opts) {
  Assessment out;
  if (h.samples.empty()) throw InputError(opts.origin + ": history: no samples to assess");
  if (!h.evaluate)
    out.warnings.push_back({AssessmentWarningKind::interpolated_history});
  AssessedTargets a = assess_targets(HistoryCurve(h, opts), targets, organisms, rules, opts);
  out.targets = std::move(a.targets);
  for (auto& w : a.warnings) out.warnings.push_back(std::move(w));
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

}  // namespace coldcore
