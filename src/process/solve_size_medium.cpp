// The size and medium questions: the largest size, and the lowest constant medium temperature
// of a stage, at which every target is met (solve_questions.cpp holds the shared steps).
#include <algorithm>
#include <functional>
#include <string>

#include "coldcore/error.hpp"
#include "coldcore/model/temperature_token.hpp"
#include "coldcore/process/inverse.hpp"
#include "process/detail/inverse_text.hpp"
#include "process/detail/question_setup.hpp"

namespace coldcore::process::detail {

SolveResult max_size(const Scenario& s, const Libraries& libs, const SolveOptions& o) {
  std::string name;
  double nominal = 0;
  std::function<void(Product&, double)> set;
  const Dimensions& d = s.product.dims;
  switch (s.product.shape) {
    case Shape::sphere:
    case Shape::cylinder:
    case Shape::finite_cylinder:
      name = "diameter";
      nominal = d.diameter_m;
      set = [](Product& p, double x) { p.dims.diameter_m = x; };
      break;
    case Shape::slab:
      name = "thickness";
      nominal = d.thickness_m;
      set = [](Product& p, double x) { p.dims.thickness_m = x; };
      break;
    case Shape::brick: {
      name = "smallest edge";
      const int j = static_cast<int>(std::min_element(d.size_m, d.size_m + 3) - d.size_m);
      nominal = d.size_m[j];
      set = [j](Product& p, double x) { p.dims.size_m[j] = x; };
      break;
    }
  }
  Setup st;
  st.apply = [s, set](double x) {
    Scenario c = s;
    set(c.product, x);
    return c;
  };
  st.considered = all_targets(s);
  st.side = FeasibleSide::below;
  st.lo = nominal * o.min_size_factor;
  st.hi = nominal * o.max_size_factor;
  st.ro.rel_tol = o.rel_tol;
  st.ro.abs_tol = 1e-9;
  st.unit = o.unit_m;
  st.domain_lo = 1e-9;
  st.why_none = "no " + name + " from " + num(st.lo * 1000) + " to " + num(st.hi * 1000) +
                " mm meets every target with the scheduled process";
  // Met even at the largest size tried: no largest size within the bounds.
  {
    const Evaluation e = evaluate(st.apply(st.hi), libs, st.considered, search_history_options());
    if (e.considered_met)
      throw NoSolution("every target is still met at " + num(o.max_size_factor) + " x the nominal " + name + " (" +
                       num(st.hi * 1000) + " mm), the search bound; the largest size lies beyond it");
  }
  // Bracket from the nominal size when it meets the targets: below it the margin need not be
  // monotone (an until_* stage ends earlier for a small product, which may then lose a hold).
  const bool nominal_met = evaluate(st.apply(nominal), libs, st.considered, search_history_options()).considered_met;
  if (nominal_met) {
    st.lo = nominal;
  } else {
    st.hi = nominal;
    st.why_none = "the nominal " + name + " (" + num(nominal * 1000) + " mm) does not meet every target, nor does any " +
                  name + " down to " + num(st.lo * 1000) + " mm";
  }
  SolveResult r = run_question(Question::max_size, st, s, libs);
  r.assumptions.push_back(note_about(ProcessNoteKind::assumes_size_search, name, nominal_met));
  r.quantity = name;
  r.unit = std::string(1, 'm');  // (a one-character literal trips GCC 12's false -Wrestrict here)
  r.nominal = nominal;
  if (s.product.shape == Shape::finite_cylinder)
    r.assumptions.push_back({ProcessNoteKind::assumes_diameter_varied});
  if (s.product.shape == Shape::brick)
    r.assumptions.push_back({ProcessNoteKind::assumes_smallest_edge_varied});
  r.assumptions.push_back({ProcessNoteKind::assumes_stages_kept});
  return r;
}

SolveResult min_medium(const Scenario& s, const Libraries& libs, const SolveOptions& o) {
  Setup st;
  st.stage = o.stage.empty() ? default_stage(s, true) : stage_index(s, o.stage, "--stage");
  const std::size_t k = static_cast<std::size_t>(st.stage);
  st.apply = [s, k](double x) {
    Scenario c = s;
    c.stages[k].medium.points = {{0.0, x}};
    c.stages[k].medium.description = "constant (solved)";
    c.stages[k].medium_gaps_s.clear();
    return c;
  };
  st.considered = all_targets(s);
  st.side = FeasibleSide::above;
  st.lo = s.product.initial_C;
  st.hi = o.max_medium_C;
  if (!(st.hi > st.lo))
    throw InputError("--max-medium-C = " + num(st.hi) + ": must be above the initial temperature " + num(st.lo));
  st.ro.rel_tol = o.rel_tol;
  st.ro.abs_tol = 1e-6;
  st.unit = o.unit_C;
  st.why_none = "no constant medium temperature of stage \"" + s.stages[k].name + "\" up to " + temp_token(o.max_medium_C) +
                " meets every target";
  SolveResult r = run_question(Question::min_medium, st, s, libs);
  r.stage = s.stages[k].name;
  r.quantity = "medium";
  r.unit = std::string(1, 'C');  // (a one-character literal trips GCC 12's false -Wrestrict here)
  r.nominal = s.stages[k].medium.highest_C();
  if (s.stages[k].medium.points.size() > 1)
    r.assumptions.push_back(note_about(ProcessNoteKind::assumes_constant_medium, r.stage));
  ProcessNote from_initial{ProcessNoteKind::assumes_search_from_initial};
  from_initial.temp_C = st.lo;
  r.assumptions.push_back(from_initial);
  return r;
}

}  // namespace coldcore::process::detail
