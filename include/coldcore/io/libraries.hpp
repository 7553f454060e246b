#pragma once
/// The data libraries shipped in products/: organisms.toml, cooling-rules.toml and
/// cooking-tables.toml, each value with its source. Loading them is the only disk access here.
#include <filesystem>

#include "coldcore/lethality/cooking_tables.hpp"
#include "coldcore/lethality/organisms.hpp"
#include "coldcore/process/cooling.hpp"

namespace coldcore::io {

struct DataLibraries {
  OrganismLibrary organisms;
  RuleLibrary rules;
  CookingTables cooking;
};

/// Reads and parses the three libraries from `dir`. InputError names the file that is missing
/// or wrong.
DataLibraries load_libraries(const std::filesystem::path& dir);

}  // namespace coldcore::io
