// libFuzzer harness: the organism library parser (organisms.toml).
#include "coldcore/io/libraries.hpp"
#include "coldcore/lethality/organisms.hpp"
#include "fuzz/fuzz_support.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  coldcore::fuzz::expect_parsed_or_refused(
      [&] { (void)coldcore::io::parse_organisms(coldcore::fuzz::as_text(data, size), "fuzz/organisms.toml"); });
  return 0;
}
