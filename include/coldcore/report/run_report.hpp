#pragma once
/// The report model every writer reads: plain values, already computed. Writers format; they
/// never recompute physics. Temperatures are stored in °C and converted by the writer.
#include <cstddef>
#include <iosfwd>
#include <array>
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
  double biot = 0;         ///< on the length RunReport::biot_length names
  std::string biot_note;  ///< plain words: what Bi means (its regime), on the same length
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
  /// The h scenario behind this verdict when the targets were split over several (see
  /// RunReport::scenarios), e.g. "scenario 2: \"blast chill\" h 60 W/m²K (high end)"; "" otherwise.
  std::string scenario;
  // Numbers for machine-readable formats.
  double required_value = 0, achieved_value = 0, margin_value = 0;
  double margin_uncertainty_value = 0;  ///< error bound of margin_value ("met" needs margin above it)
  std::string value_unit;
  std::optional<CoolingCheck> cooling;  ///< cooling-rule targets: the steps (json "cooling_steps")
  /// A calibrated product (model/calibration.hpp): the target at the one-sided 95 % bound of
  /// the fit (json "at_fit_bound"); also one line in details.
  struct AtFitBound {
    std::string achieved, margin;
    bool met = false;
    double achieved_value = 0, margin_value = 0;
  };
  std::optional<AtFitBound> at_fit_bound;
  /// probe: F by the General Method on the log, min: trapezoid, Simpson, exact on the linear
  /// interpolant (json "general_method": F_trapezoid_min, F_simpson_min, F_exact_linear_min); the verdict uses the smallest.
  std::optional<std::array<double, 3>> general_method_F_min;
};

/// What a lethality calculation delivered where no requirement was given: there is no verdict
/// (neither "met" nor "not demonstrated"), only the delivered F and, when a D value is known,
/// the log reductions. Shown in its own section in every format, never in the verdict table.
struct DeliveredRow {
  std::string name;
  std::string kind;             ///< the lethality measure: "F-value" | "log-reduction"
  std::string F_text;           ///< rounded down with its reference, e.g. "868 min at 70.0 °C (z 7.50 °C)"
  std::string log_text;         ///< log10 reductions as shown (rounded down), "" without a D value
  std::vector<std::string> details;
  double F_s = 0;               ///< credited F, s
  double reference_C = 0, z_C = 0;
  std::optional<double> log_reduction;  ///< log10, when a D (or Weibull) value is known
};

/// A report about measured data (a probe log) rather than a model run: the writers then say
/// "measured" in the lead, headings, plot legends and captions and "Reading this report", name
/// the log and show its clock time, and never speak of a conduction model or a Biot number.
struct MeasuredSource {
  std::string log;                      ///< the log file as given
  std::string lot;                      ///< lot or batch identifier; "" = not given (the report says so)
  std::optional<double> start_unix_s;   ///< clock time of the first reading, s since 1970 UTC (timestamped logs)
  std::size_t readings = 0;
};

/// A cooling-rule step drawn over the cooling curve: the checked temperature (the centre) must
/// fall from temp_hi_C, which it passed at t0_s, to temp_lo_C no later than t1_s. Times from the
/// process start; temperatures in °C. The writers draw it as a shaded box whose right edge is
/// the deadline: the curve must leave the box through its lower edge.
struct RuleBox {
  std::string label;     ///< e.g. "step 1 (2 h)"; no temperatures: writers append the limits
                         ///< in the display unit ("step 1 (2 h): 57 °C → 21 °C")
  double t0_s = 0, t1_s = 0;
  double temp_hi_C = 0, temp_lo_C = 0;
  std::string limits;    ///< the limits as the rule writes them, temperature tokens ("57 °C → 21 °C")
};

/// A required value drawn as a horizontal line on the plot that shows history column `column`,
/// e.g. {"F_F70_min", 2.0} (minutes) or {"centre_C", 72.0} (°C, converted for --units F).
struct TargetLine {
  std::string column;
  double value = 0;
  std::string label;     ///< legend text; empty: "required <column> = <value>"
};

/// One h scenario of a run whose targets need different ends of an h range (process/h_ends.hpp):
/// the history the verdicts of `targets` come from, sampled like RunReport::history, with the F
/// columns, required lines and rule boxes of those targets only.
struct ScenarioView {
  int number = 1;                    ///< 1-based, as the report names it
  std::string label;                 ///< "scenario 2: \"blast chill\" h 60 W/m²K (high end)"
  std::vector<std::string> targets;  ///< names of the targets evaluated on it
  std::vector<StageRow> stages;      ///< its stage records (times, h, Bi, temperatures at the ends)
  HistoryTable history;
  std::vector<TargetLine> target_lines;
  std::vector<RuleBox> rule_boxes;
};

/// History column names the html and markdown writers recognise: time_s, medium_C, centre_C,
/// surface_C, mean_C, the optional lumped_centre_C (the lumped-capacitance estimate of the
/// centre, drawn beside the exact centre when present) and F_<name>_min (cumulative lethality).
struct RunReport {
  std::string title;
  std::string verb;                      ///< "run", "modes", ...
  std::vector<KeyValue> product;         ///< product and property rows
  std::vector<StageRow> stages;
  /// The length every StageRow::biot is built on: a short name ("V/A" for the volume over the
  /// surface area) and its value; shown in the Bi column header, the notes and "Reading this
  /// report". Empty: not stated (plain "Bi").
  std::string biot_length;
  double biot_length_m = 0;
  HistoryTable history;
  std::vector<VerdictRow> verdicts;
  std::vector<std::string> warnings;
  std::vector<std::string> assumptions;
  std::vector<KeyValue> provenance;      ///< tool version, input file, SHA-256, date
  std::vector<std::string> cautions;     ///< always filled from cautions()
  std::vector<RuleBox> rule_boxes;       ///< cooling-rule steps to draw (may be empty)
  std::vector<TargetLine> target_lines;  ///< required values to draw (may be empty)
  std::vector<DeliveredRow> delivered;   ///< lethality without a requirement: no verdict (may be empty)
  /// Empty unless the targets were split over two or more h scenarios; then one view per
  /// scenario, and every format shows each scenario's history: text a stage table per scenario,
  /// md/html plots per scenario, json "scenarios" (history per scenario), csv one block per
  /// scenario (a leading `scenario` column). `history` stays scenario 1.
  std::vector<ScenarioView> scenarios;
  std::optional<MeasuredSource> measured;  ///< set: a report about measured data (probe)
};

/// "met" or "not demonstrated".
std::string_view verdict_word(bool met);
/// A Biot number as shown: 3 decimals, or 2 significant digits below 0.01.
std::string biot_number_text(double biot);
/// "2026-11-30 06:00:00 UTC" for a clock time in s since 1970 UTC (whole seconds, rounded down
/// after a 1 µs allowance for binary representation).
std::string utc_text(double unix_s);
/// The delivered row's one-line summary: "F 868 min at 70.0 °C (z 7.50 °C), 2600 log10".
std::string delivered_text(const DeliveredRow& d);
/// Heading of the delivered section: what it is and that no verdict is claimed.
std::string_view delivered_heading();
/// "Bi(V/A)" for a report whose Bi are built on V/A; "Bi" when the length is not stated.
std::string biot_symbol(const RunReport& r);

/// Every run/probe format opens with verdict_summary(r) (verdict_summary.hpp).
void write_run_text(const RunReport& r, std::ostream& out, TempUnit u);
/// JSON: "verdict_summary" near the top; each "assessment" row has "met" (true only for the
/// verdict "met") and, for a cooling rule, "cooling_steps".
void write_run_json(const RunReport& r, std::ostream& out, TempUnit u);
/// csv: the verdict summary, cautions and provenance as leading '# ' comment lines, then the
/// history table.
void write_run_csv(const RunReport& r, std::ostream& out, TempUnit u);

}  // namespace coldcore
