#pragma once
// Shared by the libFuzzer harnesses (tests/fuzz/README.md). A harness feeds the bytes to one
// parser and accepts exactly one outcome besides success: coldcore::Error (a clear message
// naming the input). Any other exception escapes, and libFuzzer reports it as a crash, because
// the program would print "internal error" for it; ASan and UBSan abort on memory errors and UB.
#include <cstddef>
#include <cstdint>
#include <string_view>

#include "coldcore/error.hpp"

namespace coldcore::fuzz {

inline std::string_view as_text(const std::uint8_t* data, std::size_t size) {
  return {reinterpret_cast<const char*>(data), size};
}

/// Runs `parse`, swallowing only coldcore::Error.
template <class F>
void expect_parsed_or_refused(F&& parse) {
  try {
    parse();
  } catch (const coldcore::Error&) {
    // a refusal with a message is the contract for bad input
  }
}

}  // namespace coldcore::fuzz
