// libFuzzer harness: the cooking table library parser (cooking-tables.toml).
#include "coldcore/io/libraries.hpp"
#include "coldcore/lethality/cooking_tables.hpp"
#include "fuzz/fuzz_support.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  coldcore::fuzz::expect_parsed_or_refused(
      [&] { (void)coldcore::io::parse_cooking_tables(coldcore::fuzz::as_text(data, size), "fuzz/cooking-tables.toml"); });
  return 0;
}
