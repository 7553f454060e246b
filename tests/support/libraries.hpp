#pragma once
// The project's data libraries (products/*.toml), read once per test binary, for suites that
// assess against the organisms, cooling rules and cooking tables the tool ships.
#include "coldcore/io/libraries.hpp"
#include "coldcore/lethality/cooking_tables.hpp"
#include "coldcore/lethality/organisms.hpp"
#include "coldcore/process/cooling.hpp"
#include "lethality/lethality_support.hpp"

namespace coldcore::test {

inline const OrganismLibrary& project_organisms() {
  static const OrganismLibrary lib = io::parse_organisms(read_source_file("products/organisms.toml"), "organisms.toml");
  return lib;
}

inline const RuleLibrary& project_rules() {
  static const RuleLibrary lib =
      io::parse_cooling_rules(read_source_file("products/cooling-rules.toml"), "cooling-rules.toml");
  return lib;
}

inline const CookingTables& project_cooking_tables() {
  static const CookingTables t =
      io::parse_cooking_tables(read_source_file("products/cooking-tables.toml"), "cooking-tables.toml");
  return t;
}

}  // namespace coldcore::test
