// JSON run report: {"history":[...], "summary":{...}, "assessment":[...], "warnings":[...],
// "cautions":[...], "provenance":{...}} (DESIGN.md). Numbers at full double precision.
#include <ostream>

#include "coldcore/report/json.hpp"
#include "coldcore/report/run_report.hpp"
#include "coldcore/report/solve_report.hpp"
#include "coldcore/report/verdict_summary.hpp"

namespace coldcore {

namespace {

std::string display_column(const Column& c, TempUnit u) {
  if (!c.temperature || u == TempUnit::C) return c.name;
  // "centre_C" -> "centre_F"
  std::string n = c.name;
  if (n.size() >= 2 && n.compare(n.size() - 2, 2, "_C") == 0) return n.substr(0, n.size() - 1) + "F";
  return n;
}

}  // namespace

void write_run_json(const RunReport& r, std::ostream& out, TempUnit u) {
  JsonWriter w(out);
  w.begin_object();
  w.key("verb").value(r.verb);
  w.key("title").value(r.title);
  write_summary_json(w, verdict_summary(r));
  w.key("units").value(unit_suffix(u));
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
  w.key("product").begin_object();
  for (const auto& kv : r.product) w.key(kv.key).value(kv.value);
  w.end_object();
  w.key("stages").begin_array();
  for (const auto& s : r.stages) {
    w.begin_object();
    w.key("name").value(s.name);
    w.key("start_s").value(s.start_s);
    w.key("end_s").value(s.end_s);
    w.key("ended_by").value(s.ended_by);
    w.key("medium").value(s.medium);
    if (s.h_infinite) w.key("h_W_m2K").value("inf"); else w.key("h_W_m2K").value(s.h_W_m2K);
    if (s.h_infinite) w.key("biot").value("inf"); else w.key("biot").value(s.biot);
    w.key("biot_note").value(s.biot_note);
    const std::string us(unit_suffix(u));
    w.key("centre_" + us).value(display_temp(s.centre_C, u));
    w.key("surface_" + us).value(display_temp(s.surface_C, u));
    w.key("mean_" + us).value(display_temp(s.mean_C, u));
    w.end_object();
  }
  w.end_array();
  w.end_object();
  w.key("assessment").begin_array();
  for (const auto& v : r.verdicts) {
    w.begin_object();
    w.key("name").value(v.name);
    w.key("kind").value(v.kind);
    w.key("verdict").value(verdict_word(v.met));
    w.key("met").value(v.met);
    w.key("required").value(v.required);
    w.key("achieved").value(v.achieved);
    w.key("margin").value(v.margin);
    w.key("required_value").value(v.required_value);
    w.key("achieved_value").value(v.achieved_value);
    w.key("margin_value").value(v.margin_value);
    w.key("value_unit").value(v.value_unit);
    w.key("details").value(v.details);
    if (v.cooling) write_cooling_steps_json(w, *v.cooling);
    w.end_object();
  }
  w.end_array();
  w.key("warnings").value(r.warnings);
  w.key("assumptions").value(r.assumptions);
  w.key("cautions").value(r.cautions);
  w.key("provenance").begin_object();
  for (const auto& kv : r.provenance) w.key(kv.key).value(kv.value);
  w.end_object();
  w.end_object();
}

void write_run_csv(const RunReport& r, std::ostream& out, TempUnit u) {
  write_summary_csv(out, verdict_summary(r));
  for (const auto& c : r.cautions) out << "# caution: " << c << "\n";
  for (const auto& kv : r.provenance) out << "# " << kv.key << ": " << kv.value << "\n";
  for (const auto& w : r.warnings) out << "# warning: " << w << "\n";
  for (const auto& v : r.verdicts)
    out << "# verdict: " << v.name << ": " << verdict_word(v.met) << " (required " << v.required
        << ", achieved " << v.achieved << ", margin " << v.margin << ")\n";
  // Which end of an h range each target was evaluated at (process/h_ends.hpp), when one was.
  for (const auto& v : r.verdicts)
    for (const auto& d : v.details)
      if (d.rfind("h used: ", 0) == 0) out << "# verdict note: " << v.name << ": " << d << "\n";
  for (size_t i = 0; i < r.history.columns.size(); ++i)
    out << (i ? "," : "") << display_column(r.history.columns[i], u);
  out << "\n";
  for (const auto& row : r.history.rows) {
    for (size_t i = 0; i < row.size(); ++i) {
      const bool temp = i < r.history.columns.size() && r.history.columns[i].temperature;
      out << (i ? "," : "") << JsonWriter::number(temp ? display_temp(row[i], u) : row[i]);
    }
    out << "\n";
  }
}

}  // namespace coldcore
