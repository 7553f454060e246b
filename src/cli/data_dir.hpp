#pragma once
// Where the data libraries (organisms, cooling rules, cooking tables, media) are read from:
// $COLDCORE_DATA_DIR when set, else the products/ folder of the source tree this binary was
// built from.
#include <cstdlib>
#include <filesystem>

namespace coldcore::cli {

inline std::filesystem::path data_dir() {
  if (const char* env = std::getenv("COLDCORE_DATA_DIR"); env != nullptr && *env != '\0') return env;
  return std::filesystem::path(COLDCORE_SOURCE_DIR) / "products";
}

}  // namespace coldcore::cli
