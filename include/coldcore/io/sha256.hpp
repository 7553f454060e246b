#pragma once
/// SHA-256 (FIPS 180-4, unchanged from FIPS 180-2) of a byte string, for provenance: reports
/// name the exact product file and logs they were computed from.
#include <string>
#include <string_view>

namespace coldcore::io {

/// Lower-case hex digest (64 characters) of `bytes`.
std::string sha256_hex(std::string_view bytes);

}  // namespace coldcore::io
