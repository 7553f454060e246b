// Every tests/cli/bad/*.toml is refused with the message written on its first line.
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <sstream>

#include "coldcore/error.hpp"
#include "coldcore/io/product_file.hpp"

namespace fs = std::filesystem;

namespace {
std::optional<std::string> read_under_source(const fs::path& relative) {
  std::ifstream in(fs::path(COLDCORE_SOURCE_DIR) / relative, std::ios::binary);
  if (!in) return std::nullopt;
  std::ostringstream ss;
  ss << in.rdbuf();
  return ss.str();
}
}  // namespace

TEST_CASE("tests/cli/bad: each file fails with its stated message") {
  const fs::path rel_dir = "tests/cli/bad";
  int files = 0;
  for (const auto& entry : fs::directory_iterator(fs::path(COLDCORE_SOURCE_DIR) / rel_dir)) {
    if (entry.path().extension() != ".toml") continue;
    const fs::path rel = rel_dir / entry.path().filename();
    const std::string text = *read_under_source(rel);
    const std::string tag = "# expect: ";
    REQUIRE(text.rfind(tag, 0) == 0);
    const std::string expect = text.substr(tag.size(), text.find('\n') - tag.size());
    INFO(rel.generic_string());
    CHECK_THROWS_WITH_AS(coldcore::io::parse_product(text, rel.generic_string(), rel_dir, read_under_source),
                         expect.c_str(), coldcore::InputError);
    ++files;
  }
  CHECK(files >= 7);
}
