#include "coldcore/process/conservative.hpp"

#include <cmath>
#include <sstream>

#include "coldcore/error.hpp"

#include "process/detail/inverse_text.hpp"
#include "process/detail/parallel.hpp"

namespace coldcore::process {

namespace {

bool heating_question(Question q, const Scenario& s) {
  switch (q) {
    case Question::hold_time:
    case Question::min_medium: return true;
    case Question::chill_time: return false;
    case Question::max_size:
      for (const auto& t : s.targets)
        if (t.kind != TargetKind::cooling_rule) return true;
      return false;
  }
  return true;
}

}  // namespace

std::vector<RangeChoice> worst_case_choices(const Scenario& s, const Ranges& r, bool heating, bool sizes) {
  std::vector<RangeChoice> c;
  if (sizes) {
    if (r.diameter_m) {
      const double v = (*r.diameter_m)[1];
      c.push_back({{RangeFactor::diameter, v}, [v](Scenario& x) { x.product.dims.diameter_m = v; }});
    }
    if (r.length_m) {
      const double v = (*r.length_m)[1];
      c.push_back({{RangeFactor::length, v}, [v](Scenario& x) { x.product.dims.length_m = v; }});
    }
    if (r.thickness_m) {
      const double v = (*r.thickness_m)[1];
      c.push_back({{RangeFactor::thickness, v}, [v](Scenario& x) { x.product.dims.thickness_m = v; }});
    }
  }
  if (r.conductivity_W_mK) {
    const double v = (*r.conductivity_W_mK)[0];
    c.push_back({{RangeFactor::conductivity, v}, [v](Scenario& x) { x.product.properties.conductivity_W_mK = v; }});
  }
  for (std::size_t i = 0; i < r.stage_h_W_m2K.size() && i < s.stages.size(); ++i) {
    if (!r.stage_h_W_m2K[i] || s.stages[i].h_infinite) continue;
    // A stage already taken per target (medium_type) is at its conservative ends nominally.
    if (i < s.per_target_h.size() && s.per_target_h[i]) continue;
    const double lo = (*r.stage_h_W_m2K[i])[0], hi = (*r.stage_h_W_m2K[i])[1];
    const StageHRange range{lo, hi, "h_range_W_m2K"};
    const auto apply = [range, i](Scenario& x) {
      x.per_target_h.resize(x.stages.size());
      x.per_target_h[i] = range;
    };
    Scenario probe = s;
    apply(probe);
    bool any_high = false;
    for (std::size_t t = 0; t < s.targets.size(); ++t)
      for (const auto& ch : h_choices_for(probe, static_cast<int>(t)))
        any_high = any_high || (ch.stage == i && ch.end == HEnd::high);
    RangeSetting h{RangeFactor::stage_h, lo, hi, any_high};
    h.stage = s.stages[i].name;
    c.push_back({h, apply});
  }
  if (r.initial_C) {
    const double v = heating ? (*r.initial_C)[0] : (*r.initial_C)[1];
    RangeSetting initial{RangeFactor::initial, v};
    initial.heating = heating;
    c.push_back({initial, [v](Scenario& x) { x.product.initial_C = v; }});
  }
  return c;
}

std::vector<RangeChoice> worst_case_choices(Question q, const Scenario& s, const Ranges& r) {
  // max-size varies the size itself: a size range does not apply to it.
  return worst_case_choices(s, r, heating_question(q, s), q != Question::max_size);
}

ConservativeSolve solve_conservative(Question q, const Scenario& s, const Ranges& r, const Libraries& libs,
                                     const SolveOptions& o, unsigned threads) {
  const auto choices = worst_case_choices(q, s, r);
  if (choices.empty())
    throw InputError(s.origin + ": --conservative: the file gives no range that applies to " + to_string(q) +
                     " ([product.ranges] or h_range_W_m2K; a medium_type stage is already taken at the end "
                     "conservative for each target)");
  ConservativeSolve out;
  Scenario all = s;
  for (const auto& c : choices) {
    out.choices.push_back(c.setting);
    c.apply(all);
  }
  // Slot 0: every choice together; slot k: choice k alone. The solves are independent, so they
  // run on the machine's cores; what is read from them below goes in the serial order.
  std::vector<std::optional<SolveResult>> answers(choices.size() + 1);
  std::vector<std::string> no_solution(choices.size() + 1);
  detail::for_each_index(
      choices.size() + 1,
      [&](std::size_t k) {
        Scenario x = k == 0 ? all : s;
        if (k > 0) choices[k - 1].apply(x);
        try {
          answers[k] = solve(q, x, libs, o);
        } catch (const NoSolution& e) {
          no_solution[k] = e.what();
        }
      },
      threads);
  out.result = answers[0];
  out.no_solution = no_solution[0];
  // Least favourable: longest time / highest medium (answers rounded up), smallest size.
  const bool smaller_worse = q == Question::max_size;
  double worst = smaller_worse ? 1e300 : -1e300;
  for (std::size_t k = 1; k <= choices.size(); ++k) {
    ChoiceAnswer a;
    a.choice = choices[k - 1].setting;
    if (answers[k]) {
      a.rounded = answers[k]->rounded;
      const bool w = smaller_worse ? *a.rounded < worst : *a.rounded > worst;
      if (w && !out.driven_by_no_solution) {
        worst = *a.rounded;
        out.driven_by = k - 1;
      }
    } else {
      a.no_solution = no_solution[k];
      out.driven_by = k - 1;
      out.driven_by_no_solution = true;
    }
    out.alone.push_back(std::move(a));
  }
  return out;
}

}  // namespace coldcore::process
