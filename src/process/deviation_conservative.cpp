#include "coldcore/process/deviation_conservative.hpp"

#include <algorithm>
#include <limits>
#include <optional>

#include "coldcore/error.hpp"
#include "process/detail/parallel.hpp"

namespace coldcore::process {

namespace {

double least_margin(const DeviationResult& r) {
  double m = std::numeric_limits<double>::infinity();
  for (const auto& t : r.targets) m = std::min(m, target_margin(t.delivered));
  return m;
}

/// How much extra hold a result needs; none computable because nothing restores it: +inf.
double hold_need(const DeviationResult& r) {
  if (r.extra_hold_s) return *r.extra_hold_s;
  if (r.extra_hold_none == NoHoldReason::no_extension_restores) return std::numeric_limits<double>::infinity();
  return 0;
}

}  // namespace

std::vector<RangeChoice> deviation_worst_case_choices(const DeviationInput& in, const Ranges& r, InitialChoice* initial) {
  const Scenario& s = in.scheduled;
  bool has_rule = false;
  for (const auto& t : s.targets) has_rule = has_rule || t.kind == TargetKind::cooling_rule;
  const bool stage_ok = in.stage >= 0 && in.stage < static_cast<int>(s.stages.size());
  const bool heats = stage_ok && heating_stage(s, static_cast<std::size_t>(in.stage));
  const bool heating = heats || !has_rule;
  if (initial != nullptr && r.initial_C) {
    if (stage_ok) initial->deviated_stage = s.stages[static_cast<std::size_t>(in.stage)].name;
    initial->reason = heats     ? InitialChoiceReason::deviated_stage_heats
                      : heating ? InitialChoiceReason::cools_without_rule
                                : InitialChoiceReason::cools_with_rule;
  }
  return worst_case_choices(s, r, heating, true);
}

ConservativeDeviation evaluate_deviation_conservative(const DeviationInput& in, const Ranges& r, const Libraries& libs,
                                                      const DeviationOptions& o, unsigned threads) {
  if (!in.medium_log)
    throw InputError("deviation --conservative: needs --medium-log; a measured probe log does not depend on the "
                     "file's ranges");
  ConservativeDeviation out;
  const auto choices = deviation_worst_case_choices(in, r, &out.initial);
  if (choices.empty())
    throw InputError(in.scheduled.origin + ": --conservative: the file gives no range that applies to the deviation "
                     "([product.ranges] or h_range_W_m2K; a medium_type stage is already taken at the end "
                     "conservative for each target)");
  DeviationInput base = in;  // the probe is a measurement: not re-evaluated under the ranges
  base.probe_time_s.clear();
  base.probe_temp_C.clear();
  DeviationInput all = base;
  for (const auto& c : choices) {
    out.choices.push_back(c.setting);
    c.apply(all.scheduled);
  }
  // Slot 0: every choice together; slot k: choice k alone. Independent evaluations, run on the
  // machine's cores; read below in the serial order.
  std::vector<std::optional<DeviationResult>> results(choices.size() + 1);
  detail::for_each_index(
      choices.size() + 1,
      [&](std::size_t k) {
        DeviationInput x = k == 0 ? all : base;
        if (k > 0) choices[k - 1].apply(x.scheduled);
        results[k] = evaluate_deviation(x, libs, o);
      },
      threads);
  out.result = std::move(*results[0]);
  out.result.assumptions.push_back({ProcessNoteKind::assumes_worst_case_replay});
  double worst_hold = -1, worst_margin = std::numeric_limits<double>::infinity();
  for (std::size_t k = 1; k <= choices.size(); ++k) {
    const DeviationResult& d = *results[k];
    DeviationChoiceResult a;
    a.choice = choices[k - 1].setting;
    a.all_met_delivered = d.all_met_delivered;
    a.least_margin = least_margin(d);
    a.extra_hold_s = d.extra_hold_s;
    a.extra_hold_none = d.extra_hold_none;
    const double need = hold_need(d);
    if (need > worst_hold || (need == worst_hold && a.least_margin < worst_margin)) {
      worst_hold = need;
      worst_margin = a.least_margin;
      out.driven_by = k - 1;
    }
    out.alone.push_back(std::move(a));
  }
  return out;
}

}  // namespace coldcore::process
