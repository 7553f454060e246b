#pragma once
/// The report model every writer reads: plain values, already computed. Writers format; they
/// never recompute physics. Temperatures are stored in °C and converted by the writer.
#include <iosfwd>
#include <optional>
#include <string>
#include <vector>

#include "coldcore/process/cooling.hpp"
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
  std::optional<CoolingCheck> cooling;  ///< cooling-rule targets: the steps (json "cooling_steps")
};

/// A cooling-rule step drawn over the cooling curve: the checked temperature (the centre) must
/// fall from temp_hi_C, which it passed at t0_s, to temp_lo_C no later than t1_s. Times from the
/// process start; temperatures in °C. The writers draw it as a shaded box whose right edge is
/// the deadline: the curve must leave the box through its lower edge.
struct RuleBox {
  std::string label;     ///< e.g. "step 1 (2 h)"; no temperatures: writers append the limits
                         ///< in the display unit ("step 1 (2 h): 57.0 → 21.0 °C")
  double t0_s = 0, t1_s = 0;
  double temp_hi_C = 0, temp_lo_C = 0;
};

/// A required value drawn as a horizontal line on the plot that shows history column `column`,
/// e.g. {"F_F70_min", 2.0} (minutes) or {"centre_C", 72.0} (°C, converted for --units F).
struct TargetLine {
  std::string column;
  double value = 0;
  std::string label;     ///< legend text; empty: "required <column> = <value>"
};

/// History column names the html and markdown writers recognise: time_s, medium_C, centre_C,
/// surface_C, mean_C, the optional lumped_centre_C (the lumped-capacitance estimate of the
/// centre, drawn beside the exact centre when present) and F_<name>_min (cumulative lethality).
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
  std::vector<RuleBox> rule_boxes;       ///< cooling-rule steps to draw (may be empty)
  std::vector<TargetLine> target_lines;  ///< required values to draw (may be empty)
};

/// "met" or "not demonstrated".
std::string_view verdict_word(bool met);

/// Every run/probe format opens with verdict_summary(r) (verdict_summary.hpp).
void write_run_text(const RunReport& r, std::ostream& out, TempUnit u);
/// JSON: "verdict_summary" near the top; each "assessment" row has "met" (true only for the
/// verdict "met") and, for a cooling rule, "cooling_steps".
void write_run_json(const RunReport& r, std::ostream& out, TempUnit u);
/// csv: the verdict summary, cautions and provenance as leading '# ' comment lines, then the
/// history table.
void write_run_csv(const RunReport& r, std::ostream& out, TempUnit u);

}  // namespace coldcore
