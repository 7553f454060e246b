// The assessment's words for what the log-sampling check found (lethality/integrate.hpp).
#include <string>

#include "coldcore/model/temperature_token.hpp"
#include "lethality/detail/text.hpp"
#include "process/detail/assessing.hpp"

namespace coldcore::assessing {

std::string sampling_note_text(const SamplingNote& n) {
  switch (n.kind) {
    case SamplingNoteKind::too_few_rows:
      return "only " + std::to_string(n.count) + " log rows: lethality between them is unknown";
    case SamplingNoteKind::gap:
      return "log gap of " + detail::num(n.to_s - n.from_s) + " s after t = " + detail::num(n.from_s) + " s (median interval " +
             detail::num(n.median_interval_s) + " s)";
    case SamplingNoteKind::coarse:
      return "coarse sampling: " + temp_token(n.from_C, 10) + " -> " + temp_token(n.to_C, 10) + " between t = " +
             detail::num(n.from_s) + " and " + detail::num(n.to_s) + " s (more than z/10 in one interval)";
    case SamplingNoteKind::more_gaps: return std::to_string(n.count) + " more log gaps";
    case SamplingNoteKind::more_coarse: return std::to_string(n.count) + " more coarsely sampled intervals";
  }
  return {};
}

}  // namespace coldcore::assessing
