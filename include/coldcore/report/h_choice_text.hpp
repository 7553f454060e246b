#pragma once
/// The h a stage with a per-target h range took (process/h_choice.hpp), in words.
#include <string>

#include "coldcore/process/h_choice.hpp"

namespace coldcore {

/// "stage "chill": h 60 W/m2K, the high end of 15-60 (medium_type = ...): <why>".
std::string h_choice_text(const process::HChoice& c);
/// h_choice_text + "; used for " the targets ("every target", "no target", or their names quoted).
std::string h_use_text(const process::HUse& u);

}  // namespace coldcore
