#pragma once
/// The notes of an inverse question and of a deviation as sentences (temperatures as tokens,
/// written in the chosen unit where the report is written, like every other note).
#include <string>
#include <vector>

#include "coldcore/process/deviation.hpp"
#include "coldcore/process/inverse.hpp"

namespace coldcore {

/// One note of `solve` (its values are in the answer's unit).
std::string solve_note_text(const process::ProcessNote& note, const process::SolveResult& solve);
std::vector<std::string> solve_note_texts(const process::SolveResult& solve);

/// One note of a deviation.
std::string deviation_note_text(const process::ProcessNote& note);
std::vector<std::string> deviation_note_texts(const std::vector<process::ProcessNote>& notes);

/// What the answer is solved for: the targets' names, or chill-time's end condition.
std::vector<std::string> solved_for_texts(const process::SolveResult& solve);

/// What a solve or a deviation assumes (the assumes_* kinds), as sentences.
std::string assumption_text(const process::ProcessNote& assumption);
std::vector<std::string> assumption_texts(const std::vector<process::ProcessNote>& assumptions);

}  // namespace coldcore
