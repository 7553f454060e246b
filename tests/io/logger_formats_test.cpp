// Issue 16: logger exports as they come from spreadsheets and loggers: ';' separators and decimal
// commas, quoted headers holding commas and units, a time column chosen by name, blank cells.
// The expected values are the cells as written, converted by the exact definition of the degree
// Fahrenheit (t/°C = (t/°F − 32)/1.8, NIST SP 811 appendix B.9) and plain arithmetic on the times.
#include <doctest/doctest.h>

#include <cmath>
#include <string>

#include "coldcore/error.hpp"
#include "coldcore/io/logger_csv.hpp"

using namespace coldcore;
using namespace coldcore::io;

namespace {
bool has_warning(const TimeSeries& t, const std::string& part) {
  for (const auto& w : t.warnings)
    if (w.find(part) != std::string::npos) return true;
  return false;
}
}  // namespace

TEST_CASE("issue 16: a '-' export with decimal commas is read without options") {
  const TimeSeries t = parse_log_csv("time_s;medium_C\n0;20,5\n30;21,25\n60;-1,5\n", "semi.csv");
  REQUIRE(t.time_s.size() == 3);
  CHECK(t.temp_C[0] == 20.5);
  CHECK(t.temp_C[1] == 21.25);
  CHECK(t.temp_C[2] == -1.5);
  CHECK(t.time_s[2] == 60);
  // A tab export likewise; dots still read where a file has them.
  const TimeSeries tab = parse_log_csv("time_min\tprobe_C\n0\t4.5\n0,5\t5,5\n", "tab.csv");
  CHECK(tab.time_s[1] == 30);
  CHECK(tab.temp_C[0] == 4.5);
  CHECK(tab.temp_C[1] == 5.5);
}

TEST_CASE("issue 16: quoted headers with commas and units / a time column chosen by name") {
  const std::string text =
      "\"#\",\"Date Time, GMT+00:00\",\"Temp, °F\",\"Battery, V\"\n"
      "1,2026-11-30 06:00:00,41.0,3.6\n"
      "2,2026-11-30 06:00:30,41.9,3.6\n";
  LogOptions o;
  o.time_column = "Date Time, GMT+00:00";
  const TimeSeries t = parse_log_csv(text, "export.csv", o);
  CHECK(t.time_column == "Date Time, GMT+00:00");
  CHECK(t.temp_column == "Temp, °F");
  REQUIRE(t.time_s.size() == 2);
  CHECK(t.time_s[1] == 30);
  CHECK(t.temp_C[0] == doctest::Approx(5.0).epsilon(1e-14));   // (41 − 32) / 1.8
  CHECK(t.temp_C[1] == doctest::Approx(5.5).epsilon(1e-14));   // (41.9 − 32) / 1.8
  REQUIRE(t.start_unix_s);
  CHECK(*t.start_unix_s == 1796018400.0);  // 2026-11-30T06:00:00Z: 20 787 days after 1970-01-01, + 6 h
  // Without the option the index column cannot be the time: the message names the option.
  CHECK_THROWS_WITH_AS(parse_log_csv(text, "export.csv"),
                       "export.csv:1: time column = \"#\": must be time_s, time_min, time_h (numbers) or timestamp "
                       "(ISO-8601), or name the time column with --time-column NAME",
                       InputError);
  o.time_column = "Date Time";
  CHECK_THROWS_WITH_AS(parse_log_csv(text, "export.csv", o),
                       "export.csv:1: time column = \"Date Time\": not in the header \"\\\"#\\\",\\\"Date Time, "
                       "GMT+00:00\\\",\\\"Temp, °F\\\",\\\"Battery, V\\\"\"",
                       InputError);
}

TEST_CASE("issue 16: a doubled quote inside a quoted header is one quote - the first time-named column is the time") {
  const TimeSeries t = parse_log_csv("n,elapsed_min,\"probe \"\"A\"\" (°C)\"\n1,0,10\n2,1,11\n", "q.csv");
  CHECK(t.time_column == "elapsed_min");
  CHECK(t.temp_column == "probe \"A\" (°C)");
  CHECK(t.time_s[1] == 60);
  CHECK(t.temp_C[1] == 11);
  CHECK(temperature_columns("n,elapsed_min,\"probe \"\"A\"\" (°C)\",\"B, °C\"\n") ==
        std::vector<std::string>{"probe \"A\" (°C)", "B, °C"});
}

TEST_CASE("issue 16: a blank cell skips its row with a warning - the gap rules then decide") {
  const std::string text = "time_s,probe_C\n0,70\n30,70\n60,\n90,70\n,70\n120,70\n";
  LogOptions o;
  o.max_gap_s = 45;
  const TimeSeries t = parse_log_csv(text, "blank.csv", o);
  REQUIRE(t.time_s.size() == 4);  // 0, 30, 90, 120: nothing filled in for the blank rows
  CHECK(t.time_s[2] == 90);
  CHECK(has_warning(t, "blank.csv:4: \"probe_C\" is blank: the row is skipped"));
  CHECK(has_warning(t, "blank.csv:6: \"time_s\" is blank: the row is skipped"));
  // 30 s -> 90 s is longer than the 45 s allowed: a gap, said with its lines.
  CHECK(has_warning(t, "blank.csv:5: gap of 60 s since the previous row (line 3) exceeds 45 s"));
  // Within the allowed spacing the skipped row leaves no gap.
  o.max_gap_s = 60;
  CHECK_FALSE(has_warning(parse_log_csv(text, "blank.csv", o), "gap of"));
}

TEST_CASE("issue 16: --delimiter and --decimal-comma as options") {
  LogOptions o;
  o.delimiter = ';';
  o.decimal_comma = false;  // a ';' file written with decimal points
  const TimeSeries t = parse_log_csv("time_s;medium_C\n0;20.5\n", "dots.csv", o);
  CHECK(t.temp_C[0] == 20.5);
  // "20,5" with the decimal comma switched off is not a number: said, not guessed.
  CHECK_THROWS_WITH_AS(parse_log_csv("time_s;medium_C\n0;20,5\n", "dots.csv", o),
                       "dots.csv:2: medium_C = \"20,5\": not a number", InputError);
}
