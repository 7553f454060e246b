// issue 18: values of the data libraries (cooling rules, cooking tables, media) outside the
// plausibility ranges of model/limits.hpp are refused where they are read, naming the entry.
#include <doctest/doctest.h>

#include "coldcore/io/libraries.hpp"
#include "coldcore/error.hpp"
#include "coldcore/io/media.hpp"
#include "coldcore/lethality/cooking_tables.hpp"
#include "coldcore/process/cooling.hpp"

using namespace coldcore;

TEST_CASE("issue 18: cooling-rule / cooking-table and media values outside the plausible ranges are refused") {
  const std::string rule = R"(
[[rule]]
key = "x"
name = "x"
source = "s"
status = "confirmed"
[[rule.step]]
from_C = 57
to_C = 21
within_h = 2
source = "s"
status = "confirmed"
)";
  CHECK_NOTHROW(io::parse_cooling_rules(rule, "r.toml"));
  std::string hot = rule;
  hot.replace(hot.find("from_C = 57"), 11, "from_C = 5e3");
  CHECK_THROWS_WITH_AS(io::parse_cooling_rules(hot, "r.toml"),
                       "r.toml: rule[1].step[1].from (in C) = 5000: must be from -200 to 400 C", InputError);
  std::string long_step = rule;
  long_step.replace(long_step.find("within_h = 2"), 12, "within_h = 1e300");
  CHECK_THROWS_WITH_AS(io::parse_cooling_rules(long_step, "r.toml"),
                       "r.toml: rule[1].step[1].within (in s) = 3.6e+303: must be from 0 to 31622400 s", InputError);

  const std::string table = R"(
[[table]]
key = "x"
name = "x"
source = "s"
status = "confirmed"
rows = [ { temp_C = 65, hold_s = 3 } ]
)";
  CHECK_NOTHROW(io::parse_cooking_tables(table, "c.toml"));
  std::string nan_row = table;
  nan_row.replace(nan_row.find("temp_C = 65"), 11, "temp_C = nan");
  CHECK_THROWS_AS(io::parse_cooking_tables(nan_row, "c.toml"), InputError);
  std::string long_hold = table;
  long_hold.replace(long_hold.find("hold_s = 3 "), 11, "hold_s = 1e9 ");
  CHECK_THROWS_WITH_AS(io::parse_cooking_tables(long_hold, "c.toml"),
                       "c.toml: table[1].rows[1].hold (in s) = 1000000000: must be from 0 to 31622400 s", InputError);

  CHECK_THROWS_WITH_AS(
      io::parse_media("schema = 1\n[media.x]\ndescription = \"d\"\nh_min_W_m2K = 1e-300\nh_max_W_m2K = 20\n"
                      "source = \"s\"\nstatus = \"confirmed\"\n",
                      "m.toml"),
      "m.toml: media.x.h_min_W_m2K = 1e-300: must be from 0.1 to 1e+06 W/(m2 K)", InputError);
}
