#pragma once
/// A target's notes and the assessment's warnings as sentences (temperatures as tokens, written in the chosen unit where the
/// report is written, like every other note).
#include <string>
#include <vector>

#include "coldcore/process/assessment.hpp"

namespace coldcore {

/// One note of `target`.
std::string target_note_text(const TargetNote& note, const TargetResult& target);
/// Every note of the target, in order.
std::vector<std::string> target_note_texts(const TargetResult& target);

/// One assessment-wide warning (report/assessment_warnings.cpp).
std::string assessment_warning_text(const AssessmentWarning& warning);
std::vector<std::string> assessment_warning_texts(const std::vector<AssessmentWarning>& warnings);

}  // namespace coldcore
