#pragma once
/// The report model every writer reads: plain values, already computed. Writers format; they
/// never recompute physics. Temperatures are stored in °C and converted by the writer.
#include <iosfwd>
#include <string>
#include <vector>

#include "coldcore/report/format.hpp"

namespace coldcore {

struct KeyValue {
  std::string key;
  std::string value;
};

struct StageRow {
  std::string name;
  double start_s = 0;
  double end_s = 0;
  std::string ended_by;   ///< "duration", "condition met", "CAP REACHED"
  std::string medium;     ///< description of the medium schedule
  double h_W_m2K = 0;
  bool h_infinite = false;
  double biot = 0;
  std::string biot_note;  ///< plain words: what Bi means for lumped capacitance
  double centre_C = 0, surface_C = 0, mean_C = 0;  ///< at the stage's end
};

/// A column of the history table; `temperature` columns follow --units.
struct Column {
  std::string name;        ///< csv name in °C form, e.g. "centre_C" or "F_F0_min"
  bool temperature = false;
};

struct HistoryTable {
  std::vector<Column> columns;
  std::vector<std::vector<double>> rows;
};

/// One target's verdict. `met` only when the computed margin is positive.
struct VerdictRow {
  std::string name;
  std::string kind;
  std::string required;   ///< text, e.g. "6.0 log" or "F70 ≥ 2.00 min"
  std::string achieved;   ///< text, lethality rounded down, times rounded up
  std::string margin;     ///< text, signed
  bool met = false;
  std::vector<std::string> details;  ///< per-stage shares, rule steps, flags
  // Numbers for machine-readable formats.
  double required_value = 0, achieved_value = 0, margin_value = 0;
  std::string value_unit;
};

struct RunReport {
  std::string title;
  std::string verb;                      ///< "run", "modes", ...
  std::vector<KeyValue> product;         ///< product and property rows
  std::vector<StageRow> stages;
  HistoryTable history;
  std::vector<VerdictRow> verdicts;
  std::vector<std::string> warnings;
  std::vector<std::string> assumptions;
  std::vector<KeyValue> provenance;      ///< tool version, input file, SHA-256, date
  std::vector<std::string> cautions;     ///< always filled from cautions()
};

/// "met" or "not demonstrated".
std::string_view verdict_word(bool met);

void write_run_text(const RunReport& r, std::ostream& out, TempUnit u);
void write_run_json(const RunReport& r, std::ostream& out, TempUnit u);
/// csv: cautions and provenance as leading '# ' comment lines, then the history table.
void write_run_csv(const RunReport& r, std::ostream& out, TempUnit u);

}  // namespace coldcore
