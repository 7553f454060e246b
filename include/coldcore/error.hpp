#pragma once
/// One error family for the whole library. Physics and parsers throw; only the CLI catches,
/// prints the message as one line on stderr and exits non-zero.
///
/// Message shape (place, key = value, requirement), e.g.
///   meatballs.toml: stage[2].h_W_m2K = -5: must be > 0
#include <stdexcept>
#include <string>

#include "coldcore/model/limits.hpp"

namespace coldcore {

/// Base of every error coldcore raises on purpose. A message longer than
/// limits::max_message_chars (2,000) is cut there and says so: a megabyte-long key quoted back
/// must not become a megabyte-long line on stderr.
class Error : public std::runtime_error {
 public:
  explicit Error(const std::string& what) : std::runtime_error(clipped(what)) {}
  explicit Error(const char* what) : Error(std::string(what)) {}

 private:
  static std::string clipped(const std::string& what) {
    constexpr std::size_t kMax = limits::max_message_chars;
    if (what.size() <= kMax) return what;
    return what.substr(0, kMax) + "... (message cut at " + std::to_string(kMax) + " characters)";
  }
};

/// Bad user input: a file, key, CSV line or option. Exit code 2.
class InputError : public Error {
 public:
  using Error::Error;
};

/// A numerical method did not reach its tolerance. Never returned half-done.
class NotConverged : public Error {
 public:
  using Error::Error;
};

/// An inverse question has no answer inside its bounds; the message says why.
class NoSolution : public Error {
 public:
  using Error::Error;
};

}  // namespace coldcore
