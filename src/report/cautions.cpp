#include "coldcore/report/cautions.hpp"

#include <ostream>

namespace coldcore {

const std::vector<std::string>& cautions() {
  static const std::vector<std::string> kCautions = {
      "These results are engineering estimates from a conduction model, not a validated process.",
      "They must be confirmed by heat-penetration studies on the real product and "
      "temperature-distribution studies on the real equipment.",
      "A qualified process authority and the local regulator decide whether a process or a "
      "product lot is acceptable; this tool does not release product.",
      "Follow the local food codes and regulations that apply, in their current edition.",
      "Model assumptions: conduction only, uniform initial temperature, constant thermal "
      "properties unless stated, no phase change; the cold spot is taken at the geometric centre.",
  };
  return kCautions;
}

const std::vector<std::string>& sign_off_labels() {
  static const std::vector<std::string> kLabels = {"Prepared by (name, role)", "Reviewed by (process authority)",
                                                   "Date",
                                                   "Decision (accept / hold / reprocess / reject)",
                                                   "Corrective action"};
  return kLabels;
}

const char* sign_off_note() {
  return "Filled in by hand: the decision is the reviewer's, under the local regulator; this tool makes none.";
}

void write_sign_off_text(std::ostream& out) {
  out << "SIGN-OFF\n  " << sign_off_note() << "\n";
  for (const auto& l : sign_off_labels()) out << "  " << l << ": " << std::string(30, '_') << "\n";
  out << "\n";
}

const std::vector<std::string>& measured_cautions() {
  static const std::vector<std::string> kCautions = {
      "These results are engineering estimates from one measured temperature log, not a validated process.",
      "One log is one product in one run: a process must be established by heat-penetration studies on the real "
      "product and temperature-distribution studies on the real equipment.",
      "A qualified process authority and the local regulator decide whether a process or a "
      "product lot is acceptable; this tool does not release product.",
      "Follow the local food codes and regulations that apply, in their current edition.",
      "Measurement assumptions: the probe sat at the product's slowest-heating point and was calibrated; "
      "temperatures between readings are taken as linear in time.",
  };
  return kCautions;
}

}  // namespace coldcore
