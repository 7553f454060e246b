#include "coldcore/io/logger_csv.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>

#include "coldcore/error.hpp"
#include "coldcore/model/limits.hpp"
#include "io/detail/fields.hpp"
#include "coldcore/io/quantity.hpp"
#include "coldcore/io/sha256.hpp"
#include "io/detail/text.hpp"

namespace coldcore::io {

namespace {

using detail::format_number;
using detail::quote;
using detail::trim;

/// The cells of a line split at `delimiter` outside double quotes (RFC 4180 within a line: a
/// quoted cell keeps delimiters, and a doubled quote in it is one quote), each trimmed.
std::vector<std::string> split_cells(std::string_view line, char delimiter) {
  std::vector<std::string> cells(1);
  bool quoted = false;
  bool was_quoted = false;
  for (std::size_t i = 0; i < line.size(); ++i) {
    const char ch = line[i];
    if (quoted) {
      if (ch == '"' && i + 1 < line.size() && line[i + 1] == '"') {
        cells.back() += '"';
        ++i;
      } else if (ch == '"') {
        quoted = false;
      } else {
        cells.back() += ch;
      }
    } else if (ch == '"' && trim(cells.back()).empty()) {
      cells.back().clear();  // blanks before an opening quote are not part of the cell
      quoted = was_quoted = true;
    } else if (ch == delimiter) {
      if (!was_quoted) cells.back() = std::string(trim(cells.back()));
      cells.emplace_back();
      was_quoted = false;
    } else if (!(was_quoted && (ch == ' ' || ch == '\t'))) {
      cells.back() += ch;
    }
  }
  if (!was_quoted) cells.back() = std::string(trim(cells.back()));
  return cells;
}

/// How many times `ch` occurs in `line` outside double quotes.
std::size_t count_unquoted(std::string_view line, char ch) {
  std::size_t n = 0;
  bool quoted = false;
  for (char c : line) {
    if (c == '"') quoted = !quoted;
    else if (c == ch && !quoted) ++n;
  }
  return n;
}

/// The separator of a log: the one asked for, else ';' or tab when the header has it and no comma
/// outside quotes (spreadsheet exports where the decimal mark is a comma), else ','.
char delimiter_of(std::string_view header_line, char asked) {
  if (asked != 0) return asked;
  if (count_unquoted(header_line, ',') == 0) {
    if (count_unquoted(header_line, ';') > 0) return ';';
    if (count_unquoted(header_line, '\t') > 0) return '\t';
  }
  return ',';
}

/// The whole cell as a double, or nullopt (a partial parse such as "12abc" is not a number).
/// With `decimal_comma`, one comma and no point is the decimal mark ("12,5").
std::optional<double> parse_number(std::string_view cell, bool decimal_comma = false) {
  std::string swapped;
  if (decimal_comma && cell.find('.') == std::string_view::npos && count_unquoted(cell, ',') == 1) {
    swapped = std::string(cell);
    swapped[swapped.find(',')] = '.';
    cell = swapped;
  }
  if (!cell.empty() && cell.front() == '+') cell.remove_prefix(1);
  if (cell.empty()) return std::nullopt;
  double v = 0;
  auto res = std::from_chars(cell.data(), cell.data() + cell.size(), v);
  if (res.ec != std::errc() || res.ptr != cell.data() + cell.size()) return std::nullopt;
  return v;
}

bool ends_with(std::string_view s, std::string_view suffix) {
  return s.size() > suffix.size() && s.substr(s.size() - suffix.size()) == suffix;
}

/// "_C"/"_F" suffix of a temperature column name, or empty.
/// "C" or "F" when the column name states its unit: a _C/_F suffix (the documented form), or as
/// logger exports write it: "temp °C", "Temp (°F)", "probe [degC]", and a degree sign saved in
/// Latin-1 (the byte 0xB0) rather than UTF-8. Empty otherwise (a bare "C" may be a sensor's name).
std::string_view temperature_unit(std::string_view name) {
  if (ends_with(name, "_C")) return "C";
  if (ends_with(name, "_F")) return "F";
  std::string_view n = name;
  if (!n.empty() && (n.back() == ')' || n.back() == ']')) n.remove_suffix(1);
  if (n.empty() || (n.back() != 'C' && n.back() != 'F')) return {};
  const std::string_view unit = n.back() == 'C' ? "C" : "F";
  n.remove_suffix(1);
  for (std::string_view mark : {"\xC2\xB0", "\xB0", "deg", "(", "["})
    if (ends_with(n, mark)) return unit;
  return {};
}

bool latin1_degree(std::string_view name) {
  for (std::size_t i = 0; i < name.size(); ++i)
    if (static_cast<unsigned char>(name[i]) == 0xB0 && (i == 0 || static_cast<unsigned char>(name[i - 1]) != 0xC2)) return true;
  return false;
}

bool is_timestamp_name(std::string_view name) {
  return name == "timestamp" || name == "datetime" || name == "date_time" || name == "time_iso";
}

/// "s"/"min"/"h" suffix of a numeric time column name, or empty.
std::string_view time_unit(std::string_view name) {
  if (ends_with(name, "_min")) return "min";
  if (ends_with(name, "_s")) return "s";
  if (ends_with(name, "_h")) return "h";
  return {};
}

std::string where(std::string_view origin, std::size_t line) {
  return std::string(origin) + ":" + std::to_string(line);
}

/// Index of the time column: `asked` by name (--time-column), else the first column named as a
/// time (time_s, time_min, time_h, timestamp, ...). `at` is "<origin>:<line>" of the header.
std::size_t time_column_of(const std::vector<std::string>& header, const std::string& asked, const std::string& at,
                           std::string_view line) {
  if (!asked.empty()) {
    for (std::size_t i = 0; i < header.size(); ++i)
      if (header[i] == asked) return i;
    std::string msg = at + ": time column = " + quote(asked) + ": not in the header " + quote(line);
    if (auto near = did_you_mean(asked, header)) msg += "; did you mean " + quote(*near) + "?";
    throw InputError(msg);
  }
  for (std::size_t i = 0; i < header.size(); ++i)
    if (is_timestamp_name(header[i]) || !time_unit(header[i]).empty()) return i;
  throw InputError(at + ": time column = " + quote(header[0]) +
                   ": must be time_s, time_min, time_h (numbers) or timestamp (ISO-8601), or name the time column "
                   "with --time-column NAME");
}

/// A cell as written in a message: numbers bare, anything else quoted.
std::string show_cell(std::string_view cell) {
  return parse_number(cell) ? std::string(cell) : quote(cell);
}

constexpr const char* kWhatToDo =
    "give the logger's fixed UTC offset, e.g. --timezone +01:00 (the timestamps are then read at that offset and a "
    "jump is a gap in the log), or write each timestamp with its offset (Z or +HH:MM)";

/// Local-time timestamps (no UTC offset) whose spacing jumps by one hour more than the log's usual
/// interval: a clock set forward (summer time) makes 1 h that never elapsed look like a logger gap.
/// Refused, naming the rows, unless the offset is given.
void refuse_clock_change(const TimeSeries& log, std::string_view origin, const std::string& column,
                         const std::vector<std::size_t>& lines, const std::vector<std::string>& cells0) {
  const std::size_t n = log.time_s.size();
  if (n < 3) return;
  std::vector<double> dt;
  for (std::size_t i = 1; i < n; ++i) dt.push_back(log.time_s[i] - log.time_s[i - 1]);
  std::vector<double> sorted = dt;
  std::nth_element(sorted.begin(), sorted.begin() + static_cast<std::ptrdiff_t>(sorted.size() / 2), sorted.end());
  const double usual_s = sorted[sorted.size() / 2];
  if (!(usual_s < 1800)) return;
  for (std::size_t i = 0; i < dt.size(); ++i)
    if (std::abs(dt[i] - usual_s - 3600.0) <= std::max(usual_s, 1.0) / 2 + 1e-9)
      throw InputError(where(origin, lines[i + 1]) + ": " + column + " = " + show_cell(cells0[i + 1]) +
                       ": jumps " + format_number(dt[i]) + " s after the previous row (" + show_cell(cells0[i]) +
                       " at line " + std::to_string(lines[i]) + "), one hour more than the log's usual " +
                       format_number(usual_s) + " s: the timestamps have no UTC offset, and this looks like a clock "
                       "change (local time set forward), not an hour that elapsed; " + kWhatToDo);
}

}  // namespace

TimeSeries parse_log_csv(std::string_view text, std::string_view origin, const LogOptions& opts) {
  if (text.substr(0, 3) == "\xEF\xBB\xBF") text.remove_prefix(3);  // UTF-8 byte-order mark

  TimeSeries out;
  std::vector<std::string> header;
  std::size_t header_line = 0;
  bool iso_time = false;
  std::string_view time_unit_name;
  std::size_t time_index = 0;
  std::size_t temp_index = 0;
  char delimiter = ',';
  bool decimal_comma = false;
  std::size_t skipped = 0;  // rows with a blank time or temperature cell
  std::string_view temp_unit;
  std::string prev_time_cell;
  std::size_t prev_line = 0;
  double prev_time_abs = 0;
  double first_time_abs = 0;

  bool local_rows = false;                // a timestamp without a UTC offset was read
  std::vector<std::size_t> lines;         // line of each data row
  std::vector<std::string> cells0;        // time cell of each data row, as written
  std::size_t line_no = 0;
  std::size_t pos = 0;
  while (pos <= text.size()) {
    const std::size_t nl = text.find('\n', pos);
    const std::string_view raw = text.substr(pos, nl == std::string_view::npos ? text.size() - pos : nl - pos);
    pos = nl == std::string_view::npos ? text.size() + 1 : nl + 1;
    ++line_no;
    const std::string_view line = trim(raw);
    if (line.empty() || line.front() == '#') continue;
    if (header.empty()) {
      delimiter = delimiter_of(line, opts.delimiter);
      decimal_comma = opts.decimal_comma.value_or(delimiter != ',');
    }
    const auto cells = split_cells(line, delimiter);

    if (header.empty()) {
      header_line = line_no;
      if (parse_number(cells[0], decimal_comma) || parse_iso8601_s(cells[0]))
        throw InputError(where(origin, line_no) + ": no header row: the first row must name the columns " +
                         "with their units, e.g. time_s,medium_C");
      for (const auto& c : cells) header.push_back(c);
      time_index = time_column_of(header, opts.time_column, where(origin, line_no), line);
      const std::string& tname = header[time_index];
      time_unit_name = time_unit(tname);
      // A column chosen by name that states no time unit holds timestamps ("Date Time, GMT+00:00").
      iso_time = time_unit_name.empty();
      std::vector<std::size_t> temps;
      for (std::size_t i = 0; i < header.size(); ++i)
        if (i != time_index && !temperature_unit(header[i]).empty()) temps.push_back(i);
      for (std::size_t i : temps)
        if (latin1_degree(header[i]))
          out.warnings.push_back(where(origin, line_no) + ": column " + quote(header[i]) +
                                 ": the degree sign is the Latin-1 byte 0xB0, read as °; save the file as UTF-8 "
                                 "to silence this");
      if (!opts.temp_column.empty()) {
        bool found = false;
        for (std::size_t i : temps)
          if (header[i] == opts.temp_column) {
            temp_index = i;
            found = true;
          }
        if (!found) {
          std::vector<std::string> names;
          for (std::size_t i : temps) names.push_back(header[i]);
          std::string msg = where(origin, line_no) + ": temperature column = " + quote(opts.temp_column) +
                            ": not in the header";
          if (auto near = did_you_mean(opts.temp_column, names)) msg += "; did you mean " + quote(*near) + "?";
          throw InputError(msg);
        }
      } else if (temps.empty()) {
        throw InputError(where(origin, line_no) + ": header = " + quote(line) +
                         ": no temperature column: name one with its unit, e.g. medium_C, temp_F or \"temp (°C)\"");
      } else if (temps.size() > 1) {
        std::string names;
        for (std::size_t i : temps) names += (names.empty() ? "" : ", ") + quote(header[i]);
        throw InputError(where(origin, line_no) + ": header = " + quote(line) +
                         ": several temperature columns (" + names + "): " + opts.choose_column_hint);
      } else {
        temp_index = temps.front();
      }
      out.time_column = tname;
      out.temp_column = header[temp_index];
      temp_unit = temperature_unit(out.temp_column);
      continue;
    }

    const std::string at = where(origin, line_no);
    if (cells.size() != header.size())
      throw InputError(at + ": " + std::to_string(cells.size()) + " cell(s), the header has " +
                       std::to_string(header.size()) + ": every row needs one cell per column");

    // A blank reading is not a reading: the row is skipped and said so; the rows around it are
    // then further apart, and the gap rules decide what that interval is worth.
    if (cells[time_index].empty() || cells[temp_index].empty()) {
      out.warnings.push_back(at + ": " + quote(cells[time_index].empty() ? header[time_index] : header[temp_index]) +
                             " is blank: the row is skipped, nothing is filled in for it");
      ++skipped;
      continue;
    }
    const std::string_view time_cell = cells[time_index];
    double time_abs = 0;
    if (iso_time) {
      bool zoned = false;
      const auto t = parse_iso8601_s(time_cell, &zoned);
      if (!t)
        throw InputError(at + ": " + header[time_index] + " = " + quote(time_cell) +
                         ": not an ISO-8601 timestamp (YYYY-MM-DDTHH:MM:SS, optional .fff and Z or +HH:MM)");
      time_abs = *t;
      if (!zoned) {
        local_rows = true;
        if (opts.utc_offset_s) time_abs -= *opts.utc_offset_s;  // local = UTC + offset
      }
    } else {
      const auto t = parse_number(time_cell, decimal_comma);
      if (!t) throw InputError(at + ": " + header[time_index] + " = " + quote(time_cell) + ": not a number");
      if (!std::isfinite(*t))
        throw InputError(at + ": " + header[time_index] + " = " + std::string(time_cell) + ": must be finite");
      time_abs = *to_si(Quantity::time, *t, time_unit_name);
    }

    const std::string_view temp_cell = cells[temp_index];
    const auto temp = parse_number(temp_cell, decimal_comma);
    const std::string& temp_name = header[temp_index];
    if (!temp) throw InputError(at + ": " + temp_name + " = " + quote(temp_cell) + ": not a number");
    if (!std::isfinite(*temp)) throw InputError(at + ": " + temp_name + " = " + std::string(temp_cell) + ": must be finite");
    const double temp_C = *to_si(Quantity::temperature, *temp, temp_unit);
    if (temp_C < -273.15)
      throw InputError(at + ": " + temp_name + " = " + std::string(temp_cell) + ": below absolute zero (-273.15 C)");
    if (!limits::temperature_C.contains(temp_C))
      throw InputError(at + ": " + temp_name + " = " + std::string(temp_cell) + ": must be " +
                       detail::range_text(limits::temperature_C, Quantity::temperature, temp_unit));

    if (!out.time_s.empty()) {
      if (iso_time && local_rows && !opts.utc_offset_s && time_abs <= prev_time_abs &&
          prev_time_abs - time_abs <= 3600)
        throw InputError(at + ": " + header[time_index] + " = " + show_cell(time_cell) + ": goes back to before the previous row (" +
                         show_cell(prev_time_cell) + " at line " + std::to_string(prev_line) +
                         "): the timestamps have no UTC offset, and this looks like a clock change (local time set "
                         "back); " + kWhatToDo);
      if (!(time_abs > prev_time_abs))
        throw InputError(at + ": " + header[time_index] + " = " + show_cell(time_cell) + ": must be after the previous row (" +
                         show_cell(prev_time_cell) + " at line " + std::to_string(prev_line) + ")");
      const double gap_s = time_abs - prev_time_abs;
      if (gap_s > opts.max_gap_s)
        out.warnings.push_back(at + ": gap of " + format_number(gap_s) + " s since the previous row (line " +
                               std::to_string(prev_line) + ") exceeds " + format_number(opts.max_gap_s) +
                               " s; values in between are interpolated");
    } else {
      first_time_abs = time_abs;
      if (iso_time) out.start_unix_s = time_abs;
    }
    if (time_abs - first_time_abs > limits::duration_s.high)
      throw InputError(at + ": " + header[time_index] + " = " + show_cell(time_cell) +
                       ": more than a year after the first row; a log covers at most 366 days");
    if (out.time_s.size() == limits::max_log_rows)
      throw InputError(at + ": more than " + std::to_string(limits::max_log_rows) +
                       " data rows: at most that many are read (split the log, or thin it to a coarser interval)");
    out.time_s.push_back(time_abs - first_time_abs);
    out.temp_C.push_back(temp_C);
    prev_time_abs = time_abs;
    prev_time_cell = std::string(time_cell);
    prev_line = line_no;
    lines.push_back(line_no);
    cells0.emplace_back(time_cell);
  }

  if (header.empty()) throw InputError(where(origin, 1) + ": empty log: no header and no data rows; a log is a header naming the columns with units (e.g. time_s,temp_C) and a row per reading");
  if (out.time_s.empty())
    throw InputError(where(origin, header_line) + ": empty log: a header but no data rows" +
                     (skipped ? " with both a time and a temperature (" + std::to_string(skipped) + " blank)" : "") +
                     "; give a row per reading below it");
  if (iso_time && local_rows && !opts.utc_offset_s) refuse_clock_change(out, origin, header[time_index], lines, cells0);
  return out;
}

MediumProfile medium_profile(const TimeSeries& log, std::string_view origin, std::string_view log_bytes) {
  MediumProfile prof;
  prof.points.reserve(log.time_s.size());
  for (std::size_t i = 0; i < log.time_s.size(); ++i) prof.points.push_back({log.time_s[i], log.temp_C[i]});
  prof.description = "log " + std::string(origin) + " (sha256 " + sha256_hex(log_bytes) + ")";
  return prof;
}

std::vector<std::string> temperature_columns(std::string_view text) {
  std::vector<std::string> names;
  std::size_t pos = 0;
  while (pos <= text.size()) {
    const std::size_t nl = text.find('\n', pos);
    const std::string_view line = trim(text.substr(pos, nl == std::string_view::npos ? text.size() - pos : nl - pos));
    pos = nl == std::string_view::npos ? text.size() + 1 : nl + 1;
    if (line.empty() || line.front() == '#') continue;
    const char delimiter = delimiter_of(line, 0);
    const auto cells = split_cells(line, delimiter);
    if (parse_number(cells[0], delimiter != ',') || parse_iso8601_s(cells[0])) return names;  // no header
    std::size_t time_index = cells.size();
    for (std::size_t i = 0; i < cells.size() && time_index == cells.size(); ++i)
      if (is_timestamp_name(cells[i]) || !time_unit(cells[i]).empty()) time_index = i;
    for (std::size_t i = 0; i < cells.size(); ++i)
      if (i != time_index && !temperature_unit(cells[i]).empty()) names.push_back(cells[i]);
    return names;
  }
  return names;
}

}  // namespace coldcore::io
