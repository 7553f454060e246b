#pragma once
// Small helpers shared by the inverse questions and the deviation evaluation. Private.
#include <string>

#include "coldcore/model/targets.hpp"
#include "coldcore/number_text.hpp"

namespace coldcore::process::detail {

/// A number in a message: coldcore::number_text with `prec` significant digits.
inline std::string num(double x, int prec = 6) { return number_text(x, prec); }

/// Targets whose verdict rests on lethality (F or log reduction).
inline bool is_lethality(TargetKind k) { return k == TargetKind::log_reduction || k == TargetKind::f_value; }

}  // namespace coldcore::process::detail
