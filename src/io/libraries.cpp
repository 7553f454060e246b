#include "coldcore/io/libraries.hpp"

#include "coldcore/io/product_file.hpp"

namespace coldcore::io {

DataLibraries load_libraries(const std::filesystem::path& dir) {
  DataLibraries lib;
  const auto organisms = dir / "organisms.toml";
  const auto rules = dir / "cooling-rules.toml";
  const auto cooking = dir / "cooking-tables.toml";
  lib.organisms = parse_organisms(read_text_file(organisms), organisms.string());
  lib.rules = parse_cooling_rules(read_text_file(rules), rules.string());
  lib.cooking = parse_cooking_tables(read_text_file(cooking), cooking.string());
  return lib;
}

}  // namespace coldcore::io
