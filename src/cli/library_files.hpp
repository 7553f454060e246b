#pragma once
// The data libraries (organisms.toml, cooling-rules.toml, media.toml) a verb needs, found in
// --library DIR, else beside the product file, else in $COLDCORE_DATA_DIR, else in share/coldcore
// beside the executable's folder (an installed coldcore), else in the source tree's products/
// folder. The one loader every verb uses.
#include <filesystem>
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

#include "coldcore/lethality/cooking_tables.hpp"
#include "coldcore/lethality/organisms.hpp"
#include "coldcore/process/cooling.hpp"
#include "coldcore/report/run_report.hpp"

namespace coldcore::cli {

struct LibraryFiles {
  OrganismLibrary organisms;
  RuleLibrary rules;
  CookingTables cooking;
  std::string organisms_sha256, rules_sha256, cooking_sha256;
};

/// Path of library file `name`: `library_dir`/name when library_dir is given; else beside
/// `product_file`; else $COLDCORE_DATA_DIR/name; else <exe>/../share/coldcore/name; else
/// COLDCORE_SOURCE_DIR/products/name. InputError when none exists.
std::filesystem::path library_path(const std::string& name, const std::string& library_dir,
                                   const std::string& product_file);

/// The search order above, for --help and messages.
extern const char* const kLibrarySearchOrder;

/// Adds --library DIR (the same help text on every verb that reads a data library).
void add_library_option(CLI::App& sub, std::string& library_dir);

LibraryFiles load_libraries(const std::string& library_dir, const std::string& product_file);

/// Provenance rows naming each library file and its SHA-256. names_only: the file names without
/// their folders (for libraries found by the fallbacks, whose absolute paths would make the same
/// report differ between machines; the SHA-256 identifies the content).
std::vector<KeyValue> library_provenance(const LibraryFiles& libs, bool names_only = false);

}  // namespace coldcore::cli
