// libFuzzer harness: the logger CSV reader (io/logger_csv), its use as a medium schedule, and
// the ISO 8601 time-stamp reader it relies on.
#include "coldcore/io/logger_csv.hpp"
#include "fuzz/fuzz_support.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string_view text = coldcore::fuzz::as_text(data, size);
  coldcore::fuzz::expect_parsed_or_refused([&] {
    const coldcore::TimeSeries log = coldcore::io::parse_log_csv(text, "fuzz/log.csv");
    (void)coldcore::io::medium_profile(log, "fuzz/log.csv", text);
  });
  (void)coldcore::io::parse_iso8601_s(text.substr(0, 64));  // contract: never throws, nullopt when not a time
  return 0;
}
