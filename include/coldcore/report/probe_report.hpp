#pragma once
/// Builds the report model of `coldcore probe`: a report about MEASURED data (a cold-spot probe
/// log), not a model run. The log is named, its clock time shown when it has timestamps, the lot
/// carried; lethality targets given without a requirement get a DeliveredRow (F and log
/// reductions delivered, no verdict) instead of a verdict row. Formatting only: the assessment
/// is the one assess_probe_log computed; the cumulative F column is the trapezoid sum over the
/// logged rows (lethality/integrate.hpp).
#include <string>
#include <vector>

#include "coldcore/model/time_series.hpp"
#include "coldcore/process/assessment.hpp"
#include "coldcore/report/run_report.hpp"

namespace coldcore {

struct ProbeReportOptions {
  double max_gap_s = 1e300;      ///< readings further apart are a gap: the cumulative F credits nothing across it
  std::string log_path;          ///< the log as given on the command line (named in the report)
  std::string log_sha256;        ///< SHA-256 of the log's bytes, hex
  std::string lot;               ///< lot or batch identifier; "" = not given (said so)
  /// false: no requirement was given for the lethality target(s) (no --target-log / --F-min):
  /// they are reported as delivered, with no verdict.
  bool lethality_requirement = true;
  std::vector<KeyValue> library_provenance;  ///< the data libraries read, before the date
  std::string date;              ///< provenance date (fixed in tests)
  std::string version;           ///< tool version for provenance
};

/// REQUIRES: pa from assess_probe_log on log.time_s / log.temp_C; log non-empty (parse_log_csv
/// guarantees it).
RunReport build_probe_report(const TimeSeries& log, const ProbeAssessment& pa, const ProbeReportOptions& opts);

}  // namespace coldcore
