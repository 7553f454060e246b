#pragma once
// Content shared by the html and markdown writers: the plots built from a RunReport, the
// "Reading this report" paragraphs and the formatted table cells. Plain text here; each writer
// escapes for its own markup.
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "coldcore/report/run_report.hpp"
#include "coldcore/report/svg_plot.hpp"

namespace coldcore::detail {

struct RunFigure {
  std::string key;      // "temperature", "lethality", "cooling": file-name part
  std::string caption;  // one sentence under the figure
  svg::LinePlot plot;
};

/// The plots the history supports: temperatures (if time_s and a temperature column exist),
/// cumulative lethality (if F_*_min columns exist), cooling (if rule_boxes exist).
std::vector<RunFigure> run_figures(const RunReport& r, TempUnit u);

/// History-table helpers for the figure builders.
std::optional<size_t> column_index(const HistoryTable& h, std::string_view name);
bool is_f_column(std::string_view name);          ///< "F_<name>_min"
std::string f_name(std::string_view f_column);    ///< "F_F70_min" -> "F70"
/// Column i as plotted: temperatures converted to `u`, NaN where a row is short.
std::vector<double> column_values(const HistoryTable& h, size_t i, bool temperature, TempUnit u);

struct TimeScale {
  double seconds_per_unit;
  std::string label;
};
/// Last time the report shows: history, stage ends, rule-box deadlines (s).
double report_end_s(const RunReport& r);
TimeScale time_scale_for(double end_s);  ///< minutes up to 3 h, hours beyond
TimeScale time_scale(const RunReport& r);

/// The plots of every h scenario (RunReport::scenarios), each titled and keyed by its scenario
/// ("scenario2-temperature"); empty when the targets were not split.
std::vector<RunFigure> scenario_figures(const RunReport& r, TempUnit u);
/// One h scenario as a report of its own (stages, history, required lines, rule boxes), for the
/// plot builders.
RunReport scenario_as_report(const ScenarioView& v);
/// Keys, ids, titles and captions of a scenario's figures name the scenario.
void tag_scenario_figures(std::vector<RunFigure>& figures, const ScenarioView& v);
/// The figures a rich report shows: every scenario's when split, else run_figures(r).
std::vector<RunFigure> report_figures(const RunReport& r, TempUnit u);
/// "scenario 2: ...; targets: P70" per scenario.
std::string scenario_heading(const ScenarioView& v);

/// "Reading this report" in plain words, one paragraph per string.
std::vector<std::string> reading_paragraphs(const RunReport& r, TempUnit u);
/// A stage's Biot number for the tables and the reading paragraphs ("∞ (...)" at h = ∞).
std::string biot_text(const StageRow& s);

using TextTable = std::vector<std::vector<std::string>>;  // first row is the header
TextTable stage_table(const RunReport& r, TempUnit u);
TextTable verdict_table(const RunReport& r);  ///< with a "scenario" column when split
/// Stage table of one scenario (same columns as stage_table, no medium column).
TextTable scenario_stage_table(const RunReport& r, const ScenarioView& v, TempUnit u);


/// Column name as shown: "centre_C" -> "centre_F" for --units F.
std::string display_column_name(const Column& c, TempUnit u);

/// The report's cautions; the library's cautions() if the model left them empty, so that no
/// rich report is ever written without them.
const std::vector<std::string>& report_cautions(const RunReport& r);

/// The first line every rich report shows under its title.
std::string lead_sentence();
/// The lead of a report: lead_sentence(), or for measured data its own (no conduction model).
std::string lead_sentence(const RunReport& r);
/// Heading of the product section: "Product and properties", or "Measured log".
std::string subject_heading(const RunReport& r);
/// The delivered section's lines: "<name>: F ..., N log10" then "<name>: <detail>" lines.
std::vector<std::string> delivered_lines(const RunReport& r);

}  // namespace coldcore::detail
