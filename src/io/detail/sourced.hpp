#pragma once
// What only the data libraries write: where a value comes from. Every library entry and every
// organism value names its source and how sure it is; read through Fields like any other key.
#include <string>
#include <string_view>

#include "coldcore/lethality/organisms.hpp"
#include "io/detail/fields.hpp"

namespace coldcore::io::detail {

/// The table's `status`, which must be given: "confirmed", "derived" or "from memory".
std::string source_status(const Fields& f);

/// `key = { value = <number>, source = "<text>", status = "...", note = "..." }` (note optional),
/// which must be given; the value times `scale` (60 for a _min key) is in SI.
Sourced sourced(const Fields& f, std::string_view key, double scale = 1.0);

}  // namespace coldcore::io::detail
