// libFuzzer harness: the product-file parser (schema 1 TOML), with the media library applied
// as `coldcore run` does. A stage's medium_log reads a fixed short log, so the fuzzer can reach
// everything after it.
#include <fstream>
#include <sstream>

#include "coldcore/io/media.hpp"
#include "coldcore/io/product_file.hpp"
#include "fuzz/fuzz_support.hpp"

namespace {

/// The project's own media library (the one the demo products use).
const coldcore::MediaLibrary& project_media() {
  static const coldcore::MediaLibrary media = [] {
    std::ifstream in(COLDCORE_SOURCE_DIR "/products/media.toml", std::ios::binary);
    std::stringstream text;
    text << in.rdbuf();
    return coldcore::io::parse_media(text.str(), "products/media.toml");
  }();
  return media;
}

std::optional<std::string> fixed_log(const std::filesystem::path& path) {
  if (path.filename() == "missing.csv") return std::nullopt;  // lets the fuzzer reach the unreadable-log error
  return std::string("time_s,medium_C\n0,80\n10,80.5\n20,81\n");
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const coldcore::MediaLibrary& media = project_media();
  coldcore::fuzz::expect_parsed_or_refused([&] {
    coldcore::io::ProductFile file =
        coldcore::io::parse_product(coldcore::fuzz::as_text(data, size), "fuzz/product.toml", "fuzz", fixed_log);
    if (coldcore::io::needs_media(file)) coldcore::io::apply_media(file, media);
    coldcore::io::require_constant_properties(file);
  });
  return 0;
}
