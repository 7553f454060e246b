// libFuzzer harness: the cooling rule library parser (cooling-rules.toml).
#include "coldcore/io/libraries.hpp"
#include "coldcore/process/cooling.hpp"
#include "fuzz/fuzz_support.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  coldcore::fuzz::expect_parsed_or_refused(
      [&] { (void)coldcore::io::parse_cooling_rules(coldcore::fuzz::as_text(data, size), "fuzz/cooling-rules.toml"); });
  return 0;
}
