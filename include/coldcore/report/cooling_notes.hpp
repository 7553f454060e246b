#pragma once
/// A cooling check's notes as sentences (temperatures as tokens, written in the chosen unit
/// where the report is written, like every other note).
#include <string>
#include <vector>

#include "coldcore/process/cooling.hpp"

namespace coldcore {

/// One note of `check` (a step's or the rule's).
std::string cooling_note_text(const CoolingNote& note, const CoolingCheck& check);

/// Every note of the check, each step's prefixed with its label ("57 °C -> 21 °C: ..."), then the
/// rule's: for lists that do not show the steps themselves.
std::vector<std::string> cooling_note_texts(const CoolingCheck& check);

}  // namespace coldcore
