// JSON run report: {"history":[...], "summary":{...}, "assessment":[...], "warnings":[...],
// "cautions":[...], "provenance":{...}} (DESIGN.md). Numbers at full double precision.
#include <algorithm>
#include <ostream>

#include "coldcore/report/json.hpp"
#include "coldcore/report/json_contract.hpp"
#include "coldcore/report/run_report.hpp"
#include "coldcore/report/solve_report.hpp"
#include "coldcore/report/verdict_summary.hpp"
#include "coldcore/report/temperature_text.hpp"

namespace coldcore {

namespace {

std::string display_column(const Column& c, TempUnit u);

void write_history(JsonWriter& w, const HistoryTable& h, TempUnit u) {
  w.begin_array();
  for (const auto& row : h.rows) {
    w.begin_object();
    for (size_t i = 0; i < row.size() && i < h.columns.size(); ++i) {
      const auto& c = h.columns[i];
      w.key(display_column(c, u)).value(c.temperature ? display_temp(row[i], u) : row[i]);
    }
    w.end_object();
  }
  w.end_array();
}

void write_stage(JsonWriter& w, const StageRow& s, const RunReport& r, TempUnit u, bool with_medium) {
  w.begin_object();
  w.key("name").value(s.name);
  w.key("start_s").value(s.start_s);
  w.key("end_s").value(s.end_s);
  w.key("ended_by").value(s.ended_by);
  if (with_medium) w.key("medium").value(s.medium);
  // An infinite h (a surface held at the medium) has no finite number: null beside the flag.
  w.key("h_infinite").value(s.h_infinite);
  if (s.h_infinite) w.key("h_W_m2K").null(); else w.key("h_W_m2K").value(s.h_W_m2K);
  if (s.h_infinite) w.key("biot").null(); else w.key("biot").value(s.biot);
  if (!r.biot_length.empty()) w.key("biot_length").value(r.biot_length);  // "V/A": Bi = h·(V/A)/k
  if (with_medium) w.key("biot_note").value(s.biot_note);
  const std::string us(unit_suffix(u));
  w.key("centre_" + us).value(display_temp(s.centre_C, u));
  w.key("surface_" + us).value(display_temp(s.surface_C, u));
  w.key("mean_" + us).value(display_temp(s.mean_C, u));
  w.end_object();
}

std::string display_column(const Column& c, TempUnit u) {
  if (!c.temperature || u == TempUnit::C) return c.name;
  // "centre_C" -> "centre_F"
  std::string n = c.name;
  if (n.size() >= 2 && n.compare(n.size() - 2, 2, "_C") == 0) return n.substr(0, n.size() - 1) + "F";
  return n;
}

}  // namespace

static void write_run_json_unrendered(const RunReport& r, std::ostream& out, TempUnit u);

void write_run_json(const RunReport& r, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_run_json_unrendered(r, o, u); });
}

static void write_run_json_unrendered(const RunReport& r, std::ostream& out, TempUnit u) {
  JsonWriter w(out);
  w.begin_object();
  write_json_envelope(w, r.verb, u);
  w.key("title").value(r.title);
  write_summary_json(w, verdict_summary(r));
  w.key("history").begin_array();
  for (const auto& row : r.history.rows) {
    w.begin_object();
    for (size_t i = 0; i < row.size() && i < r.history.columns.size(); ++i) {
      const auto& c = r.history.columns[i];
      w.key(display_column(c, u)).value(c.temperature ? display_temp(row[i], u) : row[i]);
    }
    w.end_object();
  }
  w.end_array();
  w.key("summary").begin_object();
  w.key("product");
  write_labelled_object(w, r.product);
  w.key("stages").begin_array();
  for (const auto& s : r.stages) write_stage(w, s, r, u, true);
  w.end_array();
  w.end_object();
  // With h split per target: every scenario's history; "history" above is scenario 1 (issue 11).
  if (!r.scenarios.empty()) {
    w.key("scenarios").begin_array();
    for (const auto& sc : r.scenarios) {
      w.begin_object();
      w.key("number").value(sc.number);
      w.key("label").value(sc.label);
      w.key("targets").value(sc.targets);
      w.key("stages").begin_array();
      for (const auto& st : sc.stages) write_stage(w, st, r, u, false);
      w.end_array();
      w.key("history");
      write_history(w, sc.history, u);
      w.end_object();
    }
    w.end_array();
  }
  w.key("assessment").begin_array();
  for (const auto& v : r.verdicts) {
    w.begin_object();
    w.key("name").value(v.name);
    w.key("kind").value(v.kind);
    w.key("verdict").value(verdict_word(v.met));
    w.key("met").value(v.met);
    // Numbers in `unit` (as solve and deviation write them), then the rounded texts shown.
    w.key("unit").value(v.value_unit);
    w.key("required").value(v.required_value);
    w.key("achieved").value(v.achieved_value);
    w.key("margin").value(v.margin_value);
    w.key("margin_uncertainty").value(v.margin_uncertainty_value);
    w.key("required_text").value(v.required);
    w.key("achieved_text").value(v.achieved);
    w.key("margin_text").value(v.margin);
    if (!v.scenario.empty()) w.key("scenario").value(v.scenario);
    w.key("details").value(v.details);
    if (v.at_fit_bound) {
      const auto& b = *v.at_fit_bound;
      w.key("at_fit_bound").begin_object();
      w.key("verdict").value(verdict_word(b.met));
      w.key("met").value(b.met);
      w.key("achieved").value(b.achieved_value);
      w.key("margin").value(b.margin_value);
      w.key("achieved_text").value(b.achieved);
      w.key("margin_text").value(b.margin);
      w.end_object();
    }
    if (v.cooling) write_cooling_steps_json(w, *v.cooling);
    if (v.general_method_F_min) {
      const auto& g = *v.general_method_F_min;
      w.key("general_method").begin_object();  // every quantity's key carries its unit
      w.key("F_trapezoid_min").value(g[0]).key("F_simpson_min").value(g[1]).key("F_exact_linear_min").value(g[2]);
      w.end_object();
    }
    w.end_object();
  }
  w.end_array();
  // Lethality without a requirement: what was delivered, with no verdict (issue 11).
  if (!r.delivered.empty()) {
    w.key("delivered").begin_array();
    for (const auto& d : r.delivered) {
      w.begin_object();
      w.key("name").value(d.name);
      w.key("kind").value(d.kind);
      w.key("verdict").value("none: no target given");
      w.key("F_min").value(d.F_s / 60.0);
      w.key("F_text").value(d.F_text);
      w.key("reference_" + std::string(unit_suffix(u))).value(display_temp(d.reference_C, u));
      w.key("z_" + std::string(unit_suffix(u))).value(display_temp_difference(d.z_C, u));
      if (d.log_reduction) {
        w.key("log_reduction").value(*d.log_reduction);
        w.key("log_reduction_text").value(d.log_text);
      }
      w.key("details").value(d.details);
      w.end_object();
    }
    w.end_array();
  }
  if (r.measured) {
    w.key("measured").begin_object();
    w.key("log").value(r.measured->log);
    w.key("lot").value(r.measured->lot);
    w.key("readings").value(static_cast<int>(r.measured->readings));
    if (r.measured->start_unix_s) {
      w.key("start_unix_s").value(*r.measured->start_unix_s);
      w.key("first_reading_utc").value(utc_text(*r.measured->start_unix_s));
    }
    w.end_object();
  }
  w.key("warnings").value(r.warnings);
  w.key("assumptions").value(r.assumptions);
  w.key("cautions").value(r.cautions);
  w.key("provenance");
  write_labelled_object(w, r.provenance);
  w.end_object();
}

namespace {

// With h split per target, one block of rows per scenario under one header (long format, which a
// spreadsheet filters or pivots by its first column): `scenario` (its number), then the history
// columns; an F column is filled only on the rows of the scenario its target was evaluated on.
void write_scenario_rows(const RunReport& r, std::ostream& out, TempUnit u) {
  for (const auto& sc : r.scenarios) {
    std::string names;
    for (const auto& t : sc.targets) names += (names.empty() ? "" : ", ") + t;
    out << "# " << sc.label << "; targets: " << names << "\n";
  }
  std::vector<Column> cols;
  for (const auto& sc : r.scenarios)
    for (const auto& c : sc.history.columns)
      if (std::none_of(cols.begin(), cols.end(), [&](const Column& x) { return x.name == c.name; })) cols.push_back(c);
  out << "scenario";
  for (const auto& c : cols) out << "," << display_column(c, u);
  out << "\n";
  for (const auto& sc : r.scenarios)
    for (const auto& row : sc.history.rows) {
      out << sc.number;
      for (const auto& c : cols) {
        out << ",";
        for (size_t i = 0; i < sc.history.columns.size() && i < row.size(); ++i)
          if (sc.history.columns[i].name == c.name) {
            out << csv_number(c.temperature ? display_temp(row[i], u) : row[i]);
            break;
          }
      }
      out << "\n";
    }
}

}  // namespace

static void write_run_csv_unrendered(const RunReport& r, std::ostream& out, TempUnit u);

void write_run_csv(const RunReport& r, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_run_csv_unrendered(r, o, u); });
}

static void write_run_csv_unrendered(const RunReport& r, std::ostream& out, TempUnit u) {
  write_summary_csv(out, verdict_summary(r));
  for (const auto& c : r.cautions) out << "# caution: " << c << "\n";
  for (const auto& kv : r.provenance) out << "# " << kv.key << ": " << kv.value << "\n";
  for (const auto& w : r.warnings) out << "# warning: " << w << "\n";
  if (r.measured)  // the log, its lot and clock times (issue 11)
    for (const auto& kv : r.product) out << "# " << kv.key << ": " << kv.value << "\n";
  for (const auto& d : r.delivered)
    out << "# delivered, no target given, no verdict: " << d.name << ": " << delivered_text(d) << "\n";
  for (const auto& v : r.verdicts)
    out << "# verdict: " << v.name << ": " << verdict_word(v.met) << " (required " << v.required
        << ", achieved " << v.achieved << ", margin " << v.margin << ")"
        << (v.scenario.empty() ? "" : ", from " + v.scenario) << "\n";
  // The raw numbers behind each verdict, with the margin's error bound ("met" needs margin > bound).
  for (const auto& v : r.verdicts)
    out << "# verdict values: " << v.name << ": required " << JsonWriter::number(v.required_value) << ", achieved "
        << JsonWriter::number(v.achieved_value) << ", margin " << JsonWriter::number(v.margin_value)
        << ", margin_uncertainty " << JsonWriter::number(v.margin_uncertainty_value) << " " << v.value_unit << "\n";
  // The probe's three General Method sums, as numbers (min).
  for (const auto& v : r.verdicts)
    if (v.general_method_F_min)
      out << "# general method F (min): " << v.name << ": trapezoid " << csv_number((*v.general_method_F_min)[0])
          << ", simpson " << csv_number((*v.general_method_F_min)[1]) << ", exact_linear "
          << csv_number((*v.general_method_F_min)[2]) << "\n";
  // Which end of an h range each target was evaluated at (process/h_ends.hpp), when one was, and
  // every unrecorded interval a target's credit leaves out.
  for (const auto& v : r.verdicts)
    for (const auto& d : v.details)
      if (d.rfind("h used: ", 0) == 0 || d.find("the gap in the log from") != std::string::npos)  // issue 11
        out << "# verdict note: " << v.name << ": " << d << "\n";
  for (const auto& c : r.history.columns)
    if (c.name == "lumped_centre_C")
      out << "# column " << display_column(c, u)
          << ": the centre as the lumped (uniform-temperature) shortcut would have it, shown to compare with the "
             "exact centre; never used for a verdict\n";
  if (!r.scenarios.empty()) {
    write_scenario_rows(r, out, u);
    return;
  }
  // The stage each row falls in, by the file's stage names (a row at a boundary starts the next).
  const bool staged = !r.stages.empty() && !r.history.rows.empty();
  const auto stage_at = [&](double t) -> const std::string& {
    for (const auto& s : r.stages)
      if (t < s.end_s) return s.name;
    return r.stages.back().name;
  };
  for (size_t i = 0; i < r.history.columns.size(); ++i) {
    out << (i ? "," : "") << display_column(r.history.columns[i], u);
    if (i == 0 && staged) out << ",stage";
  }
  out << "\n";
  for (const auto& row : r.history.rows) {
    for (size_t i = 0; i < row.size(); ++i) {
      if (i == 1 && staged) out << "," << csv_cell(stage_at(row[0]));
      const bool temp = i < r.history.columns.size() && r.history.columns[i].temperature;
      out << (i ? "," : "") << csv_number(temp ? display_temp(row[i], u) : row[i]);
    }
    out << "\n";
  }
}

}  // namespace coldcore
