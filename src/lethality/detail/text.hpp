#pragma once
// Small text helpers shared by the lethality, cooling and assessment sources (private).
#include <cstdio>
#include <string>
#include <string_view>

namespace coldcore::detail {

/// Shortest faithful-enough rendering for messages: %.10g.
inline std::string num(double v) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.10g", v);
  return buf;
}

}  // namespace coldcore::detail
