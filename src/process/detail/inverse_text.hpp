#pragma once
// Small helpers shared by the inverse questions and the deviation evaluation. Private.
#include <sstream>
#include <string>

#include "coldcore/model/targets.hpp"

namespace coldcore::process::detail {

/// A number with `prec` significant digits, for messages.
inline std::string num(double x, int prec = 6) {
  std::ostringstream s;
  s.precision(prec);
  s << x;
  return s.str();
}

/// Targets whose verdict rests on lethality (F or log reduction).
inline bool is_lethality(TargetKind k) { return k == TargetKind::log_reduction || k == TargetKind::f_value; }

}  // namespace coldcore::process::detail
