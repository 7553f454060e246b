#pragma once
/// One error family for the whole library. Physics and parsers throw; only the CLI catches,
/// prints the message as one line on stderr and exits non-zero.
///
/// Message shape (place, key = value, requirement), e.g.
///   meatballs.toml: stage[2].h_W_m2K = -5: must be > 0
#include <stdexcept>
#include <string>

namespace coldcore {

/// Base of every error coldcore raises on purpose.
class Error : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
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
