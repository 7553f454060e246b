#pragma once
/// Writers of `coldcore deviation`: the comparison and the deviation record (text, json, csv, md, html;
/// cautions always; the statement that disposition is for the process authority always).
///
/// Every format opens with the verdict summary of the delivered verdicts (verdict_summary.hpp;
/// JSON "verdict_summary", csv its leading '# verdict summary: ' line).
/// JSON: {"lot", "stage", "stage_start_s", "stage_heats", "scheduled_stage_s", "delivered_stage_s",
///        "deviations": [{"kind" (medium_colder|medium_warmer|stage_shortened|log_gap), "start_s",
///        "end_s", medium kinds: "extreme_C", "extreme_at_s", "scheduled_at_extreme_C", "departure_K";
///        "description"}] (times from the stage start), "extension_given_s", "extension_needed_s",
///        "targets": [{"name", "kind", "scheduled_F_min", "delivered_F_min", "scheduled_log_reduction",
///        "delivered_log_reduction", "verdict", "met" (as delivered), "scheduled_verdict", "delivered_margin",
///        "cooling_steps" (cooling rules, as delivered), ...}],
///        "all_met_delivered", "extra_hold_s" (rounded up, to use; null when none), "extra_hold_unrounded_s",
///        "extension_medium_C", "restored": {...}, "record": {...}, "disposition", "notes", "assumptions",
///        "warnings", "provenance", "cautions",
///        "conservative" (with --conservative): {"choices", "initial_reason", "targets": [{"name",
///        "kind", "scheduled_F_min", "delivered_F_min", "verdict", "delivered_margin", ...}],
///        "all_met_delivered", "extra_hold_s", "extra_hold_unrounded_s", "extra_hold_note",
///        "alone": [{"choice", "all_met_delivered", "least_margin", "extra_hold_s"}], "driven_by",
///        "notes", "assumptions"}}
/// csv: '# ' comment lines (cautions, record with one '# deviation: <kind>; start_s ...' line per
///      departure, provenance), then one row per target:
///        target,kind,scheduled_F_min,delivered_F_min,scheduled_log_reduction,delivered_log_reduction,verdict,met
///      (`met` true | false, as delivered); with --conservative: '# conservative ...' comment lines
///      (choices, extra hold, driver), a column `case` ("nominal" | "conservative") before `met` and
///      one more row per target for the worst case.
/// Shown F and log reductions are rounded DOWN, extra time UP.
#include <iosfwd>
#include <optional>
#include <string>
#include <vector>

#include "coldcore/process/deviation.hpp"
#include "coldcore/process/deviation_conservative.hpp"
#include "coldcore/report/format.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/report/run_report.hpp"

namespace coldcore {

struct DeviationRecordInfo {
  std::string product_name;
  std::string lot;                    ///< "" = not given (the record says so)
  std::string medium_log, medium_log_sha256;
  /// The medium log's first timestamp (s since 1970, UTC) when its time column is a timestamp:
  /// each departure is then also shown on the log's clock.
  std::optional<double> medium_log_start_unix_s;
  std::string probe_log, probe_log_sha256;
  std::vector<KeyValue> provenance;   ///< tool, input, SHA-256s, date
  std::vector<std::string> warnings;
  /// --conservative: the worst case beside the nominal result (JSON key "conservative"); not owned.
  const process::ConservativeDeviation* conservative = nullptr;
  /// md/html plots (null or empty: that curve is not drawn). The scheduled and the delivered
  /// (logged-medium) runs' own histories and assessments, sampled by build_rerun_report
  /// (run_builder.hpp); the measured probe log as read (time from the process start, °C).
  const RunReport* scheduled_plot = nullptr;
  const RunReport* delivered_plot = nullptr;
  std::vector<double> probe_time_s, probe_temp_C;
};

/// The sentence every deviation output carries.
const std::string& disposition_statement();

/// Machine key of a departure kind for json and csv: "medium_colder", "medium_warmer",
/// "stage_shortened", "log_gap".
std::string_view to_string(process::DeviationKind k);
/// One sentence naming a departure for the record: its kind, when (from the stage's start),
/// the extreme reading against the schedule, or the length of a gap or shortening and what it costs.
/// `clock_start_unix_s`: the deviated stage's start on the log's clock (its first timestamp); the
/// departure's times are then also given as clock times, as the log reads them.
std::string deviation_event_text(const process::DeviationEvent& e, TempUnit u,
                                 std::optional<double> clock_start_unix_s = std::nullopt);
/// The record's line when there is no departure.
std::string no_deviation_text(const process::DeviationResult& r);

void write_deviation_text(const process::DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u);
void write_deviation_json(const process::DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u);
void write_deviation_csv(const process::DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u);

/// Self-contained HTML (inline CSS and SVG, nothing fetched; well-formed XML after the doctype):
/// title with the lot; the deviation record (lot, deviated stage, deviation start/end, lowest
/// medium, log files and their SHA-256, tool version, assumptions); per target scheduled against
/// delivered F and log reductions with the delivered margin and verdicts; the additional time that
/// restores the targets with its re-run; plots of scheduled against delivered medium and centre
/// temperature and cumulative F when the plot data are set; notes; the disposition statement and
/// printable lines for reviewer name, date and decision; warnings, provenance, the cautions box.
/// Temperatures in `u`, F-values in minutes. Same input ⇒ same bytes.
void write_deviation_html(const process::DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u);
/// The same content as Markdown; plots as `<svg_basename>-<plot>.svg` files (see markdown.hpp).
MarkdownReport write_deviation_markdown(const process::DeviationResult& r, const DeviationRecordInfo& i, TempUnit u,
                                        std::string_view svg_basename);

}  // namespace coldcore
