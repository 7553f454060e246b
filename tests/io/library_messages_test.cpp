// The data libraries read through the same Fields as product files: the same unknown-key,
// missing, type and range messages, each naming the file, the key, the value and what is accepted.
#include <doctest/doctest.h>

#include <string>

#include "coldcore/error.hpp"
#include "coldcore/io/libraries.hpp"
#include "coldcore/io/media.hpp"

using namespace coldcore;

TEST_CASE("library readers: sourced values are checked like any other table") {
  const std::string head = "[[organism]]\nkey = \"x\"\nname = \"x\"\nkind = \"spore\"\n";
  CHECK_THROWS_WITH_AS(io::parse_organisms(head + "reference_C = { valu = 100, source = \"s\", status = \"confirmed\" }\n",
                                           "o.toml"),
                       "o.toml: organism[1].reference_C.valu = 100: unknown key; did you mean 'value'?", InputError);
  CHECK_THROWS_WITH_AS(io::parse_organisms(head + "reference_C = { value = \"100\", source = \"s\", status = \"confirmed\" }\n",
                                           "o.toml"),
                       "o.toml: organism[1].reference_C.value = \"100\": must be a number", InputError);
  CHECK_THROWS_WITH_AS(io::parse_organisms(head + "reference_C = { value = 100, source = \"s\" }\n", "o.toml"),
                       "o.toml: organism[1].reference_C.status: missing: \"confirmed\", \"derived\" or \"from memory\"",
                       InputError);
  CHECK_THROWS_WITH_AS(io::parse_organisms("[[organism]]\nkey = \"x\"\nkind = \"spore\"\n", "o.toml"),
                       "o.toml: organism[1].name: missing: a name for reports, in double quotes", InputError);
}

TEST_CASE("library readers: durations show the value as written") {
  const std::string rule =
      "[[rule]]\nkey = \"k\"\nname = \"n\"\nsource = \"s\"\nstatus = \"confirmed\"\n"
      "[[rule.step]]\nfrom_C = 57\nto_C = 21\nwithin_min = -5\nsource = \"s\"\nstatus = \"confirmed\"\n";
  CHECK_THROWS_WITH_AS(io::parse_cooling_rules(rule, "r.toml"), "r.toml: rule[1].step[1].within_min = -5: must be > 0",
                       InputError);
  CHECK_THROWS_WITH_AS(io::parse_cooking_tables("[[table]]\nkey = \"x\"\nname = \"x\"\nsource = \"s\"\n"
                                                "status = \"confirmed\"\nrows = []\n",
                                                "c.toml"),
                       doctest::Contains("c.toml: table[1].rows = []: must hold at least one row"), InputError);
}

TEST_CASE("library readers: one status check for every library") {
  CHECK_THROWS_WITH_AS(io::parse_media("schema = 1\n[media.x]\ndescription = \"d\"\nh_min_W_m2K = 5\nh_max_W_m2K = 20\n"
                                       "source = \"s\"\nstatus = \"sure\"\n",
                                       "m.toml"),
                       "m.toml: media.x.status = \"sure\": must be \"confirmed\", \"derived\" or \"from memory\"",
                       InputError);
}

// A library of another schema would be read with the wrong meaning; one check for every library
// (a custom organism, rule or table file may leave the schema out; the media file must give it).
TEST_CASE("library readers: one schema check for every library") {
  CHECK_THROWS_WITH_AS(io::parse_organisms("schema = 2\n", "o.toml"), "o.toml: schema = 2: must be 1", InputError);
  CHECK_THROWS_WITH_AS(io::parse_cooling_rules("schema = \"1\"\n", "r.toml"), "r.toml: schema = \"1\": must be 1",
                       InputError);
  CHECK_THROWS_WITH_AS(io::parse_cooking_tables("schema = 1.5\n", "c.toml"), "c.toml: schema = 1.5: must be 1",
                       InputError);
  CHECK_THROWS_WITH_AS(io::parse_media("[media.x]\n", "m.toml"), "m.toml: schema: missing: must be 1", InputError);
  // schema 1 passes: what is missing next is the rules themselves
  CHECK_THROWS_WITH_AS(io::parse_cooling_rules("schema = 1\n", "r.toml"), "r.toml: rule: missing: [[rule]] tables",
                       InputError);
}
