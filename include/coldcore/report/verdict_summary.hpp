#pragma once
/// The verdict summary every report of run, probe, solve and deviation opens with (text, md,
/// html, json, csv), and the one line the CLI prints on stderr when the report goes to --out.
/// Built ONCE here from the verdicts the report shows (the same rows and the same margin cells
/// as the verdict tables), so that the summary cannot disagree with them; the writers only
/// place it (write_summary_text / _json / _csv here, the html box and markdown line in
/// rich_page.hpp).
///
/// Sentences (exact; parts joined by "; ", the first part capitalised):
///   no verdict:   "No target given: no verdict"
///   all met:      "All 3 targets met"; a single target: "1 of 1 target met"
///   not all met:  "1 of 2 targets NOT DEMONSTRATED: listeria-monocytogenes (shortfall 0.4 log10)"
///                 naming every target not demonstrated, in table order, with its margin cell
/// A part's scope says what its verdicts are of when that is not the report's own process:
///   solve      "At the answer to use: all 2 targets met"
///   deviation  "As delivered: 1 of 2 targets NOT DEMONSTRATED: F70 (shortfall 317 min)"
///   --conservative adds "; worst case of the file's ranges: ..." (or "...: no answer").
#include <iosfwd>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "coldcore/process/conservative.hpp"
#include "coldcore/process/deviation.hpp"
#include "coldcore/process/deviation_conservative.hpp"
#include "coldcore/process/inverse.hpp"
#include "coldcore/report/run_report.hpp"

namespace coldcore {

class JsonWriter;

/// One target as the summary counts it.
struct SummaryItem {
  std::string name;
  bool met = false;
  std::string why;  ///< margin cell of a target not demonstrated ("shortfall 0.4 log10"); "" or "-": none shown
};

/// The verdicts of one set of targets (one re-run, one case).
struct VerdictCount {
  std::string scope;   ///< "" (the report's process) | "at the answer to use" | "as delivered" | "worst case of the file's ranges"
  bool no_answer = false;  ///< the case has no verdicts because the question has no answer there
  int targets = 0, met = 0, not_demonstrated = 0;
  std::vector<SummaryItem> not_met;  ///< the targets not demonstrated, in table order
};

struct VerdictSummary {
  std::vector<VerdictCount> parts;  ///< the report's verdicts first; the worst case after it (--conservative)
  /// At least one target, and every target of every part met (no part without an answer).
  bool all_met = false;
  std::string sentence;             ///< as above, without a final full stop
  /// The first part's counts (the report's own verdicts).
  const VerdictCount& main() const { return parts.front(); }
};

/// The summary of the given parts. REQUIRES: parts non-empty.
VerdictSummary summarize_verdicts(std::vector<VerdictCount> parts);
/// Counts `items` under `scope`.
VerdictCount count_verdicts(const std::vector<SummaryItem>& items, std::string scope = "");

/// run and probe: the report's verdict rows (RunReport::verdicts); none: "No target given".
VerdictSummary verdict_summary(const RunReport& r);
/// solve: the verification re-run at the value to use; with `worst` (--conservative) its
/// worst-case re-run too (no answer there: not all met).
VerdictSummary verdict_summary(const process::SolveResult& r, const process::ConservativeSolve* worst = nullptr);
/// deviation: the delivered verdicts (model with the logged medium, else the probe log); with
/// `worst` (--conservative) the worst case's delivered verdicts too.
VerdictSummary verdict_summary(const process::DeviationResult& r, const process::ConservativeDeviation* worst = nullptr);

/// Text reports: "Verdict summary: <sentence>" and a blank line (just after the title).
void write_summary_text(std::ostream& out, const VerdictSummary& s);
/// JSON: the key "verdict_summary" and its object {"sentence", "all_met", "targets", "met",
/// "not_demonstrated", "not_demonstrated_targets": [names], "scope", "worst_case": {...} when
/// there is one, with the same counts and "no_answer"}. Call inside the top-level object.
void write_summary_json(JsonWriter& w, const VerdictSummary& s);
/// csv: the leading comment line "# verdict summary: <sentence>".
void write_summary_csv(std::ostream& out, const VerdictSummary& s);
/// The stderr line of a verb whose report was written to `out_path`:
/// "coldcore <verb>: <sentence>; report written to <out_path>".
std::string summary_stderr_line(std::string_view verb, const VerdictSummary& s, std::string_view out_path);

}  // namespace coldcore
