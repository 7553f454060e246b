// Logger CSV reader: units from the header, rebasing, refusals with file:line.
#include <doctest/doctest.h>

#include "coldcore/error.hpp"
#include "coldcore/io/logger_csv.hpp"
#include "coldcore/io/sha256.hpp"

using coldcore::InputError;
using coldcore::io::LogOptions;
using coldcore::io::parse_iso8601_s;
using coldcore::io::parse_log_csv;

TEST_CASE("log in seconds and C is read as written") {
  const auto ts = parse_log_csv("time_s,medium_C\n0,20\n30,50.5\n60,80\n", "oven.csv");
  CHECK(ts.time_s == std::vector<double>{0, 30, 60});
  CHECK(ts.temp_C == std::vector<double>{20, 50.5, 80});
  CHECK(ts.warnings.empty());
  CHECK(ts.time_column == "time_s");
  CHECK(ts.temp_column == "medium_C");
}

TEST_CASE("log in minutes and F: converted / rebased so the first row is t = 0") {
  // 32 F = 0 C and 212 F = 100 C (definition of the scales).
  const auto ts = parse_log_csv("time_min,temp_F\n10,32\n11,212\n12.5,122\n", "chill.csv");
  REQUIRE(ts.time_s.size() == 3);
  CHECK(ts.time_s[0] == 0);
  CHECK(ts.time_s[1] == doctest::Approx(60));
  CHECK(ts.time_s[2] == doctest::Approx(150));
  CHECK(ts.temp_C[0] == doctest::Approx(0));
  CHECK(ts.temp_C[1] == doctest::Approx(100));
  CHECK(ts.temp_C[2] == doctest::Approx(50));
}

TEST_CASE("log with ISO-8601 timestamps / T or space / Z or none / fractions") {
  const auto ts = parse_log_csv(
      "timestamp,medium_C\n2026-03-01T08:00:00Z,20\n2026-03-01 08:00:30,25\n2026-03-01T08:01:00.5Z,30\n", "o.csv");
  REQUIRE(ts.time_s.size() == 3);
  CHECK(ts.time_s[1] == doctest::Approx(30).epsilon(1e-12));
  CHECK(ts.time_s[2] == doctest::Approx(60.5).epsilon(1e-12));
}

TEST_CASE("ISO-8601 timestamps against Unix time") {
  // Unix times of these instants (POSIX definition; checked with Python datetime.timestamp()).
  CHECK(*parse_iso8601_s("1970-01-01T00:00:00Z") == 0);
  CHECK(*parse_iso8601_s("2000-01-01T00:00:00Z") == 946684800.0);
  CHECK(*parse_iso8601_s("2026-03-01 08:00:00") == 1772352000.0);
  CHECK(*parse_iso8601_s("1970-01-01T00:00:00+01:00") == -3600.0);
  // Leap day and year end: differences across them.
  CHECK(*parse_iso8601_s("2024-02-29T00:00:30Z") - *parse_iso8601_s("2024-02-28T23:59:30Z") == 60.0);
  CHECK(*parse_iso8601_s("2025-01-01T00:00:00Z") - *parse_iso8601_s("2024-12-31T23:59:59Z") == 1.0);
  CHECK_FALSE(parse_iso8601_s("2023-02-29T00:00:00"));  // not a leap year
  CHECK_FALSE(parse_iso8601_s("2026-13-01T00:00:00"));
  CHECK_FALSE(parse_iso8601_s("2026-03-01T25:00:00"));
  CHECK_FALSE(parse_iso8601_s("2026-03-01"));
  CHECK_FALSE(parse_iso8601_s("08:00:00"));
  CHECK_FALSE(parse_iso8601_s("2026-03-01T08:00:00Zjunk"));
}

TEST_CASE("log tolerates comments / blank lines / CRLF / a byte-order mark and extra columns") {
  const auto ts = parse_log_csv("\xEF\xBB\xBF# oven 3, logger 17\r\ntime_s, channel, medium_C\r\n\r\n0, a, 20\r\n"
                                "10, a, 21\r\n",
                                "o.csv");
  CHECK(ts.time_s == std::vector<double>{0, 10});
  CHECK(ts.temp_C == std::vector<double>{20, 21});
}

TEST_CASE("several temperature columns: the option picks one / else refused") {
  const std::string text = "time_s,air_C,probe_C\n0,90,4\n10,91,5\n";
  LogOptions o;
  o.temp_column = "probe_C";
  CHECK(parse_log_csv(text, "two.csv", o).temp_C == std::vector<double>{4, 5});
  CHECK_THROWS_WITH_AS(parse_log_csv(text, "two.csv"),
                       "two.csv:1: header = \"time_s,air_C,probe_C\": several temperature columns (\"air_C\", "
                       "\"probe_C\"): choose one with --temp-column NAME",
                       InputError);
  o.temp_column = "prob_C";
  CHECK_THROWS_WITH_AS(parse_log_csv(text, "two.csv", o),
                       "two.csv:1: temperature column = \"prob_C\": not in the header; did you mean \"probe_C\"?",
                       InputError);
}

TEST_CASE("gaps longer than the limit are warnings with file:line / not errors") {
  const auto ts = parse_log_csv("time_s,medium_C\n0,20\n30,21\n120,22\n150,23\n", "gap.csv");
  CHECK(ts.time_s.size() == 4);
  REQUIRE(ts.warnings.size() == 1);
  CHECK(ts.warnings[0] ==
        "gap.csv:4: gap of 90 s since the previous row (line 3) exceeds 60 s; values in between are interpolated");
  LogOptions o;
  o.max_gap_s = 90;  // a gap equal to the limit is accepted
  CHECK(parse_log_csv("time_s,medium_C\n0,20\n30,21\n120,22\n150,23\n", "gap.csv", o).warnings.empty());
}

TEST_CASE("logs refused with file:line / column / value and requirement") {
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,medium_C\n0,20\n60,21\n30,22\n", "oven.csv"),
                       "oven.csv:4: time_s = 30: must be after the previous row (60 at line 3)", InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,medium_C\n0,20\n0,21\n", "oven.csv"),
                       "oven.csv:3: time_s = 0: must be after the previous row (0 at line 2)", InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("timestamp,medium_C\n2026-03-01T08:00:10Z,20\n2026-03-01T08:00:00Z,21\n",
                                     "oven.csv"),
                       "oven.csv:3: timestamp = \"2026-03-01T08:00:00Z\": must be after the previous row "
                       "(\"2026-03-01T08:00:10Z\" at line 2)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,medium_C\n0,20\n10,abc\n", "oven.csv"),
                       "oven.csv:3: medium_C = \"abc\": not a number", InputError);
  // A blank cell is no reading: refused with its line once there is nothing else (issue 16: a
  // blank is skipped and named, not an error; see the "issue 16" cases).
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,medium_C\n10,\n", "oven.csv"),
                       "oven.csv:1: empty log: a header but no data rows with both a time and a temperature (1 "
                       "blank); give a row per reading below it",
                       InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,medium_C\n0,20\n1O,21\n", "oven.csv"),
                       "oven.csv:3: time_s = \"1O\": not a number", InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,medium_C\n0,20\n10,nan\n", "oven.csv"),
                       "oven.csv:3: medium_C = nan: must be finite", InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("timestamp,medium_C\n2026-03-01 8:00,20\n", "oven.csv"),
                       "oven.csv:2: timestamp = \"2026-03-01 8:00\": not an ISO-8601 timestamp "
                       "(YYYY-MM-DDTHH:MM:SS, optional .fff and Z or +HH:MM)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,medium_F\n0,-500\n", "oven.csv"),
                       "oven.csv:2: medium_F = -500: below absolute zero (-273.15 C)", InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,medium_C\n0,20\n10\n", "oven.csv"),
                       "oven.csv:3: 1 cell(s), the header has 2: every row needs one cell per column", InputError);
}

TEST_CASE("logs refused for their header or for being empty") {
  CHECK_THROWS_WITH_AS(parse_log_csv("", "empty.csv"), "empty.csv:1: empty log: no header and no data rows; a log is a header naming the columns with units (e.g. time_s,temp_C) and a row per reading",
                       InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("# nothing logged\n\n", "empty.csv"),
                       "empty.csv:1: empty log: no header and no data rows; a log is a header naming the columns with units (e.g. time_s,temp_C) and a row per reading", InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("# logger 17\ntime_s,medium_C\n\n", "empty.csv"),
                       "empty.csv:2: empty log: a header but no data rows; give a row per reading below it", InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("0,20\n10,21\n", "bare.csv"),
                       "bare.csv:1: no header row: the first row must name the columns with their units, "
                       "e.g. time_s,medium_C",
                       InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("Time,medium_C\n0,20\n", "h.csv"),
                       "h.csv:1: time column = \"Time\": must be time_s, time_min, time_h (numbers) or timestamp "
                       "(ISO-8601), or name the time column with --time-column NAME",
                       InputError);
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,temp\n0,20\n", "h.csv"),
                       "h.csv:1: header = \"time_s,temp\": no temperature column: name one with its unit, "
                       "e.g. medium_C, temp_F or \"temp (°C)\"",
                       InputError);
}

TEST_CASE("a log becomes a medium profile / linear between readings / named with its digest") {
  const std::string text = "time_s,medium_C\n100,20\n160,80\n";
  const auto prof = coldcore::io::medium_profile(parse_log_csv(text, "oven.csv"), "oven.csv", text);
  CHECK(prof.at(0) == 20);
  CHECK(prof.at(30) == doctest::Approx(50));
  CHECK(prof.at(600) == 80);
  CHECK(prof.description == "log oven.csv (sha256 " + coldcore::io::sha256_hex(text) + ")");
}

// Invented local-time log at 1-min cadence across a spring-forward change (clock 02:00 -> 03:00):
// 01:59 is followed by 03:00, one real minute (common practice: summer time moves the clock 1 h).
TEST_CASE("issue 11: a local-time log across a spring-forward clock change is refused without --timezone") {
  const std::string text =
      "timestamp,medium_C\n2026-03-29T01:58:00,60\n2026-03-29T01:59:00,60\n2026-03-29T03:00:00,60\n"
      "2026-03-29T03:01:00,60\n";
  namespace io = coldcore::io;
  CHECK_THROWS_WITH_AS(io::parse_log_csv(text, "local.csv"),
                       "local.csv:4: timestamp = \"2026-03-29T03:00:00\": jumps 3660 s after the previous row "
                       "(\"2026-03-29T01:59:00\" at line 3), one hour more than the log's usual 60 s: the timestamps "
                       "have no UTC offset, and this looks like a clock change (local time set forward), not an hour "
                       "that elapsed; give the logger's fixed UTC offset, e.g. --timezone +01:00 (the timestamps are "
                       "then read at that offset and a jump is a gap in the log), or write each timestamp with its "
                       "offset (Z or +HH:MM)",
                       InputError);
  io::LogOptions o;
  o.utc_offset_s = io::parse_utc_offset_s("+01:00");
  CHECK(*o.utc_offset_s == 3600.0);
  const auto log = io::parse_log_csv(text, "local.csv", o);  // taken as given: a 3660 s gap, named
  CHECK(log.time_s == std::vector<double>{0, 60, 3720, 3780});
  REQUIRE(log.warnings.size() == 1);
  CHECK(log.warnings[0].find("local.csv:4: gap of 3660 s") == 0);
  // the same rows with their offset are read as written
  std::string zoned = text;
  for (std::size_t p = 0; (p = zoned.find(":00,", p)) != std::string::npos; p += 10) zoned.replace(p, 4, ":00+01:00,");
  CHECK_NOTHROW(io::parse_log_csv(zoned, "zoned.csv"));
  CHECK_THROWS_WITH_AS(io::parse_utc_offset_s("CET"),
                       "--timezone = \"CET\": must be a fixed UTC offset +HH:MM or -HH:MM (hours 0 to 14, e.g. "
                       "+01:00), +HH, Z or UTC",
                       InputError);
}

// issue 16/18: logger exports state the unit in the column name in several ways. 212 F is
// 100 C and 32 F is 0 C (the defining points of the scales).
TEST_CASE("issue 18: units read from the header as loggers write them / Latin-1 degree included") {
  for (const char* header : {"time_s,temp (\xC2\xB0" "F)", "time_s,Temp [degF]", "time_s,probe \xC2\xB0" "F",
                             "time_s,probe \xB0" "F"}) {
    CAPTURE(header);
    const auto log = parse_log_csv(std::string(header) + "\n0,32\n60,212\n", "l.csv");
    CHECK(log.temp_C.at(0) == doctest::Approx(0.0).epsilon(1e-12));
    CHECK(log.temp_C.at(1) == doctest::Approx(100.0).epsilon(1e-12));
  }
  // A Latin-1 degree byte is read, and said.
  const auto latin1 = parse_log_csv("time_s,probe \xB0" "C\n0,70\n60,71\n", "l.csv");
  REQUIRE(latin1.warnings.size() == 1);
  CHECK(latin1.warnings[0] ==
        "l.csv:1: column \"probe \\xB0C\": the degree sign is the Latin-1 byte 0xB0, read as \xC2\xB0; save the file "
        "as UTF-8 to silence this");
  // A bare letter after a space may be a sensor's name, not a unit: refused, with what is accepted.
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,Sensor C\n0,70\n", "l.csv"),
                       "l.csv:1: header = \"time_s,Sensor C\": no temperature column: name one with its unit, e.g. "
                       "medium_C, temp_F or \"temp (\xC2\xB0" "C)\"",
                       InputError);
  // Several: the message lists them and says how to choose.
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s,a_C,b_C\n0,70,70\n", "l.csv"),
                       "l.csv:1: header = \"time_s,a_C,b_C\": several temperature columns (\"a_C\", \"b_C\"): choose "
                       "one with --temp-column NAME",
                       InputError);
  LogOptions pick;
  pick.temp_column = "b_C";
  CHECK(parse_log_csv("time_s,a_C,b_C\n0,70,75\n", "l.csv", pick).temp_C.at(0) == 75);
}
