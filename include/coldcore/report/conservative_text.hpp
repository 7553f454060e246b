#pragma once
/// The worst-case choices of --conservative and a deviation's missing extra hold, in words
/// (process/conservative.hpp, process/deviation_conservative.hpp, process/deviation.hpp give numbers).
#include <string>
#include <vector>

#include "coldcore/process/conservative.hpp"
#include "coldcore/process/deviation.hpp"
#include "coldcore/process/deviation_conservative.hpp"

namespace coldcore {

/// "diameter 44 mm (largest)", "initial 2 °C (coldest, for heating)" (temperatures as tokens).
std::string range_setting_text(const process::RangeSetting& s);
std::vector<std::string> range_setting_texts(const std::vector<process::RangeSetting>& s);
/// The driving choice ("" when none); "… (no solution with it alone)" when that is why.
std::string driven_by_text(const process::ConservativeSolve& c);
std::string driven_by_text(const process::ConservativeDeviation& c);
/// Why the coldest or warmest start ("" without an initial-temperature range).
std::string initial_choice_text(const process::InitialChoice& c);
/// Why there is no extra hold, for a result `r` of stage r.stage ("" for NoHoldReason::none).
std::string no_hold_text(process::NoHoldReason why, const process::DeviationResult& r);

}  // namespace coldcore
