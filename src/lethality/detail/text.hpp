#pragma once
// Small text helpers shared by the lethality, cooling and assessment sources (private).
#include <string>

#include "coldcore/number_text.hpp"

namespace coldcore::detail {

/// A number in a message: coldcore::number_text with 10 significant digits.
inline std::string num(double v) { return number_text(v, 10); }

}  // namespace coldcore::detail
