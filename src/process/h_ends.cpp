#include "coldcore/process/h_ends.hpp"

#include <algorithm>

#include "coldcore/process/inverse.hpp"

#include "process/detail/inverse_text.hpp"

namespace coldcore::process {

namespace {

using detail::is_lethality;

bool credits(const Target& t, const std::string& stage) {
  return t.stages.empty() || std::find(t.stages.begin(), t.stages.end(), stage) != t.stages.end();
}

/// A lethality target credits stage i or a later one: the h of cooling stage i then matters to it.
bool credits_from(const Scenario& s, const Target& t, std::size_t i) {
  for (std::size_t j = i; j < s.stages.size(); ++j)
    if (credits(t, s.stages[j].name)) return true;
  return false;
}

HChoice choose(const Scenario& s, std::size_t i, const Target* t) {
  const StageHRange& r = *s.per_target_h[i];
  HChoice c;
  c.stage = i;
  c.stage_name = s.stages[i].name;
  c.low_W_m2K = r.low_W_m2K;
  c.high_W_m2K = r.high_W_m2K;
  c.range_label = r.label;
  const auto low = [&](HReason why) { c.end = HEnd::low; c.h_W_m2K = r.low_W_m2K; c.why = why; };
  const auto high = [&](HReason why) { c.end = HEnd::high; c.h_W_m2K = r.high_W_m2K; c.why = why; };
  if (heating_stage(s, i)) {
    low(t != nullptr && t->kind == TargetKind::cooling_rule ? HReason::heating_kept_for_rule : HReason::heating_slower);
    return c;
  }
  if (t == nullptr || t->kind == TargetKind::cooling_rule)
    low(HReason::cooling_slower_for_rule);
  else if (is_lethality(t->kind))
    if (credits_from(s, *t, i)) high(HReason::cooling_credited_faster);
    else low(HReason::cooling_not_credited);
  else
    high(HReason::cooling_faster_for_hold);
  return c;
}

bool same(const std::vector<HChoice>& a, const std::vector<HChoice>& b) {
  if (a.size() != b.size()) return false;
  for (std::size_t k = 0; k < a.size(); ++k)
    if (a[k].stage != b[k].stage || a[k].end != b[k].end) return false;
  return true;
}

}  // namespace

bool heating_stage(const Scenario& s, std::size_t i) {
  return stage_heats(s.stages[i], i == 0 ? s.product.initial_C : s.stages[i - 1].medium.lowest_C());
}

std::vector<HChoice> h_choices_for(const Scenario& s, int t) {
  std::vector<HChoice> out;
  const Target* target = t >= 0 ? &s.targets.at(static_cast<std::size_t>(t)) : nullptr;
  for (std::size_t i = 0; i < s.per_target_h.size() && i < s.stages.size(); ++i)
    if (s.per_target_h[i] && !s.stages[i].h_infinite) out.push_back(choose(s, i, target));
  return out;
}

std::vector<TargetGroup> group_targets_by_h(const Scenario& s) {
  std::vector<TargetGroup> g;
  if (s.targets.empty()) {
    g.push_back({{}, h_choices_for(s, -1)});
    return g;
  }
  for (std::size_t t = 0; t < s.targets.size(); ++t) {
    auto c = h_choices_for(s, static_cast<int>(t));
    auto it = std::find_if(g.begin(), g.end(), [&](const TargetGroup& x) { return same(x.choices, c); });
    if (it == g.end()) g.push_back({{static_cast<int>(t)}, std::move(c)});
    else it->targets.push_back(static_cast<int>(t));
  }
  return g;
}

Scenario apply_h_choices(const Scenario& s, const std::vector<HChoice>& choices) {
  Scenario c = s;
  for (const auto& ch : choices) c.stages.at(ch.stage).h_W_m2K = ch.h_W_m2K;
  c.per_target_h.clear();
  return c;
}

}  // namespace coldcore::process
