// The words for the assessment-wide warnings, among them what the log-sampling check found
// (lethality/integrate.hpp).
#include <string>

#include "coldcore/model/temperature_token.hpp"
#include "coldcore/number_text.hpp"
#include "coldcore/process/shown_values.hpp"
#include "coldcore/report/target_notes.hpp"

namespace coldcore {

namespace {

std::string num(double v) { return number_text(v, 10); }

std::string sampling_note_text(const SamplingNote& n) {
  switch (n.kind) {
    case SamplingNoteKind::too_few_rows:
      return "only " + std::to_string(n.count) + " log rows: lethality between them is unknown";
    case SamplingNoteKind::gap:
      return "log gap of " + num(n.to_s - n.from_s) + " s after t = " + num(n.from_s) + " s (median interval " +
             num(n.median_interval_s) + " s)";
    case SamplingNoteKind::coarse:
      return "coarse sampling: " + temp_token(n.from_C, 10) + " -> " + temp_token(n.to_C, 10) + " between t = " +
             num(n.from_s) + " and " + num(n.to_s) + " s (more than z/10 in one interval)";
    case SamplingNoteKind::more_gaps: return std::to_string(n.count) + " more log gaps";
    case SamplingNoteKind::more_coarse: return std::to_string(n.count) + " more coarsely sampled intervals";
  }
  return {};
}

}  // namespace

std::string assessment_warning_text(const AssessmentWarning& w) {
  switch (w.kind) {
    case AssessmentWarningKind::interpolated_history:
      return "history has no exact evaluation: samples are interpolated linearly";
    case AssessmentWarningKind::log_rules_disagree:
      return w.target + ": trapezoid, Simpson and linear-interpolation F differ by " + shown_up(100 * w.value, 2) +
             " %; the smallest is used (the log may be too coarse)";
    case AssessmentWarningKind::log_sampling: return w.target + ": " + sampling_note_text(w.sampling);
  }
  return {};
}

std::vector<std::string> assessment_warning_texts(const std::vector<AssessmentWarning>& warnings) {
  std::vector<std::string> out;
  out.reserve(warnings.size());
  for (const auto& w : warnings) out.push_back(assessment_warning_text(w));
  return out;
}

}  // namespace coldcore
