#pragma once
/// Temperature logs (CSV) from a data logger: a medium (oven, water, chiller air) or a probe.
///
/// Format: a header row naming the columns with their units, then one row per reading.
///   time column:          LogOptions::time_column, else the first column named
///                         time_s | time_min | time_h  (numbers), or
///                         timestamp | datetime | date_time | time_iso  (ISO-8601
///                         `YYYY-MM-DDTHH:MM:SS[.fff][Z|±HH:MM]`, or a space instead of the `T`);
///                         a column chosen by name that states no time unit holds timestamps
///   temperature column:   a name stating its unit: ending in _C or _F (`medium_C`, `probe1_C`),
///                         or as loggers write it (`temp (°F)`, `"Temp, °F"`, `probe [degC]`)
/// Other columns are ignored. With several temperature columns, LogOptions::temp_column picks one.
/// Cells are separated by LogOptions::delimiter; without it, by ';' (or a tab) when the header has
/// that and no comma outside quotes, else by ','. A cell may be in double quotes (a doubled quote
/// inside is one quote), so a header such as "Date Time, GMT+00:00" keeps its comma. With ';' or
/// tab as the separator a decimal comma is read (`12,5`), as LogOptions::decimal_comma forces.
/// Surrounding blanks are ignored; blank lines and lines starting with '#' are skipped; CRLF line
/// ends are accepted. A row whose time or temperature cell is blank is skipped with a warning that
/// names its line: nothing is filled in for it, so the readings around it are further apart and
/// the gap rules (max_gap_s, and each verb's rule for gaps) decide what that interval is worth.
/// A header is required: a log without one cannot say its units, so it is refused.
///
/// Errors (coldcore::InputError) name `<origin>:<line>`, the column, the value and the
/// requirement, e.g. `oven.csv:5: time_s = 120: must be after the previous row (130 at line 4)`.
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "coldcore/model/stages.hpp"
#include "coldcore/model/time_series.hpp"

namespace coldcore::io {

struct LogOptions {
  /// Gap between consecutive readings above which a warning is added (not an error): a logger
  /// that stopped says nothing about the medium meanwhile, and the schedule interpolates across.
  double max_gap_s = 60;
  /// Name of the temperature column to read when there are several; empty = the only one.
  std::string temp_column;
  /// Name of the time column; empty = the first column named as a time (see above).
  std::string time_column;
  /// The cell separator: ',', ';' or '\t'; 0 = from the header (see above).
  char delimiter = 0;
  /// Read `12,5` as 12.5; nullopt = when the separator is not a comma.
  std::optional<bool> decimal_comma;
  /// What the refusal of a log with several temperature columns tells the user to do.
  std::string choose_column_hint = "choose one with --temp-column NAME";
  /// UTC offset of timestamps written without one (local time = UTC + offset), e.g. +3600 for
  /// +01:00 (--timezone). Without it, such timestamps are read as UTC, and a log whose spacing
  /// jumps by one hour more than its usual interval (a clock set forward), or goes back by up to
  /// an hour (set back), is refused: the jump is a clock change, not time that elapsed. With it,
  /// the jump is taken as real: a gap in the log.
  std::optional<double> utc_offset_s;
};

/// A --timezone value: "+HH:MM", "-HH:MM", "+HH", "Z" or "UTC" as seconds east of UTC.
/// Throws InputError naming `option`, the value and the accepted forms.
double parse_utc_offset_s(std::string_view text, std::string_view option = "--timezone");

/// Parses a log. REQUIRES: nothing; every malformed input throws InputError naming origin:line.
/// Refused: no header, unknown time column, no temperature column, non-numeric or non-finite
/// cells, temperatures below -273.15 C, times not strictly increasing, no data rows.
TimeSeries parse_log_csv(std::string_view text, std::string_view origin, const LogOptions& = {});

/// The names of the header's temperature columns, in order (a study's probe log may hold one
/// column per container). Empty when the text has no header row; parse_log_csv then says why.
std::vector<std::string> temperature_columns(std::string_view text);

/// A parsed log as a stage's medium schedule (points at the logged times, linear between).
/// `origin` and the log's bytes go into the description: "log <origin> (sha256 <hex>)".
/// REQUIRES: !log.time_s.empty() (parse_log_csv guarantees it).
MediumProfile medium_profile(const TimeSeries& log, std::string_view origin, std::string_view log_bytes);

/// Seconds since 1970-01-01T00:00:00Z of an ISO-8601 timestamp as described above; a time
/// without zone is read as UTC (only differences matter for a log). nullopt if malformed.
/// Exposed for tests.
std::optional<double> parse_iso8601_s(std::string_view text);
/// Same; *has_offset (when given) says whether the text carried Z or ±HH:MM.
std::optional<double> parse_iso8601_s(std::string_view text, bool* has_offset);

}  // namespace coldcore::io
