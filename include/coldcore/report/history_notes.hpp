#pragma once
/// The history engine's notes as warning sentences (temperatures as tokens, written in the
/// chosen unit where the warnings are written, like every other warning).
#include <string>
#include <vector>

#include "coldcore/conduction/history.hpp"

namespace coldcore {

std::string stage_note_text(const StageNote& note);
/// One sentence per note of the history, in order.
std::vector<std::string> history_warnings(const History& history);

}  // namespace coldcore
