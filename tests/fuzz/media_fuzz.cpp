// libFuzzer harness: the media library parser (media.toml).
#include "coldcore/io/media.hpp"
#include "fuzz/fuzz_support.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  coldcore::fuzz::expect_parsed_or_refused(
      [&] { (void)coldcore::io::parse_media(coldcore::fuzz::as_text(data, size), "fuzz/media.toml"); });
  return 0;
}
