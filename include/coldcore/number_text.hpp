#pragma once
/// Numbers in messages (errors, notes): the one helper. Report tables use report/format.hpp
/// (fixed decimals, csv cells); json and TOML write the shortest text that reads back.
#include <cstdio>
#include <string>

namespace coldcore {

/// `v` with `significant` significant digits, as printf's %g writes it ("0.5", "1e-07", "inf").
inline std::string number_text(double v, int significant = 10) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*g", significant, v);
  return buf;
}

}  // namespace coldcore
