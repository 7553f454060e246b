#include <cmath>
#include <optional>
#include <ostream>

#include "coldcore/report/conservative_text.hpp"
#include "coldcore/report/process_notes.hpp"
#include "coldcore/report/cooling_notes.hpp"
#include "coldcore/report/target_notes.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/json_contract.hpp"
#include "coldcore/report/solve_report.hpp"
#include "coldcore/report/verdict_summary.hpp"
#include "coldcore/report/history_notes.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "solve_text.hpp"

namespace coldcore {

namespace {

using process::Check;
using process::Question;
using process::SolveResult;

std::string shown(const SolveResult& r, double v, TempUnit u) { return detail::solve_shown(r, v, u); }
std::string shown_raw(const SolveResult& r, double v, TempUnit u) { return detail::solve_shown_raw(r, v, u); }

void text_check(std::ostream& out, const SolveResult& r, const Check& c, const char* label, TempUnit u) {
  out << label << shown(r, c.value, u) << ": "
      << (c.eval.all_met ? "every target met" : "NOT every target met") << "\n";
  for (const auto& t : c.eval.assessment.targets)
    out << "    " << t.name << " (" << to_string(t.kind) << "): required " << t.required_text << ", achieved "
        << t.achieved_text << " -> " << t.verdict_text << "\n";
}

void json_check(JsonWriter& w, const SolveResult& r, const Check& c) {
  w.begin_object();
  w.key("value_" + r.unit).value(c.value);
  w.key("all_met").value(c.eval.all_met);
  w.key("considered_met").value(c.eval.considered_met);
  w.key("margin").value(c.eval.margin);
  w.key("targets").begin_array();
  for (const auto& t : c.eval.assessment.targets) write_target_json(w, t);
  w.end_array();
  w.key("warnings").value(history_warnings(c.eval.history));
  w.end_object();
}


}  // namespace

const char* raw_unit(const TargetResult& t) {
  if (t.kind == TargetKind::log_reduction) return "log10";
  if (t.kind == TargetKind::cooking_table) return "fraction";  // of the table's required equivalent time
  return "s";
}

void write_target_json(JsonWriter& w, const TargetResult& t) {
  w.begin_object();
  w.key("name").value(t.name);
  w.key("kind").value(to_string(t.kind));
  w.key("unit").value(raw_unit(t));
  w.key("required").value(t.required);
  w.key("achieved").value(t.achieved);
  w.key("margin").value(t.margin);
  w.key("margin_uncertainty").value(t.margin_uncertainty);
  w.key("verdict").value(to_string(t.verdict));
  w.key("required_text").value(t.required_text);
  w.key("achieved_text").value(t.achieved_text);
  w.key("verdict_text").value(t.verdict_text);
  w.key("met").value(t.verdict == Verdict::met);
  if (t.kinetics) {
    w.key("F_min").value(t.F_s / 60.0);
    w.key("F_required_min").value(t.F_required_s / 60.0);
  }
  std::vector<std::string> notes = t.cooling ? cooling_note_texts(*t.cooling) : std::vector<std::string>{};
  for (const auto& n : t.notes) notes.push_back(target_note_text(n, t));
  w.key("notes").value(notes);
  if (t.cooling) write_cooling_steps_json(w, *t.cooling);
  w.end_object();
}

void write_cooling_steps_json(JsonWriter& w, const CoolingCheck& c) {
  w.key("cooling_steps").begin_array();
  for (const auto& st : c.steps) {
    w.begin_object();
    w.key("label").value(st.step.label);
    w.key("advisory").value(st.step.advisory);
    w.key("clock_started").value(st.start_s.has_value());
    w.key("reached").value(st.reached);
    w.key("passed").value(st.passed);
    w.key("elapsed_s").value(st.elapsed_s);  // a lower bound when not reached
    w.key("within_s").value(st.step.within_s);
    w.key("margin_s").value(st.margin_s);
    w.end_object();
  }
  w.end_array();
}

static void write_solve_text_unrendered(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u);

void write_solve_text(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_solve_text_unrendered(r, c, o, u); });
}

static void write_solve_text_unrendered(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u) {
  out << "coldcore solve --for " << to_string(r.question) << ": " << c.product_name << "\n\n";
  write_summary_text(out, verdict_summary(r, c.conservative));
  if (!r.stage.empty()) out << "  stage:            " << r.stage << "\n";
  out << "  question:         " << (r.question == Question::max_size ? "largest " : "") << r.quantity
      << (r.question == Question::min_medium ? " (lowest constant)" : "") << "\n";
  out << "  scheduled:        " << shown(r, r.nominal, u) << "\n";
  out << "  answer:           " << shown_raw(r, r.answer, u) << " (unrounded)\n";
  out << "  use:              " << shown(r, r.rounded, u) << "  (" << detail::solve_rounding_text(r, u) << ")\n";
  if (c.at_fit_bound) out << "  fit bound:        " << fit_bound_sentence(r, *c.at_fit_bound, u) << "\n";
  out << "  solved for:       ";
  const auto solved_for = solved_for_texts(r);
  for (std::size_t i = 0; i < solved_for.size(); ++i) out << (i ? ", " : "") << solved_for[i];
  out << "\n\nVERIFICATION (forward re-run)\n";
  text_check(out, r, r.verification, "  at ", u);
  if (r.end_C)
    out << "    " << r.end_point << " at the end of the stage: " << fixed(display_temp(r.end_at_rounded_C, u), 3)
        << " " << unit_symbol(u) << " (end temperature " << fixed(display_temp(*r.end_C, u), 2) << " "
        << unit_symbol(u) << ": " << (r.end_reached_at_rounded ? "reached" : "NOT reached") << ")\n";
  if (r.one_unit_less) {
    text_check(out, r, *r.one_unit_less, "  one unit less, at ", u);
    if (r.end_C && r.end_at_less_C)
      out << "    " << r.end_point << " at the end of the stage: " << fixed(display_temp(*r.end_at_less_C, u), 3) << " "
          << unit_symbol(u) << " (" << (r.end_reached_at_less.value_or(false) ? "reached" : "not reached") << ")\n";
  }
  if (!r.notes.empty()) {
    out << "\nNOTES\n";
    for (const auto& n : solve_note_texts(r)) out << "  - " << n << "\n";
  }
  if (c.conservative) {
    const auto& cs = *c.conservative;
    out << "\nCONSERVATIVE (documented worst case of the file's ranges)\n  choices:";
    for (const auto& ch : range_setting_texts(cs.choices)) out << " " << ch << ";";
    out << "\n";
    if (cs.result) {
      out << "  answer:           " << shown_raw(r, cs.result->answer, u) << " (unrounded)\n";
      out << "  use:              " << shown(r, cs.result->rounded, u) << "  (nominal: " << shown(r, r.rounded, u) << ")\n";
      text_check(out, *cs.result, cs.result->verification, "  re-run at ", u);
    } else {
      out << "  no solution: " << cs.no_solution << "\n";
    }
    for (const auto& a : cs.alone)
      out << "  alone: " << range_setting_text(a.choice) << " -> " << (a.rounded ? shown(r, *a.rounded, u) : "no solution") << "\n";
    out << "  driven by: " << driven_by_text(cs) << "\n";
  }
  std::vector<std::string> warns = c.warnings;
  const auto engine_notes = history_warnings(r.verification.eval.history);
  warns.insert(warns.end(), engine_notes.begin(), engine_notes.end());
  for (const auto& w : r.verification.eval.assessment.warnings) warns.push_back(assessment_warning_text(w));
  if (!warns.empty()) {
    out << "\nWARNINGS\n";
    for (const auto& n : warns) out << "  ! " << n << "\n";
  }
  out << "\nASSUMPTIONS\n";
  for (const auto& n : assumption_texts(r.assumptions)) out << "  - " << n << "\n";
  out << "\nPROVENANCE\n";
  for (const auto& kv : c.provenance) out << "  " << kv.key << ": " << kv.value << "\n";
  out << "\n";
  write_sign_off_text(out);
  out << "CAUTIONS\n";
  for (const auto& cau : cautions()) out << "  * " << cau << "\n";
}

static void write_solve_json_unrendered(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u);

void write_solve_json(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_solve_json_unrendered(r, c, o, u); });
}

static void write_solve_json_unrendered(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u) {
  JsonWriter w(out);
  w.begin_object();
  write_json_envelope(w, "solve", u);
  w.key("question").value(to_string(r.question));
  write_summary_json(w, verdict_summary(r, c.conservative));
  if (r.stage.empty()) w.key("stage").null(); else w.key("stage").value(r.stage);
  w.key("product").value(c.product_name);
  w.key("quantity").value(r.quantity);
  w.key("answer_" + r.unit).value(r.answer);
  w.key("rounded_" + r.unit).value(r.rounded);
  w.key("unit_" + r.unit).value(r.unit_step);
  w.key("nominal_" + r.unit).value(r.nominal);
  w.key("verification");
  json_check(w, r, r.verification);
  w.key("at_fit_bound");
  if (c.at_fit_bound) {
    w.begin_object();
    w.key("answer_" + r.unit).value(c.at_fit_bound->answer);
    w.key("rounded_" + r.unit).value(c.at_fit_bound->rounded);
    w.key("verification");
    json_check(w, *c.at_fit_bound, c.at_fit_bound->verification);
    w.end_object();
  } else {
    w.null();
  }
  w.key("one_unit_less");
  if (r.one_unit_less) json_check(w, r, *r.one_unit_less); else w.null();
  if (r.end_C) {
    w.key("end").begin_object();
    w.key("point").value(r.end_point);
    const std::string us(unit_suffix(u));
    w.key("end_" + us).value(display_temp(*r.end_C, u));
    w.key("at_rounded_" + us).value(display_temp(r.end_at_rounded_C, u));
    w.key("reached_at_rounded").value(r.end_reached_at_rounded);
    if (r.end_at_less_C) {
      w.key("at_one_unit_less_" + us).value(display_temp(*r.end_at_less_C, u));
      w.key("reached_at_one_unit_less").value(r.end_reached_at_less.value_or(false));
    }
    w.key("temperature_tolerance_K").value(r.end_tol_K);
    w.end_object();
  }
  if (c.conservative) {
    const auto& cs = *c.conservative;
    w.key("conservative").begin_object();
    w.key("choices").value(range_setting_texts(cs.choices));
    if (cs.result) {
      w.key("answer_" + r.unit).value(cs.result->answer);
      w.key("rounded_" + r.unit).value(cs.result->rounded);
      w.key("verification");
      json_check(w, *cs.result, cs.result->verification);
    } else {
      w.key("rounded_" + r.unit).null();
      w.key("no_solution").value(cs.no_solution);
    }
    w.key("alone").begin_array();
    for (const auto& a : cs.alone) {
      w.begin_object();
      w.key("choice").value(range_setting_text(a.choice));
      w.key("rounded_" + r.unit);
      if (a.rounded) w.value(*a.rounded); else w.null();
      if (!a.no_solution.empty()) w.key("no_solution").value(a.no_solution);
      w.end_object();
    }
    w.end_array();
    w.key("driven_by").value(driven_by_text(cs));
    w.end_object();
  }
  w.key("considered_targets").value(solved_for_texts(r));
  w.key("root_evaluations").value(r.root.evaluations);
  w.key("notes").value(solve_note_texts(r));
  w.key("assumptions").value(assumption_texts(r.assumptions));
  w.key("warnings").value(c.warnings);
  w.key("provenance");
  write_labelled_object(w, c.provenance);
  w.key("cautions").value(cautions());
  w.end_object();
  out << "\n";
}

static void write_solve_csv_unrendered(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u);

void write_solve_csv(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_solve_csv_unrendered(r, c, o, u); });
}

static void write_solve_csv_unrendered(const SolveResult& r, const SolveReportContext& c, std::ostream& out, TempUnit) {
  write_summary_csv(out, verdict_summary(r, c.conservative));
  for (const auto& cau : cautions()) out << "# caution: " << cau << "\n";
  for (const auto& kv : c.provenance) out << "# " << kv.key << ": " << kv.value << "\n";
  out << "# question: " << to_string(r.question) << (r.stage.empty() ? "" : "; stage: " + r.stage) << "\n";
  out << "# answer_" << r.unit << " (unrounded): " << JsonWriter::number(r.answer) << "\n";
  out << "# rounded_" << r.unit << " (to use): " << JsonWriter::number(r.rounded) << "\n";
  if (c.at_fit_bound)
    out << "# at_fit_bound rounded_" << r.unit << ": " << JsonWriter::number(c.at_fit_bound->rounded) << "\n";
  for (const auto& n : solve_note_texts(r)) out << "# note: " << n << "\n";
  for (const auto& n : assumption_texts(r.assumptions)) out << "# assumption: " << n << "\n";
  for (const auto& n : c.warnings) out << "# warning: " << n << "\n";
  if (c.conservative) {
    const auto& cs = *c.conservative;
    for (const auto& ch : range_setting_texts(cs.choices)) out << "# conservative choice: " << ch << "\n";
    out << "# conservative rounded_" << r.unit << ": "
        << (cs.result ? JsonWriter::number(cs.result->rounded) : "no solution: " + cs.no_solution) << "\n";
    out << "# conservative driven by: " << driven_by_text(cs) << "\n";
  }
  if (r.end_C) {  // chill-time: the end condition of the answer and of both re-runs
    out << "# end: " << r.end_point << " below " << JsonWriter::number(*r.end_C) << " C by more than "
        << JsonWriter::number(r.end_tol_K) << " K\n";
    out << "# end at rounded: " << JsonWriter::number(r.end_at_rounded_C) << " C, "
        << (r.end_reached_at_rounded ? "reached" : "not reached") << "\n";
    if (r.end_at_less_C)
      out << "# end at one unit less: " << JsonWriter::number(*r.end_at_less_C) << " C, "
          << (r.end_reached_at_less.value_or(false) ? "reached" : "not reached") << "\n";
  }
  out << "run,value_" << r.unit << ",target,kind,required,achieved,margin,unit,verdict,met,margin_uncertainty"
      << (r.end_C ? ",end_temp_C,end_reached" : "") << "\n";
  const auto rows = [&](const char* run, const Check& ch, std::optional<double> end_temp_C, bool end_reached) {
    for (const auto& t : ch.eval.assessment.targets) {
      out << run << "," << csv_number(ch.value) << "," << csv_cell(t.name) << "," << to_string(t.kind) << ","
          << csv_number(t.required) << "," << csv_number(t.achieved) << ","
          << csv_number(t.margin) << "," << raw_unit(t) << "," << to_string(t.verdict) << ","
          << (t.verdict == Verdict::met ? "true" : "false") << "," << csv_number(t.margin_uncertainty);
      if (r.end_C)
        out << "," << (end_temp_C ? csv_number(*end_temp_C) : "") << "," << (end_reached ? "true" : "false");
      out << "\n";
    }
  };
  rows("rounded", r.verification, r.end_C ? std::optional<double>(r.end_at_rounded_C) : std::nullopt,
       r.end_reached_at_rounded);
  if (r.one_unit_less) rows("one-unit-less", *r.one_unit_less, r.end_at_less_C, r.end_reached_at_less.value_or(false));
  if (c.conservative && c.conservative->result) {
    const SolveResult& cr = *c.conservative->result;
    rows("conservative", cr.verification, cr.end_C ? std::optional<double>(cr.end_at_rounded_C) : std::nullopt,
         cr.end_reached_at_rounded);
  }
}

std::string fit_bound_sentence(const SolveResult& nominal, const SolveResult& bound, TempUnit u) {
  return detail::solve_shown(nominal, nominal.rounded, u) + " with the fitted values; " +
         detail::solve_shown(bound, bound.rounded, u) +
         " at the one-sided 95 % bound of the fit (the least favourable point of its confidence region, "
         "computed with the full model and rounded the same way)";
}

}  // namespace coldcore
